// The search's "direct" fit (search.ts: the curve as published passes within [H_d, H_d·(1 + headTolerance)] at the duty
// flow) at its two ends. It compared the head with no allowance: a curve 1 part in 10¹² under the duty head was offered
// as "speed" at 100 % (or dropped where only direct was searched), while the verdict of the same pump as published on a
// system through the duty point says "meets"; a curve 1e-12 over H_d × 1.05 was offered trimmed to 98 %. Now each end
// allows LIMIT_ROUNDING (1 part in 10⁸, limitText.ts `insideEnds`), the allowance of the search's other cuts (its NPSH cut
// at 1, the POR), and the speed solve's "already at its highest ratio" the same. Check values: the rules (search.ts's
// 5 % default, common practice); the curve is invented, the system a flat static head through the duty point (geometry).
import { describe, expect, it } from "vitest";
import { createPumpCurve, headAt, judgeCandidate, searchDuty, solveOperatingPoint } from "./index.ts";
import { LIMIT_ROUNDING } from "./limitText.ts";

const M3H = 1 / 3600; // m³/s per m³/h
const ROWS = [[0, 40, 0], [18, 41.5, 0.45], [36, 39, 0.68], [54, 35, 0.74], [72, 28, 0.7], [90, 20, 0.58]]; // m³/h, m, η
const curve = { points: ROWS.map(([q, h, e]) => ({ flow: q * M3H, head: h, efficiency: e })), speed: 1450, impellerDiameter: 0.2 };
const qd = 50 * M3H;
const h1 = headAt(createPumpCurve(curve), qd) as number; // the curve's head at the duty flow, m
const found = (head: number, methods?: ("direct" | "trim" | "speed")[]) =>
  searchDuty([{ id: "a", curve }], { flow: qd, head }, methods ? { methods } : {}).candidates.map((c) => c.method);

describe("direct at the duty head: the curve 1 part in 10⁸ or less under it is direct, further under it is not", () => {
  // Duty head H_d with the curve's head h1 = H_d × (1 − off).
  const cases: [number, string[]][] = [[-1e-4, ["direct"]], [0, ["direct"]], [1e-12, ["direct"]], [0.5 * LIMIT_ROUNDING, ["direct"]], [2 * LIMIT_ROUNDING, []], [1e-4, []]];
  for (const [off, want] of cases)
    it(`curve at H_d × (1 − ${off}): ${want.join() || "not found"}; speed alone the same`, () => {
      const hd = h1 / (1 - off);
      expect(found(hd)).toEqual(want);
      expect(found(hd, ["direct"])).toEqual(want);
      expect(found(hd, ["speed"])).toEqual(want.length ? ["speed"] : []); // at its highest ratio, 100 %, exactly where direct is
    });
  it("where it is direct, the verdict of the pump as published on a system through the duty point meets the duty", () => {
    for (const off of [1e-12, 0.5 * LIMIT_ROUNDING]) {
      const hd = h1 / (1 - off);
      const op = solveOperatingPoint(createPumpCurve(curve), () => hd);
      const v = judgeCandidate({ dutyFlow: qd, edges: [{ name: "design", flow: op.flow, head: op.head }] });
      expect([off, v?.status]).toEqual([off, "meets"]);
    }
  });
});

describe("direct at H_d × (1 + 5 %): within 1 part in 10⁸ over it still direct, further over it trimmed", () => {
  // Duty head H_d with h1 = H_d × 1.05 × (1 + off).
  const cases: [number, string][] = [[-1e-4, "direct"], [0, "direct"], [1e-12, "direct"], [0.5 * LIMIT_ROUNDING, "direct"], [2 * LIMIT_ROUNDING, "trim"], [1e-4, "trim"]];
  for (const [off, want] of cases)
    it(`curve at H_d × 1.05 × (1 + ${off}): ${want}`, () => {
      expect(found(h1 / 1.05 / (1 + off))).toEqual([want]);
    });
});
