// Recovery of an invented chart drawn by the test (test-chart.ts): calibrate on its tick marks,
// trace each impeller curve by colour, and compare with the function that drew it. The limits are
// the acceptance figures (issue 20): 0.5 % of the axis span for points, 1 point of efficiency.
import { describe, expect, it } from "vitest";
import { PNG } from "pngjs";
import { calibrate, colourMask, resample, toData, traceMask, type AxisRef, type Calibration, type Rgba } from "./index";
import { CHART, CURVE_COLOUR, IMPELLERS, Q_MAX, drawChart, headOf, paper, skewed, type Skew } from "./test-chart";

/** Through a real PNG file and back, as an upload would be. */
function viaPng(img: { width: number; height: number; data: Uint8ClampedArray }): Rgba {
  const png = new PNG({ width: img.width, height: img.height });
  png.data = Buffer.from(img.data);
  const bytes = PNG.sync.write(png);
  expect([...bytes.subarray(0, 4)]).toEqual([0x89, 0x50, 0x4e, 0x47]);
  const back = PNG.sync.read(bytes);
  return { width: back.width, height: back.height, data: back.data };
}

/** The user's clicks: tick ends on the axes at known values (where the test drew them). */
function clicks(skew?: Skew, extraX = false) {
  const at = (q: number, h: number, value: number): AxisRef => {
    const [u, v] = skewed(paper(q, h), skew);
    return { u, v, value };
  };
  const xRefs = [at(10, 0, 10), at(90, 0, 90), ...(extraX ? [at(50, 0, 50)] : [])];
  const yRefs = [at(0, 10, 10), at(0, 50, 50)];
  return { xRefs, yRefs };
}

/** Max |traced − true| over the traced points, % of each axis span (head at traced flow). */
function recovery(img: Rgba, cal: Calibration, skew?: Skew) {
  let worst = 0, n = 0, worstRow = 0;
  for (const imp of IMPELLERS) {
    const mask = colourMask(img, CURVE_COLOUR, 90, { u0: 0, v0: 0, u1: img.width - 1, v1: img.height - 1 });
    const [su, sv] = skewed(paper(20, headOf(imp.h0, 20)), skew);
    const pts = traceMask(mask, img, cal, { u0: 0, v0: 0, u1: img.width - 1, v1: img.height - 1 }, { seed: { u: su, v: sv }, maxJump: 12 }).map((p) => toData(cal, p));
    const inside = pts.filter((p) => p.x >= 1 && p.x <= Q_MAX - 1);
    expect(inside.length).toBeGreaterThan(200);
    for (const p of inside) worst = Math.max(worst, (100 * Math.abs(p.y - headOf(imp.h0, p.x))) / (CHART.head[1] - CHART.head[0]));
    // The trace covers the drawn flow range (within 1 % of the flow span at each end).
    expect(inside[0].x).toBeLessThan(2);
    expect(inside[inside.length - 1].x).toBeGreaterThan(Q_MAX - 2);
    n += inside.length;
    // The 15 points that go into the CSV (resampled as tracedRows does).
    for (const p of resample(pts, 15)) worstRow = Math.max(worstRow, (100 * Math.abs(p.y - headOf(imp.h0, p.x))) / (CHART.head[1] - CHART.head[0]));
  }
  return { worst, n, worstRow };
}

describe("tracing an invented chart (issue 20 acceptance: within 0.5 % of the axis span)", () => {
  it("recovers three impeller curves from a PNG", () => {
    const img = viaPng(drawChart());
    const cal = calibrate({ ...clicks(), xScale: "linear", yScale: "linear" });
    expect(cal.residual.xMaxPct).toBeLessThan(1e-9);
    const r = recovery(img, cal);
    console.log(`tracer recovery, straight PNG: max |error| ${r.worst.toFixed(3)} % of head span over ${r.n} traced points, ${r.worstRow.toFixed(3)} % over the 45 resampled CSV points`);
    expect(r.worst).toBeLessThan(0.5);
    expect(r.worstRow).toBeLessThan(0.5);
  });

  it("recovers them from a rotated and sheared scan with two clicks per axis", () => {
    const skew = { angleDeg: 2.5, shear: 0.03 };
    const img = viaPng(drawChart({ skew }));
    const cal = calibrate({ ...clicks(skew), xScale: "linear", yScale: "linear" });
    const r = recovery(img, cal, skew);
    console.log(`tracer recovery, skewed PNG (2.5°, shear 0.03): max |error| ${r.worst.toFixed(3)} % of head span over ${r.n} traced points, ${r.worstRow.toFixed(3)} % over the 45 resampled CSV points`);
    expect(r.worst).toBeLessThan(0.5);
    expect(r.worstRow).toBeLessThan(0.5);
  });

  it("a straight-axes calibration misreads the same skewed scan (the affine completion matters)", () => {
    const skew = { angleDeg: 2.5, shear: 0.03 };
    const img = viaPng(drawChart({ skew }));
    const c = clicks(skew);
    // Force axis-aligned clicks (as a reader that ignores skew would): u for flow, v for head only.
    const naive = calibrate({ xRefs: c.xRefs.map((r) => ({ ...r, v: 0 })), yRefs: c.yRefs.map((r) => ({ ...r, u: 0 })), xScale: "linear", yScale: "linear" });
    expect(recovery(img, naive, skew).worst).toBeGreaterThan(0.5);
  });
});
