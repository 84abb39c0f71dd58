/** Tier 3 — figures at the operating point, and field check maths. */
import { describe, expect, it } from "vitest";
import {
  createPumpCurve, fieldCheck, fluidAt, G0, gaugeTdh, headAt, npshAvailable, operatingFigures, TOLERANCE_GRADES,
  withinGrade, EngineInputError, maxShaftPower, overloadCheck,
} from "./index.ts";
import { inSI } from "./quantityText.ts";
import { M3H, samplePoints } from "./test/curves.ts";

const water = fluidAt({ kind: "water" }, 20);
const etaCurve = createPumpCurve({ points: samplePoints() });
const powerCurve = createPumpCurve({ points: samplePoints({ efficiency: false, power: true }) });

describe("powers (definitions: P_h = ρ·g₀·Q·H, P = P_h/η)", () => {
  it("hydraulic and shaft power at a data point", () => {
    const f = operatingFigures({ curve: etaCurve, flow: 40 * M3H, fluid: water });
    expect(f.hydraulicPower).toBeCloseTo(water.density * G0 * 40 * M3H * 31, 9);
    expect(f.shaftPower!).toBeCloseTo(f.hydraulicPower / 0.75, 9);
    expect(f.efficiency).toBe(0.75);
  });
  it("same figures whether the curve gives efficiency or power (at data points)", () => {
    for (const q of [20, 50, 70]) {
      const a = operatingFigures({ curve: etaCurve, flow: q * M3H, fluid: water });
      const b = operatingFigures({ curve: powerCurve, flow: q * M3H, fluid: water });
      expect(b.efficiency!).toBeCloseTo(a.efficiency!, 12);
      expect(b.shaftPower! / a.shaftPower!).toBeCloseTo(1, 12);
    }
  });
  it("POR flag: 40 m³/h is inside 70–120 % of BEP (50 m³/h), 20 m³/h is outside", () => {
    expect(operatingFigures({ curve: etaCurve, flow: 40 * M3H, fluid: water }).inPor).toBe(true);
    const low = operatingFigures({ curve: etaCurve, flow: 20 * M3H, fluid: water });
    expect(low.inPor).toBe(false);
    expect(low.warnings.map((w) => w.code)).toContain("outside-por");
  });
});

describe("NPSH (common practice formula)", () => {
  it("worked by hand: 101.325 kPa surface, water 20 °C (p_v 2.339 kPa, ρ 998.2), 3 m lift, 0.5 m loss → 6.61 m", () => {
    // (101325 − 2339)/(998.2 × 9.80665) − 3 − 0.5 = 10.112 − 3.5 = 6.612 m (hand arithmetic, 3 decimals).
    const a = npshAvailable({ surfacePressure: 101325, vaporPressure: water.vaporPressure, density: water.density, staticSuctionHead: -3, suctionLoss: 0.5 });
    expect(Math.abs(a - 6.612)).toBeLessThan(0.001);
  });
  it("margin ratio and status against ANSI/HI 9.6.1-style required ratio (from memory)", () => {
    const q = 60 * M3H; // NPSHr 4.0 m
    const ok = operatingFigures({ curve: etaCurve, flow: q, fluid: water, suction: { surfacePressure: 101325, staticSuctionHead: 0, suctionLoss: 0.3 } });
    expect(ok.npsh!.required).toBeCloseTo(4, 12);
    expect(ok.npsh!.marginRatio!).toBeCloseTo(ok.npsh!.available / 4, 12);
    expect(ok.npsh!.status).toBe("ok");
    const low = operatingFigures({ curve: etaCurve, flow: q, fluid: water, suction: { surfacePressure: 101325, staticSuctionHead: -5.8, suctionLoss: 0.3 } });
    expect(low.npsh!.status).toBe("low-margin");
    const bad = operatingFigures({ curve: etaCurve, flow: q, fluid: water, suction: { surfacePressure: 101325, staticSuctionHead: -7, suctionLoss: 0.3 } });
    expect(bad.npsh!.status).toBe("cavitation-risk");
  });
});

describe("motor and energy", () => {
  it("largest power is found anywhere on the curve, not just at the duty; non-overloading check vs rating × service factor", () => {
    const f = operatingFigures({ curve: etaCurve, flow: 30 * M3H, fluid: water, motor: { rating: 4000, serviceFactor: 1.15 } });
    expect(f.maxPower!.power).toBeGreaterThan(f.shaftPower!);
    for (let q = 10; q <= 80; q += 1) {
      const p = operatingFigures({ curve: etaCurve, flow: q * M3H, fluid: water }).shaftPower!;
      expect(p).toBeLessThanOrEqual(f.maxPower!.power * (1 + 1e-12));
    }
    expect(f.motor!.limit).toBeCloseTo(4600, 9);
    expect(f.motor!.nonOverloading).toBe(f.maxPower!.power <= 4600);
    const big = operatingFigures({ curve: etaCurve, flow: 30 * M3H, fluid: water, motor: { rating: 7500 } });
    expect(big.motor!.nonOverloading).toBe(true);
  });
  it("power data that stops short of the curve's end: overload not judged (null) unless the known part already exceeds the limit (product rule)", () => {
    const full = samplePoints();
    const short = full.map((p, i) => (i === full.length - 1 ? { flow: p.flow, head: p.head } : p)); // the last point's efficiency not published
    const shortCurve = createPumpCurve({ points: short });
    const whole = maxShaftPower(etaCurve, 998.2)!;
    const part = maxShaftPower(shortCurve, 998.2)!;
    expect(whole.toEnd).toBe(true);
    expect(whole.upTo).toBe(etaCurve.flowMax);
    expect(part.toEnd).toBe(false);
    expect(part.upTo).toBe(short[short.length - 2].flow); // the last flow with an efficiency
    // A limit above every power known: the whole curve passes, the short one is not judged.
    const above = Math.max(part.power, whole.power) * 1.01;
    expect(overloadCheck(whole, above).nonOverloading).toBe(true);
    expect(overloadCheck(part, above).nonOverloading).toBeNull();
    expect(inSI(overloadCheck(part, above).warning!)).toMatch(/^power is known only up to \d+(\.\d)? m³\/h, not to the curve's end: overload past it is not judged/);
    // The flip at the limit itself, for the whole curve: equal passes, and floating-point noise below it (the 1e-8 slack
    // the suggestion shares, motor.ts COVERS_SLACK = quantityText.ts LIMIT_ROUNDING); past the slack it fails.
    expect(overloadCheck(whole, whole.power).nonOverloading).toBe(true);
    expect(overloadCheck(whole, whole.power * (1 - 5e-9)).nonOverloading).toBe(true);
    expect(overloadCheck(whole, whole.power * (1 - 2e-8)).nonOverloading).toBe(false);
    // The known part already over the limit: can overload, judged without the rest.
    expect(overloadCheck(part, part.power * 0.99).nonOverloading).toBe(false);
    expect(operatingFigures({ curve: shortCurve, flow: 30 * M3H, fluid: water, motor: { rating: above } }).motor!.nonOverloading).toBeNull();
    expect(operatingFigures({ curve: etaCurve, flow: 30 * M3H, fluid: water, motor: { rating: above } }).motor!.nonOverloading).toBe(true);
  });
  it("energy per year = input power × hours; cost = kWh × tariff", () => {
    const f = operatingFigures({ curve: etaCurve, flow: 50 * M3H, fluid: water, energy: { hoursPerYear: 4000, tariffPerKWh: 0.2, motorEfficiency: 0.9 } });
    const kw = f.shaftPower! / 0.9 / 1000;
    expect(f.energy!.annualEnergyKWh).toBeCloseTo(kw * 4000, 9);
    expect(f.energy!.annualCost).toBeCloseTo(kw * 4000 * 0.2, 9);
    expect(() => operatingFigures({ curve: etaCurve, flow: 50 * M3H, fluid: water, energy: { hoursPerYear: 9000, tariffPerKWh: 0.2 } })).toThrow(EngineInputError);
  });
  it("flow outside the curve is a typed error naming flow", () => {
    expect(() => operatingFigures({ curve: etaCurve, flow: 1, fluid: water })).toThrow(/flow/);
  });
});

describe("field check", () => {
  // Readings made from the curve itself: TDH = H(Q0) at Q0 = 45 m³/h.
  const q0 = 45 * M3H;
  const h0 = headAt(etaCurve, q0)!;
  const suction = { pressure: -20_000, elevation: 0, pipeDiameter: 0.1, accuracy: 1000 };
  const dischargeBase = { elevation: 0.6, pipeDiameter: 0.065, accuracy: 5000 };
  const vh = (d: number) => (q0 / ((Math.PI * d * d) / 4)) ** 2 / (2 * G0);
  const pd = (h: number) => -20_000 + water.density * G0 * (h - 0.6 - vh(0.065) + vh(0.1));
  const discharge = { ...dischargeBase, pressure: pd(h0) };

  it("TDH from gauges includes elevation and velocity heads (Bernoulli between taps)", () => {
    const t = gaugeTdh(suction, discharge, q0, water.density);
    expect(t.tdh).toBeCloseTo(h0, 9);
    expect(t.vhd).toBeGreaterThan(t.vhs);
  });
  it("measured flow on the curve → ~0 deviation, within the tightest grade", () => {
    const r = fieldCheck({ curve: etaCurve, fluid: water, suction, discharge, measuredFlow: q0 });
    expect(Math.abs(r.headDeviation!)).toBeLessThan(1e-9);
    expect(Math.abs(r.flowDeviation!)).toBeLessThan(1e-9);
    expect(r.bestGrade).toBe("1B");
    expect(r.verdict).toBe("within-tolerance");
  });
  it("head 10 % low: meets no grade — head arm −10 % is beyond 3B's −7 %, and the flow arm too (ISO 9906:2012 cross, from memory)", () => {
    const r = fieldCheck({ curve: etaCurve, fluid: water, suction, discharge: { ...dischargeBase, pressure: pd(0.9 * h0) }, measuredFlow: q0 });
    const pass = Object.fromEntries(r.grades.map((g) => [g.id, g.pass]));
    expect(pass).toEqual({ "1B": false, "1E": false, "1U": false, "2B": false, "2U": false, "3B": false });
    const g3 = r.grades.find((g) => g.id === "3B")!.cross!;
    expect(g3.head.deviation!).toBeCloseTo(-0.1, 6);
    expect(g3.head.margin!).toBeCloseTo(-0.03, 6); // 3 points outside −7 %
    expect(g3.flow.deviation!).toBeLessThan(-0.09); // flow arm: outside −9 % as well
    expect(g3.flow.deviation!).toBeCloseTo(r.flowDeviation!, 12); // the same number the page shows
  });
  it("head 6 % low: meets 3B on the head arm only, 1 point inside; the flow arm is not met (flat curve: small head, large flow difference)", () => {
    const r = fieldCheck({ curve: etaCurve, fluid: water, suction, discharge: { ...dischargeBase, pressure: pd(0.94 * h0) }, measuredFlow: q0 });
    const g3 = r.grades.find((g) => g.id === "3B")!;
    expect(g3.pass).toBe(true);
    expect(g3.cross!.head.pass).toBe(true);
    expect(g3.cross!.head.margin!).toBeCloseTo(0.01, 6); // −6 % against −7 %
    expect(g3.cross!.flow.pass).toBe(false);
    expect(r.grades.find((g) => g.id === "2B")!.pass).toBe(false); // −6 % against 2B's −5 %
  });
  it("no flow meter: flow inferred from the curve equals the true flow; band widens with gauge accuracy", () => {
    const r = fieldCheck({ curve: etaCurve, fluid: water, suction, discharge });
    expect(r.verdict).toBe("no-flow-meter");
    expect(r.flow! / q0).toBeCloseTo(1, 9);
    expect(r.flowBand!.low!).toBeLessThan(q0);
    expect(r.flowBand!.high!).toBeGreaterThan(q0);
    const sloppy = fieldCheck({ curve: etaCurve, fluid: water, suction: { ...suction, accuracy: 5000 }, discharge: { ...discharge, accuracy: 20_000 } });
    expect(sloppy.flowBand!.high! - sloppy.flowBand!.low!).toBeGreaterThan(r.flowBand!.high! - r.flowBand!.low!);
  });
  it("a flat curve gives a wider inferred-flow band than a steep one for the same gauges", () => {
    const steep = createPumpCurve({ points: [{ flow: 0, head: 40 }, { flow: 0.01, head: 35 }, { flow: 0.02, head: 25 }, { flow: 0.03, head: 10 }] });
    const flat = createPumpCurve({ points: [{ flow: 0, head: 26.5 }, { flow: 0.01, head: 26 }, { flow: 0.02, head: 25 }, { flow: 0.03, head: 23 }] });
    const s = { pressure: 0, elevation: 0, pipeDiameter: 0.1, accuracy: 2000 };
    const d = { pressure: water.density * G0 * 25, elevation: 0, pipeDiameter: 0.1, accuracy: 2000 };
    const a = fieldCheck({ curve: steep, fluid: water, suction: s, discharge: d });
    const b = fieldCheck({ curve: flat, fluid: water, suction: s, discharge: d });
    expect(b.flowBand!.high! - b.flowBand!.low!).toBeGreaterThan(3 * (a.flowBand!.high! - a.flowBand!.low!));
  });
  it("grades are labelled data: every grade names its source", () => {
    for (const g of TOLERANCE_GRADES) expect(g.source).toMatch(/ISO 9906:2012.*from memory/);
    expect(withinGrade(etaCurve, q0, h0 * 1.02, TOLERANCE_GRADES[0])).toBe(true);
  });
});

describe("NPSHa above zero where the NPSHr column has stopped: the engine's caution says where", () => {
  // Invented curve: NPSHr published from 0 to 0.02 m³/s only; the pump run at 0.025 m³/s. NPSHa from a flooded suction
  // (common practice: (p_s − p_v)/(ρg) + z_s − h_loss, well above zero here).
  const pts = [0, 0.01, 0.02, 0.03].map((q, i) => ({ flow: q, head: 40 - 10000 * q * q, efficiency: [0, 0.6, 0.75, 0.7][i], npshr: q <= 0.02 ? 2 + 100 * q : undefined }));
  it("past the NPSHr column's last flow: both flows named (was the bare 'curve has no NPSHr at this flow')", () => {
    const f = operatingFigures({ curve: createPumpCurve({ points: pts }), flow: 0.025, fluid: water, suction: { surfacePressure: 101325, staticSuctionHead: 2, suctionLoss: 0 } });
    expect(f.npsh!.status).toBe("unknown");
    expect(f.warnings.find((w) => w.code === "npsh-unknown")!.message).toBe("NPSH not judged: no NPSHr at this flow (the NPSHr curve ends at ⟦flow|0.02|limit:0.025⟧, and the pump runs past it at ⟦flow|0.025|0.02⟧)");
  });
});

describe("NPSHa at or below zero with no NPSHr on the curve", () => {
  // NPSHa = (p_s − p_v)/(ρg) + z_s − h_loss (common practice): 101 325 Pa at the surface, 20 °C water, a suction lift
  // around 10.3 m puts it at zero.
  const noNpshr = createPumpCurve({ points: samplePoints({ npshr: false }) });
  const at = (z: number) => operatingFigures({ curve: noNpshr, flow: 40 * M3H, fluid: water, suction: { surfacePressure: 101325, staticSuctionHead: z, suctionLoss: 0 } });
  it("says NPSHa is not above zero, never 'below NPSHr' (there is none); flips at NPSHa = 0 (bisection on the suction lift)", () => {
    let lo = -20, hi = 0; // NPSHa(lo) < 0 < NPSHa(hi)
    for (let i = 0; i < 200; i++) { const mid = (lo + hi) / 2; if (at(mid).npsh!.available > 0) hi = mid; else lo = mid; }
    const below = at(lo), above = at(hi);
    expect(below.npsh!.available).toBeLessThanOrEqual(0);
    expect(below.npsh!.status).toBe("cavitation-risk");
    const said = below.warnings.find((w) => w.code === "npsh-cavitation")!.message;
    expect(said).toMatch(/is not above zero: cavitation risk whatever the pump \(no NPSHr at this flow: the curve publishes no NPSHr\)/); // was "(the curve has no NPSHr at this flow)"
    expect(said).not.toMatch(/below NPSHr/);
    expect(above.npsh!.status).toBe("unknown");
    expect(above.warnings.map((w) => w.code)).toContain("npsh-unknown");
    // Above zero the engine's own words say where NPSHr stops too (was the bare "curve has no NPSHr at this flow").
    expect(above.warnings.find((w) => w.code === "npsh-unknown")!.message).toBe("NPSH not judged: no NPSHr at this flow (the curve publishes no NPSHr)");
  });
});

describe("NPSHa at or below zero with NPSHr on the curve: read by NPSHa, as the band's corners are", () => {
  // NPSHa = (p_s − p_v)/(ρg) + z_s − h_loss (common practice); NPSHa ≤ 0 means the liquid boils at the inlet whatever the
  // pump, so a ratio to NPSHr or "below NPSHr" says nothing (our rule, decision "npshenergy").
  const withNpshr = createPumpCurve({ points: samplePoints() });
  const at = (z: number) => operatingFigures({ curve: withNpshr, flow: 40 * M3H, fluid: water, suction: { surfacePressure: 101325, staticSuctionHead: z, suctionLoss: 0 } });
  const said = (z: number) => inSI(at(z).warnings.find((w) => w.code === "npsh-cavitation")!.message);
  it("NPSHa ≤ 0: 'not above zero … whatever the pump's NPSHr', never 'below NPSHr'; flips to 'below NPSHr' just above zero (bisection)", () => {
    let lo = -20, hi = 0; // NPSHa(lo) ≤ 0 < NPSHa(hi)
    for (let i = 0; i < 200; i++) { const mid = (lo + hi) / 2; if (at(mid).npsh!.available > 0) hi = mid; else lo = mid; }
    expect(at(lo).npsh!.required).not.toBeNull();
    expect(said(lo)).toMatch(/^NPSHa -?0\.\d+ m is not above zero: cavitation risk whatever the pump's NPSHr$/); // old code: "… is below NPSHr … m: cavitation risk"
    expect(said(lo - 0.2)).toMatch(/^NPSHa −0\.\d+ m is not above zero/);
    expect(said(hi)).toMatch(/^NPSHa < 0\.001 m is below NPSHr [\d.]+ m: cavitation risk$/); // NPSHa just above zero (a hair: "< 0.001 m", decision "npshzero"; it read "1.00e-15 m")
  });
});

describe("the margin ratio at the source: none where NPSHa ≤ 0, NPSHa given and deciding", () => {
  // NPSHa = (p_s − p_v)/(ρg) + z_s − h_loss (common practice); NPSHa ≤ 0: the liquid boils at the inlet whatever the pump,
  // so NPSHa / NPSHr (zero or negative) means nothing (our rule, decision "npshtruth"). Flip found by bisection on the lift.
  const withNpshr = createPumpCurve({ points: samplePoints() });
  const at = (z: number) => operatingFigures({ curve: withNpshr, flow: 40 * M3H, fluid: water, suction: { surfacePressure: 101325, staticSuctionHead: z, suctionLoss: 0 } });
  let lo = -20, hi = 0; // NPSHa(lo) ≤ 0 < NPSHa(hi)
  for (let i = 0; i < 200; i++) { const mid = (lo + hi) / 2; if (at(mid).npsh!.available > 0) hi = mid; else lo = mid; }
  it("NPSHa at or below zero (at the flip and 1 m further): ratio null, NPSHa kept, status and warning by NPSHa", () => {
    for (const z of [lo, lo - 1]) {
      const f = at(z);
      expect(f.npsh!.required).toBeGreaterThan(0);
      expect(f.npsh!.available).toBeLessThanOrEqual(0);
      expect(f.npsh!.marginRatio).toBeNull(); // old code: NPSHa / NPSHr, ≤ 0 (e.g. -0.25 at 1 m further)
      expect(f.npsh!.status).toBe("cavitation-risk");
      expect(inSI(f.warnings.find((w) => w.code === "npsh-cavitation")!.message)).toMatch(/^NPSHa −?\d+\.\d+ m is not above zero: cavitation risk whatever the pump's NPSHr$/);
    }
  });
  it("NPSHa just above zero: the ratio NPSHa / NPSHr, positive, decides (below 1: cavitation risk below NPSHr)", () => {
    const f = at(hi);
    expect(f.npsh!.available).toBeGreaterThan(0);
    expect(f.npsh!.marginRatio!).toBeGreaterThan(0);
    expect(f.npsh!.marginRatio!).toBeCloseTo(f.npsh!.available / f.npsh!.required!, 12);
    expect(f.npsh!.status).toBe("cavitation-risk");
  });
});
