/**
 * The operating point at both ends of every demo curve set (fixtures/demo, invented data, every model × speed × impeller the
 * libraries offer — the db seed loads the same files), against a flat system (zero friction), one with zero static head,
 * and one half static, each built through a chosen point of the curve: found there when the crossing is on the published
 * curve, to LIMIT_ROUNDING = 1e-8 of the last flow past its end (limitText.ts: within it a value is at its limit); further
 * past, "beyond-curve-end", nothing extrapolated, and the words name the curve's last flow.
 * Check values: geometry — each system curve passes through (Q*, H*) with H* the pump's head at Q* on the curve, or past
 * its end the curve's own end slope carried on (H* = H_end + m_end·(Q* − Q_end)), so the curves meet at Q* by construction.
 */
import { describe, expect, it } from "vitest";
import { createPumpCurve, evalCubic, solveOperatingPoint, type PumpCurve } from "./index.ts";
import { qt } from "./quantityText.ts";
import { demoCurveInputs } from "./test/demoCurves.ts";

const demo = demoCurveInputs().map((d) => ({ id: d.id, c: createPumpCurve(d.curve) }));

/** The pump's head at q, or past the last flow the curve's end slope carried on (a test construction, not the solver's). */
function headAt(c: PumpCurve, q: number) {
  if (q <= c.flowMax) return evalCubic(c.head, q) as number;
  return (evalCubic(c.head, c.flowMax) as number) + c.head.m[c.head.m.length - 1] * (q - c.flowMax);
}
/** Systems through (q, head at q): flat (zero friction), zero static head, half static. */
function systems(c: PumpCurve, q: number): [string, (x: number) => number][] {
  const h = headAt(c, q);
  const out: [string, (x: number) => number][] = [["flat", () => h]];
  if (q > 0) out.push(["no static", (x) => h * (x / q) ** 2], ["half static", (x) => h / 2 + (h / 2) * (x / q) ** 2]);
  return out;
}

describe(`every demo curve set (${demo.length}) at the ends of its flow range`, () => {
  it("crossings at 0 %, 0.5 %, 99 %, 99.5 % and 100 % of the range: found there, to 1e-9 of the range", () => {
    const missed: string[] = [];
    let all = 0;
    for (const { id, c } of demo) {
      const span = c.flowMax - c.flowMin;
      for (const f of [0, 0.005, 0.99, 0.995, 1]) {
        const q = f === 1 ? c.flowMax : c.flowMin + f * span;
        for (const [kind, sys] of systems(c, q)) {
          all++;
          const op = solveOperatingPoint(c, sys);
          if (op.flow === null || Math.abs(op.flow - q) > 1e-9 * span) missed.push(`${id} ${f} ${kind}: ${op.status} ${op.flow}`);
        }
      }
    }
    expect(all).toBe(demo.length * 15 - demo.filter(({ c }) => c.flowMin === 0).length * 2); // no sloped system through zero flow
    expect(missed.slice(0, 5)).toEqual([]);
  });
  it("0.99e-8 of the last flow past the end: met at the last point; 1.01e-8 and 1e-6 past: beyond-curve-end, naming the last flow", () => {
    // old code: every one of the 0.99e-8 cases ended "beyond-curve-end" (the last point's rule read heads to 1e-12 only),
    // and its words named the heads at "the last curve point" but not its flow.
    const wrong: string[] = [];
    for (const { id, c } of demo) {
      for (const e of [0.99e-8, 1.01e-8, 1e-6]) {
        for (const [kind, sys] of systems(c, c.flowMax * (1 + e))) {
          const op = solveOperatingPoint(c, sys);
          const ok = e < 1e-8
            ? op.flow === c.flowMax && op.head === headAt(c, c.flowMax) && op.warnings.some((w) => w.code === "near-curve-end")
            : op.status === "beyond-curve-end" && op.flow === null && op.message.startsWith(`At the curve's last published point, ${qt("flow", c.flowMax)}, the pump still gives`);
          if (!ok) wrong.push(`${id} ${e} ${kind}: ${op.status} ${op.flow} ${op.message.slice(0, 60)}`);
        }
      }
    }
    expect(wrong.slice(0, 5)).toEqual([]);
  });
});
