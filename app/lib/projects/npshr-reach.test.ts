// "NPSH not checked: the curve publishes no NPSHr at 43.2 m³/h" did not tell the flow the pump runs at from where the
// NPSHr curve stops. Now, where a point NPSH is judged at (design point, band corner) lies past the NPSHr curve's last
// published flow or before its first, the words say so with both flows: "the NPSHr curve ends at 28.8 m³/h, and the pump
// runs past it at 41.1 m³/h (design point), …" / "the NPSHr curve starts at 43.2 m³/h, and the pump runs below it at …"
// (npshr-reach.ts), on the verdict's line (every surface: verdict-npsh.ts), in the points not judged (`unjudged` why) and
// in the candidates table's NPSH margin row. Pumps in parallel compare one pump's flow with one pump's NPSHr curve.
// Flips bisected on the static head moving a corner across each end. Check values: the rule "NPSHr is read off the
// published curve, never beyond it; NPSH is judged wherever the pump runs" (common practice); the pump is the invented
// falling curve of npsh-not-checked.test.ts (flat NPSHr 2.5 m on the flows kept); 0.008 m³/s = 28.8 m³/h, 0.012 m³/s =
// 43.2 m³/h, 0.004 m³/s = 14.4 m³/h (arithmetic).
import { describe, expect, it } from "vitest";
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { CandidateTable } from "~/components/CandidateTable";
import { renderUnits, SI_UNITS, US_UNITS } from "~/lib/shared/units";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, evaluateCandidate, type Adjustment, type SystemInput } from "./hydraulics";
import { verdictNpshNote } from "./verdict-npsh";
import type { WorkbenchView } from "./workbench-view";

import { npshrPump as pump, upTo, from } from "./npshr-fixture";
const evaluate = (input: SystemInput, keep: (q: number) => boolean, adj: Adjustment = DEFAULT_ADJUSTMENT) => evaluateCandidate(input, pump(keep), adj);
type R = ReturnType<typeof evaluate>;
const note = (r: R, units = SI_UNITS) => renderUnits(verdictNpshNote(r.verdict, r.npsh) ?? "", units);
const flows = (r: R) => (r.npsh.judgedAt ?? []).map((p) => p.flow ?? NaN);
const FLOW = String.raw`\d+\.\d+ m³/h`;

describe("past the NPSHr curve's last flow: both flows", () => {
  const r = evaluate(defaultSystemInput(), upTo(0.008)); // duty 36 m³/h; every point runs past 28.8 m³/h
  it("the case: a pass whose every point lies past 28.8 m³/h", () => {
    expect(r.verdict?.status).toBe("meets");
    expect(Math.min(...flows(r))).toBeGreaterThan(0.008);
  });
  it("the verdict's line says where the NPSHr curve ends and where the pump runs (old code: 'the curve publishes no NPSHr at 41.1 m³/h (design point), …')", () => {
    expect(note(r)).toMatch(new RegExp(`^but NPSH not checked: the NPSHr curve ends at 28\\.8 m³/h, and the pump runs past it at ${FLOW} \\(design point\\), ${FLOW} \\(least lift, new pipe\\), ${FLOW} \\(least lift, aged pipe\\), ${FLOW} \\(most lift, new pipe\\), ${FLOW} \\(most lift, aged pipe\\)$`));
    expect(note(r, US_UNITS)).toMatch(/^but NPSH not checked: the NPSHr curve ends at 127 gpm, and the pump runs past it at \d+ gpm \(design point\)/); // 0.008 m³/s = 126.8 gpm, whole gpm from 100 up (1 gal = 3.785411784 L, NIST SP 811)
  });
  it("each point not judged says why", () => {
    expect(r.npsh.unjudged?.map((u) => u.why)).toEqual(Array(5).fill("past the NPSHr curve's last flow"));
  });
  it("the table's NPSH margin row at the operating point (old code: 'not checked: the curve publishes no NPSHr at 41.1 m³/h')", () => {
    const view = { evaluation: null, systemError: null, flowMax: 0.02, needsReview: [], candidates: [{ id: 1, curveSetId: 1, label: "P", library: "L", adjustment: DEFAULT_ADJUSTMENT, result: r, error: null, energy: null }] } as unknown as WorkbenchView;
    const html = renderToStaticMarkup(createElement(CandidateTable, { view, unitSystem: SI_UNITS }));
    const cell = (/<th scope="row"[^>]*>NPSH margin<\/th><td[^>]*>(.*?)<\/td>/.exec(html)?.[1] ?? "").replace(/<[^>]+>/g, "");
    expect(cell).toMatch(new RegExp(`^not checked: the NPSHr curve ends at 28\\.8 m³/h, and the pump runs past it at ${FLOW}$`));
  });
});

describe("before the NPSHr curve's first flow: both flows", () => {
  const r = evaluate(defaultSystemInput(), from(0.012)); // every point runs below 43.2 m³/h
  it("the verdict's line says where the NPSHr curve starts (old code: 'the curve publishes no NPSHr at …')", () => {
    expect(Math.max(...flows(r))).toBeLessThan(0.012);
    expect(note(r)).toMatch(new RegExp(`^but NPSH not checked: the NPSHr curve starts at 43\\.2 m³/h, and the pump runs below it at ${FLOW} \\(design point\\), `));
    expect(r.npsh.unjudged?.map((u) => u.why)).toEqual(Array(5).fill("before the NPSHr curve's first flow"));
  });
});

describe("the flips: a corner crossing each end of the NPSHr curve (static head bisected, then 0.1 mm either side)", () => {
  // Bisection finds the crossing to 1e-15 m³/s, past the 9 significant digits a text prints a flow to; a step of 1e-4 m of
  // static head either side moves the corner's flow by a few parts in 10⁶: still at the threshold, and read apart.
  const crossing = (at: (s: number) => R, judged: (r: R) => boolean, lo: number, hi: number) => {
    for (let i = 0; i < 60; i++) { const mid = (lo + hi) / 2; if (judged(at(mid))) lo = mid; else hi = mid; }
    const step = Math.sign(hi - lo) * 1e-4;
    return [at(lo - step), at(hi + step)] as const;
  };
  it("the last flow 43.2 m³/h: judged everywhere on one side; past it 'ends at 43.2 m³/h, and the pump runs past it at 43.20… m³/h'", () => {
    // The least lift lowered raises the least-lift corner's flow above 0.012 m³/s.
    const [inside, past] = crossing((s) => evaluate({ ...defaultSystemInput(), staticLow: s }, upTo(0.012)), (r) => Math.max(...flows(r)) <= 0.012, 10, 0);
    expect(Math.max(...flows(inside))).toBeGreaterThan(0.012 * (1 - 1e-5));
    expect(inside.npsh.status).toBe("ok");
    expect(verdictNpshNote(inside.verdict, inside.npsh)).toBeNull();
    expect(past.npsh.status).toBe("unknown");
    expect(Math.max(...flows(past))).toBeLessThan(0.012 * (1 + 1e-5));
    expect(note(past)).toMatch(/^(but|and) NPSH not checked: the NPSHr curve ends at 43\.2 m³\/h, and the pump runs past it at 43\.20*[1-9]\d* m³\/h \(least lift, new pipe\); where judged, the lowest NPSHa \/ NPSHr is \d+\.\d\d at /);
  });
  it("the first flow 28.8 m³/h: judged everywhere on one side; below it 'starts at 28.8 m³/h, and the pump runs below it at 28.79… m³/h'", () => {
    // A duty of 21.6 m³/h (oversized: a pass) and the most lift raised lower the most-lift corner's flow below 0.008 m³/s.
    const input = { ...defaultSystemInput(), duty: { flow: 0.006, head: 12 } };
    const [inside, below] = crossing((s) => evaluate({ ...input, staticHigh: s }, from(0.008)), (r) => Math.min(...flows(r)) >= 0.008, 12, 20);
    expect(["meets", "oversized"]).toContain(below.verdict?.status);
    expect(Math.min(...flows(inside))).toBeLessThan(0.008 * (1 + 1e-5));
    expect(inside.npsh.status).toBe("ok");
    expect(below.npsh.status).toBe("unknown");
    expect(Math.min(...flows(below))).toBeGreaterThan(0.008 * (1 - 1e-5));
    expect(note(below)).toMatch(/^(but|and) NPSH not checked: the NPSHr curve starts at 28\.8 m³\/h, and the pump runs below it at 28\.79+[0-8]?\d* m³\/h \(most lift, aged pipe\); where judged, /);
  });
});

describe("pumps in parallel: one pump's flow against one pump's NPSHr curve", () => {
  const two: Adjustment = { ...DEFAULT_ADJUSTMENT, arrangement: "parallel", dutyPumps: 2, standbyPumps: 0 };
  const r = evaluate(defaultSystemInput(), upTo(0.004), two);
  it("'one pump's NPSHr curve ends at 14.4 m³/h, and each pump runs past it at …' with each pump's flow, half the total (old code: the total flow, 'no NPSHr at 69.0 m³/h')", () => {
    expect(note(r)).toMatch(new RegExp(`^(but|and) NPSH not checked: one pump's NPSHr curve ends at 14\\.4 m³/h, and each pump runs past it at ${FLOW} \\(design point\\)`));
    const design = r.npsh.judgedAt![0];
    expect(design.pumpFlow! * 2).toBeCloseTo(design.flow!, 12); // identical pumps share the flow equally (common practice)
    const shown = Number(/each pump runs past it at (\d+\.\d+) m³\/h/.exec(note(r))![1]);
    expect(shown).toBeCloseTo((design.flow! / 2) * 3600, 1);
  });
});

describe("pumps in parallel on a curve that publishes no NPSHr at all: each pump's flow, never the total", () => {
  const two: Adjustment = { ...DEFAULT_ADJUSTMENT, arrangement: "parallel", dutyPumps: 2, standbyPumps: 0 };
  const r = evaluate(defaultSystemInput(), () => false, two);
  const design = r.npsh.judgedAt![0];
  it("'the curve publishes no NPSHr, and each pump runs at …' with half the total at each point (old code: 'the curve publishes no NPSHr at 68.9 m³/h (design point), …', the total)", () => {
    expect(r.npsh.npshrPublished).toBeNull(); // control: none published
    expect(design.pumpFlow! * 2).toBeCloseTo(design.flow!, 12); // identical pumps share the flow equally (common practice)
    expect(note(r)).toMatch(new RegExp(`^(but|and) NPSH not checked: the curve publishes no NPSHr, and each pump runs at ${FLOW} \\(design point\\), ${FLOW} \\(least lift, new pipe\\), ${FLOW} \\(least lift, aged pipe\\), ${FLOW} \\(most lift, new pipe\\), ${FLOW} \\(most lift, aged pipe\\)$`));
    const shown = [...note(r).matchAll(/(\d+\.\d+) m³\/h \(([^)]+)\)/g)].map((m) => [m[2], Number(m[1])]);
    expect(shown.map(([at]) => at)).toEqual(r.npsh.judgedAt!.map((p) => p.at));
    for (const [at, q] of shown) expect(q).toBeCloseTo((r.npsh.judgedAt!.find((p) => p.at === at)!.flow! / 2) * 3600, 1);
  });
  it("the table's NPSH margin row at the operating point: each pump's flow too", () => {
    const view = { evaluation: null, systemError: null, flowMax: 0.04, needsReview: [], candidates: [{ id: 1, curveSetId: 1, label: "P", library: "L", adjustment: two, result: r, error: null, energy: null }] } as unknown as WorkbenchView;
    const html = renderToStaticMarkup(createElement(CandidateTable, { view, unitSystem: SI_UNITS }));
    const cell = (/<th scope="row"[^>]*>NPSH margin<\/th><td[^>]*>(.*?)<\/td>/.exec(html)?.[1] ?? "").replace(/<[^>]+>/g, "");
    expect(cell).toMatch(new RegExp(`^not checked: the curve publishes no NPSHr, and each pump runs at ${FLOW}$`));
    expect(Number(/at (\d+\.\d+) m³/.exec(cell)![1])).toBeCloseTo((design.flow! / 2) * 3600, 1);
  });
  it("one pump alone keeps its words: 'the curve publishes no NPSHr at …' (its flow is the total)", () => {
    const one = evaluate(defaultSystemInput(), () => false);
    expect(note(one)).toMatch(new RegExp(`^but NPSH not checked: the curve publishes no NPSHr at ${FLOW} \\(design point\\), `));
  });
});

describe("a selection frozen before the NPSHr's reach was kept names what it holds, as before", () => {
  it("no npshrPublished: 'the curve publishes no NPSHr at …'", () => {
    const r = evaluate(defaultSystemInput(), upTo(0.008));
    const old = { ...r.npsh, npshrPublished: undefined, judgedAt: r.npsh.judgedAt!.map(({ pumpFlow: _, ...p }) => p) };
    expect(renderUnits(verdictNpshNote(r.verdict, old) ?? "", SI_UNITS)).toMatch(new RegExp(`^but NPSH not checked: the curve publishes no NPSHr at ${FLOW} \\(design point\\), `));
  });
});
