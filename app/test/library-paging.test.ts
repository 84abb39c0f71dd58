// A library's page at catalogue size, through its own loader: the model list comes a page at a time
// (MODEL_PAGE_ROWS), odd `page` values land on a real page, a `model` the list does not hold (another
// library's, a deleted one, junk, one the filters hide) shows the first listed with a notice instead of
// an error, the model shown carries exactly its own curves, and a new revision is listed at once (the
// kept lists are per immutable revision). The API's model list (GET /api/v1/libraries/:id/models) pages the
// same way, with links to the other pages. Real MariaDB, invented curves (app/test/big-library.ts).
// Expected values: our product rules (MODEL_PAGE_ROWS, name order) and the stored revision read afresh.
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import { createLibrary, curvesOfRevisions, getLibrary, listModels, MODEL_PAGE_ROWS, updateLibrary } from "~/lib/libraries";
import { importCsvText } from "~/lib/projects/test-kit";
import { pageOf } from "~/lib/shared/paging";
import { call, makeMember, type TestMember } from "./harness";
import { bigLibraryCsv } from "./big-library";
import * as libraryPage from "~/routes/libraries.$id";
import * as apiModels from "~/routes/api.v1.libraries.$id.models";
import * as apiDocs from "~/routes/api-docs";

const MODELS = 120; // three pages: 50, 50, 20
let engineer: TestMember;
let dv: Parameters<typeof createLibrary>[0];
let bigId: number;
let otherId: number;
type Page = {
  paging: { page: number; pages: number; total: number; first: number };
  models: { id: number; name: string; curveCount: number }[];
  modelId: number | null;
  modelMissing: number | null;
  curves: { id: number; speed: number | null; impellerDiameter: number | null; points: { flow: number; head: number }[] }[];
};
const load = async (libId: number, query = "") => {
  const r = await call(libraryPage.loader as never, { path: `/libraries/${libId}${query}`, cookie: engineer.cookie, params: { id: String(libId) } });
  expect(r.status, query).toBe(200);
  return r.body as Page;
};

async function importInto(libId: number, csv: string, name: string) {
  await importCsvText(dv, libId, csv, `${name}.csv`);
  await updateLibrary(dv, libId, { name, description: "", visibility: "workspace" });
}

beforeAll(async () => {
  engineer = await makeMember("engineer");
  const dist = await makeMember("distributor", engineer.workspaceId);
  dv = { userId: dist.userId, workspace: { id: engineer.workspaceId, name: "W", slug: "w", plan: "free" as const }, role: "distributor" as const };
  bigId = await createLibrary(dv, { name: "Paged catalogue", description: "" });
  await importInto(bigId, bigLibraryCsv(MODELS, 8000), "Paged catalogue");
  otherId = await createLibrary(dv, { name: "Other range", description: "" });
  await importInto(otherId, bigLibraryCsv(2, 9100), "Other range");
});
afterAll(() => closeDb());

describe("pageOf: the page shown of a list (product rule)", () => {
  test.each([
    // total, size, asked → page, pages, first
    [0, 50, undefined, 1, 1, 0], // an empty list has one empty page
    [120, 50, undefined, 1, 3, 0],
    [120, 50, null, 1, 3, 0],
    [120, 50, 2, 2, 3, 50],
    [120, 50, 3, 3, 3, 100],
    [120, 50, 4, 3, 3, 100], // past the end: the last
    [120, 50, Infinity, 3, 3, 100],
    [120, 50, -Infinity, 1, 3, 0],
    [120, 50, 0, 1, 3, 0],
    [120, 50, -3, 1, 3, 0],
    [120, 50, 2.9, 2, 3, 50], // truncated
    [120, 50, NaN, 1, 3, 0],
    [100, 50, 3, 2, 2, 50], // exactly two pages
    [101, 50, 3, 3, 3, 100],
  ])("%d rows at %d, page %s → page %d of %d from row %d", (total, size, asked, page, pages, first) => {
    expect(pageOf(total, size, asked)).toEqual({ page, pages, pageSize: size, total, first });
  });
});

describe("a library's models a page at a time", () => {
  test(`pages of ${MODEL_PAGE_ROWS}: every model once, in name order, the last page holds the rest`, async () => {
    const pages = [await load(bigId), await load(bigId, "?page=2"), await load(bigId, "?page=3")];
    expect(pages.map((p) => p.models.length)).toEqual([MODEL_PAGE_ROWS, MODEL_PAGE_ROWS, MODELS - 2 * MODEL_PAGE_ROWS]);
    expect(pages.map((p) => p.paging.page)).toEqual([1, 2, 3]);
    for (const p of pages) expect(p.paging).toMatchObject({ pages: 3, total: MODELS });
    const names = pages.flatMap((p) => p.models.map((m) => m.name));
    expect(new Set(names).size).toBe(MODELS);
    expect(names).toEqual([...names].sort((a, b) => (a < b ? -1 : a > b ? 1 : 0))); // the database's name order (plain ASCII names)
    for (const p of pages) for (const m of p.models) expect(m.curveCount).toBe(10); // 2 speeds × 5 impellers each (big-library.ts)
  });

  test("odd page values answer a real page, never an error", async () => {
    for (const q of ["?page=abc", "?page=0", "?page=-2", "?page=", "?page=NaN", "?page=%00", `?page=${"9".repeat(40)}`, "?page=2.5"]) {
      const p = await load(bigId, q);
      expect([1, 2, 3], q).toContain(p.paging.page);
      expect(p.models.length, q).toBeGreaterThan(0);
    }
    expect((await load(bigId, "?page=99999")).paging.page).toBe(3);
  });

  test("a speed filter that is no number (0x10, which Number() reads as 16; an ambiguous 1,500) filters nothing; 2900 keeps the models that run at it", async () => {
    for (const q of ["?speed=0x10", "?speed=1,500", "?speed=abc"]) expect((await load(bigId, q)).paging.total, q).toBe(MODELS);
    expect((await load(bigId, "?speed=2900")).paging.total).toBe(MODELS); // every invented model has a 2900 rpm curve (big-library.ts)
    expect((await load(bigId, "?speed=16")).paging.total).toBe(0); // none near 16 rpm: the filter works when it is a number
  });

  test("the model asked for is shown with exactly its own curves and points, as the stored revision has them", async () => {
    const third = await load(bigId, "?page=3");
    const want = third.models[7];
    const p = await load(bigId, `?page=3&model=${want.id}`);
    expect(p.modelId).toBe(want.id);
    expect(p.modelMissing).toBeNull();
    const lib = await getLibrary(dv, bigId);
    const stored = (await curvesOfRevisions([lib.currentRevisionId!])).filter((c) => c.modelId === want.id);
    expect(stored).toHaveLength(10);
    expect(p.curves.map((c) => [c.id, c.speed, c.impellerDiameter, c.points.length])).toEqual(stored.map((c) => [c.id, c.speed, c.impellerDiameter, c.points.length]));
    expect(p.curves.flatMap((c) => c.points.map((x) => [x.flow, x.head]))).toEqual(stored.flatMap((c) => c.points.map((x) => [x.flow, x.head])));
  });

  test("a model the list does not hold shows the page's first model and says so; no error", async () => {
    const first = (await load(bigId)).models[0].id;
    const foreign = (await load(otherId)).models[0].id; // another library's model
    const third = await load(bigId, "?page=3");
    for (const [q, missing] of [
      [`?model=${foreign}`, foreign],
      ["?model=999999999", 999999999],
      [`?model=${third.models[0].id}&q=Bench%208001`, third.models[0].id], // hidden by the name filter
    ] as const) {
      const p = await load(bigId, q);
      expect(p.modelMissing, q).toBe(missing);
      expect(p.modelId, q).toBe(q.includes("q=") ? p.models[0].id : first);
      expect(p.curves.length, q).toBe(10);
    }
    const ok = await load(bigId, `?model=${first}`);
    expect(ok.modelMissing).toBeNull();
    const junk = await load(bigId, "?model=abc");
    expect(junk.modelMissing).toBeNull(); // not an id: as if none were asked
    expect(junk.modelId).toBe(first);
  });

  test("a new revision is listed at once; the kept list of a revision cannot be changed by a caller", async () => {
    const before = await listModels(dv, otherId);
    expect(before.map((m) => m.name)).toEqual(["Bench 9100", "Bench 9101"]);
    expect(() => {
      (before[0].curves as unknown as unknown[]).push({});
    }).toThrow(TypeError);
    expect(() => {
      (before[0] as { name: string }).name = "changed";
    }).toThrow(TypeError);
    await importInto(otherId, bigLibraryCsv(3, 9200), "Other range");
    const after = await listModels(dv, otherId);
    expect(after.map((m) => m.name)).toEqual(["Bench 9200", "Bench 9201", "Bench 9202"]);
    expect((await listModels(dv, otherId)).map((m) => m.name)).toEqual(["Bench 9200", "Bench 9201", "Bench 9202"]);
  });
});

describe("GET /api/v1/libraries/:id/models a page at a time (the library page's convention: pageOf, MODEL_PAGE_ROWS)", () => {
  type ApiPage = {
    paging: { page: number; pages: number; pageSize: number; total: number };
    links: { self: string; first: string; prev: string | null; next: string | null; last: string };
    models: { id: number; name: string; curves: unknown[] }[];
  };
  const path = () => `/api/v1/libraries/${bigId}/models`;
  const api = async (query = "") => {
    const r = await call(apiModels.loader as never, { path: `${path()}${query}`, cookie: engineer.cookie, params: { id: String(bigId) } });
    expect(r.status, query).toBe(200);
    return r.body as ApiPage;
  };

  test(`${MODELS} models in pages of ${MODEL_PAGE_ROWS}: following links.next from the first page gives every model once, in the service's order`, async () => {
    const pages: ApiPage[] = [await api()];
    while (pages.at(-1)!.links.next && pages.length < 10) pages.push(await api(pages.at(-1)!.links.next!.slice(path().length)));
    expect(pages.map((p) => p.models.length)).toEqual([MODEL_PAGE_ROWS, MODEL_PAGE_ROWS, MODELS - 2 * MODEL_PAGE_ROWS]);
    expect(pages.map((p) => p.paging)).toEqual([1, 2, 3].map((page) => ({ page, pages: 3, pageSize: MODEL_PAGE_ROWS, total: MODELS })));
    const ids = pages.flatMap((p) => p.models.map((m) => m.id));
    expect(new Set(ids).size).toBe(MODELS);
    expect(ids).toEqual((await listModels(dv, bigId)).map((m) => m.id)); // the whole list, in order, once
    for (const p of pages) for (const m of p.models) expect(m.curves).toHaveLength(10); // 2 speeds × 5 impellers (big-library.ts)
    expect(pages[0].links).toEqual({ self: `${path()}?page=1`, first: `${path()}?page=1`, prev: null, next: `${path()}?page=2`, last: `${path()}?page=3` });
    expect(pages[1].links).toMatchObject({ prev: `${path()}?page=1`, next: `${path()}?page=3` });
    expect(pages[2].links).toMatchObject({ self: `${path()}?page=3`, prev: `${path()}?page=2`, next: null });
  });

  test("odd page values answer a page as the library page does, never an error: not a whole number from 1 is the first, past the end the last", async () => {
    const firstIds = (await api("?page=1")).models.map((m) => m.id);
    for (const q of ["0", "-1", "1e9", "abc", "1.5", "", "%00", "2x", "0x2"]) {
      const p = await api(`?page=${q}`);
      expect(p.paging.page, q).toBe(1);
      expect(p.models.map((m) => m.id), q).toEqual(firstIds);
    }
    for (const q of ["4", "1000000000", "9".repeat(15)]) expect((await api(`?page=${q}`)).paging.page, q).toBe(3);
    expect((await api("?page=2")).paging.page).toBe(2);
    // A parameter the route does not take is refused by name (queryProblem), not carried into the links;
    // the links keep the parameters a route does take (api-paging.test.ts, with `revision`).
    const odd = await call(apiModels.loader as never, { path: `${path()}?x=1&page=2`, cookie: engineer.cookie, params: { id: String(bigId) } });
    expect(odd.status).toBe(400);
    expect(JSON.stringify(odd.body)).toMatch(/\bx\b/);
  });

  test("the /api page states the page size the route answers with", async () => {
    expect(apiDocs.loader().pageSizes.models).toBe((await api()).paging.pageSize);
  });
});
