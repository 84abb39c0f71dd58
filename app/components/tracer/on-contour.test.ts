// A head curve clicked from, or to, the very point where it meets a contour (its first or last point on the contour's
// line): which side it starts on, and what the page says of the best-efficiency point against what the engine does with
// the page's CSV. One invented chart (lib/tracer/test-chart.ts `paper`): H = 50 − 0.003·Q² clicked at every m³/h,
// closed rectangular 70 % (20–80 m³/h) and 74 % (30–60 m³/h) contours over heads 5–60 m. Expected values by construction.
import { describe, expect, it } from "vitest";
import { createPumpCurve } from "~/engine";
import { analyseCsv } from "~/lib/import";
import { peakBoxLabel, peakNote, peakWarning } from "~/lib/tracer/peak";
import { paper } from "~/lib/tracer/test-chart";
import { calibrations, csvOf, initialState, unreadPeaks, type Curve, type TracerState } from "./model";

const ref = (q: number, h: number, value: number) => ({ u: paper(q, h)[0], v: paper(q, h)[1], value });
const px = (q: number, h: number) => ({ u: paper(q, h)[0], v: paper(q, h)[1] });
const headOf = (q: number) => 50 - 0.003 * q * q; // invented
const box = (id: number, level: number, a: number, b: number): Curve => ({
  id, panelId: 1, kind: "contour", impellerMm: NaN, speedRpm: 2900, level, closed: true, points: [px(a, 5), px(b, 5), px(b, 60), px(a, 60)],
});
const state = (q0: number, q1: number, taken: boolean): TracerState => ({
  ...initialState(), model: "Invented 50-200", xRefs: [ref(10, 0, 10), ref(90, 0, 90)],
  panels: [{ id: 1, quantity: "head", unit: "m", scale: "linear", refs: [ref(0, 10, 10), ref(0, 50, 50)] }],
  curves: [
    { id: 1, panelId: 1, kind: "curve", impellerMm: 200, speedRpm: 2900, level: 0, peakAtMidpoint: taken, points: Array.from({ length: q1 - q0 + 1 }, (_, i) => px(q0 + i, headOf(q0 + i))) },
    box(2, 70, 20, 80), box(3, 74, 30, 60),
  ],
});
function read(s: TracerState) {
  const cals = calibrations(s);
  const ps = unreadPeaks(s, cals);
  expect(ps).toHaveLength(1);
  const [set] = analyseCsv(csvOf(s, cals)).result.curveSets;
  return { p: ps[0], text: peakWarning(ps[0], "m3/h"), label: peakBoxLabel(ps[0], "m3/h") ?? "", note: peakNote(ps, "m3/h"), curve: createPumpCurve({ points: set.points }) };
}
const num = (m: RegExpMatchArray | null) => (m ? Number(m[1]) : NaN);

// Starts on the 74 % contour: clicked 30–95 m³/h, first point on the contour's left side, inside 30–60. Ends on it: clicked
// 5–60 m³/h, last point on its right side, inside 30–60 (5, not 0, so that no CSV row falls on the crossing at 30 by chance).
const cases = [
  { name: "a curve that starts on the 74 % contour", q0: 30, q1: 95, start: true },
  { name: "a curve that ends on the 74 % contour", q0: 5, q1: 60, start: false },
];

describe("a head curve that starts or ends on a contour", () => {
  it("starting on the contour, is inside it up to the next crossing (it read as outside: a dip, 'leaves it at 30.0')", () => {
    const { p, text } = read(state(30, 95, false));
    expect([p.valley === true, Math.round(p.from), Math.round(p.to)]).toEqual([false, 30, 60]);
    expect(text).toMatch(/^Curve 1 \(200 mm, 2900 rpm\): the peak is not traced\. Inside the 74 % contour, from 30\.0 to 60\.0 m³\/h/);
  });

  for (const c of cases) {
    for (const taken of [false, true]) {
      it(`${c.name}, box ${taken ? "ticked" : "unticked"}: the words on the best-efficiency point are the engine's`, () => {
        const { p, text, curve } = read(state(c.q0, c.q1, taken));
        const none = /no best-efficiency point is known for this curve/i.test(text);
        const atMiddle = num(text.match(/middle of that span, ([\d.]+) m³\/h, is written at [\d.]+ % and taken as the best-efficiency point/));
        const outside = /puts the best-efficiency point outside the contour/.test(text);
        expect([none, Number.isFinite(atMiddle), outside].filter(Boolean)).toHaveLength(1);
        expect(curve.bep === null).toBe(none);
        if (Number.isFinite(atMiddle)) expect(Math.abs(curve.bep!.flow * 3600 - atMiddle)).toBeLessThanOrEqual(0.05); // the text's 0.1 m³/h
        expect([p.onStart === true, p.onEnd === true]).toEqual([c.start, !c.start]);
      });
    }
    it(`${c.name}: the box's label says what ticking it does`, () => {
      const { label } = read(state(c.q0, c.q1, false));
      const ticked = read(state(c.q0, c.q1, true));
      const takesBep = /as Curve 1’s best-efficiency point$/.test(label);
      expect(takesBep || /no best-efficiency point either way$/.test(label)).toBe(true);
      expect(ticked.curve.bep !== null).toBe(takesBep);
      if (takesBep) expect(Math.abs(ticked.curve.bep!.flow * 3600 - 45)).toBeLessThan(0.05); // the middle of 30–60 (construction)
      expect(/no BEP/.test(ticked.note)).toBe(!takesBep);
    });
  }
});
