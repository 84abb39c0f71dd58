// The tracer page's wiring (model.ts) at its edges: an open iso-efficiency line clicked by hand, the
// peak inside the innermost contour, panels of one quantity in different units, and curves with no
// impeller Ø. Charts are the invented ones of app/lib/tracer/test-chart.ts (paper(): chart data →
// page pixels); expected values come from the invented functions that drew them.
import { describe, expect, it } from "vitest";
import { createPumpCurve, efficiencyAt } from "~/engine";
import { analyseCsv } from "~/lib/import";
import { colourMask, traceIsland, traceMask, calibrate } from "~/lib/tracer";
import { peakNote, peakWarning } from "~/lib/tracer/peak";
import { CURVE_COLOUR, IMPELLERS, LEVELS, LEVEL_COLOURS, drawChart, etaField, headOf, paper } from "~/lib/tracer/test-chart";
import { calibrations, cleared, contourEfficiency, contourReading, csvOf, initialState, takeIsland, tracedSets, unreadPeaks, type Curve, type Panel, type TracerState } from "./model";

const ref = (q: number, h: number, value: number) => ({ u: paper(q, h)[0], v: paper(q, h)[1], value });
const xRefs = [ref(10, 0, 10), ref(90, 0, 90)];
const headPanel = (id: number, unit: "m" | "ft"): Panel => {
  const k = unit === "ft" ? 1 / 0.3048 : 1; // 1 ft = 0.3048 m (NIST SP 811)
  return { id, quantity: "head", unit, scale: "linear", refs: [ref(0, 10, 10 * k), ref(0, 50, 50 * k)] };
};
/** A head curve clicked along H = h0 − 0.003·Q² (the test chart's K), one point per m³/h from 0 to 95. */
const clickedHead = (id: number, panelId: number, h0: number, impellerMm: number): Curve => ({
  id, panelId, kind: "curve", impellerMm, speedRpm: 2900, level: 0,
  points: Array.from({ length: 96 }, (_, q) => ({ u: paper(q, headOf(h0, q))[0], v: paper(q, headOf(h0, q))[1] })),
});
const state = (panels: Panel[], curves: Curve[], model = "Invented 65-250"): TracerState => ({ ...initialState(), model, xRefs, panels, curves });

describe("an iso-efficiency line clicked by hand is open unless the user closes it", () => {
  // One arm of the 70 % contour clicked as three points; the head curve H = 50 − 0.003·Q² crosses only
  // its lower segment (82,30)–(78,15), at 81.96 m³/h (solved numerically); the chord (78,15)→(75,40)
  // that closing the line would add meets it at 75.87 m³/h.
  const arm: Curve = { id: 2, panelId: 1, kind: "contour", impellerMm: NaN, speedRpm: 2900, level: 70, points: [paper(75, 40), paper(82, 30), paper(78, 15)].map(([u, v]) => ({ u, v })) };
  const head = clickedHead(1, 1, 50, 200);

  it("crosses the open arm once (81.96 m³/h), so no efficiency curve is made from one crossing", () => {
    const s = state([headPanel(1, "m")], [head, arm]);
    const cals = calibrations(s);
    const eff = contourEfficiency(s, head, cals);
    expect(eff.map((p) => +p.x.toFixed(2))).toEqual([81.96]);
    expect(tracedSets(s, cals)[0].curves.efficiency).toBeUndefined();
  });

  it("says so on the page: the one contour, its level and the one flow; the CSV has no efficiency for the curve", () => {
    const s = state([headPanel(1, "m")], [head, arm]);
    const cals = calibrations(s);
    const ps = unreadPeaks(s, cals);
    expect(ps.map((p) => [p.curve, p.level, p.lone, p.taken, +p.from.toFixed(2)])).toEqual([["Curve 1", 70, true, false, 81.96]]);
    expect(peakWarning(ps[0], "m3/h")).toMatch(/^Curve 1 \(200 mm, 2900 rpm\): the efficiency is not read\. The curve crosses one contour only, the 70 % contour, once, at 82\.0 m³\/h: the efficiency is known at that one flow only/);
    expect(peakNote(ps, "m3/h")).toBe("efficiency at one contour crossing only, none written: 200 mm, 2900 rpm 70 % at 82.0 m³/h");
    // What the warning says of the engine: no efficiency written, so none, no power, no BEP...
    const [c] = analyseCsv(csvOf(s, cals)).result.curveSets;
    expect(c.points.filter((p) => p.efficiency !== undefined)).toEqual([]);
    const curve = createPumpCurve({ points: c.points });
    expect([curve.efficiency, curve.bep, efficiencyAt(curve, c.points[5].flow)]).toEqual([null, null, null]);
    expect(curve.warnings.map((w) => w.code)).toContain("no-efficiency");
    // ...and one value alone makes no efficiency curve, nor a BEP (pumpCurve.ts: a column needs two rows, a BEP an interior peak).
    const one = createPumpCurve({ points: c.points.map((p, i) => (i === 5 ? { ...p, efficiency: 0.7 } : p)) });
    expect([one.efficiency, efficiencyAt(one, c.points[5].flow), one.bep]).toEqual([null, null, null]);
    expect(one.warnings.map((w) => w.code)).toContain("bep-not-published");
  });

  it("closed by the user's choice, the chord's crossing (75.87 m³/h) counts too", () => {
    const s = state([headPanel(1, "m")], [head, { ...arm, closed: true }]);
    expect(contourReading(s, head, calibrations(s)).crossings.map((x) => +x.x.toFixed(2))).toEqual([75.87, 81.96]);
  });

  it("the island tracer's outline is closed, a cleared line open again", () => {
    const island = takeIsland(arm, arm.points);
    expect(island.closed).toBe(true);
    expect(cleared(island)).toEqual({ ...arm, points: [], closed: false });
  });
});

describe("each curve is converted with its own panel's unit", () => {
  it("a head curve on a second head panel in ft comes out in metres, as the one on the panel in m", () => {
    // Both panels calibrated on the same paper: 10 and 50 m are 32.81 and 164.04 ft.
    const s = state([headPanel(1, "m"), headPanel(2, "ft")], [clickedHead(1, 1, 52, 250), clickedHead(2, 2, 45, 230)]);
    const a = analyseCsv(csvOf(s, calibrations(s)));
    expect(a.result.curveSets.map((c) => c.ok)).toEqual([true, true]);
    for (const c of a.result.curveSets) {
      const h0 = c.impellerDiameter! > 0.24 ? 52 : 45;
      for (const p of c.points) expect(p.head).toBeCloseTo(headOf(h0, p.flow * 3600), 2);
    }
  });
});

describe("a curve with no impeller Ø", () => {
  it("is written without the impeller column when no curve has one, and imports", () => {
    for (const blank of [NaN, 0]) {
      const s = state([headPanel(1, "m")], [clickedHead(1, 1, 52, blank)]);
      const csv = csvOf(s, calibrations(s));
      expect(csv.split("\n")[0]).not.toContain("impeller");
      const a = analyseCsv(csv);
      expect(a.result.problems.filter((p) => p.severity === "error")).toEqual([]);
      expect(a.result.curveSets.map((c) => [c.ok, c.impellerDiameter ?? null])).toEqual([[true, null]]);
    }
  });
});

describe("efficiency inside the innermost contour a head curve crosses (invented islands chart)", () => {
  const img = drawChart({ islands: true });
  const all = { u0: 0, v0: 0, u1: img.width - 1, v1: img.height - 1 };
  const yRefs = [ref(0, 10, 10), ref(0, 50, 50)];
  const cal = calibrate({ xRefs, yRefs, xScale: "linear", yScale: "linear" });
  const curves: Curve[] = [
    ...IMPELLERS.map((imp, i) => {
      const [u, v] = paper(5, headOf(imp.h0, 5));
      return { id: i + 1, panelId: 1, kind: "curve" as const, impellerMm: imp.mm, speedRpm: 2900, level: 0, points: traceMask(colourMask(img, CURVE_COLOUR, 90, all), img, cal, all, { seed: { u, v }, maxJump: 12 }) };
    }),
    ...LEVELS.map((L, i) => ({ id: 10 + i, panelId: 1, kind: "contour" as const, impellerMm: NaN, speedRpm: 2900, level: L, closed: true, points: traceIsland(colourMask(img, LEVEL_COLOURS[L], 60, all), img, all, 200) })),
  ];
  const s = state([{ ...headPanel(1, "m"), refs: yRefs }], curves);
  /** The invented field along an impeller's curve: its peak and the span inside its innermost level crossed. */
  const truth = (h0: number) => {
    const along = Array.from({ length: 9501 }, (_, i) => ({ q: i / 100, e: etaField(i / 100, headOf(h0, i / 100)) }));
    const peak = along.reduce((a, b) => (b.e > a.e ? b : a));
    const top = Math.max(...LEVELS.filter((L) => L < peak.e));
    const inside = along.filter((p) => p.e > top);
    return { peak, top, from: inside[0].q, to: inside[inside.length - 1].q };
  };
  const engineCurves = (st: TracerState) =>
    analyseCsv(csvOf(st, calibrations(st))).result.curveSets.map((c) => ({ mm: Math.round(c.impellerDiameter! * 1000), points: c.points, curve: createPumpCurve({ points: c.points }) }));

  it("names each curve's unread span with its level, the next level drawn and its middle", () => {
    const ps = unreadPeaks(s, calibrations(s));
    expect(ps.map((p) => [p.curve, p.impellerMm, p.level, p.next, p.taken])).toEqual([["Curve 1", 250, 82, null, false], ["Curve 2", 230, 82, null, false], ["Curve 3", 210, 78, 82, false]]);
    for (const p of ps) {
      const t = truth(IMPELLERS.find((x) => x.mm === p.impellerMm)!.h0);
      expect(Math.abs(p.from - t.from)).toBeLessThan(0.5);
      expect(Math.abs(p.to - t.to)).toBeLessThan(0.5);
      expect(p.midpoint).toBeCloseTo((p.from + p.to) / 2, 9);
    }
    const w = peakWarning(ps[2], "m3/h");
    console.log(`tracer peak warning: ${w}\ntracer peak note: ${peakNote(ps, "m3/h")}`);
    expect(w).toMatch(/^Curve 3 \(210 mm, 2900 rpm\): the peak is not traced\. Inside the 78 % contour, from \d+\.\d to \d+\.\d m³\/h, the contours say only that the efficiency is above 78 % and below 82 %, so the efficiency there is left blank/);
    expect(peakNote(ps, "m3/h")).toMatch(/^peak not traced, efficiency blank inside the innermost contour: 250 mm, 2900 rpm above 82 % at \d+\.\d–\d+\.\d m³\/h; 230 mm/);
  });

  it("leaves it blank (no flat plateau at the contour's level): the engine's BEP then lies outside that contour", () => {
    for (const { mm, points, curve } of engineCurves(s)) {
      const t = truth(IMPELLERS.find((x) => x.mm === mm)!.h0);
      // 1 m³/h of margin: the traced crossings lie within a fraction of that of the invented ones.
      const inside = points.filter((p) => p.flow * 3600 > t.from + 1 && p.flow * 3600 < t.to - 1);
      expect(inside.length).toBeGreaterThan(1);
      expect(inside.filter((p) => p.efficiency !== undefined)).toEqual([]);
      const bepQ = curve.bep!.flow * 3600;
      expect(bepQ < t.from + 1 || bepQ > t.to - 1).toBe(true);
      // What the engine reads across the blank rows: below the contour's level (understated, not invented).
      expect(efficiencyAt(curve, ((t.from + t.to) / 2) / 3600)! * 100).toBeLessThan(t.top);
    }
  });

  it("takes the middle of the innermost contour as the BEP, at its level, when the user confirms it", () => {
    const confirmed = { ...s, curves: s.curves.map((c) => (c.kind === "curve" ? { ...c, peakAtMidpoint: true } : c)) };
    const rows: string[] = [];
    for (const { mm, curve } of engineCurves(confirmed)) {
      const t = truth(IMPELLERS.find((x) => x.mm === mm)!.h0);
      const bep = curve.bep!;
      rows.push(`${mm} mm: BEP ${(bep.flow * 3600).toFixed(2)} m³/h at ${(100 * bep.efficiency).toFixed(1)} % (field's peak ${t.peak.q.toFixed(2)} m³/h at ${t.peak.e.toFixed(2)} %)`);
      expect(100 * bep.efficiency).toBeCloseTo(t.top, 6);
      // The chord's middle, not the peak itself: within 1 m³/h on this chart (0.52 at 210 mm from the field alone).
      expect(Math.abs(bep.flow * 3600 - t.peak.q)).toBeLessThan(1);
    }
    console.log(`tracer BEP at the innermost contour's middle: ${rows.join("; ")}`);
    expect(rows).toHaveLength(3);
  });

  it("warns for a head curve that ends inside its innermost contour, blank from its one crossing on unless the user takes the span's middle", () => {
    // The 250 mm curve clicked from 0 only to the middle of its span inside the 82 % contour (rounded to a whole m³/h).
    const t = truth(52);
    const qEnd = Math.round((t.from + t.to) / 2);
    const full = clickedHead(1, 1, 52, 250);
    const st = { ...s, curves: [{ ...full, points: full.points.slice(0, qEnd + 1) }, ...s.curves.filter((c) => c.kind === "contour")] };
    const ps = unreadPeaks(st, calibrations(st));
    expect(ps.map((p) => [p.curve, p.level, p.next, p.toEnd, p.taken])).toEqual([["Curve 1", 82, null, true, false]]);
    expect(Math.abs(ps[0].from - t.from)).toBeLessThan(0.5);
    expect(ps[0].to).toBeCloseTo(qEnd, 6); // the last clicked point, read back through the calibration
    expect(ps[0].midpoint).toBeCloseTo((ps[0].from + qEnd) / 2, 6);
    expect(peakWarning(ps[0], "m3/h")).toMatch(/^Curve 1 \(250 mm, 2900 rpm\): the peak is not traced\. The curve ends inside the 82 % contour: it crosses it once, at \d+\.\d m³\/h, and from there to the curve's end at \d+\.0 m³\/h the contours say only that the efficiency is above 82 %/);
    // Unticked: no efficiency from the crossing to the end; its highest value is its last, before the contour: no BEP
    // (pumpCurve.ts: a BEP is known only at an interior peak of the efficiency; the peak lies in the blank span).
    const [blank] = engineCurves(st);
    const inside = blank.points.filter((p) => p.flow * 3600 > t.from + 1);
    expect(inside.length).toBeGreaterThan(1);
    expect(inside.filter((p) => p.efficiency !== undefined)).toEqual([]);
    expect(blank.curve.bep).toBeNull();
    expect(blank.curve.warnings.map((w) => w.code)).toContain("bep-not-published");
    // Ticked: the span's middle is written at 82 %, the last efficiency row: the engine takes no BEP at a data end either.
    const [taken] = engineCurves({ ...st, curves: st.curves.map((c) => (c.id === 1 ? { ...c, peakAtMidpoint: true } : c)) });
    const top = taken.points.filter((p) => p.efficiency !== undefined).at(-1)!;
    expect(100 * top.efficiency!).toBeCloseTo(82, 6);
    expect(top.flow * 3600).toBeCloseTo(ps[0].midpoint, 3);
    expect(taken.curve.bep).toBeNull();
    expect(taken.points.filter((p) => p.efficiency !== undefined && p.flow * 3600 > ps[0].midpoint + 1e-6)).toEqual([]);
  });

  it("warns for a head curve that starts inside its innermost contour, blank up to its one crossing unless the user takes the span's middle", () => {
    // The 250 mm curve clicked from the middle of its span inside the 82 % contour (a whole m³/h) to 95.
    const t = truth(52);
    const qStart = Math.round((t.from + t.to) / 2);
    const full = clickedHead(1, 1, 52, 250);
    const st = { ...s, curves: [{ ...full, points: full.points.slice(qStart) }, ...s.curves.filter((c) => c.kind === "contour")] };
    const ps = unreadPeaks(st, calibrations(st));
    expect(ps.map((p) => [p.curve, p.level, p.next, p.fromStart, p.toEnd, p.taken])).toEqual([["Curve 1", 82, null, true, false, false]]);
    expect(ps[0].from).toBeCloseTo(qStart, 6); // the first clicked point, read back through the calibration
    expect(Math.abs(ps[0].to - t.to)).toBeLessThan(0.5);
    expect(ps[0].midpoint).toBeCloseTo((qStart + ps[0].to) / 2, 6);
    expect(peakWarning(ps[0], "m3/h")).toMatch(/^Curve 1 \(250 mm, 2900 rpm\): the peak is not traced\. The curve starts inside the 82 % contour: it crosses it once, at \d+\.\d m³\/h, and from the curve's start at \d+\.0 m³\/h to there the contours say only that the efficiency is above 82 %/);
    // Unticked: no efficiency from the start to the crossing; its highest value is its first, after the contour: no BEP.
    const [blank] = engineCurves(st);
    const inside = blank.points.filter((p) => p.flow * 3600 < t.to - 1);
    expect(inside.length).toBeGreaterThan(1);
    expect(inside.filter((p) => p.efficiency !== undefined)).toEqual([]);
    expect(blank.curve.bep).toBeNull();
    expect(blank.curve.warnings.map((w) => w.code)).toContain("bep-not-published");
    // Ticked: the span's middle is written at 82 %, the first efficiency row, nothing before it: no BEP at a data end either.
    const [taken] = engineCurves({ ...st, curves: st.curves.map((c) => (c.id === 1 ? { ...c, peakAtMidpoint: true } : c)) });
    const first = taken.points.find((p) => p.efficiency !== undefined)!;
    expect(100 * first.efficiency!).toBeCloseTo(82, 6);
    expect(first.flow * 3600).toBeCloseTo(ps[0].midpoint, 3);
    expect(taken.curve.bep).toBeNull();
    expect(taken.points.filter((p) => p.efficiency !== undefined && p.flow * 3600 < ps[0].midpoint - 1e-3)).toEqual([]); // the CSV writes flow to 4 decimals
  });
});
