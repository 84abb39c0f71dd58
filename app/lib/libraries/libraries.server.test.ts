// Pump libraries against the real MariaDB. Fixture CSVs are invented vendor exports
// (fixtures/csv/, hand-written); expected counts are read off those files.
import { readFileSync } from "node:fs";
import { afterAll, describe, expect, onTestFinished, test } from "vitest";
import { eq, inArray } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { curvePoints, curveSets, libraries, libraryRevisions, pumpModels } from "@db/schema";
import {
  analyseStored,
  createLibrary,
  deleteLibrary,
  getUpload,
  importUpload,
  libraryCurves,
  listLibraries,
  searchableRevisions,
  storeUpload,
  updateLibrary,
  UploadRejected,
  type Viewer,
} from "./index";
import { makeMember, makeWorkspace, type TestMember } from "~/test/harness";
import { viewerOfUser } from "../projects/test-kit";

afterAll(() => closeDb());

const viewerOf = (m: TestMember): Promise<Viewer> => viewerOfUser(m.userId, m.role);
const csv = (name: string, type = "text/csv") => new File([readFileSync(`fixtures/csv/${name}`)], name, { type });

async function importFixture(v: Viewer, libId: number, name: string) {
  const uploadId = await storeUpload(v, libId, csv(name));
  const { text, lib } = await getUpload(v, libId, uploadId);
  const a = analyseStored(text, lib);
  return { uploadId, analysis: a, result: await importUpload(v, libId, uploadId, a.mapping, `import of ${name}`) };
}

describe("uploads", () => {
  test("keeps the original bytes with their SHA-256 and refuses what is not CSV", async () => {
    const d = await viewerOf(await makeMember("distributor"));
    const lib = await createLibrary(d, { name: "Bytes", description: "" });
    const uploadId = await storeUpload(d, lib, csv("semicolon-decimal-comma.csv"));
    const { upload } = await getUpload(d, lib, uploadId);
    const original = readFileSync("fixtures/csv/semicolon-decimal-comma.csv");
    expect(Buffer.compare(upload.content, original)).toBe(0);
    expect(upload.sha256).toMatch(/^[0-9a-f]{64}$/);
    await expect(storeUpload(d, lib, new File([new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0, 0, 1])], "curve.csv", { type: "text/csv" }))).rejects.toThrow(UploadRejected);
    await expect(storeUpload(d, lib, new File(["a,b"], "curves.xlsx", { type: "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet" }))).rejects.toThrow(/not a CSV/);
    await expect(storeUpload(d, lib, new File([], "empty.csv", { type: "text/csv" }))).rejects.toThrow(/empty/);
  });
});

describe("import", () => {
  test("imports the clean long file as revision 1 with every point, in SI", async () => {
    const d = await viewerOf(await makeMember("distributor"));
    const libId = await createLibrary(d, { name: "Clean", description: "" });
    const { analysis, result } = await importFixture(d, libId, "long-si.csv");
    expect(analysis.result.stats.errors).toBe(0);
    expect(result.number).toBe(1);
    expect(result.curves).toBe(analysis.result.curveSets.length);
    const curves = await libraryCurves(d, libId);
    expect(curves.reduce((s, c) => s + c.points.length, 0)).toBe(result.points);
    // First row of long-si.csv: 2900 rpm, 165 mm, 0 m³/h, 34.00 m (hand-written fixture).
    const kr3 = curves.find((c) => c.model === "Kestrel KR-3" && c.speed === 2900)!;
    expect(kr3.impellerDiameter).toBeCloseTo(0.165, 9);
    expect(kr3.points[0].head).toBeCloseTo(34.0, 9);
    // 5.71 m³/h = 5.71/3600 m³/s (definition of the hour)
    expect(kr3.points[1].flow).toBeCloseTo(5.71 / 3600, 12);
    expect(kr3.points[1].efficiency).toBeCloseTo(0.277, 9);
    expect(kr3.points[1].power).toBeCloseTo(1889, 6);
    const [lib] = await db().select().from(libraries).where(eq(libraries.id, libId));
    expect(lib.currentRevisionId).toBe(result.revisionId);
    expect(lib.mappingJson).toContain('"version":1');
  });

  test("a file with bad rows imports the good curves and skips the flagged ones", async () => {
    const d = await viewerOf(await makeMember("distributor"));
    const libId = await createLibrary(d, { name: "Mixed", description: "" });
    const { analysis, result } = await importFixture(d, libId, "bad.csv");
    const good = analysis.result.curveSets.filter((c) => c.ok).length;
    expect(analysis.result.stats.errors).toBeGreaterThan(0);
    expect(result.curves).toBe(good);
    expect(result.skipped).toBe(analysis.result.curveSets.length - good);
  });

  test("a re-import makes revision 2 and leaves revision 1's curves as they were", async () => {
    const d = await viewerOf(await makeMember("distributor"));
    const libId = await createLibrary(d, { name: "Revisions", description: "" });
    const first = await importFixture(d, libId, "long-si.csv");
    const before = await libraryCurves(d, libId, first.result.revisionId);
    const second = await importFixture(d, libId, "us-units.csv");
    expect(second.result.number).toBe(2);
    expect(await libraryCurves(d, libId, first.result.revisionId)).toEqual(before);
    expect((await libraryCurves(d, libId)).map((c) => c.model)).not.toEqual(before.map((c) => c.model));
  });

  test("a failure inside the import leaves the previous revision current and no partial rows", async () => {
    const d = await viewerOf(await makeMember("distributor"));
    const libId = await createLibrary(d, { name: "Atomic", description: "" });
    const first = await importFixture(d, libId, "long-si.csv");
    const uploadId = await storeUpload(d, libId, csv("us-units.csv"));
    const { text, lib } = await getUpload(d, libId, uploadId);
    const mapping = analyseStored(text, lib).mapping;
    await expect(
      importUpload(d, libId, uploadId, mapping, "", {
        beforeCommit: async () => {
          throw new Error("power cut");
        },
      }),
    ).rejects.toThrow("power cut");
    const revs = await db().select().from(libraryRevisions).where(eq(libraryRevisions.libraryId, libId));
    expect(revs.map((r) => r.number)).toEqual([1]);
    const [l] = await db().select().from(libraries).where(eq(libraries.id, libId));
    expect(l.currentRevisionId).toBe(first.result.revisionId);
    const models = await db().select().from(pumpModels).where(inArray(pumpModels.revisionId, revs.map((r) => r.id)));
    const sets = await db().select().from(curveSets).where(eq(curveSets.revisionId, first.result.revisionId));
    expect(models.length).toBe(first.result.models);
    expect(sets.length).toBe(first.result.curves);
    const orphans = await db().select({ id: curveSets.id }).from(curveSets).innerJoin(libraryRevisions, eq(libraryRevisions.id, curveSets.revisionId)).where(eq(libraryRevisions.libraryId, libId));
    expect(orphans.length).toBe(first.result.curves);
    const pts = await db().select({ id: curvePoints.id }).from(curvePoints).where(inArray(curvePoints.curveSetId, sets.map((s) => s.id)));
    expect(pts.length).toBe(first.result.points);
  });
});

describe("visibility and the plan gate", () => {
  test("shared libraries are listed locked on the free plan and never give curves; open on the paid plan", async () => {
    const dist = await viewerOf(await makeMember("distributor"));
    const libId = await createLibrary(dist, { name: `Shared ${Date.now()}`, description: "for subscribers" });
    await importFixture(dist, libId, "long-si.csv");
    await updateLibrary(dist, libId, { name: "Shared lib", description: "for subscribers", visibility: "shared" });
    // A shared library is seen by every paid workspace of this database: gone at the end, even when a check fails.
    onTestFinished(async () => void (await deleteLibrary(dist, libId)));

    const freeEng = await viewerOf(await makeMember("engineer"));
    const listed = (await listLibraries(freeEng)).find((l) => l.id === libId);
    expect(listed?.access).toBe("locked");
    const thrown = await libraryCurves(freeEng, libId).catch((e) => e);
    expect(thrown?.init?.status).toBe(403);
    expect((await searchableRevisions(freeEng)).open.some((r) => r.libraryId === libId)).toBe(false);

    const paidWs = await makeWorkspace(undefined, "network");
    const paidEng = await viewerOf(await makeMember("engineer", paidWs.id));
    expect((await listLibraries(paidEng)).find((l) => l.id === libId)?.access).toBe("open");
    expect((await libraryCurves(paidEng, libId)).length).toBeGreaterThan(0);
    expect((await searchableRevisions(paidEng)).open.some((r) => r.libraryId === libId)).toBe(true);
  });

  test("private and workspace libraries stay inside their workspace; private ones only for authors", async () => {
    const dist = await makeMember("distributor");
    const dv = await viewerOf(dist);
    const libId = await createLibrary(dv, { name: "Draft", description: "" });
    const colleague = await viewerOf(await makeMember("engineer", dist.workspaceId));
    const outsider = await viewerOf(await makeMember("admin", (await makeWorkspace(undefined, "network")).id));
    expect((await listLibraries(colleague)).some((l) => l.id === libId)).toBe(false);
    await updateLibrary(dv, libId, { name: "Draft", description: "", visibility: "workspace" });
    expect((await listLibraries(colleague)).some((l) => l.id === libId)).toBe(true);
    expect((await listLibraries(outsider)).some((l) => l.id === libId)).toBe(false);
    expect((await libraryCurves(outsider, libId).catch((e) => e))?.init?.status).toBe(404);
  });

  test("an engineer cannot publish or upload", async () => {
    const dist = await makeMember("distributor");
    const libId = await createLibrary(await viewerOf(dist), { name: "Guarded", description: "" });
    const eng = await viewerOf(await makeMember("engineer", dist.workspaceId));
    await updateLibrary(await viewerOf(dist), libId, { name: "Guarded", description: "", visibility: "workspace" });
    expect((await updateLibrary(eng, libId, { name: "x", description: "", visibility: "shared" }).catch((e) => e))?.init?.status).toBe(403);
    expect((await storeUpload(eng, libId, csv("long-si.csv")).catch((e) => e))?.init?.status).toBe(403);
  });
});
