// What the tracer will not send to the import until the user fixes it, curve by curve, and what the importer will warn
// of. Pure.
// The CSV keeps one curve per (quantity, speed, impeller Ø) — tracedSets takes the first head curve of a
// key and one curve of each other quantity — so a second curve of one key would vanish without a word;
// the importer refuses a blank speed or impeller Ø where it would split a curve (the set next to it in the CSV has the
// same other key and a value, or its own other key is blank too, and the flow rises on from one to the other where they
// meet; where it starts again, the set is one of its own: the importer's own rule, run on the CSV's key cells and flows by
// refusedBlankKeys; a set without a Ø at a speed of its own, or without a speed at a Ø of its own, is imported without
// it — without a speed, with the importer's no-speed warning, which curveWarnings names) and a speed or Ø typed at zero
// or below; a curve of another quantity with no head curve of its key is left out of the CSV; a contour drawn without
// an efficiency level (above zero) is left out of the reading (model.ts contourReading), so its crossings
// would be missing from the efficiency column; an open contour at a level that also has a closed loop would leave which side
// of that level a curve is on to a guess (mixedLevelProblem); two contours of different levels that cross (crossingContours). Each is named beside its curve in the sidebar, and "Check
// and import" (and the export) wait until none is left.
import { contoursCrossing, impellerGiven, inCsv, refusedBlankKeys, toData, type Calibration, type RefusedBlank } from "~/lib/tracer";
import { fmtNumShown as fmtNum } from "~/lib/shared/format"; // "−" as every shown quantity
import { NO_SPEED_WARNING } from "~/lib/import";
import { QUANTITY_LABEL, calibrations, keyOf, tracedSets, type Curve, type TracerState } from "./model";

export type CurveProblem = { curveId: number; message: string };

const name = (c: Curve) => `Curve ${c.id}`;
/** A speed typed (a blank field is NaN): written in the CSV, where the importer takes it only above zero. */
const speedTyped = (rpm: number) => Number.isFinite(rpm);
const impellerText = (mm: number) => (impellerGiven(mm) ? `impeller Ø ${mm} mm` : "no impeller Ø");
/** A key after a curve's name: "at 2900 rpm with impeller Ø 230 mm", "with no speed and no impeller Ø". */
const atKey = (c: Curve) => (speedTyped(c.speedRpm) ? `at ${c.speedRpm} rpm with ${impellerText(c.impellerMm)}` : `with no speed and ${impellerText(c.impellerMm)}`);
const list = (cs: Curve[]) => (cs.length === 2 ? `${name(cs[0])} and ${name(cs[1])}` : `${cs.slice(0, -1).map(name).join(", ")} and ${name(cs[cs.length - 1])}`);
const order = (r: RefusedBlank) => (r.where === "above" ? "just after" : "just before");
const warned = `with the importer's warning “${NO_SPEED_WARNING}”`;
/** The flow where two sets meet in the CSV: rising on from one to the next continues a curve; starting again (not above) begins one. */
const rising = "with the flow rising on from one to the next";
const restarts = ", or where its flow starts again (at or below theirs) where they meet, with the importer's key-not-given warning";

/**
 * A contour with points but no efficiency level above zero (blank is NaN, a new contour's 0), or one above 100 % (a typo:
 * the importer refuses any efficiency above 100 %, import/validate.ts, and would name the values read between the crossings,
 * not the contour), or null.
 */
function contourProblem(c: Curve): string | null {
  if (c.kind !== "contour" || !c.points.length) return null;
  if (c.level > 100)
    return `Contour ${c.id} has efficiency level ${c.level} %, above 100 %: no pump runs above 100 %, and the importer refuses any efficiency above 100 % ` +
      `(it would name the values read between this contour's crossings, not the contour); type its level in % (0–100) or remove it.`;
  if (c.level > 0) return null;
  const why = Number.isFinite(c.level) && c.level !== 0 ? `has efficiency level ${c.level} %, not above zero` : "has no efficiency level";
  return `Contour ${c.id} ${why}: it is left out (no efficiency is read where it crosses a head curve); type its level in % or remove it.`;
}

/** A contour the reading takes (contourReading: two points or more, a level above zero) as a closed loop (insideLevel: ticked, three points or more). */
const readAs = (c: Curve) => (c.kind !== "contour" || c.points.length < 2 || !(c.level > 0) ? null : c.closed === true && c.points.length >= 3 ? "closed" : "open");

/**
 * An open contour at a level that also has a closed loop on its panel, or null. Which side of a level a head curve starts on
 * is read from that level's closed loops (contours.ts insideLevel, even–odd) and only there; a level with an open line has
 * no inside, so the tracer falls back to its guess, and with a closed loop beside it the guess would overrule what the loop
 * says. Refused rather than guessed: a wrong side swaps the span above the level (the peak) with one below it (a dip).
 */
function mixedLevelProblem(c: Curve, s: TracerState): string | null {
  if (readAs(c) !== "open") return null;
  const loops = s.curves.filter((d) => d.panelId === c.panelId && d.level === c.level && readAs(d) === "closed");
  if (!loops.length) return null;
  const level = `${c.level} %`;
  const them = loops.length === 1 ? `Contour ${loops[0].id} is a closed loop` : `Contours ${loops.map((d) => d.id).join(", ")} are closed loops`;
  return `Contour ${c.id} (${level}) is an open line, and ${them} at ${level} too: the tracer reads which side of the ${level} contours a head curve is on ` +
    `from that level's closed loops, and an open line has no inside, so with both at ${level} it would have to guess, and a wrong guess swaps the span above ${level} ` +
    `(the peak) with one below it (a dip). Close Contour ${c.id}: where the chart cuts it off, click on along the chart's edge (round its corners) to where the line started, and tick “Closed loop” ` +
    `(its last point then joins its first); or remove it.`;
}

/**
 * Each contour (by id) that crosses one of another level drawn before it on its panel, with the message, where the panel is
 * calibrated (the crossing's flow and head given). Lines of different efficiency never meet on a chart (a point has one
 * efficiency; contours.ts contoursCrossing): a head curve near there would meet the levels in an order the chart does not have.
 */
function crossingContours(s: TracerState, cals: Map<number, Calibration | string>): Map<number, string> {
  const out = new Map<number, string>();
  for (const panel of s.panels) {
    const cal = cals.get(panel.id);
    if (!cal || typeof cal === "string") continue;
    const drawn = s.curves.filter((c) => c.panelId === panel.id && readAs(c) !== null);
    const lines = drawn.map((c) => ({ level: c.level, closed: readAs(c) === "closed", points: c.points.map((p) => ({ x: p.u, y: p.v })) }));
    for (const { a, b, at } of contoursCrossing(lines)) {
      const [first, later] = [drawn[a], drawn[b]];
      if (out.has(later.id)) continue;
      const d = toData(cal, { u: at.x, v: at.y });
      out.set(later.id,
        `Contour ${later.id} (${later.level} %) crosses Contour ${first.id} (${first.level} %) at ${fmtNum(d.x)} ${s.flowUnit.replace("m3", "m³")}, ${fmtNum(d.y)} ${panel.unit}: ` +
        `lines of different efficiency never meet on a chart (a point has one efficiency), so a head curve near there would meet the ${first.level} % and ${later.level} % levels ` +
        `in an order the chart does not have. Move a point of either line so they do not cross, or click more points where they run close.`);
    }
  }
  return out;
}

/** The message for a blank speed the importer refuses; `next`: the curve next to it in the CSV, `nextMm`: that curve's Ø. */
function speedRefused(c: Curve, r: RefusedBlank, next: string, nextMm: number): string {
  const rows = `its rows in the CSV come ${order(r)} those of ${next} at ${r.value} rpm`;
  if (!r.otherBlank && impellerGiven(c.impellerMm))
    return `${name(c)} has no speed, and ${rows} with the same impeller Ø (${c.impellerMm} mm): the importer reads rows of one model and impeller Ø ` +
      `that follow each other ${rising} as one curve, so it refuses the blank speed (it would split that curve); type its speed. A curve without a speed ` +
      `is imported without one, ${warned}, when the curves next to it in the CSV have another impeller Ø${restarts}.`;
  return `${name(c)} has no speed and no impeller Ø, and ${rows}${impellerGiven(nextMm) ? ` with Ø ${nextMm} mm` : ""}, ${rising}: with neither key ` +
    `nothing tells its rows from that curve's, so the importer refuses the blank speed (it would split that curve); type its speed. A curve ` +
    `without a speed is imported without one, ${warned}, when it has an impeller Ø and the curves next to it in the CSV have another${restarts}.`;
}

/** The message for a blank impeller Ø the importer refuses; `nextRpm`: the speed of the curve next to it. */
function impellerRefused(c: Curve, r: RefusedBlank, next: string, nextRpm: number): string {
  const rows = `its rows in the CSV come ${order(r)} those of ${next}`;
  if (!r.otherBlank)
    return `${name(c)} has no impeller Ø, and ${rows} at the same speed (${c.speedRpm} rpm) with Ø ${r.value} mm: the importer reads rows of one ` +
      `model and speed that follow each other ${rising} as one curve, so it refuses the blank Ø (it would split that curve); type its Ø. A curve without ` +
      `a Ø is imported without one when the curves next to it in the CSV are at another speed${restarts}.`;
  return `${name(c)} has no impeller Ø and no speed, and ${rows} with Ø ${r.value} mm${speedTyped(nextRpm) ? ` at ${nextRpm} rpm` : " and no speed"}, ${rising}: ` +
    `with neither key nothing tells its rows from that curve's, so the importer refuses the blank Ø (it would split that curve); type its Ø. ` +
    `A curve without a Ø is imported without one when it has a speed and the curves next to it in the CSV are at another speed${restarts}.`;
}

/**
 * The message of each key whose set the importer would refuse for a blank speed or Ø (refusedBlankKeys on the sets in the
 * CSV's order; the speed first), naming the head curve of the set next to it that has the value.
 */
function refusedBlanks(s: TracerState, cals: Map<number, Calibration | string>, heads: Curve[]): Map<string, (c: Curve) => string> {
  const sets = tracedSets(s, cals);
  const out = new Map<string, (c: Curve) => string>();
  for (const [i, why] of refusedBlankKeys(sets, s.flowUnit)) {
    const r = why.speed ?? why.impeller!;
    const by = heads.find((h) => keyOf(h) === keyOf(sets[r.by]));
    const next = by ? name(by) : "the curve";
    const { speedRpm, impellerMm } = sets[r.by];
    out.set(keyOf(sets[i]), (c) => (why.speed ? speedRefused(c, r, next, impellerMm) : impellerRefused(c, r, next, speedRpm)));
  }
  return out;
}

/** Every problem, in the order of the curves (one message per curve: the first that applies). */
export function curveProblems(s: TracerState, cals: Map<number, Calibration | string> = calibrations(s)): CurveProblem[] {
  const quantityOf = new Map(s.panels.map((p) => [p.id, p.quantity]));
  const curves = s.curves.filter((c) => c.kind === "curve" && quantityOf.has(c.panelId));
  const heads = curves.filter((c) => quantityOf.get(c.panelId) === "head");
  const headKeys = new Set(heads.map(keyOf));
  const refused = refusedBlanks(s, cals, heads);
  const crossed = crossingContours(s, cals);
  const out: CurveProblem[] = [];
  for (const c of s.curves) {
    const contour = contourProblem(c) ?? mixedLevelProblem(c, s) ?? crossed.get(c.id) ?? null;
    if (contour) out.push({ curveId: c.id, message: contour });
    if (!curves.includes(c)) continue;
    const q = quantityOf.get(c.panelId)!;
    const label = QUANTITY_LABEL[q].toLowerCase();
    let message: string | null = null;
    if (speedTyped(c.speedRpm) && !(c.speedRpm > 0)) message = `${name(c)} has speed ${c.speedRpm} rpm: it must be above zero.`;
    else if (Number.isFinite(c.impellerMm) && c.impellerMm < 0) message = `${name(c)} has impeller Ø ${c.impellerMm} mm: it must be above zero.`;
    else if (refused.has(keyOf(c))) message = refused.get(keyOf(c))!(c);
    else {
      const same = curves.filter((d) => quantityOf.get(d.panelId) === q && keyOf(d) === keyOf(c));
      if (same.length > 1)
        message = `${list(same)} are both ${label} curves ${atKey(c)}: the CSV keeps one curve per speed and impeller, so give each its own Ø (or speed) or remove one.`;
      else if (q !== "head" && !headKeys.has(keyOf(c)))
        message = `${name(c)} (${label}) has no head curve ${atKey(c)}: it would be left out of the CSV; trace that head curve or give this one the Ø and speed of its head curve.`;
    }
    if (message) out.push({ curveId: c.id, message });
  }
  return out;
}

/**
 * The importer's no-speed warning, on the head curve of each set in the CSV it takes without a speed (a blank speed it
 * does not refuse; a curve with a problem is left to that), with what a curve without a speed cannot give.
 */
export function curveWarnings(s: TracerState, cals: Map<number, Calibration | string> = calibrations(s), problems: CurveProblem[] = curveProblems(s, cals)): CurveProblem[] {
  const blocked = new Set(problems.map((p) => p.curveId));
  const inTheCsv = new Set(tracedSets(s, cals).filter(inCsv).map(keyOf));
  const head = new Set(s.panels.filter((p) => p.quantity === "head").map((p) => p.id));
  const seen = new Set<string>();
  const out: CurveProblem[] = [];
  for (const c of s.curves) {
    if (c.kind !== "curve" || !head.has(c.panelId) || seen.has(keyOf(c))) continue;
    seen.add(keyOf(c)); // the first head curve of a key is its set's (tracedSets)
    if (speedTyped(c.speedRpm) || !inTheCsv.has(keyOf(c)) || blocked.has(c.id)) continue;
    out.push({
      curveId: c.id,
      message: `${name(c)} (${impellerText(c.impellerMm)}) has no speed: no curve next to it in the CSV has its impeller Ø and a speed, so the importer ` +
        `takes it as a curve of its own without one, ${warned}. Without a speed, a speed change for this pump is set and judged as a percentage ` +
        `of the curve's speed, never in rpm against a rated speed, and on a viscous liquid the ANSI/HI 9.6.7 correction, which needs the speed, ` +
        `is not made. Type its speed if the chart gives one.`,
    });
  }
  return out;
}

/** Why the import (and the export) wait, or null when nothing does. */
export function importBlock(s: TracerState, cals: Map<number, Calibration | string> = calibrations(s)): string | null {
  const p = curveProblems(s, cals);
  if (!p.length) return null;
  return `Fix ${p.length} ${p.length === 1 ? "curve" : "curves"} before import (marked in “2 · Curves”): ${p.map((x) => x.message).join(" ")}`;
}
