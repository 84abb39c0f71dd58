// The search page's pages (search.server.ts `page`/`pageSize`): a page is a slice of one ranking, so
// its ranks, its "why this rank" text and its verdicts are the rows of the whole list at those places,
// and odd page numbers land on the nearest page. Against the real MariaDB with the demo libraries and
// a library of half of a demo file (invented data); the check values are the same search asked for all
// rows at once (the reference), and ceil(total / pageSize) for the page count (common practice).
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import { candidateSetIds } from "./candidates.server";
import { addCandidate } from "./projects.server";
import { SEARCH_PAGE_ROWS, SEARCH_SHOWN, searchForSystem } from "./search.server";
import { DEFAULT_ADJUSTMENT } from "./hydraulics";
import { searchFixture, viewerOfUser } from "./test-kit";

afterAll(() => closeDb());

let userId: string;
let systemId: number;
const viewer = () => viewerOfUser(userId);
const row = (r: Awaited<ReturnType<typeof searchForSystem>>["results"][number]) => ({ rank: r.rank, id: r.curveSetId, method: r.method, reason: r.reason, verdict: r.verdict });

beforeAll(async () => {
  ({ userId, systemId } = await searchFixture({ demoFile: "tallowmere.csv", library: "Paging check", project: "Paged search", fraction: 0.5 }));
});

describe("pages of one ranking", () => {
  test("each page is the whole list's rows at its places: ranks, reasons and verdicts", async () => {
    const v = await viewer();
    const all = await searchForSystem(v, systemId, {}, { pageSize: 1000 });
    const total = all.paging.total;
    expect(total).toBeGreaterThan(7); // enough rows for three pages of 3
    expect(all.results.length).toBe(total);
    expect(all.results.map((r) => r.rank)).toEqual(Array.from({ length: total }, (_, i) => i + 1));
    const size = 3;
    const pages = Math.ceil(total / size);
    const seen: ReturnType<typeof row>[] = [];
    for (let page = 1; page <= pages; page++) {
      const r = await searchForSystem(v, systemId, {}, { page, pageSize: size });
      expect(r.paging).toEqual({ page, pages, pageSize: size, total });
      expect(r.results.length).toBe(page < pages ? size : total - size * (pages - 1)); // the last page holds what is left
      seen.push(...r.results.map(row));
    }
    expect(seen).toEqual(all.results.map(row));
  });

  test("pages out of range land on the nearest page; no page number gives nothing or an error", async () => {
    const v = await viewer();
    const size = 4;
    const first = await searchForSystem(v, systemId, {}, { page: 1, pageSize: size });
    const last = await searchForSystem(v, systemId, {}, { page: first.paging.pages, pageSize: size });
    for (const page of [0, -3, Number.NaN, Number.NEGATIVE_INFINITY, 1.7]) {
      const r = await searchForSystem(v, systemId, {}, { page, pageSize: size });
      expect(r.paging.page, `page ${page}`).toBe(1);
      expect(r.results.map(row)).toEqual(first.results.map(row));
    }
    for (const page of [first.paging.pages + 1, 1e9, Number.POSITIVE_INFINITY]) {
      const r = await searchForSystem(v, systemId, {}, { page, pageSize: size });
      expect(r.paging.page, `page ${page}`).toBe(first.paging.pages);
      expect(r.results.map(row)).toEqual(last.results.map(row));
    }
  });

  test("the read API's default is SEARCH_SHOWN rows, the page's SEARCH_PAGE_ROWS; a search with nothing to show is one empty page", async () => {
    const v = await viewer();
    const api = await searchForSystem(v, systemId);
    expect(api.paging.pageSize).toBe(SEARCH_SHOWN);
    expect(api.results.length).toBe(Math.min(SEARCH_SHOWN, api.paging.total));
    const page = await searchForSystem(v, systemId, {}, { pageSize: SEARCH_PAGE_ROWS });
    expect(page.results.length).toBe(Math.min(SEARCH_PAGE_ROWS, page.paging.total));
    const none = await searchForSystem(v, systemId, { type: "no such pump type" }, { page: 3, pageSize: SEARCH_PAGE_ROWS });
    expect(none.results).toEqual([]);
    expect(none.paging).toEqual({ page: 1, pages: 1, pageSize: SEARCH_PAGE_ROWS, total: 0 });
  });
});

describe("the rows already on the system", () => {
  test("candidateSetIds names the curve sets added, and nothing for another workspace's viewer", async () => {
    const v = await viewer();
    const r = await searchForSystem(v, systemId, {}, { pageSize: 5 });
    expect(await candidateSetIds(v, systemId)).toEqual([]);
    const picked = r.results.slice(0, 2).map((x) => x.curveSetId);
    for (const id of picked) expect((await addCandidate(v, systemId, id, DEFAULT_ADJUSTMENT)).ok).toBe(true);
    expect((await candidateSetIds(v, systemId)).sort()).toEqual([...picked].sort());
    const other = await searchFixture({ demoFile: "tallowmere.csv", library: "Other workspace", project: "Other", fraction: 0.1 });
    expect(await candidateSetIds(other.viewer, systemId)).toEqual([]);
  });
});
