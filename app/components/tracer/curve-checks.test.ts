// What the tracer refuses to send to the import until the user fixes it (curve-checks.ts): two curves
// of one quantity with the same speed and impeller Ø (the CSV keeps one curve per key, so the other
// would vanish), an impeller Ø left blank next to a curve of its speed that has one (the importer refuses
// that blank key cell; another speed's set without a Ø it takes), a speed left blank, a curve no head curve of its key takes, a contour drawn without an
// efficiency level (or one above 100 %), an open contour at a level that also has a closed loop, and two contours of
// different levels that cross. Invented curves.
import { describe, expect, it } from "vitest";
import { calibrations, contourReading, csvOf, initialState, keyOf, tracedSets, withNewCurve, type Curve, type TracerState } from "./model";
import { curveProblems, curveWarnings, importBlock } from "./curve-checks";
import { analyseCsv } from "~/lib/import";

/**
 * Ten points from flow 0 to 90 (the axis: u 100 → 0, 600 → 100); with `from`, from that flow on, 4 apart (from + 36 at the
 * end): curves that follow each other in flow, as one curve cut in two would (the importer then refuses a blank key between them).
 */
const pts = (h0: number, from?: number) =>
  Array.from({ length: 10 }, (_, i) => ({ u: from === undefined ? 100 + 50 * i : 100 + 5 * from + 20 * i, v: 500 - h0 * 8 + i * i }));
const curve = (id: number, panelId: number, impellerMm: number, h0: number, speedRpm = 2900, from?: number): Curve =>
  ({ id, panelId, kind: "curve", impellerMm, speedRpm, level: 0, points: pts(h0, from) });
/** The same curve drawn over flow 0–36 (low) or 50–86 (high). */
const low = (id: number, panelId: number, mm: number, h0: number, rpm = 2900) => curve(id, panelId, mm, h0, rpm, 0);
const high = (id: number, panelId: number, mm: number, h0: number, rpm = 2900) => curve(id, panelId, mm, h0, rpm, 50);
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

// The importer's errors on the tracer's CSV, as [column, code].
const refusedByImport = (st: TracerState) =>
  analyseCsv(csvOf(st, calibrations(st))).result.problems.filter((p) => p.severity === "error").map((p) => [p.column, p.code]);

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

  // The CSV writes a Ø to 0.1 mm (to-csv.ts): 190 and 190.04 mm are one key there. The page's key took the Ø as typed, so two
  // such curves were two sets on the page, both written as Ø 190 mm, and the importer read their rows as one curve (refused).
  it("takes two head curves whose Ø round to the same 0.1 mm in the CSV as one key, as the CSV does", () => {
    const s = withCurves([curve(1, 1, 190, 50), curve(2, 1, 190.04, 45)]);
    expect(keyOf(s.curves[0])).toBe(keyOf(s.curves[1])); // source: the CSV's one rounding (0.1 mm, csvImpellerMm): both write 190
    expect(keyOf(s.curves[1])).toBe("2900|190"); // source: same
    expect(tracedSets(s, calibrations(s)).length).toBe(1); // source: one key, one set (the first head curve's)
    expect(curveProblems(s).map((x) => x.curveId)).toEqual([1, 2]); // source: curve-checks.ts (two head curves of one key are blocked)
    expect(refusedByImport(s)).toEqual([]); // source: the importer itself, on the CSV the page would now write (one curve at Ø 190)
  });

  it("flags an impeller Ø left blank next to a curve of the same speed that has one, and a speed of zero", () => {
    const s = withCurves([low(1, 1, 250, 50), high(2, 1, NaN, 45), curve(3, 1, 210, 40, 0)]);
    expect(curveProblems(s)).toEqual([
      {
        curveId: 2,
        message: "Curve 2 has no impeller Ø, and its rows in the CSV come just after those of Curve 1 at the same speed (2900 rpm) with Ø 250 mm: " +
          "the importer reads rows of one model and speed that follow each other with the flow rising on from one to the next as one curve, so it refuses the blank Ø (it would split that curve); " +
          "type its Ø. A curve without a Ø is imported without one when the curves next to it in the CSV are at another speed, or where its flow starts " +
          "again (at or below theirs) where they meet, with the importer's key-not-given warning.",
      },
      { curveId: 3, message: "Curve 3 has speed 0 rpm: it must be above zero." },
    ]); // source: import/blank-keys.ts rule (same model and speed next to it, with a Ø); validate.ts (a speed must be above zero)
    expect(refusedByImport(s)).toContainEqual(["speed_rpm", "zero"]); // source: the importer itself, on the tracer's CSV
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

  it("flags a contour drawn without an efficiency level above zero (it was left out of the CSV without a word), or above 100 %", () => {
    // Two vertical contours across the head curve at 40 and 60 m³/h (u = 300 and 400 on this invented paper).
    const line = (id: number, u: number, level: number): Curve => ({ id, panelId: 1, kind: "contour", impellerMm: NaN, speedRpm: 2900, level, closed: false, points: [{ u, v: 50 }, { u, v: 450 }] });
    const withLevel = (level: number) => withCurves([curve(1, 1, 250, 50), line(2, 300, 70), line(3, 400, level)]);
    const effCells = (st: TracerState) => csvOf(st, calibrations(st)).trim().split("\n").slice(1).map((r) => r.split(",")[7]).filter((x) => x !== "");
    // With its level the two crossings give an efficiency column; without it the one crossing left gives none.
    expect(effCells(withLevel(74)).length).toBeGreaterThan(0);
    expect(effCells(withLevel(NaN))).toEqual([]);
    expect(curveProblems(withLevel(74))).toEqual([]);
    for (const blank of [NaN, 0]) {
      expect(curveProblems(withLevel(blank))).toEqual([
        { curveId: 3, message: "Contour 3 has no efficiency level: it is left out (no efficiency is read where it crosses a head curve); type its level in % or remove it." },
      ]);
    }
    // Above 100 % (a typo for 74): before, let through, and the importer then refused "efficiency 364.22 % is above 100 %" and the like,
    // values read between the crossings, with no word of the contour (import/validate.ts: no efficiency above 100 %).
    expect(curveProblems(withLevel(740))).toEqual([
      {
        curveId: 3,
        message: "Contour 3 has efficiency level 740 %, above 100 %: no pump runs above 100 %, and the importer refuses any efficiency above 100 % (it would name the values " +
          "read between this contour's crossings, not the contour); type its level in % (0–100) or remove it.",
      },
    ]); // source: import/validate.ts rule (efficiency at most 100 %)
    expect(refusedByImport(withLevel(740)).some(([, code]) => code === "efficiency-over-100")).toBe(true); // source: the importer itself, on the tracer's CSV
    expect(curveProblems(withLevel(100))).toEqual([]); // 100 % is the limit, not above it (source: import/validate.ts)
    expect(curveProblems(withLevel(-5))[0].message).toBe("Contour 3 has efficiency level -5 %, not above zero: it is left out (no efficiency is read where it crosses a head curve); type its level in % or remove it.");
    expect(importBlock(withLevel(NaN))).toMatch(/^Fix 1 curve before import \(marked in “2 · Curves”\): Contour 3 has no efficiency level: it is left out/);
    // A contour just added, with no points yet, waits for its level without a word.
    expect(curveProblems(withNewCurve(withLevel(74), "contour"))).toEqual([]);
  });

  it("refuses a level drawn both as a closed loop and as an open line, naming the level (the side of it was guessed)", () => {
    // Invented: a closed 74 % box over flow −10–30 m³/h (u 50–250) that the head curve starts inside and leaves at 30, and an open
    // 74 % line across it at 60 (u 400). Before, the level read as open (no inside): the guess started the curve outside, so
    // 30–60 read as the peak inside 74 % although the closed loop says the curve left it at 30.
    const box: Curve = { id: 2, panelId: 1, kind: "contour", impellerMm: NaN, speedRpm: 2900, level: 74, closed: true, points: [{ u: 50, v: 50 }, { u: 250, v: 50 }, { u: 250, v: 450 }, { u: 50, v: 450 }] };
    const arm: Curve = { id: 3, panelId: 1, kind: "contour", impellerMm: NaN, speedRpm: 2900, level: 74, closed: false, points: [{ u: 400, v: 50 }, { u: 400, v: 450 }] };
    const s = withCurves([curve(1, 1, 250, 50), box, arm]);
    // The guess the block keeps out of the CSV: 30–60 m³/h read as inside 74 % (source: construction, the box's side at 30–60 is outside).
    expect(contourReading(s, s.curves[0], calibrations(s)).gaps.map((g) => [g.from, g.to, g.innermost])).toEqual([[30, 60, true]]);
    expect(curveProblems(s)).toEqual([
      {
        curveId: 3,
        message: "Contour 3 (74 %) is an open line, and Contour 2 is a closed loop at 74 % too: the tracer reads which side of the 74 % contours a head curve is on from that " +
          "level's closed loops, and an open line has no inside, so with both at 74 % it would have to guess, and a wrong guess swaps the span above 74 % (the peak) with one " +
          "below it (a dip). Close Contour 3: where the chart cuts it off, click on along the chart's edge (round its corners) to where the line started, and tick “Closed loop” " +
          "(its last point then joins its first); or remove it.",
      },
    ]); // source: curve-checks.ts rule (an open contour beside a closed loop of its level)
    expect(importBlock(s)).toMatch(/^Fix 1 curve before import \(marked in “2 · Curves”\): Contour 3 \(74 %\) is an open line/);
    // Closed, or every contour of the level open (the guess as documented for open lines), or at another level: no block.
    expect(curveProblems({ ...s, curves: [s.curves[0], box, { ...arm, closed: true, points: [...arm.points, { u: 500, v: 450 }] }] })).toEqual([]);
    expect(curveProblems({ ...s, curves: [s.curves[0], { ...box, closed: false }, arm] })).toEqual([]);
    expect(curveProblems({ ...s, curves: [s.curves[0], box, { ...arm, level: 70 }] })).toEqual([]);
    // A contour ticked closed with two points is read as an open line (no loop), so it counts as open here too.
    expect(curveProblems({ ...s, curves: [s.curves[0], { ...box, closed: true, points: box.points.slice(0, 2) }, arm] })).toEqual([]);
  });

  it("refuses two contours of different levels that cross each other, naming both and where (they were read as drawn)", () => {
    // Invented: a 70 % line straight up at u 300 (40 m³/h), a 74 % line from (250, 100) to (350, 400): they cross at u 300, v 250,
    // that is 40 m³/h and (500 − 250) / 8 = 31.25 m on this paper (construction).
    const up: Curve = { id: 2, panelId: 1, kind: "contour", impellerMm: NaN, speedRpm: 2900, level: 70, closed: false, points: [{ u: 300, v: 50 }, { u: 300, v: 450 }] };
    const slant: Curve = { id: 3, panelId: 1, kind: "contour", impellerMm: NaN, speedRpm: 2900, level: 74, closed: false, points: [{ u: 250, v: 100 }, { u: 350, v: 400 }] };
    const s = withCurves([curve(1, 1, 250, 50), up, slant]);
    expect(curveProblems(s)).toEqual([
      {
        curveId: 3,
        message: "Contour 3 (74 %) crosses Contour 2 (70 %) at 40.0 m³/h, 31.3 m: lines of different efficiency never meet on a chart (a point has one efficiency), so a head " +
          "curve near there would meet the 70 % and 74 % levels in an order the chart does not have. Move a point of either line so they do not cross, or click more points where they run close.",
      },
    ]); // source: construction (the crossing above), rounded as the page rounds
    // Moved clear (the 74 % line right of 40 m³/h), or at the same level: no block.
    expect(curveProblems({ ...s, curves: [s.curves[0], up, { ...slant, points: slant.points.map((p) => ({ ...p, u: p.u + 100 })) }] })).toEqual([]);
    expect(curveProblems({ ...s, curves: [s.curves[0], up, { ...slant, level: 70 }] })).toEqual([]);
  });

  it("a crossing left of the flow axis's zero and below the head axis's zero reads with the true minus, as every shown quantity", () => {
    // Invented: a 70 % line straight down at u 80, (80 − 100) / 5 = −4 m³/h; a 74 % line from (30, 450) to (130, 630) meets it at
    // v 540, (500 − 540) / 8 = −5 m on this paper (construction). Before: "at -4.00 m³/h, -5.00 m" (fmtNum's ASCII hyphen).
    const up: Curve = { id: 2, panelId: 1, kind: "contour", impellerMm: NaN, speedRpm: 2900, level: 70, closed: false, points: [{ u: 80, v: 300 }, { u: 80, v: 600 }] };
    const slant: Curve = { id: 3, panelId: 1, kind: "contour", impellerMm: NaN, speedRpm: 2900, level: 74, closed: false, points: [{ u: 30, v: 450 }, { u: 130, v: 630 }] };
    const [problem] = curveProblems(withCurves([curve(1, 1, 250, 50), up, slant]));
    expect(problem.message).toMatch(/^Contour 3 \(74 %\) crosses Contour 2 \(70 %\) at −4\.00 m³\/h, −5\.00 m: /); // source: construction (above)
    expect(problem.message).not.toMatch(/-\d/);
  });

  it("leaves no impeller on any curve alone (the CSV then has no impeller column)", () => {
    expect(curveProblems(withCurves([curve(1, 1, NaN, 50)]))).toEqual([]);
  });

  // The importer's rule (import/blank-keys.ts): a blank Ø is "not given" for a set of its own (the same model at another
  // speed), refused where the set next to it in the CSV has the same speed and a Ø. The tracer runs that rule on its CSV's
  // key cells (lib/tracer/blank-impellers.ts), so it blocks exactly what the import would refuse.

  it("lets a curve without a Ø at another speed through, as the importer does (it was blocked beside curves with one)", () => {
    const s = withCurves([curve(1, 1, 250, 50), curve(2, 1, NaN, 30, 1450)]);
    expect(curveProblems(s)).toEqual([]); // source: blank-keys.ts rule (another speed: a set of its own)
    expect(importBlock(s)).toBeNull();
    const a = analyseCsv(csvOf(s, calibrations(s)));
    expect(a.result.problems.filter((p) => p.severity === "error")).toEqual([]); // source: the importer itself
    expect(a.result.curveSets.map((c) => [c.key, c.ok])).toEqual([["Invented 50-200|2900|250", true], ["Invented 50-200|1450|", true]]); // source: construction
  });

  it("blocks exactly where the importer refuses: the CSV's order decides which sets meet", () => {
    const cases: [string, Curve[], number[]][] = [
      ["same speed next to it, flow rising on", [low(1, 1, 250, 50), high(2, 1, NaN, 45)], [2]],
      ["same speed, blank first, flow rising on", [low(1, 1, NaN, 50), high(2, 1, 250, 45)], [1]],
      ["same speed next to it, flow starting again", [curve(1, 1, 250, 50), curve(2, 1, NaN, 45)], []],
      ["same speed, blank first, flow starting again", [high(1, 1, NaN, 50), low(2, 1, 250, 45)], []],
      ["another speed between", [low(1, 1, 250, 50), curve(2, 1, 230, 40, 1450), high(3, 1, NaN, 45)], []],
      ["efficiency curve of the blank set flagged too", [low(1, 1, 250, 50), high(2, 1, NaN, 45), high(3, 2, NaN, 40)], [2, 3]],
      ["no Ø on any curve", [curve(1, 1, NaN, 50), curve(2, 1, NaN, 45, 1450)], []],
    ];
    for (const [what, curves, flagged] of cases) {
      const s = withCurves(curves);
      expect(curveProblems(s).map((p) => p.curveId), what).toEqual(flagged); // source: blank-keys.ts rule on the CSV's order (head curves' order)
      const refused = refusedByImport(s);
      expect(refused.length > 0, what).toBe(flagged.length > 0); // source: the importer itself, on the tracer's CSV
      expect(refused.every(([column, code]) => column === "impeller_mm" && code === "missing-value"), what).toBe(true); // source: same
    }
  });

  it("a curve not yet in the CSV (fewer than 3 points) neither is blocked nor keeps its neighbours apart", () => {
    const empty: Curve = { ...curve(2, 1, 230, 40, 1450), points: [] };
    const s = withCurves([low(1, 1, 250, 50), empty, high(3, 1, NaN, 45)]);
    expect(curveProblems(s).map((p) => p.curveId)).toEqual([3]); // source: to-csv.ts leaves Curve 2 out, so Curve 3's rows follow Curve 1's (same speed)
    expect(refusedByImport(s).length).toBeGreaterThan(0); // source: the importer itself
  });

  // The same rule for a blank speed (import/blank-keys.ts): "not given" for a set of its own (the same model with another
  // Ø), with the importer's no-speed warning; refused where the set next to it in the CSV has the same Ø and a speed, or
  // its own Ø is blank too (or no curve has one). The tracer runs it on its CSV's key cells (lib/tracer/blank-keys.ts).
  const importOf = (st: TracerState) => analyseCsv(csvOf(st, calibrations(st))).result;
  const noSpeedKeys = (st: TracerState) => importOf(st).problems.filter((p) => p.code === "no-speed").map((p) => p.curveKey);

  it("lets a curve without a speed at a Ø of its own through, with the importer's no-speed warning (it was blocked outright)", () => {
    const s = withCurves([curve(1, 1, 250, 50), curve(2, 1, 230, 45, NaN)]);
    expect(curveProblems(s)).toEqual([]); // source: blank-keys.ts rule (another Ø next to it: a set of its own)
    expect(importBlock(s)).toBeNull();
    const r = importOf(s);
    expect(r.problems.filter((p) => p.severity === "error")).toEqual([]); // source: the importer itself, on the tracer's CSV
    expect(r.curveSets.map((c) => [c.key, c.ok])).toEqual([["Invented 50-200|2900|250", true], ["Invented 50-200||230", true]]); // source: construction
    const warning = r.problems.find((p) => p.code === "no-speed")!;
    expect(warning.curveKey).toBe("Invented 50-200||230"); // source: the importer itself
    const w = curveWarnings(s);
    expect(w).toEqual([
      {
        curveId: 2,
        message: "Curve 2 (impeller Ø 230 mm) has no speed: no curve next to it in the CSV has its impeller Ø and a speed, so the importer takes it " +
          "as a curve of its own without one, with the importer's warning “no speed given for this curve”. Without a speed, a speed change for this " +
          "pump is set and judged as a percentage of the curve's speed, never in rpm against a rated speed, and on a viscous liquid the ANSI/HI 9.6.7 " +
          "correction, which needs the speed, is not made. Type its speed if the chart gives one.",
      },
    ]); // source: setting-step.ts (a ratio in 0.1 % where the curve names no speed), verdict.ts (rpm against the rated speed only with both), viscosity-check.ts (B needs the speed)
    expect(w[0].message).toContain(`“${warning.reason.split(";")[0]}”`); // source: the importer's own words
  });

  it("blocks a blank speed exactly where the importer refuses it, and warns exactly where it warns", () => {
    const cases: [string, Curve[], number[], number[]][] = [
      ["same Ø next to it, with a speed", [low(1, 1, 250, 50), high(2, 1, 250, 45, NaN)], [2], []],
      ["same Ø, blank first", [low(1, 1, 250, 50, NaN), high(2, 1, 250, 45)], [1], []],
      ["same Ø next to it, flow starting again", [curve(1, 1, 250, 50), curve(2, 1, 250, 45, NaN)], [], [2]],
      ["another Ø next to it", [curve(1, 1, 250, 50), curve(2, 1, 230, 45, NaN)], [], [2]],
      ["another Ø between", [curve(1, 1, 250, 50), curve(2, 1, 230, 40), curve(3, 1, 250, 45, NaN)], [], [3]],
      ["its Ø blank too, next to a curve with a speed and a Ø", [low(1, 1, 250, 50), high(2, 1, NaN, 45, NaN)], [2], []],
      ["no Ø on any curve, next to a curve with a speed", [low(1, 1, NaN, 50), high(2, 1, NaN, 45, NaN)], [2], []],
      ["no Ø and no speed, alone", [curve(1, 1, NaN, 50, NaN)], [], [1]],
      ["no speed on either, each its own Ø", [curve(1, 1, 250, 50, NaN), curve(2, 1, 230, 45, NaN)], [], [1, 2]],
      ["efficiency curve of the refused set flagged too", [low(1, 1, 250, 50), high(2, 1, 250, 45, NaN), high(3, 2, 250, 40, NaN)], [2, 3], []],
      ["its Ø blank next to a Ø without a speed", [low(1, 1, 250, 50, NaN), high(2, 1, NaN, 45, NaN)], [2], [1]],
    ];
    for (const [what, curves, flagged, warned] of cases) {
      const s = withCurves(curves);
      expect(curveProblems(s).map((p) => p.curveId), what).toEqual(flagged); // source: blank-keys.ts rule on the CSV's order (head curves' order)
      const refused = refusedByImport(s);
      expect(refused.length > 0, what).toBe(flagged.length > 0); // source: the importer itself, on the tracer's CSV
      expect(refused.every(([column, code]) => (column === "speed_rpm" || column === "impeller_mm") && code === "missing-value"), what).toBe(true); // source: same
      const w = curveWarnings(s);
      expect(w.map((x) => x.curveId), what).toEqual(warned); // source: construction (the sets the importer takes without a speed)
      const dia = (id: number) => curves.find((c) => c.id === id)!.impellerMm;
      expect(noSpeedKeys(s), what).toEqual(warned.map((id) => `Invented 50-200||${Number.isNaN(dia(id)) ? "" : dia(id)}`)); // source: the importer itself
      for (const x of [...curveProblems(s), ...w]) expect(x.message, what).not.toMatch(/NaN/);
    }
  });

  it("names the rule and the curve next to it when it refuses a blank speed", () => {
    const restarts = ", or where its flow starts again (at or below theirs) where they meet, with the importer's key-not-given warning."; // source: blank-keys.ts rule (flow starting again)
    expect(curveProblems(withCurves([low(1, 1, 250, 50), high(2, 1, 250, 45, NaN)]))[0].message).toBe(
      "Curve 2 has no speed, and its rows in the CSV come just after those of Curve 1 at 2900 rpm with the same impeller Ø (250 mm): the importer " +
        "reads rows of one model and impeller Ø that follow each other with the flow rising on from one to the next as one curve, so it refuses the blank speed (it would split that curve); type its " +
        "speed. A curve without a speed is imported without one, with the importer's warning “no speed given for this curve”, when the curves next to " +
        "it in the CSV have another impeller Ø" + restarts,
    ); // source: blank-keys.ts rule (same model and Ø next to it, with a speed, flow rising on)
    expect(curveProblems(withCurves([low(1, 1, NaN, 50, NaN), high(2, 1, 230, 45)]))[0].message).toBe(
      "Curve 1 has no speed and no impeller Ø, and its rows in the CSV come just before those of Curve 2 at 2900 rpm with Ø 230 mm, with the flow rising on from one to the next: with neither key " +
        "nothing tells its rows from that curve's, so the importer refuses the blank speed (it would split that curve); type its speed. A curve without " +
        "a speed is imported without one, with the importer's warning “no speed given for this curve”, when it has an impeller Ø and the curves next " +
        "to it in the CSV have another" + restarts,
    ); // source: blank-keys.ts rule (its other key blank too)
    expect(curveProblems(withCurves([low(1, 1, 250, 50, NaN), high(2, 1, NaN, 45, NaN)]))[0].message).toBe(
      "Curve 2 has no impeller Ø and no speed, and its rows in the CSV come just after those of Curve 1 with Ø 250 mm and no speed, with the flow rising on from one to the next: with neither key " +
        "nothing tells its rows from that curve's, so the importer refuses the blank Ø (it would split that curve); type its Ø. A curve without a Ø " +
        "is imported without one when it has a speed and the curves next to it in the CSV are at another speed" + restarts,
    ); // source: blank-keys.ts rule (its other key blank too)
  });

  it("names a key without a speed as such (it read 'at NaN rpm')", () => {
    const s = withCurves([curve(1, 1, 250, 50, NaN), curve(2, 1, 250, 45, NaN), curve(3, 2, 240, 40, NaN)]);
    expect(curveProblems(s).map((p) => p.message)).toEqual([
      "Curve 1 and Curve 2 are both head curves with no speed and impeller Ø 250 mm: the CSV keeps one curve per speed and impeller, so give each its own Ø (or speed) or remove one.",
      "Curve 1 and Curve 2 are both head curves with no speed and impeller Ø 250 mm: the CSV keeps one curve per speed and impeller, so give each its own Ø (or speed) or remove one.",
      "Curve 3 (efficiency) has no head curve with no speed and impeller Ø 240 mm: it would be left out of the CSV; trace that head curve or give this one the Ø and speed of its head curve.",
    ]); // source: construction (one key twice; an efficiency curve of a key with no head curve)
  });
});
