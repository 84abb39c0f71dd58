// Axis calibration: exact cases worked by hand (common practice: a straight line through two
// points; log10 for a logarithmic axis), the affine fit's residual, and bad input.
import { describe, expect, it } from "vitest";
import { calibrate, toData, toPixel, TraceInputError } from "./calibrate";

const straight = {
  xRefs: [{ u: 100, v: 500, value: 0 }, { u: 700, v: 500, value: 300 }],
  yRefs: [{ u: 100, v: 500, value: 0 }, { u: 100, v: 100, value: 80 }],
};

describe("calibrate", () => {
  it("reads a linear chart: 2 px per m³/h, 5 px per m (worked by hand)", () => {
    const cal = calibrate({ ...straight, xScale: "linear", yScale: "linear" });
    const d = toData(cal, { u: 400, v: 300 });
    expect(d.x).toBeCloseTo(150, 9);
    expect(d.y).toBeCloseTo(40, 9);
    expect(cal.residual.xMaxPct).toBeLessThan(1e-9);
    const p = toPixel(cal, 150, 40)!;
    expect(p.u).toBeCloseTo(400, 9);
    expect(p.v).toBeCloseTo(300, 9);
  });

  it("reads a logarithmic flow axis: halfway between 1 and 100 is 10 (log10, by hand)", () => {
    const cal = calibrate({ xRefs: [{ u: 100, v: 500, value: 1 }, { u: 700, v: 500, value: 100 }], yRefs: straight.yRefs, xScale: "log", yScale: "linear" });
    expect(toData(cal, { u: 400, v: 500 }).x).toBeCloseTo(10, 9);
    expect(toPixel(cal, 0, 10)).toBeNull();
  });

  it("reads a rotated chart from two clicks per axis (axes 90° turned: flow runs up the picture)", () => {
    const cal = calibrate({
      xRefs: [{ u: 500, v: 700, value: 0 }, { u: 500, v: 100, value: 300 }],
      yRefs: [{ u: 500, v: 700, value: 0 }, { u: 100, v: 700, value: 80 }],
      xScale: "linear", yScale: "linear",
    });
    const d = toData(cal, { u: 300, v: 400 });
    expect(d.x).toBeCloseTo(150, 9);
    expect(d.y).toBeCloseTo(40, 9);
  });

  it("shows a residual when a third reference disagrees, and none when it agrees", () => {
    const agree = calibrate({ ...straight, xRefs: [...straight.xRefs, { u: 400, v: 500, value: 150 }], xScale: "linear", yScale: "linear" });
    expect(agree.residual.xMaxPct).toBeLessThan(1e-9);
    const off = calibrate({ ...straight, xRefs: [...straight.xRefs, { u: 403, v: 500, value: 150 }], xScale: "linear", yScale: "linear" });
    // 3 px of 600 px miss shared by least squares: residual between 0.1 % and 0.5 % of the span.
    expect(off.residual.xMaxPct).toBeGreaterThan(0.1);
    expect(off.residual.xMaxPct).toBeLessThan(0.5);
  });

  it("fits a full affine map from grid points off the axes, exact for an affine picture", () => {
    // A sheared picture: u = 100 + 2x + 1.25y, v = 500 − 5y (px), so no axis is a pixel row or column.
    const map = (x: number, y: number) => ({ u: 100 + 2 * x + 0.25 * 5 * y, v: 500 - 5 * y });
    const grid = [[0, 0], [300, 0], [0, 80], [300, 80], [150, 40]].map(([x, y]) => ({ ...map(x, y), x, y }));
    const cal = calibrate({ xRefs: [], yRefs: [], gridRefs: grid, xScale: "linear", yScale: "linear" });
    expect(cal.residual.fullAffine).toBe(true);
    expect(cal.residual.rmsPct).toBeLessThan(1e-9);
    const d = toData(cal, map(120, 33));
    expect(d.x).toBeCloseTo(120, 9);
    expect(d.y).toBeCloseTo(33, 9);
  });

  it("refuses too few, equal, non-finite or non-positive-log references", () => {
    const bad = (o: Partial<Parameters<typeof calibrate>[0]>) => () => calibrate({ ...straight, xScale: "linear", yScale: "linear", ...o });
    expect(bad({ xRefs: straight.xRefs.slice(0, 1) })).toThrow(TraceInputError);
    expect(bad({ yRefs: [] })).toThrow(TraceInputError);
    expect(bad({ xRefs: [{ u: 100, v: 500, value: 5 }, { u: 700, v: 500, value: 5 }] })).toThrow(/two different values/);
    expect(bad({ xRefs: [{ u: 100, v: 500, value: NaN }, straight.xRefs[1]] })).toThrow(TraceInputError);
    expect(bad({ xRefs: [{ u: Infinity, v: 500, value: 0 }, straight.xRefs[1]] })).toThrow(TraceInputError);
    expect(bad({ xScale: "log" })).toThrow(/above zero/);
    // Both axes clicked along the same line: the axes come out parallel.
    expect(bad({ yRefs: [{ u: 100, v: 500, value: 0 }, { u: 700, v: 500, value: 80 }] })).toThrow(TraceInputError);
  });
});
