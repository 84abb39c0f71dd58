/**
 * Where a curve's BEP and its efficiency are known, and what the figures say where they are not.
 * Rule (common practice): a BEP is known only where the efficiency has an interior maximum among the points that give
 * it; with one efficiency point, or the highest at the first or last of them, the peak may lie past the data: no BEP,
 * no POR verdict, and the warning says why. Curves below are made-up; the demo libraries' are invented (fixtures/demo).
 */
import { describe, expect, it } from "vitest";
import { createPumpCurve, fluidAt, maxShaftPower, operatingFigures, overloadCheck, type PumpPoint } from "./index.ts";
import { inSI } from "./quantityText.ts";
import { demoCurveInputs } from "./test/demoCurves.ts";

const water = fluidAt({ kind: "water" }, 20);
const messages = (w: { message: string }[]) => w.map((x) => inSI(x.message));

describe("efficiency given over part of the flow range (B1)", () => {
  // Efficiency at 0.01–0.02 m³/s only (the importer allows blank optional cells); the operating point at 0.0278 m³/s.
  const partial = createPumpCurve({ points: [{ flow: 0, head: 40 }, { flow: 0.01, head: 38, efficiency: 0.6 },
    { flow: 0.015, head: 35, efficiency: 0.7 }, { flow: 0.02, head: 31, efficiency: 0.65 }, { flow: 0.03, head: 22 }] });

  it("past the data's end: says they end before this flow, with the range where they are known", () => {
    const f = operatingFigures({ curve: partial, flow: 0.0278, fluid: water });
    expect(f.efficiency).toBeNull();
    const w = messages(f.warnings).filter((m) => m.includes("efficiency"));
    expect(w.some((m) => m.includes("neither efficiency nor power"))).toBe(false); // the curve does give efficiency
    // 0.02 m³/s = 72.0 m³/h, 0.0278 m³/s = 100 m³/h, 0.01 m³/s = 36.0 m³/h (definition of the units)
    expect(w).toContain("the curve's efficiency data end at 72.0 m³/h, before this flow 100 m³/h (known from 36.0 m³/h to 72.0 m³/h): efficiency and power figures unavailable at this flow");
  });
  it("before the data's start: says they start after this flow", () => {
    const f = operatingFigures({ curve: partial, flow: 0.005, fluid: water });
    expect(messages(f.warnings)).toContain("the curve's efficiency data start at 36.0 m³/h, after this flow 18.0 m³/h (known from 36.0 m³/h to 72.0 m³/h): efficiency and power figures unavailable at this flow");
  });
  it("a curve with neither column still says so", () => {
    const none = createPumpCurve({ points: [{ flow: 0, head: 40 }, { flow: 0.03, head: 22 }] });
    expect(messages(operatingFigures({ curve: none, flow: 0.02, fluid: water }).warnings)).toContain("curve gives neither efficiency nor power: power figures unavailable");
  });
});

describe("no BEP claimed where none is known (B2)", () => {
  it("a single efficiency value: no BEP, no POR, no position; the warnings say one point", () => {
    const c = createPumpCurve({ points: [{ flow: 0, head: 50 }, { flow: 0.04, head: 44, efficiency: 0.75 }, { flow: 0.1, head: 20 }] });
    expect(c.bep).toBeNull();
    expect(c.por).toBeNull();
    const f = operatingFigures({ curve: c, flow: 0.04, fluid: water });
    expect(f.bepRatio).toBeNull();
    expect(f.inPor).toBeNull();
    const w = messages(f.warnings);
    expect(w).toContain("BEP not published (efficiency given at one point only, 144 m³/h): no BEP position or preferred operating region is judged");
    expect(w.some((m) => m.includes("neither efficiency nor power"))).toBe(false);
    expect(w).toContain("curve gives efficiency or power at one point only (144 m³/h), too few to read it at another flow: power figures unavailable");
    // The motor check beside it: no power anywhere, and not because the curve gives no efficiency.
    const text = inSI(overloadCheck(maxShaftPower(c, water.density), 5500).text);
    expect(text).not.toMatch(/neither power nor efficiency/);
    expect(text).toBe("overload not judged: the curve gives power at no flow (no power or efficiency column of two points or more), motor rating × service factor 5.50 kW");
  });
  it("efficiency still rising at the last point: no BEP taken at the curve's end, and the figures say why", () => {
    const c = createPumpCurve({ points: [{ flow: 0.005, head: 40, efficiency: 0.5 }, { flow: 0.03, head: 20, efficiency: 0.72 }] });
    expect(c.bep).toBeNull();
    expect(c.por).toBeNull();
    const f = operatingFigures({ curve: c, flow: 0.028, fluid: water });
    expect(f.efficiency).not.toBeNull(); // the efficiency itself is known here
    expect(f.bepRatio).toBeNull();
    expect(f.inPor).toBeNull();
    // 0.03 m³/s = 108 m³/h (definition)
    expect(messages(f.warnings)).toContain("BEP not published (efficiency still rising at the curve's end, 108 m³/h): no BEP position or preferred operating region is judged");
  });
  it("efficiency highest at the first point: no BEP either", () => {
    const c = createPumpCurve({ points: [{ flow: 0.01, head: 40, efficiency: 0.8 }, { flow: 0.02, head: 30, efficiency: 0.7 }, { flow: 0.03, head: 20, efficiency: 0.6 }] });
    expect(c.bep).toBeNull();
    expect(messages(c.warnings)).toContain("BEP not published (efficiency highest at the curve's first point, 36.0 m³/h: the peak may lie below the curve's flows): no BEP position or preferred operating region is judged");
  });
  it("efficiency data that end (or start) inside the curve with their highest value there: no BEP, the data's end named", () => {
    const pts = (eta: (number | undefined)[]) => [0.01, 0.02, 0.03, 0.04].map((flow, i) => ({ flow, head: 40 - 500 * flow, ...(eta[i] === undefined ? {} : { efficiency: eta[i] }) }));
    const end = createPumpCurve({ points: pts([0.6, 0.7, 0.75, undefined]) });
    expect(end.bep).toBeNull();
    // 0.03 m³/s = 108 m³/h, 0.04 m³/s = 144 m³/h, 0.02 m³/s = 72.0 m³/h, 0.01 m³/s = 36.0 m³/h (definition)
    expect(messages(end.warnings)).toContain("BEP not published (efficiency highest at its last value, 108 m³/h, where its data end before the curve's end 144 m³/h: the peak may lie past it): no BEP position or preferred operating region is judged");
    const start = createPumpCurve({ points: pts([undefined, 0.75, 0.7, 0.6]) });
    expect(start.bep).toBeNull();
    expect(messages(start.warnings)).toContain("BEP not published (efficiency highest at its first value, 72.0 m³/h, where its data start after the curve's first flow 36.0 m³/h: the peak may lie before it): no BEP position or preferred operating region is judged");
  });
  it("an interior peak is the BEP, POR 70–120 % of its flow (ANSI/HI 9.6.3, from memory)", () => {
    const c = createPumpCurve({ points: [{ flow: 0.01, head: 40, efficiency: 0.6 }, { flow: 0.02, head: 30, efficiency: 0.75 }, { flow: 0.03, head: 20, efficiency: 0.7 }] });
    expect(c.bep).toEqual({ flow: 0.02, head: 30, efficiency: 0.75 });
    expect(c.por!.min).toBeCloseTo(0.014, 15);
    expect(c.por!.max).toBeCloseTo(0.024, 15);
    expect(c.warnings.map((w) => w.code)).not.toContain("bep-not-published");
  });
  it("every demo curve keeps its BEP: the highest efficiency point, interior (fixtures/demo, invented data)", () => {
    const sets = demoCurveInputs();
    expect(sets.length).toBeGreaterThan(100);
    for (const s of sets) {
      const c = createPumpCurve(s.curve);
      const withEta = s.curve.points.filter((p: PumpPoint) => p.efficiency !== undefined && p.efficiency > 0);
      const top = withEta.reduce((a, b) => (b.efficiency! > a.efficiency! ? b : a));
      expect(c.bep, s.id).not.toBeNull();
      expect(c.bep!.flow, s.id).toBe(top.flow);
      expect(c.bep!.efficiency, s.id).toBe(top.efficiency);
    }
  });
});
