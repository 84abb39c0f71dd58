// A candidate whose stored adjustment no longer passes AdjustmentSchema (stored under an older or looser schema, edited
// in the database, text that is not JSON) used to be evaluated as DEFAULT_ADJUSTMENT — as published, one pump — under its
// own name: drawn, compared, given a verdict and selectable (or a 500 for non-JSON). Here a booster gets two candidates,
// one's adjustment_json is corrupted directly in MariaDB, and every path must answer honestly: the system page lists it as
// needing review with its problems in plain words and the adjust form (stored values), keeps it out of the chart, the
// comparison and selection (409), the read API lists it apart; applying an adjustment or removing it is the way out.
// Real route modules, guards and MariaDB (app/test/harness.ts). Check values: our product rules (stored-adjustment.ts,
// the schema's own messages and limits in candidate-input.ts) and the demo curves (fixtures/demo/tallowmere.csv, invented).
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { candidates, selections } from "@db/schema";
import type { Viewer } from "~/lib/libraries";
import { addCandidate, createSystem, searchForSystem } from "~/lib/projects";
import { DEFAULT_ADJUSTMENT } from "~/lib/projects/hydraulics";
import { boosterInput, demoProjectFixture } from "~/lib/projects/test-kit";
import type { WorkbenchView } from "~/lib/projects/workbench-view";
import * as systemPage from "~/routes/systems.$id";
import SystemPageView from "~/routes/systems.$id";
import * as apiSystem from "~/routes/api.v1.systems.$id";
import { call, type TestMember } from "./harness";
import { renderPage } from "./render-page";

afterAll(() => closeDb());

let m: TestMember;
let v: Viewer;
let projectId = 0;
const booster = boosterInput;

beforeAll(async () => void ({ m, v, projectId } = await demoProjectFixture("Stored adjustment pumps", "Stored adjustments")));

type Corruption = { name: string; corrupt: (adj: Record<string, unknown>) => string; label: string; message: RegExp; stored: string | null };
/** Each corruption, the place it must be named by (stored-adjustment.ts) and what must be said (the schema's messages, SI). */
const CASES: Corruption[] = [
  { name: "duty pumps out of range (0; the schema allows 1 to 8)", corrupt: (a) => JSON.stringify({ ...a, dutyPumps: 0 }), label: "duty pumps", message: /^The number of duty pumps is a whole number from 1 to 8\.$/, stored: "0" },
  { name: "the method missing", corrupt: ({ method: _m, ...a }) => JSON.stringify(a), label: "adjusted by (nothing, speed or trim)", message: /^Missing from the stored document\.$/, stored: null },
  { name: "a ratio out of range (150 %; the schema allows 30 to 120 %)", corrupt: (a) => JSON.stringify({ ...a, method: "speed", ratio: 1.5 }), label: "ratio", message: /^The ratio is 30 % to 120 %/, stored: "150 %" },
  { name: "text that is not JSON (cut off)", corrupt: (a) => JSON.stringify(a).slice(0, 20), label: "the stored adjustment", message: /^Is not valid JSON/, stored: null },
];

/** A booster with two candidates (added while good), then the second's adjustment_json corrupted in the database. */
async function corrupted(c: Corruption) {
  const systemId = await createSystem(v, projectId, `Booster (${c.label})`, booster());
  const found = await searchForSystem(v, systemId);
  expect(found.results.length).toBeGreaterThan(1); // control: the booster finds pumps
  const good = await addCandidate(v, systemId, found.results[0].curveSetId, DEFAULT_ADJUSTMENT);
  const bad = await addCandidate(v, systemId, found.results[1].curveSetId, { ...DEFAULT_ADJUSTMENT, arrangement: "parallel", dutyPumps: 2, standbyPumps: 1 });
  if (!good.ok || !bad.ok) throw new Error("not added");
  const [row] = await db().select().from(candidates).where(eq(candidates.id, bad.id));
  await db().update(candidates).set({ adjustmentJson: c.corrupt(JSON.parse(row.adjustmentJson)) }).where(eq(candidates.id, bad.id));
  return { systemId, good: good.id, bad: bad.id };
}

const page = (systemId: number) => call(systemPage.loader as never, { path: `/systems/${systemId}`, params: { id: String(systemId) }, cookie: m.cookie });
const act = (systemId: number, form: Record<string, string>) => call(systemPage.action as never, { path: `/systems/${systemId}`, params: { id: String(systemId) }, cookie: m.cookie, form });
type PageData = { view: WorkbenchView | null };

describe.each(CASES)("a candidate's stored adjustment with $name", (c) => {
  let s: Awaited<ReturnType<typeof corrupted>>;
  beforeAll(async () => {
    s = await corrupted(c);
  });

  test("the system page lists it as needing review with its problem in plain words, and evaluates only the other (was: evaluated as published on one pump, or a 500)", async () => {
    const r = await page(s.systemId);
    expect(r.status).toBe(200);
    const view = (r.body as PageData).view!;
    expect(view.evaluation).toBeTruthy(); // the system itself is fine
    expect(view.candidates.map((x) => x.id)).toEqual([s.good]); // kept out of the chart, comparison and energy panel
    expect(view.candidates[0].result?.operating).toBeTruthy();
    expect(view.needsReview.map((x) => x.id)).toEqual([s.bad]);
    const p = view.needsReview[0].problems.find((x) => x.label === c.label);
    expect(p, JSON.stringify(view.needsReview)).toBeTruthy();
    expect(p!.message).toMatch(c.message);
    expect(p!.stored).toBe(c.stored);
    // The adjust form gets the stored values, never the default adjustment's (the corrupted one ran 2 in parallel + 1 standby).
    const form = view.needsReview[0].form;
    if (c.label === "the stored adjustment") expect([form.dutyPumps, form.standbyPumps, form.serviceFactor]).toEqual([NaN, NaN, NaN]); // nothing readable: blank
    else expect([form.arrangement, form.dutyPumps, form.standbyPumps]).toEqual(["parallel", c.label === "duty pumps" ? 0 : 2, 1]);
  });

  test("the page renders it in the candidates panel (problem, adjust form, remove), not in the comparison table, and without NaN", async () => {
    const data = (await page(s.systemId)).body;
    const html = renderPage("/systems/:id", SystemPageView, `/systems/${s.systemId}`, data).replace(/<!-- -->/g, "");
    const review = /data-testid="candidates-needing-review"[\s\S]*?(?=<\/section>)/.exec(html)?.[0] ?? "";
    expect(review).toContain("1 candidate needs review: the stored adjustment does not pass the checks");
    expect(review).toContain(c.label);
    expect(review).toContain(`name="candidateId" value="${s.bad}"`); // its own adjust form and remove button
    expect(review).toMatch(/value="adjust"/);
    expect(review).toMatch(/value="remove-candidate"/);
    const table = /aria-label="Candidates compared"[\s\S]*?<\/table>/.exec(html)?.[0] ?? "";
    expect(table).toContain(`value="${s.good}"`);
    expect(table).not.toContain(`value="${s.bad}"`);
    expect(html.match(/Select this pump/g)).toHaveLength(1); // only the readable candidate
    expect(html).not.toContain("NaN");
  });

  test("selecting it refuses (409 naming the problem), nothing frozen (was: a selection of the pump as published on one pump)", async () => {
    const r = await act(s.systemId, { intent: "select", candidateId: String(s.bad), title: "", note: "" });
    expect(r.status).toBe(409);
    expect((r.body as { detail: string }).detail).toContain(c.label);
    expect(await db().select({ id: selections.id }).from(selections).where(eq(selections.systemId, s.systemId))).toEqual([]);
  });

  test("the read API lists it under needsReview, not among the evaluated candidates, its problem in the caller's units", async () => {
    const r = await call(apiSystem.loader as never, { path: `/api/v1/systems/${s.systemId}`, params: { id: String(s.systemId) }, cookie: m.cookie });
    expect(r.status).toBe(200);
    const body = r.body as WorkbenchView;
    expect(body.candidates.map((x) => x.id)).toEqual([s.good]);
    expect(body.needsReview.map((x) => x.id)).toEqual([s.bad]);
    expect(body.needsReview[0].problems.some((p) => p.label === c.label && c.message.test(p.message))).toBe(true);
    expect(JSON.stringify(body)).not.toContain("⟦");
  });
});

test("applying an adjustment that passes brings the candidate back into the comparison; removing one needing review removes it", async () => {
  const s = await corrupted(CASES[0]);
  const form = { intent: "adjust", candidateId: String(s.bad), method: "none", ratio: "", arrangement: "parallel", dutyPumps: "0", standbyPumps: "1", motorRating: "", serviceFactor: "1", ieClass: "IE3" };
  const refused = await act(s.systemId, form); // the stored 0 as shown in the form is refused again, nothing written
  expect((refused.body as { errors: Record<string, string> }).errors[`adj.${s.bad}`]).toMatch(/duty pumps/);
  expect(((await page(s.systemId)).body as PageData).view!.needsReview).toHaveLength(1);
  const fixed = await act(s.systemId, { ...form, dutyPumps: "2" });
  expect((fixed.body as { notice: string }).notice).toBe("Candidate adjusted.");
  const after = ((await page(s.systemId)).body as PageData).view!;
  expect(after.needsReview).toEqual([]);
  expect(after.candidates.map((x) => [x.id, x.adjustment.dutyPumps])).toEqual([[s.good, 1], [s.bad, 2]]);

  const t = await corrupted(CASES[3]);
  const removed = await act(t.systemId, { intent: "remove-candidate", candidateId: String(t.bad) });
  expect((removed.body as { notice: string }).notice).toBe("Candidate removed.");
  const left = ((await page(t.systemId)).body as PageData).view!;
  expect([left.candidates.map((x) => x.id), left.needsReview]).toEqual([[t.good], []]);
});
