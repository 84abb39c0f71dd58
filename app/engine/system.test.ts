/** Tier 3 — system curve consistency. */
import { describe, expect, it } from "vitest";
import { EngineInputError, fluidAt, G0, pipeHeadLoss, sumK, systemCurve, systemHead, systemHeadFunction, suctionLoss, type SystemSpec } from "./index.ts";

const fluid = fluidAt({ kind: "water" }, 20);
const base: SystemSpec = {
  fluid,
  staticHead: { min: 8, max: 14 },
  pressureDifference: 50_000,
  suction: [{ length: 5, diameter: 0.1, roughness: 0.045e-3, agedRoughness: 0.5e-3, fittings: [{ id: "entrance-sharp" }, { id: "gate-valve-open" }], nominal: "4" }],
  discharge: [
    { length: 60, diameter: 0.08, roughness: 0.045e-3, agedRoughness: 0.5e-3, fittings: [{ id: "elbow-90-standard", count: 4 }, { id: "swing-check" }, { id: "exit" }], nominal: "3" },
    { length: 40, diameter: 0.08, roughness: 0.045e-3, agedRoughness: 0.5e-3 },
  ],
};

describe("system head", () => {
  it("at zero flow: nominal static (mid of min/max) + Δp/(ρ·g₀)", () => {
    const r = systemHead(base, 0);
    expect(r.head).toBeCloseTo(11 + 50_000 / (fluid.density * G0), 12);
    expect(r.suctionLoss).toBe(0);
  });
  it("pressure = ρ·g₀·H (definition)", () => {
    const r = systemHead(base, 0.01);
    expect(r.pressure).toBeCloseTo(fluid.density * G0 * r.head, 6);
  });
  it("runs in series add: two 50 m runs = one 100 m run of the same size (no fittings)", () => {
    const one = systemHead({ fluid, discharge: [{ length: 100, diameter: 0.1, roughness: 1e-4 }] }, 0.02).head;
    const two = systemHead({ fluid, discharge: [{ length: 50, diameter: 0.1, roughness: 1e-4 }, { length: 50, diameter: 0.1, roughness: 1e-4 }] }, 0.02).head;
    expect(two).toBeCloseTo(one, 12);
  });
  it("fittings' ΣK is applied: loss equals Darcy-Weisbach with minorK = ΣK", () => {
    const k = sumK([{ id: "elbow-90-standard", count: 4 }, { id: "swing-check" }, { id: "exit" }], 0.08, "3");
    const direct = pipeHeadLoss({ flow: 0.01, diameter: 0.08, length: 60, roughness: 0.045e-3, minorK: k, kinematicViscosity: fluid.kinematicViscosity }).headLoss;
    const r = systemHead(base, 0.01);
    expect(r.dischargeRuns[0].headLoss).toBeCloseTo(direct, 12);
  });
  it("suction loss is the suction side only", () => {
    const r = systemHead(base, 0.015);
    expect(suctionLoss(base, 0.015).headLoss).toBeCloseTo(r.suctionLoss, 14);
  });
  it("closed loop: no static lift; head at zero flow = control head", () => {
    const closed: SystemSpec = { ...base, mode: "closed-loop", controlHead: 6 };
    expect(systemHead(closed, 0).head).toBe(6);
    expect(systemHead(closed, 0).staticHead).toBe(0);
    expect(systemHead(closed, 0.01).warnings.some((w) => w.parameter === "staticHead")).toBe(true);
  });
  it("Hazen-Williams loss model runs and warns outside its velocity range", () => {
    const hw: SystemSpec = { fluid, lossModel: "hazen-williams", discharge: [{ length: 100, diameter: 0.05, roughness: 0, hazenWilliamsC: 150 }] };
    const slow = systemHead(hw, 0.002);
    const fast = systemHead(hw, 0.01); // 5.1 m/s
    expect(slow.head).toBeGreaterThan(0);
    expect(fast.warnings.some((w) => w.code === "outside-validity")).toBe(true);
  });
});

describe("system curve and band", () => {
  const c = systemCurve(base, { flowMax: 0.02, points: 21 });
  it("rises with flow", () => {
    for (let i = 1; i < c.flows.length; i++) expect(c.head[i]).toBeGreaterThan(c.head[i - 1]);
  });
  it("band: least lift & new pipe ≤ design ≤ most lift & aged pipe", () => {
    for (let i = 0; i < c.flows.length; i++) {
      expect(c.band.low[i]).toBeLessThanOrEqual(c.head[i] + 1e-12);
      expect(c.band.high[i]).toBeGreaterThanOrEqual(c.head[i] - 1e-12);
      expect(c.band.low[i]).toBe(c.corners.minNew[i]);
      expect(c.band.high[i]).toBe(c.corners.maxAged[i]);
    }
    expect(c.band.high[0] - c.band.low[0]).toBeCloseTo(6, 12); // static range only at zero flow
  });
  it("Δp array = ρ·g₀·H", () => {
    c.flows.forEach((_, i) => expect(c.pressure[i]).toBeCloseTo(fluid.density * G0 * c.head[i], 6));
  });
  it("bad ranges throw typed errors", () => {
    expect(() => systemCurve(base, { flowMax: 0 })).toThrow(EngineInputError);
    expect(() => systemCurve(base, { flowMax: 1, points: 1 })).toThrow(EngineInputError);
    expect(() => systemHead({ ...base, staticHead: { min: 5, max: 2 } }, 0)).toThrow(EngineInputError);
  });
});

describe("warnings of several runs", () => {
  it("two runs out of the same range each keep their warning, naming the run (one each, not one per flow)", () => {
    // ε/D = 6 mm / 0.1 m = 0.06 aged: above every correlation's stated ε/D range (Colebrook's to 0.05, registry.ts).
    const run = (name: string) => ({ name, length: 10, diameter: 0.1, roughness: 0.045e-3, agedRoughness: 6e-3 });
    const c = systemCurve({ fluid, staticHead: 10, suction: [run("Suction line")], discharge: [run("Rising main")] }, { flowMax: 0.02, points: 5 });
    const eps = c.warnings.filter((w) => w.code === "outside-validity" && w.parameter === "ε/D").map((w) => w.message);
    expect(eps).toHaveLength(2);
    expect(eps[0]).toMatch(/^Suction line: .*ε\/D = 0\.06 is outside/);
    expect(eps[1]).toMatch(/^Rising main: .*ε\/D = 0\.06 is outside/);
  });
  it("two runs with fittings beyond the table's sizes each keep theirs too", () => {
    const run = (name: string) => ({ name, length: 10, diameter: 0.1, roughness: 0.045e-3, fittings: [{ id: "elbow-90-standard" }], nominal: "40" });
    const c = systemCurve({ fluid, staticHead: 10, suction: [run("Suction line")], discharge: [run("Rising main")] }, { flowMax: 0.02, points: 5 });
    const byRun = (name: string) => c.warnings.filter((w) => w.parameter === "nominal" && w.message.startsWith(`${name}: `));
    expect(byRun("Suction line").length).toBeGreaterThan(0);
    expect(byRun("Rising main").length).toBe(byRun("Suction line").length);
  });
  it("roughness at or above half the inner diameter is refused naming the run and the field, not ε/D alone", () => {
    const spec = (aged: number): SystemSpec => ({ fluid, staticHead: 10, discharge: [{ name: "Rising main", length: 10, diameter: 0.001, roughness: 0.045e-3, agedRoughness: aged }] });
    expect(() => systemHead(spec(0.005), 0.001, { roughness: "aged" })).toThrow("discharge[0].agedRoughness: must be below half the inner diameter of Rising main, 0.001 m, 0.0005 m: roughness that high would close the bore, physically meaningless (got 0.005 m, ε/D = 5)");
    // The rule flips at ε = D/2 (wall bumps meeting in the middle of the bore: no pipe has them, common practice).
    expect(() => systemHead(spec(0.5e-3), 0.001, { roughness: "aged" })).toThrow(/agedRoughness: must be below half the inner diameter .* \(got 0\.0005 m, ε\/D = 0\.5\)/);
    expect(() => systemHead(spec(0.49e-3), 0.001, { roughness: "aged" })).not.toThrow(); // ε/D 0.49: computed with a range warning
  });
  it("ε/D between 0.05 and 0.5 is computed with the correlation's range warning, its range read 0–0.05 (Colebrook's stated ε/D range, registry.ts)", () => {
    const c = systemCurve({ fluid, staticHead: 10, discharge: [{ name: "Rising main", length: 10, diameter: 0.1, roughness: 0.049 }] }, { flowMax: 0.02, points: 5 });
    const eps = c.warnings.filter((w) => w.code === "outside-validity" && w.parameter === "ε/D").map((w) => w.message);
    expect(eps).toEqual(["Rising main: Colebrook (solved exactly): ε/D = 0.49 is outside its stated range 0–0.05; result given, use with care"]);
  });
});

describe("fast system head function", () => {
  it("gives the same head as systemHead for every case and model (1e-14 relative)", () => {
    const cases = [{}, { level: "min" as const, roughness: "aged" as const }, { level: "max" as const }];
    const hw: SystemSpec = { ...base, lossModel: "hazen-williams",
      suction: base.suction!.map((r) => ({ ...r, hazenWilliamsC: 130 })), discharge: base.discharge!.map((r) => ({ ...r, hazenWilliamsC: 120, hazenWilliamsCAged: 100 })) };
    const viscous: SystemSpec = { ...base, fluid: { ...fluid, kinematicViscosity: 2e-4, dynamicViscosity: 0.2 } }; // laminar runs
    for (const spec of [base, hw, viscous, { ...base, frictionMethod: "haaland" as const }, { ...base, mode: "closed-loop" as const, controlHead: 4 }]) {
      for (const c of cases) {
        const fast = systemHeadFunction(spec, c);
        for (const q of [0, 1e-5, 0.002, 0.01, 0.03]) {
          const slow = systemHead(spec, q, c).head;
          expect(Math.abs(fast(q) - slow)).toBeLessThanOrEqual(1e-14 * Math.abs(slow));
        }
      }
    }
  });
});
