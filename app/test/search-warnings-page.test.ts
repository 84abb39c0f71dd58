// The search's own warnings on the search page. Each ranked row carries the engine's warnings at the typed duty (searchDuty:
// "trim by the linear law is approximate" on a trimmed pump; on a custom liquid, figures left on the water curve): the read
// API's row gives them in `warnings` (after the verdict's cautions), but the page showed only the cautions. Now the row's
// verdict cell says them too, in plain text, through the loader's units rendering. Real MariaDB, the route's loader and
// component; 200 invented curve sets (app/test/big-library.ts). Check values: the engine's own warning text (identity with
// the API row's `warnings`), the affinity laws' trim being approximate (common practice, from memory).
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import { createLibrary, updateLibrary, type Viewer } from "~/lib/libraries";
import { createProject, createSystem, searchForSystem } from "~/lib/projects";
import { defaultSystemInput } from "~/lib/projects/hydraulics";
import { searchResultView } from "~/lib/projects/search-view";
import { importCsvText, M3H, viewerOfUser } from "~/lib/projects/test-kit";
import * as searchPage from "~/routes/systems.$id.search";
import { bigLibraryCsv } from "./big-library";
import { makeMember, type TestMember } from "./harness";
import { loadedPage } from "./render-page";

afterAll(() => closeDb());

let m: TestMember;
let v: Viewer;
let systemId = 0;
beforeAll(async () => {
  m = await makeMember("admin");
  v = await viewerOfUser(m.userId);
  const lib = await createLibrary(v, { name: "Warned", description: "" });
  await importCsvText(v, lib, bigLibraryCsv(20, 9000), "warned.csv");
  await updateLibrary(v, lib, { name: "Warned", description: "", visibility: "workspace" });
  const p = await createProject(v, { name: "Warned", site: "", description: "" });
  systemId = await createSystem(v, p, "Low duty", { ...defaultSystemInput(), staticLow: 10.5, staticHigh: 11, duty: { flow: 25 * M3H, head: 12 } });
}, 60_000);

const pageHtml = async (query: string) =>
  (await loadedPage(m, searchPage, "/systems/:id/search", `/systems/${systemId}/search${query}`, { id: String(systemId) })).html;
const warningsOf = (html: string, id: number) => new RegExp(`data-testid="search-warnings-${id}"[^>]*>(.*?)</p>`, "s").exec(html)?.[1] ?? null;

describe("a trimmed pump's row", () => {
  test("shows the search's warning the API gives: trim by the linear law is approximate", async () => {
    const res = await searchForSystem(v, systemId, { methods: ["trim"] }, { pageSize: 25 });
    const row = res.results[0];
    expect(row.method).toBe("trim");
    const own = row.warnings.map((w) => w.message);
    expect(own).toEqual(["trim by the linear law is approximate"]); // the engine's text (searchDuty, linear law by default)
    expect(searchResultView(row).warnings).toContain(own[0]); // the API row says it
    const html = await pageHtml("?method=trim");
    expect(warningsOf(html, row.curveSetId)).toBe("Search at the typed duty: trim by the linear law is approximate");
  });

  test("a pump as published or slowed down has no such warning: nothing is added to its row", async () => {
    const res = await searchForSystem(v, systemId, { methods: ["speed"] }, { pageSize: 25 });
    expect(res.results.length).toBeGreaterThan(0);
    expect(res.results.every((r) => r.warnings.length === 0)).toBe(true);
    const html = await pageHtml("?method=speed");
    expect(html).not.toContain('data-testid="search-warnings-');
  });
});
