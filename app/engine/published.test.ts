/**
 * Tier 1 — published values. Each check names its source beside it; tolerances fit the
 * printed precision unless stated otherwise (and then the reason is given).
 */
import { describe, expect, it } from "vitest";
import {
  FACTORS, CRANE_FT, colebrook, churchill, fittingK, frictionFactor, fromSI, haaland, hazenWilliamsHeadLoss,
  innerDiameter, pipeHeadLoss, swameeJain, systemHead, toSI, waterProperties, customFluid, G0,
} from "./index.ts";

describe("common practice, worked example: 0.1 m³/s of water at 15.6 °C through 100 m of 200 mm cast iron", () => {
  // Source: common practice, worked example (ν = 1.12e-6 m²/s, ε = 0.26 mm for cast iron from
  // Moody's roughness table, from memory). Printed: V ≈ 3.18 m/s, Re ≈ 5.7e5, f ≈ 0.021 (Moody
  // chart; Colebrook gives 0.0214), hf ≈ 5.4–5.5 m, Δp to lift it 100 m ≈ 1033 kPa (γ = 9800 N/m³).
  const r = pipeHeadLoss({ flow: 0.1, diameter: 0.2, length: 100, roughness: 0.26e-3, kinematicViscosity: 1.12e-6 });

  it("velocity ≈ 3.18 m/s (printed to 0.01)", () => {
    expect(Math.abs(r.velocity - 3.18)).toBeLessThan(0.005);
  });
  it("Reynolds number ≈ 5.7e5 (printed to 2 significant figures)", () => {
    expect(Math.abs(r.reynolds - 5.7e5)).toBeLessThan(0.05e5);
    expect(r.regime).toBe("turbulent");
  });
  it("Colebrook f ≈ 0.0214 (printed to 3 significant figures); Moody chart reading ≈ 0.021", () => {
    expect(Math.abs(r.frictionFactor - 0.0214)).toBeLessThan(0.00005);
    expect(Math.abs(r.frictionFactor - 0.021)).toBeLessThan(0.0005);
  });
  it("hf ≈ 5.4–5.5 m (the printed range comes from f ≈ 0.021; Colebrook's 0.0214 gives 5.53 m, so the band is 5.4–5.55)", () => {
    expect(r.headLoss).toBeGreaterThan(5.4);
    expect(r.headLoss).toBeLessThan(5.55);
  });
  it("Δp to lift it 100 m ≈ 1033 kPa with γ = 9800 N/m³ (printed to 1 kPa; ±2 kPa covers the hf band above)", () => {
    // Build the same case as a system: 100 m static, the pipe on the discharge side, no minor losses.
    const fluid = customFluid("water 15.6 °C (worked example)", 9800 / G0, 1.12e-6 * (9800 / G0), 1772);
    const sys = systemHead({ fluid, staticHead: 100, discharge: [{ length: 100, diameter: 0.2, roughness: 0.26e-3 }] }, 0.1);
    const dpKPa = (9800 * sys.head) / 1000;
    expect(Math.abs(dpKPa - 1033)).toBeLessThan(2);
    expect(Math.abs(sys.pressure / 1000 - dpKPa)).toBeLessThan(1e-9 * dpKPa); // ρ·g₀ = γ here
  });
});

describe("friction factors: references.md table (python3-fluids 1.0.22, printed to 7 decimals → ±5e-8)", () => {
  // Sources: Colebrook 1939; Swamee & Jain 1976; Haaland 1983; Churchill 1977 — values as
  // printed in references.md from python3-fluids 1.0.22.
  const rows: [number, number, number, number | null, number, number][] = [
    [1e5, 1e-4, 0.0185139, 0.0184524, 0.0182651, 0.0184626],
    [1e6, 1e-3, 0.0199435, 0.0200292, 0.0199412, 0.020022],
    [5e3, 0, 0.0373927, null, 0.0377299, 0.0378872],
    [1e7, 1e-5, 0.0089957, 0.0090585, 0.008958, 0.0090589],
  ];
  const tol = 5e-8 + 1e-12;
  for (const [re, ed, cb, sj, ha, ch] of rows) {
    it(`Re = ${re}, ε/D = ${ed}`, () => {
      expect(Math.abs(colebrook(re, ed) - cb)).toBeLessThan(tol);
      expect(Math.abs(frictionFactor(re, ed) - cb)).toBeLessThan(tol);
      if (sj !== null) expect(Math.abs(swameeJain(re, ed) - sj)).toBeLessThan(tol);
      expect(Math.abs(haaland(re, ed) - ha)).toBeLessThan(tol);
      expect(Math.abs(churchill(re, ed) - ch)).toBeLessThan(tol);
    });
  }
  it("laminar f = 64/Re (Hagen-Poiseuille)", () => {
    expect(frictionFactor(1000, 0.01)).toBe(0.064);
  });
});

describe("water: references.md table (IAPWS-95 via python3-iapws)", () => {
  // Source: references.md (IAPWS R6-95 density, R12-08 viscosity). Printed to 6 significant
  // figures; our density is IAPWS-IF97 region 1, whose stated agreement with IAPWS-95 here is
  // 2e-5 relative (see fluids.ts), and viscosity 5e-5 relative: those are the tolerances.
  const rows: [number, number, number, number][] = [
    [15.6, 999.01, 1.11973e-3, 1.12084e-6],
    [20, 998.207, 1.0016e-3, 1.0034e-6],
    [60, 983.196, 4.66035e-4, 4.74e-7],
  ];
  for (const [t, rho, mu, nu] of rows) {
    it(`${t} °C`, () => {
      const w = waterProperties(t);
      expect(Math.abs(w.density / rho - 1)).toBeLessThan(2e-5);
      expect(Math.abs(w.dynamicViscosity / mu - 1)).toBeLessThan(5e-5);
      expect(Math.abs(w.kinematicViscosity / nu - 1)).toBeLessThan(5e-5);
    });
  }
  it("vapour pressure 20 °C 2.3393 kPa, 60 °C 19.9464 kPa (references.md; these printed values match IAPWS-95's saturation line — IF97 differs by < 8e-5 relative, our tolerance)", () => {
    expect(Math.abs(waterProperties(20).vaporPressure / 2339.3 - 1)).toBeLessThan(8e-5);
    expect(Math.abs(waterProperties(60).vaporPressure / 19946.4 - 1)).toBeLessThan(8e-5);
  });
  it("boils near 100 °C at one standard atmosphere (IAPWS-IF97: T_sat(101.325 kPa) = 372.76 K, from memory)", () => {
    expect(waterProperties(99.9).vaporPressure).toBeLessThan(101325);
    expect(waterProperties(100).vaporPressure).toBeGreaterThan(101325);
  });
});

describe("units: exact factors (NIST SP 811, references.md)", () => {
  it("1 ft = 0.3048 m, 1 in = 0.0254 m", () => {
    expect(toSI("length", "ft", 1)).toBe(0.3048);
    expect(toSI("diameter", "in", 1)).toBe(0.0254);
  });
  it("1 gpm = 6.30901964e-5 m³/s (printed to 9 significant figures)", () => {
    expect(Math.abs(toSI("flow", "gpm", 1) - 6.30901964e-5)).toBeLessThan(5e-14);
  });
  it("1 psi = 6894.757 Pa (printed to 7 significant figures)", () => {
    expect(Math.abs(toSI("pressure", "psi", 1) - 6894.757)).toBeLessThan(5e-4);
  });
  it("1 hp = 745.69987 W (printed to 8 significant figures)", () => {
    expect(Math.abs(toSI("power", "hp", 1) - 745.69987)).toBeLessThan(5e-6);
  });
  it("°F ↔ °C exact: 212 °F = 100 °C, −40 °F = −40 °C (definition)", () => {
    expect(toSI("temperature", "F", 212)).toBeCloseTo(100, 12);
    expect(fromSI("temperature", "F", -40)).toBeCloseTo(-40, 12);
  });
  it("1 US gal = 3.785411784 L exactly (NIST SP 811)", () => {
    expect(FACTORS.US_GALLON).toBe(3.785411784e-3);
    expect(toSI("flow", "m3/h", 3600)).toBe(1);
  });
});

describe("pipe catalogue: Schedule 40 steel IDs (references.md, ASME B36.10M from memory, mm)", () => {
  // references.md derives ID from metric OD/wall rounded to 0.1 mm / 0.01 mm; ours from the inch
  // dimensions. Tolerance 0.06 mm covers that rounding.
  const rows: [string, number][] = [["1", 26.64], ["2", 52.5], ["3", 77.92], ["4", 102.26], ["6", 154.08], ["8", 202.74], ["10", 254.46], ["12", 303.18]];
  for (const [nps, id] of rows) {
    it(`NPS ${nps}" → ${id} mm`, () => {
      expect(Math.abs(innerDiameter("steel-sch40", nps) * 1000 - id)).toBeLessThan(0.06);
    });
  }
});

describe("fittings: Crane TP-410 K = n·fT (references.md, from memory)", () => {
  it("fT table: 1\" 0.023, 2\" 0.019, 4\" 0.017, 6\" 0.015, 8–10\" 0.014, 12–16\" 0.013", () => {
    expect([CRANE_FT["1"], CRANE_FT["2"], CRANE_FT["4"], CRANE_FT["6"], CRANE_FT["8"], CRANE_FT["10"], CRANE_FT["12"], CRANE_FT["16"]])
      .toEqual([0.023, 0.019, 0.017, 0.015, 0.014, 0.014, 0.013, 0.013]);
  });
  it("4\" fittings: elbow 30 fT, 45° 16 fT, gate 8 fT, globe 340 fT, swing check 100 fT, tee run 20 fT (Crane TP-410)", () => {
    const d = innerDiameter("steel-sch40", "4");
    const k = (id: string) => fittingK(id, d, "4") / 0.017;
    expect(k("elbow-90-standard")).toBeCloseTo(30, 10);
    expect(k("elbow-45-standard")).toBeCloseTo(16, 10);
    expect(k("gate-valve-open")).toBeCloseTo(8, 10);
    expect(k("globe-valve-open")).toBeCloseTo(340, 10);
    expect(k("swing-check")).toBeCloseTo(100, 10);
    expect(k("tee-run")).toBeCloseTo(20, 10);
  });
  it("entrance (sharp) K = 0.5, exit K = 1.0 (common practice)", () => {
    expect(fittingK("entrance-sharp", 0.1)).toBe(0.5);
    expect(fittingK("exit", 0.1)).toBe(1);
  });
});

describe("Hazen-Williams (SI form, references.md, common practice)", () => {
  it("hf = 10.67·L·Q^1.852/(C^1.852·D^4.87): 1 km of 0.3 m pipe, C = 130, 0.1 m³/s", () => {
    // Evaluated by hand from the printed formula: 10.67·1000·0.1^1.852/(130^1.852·0.3^4.87).
    const byHand = (10.67 * 1000 * 0.1 ** 1.852) / (130 ** 1.852 * 0.3 ** 4.87);
    expect(hazenWilliamsHeadLoss(0.1, 0.3, 1000, 130)).toBeCloseTo(byHand, 12);
    // Order of magnitude check against Darcy-Weisbach for new ductile iron (ε ≈ 0.1 mm): within 15 %.
    const dw = pipeHeadLoss({ flow: 0.1, diameter: 0.3, length: 1000, roughness: 0.1e-3, kinematicViscosity: 1.0e-6 }).headLoss;
    expect(Math.abs(byHand / dw - 1)).toBeLessThan(0.15);
  });
});
