// The import plan reads a fast-path result from its typed arrays (app/lib/import/packed.ts) and a
// full-path result from its curve set objects: both must plan the same write.
import { describe, expect, it } from "vitest";
import { generateDemo } from "../../../fixtures/demo/generate";
import { BIG_HEADER, makeBigCsv } from "../../../fixtures/csv/make-big";
import { analyseCsv } from "../import";
import { packedOf } from "../import/packed";
import { fixture } from "../import/test-helpers";
import { planImport, writable } from "./import-plan";

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
    // 100.00000001 % passes validation (tolerance 1e-9) but not the write check (η ≤ 1)
    const rows = [0, 1, 2, 3].map((i) => `Nordquay NQ-1,2900,200,${10 * i},${30 - i},${i === 1 ? "100.00000001" : "50"},,`);
    const good = [0, 1, 2].map((i) => `Nordquay NQ-2,2900,200,${10 * i},${30 - i},50,,`);
    const text = [BIG_HEADER, ...rows, ...good].join("\n") + "\n";
    const fast = analyseCsv(text);
    const full = analyseCsv(text, undefined, { fast: false });
    expect(fast.fastPath).toBe(true); // source: no problem is reported for the row (within 1e-9 of 100 %)
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
