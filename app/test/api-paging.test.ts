// The API's long lists a page at a time, with the convention of GET /api/v1/libraries/:id/models
// (library-paging.test.ts): `?page=N` read as the pages read it, { paging, links } beside the list.
//  - GET /api/v1/libraries/:id/curves answered every curve set with its points in one answer (a 10 000-set
//    library was megabytes); now CURVE_PAGE_SETS a page, its links pinned to the revision answered.
//  - GET /api/v1/systems/:id/search answered the first SEARCH_SHOWN results and no more; now `page` reaches the rest.
// Real MariaDB, invented curves (app/test/big-library.ts). Expected values: the unpaged services (libraryCurves,
// searchForSystem asked for every row at once), ceil(total / pageSize) pages (common practice) and our product
// rules (the page sizes, the clamping of odd page values).
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import { CURVE_PAGE_SETS, createLibrary, getLibrary, libraryCurves, updateLibrary, type Viewer } from "~/lib/libraries";
import { createProject, createSystem, SEARCH_EVALUATED, SEARCH_SHOWN, searchForSystem } from "~/lib/projects";
import { defaultSystemInput } from "~/lib/projects/hydraulics";
import { importCsvText, viewerOfUser } from "~/lib/projects/test-kit";
import { call, makeMember, type TestMember } from "./harness";
import { bigLibraryCsv } from "./big-library";
import * as apiCurves from "~/routes/api.v1.libraries.$id.curves";
import * as apiSearch from "~/routes/api.v1.systems.$id.search";
import * as apiDocs from "~/routes/api-docs";

const MODELS = 25; // × 10 curve sets (big-library.ts) = 250 sets: pages of 100, 100, 50
const SETS = MODELS * 10;
type Links = { self: string; first: string; prev: string | null; next: string | null; last: string };
type Paging = { page: number; pages: number; pageSize: number; total: number };
type CurvesPage = { revision: number | null; paging: Paging; links: Links; curveSets: { id: number; model: string; points: { flow: number; head: number }[] }[] };
type SearchPage = { paging: Paging; links: Links; results: { rank: number; curveSetId: number; adjustment: { kind: string } }[] };

let m: TestMember;
let v: Viewer;
let libId = 0;
let emptyId = 0;
let systemId = 0;

beforeAll(async () => {
  m = await makeMember("admin");
  v = await viewerOfUser(m.userId);
  libId = await createLibrary(v, { name: "API paging catalogue", description: "" });
  await importCsvText(v, libId, bigLibraryCsv(MODELS, 7000), "paged.csv");
  await updateLibrary(v, libId, { name: "API paging catalogue", description: "", visibility: "workspace" });
  emptyId = await createLibrary(v, { name: "Nothing imported yet", description: "" });
  const p = await createProject(v, { name: "API paging", site: "", description: "" });
  // A low duty most invented curves reach, directly, trimmed or slowed: 75 rows on these 250 sets when tried, more than a page.
  systemId = await createSystem(v, p, "Paged duty", { ...defaultSystemInput(), staticLow: 2, staticHigh: 2, duty: { flow: 25 / 3600, head: 12 } });
}, 60_000);
afterAll(() => closeDb());

const curves = async (query = "", id = libId) => {
  const r = await call(apiCurves.loader as never, { path: `/api/v1/libraries/${id}/curves${query}`, cookie: m.cookie, params: { id: String(id) } });
  expect(r.status, query).toBe(200);
  return r.body as CurvesPage;
};
const curvesPath = (id = libId) => `/api/v1/libraries/${id}/curves`;

describe(`GET /api/v1/libraries/:id/curves, ${CURVE_PAGE_SETS} curve sets a page`, () => {
  test("following links.next from the first page gives every set once with its points, in libraryCurves' order", async () => {
    const pages: CurvesPage[] = [await curves()];
    while (pages.at(-1)!.links.next && pages.length < 10) pages.push(await curves(pages.at(-1)!.links.next!.slice(curvesPath().length)));
    const pageCount = Math.ceil(SETS / CURVE_PAGE_SETS); // common practice
    expect(pages.map((p) => p.paging)).toEqual(Array.from({ length: pageCount }, (_, i) => ({ page: i + 1, pages: pageCount, pageSize: CURVE_PAGE_SETS, total: SETS })));
    expect(pages.map((p) => p.curveSets.length)).toEqual(Array.from({ length: pageCount }, (_, i) => Math.min(CURVE_PAGE_SETS, SETS - i * CURVE_PAGE_SETS)));
    const all = await libraryCurves(v, libId); // the unpaged list, as the exports read it
    expect(pages.flatMap((p) => p.curveSets.map((c) => c.id))).toEqual(all.map((c) => c.id));
    expect(pages.flatMap((p) => p.curveSets)).toEqual(JSON.parse(JSON.stringify(all))); // points and all, as stored
    for (const p of pages) for (const c of p.curveSets) expect(c.points).toHaveLength(8); // 8 points a set (big-library.ts)
    const rev = (await getLibrary(v, libId)).currentRevisionId!;
    expect(pages.map((p) => p.revision)).toEqual(pages.map(() => rev));
    const at = (page: number) => `${curvesPath()}?revision=${rev}&page=${page}`;
    expect(pages[0].links).toEqual({ self: at(1), first: at(1), prev: null, next: at(2), last: at(pageCount) });
    expect(pages.at(-1)!.links).toMatchObject({ self: at(pageCount), prev: at(pageCount - 1), next: null });
  });

  test("a page is a few hundred KB at most here, where the whole library was one answer", async () => {
    const bytes = JSON.stringify(await curves()).length;
    const whole = JSON.stringify(await libraryCurves(v, libId)).length;
    // Measured here for the report: 8-point sets (big-library.ts).
    console.info(`curves API: ${bytes} bytes a page of ${CURVE_PAGE_SETS} sets; ${whole} bytes for all ${SETS} (${(whole / SETS).toFixed(0)} a set)`);
    expect(bytes).toBeLessThan(whole / 2);
    expect(bytes).toBeLessThan(300_000);
  });

  test("odd page values answer a page as the models list does, never an error: not a whole number from 1 is the first, past the end the last", async () => {
    const firstIds = (await curves("?page=1")).curveSets.map((c) => c.id);
    for (const q of ["0", "-1", "1e9", "abc", "1.5", "", "%00", "2x", "0x2"]) {
      const p = await curves(`?page=${q}`);
      expect(p.paging.page, q).toBe(1);
      expect(p.curveSets.map((c) => c.id), q).toEqual(firstIds);
    }
    const last = Math.ceil(SETS / CURVE_PAGE_SETS);
    for (const q of [String(last + 1), "1000000000", "9".repeat(15)]) expect((await curves(`?page=${q}`)).paging.page, q).toBe(last);
    const rev = (await curves("?page=2")).revision;
    expect((await curves(`?revision=${rev}&page=2`)).links.next).toBe(`${curvesPath()}?revision=${rev}&page=3`); // the rest of the query kept
  });

  test("links keep the revision answered: a new import between two pages does not mix revisions; the new one is answered without it", async () => {
    const lib2 = await createLibrary(v, { name: "API paging, re-imported", description: "" });
    await importCsvText(v, lib2, bigLibraryCsv(12, 7100), "before.csv"); // 120 sets: two pages
    const first = await curves("", lib2);
    const oldRev = first.revision!;
    await importCsvText(v, lib2, bigLibraryCsv(15, 7200), "after.csv"); // a new current revision of 150 sets
    const second = await curves(first.links.next!.slice(curvesPath(lib2).length), lib2);
    expect(second.revision).toBe(oldRev);
    const before = await libraryCurves(v, lib2, oldRev);
    expect([...first.curveSets, ...second.curveSets].map((c) => c.id)).toEqual(before.map((c) => c.id));
    const now = await curves("", lib2);
    expect(now.revision).not.toBe(oldRev);
    expect(now.paging.total).toBe(150);
    expect(now.curveSets[0].model).toBe("Bench 7200");
  });

  test("a library with nothing imported: one empty page, revision null; a bad revision is still a 400, another library's a 404", async () => {
    const p = await curves("", emptyId);
    expect(p).toMatchObject({ revision: null, paging: { page: 1, pages: 1, pageSize: CURVE_PAGE_SETS, total: 0 }, curveSets: [] });
    expect(p.links).toMatchObject({ prev: null, next: null });
    const get = (q: string) => call(apiCurves.loader as never, { path: `${curvesPath(emptyId)}${q}`, cookie: m.cookie, params: { id: String(emptyId) } });
    expect((await get("?revision=abc")).status).toBe(400);
    const anotherLibrarysRevision = (await getLibrary(v, libId)).currentRevisionId!;
    expect((await get(`?revision=${anotherLibrarysRevision}`)).status).toBe(404);
  });
});

const search = async (query = "") => {
  const r = await call(apiSearch.loader as never, { path: `/api/v1/systems/${systemId}/search${query}`, cookie: m.cookie, params: { id: String(systemId) } });
  expect(r.status, query).toBe(200);
  return r.body as SearchPage;
};
const searchPath = () => `/api/v1/systems/${systemId}/search`;

describe(`GET /api/v1/systems/:id/search, ${SEARCH_SHOWN} results a page`, () => {
  test("following links.next gives every row of the one ranking once: the same rows and ranks as the search asked for all at once", async () => {
    const all = await searchForSystem(v, systemId, {}, { pageSize: 1000 });
    const total = all.paging.total;
    expect(total).toBeGreaterThan(SEARCH_SHOWN); // more rows than a page, so page 2 holds rows the API could not reach before
    expect(total).toBeLessThanOrEqual(SEARCH_EVALUATED);
    const pages: SearchPage[] = [await search()];
    while (pages.at(-1)!.links.next && pages.length < 10) pages.push(await search(pages.at(-1)!.links.next!.slice(searchPath().length)));
    const pageCount = Math.ceil(total / SEARCH_SHOWN); // common practice
    expect(pages.map((p) => p.paging)).toEqual(Array.from({ length: pageCount }, (_, i) => ({ page: i + 1, pages: pageCount, pageSize: SEARCH_SHOWN, total })));
    const rows = pages.flatMap((p) => p.results.map((r) => [r.rank, r.curveSetId]));
    expect(rows).toEqual(all.results.map((r) => [r.rank, r.curveSetId]));
    expect(pages[0].links).toEqual({ self: `${searchPath()}?page=1`, first: `${searchPath()}?page=1`, prev: null, next: `${searchPath()}?page=2`, last: `${searchPath()}?page=${pageCount}` });
  });

  test("odd page values answer a page, never an error; the method filter stays in the links", async () => {
    const firstIds = (await search()).results.map((r) => r.curveSetId);
    for (const q of ["0", "-1", "abc", "1.5", "", "1e9"]) {
      const p = await search(`?page=${q}`);
      expect(p.paging.page, q).toBe(1);
      expect(p.results.map((r) => r.curveSetId), q).toEqual(firstIds);
    }
    const last = (await search()).paging.pages;
    expect((await search("?page=99999")).paging.page).toBe(last);
    const speed = await search("?method=speed&page=1");
    expect(speed.results.every((r) => r.adjustment.kind === "speed")).toBe(true);
    if (speed.links.next) expect(speed.links.next).toBe(`${searchPath()}?method=speed&page=2`);
    expect(speed.links.last).toBe(`${searchPath()}?method=speed&page=${speed.paging.pages}`);
  });
});

test("the /api page states the page sizes the routes answer with", async () => {
  const { pageSizes } = apiDocs.loader();
  expect(pageSizes.curveSets).toBe((await curves()).paging.pageSize);
  expect(pageSizes.searchResults).toBe((await search()).paging.pageSize);
});
