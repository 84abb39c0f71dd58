// An NPSH margin ratio just above zero (NPSHa a hair above zero) reads by the ratios' own two-decimal rule: "< 0.01"
// below 0.01, never an exponent ("4.44e-16 (cavitation-risk)"), never "0.00" (which would read as NPSHa at zero, the case
// shown as NPSHa instead), with NPSHa and NPSHr beside it on their own row. At 0.01 and above the ratio as before.
// Check values: the ratio's rule is ours (two decimals, apart from 1 and the wanted ratio); 1e-15, 0.004 and 0.01 are the
// brief's probe values; 1e-15 m / 2.25 m is 4.44e-16 (arithmetic).
import { describe, expect, it } from "vitest";
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { CandidateTable } from "./CandidateTable";
import { npshJudgedRange, npshLowestText, npshMarginText, npshPointsText } from "./candidate-figures";
import { npshAgainstVerdict } from "~/lib/projects/verdict-npsh";
import { DEFAULT_ADJUSTMENT } from "~/lib/projects/candidate-input";
import type { NpshJudgement } from "~/lib/projects/candidate-judgement";
import type { WorkbenchView } from "~/lib/projects/workbench-view";
import { renderUnits, SI_UNITS } from "~/lib/shared/units";

const NPSHR = 2.25; // m, made up
const judgement = (ratio: number): NpshJudgement => ({
  status: ratio < 1 ? "cavitation-risk" : "ok", marginRatio: ratio, at: "least lift, aged pipe", available: ratio * NPSHR, rule: "rule", requiredMargin: 1.1,
  judgedAt: [{ at: "least lift, aged pipe", flow: 0.03, available: ratio * NPSHR, required: NPSHR, marginRatio: ratio }, { at: "design point", flow: 0.03, available: 3, required: NPSHR, marginRatio: 3 / NPSHR }],
} as unknown as NpshJudgement);

/** The candidates table's "NPSH margin" cell for a candidate at this ratio (made-up figures). */
function ratioCell(ratio: number): string {
  const result = {
    status: "ok", message: "", ratio: 1, ratioNote: null, speed: null, diameter: null, curve: [], operating: { flow: 0.02, head: 20 }, allIntersections: [],
    figures: { efficiency: 0.7, hydraulicPower: 4000, shaftPower: 5700, bepFlow: 0.02, bepHead: 20, maxPower: 6000, motorLimit: null, nonOverloading: null, motorLoadAtDuty: null, annualEnergyKWh: null, annualCost: null, motor: null,
      bepRatio: 1, inPor: true, npshAvailable: ratio * NPSHR, npshRequired: NPSHR, npshMarginRatio: ratio, npshStatus: ratio < 1 ? "cavitation-risk" : "ok" },
    por: null, band: [], npsh: judgement(ratio), verdict: null, warnings: [],
  };
  const v = { evaluation: null, systemError: null, flowMax: 0.05, candidates: [{ id: 1, curveSetId: 1, label: "P", library: "L", adjustment: DEFAULT_ADJUSTMENT, result, error: null, energy: null }] } as unknown as WorkbenchView;
  const html = renderToStaticMarkup(createElement(CandidateTable, { view: v, unitSystem: SI_UNITS }));
  return (/<th scope="row"[^>]*>NPSH margin<\/th><td[^>]*>(.*?)<\/td>/.exec(html)?.[1] ?? "").replace(/<[^>]+>/g, "").replace(/&lt;/g, "<");
}

describe("an NPSH margin ratio just above zero", () => {
  it("1e-15 and 0.004 read '< 0.01'; 0.01 reads 0.01", () => {
    expect(npshMarginText(1e-15, 1.1)).toBe("< 0.01");
    expect(npshMarginText(0.004, 1.1)).toBe("< 0.01");
    expect(npshMarginText(0.01, 1.1)).toBe("0.01");
  });
  it("the table's NPSH margin row: '< 0.01 (cavitation-risk)' at 1e-15 / 2.25 (4.44e-16) and 0.004; '0.01 (cavitation-risk)' at 0.01", () => {
    expect(ratioCell(1e-15 / NPSHR)).toBe("< 0.01 (cavitation-risk: below 1)");
    expect(ratioCell(0.004)).toBe("< 0.01 (cavitation-risk: below 1)");
    expect(ratioCell(0.01)).toBe("0.01 (cavitation-risk: below 1)");
  });
  it("the band's lowest, range and points, and the verdict's NPSH qualifier, by the same rule", () => {
    for (const [r, shown] of [[1e-15, "< 0.01"], [0.004, "< 0.01"], [0.01, "0.01"]] as const) {
      const n = judgement(r);
      expect(npshLowestText(SI_UNITS, n)).toBe(`lowest ${shown} at least lift, aged pipe`);
      expect(npshJudgedRange(n)).toBe(`${shown} – 1.33`);
      expect(npshPointsText(SI_UNITS, n)).toMatch(new RegExp(`^least lift, aged pipe ${shown.replace(/[.<]/g, "\\$&")}; design point 1\\.33$`));
      expect(renderUnits(npshAgainstVerdict(n) ?? "", SI_UNITS)).toMatch(new RegExp(`\\(NPSHa / NPSHr ${shown.replace(/[.<]/g, "\\$&")}, below 1\\): cavitation risk$`));
    }
  });
});
