// A contour that runs along a head curve (contours.ts): the two ends of the run are one meeting — a crossing where the
// contour leaves on the other side from the one it came from, a touch where it leaves on the same side — and the
// efficiency is the contour's level all along the run, never a gap. Check values: geometry of invented polylines in one
// plane (flow, head): the head curve (0, 32) → (10, 30) → (20, 25) → (30, 18) falls 0.5 m per unit of flow from 10 to
// 20, and the contours' points (12, 29) and (18, 26) lie on that segment; a run 0.01 m off it is a contour that crosses.
import { describe, expect, it } from "vitest";
import { contourGaps, crossings, efficiencyFromContours, type Contour } from "./index";

const curve = [{ x: 0, y: 32 }, { x: 10, y: 30 }, { x: 20, y: 25 }, { x: 30, y: 18 }];
const line = (level: number, pts: number[][], closed = false): Contour => ({ level, closed, points: pts.map(([x, y]) => ({ x, y })) });
const lower = line(60, [[4, 20], [8, 40]]); // a 60 % line crossing the curve once, near flow 5.9 (geometry)

describe("a contour running along the head curve from flow 12 to 18", () => {
  it("in from above, out above (open line): a touch, not two crossings; the efficiency is the level along the run", () => {
    const xs = crossings(curve, [lower, line(70, [[11, 40], [12, 29], [18, 26], [19, 40]])]);
    const at70 = xs.filter((p) => p.level === 70);
    expect(at70.map((p) => p.x)).toEqual([12, 18]);
    // old code: two crossings (no touch), and a gap between them where the efficiency was not read (null at 15)
    expect(at70.every((p) => p.touch)).toBe(true);
    expect(contourGaps(xs).filter((g) => g.level === 70)).toEqual([]);
    expect(efficiencyFromContours(xs, 15)).toBe(70);
  });
  it("in from above, out below (open line): one crossing at the run's start, its end no crossing of its own", () => {
    const xs = crossings(curve, [lower, line(70, [[11, 40], [12, 29], [18, 26], [19, 10]])]);
    const at70 = xs.filter((p) => p.level === 70);
    expect(at70.map((p) => [p.x, p.touch === true])).toEqual([[12, false], [18, true]]); // old code: [12, false], [18, false]
    expect(efficiencyFromContours(xs, 15)).toBe(70);
  });
  it("an island whose lower edge runs along the curve (closed): a touch; the flip, the edge 0.01 m below the curve: two crossings and the gap inside", () => {
    const on = crossings(curve, [lower, line(70, [[12, 29], [18, 26], [16, 35], [13, 34]], true)]).filter((p) => p.level === 70);
    expect(on.every((p) => p.touch)).toBe(true); // old code: two crossings
    const off = crossings(curve, [lower, line(70, [[12, 28.99], [18, 25.99], [16, 35], [13, 34]], true)]);
    expect(off.filter((p) => p.level === 70).some((p) => p.touch)).toBe(false);
    expect(contourGaps(off).some((g) => g.level === 70 && g.innermost)).toBe(true); // the curve inside the island between them
  });
  // The same island listed from another vertex: its edge along the curve is the ring's closing segment (12, 29) → (18, 26),
  // or runs (12, 29) → (15, 27.5) → (18, 26) across the array's end; (15, 27.5) lies on the curve's segment (geometry).
  it.each([
    ["the run is the closing segment", [[18, 26], [16, 35], [13, 34], [12, 29]]],
    ["the run wraps past the array's end through (15, 27.5)", [[15, 27.5], [18, 26], [16, 35], [13, 34], [12, 29]]],
    ["the run mid-array through (15, 27.5), the guard", [[16, 35], [13, 34], [12, 29], [15, 27.5], [18, 26]]],
  ])("an island listed so that %s: one touch, no gap", (_, pts) => {
    const xs = crossings(curve, [lower, line(70, pts, true)]);
    // old code (the wrapping two): [12, false], [18, false], a gap 12–18 and no efficiency at 15 (null)
    expect(xs.filter((p) => p.level === 70).map((p) => [p.x, p.touch === true])).toEqual([[12, true], [18, true]]);
    expect(contourGaps(xs).filter((g) => g.level === 70)).toEqual([]);
    expect(efficiencyFromContours(xs, 15)).toBe(70);
  });
  it("the wrapping run 0.01 m below the curve at (15, 27.49): two crossings and the gap inside (the flip)", () => {
    const xs = crossings(curve, [lower, line(70, [[15, 27.49], [18, 26], [16, 35], [13, 34], [12, 29]], true)]);
    expect(xs.filter((p) => p.level === 70).some((p) => p.touch)).toBe(false);
    expect(contourGaps(xs).some((g) => g.level === 70 && g.innermost)).toBe(true);
  });
});
