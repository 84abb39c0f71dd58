// The peak the contours do not trace (peak.ts, contours.ts, to-csv.ts): blank rows over a gap, the
// middle the user took written as a row of its own, the words on the page and in the source line.
// Invented curves and levels; expected values worked out by hand beside each check.
import { describe, expect, it } from "vitest";
import { contourGaps, crossings, insideLevel, tracedRows, type TracedSet } from "./index";
import { peakBoxLabel, peakNote, peakWarning, type UnreadPeak } from "./peak";
import { SOURCE_MAX, tracedSource } from "./sniff";

const units = { flow: "m3/h", head: "m", efficiency: "%", power: "kW", npshr: "m" } as const;
const line = (f: (x: number) => number, x0: number, x1: number, n = 41) => Array.from({ length: n }, (_, i) => ({ x: x0 + ((x1 - x0) * i) / (n - 1), y: f(x0 + ((x1 - x0) * i) / (n - 1)) }));
// Head 40 − 0.004·Q² over 0–80 m³/h; efficiency read from contours 70 % at 20 and 60, 74 % at 30 and 50 (innermost).
const set: TracedSet = {
  model: "Invented 40-160", speedRpm: 2900, impellerMm: 160,
  curves: { head: line((q) => 40 - 0.004 * q * q, 0, 80), efficiency: [{ x: 20, y: 70 }, { x: 30, y: 74 }, { x: 50, y: 74 }, { x: 60, y: 70 }] },
  efficiencyGaps: [{ from: 30, to: 50 }],
};

describe("contour gaps", () => {
  it("are the spans between consecutive crossings of one level; the highest level's is the innermost", () => {
    const xs = [{ x: 20, y: 0, level: 70 }, { x: 30, y: 0, level: 74 }, { x: 50, y: 0, level: 74 }, { x: 60, y: 0, level: 70 }];
    expect(contourGaps(xs)).toEqual([{ from: 30, to: 50, level: 74, innermost: true }]);
    expect(contourGaps([{ x: 1, y: 0, level: 70 }, { x: 2, y: 0, level: 74 }])).toEqual([]);
  });

  it("include the span from a lone crossing of the highest level to the curve's end: the curve ends inside that contour", () => {
    // Crossings 70 % at 20 and 74 % at 30, curve ends at 45 (invented): inside the 74 % contour from 30 to 45.
    const xs = [{ x: 20, y: 0, level: 70 }, { x: 30, y: 0, level: 74 }];
    expect(contourGaps(xs, 45)).toEqual([{ from: 30, to: 45, level: 74, innermost: true, toEnd: true }]);
    // Ending on the crossing, or with the last crossing of a lower level (the curve came out again): no such span.
    expect(contourGaps(xs, 30)).toEqual([]);
    expect(contourGaps([...xs, { x: 50, y: 0, level: 74 }, { x: 60, y: 0, level: 70 }], 80)).toEqual([{ from: 30, to: 50, level: 74, innermost: true }]);
  });

  it("include the span from the curve's start to a lone first crossing of the highest level: the curve starts inside that contour", () => {
    // Curve starts at 35 (invented), crosses 74 % at 50 and 70 % at 60: inside the 74 % contour from 35 to 50.
    const xs = [{ x: 50, y: 0, level: 74 }, { x: 60, y: 0, level: 70 }];
    expect(contourGaps(xs, 80, 35)).toEqual([{ from: 35, to: 50, level: 74, innermost: true, fromStart: true }]);
    // Starting on the crossing, a first crossing of a lower level (the curve went in and came out), or a
    // lone crossing (which side is inside is not said): no such span.
    expect(contourGaps(xs, 80, 50)).toEqual([]);
    expect(contourGaps([{ x: 20, y: 0, level: 70 }, { x: 30, y: 0, level: 74 }, { x: 50, y: 0, level: 74 }, { x: 60, y: 0, level: 70 }], 80, 0)).toEqual([{ from: 30, to: 50, level: 74, innermost: true }]);
    expect(contourGaps([{ x: 50, y: 0, level: 74 }], 80, 35).filter((g) => g.fromStart)).toEqual([]);
  });
});

describe("inside and outside along a curve that crosses one level three times or more", () => {
  // Crossings of 74 % at 20, 40, 60 and 80 (invented): inside 20–40 and 60–80, outside 40–60 (the curve left the contour and came back in).
  const four = [20, 40, 60, 80].map((x) => ({ x, y: 0, level: 74 }));
  it("alternate from outside when the contour's geometry does not say (an open contour)", () => {
    expect(contourGaps(four, 95, 0)).toEqual([
      { from: 20, to: 40, level: 74, innermost: true }, { from: 40, to: 60, level: 74, innermost: false, outside: true }, { from: 60, to: 80, level: 74, innermost: true },
    ]);
  });
  it("alternate from the curve's first point as the geometry places it", () => {
    // First point at 25 inside the contour (invented): inside 25–40 and 60–80, outside 40–60, out at the end.
    const three = four.slice(1);
    expect(contourGaps(three, 95, 25, () => true)).toEqual([
      { from: 25, to: 40, level: 74, innermost: true, fromStart: true }, { from: 40, to: 60, level: 74, innermost: false, outside: true }, { from: 60, to: 80, level: 74, innermost: true },
    ]);
    // Told it starts outside, the same three crossings end inside: 40–60 inside, 60–80 outside, 80 to the end at 95 inside.
    expect(contourGaps(three, 95, 25, () => false)).toEqual([
      { from: 40, to: 60, level: 74, innermost: true }, { from: 60, to: 80, level: 74, innermost: false, outside: true }, { from: 80, to: 95, level: 74, innermost: true, toEnd: true },
    ]);
  });
  it("read the start from closed loops (even–odd), and not from an open contour", () => {
    const sq = (a: number, b: number) => ({ level: 74, closed: true, points: [{ x: a, y: 0 }, { x: b, y: 0 }, { x: b, y: 10 }, { x: a, y: 10 }] });
    expect(insideLevel({ x: 25, y: 5 }, [sq(20, 40), sq(60, 80)], 74)).toBe(true); // in the first square (construction)
    expect(insideLevel({ x: 50, y: 5 }, [sq(20, 40), sq(60, 80)], 74)).toBe(false); // between the squares
    expect(insideLevel({ x: 25, y: 5 }, [sq(20, 40), { ...sq(60, 80), closed: false }], 74)).toBeNull();
    expect(insideLevel({ x: 25, y: 5 }, [sq(20, 40)], 70)).toBeNull(); // no contour of that level
  });
});

describe("a curve that touches a contour without crossing it", () => {
  // The line y = 5 over 0–100 (invented); a closed triangle of 74 % with its lowest vertex on it at 30 (above it elsewhere),
  // a closed square of 74 % over 50–70 that it crosses at 50 and 70 (construction).
  const curve = [{ x: 0, y: 5 }, { x: 100, y: 5 }];
  const tri = { level: 74, closed: true, points: [{ x: 25, y: 9 }, { x: 35, y: 9 }, { x: 30, y: 5 }] };
  const sq = { level: 74, closed: true, points: [{ x: 50, y: 0 }, { x: 70, y: 0 }, { x: 70, y: 10 }, { x: 50, y: 10 }] };
  it("is marked a touch where the level's contours are closed, and the count goes on past it", () => {
    const xs = crossings(curve, [tri, sq]);
    expect(xs).toEqual([{ x: 30, y: 5, level: 74, touch: true }, { x: 50, y: 5, level: 74 }, { x: 70, y: 5, level: 74 }]);
    // Outside from the touch to 50 (a dip), inside 50–70 (the peak); the old count flipped at 30 and swapped them.
    expect(contourGaps(xs, 100, 0, () => false)).toEqual([
      { from: 30, to: 50, level: 74, innermost: false, outside: true, fromTouch: true }, { from: 50, to: 70, level: 74, innermost: true },
    ]);
  });
  it("is marked a touch on an open contour too, read from that contour's sides of the curve; an open line ending on the curve stays a crossing", () => {
    // The open V (25, 9) → (30, 5) → (35, 9) stays above y = 5 on both sides of its tip (construction); before, a crossing.
    const v = { level: 74, closed: false, points: [{ x: 25, y: 9 }, { x: 30, y: 5 }, { x: 35, y: 9 }] };
    expect(crossings(curve, [v, { ...sq, closed: false }])[0]).toEqual({ x: 30, y: 5, level: 74, touch: true });
    // Beside a closed contour of the level (insideLevel null: the level has an open one) the V is read alone, the same.
    expect(crossings(curve, [v, sq])[0]).toEqual({ x: 30, y: 5, level: 74, touch: true });
    // The open line (25, 9) → (35, 9) → (30, 5) stops on the curve: which side it goes on is not drawn, so a crossing.
    expect(crossings(curve, [{ ...tri, closed: false }, sq]).some((p) => p.touch)).toBe(false);
    // An open line across the curve: a crossing (sides below and above).
    expect(crossings(curve, [{ level: 74, closed: false, points: [{ x: 40, y: 0 }, { x: 42, y: 10 }] }])).toEqual([{ x: 41, y: 5, level: 74 }]);
  });
  it("leaves the guess for an open level to the crossings: a first touch of the top level does not make the curve start inside", () => {
    // Open contours (no geometry to read the start from): 74 % touched at 10, 70 % crossed at 20, 74 % crossed at 30, 70 % at 60
    // (invented). The guess (helper "tracerone") starts a curve inside its top level only when its first crossing is of that level;
    // the first crossing here is 70 %'s, so no span from the start (before, the touch counted as that first crossing: "starts
    // inside the 74 % contour" from 0 to 10).
    const xs = [{ x: 10, y: 0, level: 74, touch: true as const }, { x: 20, y: 0, level: 70 }, { x: 30, y: 0, level: 74 }, { x: 60, y: 0, level: 70 }];
    expect(contourGaps(xs, 80, 0)).toEqual([]);
  });
});

describe("a contour point that is not finite", () => {
  it("meets nothing and leaves its loop without an inside (it gave a crossing at NaN)", () => {
    // The square 20–40 × 0–10 with its first corner NaN or Infinity (invented); the line y = 5 over 0–100.
    for (const bad of [NaN, Infinity]) {
      const k = { level: 74, closed: true, points: [{ x: bad, y: 0 }, { x: 40, y: 0 }, { x: 40, y: 10 }, { x: 20, y: 10 }] };
      const xs = crossings([{ x: 0, y: 5 }, { x: 100, y: 5 }], [k]);
      expect(xs.every((p) => Number.isFinite(p.x) && Number.isFinite(p.y))).toBe(true);
      expect(xs.map((p) => p.x)).toEqual([40]); // the side 40,0 → 40,10 only (construction)
      expect(insideLevel({ x: 30, y: 5 }, [k], 74)).toBeNull();
    }
  });
});

describe("our CSV over a gap", () => {
  it("leaves efficiency blank strictly inside the gap and reads it elsewhere", () => {
    const rows = tracedRows([set], units, 9); // rows every 10 m³/h
    const eff = rows.slice(1).map((r) => [r[5], r[7]]);
    expect(eff).toEqual([[0, null], [10, null], [20, 70], [30, 74], [40, null], [50, 74], [60, 70], [70, null], [80, null]]);
  });

  it("writes a peak the user took as a row of its own, head on the kept points' interpolant", () => {
    const rows = tracedRows([{ ...set, peaks: [{ x: 43, y: 74 }] }], units, 9).slice(1);
    expect(rows.map((r) => r[5])).toEqual([0, 10, 20, 30, 40, 43, 50, 60, 70, 80]);
    const peak = rows[5];
    expect(peak[7]).toBe(74);
    // 40 − 0.004·43² = 32.604 m (the invented curve); the monotone cubic through rows every 10 m³/h is within 0.01 m of it.
    expect(Math.abs((peak[6] as number) - 32.604)).toBeLessThan(0.01);
    expect(rows[4][7]).toBeNull(); // the rest of the span stays blank
  });

  it("puts a peak on an existing row's flow onto that row, and ignores one outside the head's flows", () => {
    const rows = tracedRows([{ ...set, peaks: [{ x: 40, y: 74 }, { x: 95, y: 74 }] }], units, 9).slice(1);
    expect(rows.map((r) => [r[5], r[7]])).toEqual([[0, null], [10, null], [20, 70], [30, 74], [40, 74], [50, 74], [60, 70], [70, null], [80, null]]);
  });

  it("converts each curve with its own unit over the call's", () => {
    const ft = { ...set, efficiencyGaps: [], curves: { head: line((q) => (40 - 0.004 * q * q) / 0.3048, 0, 80) }, units: { head: "ft" as const } };
    // 1 ft = 0.3048 m (NIST SP 811): the head in ft comes back in metres, 40 m at zero flow.
    expect(tracedRows([ft], units, 9)[1][6]).toBeCloseTo(40, 4);
  });
});

describe("words about the peak", () => {
  const p: UnreadPeak = { curveId: 2, curve: "Curve 2", impellerMm: 160, speedRpm: 2900, level: 74, from: 30, to: 50, next: null, midpoint: 40, taken: false };

  it("on the page: the span, the bound, what the engine does, and the choice", () => {
    expect(peakWarning(p, "m3/h")).toBe(
      "Curve 2 (160 mm, 2900 rpm): the peak is not traced. Inside the 74 % contour, from 30.0 to 50.0 m³/h, the contours say only that the efficiency is above 74 %, so the efficiency there is left blank: the engine reads it below 74 % from the rows either side (power overstated) and puts the best-efficiency point outside the contour. Tick the box to take the middle of the span, 40.0 m³/h, as the best-efficiency point at 74 %.",
    );
    expect(peakWarning({ ...p, taken: true, next: 78, impellerMm: NaN }, "l/s")).toBe(
      "Curve 2 (2900 rpm): the peak is not traced. Inside the 74 % contour, from 30.0 to 50.0 l/s, the contours say only that the efficiency is above 74 % and below 78 %; the middle of that span, 40.0 l/s, is written at 74 % and taken as the best-efficiency point (its efficiency understated by less than 4 points), the rest of the span blank.",
    );
    // Between two crossings the middle is an interior peak, so the box takes it as the BEP (peak-engine.test.ts ties it to the engine).
    expect(peakBoxLabel(p, "m3/h")).toBe("Take the middle of the 74 % contour as Curve 2’s best-efficiency point");
  });

  it("on the page, for a curve that ends inside the contour: the one crossing, the curve's end, what the engine does, and the choice", () => {
    const end: UnreadPeak = { ...p, from: 30, to: 45, midpoint: 37.5, toEnd: true };
    expect(peakWarning(end, "m3/h")).toBe(
      "Curve 2 (160 mm, 2900 rpm): the peak is not traced. The curve ends inside the 74 % contour: it crosses it once, at 30.0 m³/h, and from there to the curve's end at 45.0 m³/h the contours say only that the efficiency is above 74 %; the peak lies there or past the curve's end, so the efficiency there is left blank: it is written up to its last row before 30.0 m³/h, rising to it, and none past it (no efficiency or shaft power from 30.0 m³/h to the curve's end at 45.0 m³/h). No best-efficiency point is known for this curve: the engine gives one only at a peak with efficiency rows on both sides, and this curve's highest efficiency written is its last row, the peak at or past the end of its efficiency data (no BEP or preferred operating region is judged). Tick the box to write the middle of the span, 37.5 m³/h, at 74 %: the efficiency (understated) and shaft power (overstated) then reach 37.5 m³/h, still with no best-efficiency point.",
    );
    expect(peakWarning({ ...end, taken: true, next: 78 }, "m3/h")).toBe(
      "Curve 2 (160 mm, 2900 rpm): the peak is not traced. The curve ends inside the 74 % contour: it crosses it once, at 30.0 m³/h, and from there to the curve's end at 45.0 m³/h the contours say only that the efficiency is above 74 % and below 78 %; the peak lies there or past the curve's end. The middle of that span, 37.5 m³/h, is written at 74 % (understated by less than 4 points, its flow a guess within the span), the rest of the span blank: the efficiency is written up to 37.5 m³/h, read below 74 % from 30.0 m³/h to there (shaft power overstated), and none past it (no efficiency or shaft power from 37.5 m³/h to the curve's end at 45.0 m³/h). No best-efficiency point is known for this curve: the engine gives one only at a peak with efficiency rows on both sides, and this curve's highest efficiency written is its last row, the peak at or past the end of its efficiency data (no BEP or preferred operating region is judged).",
    );
    expect(peakNote([end], "m3/h")).toBe("peak not traced, efficiency blank inside the innermost contour: 160 mm, 2900 rpm above 74 % from 30.0 m³/h to the curve's end at 45.0 m³/h, no BEP (peak at or past the end of the efficiency data)");
    // Ticked, the note names the middle written and still no BEP (pumpCurve.ts: a BEP only at an interior efficiency peak); the box says as much.
    expect(peakNote([{ ...end, taken: true }], "m3/h")).toBe("peak not traced, efficiency blank inside the innermost contour: 160 mm, 2900 rpm above 74 % from 30.0 m³/h to the curve's end at 45.0 m³/h, middle 37.5 m³/h written at 74 %, no BEP (peak at or past the end of the efficiency data)");
    expect(peakBoxLabel(end, "m3/h")).toBe("Write the middle of the span inside the 74 % contour, 37.5 m³/h, at 74 % for Curve 2: efficiency and shaft power up to 37.5 m³/h, no best-efficiency point either way");
  });

  it("on the page, for a curve that starts inside the contour: the curve's start, the one crossing, what the engine does, and the choice", () => {
    // Invented: the curve starts at 35 m³/h inside the 74 % contour and crosses it at 50; middle 42.5.
    const start: UnreadPeak = { ...p, from: 35, to: 50, midpoint: 42.5, fromStart: true };
    expect(peakWarning(start, "m3/h")).toBe(
      "Curve 2 (160 mm, 2900 rpm): the peak is not traced. The curve starts inside the 74 % contour: it crosses it once, at 50.0 m³/h, and from the curve's start at 35.0 m³/h to there the contours say only that the efficiency is above 74 %; the peak lies there or before the curve's start, so the efficiency there is left blank: it is written from its first row past 50.0 m³/h, falling from it, and none before it (no efficiency or shaft power from the curve's start at 35.0 m³/h to 50.0 m³/h). No best-efficiency point is known for this curve: the engine gives one only at a peak with efficiency rows on both sides, and this curve's highest efficiency written is its first row, the peak at or before the start of its efficiency data (no BEP or preferred operating region is judged). Tick the box to write the middle of the span, 42.5 m³/h, at 74 %: the efficiency (understated) and shaft power (overstated) then start at 42.5 m³/h, still with no best-efficiency point.",
    );
    expect(peakWarning({ ...start, taken: true, next: 78 }, "m3/h")).toBe(
      "Curve 2 (160 mm, 2900 rpm): the peak is not traced. The curve starts inside the 74 % contour: it crosses it once, at 50.0 m³/h, and from the curve's start at 35.0 m³/h to there the contours say only that the efficiency is above 74 % and below 78 %; the peak lies there or before the curve's start. The middle of that span, 42.5 m³/h, is written at 74 % (understated by less than 4 points, its flow a guess within the span), the rest of the span blank: the efficiency is written from 42.5 m³/h, read below 74 % from there to 50.0 m³/h (shaft power overstated), and none before it (no efficiency or shaft power from the curve's start at 35.0 m³/h to 42.5 m³/h). No best-efficiency point is known for this curve: the engine gives one only at a peak with efficiency rows on both sides, and this curve's highest efficiency written is its first row, the peak at or before the start of its efficiency data (no BEP or preferred operating region is judged).",
    );
    expect(peakNote([start], "m3/h")).toBe("peak not traced, efficiency blank inside the innermost contour: 160 mm, 2900 rpm above 74 % from the curve's start at 35.0 m³/h to 50.0 m³/h, no BEP (peak at or before the start of the efficiency data)");
    expect(peakBoxLabel(start, "m3/h")).toBe("Write the middle of the span inside the 74 % contour, 42.5 m³/h, at 74 % for Curve 2: efficiency and shaft power from 42.5 m³/h, no best-efficiency point either way");
  });

  it("on the page, for a curve that crosses one contour once: the level, the one flow, and what the engine would do with one value", () => {
    // Invented: one crossing of the 70 % contour at 81.96 m³/h, no other contour crossed.
    const lone: UnreadPeak = { ...p, level: 70, from: 81.96, to: 81.96, midpoint: 81.96, next: 74, lone: true };
    expect(peakWarning(lone, "m3/h")).toBe(
      "Curve 2 (160 mm, 2900 rpm): the efficiency is not read. The curve crosses one contour only, the 70 % contour, once, at 82.0 m³/h: the efficiency is known at that one flow only, and one value makes no efficiency curve (the engine reads efficiency, and shaft power from it, only between two rows or more, yet would take a lone value as the best-efficiency point, at a contour crossing). So the CSV writes no efficiency for this curve: the engine has no efficiency, shaft power or best-efficiency point for it. Trace more of the contours it crosses, or its efficiency curve on an efficiency panel.",
    );
    expect(peakNote([lone], "m3/h")).toBe("efficiency at one contour crossing only, none written: 160 mm, 2900 rpm 70 % at 82.0 m³/h");
    expect(peakNote([p, lone], "m3/h")).toBe(
      "peak not traced, efficiency blank inside the innermost contour: 160 mm, 2900 rpm above 74 % at 30.0–50.0 m³/h; efficiency at one contour crossing only, none written: 160 mm, 2900 rpm 70 % at 82.0 m³/h",
    );
  });

  it("on the page, for a curve that crosses one contour twice and no other: the two flows, why no row has an efficiency, and no box", () => {
    // Invented: the 74 % contour crossed at 30 and 60 m³/h, no other contour crossed; a 78 % one drawn elsewhere.
    const twice: UnreadPeak = { ...p, from: 30, to: 60, midpoint: 45, next: 78, twice: true };
    expect(peakWarning(twice, "m3/h")).toBe(
      "Curve 2 (160 mm, 2900 rpm): the efficiency is not read. The curve crosses one contour only, the 74 % contour, twice, at 30.0 and 60.0 m³/h: the efficiency is known at those two flows only (74 %); between them the contours say only that it is above 74 % and below 78 %, and outside them nothing, no other contour crossing the curve. So no row of the curve has an efficiency: the rows between the crossings are left blank (inside the contour) and those outside have none to read (it is not carried past the crossings), and the CSV writes no efficiency for this curve: the engine has no efficiency, shaft power or best-efficiency point for it. No box is offered to take the middle of the span, 45.0 m³/h, as the best-efficiency point: at 74 % it would be the curve's only efficiency row, and the engine reads efficiency, and shaft power from it, only between two rows or more, and a best-efficiency point only at a peak with efficiency rows on both sides; with the crossings written at 74 % too, the line would be flat: still no best-efficiency point. Trace more of the contours it crosses, or its efficiency curve on an efficiency panel.",
    ); // source: construction (the invented flows and levels above)
    expect(peakNote([p, twice], "m3/h")).toBe(
      "peak not traced, efficiency blank inside the innermost contour: 160 mm, 2900 rpm above 74 % at 30.0–50.0 m³/h; efficiency at two crossings of one contour only, none written: 160 mm, 2900 rpm 74 % at 30.0 and 60.0 m³/h",
    ); // source: construction
    // No box for one contour crossed once or twice (the CSV writes no efficiency either way); a span's box as before.
    expect([peakBoxLabel(twice, "m3/h"), peakBoxLabel({ ...p, lone: true }, "m3/h"), peakBoxLabel(p, "m3/h")]).toEqual([null, null, "Take the middle of the 74 % contour as Curve 2’s best-efficiency point"]); // source: construction
  });

  it("in the source line: a dip outside a contour, two islands ticked, one level crossed four times, no contour crossed", () => {
    const dip = { ...p, from: 40, to: 60, midpoint: 50, valley: true };
    const first = { ...p, from: 20, to: 40, midpoint: 30, bepMidpoint: 30, taken: true }, second = { ...p, from: 60, to: 80, midpoint: 70, bepMidpoint: 30, taken: true };
    const many = { ...p, from: 20, to: 80, twice: true, at: [20, 40, 60, 80] }, none = { ...p, level: NaN, from: NaN, to: NaN, midpoint: NaN, uncrossed: [70, 74] };
    expect(peakNote([dip, first, second, many, none], "m3/h")).toBe(
      "no contour crossed, no efficiency written: 160 mm, 2900 rpm; " +
        "efficiency blank outside a contour between two of its crossings (read across from the rows either side, overstated): 160 mm, 2900 rpm below 74 % at 40.0–60.0 m³/h; " +
        "peak not traced, efficiency blank inside the innermost contour: 160 mm, 2900 rpm above 74 % at 20.0–40.0 m³/h, middle 30.0 m³/h written at 74 %, the BEP; " +
        "160 mm, 2900 rpm above 74 % at 60.0–80.0 m³/h, middle 70.0 m³/h written at 74 %, not the BEP; " +
        "efficiency at crossings of one level only, none written: 160 mm, 2900 rpm 74 % at 20.0, 40.0, 60.0 and 80.0 m³/h",
    ); // source: construction (the invented flows and levels above)
    // No box for a dip, four crossings of one level, or none; one for the islands that names the BEP ticking gives.
    expect([dip, many, none].map((x) => peakBoxLabel(x, "m3/h"))).toEqual([null, null, null]);
    expect(peakBoxLabel(second, "m3/h")).toBe("Write the middle of each span inside a 74 % contour at 74 % for Curve 2: the first, 30.0 m³/h, is taken as its best-efficiency point"); // source: construction
    expect(peakWarning(none, "m3/h")).toMatch(/^Curve 2 \(160 mm, 2900 rpm\): the efficiency is not read\. The curve crosses none of the contours on its panel \(70 %, 74 %\)/); // source: construction
  });

  it("names a curve imported without a speed as such (it read 'NaN rpm'), on the page and in the source line", () => {
    // A blank speed the importer takes (curve-checks.ts lets it through beside another Ø) is NaN on the page.
    const blank = { ...p, speedRpm: NaN };
    expect(peakWarning(blank, "m3/h")).toMatch(/^Curve 2 \(160 mm, no speed\): the peak is not traced\./); // source: construction
    expect(peakWarning({ ...blank, impellerMm: NaN }, "m3/h")).toMatch(/^Curve 2 \(no speed\): the peak is not traced\./); // source: construction
    expect(peakNote([blank], "m3/h")).toBe("peak not traced, efficiency blank inside the innermost contour: 160 mm, no speed above 74 % at 30.0–50.0 m³/h"); // source: construction
  });

  it("in the source line: short, after the file and page, cut to the column's 300 characters", () => {
    const note = peakNote([p, { ...p, impellerMm: 150, taken: true }], "m3/h");
    expect(note).toBe("peak not traced, efficiency blank inside the innermost contour: 160 mm, 2900 rpm above 74 % at 30.0–50.0 m³/h; 150 mm, 2900 rpm above 74 % at 30.0–50.0 m³/h, BEP taken at its middle 40.0 m³/h at 74 %");
    expect(tracedSource("sheet.pdf", "application/pdf", 2, note)).toBe(`traced from sheet.pdf, page 2; ${note}`);
    expect(tracedSource("sheet.pdf", "application/pdf", 2, "")).toBe("traced from sheet.pdf, page 2");
    const long = tracedSource("x".repeat(200), "image/png", null, `${note}\n${note}`);
    expect(long).toHaveLength(SOURCE_MAX);
    expect(long.endsWith("…")).toBe(true);
    expect(long).not.toMatch(/\n/);
  });
});
