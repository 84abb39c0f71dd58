// The motor's overload verdict on a candidate, over every flow its pump can run at: never "non-overloading" where the
// pump runs past its published curve's end at least lift (its power is unknown there), nor, in parallel, where one pump
// running alone (the first to start, or the others tripped) does; nor where the curve's power starts past its first
// flow. Each case is bisected across its threshold (the least-lift static head where the pump's head at its last point
// meets the system's). Check values: the product rule (motor-overload.ts, engine figures.ts), common practice (a single
// pump of a parallel set runs further out on its curve than when it shares the flow), invented curves and the demo data
// (fixtures/demo/generate.ts).
import { describe, expect, it } from "vitest";
import { createPumpCurve, headAt, maxShaftPower, prepareSystem, scaleBySpeed, scaleByTrim, solveOperatingPoint, systemHeadFunction } from "~/engine";
import { inSI } from "~/engine/quantityText";
import { demoCurves, demoCurveSI } from "~/test/demo-curves";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, evaluateCandidate, toPumpPoints, type Adjustment, type CurvePointsIn, type SystemInput } from "./hydraulics";
import { motorFigures } from "./candidate-judgement";
import { candidateEnergy } from "./energy";
import { systemSpec } from "./system-input";

const M3H = 1 / 3600;
const LEAST_LIFT = { level: "min", roughness: "new" } as const;
/** Invented radial pump: 0–40 m³/h, head 30 − 0.008 Q² m, power 2 + 0.05 Q kW on water of 1000 kg/m³ rising to its end (from the k-th point on); 3.99 kW at its end on water at 20 °C (× 998.2/1000). */
const points = (k = 0): CurvePointsIn =>
  [0, 10, 20, 30, 40].map((q, i) => ({ flow: q * M3H, head: 30 - 0.008 * q * q, efficiency: null, power: i >= k ? 2000 + 50 * q : null, npshr: null }));
const set = (k = 0) => ({ points: points(k), speed: 2900, impellerDiameter: 0.2 });
const END = 40 * M3H, END_HEAD = 30 - 0.008 * 40 * 40; // 17.2 m at 40 m³/h
const system = (staticLow: number): SystemInput => ({ ...defaultSystemInput(), staticLow, staticHigh: staticLow + 4, duty: { flow: 25 * M3H, head: staticLow + 4 } });
/** The least-lift static head at which the system needs the pump's last-point head at `flow` (linear in the static head). */
function threshold(flow: number): number {
  const sys = systemHeadFunction(prepareSystem(systemSpec(system(0))), LEAST_LIFT);
  return END_HEAD - sys(flow);
}

describe("past the published curve's end at least lift: overload not judged", () => {
  it("one pump: bisected across the static head where its last point meets the system", () => {
    const t = threshold(END);
    expect(t).toBeGreaterThan(0);
    const past = evaluateCandidate(system(t - 0.01), set(), DEFAULT_ADJUSTMENT);
    const on = evaluateCandidate(system(t + 0.01), set(), DEFAULT_ADJUSTMENT);
    expect(solveOperatingPoint(createPumpCurve({ points: toPumpPoints(points()) }), systemHeadFunction(prepareSystem(systemSpec(system(t - 0.01))), LEAST_LIFT)).status).toBe("beyond-curve-end");
    expect(past.figures!.nonOverloading).toBeNull();
    expect(inSI(past.figures!.motorCheck!)).toMatch(/^overload not judged: at least lift, new pipe the pump runs past the published curve's end \(40\.0 m³\/h, still giving 17\.2\d* m against the system's 17\.1\d* m\), where the pump's power is not published; within the curve the largest power 3\.99 kW is within motor rating × service factor 4\.00 kW$/);
    expect(past.warnings.map(inSI).some((w) => w.startsWith("overload not judged: at least lift, new pipe the pump runs past"))).toBe(true);
    expect(on.figures!.nonOverloading).toBe(true);
    expect(inSI(on.figures!.motorCheck!)).toBe("non-overloading: largest power on the curve 3.99 kW at 40.0 m³/h is within motor rating × service factor 4.00 kW");
  });
  it("two pumps in parallel: one running alone runs past its end though the pair does not — bisected where one pump's last point meets the system", () => {
    const t = threshold(END);
    const adj: Adjustment = { ...DEFAULT_ADJUSTMENT, arrangement: "parallel", dutyPumps: 2 };
    const alonePast = evaluateCandidate(system(t - 0.01), set(), adj);
    const aloneOn = evaluateCandidate(system(t + 0.01), set(), adj);
    // The pair is on its curve in both (its end, 80 m³/h, needs more head than 17.2 m there).
    for (const r of [alonePast, aloneOn]) expect(r.band.every((b) => b.flow !== null), "pair on its curve").toBe(true);
    expect(alonePast.figures!.nonOverloading).toBeNull();
    expect(inSI(alonePast.figures!.motorCheck!)).toContain("one pump running alone (the first to start, or the others tripped) runs past the published curve's end (40.0 m³/h");
    expect(aloneOn.figures!.nonOverloading).toBe(true);
  });
  it("a known overload decides even where the pump runs past its end", () => {
    const r = evaluateCandidate(system(threshold(END) - 0.01), set(), { ...DEFAULT_ADJUSTMENT, motorRating: 3000 });
    expect(r.figures!.nonOverloading).toBe(false);
    expect(inSI(r.figures!.motorCheck!)).toBe("can overload: largest power on the curve 3.99 kW at 40.0 m³/h exceeds motor rating × service factor 3.00 kW");
  });
});

describe("power published from the second point on: overload not judged below it", () => {
  it("the candidate says from where, and the suggestion too; from shut-off it is judged", () => {
    const t = threshold(END) + 1;
    const part = evaluateCandidate(system(t), set(1), DEFAULT_ADJUSTMENT);
    expect(part.figures!.nonOverloading).toBeNull();
    expect(inSI(part.figures!.motorCheck!)).toContain("power is known only from 10.0 m³/h, not from the curve's first flow: overload below it is not judged");
    expect(inSI(part.figures!.motor.suggestionBasis)).toContain("from 10.0 m³/h to its end (power not known below 10.0 m³/h: not checked there)");
    expect(evaluateCandidate(system(t), set(0), DEFAULT_ADJUSTMENT).figures!.nonOverloading).toBe(true);
  });
});

describe("a motor rating past the efficiency table (1000 kW, IEC 60034-30-1, from memory)", () => {
  it("says the table's last value is used; at 1000 kW it does not", () => {
    const run = (userRating: number) => motorFigures({ shaftPower: 5e5, maxCurvePower: null, pumps: 1, userRating, serviceFactor: 1, ieClass: "IE3", speedDrive: false, ratedSpeed: 1450, hoursPerYear: 4000, tariffPerKWh: 0.2, currency: "EUR" });
    expect(run(1e6).warnings).toEqual([]);
    expect(run(1e6 + 1).warnings.map(inSI)).toEqual(["motor 1000 kW is above the efficiency table (1000 kW): the 1000 kW efficiency is used"]);
    expect(run(5e6).warnings.map(inSI)).toEqual(["motor 5000 kW is above the efficiency table (1000 kW): the 1000 kW efficiency is used"]);
  });
});

describe("the duty cycle's drive runs faster than the set speed: a step above the motor is warned of", () => {
  it("NQ Fathom 100 2900 rpm Ø170 on speed, VFD on the system curve, a 130 % flow step: non-overloading as set, overloaded at that step (demo data)", () => {
    const c = demoCurves.find((d) => d.model === "NQ Fathom 100" && d.speed === 2900 && d.impellerMm === 170)!;
    const s = demoCurveSI(c);
    const bep = s.points.reduce((a, b) => ((b.efficiency ?? 0) > (a.efficiency ?? 0) ? b : a));
    const duty = { flow: bep.flow * 0.8, head: bep.head * 0.8 };
    const input: SystemInput = { ...defaultSystemInput(), staticLow: duty.head * 0.5, staticHigh: duty.head * 0.6, duty,
      energy: { control: "system-curve", profile: [{ flowFraction: 1.3, hours: 1000 }, { flowFraction: 1, hours: 3000 }], years: 15, escalation: 0.03, discountRate: 0.05 } };
    const adjustment: Adjustment = { ...DEFAULT_ADJUSTMENT, method: "speed" };
    const r = evaluateCandidate(input, s, adjustment);
    expect(r.figures!.nonOverloading).toBe(true); // on the curve as set
    const e = candidateEnergy(input, systemSpec(input), prepareSystem(systemSpec(input)).fluid.density, { adjustment, result: r }, null);
    const step = e.cycle!.steps[0];
    expect(step.loadFraction!).toBeGreaterThan(1); // the drive at more than the set speed (energy.ts: a VFD may run up to full speed)
    const w = e.cycle!.warnings.filter((x) => x.code === "motor-overload-step");
    expect(w.map((x) => x.parameter)).toEqual(["profile[0]"]);
    expect(inSI(w[0].message)).toBe("at 130 % flow the motor runs at 108 % load, above its rating × service factor 100 %: the shaft power 8.07 kW exceeds 7.50 kW, so the motor overloads at this step (its efficiency taken at full load)");
  });
});

describe("property: the demo curves, single and two in parallel, as published, on speed and trimmed", () => {
  it("never non-overloading where the pump (or one pump alone) runs past its curve's end at least lift; judged on the curve as set (rounded up)", () => {
    let judged = 0, notJudged = 0;
    for (const c of demoCurves) {
      const s = demoCurveSI(c);
      const base = createPumpCurve({ points: toPumpPoints(s.points), speed: s.speed, impellerDiameter: s.impellerDiameter, riseTolerance: 1 });
      const bep = s.points.reduce((a, b) => ((b.efficiency ?? 0) > (a.efficiency ?? 0) ? b : a));
      for (const arrangement of ["single", "parallel"] as const) for (const method of ["none", "speed", "trim"] as const) for (const low of [0.3, 0.7]) {
        const n = arrangement === "parallel" ? 2 : 1;
        const duty = { flow: bep.flow * n * 0.9, head: bep.head * 0.9 };
        const input: SystemInput = { ...defaultSystemInput(), staticLow: duty.head * low, staticHigh: duty.head * 0.75, duty };
        const r = evaluateCandidate(input, s, { ...DEFAULT_ADJUSTMENT, arrangement, dutyPumps: n, method });
        if (!r.figures) continue;
        const where = `${c.model} ${c.speed} rpm Ø${c.impellerMm} ${arrangement} ${method} low ×${low}`;
        // The curve as set: the rounded-up ratio, as the page shows it (setting-step.ts).
        const one = method === "speed" ? scaleBySpeed(base, r.ratio).curve : method === "trim" ? scaleByTrim(base, r.ratio).curve : base;
        const prepared = prepareSystem(systemSpec(input));
        expect(r.figures.maxPower! / maxShaftPower(one, prepared.fluid.density)!.power, where).toBeCloseTo(1, 9);
        const sys = systemHeadFunction(prepared, LEAST_LIFT);
        const runsPast = headAt(one, one.flowMax)! > sys(one.flowMax * n) || (n > 1 && headAt(one, one.flowMax)! > sys(one.flowMax));
        if (runsPast) { expect(r.figures.nonOverloading, where).not.toBe(true); notJudged++; }
        else { expect(r.figures.nonOverloading, where).toBe(true); judged++; } // the suggested motor covers the whole curve
      }
    }
    expect(judged).toBeGreaterThan(50);
    expect(notJudged).toBeGreaterThan(50);
  });
});
