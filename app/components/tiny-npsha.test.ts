// NPSHa just above zero (1e-15 m: a suction a hair above the liquid's boiling) printed by the tiny-number rule, "1.00e-15 m"
// beside NPSHr and "0.000000000000001 m" beside zero: correct but unreadable, as the ratio was before "< 0.01"
// (tiny-ratio.test.ts). Now NPSHa above zero that the unit's three decimals would show as 0.000 reads "< 0.001 m" ("< 0.001
// ft" in US units; below 0.0005 in the unit shown since decision "npshone", which made a hair below zero read "below 0 m":
// npsha-below-zero.test.ts), on every surface that prints it as text: the candidates table's NPSHa / NPSHr row (system page and
// report), the band's points (table and search row), the verdict's NPSH qualifier, the engine's cavitation warning, the
// search page's count of pumps left out for NPSH, a staged step's NPSH warning, the chart's readout and table view. From
// 0.0005 in the unit shown up it prints as a number ("0.001 m"); zero as before. CSV and JSON keep the number.
// Check values: 1e-15 m and 1 ft = 0.3048 m (exact, by definition), so 0.0005 ft = 0.0001524 m; NPSHr 2.25 m is made up;
// 0.001 is the three decimals the magnitude rule shows below 1 (quantityText.ts `decimalsFor`), and 0.0005 rounds to it.
import { describe, expect, it } from "vitest";
import Papa from "papaparse";
import { createPumpCurve, operatingFigures } from "~/engine";
import { qtAboveZero } from "~/engine/quantityText";
import { npshLowestText, npshPairText, npshPointsText } from "./candidate-figures";
import { npshAgainstVerdict } from "~/lib/projects/verdict-npsh";
import { npshLeftOutText } from "~/lib/projects/search-npsha";
import type { NpshJudgement } from "~/lib/projects/candidate-judgement";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, evaluateCandidate } from "~/lib/projects/hydraulics";
import { selectionCsv } from "~/lib/projects/selection-export.server";
import type { FrozenSelection } from "~/lib/projects/selections.server";
import { renderUnits, SI_UNITS, US_UNITS } from "~/lib/shared/units";
import { formatNpshaValue } from "./chart/format";
import { buildChartModel } from "./chart/model";
import { readoutText } from "./chart/readout";
import { linePump } from "./chart/test-pumps";

const NPSHR = 2.25; // m, made up
const FT = 0.3048; // m, exact
const cavitating = (a: number): NpshJudgement => ({
  status: "cavitation-risk", marginRatio: a / NPSHR, at: "least lift, aged pipe", available: a, rule: "rule", requiredMargin: 1.1,
  judgedAt: [{ at: "least lift, aged pipe", flow: 0.03, available: a, required: NPSHR, marginRatio: a / NPSHR }],
} as NpshJudgement);
const unjudged = (a: number): NpshJudgement => ({
  status: "unknown", marginRatio: null, at: null, available: null, rule: "rule", requiredMargin: 1.1,
  judgedAt: [{ at: "design point", flow: 0.03, available: a, required: null, marginRatio: null }], unjudged: [{ at: "design point", why: "no NPSHr at that flow" }],
} as NpshJudgement);

describe("NPSHa above zero that three decimals in the unit shown read as zero reads '< 0.001'", () => {
  it("the NPSHa / NPSHr row: '< 0.001 m / 2.25 m' (was '1.00e-15 m / 2.25 m'), US '< 0.001 ft / 7.38 ft'", () => {
    expect(npshPairText(SI_UNITS, 1e-15, NPSHR)).toBe("< 0.001 m / 2.25 m");
    expect(npshPairText(US_UNITS, 1e-15, NPSHR)).toBe("< 0.001 ft / 7.38 ft"); // 2.25 / 0.3048 = 7.38
  });
  it("flips where three decimals stop reading it as zero: 0.0004995 m '< 0.001 m', 0.0005005 m '0.001 m'; in ft at 0.0005 ft (0.0001524 m)", () => {
    expect(npshPairText(SI_UNITS, 0.0005 * (1 - 1e-3), NPSHR)).toBe("< 0.001 m / 2.25 m");
    expect(npshPairText(SI_UNITS, 0.0005 * (1 + 1e-3), NPSHR)).toBe("0.001 m / 2.25 m"); // decision "npshone" (was '< 0.001 m' up to 0.001 m)
    expect(npshPairText(SI_UNITS, 0.001, NPSHR)).toBe("0.001 m / 2.25 m");
    expect(npshPairText(US_UNITS, 0.0005 * FT * (1 - 1e-9), NPSHR)).toBe("< 0.001 ft / 7.38 ft");
    expect(npshPairText(US_UNITS, 0.0005 * FT * (1 + 1e-9), NPSHR)).toBe("0.001 ft / 7.38 ft");
  });
  it("zero as before, below zero a number or 'below 0 m' (said at or below zero elsewhere), never '< 0.001'", () => {
    expect(npshPairText(SI_UNITS, 0, NPSHR)).toBe("0.000 m / 2.25 m");
    expect(npshPairText(SI_UNITS, -0.25, NPSHR)).toBe("−0.250 m / 2.25 m"); // true minus (helper "numtext")
    expect(npshPairText(SI_UNITS, -1e-15, NPSHR)).toBe("below 0 m / 2.25 m");
  });
  it("the band's points where NPSHr is unknown (table cell's title) and the lowest where NPSHa decides", () => {
    expect(npshPointsText(SI_UNITS, unjudged(1e-15))).toBe("design point NPSHa < 0.001 m"); // was "NPSHa 0.000000000000001 m"
    expect(npshPointsText(US_UNITS, unjudged(1e-15))).toBe("design point NPSHa < 0.001 ft");
    expect(npshLowestText(SI_UNITS, { ...unjudged(1e-15), at: "design point", available: 1e-15 })).toBe("NPSHa < 0.001 m at design point");
    expect(npshPointsText(SI_UNITS, unjudged(0.001))).toBe("design point NPSHa 0.001 m");
  });
  it("the verdict's NPSH qualifier (report, table, search row, CSV verdict_npsh, API verdictNpsh)", () => {
    expect(renderUnits(npshAgainstVerdict(cavitating(1e-15))!, SI_UNITS)).toBe("NPSHa < 0.001 m below NPSHr 2.25 m at least lift, aged pipe (NPSHa / NPSHr < 0.01, below 1): cavitation risk");
    expect(renderUnits(npshAgainstVerdict(cavitating(1e-15))!, US_UNITS)).toMatch(/^NPSHa < 0\.001 ft below NPSHr 7\.38 ft /);
    expect(renderUnits(npshAgainstVerdict(cavitating(0.001))!, SI_UNITS)).toMatch(/^NPSHa 0\.001 m below NPSHr 2\.25 m /);
  });
  it("the engine's cavitation warning at the operating point", () => {
    const curve = createPumpCurve({ points: [0, 0.01, 0.02].map((q) => ({ flow: q, head: 30 - 20000 * q * q, npshr: NPSHR })) });
    const fluid = { density: 998.2, vaporPressure: 2339, dynamicViscosity: 1.0016e-3, kinematicViscosity: 1.0034e-6 };
    // NPSHa = (p − p_v)/(ρ g) + z − h_f (common practice): the surface 1e-11 Pa above the vapour pressure, z = h_f = 0,
    // gives NPSHa = 1e-11 / (998.2 × 9.80665) ≈ 1.02e-15 m.
    const f = operatingFigures({ curve, flow: 0.01, fluid: fluid as never, suction: { surfacePressure: 2339 + 1e-11, staticSuctionHead: 0, suctionLoss: 0 } });
    const a = f.npsh!.available;
    expect(a).toBeGreaterThan(0);
    expect(a).toBeLessThan(1e-14);
    const w = f.warnings.find((x) => x.code === "npsh-cavitation")!.message;
    expect(renderUnits(w, SI_UNITS)).toBe("NPSHa < 0.001 m is below NPSHr 2.25 m: cavitation risk"); // was "NPSHa 1.02e-15 m is below …"
  });
  it("the search page's count of pumps left out for NPSH at the duty", () => {
    expect(renderUnits(npshLeftOutText(3, 1e-15), SI_UNITS)).toBe("3 left out because their NPSHr at the duty is above the NPSHa there (< 0.001 m)");
    expect(renderUnits(npshLeftOutText(3, 1e-15), US_UNITS)).toBe("3 left out because their NPSHr at the duty is above the NPSHa there (< 0.001 ft)");
  });
  it("a token for a reading judged by its side of zero carries its mark even with nothing to read apart from", () => {
    expect(renderUnits(qtAboveZero("head", 1e-15, []), SI_UNITS)).toBe("< 0.001 m");
    expect(renderUnits(qtAboveZero("head", 1.2345, []), SI_UNITS)).toBe("1.23 m");
    expect(renderUnits(qtAboveZero("head", -1e-15, []), SI_UNITS)).toBe("below 0 m"); // a hair below zero (decision "npshone"; it printed its digits)
  });
});

describe("a selection at NPSHa 1e-15 m above zero: the CSV keeps the number", () => {
  it("npsh_available is the number, never '< 0.001'", () => {
    const points = [0, 0.004, 0.008, 0.012, 0.016].map((q) => ({ flow: q, head: 24 - 84979 * q * q, efficiency: q === 0 ? 0 : 0.75 * (1 - ((q - 0.01) / 0.01) ** 2), power: null, npshr: 2.5 }));
    const at = (z: number) => evaluateCandidate({ ...defaultSystemInput(), suctionStaticHead: z }, { points, speed: 2900, impellerDiameter: null }, DEFAULT_ADJUSTMENT);
    let lo = -15, hi = 0;
    for (let i = 0; i < 80; i++) { const mid = (lo + hi) / 2; if (at(mid).figures!.npshAvailable! > 0) hi = mid; else lo = mid; }
    const r = at(hi);
    const a = r.figures!.npshAvailable!;
    expect(a).toBeGreaterThan(0);
    expect(a).toBeLessThan(1e-9);
    const frozen = { result: r, system: { name: "S", input: { ...defaultSystemInput(), suctionStaticHead: hi } }, project: { name: "P" }, systemCurve: null, adjustment: DEFAULT_ADJUSTMENT, pump: { library: { name: "L", revision: 1 }, model: "M", points }, energy: null } as unknown as FrozenSelection;
    const row = Papa.parse<string[]>(selectionCsv(1, "t", frozen).trim()).data.find((x) => x[0] === "figures" && x[1] === "npsh_available")!;
    expect(Math.abs(Number(row[2]) / a - 1)).toBeLessThan(1e-9); // the number, to the CSV's 10 significant digits
  });
});

describe("the chart's readout and table view: NPSHa above zero that three decimals show as zero reads '< 0.001' (it read '0.000', as at zero)", () => {
  it("the value rule, flipping at 0.0005 in the chart's unit; zero and below as before", () => {
    expect(formatNpshaValue(1e-15)).toBe("< 0.001");
    expect(formatNpshaValue(0.0004999)).toBe("< 0.001");
    expect(formatNpshaValue(0.0005001)).toBe("0.001"); // decision "npshone" (0.000999 read '< 0.001')
    expect(formatNpshaValue(0.001)).toBe("0.001");
    expect(formatNpshaValue(0)).toBe("0.000"); // NPSHa at zero, as the candidates table writes it (decision "npshzero")
    expect(formatNpshaValue(-0.25)).toBe("−0.250"); // true minus, as fmtQ (helper "numtext")
  });
  it("the cursor's readout names NPSHa '< 0.001 m' on an NPSHa curve a hair above zero", () => {
    const npsha = [{ flow: 0, y: 1e-15 }, { flow: 0.2, y: 1e-15 }]; // m, flat just above zero (made up)
    const model = buildChartModel({ unitSystem: SI_UNITS, pumps: [linePump({ id: "a", label: "Pump a" })], npsha });
    expect(readoutText(model, 0.1)).toContain("NPSHa (aged pipe): NPSH < 0.001 m");
  });
});
