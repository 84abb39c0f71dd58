// Hostile and broken uploads through the library service against the real MariaDB.
// Contract checked for every input (source: libraries.server.ts and the upload/import routes):
// - storeUpload either stores or rejects with UploadRejected (then no upload row is written);
// - importUpload either imports or rejects with UploadRejected; a mapping that MappingSchema
//   refuses throws v.ValiError instead (documented in app/lib/import/index.ts; the route checks
//   the mapping before calling importUpload);
// - a rejected import writes zero rows: pump_models, curve_sets, curve_points and
//   library_revisions of the library are counted before and after;
// - a successful import writes exactly the models, curves and points it reports.
// Inputs are built here (seeded PRNG) or taken from fixtures/demo (generate.ts, invented data).
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as v from "valibot";
import { closeDb, getPool } from "@db/client.server";
import { generateDemo } from "../../../fixtures/demo/generate";
import { analyseStored, createLibrary, getUpload, importUpload, storeUpload, UploadRejected, type Viewer } from "./index";
import { MappingSchema } from "../import";
import { makeMember } from "~/test/harness";
import { viewerOfUser } from "../projects/test-kit";
import { prng } from "../../../fixtures/prng";

afterAll(() => closeDb());

let viewer: Viewer;
beforeAll(async () => {
  const m = await makeMember("distributor");
  viewer = await viewerOfUser(m.userId, m.role);
});


type Counts = { uploads: number; revisions: number; models: number; sets: number; points: number };

async function counts(libraryId: number): Promise<Counts> {
  const q = async (sql: string) => Number((await getPool().query(sql, [libraryId]))[0].n);
  return {
    uploads: await q("SELECT COUNT(*) AS n FROM uploads WHERE library_id = ?"),
    revisions: await q("SELECT COUNT(*) AS n FROM library_revisions WHERE library_id = ?"),
    models: await q("SELECT COUNT(*) AS n FROM pump_models m JOIN library_revisions r ON r.id = m.revision_id WHERE r.library_id = ?"),
    sets: await q("SELECT COUNT(*) AS n FROM curve_sets s JOIN library_revisions r ON r.id = s.revision_id WHERE r.library_id = ?"),
    points: await q(
      "SELECT COUNT(*) AS n FROM curve_points p JOIN curve_sets s ON s.id = p.curve_set_id JOIN library_revisions r ON r.id = s.revision_id WHERE r.library_id = ?",
    ),
  };
}

type Outcome =
  | { stage: "store"; rejected: true }
  | { stage: "import"; rejected: "UploadRejected" | "ValiError" }
  | { stage: "import"; rejected: false; models: number; curves: number; points: number };

/** Runs the upload → analyse → import path the way the routes do, checking the row counts at each step. */
async function throughService(name: string, bytes: Uint8Array | string): Promise<Outcome> {
  const libId = await createLibrary(viewer, { name: `Fuzz ${name}`.slice(0, 120), description: "" });
  const before = await counts(libId);
  let uploadId: number;
  try {
    uploadId = await storeUpload(viewer, libId, new File([bytes as BlobPart], name, { type: "text/csv" }));
  } catch (e) {
    expect(e, `${name}: storeUpload threw ${String(e)}`).toBeInstanceOf(UploadRejected);
    expect(await counts(libId)).toEqual(before); // nothing written
    return { stage: "store", rejected: true };
  }
  const stored = await counts(libId);
  expect(stored).toEqual({ ...before, uploads: before.uploads + 1 });
  const { text, lib } = await getUpload(viewer, libId, uploadId);
  const analysis = analyseStored(text, lib);
  const mappingValid = v.safeParse(MappingSchema, analysis.mapping).success;
  try {
    const r = await importUpload(viewer, libId, uploadId, analysis.mapping, `fuzz ${name}`);
    expect(mappingValid).toBe(true);
    expect(await counts(libId)).toEqual({ ...stored, revisions: stored.revisions + 1, models: stored.models + r.models, sets: stored.sets + r.curves, points: stored.points + r.points });
    return { stage: "import", rejected: false, models: r.models, curves: r.curves, points: r.points };
  } catch (e) {
    if (mappingValid) expect(e, `${name}: importUpload threw ${String(e)}`).toBeInstanceOf(UploadRejected);
    else expect(e, `${name}: importUpload threw ${String(e)}`).toBeInstanceOf(v.ValiError);
    expect(await counts(libId), `${name}: zero rows written`).toEqual(stored);
    return { stage: "import", rejected: e instanceof UploadRejected ? "UploadRejected" : "ValiError" };
  }
}

const demo = generateDemo();
const file = (variant: string) => demo[0].files.find((f) => f.variant === variant)!.text;

describe("hostile uploads through storeUpload and importUpload", () => {
  it("an empty file is refused at upload", async () => {
    expect(await throughService("empty.csv", "")).toEqual({ stage: "store", rejected: true }); // source: storeUpload (size 0)
  });

  it("random bytes (seeded): refused at upload or at import, never a row written", async () => {
    const r = prng(31337);
    const outcomes: string[] = [];
    for (let n = 0; n < 12; n++) {
      const bytes = new Uint8Array(1 + Math.floor(r() * 3000));
      for (let i = 0; i < bytes.length; i++) bytes[i] = Math.floor(r() * 256);
      const o = await throughService(`random-${n}.csv`, bytes);
      expect(o.rejected, `random-${n}`).not.toBe(false); // random bytes never make three good points
      outcomes.push(`${o.stage}:${String(o.rejected)}`);
    }
    expect(outcomes.filter((o) => o === "store:true").length).toBeGreaterThan(0); // most hold a NUL byte: refused as binary
  });

  it("random bytes without NUL (seeded): get past the upload check and are refused at import", async () => {
    const r = prng(2718);
    for (let n = 0; n < 6; n++) {
      const bytes = new Uint8Array(200 + Math.floor(r() * 3000));
      for (let i = 0; i < bytes.length; i++) bytes[i] = 1 + Math.floor(r() * 255);
      const o = await throughService(`random-nonul-${n}.csv`, bytes);
      expect(o.stage, `random-nonul-${n}`).toBe("import");
      expect(o.rejected, `random-nonul-${n}`).not.toBe(false);
    }
  });

  it("headers only and only commas: refused at import, zero rows", async () => {
    expect(await throughService("headers.csv", file("clean").split("\n")[0] + "\n")).toEqual({ stage: "import", rejected: "UploadRejected" }); // no curve passed
    const commas = await throughService("commas.csv", ",,,,,,\n".repeat(40));
    expect(commas).toMatchObject({ stage: "import" });
    expect(commas.rejected).not.toBe(false); // the suggested mapping has no flow/head: ValiError (documented)
  });

  it("a truncated clean file imports every whole curve and skips the cut one", async () => {
    const lines = file("clean").split("\n");
    const keyOf = (l: string) => l.split(",").slice(0, 5).join(",");
    const k = lines.findIndex((l, i) => i > 150 && keyOf(l) === keyOf(lines[i - 3]));
    const cut = lines.slice(0, k).join("\n") + "\n" + lines[k].split(",").slice(0, 6).join(",") + ","; // head missing on the last row
    const curvesInCut = new Set(lines.slice(1, k + 1).map(keyOf)).size;
    const o = await throughService("truncated.csv", cut);
    expect(o).toMatchObject({ stage: "import", rejected: false, curves: curvesInCut - 1 }); // source: construction
  });

  it("one 10 MB line: stored, refused at import (one point is no curve), zero rows", async () => {
    const t = "model,speed_rpm,impeller_mm,flow_m3h,head_m\n" + "9,".repeat(5 * 1024 * 1024) + "\n";
    expect(await throughService("long-line.csv", t)).toEqual({ stage: "import", rejected: "UploadRejected" });
  }, 90_000); // 10 MB through the analysis worker (started on first use) on a shared machine

  it("Windows-1252 bytes are stored and imported like the UTF-8 file (server falls back to windows-1252)", async () => {
    const utf8 = demo[1].files.find((f) => f.variant === "semicolon")!.text.replace(/^\uFEFF/, "");
    const CP1252: Record<string, number> = { "Ø": 0xd8, "³": 0xb3, "—": 0x97 }; // source: windows-1252 code chart
    const bytes = Uint8Array.from([...utf8].map((ch) => (ch.charCodeAt(0) < 0x80 ? ch.charCodeAt(0) : CP1252[ch] ?? 0x3f)));
    const points = demo[1].curves.reduce((n, c) => n + c.points.length, 0);
    expect(await throughService("latin1.csv", bytes)).toEqual({
      stage: "import", rejected: false, models: new Set(demo[1].curves.map((c) => c.model)).size, curves: demo[1].curves.length, points,
    }); // source: generator (Nordquay's curves)
  });

  it('"NaN" / "Infinity" strings are refused per row; the rest of the curve imports', async () => {
    const H = "model,speed_rpm,impeller_mm,flow_m3h,head_m\n";
    const t = H + ["Z,2900,200,0,10", "Z,2900,200,NaN,9.5", "Z,2900,200,Infinity,9", "Z,2900,200,1,9", "Z,2900,200,2,8", "Y,2900,200,0,10", "Y,2900,200,1,1e308", "Y,2900,200,2,9"].join("\n");
    // Z: 3 good points but errors charged → skipped; Y: head 1e308 rises above 5 % of shutoff → flagged → skipped
    expect(await throughService("nan.csv", t)).toEqual({ stage: "import", rejected: "UploadRejected" }); // source: construction (no ok curve)
  });

  // "1e309" reads as Infinity: the importer must refuse it (UploadRejected, zero rows), never hand it to MariaDB.
  it("an overflowing number (1e309) never reaches the database", async () => {
    const H = "model,speed_rpm,impeller_mm,flow_m3h,head_m\n";
    const t = H + ["W,2900,200,0,10", "W,2900,200,1,9", "W,2900,200,2,8", "W,2900,200,1e309,7"].join("\n"); // the last point overflows
    expect(await throughService("overflow.csv", t)).toEqual({ stage: "import", rejected: "UploadRejected" });
  });
});
