// What the tracer will not send to the import until the user fixes it, curve by curve. Pure.
// The CSV keeps one curve per (quantity, speed, impeller Ø) — tracedSets takes the first head curve of a
// key and one curve of each other quantity — so a second curve of one key would vanish without a word;
// the importer refuses a blank impeller Ø where it would split a curve (the set next to it in the CSV has
// the same speed and a Ø: the importer's own rule, run on the CSV's key cells by refusedBlankImpellers;
// a set without a Ø at a speed of its own is imported without one) and the tracer asks for a speed; a
// curve of another quantity with no head curve of its key is left out of the CSV; a contour drawn without
// an efficiency level (above zero) is left out of the reading (model.ts contourReading), so its crossings
// would be missing from the efficiency column. Each is named beside its curve in the sidebar, and "Check
// and import" (and the export) wait until none is left.
import { impellerGiven, refusedBlankImpellers, type Calibration } from "~/lib/tracer";
import { QUANTITY_LABEL, calibrations, keyOf, tracedSets, type Curve, type TracerState } from "./model";

export type CurveProblem = { curveId: number; message: string };

const name = (c: Curve) => `Curve ${c.id}`;
const speedGiven = (rpm: number) => Number.isFinite(rpm) && rpm > 0;
const keyText = (c: Curve) => `${c.speedRpm} rpm${impellerGiven(c.impellerMm) ? ` with impeller Ø ${c.impellerMm} mm` : " with no impeller Ø"}`;
const list = (cs: Curve[]) => (cs.length === 2 ? `${name(cs[0])} and ${name(cs[1])}` : `${cs.slice(0, -1).map(name).join(", ")} and ${name(cs[cs.length - 1])}`);

/** A contour with points but no efficiency level above zero (blank is NaN, a new contour's 0), or null. */
function contourProblem(c: Curve): string | null {
  if (c.kind !== "contour" || !c.points.length || c.level > 0) return null;
  const why = Number.isFinite(c.level) && c.level !== 0 ? `has efficiency level ${c.level} %, not above zero` : "has no efficiency level";
  return `Contour ${c.id} ${why}: it is left out (no efficiency is read where it crosses a head curve); type its level in % or remove it.`;
}

/**
 * The blank-Ø message of each key whose set the importer would refuse (refusedBlankImpellers on the sets in the CSV's
 * order), naming the head curve of the set next to it that has the Ø.
 */
function refusedBlanks(s: TracerState, cals: Map<number, Calibration | string>, heads: Curve[]): Map<string, (c: Curve) => string> {
  const sets = tracedSets(s, cals);
  const out = new Map<string, (c: Curve) => string>();
  for (const [i, why] of refusedBlankImpellers(sets)) {
    const by = heads.find((h) => keyOf(h) === keyOf(sets[why.by]));
    const next = by ? name(by) : "the curve";
    out.set(keyOf(sets[i]), (c) =>
      `${name(c)} has no impeller Ø, and its rows in the CSV come ${why.where === "above" ? "just after" : "just before"} those of ${next} ` +
      `at the same speed (${c.speedRpm} rpm) with Ø ${why.impellerMm} mm: the importer reads rows of one model and speed that follow each ` +
      `other as one curve, so it refuses the blank Ø (it would split that curve); type its Ø. A curve without a Ø is imported ` +
      `without one when the curves next to it in the CSV are at another speed.`);
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
  const out: CurveProblem[] = [];
  for (const c of s.curves) {
    const contour = contourProblem(c);
    if (contour) out.push({ curveId: c.id, message: contour });
    if (!curves.includes(c)) continue;
    const q = quantityOf.get(c.panelId)!;
    const label = QUANTITY_LABEL[q].toLowerCase();
    let message: string | null = null;
    if (!speedGiven(c.speedRpm)) message = `${name(c)} has no speed: type it in rpm (above zero).`;
    else if (Number.isFinite(c.impellerMm) && c.impellerMm < 0) message = `${name(c)} has impeller Ø ${c.impellerMm} mm: it must be above zero.`;
    else if (!impellerGiven(c.impellerMm) && refused.has(keyOf(c))) message = refused.get(keyOf(c))!(c);
    else {
      const same = curves.filter((d) => quantityOf.get(d.panelId) === q && keyOf(d) === keyOf(c));
      if (same.length > 1)
        message = `${list(same)} are both ${label} curves at ${keyText(c)}: the CSV keeps one curve per speed and impeller, so give each its own Ø (or speed) or remove one.`;
      else if (q !== "head" && !headKeys.has(keyOf(c)))
        message = `${name(c)} (${label}) has no head curve at ${keyText(c)}: it would be left out of the CSV; trace that head curve or give this one the Ø and speed of its head curve.`;
    }
    if (message) out.push({ curveId: c.id, message });
  }
  return out;
}

/** Why the import (and the export) wait, or null when nothing does. */
export function importBlock(s: TracerState, cals: Map<number, Calibration | string> = calibrations(s)): string | null {
  const p = curveProblems(s, cals);
  if (!p.length) return null;
  return `Fix ${p.length} ${p.length === 1 ? "curve" : "curves"} before import (marked in “2 · Curves”): ${p.map((x) => x.message).join(" ")}`;
}
