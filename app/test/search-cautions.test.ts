// A search row carries the cautions that qualify its verdict (dead-head, an unstable crossing, a band edge's, a pump in
// parallel or series that cannot start) as the candidates table does: in the read API's `warnings` and on the search page's
// row (a count, the texts in a <details>, only where there are some). Check values: the start-from-rest rule (common
// practice, from memory: a pump settles at the first crossing where its head falls below the system's; a crossing where it
// rises above it again is unstable), the engine's own caution text (identity with evaluateCandidate). The curve is invented
// ("Dip probe 80": a dip between shut-off and a second hump), the system the default with a static head of 39.5 m.
// Also the row's NPSH cell where NPSHa ≤ 0 decides: no ratio, no dash for the missing range (DEVELOPERS.md "npshenergy").
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import { createLibrary, updateLibrary, type Viewer } from "~/lib/libraries";
import { createProject, createSystem, searchForSystem } from "~/lib/projects";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, evaluateCandidate, type SystemInput } from "~/lib/projects/hydraulics";
import { searchResultView } from "~/lib/projects/search-view";
import { importCsvText, M3H, viewerOfUser } from "~/lib/projects/test-kit";
import { inSI } from "~/engine/quantityText";
import * as searchPage from "~/routes/systems.$id.search";
import { makeMember, type TestMember } from "./harness";
import { loadedPage } from "./render-page";

afterAll(() => closeDb());

const MODEL = "Dip probe 80";
// flow m³/h, head m, efficiency % (invented)
const ROWS = [[0, 40, 0], [36, 39, 50], [72, 40.5, 70], [108, 40.2, 72], [144, 35, 60]];
const POINTS = ROWS.map(([q, h, e]) => ({ flow: q * M3H, head: h, efficiency: e / 100, power: null, npshr: null }));

let m: TestMember;
let v: Viewer;
let projectId = 0;
beforeAll(async () => {
  m = await makeMember("admin");
  v = await viewerOfUser(m.userId);
  const lib = await createLibrary(v, { name: "Dip probes", description: "" });
  await importCsvText(v, lib, ["model,type,size,speed_rpm,impeller_mm,flow_m3h,head_m,efficiency_pct", ...ROWS.map(([q, h, e]) => `${MODEL},end-suction,DN80,2900,200,${q},${h},${e}`)].join("\n"));
  await updateLibrary(v, lib, { name: "Dip probes", description: "", visibility: "workspace" });
  projectId = await createProject(v, { name: "Dip search", site: "", description: "" });
});

/** Static `s` m at both levels, 300 mm runs (little friction), the duty 20 m³/h at 39.3 m. */
function input(s: number): SystemInput {
  const base = defaultSystemInput();
  return { ...base, staticLow: s, staticHigh: s, runs: base.runs.map((r) => ({ ...r, diameter: 0.3 })), duty: { flow: 20 * M3H, head: 39.3 } };
}
const unstable = (ws: string[]) => ws.map(inSI).filter((w) => /unstable/.test(w));

const pageHtml = async (id: number) => (await loadedPage(m, searchPage, "/systems/:id/search", `/systems/${id}/search`, { id: String(id) })).html;

describe("search row of a pump whose curve crosses the system's again, unstably, past its operating point", () => {
  test("the case: evaluateCandidate warns the crossing at 50.2 m³/h is unstable", () => {
    const e = evaluateCandidate(input(39.5), { points: POINTS, speed: 2900, impellerDiameter: 0.2 }, DEFAULT_ADJUSTMENT);
    expect(unstable(e.warnings).join(" ")).toMatch(/50\.2 m³\/h/);
  });
  test("the read API's row carries it in warnings, the engine's own text", async () => {
    const id = await createSystem(v, projectId, "Static 39.5 m", input(39.5));
    const row = (await searchForSystem(v, id, { allowBeyondCatalogue: true })).results.find((x) => x.model === MODEL)!;
    expect(row).toBeDefined();
    const e = evaluateCandidate(input(39.5), { points: POINTS, speed: 2900, impellerDiameter: 0.2 }, { ...DEFAULT_ADJUSTMENT, method: row.method === "direct" ? "none" : row.method });
    const api = searchResultView(row).warnings;
    expect(unstable(api).length).toBeGreaterThan(0);
    expect(unstable(api)).toEqual(unstable(e.warnings));
  });
  test("the page's row: a count with the texts in a <details>", async () => {
    const id = await createSystem(v, projectId, "Static 39.5 m (page)", input(39.5));
    const html = await pageHtml(id);
    const cell = /<details[^>]*data-testid="search-cautions-\d+"[^>]*>(.*?)<\/details>/s.exec(html)?.[1] ?? "";
    expect(cell).toMatch(/<summary[^>]*>\d+ cautions?<\/summary>/);
    expect(cell.replace(/<[^>]+>/g, " ")).toMatch(/unstable.*50\.2 m³\/h|50\.2 m³\/h.*unstable/s);
  });
  test("the flip: static 38.5 m, below the dip, one stable crossing: no caution on the row, no <details>", async () => {
    const e = evaluateCandidate(input(38.5), { points: POINTS, speed: 2900, impellerDiameter: 0.2 }, DEFAULT_ADJUSTMENT);
    expect(e.operating).not.toBeNull();
    expect(unstable(e.warnings)).toEqual([]);
    const id = await createSystem(v, projectId, "Static 38.5 m", input(38.5));
    const row = (await searchForSystem(v, id, { allowBeyondCatalogue: true })).results.find((x) => x.model === MODEL)!;
    expect(row).toBeDefined();
    expect(unstable(searchResultView(row).warnings)).toEqual([]);
    expect(await pageHtml(id)).not.toContain('data-testid="search-cautions-');
  });
});

describe("the search row's NPSH cell where NPSHa ≤ 0 decides (the same system at 100 °C, suction surface at the pump)", () => {
  // Water's vapour pressure at 100 °C is about one standard atmosphere (steam tables, from memory): NPSHa below zero everywhere.
  test("no ratio and no dash for it: the lowest NPSHa and where", async () => {
    const id = await createSystem(v, projectId, "Static 39.5 m, 100 °C", { ...input(39.5), temperatureC: 100, suctionStaticHead: 0 });
    const cell = (html: string) => (/data-testid="search-npsh-\d+"[^>]*>(.*?)<\/td>/s.exec(html)?.[1] ?? "").replace(/<[^>]+>/g, "");
    expect(cell(await pageHtml(id))).toMatch(/^NPSHa −\d+\.\d+ m at .* \(cavitation-risk\)$/);
  });
});
