// The motor at its edges: the suggestion and the overload check share one rule at a size boundary (a suggested motor is
// never judged to overload on the power it was suggested for), the series' ends, and "non-overloading" only where the
// curve's power is known from its first flow to its last. Check values: the IEC standard rated outputs (IEC 60034-1 /
// IEC 60072-1 series, from memory, motor.ts), service factors 1.0–1.5 (common practice), invented curves.
import { describe, expect, it } from "vitest";
import { createPumpCurve, IEC_MOTOR_RATINGS_KW, maxShaftPower, motorLimit, overloadCheck, suggestMotor, type MaxShaftPower } from "./index.ts";
import { inSI } from "./quantityText.ts";

const whole = (power: number): MaxShaftPower => ({ power, flow: 0.01, upTo: 0.02, toEnd: true, from: 0, fromStart: true });
const SERVICE_FACTORS = [1, 1.05, 1.1, 1.15, 1.2, 1.25, 1.5]; // common practice: 1.0–1.5

describe("a largest power at a standard size's boundary", () => {
  it("12 650 W with service factor 1.15 picks 11 kW (11 × 1.15 = 12.65 kW) and that motor is non-overloading (series from memory)", () => {
    const s = suggestMotor({ dutyPower: 10000, maxCurvePower: 12650, serviceFactor: 1.15 });
    expect(s.rating).toBe(11000);
    // 11 000 × 1.15 computes as 12 649.999… W: the check must take it as covering 12 650 W, as the suggestion did.
    const check = overloadCheck(whole(12650), motorLimit(s.rating!, 1.15));
    expect(check.nonOverloading).toBe(true);
    expect(inSI(check.text)).toBe("non-overloading: largest power on the curve 12.7 kW at 36.0 m³/h is within motor rating × service factor 12.7 kW");
    expect(inSI(s.basis)).toBe("11.0 kW is the smallest standard rating whose rating × service factor 1.15 = 12.7 kW covers the largest power on the curve to its end 12.7 kW (duty 10.0 kW)");
  });
  it("sweep: every rating × service factor, the power bisected across it — the pick and the check flip together", () => {
    let flips = 0;
    IEC_MOTOR_RATINGS_KW.forEach((kw, i) => {
      for (const sf of SERVICE_FACTORS) {
        const limit = motorLimit(kw * 1000, sf);
        const next = IEC_MOTOR_RATINGS_KW[i + 1];
        // Just inside (rounding, COVERS_SLACK = quantityText.ts LIMIT_ROUNDING, 1e-8) and just past the boundary.
        const inside = suggestMotor({ dutyPower: 0, maxCurvePower: limit * (1 + 5e-9), serviceFactor: sf });
        const past = suggestMotor({ dutyPower: 0, maxCurvePower: limit * (1 + 2e-8), serviceFactor: sf });
        const where = `${kw} kW × ${sf}`;
        expect(inside.rating, where).toBe(kw * 1000);
        expect(overloadCheck(whole(limit * (1 + 5e-9)), motorLimit(inside.rating!, sf)).nonOverloading, where).toBe(true);
        // As the page computed it before (rating × service factor, unrounded): the same verdict.
        expect(overloadCheck(whole(limit * (1 + 5e-9)), inside.rating! * sf).nonOverloading, where).toBe(true);
        expect(overloadCheck(whole(limit * (1 + 2e-8)), limit).nonOverloading, where).toBe(false);
        expect(past.rating, where).toBe(next === undefined ? null : next * 1000);
        if (past.rating !== null) expect(overloadCheck(whole(limit * (1 + 2e-8)), motorLimit(past.rating, sf)).nonOverloading, where).toBe(true);
        flips++;
      }
    });
    expect(flips).toBe(IEC_MOTOR_RATINGS_KW.length * SERVICE_FACTORS.length);
  });
  it("past the largest rating (1000 kW, from memory): no suggestion, and the text says by how much; below the smallest: 0.06 kW", () => {
    expect(suggestMotor({ dutyPower: 1e6, maxCurvePower: 1e6 }).rating).toBe(1e6);
    const over = suggestMotor({ dutyPower: 9e5, maxCurvePower: 1e6 * (1 + 2e-8) });
    expect(over.rating).toBeNull();
    expect(inSI(over.basis)).toMatch(/^largest power on the curve to its end 1000\.0+\d* kW \(duty 900 kW\) is above the largest standard rating \(1000 kW\)$/);
    const sf = suggestMotor({ dutyPower: 9e5, maxCurvePower: 1.2e6, serviceFactor: 1.15 });
    expect(inSI(sf.basis)).toContain("is above the largest standard rating (1000 kW × service factor 1.15 = 1150 kW)");
    expect(suggestMotor({ dutyPower: 10, maxCurvePower: 12 }).rating).toBe(60);
  });
});

describe("non-overloading only where the power is known from the curve's first flow to its end", () => {
  const M3H = 1 / 3600;
  const flows = [0, 10, 20, 30, 40]; // m³/h, invented curve
  const head = (q: number) => 30 - 0.008 * q * q;
  /** Power published from the k-th point on (W, falling with flow: where a mixed-flow pump takes most at shut-off). */
  const curve = (k: number) => createPumpCurve({ points: flows.map((q, i) => ({ flow: q * M3H, head: head(q), ...(i >= k ? { power: 6000 - 50 * q } : {}) })) });
  it("a power column from shut-off is judged; one that starts at the next point is not, and says from where", () => {
    const from0 = maxShaftPower(curve(0), 1000)!;
    expect(from0.fromStart).toBe(true);
    expect(from0.power).toBeCloseTo(6000, 6); // at shut-off (invented)
    expect(overloadCheck(from0, 6000).nonOverloading).toBe(true);
    const from1 = maxShaftPower(curve(1), 1000)!;
    expect(from1.fromStart).toBe(false);
    expect(from1.from).toBeCloseTo(10 * M3H, 12);
    // Largest known 5500 W at 10 m³/h, under a 5.5 kW limit: not "non-overloading" — at shut-off it takes 6000 W.
    const c = overloadCheck(from1, 5500);
    expect(c.nonOverloading).toBeNull();
    expect(inSI(c.text)).toBe("overload not judged: power is known only from 10.0 m³/h, not from the curve's first flow: overload below it is not judged (largest power where known 5.50 kW, motor rating × service factor 5.50 kW)");
    // What is known already over the limit decides.
    expect(overloadCheck(from1, 5400).nonOverloading).toBe(false);
  });
  it("efficiency 0 at shut-off (power 0/0 there) counts as known from the start; a blank efficiency there does not", () => {
    const eff = (first: number | undefined) => createPumpCurve({ points: flows.map((q, i) => ({ flow: q * M3H, head: head(q), ...(i === 0 ? (first === undefined ? {} : { efficiency: first }) : { efficiency: 0.3 + 0.01 * q }) })) });
    expect(maxShaftPower(eff(0), 998.2)!.fromStart).toBe(true);
    expect(maxShaftPower(eff(undefined), 998.2)!.fromStart).toBe(false);
  });
  it("the suggestion says where it checked", () => {
    const from1 = maxShaftPower(curve(1), 1000)!;
    const s = suggestMotor({ dutyPower: 4000, maxCurvePower: from1.power, maxCurvePowerFrom: from1.from });
    expect(inSI(s.basis)).toContain("largest power on the curve from 10.0 m³/h to its end (power not known below 10.0 m³/h: not checked there) 5.50 kW");
  });
});
