// Our library CSV export (GET /libraries/:id/export.csv, csv-export.ts) imports again into a fresh
// library with the same curve sets and points: every demo library (fixtures/demo, invented),
// libraries whose curves carry no impeller diameter or no speed, and libraries mixing sets with and
// without one (invented names and numbers).
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import { analyseStored, createLibrary, curvesToCsv, getUpload, importUpload, libraryCurves, storeUpload, type LibraryCurveSet, type Viewer } from "./index";
import { analyseCsv } from "~/lib/import";
import { call, makeMember, type TestMember } from "~/test/harness";
import { viewerOfUser } from "~/lib/projects/test-kit";
import { demoLibraries } from "../../../fixtures/demo";
import * as exportCsv from "~/routes/libraries.$id.export-csv";

let d: TestMember;
let viewer: Viewer;
beforeAll(async () => {
  d = await makeMember("distributor");
  viewer = await viewerOfUser(d.userId, "distributor");
});
afterAll(() => closeDb());

/** A fresh library holding `text` imported with the mapping the importer suggests; its curves. */
async function importedLibrary(name: string, text: string) {
  const libId = await createLibrary(viewer, { name: `${name} ${Date.now()}`, description: "" });
  const uploadId = await storeUpload(viewer, libId, new File([text], `${name}.csv`, { type: "text/csv" }));
  const { upload, lib } = await getUpload(viewer, libId, uploadId);
  const a = analyseStored(upload.content, lib);
  const r = await importUpload(viewer, libId, uploadId, a.mapping);
  return { libId, curves: await libraryCurves(viewer, libId), skipped: r.skipped, errors: a.result.stats.errors };
}

async function exported(libId: number) {
  const res = await call(exportCsv.loader as Parameters<typeof call>[0], { path: `/libraries/${libId}/export.csv`, cookie: d.cookie, params: { id: String(libId) } });
  expect(res.status).toBe(200);
  return res.body as string;
}

const keyOf = (c: LibraryCurveSet) => [c.model, c.type, c.nominalSize, c.speed, c.impellerDiameter, c.points.length];

/** Export, import the export into a fresh library: the same sets, and points within the printed digits. */
async function roundTrip(name: string, original: LibraryCurveSet[], libId: number) {
  const csv = await exported(libId);
  const again = await importedLibrary(`${name} again`, csv);
  expect(again.errors).toBe(0);
  expect(again.skipped).toBe(0);
  expect(again.curves.map(keyOf)).toEqual(original.map(keyOf));
  again.curves.forEach((c, i) =>
    c.points.forEach((p, j) => {
      const o = original[i].points[j];
      expect(p.flow).toBeCloseTo(o.flow, 9); // the export's 6 decimals of m³/h ≈ 3e-10 m³/s (construction)
      expect(p.head).toBeCloseTo(o.head, 5); // 6 decimals of m
      expect(p.efficiency == null).toBe(o.efficiency == null);
      expect(p.power == null).toBe(o.power == null);
      expect(p.npshr == null).toBe(o.npshr == null);
    }),
  );
  // Exported again, the copy writes the very same text (source: construction: same sets, same digits).
  expect(await exported(again.libId)).toBe(csv);
  return csv;
}

describe("library CSV export → import into a fresh library", () => {
  for (const demo of demoLibraries()) {
    test(`demo library ${demo.library}`, async () => {
      const clean = demo.files.find((f) => !f.variantOf)!;
      const first = await importedLibrary(demo.library, clean.text);
      expect(first.curves.length).toBeGreaterThan(0);
      await roundTrip(demo.library, first.curves, first.libId);
    });
  }

  test("curves without an impeller diameter (no impeller column imported): the export leaves the column out", async () => {
    const rows = [[0, 42], [30, 40], [60, 33]].flatMap(([q, h]) => [`Invented CX 50,2900,${q},${h}`]);
    const rows2 = [[0, 11], [15, 10], [30, 8]].map(([q, h]) => `Invented CX 50,1450,${q},${h}`);
    const first = await importedLibrary("no impeller", ["model,speed_rpm,flow_m3h,head_m", ...rows, ...rows2].join("\n") + "\n");
    expect(first.curves.map((c) => c.impellerDiameter)).toEqual([null, null]);
    const csv = await roundTrip("no impeller", first.curves, first.libId);
    expect(csv.split("\n")[0]).toBe("model,type,size,speed_rpm,flow_m3h,head_m,efficiency_pct,power_kw,npshr_m");
  });

  test("curves without a speed or an impeller diameter: both columns left out", async () => {
    const text = "model,flow_m3h,head_m,efficiency_pct\n" + [[0, 20, ""], [10, 19, 55], [20, 15, 62]].map((r) => `Invented LX 32,${r.join(",")}`).join("\n") + "\n";
    const first = await importedLibrary("no speed", text);
    expect(first.curves.map((c) => [c.speed, c.impellerDiameter])).toEqual([[null, null]]);
    const csv = await roundTrip("no speed", first.curves, first.libId);
    expect(csv.split("\n")[0]).toBe("model,type,size,flow_m3h,head_m,efficiency_pct,power_kw,npshr_m");
  });

  // A revision mixing sets with and without a diameter comes from a wide file with a diameter block beside a
  // speed-only block (invented names and numbers). Its export writes blank impeller_mm (speed_rpm) cells for the sets without one.
  const head = [[0, 42], [30, 40], [60, 33]];
  const low = [[0, 11], [15, 10], [30, 8]];
  const wide = (model: string, speedColumn: boolean) =>
    [`Model,${speedColumn ? "Speed (rpm)," : ""}Q 250mm (m3/h),H 250mm (m),Q@1450 rpm (m3/h),H@1450 rpm (m)`,
      ...head.map((h, i) => [model, ...(speedColumn ? [2900] : []), ...h, ...low[i]].join(","))].join("\n") + "\n";

  test("a library mixing a set with a diameter and a set without one imports again: same sets, points and diameters", async () => {
    const first = await importedLibrary("mixed impeller", wide("Invented MX 65", true));
    expect(first.curves.map((c) => [c.speed, c.impellerDiameter])).toEqual([[1450, null], [2900, 0.25]]); // source: construction (the file's two blocks)
    const csv = await roundTrip("mixed impeller", first.curves, first.libId);
    expect(csv.split("\n").slice(1, 2)).toEqual(["Invented MX 65,,,1450,,0,11,,,"]); // source: construction: the set without a diameter has a blank cell
  });

  test("a library mixing a set with a diameter and no speed and one with a speed and no diameter imports again", async () => {
    const first = await importedLibrary("mixed speed", wide("Invented MX 80", false));
    expect(first.curves.map((c) => [c.speed, c.impellerDiameter])).toEqual([[null, 0.25], [1450, null]]); // source: construction (the file's two blocks)
    const csv = await roundTrip("mixed speed", first.curves, first.libId);
    expect(csv.split("\n").slice(1, 5)).toEqual(["Invented MX 80,,,,250,0,42,,,", "Invented MX 80,,,,250,30,40,,,", "Invented MX 80,,,,250,60,33,,,", "Invented MX 80,,,1450,,0,11,,,"]); // source: construction
  });

  // One model at one speed both with a diameter and without one: a wide file with a diameter block beside a speed-only block
  // at the same speed (invented). Its export writes the two sets one after the other under the same model and speed; the
  // blank impeller_mm rows were refused as a break in the curve above (missing-value on each), so the library did not import again.
  test("a library holding one model at one speed with and without a diameter imports again: same sets, points and diameters", async () => {
    const text = ["Model,Speed (rpm),Q 250mm (m3/h),H 250mm (m),Q@2900 rpm (m3/h),H@2900 rpm (m)",
      ...head.map((h, i) => ["Invented MX 100", 2900, ...h, low[i][0] * 2, low[i][1] * 4].join(","))].join("\n") + "\n";
    const first = await importedLibrary("same speed", text);
    expect(first.errors).toBe(0); // source: construction (two blocks, two sets)
    expect(first.curves.map((c) => [c.speed, c.impellerDiameter])).toEqual([[2900, 0.25], [2900, null]]); // source: construction (the file's two blocks)
    const csv = await roundTrip("same speed", first.curves, first.libId);
    expect(csv.split("\n").slice(3, 7)).toEqual(["Invented MX 100,,,2900,250,60,33,,,", "Invented MX 100,,,2900,,0,44,,,", "Invented MX 100,,,2900,,30,40,,,", "Invented MX 100,,,2900,,60,32,,,"]); // source: construction (the 250 mm set, then its blank-Ø rows: flow starts again at 0)
  });
});

describe("curvesToCsv key columns", () => {
  const set = (model: string, speed: number | null, impellerDiameter: number | null): LibraryCurveSet => ({
    id: 1, modelId: 1, model, type: "", nominalSize: "", speed, impellerDiameter, impellerMin: null, impellerMax: null, ratedSpeed: null, minFlow: null,
    points: [0, 0.001, 0.002].map((flow, i) => ({ flow, head: 10 - i, efficiency: null, power: null, npshr: null })),
  });

  test("a library whose sets all carry a diameter keeps impeller_mm on every row (the documented format)", () => {
    const csv = curvesToCsv([set("A", 2900, 0.2), set("B", 2900, 0.18)]);
    expect(csv.split("\n")[0]).toBe("model,type,size,speed_rpm,impeller_mm,flow_m3h,head_m,efficiency_pct,power_kw,npshr_m");
    expect(csv.split("\n").slice(1, 3)).toEqual(["A,,,2900,200,0,10,,,", "A,,,2900,200,3.6,9,,,"]);
  });

  test("a library mixing sets with and without a diameter writes blank cells, which the importer reads as no diameter", () => {
    const a = analyseCsv(curvesToCsv([set("A", 2900, 0.2), set("B", 2900, null)]));
    expect(a.result.problems).toEqual([]); // source: blank-keys.ts rule (another model: a set of its own)
    expect(a.result.curveSets.map((c) => [c.key, c.impellerDiameter, c.points.length, c.ok])).toEqual([["A|2900|200", 0.2, 3, true], ["B|2900|", null, 3, true]]); // source: construction
  });

  test("one model at one speed with and without a diameter: the blank rows, where the flow starts again, are a set of their own, named", () => {
    const a = analyseCsv(curvesToCsv([set("A", 2900, 0.2), set("A", 2900, null)]));
    expect(a.result.problems.map((p) => [p.row, p.column, p.code, p.severity])).toEqual([[5, "impeller_mm", "key-not-given", "warning"]]); // source: construction, line 5 (header, three rows of the first set); was missing-value on lines 5-7
    expect(a.result.problems[0].reason).toContain("Line 4 above it (same model and speed) has 200, but the flow starts again where they meet (7.2 on line 4, 0 on line 5, as written)"); // source: construction (0.002 m³/s = 7.2 m³/h, then 0)
    expect(a.result.curveSets.map((c) => [c.key, c.impellerDiameter, c.points.length, c.ok])).toEqual([["A|2900|200", 0.2, 3, true], ["A|2900|", null, 3, true]]); // source: construction
  });
});
