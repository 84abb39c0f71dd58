// A system whose stored input no longer passes SystemInputSchema (stored under an older or looser schema, edited in the
// database, text that is not JSON) used to be read as the DEFAULT system: its curve, duty, search ranking and verdicts
// were shown and could be frozen into a selection under the real system's name (or a 500 for non-JSON). Here a system
// is stored, its input_json corrupted directly in MariaDB, and every path that reads it must answer honestly: the page
// names what is wrong and computes nothing, lists say "needs review", search, adding candidates, selecting and the
// read API refuse with 409 (problem+json for the API), never a default number and never a 500.
// Real route modules, guards and MariaDB (app/test/harness.ts). Check values: our product rules (stored-input.ts, the
// schema's own limits in system-input.ts) and the demo curves (fixtures/demo/tallowmere.csv, invented).
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { and, eq, ne } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { candidates, selections, systems } from "@db/schema";
import type { Viewer } from "~/lib/libraries";
import { addCandidate, createSystem, searchForSystem } from "~/lib/projects";
import { DEFAULT_ADJUSTMENT, type SystemInput } from "~/lib/projects/hydraulics";
import { systemFormValues } from "~/lib/projects/system-form";
import { boosterInput, demoProjectFixture } from "~/lib/projects/test-kit";
import { SI_UNITS } from "~/lib/shared/units";
import * as systemPage from "~/routes/systems.$id";
import SystemPageView from "~/routes/systems.$id";
import * as searchPage from "~/routes/systems.$id.search";
import * as projectPage from "~/routes/projects.$id";
import * as apiSystem from "~/routes/api.v1.systems.$id";
import * as apiSearch from "~/routes/api.v1.systems.$id.search";
import { call, type TestMember } from "./harness";
import { renderPage } from "./render-page";

afterAll(() => closeDb());

let m: TestMember;
let v: Viewer;
let projectId = 0;
const booster = boosterInput;

beforeAll(async () => void ({ m, v, projectId } = await demoProjectFixture("Stored input pumps", "Stored inputs")));

type Corruption = { name: string; corrupt: (doc: Record<string, unknown>) => string; label: string; message: RegExp; stored: string | null };
/** Each corruption, the place it must be named by (stored-input.ts `pathLabel`) and what must be said (the schema's messages, SI). */
const CASES: Corruption[] = [
  { name: "a field out of range (temperature 350 °C, the schema allows -50 to 300 °C)", corrupt: (d) => JSON.stringify({ ...d, temperatureC: 350 }), label: "temperature", message: /Temperature is too high: it takes from −50 °C to 300 °C, not 350 °C; check the value and its unit\./, stored: "350 °C" },
  {
    name: "a missing field (pipe run 2 without its inner diameter)",
    corrupt: (d) => {
      const runs = (d.runs as Record<string, unknown>[]).map((r) => ({ ...r }));
      delete runs[1].diameter;
      return JSON.stringify({ ...d, runs });
    },
    label: "pipe run 2, inner diameter",
    message: /Missing from the stored document\./,
    stored: null,
  },
  { name: "a wrong type (static head low level as text)", corrupt: (d) => JSON.stringify({ ...d, staticLow: "26 m" }), label: "static head (low level)", message: /Static head \(low level\) must be a number\./, stored: '"26 m"' },
  { name: "text that is not JSON (cut off mid-document)", corrupt: (d) => JSON.stringify(d).slice(0, 40), label: "the stored document", message: /Is not valid JSON/, stored: null },
];

/** A stored booster with one candidate (added while its input was good), then its input_json corrupted in the database. */
async function corrupted(c: Corruption) {
  const systemId = await createSystem(v, projectId, `Booster (${c.label})`, booster());
  const found = await searchForSystem(v, systemId);
  expect(found.results.length).toBeGreaterThan(1); // control: the good input finds pumps
  const added = await addCandidate(v, systemId, found.results[0].curveSetId, DEFAULT_ADJUSTMENT);
  if (!added.ok) throw new Error(added.reason);
  const [row] = await db().select().from(systems).where(eq(systems.id, systemId));
  await db().update(systems).set({ inputJson: c.corrupt(JSON.parse(row.inputJson)) }).where(eq(systems.id, systemId));
  return { systemId, candidateId: added.id, otherCurveSetId: found.results[1].curveSetId };
}

const page = (systemId: number) => call(systemPage.loader as never, { path: `/systems/${systemId}`, params: { id: String(systemId) }, cookie: m.cookie });
type Review = { count: number; problems: { label: string; message: string; stored: string | null; path: string }[]; fields: Record<string, string> };

describe.each(CASES)("stored input with $name", (c) => {
  let s: Awaited<ReturnType<typeof corrupted>>;
  beforeAll(async () => {
    s = await corrupted(c);
  });

  test("the system page names the problem in plain words, computes nothing and shows the stored values in the editor (was: the default system's curve and inputs, or a 500)", async () => {
    const r = await page(s.systemId);
    expect(r.status).toBe(200);
    const d = r.body as { review: Review | null; view: unknown; input: SystemInput; name: string };
    expect(d.name).toBe(`Booster (${c.label})`);
    expect(d.view).toBeNull(); // no system curve, operating points, candidate results or verdicts
    expect(d.review).not.toBeNull();
    const p = d.review!.problems.find((x) => x.label === c.label);
    expect(p, JSON.stringify(d.review)).toBeTruthy();
    expect(p!.message).toMatch(c.message);
    expect(p!.stored).toBe(c.stored);
    expect(JSON.stringify(d.review)).not.toContain("⟦"); // quantities written in the reader's units
    // The editor: the stored values, never the default system's (default static heads 10/12 m, duty 0.01 m³/s at 15 m).
    const f = systemFormValues(d.input, SI_UNITS);
    if (c.label === "the stored document") {
      expect([f.staticLow, f.staticHigh, f.dutyFlow, f.dutyHead, f.temperature, f.tolPlus, f.npshMargin]).toEqual(["", "", "", "", "", "", ""]); // nothing could be read: blank, not defaults
    } else {
      expect([f.staticHigh, f.dutyFlow, f.dutyHead]).toEqual(["30", "40", "38"]); // the booster's own values (m, m³/h, m)
      if (c.label === "temperature") expect(f.temperature).toBe("350"); // shown as stored, refused again on save until fixed
      if (c.label === "static head (low level)") expect(f.staticLow).toBe(""); // not a number: blank, a required field
      if (c.label === "pipe run 2, inner diameter") expect(f.runs[1].diameter).toBe("");
      expect(Object.values(d.review!.fields).join(" ")).toMatch(c.message); // the same problem beside its field
    }
  });

  test("the system page renders it: the review panel with the problem, the stored values in the editor, no chart, candidates or pump search link", async () => {
    const data = (await page(s.systemId)).body;
    const html = renderPage("/systems/:id", SystemPageView, `/systems/${s.systemId}`, data);
    expect(html).toContain("This system needs review: its stored inputs do not pass the checks");
    expect(html).toContain(c.label);
    expect(html).not.toContain("System curve");
    expect(html).not.toContain("Find pumps for this duty");
    expect(html).not.toContain("NaN");
    if (c.label === "temperature") expect(html).toMatch(/name="temperature" value="350"/); // the stored value, refused again on save
  });

  test("the project page marks the system as needing review instead of showing a duty (was: the default duty, or a 500)", async () => {
    const r = await call(projectPage.loader as never, { path: `/projects/${projectId}`, params: { id: String(projectId) }, cookie: m.cookie });
    expect(r.status).toBe(200);
    const row = (r.body as { systems: { id: number; duty: unknown; mode: unknown; needsReview: { problems: number; places: string } | null }[] }).systems.find((x) => x.id === s.systemId)!;
    expect(row.duty).toBeNull();
    expect(row.mode).toBeNull();
    expect(row.needsReview?.places).toContain(c.label);
  });

  test("the search page and its Add buttons refuse (409 naming the problem), nothing added (was: pumps ranked for the default duty and added)", async () => {
    const r = await call(searchPage.loader as never, { path: `/systems/${s.systemId}/search`, params: { id: String(s.systemId) }, cookie: m.cookie });
    expect(r.status).toBe(409);
    expect((r.body as { detail: string }).detail).toContain(c.label);
    const forms: Record<string, string>[] = [{ one: `${s.otherCurveSetId}:direct` }, { intent: "add-many", add: `${s.otherCurveSetId}:trim` }, { curveSetId: String(s.otherCurveSetId), method: "speed" }];
    for (const form of forms) {
      const a = await call(searchPage.action as never, { path: `/systems/${s.systemId}/search`, params: { id: String(s.systemId) }, cookie: m.cookie, form });
      expect(a.status, JSON.stringify(form)).toBe(409);
    }
    expect(await db().select({ id: candidates.id }).from(candidates).where(and(eq(candidates.systemId, s.systemId), ne(candidates.id, s.candidateId)))).toEqual([]);
  });

  test("selecting a candidate refuses (409), no selection frozen (was: a selection frozen with the default system's inputs and results)", async () => {
    const r = await call(systemPage.action as never, { path: `/systems/${s.systemId}`, params: { id: String(s.systemId) }, cookie: m.cookie, form: { intent: "select", candidateId: String(s.candidateId), title: "", note: "" } });
    expect(r.status).toBe(409);
    expect((r.body as { detail: string }).detail).toContain(c.label);
    expect(await db().select({ id: selections.id }).from(selections).where(eq(selections.systemId, s.systemId))).toEqual([]);
  });

  test("the read API refuses with 409 problem+json naming each problem (was: 200 with the default inputs and results, or a 500)", async () => {
    for (const [fn, path] of [[apiSystem.loader, `/api/v1/systems/${s.systemId}`], [apiSearch.loader, `/api/v1/systems/${s.systemId}/search`]] as const) {
      const r = await call(fn as never, { path, params: { id: String(s.systemId) }, cookie: m.cookie });
      expect(r.status, path).toBe(409);
      expect(r.headers.get("content-type")).toBe("application/problem+json");
      const body = r.body as { title: string; detail: string; errors: { field: string; message: string }[] };
      expect(body.title).toBe("Conflict");
      expect(body.detail).toContain(c.label);
      expect(body.errors.some((e) => e.message.startsWith(`${c.label}: `) && c.message.test(e.message)), JSON.stringify(body.errors)).toBe(true);
      expect(JSON.stringify(body)).not.toContain("⟦");
    }
  });
});

test("saving the fixed inputs from the editor brings the computed page back (the way out of review)", async () => {
  const s = await corrupted(CASES[0]);
  const before = (await page(s.systemId)).body as { review: Review | null; input: SystemInput };
  expect(before.review?.count).toBe(1);
  const f = systemFormValues(before.input, SI_UNITS);
  // The editor's own fields as shown (SI preset: head m, pressure kPa, flow m³/h), the temperature corrected.
  const form: Record<string, string> = {
    intent: "save", name: "Booster fixed", temperature: "20", mode: f.mode, staticLow: f.staticLow, staticHigh: f.staticHigh, pressureDifference: f.pressureDifference,
    controlHead: f.controlHead, suctionSurfacePressure: f.suctionSurfacePressure, suctionStaticHead: f.suctionStaticHead, dutyFlow: f.dutyFlow, dutyHead: f.dutyHead, runCount: "0",
  };
  const refused = await call(systemPage.action as never, { path: `/systems/${s.systemId}`, params: { id: String(s.systemId) }, cookie: m.cookie, form: { ...form, temperature: "350" } });
  expect((refused.body as { errors: Record<string, string> }).errors.temperature).toBeTruthy(); // the stored value is refused again, not saved
  const saved = await call(systemPage.action as never, { path: `/systems/${s.systemId}`, params: { id: String(s.systemId) }, cookie: m.cookie, form });
  expect((saved.body as { saved?: boolean }).saved).toBe(true);
  const after = (await page(s.systemId)).body as { review: Review | null; view: { evaluation: unknown; candidates: unknown[] } | null };
  expect(after.review).toBeNull();
  expect(after.view?.evaluation).toBeTruthy();
  expect(after.view?.candidates).toHaveLength(1);
  const api = await call(apiSystem.loader as never, { path: `/api/v1/systems/${s.systemId}`, params: { id: String(s.systemId) }, cookie: m.cookie });
  expect(api.status).toBe(200);
});
