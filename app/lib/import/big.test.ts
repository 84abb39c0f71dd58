import { describe, expect, it } from "vitest";
import { bigCurveCount, makeBigCsv } from "../../../fixtures/csv/make-big";
import { analyseCsv } from "./index";

describe("100 000-point file from make-big.ts", () => {
  it("is deterministic", () => {
    expect(makeBigCsv({ points: 50, pointsPerCurve: 5, seed: 7 })).toBe(makeBigCsv({ points: 50, pointsPerCurve: 5, seed: 7 })); // source: generator contract
    expect(makeBigCsv({ points: 50, pointsPerCurve: 5, seed: 7 })).not.toBe(makeBigCsv({ points: 50, pointsPerCurve: 5, seed: 8 })); // source: seed varies curves
  });
  it("analyses completely with correct counts", () => {
    const text = makeBigCsv({ points: 100_000 });
    const a = analyseCsv(text);
    expect(a.rows).toHaveLength(100_000); // source: generator writes one row per point
    expect(a.result.stats).toEqual({
      pointRows: 100_000, // source: generator (points)
      pointsAccepted: 100_000, // source: generator writes only valid curves
      curveSets: bigCurveCount(100_000), // source: generator (10 points per curve → 10 000)
      curveSetsOk: 10_000, // source: generator writes only valid curves
      errors: 0, // source: generator writes only valid curves
      warnings: 0, // source: generator writes only valid curves
    });
    expect(a.result.curveSets[9_999].sourceRows.at(-1)).toBe(100_001); // source: header on line 1, last point on line 100 001
  });
});
