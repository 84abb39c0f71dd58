// The pipe-run table's Reynolds number beside its regime reads apart from the regime's ends in every unit choice (Re is
// dimensionless): 3999.6, in the transition, read "4.00e+3" beside "transition" (turbulent from 4000). Other values read
// as before. Check values: the regimes ≤ 2000 laminar, ≥ 4000 turbulent (common practice, engine headLoss.ts regimeOf);
// the run's other figures are made up (the table prints them as given).
import { createElement } from "react";
import { renderToString } from "react-dom/server";
import { describe, expect, test } from "vitest";
import { SI_UNITS, US_UNITS } from "~/lib/shared/units";
import type { WorkbenchView } from "~/lib/projects/workbench-view";
import { RunTable } from "./workbench";

const run = (reynolds: number, regime: string) => ({ name: "Suction line", side: "suction", velocity: 0.05, reynolds, frictionFactor: 0.04, regime, headLoss: 0.01, warnings: [] });
const html = (reynolds: number, regime: string, units = SI_UNITS) =>
  renderToString(createElement(RunTable, { view: { evaluation: { dutyFlow: 0.0003, runs: [run(reynolds, regime)] } } as unknown as WorkbenchView, unitSystem: units }));

describe("the Re cell beside the regime", () => {
  test("3999.6 (transition) and 2000.4 (transition) read inside the band, in SI and US units", () => {
    for (const units of [SI_UNITS, US_UNITS]) {
      expect(html(3999.6, "transition", units)).toContain("<td>3.9996e+3</td><td>0.0400</td><td>transition</td>");
      expect(html(2000.4, "transition", units)).toContain("<td>2.0004e+3</td>");
    }
  });
  test("elsewhere as before: three significant digits", () => {
    expect(html(71050, "turbulent")).toContain("<td>7.11e+4</td>");
    expect(html(4000, "turbulent")).toContain("<td>4.00e+3</td>");
  });
});
