// The candidates table (system page and selection report) at two edges: NPSHa at or below zero at every point, where no
// ratio NPSHa / NPSHr is shown over the band (it means nothing there: the NPSHa decides, DEVELOPERS.md "npshenergy"), also
// for a selection frozen before the judged points were kept; and a dead-head result, whose Crossing cell says there is no
// delivery. Check values: the rule "NPSHa ≤ 0: cavitation risk whatever the pump's NPSHr" (common practice), water's vapour
// pressure at 100 °C about one standard atmosphere (steam tables, from memory), a pump at its shut-off head against an equal
// static head delivers nothing (common practice). The pump curve is invented (verdict-npsh.test.ts's falling curve).
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { CandidateTable } from "./CandidateTable";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, evaluateCandidate, type SystemInput } from "~/lib/projects/hydraulics";
import type { WorkbenchView } from "~/lib/projects/workbench-view";
import { SI_UNITS, US_UNITS, type UnitChoice } from "~/lib/shared/units";

/** A falling curve through 24 m at shut-off meeting the default duty; flat NPSHr 2.5 m (invented). */
const points = [0, 0.004, 0.008, 0.012, 0.016].map((q) => ({ flow: q, head: 24 - 84979 * q * q, efficiency: q === 0 ? 0 : 0.75 * (1 - ((q - 0.01) / 0.01) ** 2), power: null, npshr: 2.5 }));
const evaluate = (input: SystemInput) => evaluateCandidate(input, { points, speed: 2900, impellerDiameter: null }, DEFAULT_ADJUSTMENT);
type R = ReturnType<typeof evaluate>;

/** The table's cells by row label, as text. */
function cells(r: R, units: UnitChoice = SI_UNITS): Record<string, string> {
  const view = { evaluation: null, systemError: null, flowMax: 0.02, needsReview: [], candidates: [{ id: 1, curveSetId: 1, label: "P", library: "L", adjustment: DEFAULT_ADJUSTMENT, result: r, error: null, energy: null }] } as unknown as WorkbenchView;
  const html = renderToStaticMarkup(createElement(CandidateTable, { view, unitSystem: units })).replace(/&#x27;/g, "'");
  const out: Record<string, string> = {};
  for (const m of html.matchAll(/<tr[^>]*>(.*?)<\/tr>/gs)) {
    const tds = [...m[1].matchAll(/<t[hd][^>]*>(.*?)<\/t[hd]>/gs)].map((x) => x[1].replace(/<[^>]+>/g, ""));
    if (tds.length >= 2) out[tds[0]] = tds[1];
  }
  return out;
}

describe("NPSH margin over the band where NPSHa is at or below zero at every point (default system, 100 °C, suction surface at 0 m)", () => {
  const r = evaluate({ ...defaultSystemInput(), temperatureC: 100, suctionStaticHead: 0 });
  it("the case: every point's NPSHa below zero, no ratio at the source (decision \"npshtruth\"; the old evaluation held negative ones)", () => {
    for (const p of r.npsh.judgedAt!) expect(p.available!).toBeLessThan(0);
    expect(r.band.every((b) => b.npshMarginRatio === null && b.npshAvailable! < 0)).toBe(true);
    expect(r.figures!.npshMarginRatio).toBeNull();
    expect(r.npsh.status).toBe("cavitation-risk");
  });
  it("no ratio: the cell reads the lowest NPSHa and where, in SI and US units", () => {
    const si = cells(r)["NPSH margin over the band"];
    expect(si).toMatch(/^NPSHa −0\.\d+ m at least lift, aged pipe \(cavitation-risk: NPSHa at or below zero\)$/);
    expect(cells(r, US_UNITS)["NPSH margin over the band"]).toMatch(/^NPSHa −0\.\d+ ft at least lift, aged pipe \(cavitation-risk: NPSHa at or below zero\)$/);
  });
  it("a selection frozen before the judged points were kept, with the negative ratios then computed: not shown either", () => {
    // NPSHa / NPSHr as the old evaluation froze it where NPSHa ≤ 0 (negative): the table's own guard keeps it out.
    const oldRatio = <T extends { npshMarginRatio: number | null; npshAvailable?: number | null; npshRequired?: number | null }>(b: T): T => ({ ...b, npshMarginRatio: b.npshAvailable! / b.npshRequired! });
    const frozen = { ...r, band: r.band.map(oldRatio), figures: oldRatio(r.figures!), npsh: { ...r.npsh, judgedAt: undefined } } as unknown as R;
    expect(frozen.band.every((b) => b.npshMarginRatio! < 0)).toBe(true);
    expect(cells(frozen)["NPSH margin over the band"]).toMatch(/^NPSHa −0\.\d+ m at least lift, aged pipe \(cavitation-risk: NPSHa at or below zero\)$/);
  });
  it("the flip: at 20 °C (NPSHa above zero) the ratios over the band are shown", () => {
    const cold = evaluate({ ...defaultSystemInput(), suctionStaticHead: 0 });
    expect(cold.npsh.judgedAt!.every((p) => p.available! > 0)).toBe(true);
    expect(cells(cold)["NPSH margin over the band"]).toMatch(/^\d+\.\d+( – \d+\.\d+)? — lowest /);
  });
});

describe("Crossing of a dead-head result (static head equal to the shut-off head 24 m)", () => {
  const dead = evaluate({ ...defaultSystemInput(), staticLow: 24, staticHigh: 24 });
  it("says no delivery with the head, not 'one crossing'", () => {
    expect(dead.operating).toEqual({ flow: 0, head: 24 });
    const cell = cells(dead)["Crossing"];
    expect(cell).not.toBe("one crossing");
    expect(cell).toBe("dead-head at 24.0 m: no delivery (the shut-off head only balances the system's at zero flow)");
    expect(cells(dead, US_UNITS)["Crossing"]).toMatch(/^dead-head at 78\.\d+ ft: no delivery/);
  });
  it("the flip: static 23 m, a flow above zero reads 'one crossing'", () => {
    const r = evaluate({ ...defaultSystemInput(), staticLow: 23, staticHigh: 23 });
    expect(r.operating!.flow).toBeGreaterThan(0);
    expect(cells(r)["Crossing"]).toBe("one crossing");
  });
});

describe("NPSH margin over the band of a curve without NPSHr (nothing judged anywhere: unknown)", () => {
  const bare = evaluateCandidate(defaultSystemInput(), { points: points.map((p) => ({ ...p, npshr: null })), speed: 2900, impellerDiameter: null }, DEFAULT_ADJUSTMENT);
  it("says what was not judged and why, once, without a dash standing for a value before it (it read '— — not judged at …')", () => {
    expect(bare.npsh.status).toBe("unknown"); // control
    const cell = cells(bare)["NPSH margin over the band"];
    expect(cell).toMatch(/^not judged at design point \(no NPSHr at that flow\); least lift, new pipe \(no NPSHr at that flow\); .* \(unknown\)$/);
    expect(cell).not.toMatch(/— —/);
  });
  it("the flip: with NPSHr the ratios lead and the dash separates them from the lowest", () => {
    expect(cells(evaluate(defaultSystemInput()))["NPSH margin over the band"]).toMatch(/^\d+\.\d+( – \d+\.\d+)? — lowest \d+\.\d+ at .* \(ok: at least the wanted [\d.]+\)$/);
  });
});

describe("a curve that gives no power or efficiency and no motor typed: no motor to read an efficiency for", () => {
  const headOnly = points.map((p) => ({ ...p, efficiency: null }));
  const r = evaluateCandidate(defaultSystemInput(), { points: headOnly, speed: 2900, impellerDiameter: null }, DEFAULT_ADJUSTMENT);
  it("the motor efficiency row says there is no motor and why (it read 'motor — (IE3) · no drive' with the IE table's source)", () => {
    expect(r.figures?.motor?.rating ?? null).toBeNull();
    expect(cells(r)["Motor and drive efficiency"]).toBe("— (no motor: no shaft power at the operating point: no motor suggested)");
  });
  it("with a motor typed, the row reads its efficiency as before", () => {
    const typed = evaluateCandidate(defaultSystemInput(), { points: headOnly, speed: 2900, impellerDiameter: null }, { ...DEFAULT_ADJUSTMENT, motorRating: 4000 });
    expect(cells(typed)["Motor and drive efficiency"]).toMatch(/^motor \d+\.\d %\s*\(IE3\) · no drive/);
  });
});
