// What the tracer will not send to the import until the user fixes it, curve by curve. Pure.
// The CSV keeps one curve per (quantity, speed, impeller Ø) — tracedSets takes the first head curve of a
// key and one curve of each other quantity — so a second curve of one key would vanish without a word;
// the importer refuses a blank impeller Ø among curves that have one (a blank key cell) and a blank
// speed; a curve of another quantity with no head curve of its key is left out of the CSV; a contour
// drawn without an efficiency level (above zero) is left out of the reading (model.ts contourReading),
// so its crossings would be missing from the efficiency column. Each is named beside its curve in the
// sidebar, and "Check and import" (and the export) wait until none is left.
import { impellerGiven } from "~/lib/tracer";
import { QUANTITY_LABEL, keyOf, type Curve, type TracerState } from "./model";

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

/** Every problem, in the order of the curves (one message per curve: the first that applies). */
export function curveProblems(s: TracerState): CurveProblem[] {
  const quantityOf = new Map(s.panels.map((p) => [p.id, p.quantity]));
  const curves = s.curves.filter((c) => c.kind === "curve" && quantityOf.has(c.panelId));
  const anyImpeller = curves.some((c) => impellerGiven(c.impellerMm));
  const headKeys = new Set(curves.filter((c) => quantityOf.get(c.panelId) === "head").map(keyOf));
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
    else if (anyImpeller && !impellerGiven(c.impellerMm))
      message = `${name(c)} has no impeller Ø while other curves have one: type it (the importer refuses a curve without one among curves with one).`;
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
export function importBlock(s: TracerState): string | null {
  const p = curveProblems(s);
  if (!p.length) return null;
  return `Fix ${p.length} ${p.length === 1 ? "curve" : "curves"} before import (marked in “2 · Curves”): ${p.map((x) => x.message).join(" ")}`;
}
