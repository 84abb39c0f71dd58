/**
 * The first point of a curve published from a flow above zero (operatingPoint.ts), the last point's rule mirrored: a crossing
 * before the first published flow by no more than LIMIT_ROUNDING = 1e-8 of it (limitText.ts: within it a value is at its
 * limit) is met at the first point; further before it, the pump cannot be shown starting from rest, and the words name the
 * first published flow. And the sweep at both ends of every demo curve set (fixtures/demo, invented data, as printed and
 * published from its second row, a curve starting above zero flow): a crossing 1e-9 of the flow either side of the first
 * and last published flows is found there, or met at the end point.
 * Check values: geometry — each system curve passes through (Q*, H*) with H* the pump's head at Q* on the curve, or outside
 * it the curve's own end slope carried on (H* = H_end + m_end·(Q* − Q_end)), so the curves meet at Q* by construction.
 */
import { describe, expect, it } from "vitest";
import { createPumpCurve, evalCubic, solveOperatingPoint, type PumpCurve } from "./index.ts";
import { inSI, qt } from "./quantityText.ts";
import { demoCurveInputs } from "./test/demoCurves.ts";

const demo = demoCurveInputs().flatMap((d) => [
  { id: d.id, c: createPumpCurve(d.curve) },
  { id: `${d.id} from row 2`, c: createPumpCurve({ ...d.curve, points: d.curve.points.slice(1) }) },
]);

/** The pump's head at q, or outside the curve its end slope carried on (a test construction, not the solver's). */
function headAt(c: PumpCurve, q: number) {
  const m = c.head.m, n = m.length;
  if (q < c.flowMin) return (evalCubic(c.head, c.flowMin) as number) + m[0] * (q - c.flowMin);
  if (q > c.flowMax) return (evalCubic(c.head, c.flowMax) as number) + m[n - 1] * (q - c.flowMax);
  return evalCubic(c.head, q) as number;
}
/** Systems through (q, head at q) rising with flow (no static head, half static): the crossing at q is stable. */
function systems(c: PumpCurve, q: number): [string, (x: number) => number][] {
  const h = headAt(c, q);
  return [["no static", (x) => h * (x / q) ** 2], ["half static", (x) => h / 2 + (h / 2) * (x / q) ** 2]];
}
const ends = (c: PumpCurve) => [c.flowMin, c.flowMax].filter((q) => q > 0);

describe(`every demo curve set at both ends, as printed and from its second row (${demo.length} curves)`, () => {
  it("a crossing 1e-9 of the flow inside either end: found there; 1e-9 outside: met at the end point", () => {
    // old code: every crossing 1e-9 before a first flow above zero read "cannot start" (the first point had no allowance).
    const wrong: string[] = [];
    let all = 0;
    for (const { id, c } of demo) {
      for (const end of ends(c)) {
        const inward = end === c.flowMin ? 1 : -1;
        for (const e of [1e-9, -1e-9]) {
          const q = end * (1 + inward * e);
          for (const [kind, sys] of systems(c, q)) {
            all++;
            const op = solveOperatingPoint(c, sys);
            const want = e > 0 ? q : end;
            if (op.flow === null || Math.abs(op.flow - want) > 1e-12 * end) wrong.push(`${id} ${end} ${e} ${kind}: ${op.status} ${op.flow} ${op.message.slice(0, 70)}`);
          }
        }
      }
    }
    expect(all).toBe(demo.length * 2 * 2 * 2 - demo.filter(({ c }) => c.flowMin === 0).length * 4);
    expect(wrong.slice(0, 5)).toEqual([]);
  });
});

describe("the first point's allowance, both sides of LIMIT_ROUNDING", () => {
  const fromRow2 = demo.filter(({ c }) => c.flowMin > 0);
  it("0.99e-8 of the first flow before it: met at the first point; 1.01e-8 and 1e-6 before: no point, naming the first flow", () => {
    const wrong: string[] = [];
    for (const { id, c } of fromRow2) {
      for (const e of [0.99e-8, 1.01e-8, 1e-6]) {
        for (const [kind, sys] of systems(c, c.flowMin * (1 - e))) {
          const op = solveOperatingPoint(c, sys);
          const ok = e < 1e-8
            ? op.flow === c.flowMin && (op.status === "ok" || op.status === "multiple")
            : op.status === "no-intersection-shutoff-below-static" && op.flow === null
              && op.message.startsWith(`At the curve's first published point, ${qt("flow", c.flowMin)}, the pump's head `);
          if (!ok) wrong.push(`${id} ${e} ${kind}: ${op.status} ${op.flow} ${op.message.slice(0, 70)}`);
        }
      }
    }
    expect(fromRow2.length).toBeGreaterThan(100);
    expect(wrong.slice(0, 5)).toEqual([]);
  });
  it("an invented curve from 0.002 m³/s (m³/s, m): the words say the head, the first flow and that the shut-off head is not published", () => {
    const c = createPumpCurve({ points: [[0.002, 40], [0.01, 38], [0.02, 30]].map(([flow, head]) => ({ flow, head })) });
    const op = solveOperatingPoint(c, (q) => 41 + 1000 * q * q);
    // old code: "Pump head at its first point (40.0 m) is below the system head there (41.0 m) and the curves never meet"
    expect(inSI(op.message)).toBe("At the curve's first published point, 7.20 m³/h, the pump's head 40.0 m is below the system head there (41.0 m) and the curves never meet");
  });
});
