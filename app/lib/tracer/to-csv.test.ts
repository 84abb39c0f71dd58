// Traced curves → our CSV → the importer (the same analyseCsv the upload path runs), unchanged
// mapping. Check values come from the invented curves of test-chart.ts.
import { describe, expect, it } from "vitest";
import { analyseCsv } from "~/lib/import";
import { engineSmooth, resample, tracedCsv, tracedRows, valueAt, type XY } from "./index";
import { K } from "./test-chart";

const units = { flow: "l/s", head: "ft", efficiency: "%", power: "kW", npshr: "m" } as const;
const dense = (f: (x: number) => number, x0: number, x1: number, n = 200): XY[] => Array.from({ length: n }, (_, i) => ({ x: x0 + ((x1 - x0) * i) / (n - 1), y: f(x0 + ((x1 - x0) * i) / (n - 1)) }));

describe("our CSV from traced points", () => {
  const head = (x: number) => 170 - 0.02 * x * x; // ft over l/s, invented
  const sets = [
    { model: "Traced 80-200", speedRpm: 2900, impellerMm: 205, curves: { head: dense(head, 0, 60), efficiency: dense((x) => 40 + x, 10, 50), npshr: dense((x) => 1 + 0.05 * x, 5, 60) } },
    { model: "Traced 80-200", speedRpm: 2900, impellerMm: 190, curves: { head: dense((x) => 140 - 0.02 * x * x, 0, 55) } },
    { model: "Too short", speedRpm: 2900, impellerMm: 150, curves: { head: dense(head, 0, 10, 2) } },
  ];

  it("imports as two curve sets with SI values, empty cells outside a traced range", () => {
    const csv = tracedCsv(sets, units, 12);
    expect(csv.split("\n")[0]).toBe("model,type,size,speed_rpm,impeller_mm,flow_m3h,head_m,efficiency_pct,power_kw,npshr_m");
    const a = analyseCsv(csv);
    expect(a.result.curveSets.map((c) => c.ok)).toEqual([true, true]);
    const [c1] = a.result.curveSets;
    expect(c1.points).toHaveLength(12);
    expect(c1.impellerDiameter).toBeCloseTo(0.205, 9);
    // 60 l/s = 0.06 m³/s; head there 170 − 72 = 98 ft = 29.8704 m (1 ft = 0.3048 m, NIST SP 811).
    expect(c1.points[11].flow).toBeCloseTo(0.06, 6);
    expect(c1.points[11].head).toBeCloseTo(98 * 0.3048, 3);
    expect(c1.points[0].efficiency).toBeUndefined(); // traced from 10 l/s only
    expect(c1.points[11].efficiency).toBeUndefined(); // traced up to 50 l/s only
    expect(c1.points[5].efficiency).toBeCloseTo((40 + 60 * (5 / 11)) / 100, 3);
  });

  it("drops traced points left of zero flow (a stroke's end cap at the axis), keeps the rest", () => {
    const rows = tracedRows([{ model: "Cap", speedRpm: 1450, impellerMm: 200, curves: { head: [{ x: -0.3, y: 30 }, ...dense((x) => 30 - x, 0, 10, 11)] } }], { flow: "m3/h", head: "m", efficiency: "%", power: "kW", npshr: "m" }, 5);
    expect(rows.slice(1).map((r) => r[5])).toEqual([0, 2.5, 5, 7.5, 10]);
    expect(analyseCsv(tracedCsv([{ model: "Cap", speedRpm: 1450, impellerMm: 200, curves: { head: [{ x: -0.3, y: 30 }, ...dense((x) => 30 - x, 0, 10, 11)] } }], { flow: "m3/h", head: "m", efficiency: "%", power: "kW", npshr: "m" }, 5)).result.curveSets[0].ok).toBe(true);
  });

  it("resamples a noisy trace without bias beyond the noise (quadratic curve, ±0.2 m noise)", () => {
    let seed = 1;
    const noise = () => ((seed = (seed * 16807) % 2147483647) / 2147483647 - 0.5) * 0.4;
    const truth = (q: number) => 52 - K * q * q;
    const pts = resample(dense((q) => truth(q) + noise(), 0, 95, 400), 15);
    expect(pts).toHaveLength(15);
    for (const p of pts) expect(Math.abs(p.y - truth(p.x))).toBeLessThan(0.1);
  });

  it("draws the engine's interpolant through the points and reads nothing outside them", () => {
    const pts = [{ x: 0, y: 10 }, { x: 1, y: 9 }, { x: 2, y: 6 }, { x: 3, y: 1 }];
    const s = engineSmooth(pts, 31);
    expect(s[0]).toEqual({ x: 0, y: 10 });
    expect(s[30].y).toBeCloseTo(1, 12);
    expect(valueAt(pts, 3.0001)).toBeNull();
    expect(valueAt(pts, -0.0001)).toBeNull();
    expect(valueAt([], 1)).toBeNull();
    expect(valueAt([{ x: NaN, y: 1 }, { x: 1, y: Infinity }], 1)).toBeNull();
  });
});
