// The transition warning of a system curve, judged from the band's own flows (Q = Re·ν·π·D/4 at Re 2000 and 4000),
// not from the first grid flow that fell in it. Check values: Re = 4Q/(π·D·ν) (definition); water's ν at 0 °C
// 1.7918e-6 m²/s and 20 °C 1.0034e-6 m²/s (IAPWS, the engine's fluids.ts); the default system's suction run, 5 m of
// 0.1 m steel (app/lib/projects/system-input.ts).
import { describe, expect, it } from "vitest";
import { fluidAt } from "./fluids.ts";
import { systemCurve, type SystemSpec } from "./system.ts";
import { TRANSITION_DUTY_FRACTION, transitionFlows } from "./transitionText.ts";
import { inSI } from "./quantityText.ts";

const spec = (tC: number, method?: SystemSpec["frictionMethod"]): SystemSpec => ({
  fluid: fluidAt({ kind: "water" }, tC),
  staticHead: 10,
  suction: [{ name: "Suction line", length: 5, diameter: 0.1, roughness: 0.045e-3 }],
  frictionMethod: method,
});
const transition = (s: SystemSpec, points: number, duty?: number) =>
  systemCurve(s, { flowMax: 0.016, points, duty }).warnings.filter((w) => w.code === "transition-flow").map((w) => inSI(w.message));

// The duty flow at a Reynolds number in the default suction run (Q = Re·ν·π·D/4), m³/s.
const dutyAtRe = (re: number, tC: number) => (re * fluidAt({ kind: "water" }, tC).kinematicViscosity * Math.PI * 0.1) / 4;

describe("the transition warning over a system curve", () => {
  it("names the band's flows and says the duty is above it (0 °C, duty at Re 6000: the band's top is 2/3 of it)", () => {
    const nu = fluidAt({ kind: "water" }, 0).kinematicViscosity;
    const low = (2000 * nu * Math.PI * 0.1) / 4, high = (4000 * nu * Math.PI * 0.1) / 4; // Q = Re·ν·π·D/4
    const duty = dutyAtRe(6000, 0);
    const [w, ...rest] = transition(spec(0), 41, duty);
    expect(rest).toEqual([]);
    // The SI preset shows flow in m³/h: 2.815e-4 m³/s = 1.01 m³/h, 5.63e-4 m³/s = 2.03 m³/h.
    expect(low * 3600).toBeCloseTo(1.01, 2);
    expect(high * 3600).toBeCloseTo(2.03, 2);
    expect(w).toMatch(/^Suction line: flows from 1\.01 m³\/h to 2\.03 m³\/h \(Re 2000–4000, Q = Re·ν·π·D\/4 with D = 100 mm\) are in the laminar–turbulent transition/);
    expect(w).toContain("the duty flow 3.04 m³/h (Re = 6000) is above it, turbulent: only the curve below 2.03 m³/h (66.7 % of the duty flow; warned from 50 % of it) is affected.");
  });
  it("with the duty far above the band there is none: the default suction run at 0 °C, duty 0.01 m³/s at Re ≈ 71 000 (the edge hunt's case, warned 'Re = 2842' at the grid's first flow)", () => {
    const nu = fluidAt({ kind: "water" }, 0).kinematicViscosity;
    expect(Math.round((4 * 0.01) / (Math.PI * 0.1 * nu))).toBe(71050); // the duty's Re, as the edge hunt found it
    for (const n of [2, 41, 1000]) expect(transition(spec(0), n, 0.01)).toEqual([]);
    // Without a duty, a curve from zero flow crosses the band: warned.
    expect(transition(spec(0), 41)).toHaveLength(1);
  });
  it(`flips where the band's top (Re 4000) is ${TRANSITION_DUTY_FRACTION * 100} % of the duty flow: duty at Re 8000 × (1 ∓ 1e-6)`, () => {
    expect(transition(spec(20), 41, dutyAtRe(8000 * (1 - 1e-6), 20))).toHaveLength(1);
    expect(transition(spec(20), 41, dutyAtRe(8000 * (1 + 1e-6), 20))).toEqual([]);
  });
  it("is the same whatever the grid: 41 points at 0 °C and at 20 °C (the grid's first flow was in the band at 0 °C only), 2, 7 and 1000 points", () => {
    for (const t of [0, 20]) {
      const duty = dutyAtRe(6000, t);
      const ref = transition(spec(t), 41, duty);
      expect(ref).toHaveLength(1);
      for (const n of [2, 7, 1000]) expect(transition(spec(t), n, duty)).toEqual(ref);
    }
  });
  it("a duty in the band is said to be in it, and the method's figures are at its Re", () => {
    const [w] = transition(spec(20), 41, dutyAtRe(3000, 20));
    expect(w).toContain("(Re = 3000) is in it.");
    expect(w).toContain("At Re = 3000 (the duty): Colebrook");
  });
  it("Churchill away from the duty: judged at the band's lowest Re drawn (2000), where it is below the turbulent value", () => {
    const [w] = transition(spec(20, "churchill"), 41, dutyAtRe(6000, 20));
    expect(w).toContain("At Re = 2000: Churchill");
    expect(w).toContain("not the conservative side");
  });
  it("a curve that ends below the band has none (the band starts at 0.000158 m³/s at 20 °C)", () => {
    const c = systemCurve(spec(20), { flowMax: 0.00015, points: 41 });
    expect(c.warnings.filter((w) => w.code === "transition-flow")).toEqual([]);
  });
});

describe("a duty exactly at an end of the band (Re 2000 or 4000, as transitionFlows gives them)", () => {
  // Re 4000 is turbulent and Re 2000 laminar (headLoss.ts: 64/Re up to 2000, turbulent from 4000): a duty there is at the
  // band's end, not past it. Was "is above it" / "is below it" at the very end.
  const nu = fluidAt({ kind: "water" }, 20).kinematicViscosity;
  const { low, high } = transitionFlows(0.1, nu);
  it("at the top end: 'is at its top end, turbulent'; a hair above: 'is above it'", () => {
    expect(transition(spec(20), 41, high)[0]).toMatch(/\(Re = 4000\) is at its top end, turbulent: only the curve below/);
    expect(transition(spec(20), 41, high * (1 + 1e-6))[0]).toMatch(/\(Re = 4000\.0\d*\) is above it, turbulent/);
  });
  it("at the bottom end: 'is at its bottom end, laminar'; a hair below: 'is below it'", () => {
    expect(transition(spec(20), 41, low)[0]).toMatch(/\(Re = 2000\) is at its bottom end, laminar \(64\/Re\)/);
    expect(transition(spec(20), 41, low * (1 - 1e-6))[0]).toMatch(/\(Re = 1999\.99\d*\) is below it, laminar/);
  });
});
