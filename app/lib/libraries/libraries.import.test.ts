// Importer on the server (issue 16), against the real MariaDB: LOAD DATA writes exactly what the
// analysis produced, encodings, run-out, the policy through the API, fix in the browser (plain
// form post, corrected copy kept as a new upload). Fixtures: fixtures/csv/ (invented vendors).
import { createHash } from "node:crypto";
import { readFileSync } from "node:fs";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { asc, eq, inArray } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { curvePoints, curveSets, libraryRevisions, pumpModels, uploads } from "@db/schema";
import { analyseStored, createLibrary, getUpload, importUpload, storeUpload, type Viewer } from "./index";
import { correctedName } from "./upload-fix.server";
import { call, makeMember, type TestMember } from "~/test/harness";
import { createApiToken } from "../auth/api-tokens.server";
import * as uploadPage from "~/routes/libraries.$id.uploads.$uploadId";
import * as apiUpload from "~/routes/api.v1.libraries.$id.upload";

type Fn = Parameters<typeof call>[0];
let d: TestMember;
let viewer: Viewer;
beforeAll(async () => {
  d = await makeMember("distributor");
  viewer = { userId: d.userId, workspace: { id: d.workspaceId, name: "w", slug: "w", plan: "free" }, role: "distributor" };
});
afterAll(() => closeDb());

const file = (name: string, text?: string) => new File([text ?? readFileSync(`fixtures/csv/${name}`)], name, { type: "text/csv" });

async function stored(name: string, text?: string) {
  const libId = await createLibrary(viewer, { name: `import ${name} ${Date.now()}`, description: "" });
  const uploadId = await storeUpload(viewer, libId, file(name, text));
  return { libId, uploadId };
}

async function pointsOf(revisionId: number) {
  const sets = await db().select().from(curveSets).where(eq(curveSets.revisionId, revisionId)).orderBy(asc(curveSets.id));
  const pts = await db().select().from(curvePoints).where(inArray(curvePoints.curveSetId, sets.map((s) => s.id))).orderBy(asc(curvePoints.curveSetId), asc(curvePoints.seq));
  return { sets, pts };
}

describe("LOAD DATA LOCAL INFILE writes what the analysis produced", () => {
  test("every point double is stored bit for bit (long-si.csv)", async () => {
    const { libId, uploadId } = await stored("long-si.csv");
    const { upload, lib } = await getUpload(viewer, libId, uploadId);
    const a = analyseStored(upload.content, lib);
    const r = await importUpload(viewer, libId, uploadId, a.mapping);
    const { sets, pts } = await pointsOf(r.revisionId);
    const expected = a.result.curveSets.flatMap((c) => c.points.map((p) => [p.flow, p.head, p.efficiency ?? null, p.power ?? null, p.npshr ?? null]));
    expect(pts.map((p) => [p.flow, p.head, p.efficiency, p.power, p.npshr])).toEqual(expected); // source: the analysis (shortest round-trip text → same double)
    expect(sets.map((s) => [s.speed, s.impellerDiameter, s.pointCount])).toEqual(a.result.curveSets.map((c) => [c.speed, c.impellerDiameter, c.points.length]));
  });

  test("model names with tab, backslash, quotes and non-ASCII survive the text format", async () => {
    const name = 'Odd "Q" \\ model\twith tab – Ø';
    const csv = `Model,Speed (rpm),Flow (m3/h),Head (m)\n${["0,10", "1,9.5", "2,8"].map((x) => `"${name.replace(/"/g, '""')}",2900,${x}`).join("\n")}\n`;
    const { libId, uploadId } = await stored("odd.csv", csv);
    const { upload, lib } = await getUpload(viewer, libId, uploadId);
    const r = await importUpload(viewer, libId, uploadId, analyseStored(upload.content, lib).mapping);
    const models = await db().select().from(pumpModels).where(eq(pumpModels.revisionId, r.revisionId));
    expect(models.map((m) => m.name)).toEqual([name]); // source: construction
  });
});

describe("encodings on the server", () => {
  test("UTF-16 LE with BOM and a BOM followed by Windows-1252 import with clean headers; the mapping page names the encoding", async () => {
    for (const [f, enc] of [["utf16le-bom.csv", "utf-16le"], ["bom-then-1252.csv", "windows-1252"]] as const) {
      const { libId, uploadId } = await stored(f);
      const page = await call(uploadPage.loader as unknown as Fn, { path: `/libraries/${libId}/uploads/${uploadId}`, params: { id: String(libId), uploadId: String(uploadId) }, cookie: d.cookie });
      const body = page.body as { encoding: { name: string }; headers: string[]; stats: { curveSetsOk: number } };
      expect(body.encoding.name).toBe(enc); // source: fixture bytes (BOM / not valid UTF-8)
      expect(body.headers[0]).toBe("Modell");
      expect(body.stats.curveSetsOk).toBe(1); // source: one curve of 5 rows in the fixture
    }
  });
  test("an encoding chosen on the mapping page is used for the import", async () => {
    const { libId, uploadId } = await stored("windows-1252.csv");
    const { upload, lib } = await getUpload(viewer, libId, uploadId);
    const m = analyseStored(upload.content, lib).mapping;
    const asUtf8 = analyseStored(upload.content, lib, { ...m, encoding: "utf-8" });
    expect(asUtf8.decoded.encoding).toBe("utf-8");
    expect(asUtf8.result.curveSets[0].model).toBe("Grauwald GW-\uFFFD1"); // source: byte D6 (Ö in 1252) is not UTF-8 → replacement character
    const r = await importUpload(viewer, libId, uploadId, { ...m, encoding: "windows-1252" });
    expect((await db().select().from(pumpModels).where(eq(pumpModels.revisionId, r.revisionId)))[0].name).toBe("Grauwald GW-Ö1");
  });
});

describe("run-out points and the policy", () => {
  test("run-out.csv imports both curves without their run-out points", async () => {
    const { libId, uploadId } = await stored("run-out.csv");
    const { upload, lib } = await getUpload(viewer, libId, uploadId);
    const r = await importUpload(viewer, libId, uploadId, analyseStored(upload.content, lib).mapping);
    expect([r.curves, r.points, r.skipped]).toEqual([2, 12, 0]); // source: run-out.csv, 2 curves × (7 rows − 1 run-out)
  });
  test("API: policy=drop-points imports curves that keep ≥ 3 good points; the default skips them; a bad policy is a 400", async () => {
    const { token } = await createApiToken({ userId: d.userId, workspaceId: d.workspaceId, name: "policy", scope: "write" });
    const post = async (libId: number, policy?: string) => {
      const fd = new FormData();
      fd.append("file", file("bad.csv"));
      fd.append("import", "1");
      if (policy) fd.append("policy", policy);
      return call(apiUpload.action as unknown as Fn, { path: `/api/v1/libraries/${libId}/upload`, params: { id: String(libId) }, method: "POST", body: fd, headers: { authorization: `Bearer ${token}` } });
    };
    const l1 = await createLibrary(viewer, { name: `policy skip ${Date.now()}`, description: "" });
    const l2 = await createLibrary(viewer, { name: `policy drop ${Date.now()}`, description: "" });
    const skip = (await post(l1)).body as { revision: { curves: number }; report: { mapping: { policy?: string } } };
    const drop = await post(l2, "drop-points");
    expect(drop.status).toBe(201);
    const dropBody = drop.body as { revision: { curves: number }; report: { mapping: { policy?: string }; problems: { curve: string | null }[] } };
    expect(skip.revision.curves).toBe(1); // source: validate.test.ts, BR-40K is the only clean curve
    expect(dropBody.revision.curves).toBeGreaterThan(1);
    expect(dropBody.report.mapping.policy).toBe("drop-points");
    expect(dropBody.report.problems.some((p) => p.curve === "Brindle BR-40B · 2900 rpm · Ø160 mm")).toBe(true); // curve names, not keys
    expect((await post(l1, "keep-all")).status).toBe(400);
  });
});

describe("fix in the browser (a plain form post, no JavaScript)", () => {
  test("a corrected cell makes a new upload beside the original, both with checksums, and it checks clean", async () => {
    const { libId, uploadId } = await stored("blank-speed.csv");
    const before = (await db().select().from(uploads).where(eq(uploads.id, uploadId)))[0];
    const path = `/libraries/${libId}/uploads/${uploadId}`;
    const page = await call(uploadPage.loader as unknown as Fn, { path, params: { id: String(libId), uploadId: String(uploadId) }, cookie: d.cookie });
    const flagged = (page.body as { flagged: { rows: { line: number; cells: string[] }[] } }).flagged.rows;
    expect(flagged.map((r) => [r.line, r.cells[1]])).toEqual([[4, ""]]); // source: blank-speed.csv line 4 (blank speed)
    const form: Record<string, string> = { intent: "fix", encoding: "utf-8" };
    flagged[0].cells.forEach((c, i) => (form[`cell.4.${i}`] = i === 1 ? "2900" : c));
    const r = await call(uploadPage.action as unknown as Fn, { path, params: { id: String(libId), uploadId: String(uploadId) }, cookie: d.cookie, form });
    expect(r.status).toBe(302);
    const newId = Number(/uploads\/(\d+)\?from=/.exec(r.location ?? "")?.[1]);
    expect(newId).toBeGreaterThan(uploadId);
    const [orig, fixed] = await db().select().from(uploads).where(inArray(uploads.id, [uploadId, newId])).orderBy(asc(uploads.id));
    expect(orig.sha256).toBe(before.sha256); // the original is kept as it was
    expect(fixed.filename).toBe("blank-speed.corrected.csv");
    const text = Buffer.from(fixed.content).toString("utf8");
    expect(fixed.sha256).toBe(createHash("sha256").update(fixed.content).digest("hex"));
    expect(text.split("\n")[3]).toBe("Ashgrove AG-32,2900,140,8,23.4"); // source: blank-speed.csv line 4 with the speed filled in
    expect(text.split("\n").filter((l, i) => i !== 3)).toEqual(readFileSync("fixtures/csv/blank-speed.csv", "utf8").split("\n").filter((l, i) => i !== 3)); // other lines untouched
    const again = await call(uploadPage.loader as unknown as Fn, { path: `/libraries/${libId}/uploads/${newId}?from=${uploadId}`, params: { id: String(libId), uploadId: String(newId) }, cookie: d.cookie });
    expect((again.body as { stats: { errors: number; curveSetsOk: number } }).stats).toMatchObject({ errors: 0, curveSetsOk: 1 }); // checked again on the server
  });
  test("posting unchanged cells saves nothing (422); a cell outside the file is refused", async () => {
    const { libId, uploadId } = await stored("blank-speed.csv");
    const path = `/libraries/${libId}/uploads/${uploadId}`;
    const params = { id: String(libId), uploadId: String(uploadId) };
    const same = await call(uploadPage.action as unknown as Fn, { path, params, cookie: d.cookie, form: { intent: "fix", "cell.4.0": "Ashgrove AG-32" } });
    // a refusal, not a success: 422 as the route's other refused fixes (helper "refusals200"; it answered 200)
    expect([same.status, (same.body as { error: string }).error]).toEqual([422, "No cell was changed; nothing was saved."]); // source: our rule (the route's words)
    const out = await call(uploadPage.action as unknown as Fn, { path, params, cookie: d.cookie, form: { intent: "fix", "cell.99.0": "x" } });
    expect((out.body as { error: string }).error).toContain("line 99 is not in the file");
    expect((await db().select().from(uploads).where(eq(uploads.libraryId, libId))).length).toBe(1);
  });
  test("corrected names", () => {
    expect(correctedName("pumps.csv")).toBe("pumps.corrected.csv"); // source: our naming rule
    expect(correctedName("pumps.corrected.csv")).toBe("pumps.corrected-2.csv");
    expect(correctedName("pumps.corrected-2.tsv")).toBe("pumps.corrected-3.tsv");
  });
});

test("nothing partial: a revision row exists only with its points (import then count)", async () => {
  const { libId, uploadId } = await stored("long-si.csv");
  const { upload, lib } = await getUpload(viewer, libId, uploadId);
  await expect(importUpload(viewer, libId, uploadId, analyseStored(upload.content, lib).mapping, "", { beforeCommit: async () => { throw new Error("boom"); } })).rejects.toThrow("boom");
  expect(await db().select().from(libraryRevisions).where(eq(libraryRevisions.libraryId, libId))).toEqual([]); // rolled back with the LOAD DATA rows
  const orphans = await db().select({ id: pumpModels.id }).from(pumpModels).innerJoin(libraryRevisions, eq(libraryRevisions.id, pumpModels.revisionId)).where(eq(libraryRevisions.libraryId, libId));
  expect(orphans).toEqual([]);
});
