// The import audit's four messy files, on the real upload path (storeUpload → analyseStored → importUpload, MariaDB):
// what the distributor is told, and what reaches the library. Hand-written files, invented pumps; the rules are
// app/lib/import's (unnamed-tail, empty-file, model-line-break, zero-head tests).
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { pumpModels } from "@db/schema";
import { analyseStored, createLibrary, getUpload, importUpload, storeUpload, UploadRejected, type Viewer } from "./index";
import { makeMember } from "~/test/harness";
import { viewerOfUser } from "../projects/test-kit";

let v: Viewer;
beforeAll(async () => {
  const m = await makeMember("distributor");
  v = await viewerOfUser(m.userId, "distributor");
});
afterAll(() => closeDb());

async function upload(text: string) {
  const libId = await createLibrary(v, { name: `messy ${Date.now()} ${Math.random()}`, description: "" });
  const uploadId = await storeUpload(v, libId, new File([text], "messy.csv", { type: "text/csv" }));
  const { upload: u, lib } = await getUpload(v, libId, uploadId);
  return { libId, uploadId, a: analyseStored(u.content, lib) };
}

describe("on the upload path", () => {
  test("min flow “12,5” unquoted in the last column: refused at each row, nothing imported (old code: min flow 12 m³/h, no word)", async () => {
    const rows = [0, 10, 20, 30].map((q, i) => `A,2900,${q},${30 - i * 3},12,5`);
    const { libId, uploadId, a } = await upload(["Model,Speed (rpm),Flow (m3/h),Head (m),Min flow (m3/h)", ...rows].join("\n") + "\n");
    expect(a.result.problems.filter((p) => p.code === "extra-cells").map((p) => [p.row, p.column, p.severity])).toEqual([2, 3, 4, 5].map((r) => [r, "Min flow (m3/h)", "error"]));
    await expect(importUpload(v, libId, uploadId, a.mapping)).rejects.toBeInstanceOf(UploadRejected);
  });
  test("a 1-byte file “A”: the missing data rows, first and alone", async () => {
    const { a } = await upload("A");
    expect(a.result.problems.map((p) => [p.row, p.code, p.reason])).toEqual([[1, "missing-value", "the file has no data rows: line 1 (“A”) is all it holds, read as its header; a curve file has rows of flow and head below it"]]);
  });
  test("a model “Pump⏎X”: stored as “Pump X”, the warning at line 2", async () => {
    const rows = [0, 10, 20].map((q, i) => `"Pump\nX",2900,${q},${30 - i * 3}`);
    const { libId, uploadId, a } = await upload(["Model,Speed (rpm),Flow (m3/h),Head (m)", ...rows].join("\n") + "\n");
    expect(a.result.problems.map((p) => [p.row, p.code])).toEqual([[2, "model-line-break"]]);
    const r = await importUpload(v, libId, uploadId, a.mapping);
    const models = await db().select().from(pumpModels).where(eq(pumpModels.revisionId, r.revisionId));
    expect(models.map((m) => m.name)).toEqual(["Pump X"]);
  });
  test("a zero head in the middle: refused at its own row only", async () => {
    const rows = [30, 28, 0, 20, 14].map((h, i) => `A,2900,${i * 10},${h}`);
    const { a } = await upload(["Model,Speed (rpm),Flow (m3/h),Head (m)", ...rows].join("\n") + "\n");
    expect(a.result.problems.map((p) => [p.row, p.column, p.code])).toEqual([[4, "Head (m)", "zero"]]);
  });
});
