// The mapping page's maker's-minimum-flow editor (MinFlowEditor, lib/libraries/min-flow-form.ts): a figure typed for a curve
// becomes a corrected copy of the upload — written on every row of the curve, in a column it adds when the file has none,
// in the reader's unit — which reads back and imports as the curve set's `min_flow`; the field attacked with NaN, Infinity,
// negative, 0, 1e400, a 10 kB string, a figure at or past the curve's last flow (400, nothing stored) and curve numbers the
// list does not hold (404, not 500). Real route module, guards, analysis worker and MariaDB. Invented pumps.
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { and, eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { curveSets, pumpModels, uploads, users } from "@db/schema";
import { createLibrary, storeUpload, type Viewer } from "~/lib/libraries";
import { stopAnalysisWorker } from "~/lib/libraries/upload-analysis.server";
import type { UploadSummary } from "~/lib/libraries/upload-analysis";
import { importCsvText, viewerOfUser } from "~/lib/projects/test-kit";
import * as uploadPage from "~/routes/libraries.$id.uploads.$uploadId";
import { call, makeMember, type TestMember } from "./harness";
import { describeOnTheWire } from "./on-the-wire";
import { plainHtml } from "./render-page";

afterAll(async () => {
  await stopAnalysisWorker();
  await closeDb();
});

const M3H = 1 / 3600;
const GPM = 3.785411784e-3 / 60; // m³/s per US gpm (NIST SP 811)
/** Two invented curves, 0–40 m³/h, no maker's minimum flow column. */
const CSV = ["Model,Speed (rpm),Impeller (mm),Flow (m3/h),Head (m)", ...["MF-1", "MF-2"].flatMap((m) => [0, 20, 30, 40].map((q, i) => `${m},2900,160,${q},${30 - 2 * i * i}`))].join("\n") + "\n";

let m: TestMember;
let v: Viewer;
let lib = 0;
let upload = 0;
const params = () => ({ id: String(lib), uploadId: String(upload) });
const page = async (id = upload, member = m) => {
  const r = await call(uploadPage.loader as never, { path: `/libraries/${lib}/uploads/${id}`, cookie: member.cookie, params: { id: String(lib), uploadId: String(id) } });
  expect(r.status).toBe(200);
  return r.body as UploadSummary;
};
const post = async (fields: Record<string, string>, id = upload, member = m) => {
  const s = await page(id, member);
  return call(uploadPage.action as never, {
    path: `/libraries/${lib}/uploads/${id}`, cookie: member.cookie, params: { id: String(lib), uploadId: String(id) },
    form: { intent: "min-flow", base: JSON.stringify(s.mapping), encoding: "utf-8", ...fields },
  });
};
const uploadCount = async () => (await db().select({ id: uploads.id }).from(uploads).where(eq(uploads.libraryId, lib))).length;
const textOf = async (id: number) => new TextDecoder().decode((await db().select({ c: uploads.content }).from(uploads).where(eq(uploads.id, id)))[0].c);
const newId = (location: string | null) => Number(/uploads\/(\d+)\?from=/.exec(location ?? "")?.[1]);

beforeAll(async () => {
  m = await makeMember("distributor");
  v = await viewerOfUser(m.userId, "distributor");
  lib = await createLibrary(v, { name: "Min flow editor", description: "" });
  upload = await storeUpload(v, lib, new File([CSV], "pumps.csv", { type: "text/csv" }));
});

describe("a figure typed for a curve: a corrected copy that reads back and imports", () => {
  test("the page lists each curve with its last flow and no figure; saving 12 m³/h for MF-1 adds the column on MF-1's rows", async () => {
    const before = await page();
    // names in the reader's units (SI: Ø in mm); flows in m³/s as the importer read them (40 m³/h ÷ 3600)
    expect(before.minFlows.rows.map((r) => [r.n, r.name, r.lastFlow, r.minFlow])).toEqual([[1, "MF-1 · 2900 rpm · Ø160 mm", 40 * M3H, null], [2, "MF-2 · 2900 rpm · Ø160 mm", 40 * M3H, null]]);
    const r = await post({ "minflow.1": "12", "minflow.2": "" });
    expect(r.status).toBe(302);
    const copy = newId(r.location);
    expect(copy).toBeGreaterThan(upload);
    const text = await textOf(copy);
    expect(text.split("\n").slice(0, 6)).toEqual(["Model,Speed (rpm),Impeller (mm),Flow (m3/h),Head (m),Min flow (m3/h)", "MF-1,2900,160,0,30,12", "MF-1,2900,160,20,28,12", "MF-1,2900,160,30,22,12", "MF-1,2900,160,40,12,12", "MF-2,2900,160,0,30"]); // source: construction
    const after = await page(copy);
    expect(after.stats.errors).toBe(0);
    expect(after.minFlows.column?.header).toBe("Min flow (m3/h)");
    expect(after.minFlows.rows.map((x) => x.minFlow)).toEqual([12 * M3H, null]);
  });

  test("a figure changed in the file's own column, and one cleared, each on every row of its curve", async () => {
    const withColumn = await storeUpload(v, lib, new File([CSV.replace("Head (m)\n", "Head (m),Qmin (l/s)\n").replace(/^(MF-1,.*)$/gm, "$1,3")], "qmin.csv", { type: "text/csv" }));
    expect((await page(withColumn)).minFlows.rows.map((x) => x.minFlow)).toEqual([3e-3, null]); // source: 3 L/s
    const r = await post({ "minflow.1": "", "minflow.2": "25" }, withColumn);
    expect(r.status).toBe(302);
    const text = await textOf(newId(r.location));
    expect(text.split("\n").filter((l) => l.startsWith("MF-1")).map((l) => l.split(",")[5])).toEqual(["", "", "", ""]);
    // 25 m³/h typed (SI reader) written in the column's own unit, L/s: 25 / 3.6 = 6.94444444444 L/s (12 significant digits)
    expect(text.split("\n").filter((l) => l.startsWith("MF-2")).map((l) => l.split(",")[5])).toEqual(Array(4).fill("6.94444444444"));
  });

  test("imported: the curve set carries the figure in m³/s; the other none", async () => {
    const r = await post({ "minflow.2": "9.5" });
    const text = await textOf(newId(r.location));
    const imported = await createLibrary(v, { name: "Min flow imported", description: "" });
    await importCsvText(v, imported, text, "corrected.csv");
    const rows = await db().select({ model: pumpModels.name, minFlow: curveSets.minFlow }).from(curveSets).innerJoin(pumpModels, eq(pumpModels.id, curveSets.modelId)).where(and(eq(pumpModels.revisionId, curveSets.revisionId)));
    const mine = rows.filter((x) => x.model.startsWith("MF-")).slice(-2);
    expect(mine.map((x) => x.model)).toEqual(["MF-1", "MF-2"]);
    expect(mine[0].minFlow).toBeNull();
    expect(mine[1].minFlow).toBeCloseTo(9.5 * M3H, 15); // source: 9.5 m³/h ÷ 3600
  });

  test("a reader in US units types gpm, and the added column is in gpm", async () => {
    const us = await makeMember("distributor", m.workspaceId);
    await db().update(users).set({ unitSystem: "US" }).where(eq(users.id, us.userId));
    const r = await post({ "minflow.1": "50" }, upload, us);
    expect(r.status).toBe(302);
    const copy = newId(r.location);
    expect((await textOf(copy)).split("\n")[0]).toBe("Model,Speed (rpm),Impeller (mm),Flow (m3/h),Head (m),Min flow (gpm)");
    expect((await page(copy)).minFlows.rows[0].minFlow).toBeCloseTo(50 * GPM, 15); // source: NIST SP 811
  });
});

describe("the field attacked: refused with the field's words, never a 500, nothing stored", () => {
  const bad: [string, string, RegExp][] = [
    ["NaN", "NaN", /must be a number/],
    ["Infinity", "Infinity", /must be a number/],
    ["-Infinity", "-Infinity", /must be a number/],
    ["negative", "-5", /must be a number above zero/],
    ["zero", "0", /must be a number above zero/],
    ["1e400", "1e400", /out of range/],
    ["a 10 kB string", "x".repeat(10 * 1024), /must be a number/],
    ["1,500 (ambiguous)", "1,500", /ambiguous/],
    ["the last flow, 40 m³/h", "40", /, 40\.0 m³\/h, is not below the curve's last published flow, 40\.0 m³\/h: a curve's maker's minimum flow is one figure, above zero and below/],
    ["past it, 41 m³/h", "41", /41\.0 m³\/h, is not below the curve's last published flow/],
  ];
  test.each(bad)("minflow.1 = %s → 400", async (_, value, words) => {
    const n = await uploadCount();
    const r = await post({ "minflow.1": value });
    expect(r.status).toBe(400);
    const error = String((r.body as { error?: string }).error);
    expect(error).toMatch(words);
    expect(error.length).toBeLessThan(400); // a long text is never echoed whole
    expect(await uploadCount()).toBe(n);
  });

  test.each(["minflow.3", "minflow.0", "minflow.999999", "minflow.-1", "minflow.abc", "minflow.1e3", `minflow.${"9".repeat(400)}`].map((k) => [k.slice(0, 24), k]))("%s (no such curve in the list) → 404", async (_, key) => {
    const n = await uploadCount();
    const r = await post({ [key]: "12" });
    expect(r.status).toBe(404);
    expect(await uploadCount()).toBe(n);
  });

  test("just below the last flow is taken; an unchanged figure saves nothing (422)", async () => {
    const r = await post({ "minflow.1": String(40 * (1 - 1e-6)) });
    expect(r.status).toBe(302);
    const again = await post({ "minflow.1": "", "minflow.2": "" });
    expect(again.status).toBe(422); // a refusal, as the route's other refused saves (helper "refusals200"; it answered 200)
    expect((again.body as { error?: string }).error).toBe("No figure was changed; nothing was saved."); // source: our rule (the route's words)
  });

  test("another workspace's member cannot reach it (404 before any field is read)", async () => {
    const stranger = await makeMember("distributor");
    const r = await call(uploadPage.action as never, { path: `/libraries/${lib}/uploads/${upload}`, cookie: stranger.cookie, params: params(), form: { intent: "min-flow", "minflow.1": "12" } });
    expect(r.status).toBe(404);
  });
});

// A save that changes nothing, posted as a browser without JavaScript posts it (helper "refusals200"; both answered 200):
// 422, and the mapping page itself again with the refusal's words and its forms.
describeOnTheWire("on the wire, without JavaScript: a save that changes nothing", (wire) => {
  const postAsBrowser = (form: Record<string, string>) => wire.postAsBrowser(`/libraries/${lib}/uploads/${upload}`, m.cookie, form);

  test.each([
    ["a fix whose cell is the file's own (MF-1)", { intent: "fix", encoding: "utf-8", "cell.2.0": "MF-1" }, "No cell was changed; nothing was saved."],
    ["a min-flow save with every figure left blank", { "minflow.1": "", "minflow.2": "" }, "No figure was changed; nothing was saved."],
  ] as [string, Record<string, string>, string][])("%s: 422, the page with the refusal", async (_, fields, words) => {
    const n = await uploadCount();
    const form = fields.intent ? fields : { intent: "min-flow", base: JSON.stringify((await page()).mapping), encoding: "utf-8", ...fields };
    const res = await postAsBrowser(form);
    const html = plainHtml(await res.text());
    expect([res.status, res.headers.get("content-type")]).toEqual([422, "text/html; charset=utf-8"]);
    expect(html).toContain(`role="alert">${words}</p>`); // source: our rule (the route's words, in FormError)
    expect(html).toContain("Map and check: pumps.csv"); // the page itself, not an error page
    expect(html).toMatch(/<form[^>]*method="post"/);
    expect(await uploadCount()).toBe(n);
  }, 60_000);
});
