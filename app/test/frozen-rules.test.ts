// A selection is read under the input rules it was frozen under. The system input's rules grew after selections were
// frozen (roughness refused from half the inner diameter, helper "systexts"; before it, from the whole diameter): a
// selection frozen before, with a run whose roughness lies between the two, was refused (409) by the report and both
// exports, because its frozen input was checked against today's schema. What was signed must always read back, as
// frozen; the same input in a live system still needs review (it is computed with today's rules).
// Real route modules, guards and MariaDB (app/test/harness.ts). Check values: our product rules (system-input.ts: ε below
// D/2 for a live input; ε below D, at most 0.05 m, when the selections here were frozen) and the demo curves
// (fixtures/demo/tallowmere.csv, invented).
import { afterAll, beforeAll, expect, test } from "vitest";
import { eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { selections } from "@db/schema";
import type { Viewer } from "~/lib/libraries";
import { addCandidate, createProject, createSystem, searchForSystem, selectCandidate } from "~/lib/projects";
import { DEFAULT_ADJUSTMENT, type SystemInput } from "~/lib/projects/hydraulics";
import { readStoredInput } from "~/lib/projects/stored-input";
import { boosterInput, demoLibrary, viewerOfUser } from "~/lib/projects/test-kit";
import * as selectionPage from "~/routes/selections.$id";
import * as selectionJson from "~/routes/selections.$id.export-json";
import * as selectionCsv from "~/routes/selections.$id.export-csv";
import * as apiSystem from "~/routes/api.v1.systems.$id";
import { call, makeMember, type TestMember } from "./harness";
import { selectionPages } from "./selection-pages";

afterAll(() => closeDb());

let m: TestMember;
let v: Viewer;
let projectId = 0;

beforeAll(async () => {
  m = await makeMember("admin");
  v = await viewerOfUser(m.userId);
  await demoLibrary(v, "Frozen rules pumps");
  projectId = await createProject(v, { name: "Frozen rules", site: "", description: "" });
});

/** The booster's first run as a typed 50 mm bore with a roughness of `roughness` m, new and aged (invented). */
const roughRun = (input: SystemInput, diameter: number, roughness: number): SystemInput => ({
  ...input,
  runs: input.runs.map((r, i) => (i === 0 ? { ...r, pipeTable: "", nominal: "", diameter, roughness, agedRoughness: roughness } : r)),
});

/** A booster selection frozen by the app, then its frozen input's first run set as `roughRun` gives it, in MariaDB: as frozen before the rule. */
async function frozenBefore(name: string, diameter: number, roughness: number) {
  const systemId = await createSystem(v, projectId, name, boosterInput());
  const found = await searchForSystem(v, systemId);
  expect(found.results.length, name).toBeGreaterThan(0); // control: the demo curves serve the booster
  const added = await addCandidate(v, systemId, found.results[0].curveSetId, DEFAULT_ADJUSTMENT);
  if (!added.ok) throw new Error(added.reason);
  const id = await selectCandidate(v, added.id, name, "");
  const [row] = await db().select().from(selections).where(eq(selections.id, id));
  const frozen = JSON.parse(row.frozenJson);
  frozen.system.input = roughRun(frozen.system.input, diameter, roughness);
  await db().update(selections).set({ frozenJson: JSON.stringify(frozen) }).where(eq(selections.id, id));
  return { id, frozen };
}
const get = (fn: unknown, path: string, id: number) => call(fn as never, { path, params: { id: String(id) }, cookie: m.cookie });

test("a selection frozen with ε = 0.6·D (50 mm bore, 30 mm roughness new and aged; below D and 0.05 m, so valid then) reads: report, JSON and CSV answer 200 with its numbers as frozen (was: 409, 2 roughness problems)", async () => {
  const { id, frozen } = await frozenBefore("Rough bore", 0.05, 0.03);
  const report = await get(selectionPage.loader, `/selections/${id}`, id);
  expect(report.status, JSON.stringify(report.body).slice(0, 400)).toBe(200);
  const shown = (report.body as { frozen: typeof frozen }).frozen;
  expect(shown.system.input.runs[0]).toMatchObject({ diameter: 0.05, roughness: 0.03, agedRoughness: 0.03 });
  // Its numbers as frozen: the system curve and the result are the stored ones, not worked out again under today's rule.
  expect(shown.systemCurve.design).toEqual(frozen.systemCurve.design);
  expect(shown.result.operating).toEqual(frozen.result.operating);
  expect(shown.result.figures.shaftPower).toBe(frozen.result.figures.shaftPower);

  const json = await get(selectionJson.loader, `/selections/${id}/export.json`, id);
  expect(json.status).toBe(200);
  const exported = json.body as typeof frozen;
  expect(exported.system.input).toEqual(frozen.system.input);
  expect(exported.result.operating).toEqual(frozen.result.operating);

  const csv = await get(selectionCsv.loader, `/selections/${id}/export.csv`, id);
  expect(csv.status).toBe(200);
  // The report rendered by its page component and the CSV parsed (selection-pages.ts asserts 200 on both): neither throws.
  const pages = await selectionPages(m, id);
  expect(pages.text).toContain("Figures at the operating point");
  expect(pages.csv.length).toBeGreaterThan(10);
});

test("the rule a selection was frozen under still holds: ε not below D (40 mm bore, 45 mm roughness) is refused (409) naming the roughness", async () => {
  const { id } = await frozenBefore("Closed bore", 0.04, 0.045);
  for (const [fn, path] of [[selectionPage.loader, `/selections/${id}`], [selectionJson.loader, `/selections/${id}/export.json`], [selectionCsv.loader, `/selections/${id}/export.csv`]] as const) {
    const r = await get(fn, path, id);
    expect(r.status, path).toBe(409);
    expect((r.body as { detail: string }).detail, path).toContain("pipe run 1, roughness");
  }
});

test("a live system storing ε = 0.6·D still needs review (today's rule, both numbers): the stored input names both roughnesses, the read API answers 409", async () => {
  const input = roughRun(boosterInput(), 0.05, 0.03);
  const r = readStoredInput(JSON.stringify(input));
  expect(r.ok).toBe(false);
  const problems = r.ok ? [] : r.problems;
  expect(problems.map((p) => p.label)).toEqual(["pipe run 1, roughness", "pipe run 1, aged roughness"]);
  expect(problems[0].message).toMatch(/is not below half the inner diameter/);
  const systemId = await createSystem(v, projectId, "Live rough bore", input);
  const api = await get(apiSystem.loader, `/api/v1/systems/${systemId}`, systemId);
  expect(api.status).toBe(409);
});
