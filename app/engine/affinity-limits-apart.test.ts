// The speed solve's answer where the speed limits (not a curve end it reaches) decide: the duty, the pump's head at the
// duty flow at the speed limit that binds (or the curve's flow range there) and the limit, the pump's figure read apart
// from the duty's in SI and US units. It said "duty head is above the curve even at the highest allowed speed", "duty
// flow falls outside the curve at every allowed speed" or "duty needs a speed below the lowest allowed", with no number.
// Check values: hand algebra with the affinity laws (Q ∝ N, H ∝ N², common practice) on the made-up knot curve
// H = 20 − 0.02·Q² m (Q in m³/h, knots every 5 m³/h; app/engine/test/curves.ts, not any vendor's).
import { describe, expect, it } from "vitest";
import { createPumpCurve, headAt, speedForDuty, trimForDuty } from "./index.ts";
import { renderQuantities } from "./quantityText.ts";
import { UNIT_SYSTEMS } from "./units.ts";
import { knotCurve, M3H } from "./test/curves.ts";

const NUM = String.raw`(\d+(?:\.\d+)?)`;
const UNITS = Object.entries(UNIT_SYSTEMS);
// The knot curve from 5 m³/h on (19.5 m there, made up): at 30 % speed it starts at 1.5 m³/h (Q ∝ N).
const fromFive = createPumpCurve({ points: [5, 10, 15, 20].map((q) => ({ flow: q * M3H, head: 20 - 0.02 * q * q })) });

describe("a duty head the speed limits bound", () => {
  it("18 m × (1 + 1e-6) at 10 m³/h, above the 18 m the pump gives there at full speed (100 %): the pump's head reads below the duty's", () => {
    const sol = speedForDuty(knotCurve(), { flow: 10 * M3H, head: 18 * (1 + 1e-6) }, { min: 0.3, max: 1 });
    expect(sol.status).toBe("duty-above-curve");
    for (const [name, units] of UNITS) {
      const t = renderQuantities(sol.message, units);
      const m = t.match(new RegExp(`^the duty head ${NUM} (?:m|ft) at ${NUM} (?:m³/h|gpm) is above the curve even at the highest allowed speed, 100 %: there the pump gives ${NUM} (?:m|ft) at this flow$`));
      expect(m, `${name}: ${t}`).not.toBeNull();
      expect(Number(m![3]), `${name}: ${t}`).toBeLessThan(Number(m![1]));
    }
    expect(renderQuantities(sol.message, UNIT_SYSTEMS.SI)).toContain("at 10.0 m³/h"); // the duty flow
  });
  it("at a highest allowed speed of 90 %: the pump's 0.81 × 18 = 14.58 m there, below a duty of 14.58 m × (1 + 1e-6)", () => {
    const sol = speedForDuty(knotCurve(), { flow: 9 * M3H, head: 14.58 * (1 + 1e-6) }, { min: 0.3, max: 0.9 });
    expect(sol.status).toBe("duty-above-curve");
    const m = renderQuantities(sol.message, UNIT_SYSTEMS.SI).match(new RegExp(`^the duty head ${NUM} m at 9\\.00 m³/h is above the curve even at the highest allowed speed, 90 %: there the pump gives ${NUM} m`));
    expect(m, sol.message).not.toBeNull();
    expect(Number(m![2])).toBeLessThan(Number(m![1]));
    expect(Number(m![2])).toBeCloseTo(14.58, 3);
  });
  it("a duty just below the head at the lowest allowed speed (70 %, 13 m³/h): the pump's head there reads above the duty's", () => {
    // At 70 %: 13/0.7 = 18.57 m³/h on the curve, 0.49 × H(18.57) ≈ 6.4 m (hand algebra); the duty 1e-6 below it.
    const h70 = 0.49 * headAt(knotCurve(), (13 / 0.7) * M3H)!;
    expect(h70).toBeGreaterThan(6.3);
    expect(h70).toBeLessThan(6.5);
    const sol = speedForDuty(knotCurve(), { flow: 13 * M3H, head: h70 * (1 - 1e-6) }, { min: 0.7, max: 1 });
    expect(sol.status).toBe("duty-below-limit");
    for (const [name, units] of UNITS) {
      const t = renderQuantities(sol.message, units);
      const m = t.match(new RegExp(`^the duty head ${NUM} (?:m|ft) at ${NUM} (?:m³/h|gpm) needs a speed below the lowest allowed, 70 %: there the pump gives ${NUM} (?:m|ft) at this flow, more than the duty's$`));
      expect(m, `${name}: ${t}`).not.toBeNull();
      expect(Number(m![3]), `${name}: ${t}`).toBeGreaterThan(Number(m![1]));
    }
  });
});

describe("a duty flow off the curve at every allowed speed", () => {
  it("20 m³/h × (1 + 1e-6) past the curve's end, 20 m³/h at full speed: the duty flow reads past it", () => {
    const sol = speedForDuty(knotCurve(), { flow: 20 * M3H * (1 + 1e-6), head: 5 }, { min: 0.3, max: 1 });
    expect(sol.status).toBe("outside-curve");
    for (const [name, units] of UNITS) {
      const t = renderQuantities(sol.message, units);
      const m = t.match(new RegExp(`^the duty flow ${NUM} (?:m³/h|gpm) lies past the curve's end at every allowed speed: at the highest, 100 %, the curve spans 0\\.000 (?:m³/h|gpm)–${NUM} (?:m³/h|gpm)$`));
      expect(m, `${name}: ${t}`).not.toBeNull();
      expect(Number(m![1]), `${name}: ${t}`).toBeGreaterThan(Number(m![2]));
    }
  });
  it("1.5 m³/h × (1 − 1e-6) before the first point of the curve from 5 m³/h, which starts at 1.5 m³/h at the lowest speed, 30 %", () => {
    const sol = speedForDuty(fromFive, { flow: 1.5 * M3H * (1 - 1e-6), head: 1 }, { min: 0.3, max: 1 });
    expect(sol.status).toBe("outside-curve");
    for (const [name, units] of UNITS) {
      const t = renderQuantities(sol.message, units);
      const m = t.match(new RegExp(`^the duty flow ${NUM} (?:m³/h|gpm) lies before the curve's first point at every allowed speed: at the lowest, 30 %, the curve spans ${NUM} (?:m³/h|gpm)–${NUM} (?:m³/h|gpm) \\(${NUM} (?:m³/h|gpm) as published at 100 %\\)$`));
      expect(m, `${name}: ${t}`).not.toBeNull();
      expect(Number(m![1]), `${name}: ${t}`).toBeLessThan(Number(m![2]));
    }
    expect(renderQuantities(sol.message, UNIT_SYSTEMS.SI)).toMatch(/–6\.00 m³\/h \(5\.00 m³\/h as published at 100 %\)$/); // 0.3 × 20 m³/h
  });
});

// The trim solve, with the same words for its limits (the full diameter, the smallest diameter searched): it said "duty
// head is above the full-diameter curve: trimming cannot help", "duty flow falls outside the curve at every trim" or "duty
// needs a trim beyond the searched range", with no number. Trim laws (approximate, common practice): linear Q ∝ D,
// square Q ∝ D², H ∝ D² for both.
describe("the trim solve where the diameters searched bound the duty", () => {
  it("18 m × (1 + 1e-6) at 10 m³/h, above the 18 m the full diameter gives there: the pump's head reads below the duty's", () => {
    const sol = trimForDuty(knotCurve(), { flow: 10 * M3H, head: 18 * (1 + 1e-6) });
    expect(sol.status).toBe("duty-above-curve");
    for (const [name, units] of UNITS) {
      const t = renderQuantities(sol.message, units);
      const m = t.match(new RegExp(`^the duty head ${NUM} (?:m|ft) at ${NUM} (?:m³/h|gpm) is above the curve even at the full diameter, 100 %: there the pump gives ${NUM} (?:m|ft) at this flow; trimming cannot help$`));
      expect(m, `${name}: ${t}`).not.toBeNull();
      expect(Number(m![3]), `${name}: ${t}`).toBeLessThan(Number(m![1]));
    }
  });
  for (const [law, q, s] of [["linear", 13, 0.7], ["square", 5, 0.8]] as const) {
    it(`${law} law: a duty just below the head at the smallest diameter searched (${s * 100} %, ${q} m³/h) reads below the pump's there`, () => {
      // At ratio s the curve gives s² × H(Q / s^k) at Q (k = 1 linear, 2 square; hand algebra); the duty 1e-6 below it.
      const k = law === "linear" ? 1 : 2;
      const h = s * s * headAt(knotCurve(), (q / s ** k) * M3H)!;
      const sol = trimForDuty(knotCurve(), { flow: q * M3H, head: h * (1 - 1e-6) }, { law, minRatio: s });
      expect(sol.status).toBe("duty-below-limit");
      for (const [name, units] of UNITS) {
        const t = renderQuantities(sol.message, units);
        const m = t.match(new RegExp(`^the duty head ${NUM} (?:m|ft) at ${NUM} (?:m³/h|gpm) needs a diameter below the smallest searched, ${s * 100} %: there the pump gives ${NUM} (?:m|ft) at this flow, more than the duty's$`));
        expect(m, `${name}: ${t}`).not.toBeNull();
        expect(Number(m![3]), `${name}: ${t}`).toBeGreaterThan(Number(m![1]));
      }
    });
  }
  it("20 m³/h × (1 + 1e-6), past the curve's end (20 m³/h) at the full diameter: the duty flow reads past it", () => {
    const sol = trimForDuty(knotCurve(), { flow: 20 * M3H * (1 + 1e-6), head: 5 });
    expect(sol.status).toBe("outside-curve");
    for (const [name, units] of UNITS) {
      const t = renderQuantities(sol.message, units);
      const m = t.match(new RegExp(`^the duty flow ${NUM} (?:m³/h|gpm) lies past the curve's end at every diameter searched: at the full diameter, 100 %, the curve spans 0\\.000 (?:m³/h|gpm)–${NUM} (?:m³/h|gpm)$`));
      expect(m, `${name}: ${t}`).not.toBeNull();
      expect(Number(m![1]), `${name}: ${t}`).toBeGreaterThan(Number(m![2]));
    }
  });
  it("square law: 1.25 m³/h × (1 − 1e-6), before the first point of the curve from 5 m³/h at 50 % (5 × 0.5² = 1.25 m³/h)", () => {
    const sol = trimForDuty(fromFive, { flow: 1.25 * M3H * (1 - 1e-6), head: 1 }, { law: "square", minRatio: 0.5 });
    expect(sol.status).toBe("outside-curve");
    for (const [name, units] of UNITS) {
      const t = renderQuantities(sol.message, units);
      const m = t.match(new RegExp(`^the duty flow ${NUM} (?:m³/h|gpm) lies before the curve's first point at every diameter searched: at the smallest searched, 50 %, the curve spans ${NUM} (?:m³/h|gpm)–${NUM} (?:m³/h|gpm) \\(${NUM} (?:m³/h|gpm) as published at 100 %\\)$`));
      expect(m, `${name}: ${t}`).not.toBeNull();
      expect(Number(m![1]), `${name}: ${t}`).toBeLessThan(Number(m![2]));
    }
    expect(renderQuantities(sol.message, UNIT_SYSTEMS.SI)).toMatch(/–5\.00 m³\/h \(5\.00 m³\/h as published at 100 %\)$/); // 20 m³/h × 0.5²
  });
});
