// A speed ratio typed in and judged outside the catalogue reads apart from the limit its verdict names, in the chart's
// label and the candidates table's Adjustment row, in SI and US units: 100.04 % read "at 100.0 % speed (2901.2 rpm) —
// outside catalogue" beside the reason "2901.2 rpm is 100.04 % of the rated 2900 rpm, above the allowed 100 %".
// Check values: speed within 30–100 % of rated (common practice, DEFAULT_SPEED_RANGE); an invented straight-line curve
// (H = 40 − 1000·Q at 2900 rpm, app/test/fieldcheck-fixture.ts); 0.9996 is inside and reads as before.
import { describe, expect, test } from "vitest";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, evaluateCandidate } from "~/lib/projects/hydraulics";
import { renderUnits, SI_UNITS, US_UNITS } from "~/lib/shared/units";
import { linearPoints } from "~/test/fieldcheck-fixture";
import { adjustmentText } from "./workbench";

const SET = { points: linearPoints(), speed: 2900, impellerDiameter: null };
const CATALOGUE = { impellerMin: null, impellerMax: null, ratedSpeed: 2900 };

function shown(ratio: number) {
  const adjustment = { ...DEFAULT_ADJUSTMENT, method: "speed" as const, ratio };
  const result = evaluateCandidate({ ...defaultSystemInput(), duty: { flow: 0.012, head: 28 } }, SET, adjustment, { catalogue: CATALOGUE });
  return { result, text: (units: typeof SI_UNITS, solvedToo = false) => adjustmentText({ adjustment, result }, units, solvedToo) };
}

describe("a typed speed above the rated speed", () => {
  test("reads above 100 % beside its outside-catalogue verdict, in the label and the table, SI and US", () => {
    const s = shown(1.0004);
    expect(s.result.verdict?.status).toBe("outside-catalogue");
    expect(renderUnits(s.result.verdict!.reasons.join(" "), SI_UNITS)).toMatch(/100\.04 % of the rated 2900 rpm, above the allowed 100 %/);
    for (const [name, units] of Object.entries({ SI: SI_UNITS, US: US_UNITS })) {
      for (const solvedToo of [false, true]) {
        const m = s.text(units, solvedToo).match(/at (\d+(?:\.\d+)?) % speed/);
        expect(m, `${name}: ${s.text(units, solvedToo)}`).not.toBeNull();
        expect(Number(m![1]), `${name}: ${s.text(units, solvedToo)}`).toBeGreaterThan(100);
      }
    }
  });

  test("a speed inside the range reads as before, to a tenth", () => {
    expect(shown(0.873).text(SI_UNITS)).toBe(" (at 87.3 % speed (2531.7 rpm))"); // 0.873 × 2900 rpm
    expect(shown(0.9996).text(US_UNITS)).toMatch(/^ \(at 100\.0 % speed \(2898\.8 rpm\)\)$/); // inside: a rounded limit reads true
  });
});
