// The candidates table's "Largest power on curve" row beside the Motor row's overload check: the largest power reads apart
// from the motor's limit (rating × service factor) it is judged against, in SI and US units — it read "5.50 kW" beside
// "largest power on the curve 5.5004 kW exceeds motor rating × service factor 5.50 kW". Server-rendered markup. Check
// values: made-up figures; the limit is rating × service factor (common practice); 1 hp = 745.7 W (units.ts).
import { describe, expect, it } from "vitest";
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { CandidateTable } from "./CandidateTable";
import { DEFAULT_ADJUSTMENT } from "~/lib/projects/candidate-input";
import type { WorkbenchView } from "~/lib/projects/workbench-view";
import { SI_UNITS, US_UNITS, type UnitChoice } from "~/lib/shared/units";

const NUM = String.raw`(\d+(?:\.\d+)?)`;

/** A candidate with a 5.5 kW motor (service factor 1) whose curve's largest power is `maxPower` W (made up). */
function view(maxPower: number, motorLimit: number | null, adjustment = DEFAULT_ADJUSTMENT): WorkbenchView {
  const motor = { rating: 5500, ratingSource: "user", suggestedRating: 5500, suggestionBasis: "basis", ieClass: "IE3", efficiency: 0.9, efficiencySource: "src", driveEfficiency: null, driveSource: null, electricalPower: null, annualEnergyKWh: null, annualCost: null, currency: "", warnings: [] };
  const result = {
    status: "ok", message: "", ratio: 1, ratioNote: null, speed: null, diameter: null, curve: [], operating: { flow: 0.02, head: 20 }, allIntersections: [],
    figures: { efficiency: 0.7, hydraulicPower: 4000, shaftPower: 5000, bepFlow: 0.02, bepHead: 20, maxPower, motorLimit, motorLoadAtDuty: 0.9, annualEnergyKWh: null, annualCost: null, motor, nonOverloading: motorLimit == null ? null : maxPower <= motorLimit },
    por: null, band: [], npsh: { status: "ok", marginRatio: 2, at: "design point", rule: "rule", requiredMargin: 1.1 }, verdict: null, warnings: [],
  };
  return { evaluation: null, systemError: null, flowMax: 0.05, candidates: [{ id: 1, curveSetId: 1, label: "P", library: "L", adjustment, result, error: null, energy: null }] } as unknown as WorkbenchView;
}
function row(v: WorkbenchView, units: UnitChoice, name: string): string {
  const html = renderToStaticMarkup(createElement(CandidateTable, { view: v, unitSystem: units }));
  const m = new RegExp(`<th scope="row"[^>]*>${name}</th><td[^>]*>(.*?)</td>`).exec(html);
  expect(m, html).toBeTruthy();
  return m![1].replace(/<[^>]+>/g, "|");
}

describe("the largest power on the curve beside the motor's limit", () => {
  for (const [name, units, unit] of [["SI", SI_UNITS, "kW"], ["US", US_UNITS, "hp"]] as const) {
    it(`${name}: 5500.4 W reads above a 5500 W limit, 5499.6 W below it`, () => {
      for (const [w, above] of [[5500.4, true], [5499.6, false]] as const) {
        const shown = row(view(w, 5500), units, "Largest power on curve");
        const m = new RegExp(`^${NUM} ${unit}$`).exec(shown);
        expect(m, shown).not.toBeNull();
        const perUnit = name === "SI" ? 1000 : 745.69987158227; // W per kW or hp (550 ft·lbf/s, units.ts)
        if (above) expect(Number(m![1]), shown).toBeGreaterThan(5500 / perUnit);
        else expect(Number(m![1]), shown).toBeLessThan(5500 / perUnit);
      }
    });
  }
  it("per pump where there are several duty pumps, apart from each pump's limit", () => {
    const two = { ...DEFAULT_ADJUSTMENT, arrangement: "parallel" as const, dutyPumps: 2 };
    expect(row(view(5500.4, 5500, two), SI_UNITS, "Largest power on curve")).toBe("5.5004 kW per pump");
  });
  it("without a motor limit (no rating), as it always read: the unit's digits", () => {
    expect(row(view(5500.4, null), SI_UNITS, "Largest power on curve")).toBe("5.50 kW");
    expect(row(view(5500.4, 5500), SI_UNITS, "Largest power on curve")).toBe("5.5004 kW"); // it read "5.50 kW"
  });
});
