// A pump that passes (meets the duty, or oversized) whose NPSH could not be judged everywhere the rule names — its curve
// publishes no NPSHr at a point's flow (the NPSHr curve ends before it, or none at all), or no operating point there — was
// a plain "meets the duty" on its line (verdict-npsh.ts said nothing for an unknown status; only the NPSH cell said "not
// judged"). Now the line says "but NPSH not checked: the NPSHr curve ends at <flow>, and the pump runs past it at <flow>
// (<where>)" (where it stops since decision "npshone"; "the curve publishes no NPSHr at <flow> (<where>)" without any) on every surface
// that shows the verdict as a headline: candidates table and report (`npshNoteOf`), the chart's label, the CSV's
// `verdict_npsh`, the systems API's `verdictNpsh`, the search row (`searchResultView`). The flip is bisected on the
// system's least-lift static head, moving the least-lift corner's flow across the NPSHr curve's last published flow.
// Check values: the rule "NPSH is judged wherever the pump runs" (common practice); the pump is invented (the falling curve
// of npsh-ratio-sweep.test.ts, flat NPSHr 2.5 m up to a chosen flow); 0.008 m³/s = 28.8 m³/h (arithmetic).
import Papa from "papaparse";
import { describe, expect, it } from "vitest";
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { CandidateTable } from "~/components/CandidateTable";
import { candidateSeries, npshNoteOf } from "~/components/workbench";
import { NPSHR_END_ROUNDING } from "~/engine";
import { inSI } from "~/engine/quantityText";
import { renderUnits, SI_UNITS } from "~/lib/shared/units";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, evaluateCandidate, type SystemInput } from "./hydraulics";
import { selectionCsv } from "./selection-export.server";
import type { FrozenSelection } from "./selections.server";
import { searchResultView } from "./search-view";
import { verdictNpshNote, verdictNpshShort } from "./verdict-npsh";
import { workbenchApiView, type WorkbenchView } from "./workbench-view";

const FLOWS = [0, 0.004, 0.008, 0.012, 0.016]; // m³/s
/** The invented pump with NPSHr 2.5 m published up to `npshrTo` (m³/s) and none past it. */
const pump = (npshrTo: number) => ({
  points: FLOWS.map((q) => ({ flow: q, head: 24 - 84979 * q * q, efficiency: q === 0 ? 0 : 0.75 * (1 - ((q - 0.01) / 0.01) ** 2), power: null, npshr: q <= npshrTo ? 2.5 : null })),
  speed: 2900, impellerDiameter: null,
});
const evaluate = (input: SystemInput, npshrTo: number) => evaluateCandidate(input, pump(npshrTo), DEFAULT_ADJUSTMENT);
type R = ReturnType<typeof evaluate>;
const cand = (r: R) => ({ id: 1, curveSetId: 1, label: "P", library: "L", adjustment: DEFAULT_ADJUSTMENT, result: r, error: null, energy: null });
const view = (r: R) => ({ evaluation: null, systemError: null, flowMax: 0.02, needsReview: [], candidates: [cand(r)] }) as unknown as WorkbenchView;
const frozen = (r: R, input: SystemInput, npshrTo: number) => ({ result: r, system: { name: "S", input }, project: { name: "P" }, systemCurve: null, adjustment: DEFAULT_ADJUSTMENT, pump: { library: { name: "L", revision: 1 }, model: "M", points: pump(npshrTo).points }, energy: null }) as unknown as FrozenSelection;
const csvFigure = (r: R, input: SystemInput, npshrTo: number, key: string) => Papa.parse<string[]>(selectionCsv(1, "t", frozen(r, input, npshrTo)).trim()).data.find((row) => row[0] === "figures" && row[1] === key)?.[2];
const searchRow = (r: R) => searchResultView({ rank: 1, modelId: 1, curveSetId: 1, label: "P", model: "P", type: "", size: "", library: "L", setSpeed: 2900, setDiameter: null, method: "direct", ratio: 1, speed: 2900, diameter: null, ratioNote: null, verdict: r.verdict, npsh: r.npsh, stagedStart: [], operatingPoint: null, headAtDuty: 15, efficiency: null, shaftPower: null, npshr: null, npshMargin: null, bepRatio: null, inPor: null, score: 0, atTypedDuty: null, reason: "", warnings: [], cautions: [] } as never);

/** Every surface's NPSH words on the verdict's line, rendered in SI. */
function surfaces(r: R, input: SystemInput, npshrTo: number) {
  return {
    table: npshNoteOf(r, SI_UNITS) ?? "",
    label: candidateSeries(cand(r) as never, 0, SI_UNITS)!.label,
    api: inSI(workbenchApiView(view(r)).candidates[0].result!.verdictNpsh ?? ""),
    csv: csvFigure(r, input, npshrTo, "verdict_npsh") ?? "",
    search: inSI(searchRow(r).verdictNpsh ?? ""),
  };
}

describe("the NPSHr curve ends before the duty flow: 'NPSH not checked' on the verdict's line", () => {
  const input = defaultSystemInput(); // duty 0.01 m³/s (36 m³/h); NPSHr published to 0.008 m³/s (28.8 m³/h)
  const r = evaluate(input, 0.008);
  it("the case: meets the duty, NPSH unknown (no NPSHr at any point judged)", () => {
    expect(r.verdict?.status).toBe("meets");
    expect(r.npsh.status).toBe("unknown");
    expect(r.npsh.unjudged?.every((u) => u.why === "past the NPSHr curve's last flow")).toBe(true);
  });
  it("the qualifier names each flow without NPSHr and where (old code: null, a plain 'meets the duty')", () => {
    const note = renderUnits(verdictNpshNote(r.verdict, r.npsh) ?? "", SI_UNITS);
    expect(note).toMatch(/^but NPSH not checked: the NPSHr curve ends at 28\.8 m³\/h, and the pump runs past it at \d+\.\d m³\/h \(design point\), \d+\.\d m³\/h \(least lift, new pipe\), /);
    expect(verdictNpshShort(r.verdict, r.npsh)).toBe(", but NPSH not checked");
  });
  it("every surface says it: table and report, chart label, CSV verdict_npsh, systems API verdictNpsh, search row", () => {
    const s = surfaces(r, input, 0.008);
    for (const [where, text] of Object.entries(s)) expect(text, where).toMatch(/NPSH not checked/);
    expect(s.csv).toMatch(/^but NPSH not checked: the NPSHr curve ends at 28\.8 m³\/h, and the pump runs past it at \d+\.\d m³\/h \(design point\)/);
  });
  it("the table's NPSH margin row says what it did at the operating point (was a bare '—')", () => {
    const html = renderToStaticMarkup(createElement(CandidateTable, { view: view(r), unitSystem: SI_UNITS }));
    const cell = (/<th scope="row"[^>]*>NPSH margin<\/th><td[^>]*>(.*?)<\/td>/.exec(html)?.[1] ?? "").replace(/<[^>]+>/g, "");
    expect(cell).toMatch(/^not checked: the NPSHr curve ends at 28\.8 m³\/h, and the pump runs past it at \d+\.\d m³\/h$/);
  });
  it("no NPSHr column at all: the same words", () => {
    const none = evaluate(input, -1);
    expect(renderUnits(verdictNpshNote(none.verdict, none.npsh) ?? "", SI_UNITS)).toMatch(/^but NPSH not checked: the curve publishes no NPSHr at /);
  });
  it("a verdict that is no pass ('short') is not qualified by an unknown NPSH: the verdict already fails", () => {
    const short = evaluate({ ...input, duty: { flow: 0.015, head: 22 } }, 0.008);
    expect(short.verdict?.status).not.toBe("meets");
    expect(short.verdict?.status).not.toBe("oversized");
    expect(short.npsh.status).toBe("unknown");
    expect(verdictNpshNote(short.verdict, short.npsh)).toBeNull();
  });
});

describe("the flip: the least-lift corner's flow crossing the NPSHr curve's last published flow (0.012 m³/s) and its rounding allowance", () => {
  const END = 0.012;
  // A flow within 1 part in 10⁸ of the last published flow reads the NPSHr there (engine npshrEnds.ts NPSHR_END_ROUNDING):
  // the flip lies at END × (1 + 1e-8), the allowance's edge (npshr-end-rounding.test.ts: 1e-12 past judged, 1e-6 not).
  const EDGE = END * (1 + NPSHR_END_ROUNDING);
  const at = (staticLow: number) => evaluate({ ...defaultSystemInput(), staticLow }, END);
  const maxFlow = (r: R) => Math.max(...(r.npsh.judgedAt ?? []).map((p) => p.flow ?? 0));
  // The least lift lowered moves its corner's flow up (bisection on the static head, m): lo judged everywhere, hi not.
  let lo = 10, hi = 0;
  for (let i = 0; i < 60; i++) { const mid = (lo + hi) / 2; if (maxFlow(at(mid)) <= EDGE) lo = mid; else hi = mid; }
  const judged = at(lo), past = at(hi);
  it("bisection found it: every point judged on one side, one corner just past the NPSHr's allowance on the other", () => {
    expect(hi - lo).toBeLessThan(1e-9);
    expect(maxFlow(judged)).toBeLessThanOrEqual(EDGE);
    expect(maxFlow(judged)).toBeGreaterThan(END); // judged a rounding error past the published end
    expect(maxFlow(past)).toBeGreaterThan(EDGE);
    for (const r of [judged, past]) expect(["meets", "oversized"]).toContain(r.verdict?.status);
  });
  it("judged everywhere: the verdict carries no 'not checked' (NPSHa / NPSHr well above 1.1 here: nothing)", () => {
    expect(judged.npsh.status).toBe("ok");
    expect(verdictNpshNote(judged.verdict, judged.npsh)).toBeNull();
    for (const [where, text] of Object.entries(surfaces(judged, { ...defaultSystemInput(), staticLow: lo }, END))) expect(text, where).not.toMatch(/not checked/);
  });
  it("a corner just past it: 'but NPSH not checked: … no NPSHr at … (least lift, new pipe); where judged, the lowest …'", () => {
    expect(past.npsh.status).toBe("unknown");
    const note = renderUnits(verdictNpshNote(past.verdict, past.npsh) ?? "", SI_UNITS);
    // The corner's flow lies 1 part in 10⁸ past the end (bisected to 1e-15): 43.200000432 m³/h, "43.2000004" at the 9
    // significant digits a text prints, apart from the end's "43.2" (the old allowance, 1 part in 10⁹, read "43.2000000").
    expect(note).toMatch(/^(but|and) NPSH not checked: the NPSHr curve ends at 43\.2 m³\/h, and the pump runs past it at 43\.2000004 m³\/h \(least lift, new pipe\)(, [^;]+)?; where judged, the lowest NPSHa \/ NPSHr is \d+\.\d\d at /);
    for (const [where, text] of Object.entries(surfaces(past, { ...defaultSystemInput(), staticLow: hi }, END))) expect(text, where).toMatch(/NPSH not checked/);
  });
});
