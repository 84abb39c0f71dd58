// Iso-efficiency islands of an invented impeller family (test-chart.ts): trace each contour and each
// impeller curve from the picture, read each impeller's efficiency where the contours cross it, and
// compare with the invented field that drew the contours. Issue 20's limit: within 1 point.
import { describe, expect, it } from "vitest";
import { calibrate, colourMask, contourGaps, crossings, efficiencyFromContours, toAxis, toData, traceIsland, traceMask, tracedRows, type Contour } from "./index";
import { CURVE_COLOUR, IMPELLERS, LEVELS, LEVEL_COLOURS, drawChart, etaField, headOf, paper } from "./test-chart";

describe("iso-efficiency contours against impeller curves", () => {
  const img = drawChart({ islands: true });
  const at = (q: number, h: number, value: number) => ({ u: paper(q, h)[0], v: paper(q, h)[1], value });
  const cal = calibrate({ xRefs: [at(10, 0, 10), at(90, 0, 90)], yRefs: [at(0, 10, 10), at(0, 50, 50)], xScale: "linear", yScale: "linear" });
  const all = { u0: 0, v0: 0, u1: img.width - 1, v1: img.height - 1 };
  const contours: Contour[] = LEVELS.map((level) => ({
    level,
    closed: true,
    points: traceIsland(colourMask(img, LEVEL_COLOURS[level], 60, all), img, all, 200).map((p) => { const a = toAxis(cal, p); return { x: a.X, y: a.Y }; }),
  }));
  const curves = IMPELLERS.map((imp) => {
    const [u, v] = paper(5, headOf(imp.h0, 5));
    const mask = colourMask(img, CURVE_COLOUR, 90, all);
    return { imp, pts: traceMask(mask, img, cal, all, { seed: { u, v }, maxJump: 12 }).map((p) => toData(cal, p)) };
  });

  it("finds each impeller's efficiency at the contour crossings within 1 point", () => {
    let worst = 0, n = 0;
    for (const { imp, pts } of curves) {
      const xs = crossings(pts, contours);
      // Each level crossed by this curve is crossed twice (both sides of the island), per the field.
      const expected = LEVELS.filter((L) => Math.max(...Array.from({ length: 951 }, (_, i) => etaField(i / 10, headOf(imp.h0, i / 10)))) > L + 0.3);
      expect(xs.map((x) => x.level).sort()).toEqual([...expected, ...expected].sort());
      for (const c of xs) {
        worst = Math.max(worst, Math.abs(c.level - etaField(c.x, headOf(imp.h0, c.x))));
        n++;
      }
    }
    console.log(`tracer iso-efficiency: max |error| ${worst.toFixed(3)} points at ${n} crossings`);
    expect(n).toBeGreaterThan(12);
    expect(worst).toBeLessThan(1);
  });

  it("writes the efficiency read between crossings into our CSV within 1 point of the field, blank inside the innermost island", () => {
    let worst = 0, n = 0, blank = 0;
    for (const { imp, pts } of curves) {
      const xs = crossings(pts, contours);
      const gaps = contourGaps(xs);
      // Inside the innermost level crossed the contours say only "above that level": the one span left unread.
      expect(gaps.map((g) => [g.level, g.innermost])).toEqual([[Math.max(...xs.map((x) => x.level)), true]]);
      const eff = pts.map((p) => ({ x: p.x, y: efficiencyFromContours(xs, p.x) })).filter((p): p is { x: number; y: number } => p.y != null);
      expect(eff.some((p) => p.x > gaps[0].from && p.x < gaps[0].to)).toBe(false);
      const rows = tracedRows([{ model: "Invented 1", speedRpm: 2900, impellerMm: imp.mm, curves: { head: pts, efficiency: eff }, efficiencyGaps: gaps }], { flow: "m3/h", head: "m", efficiency: "%", power: "kW", npshr: "m" }, 25);
      for (const r of rows.slice(1)) {
        const [q, e] = [r[5] as number, r[7] as number | null];
        if (q > gaps[0].from && q < gaps[0].to) {
          expect(e).toBeNull();
          blank++;
          continue;
        }
        if (e == null) continue;
        worst = Math.max(worst, Math.abs(e - etaField(q, headOf(imp.h0, q))));
        n++;
      }
    }
    console.log(`tracer iso-efficiency between crossings (outside the innermost island): max |error| ${worst.toFixed(3)} points over ${n} rows; ${blank} rows inside it blank`);
    expect(n).toBeGreaterThan(10);
    expect(blank).toBeGreaterThan(10);
    expect(worst).toBeLessThan(1);
  });
});
