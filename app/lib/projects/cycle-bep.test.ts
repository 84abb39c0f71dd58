// A duty-cycle step's POR note (engine stepPor.ts: outside 70–120 % of BEP flow, ANSI/HI 9.6.3 from memory) judges the
// step against the BEP the candidate's figures name (`figures.bepFlow`: "Position vs BEP", the chart's BEP mark and POR),
// not one read off the 41 points the cycle's curve is rebuilt from (cycle-curve.ts). Check values: the demo curve TFS
// Meregate 80 at 2900 rpm, Ø195 mm (invented, fixtures/demo/): its published points peak at 70.8 % at 40.47 m³/h (and
// again at 46.26 m³/h: the first is the BEP, engine pumpCurve.ts); the rebuilt curve's own peak lay at 41.6 m³/h, so a step
// at 28.33 m³/h read "68 % of its BEP flow, 41.6 m³/h: left of the POR" beside figures that put 70 % of 40.47 m³/h inside it.
// The rule flips at 0.7 × 40.47 = 28.329 m³/h: steps at 70.82 % and 70.83 % of the 40 m³/h duty (28.328 and 28.332 m³/h).
import { describe, expect, it } from "vitest";
import { candidateEnergy } from "./energy";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, evaluateCandidate, fluidOf, systemSpec, type Adjustment, type SystemInput } from "./hydraulics";

const M3H = 1 / 3600;
// fixtures/demo/tallowmere.csv, TFS Meregate 80, 2900 rpm, Ø195 mm, as imported: flow m³/h, head m, efficiency %, power kW, NPSHr m.
const ROWS = [[0, 45.66, 0, 3.234, 1.12], [5.78, 45.42, 20.1, 3.549, 1.15], [11.56, 45.02, 36.3, 3.896, 1.24], [17.35, 44.44, 49.0, 4.28, 1.39], [23.13, 43.68, 58.4, 4.705, 1.6],
  [28.91, 42.75, 64.9, 5.175, 1.87], [34.69, 41.65, 69.0, 5.697, 2.2], [40.47, 40.37, 70.8, 6.275, 2.59], [46.26, 38.92, 70.8, 6.913, 3.04], [52.04, 37.29, 69.3, 7.61, 3.55]];
const set = { speed: 2900, impellerDiameter: 0.195, points: ROWS.map(([q, h, e, p, n]) => ({ flow: q * M3H, head: h, efficiency: e > 0 ? e / 100 : null, power: p * 1000, npshr: n })) };

/** The default open system (app defaults) at 35–37 m static lift so the pump meets 40 m³/h; one step at `f` of the duty, fixed speed unless `control`. */
function cycle(f: number, adj: Adjustment = DEFAULT_ADJUSTMENT, control: "fixed-speed" | "system-curve" = "fixed-speed", duty = 40) {
  const input: SystemInput = { ...defaultSystemInput(), staticLow: 35, staticHigh: 37, duty: { flow: duty * M3H, head: 40 }, energy: { ...defaultSystemInput().energy!, control, profile: [{ flowFraction: 1, hours: 1000 }, { flowFraction: f, hours: 1000 }] } };
  const result = evaluateCandidate(input, set, adj);
  const e = candidateEnergy(input, systemSpec(input), fluidOf(input).density, { adjustment: adj, result }, null);
  const note = e.cycle!.warnings.find((w) => w.parameter === "profile[1]" && /BEP flow/.test(w.message)) as { code: string; bepRatio?: number; message: string } | undefined;
  return { result, e, note };
}

describe("the step's BEP is the figures' BEP", () => {
  it("control: the figures name the published peak, 40.47 m³/h (demo data), and the pump meets the duty", () => {
    const { result } = cycle(0.7083);
    expect(result.verdict?.status).toBe("meets");
    expect(result.figures!.bepFlow! / M3H).toBeCloseTo(40.47, 6);
  });
  it("70.83 % of the duty (28.332 m³/h, 70.01 % of 40.47 m³/h): inside the POR, no note (the rebuilt curve's 41.6 m³/h read 68 %: outside)", () => {
    const { note } = cycle(0.7083);
    expect(note?.message ?? null).toBeNull();
  });
  it("70.82 % of the duty (28.328 m³/h, 69.998 % of 40.47 m³/h): outside, the note naming the figures' BEP flow", () => {
    const { note } = cycle(0.7082);
    expect(note?.code).toBe("step-outside-por");
    expect(note!.bepRatio).toBeCloseTo((0.7082 * 40) / 40.47, 9);
    expect(note!.message).toContain("⟦flow|0.011241666666666667|limit:");
  });
  it("two in parallel, staged (one and two running), and a drive's speed setting: every step's ratio is its flow per pump over the figures' BEP at its speed", () => {
    const cases: [Adjustment, "fixed-speed" | "system-curve", number][] = [
      [{ ...DEFAULT_ADJUSTMENT, arrangement: "parallel", dutyPumps: 2, standbyPumps: 1 }, "fixed-speed", 70],
      [{ ...DEFAULT_ADJUSTMENT, method: "speed" }, "system-curve", 34],
      [{ ...DEFAULT_ADJUSTMENT, method: "trim" }, "fixed-speed", 34],
    ];
    for (const [adj, control, duty] of cases) {
      for (const f of [0.25, 0.45, 0.6, 0.75, 1]) {
        const { result, e } = cycle(f, adj, control, duty);
        const bep = result.figures!.bepFlow!; // one pump's, on its curve as set
        const undo = control === "system-curve" && adj.method === "speed" ? result.ratio : 1; // the cycle's speeds are fractions of the curve's
        e.cycle!.steps.forEach((s, i) => {
          const w = e.cycle!.warnings.find((x) => x.parameter === `profile[${i}]` && "bepRatio" in x) as { bepRatio: number } | undefined;
          if (!w || !(s.flow > 0)) return;
          const running = s.pumpsRunning ?? 1;
          expect(w.bepRatio, `${adj.method} ${adj.arrangement} step ${i}`).toBeCloseTo(s.flow / running / ((bep / undo) * (s.speedRatio ?? 1)), 9);
        });
      }
    }
  });
});
