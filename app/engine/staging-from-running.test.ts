/**
 * Pumps in parallel started one after another (lib/projects/arrangement-start.ts `parallelStaging` solves k pumps' combined
 * curve from rest each time): on a drooping curve, the point k pumps reach from rest is the point they settle at when the
 * k-th pump starts while k − 1 run — the flow moves from the k − 1 pumps' point, up where the k pumps' head there is above
 * the system's, down where it is below, to the nearest crossing where the heads' difference falls through zero.
 * Check values: geometry of invented drooping curves (m³/s, m; a hump above the shut-off head, common practice for a
 * drooping curve) and against systems s + K·Q²; flows added at equal
 * head (combinePumps). Common practice, from memory: a pump started against the head of those running moves the flow
 * from where they run.
 */
import { describe, expect, it } from "vitest";
import { combinePumps, createPumpCurve, evalCubic, solveOperatingPoint, type PumpCurve } from "./index.ts";

/** Where the flow settles on curve c against sys, moving from q0 (a walk in small steps, then bisection; independent of the solver). */
function settleFrom(c: PumpCurve, sys: (q: number) => number, q0: number): number | null {
  const g = (q: number) => (evalCubic(c.head, q) as number) - sys(q);
  const step = (c.flowMax - c.flowMin) / 20000;
  let a = Math.min(Math.max(q0, c.flowMin), c.flowMax);
  const dir = g(a) > 0 ? 1 : -1;
  for (let b = a + dir * step; b >= c.flowMin && b <= c.flowMax; a = b, b += dir * step) {
    if (Math.sign(g(b)) !== Math.sign(g(a))) {
      let lo = Math.min(a, b), hi = Math.max(a, b);
      for (let i = 0; i < 80; i++) { const m = (lo + hi) / 2; if (Math.sign(g(m)) === Math.sign(g(lo))) lo = m; else hi = m; }
      return (lo + hi) / 2;
    }
  }
  return null;
}

const drooping = [
  [[0, 40], [0.005, 43], [0.01, 44], [0.015, 42], [0.02, 37], [0.025, 30]],
  [[0, 30], [0.02, 33], [0.04, 30], [0.06, 20]],
].map((rows) => createPumpCurve({ points: rows.map(([flow, head]) => ({ flow, head })), riseTolerance: 1 }));

describe("k pumps in parallel on a drooping curve: the point from rest is the point reached from k − 1 running", () => {
  it("invented drooping curves (the demo curve sets all fall from shut-off), 2–4 pumps, statics 30–99 % of the shut-off head", () => {
    const differ: string[] = [];
    let all = 0;
    for (const one of drooping) {
      const h0 = one.shutoffHead!;
      for (const f of [0.3, 0.6, 0.9, 0.99]) {
        for (const share of [0.5, 1, 2]) {
          const s = h0 * f, K = share * (h0 - s) / (one.flowMax * one.flowMax);
          const sys = (q: number) => s + K * q * q;
          let prev = solveOperatingPoint(one, sys).flow;
          for (let k = 2; k <= 4 && prev !== null; k++) {
            const ck = combinePumps(one, { mode: "parallel", duty: k }).curve;
            const fromRest = solveOperatingPoint(ck, sys).flow;
            const fromRunning = settleFrom(ck, sys, prev);
            all++;
            if (fromRest === null || fromRunning === null || Math.abs(fromRest - fromRunning) > 1e-9 * ck.flowMax) differ.push(`${h0} ${f} ${share} k${k}: ${fromRest} vs ${fromRunning}`);
            prev = fromRest;
          }
        }
      }
    }
    expect(all).toBeGreaterThan(60);
    expect(differ.slice(0, 5)).toEqual([]);
  });
});
