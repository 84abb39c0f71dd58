// What the tracer refuses to send to the import until the user fixes it (curve-checks.ts): two curves
// of one quantity with the same speed and impeller Ø (the CSV keeps one curve per key, so the other
// would vanish), an impeller Ø left blank beside curves that have one (the importer refuses a blank
// key cell), a speed left blank, and a curve no head curve of its key takes. Invented curves.
import { describe, expect, it } from "vitest";
import { calibrations, csvOf, initialState, withNewCurve, type Curve, type TracerState } from "./model";
import { curveProblems, importBlock } from "./curve-checks";

const pts = (h0: number) => Array.from({ length: 10 }, (_, i) => ({ u: 100 + 50 * i, v: 500 - h0 * 8 + i * i }));
const curve = (id: number, panelId: number, impellerMm: number, h0: number, speedRpm = 2900): Curve => ({ id, panelId, kind: "curve", impellerMm, speedRpm, level: 0, points: pts(h0) });
const base = initialState();
const withCurves = (curves: Curve[]): TracerState => ({
  ...base,
  model: "Invented 50-200",
  xRefs: [{ u: 100, v: 500, value: 0 }, { u: 600, v: 500, value: 100 }],
  panels: [
    { id: 1, quantity: "head", unit: "m", scale: "linear", refs: [{ u: 80, v: 500, value: 0 }, { u: 80, v: 100, value: 50 }] },
    { id: 2, quantity: "efficiency", unit: "%", scale: "linear", refs: [{ u: 80, v: 500, value: 0 }, { u: 80, v: 100, value: 100 }] },
  ],
  curves,
});

describe("curve checks before import", () => {
  it("passes distinct curves", () => {
    const s = withCurves([curve(1, 1, 250, 50), curve(2, 1, 230, 45), curve(3, 2, 250, 40)]);
    expect(curveProblems(s)).toEqual([]);
    expect(importBlock(s)).toBeNull();
  });

  it("flags a second head curve with the same speed and impeller Ø (it used to be dropped from the CSV without a word)", () => {
    const s = withCurves([curve(1, 1, 230, 50), curve(2, 1, 230, 45)]);
    // The CSV holds one curve per key: the second head curve is not in it.
    expect(csvOf(s, calibrations(s)).trim().split("\n").length - 1).toBe(15);
    const p = curveProblems(s);
    expect(p.map((x) => x.curveId)).toEqual([1, 2]);
    expect(p[1].message).toBe("Curve 1 and Curve 2 are both head curves at 2900 rpm with impeller Ø 230 mm: the CSV keeps one curve per speed and impeller, so give each its own Ø (or speed) or remove one.");
    expect(importBlock(s)).toMatch(/^Fix 2 curves before import/);
  });

  it("flags an impeller Ø left blank beside curves that have one, and a blank speed", () => {
    const s = withCurves([curve(1, 1, 250, 50), curve(2, 1, NaN, 45), curve(3, 1, 210, 40, NaN)]);
    expect(curveProblems(s)).toEqual([
      { curveId: 2, message: "Curve 2 has no impeller Ø while other curves have one: type it (the importer refuses a curve without one among curves with one)." },
      { curveId: 3, message: "Curve 3 has no speed: type it in rpm (above zero)." },
    ]);
  });

  it("flags a curve that no head curve of its speed and impeller takes", () => {
    const s = withCurves([curve(1, 1, 250, 50), curve(2, 2, 240, 40)]);
    expect(curveProblems(s)).toEqual([
      { curveId: 2, message: "Curve 2 (efficiency) has no head curve at 2900 rpm with impeller Ø 240 mm: it would be left out of the CSV; trace that head curve or give this one the Ø and speed of its head curve." },
    ]);
  });

  it("starts a new curve with a blank impeller Ø and the active curve's speed", () => {
    const s = withNewCurve({ ...withCurves([curve(1, 1, 250, 50, 1450)]), activeCurve: 1 }, "curve");
    expect(s.curves[1]).toMatchObject({ id: 2, kind: "curve", speedRpm: 1450, points: [] });
    expect(Number.isNaN(s.curves[1].impellerMm)).toBe(true);
    expect(s.activeCurve).toBe(2);
    expect(withNewCurve(s, "contour").curves[2]).toMatchObject({ id: 3, kind: "contour", closed: false });
  });

  it("leaves no impeller on any curve alone (the CSV then has no impeller column)", () => {
    expect(curveProblems(withCurves([curve(1, 1, NaN, 50)]))).toEqual([]);
  });
});
