// Inputs far outside any pump system, found by sending them to the running app (helper "attack",
// 2026-12-02): each answered 500. A value the app cannot work with is the user's to fix (a 400 with
// the field's message), and a system the engine can evaluate but no pump can serve is a page that says so.
// Real route modules, real guards, real MariaDB (app/test/harness.ts).
import { afterAll, beforeAll, expect, test } from "vitest";
import { eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { candidates, fieldChecks, libraries, systems, users } from "@db/schema";
import { readFileSync } from "node:fs";
import { addCandidate, createProject, createSystem, selectCandidate } from "~/lib/projects";
import { createLibrary, curvesOfRevisions } from "~/lib/libraries";
import { importCsvText } from "~/lib/projects/test-kit";
import { DEFAULT_ADJUSTMENT, defaultSystemInput } from "~/lib/projects/hydraulics";
import * as systemPage from "~/routes/systems.$id";
import * as apiPreview from "~/routes/api.v1.systems.$id.preview";
import * as searchPage from "~/routes/systems.$id.search";
import * as apiSearch from "~/routes/api.v1.systems.$id.search";
import * as selectionPage from "~/routes/selections.$id";
import * as selectionCsv from "~/routes/selections.$id.export-csv";
import * as selectionJson from "~/routes/selections.$id.export-json";
import * as fieldForm from "~/routes/field.selections.$id";
import * as fieldSync from "~/routes/field.selections.$id.checks";
import { parseCheckFields, PRESSURE_UNITS } from "~/lib/fieldchecks";
import { unitLabel } from "~/engine";
import { fieldsForHead, storeSelection } from "./fieldcheck-fixture";
import { call, makeMember, type TestMember } from "./harness";

let m: TestMember;
let project: number;
const viewerOfM = () => ({ userId: m.userId, workspace: { id: m.workspaceId, name: "W", slug: "w", plan: "free" as const }, role: "admin" as const });
beforeAll(async () => {
  m = await makeMember("admin");
  project = await createProject(viewerOfM(), { name: "Out of range", site: "", description: "" });
});
afterAll(() => closeDb());

/** The system editor's fields for an open tank, no pipe runs, in the SI preset's display units (head m, pressure kPa, flow m³/h). */
const editorForm = (over: Record<string, string> = {}) => ({
  intent: "save", name: "Edited", temperature: "20", mode: "open", staticLow: "10", staticHigh: "10", pressureDifference: "0", controlHead: "0",
  suctionSurfacePressure: "101.325", suctionStaticHead: "2", dutyFlow: "20", dutyHead: "25", runCount: "0", ...over,
});

test("POST /systems/:id with a value whose SI form or display overflows a double (1e308 kPa, 1e308 m): the editor's message beside the field, nothing saved (was 500, or saved and a 500 for every US-unit reader)", async () => {
  const system = await createSystem(viewerOfM(), project, "Overflow", { ...defaultSystemInput(), duty: { flow: 20 / 3600, head: 25 } });
  const post = (form: Record<string, string>) => call(systemPage.action as never, { path: `/systems/${system}`, params: { id: String(system) }, cookie: m.cookie, form });
  const ok = await post(editorForm()); // control: the same form with ordinary values saves
  expect(ok.status).toBe(200);
  expect((ok.body as { saved?: boolean }).saved).toBe(true);
  const saved = (await db().select().from(systems).where(eq(systems.id, system)))[0].inputJson;
  for (const [field, value] of [["pressureDifference", "1e308"], ["suctionSurfacePressure", "1e308"], ["dutyHead", "1e308"], ["staticHigh", "-1e308"], ["dutyFlow", "1e308"], ["flowMax", "1e308"]]) {
    const r = await post(editorForm({ [field]: value }));
    expect(r.status, `${field}=${value}`).toBe(400); // a refused field: 400, the page with the errors shown in the form
    const errors = (r.body as { errors: Record<string, string>; saved?: boolean }).errors;
    expect(errors[field], `${field}=${value}`).toBeTruthy();
    expect((r.body as { saved?: boolean }).saved).toBeUndefined();
  }
  expect((await db().select().from(systems).where(eq(systems.id, system)))[0].inputJson).toBe(saved);
});

test("POST /api/v1/systems/:id/preview with duty.head 1e308 m, by a member reading US units → 400 problem+json naming duty.head (was 500: the head in ft overflows)", async () => {
  const us = await makeMember("engineer", m.workspaceId);
  await db().update(users).set({ unitSystem: "US" }).where(eq(users.id, us.userId));
  const system = await createSystem(viewerOfM(), project, "Preview overflow", { ...defaultSystemInput(), duty: { flow: 20 / 3600, head: 25 } });
  const input = { ...defaultSystemInput(), duty: { flow: 20 / 3600, head: 1e308 } };
  const r = await call(apiPreview.action as never, {
    path: `/api/v1/systems/${system}/preview`,
    params: { id: String(system) },
    method: "POST",
    cookie: us.cookie,
    headers: { "content-type": "application/json", origin: "http://127.0.0.1:3999" },
    body: JSON.stringify({ input }),
  });
  expect(r.status).toBe(400);
  expect(r.headers.get("content-type")).toBe("application/problem+json");
  expect(JSON.stringify(r.body)).toContain("duty.head");
});

test("a system whose suction cannot feed any pump (20 m suction lift from an open tank: NPSHa below zero): GET /systems/:id/search and GET /api/v1/systems/:id/search answer 200 (were 500: npshAvailable must not be negative)", async () => {
  // 20 m of lift from a tank at 101.325 kPa: NPSHa ≈ 10.3 − 20 − losses < 0 m at every flow (common practice: the barometric head of water is about 10.3 m)
  const input = { ...defaultSystemInput(), mode: "open" as const, suctionStaticHead: -20, duty: { flow: 20 / 3600, head: 25 } };
  const system = await createSystem(viewerOfM(), project, "Suction lift", input);
  const page = await call(searchPage.loader as never, { path: `/systems/${system}/search`, params: { id: String(system) }, cookie: m.cookie });
  expect(page.status).toBe(200);
  const api = await call(apiSearch.loader as never, { path: `/api/v1/systems/${system}/search`, params: { id: String(system) }, cookie: m.cookie });
  expect(api.status).toBe(200);
  expect(Array.isArray((api.body as { results: unknown[] }).results)).toBe(true);
});

/** A system with one candidate (a curve of fixtures/csv/long-si.csv) in m's workspace. */
async function systemWithCandidate(name: string) {
  const lib = await createLibrary(viewerOfM(), { name: `${name} ${Date.now()}`, description: "" });
  await importCsvText(viewerOfM(), lib, readFileSync("fixtures/csv/long-si.csv", "utf8"), "o.csv");
  const [rev] = await db().select({ id: libraries.currentRevisionId }).from(libraries).where(eq(libraries.id, lib));
  const system = await createSystem(viewerOfM(), project, name, { ...defaultSystemInput(), duty: { flow: 20 / 3600, head: 25 } });
  const added = await addCandidate(viewerOfM(), system, (await curvesOfRevisions([rev.id!]))[0].id, DEFAULT_ADJUSTMENT);
  if (!added.ok) throw new Error(added.reason);
  return { system, candidate: added.id };
}

test("POST /systems/:id intent=adjust with motorRating=1e308 (kW): the candidate's message, adjustment unchanged (was 500: the rating in W overflowed)", async () => {
  const { system, candidate } = await systemWithCandidate("Motor overflow");
  const before = (await db().select().from(candidates).where(eq(candidates.id, candidate)))[0].adjustmentJson;
  const form = { intent: "adjust", candidateId: String(candidate), method: "none", ratio: "", arrangement: "single", dutyPumps: "1", standbyPumps: "0", motorRating: "1e308", serviceFactor: "1", ieClass: "IE3" };
  const r = await call(systemPage.action as never, { path: `/systems/${system}`, params: { id: String(system) }, cookie: m.cookie, form });
  expect(r.status).toBe(400); // a refused form post answers 400, as the save does (200 until helper "formedges")
  expect((r.body as { errors: Record<string, string> }).errors[`adj.${candidate}`]).toMatch(/motor/i);
  expect((await db().select().from(candidates).where(eq(candidates.id, candidate)))[0].adjustmentJson).toBe(before);
});

test("a selection titled with a quantity token past a double in display units (⟦flow|1e308⟧): its page and both exports answer 200 with the text as typed (were 500 for every reader)", async () => {
  const { candidate } = await systemWithCandidate("Token title");
  const title = "Pump for ⟦flow|1e308⟧";
  const selection = await selectCandidate(viewerOfM(), candidate, title, "note ⟦head|1e308⟧");
  for (const route of [selectionPage, selectionCsv, selectionJson]) {
    const r = await call(route.loader as never, { path: `/selections/${selection}`, params: { id: String(selection) }, cookie: m.cookie });
    expect(r.status).toBe(200);
    expect(JSON.stringify(r.body)).toContain("⟦flow|1e308⟧");
  }
});

test("a field check with a reading past a double in SI (sPressure 1e308 kPa, flow 1e400): 400 with the field's message from the page's form and the phone's queue, nothing recorded (were 500)", async () => {
  const { selectionId } = await storeSelection(m.workspaceId, m.userId, undefined, "Overflow field");
  const post = (route: typeof fieldForm | typeof fieldSync, suffix: string, form: Record<string, string>) =>
    call(route.action as never, { path: `/field/selections/${selectionId}/${suffix}`, params: { id: String(selectionId) }, cookie: m.cookie, form });
  for (const [field, value] of [["sPressure", "1e308"], ["flow", "1e400"], ["dDiameter", "-1e308"]]) {
    const form = fieldsForHead(25, 998.2, { flow: "0.005", [field]: value, pageWorkspaceId: String(m.workspaceId) });
    const page = await post(fieldForm, "photos", form);
    expect(page.status, `${field}=${value}`).toBe(400);
    // 1e308 is a number the reader takes, then too high for the check; 1e400 is no finite number at all: out of range.
    expect((page.body as { errors: Record<string, string> }).errors[field], `${field}=${value}`).toMatch(/too (high|low)|out of range/);
    const sync = await post(fieldSync, "checks", { ...form, clientId: `overflow-${field}-${Date.now().toString(36)}` });
    expect(sync.status, `${field}=${value}`).toBe(400);
    expect((sync.body as { errors: Record<string, string> }).errors[field]).toMatch(/too (high|low)|out of range/);
  }
  expect(await db().select().from(fieldChecks).where(eq(fieldChecks.selectionId, selectionId))).toEqual([]);
});

test("a field check posted with a unit the form does not offer (pressureUnit=x): the fields given back to redraw the form carry a unit it can label (the page threw drawing 'x': 500)", () => {
  const r = parseCheckFields(fieldsForHead(25, 998.2, { pressureUnit: "x", flowUnit: "gpm-ish", temperatureUnit: "K" }), { kind: "water" });
  if (r.ok) throw new Error("a unit the form does not offer was taken");
  expect(Object.keys(r.errors)).toEqual(expect.arrayContaining(["pressureUnit", "flowUnit", "temperatureUnit"]));
  expect(PRESSURE_UNITS).toContain(r.fields.pressureUnit);
  for (const [q, key] of [["pressure", "pressureUnit"], ["flow", "flowUnit"], ["temperature", "temperatureUnit"]] as const) expect(() => unitLabel(q, r.fields[key])).not.toThrow();
});

test("GET /systems/:id/search?maxPower=1e308 (kW): 200, the filter set aside as for any other odd value (was 500: the power in W overflowed)", async () => {
  const system = await createSystem(viewerOfM(), project, "Power filter", { ...defaultSystemInput(), duty: { flow: 20 / 3600, head: 25 } });
  for (const maxPower of ["1e308", "-1e308", "1e400"]) {
    const r = await call(searchPage.loader as never, { path: `/systems/${system}/search?maxPower=${maxPower}`, params: { id: String(system) }, cookie: m.cookie });
    expect(r.status, maxPower).toBe(200);
  }
});
