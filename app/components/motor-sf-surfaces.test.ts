// The operating point's motor running into its service factor (motor-service-factor.ts) on the Motor row of the candidates
// table (system page and report) and the selection CSV's `motor_service_factor_note`; nothing on a motor that covers the
// operating point. Check values: the energy fixture's invented pump (about 2.05 kW shaft at its operating point on the
// default system, read back from its figures), motors sized here around that power by hand arithmetic.
import { describe, expect, it } from "vitest";
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import Papa from "papaparse";
import { CandidateTable } from "./CandidateTable";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, evaluateCandidate, type Adjustment } from "~/lib/projects/hydraulics";
import { selectionCsv } from "~/lib/projects/selection-export.server";
import type { FrozenSelection } from "~/lib/projects/selections.server";
import type { WorkbenchView } from "~/lib/projects/workbench-view";
import { SI_UNITS } from "~/lib/shared/units";

const text = (html: string) => html.replace(/<[^>]*>/g, " ").replace(/&#x27;/g, "'").replace(/&amp;/g, "&").replace(/\s+/g, " ");
const PUMP = [[5, 21.8, 0.3], [10, 21.5, 0.45], [20, 20, 0.62], [30, 17.5, 0.72], [36, 15.5, 0.74], [45, 12, 0.7], [55, 7, 0.6]].map(([q, h, e]) => ({ flow: q / 3600, head: h, efficiency: e, power: null, npshr: null }));
const input = defaultSystemInput();
const shaft = evaluateCandidate(input, { points: PUMP, speed: 2900, impellerDiameter: null }, DEFAULT_ADJUSTMENT).figures!.shaftPower!;
const judged = (adj: Adjustment) => evaluateCandidate(input, { points: PUMP, speed: 2900, impellerDiameter: null }, adj);
const table = (adj: Adjustment) => {
  const view = { evaluation: null, systemError: null, flowMax: 0.02, needsReview: [], candidates: [{ id: 1, curveSetId: 1, label: "P", library: "L", adjustment: adj, result: judged(adj), error: null, energy: null }] } as unknown as WorkbenchView;
  return text(renderToStaticMarkup(createElement(CandidateTable, { view, unitSystem: SI_UNITS })));
};
const csvNote = (adj: Adjustment) => {
  const csv = selectionCsv(1, "t", { system: { input }, pump: { library: { traced: null } }, adjustment: adj, result: judged(adj), energy: null } as unknown as FrozenSelection);
  return Papa.parse<string[]>(csv.trim()).data.find((r) => r[0] === "figures" && r[1] === "motor_service_factor_note")?.[2];
};

describe("the Motor row and the CSV", () => {
  it("a motor 2 % below the operating point's shaft power, service factor 1.15: the note with load, rating and SF", () => {
    const adj = { ...DEFAULT_ADJUSTMENT, motorRating: shaft / 1.02, serviceFactor: 1.15 };
    expect(table(adj)).toMatch(/▲ runs into its service factor at the operating point: 102\.0 % load, one pump's [\d.]+ kW above its [\d.]+ kW rating, within rating × service factor 115 % \([\d.]+ kW\); a service factor is margin for occasional overload, not for continuous running \(common practice\)/);
    expect(csvNote(adj)).toMatch(/^runs into its service factor at the operating point: 102\.0 % load/);
  });
  it("a motor that covers the operating point: neither", () => {
    const adj = { ...DEFAULT_ADJUSTMENT, motorRating: shaft * 1.001, serviceFactor: 1.15 };
    expect(table(adj)).not.toContain("runs into its service factor");
    expect(csvNote(adj)).toBe("");
  });
});
