// A candidate of duty pumps in parallel is staged by demand over its duty cycle (engine dutyStaging.ts): each step runs
// the fewest duty pumps that meet it (duty/assist staging: common practice, from memory); standby pumps never run. Before,
// every duty pump ran at every step: at 25 % flow two throttled pumps drew about 2.49 kW where one draws about 1.68 kW
// (DEVELOPERS.md, helper "cycleedge"). Check values: hand-checks against the same pump alone as a single-pump candidate on
// the same system and motor, and against the series candidate's cycle as the engine gives it for all pumps running
// (unchanged). The curve is invented (the energy fixture's pump).
import { describe, expect, it } from "vitest";
import { createPumpCurve, dutyCycleEnergy, PARALLEL_STAGING_RULE, prepareSystem, systemHeadFunction } from "~/engine";
import { candidateEnergy } from "./energy";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, evaluateCandidate, fluidOf, systemSpec, type Adjustment, type SystemInput } from "./hydraulics";

const M3H = 1 / 3600;
const ROWS = [[0, 22, null], [5, 21.8, 0.3], [10, 21.5, 0.45], [20, 20, 0.62], [30, 17.5, 0.72], [36, 15.5, 0.74], [45, 12, 0.7], [55, 7, 0.6]] as const;
const SET = { points: ROWS.map(([q, h, e]) => ({ flow: q * M3H, head: h, efficiency: e, power: null, npshr: null })), speed: 2900, impellerDiameter: 0.2 };
const base = defaultSystemInput();
const input: SystemInput = { ...base, duty: { flow: 72 * M3H, head: 12 }, energy: { ...base.energy!, profile: [{ flowFraction: 0.25, hours: 3000 }, { flowFraction: 0.9, hours: 1000 }] } };
const MOTOR = { motorRating: 3000 }; // the same 3.00 kW motor on every pump, typed (so the single pump's and each of the pair's match)
const energyOf = (adj: Adjustment, inp: SystemInput = input) => candidateEnergy(inp, systemSpec(inp), fluidOf(inp).density, { adjustment: adj, result: evaluateCandidate(inp, SET, adj) }, null);
const PAIR: Adjustment = { ...DEFAULT_ADJUSTMENT, ...MOTOR, arrangement: "parallel", dutyPumps: 2, standbyPumps: 1 };
const ALONE: Adjustment = { ...DEFAULT_ADJUSTMENT, ...MOTOR };

describe("two identical pumps in parallel (+1 standby), fixed speed throttled", () => {
  const pair = energyOf(PAIR);
  const alone = energyOf(ALONE);

  it("25 % flow runs 1 of 2, its energy the same pump's alone at that flow (a single-pump candidate)", () => {
    const s = pair.cycle!.steps[0];
    const a = alone.cycle!.steps[0];
    expect(a.status).toBe("ok"); // control: one pump alone meets 18 m³/h on this system
    expect(s.flow).toBeCloseTo(18 * M3H, 12);
    expect([s.pumpsRunning, s.dutyPumps]).toEqual([1, 2]);
    expect(s.shaftPower).toBeCloseTo(a.shaftPower!, 3);
    expect(s.pumpShaftPower).toBeCloseTo(a.shaftPower!, 3);
    expect(s.electricalPower).toBeCloseTo(a.electricalPower!, 3);
    expect(s.energyKWh).toBeCloseTo(a.energyKWh!, 3);
  });

  it("90 % flow (64.8 m³/h, past one pump's 55 m³/h curve end) runs 2 of 2, one pump's shaft power half the pair's", () => {
    const s = pair.cycle!.steps[1];
    expect(alone.cycle!.steps[1].status).toBe("beyond-curve"); // control: one pump cannot
    expect(s).toMatchObject({ pumpsRunning: 2, dutyPumps: 2, status: "ok" });
    expect(s.pumpShaftPower).toBeCloseTo(s.shaftPower! / 2, 6);
  });

  it("the rule is one of the cycle's assumptions", () => {
    expect(pair.assumptions).toContain(`${PARALLEL_STAGING_RULE}.`);
    expect(PARALLEL_STAGING_RULE).toBe("Pumps in parallel staged by demand: each step runs the fewest duty pumps that meet it with their motors within rating (else within rating × service factor, else overloaded, said at the step; common practice, from memory); standby pumps never run");
    expect(alone.assumptions.join(" ")).not.toMatch(/staged by demand/);
  });
});

describe("unchanged: series and single pumps", () => {
  it("two pumps in series run both at every step, as the engine's cycle on their combined curve and both motors gives it", () => {
    const high: SystemInput = { ...input, staticLow: 20, staticHigh: 22, duty: { flow: 36 * M3H, head: 30 } };
    const adj: Adjustment = { ...DEFAULT_ADJUSTMENT, ...MOTOR, arrangement: "series", dutyPumps: 2 };
    const e = energyOf(adj, high);
    expect(e.cycle!.steps.every((s) => s.pumpsRunning === undefined)).toBe(true);
    expect(e.assumptions.join(" ")).not.toMatch(/staged by demand/);
    const r = evaluateCandidate(high, SET, adj);
    const curve = createPumpCurve({ points: r.curve.map((p) => ({ flow: p.flow, head: p.head, ...(p.efficiency != null ? { efficiency: p.efficiency } : {}), ...(p.power != null ? { power: p.power } : {}) })), powerDensity: fluidOf(high).density, riseTolerance: 1 });
    const direct = dutyCycleEnergy({ curve, systemHead: systemHeadFunction(prepareSystem(systemSpec(high))), designFlow: high.duty!.flow, mode: "fixed-speed", profile: high.energy!.profile!, density: fluidOf(high).density,
      motor: { rating: 3000 * 2, efficiency: r.figures!.motor.efficiency!, serviceFactor: adj.serviceFactor, units: 2 }, driveEfficiency: null });
    expect(e.cycle!.steps.map((s) => s.status)).toEqual(direct.steps.map((s) => s.status));
    expect(e.cycle!.annualEnergyKWh).toBeGreaterThan(0);
    expect(e.cycle!.annualEnergyKWh).toBeCloseTo(direct.annualEnergyKWh, 6);
  });
});
