// The candidates table (system page and selection report): the BEP position beside "outside POR" and the
// NPSH figures beside their status never read as the limit they were judged against, in SI and US units.
// Server-rendered markup (react-dom/server, node environment). Limits: POR 70–120 % of BEP flow (ANSI/HI 9.6.3,
// from memory), NPSHa against NPSHr and the margin ratio against 1 and the wanted ratio (ANSI/HI 9.6.1, from memory).
import { describe, expect, it } from "vitest";
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { CandidateTable } from "./CandidateTable";
import { bepPercentText, npshMarginText } from "./candidate-figures";
import { DEFAULT_ADJUSTMENT } from "~/lib/projects/candidate-input";
import type { WorkbenchView } from "~/lib/projects/workbench-view";
import { SI_UNITS, US_UNITS, toChosen, type UnitChoice } from "~/lib/shared/units";

const OFFSETS = [-1e-3, -1e-4, -1e-5, 1e-5, 1e-4, 1e-3];
type Figures = { bepRatio: number; inPor: boolean; npshAvailable: number; npshRequired: number; npshMarginRatio: number; npshStatus: string };

/** A candidate with only the figures these rows read (made up). */
function view(f: Figures, requiredMargin: number): WorkbenchView {
  const result = {
    status: "ok", message: "", ratio: 1, ratioNote: null, speed: null, diameter: null, curve: [], operating: { flow: 0.02, head: 20 }, allIntersections: [],
    figures: { efficiency: 0.7, hydraulicPower: 4000, shaftPower: 5700, bepFlow: 0.02, bepHead: 20, maxPower: 6000, motorLimit: null, nonOverloading: null, motorLoadAtDuty: null, annualEnergyKWh: null, annualCost: null, motor: null, ...f },
    por: null, band: [], npsh: { status: f.npshStatus, marginRatio: f.npshMarginRatio, at: "design point", rule: "rule", requiredMargin }, verdict: null, warnings: [],
  };
  return { evaluation: null, systemError: null, flowMax: 0.05, candidates: [{ id: 1, curveSetId: 1, label: "P", library: "L", adjustment: DEFAULT_ADJUSTMENT, result, error: null, energy: null }] } as unknown as WorkbenchView;
}
/** The text of the table's cell in the row with this label. */
function cell(v: WorkbenchView, units: UnitChoice, label: string): string {
  const html = renderToStaticMarkup(createElement(CandidateTable, { view: v, unitSystem: units }));
  const m = new RegExp(`<th scope="row"[^>]*>${label.replace(/[/()]/g, "\\$&")}</th><td[^>]*>(.*?)</td>`).exec(html);
  expect(m, label).toBeTruthy();
  return m![1].replace(/<[^>]+>/g, "");
}
const decimals = (shown: string) => shown.split(".")[1]?.length ?? 0;
/** The printed number is not the limit rounded to its decimals, and lies on the limit's true side. */
function expectApart(shown: string, value: number, limit: number, what: string) {
  const v = Number(shown), rounded = Number(limit.toFixed(decimals(shown)));
  expect(v, `${what}: ${shown} reads as ${limit}`).not.toBe(rounded);
  expect(Math.sign(v - rounded), `${what}: ${shown} on the wrong side of ${limit}`).toBe(Math.sign(value - limit));
}
const ok: Figures = { bepRatio: 1, inPor: true, npshAvailable: 8, npshRequired: 4, npshMarginRatio: 2, npshStatus: "ok" };

describe("the candidates table's judged figures read apart from their limits", () => {
  it("sweep: BEP ratio just outside 70 % and 120 % reads outside", () => {
    for (const limit of [0.7, 1.2]) for (const off of OFFSETS) {
      const r = limit * (1 + off);
      const inPor = r >= 0.7 && r <= 1.2;
      if (inPor) continue;
      const t = cell(view({ ...ok, bepRatio: r, inPor }, 1.1), SI_UNITS, "Position vs BEP");
      const m = /^([\d.]+) % of BEP flow — outside POR 70–120 %$/.exec(t); // the region's limits on the line (ANSI/HI 9.6.3)
      expect(m, t).toBeTruthy();
      expectApart(m![1], r * 100, limit * 100, t);
    }
  });
  it("sweep: NPSHa just below NPSHr (3, 4, 4.37 m) never prints as it, in m and ft", () => {
    for (const required of [3, 4, 4.37]) for (const off of OFFSETS) for (const units of [SI_UNITS, US_UNITS]) {
      const available = required * (1 + off);
      const status = available < required ? "cavitation-risk" : "low-margin";
      const t = cell(view({ ...ok, npshAvailable: available, npshRequired: required, npshMarginRatio: available / required, npshStatus: status }, 1.1), units, "NPSHa / NPSHr (design curve)");
      const m = /^([\d.]+) (m|ft) \/ ([\d.]+) (m|ft)$/.exec(t);
      expect(m, t).toBeTruthy();
      expectApart(m![1], toChosen(units, "head", available), toChosen(units, "head", required), t);
      expect(Math.sign(Number(m![1]) - Number(m![3])), t).toBe(Math.sign(available - required));
    }
  });
  it("sweep: the margin ratio just beside 1 and the wanted 1.1, 1.3 never prints as them", () => {
    for (const req of [1.1, 1.3]) for (const limit of [1, req]) for (const off of OFFSETS) {
      const ratio = limit * (1 + off);
      const status = ratio < 1 ? "cavitation-risk" : ratio < req ? "low-margin" : "ok";
      const t = cell(view({ ...ok, npshMarginRatio: ratio, npshStatus: status }, req), SI_UNITS, "NPSH margin");
      const m = /^([\d.]+) \((ok: at least the wanted [\d.]+|low-margin: below the wanted [\d.]+|cavitation-risk: below 1)\)$/.exec(t);
      expect(m, t).toBeTruthy();
      expect(m![2].split(":")[0], t).toBe(status);
      if (status !== "cavitation-risk") expect(m![2], t).toMatch(new RegExp(`wanted ${req}$`)); // the wanted ratio as typed
      for (const l of [1, req]) expectApart(m![1], ratio, l, `${t} against ${l}`);
      const lowest = new RegExp(`lowest ([\\d.]+) at design point \\(${status}: `).exec(cell(view({ ...ok, npshMarginRatio: ratio, npshStatus: status }, req), SI_UNITS, "NPSH margin over the band"));
      if (status !== "ok") {
        expect(lowest, t).toBeTruthy();
        for (const l of [1, req]) expectApart(lowest![1], ratio, l, `lowest ${lowest![1]} against ${l}`);
      }
    }
  });
  it("the search page's cells use the same helpers (hand-written cases; POR 70–120 %, wanted margin 1.1)", () => {
    expect(bepPercentText(0.6996, false)).toBe("69.96 %");
    expect(bepPercentText(1.2004, false)).toBe("120.04 %");
    expect(bepPercentText(0.7004, true)).toBe("70 %"); // inside: the rounded end reads true
    expect(npshMarginText(1.0996, 1.1)).toBe("1.0996");
    expect(npshMarginText(1.0996, undefined)).toBe("1.10"); // a selection frozen before the wanted ratio was kept: apart from 1 only
  });
  it("values well apart from their limits read as before (hand-written cases)", () => {
    expect(cell(view({ ...ok, bepRatio: 0.55, inPor: false }, 1.1), SI_UNITS, "Position vs BEP")).toBe("55 % of BEP flow — outside POR 70–120 %");
    expect(cell(view({ ...ok, bepRatio: 0.95, inPor: true }, 1.1), SI_UNITS, "Position vs BEP")).toBe("95 % of BEP flow");
    expect(cell(view(ok, 1.1), SI_UNITS, "NPSHa / NPSHr (design curve)")).toBe("8.00 m / 4.00 m");
    expect(cell(view(ok, 1.1), SI_UNITS, "NPSH margin")).toBe("2.00 (ok: at least the wanted 1.1)");
  });
  it("NPSHa at or below zero without NPSHr decides at a corner: the band cell names NPSHa and the corner, in m and ft (made-up figures)", () => {
    const v = view(ok, 1.1);
    const c = v.candidates[0] as unknown as { result: { npsh: object } };
    c.result.npsh = { status: "cavitation-risk", marginRatio: null, at: "least lift, aged pipe", available: -1.18, rule: "rule", requiredMargin: 1.1 };
    expect(cell(v, SI_UNITS, "NPSH margin over the band")).toBe("NPSHa −1.18 m at least lift, aged pipe (cavitation-risk: NPSHa at or below zero)");
    expect(cell(v, US_UNITS, "NPSH margin over the band")).toBe("NPSHa −3.87 ft at least lift, aged pipe (cavitation-risk: NPSHa at or below zero)"); // 1.18 m / 0.3048
  });

  it("the range beside 'lowest … at <corner>' holds that lowest: every judged point, not only the band's two edges (made-up figures)", () => {
    const v = view(ok, 1.1);
    const c = v.candidates[0] as unknown as { result: { band: object[]; npsh: object } };
    // The band's two edges at 1.32 and 1.45; the least-lift, aged-pipe corner at 0.958 decides.
    c.result.band = [{ edge: "least lift, new pipe", npshMarginRatio: 1.45 }, { edge: "most lift, aged pipe", npshMarginRatio: 1.32 }];
    c.result.npsh = { status: "cavitation-risk", marginRatio: 0.958, at: "least lift, aged pipe", available: 2.395, rule: "rule", requiredMargin: 1.1,
      judgedAt: [{ at: "design point", marginRatio: 1.38 }, { at: "least lift, new pipe", marginRatio: 1.45 }, { at: "least lift, aged pipe", marginRatio: 0.958 }, { at: "most lift, aged pipe", marginRatio: 1.32 }] };
    expect(cell(v, SI_UNITS, "NPSH margin over the band")).toBe("0.96 – 1.45 — lowest 0.96 at least lift, aged pipe (cavitation-risk: below 1)");
    delete (c.result.npsh as { judgedAt?: unknown }).judgedAt; // a selection frozen before the corners were kept: the two edges, as before
    expect(cell(v, SI_UNITS, "NPSH margin over the band")).toBe("1.45 – 1.32 — lowest 0.96 at least lift, aged pipe (cavitation-risk: below 1)");
  });
});
