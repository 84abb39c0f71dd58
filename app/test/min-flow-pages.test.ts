// The maker's-minimum-flow editor on the mapping page with more curves than one page holds (MIN_FLOW_CURVES_SHOWN = 50).
// Before, the page listed the first 50 curves only and said "write the others in the file's column": a distributor with 53
// curves could not set or correct the 51st from the page (`minflow.51` → 404 "No curve 51 in this upload's list of 50").
// Now the list is paged (`?minflows=N`, shared/paging.ts: none or below 1 → the first, past the last → the last), each
// curve keeps its number in the file, and the editor's form on page 2 saves curve 51's figure into the corrected copy.
// Real route module, guards, analysis worker and MariaDB. Invented pumps.
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { uploads } from "@db/schema";
import { createLibrary, storeUpload, type Viewer } from "~/lib/libraries";
import { stopAnalysisWorker } from "~/lib/libraries/upload-analysis.server";
import { MIN_FLOW_CURVES_SHOWN } from "~/lib/libraries/upload-min-flows";
import type { UploadSummary } from "~/lib/libraries/upload-analysis";
import { viewerOfUser } from "~/lib/projects/test-kit";
import * as uploadPage from "~/routes/libraries.$id.uploads.$uploadId";
import { call, makeMember, type TestMember } from "./harness";

afterAll(async () => {
  await stopAnalysisWorker();
  await closeDb();
});

const M3H = 1 / 3600;
const CURVES = 53;
const name = (i: number) => `PG-${String(i).padStart(2, "0")}`;
/** 53 invented curves of four points each, 0–40 m³/h, no maker's minimum flow column; curve i on lines 4i−2 … 4i+1. */
const CSV = ["Model,Speed (rpm),Flow (m3/h),Head (m)", ...Array.from({ length: CURVES }, (_, i) => [0, 20, 30, 40].map((q, k) => `${name(i + 1)},2900,${q},${30 - 2 * k * k}`)).flat()].join("\n") + "\n";

let m: TestMember;
let v: Viewer;
let lib = 0;
let upload = 0;
const path = (id: number, query = "") => `/libraries/${lib}/uploads/${id}${query}`;
const page = async (query = "", id = upload) => {
  const r = await call(uploadPage.loader as never, { path: path(id, query), cookie: m.cookie, params: { id: String(lib), uploadId: String(id) } });
  expect(r.status).toBe(200);
  return (r.body as UploadSummary).minFlows;
};
const post = async (query: string, fields: Record<string, string>) => {
  const r = await call(uploadPage.loader as never, { path: path(upload, query), cookie: m.cookie, params: { id: String(lib), uploadId: String(upload) } });
  return call(uploadPage.action as never, {
    path: path(upload, query), cookie: m.cookie, params: { id: String(lib), uploadId: String(upload) },
    form: { intent: "min-flow", base: JSON.stringify((r.body as UploadSummary).mapping), encoding: "utf-8", ...fields },
  });
};
const textOf = async (id: number) => new TextDecoder().decode((await db().select({ c: uploads.content }).from(uploads).where(eq(uploads.id, id)))[0].c);

beforeAll(async () => {
  m = await makeMember("distributor");
  v = await viewerOfUser(m.userId, "distributor");
  lib = await createLibrary(v, { name: "Min flow pages", description: "" });
  upload = await storeUpload(v, lib, new File([CSV], "many.csv", { type: "text/csv" }));
});

describe("53 curves: two pages, and the 51st can be corrected", () => {
  test("page 1 lists curves 1–50 of 53 and says there are 2 pages", async () => {
    expect(MIN_FLOW_CURVES_SHOWN).toBe(50);
    const l = await page();
    expect([l.total, l.page, l.pages, l.rows.length, l.rows[0].n, l.rows[49].n, l.rows[49].name]).toEqual([53, 1, 2, 50, 1, 50, "PG-50 · 2900 rpm"]);
  });

  test("?minflows=2 lists curves 51–53 by their numbers in the file, with their lines (old code: curves 1–50 again)", async () => {
    const l = await page("?minflows=2");
    expect(l.rows.map((r) => [r.n, r.name, r.lastFlow, r.minFlow, r.lines])).toEqual([
      [51, "PG-51 · 2900 rpm", 40 * M3H, null, [202, 203, 204, 205]], // source: construction, curve i on lines 4i−2 … 4i+1
      [52, "PG-52 · 2900 rpm", 40 * M3H, null, [206, 207, 208, 209]],
      [53, "PG-53 · 2900 rpm", 40 * M3H, null, [210, 211, 212, 213]],
    ]);
    expect([l.page, l.pages]).toEqual([2, 2]);
  });

  test("saving 12 m³/h for curve 51 on page 2: the corrected copy holds it on PG-51's rows only, and reads back on its page 2", async () => {
    const r = await post("?minflows=2", { "minflow.51": "12" });
    expect(r.status).toBe(302);
    expect(r.location).toMatch(/\/uploads\/\d+\?from=\d+&minflows=2$/);
    const copy = Number(/uploads\/(\d+)/.exec(r.location ?? "")?.[1]);
    const lines = (await textOf(copy)).split("\n");
    expect(lines[0]).toBe("Model,Speed (rpm),Flow (m3/h),Head (m),Min flow (m3/h)");
    expect(lines.filter((x) => x.split(",")[4] === "12").map((x) => x.split(",")[0])).toEqual(Array(4).fill("PG-51"));
    const after = await page("?minflows=2", copy);
    expect(after.rows.map((x) => x.minFlow)).toEqual([12 * M3H, null, null]);
  });

  test("curve 51 posted from page 1 is not on that page: 404, nothing saved", async () => {
    const before = (await db().select({ id: uploads.id }).from(uploads).where(eq(uploads.libraryId, lib))).length;
    const r = await post("", { "minflow.51": "12" });
    expect(r.status).toBe(404);
    expect(String(r.body)).toContain("No curve 51 on this page of the upload's curves (1–50 of 53)");
    expect((await db().select({ id: uploads.id }).from(uploads).where(eq(uploads.libraryId, lib))).length).toBe(before);
  });

  test.each([["?minflows=0", 1], ["?minflows=abc", 1], ["?minflows=-3", 1], ["?minflows=3", 2], ["?minflows=99999999", 2]])("%s shows page %i (clamped, never a 500)", async (query, want) => {
    expect((await page(query)).page).toBe(want);
  });
});
