// Import progress (issue 16): the `imports` row advances per batch of points streamed, outside the
// import's transaction, and ends done (with its revision) or failed (with the reason, nothing kept);
// a running row that stopped moving shows as stopped; the library page lists them.
import { eq, sql } from "drizzle-orm";
import { afterAll, beforeAll, expect, test } from "vitest";
import { closeDb, db } from "@db/client.server";
import { imports, libraryRevisions } from "@db/schema";
import { makeBigCsv } from "../../../fixtures/csv/make-big";
import { createLibrary, prepareImport, storeUpload, analyseStored, getUpload, type Viewer } from "~/lib/libraries";
import { stopAnalysisWorker } from "~/lib/libraries/upload-analysis.server";
import * as libraryPage from "~/routes/libraries.$id";
import { call, makeMember, type TestMember } from "~/test/harness";
import { linesHere, POINTS_PER_PIECE } from "./import-write.server";
import { importOf, progressWriter, recentImports, startImportRow, STALE_AFTER_MS } from "./import-progress.server";
import { runImport, startImport } from "./import-run.server";

let m: TestMember;
let viewer: Viewer;
beforeAll(async () => {
  m = await makeMember("distributor");
  viewer = { userId: m.userId, workspace: { id: m.workspaceId, name: "W", slug: "w", plan: "free" }, role: "distributor" };
});
afterAll(async () => {
  await stopAnalysisWorker();
  await closeDb();
});

async function prepared(points: number) {
  const lib = await createLibrary(viewer, { name: `Progress ${points}`, description: "" });
  const upload = await storeUpload(viewer, lib, new File([makeBigCsv({ points })], "p.csv", { type: "text/csv" }));
  const { lib: l } = await getUpload(viewer, lib, upload);
  const mapping = analyseStored(makeBigCsv({ points: 30 }), l).mapping;
  const { uploadId, plan } = await prepareImport(viewer, lib, upload, mapping);
  return { lib, upload, uploadId, plan };
}

test("points are streamed in pieces and each piece reports the count so far (12 000 points: 5 000, 10 000, 12 000)", async () => {
  const { plan } = await prepared(12_000);
  const seen: number[] = [];
  const text = Buffer.concat([...linesHere(plan, "points", (i) => String(i + 1), POINTS_PER_PIECE, (n) => seen.push(n))]).toString("latin1");
  expect(POINTS_PER_PIECE).toBe(5000);
  expect(seen).toEqual([5000, 10_000, 12_000]);
  expect(text.split("\n").length - 1).toBe(12_000);
});

test("the progress row advances outside any transaction; the latest count wins", async () => {
  const { lib, upload } = await prepared(30);
  const id = await startImportRow({ libraryId: lib, uploadId: upload, userId: m.userId, pointsTotal: 30_000 });
  const w = progressWriter(id);
  for (const n of [5000, 10_000, 15_000]) w.sink(n);
  await w.flush();
  expect(await importOf(lib, id)).toMatchObject({ status: "running", pointsWritten: 15_000, pointsTotal: 30_000 });
  w.sink(20_000);
  await w.flush();
  expect((await importOf(lib, id))!.pointsWritten).toBe(20_000);
});

test("a finished import shows done with its revision; a failed one shows failed with the reason and keeps nothing", async () => {
  const a = await prepared(12_000);
  const args = { libraryId: a.lib, uploadId: a.uploadId, userId: m.userId, plan: a.plan, note: "" };
  const ok = await runImport(args);
  expect(await importOf(a.lib, ok.importId)).toMatchObject({ status: "done", pointsWritten: 12_000, pointsTotal: 12_000, revisionNumber: 1 });
  let seenRunning: unknown = null;
  await expect(
    runImport(args, {
      beforeCommit: async () => {
        seenRunning = (await db().select().from(imports).where(eq(imports.libraryId, a.lib)).orderBy(sql`id DESC`).limit(1))[0]?.status;
        throw new Error("power cut");
      },
    }),
  ).rejects.toThrow("power cut");
  expect(seenRunning).toBe("running"); // visible from another connection while the import's transaction is open
  const [failed] = await recentImports(a.lib, 1);
  expect(failed).toMatchObject({ status: "failed", message: "power cut" });
  expect((await db().select().from(libraryRevisions).where(eq(libraryRevisions.libraryId, a.lib))).length).toBe(1);
});

test("a background import is found on the library page, running or done; a stale running row shows as stopped", async () => {
  const a = await prepared(12_000);
  const id = await startImport({ libraryId: a.lib, uploadId: a.uploadId, userId: m.userId, plan: a.plan, note: "" });
  const page = async () =>
    (await call(libraryPage.loader as never, { path: `/libraries/${a.lib}?import=${id}`, cookie: m.cookie, params: { id: String(a.lib) } })).body as {
      imports: { id: number; status: string; pointsWritten: number }[];
      importId: number;
    };
  const first = await page();
  expect(first.importId).toBe(id);
  expect(first.imports.map((i) => i.id)).toContain(id);
  expect(["running", "done"]).toContain(first.imports.find((i) => i.id === id)!.status);
  for (let i = 0; i < 600 && (await importOf(a.lib, id))!.status === "running"; i++) await new Promise((r) => setTimeout(r, 100));
  expect((await page()).imports.find((i) => i.id === id)).toMatchObject({ status: "done", pointsWritten: 12_000 });
  const stale = await startImportRow({ libraryId: a.lib, uploadId: a.uploadId, userId: m.userId, pointsTotal: 10 });
  await db().update(imports).set({ updatedAt: new Date(Date.now() - STALE_AFTER_MS - 60_000) }).where(eq(imports.id, stale));
  expect(await importOf(a.lib, stale)).toMatchObject({ status: "stopped" });
});
