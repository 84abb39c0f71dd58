// The motor's overload verdict for pumps in series with one stopped or tripped: the rest lift the liquid alone, at a lower
// flow than the pair (solveOperatingPoint, the start-from-rest rule; the stopped pump's own loss left out — common
// practice, from memory). Where the curve already overloads, the check names the series edge whose power exceeds the
// limit; where the curve is published from a flow above zero and the rest cannot reach its first point, overload is not
// judged. Check values: the product rule (motor-overload.ts), invented curves (power from the invented linear formulas,
// × the liquid's density / 1000), each case bisected across its threshold.
import { describe, expect, it } from "vitest";
import { createPumpCurve, prepareSystem, solveOperatingPoint, systemHeadFunction } from "~/engine";
import { inSI } from "~/engine/quantityText";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, evaluateCandidate, toPumpPoints, type Adjustment, type CurvePointsIn, type SystemInput } from "./hydraulics";
import { systemSpec } from "./system-input";

const M3H = 1 / 3600;
const SERIES: Adjustment = { ...DEFAULT_ADJUSTMENT, arrangement: "series", dutyPumps: 2 };
/** Invented pump, 0–80 m³/h, head 30 − 0.004 Q² m; power on water of 1000 kg/m³ (W, Q in m³/h). */
const MIXED = (q: number) => 6000 - 50 * q; // mixed-flow-like: most power at shut-off (6 kW), least at the end (2 kW)
const RADIAL = (q: number) => 2000 + 25 * q; // radial: least power at shut-off (2 kW), most at the end (4 kW)
const points = (power: (q: number) => number, from = 0): CurvePointsIn =>
  [0, 10, 20, 40, 60, 80].filter((q) => q >= from).map((q) => ({ flow: q * M3H, head: 30 - 0.004 * q * q, efficiency: null, power: power(q), npshr: null }));
const set = (power: (q: number) => number, from = 0) => ({ points: points(power, from), speed: 2900, impellerDiameter: 0.2 });
const system = (staticLow: number): SystemInput => ({ ...defaultSystemInput(), staticLow, staticHigh: staticLow + 4, duty: { flow: 60 * M3H, head: staticLow + 4 } });
const EDGES = [{ name: "least lift, new pipe", which: { level: "min", roughness: "new" } }, { name: "most lift, aged pipe", which: { level: "max", roughness: "aged" } }] as const;

/** One pump alone against the system at an edge (the engine's solve, independent of the candidate), and its power there, W. */
function alone(power: (q: number) => number, staticLow: number, edge: (typeof EDGES)[number]) {
  const prepared = prepareSystem(systemSpec(system(staticLow)));
  const op = solveOperatingPoint(createPumpCurve({ points: toPumpPoints(points(power)) }), systemHeadFunction(prepared, edge.which));
  return { flow: op.flow!, power: (power(op.flow! / M3H) * prepared.fluid.density) / 1000 };
}

describe("two pumps in series, one stopped: the one left running runs at a lower flow", () => {
  const S = 15; // static head at least lift, m: the pair and one pump alone both run on the curve
  it("power rising toward shut-off: the edge whose power exceeds the limit is named, bisected on the rating", () => {
    for (const edge of EDGES) {
      const a = alone(MIXED, S, edge);
      expect(a.flow).toBeGreaterThan(0);
      const over = evaluateCandidate(system(S), set(MIXED), { ...SERIES, motorRating: a.power * 0.999 });
      const under = evaluateCandidate(system(S), set(MIXED), { ...SERIES, motorRating: a.power * 1.001 });
      // The curve's own largest power (6 kW at shut-off) exceeds either rating: "can overload" both ways.
      for (const r of [over, under]) expect(r.figures!.nonOverloading).toBe(false);
      const named = `at ${edge.name}, with one of the 2 pumps in series stopped or tripped (its own loss left out), the pump left running runs at ${(a.flow / M3H).toFixed(1)} m³/h`;
      expect(inSI(over.figures!.motorCheck!)).toContain(named);
      expect(inSI(over.figures!.motorCheck!)).toMatch(new RegExp(`${edge.name}[^;]* taking ${(a.power / 1000).toFixed(2)}\\d* kW, above motor rating × service factor`));
      expect(inSI(under.figures!.motorCheck!)).not.toContain(named);
      expect(over.warnings.map(inSI).some((w) => w.includes(named))).toBe(true);
    }
  });
  it("radial (power falling toward shut-off): a motor that covers the pair's duty covers the one left running", () => {
    const r = evaluateCandidate(system(S), set(RADIAL), { ...SERIES, motorRating: 3900 });
    const duty = r.figures!.shaftPower! / 2;
    expect(duty).toBeLessThan(3900);
    for (const edge of EDGES) expect(alone(RADIAL, S, edge).power).toBeLessThan(duty);
    expect(r.figures!.nonOverloading).toBe(false); // the curve's end (4 kW × ρ/1000) still exceeds 3.9 kW
    expect(r.figures!.motorCheck).not.toContain("stopped or tripped");
    const big = evaluateCandidate(system(S), set(RADIAL), { ...SERIES, motorRating: 4000 });
    expect(inSI(big.figures!.motorCheck!)).toMatch(/^non-overloading: largest power on the curve 3\.99\d* kW at 80\.0 m³\/h/);
  });
});

describe("two pumps in series, one stopped, on a curve published from 10 m³/h: overload not judged below it", () => {
  // The static head at least lift where, at most lift (static + 4 m, aged pipe), the system needs the pump's head at its
  // first point, 29.6 m at 10 m³/h (the system's head is linear in the static head).
  const most = systemHeadFunction(prepareSystem(systemSpec(system(0))), EDGES[1].which);
  const t = 30 - 0.004 * 10 * 10 - most(10 * M3H);
  it("bisected on the static head", () => {
    expect(t).toBeGreaterThan(0);
    const below = evaluateCandidate(system(t + 0.01), set(MIXED, 10), { ...SERIES, motorRating: 7500 });
    const on = evaluateCandidate(system(t - 0.01), set(MIXED, 10), { ...SERIES, motorRating: 7500 });
    for (const r of [below, on]) expect(r.band.every((b) => b.flow !== null), "pair on its curve").toBe(true);
    expect(below.figures!.nonOverloading).toBeNull();
    expect(inSI(below.figures!.motorCheck!)).toContain("overload not judged: at most lift, aged pipe, with one of the 2 pumps in series stopped or tripped (its own loss left out), the pump left running cannot reach the published curve's first point (10.0 m³/h, no shut-off head published) and runs below it, where the pump's power is not published; within the curve the largest power 5.49");
    expect(inSI(below.figures!.motorCheck!)).not.toContain("least lift");
    expect(on.figures!.nonOverloading).toBe(true);
  });
});
