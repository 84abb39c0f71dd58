// A head curve that touches a contour without crossing it (tangent, or grazing a vertex), on the page: open contours
// (a line clicked by hand) as well as closed ones, and what the page says of a curve whose one meeting is a touch.
// One invented chart (lib/tracer/test-chart.ts `paper`): a head curve clicked at every m³/h along H = 50 − 0.003·Q²;
// contours drawn as Vs whose tip lies on the curve, or as vertical lines across it. Expected values by construction.
import { describe, expect, it } from "vitest";
import { peakNote, peakWarning } from "~/lib/tracer/peak";
import { paper } from "~/lib/tracer/test-chart";
import { calibrations, contourReading, initialState, unreadPeaks, type Curve, type TracerState } from "./model";

const ref = (q: number, h: number, value: number) => ({ u: paper(q, h)[0], v: paper(q, h)[1], value });
const px = (q: number, h: number) => ({ u: paper(q, h)[0], v: paper(q, h)[1] });
const headOf = (q: number) => 50 - 0.003 * q * q; // invented
const head: Curve = {
  id: 1, panelId: 1, kind: "curve", impellerMm: 200, speedRpm: 2900, level: 0,
  points: Array.from({ length: 96 }, (_, i) => px(i, headOf(i))),
};
/** A V above the curve with its tip on the curve at flow q (arms 5 m³/h either side, 8 m up): touches it there, stays above. */
const vee = (id: number, level: number, q: number, closed: boolean): Curve => ({
  id, panelId: 1, kind: "contour", impellerMm: NaN, speedRpm: 2900, level, closed,
  points: closed ? [px(q - 5, headOf(q) + 8), px(q + 5, headOf(q) + 8), px(q, headOf(q))] : [px(q - 5, headOf(q) + 8), px(q, headOf(q)), px(q + 5, headOf(q) + 8)],
});
/** An open line straight up across the curve at flow q, heads 5–60 m: crosses it there. */
const across = (id: number, level: number, q: number): Curve => ({
  id, panelId: 1, kind: "contour", impellerMm: NaN, speedRpm: 2900, level, closed: false, points: [px(q, 5), px(q, 60)],
});
const state = (contours: Curve[]): TracerState => ({
  ...initialState(), model: "Invented 50-200", xRefs: [ref(10, 0, 10), ref(90, 0, 90)],
  panels: [{ id: 1, quantity: "head", unit: "m", scale: "linear", refs: [ref(0, 10, 10), ref(0, 50, 50)] }],
  curves: [head, ...contours],
});
const near = (a: number, b: number) => Math.abs(a - b) < 0.05; // pixel rounding through the calibration

describe("a touch of an open contour is no crossing", () => {
  it("the curve touching an open 74 % V at 25 m³/h and crossing 74 % lines at 40 and 60 is inside 40–60, outside 25–40", () => {
    // 70 % lines at 10 and 90, 74 % lines at 40 and 60 (all open), the 74 % V touching at 25 (construction).
    const s = state([across(2, 70, 10), vee(3, 74, 25, false), across(4, 74, 40), across(5, 74, 60), across(6, 70, 90)]);
    const r = contourReading(s, head, calibrations(s));
    expect(r.crossings.map((x) => [Math.round(x.x), x.level, x.touch === true])).toEqual([
      [10, 70, false], [25, 74, true], [40, 74, false], [60, 74, false], [90, 70, false],
    ]);
    // Before: the touch flipped the side, so 25–40 read as the peak and 40–60 as a dip (its middle written at 74 % when ticked).
    const spans = r.gaps.map((g) => [Math.round(g.from), Math.round(g.to), g.innermost, g.outside, g.fromTouch]);
    expect(spans).toEqual([[25, 40, false, true, true], [40, 60, true, false, false]]);
  });
});

describe("a curve whose one contour meeting is a touch says it touches it", () => {
  for (const closed of [false, true]) {
    it(`an ${closed ? "closed" : "open"} 74 % V touching at 45 m³/h: the level, the flow, and that it does not cross`, () => {
      const s = state([vee(2, 74, 45, closed)]);
      const [p] = unreadPeaks(s, calibrations(s));
      expect(p.lone).toBe(true);
      expect(near(p.from, 45)).toBe(true);
      const text = peakWarning(p, "m3/h");
      // Before: "The curve crosses one contour only, the 74 % contour, once, at 45.0 m³/h".
      expect(text).toContain("The curve meets one contour only, the 74 % contour, and does not cross it: it touches it at 45.0 m³/h (tangent, or grazing a vertex)");
      expect(text).not.toContain("crosses one contour");
      expect(peakNote([p], "m3/h")).toBe("efficiency at one contour meeting only, none written: 200 mm, 2900 rpm 74 % touched, not crossed, at 45.0 m³/h");
    });
  }

  it("a touch and a crossing of one contour only: which is which, and no claim of the side between", () => {
    // The open 74 % V touching at 30, a 74 % line across at 60 (construction).
    const s = state([vee(2, 74, 30, false), across(3, 74, 60)]);
    const [p] = unreadPeaks(s, calibrations(s));
    expect([p.twice, p.fromTouch, p.toTouch === true]).toEqual([true, true, false]);
    const text = peakWarning(p, "m3/h");
    expect(text).toContain("The curve meets one contour only, the 74 % contour, twice: at 30.0 m³/h it touches it without crossing it and at 60.0 m³/h it crosses it");
    expect(text).toContain("between them the contours say only that it is above or below 74 % (inside or outside the contour)");
    expect(peakNote([p], "m3/h")).toBe("efficiency at two meetings with one contour only, none written: 200 mm, 2900 rpm 74 % touched at 30.0 and crossed at 60.0 m³/h");
  });
});
