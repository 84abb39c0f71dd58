// A pump's water curve on a viscous liquid, and catalogue fittings at low Reynolds number (pure). Check values:
// ANSI/HI 9.6.7 (from memory: B above 1 needs a viscosity correction), the laminar limit Re 2000 (common practice),
// and the product's rules (app/engine/verdict.ts).
import { describe, expect, it } from "vitest";
import { generateDemo, type DemoCurve } from "../../../fixtures/demo/generate";
import { demoSystems } from "../../cli/demo-systems";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, evaluateCandidate, evaluateSystem, type SystemInput } from "./hydraulics";
import { bisection } from "~/engine";
import { inSI } from "~/engine/quantityText";

const M3H = 1 / 3600;
const custom = (mu: number): SystemInput => ({ ...defaultSystemInput(), fluid: { kind: "custom", name: "oil", density: 900, dynamicViscosity: mu, vaporPressure: 100 } });
// The hunt's water-test curve (invented): 10 L/s at 20 m-ish, BEP near 0.011 m³/s, 2900 rpm.
const huntCurve = {
  speed: 2900, impellerDiameter: null,
  points: [0, 0.004, 0.008, 0.012, 0.016].map((q) => ({ flow: q, head: 32 - 40000 * q * q, efficiency: q === 0 ? 0 : 0.75 * (1 - ((q - 0.011) / 0.011) ** 2), power: null, npshr: 1 + 10000 * q * q })),
};
const onOil = (mu: number) => evaluateCandidate(custom(mu), huntCurve, DEFAULT_ADJUSTMENT);
const viscWarning = /ANSI\/HI 9\.6\.7 parameter B/;
const fittingsWarning = /catalogue fittings' K values/;

describe("a water curve on a viscous liquid (ANSI/HI 9.6.7 parameter B)", () => {
  it("oil 0.5 Pa·s: not 'meets' but viscosity-uncorrected, with B and the rule in a warning", () => {
    const r = onOil(0.5);
    expect(r.viscosityB!).toBeGreaterThan(10); // ν 556 cSt on a 40 m³/h, 2900 rpm pump: B ≈ 16 (viscous.test.ts by hand)
    expect(r.verdict!.status).toBe("viscosity-uncorrected");
    expect(r.verdict!.reasons[0]).toMatch(/not corrected for viscosity: this pump cannot be signed off as is/);
    expect(r.verdict!.reasons[1]).toMatch(/^On the water curve \(meets the duty\)/);
    const w = r.warnings.map((x) => inSI(x)).find((x) => viscWarning.test(x))!;
    expect(w).toMatch(/B = 15\.8\d \(above 1: correction needed\) for oil \(ν 556 cSt\) at its water BEP/);
  });

  it("flips at B = 1: a viscosity a hair below gives 'meets' and no warning, a hair above the qualified verdict", () => {
    // Near 2 cSt the hunt's curve runs further out: one more point (0.02 m³/s) and a duty of 0.017 m³/s it meets on water.
    const longer = { ...huntCurve, points: [...huntCurve.points, { flow: 0.02, head: 32 - 40000 * 0.02 ** 2, efficiency: 0.75 * (1 - (0.009 / 0.011) ** 2), power: null, npshr: 5 }] };
    const at = (mu: number) => evaluateCandidate({ ...custom(mu), duty: { flow: 0.017, head: 15 } }, longer, DEFAULT_ADJUSTMENT);
    const mu1 = bisection((mu) => at(mu).viscosityB! - 1, 1e-4, 0.01, 1e-13)!.x;
    const below = at(mu1 * (1 - 1e-6)), above = at(mu1 * (1 + 1e-6));
    expect(below.viscosityB!).toBeLessThanOrEqual(1);
    expect(below.verdict!.status).toBe("meets");
    expect(below.warnings.some((x) => viscWarning.test(x))).toBe(false);
    expect(above.verdict!.status).toBe("viscosity-uncorrected");
    expect(above.warnings.some((x) => viscWarning.test(x))).toBe(true);
  });

  it("a curve without a speed: no B, and a warning that the curve was not checked for the liquid", () => {
    const r = evaluateCandidate(custom(0.5), { ...huntCurve, speed: null as unknown as number }, DEFAULT_ADJUSTMENT);
    expect(r.viscosityB).toBeNull();
    expect(r.warnings.join(" ")).toMatch(/not checked for oil \(ν 556 cSt\): the ANSI\/HI 9\.6\.7 parameter B needs the pump's speed/);
  });
});

describe("catalogue fittings at low Reynolds number", () => {
  it("flips at Re 2000 in the run that has fittings, naming the run and its Re", () => {
    const re = (mu: number) => evaluateSystem(custom(mu)).runs.find((r) => r.name === "Rising main")!.reynolds;
    const mu1 = bisection((mu) => re(mu) - 2000, 1e-3, 0.5, 1e-14)!.x;
    const below = evaluateSystem(custom(mu1 * (1 + 1e-6))).runs.find((r) => r.name === "Rising main")!; // more viscous: Re below 2000
    const above = evaluateSystem(custom(mu1 * (1 - 1e-6))).runs.find((r) => r.name === "Rising main")!;
    expect(below.reynolds).toBeLessThan(2000);
    expect(below.warnings.find((w) => fittingsWarning.test(w))).toMatch(/^Rising main: Re 1999\.99\d* at the duty flow is below 2000 \(laminar\)/);
    expect(above.warnings.some((w) => fittingsWarning.test(w))).toBe(false);
  });
  it("the hunt's case: Re 229 in both runs; a run without fittings says nothing", () => {
    const input = custom(0.5);
    input.runs = input.runs.map((r) => (r.side === "suction" ? { ...r, fittings: [] } : r));
    const runs = evaluateSystem(input).runs;
    expect(runs.find((r) => r.side === "suction")!.warnings.some((w) => fittingsWarning.test(w))).toBe(false);
    expect(runs.find((r) => r.name === "Rising main")!.warnings.join(" ")).toMatch(/Rising main: Re 229 at the duty flow/);
  });
});

describe("water is the curve's own liquid: nothing new on the demo systems", () => {
  const curves: DemoCurve[] = generateDemo().flatMap((d) => d.curves).filter((_, i) => i % 4 === 0);
  const si = (c: DemoCurve) => ({ speed: c.speed, impellerDiameter: c.impellerMm / 1000,
    points: c.points.map((p) => ({ flow: p.flowM3h * M3H, head: p.headM, efficiency: p.effPct / 100, power: p.powerKw * 1000, npshr: p.npshrM })) });
  const systems = [...demoSystems().map((d) => d.input), defaultSystemInput()];
  it("no viscosity warning, no B, no qualified verdict, and no low-Re fittings warning", () => {
    let judged = 0;
    for (const input of systems) {
      for (const run of evaluateSystem(input).runs) expect(run.warnings.filter((w) => fittingsWarning.test(w))).toEqual([]);
      for (const c of curves) {
        for (const method of ["none", "speed"] as const) {
          let r;
          try { r = evaluateCandidate(input, si(c), { ...DEFAULT_ADJUSTMENT, method }); } catch { continue; }
          judged++;
          expect(r.viscosityB).toBeNull();
          expect(r.warnings.filter((w) => viscWarning.test(w) || /not checked for/.test(w))).toEqual([]);
          expect(r.verdict?.status).not.toBe("viscosity-uncorrected");
        }
      }
    }
    expect(judged).toBeGreaterThan(100);
  });
});
