/**
 * Power headers the importer takes to be a rating (a nameplate figure, one for all points) by assumption, not because a
 * word says so outright (input-power.ts decides which headers these are):
 * - kind "motor": a motor word with no word for the input (P1, input, electrical), the output (output, P2, shaft) or the
 *   rating: "Motor power", "Motor kW", "Motor power kW", "Motorleistung", "Puissance moteur". In vendor catalogues such a
 *   column is usually the motor's rated output, its nameplate kW (common practice); it may also be the motor's electrical
 *   input (P1) at each point, or the pump's shaft power at each point.
 * - kind "rated": rated, nominal, nameplate, Nenn…, Bemessung… with no P1, input or electrical word, with or without a shaft
 *   word: "Rated power kW", "Nominal power", "Nennleistung", "Rated output kW", "Rated power P2", "Rated shaft power", "P2 rated",
 *   "Nameplate power". A nameplate figure: the motor's rated output, or the pump's shaft power at its rated point (a rated P2 is
 *   the shaft power at one duty, not along the curve); rarely a shaft power curve under a loose name. "P2" and "Shaft power" are
 *   readings at each point; "at rated speed" names the curve's condition, not a rating (input-power.ts namesRatedPower).
 * Neither reading is the shaft power at each point that Dutymark's power field holds, so the column is left unmapped
 * ("ignore"), and checkMapping and the mapping page say what was assumed, by which rule, the other readings and what to
 * choose for each (assumedPowerMessage, power-kinds.ts). The suggestion is made from the header alone: the values do not
 * decide the mapping. A power column mapped all the same whose values are one figure at every point of a curve is named by
 * the validation instead, whatever its header (constant-power.ts: a `power-constant` warning on that curve). Pure: no Node
 * or DOM APIs.
 */
import { shaftPowerSource } from "./input-power";

/** A power header read as a rating by assumption: what is assumed, the rule, the other readings, and the mapping page's note. */
export type AssumedPower = {
  /** What the column is taken to be. */
  assumed: string;
  /** The header words that led to it, and the words that would have settled it otherwise. */
  rule: string;
  /** The other readings, and what the user chooses for each. */
  others: string;
  /** Said on the mapping page beside the column (before ": left out" or ": see the problems below"). */
  note: string;
};

/** Why a rating is not read as shaft power, with the numbers (common practice: a motor is sized above the pump's highest shaft power). */
const WHY =
  "Dutymark's power is the pump's shaft power (P2) at each point of the curve; a rating is one figure written on every row (a 7.5 kW " +
  "motor reads 7.5 at shutoff and at the last point), so read as P2 every point would draw the full rating: the motor suggested and " +
  "the overload check would rest on the rating, not on the pump's power, and the efficiencies worked out from it would be wrong";

/** "Motor power", "Motor kW", "Motorleistung": the motor's rated output, assumed. */
export const MOTOR_POWER: AssumedPower = {
  assumed: "the motor's rated output (its nameplate size, one figure for all points), not the pump's shaft power at each point",
  rule:
    "a power header with a motor word (motor, Motor…, moteur) and no word for the input (P1, input, electrical), the output (output, P2, " +
    "shaft) or the rating is read as the motor's rated output, as vendor catalogues write it (common practice); " +
    "“P1” or “input” in the header would make it the motor's electrical input, “P2” or “shaft” the pump's shaft power",
  others:
    "the motor's electrical input power (P1) at each point, which is not the shaft power either (leave the column out, “— ignore —”); " +
    "or the pump's shaft power (P2) at each point, if the values change along the curve: then choose “Shaft power” for the column",
  note:
    "assumed: the motor's rated output (its size, one figure for all points), not the shaft power (P2) at each point; if it is the " +
    "shaft power at each point, choose “Shaft power”",
};

/** "Rated power kW", "Nennleistung": a rating, assumed. */
export const RATED_POWER: AssumedPower = {
  assumed:
    "a rating (a nameplate figure, one for all points: the motor's rated output, or the pump's shaft power at its rated point), " +
    "not the pump's shaft power at each point",
  rule:
    "a power header with rated, nominal, nameplate, Nenn… or Bemessung… and no word for the input (P1, input, electrical) is read as a " +
    "rating, also beside P2, shaft, brake or absorbed (a rated shaft power is the shaft power at one duty, the rated point); " +
    "without the rating word (“P2”, “Shaft power”) the header is the pump's shaft power at each point, and “at rated speed” names " +
    "the speed the curve is drawn at, not a rating",
  others: "the pump's shaft power (P2) at each point, if the values change along the curve: then choose “Shaft power” for the column",
  note:
    "assumed: a rating (one figure for all points), not the shaft power (P2) at each point; if it is the shaft power at each point, " +
    "choose “Shaft power”",
};

/**
 * checkMapping's warning for a column read as a rating by assumption. `mapped`: the column is mapped to power all the same
 * (a user's or a saved mapping); otherwise it was left out. `efficiency`: the header of the mapped pump efficiency column, or null.
 */
export function assumedPowerMessage(a: AssumedPower, header: string, mapped: boolean, efficiency: string | null): string {
  if (mapped)
    return (
      `“${header}” is mapped to shaft power, but its header reads as ${a.assumed} (assumed). Rule: ${a.rule}. ${WHY}. ` +
      `If its values are the same at every point of a curve, they are a rating: set the column to “— ignore —” (API: field "ignore"); ` +
      `keep it only if they change from point to point as the pump's shaft power does.`
    );
  return (
    `“${header}” is left unmapped, assumed: ${a.assumed}. Rule: ${a.rule}. ${WHY}. ${shaftPowerSource(efficiency)} ` +
    `It may also be ${a.others}.`
  );
}
