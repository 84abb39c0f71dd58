// The candidates table's Motor cell (system page and selection report): the overload verdict with its rule and numbers,
// and the load at the operating point never reading as 100 % (or the service factor) when it is not — "100 % load"
// beside "can overload" read as a contradiction. Server-rendered markup. Check values: made-up figures; the limits are
// 100 % of the rating and rating × service factor (common practice).
import { describe, expect, it } from "vitest";
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { CandidateTable } from "./CandidateTable";
import { DEFAULT_ADJUSTMENT } from "~/lib/projects/candidate-input";
import type { WorkbenchView } from "~/lib/projects/workbench-view";
import { SI_UNITS } from "~/lib/shared/units";

/** A candidate with a 7.5 kW motor, its load at the operating point and its check (made up). */
function view(load: number, serviceFactor: number, check: { nonOverloading: boolean | null; motorCheck?: string }): WorkbenchView {
  const motor = { rating: 7500, ratingSource: "user", suggestedRating: 7500, suggestionBasis: "basis", ieClass: "IE3", efficiency: 0.904, efficiencySource: "src", driveEfficiency: null, driveSource: null, electricalPower: null, annualEnergyKWh: null, annualCost: null, currency: "", warnings: [] };
  const result = {
    status: "ok", message: "", ratio: 1, ratioNote: null, speed: null, diameter: null, curve: [], operating: { flow: 0.02, head: 20 }, allIntersections: [],
    figures: { efficiency: 0.7, hydraulicPower: 4000, shaftPower: 7500 * load, bepFlow: 0.02, bepHead: 20, maxPower: 7600, motorLimit: 7500 * serviceFactor, motorLoadAtDuty: load, annualEnergyKWh: null, annualCost: null, motor, ...check },
    por: null, band: [], npsh: { status: "ok", marginRatio: 2, at: "design point", rule: "rule", requiredMargin: 1.1 }, verdict: null, warnings: [],
  };
  return { evaluation: null, systemError: null, flowMax: 0.05, candidates: [{ id: 1, curveSetId: 1, label: "P", library: "L", adjustment: DEFAULT_ADJUSTMENT, result, error: null, energy: null }] } as unknown as WorkbenchView;
}
function motorCell(v: WorkbenchView): string {
  const html = renderToStaticMarkup(createElement(CandidateTable, { view: v, unitSystem: SI_UNITS }));
  const m = /<th scope="row"[^>]*>Motor<\/th><td[^>]*>(.*?)<\/td>/.exec(html);
  expect(m).toBeTruthy();
  return m![1].replace(/<[^>]+>/g, "|");
}

describe("the Motor cell", () => {
  it("the load bisected across 100 % (service factor 1): never '100 %' unless it is", () => {
    const shown = (load: number) => /· ([\d.]+ %) load/.exec(motorCell(view(load, 1, { nonOverloading: load <= 1 })))![1];
    expect(shown(1.004)).toBe("100.4 %");
    expect(shown(0.9996)).toBe("99.96 %");
    expect(shown(1)).toBe("100 %");
    expect(shown(0.9)).toBe("90 %");
  });
  it("with service factor 1.15 the load is kept apart from 115 % too", () => {
    expect(motorCell(view(1.1496, 1.15, { nonOverloading: true }))).toContain("· 114.96 % load");
    expect(motorCell(view(1.1504, 1.15, { nonOverloading: false }))).toContain("· 115.04 % load");
  });
  it("shows the verdict with its rule and numbers; a selection frozen before it was kept keeps its words", () => {
    const text = "can overload: largest power on the curve 7.60 kW at 72.0 m³/h exceeds motor rating × service factor 7.50 kW";
    expect(motorCell(view(0.95, 1, { nonOverloading: false, motorCheck: text }))).toContain(`|${text}|`);
    expect(motorCell(view(0.95, 1, { nonOverloading: false }))).toContain("|can overload|");
  });
});
