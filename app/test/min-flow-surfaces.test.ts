// A duty below the maker's minimum continuous flow (verdict-min-flow.ts) wherever the verdict is a headline: the system
// page's candidates table (the verdict's line and the "Maker's minimum flow" row) and chart label, in the reader's units
// (SI and US); the systems read API (`result.verdictMinFlow`, `result.minFlow`); the report's verdict line and figures; the
// selection CSV (`verdict_min_flow`, `maker_min_flow`, `maker_min_flow_as_run`, `duty_flow_per_running_pump`) and JSON
// (`verdictMinFlow`, `pump.minFlow`); and a duty-cycle step below it in the CSV's step warnings. The library is imported
// from a CSV with the optional `min_flow_m3h` column (12 m³/h). Duty 8 m³/h: below it; 12 m³/h: at it, nothing said.
// Invented pump (the staged-NPSH fixture's curve); check values from construction and NIST SP 811 (1 gpm = 3.785411784 L/min).
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { createElement } from "react";
import { renderToString } from "react-dom/server";
import { createRoutesStub } from "react-router";
import { eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { users } from "@db/schema";
import { createApiToken } from "~/lib/auth/api-tokens.server";
import { createLibrary, listModels, type Viewer } from "~/lib/libraries";
import { addCandidate, createProject, createSystem, selectCandidate, systemWorkbench } from "~/lib/projects";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, type SystemInput } from "~/lib/projects/hydraulics";
import { importCsvText, viewerOfUser } from "~/lib/projects/test-kit";
import * as apiSystem from "~/routes/api.v1.systems.$id";
import * as apiSearch from "~/routes/api.v1.systems.$id.search";
import SearchPage, * as searchPage from "~/routes/systems.$id.search";
import * as selectionJson from "~/routes/selections.$id.export-json";
import SystemPage, * as systemPage from "~/routes/systems.$id";
import { call, makeMember, type TestMember } from "./harness";
import { csvFigures, selectionPages, textOf } from "./selection-pages";

afterAll(() => closeDb());

const M3H = 1 / 3600;
const CSV = [
  "model,type,size,speed_rpm,impeller_mm,flow_m3h,head_m,efficiency_pct,npshr_m,min_flow_m3h",
  ...[[0, 22, 0, ""], [5, 21.8, 30, 1.2], [10, 21.5, 45, 1.3], [20, 20, 62, 1.6], [30, 17.5, 72, 2.0], [36, 15.5, 74, 2.4], [45, 12, 70, 3.2], [55, 7, 60, 4.5]].map((r) => `Minflow 50,end-suction,DN50,2900,200,${r.join(",")},12`),
].join("\n");
const base = defaultSystemInput();
const sysAt = (duty: number): SystemInput => ({ ...base, duty: { flow: duty * M3H, head: 12 }, energy: { ...base.energy!, profile: [{ flowFraction: 1, hours: 2000 }, { flowFraction: 0.5, hours: 1000 }] } });

let m: TestMember;
let us: TestMember;
let v: Viewer;
let token = "";
let setId = 0;
const systems = { below: 0, at: 0, none: 0 };
const selections = { below: 0, at: 0 };
beforeAll(async () => {
  m = await makeMember("admin");
  us = await makeMember("admin", m.workspaceId); // sees the workspace's private library, as its owner does
  await db().update(users).set({ unitSystem: "US" }).where(eq(users.id, us.userId));
  v = await viewerOfUser(m.userId);
  const lib = await createLibrary(v, { name: "Maker's minimum flow", description: "" });
  await importCsvText(v, lib, CSV, "minflow.csv");
  setId = (await listModels(v, lib))[0].curves[0].id;
  const project = await createProject(v, { name: "Min flow surfaces", site: "", description: "" });
  for (const [k, duty] of [["below", 8], ["at", 12]] as const) {
    systems[k] = await createSystem(v, project, `Min flow ${k}`, sysAt(duty));
    const added = await addCandidate(v, systems[k], setId, { ...DEFAULT_ADJUSTMENT, motorRating: 3000 });
    if (!added.ok) throw new Error(added.reason);
    selections[k] = await selectCandidate(v, (await systemWorkbench(v, systems[k])).candidates[0].id, `Min flow ${k}`, "");
  }
  // The same pump from a file without the column: no figure recorded.
  const plain = await createLibrary(v, { name: "No minimum flow", description: "" });
  await importCsvText(v, plain, CSV.replace(",min_flow_m3h", "").replace(/,12$/gm, ""), "plain.csv");
  systems.none = await createSystem(v, project, "Min flow none", sysAt(8));
  const plainAdded = await addCandidate(v, systems.none, (await listModels(v, plain))[0].curves[0].id, { ...DEFAULT_ADJUSTMENT, motorRating: 3000 });
  if (!plainAdded.ok) throw new Error(plainAdded.reason);
  token = (await createApiToken({ userId: m.userId, workspaceId: m.workspaceId, name: "r", scope: "read" })).token;
});

const LINE_SI = /^(but|and) runs below the maker's minimum flow: 8\.00 m³\/h < 12\.0 m³\/h$/; // 8 and 12 m³/h (construction)
const LINE_US = /^(but|and) runs below the maker's minimum flow: 35\.2 gpm < 52\.8 gpm$/; // 8 m³/h = 35.22 gpm, 12 m³/h = 52.83 gpm (NIST SP 811)

async function systemHtml(id: number, member: TestMember) {
  const sys = await call(systemPage.loader as never, { path: `/systems/${id}`, cookie: member.cookie, params: { id: String(id) } });
  expect(sys.status).toBe(200);
  const Stub = createRoutesStub([{ path: "/systems/:id", Component: SystemPage as never, loader: () => sys.body }]);
  return renderToString(createElement(Stub, { initialEntries: [`/systems/${id}`], hydrationData: { loaderData: { "0": sys.body } } } as never));
}
const lineOf = (html: string, id: RegExp) => textOf(new RegExp(`data-testid="${id.source}"[^>]*>([\\s\\S]*?)</span>`).exec(html)?.[1] ?? "").replace(/^— /, "");

describe("a duty below the maker's minimum flow fails the verdict on every headline; at it, nothing is said", () => {
  test("the system page: the verdict's line, the figures row and the chart's label, in SI and in US units", async () => {
    for (const [member, line, figure] of [[m, LINE_SI, /^12\.0 m³\/h · duty 8\.00 m³\/h: below it$/], [us, LINE_US, /^52\.8 gpm · duty 35\.2 gpm: below it$/]] as const) {
      const html = await systemHtml(systems.below, member);
      expect(lineOf(html, /verdict-\d+-min-flow/)).toMatch(line);
      expect(lineOf(html, /min-flow-\d+/)).toMatch(figure);
      expect(textOf(html)).toMatch(/, (but|and) runs below the maker's minimum flow(?!:)/); // the chart's label (short form)
      const at = await systemHtml(systems.at, member);
      expect(at).not.toMatch(/data-testid="verdict-\d+-min-flow"/);
      expect(lineOf(at, /min-flow-\d+/)).toMatch(/: at or above it$/);
    }
    // No figure recorded: nothing on the verdict's line, and no "Maker's minimum flow" row (the table as it was).
    const none = await systemHtml(systems.none, m);
    expect(none).not.toMatch(/data-testid="verdict-\d+-min-flow"/);
    expect(textOf(none)).not.toContain("Maker's minimum flow");
  });

  test("systems read API: result.verdictMinFlow and result.minFlow; null at the figure", async () => {
    for (const k of ["below", "at"] as const) {
      const r = await call(apiSystem.loader as never, { path: `/api/v1/systems/${systems[k]}`, params: { id: String(systems[k]) }, headers: { authorization: `Bearer ${token}` } });
      expect(r.status).toBe(200);
      const res = (r.body as { candidates: { result: { verdictMinFlow: string | null; minFlow: { published: number; dutyPerPump: number; below: boolean } } }[] }).candidates[0].result;
      expect(res.minFlow.published).toBeCloseTo(12 * M3H, 15);
      expect(res.minFlow.below).toBe(k === "below");
      if (k === "below") expect(res.verdictMinFlow).toMatch(LINE_SI);
      else expect(res.verdictMinFlow).toBeNull();
    }
  });

  test("the search: the API row's verdictMinFlow and the page row's verdict line; nothing at the figure", async () => {
    for (const k of ["below", "at"] as const) {
      const r = await call(apiSearch.loader as never, { path: `/api/v1/systems/${systems[k]}/search`, params: { id: String(systems[k]) }, headers: { authorization: `Bearer ${token}` } });
      expect(r.status).toBe(200);
      const row = (r.body as { results: { curveSetId: number; verdictMinFlow: string | null }[] }).results.find((x) => x.curveSetId === setId);
      expect(row, k).toBeDefined();
      // The search offers the pump slowed to the duty: the figure scales with its speed (affinity laws, verdict-min-flow.ts).
      if (k === "below") expect(row!.verdictMinFlow).toMatch(/^(but|and) runs below the maker's minimum flow: 8\.00 m³\/h < [\d.]+ m³\/h \(12\.0 m³\/h at the curve's speed × [\d.]+ % speed, affinity laws Q ∝ N\)$/);
      else expect(row!.verdictMinFlow).toBeNull();
    }
    const page = await call(searchPage.loader as never, { path: `/systems/${systems.below}/search`, params: { id: String(systems.below) }, cookie: us.cookie });
    expect(page.status).toBe(200);
    const Stub = createRoutesStub([{ path: "/systems/:id/search", Component: SearchPage as never, loader: () => page.body }]);
    const html = renderToString(createElement(Stub, { initialEntries: [`/systems/${systems.below}/search`], hydrationData: { loaderData: { "0": page.body } } } as never));
    expect(lineOf(html, new RegExp(`search-verdict-${setId}-min-flow`))).toMatch(/^(but|and) runs below the maker's minimum flow: 35\.2 gpm < [\d.]+ gpm \(52\.8 gpm at the curve's speed × [\d.]+ % speed, affinity laws Q ∝ N\)$/);
  });

  test("the report's verdict line and figures, the CSV and the JSON", async () => {
    const below = await selectionPages(m, selections.below);
    expect(lineOf(below.html, /report-verdict-min-flow/)).toMatch(LINE_SI);
    const f = csvFigures(below.csv);
    expect(f.get("verdict_min_flow")?.[0]).toMatch(LINE_SI);
    expect(Number(f.get("maker_min_flow")?.[0])).toBeCloseTo(12 * M3H, 12);
    expect(f.get("maker_min_flow")?.[1]).toBe("m3/s");
    expect(Number(f.get("maker_min_flow_as_run")?.[0])).toBeCloseTo(12 * M3H, 12);
    expect(Number(f.get("duty_flow_per_running_pump")?.[0])).toBeCloseTo(8 * M3H, 12);
    // The 50 % step, 4 m³/h, below the figure: the maker's note in the CSV's step warnings (stepPor.ts).
    expect(below.csv.find((r) => r[0] === "duty_cycle" && r[1] === "2")?.at(-1)).toMatch(/below the maker's minimum continuous flow, 12\.0 m³\/h/);
    const json = await call(selectionJson.loader as never, { path: `/selections/${selections.below}/export.json`, cookie: m.cookie, params: { id: String(selections.below) } });
    const body = (typeof json.body === "string" ? JSON.parse(json.body) : json.body) as { verdictMinFlow: string | null; pump: { minFlow: number | null } };
    expect(body.verdictMinFlow).toMatch(LINE_SI);
    expect(body.pump.minFlow).toBeCloseTo(12 * M3H, 15);
    const at = await selectionPages(m, selections.at);
    expect(at.html).not.toMatch(/report-verdict-min-flow/);
    expect(csvFigures(at.csv).get("verdict_min_flow")?.[0] ?? "").toBe("");
  });
});
