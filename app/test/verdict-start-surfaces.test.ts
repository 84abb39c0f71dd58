// The staged-start qualifier of the verdict (verdict-start.ts, DEVELOPERS.md "enginetexts") on the read APIs and the search
// row, beside `verdictNpsh`: the systems API's candidates (GET /api/v1/systems/:id, POST …/preview) carry `result.verdictStart`
// and `result.stagedStart` (the numbers behind it); a search row carries `verdictStart` (API) and shows it on its verdict line
// (page), nothing where there is no note. The search judges each pump alone, so a real search row's note is null; the row's
// view and the page are shown the note of the same pump evaluated in parallel.
// Check values: common practice, from memory (in parallel a pump starts against the head of those running, behind a check
// valve); the note's text and its heads and flows are those selection-start-texts.test.ts reads off the invented curve below
// (40 m shut-off, 41.9 m peak): pump 1 alone holds 41.2 m and delivers 50.8 m³/h at most lift, aged pipe.
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import { createApiToken } from "~/lib/auth/api-tokens.server";
import type { Viewer } from "~/lib/libraries";
import { addCandidate, createProject, createSystem, searchForSystem } from "~/lib/projects";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, evaluateCandidate, type Adjustment, type SystemInput } from "~/lib/projects/hydraulics";
import { searchResultView } from "~/lib/projects/search-view";
import { viewerOfUser } from "~/lib/projects/test-kit";
import { renderDeep, SI_UNITS } from "~/lib/shared/units";
import * as apiSystem from "~/routes/api.v1.systems.$id";
import * as apiPreview from "~/routes/api.v1.systems.$id.preview";
import * as apiSearch from "~/routes/api.v1.systems.$id.search";
import * as searchPage from "~/routes/systems.$id.search";
import { call, makeMember, type TestMember } from "./harness";
import { plainHtml, renderPage } from "./render-page";
import { DROOP_ROWS, importDroopPump } from "./droop-pump";

afterAll(() => closeDb());

const M3H = 1 / 3600;
const NOTE = "but started one after another (duty/standby staging) the duty is not met: at most lift, aged pipe pump 2 of 2 cannot open its check valve against the 41.2 m pump 1 holds (above its shut-off head 40.0 m), so only 1 delivers, 50.8 m³/h, below the duty 54.0 m³/h; the verdict assumes the 2 started together";

const sys = (staticLow: number, staticHigh: number): SystemInput => ({ ...defaultSystemInput(), staticLow, staticHigh, duty: { flow: 54 * M3H, head: 40 } });
/** A1: two pumps in parallel against 36–37 m static, duty 54 m³/h at 40 m (meets together, not started one after another). */
const A1 = () => sys(36, 37);
/** The flip: 30–32 m static, pump 1 alone holds less than the 40 m shut-off head, so pump 2 starts. */
const FLIP = () => sys(30, 32);
const PARALLEL: Adjustment = { ...DEFAULT_ADJUSTMENT, arrangement: "parallel", dutyPumps: 2 };

let m: TestMember;
let v: Viewer;
let token = "";
let setId = 0;
let project = 0;
let a1Id = 0;
let flipId = 0;
beforeAll(async () => {
  m = await makeMember("admin");
  v = await viewerOfUser(m.userId);
  setId = await importDroopPump(v); // droop-pump.ts: 40 m shut-off, 41.9 m peak (invented)
  project = await createProject(v, { name: "Start surfaces", site: "", description: "" });
  a1Id = await createSystem(v, project, "A1 two in parallel", A1());
  flipId = await createSystem(v, project, "Two in parallel, less lift", FLIP());
  for (const id of [a1Id, flipId]) {
    const added = await addCandidate(v, id, setId, PARALLEL);
    if (!added.ok) throw new Error(added.reason);
  }
  token = (await createApiToken({ userId: m.userId, workspaceId: m.workspaceId, name: "r", scope: "read" })).token;
});

type ApiResult = { verdict: { status: string } | null; verdictStart?: string | null; stagedStart?: { at: string; running: number; of: number; heldHead: number; shutoffHead: number; flow: number; leastFlow: number }[] };
const auth = () => ({ authorization: `Bearer ${token}` });
async function read(id: number): Promise<ApiResult> {
  const r = await call(apiSystem.loader as never, { path: `/api/v1/systems/${id}`, params: { id: String(id) }, headers: auth() });
  expect(r.status).toBe(200);
  return (r.body as { candidates: { result: ApiResult }[] }).candidates[0].result;
}
async function preview(id: number, input: SystemInput): Promise<ApiResult> {
  const r = await call(apiPreview.action as never, { path: `/api/v1/systems/${id}/preview`, method: "POST", params: { id: String(id) }, headers: { ...auth(), "content-type": "application/json" }, body: JSON.stringify({ input }) });
  expect(r.status).toBe(200);
  return (r.body as { candidates: { result: ApiResult }[] }).candidates[0].result;
}

describe("systems read API: result.verdictStart beside verdictNpsh, result.stagedStart its numbers", () => {
  for (const [name, a1, flip] of [
    ["GET /api/v1/systems/:id", () => read(a1Id), () => read(flipId)],
    ["POST …/preview", () => preview(flipId, A1()), () => preview(a1Id, FLIP())],
  ] as const) {
    test(`${name}, A1: the note with both heads, the flow and the duty`, async () => {
      const r = await a1();
      expect(r.verdict?.status).toBe("meets"); // control: together they meet the duty
      expect(r.verdictStart).toBe(NOTE); // old code: undefined (no verdictStart)
      expect(r.stagedStart).toHaveLength(1);
      const s = r.stagedStart![0];
      expect({ at: s.at, running: s.running, of: s.of, shutoffHead: s.shutoffHead }).toEqual({ at: "most lift, aged pipe", running: 1, of: 2, shutoffHead: 40 });
      expect(s.heldHead).toBeCloseTo(41.2, 1); // m, read off the invented curve (as the note)
      expect(s.flow / M3H).toBeCloseTo(50.8, 1); // m³/h
      expect(s.flow).toBeLessThan(s.leastFlow); // the rule: below duty × (1 − minus)
    });
    test(`${name}, the flip (30–32 m static): verdictStart null, stagedStart []`, async () => {
      const r = await flip();
      expect(r.verdict).not.toBeNull();
      expect(r.verdictStart).toBeNull(); // old code: undefined
      expect(r.stagedStart).toEqual([]);
    });
  }
});

/** The search row of the drooping pump on a system (the search judges it alone: as published, one pump). */
async function droopRow(id: number) {
  const row = (await searchForSystem(v, id, { allowBeyondCatalogue: true })).results.find((x) => x.curveSetId === setId);
  expect(row).toBeDefined();
  return row!;
}
/** The same pump evaluated as the search row's setting, two in parallel: its verdict and staged starts. */
function inParallel(input: SystemInput, method: string) {
  const e = evaluateCandidate(input, { points: DROOP_ROWS.map(([q, h, eff]) => ({ flow: q * M3H, head: h, efficiency: eff / 100, power: null, npshr: null })), speed: 2900, impellerDiameter: 0.2 }, { ...PARALLEL, method: method === "direct" ? "none" : (method as Adjustment["method"]) });
  return { verdict: e.verdict, stagedStart: e.stagedStart };
}

describe("search row: verdictStart beside verdictNpsh", () => {
  test("the search API's row has the key, null: the search judges one pump", async () => {
    const r = await call(apiSearch.loader as never, { path: `/api/v1/systems/${a1Id}/search`, params: { id: String(a1Id) }, headers: auth() });
    expect(r.status).toBe(200);
    const row = (r.body as { results: { curveSetId: number; verdictStart?: string | null }[] }).results.find((x) => x.curveSetId === setId);
    expect(row).toBeDefined();
    expect(row).toHaveProperty("verdictStart", null); // old code: no verdictStart key
  });
  test("the row's view carries the note of the same pump in parallel on A1, none on the flip", async () => {
    const a1 = await droopRow(a1Id);
    expect(renderDeep(searchResultView({ ...a1, ...inParallel(A1(), a1.method) }), SI_UNITS).verdictStart).toBe(NOTE); // old code: undefined
    const flip = await droopRow(flipId);
    expect(searchResultView({ ...flip, ...inParallel(FLIP(), flip.method) }).verdictStart).toBeNull();
  });
  test("the page shows a row's note on its verdict line, and nothing (no key, no span) where there is none", async () => {
    const r = await call(searchPage.loader as never, { path: `/systems/${a1Id}/search`, params: { id: String(a1Id) }, cookie: m.cookie });
    expect(r.status).toBe(200);
    const body = r.body as { results: { curveSetId: number }[] };
    const i = body.results.findIndex((x) => x.curveSetId === setId);
    expect(i).toBeGreaterThanOrEqual(0);
    expect(body.results[i]).not.toHaveProperty("verdictStart"); // the real row: one pump, no note, no key
    const html = (data: unknown) => plainHtml(renderPage("/systems/:id/search", searchPage.default, `/systems/${a1Id}/search`, data));
    expect(html(body)).not.toContain(`search-verdict-${setId}-start`);
    const withNote = { ...body, results: body.results.map((x, j) => (j === i ? { ...x, verdictStart: NOTE } : x)) };
    const line = /data-testid="search-verdict-(\d+)-start"[^>]*>([\s\S]*?)<\/span>/.exec(html(withNote));
    expect(line?.[1]).toBe(String(setId)); // old code: no such span (the page ignored it)
    expect(line?.[2].replace(/<[^>]+>/g, "")).toBe(` — ${NOTE}`);
  });
});
