// A sweep over the demo data (invented, fixtures/demo/): the maker's minimum flow the demo records (min-flows.ts: two
// Harrow & Vell curve sets) reads back from every demo file that carries it and no other gains one; on every demo curve set,
// one pump and two in parallel, the verdict's line flips exactly where the duty per running pump crosses a figure set at it
// (at it: nothing; 1e-6 relative above the duty's share: runs below; 1e-6 below: nothing); and a duty-cycle step of the
// recorded sets below their figure gets the maker's note, while a set without one says none is recorded.
// Check values: construction (each figure set from the duty itself) and the demo generator's figures.
import { describe, expect, it } from "vitest";
import { generateDemo } from "../../../fixtures/demo/generate";
import { analyseCsv } from "../import";
import { STEP_BELOW_MAKER_MIN_FLOW } from "~/engine";
import { inSI } from "~/engine/quantityText";
import { demoCurves, demoCurveSI } from "~/test/demo-curves";
import { candidateEnergy } from "./energy";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, evaluateCandidate, fluidOf, systemSpec, type Adjustment, type SystemInput } from "./hydraulics";
import { verdictMinFlowNote } from "./verdict-min-flow";

const M3H = 1 / 3600;
const demo = generateDemo();

describe("the demo files: the recorded figures and no others", () => {
  it("two Harrow & Vell curve sets record one; every file reads without a min-flow finding", () => {
    const recorded = demoCurves.filter((c) => c.minFlowM3h !== undefined);
    expect(recorded.map((c) => `${c.model}|${c.speed}|${c.impellerMm}`)).toEqual(["HV Vellbrook 100|2900|180", "HV Vellbrook 100|1450|180"]); // source: min-flows.ts (first model, full impeller, each speed)
    for (const d of demo)
      for (const f of d.files) {
        const r = analyseCsv(f.text).result;
        expect(r.problems.filter((p) => p.code === "min-flow"), f.name).toEqual([]);
        const withFigure = r.curveSets.filter((c) => c.minFlow !== undefined).map((c) => [c.key, c.minFlow]);
        const carries = f.variant === "clean" || f.variant === "broken" ? recorded.filter((c) => d.curves.some((x) => x.model === c.model)) : [];
        expect(withFigure, f.name).toEqual(carries.map((c) => [`${c.model}|${c.speed}|${c.impellerMm}`, c.minFlowM3h! * (1 / 3600)]));
      }
  });
});

describe("every demo curve set: the verdict's line flips at the figure", () => {
  const PAIR: Adjustment = { ...DEFAULT_ADJUSTMENT, arrangement: "parallel", dutyPumps: 2 };
  const arrangements: [string, Adjustment, number][] = [["one pump", DEFAULT_ADJUSTMENT, 1], ["2 in parallel", PAIR, 2]];
  it(`${demoCurves.length} sets × one pump and 2 in parallel × at, above and below the share`, () => {
    let judged = 0;
    for (const c of demoCurves) {
      const s = demoCurveSI(c);
      const last = s.points[s.points.length - 1].flow;
      for (const [name, adj, k] of arrangements) {
        const duty = 0.6 * last * k; // each running pump at 60 % of its curve's last flow
        const input: SystemInput = { ...defaultSystemInput(), duty: { flow: duty, head: 14 } };
        for (const [factor, below] of [[1, false], [1 + 1e-6, true], [1 - 1e-6, false]] as const) {
          const r = evaluateCandidate(input, { ...s, minFlow: (duty / k) * factor }, adj);
          const what = `${c.model} ${c.speed} Ø${c.impellerMm}, ${name}, figure × ${factor}`;
          expect(r.minFlow?.below, what).toBe(below);
          const note = verdictMinFlowNote(r.verdict ?? { status: "meets" }, r.minFlow);
          expect(note !== null, what).toBe(below);
          if (note) expect(inSI(note), what).toMatch(/runs below the maker's minimum flow: [\d.]+ m³\/h < [\d.]+ m³\/h/);
          judged++;
        }
      }
    }
    expect(judged).toBe(demoCurves.length * 6);
  });
});

describe("the duty cycle of the recorded sets: the maker's note below the figure, and none recorded elsewhere", () => {
  /** The curve's head at a flow, linear between its points (m; m³/s in). */
  const headAt = (s: ReturnType<typeof demoCurveSI>, q: number) => {
    const i = s.points.findIndex((p) => p.flow >= q);
    const [a, b] = [s.points[i - 1], s.points[i]];
    return a.head + ((b.head - a.head) * (q - a.flow)) / (b.flow - a.flow);
  };
  /** An open tank with no pipe runs whose static head is the pump's at 90 % of its last flow: the pump runs there, every step below is met at fixed speed. */
  const cycleOf = (c: (typeof demoCurves)[number], f: number) => {
    const s = demoCurveSI(c);
    const last = s.points[s.points.length - 1].flow;
    const lift = headAt(s, 0.9 * last);
    const input: SystemInput = { ...defaultSystemInput(), staticLow: lift, staticHigh: lift, runs: [], duty: { flow: 0.8 * last, head: lift },
      energy: { ...defaultSystemInput().energy!, profile: [{ flowFraction: 1, hours: 1000 }, { flowFraction: f, hours: 3000 }] } };
    const adj = DEFAULT_ADJUSTMENT; // the motor suggested
    const result = evaluateCandidate(input, s, adj);
    return { cycle: candidateEnergy(input, systemSpec(input), fluidOf(input).density, { adjustment: adj, result }, null).cycle!, s, input };
  };
  it("a step just below the figure, and just above it", () => {
    for (const c of demoCurves.filter((x) => x.minFlowM3h !== undefined)) {
      const fAt = (c.minFlowM3h! * M3H) / (0.8 * demoCurveSI(c).points.at(-1)!.flow); // the step flow fraction at the figure
      const below = cycleOf(c, fAt * (1 - 1e-4));
      expect(below.cycle.warnings.filter((w) => w.code.startsWith("step-")).map((w) => [w.parameter, w.code]), c.model).toEqual([["profile[1]", STEP_BELOW_MAKER_MIN_FLOW]]);
      expect(inSI(below.cycle.warnings.find((w) => w.code === STEP_BELOW_MAKER_MIN_FLOW)!.message)).toContain(`below the maker's minimum continuous flow, ${c.minFlowM3h!.toFixed(1)} m³/h`);
      expect(cycleOf(c, fAt * (1 + 1e-4)).cycle.warnings.some((w) => w.code === STEP_BELOW_MAKER_MIN_FLOW), c.model).toBe(false);
    }
  });
  it("a set without a figure: a step below 50 % of BEP says none is recorded", () => {
    const none = demoCurves.find((x) => x.minFlowM3h === undefined)!;
    const note = cycleOf(none, 0.15).cycle.warnings.find((w) => w.code === "step-below-min-flow");
    expect(note?.message).toContain("no maker's minimum flow is recorded for this curve");
  });
});
