// The charts' operating point on sampled curves (curves.ts `crossingOf`) against the engine's (operatingPoint.ts
// `solveOperatingPoint`, the candidate's: verdict, table, report): the same start-from-rest rule, judged from the pump
// curve's first flow. Check values: the rule is common practice, from memory (a pump starts against a closed check valve:
// it runs only when its head at the curve's first flow is not below the system's there, and settles at the first crossing
// where its head falls below the system's); the curves are invented (fixtures/demo/generate.ts, test/droop-pump.ts: 40 m
// shut-off, 41.9 m peak); the engine's solve is the reference. Tolerance: 1 % of the curve's flow range and of the head,
// the chart's sampled curves being straight between 41 points (our choice: about a pixel on a chart a few hundred wide).
import { describe, expect, it } from "vitest";
import { createPumpCurve, prepareSystem, sampleCurve, solveOperatingPoint, systemCurve, systemHeadFunction, type PumpCurve } from "~/engine";
import { defaultSystemInput, toPumpPoints, type SystemInput } from "~/lib/projects/hydraulics";
import { flowMaxOf, systemSpec } from "~/lib/projects/system-input";
import { bandEdges } from "~/lib/projects/candidate-judgement";
import { demoCurves, demoCurveSI } from "~/test/demo-curves";
import { DROOP_ROWS } from "~/test/droop-pump";
import { crossingOf } from "./curves.ts";
import type { Pt } from "./types.ts";

const M3H = 1 / 3600;
const droop = createPumpCurve({ points: DROOP_ROWS.map(([q, h]) => ({ flow: q * M3H, head: h })), riseTolerance: 1 });
/** A pump curve as the field check stores it: 41 points (evaluate.ts `sample`). */
const sampled = (c: PumpCurve): Pt[] => { const s = sampleCurve(c, 41); return s.flows.map((flow, i) => ({ flow, y: s.head[i] })); };
/** A system curve as the selection freezes it (hydraulics.ts `evaluateSystem`): 41 points from flowMin to flowMax. */
const systemPts = (input: SystemInput, range: { flowMin?: number; flowMax: number }, which = {}): Pt[] => {
  const sc = systemCurve(prepareSystem(systemSpec(input)), { ...range, points: 41, design: which });
  return sc.flows.map((flow, i) => ({ flow, y: sc.head[i] }));
};
const engineAt = (c: PumpCurve, input: SystemInput, which = {}) => solveOperatingPoint(c, systemHeadFunction(prepareSystem(systemSpec(input)), which));

describe("a system curve sampled from above the pump curve's first flow", () => {
  // The drooping pump against 41 m static, no pipe: its 40 m shut-off head is below the system's, so it cannot start.
  const input: SystemInput = { ...defaultSystemInput(), runs: [], staticLow: 41, staticHigh: 41 };
  it("engine: no point from rest (40 m shut-off below 41 m); the chart marks none either, though its samples start at 18 m³/h where the pump gives 41.5 m", () => {
    expect(engineAt(droop, input).status).toBe("no-intersection-shutoff-below-static"); // control
    const system = systemPts(input, { flowMin: 18 * M3H, flowMax: 100 * M3H });
    expect(crossingOf(sampled(droop), system)).toBeNull(); // old code: a point at 52.4 m³/h (judged from 18 m³/h, the first flow both cover)
  });
  it("the flip: sampled from zero flow, the chart judges the start at the pump's first flow: no point, as the engine", () => {
    expect(crossingOf(sampled(droop), systemPts(input, { flowMax: 100 * M3H }))).toBeNull();
  });
});

describe("property: demo curves and the drooping pump, statics around the shut-off head, at both edges of the band", () => {
  const sets = [...demoCurves.map((c) => ({ name: `${c.model} ${c.speed} rpm Ø${c.impellerMm}`, s: demoCurveSI(c) })), { name: "Droop 80", s: { points: DROOP_ROWS.map(([q, h]) => ({ flow: q * M3H, head: h, efficiency: null, power: null, npshr: null })), speed: 2900, impellerDiameter: 0.2 } }];
  const FRACTIONS = [0, 0.3, 0.6, 0.9, 0.97, 0.995, 1, 1.005, 1.02, 1.05]; // static × shut-off head: the start flips near 1
  it(`sweeps ${sets.length} curves × ${FRACTIONS.length} statics × 2 edges × 3 system grids`, () => {
    let points = 0, none = 0, unseen = 0;
    for (const { name, s } of sets) {
      const c = createPumpCurve({ points: toPumpPoints(s.points), speed: s.speed, impellerDiameter: s.impellerDiameter, riseTolerance: 1 });
      const pump = sampled(c);
      const shutoff = c.shutoffHead ?? c.head.y[0];
      for (const f of FRACTIONS) {
        const input: SystemInput = { ...defaultSystemInput(), staticLow: shutoff * f * 0.95, staticHigh: shutoff * f, duty: { flow: c.flowMax * 0.6, head: shutoff * f } };
        const flowMax = flowMaxOf(input, c.flowMax); // the workbench's grid: past the pump curve's end
        for (const { name: edge, which } of bandEdges("open")) {
          const op = engineAt(c, input, which);
          const where = `${name}, static ${f} × shut-off, ${edge}`;
          const near = (x: Pt | null) => {
            expect(x, where).not.toBeNull();
            expect(Math.abs(x!.flow - op.flow!) / c.flowMax, where).toBeLessThan(0.01);
            expect(Math.abs(x!.y - op.head!) / op.head!, where).toBeLessThan(0.01);
          };
          // The grid from zero to past the curve's end: the same outcome, the same point.
          const full = crossingOf(pump, systemPts(input, { flowMax }, which));
          if (op.flow == null) { expect(full, `${where}: ${op.status}`).toBeNull(); none++; } else { near(full); points++; }
          // A grid from a quarter of the curve's range: never a point the engine does not reach from rest.
          const late = crossingOf(pump, systemPts(input, { flowMin: c.flowMin + (c.flowMax - c.flowMin) / 4, flowMax }, which));
          if (op.flow == null) expect(late, `${where}, grid from a quarter: ${op.status}`).toBeNull(); // old code: droop points
          else if (late) near(late);
          // A grid ending at half the curve's range: a point only where the engine has it; none where the samples end first.
          const short = crossingOf(pump, systemPts(input, { flowMax: c.flowMin + (c.flowMax - c.flowMin) / 2 }, which));
          if (op.flow == null) expect(short, where).toBeNull();
          else if (short) near(short);
          else unseen++;
        }
      }
    }
    expect(points).toBeGreaterThan(0); // both outcomes are swept
    expect(none).toBeGreaterThan(0);
    expect(unseen).toBeGreaterThan(0); // the short grid does end before some engine points
  });
});
