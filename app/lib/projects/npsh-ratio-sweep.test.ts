// The NPSH margin ratio NPSHa / NPSHr on every surface that prints one, with NPSHa just above zero and at or below it:
// none where NPSHa ≤ 0 (it means nothing there; NPSHa beside it decides, a cavitation risk whatever the pump — decision
// "npshtruth"), from the source (engine `operatingFigures`, the band's points) through the candidates table (system page and
// report), the verdict's line (report, chart label), the selection CSV and JSON and the systems read API; a selection
// frozen before, holding the negative ratios then computed, is read the same way. The search row carries no ratio at an
// NPSHa ≤ 0 (the search rejects every pump with an NPSHr there, search-npsh.server.test.ts); the field check prints no NPSH.
// Check values: NPSHa = (p_s − p_v)/(ρg) + z_s − h_f (common practice), the flip found by bisection on the suction static
// head; the pump is invented (candidate-table-edges.test.ts's falling curve, flat NPSHr 2.5 m).
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import Papa from "papaparse";
import { describe, expect, it } from "vitest";
import { CandidateTable } from "~/components/CandidateTable";
import { candidateSeries, npshNoteOf } from "~/components/workbench";
import { SI_UNITS } from "~/lib/shared/units";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, evaluateCandidate, type SystemInput } from "./hydraulics";
import { selectionCsv, selectionJson } from "./selection-export.server";
import type { FrozenSelection } from "./selections.server";
import { workbenchApiView, type WorkbenchView } from "./workbench-view";

const points = [0, 0.004, 0.008, 0.012, 0.016].map((q) => ({ flow: q, head: 24 - 84979 * q * q, efficiency: q === 0 ? 0 : 0.75 * (1 - ((q - 0.01) / 0.01) ** 2), power: null, npshr: 2.5 }));
const inputAt = (z: number): SystemInput => ({ ...defaultSystemInput(), suctionStaticHead: z });
const evaluate = (z: number) => evaluateCandidate(inputAt(z), { points, speed: 2900, impellerDiameter: null }, DEFAULT_ADJUSTMENT);
type R = ReturnType<typeof evaluate>;

// The suction static head where NPSHa at the design point is zero (bisection, m): NPSHa grows with it.
let lo = -15, hi = 0;
for (let i = 0; i < 80; i++) { const mid = (lo + hi) / 2; if (evaluate(mid).figures!.npshAvailable! > 0) hi = mid; else lo = mid; }
const below = evaluate(lo), above = evaluate(hi), deep = evaluate(lo - 1);

type Pt = { available: number | null | undefined; ratio: number | null | undefined; required?: number | null };
const pointsOf = (r: { figures: R["figures"]; band: R["band"]; npsh: R["npsh"] }): Pt[] => [
  { available: r.figures!.npshAvailable, ratio: r.figures!.npshMarginRatio, required: r.figures!.npshRequired },
  ...r.band.map((b) => ({ available: b.npshAvailable, ratio: b.npshMarginRatio, required: b.npshRequired })),
  ...(r.npsh.judgedAt ?? []).map((p) => ({ available: p.available, ratio: p.marginRatio, required: p.required })),
];
/** Each point: no ratio where NPSHa ≤ 0, NPSHa / NPSHr above it. */
function expectRatios(ps: Pt[]) {
  for (const p of ps) {
    if (p.available! <= 0) expect(p.ratio, JSON.stringify(p)).toBeNull();
    else expect(p.ratio!, JSON.stringify(p)).toBeCloseTo(p.available! / p.required!, 12);
  }
}
/** What the evaluation froze before this decision: NPSHa / NPSHr everywhere NPSHr is known, negative where NPSHa < 0. */
function frozenOld(r: R): R {
  const old = <T extends { npshAvailable?: number | null; npshRequired?: number | null }>(b: T) => ({ ...b, npshMarginRatio: b.npshAvailable! / b.npshRequired! });
  return { ...r, figures: old(r.figures!), band: r.band.map(old), npsh: { ...r.npsh, judgedAt: r.npsh.judgedAt!.map((p) => ({ ...p, marginRatio: p.available! / p.required! })) } };
}
const frozenOf = (r: R, z: number) => ({ result: r, system: { name: "S", input: inputAt(z) }, project: { name: "P" }, systemCurve: null, adjustment: DEFAULT_ADJUSTMENT, pump: { library: { name: "L", revision: 1 }, model: "M", points }, energy: null }) as unknown as FrozenSelection;
const viewOf = (r: R) => ({ evaluation: null, systemError: null, flowMax: 0.02, needsReview: [], candidates: [{ id: 1, curveSetId: 1, label: "P", library: "L", adjustment: DEFAULT_ADJUSTMENT, result: r, error: null, energy: null }] }) as unknown as WorkbenchView;
function tableCells(r: R): Record<string, string> {
  const html = renderToStaticMarkup(createElement(CandidateTable, { view: viewOf(r), unitSystem: SI_UNITS })).replace(/&#x27;/g, "'");
  return Object.fromEntries([...html.matchAll(/<tr[^>]*>(.*?)<\/tr>/gs)].map((m) => [...m[1].matchAll(/<t[hd][^>]*>(.*?)<\/t[hd]>/gs)].map((x) => x[1].replace(/<[^>]+>/g, ""))).filter((t) => t.length >= 2).map((t) => [t[0], t[1]]));
}
const csvFigure = (r: R, z: number, key: string) => Papa.parse<string[]>(selectionCsv(1, "t", frozenOf(r, z)).trim()).data.find((row) => row[0] === "figures" && row[1] === key)![2];
const NO_RATIO_TEXT = /(^|[^\w.])-\d+\.\d+(?![\d.])(?! m)/; // a negative number that is not a head in m

describe("the case, at the source: NPSHa at the design point just above zero and at or below it", () => {
  it("bisection found the flip: NPSHr 2.5 m known at the design point on both sides", () => {
    expect(below.figures!.npshAvailable!).toBeLessThanOrEqual(0);
    expect(above.figures!.npshAvailable!).toBeGreaterThan(0);
    expect(hi - lo).toBeLessThan(1e-9);
    for (const r of [below, above, deep]) expect(r.figures!.npshRequired).toBe(2.5);
  });
  it("figures, band and judged points: no ratio where NPSHa ≤ 0 (old code: NPSHa / NPSHr, ≤ 0), NPSHa / NPSHr above", () => {
    expect(below.figures!.npshMarginRatio).toBeNull(); // old code: -0 or a tiny negative ratio
    expect(deep.figures!.npshMarginRatio).toBeNull(); // old code: about -0.4 (1 m further down: NPSHa about -1 m / 2.5 m)
    expect(above.figures!.npshMarginRatio!).toBeGreaterThan(0);
    for (const r of [below, above, deep]) expectRatios(pointsOf(r));
    for (const r of [below, deep]) expect(r.npsh.status).toBe("cavitation-risk");
  });
});

describe("every surface, live and frozen before (negative ratios kept then)", () => {
  const cases = [["NPSHa ≤ 0 at the flip", below, lo], ["NPSHa 1 m below zero", deep, lo - 1]] as const;
  for (const [name, live, z] of cases) for (const [how, r] of [["live", live], ["frozen before", frozenOld(live)]] as const) {
    it(`${name}, ${how}: the systems API and the selection JSON give null ratios where NPSHa ≤ 0, NPSHa kept`, () => {
      const api = workbenchApiView(viewOf(r)).candidates[0].result!;
      expectRatios(pointsOf(api as never));
      const json = selectionJson({ id: 1, title: "t", note: "", createdAt: new Date(0) }, frozenOf(r, z));
      expectRatios(pointsOf(json.result as never));
    });
    it(`${name}, ${how}: the CSV leaves the ratio blank beside NPSHa; the table, the verdict's line and the chart label read NPSHa`, () => {
      expect(csvFigure(r, z, "npsh_margin_ratio")).toBe("");
      expect(Number(csvFigure(r, z, "npsh_available"))).toBeLessThanOrEqual(0);
      const cells = tableCells(r);
      expect(cells["NPSH margin"]).toMatch(/^NPSHa (−?\d+\.\d+|below 0) m, at or below zero \(cavitation-risk\)$/); // a hair below zero "below 0 m" (decision "npshone")
      expect(cells["NPSH margin over the band"]).toMatch(/NPSHa (−?\d+\.\d+|below 0) m at [^(]*\(cavitation-risk: NPSHa at or below zero\)$/); // ratios only where NPSHa > 0
      expect(cells["NPSH margin over the band"]).not.toMatch(NO_RATIO_TEXT);
      const note = npshNoteOf(r, SI_UNITS)!;
      expect(note).toMatch(/NPSHa (−?\d+\.\d+|below 0) m, at or below zero/);
      expect(note).not.toMatch(/NPSHa \/ NPSHr/);
      const label = candidateSeries({ id: 1, curveSetId: 1, label: "P", library: "L", adjustment: DEFAULT_ADJUSTMENT, result: r, error: null, energy: null } as never, 0, SI_UNITS)!.label;
      expect(label).not.toMatch(NO_RATIO_TEXT);
      expect(label).not.toMatch(/NPSHa \/ NPSHr/);
    });
  }
  it("the flip, NPSHa just above zero at the design point: the ratio is given on each surface (below 1: cavitation risk)", () => {
    const api = workbenchApiView(viewOf(above)).candidates[0].result!;
    expect(api.figures!.npshMarginRatio!).toBeGreaterThan(0);
    expect((selectionJson({ id: 1, title: "t", note: "", createdAt: new Date(0) }, frozenOf(above, hi)).result.figures as { npshMarginRatio: number }).npshMarginRatio).toBeGreaterThan(0);
    expect(Number(csvFigure(above, hi, "npsh_margin_ratio"))).toBeGreaterThan(0);
    expect(tableCells(above)["NPSH margin"].replace(/&lt;/g, "<")).toBe("< 0.01 (cavitation-risk: below 1)"); // NPSHa / NPSHr just above zero (was "4.44e-16 …"; tiny-ratio.test.ts)
    expect(tableCells(above)["NPSH margin"]).not.toMatch(/at or below zero/);
  });
});
