import { NOT_CITED_REFERENCE } from "./test/not-cited";
/** Tier 3 — friction consistency, regimes and warnings; units and fluids round trips. */
import { describe, expect, it } from "vitest";
import {
  churchill, colebrook, CORRELATIONS, customFluid, EngineInputError, fluidAt, frictionFactor, frictionFactorDetailed,
  FRICTION_METHODS, fromSI, haaland, innerDiameter, material, MATERIALS, PIPE_TABLES, pipeHeadLoss, swameeJain,
  toSI, UNIT_SYSTEMS, UNITS, waterProperties,
} from "./index.ts";

describe("correlations agree where they should", () => {
  const res = [5e3, 1e4, 3e4, 1e5, 1e6, 1e7, 1e8];
  const eds = [1e-6, 1e-5, 1e-4, 1e-3, 1e-2];
  it("inside Re 5e3–1e8 × ε/D 1e-6–1e-2: Haaland within 1.5 % of Colebrook (Haaland 1983 claims about 1.5 %); Swamee-Jain and Churchill within 3 % (we observe 2.8 % at Re 5e3, ε/D 1e-2 — wider than Swamee & Jain's ~1 % claim)", () => {
    for (const re of res) for (const ed of eds) {
      const c = colebrook(re, ed);
      expect(Math.abs(swameeJain(re, ed) / c - 1)).toBeLessThan(0.03);
      expect(Math.abs(haaland(re, ed) / c - 1)).toBeLessThan(0.015);
      expect(Math.abs(churchill(re, ed) / c - 1)).toBeLessThan(0.03);
    }
  });
  it("Churchill reproduces 64/Re in laminar flow (Churchill 1977) to 0.1 %", () => {
    for (const re of [50, 300, 1000, 1800]) expect(Math.abs(churchill(re, 0.001) * re / 64 - 1)).toBeLessThan(1e-3);
  });
  it("f falls with Re and rises with ε/D (Moody chart shape)", () => {
    expect(colebrook(1e6, 1e-4)).toBeLessThan(colebrook(1e5, 1e-4));
    expect(colebrook(1e6, 1e-3)).toBeGreaterThan(colebrook(1e6, 1e-4));
  });
});

describe("regimes and warnings", () => {
  it("laminar below 2000: 64/Re whatever the turbulent method (except Churchill, used as is)", () => {
    for (const m of ["colebrook", "swamee-jain", "haaland"] as const) expect(frictionFactor(1500, 0.01, m)).toBe(64 / 1500);
    expect(frictionFactorDetailed(1500, 0.01, "churchill").method).toBe("churchill");
    expect(frictionFactorDetailed(1500, 0.01).regime).toBe("laminar");
  });
  it("2000 < Re < 4000 is flagged as transition, with the turbulent correlation (higher, conservative)", () => {
    const r = frictionFactorDetailed(3000, 1e-4);
    expect(r.regime).toBe("transition");
    expect(r.warnings.map((w) => w.code)).toContain("transition-flow");
    expect(r.frictionFactor).toBeGreaterThan(64 / 3000);
  });
  it("the transition warning says what each method gives there: turbulent ones the higher f, Churchill about 64/Re near Re 2000", () => {
    const msg = (re: number, m: "colebrook" | "swamee-jain" | "haaland" | "churchill") => frictionFactorDetailed(re, 0, m).warnings.find((w) => w.code === "transition-flow")!.message;
    // Re 2001, smooth: 64/Re = 0.0320; Colebrook 0.0494 (python fluids 1.0.22 Colebrook: 0.04944); Churchill 0.0320 (fluids Churchill_1977 0.03203: about 64/Re there).
    for (const m of ["colebrook", "swamee-jain", "haaland"] as const) {
      expect(msg(2001, m)).toMatch(/above the laminar 64\/Re = 0\.0320, the higher, conservative side/);
    }
    expect(msg(2001, "colebrook")).toContain("f = 0.0494");
    const ch = msg(2001, "churchill");
    expect(ch).toContain("f = 0.0320, against the laminar 64/Re = 0.0320 and Colebrook's turbulent 0.0494: below the turbulent value, so not the conservative side");
    expect(ch).not.toMatch(/, the conservative side|used, conservative/);
    // Re 3999, smooth: Churchill 0.0406 is at or above Colebrook's 0.0399 (python fluids 1.0.22: 0.04059, 0.03991): there the word is true.
    expect(msg(3999, "churchill")).toContain("at or above the turbulent value, the conservative side");
  });
  it("outside a correlation's stated range: a result plus a warning, never silence", () => {
    const r = frictionFactorDetailed(1e5, 0.03, "swamee-jain"); // ε/D above 1e-2
    expect(r.frictionFactor).toBeGreaterThan(0);
    expect(r.warnings.some((w) => w.code === "outside-validity" && /ε\/D/.test(w.message))).toBe(true);
    expect(frictionFactorDetailed(5e8, 1e-4).warnings.some((w) => w.code === "outside-validity")).toBe(true);
    expect(frictionFactorDetailed(1e6, 1e-4).warnings).toEqual([]);
  });
  it("registry: every correlation names a source, units, accuracy and a validity range; methods come from it", () => {
    for (const c of CORRELATIONS) {
      expect(c.reference.length).toBeGreaterThan(10);
      expect(c.units).toMatch(/dimensionless|m/);
      expect(c.accuracy.length).toBeGreaterThan(5);
      expect(Object.keys(c.validity).length).toBeGreaterThan(0);
      expect(c.reference).not.toMatch(NOT_CITED_REFERENCE);
    }
    for (const m of FRICTION_METHODS) expect(CORRELATIONS.some((c) => c.id === m)).toBe(true);
    expect(() => frictionFactor(1e5, 1e-4, "moody" as never)).toThrow(EngineInputError);
  });
  it("pipeHeadLoss: zero flow → zero loss and regime no-flow (no NaN)", () => {
    const r = pipeHeadLoss({ flow: 0, diameter: 0.1, length: 10, roughness: 1e-4, kinematicViscosity: 1e-6 });
    expect(r).toMatchObject({ headLoss: 0, velocity: 0, reynolds: 0, frictionFactor: 0, regime: "no-flow" });
  });
  it("pipeHeadLoss: laminar oil-like flow obeys Hagen-Poiseuille hf = 32·ν·L·V/(g·D²)", () => {
    const nu = 1e-4, D = 0.05, L = 20, Q = 0.001;
    const r = pipeHeadLoss({ flow: Q, diameter: D, length: L, roughness: 0, kinematicViscosity: nu });
    const V = Q / (Math.PI * D * D / 4);
    expect(r.regime).toBe("laminar");
    expect(r.headLoss).toBeCloseTo((32 * nu * L * V) / (9.80665 * D * D), 12);
  });
});

describe("units round trip and presets", () => {
  it("every unit converts SI → unit → SI exactly enough (1e-12 relative)", () => {
    for (const [q, list] of Object.entries(UNITS)) for (const u of list) {
      const v = 123.456;
      expect(toSI(q as never, u.id, fromSI(q as never, u.id, v))).toBeCloseTo(v, 9);
    }
  });
  it("presets name existing units: SI = m³/h, m, kPa, kW, mm; US = gpm, ft, psi, hp, in", () => {
    expect([UNIT_SYSTEMS.SI.flow, UNIT_SYSTEMS.SI.head, UNIT_SYSTEMS.SI.pressure, UNIT_SYSTEMS.SI.power, UNIT_SYSTEMS.SI.diameter]).toEqual(["m3/h", "m", "kPa", "kW", "mm"]);
    expect([UNIT_SYSTEMS.US.flow, UNIT_SYSTEMS.US.head, UNIT_SYSTEMS.US.pressure, UNIT_SYSTEMS.US.power, UNIT_SYSTEMS.US.diameter]).toEqual(["gpm", "ft", "psi", "hp", "in"]);
    for (const preset of [UNIT_SYSTEMS.SI, UNIT_SYSTEMS.US]) for (const [q, id] of Object.entries(preset)) expect(() => toSI(q as never, id, 1)).not.toThrow();
  });
  it("unknown units are typed errors", () => {
    expect(() => toSI("flow", "furlongs", 1)).toThrow(EngineInputError);
  });
});

describe("fluids and catalogue", () => {
  it("water: density peaks near 4 °C; viscosity falls with temperature; vapour pressure rises (IAPWS behaviour)", () => {
    expect(waterProperties(4).density).toBeGreaterThan(waterProperties(0).density);
    expect(waterProperties(4).density).toBeGreaterThan(waterProperties(8).density);
    for (let t = 1; t <= 100; t++) {
      expect(waterProperties(t).dynamicViscosity).toBeLessThan(waterProperties(t - 1).dynamicViscosity);
      expect(waterProperties(t).vaporPressure).toBeGreaterThan(waterProperties(t - 1).vaporPressure);
    }
  });
  it("water outside 0–100 °C is a typed error pointing to a user-defined fluid", () => {
    expect(() => waterProperties(-1)).toThrow(/user-defined fluid/);
    expect(() => waterProperties(101)).toThrow(EngineInputError);
  });
  it("a user-defined fluid goes wherever water goes", () => {
    const glycol = fluidAt({ kind: "custom", name: "30 % glycol", density: 1040, dynamicViscosity: 2.5e-3, vaporPressure: 2000 }, 20);
    expect(glycol.kinematicViscosity).toBeCloseTo(2.5e-3 / 1040, 15);
    expect(() => customFluid("x", -1, 1e-3, 0)).toThrow(EngineInputError);
  });
  it("catalogue: every table has a source; IDs positive and increasing with size", () => {
    for (const t of PIPE_TABLES) {
      expect(t.source.length).toBeGreaterThan(10);
      for (let i = 0; i < t.sizes.length; i++) {
        expect(t.sizes[i].innerDiameter).toBeGreaterThan(0);
        if (i > 0) expect(t.sizes[i].innerDiameter).toBeGreaterThan(t.sizes[i - 1].innerDiameter);
      }
      expect(() => material(t.material)).not.toThrow();
    }
    expect(innerDiameter("steel-sch80", "4")).toBeLessThan(innerDiameter("steel-sch40", "4"));
    expect(innerDiameter("copper-k", "2")).toBeLessThan(innerDiameter("copper-l", "2"));
    for (const m of MATERIALS) expect(m.roughnessAged).toBeGreaterThanOrEqual(m.roughnessNew);
    expect(material("cast-iron").roughnessNew).toBe(0.26e-3); // references.md (Moody, from memory)
  });
});

describe("Colebrook solver internals", () => {
  it("lnFast matches Math.log to 2.3e-16 absolute (scaled by max(1, |ln x|)) over 1e-3..1e30", async () => {
    const { lnFast } = await import("./friction.ts");
    let seed = 3;
    const rnd = () => ((seed = (seed * 16807) % 2147483647) / 2147483647);
    let worst = 0;
    for (let i = 0; i < 200_000; i++) {
      const x = Math.exp(-6.9 + 76 * rnd());
      const ref = Math.log(x);
      worst = Math.max(worst, Math.abs(lnFast(x) - ref) / Math.max(1, Math.abs(ref)));
    }
    expect(worst).toBeLessThan(2.3e-16);
    expect(lnFast(1)).toBe(0);
    expect(lnFast(0)).toBe(-Infinity);
    expect(Number.isNaN(lnFast(-1))).toBe(true);
  });
  it("solution satisfies the Colebrook equation to rounding for 100 000 random (Re, ε/D), Re 2e3–1e9, ε/D 0–0.1", () => {
    let seed = 7;
    const rnd = () => ((seed = (seed * 16807) % 2147483647) / 2147483647);
    let worst = 0;
    for (let i = 0; i < 100_000; i++) {
      const re = Math.exp(Math.log(2e3) + rnd() * Math.log(1e9 / 2e3));
      const ed = rnd() < 0.1 ? 0 : Math.exp(Math.log(1e-7) + rnd() * Math.log(0.1 / 1e-7));
      const f = colebrook(re, ed);
      // Residual of 1/√f + 2·log10(ε/3.7D + 2.51/(Re√f)), relative to 1/√f (Colebrook 1939).
      const s = 1 / Math.sqrt(f);
      worst = Math.max(worst, Math.abs(s + 2 * Math.log10(ed / 3.7 + (2.51 / re) * s)) / s);
    }
    expect(worst).toBeLessThan(1e-14);
  });
});
