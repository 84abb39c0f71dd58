// Rows hidden as outside the catalogue fill none of the search's places. The search hides a pump whose verdict is
// "outside the catalogue" unless asked for, but it stopped judging once SEARCH_EVALUATED had been judged, hidden ones
// included: each hidden row took a place a passing pump further down could fill, and the list came out short (58 rows of
// 80 here). Now it judges on down the ranking until SEARCH_EVALUATED are kept, the ranking ends or SEARCH_FILL_JUDGED are
// judged, and the page and the read API say when the list was cut, why and with the numbers; the copies merged from other
// libraries are counted among the pumps judged. Real MariaDB, route modules and guards; invented curve sets
// (app/test/big-library.ts). Check values: the same search with "allow beyond the catalogue" (the ranking the hidden list
// must follow), our product rules (SEARCH_EVALUATED, SEARCH_FILL_JUDGED) and the verdict's catalogue rule (engine
// verdict.ts: an impeller within the model's published diameters, so a model publishing one impeller has every trim
// outside the catalogue).
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import { createApiToken } from "~/lib/auth/api-tokens.server";
import { createLibrary, updateLibrary, type Viewer } from "~/lib/libraries";
import { createProject, createSystem, SEARCH_EVALUATED, SEARCH_FILL_JUDGED, searchForSystem, type SearchFilters } from "~/lib/projects";
import { defaultSystemInput } from "~/lib/projects/hydraulics";
import { importCsvText, M3H, viewerOfUser } from "~/lib/projects/test-kit";
import * as searchPage from "~/routes/systems.$id.search";
import * as apiSearch from "~/routes/api.v1.systems.$id.search";
import { bigLibraryCsv } from "./big-library";
import { call, makeMember, type TestMember } from "./harness";
import { loadedPage } from "./render-page";

afterAll(() => closeDb());

type Row = { curveSetId: number; method: string; verdict: unknown };
const key = (r: { curveSetId: number; method: string }) => `${r.curveSetId}:${r.method}`;
const status = (r: Row) => (r.verdict as { status: string } | null)?.status ?? null;
// 25 m³/h at 12 m with 10.5–11 m static (as search-power-fill.test.ts): the system's head at the duty flow is the typed 12 m.
const LOW_DUTY = { ...defaultSystemInput(), staticLow: 10.5, staticHigh: 11, duty: { flow: 25 * M3H, head: 12 } };

/** A member with its own workspace, a library of `csv` open to it and a system on LOW_DUTY. */
async function fixture(name: string, csv: string) {
  const m = await makeMember("admin");
  const v = await viewerOfUser(m.userId);
  const lib = await createLibrary(v, { name, description: "" });
  await importCsvText(v, lib, csv, `${name}.csv`);
  await updateLibrary(v, lib, { name, description: "", visibility: "workspace" });
  const systemId = await createSystem(v, await createProject(v, { name, site: "", description: "" }), "Low duty", LOW_DUTY);
  return { m, v, systemId };
}

const pageHtml = async (m: TestMember, systemId: number, query: string) =>
  (await loadedPage(m, searchPage, "/systems/:id/search", `/systems/${systemId}/search${query}`, { id: String(systemId) })).html;
const cutNote = (html: string) => /data-testid="search-catalogue-cut"[^>]*>(.*?)<\/span>/s.exec(html)?.[1] ?? null;

describe("pumps outside the catalogue among the best-ranked (60 invented models, 600 curve sets)", () => {
  let m: TestMember;
  let v: Viewer;
  let systemId = 0;
  const search = (filters: SearchFilters) => searchForSystem(v, systemId, filters, { pageSize: 1000 });
  beforeAll(async () => {
    ({ m, v, systemId } = await fixture("Catalogue fill", bigLibraryCsv(60, 3000)));
  }, 60_000);

  test("the list is filled to SEARCH_EVALUATED rows with pumps from further down (was SEARCH_EVALUATED less those hidden)", async () => {
    const beyond = await search({ allowBeyondCatalogue: true });
    expect(beyond.paging.total).toBe(SEARCH_EVALUATED); // more pumps meet the duty than are kept
    const outside = beyond.results.filter((r) => status(r) === "outside-catalogue");
    expect(outside.length).toBeGreaterThan(0); // the best SEARCH_EVALUATED include pumps outside the catalogue
    const passing = beyond.results.filter((r) => status(r) !== "outside-catalogue");

    const hidden = await search({});
    expect(hidden.paging.total).toBe(SEARCH_EVALUATED); // the old code: SEARCH_EVALUATED − outside.length
    expect(hidden.results.filter((r) => status(r) === "outside-catalogue")).toEqual([]);
    // The best SEARCH_EVALUATED's passing rows are all there, in their order, and pumps from further down fill the rest.
    const shown = hidden.results.map(key);
    const passingKeys = new Set(passing.map(key));
    expect(shown.filter((k) => passingKeys.has(k))).toEqual(passing.map(key));
    const inBest = new Set(beyond.results.map(key));
    expect(shown.filter((k) => !inBest.has(k)).length).toBe(outside.length);
    // Every hidden pump judged is counted (those further down too), and each judged pump was kept or hidden.
    expect(hidden.hidden.outsideCatalogue).toBeGreaterThanOrEqual(outside.length);
    expect(hidden.catalogueFilter).toEqual({ judged: SEARCH_EVALUATED + hidden.hidden.outsideCatalogue, atMost: SEARCH_FILL_JUDGED, kept: SEARCH_EVALUATED, places: SEARCH_EVALUATED, outsideCatalogue: hidden.hidden.outsideCatalogue, cut: false, message: null });
    expect(beyond.catalogueFilter).toBeNull(); // nothing hidden, nothing to say
    expect(beyond.hidden.outsideCatalogue).toBe(0);
  });

  test("the page counts the hidden pumps and says nothing of a cut", async () => {
    const hidden = await search({});
    const html = await pageHtml(m, systemId, "");
    expect(html).toContain(` · ${hidden.hidden.outsideCatalogue} outside the catalogue hidden (tick "allow beyond the catalogue" to see them)`);
    expect(cutNote(html)).toBeNull();
  });
});

describe("a ranking led by pumps outside the catalogue (800 invented models publishing one impeller each)", () => {
  let m: TestMember;
  let v: Viewer;
  let systemId = 0;
  // Each model's 250 mm impeller only: every trim is below the one published diameter, so outside the catalogue.
  const oneImpeller = bigLibraryCsv(800, 5000).split("\n").filter((l, i) => i === 0 || l.split(",")[4] === "250").join("\n");
  const METHODS: SearchFilters["methods"] = ["direct", "trim"];
  beforeAll(async () => {
    ({ m, v, systemId } = await fixture("Catalogue cut", oneImpeller));
  }, 60_000);

  test("the judging stops at SEARCH_FILL_JUDGED with the places not filled: the list is cut, and says so with its numbers", async () => {
    const r = await searchForSystem(v, systemId, { methods: METHODS }, { pageSize: 1000 });
    expect(r.stats!.matched).toBeGreaterThan(SEARCH_FILL_JUDGED); // more pumps ranked than may be judged
    const f = r.catalogueFilter!;
    expect(f).toMatchObject({ judged: SEARCH_FILL_JUDGED, atMost: SEARCH_FILL_JUDGED, places: SEARCH_EVALUATED, cut: true });
    expect(f.kept).toBeLessThan(SEARCH_EVALUATED);
    expect(f.kept).toBe(r.paging.total);
    expect(f.outsideCatalogue).toBe(SEARCH_FILL_JUDGED - f.kept); // each judged pump kept or hidden (no power filter)
    expect(r.hidden.outsideCatalogue).toBe(f.outsideCatalogue);
    expect(f.message).toBe(`list cut: a pump whose verdict is "outside the catalogue" (a trim or speed the model does not publish) is hidden and fills none of the ${SEARCH_EVALUATED} places, so the search judged the ranked pumps in turn and stopped after ${SEARCH_FILL_JUDGED} (${SEARCH_FILL_JUDGED} at most), ${f.outsideCatalogue} of them outside the catalogue, with ${f.kept} of the places filled; pumps further down the ranking that would pass are not shown`);
    // Allowed beyond the catalogue, nothing is hidden: the places are filled and nothing is said.
    const beyond = await searchForSystem(v, systemId, { methods: METHODS, allowBeyondCatalogue: true }, { pageSize: 1000 });
    expect(beyond.paging.total).toBe(SEARCH_EVALUATED);
    expect(beyond.catalogueFilter).toBeNull();
  });

  test("the page says the list was cut, why and with the numbers, and how to see the hidden pumps", async () => {
    const f = (await searchForSystem(v, systemId, { methods: METHODS })).catalogueFilter!;
    const html = await pageHtml(m, systemId, "?method=direct&method=trim");
    expect(cutNote(html)).toBe(` · ${f.message} (tick "allow beyond the catalogue" to see the hidden ones, or narrow the filters)`);
    expect(cutNote(await pageHtml(m, systemId, "?method=direct&method=trim&beyond=1"))).toBeNull();
  });

  test("the read API says it too: hidden counts and catalogueFilter with its message", async () => {
    const token = (await createApiToken({ userId: m.userId, workspaceId: m.workspaceId, name: "r", scope: "read" })).token;
    const r = await call(apiSearch.loader as never, { path: `/api/v1/systems/${systemId}/search?method=direct&method=trim`, params: { id: String(systemId) }, headers: { authorization: `Bearer ${token}` } });
    expect(r.status).toBe(200);
    const body = r.body as { hidden: { outsideCatalogue: number; duplicates: number }; catalogueFilter: { cut: boolean; judged: number; kept: number; message: string }; paging: { total: number } };
    const f = (await searchForSystem(v, systemId, { methods: METHODS })).catalogueFilter!;
    expect(body.catalogueFilter).toEqual(f);
    expect(body.hidden).toEqual({ outsideCatalogue: f.outsideCatalogue, duplicates: 0 });
    expect(body.paging.total).toBe(f.kept);
  });
});

describe("every curve in two libraries of the workspace (the 60 invented models imported twice)", () => {
  test("the copies merged are counted among the pumps judged, whatever the engine ranked beyond them", async () => {
    const m = await makeMember("admin");
    const v = await viewerOfUser(m.userId);
    for (const name of ["Copies A", "Copies B"]) {
      const lib = await createLibrary(v, { name, description: "" });
      await importCsvText(v, lib, bigLibraryCsv(60, 3000), `${name}.csv`);
      await updateLibrary(v, lib, { name, description: "", visibility: "workspace" });
    }
    const systemId = await createSystem(v, await createProject(v, { name: "Copies", site: "", description: "" }), "Low duty", LOW_DUTY);
    const r = await searchForSystem(v, systemId, {}, { pageSize: 1000 });
    expect(r.paging.total).toBe(SEARCH_EVALUATED);
    const f = r.catalogueFilter!;
    expect(f.outsideCatalogue).toBeGreaterThan(0); // as above: the list was filled from further down
    expect(r.hidden.duplicates).toBe(f.judged); // one copy of each pump judged (not of every row the engine returned)
    expect(r.results.every((x) => x.alsoIn.length === 1)).toBe(true);
  }, 60_000);
});
