// A selection's frozen document (selections.frozen_json) damaged in the database — cut off, a number turned into text, a
// system input out of range, a part missing — used to be read with an unchecked JSON.parse: a 500 for text that was not
// JSON, else a report and exports half-rendered from whatever was there, and field checks worked out against it. Here a
// real selection is frozen, its frozen_json corrupted directly in MariaDB, and every reader must answer honestly: the
// report page says the stored selection cannot be read and where (409, shown by its ErrorBoundary), both exports and the
// phone's queue answer 409 problem+json, the field page refuses, nothing is recorded; a check recorded before still shows
// its own stored record. Documents frozen by the app itself all read (a sweep of demo systems × adjustments).
// Real route modules, guards and MariaDB (app/test/harness.ts). Check values: our product rules (stored-selection.ts,
// stored-doc.ts), the system schema's own limits (system-input.ts) and the demo curves (fixtures/demo/*.csv, invented).
import { createElement } from "react";
import { renderToString } from "react-dom/server";
import { createRoutesStub, UNSAFE_ErrorResponseImpl } from "react-router";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { fieldChecks, selections } from "@db/schema";
import { fluidAt } from "~/engine";
import type { Viewer } from "~/lib/libraries";
import { addCandidate, createProject, createSystem, searchForSystem, selectCandidate } from "~/lib/projects";
import { DEFAULT_ADJUSTMENT, evaluateSystem, type Adjustment, type SystemInput } from "~/lib/projects/hydraulics";
import { readStoredSelection, type FrozenSelection } from "~/lib/projects/stored-selection";
import { boosterInput, demoLibrary, viewerOfUser } from "~/lib/projects/test-kit";
import { parseCheckFields } from "~/lib/fieldchecks";
import { recordFieldCheck } from "~/lib/fieldchecks/records.server";
import { demoSystems } from "~/cli/demo-systems";
import * as selectionPage from "~/routes/selections.$id";
import * as selectionCsv from "~/routes/selections.$id.export-csv";
import * as selectionJson from "~/routes/selections.$id.export-json";
import * as fieldPage from "~/routes/field.selections.$id";
import * as fieldQueue from "~/routes/field.selections.$id.checks";
import * as fieldCsv from "~/routes/field.selections.$id.export-csv";
import * as checkPage from "~/routes/field.checks.$id";
import { call, makeMember, type TestMember } from "./harness";
import { fieldsForHead, frozenFixture } from "./fieldcheck-fixture";

afterAll(() => closeDb());

let m: TestMember;
let v: Viewer;
let projectId = 0;
const booster = boosterInput;
const RHO20 = fluidAt({ kind: "water" }, 20).density;
const readings = (head: number) => {
  const r = parseCheckFields(fieldsForHead(head, RHO20, { flow: "0.011" }), { kind: "water" });
  if (!r.ok) throw new Error(JSON.stringify(r.errors));
  return r.readings;
};

beforeAll(async () => {
  m = await makeMember("admin");
  v = await viewerOfUser(m.userId);
  for (const file of ["tallowmere.csv", "harrow-vell.csv", "nordquay.csv"]) await demoLibrary(v, `Frozen ${file}`, file);
  projectId = await createProject(v, { name: "Frozen selections", site: "", description: "" });
});

/** A selection frozen by the app from a system's best search result, with `adjustment`. */
async function freeze(name: string, input: SystemInput, adjustment: Adjustment = DEFAULT_ADJUSTMENT, pick = 0) {
  const systemId = await createSystem(v, projectId, name, input);
  const found = await searchForSystem(v, systemId);
  expect(found.results.length, name).toBeGreaterThan(pick); // control: the demo curves serve it
  const added = await addCandidate(v, systemId, found.results[pick].curveSetId, adjustment);
  if (!added.ok) throw new Error(added.reason);
  return { systemId, selectionId: await selectCandidate(v, added.id, name, "") };
}
const frozenJsonOf = async (id: number) => (await db().select().from(selections).where(eq(selections.id, id)))[0].frozenJson;

test("every document the app freezes reads (demo systems, booster and a duty-less one × as published, speed, trim, 2 in parallel + 1, 2 in series); so does the field-check fixture", async () => {
  // The demo systems with their duty head as the seed sets it (app/cli/seed.ts): the system's head at the duty flow at the band's demanding edge.
  const seeded = demoSystems().map((d): [string, SystemInput] => [d.system, { ...d.input, duty: { flow: d.input.duty!.flow, head: Math.ceil(evaluateSystem(d.input, { flowMax: d.input.duty!.flow, points: 2 }).high[1] * 2) / 2 } }]);
  const inputs: [string, SystemInput][] = [...seeded, ["Booster", booster()]];
  const adjustments: Adjustment[] = [
    DEFAULT_ADJUSTMENT,
    { ...DEFAULT_ADJUSTMENT, method: "speed" },
    { ...DEFAULT_ADJUSTMENT, method: "trim" },
    { ...DEFAULT_ADJUSTMENT, arrangement: "parallel", dutyPumps: 2, standbyPumps: 1, motorRating: 15000 },
    { ...DEFAULT_ADJUSTMENT, arrangement: "series", dutyPumps: 2, ieClass: "IE4" },
  ];
  let read = 0;
  for (const [name, input] of inputs) {
    for (const [i, adj] of adjustments.entries()) {
      const { selectionId } = await freeze(`${name} ${i}`, input, adj, i % 2);
      const r = readStoredSelection(await frozenJsonOf(selectionId));
      expect(r.ok ? [] : r.problems, `${name}, adjustment ${i}`).toEqual([]);
      read++;
    }
  }
  expect(read).toBe((demoSystems().length + 1) * adjustments.length);
  // Without a duty the verdict is null and the energy has no cycle: it still reads.
  const systemId = await createSystem(v, projectId, "No duty", { ...booster(), duty: null });
  const added = await addCandidate(v, systemId, (await searchForSystem(v, (await freeze("Duty donor", booster())).systemId)).results[0].curveSetId, DEFAULT_ADJUSTMENT);
  if (!added.ok) throw new Error(added.reason);
  const noDuty = readStoredSelection(await frozenJsonOf(await selectCandidate(v, added.id, "No duty", "")));
  expect(noDuty.ok ? [] : noDuty.problems).toEqual([]);
  // The field-check fixture: no system curve, no energy, an empty library record (selections frozen before those existed).
  const fixture = readStoredSelection(JSON.stringify(frozenFixture()));
  expect(fixture.ok ? [] : fixture.problems).toEqual([]);
});

test("a viscous liquid: a selection frozen now (curve corrected per ANSI/HI 9.6.7) and one frozen before the correction ('viscosity-uncorrected', no result.viscosity) both read, and the report shows each as stored", async () => {
  // An oil (invented: 900 kg/m³, 0.05 Pa·s = 55.6 cSt) on the booster: B well above 1 on the demo pumps (ANSI/HI 9.6.7, from memory).
  const oil: SystemInput = { ...booster(), fluid: { kind: "custom", name: "Test oil", density: 900, dynamicViscosity: 0.05, vaporPressure: 100 } };
  const { selectionId } = await freeze("Booster on oil", oil);
  const now = JSON.parse(await frozenJsonOf(selectionId));
  expect(now.result.viscosity?.status).toBe("corrected"); // control: the frozen result carries the correction
  expect(now.result.verdict.reasons[0]).toMatch(/^Figures on the pumped liquid: curve corrected for viscosity per ANSI\/HI 9\.6\.7: B = /);
  const readNow = readStoredSelection(JSON.stringify(now));
  expect(readNow.ok ? [] : readNow.problems).toEqual([]);
  // As the code before the correction froze it: the water curve, the verdict 'viscosity-uncorrected' and no result.viscosity.
  const { viscosity: _v, ...oldResult } = now.result;
  const before = { ...now, result: { ...oldResult, verdict: { status: "viscosity-uncorrected", edge: "most lift, aged pipe",
    rule: "viscosity-uncorrected: a pump curve measured on water is judged on a liquid with ANSI/HI 9.6.7 parameter B above 1 only once corrected for viscosity (B = 9.05)",
    reasons: ["The pumped liquid's ANSI/HI 9.6.7 parameter B is 9.05, above 1: … cannot be signed off as is; correct the curve (or ask the maker for one on this liquid) and judge again.", "On the water curve (meets the duty): Delivers …"] } } };
  const readBefore = readStoredSelection(JSON.stringify(before));
  expect(readBefore.ok ? [] : readBefore.problems).toEqual([]);
  await db().update(selections).set({ frozenJson: JSON.stringify(before) }).where(eq(selections.id, selectionId));
  const page = await call(selectionPage.loader as never, { path: `/selections/${selectionId}`, params: { id: String(selectionId) }, cookie: m.cookie });
  expect(page.status).toBe(200);
  expect((page.body as { frozen: FrozenSelection }).frozen.result.verdict?.status).toBe("viscosity-uncorrected");
});

type Corruption = { name: string; corrupt: (f: Record<string, any>) => string; label: string; message: RegExp; stored: string | null }; // eslint-disable-line @typescript-eslint/no-explicit-any
/** Each corruption, the place it must be named by (stored-selection.ts) and what must be said (the schemas' messages, SI). */
const CASES: Corruption[] = [
  { name: "text that is not JSON (cut off)", corrupt: (f) => JSON.stringify(f).slice(0, 300), label: "the frozen selection", message: /^Is not valid JSON/, stored: null },
  {
    name: "a curve point's head as text",
    corrupt: (f) => JSON.stringify({ ...f, result: { ...f.result, curve: f.result.curve.map((p: object, i: number) => (i === 2 ? { ...p, head: "38 m" } : p)) } }),
    label: "result, curve as used, point 3, head",
    message: /^Should be a number\.$/,
    stored: '"38 m"',
  },
  { name: "a system input out of range (350 °C)", corrupt: (f) => JSON.stringify({ ...f, system: { ...f.system, input: { ...f.system.input, temperatureC: 350 } } }), label: "system, inputs, temperature", message: /^Temperature is too high: it takes from −50 °C to 300 °C, not 350 °C; check the value and its unit\.$/, stored: "350 °C" },
  { name: "the pump missing", corrupt: ({ pump: _p, ...f }) => JSON.stringify(f), label: "pump", message: /^Missing from the stored document\.$/, stored: null },
  {
    name: "a duty-cycle step's energy as text",
    corrupt: (f) => JSON.stringify({ ...f, energy: { ...f.energy, cycle: { ...f.energy.cycle, steps: f.energy.cycle.steps.map((s: object, i: number) => (i === 0 ? { ...s, energyKWh: "lots" } : s)) } } }),
    label: "energy over the duty cycle, duty cycle, step 1, energy",
    message: /^Should be a number\.$/,
    stored: '"lots"',
  },
];

describe.each(CASES)("a frozen selection with $name", (c) => {
  let s: { systemId: number; selectionId: number; checkId: number; title: string };
  beforeAll(async () => {
    const frozen = await freeze(`Booster (${c.name})`, { ...booster(), hoursPerYear: 4000, tariffPerKWh: 0.2 });
    // A check recorded while the document was sound, then the document corrupted in the database.
    const checkId = (await recordFieldCheck(v, frozen.selectionId, { readings: readings(38), fields: {}, notes: "", gradeId: "2B" }, [], { notify: false })).id;
    const raw = JSON.parse(await frozenJsonOf(frozen.selectionId));
    expect(raw.energy?.cycle?.steps?.length, JSON.stringify(raw.energy)).toBeGreaterThan(0); // control: the corruption below has a step to hit
    await db().update(selections).set({ frozenJson: c.corrupt(raw) }).where(eq(selections.id, frozen.selectionId));
    s = { ...frozen, checkId, title: `Booster (${c.name})` };
  });
  const get = (fn: unknown, path: string) => call(fn as never, { path, params: { id: String(s.selectionId) }, cookie: m.cookie });

  test("the report page refuses with 409: the stored selection cannot be read, and where — shown by its ErrorBoundary, no numbers (was: a 500, or the report half-rendered)", async () => {
    const r = await get(selectionPage.loader, `/selections/${s.selectionId}`);
    expect(r.status).toBe(409);
    const body = r.body as { detail: string; errors: { field: string; message: string }[] };
    expect(body.detail).toMatch(/^The stored selection ".*" \(report DM-\d{5}\) cannot be read: its frozen document does not pass the checks/);
    expect(body.detail).toContain(c.label);
    expect(body.errors.map((e) => e.message.split(": ")[0])).toContain(c.label);
    const Stub = createRoutesStub([{ path: "/selections/:id", Component: selectionPage.default as never, ErrorBoundary: selectionPage.ErrorBoundary as never }]);
    const html = renderToString(
      createElement(Stub, { initialEntries: [`/selections/${s.selectionId}`], hydrationData: { errors: { "0": new UNSAFE_ErrorResponseImpl(409, "Conflict", body) } } } as never),
    ).replace(/<!-- -->/g, "");
    expect(html).toContain("Not possible as things stand");
    expect(html).toContain("cannot be read");
    expect(html).not.toContain("Figures at the operating point");
  });

  test("both exports answer 409 problem+json naming the problem (was: a 500, or a file written from the damaged record)", async () => {
    for (const [fn, path] of [[selectionCsv.loader, `/selections/${s.selectionId}/export.csv`], [selectionJson.loader, `/selections/${s.selectionId}/export.json`]] as const) {
      const r = await get(fn, path);
      expect(r.status, path).toBe(409);
      expect(r.headers.get("content-type"), path).toBe("application/problem+json");
      const body = r.body as { title: string; detail: string; errors: { field: string; message: string }[] };
      expect(body.title).toBe("Conflict");
      expect(body.detail).toContain(c.label);
      const line = body.errors.find((e) => e.message.startsWith(`${c.label}: `))?.message ?? JSON.stringify(body.errors);
      const stored = c.stored ? ` (stored: ${c.stored})` : "";
      expect(line.endsWith(stored), line).toBe(true);
      expect(line.slice(c.label.length + 2, line.length - stored.length)).toMatch(c.message); // SI: the exports' units
      expect(JSON.stringify(body)).not.toContain("⟦");
    }
  });

  test("the field page refuses (409) and the phone's queue answers 409 problem+json; nothing recorded against it (was: a 500, or a check worked out against the damaged record)", async () => {
    const page = await get(fieldPage.loader, `/field/selections/${s.selectionId}`);
    expect(page.status).toBe(409);
    expect((page.body as { detail: string }).detail).toContain("cannot be read");
    const form = new FormData();
    for (const [k, x] of Object.entries({ ...fieldsForHead(38, RHO20, { flow: "0.011" }), clientId: `frozen-${s.selectionId}-queue`, pageWorkspaceId: String(m.workspaceId) })) form.set(k, x);
    const queued = await call(fieldQueue.action as never, { path: `/field/selections/${s.selectionId}/checks`, params: { id: String(s.selectionId) }, cookie: m.cookie, body: form });
    expect(queued.status).toBe(409);
    expect(queued.headers.get("content-type")).toBe("application/problem+json");
    expect((queued.body as { detail: string }).detail).toContain(c.label);
    expect((await db().select({ id: fieldChecks.id }).from(fieldChecks).where(eq(fieldChecks.selectionId, s.selectionId))).map((x) => x.id)).toEqual([s.checkId]);
  });

  test("a check recorded before still shows its own stored record, and the checks' CSV still lists it (it never reads the frozen document)", async () => {
    const r = await call(checkPage.loader as never, { path: `/field/checks/${s.checkId}`, params: { id: String(s.checkId) }, cookie: m.cookie });
    expect(r.status).toBe(200);
    expect((r.body as { check: { id: number } }).check.id).toBe(s.checkId);
    const csv = await get(fieldCsv.loader, `/field/selections/${s.selectionId}/export.csv`);
    expect(csv.status).toBe(200);
    expect(String(csv.body)).toContain(`selection ${s.selectionId}`);
  });
});
