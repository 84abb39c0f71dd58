// The import plan reads a fast-path result from its typed arrays (app/lib/import/packed.ts) and a
// full-path result from its curve set objects: both must plan the same write.
import { describe, expect, it } from "vitest";
import { generateDemo } from "../../../fixtures/demo/generate";
import { BIG_HEADER, makeBigCsv } from "../../../fixtures/csv/make-big";
import { analyseCsv, SI_FACTOR } from "../import";
import { packedOf, POINT_WIDTH } from "../import/packed";
import { fixture } from "../import/test-helpers";
import { planImport, pointLines, setLines, writable } from "./import-plan";
import { runJob, type ImportAnalysis } from "./analysis-jobs";
import { linesHere, POINTS_PER_PIECE, withIds } from "./import-write.server";

const plain = (p: ReturnType<typeof planImport>) =>
  p && { ...p, setModel: [...p.setModel], setSpeed: [...p.setSpeed], setImpeller: [...p.setImpeller], starts: [...p.starts], values: [...p.values] };

const demo = generateDemo();
const cases: [string, string][] = [
  ["make-big 5 000 points", makeBigCsv({ points: 5_000 })],
  ["fixtures/csv/long-si.csv", fixture("long-si.csv")],
  ["fixtures/csv/semicolon-decimal-comma.csv", fixture("semicolon-decimal-comma.csv")],
  ...demo.flatMap((d) => d.files.filter((f) => f.variant === "clean" || f.variant === "semicolon").map((f) => [`demo ${f.name}`, f.text] as [string, string])),
];

describe("import plan from the fast path's arrays and from the full path's objects", () => {
  for (const [name, text] of cases)
    it(name, () => {
      const fast = analyseCsv(text);
      const full = analyseCsv(text, undefined, { fast: false });
      expect(fast.fastPath).toBe(true); // source: clean long-layout files take the fast path (fast.test.ts)
      expect(packedOf(fast.result)).not.toBeNull();
      expect(packedOf(full.result)).toBeNull();
      const a = planImport(fast);
      expect(a).not.toBeNull();
      expect(plain(a)).toEqual(plain(planImport(full))); // source: the full path's objects are the reference
      expect(a!.values.length).toBe(a!.points * 5); // source: five doubles per point (import-plan.ts)
    });

  it("applies the write check to the arrays as to the objects (efficiency just over 1 is skipped)", () => {
    // Validation no longer lets such a value through (a best efficiency above 95 % is flagged: point-rules.ts), so the
    // write check is the last guard only: the value is put into both results by hand, as a bug upstream would.
    const rows = [0, 1, 2, 3].map((i) => `Nordquay NQ-1,2900,200,${10 * i},${30 - i},50,,`);
    const good = [0, 1, 2].map((i) => `Nordquay NQ-2,2900,200,${10 * i},${30 - i},50,,`);
    const text = [BIG_HEADER, ...rows, ...good].join("\n") + "\n";
    const fast = analyseCsv(text);
    const full = analyseCsv(text, undefined, { fast: false });
    expect(fast.fastPath).toBe(true); // source: a clean long file
    packedOf(fast.result)!.values[1 * POINT_WIDTH + 2] = 1.00000001; // NQ-1's second point, efficiency (packed.ts layout)
    full.result.curveSets[0].points[1].efficiency = 1.00000001;
    expect(writable(full.result.curveSets[0])).toBe(false); // source: import-plan.ts writable(), η ≤ 1
    const a = planImport(fast)!;
    expect(plain(a)).toEqual(plain(planImport(full))); // source: the full path's objects are the reference
    expect([a.points, a.skipped, a.models.map((m) => m.name)]).toEqual([3, 1, ["Nordquay NQ-2"]]); // source: construction (one curve of 3 points kept, one skipped)
  });

  it("plans without building the fast path's point objects, and builds them when asked", () => {
    const fast = analyseCsv(makeBigCsv({ points: 1_000 }));
    const before = Object.getOwnPropertyDescriptor(fast.result, "curveSets");
    expect(typeof before?.get).toBe("function"); // source: packed.ts keeps curveSets behind a getter
    const plan = planImport(fast)!;
    expect(plan.points).toBe(1_000); // source: make-big writes 1 000 valid points
    const sets = fast.result.curveSets;
    expect(sets).toHaveLength(100); // source: 10 points per curve
    expect(sets[0].points[0]).toEqual({ flow: 0, head: expect.any(Number), efficiency: expect.any(Number), power: expect.any(Number), npshr: expect.any(Number) }); // source: make-big's first point is at zero flow, all columns given
    expect(fast.result.curveSets).toBe(sets); // source: built once
  });
});

describe("the LOAD DATA text: the worker's lines and the writer's own", () => {
  const join = (pieces: Iterable<string | Uint8Array>) => [...pieces].map((p) => (typeof p === "string" ? p : Buffer.from(p).toString("latin1"))).join("");

  it("the writer's lines made a piece at a time are byte for byte the worker's lines with the ids in front, with the same progress", () => {
    // absent values (\\N), 3-point curves, ids of different lengths, pieces cut between curve sets
    const rows = (model: string, n: number, eff: boolean) => Array.from({ length: n }, (_, i) => `${model},2900,200,${1.5 * i},${40 - i / 3},${eff ? 40 + i : ""},${eff ? "" : 2 + i},`);
    const text = [BIG_HEADER, ...rows("A-1", 3, true), ...rows("A-2", 7, false), ...makeBigCsv({ points: 12_000 }).split("\n").slice(1)].join("\n");
    const plan = planImport(analyseCsv(text))!;
    const ids = Array.from({ length: plan.setModel.length }, (_, i) => (i % 3 === 0 ? 7 + i : 123_456_789_012 + i));
    const lines = pointLines(plan);
    expect(lines.ends.length).toBe(plan.points + 1); // source: one line per point (import-plan.ts)
    const p1: number[] = [], p2: number[] = [];
    const expected = join(withIds(lines, plan.starts, (i) => String(ids[i]), POINTS_PER_PIECE, (n: number) => p1.push(n)));
    expect(join(linesHere(plan, "points", (i) => String(ids[i]), POINTS_PER_PIECE, (n: number) => p2.push(n)))).toBe(expected); // source: the worker's path (whole lines, ids in front)
    expect(expected.split("\n")[0]).toBe("7\t0\t0\t40\t0.4\t\\N\t\\N"); // source: construction (first row of A-1 in SI: 0 m³/s, 40 m, 40 % → 0.4; power and NPSHr blank)
    expect(p2).toEqual(p1); // source: same pieces, same progress counts
    expect(p2.at(-1)).toBe(plan.points); // source: the last progress count is every point

    // curve sets: model id and revision id in front
    const modelIds = new Map(plan.models.map((m, i) => [m.name, i % 2 ? 9 : 10_000_000 + i]));
    const sets = setLines(plan);
    const identity = Int32Array.from({ length: plan.setModel.length + 1 }, (_, i) => i);
    const setPrefix = (i: number) => `${modelIds.get(plan.models[plan.setModel[i]].name)}\t42`;
    const setsExpected = join(withIds(sets, identity, setPrefix, 2000));
    for (const perPiece of [2000, 7]) expect(join(linesHere(plan, "sets", setPrefix, perPiece)), `pieces of ${perPiece}`).toBe(setsExpected); // source: the worker's path
    expect(setsExpected.split("\n")[0]).toBe(`10000000\t42\t2900\t0.2\t0\t${3 * SI_FACTOR.flow["m3/h"]!}\t40\t${40 - 2 / 3}\t3\t\\N`); // source: construction (A-1: 3 points, flow 0–3 m³/h times the SI factor 1/3600 as the importer applies it, head 40 → 40 − 2/3 m, Ø200 mm; no maker's minimum flow)
  });
});

describe("the import job", () => {
  it("makes the plan by default and leaves it (and its LOAD DATA lines) out of a report-only call", () => {
    const bytes = new TextEncoder().encode(fixture("long-si.csv"));
    const full = runJob({ kind: "import", bytes, mappingJson: null, report: true }) as ImportAnalysis;
    const reportOnly = runJob({ kind: "import", bytes, mappingJson: null, report: true, plan: false }) as ImportAnalysis;
    expect(full.plan).not.toBeNull(); // source: long-si.csv imports (fixtures/csv)
    expect(reportOnly.plan).toBeNull(); // source: definition (plan: false)
    expect(reportOnly.report).toEqual(full.report); // source: definition (the report does not depend on the plan)
  });
});
