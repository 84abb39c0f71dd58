// How candidates and selections are named to people: "Model · 2900 rpm · Ø195 mm", the impeller as a
// quantity token (app/engine/quantityText.ts), so each reader sees it in their own units. Pure.
import { qt } from "~/engine/quantityText";
import { renderUnits, type UnitChoice } from "../shared/units";

export type { UnitChoice };

/** A curve set's label; speed in rpm, impeller diameter in m (SI, as stored). */
export const candidateLabel = (set: { model: string; speed: number | null; impellerDiameter: number | null }) =>
  `${set.model}${set.speed ? ` · ${Math.round(set.speed)} rpm` : ""}${set.impellerDiameter ? ` · Ø${qt("diameter", set.impellerDiameter)}` : ""}`;

/**
 * The title a selection keeps: a blank one, or the label exactly as the form showed it in the selecting
 * user's `units`, is the label itself (with its token); a title the user typed is kept as typed.
 */
export function selectionTitle(typed: string, label: string, units?: UnitChoice): string {
  return !typed || (units && typed === renderUnits(label, units)) ? label : typed;
}
