// The verdict's headline qualified by NPSH over the band (verdict-npsh.ts), NPSHa at or below zero read by NPSHa and never by
// a ratio, and the NPSH rule naming the suction level used at every corner. Check values: the rule "NPSHa / NPSHr below 1, or
// NPSHa ≤ 0: cavitation risk; below the wanted margin: low margin" (common practice), water's vapour pressure at 100 °C
// (about one standard atmosphere, steam tables from memory), and the engine's own figures (identities by construction).
// The pump curve is invented; the system is the product's default (defaultSystemInput) at the temperatures named.
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { inSI } from "~/engine/quantityText";
import { CandidateTable } from "~/components/CandidateTable";
import { npshLowestText, npshPointsText } from "~/components/candidate-figures";
import { candidateSeries } from "~/components/workbench";
import { renderUnits, SI_UNITS, US_UNITS } from "~/lib/shared/units";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, evaluateCandidate, type SystemInput } from "./hydraulics";
import { selectionCsv } from "./selection-export.server";
import type { FrozenSelection } from "./selections.server";
import type { WorkbenchView } from "./workbench-view";
import { verdictNpshNote } from "./verdict-npsh";

/** A falling curve through 24 m at shut-off meeting the default duty (36 m³/h) at most lift, aged pipe; flat NPSHr 2.5 m (invented). */
const points = [0, 0.004, 0.008, 0.012, 0.016].map((q) => ({ flow: q, head: 24 - 84979 * q * q, efficiency: q === 0 ? 0 : 0.75 * (1 - ((q - 0.01) / 0.01) ** 2), power: null, npshr: 2.5 }));
const NPSHR = 2.5;
const evaluate = (input: SystemInput) => evaluateCandidate(input, { points, speed: 2900, impellerDiameter: null }, DEFAULT_ADJUSTMENT);
/** The default system at 100 °C with the suction surface level with the pump (the edge hunt's case). */
const boiling = (): SystemInput => ({ ...defaultSystemInput(), temperatureC: 100, suctionStaticHead: 0 });

function table(r: ReturnType<typeof evaluate>, units = SI_UNITS): string {
  const view = { evaluation: null, systemError: null, flowMax: 0.02, needsReview: [], candidates: [{ id: 1, curveSetId: 1, label: "P", library: "L", adjustment: DEFAULT_ADJUSTMENT, result: r, error: null, energy: null }] } as unknown as WorkbenchView;
  return renderToStaticMarkup(createElement(CandidateTable, { view, unitSystem: units })).replace(/&#x27;/g, "'");
}
const verdictCell = (html: string) => (/data-testid="verdict-1"[^>]*>(.*?)<\/div>/s.exec(html)?.[1] ?? "").replace(/<p.*$/s, "").replace(/<[^>]+>/g, "");

describe("a pump that meets the duty while NPSHa is at or below zero (default system, 100 °C, suction surface at 0 m)", () => {
  const r = evaluate(boiling());
  it("the duty verdict stays about the duty; NPSH decides by NPSHa, never by a ratio", () => {
    expect(r.verdict!.status).toBe("meets");
    for (const p of r.npsh.judgedAt!) expect(p.available!).toBeLessThan(0); // vapour pressure ≈ the surface pressure at 100 °C
    expect(r.npsh.status).toBe("cavitation-risk");
    expect(r.npsh.marginRatio).toBeNull();
    const lowest = Math.min(...r.npsh.judgedAt!.map((p) => p.available!));
    expect(r.npsh.available).toBe(lowest);
    expect(npshLowestText(SI_UNITS, r.npsh)).toMatch(/^NPSHa −0\.\d+ m at least lift, aged pipe$/);
    expect(npshPointsText(SI_UNITS, r.npsh)).not.toMatch(/ -0\.\d+(;|$)/); // no ratio of a negative NPSHa
    expect(r.warnings.map(inSI)).toContain(`NPSH at least lift, aged pipe: NPSHa ${renderUnits(`⟦head|${lowest}|0⟧`, SI_UNITS)} is not above zero: cavitation risk whatever the pump's NPSHr`);
    expect(r.warnings.join(" ")).not.toMatch(/margin ratio -/);
  });
  it("the candidates table qualifies 'meets the duty' on the verdict's line, with NPSHa and the corner", () => {
    expect(verdictCell(table(r))).toMatch(/^meets the duty — but NPSHa −0\.\d+ m, at or below zero, at least lift, aged pipe: cavitation risk whatever the pump's NPSHr$/);
    expect(verdictCell(table(r, US_UNITS))).toMatch(/^meets the duty — but NPSHa −0\.\d+ ft, at or below zero, at least lift, aged pipe: cavitation risk whatever the pump's NPSHr$/);
    expect(table(r)).toMatch(/NPSHa −0\.\d+ m, at or below zero \(cavitation-risk\)/); // the design point's NPSH margin cell: no ratio
  });
  it("the chart's label and the CSV say it too", () => {
    expect(candidateSeries({ id: 1, curveSetId: 1, label: "P", library: "L", adjustment: DEFAULT_ADJUSTMENT, result: r, error: null }, 0, SI_UNITS)!.label).toBe("P — meets the duty, but NPSH cavitation risk at least lift, aged pipe");
    const f = { system: { input: boiling() }, pump: { library: { traced: null } }, adjustment: DEFAULT_ADJUSTMENT, result: r, energy: null } as unknown as FrozenSelection;
    expect(selectionCsv(1, "t", f)).toMatch(/figures,verdict_npsh,"?but NPSHa −0\.\d+ m, at or below zero, at least lift, aged pipe: cavitation risk whatever the pump's NPSHr"?,/);
  });
  it("the NPSH rule says the suction level is the one entered at every corner", () => {
    expect(inSI(r.npsh.rule)).toContain("at each corner of the band (least lift, new pipe; least lift, aged pipe; most lift, new pipe; most lift, aged pipe), NPSHa at each with the suction static head as entered (0.000 m), the same at every corner");
  });
});

describe("the qualifier flips where the deciding point's NPSHa / NPSHr crosses the wanted margin and 1 (20 °C, suction level varied)", () => {
  // NPSHr is flat, so the suction static head z moves every point's NPSHa by the same metres and the deciding point stays:
  // the ratio there is (a0 + z − z0) / NPSHr, and NPSHa = NPSHr × m at z = z0 + m·NPSHr − a0.
  const z0 = 2;
  const base = evaluate({ ...defaultSystemInput(), suctionStaticHead: z0 });
  const a0 = Math.min(...base.npsh.judgedAt!.map((p) => p.available!));
  const at = (z: number) => evaluate({ ...defaultSystemInput(), suctionStaticHead: z });
  const note = (z: number) => { const r = at(z); return { r, note: verdictNpshNote(r.verdict, r.npsh), cell: verdictCell(table(r)) }; };
  it("at NPSHa = NPSHr × 1.1 (the wanted margin): none just above, 'low NPSH margin' just below", () => {
    const zm = z0 + 1.1 * NPSHR - a0;
    const above = note(zm + 1e-6), below = note(zm - 1e-6);
    expect(above.r.verdict!.status).toBe("meets");
    expect(above.r.npsh.status).toBe("ok");
    expect(above.note).toBeNull();
    expect(above.cell).toBe("meets the duty");
    expect(below.r.npsh.status).toBe("low-margin");
    expect(below.cell).toMatch(/^meets the duty — but NPSHa \/ NPSHr 1\.0999\d* at least lift, aged pipe \(NPSHa 2\.7\d* m \/ NPSHr 2\.5\d* m\), below the wanted 1\.1: low NPSH margin$/);
  });
  it("at NPSHa = NPSHr: 'low NPSH margin' just above, 'cavitation risk' just below, with both heads", () => {
    const z1 = z0 + NPSHR - a0;
    expect(note(z1 + 1e-6).note).toMatch(/low NPSH margin$/);
    const below = note(z1 - 1e-6);
    expect(below.r.npsh.status).toBe("cavitation-risk");
    expect(below.cell).toMatch(/^meets the duty — but NPSHa 2\.49\d* m below NPSHr 2\.50?\d* m at least lift, aged pipe \(NPSHa \/ NPSHr 0\.99\d*, below 1\): cavitation risk$/);
  });
  it("another verdict is qualified with 'and'; no verdict, nothing", () => {
    const r = at(z0 + NPSHR - a0 - 0.5);
    expect(verdictNpshNote({ status: "oversized" }, r.npsh)).toMatch(/^and NPSHa .* cavitation risk$/);
    expect(verdictNpshNote(null, r.npsh)).toBeNull();
  });
});
