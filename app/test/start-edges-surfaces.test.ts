// A start warning that holds at both edges of the band (arrangement-start.ts) is one line on every surface that shows the
// candidate's warnings: the system page's candidates table, the systems read API (warnings and cautions), the selection's
// report (Notes) and its CSV (warning_N). Real route modules and MariaDB. Check values: common practice, from memory (in
// parallel a pump starts against the head of those running, behind a check valve); the drooping curve is invented
// (droop-pump.ts: 40 m shut-off, 41.9 m peak) and the heads and flows quoted are read off it — the numbers the old two lines
// showed, one per edge (arrangement-start-edges.test.ts).
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import { createApiToken } from "~/lib/auth/api-tokens.server";
import type { Viewer } from "~/lib/libraries";
import { addCandidate, createProject, createSystem, selectCandidate } from "~/lib/projects";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, type Adjustment } from "~/lib/projects/hydraulics";
import { viewerOfUser } from "~/lib/projects/test-kit";
import { inSI } from "~/engine/quantityText";
import * as apiSystem from "~/routes/api.v1.systems.$id";
import * as systemPage from "~/routes/systems.$id";
import SystemPageView from "~/routes/systems.$id";
import { call, makeMember, type TestMember } from "./harness";
import { renderPage } from "./render-page";
import { importDroopPump } from "./droop-pump";
import { csvFigures, selectionPages, textOf } from "./selection-pages";

afterAll(() => closeDb());

const M3H = 1 / 3600;
const PARALLEL: Adjustment = { ...DEFAULT_ADJUSTMENT, arrangement: "parallel", dutyPumps: 2 };
/** The one line: 37–38 m static, pump 1 alone holds 40.5 m (least lift) and 41.5 m (most lift), above the 40 m shut-off. */
const LINE = "At both edges of the band, with 1 pump running in parallel the system holds 40.5 m at 56.1 m³/h (least lift, new pipe) and 41.5 m at 46.7 m³/h (most lift, aged pipe), above one pump's shut-off head 40.0 m: pump 2 of 2, started then, cannot open its check valve, so only 1 of the 2 deliver and it runs at zero flow against its closed check valve (dead-head), churning and heating the liquid, below any minimum continuous flow (common practice: a pump in parallel starts against the head of those running; at or above its shut-off head, to 1 part in 10⁸, it delivers no flow)";
const START = /cannot open its check valve, so only/;

let m: TestMember;
let v: Viewer;
let systemId = 0;
let candidateId = 0;
let token = "";
beforeAll(async () => {
  m = await makeMember("admin");
  v = await viewerOfUser(m.userId);
  const setId = await importDroopPump(v);
  const project = await createProject(v, { name: "Start edges", site: "", description: "" });
  systemId = await createSystem(v, project, "Two in parallel, 37–38 m", { ...defaultSystemInput(), staticLow: 37, staticHigh: 38, duty: { flow: 40 * M3H, head: 40 } });
  const added = await addCandidate(v, systemId, setId, PARALLEL);
  if (!added.ok) throw new Error(added.reason);
  candidateId = added.id;
  token = (await createApiToken({ userId: m.userId, workspaceId: m.workspaceId, name: "r", scope: "read" })).token;
});

describe("pump 2 of 2 cannot start at either edge: one line, both edges' numbers", () => {
  test("systems read API: result.warnings and result.cautions carry it once", async () => {
    const r = await call(apiSystem.loader as never, { path: `/api/v1/systems/${systemId}`, params: { id: String(systemId) }, headers: { authorization: `Bearer ${token}` } });
    expect(r.status).toBe(200);
    const res = (r.body as { candidates: { result: { warnings: string[]; cautions: string[] } }[] }).candidates[0].result;
    expect(res.warnings.map(inSI).filter((w) => START.test(w))).toEqual([LINE]); // old code: two lines, one per edge
    expect(res.cautions.map(inSI).filter((w) => START.test(w))).toEqual([LINE]);
  });
  test("the system page's candidates table lists it once", async () => {
    const r = await call(systemPage.loader as never, { path: `/systems/${systemId}`, params: { id: String(systemId) }, cookie: m.cookie });
    expect(r.status).toBe(200);
    const text = textOf(renderPage("/systems/:id", SystemPageView, `/systems/${systemId}`, r.body));
    expect(text.split("cannot open its check valve, so only")).toHaveLength(2); // once; old code: twice
    expect(text).toContain("40.5 m at 56.1 m³/h (least lift, new pipe) and 41.5 m at 46.7 m³/h (most lift, aged pipe)");
  });
  test("the selection's report (Notes) and CSV (warning_N) carry it once", async () => {
    const id = await selectCandidate(v, candidateId, "Two in parallel", "");
    const pages = await selectionPages(m, id);
    expect(pages.text.split("cannot open its check valve, so only")).toHaveLength(2); // once; old code: twice
    expect(pages.text).toContain(LINE);
    const rows = [...csvFigures(pages.csv)].filter(([k, [val]]) => /^warning_\d+$/.test(k) && START.test(val)).map(([, [val]]) => val);
    expect(rows).toEqual([LINE]); // old code: warning_N and warning_N+1, one per edge
  });
});
