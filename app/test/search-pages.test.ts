// The search page's pages through its own loader (the way React Router calls it): `?page=` picks a
// slice of one ranking (25 rows a page), odd values land on a real page, the filters stay as asked, and
// the links to other pages keep the query string. Real MariaDB with a workspace library of 1 000 invented
// curve sets (app/test/big-library.ts). Expected values: our product rules (SEARCH_PAGE_ROWS, ranks
// 1..n across pages) and URLSearchParams' own encoding.
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import { createLibrary, updateLibrary } from "~/lib/libraries";
import { importCsvText } from "~/lib/projects/test-kit";
import { createProject, createSystem, SEARCH_PAGE_ROWS } from "~/lib/projects";
import { defaultSystemInput } from "~/lib/projects/hydraulics";
import { pageHref } from "~/lib/shared/paging";
import { call, makeMember, type TestMember } from "./harness";
import { bigLibraryCsv } from "./big-library";
import * as searchPage from "~/routes/systems.$id.search";

let engineer: TestMember;
let systemId: number;
type Page = { paging: { page: number; pages: number; total: number }; results: { rank: number }[]; filters: { methods: string[]; type: string } };
const load = async (query: string) => {
  const r = await call(searchPage.loader as never, { path: `/systems/${systemId}/search${query}`, cookie: engineer.cookie, params: { id: String(systemId) } });
  expect(r.status, query).toBe(200);
  return r.body as Page;
};

beforeAll(async () => {
  engineer = await makeMember("engineer");
  const dist = await makeMember("distributor", engineer.workspaceId);
  const dv = { userId: dist.userId, workspace: { id: engineer.workspaceId, name: "W", slug: "w", plan: "free" as const }, role: "distributor" as const };
  const libId = await createLibrary(dv, { name: "Paged range", description: "" });
  await importCsvText(dv, libId, bigLibraryCsv(100, 7000), "paged.csv");
  await updateLibrary(dv, libId, { name: "Paged range", description: "", visibility: "workspace" });
  const ev = { ...dv, userId: engineer.userId, role: "engineer" as const };
  // A duty on many of the invented curves (40 m³/h at 35 m with 30–32 m static, as the bench uses).
  const input = { ...defaultSystemInput(), staticLow: 30, staticHigh: 32, duty: { flow: 40 / 3600, head: 35 } };
  systemId = await createSystem(ev, await createProject(ev, { name: "Paged search", site: "", description: "" }), "Paged", input);
});
afterAll(() => closeDb());

describe("search pages through the loader", () => {
  test("page 1 and page 2 are ranks 1–25 and 26–50 of one ranking; the last page holds the rest", async () => {
    const one = await load("");
    expect(one.paging.total).toBeGreaterThan(2 * SEARCH_PAGE_ROWS); // three pages at least
    expect(one.paging.pages).toBe(Math.ceil(one.paging.total / SEARCH_PAGE_ROWS));
    expect(one.results.map((r) => r.rank)).toEqual(Array.from({ length: SEARCH_PAGE_ROWS }, (_, i) => i + 1));
    const two = await load("?page=2");
    expect(two.paging.page).toBe(2);
    expect(two.results.map((r) => r.rank)).toEqual(Array.from({ length: SEARCH_PAGE_ROWS }, (_, i) => i + 26));
    const last = await load(`?page=${one.paging.pages}`);
    const before = (one.paging.pages - 1) * SEARCH_PAGE_ROWS;
    expect(last.results.map((r) => r.rank)).toEqual(Array.from({ length: one.paging.total - before }, (_, i) => before + i + 1));
  });

  test("odd page values answer a real page, never an error: junk or 0 → 1, past the end → the last", async () => {
    const one = await load("");
    for (const q of ["?page=abc", "?page=0", "?page=-2", "?page=1.5", "?page=", "?page=NaN", "?page=%00", `?page=${"9".repeat(40)}`]) {
      const p = await load(q);
      expect(p.paging.page === 1 || p.paging.page === one.paging.pages, q).toBe(true);
      expect(p.results.length, q).toBeGreaterThan(0);
    }
    expect((await load("?page=abc")).paging.page).toBe(1);
    expect((await load("?page=99999")).paging.page).toBe(one.paging.pages);
  });

  test("filters stay as asked on page 2, and the page links keep them", async () => {
    const p = await load("?method=trim&method=speed&type=end&page=2");
    expect(p.filters.methods).toEqual(["trim", "speed"]);
    expect(p.filters.type).toBe("end");
    expect(pageHref("?method=trim&method=speed&type=end&page=2", 3)).toBe("?method=trim&method=speed&type=end&page=3");
    expect(pageHref("", 2)).toBe("?page=2");
    expect(pageHref("?type=a%26b&page=1", 2)).toBe("?type=a%26b&page=2"); // an & inside a value stays encoded
  });
});
