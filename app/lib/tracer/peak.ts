/**
 * What the tracer says about the peak it did not trace. Pure: no DOM.
 *
 * Read from iso-efficiency contours, a head curve's efficiency is known at its crossings only; inside
 * the innermost contour it crosses the chart says only that the efficiency is above that contour's
 * level (and below the next level drawn, when the chart has one the curve does not reach). The CSV
 * leaves those rows blank (contours.ts, to-csv.ts): the engine then reads efficiency there from the
 * rows either side, below the level, and puts the best-efficiency point (BEP) on a row outside the
 * contour. A curve that crosses that level once ends inside the contour: its span runs from the
 * crossing to the curve's end, and the peak may lie past the end (`toEnd`); one that starts inside it,
 * the mirror (`fromStart`). A curve that crosses one contour once (`lone`) has its efficiency at that
 * one flow only, which makes no efficiency curve: the CSV writes none for it; one that crosses one contour
 * twice and no other (`twice`) has it at those two flows only, the ends of its unread span, so no row has
 * one and the CSV writes none either (no box: the middle alone would be one row, no curve). Only when the user
 * confirms it is the middle of that span (in axis space: the middle on the paper) written as a row at
 * the contour's level: between two crossings it is then taken as the BEP; at the curve's end or start
 * it is the last (or first) efficiency row, and the engine, which knows a BEP only at an interior peak
 * of the efficiency rows (pumpCurve.ts), gives that curve none, ticked or not: the row only carries the
 * efficiency and shaft power to the middle. A curve inside two contours of its top level or more (two islands:
 * `bepMidpoint`) gets every middle written, the engine's BEP the first of those equal rows. Where a curve is
 * outside a contour between two of its crossings (`valley`: it left it and comes back in) the efficiency dips
 * below the level, unread and read across too high by the engine; one that crosses contours of one level only
 * three times or more (`twice` with `at`) or none of its panel's (`uncrossed`) gets no efficiency at all. These sentences say which, with the numbers, on the
 * tracer page (`peakWarning`) and in the source line the revision's note carries (`peakNote`, short:
 * the line has `SOURCE_MAX` characters).
 */
import { fmtNumShown as fmtNum } from "~/lib/shared/format"; // "−" as every shown quantity
import { impellerGiven } from "./to-csv";

/** One head curve's innermost contour span (flows in the flow axis's unit). */
export type UnreadPeak = {
  /** The curve's id and name on the page, e.g. 3, "Curve 3". */
  curveId: number;
  curve: string;
  impellerMm: number;
  speedRpm: number;
  /** The innermost level it crosses, %. */
  level: number;
  from: number;
  /** The span's end: the next crossing of `level`, or (`toEnd`) the curve's last flow. */
  to: number;
  /** The curve ends inside the contour: it crosses `level` once, at `from`, and its peak lies between there and its end or past it. */
  toEnd?: boolean;
  /** The curve starts inside the contour (`from`: its first flow): it crosses `level` once, at `to`, and its peak lies between its start and there or before its start. */
  fromStart?: boolean;
  /** The curve crosses one contour only, once, at `from` (= `to`): no span, no box; its efficiency is known at that flow only. */
  lone?: boolean;
  /** The curve crosses one contour only, twice, at `from` and `to`: its efficiency is known at those two flows only, the ends of the span inside it; no box. */
  twice?: boolean;
  /** With `twice`: the curve crosses contours of that level three times or more, at these flows (`from` the first, `to` the last). */
  at?: number[];
  /** With `at`: those of its flows where the curve touches the contour without crossing it. */
  touchedAt?: number[];
  /**
   * A span between two meetings whose first is the curve's first flow (`onStart`: it starts on the contour and goes in) or whose second
   * is its last (`onEnd`: it ends on the contour): that row is at the level, the curve's first (last) efficiency row.
   */
  onStart?: boolean;
  onEnd?: boolean;
  /** Between `from` and `to`, two crossings of `level`, the curve is outside that level's contour (it left it and comes back in): the efficiency dips below the level; no box. */
  valley?: boolean;
  /**
   * The curve touches the level's contour at `from` (`fromTouch`) or `to` (`toTouch`) without crossing it (tangent, or grazing a vertex):
   * on a `valley`, a span's end; on a `toEnd` (`fromStart`) span, its last (first) meeting with the level, from inside; on `lone`, both, its one meeting;
   * on `twice`, its first or last meeting.
   */
  fromTouch?: boolean;
  toTouch?: boolean;
  /** The curve crosses none of its panel's contours, whose levels these are: no efficiency from the chart; `level`, `from`, `to`, `midpoint` are NaN; no box. */
  uncrossed?: number[];
  /**
   * The curve has two spans or more inside `level` contours (it leaves one and enters another, or the same again): ticked, every
   * middle is written at the level and the engine's BEP is the first of equal rows: this middle, or null when the first is the
   * middle of the span at the curve's start (its first efficiency row: no BEP). Absent with one span.
   */
  bepMidpoint?: number | null;
  /** The lowest level above `level` drawn on the panel (the peak is below it), or null. */
  next: number | null;
  /** The middle of the span (on the paper). */
  midpoint: number;
  /** The user took the middle as the BEP. */
  taken: boolean;
};

/** "m3/h" → "m³/h" for reading. */
export const flowUnitText = (unit: string) => unit.replace("m3", "m³");

/** A value the user typed (level, Ø, speed) as typed: at most two decimals, no trailing zeros. */
const typed = (x: number) => String(+x.toFixed(2));
/** The curve's key: "160 mm, 2900 rpm"; a speed left blank (NaN, imported without one) is "no speed". */
const keyText = (p: UnreadPeak) => `${impellerGiven(p.impellerMm) ? `${typed(p.impellerMm)} mm, ` : ""}${Number.isFinite(p.speedRpm) ? `${typed(p.speedRpm)} rpm` : "no speed"}`;
const bound = (p: UnreadPeak) => (p.next == null ? `above ${typed(p.level)} %` : `above ${typed(p.level)} % and below ${typed(p.next)} %`);

/** The tracer page's warning for one curve. */
export function peakWarning(p: UnreadPeak, flowUnit: string): string {
  if (p.uncrossed) return uncrossedWarning(p);
  if (p.valley) return valleyWarning(p, flowUnit);
  if (p.lone) return loneWarning(p, flowUnit);
  if (p.twice) return twiceWarning(p, flowUnit);
  if (p.bepMidpoint !== undefined) return manyWarning(p, flowUnit);
  if (p.toEnd) return edgeWarning(p, flowUnit, "end");
  if (p.fromStart) return edgeWarning(p, flowUnit, "start");
  const u = flowUnitText(flowUnit);
  const span = `from ${fmtNum(p.from)} to ${fmtNum(p.to)} ${u}`;
  const head = `${p.curve} (${keyText(p)}): the peak is not traced. Inside the ${typed(p.level)} % contour, ${span}, the contours say only that the efficiency is ${bound(p)}`;
  if (p.onStart || p.onEnd) return onEdgeWarning(p, flowUnit, head);
  return p.taken
    ? `${head}; the middle of that span, ${fmtNum(p.midpoint)} ${u}, is written at ${typed(p.level)} % and taken as the best-efficiency point (its efficiency understated ${understated(p)}), the rest of the span blank.`
    : `${head}, so the efficiency there is left blank: the engine reads it below ${typed(p.level)} % from the rows either side (power overstated) and puts the best-efficiency point outside the contour. Tick the box to take the middle of the span, ${fmtNum(p.midpoint)} ${u}, as the best-efficiency point at ${typed(p.level)} %.`;
}

/**
 * The span between two meetings where the curve starts (`onStart`) or ends (`onEnd`) on the contour: that end's row is the
 * curve's first (last) efficiency row, at the level, the highest written when the span is blank, so the engine (a BEP only at an
 * interior peak of the efficiency rows, the first of equal rows: pumpCurve.ts) gives none unticked. Ticked, the middle at the
 * level follows the row at the curve's end and is taken (an interior row, the first of the equal ones); at the curve's start
 * the first row, at the level too, comes before it and is the first of the equal rows: still no BEP.
 */
function onEdgeWarning(p: UnreadPeak, flowUnit: string, head: string): string {
  const u = flowUnitText(flowUnit);
  const level = `${typed(p.level)} %`;
  const mid = `${fmtNum(p.midpoint)} ${u}`;
  const start = p.onStart === true;
  const edge = start ? `The curve starts on the contour at ${fmtNum(p.from)} ${u}, so its first efficiency row is there, at ${level}` : `The curve ends on the contour at ${fmtNum(p.to)} ${u}, so its last efficiency row is there, at ${level}`;
  const noBep = `no best-efficiency point is known for this curve (the engine gives one only at a peak with efficiency rows on both sides)`;
  if (!p.taken)
    return `${head}, so the efficiency there is left blank: the engine reads it below ${level} from the rows either side (power overstated). ${edge}, the highest written: ${noBep}. ` +
      (start
        ? `Tick the box to write the middle of the span, ${mid}, at ${level}: the efficiency (understated) and shaft power (overstated) then reach it, still with no best-efficiency point (the first row, at ${level} too, comes first, and the engine takes the first of equal rows).`
        : `Tick the box to take the middle of the span, ${mid}, as the best-efficiency point at ${level}.`);
  return start
    ? `${head}; the middle of that span, ${mid}, is written at ${level} (understated ${understated(p)}), the rest of the span blank. ${edge} too, and the engine takes the first of equal rows, the curve's first: ${noBep}.`
    : `${head}; the middle of that span, ${mid}, is written at ${level} and taken as the best-efficiency point (its efficiency understated ${understated(p)}; the row at the curve's end, at ${level} too, comes after it and the engine takes the first of equal rows), the rest of the span blank.`;
}

/**
 * The warning for one of a curve's spans inside its top level's contours when it has two or more (it leaves a contour
 * and enters another of that level, or the same one again): every span's rows are blank, so unticked the engine's
 * BEP, if any, is a row outside them all; ticked, every middle is written at the level, and the engine's BEP is the first
 * of those equal rows, none when that is the middle of the span at the curve's start (its first efficiency row).
 */
function manyWarning(p: UnreadPeak, flowUnit: string): string {
  const u = flowUnitText(flowUnit);
  const level = `${typed(p.level)} %`;
  const where = p.toEnd ? `from ${fmtNum(p.from)} ${u} to the curve's end at ${fmtNum(p.to)} ${u}, the curve ending inside it (the peak there or past the end)`
    : p.fromStart ? `from the curve's start at ${fmtNum(p.from)} ${u} to ${fmtNum(p.to)} ${u}, the curve starting inside it (the peak there or before the start)`
    : `from ${fmtNum(p.from)} to ${fmtNum(p.to)} ${u}`;
  const head = `${p.curve} (${keyText(p)}): the peak is not traced. Inside a ${level} contour, ${where}, the contours say only that the efficiency is ${bound(p)}; the curve has other spans inside ${level} contours, each with its warning`;
  const mid = `${fmtNum(p.midpoint)} ${u}`;
  if (!p.taken)
    return `${head}. The efficiency is left blank in all of them: the engine reads it below ${level} from the rows either side (power overstated) and puts the best-efficiency point, if it gives one, outside the ${level} contours. Tick the box to write the middle of each span at ${level}.`;
  const bep = p.bepMidpoint === null
    ? `the first of those equal rows is ${p.onStart ? "the row where the curve starts on the contour" : "the middle of the span at the curve's start"}, its first efficiency row, so no best-efficiency point is known for this curve (the engine gives one only at a peak with efficiency rows on both sides)`
    : p.bepMidpoint === p.midpoint ? `the engine takes the first of those equal rows, this one, ${mid}, as the best-efficiency point`
    : `the engine takes the first of those equal rows, ${fmtNum(p.bepMidpoint!)} ${u}, as the best-efficiency point, not this one`;
  return `${head}. The middle of this span, ${mid}, is written at ${level} (understated ${understated(p)}), the rest of it blank, and so is every span's middle: ${bep}.`;
}

/** "20.0, 40.0 and 60.0". */
const listed = (xs: readonly number[]) => `${xs.slice(0, -1).map((x) => fmtNum(x)).join(", ")} and ${fmtNum(xs[xs.length - 1])}`;
/** "20.0", or "20.0 and 40.0" (listed, for one value or more). */
const listed1 = (xs: readonly number[]) => (xs.length === 1 ? fmtNum(xs[0]) : listed(xs));
const understated = (p: UnreadPeak) => (p.next == null ? "by an amount the chart does not show" : `by less than ${typed(p.next - p.level)} points`);

/**
 * The warning for a curve that ends (`toEnd`) or starts (`fromStart`) inside its innermost contour: no crossing closes
 * the span on that side, so the efficiency rows stop at the contour: they rise to their last row (or fall from their
 * first), the highest efficiency written. The engine knows a best-efficiency point only at an interior peak of the rows
 * with efficiency (pumpCurve.ts, warning `bep-not-published`), so this curve has none, ticked or not: the box only
 * writes the span's middle at the level, which carries the efficiency (understated) and so the shaft power (overstated)
 * from the crossing to there, the peak still at or past the end of the data. One text for both sides, its words mirrored.
 */
function edgeWarning(p: UnreadPeak, flowUnit: string, side: "end" | "start"): string {
  const u = flowUnitText(flowUnit);
  const end = side === "end";
  const crossing = end ? p.from : p.to;
  const edge = end ? p.to : p.from;
  const span = end
    ? `from there to the curve's end at ${fmtNum(p.to)} ${u}`
    : `from the curve's start at ${fmtNum(p.from)} ${u} to there`;
  const head =
    `${p.curve} (${keyText(p)}): the peak is not traced. The curve ${end ? "ends" : "starts"} inside the ${typed(p.level)} % contour: ${
      (end ? p.fromTouch : p.toTouch)
        ? `its ${end ? "last" : "first"} meeting with it is a touch from inside at ${fmtNum(crossing)} ${u}, where it does not ${end ? "leave" : "enter"} it (tangent, or grazing a vertex; the efficiency there is ${typed(p.level)} %)`
        : `it crosses it once, at ${fmtNum(crossing)} ${u}`}, ` +
    `and ${span} the contours say only that the efficiency is ${bound(p)}; the peak lies there or ${end ? "past the curve's end" : "before the curve's start"}`;
  const noBep =
    `No best-efficiency point is known for this curve: the engine gives one only at a peak with efficiency rows on both sides, ` +
    `and this curve's highest efficiency written is its ${end ? "last" : "first"} row, the peak at or ${end ? "past the end" : "before the start"} of its efficiency data (no BEP or preferred operating region is judged).`;
  const none = (at: string) => `none ${end ? "past" : "before"} it (no efficiency or shaft power ${end ? `from ${at} to the curve's end at ${fmtNum(edge)} ${u}` : `from the curve's start at ${fmtNum(edge)} ${u} to ${at}`})`;
  const mid = `${fmtNum(p.midpoint)} ${u}`;
  return p.taken
    ? `${head}. The middle of that span, ${mid}, is written at ${typed(p.level)} % (understated ${understated(p)}, its flow a guess within the span), the rest of the span blank: ` +
        `the efficiency is written ${end ? "up to" : "from"} ${mid}, read below ${typed(p.level)} % ${end ? `from ${fmtNum(crossing)} ${u} to there` : `from there to ${fmtNum(crossing)} ${u}`} (shaft power overstated), and ${none(mid)}. ${noBep}`
    : `${head}, so the efficiency there is left blank: it is written ${end ? "up to its last row before" : "from its first row past"} ${fmtNum(crossing)} ${u}, ${end ? "rising to it" : "falling from it"}, and ${none(`${fmtNum(crossing)} ${u}`)}. ${noBep} ` +
        `Tick the box to write the middle of the span, ${mid}, at ${typed(p.level)} %: the efficiency (understated) and shaft power (overstated) then ${end ? "reach" : "start at"} ${mid}, still with no best-efficiency point.`;
}

/**
 * The box's label beside a span's warning: for a span between two crossings it takes the middle as the best-efficiency
 * point; for one at the curve's end or start it writes the middle at the level, which carries the efficiency and shaft
 * power to there but gives no best-efficiency point (edgeWarning); with two spans or more between crossings (two islands of
 * one level) it writes every middle, and the engine takes the first of equal rows as the BEP. Null, no box, for a curve
 * that crosses one contour only, once or twice, or none (the CSV writes no efficiency for it, ticked or not: loneWarning,
 * twiceWarning, uncrossedWarning), and for a span outside a contour (valleyWarning: its middle is no peak).
 */
export function peakBoxLabel(p: UnreadPeak, flowUnit: string): string | null {
  if (p.lone || p.twice || p.valley || p.uncrossed) return null;
  const level = `${typed(p.level)} %`;
  if (p.bepMidpoint !== undefined)
    return `Write the middle of each span inside a ${level} contour at ${level} for ${p.curve}: ${p.bepMidpoint === null ? "the first is its first efficiency row, no best-efficiency point either way" : `the first, ${fmtNum(p.bepMidpoint)} ${flowUnitText(flowUnit)}, is taken as its best-efficiency point`}`;
  if (p.onStart) return `Write the middle of the ${level} contour, ${fmtNum(p.midpoint)} ${flowUnitText(flowUnit)}, at ${level} for ${p.curve}: the curve starts on the contour, no best-efficiency point either way`;
  if (!p.toEnd && !p.fromStart) return `Take the middle of the ${level} contour as ${p.curve}’s best-efficiency point`;
  const mid = `${fmtNum(p.midpoint)} ${flowUnitText(flowUnit)}`;
  return `Write the middle of the span inside the ${level} contour, ${mid}, at ${level} for ${p.curve}: efficiency and shaft power ${p.toEnd ? "up to" : "from"} ${mid}, no best-efficiency point either way`;
}

/**
 * The warning for a curve that crosses one contour once: one efficiency value. The engine's efficiency
 * (and so shaft power) is an interpolant through two rows or more (pumpCurve.ts `column`), yet its
 * best-efficiency point is the row of highest efficiency given: a lone value would put the BEP on a
 * contour crossing. The CSV writes none (model.ts `tracedSets`), so the engine has no efficiency.
 */
function loneWarning(p: UnreadPeak, flowUnit: string): string {
  const u = flowUnitText(flowUnit);
  return (
    `${p.curve} (${keyText(p)}): the efficiency is not read. ${
      p.fromTouch
        ? `The curve meets one contour only, the ${typed(p.level)} % contour, and does not cross it: it touches it at ${fmtNum(p.from)} ${u} (tangent, or grazing a vertex) and stays on one side of it: `
        : `The curve crosses one contour only, the ${typed(p.level)} % contour, once, at ${fmtNum(p.from)} ${u}: `}` +
    `the efficiency is known at that one flow only, and one value makes no efficiency curve (the engine reads efficiency, and shaft power from it, only between two rows or more, ` +
    `yet would take a lone value as the best-efficiency point, at a contour ${p.fromTouch ? "touch" : "crossing"}). So the CSV writes no efficiency for this curve: the engine has no efficiency, shaft power or ` +
    `best-efficiency point for it. Trace more of the contours it crosses, or its efficiency curve on an efficiency panel.`
  );
}

/**
 * The warning for a curve that crosses one contour twice and no other: its efficiency is known at the two crossings
 * only, the ends of the span inside the contour. Rows inside the span are blank (unread), rows outside have nothing
 * to read from (the efficiency is not carried past the crossings), so the CSV writes none (model.ts `tracedSets`)
 * and the engine has no efficiency, shaft power or BEP. No box: the middle at the level would be the one efficiency
 * row (one value makes no curve, pumpCurve.ts `column`), and with the crossings written at the level too, a flat
 * line, no interior peak, so still no BEP (warning `bep-not-published`).
 */
function twiceWarning(p: UnreadPeak, flowUnit: string): string {
  const u = flowUnitText(flowUnit);
  const level = `${typed(p.level)} %`;
  if (p.at)
    return (
      `${p.curve} (${keyText(p)}): the efficiency is not read. The curve ${p.touchedAt ? "meets" : "crosses"} contours of one level only, ${level}, ${p.at.length} times, at ${listed(p.at)} ${u}` +
      `${p.touchedAt ? ` (at ${listed1(p.touchedAt)} ${u} it touches one without crossing it, staying on its side)` : ""}: ` +
      `the efficiency is known at those flows only (${level}); between them the contours say only that it is above or below ${level} (inside or outside a contour), and outside them nothing, ` +
      `no other contour crossing the curve. So no row of the curve has an efficiency: the rows between the crossings are left blank (unread) and those outside have none to read ` +
      `(it is not carried past the crossings), and the CSV writes no efficiency for this curve: the engine has no efficiency, shaft power or best-efficiency point for it. ` +
      `No box is offered to write the middles of the spans inside the contour at ${level}: with the crossings at ${level} too they would make a flat line, ` +
      `the dips between them read at ${level} and no best-efficiency point. Trace more of the contours it crosses, or its efficiency curve on an efficiency panel.`
    );
  return (
    `${p.curve} (${keyText(p)}): the efficiency is not read. ${
      p.fromTouch || p.toTouch
        ? `The curve meets one contour only, the ${level} contour, twice: at ${fmtNum(p.from)} ${u} ${p.fromTouch ? "it touches it without crossing it" : "it crosses it"} and at ${fmtNum(p.to)} ${u} ${p.toTouch ? "it touches it without crossing it" : "it crosses it"} (a touch: tangent, or grazing a vertex, the curve staying on its side): ` +
          `the efficiency is known at those two flows only (${level}); between them the contours say only that it is above or below ${level} (inside or outside the contour)`
        : `The curve crosses one contour only, the ${level} contour, twice, at ${fmtNum(p.from)} and ${fmtNum(p.to)} ${u}: ` +
          `the efficiency is known at those two flows only (${level}); between them the contours say only that it is ${bound(p)}`}, and outside them nothing, no other contour crossing the curve. ` +
    `So no row of the curve has an efficiency: the rows between the crossings are left blank (inside the contour) and those outside have none to read (it is not carried past the crossings), ` +
    `and the CSV writes no efficiency for this curve: the engine has no efficiency, shaft power or best-efficiency point for it. ` +
    `No box is offered to take the middle of the span, ${fmtNum(p.midpoint)} ${u}, as the best-efficiency point: at ${level} it would be the curve's only efficiency row, and the engine reads ` +
    `efficiency, and shaft power from it, only between two rows or more, and a best-efficiency point only at a peak with efficiency rows on both sides; with the crossings ` +
    `written at ${level} too, the line would be flat: still no best-efficiency point. Trace more of the contours it crosses, or its efficiency curve on an efficiency panel.`
  );
}

/**
 * The warning for a span between two crossings of one level where the curve is outside that level's contour (it leaves
 * it and comes back in: two islands of one level, or a bay in one). The efficiency dips below the level there, by how
 * much the chart does not say: the rows are left blank (contours.ts), and the engine reads across them from the rows
 * with efficiency either side (a monotone cubic: between their values), so it reads the dip too high and the shaft
 * power too low. No box: the span's middle is no peak.
 */
function valleyWarning(p: UnreadPeak, flowUnit: string): string {
  const u = flowUnitText(flowUnit);
  const level = `${typed(p.level)} %`;
  return (
    `${p.curve} (${keyText(p)}): the efficiency dips and is not traced. From ${fmtNum(p.from)} to ${fmtNum(p.to)} ${u} the curve is outside the ${level} contour: ` +
    `${p.fromTouch ? `it touches it at ${fmtNum(p.from)} ${u} without going in` : `it leaves it at ${fmtNum(p.from)} ${u}`} ` +
    `and ${p.toTouch ? `touches it at ${fmtNum(p.to)} ${u} without going in` : `comes back in at ${fmtNum(p.to)} ${u}`}, so the contours say only that the efficiency there is below ${level}, not how far. It is left blank: the engine reads it across the blank rows ` +
    `from the rows with efficiency either side, between their values, so it reads the dip too high (efficiency overstated, shaft power understated) and puts no best-efficiency point in it. ` +
    `Trace the lower contours the curve crosses there, or its efficiency curve on an efficiency panel.`
  );
}

/**
 * The warning for a head curve that crosses none of its panel's contours (its efficiency from contours, no efficiency
 * curve of its own): no crossing, no efficiency value, so the CSV writes none (model.ts `tracedSets`: fewer than two)
 * and the engine has no efficiency, shaft power or BEP for the curve (warning `no-efficiency`).
 */
function uncrossedWarning(p: UnreadPeak): string {
  const levels = (p.uncrossed ?? []).map((L) => `${typed(L)} %`).join(", ");
  return (
    `${p.curve} (${keyText(p)}): the efficiency is not read. The curve crosses none of the contours on its panel (${levels}), so the contours give no efficiency along it: ` +
    `the CSV writes no efficiency for this curve, and the engine has no efficiency, shaft power or best-efficiency point for it from this chart. ` +
    `Trace the curve over its whole length and the contours it passes through (an island reaching the curve, a contour closed where the chart closes it), or its efficiency curve on an efficiency panel.`
  );
}

const met = (touch?: boolean) => (touch ? "touched" : "crossed");
const touched = (p: UnreadPeak) => p.fromTouch === true || p.toTouch === true;

/** The short sentence for the source line (and so the revision's note); "" when nothing is unread. */
export function peakNote(ps: readonly UnreadPeak[], flowUnit: string): string {
  const u = flowUnitText(flowUnit);
  const span = (p: UnreadPeak) =>
    p.toEnd ? `from ${fmtNum(p.from)} ${u}${p.fromTouch ? " (touched from inside)" : ""} to the curve's end at ${fmtNum(p.to)} ${u}`
    : p.fromStart ? `from the curve's start at ${fmtNum(p.from)} ${u} to ${fmtNum(p.to)} ${u}${p.toTouch ? " (touched from inside)" : ""}`
    : `at ${fmtNum(p.from)}–${fmtNum(p.to)} ${u}`;
  const one = (p: UnreadPeak) =>
    `${keyText(p)} above ${typed(p.level)} % ${span(p)}${
      p.bepMidpoint !== undefined ? (p.taken ? `, middle ${fmtNum(p.midpoint)} ${u} written at ${typed(p.level)} %, ${p.bepMidpoint === p.midpoint ? "the BEP" : "not the BEP"}` : "")
      : p.onStart ? `${p.taken ? `, middle ${fmtNum(p.midpoint)} ${u} written at ${typed(p.level)} %` : ""}, no BEP (the curve starts on the contour, its first row at ${typed(p.level)} %)`
      : p.onEnd && !p.taken ? ", no BEP (the curve ends on the contour, its last row the highest)"
      : !p.toEnd && !p.fromStart ? (p.taken ? `, BEP taken at its middle ${fmtNum(p.midpoint)} ${u} at ${typed(p.level)} %` : "")
      : `${p.taken ? `, middle ${fmtNum(p.midpoint)} ${u} written at ${typed(p.level)} %` : ""}, no BEP (peak at or ${p.toEnd ? "past the end" : "before the start"} of the efficiency data)`}`;
  const spans = ps.filter((p) => !p.lone && !p.twice && !p.valley && !p.uncrossed), lone = ps.filter((p) => p.lone), twice = ps.filter((p) => p.twice && !p.at), many = ps.filter((p) => p.at);
  const valley = ps.filter((p) => p.valley), uncrossed = ps.filter((p) => p.uncrossed);
  return [
    uncrossed.length ? `no contour crossed, no efficiency written: ${uncrossed.map(keyText).join("; ")}` : "",
    valley.length ? `efficiency blank outside a contour between two of its crossings (read across from the rows either side, overstated): ${valley.map((p) => `${keyText(p)} below ${typed(p.level)} % at ${fmtNum(p.from)}–${fmtNum(p.to)} ${u}`).join("; ")}` : "",
    spans.length ? `peak not traced, efficiency blank inside the innermost contour: ${spans.map(one).join("; ")}` : "",
    lone.length ? `efficiency at one contour ${lone.some((p) => p.fromTouch) ? "meeting" : "crossing"} only, none written: ${lone.map((p) => `${keyText(p)} ${typed(p.level)} %${p.fromTouch ? " touched, not crossed," : ""} at ${fmtNum(p.from)} ${u}`).join("; ")}` : "",
    twice.length ? `efficiency at two ${twice.some(touched) ? "meetings with" : "crossings of"} one contour only, none written: ${twice.map((p) => `${keyText(p)} ${typed(p.level)} % ${touched(p) ? `${met(p.fromTouch)} at ${fmtNum(p.from)} and ${met(p.toTouch)} at` : `at ${fmtNum(p.from)} and`} ${fmtNum(p.to)} ${u}`).join("; ")}` : "",
    many.length ? `efficiency at ${many.some((p) => p.touchedAt) ? "meetings with" : "crossings of"} one level only, none written: ${many.map((p) => `${keyText(p)} ${typed(p.level)} % at ${listed(p.at!)} ${u}${p.touchedAt ? ` (touched, not crossed, at ${listed1(p.touchedAt)})` : ""}`).join("; ")}` : "",
  ].filter(Boolean).join("; ");
}
