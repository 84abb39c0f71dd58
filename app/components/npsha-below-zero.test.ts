// NPSHa a hair below zero printed its digits ("-0.000001 m", "-0.000003 ft") where a hair above zero read "< 0.001 m".
// One rule now, in one place (quantityText.ts `nearZeroWords`), for every NPSHa printed in a text, SI and US alike: where
// the three decimals the magnitude rule shows below 1 would read the value as zero though it is not (|v| below 0.0005 in
// the unit shown), it reads by its side of zero — "< 0.001 m" above, "below 0 m" below; zero reads "0.000 m"; every value
// those decimals tell from zero prints as a number (0.0005 m "0.001 m", −0.0005 m "-0.001 m"). The flips are at 0,
// −0.0005 and +0.0005 in the unit shown; the surfaces: the NPSHa / NPSHr pair, the band's points and lowest, the NPSH
// margin row, the verdict's NPSH qualifier, the engine's NPSH warning at the operating point and the band's, the system's
// warning at zero flow, the search's note at the duty, the chart's readout and table view. Check values: 1 ft = 0.3048 m
// exactly (NIST SP 811); NPSHa = (p − p_v)/(ρg) + z − h_f (common practice), so p = p_v and z = −1e-6 m give −1e-6 m;
// NPSHr 2.25 m is made up.
import { describe, expect, it } from "vitest";
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { CandidateTable } from "./CandidateTable";
import { npshLowestText, npshPairText, npshPointsText } from "./candidate-figures";
import { formatNpshaValue } from "./chart/format";
import { npshNoteOf } from "./workbench";
import { qtAboveZero } from "~/engine/quantityText";
import type { NpshJudgement } from "~/lib/projects/candidate-judgement";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, evaluateCandidate, npshaAtZeroFlow } from "~/lib/projects/hydraulics";
import { npshaAtDutyNote } from "~/lib/projects/search-npsha";
import { npshAgainstVerdict } from "~/lib/projects/verdict-npsh";
import type { WorkbenchView } from "~/lib/projects/workbench-view";
import { fmtQAboveZero, renderUnits, SI_UNITS, US_UNITS } from "~/lib/shared/units";

const FT = 0.3048; // m, exact
const NPSHR = 2.25; // m, made up
const E = 1e-6; // relative step either side of a flip
/** Each flip (in the unit shown) with the words just below and just above it. */
const FLIPS: [at: number, below: string, above: string][] = [
  [-0.0005, "−0.001", "below 0"], // "-0.001" before the true minus (helper "numtext")
  [0, "below 0", "< 0.001"],
  [0.0005, "< 0.001", "0.001"],
];
const side = (at: number, s: -1 | 1) => (at === 0 ? s * 1e-6 : at * (1 + (s * E * Math.sign(at)))); // just below (−1) or above (+1) `at`

describe("the one rule, flipping at −0.0005, 0 and +0.0005 in the unit shown", () => {
  it("SI: '−0.001 m' | 'below 0 m' | '0.000 m' | '< 0.001 m' | '0.001 m' (old code: '-0.000499… m', '-0.000001 m', '< 0.001 m' up to 0.001 m)", () => {
    for (const [at, below, above] of FLIPS) {
      expect(fmtQAboveZero(SI_UNITS, "head", side(at, -1)), `just below ${at} m`).toBe(`${below} m`);
      expect(fmtQAboveZero(SI_UNITS, "head", side(at, 1)), `just above ${at} m`).toBe(`${above} m`);
    }
    expect(fmtQAboveZero(SI_UNITS, "head", 0)).toBe("0.000 m");
    expect(fmtQAboveZero(SI_UNITS, "head", -1e-6)).toBe("below 0 m");
  });
  it("US, the same flips in ft (0.0005 ft = 0.0001524 m)", () => {
    for (const [at, below, above] of FLIPS) {
      expect(fmtQAboveZero(US_UNITS, "head", side(at, -1) * FT), `just below ${at} ft`).toBe(`${below} ft`);
      expect(fmtQAboveZero(US_UNITS, "head", side(at, 1) * FT), `just above ${at} ft`).toBe(`${above} ft`);
    }
    expect(fmtQAboveZero(US_UNITS, "head", -1e-6)).toBe("below 0 ft"); // −3.28e-6 ft (old code: '-0.000003 ft')
  });
  it("the chart's readout and table view (display units), from the same rule", () => {
    for (const [at, below, above] of FLIPS) {
      expect(formatNpshaValue(side(at, -1))).toBe(below);
      expect(formatNpshaValue(side(at, 1))).toBe(above);
    }
    expect(formatNpshaValue(0)).toBe("0.000"); // NPSHa at zero as the candidates table writes it (decision "surfaces2": the chart prints numbers as the app does)
  });
  it("a token read apart from its NPSHr too: '−0.001 m' stays a number, never '0.000'", () => {
    expect(renderUnits(qtAboveZero("head", -0.0006, [NPSHR]), SI_UNITS)).toBe("−0.001 m");
    expect(renderUnits(qtAboveZero("head", -0.0004, [NPSHR]), SI_UNITS)).toBe("below 0 m");
  });
});

describe("every surface that prints NPSHa a hair below zero reads 'below 0 m' ('below 0 ft')", () => {
  const zeroJudgement = (a: number): NpshJudgement => ({ status: "cavitation-risk", marginRatio: null, at: "least lift, aged pipe", available: a, rule: "rule", requiredMargin: 1.1,
    judgedAt: [{ at: "least lift, aged pipe", flow: 0.03, available: a, required: NPSHR, marginRatio: null }], unjudged: [] } as NpshJudgement);
  it("the pair, the band's points and lowest", () => {
    expect(npshPairText(SI_UNITS, -1e-6, NPSHR)).toBe("below 0 m / 2.25 m");
    expect(npshPairText(US_UNITS, -1e-6, NPSHR)).toBe("below 0 ft / 7.38 ft"); // 2.25 / 0.3048 = 7.38
    expect(npshPointsText(SI_UNITS, zeroJudgement(-1e-6))).toBe("least lift, aged pipe NPSHa below 0 m");
    expect(npshLowestText(SI_UNITS, zeroJudgement(-1e-6))).toBe("NPSHa below 0 m at least lift, aged pipe");
  });
  it("the verdict's NPSH qualifier (old code: 'NPSHa -0.000001 m, at or below zero, …')", () => {
    expect(renderUnits(npshAgainstVerdict(zeroJudgement(-1e-6))!, SI_UNITS)).toBe("NPSHa below 0 m, at or below zero, at least lift, aged pipe: cavitation risk whatever the pump's NPSHr");
    expect(renderUnits(npshAgainstVerdict(zeroJudgement(-1e-6))!, US_UNITS)).toMatch(/^NPSHa below 0 ft, at or below zero, /);
    expect(renderUnits(npshAgainstVerdict(zeroJudgement(-0.0006))!, SI_UNITS)).toMatch(/^NPSHa −0\.001 m, at or below zero, /);
  });
  it("the system's warning at zero flow and the search's note at the duty", () => {
    const input = { ...defaultSystemInput(), suctionSurfacePressure: 2339, suctionStaticHead: -1e-6 };
    expect(renderUnits(npshaAtZeroFlow(input, { density: 998.2, vaporPressure: 2339 })!, SI_UNITS)).toMatch(/^NPSH available is below 0 m already at zero flow, not above zero: /);
    expect(renderUnits(npshaAtDutyNote(-1e-6, 0)!, US_UNITS)).toMatch(/^NPSHa at the duty is below 0 ft, at or below zero: /);
  });
  it("a candidate bisected to NPSHa just below zero: the NPSH margin row, the verdict's line and the warnings", () => {
    const points = [0, 0.004, 0.008, 0.012, 0.016].map((q) => ({ flow: q, head: 24 - 84979 * q * q, efficiency: q === 0 ? 0 : 0.75 * (1 - ((q - 0.01) / 0.01) ** 2), power: null, npshr: 2.5 }));
    const at = (z: number) => evaluateCandidate({ ...defaultSystemInput(), suctionStaticHead: z }, { points, speed: 2900, impellerDiameter: null }, DEFAULT_ADJUSTMENT);
    let lo = -15, hi = 0;
    for (let i = 0; i < 80; i++) { const mid = (lo + hi) / 2; if (at(mid).figures!.npshAvailable! > 0) hi = mid; else lo = mid; }
    const r = at(lo);
    const a = r.figures!.npshAvailable!;
    expect(a).toBeLessThan(0);
    expect(a).toBeGreaterThan(-1e-9);
    const view = { evaluation: null, systemError: null, flowMax: 0.02, needsReview: [], candidates: [{ id: 1, curveSetId: 1, label: "P", library: "L", adjustment: DEFAULT_ADJUSTMENT, result: r, error: null, energy: null }] } as unknown as WorkbenchView;
    const html = renderToStaticMarkup(createElement(CandidateTable, { view, unitSystem: SI_UNITS }));
    const row = (name: string) => (new RegExp(`<th scope="row"[^>]*>${name}</th><td[^>]*>(.*?)</td>`).exec(html)?.[1] ?? "").replace(/<[^>]+>/g, "");
    expect(row("NPSH margin")).toBe("NPSHa below 0 m, at or below zero (cavitation-risk)"); // old code: "NPSHa -0.000000000000002 m, …"
    expect(row("NPSHa / NPSHr \\(design curve\\)")).toBe("below 0 m / 2.50 m");
    expect(r.warnings.map((w) => renderUnits(w, SI_UNITS))).toContain("NPSHa below 0 m is not above zero: cavitation risk whatever the pump's NPSHr");
    // The least NPSHa over the band decides the verdict's line: a corner's, further below zero, or the design point's.
    expect(npshNoteOf(r, SI_UNITS)).toMatch(/^(but|and) NPSHa (below 0 m|−\d+\.\d+ m), at or below zero, at /);
    expect(npshNoteOf(r, SI_UNITS)).not.toMatch(/-0\.0000/);
  });
});
