/**
 * Power headers that name the hydraulic power: the power the pump gives the liquid, P_hyd = ρ·g·Q·H (common
 * practice; also called output, water, fluid or useful power, "WHP" for water horsepower, P_u for the pump power
 * output in ISO 9906's symbols, from memory), not the pump's shaft power (P2). The importer's power field is shaft
 * power: P2 = P_hyd / η (η the pump efficiency), so P_hyd read as P2 understates it by the pump efficiency (at
 * η = 70 % by 30 %), an efficiency worked out from it comes out at 100 % and the motor is sized too small. Such a
 * column is left unmapped ("ignore") and checkMapping says why (notShaftPowerMessage with HYDRAULIC_POWER). It holds nothing that the flow
 * and head columns do not (P_hyd = ρ·g·Q·H), so leaving it out loses nothing; it is never converted.
 * Pure: no Node or DOM APIs. Patterns run on the normalised, lower-case header.
 */
import { namesShaftOrElectrical, type NotShaftPower } from "./input-power";

/**
 * Words that name the hydraulic power: hydraulic (hydr., hyd, Phyd, P_hyd, hydraulische, hydraulique), output
 * (Output power, Power output, P out, Pout), water power (water horsepower, water hp, WHP), fluid power, useful
 * power (Nutzleistung, puissance utile) and P_u. "P_w"/"Pw" (water power, or a power in W?) is ambiguous-power.ts's.
 */
const HYDRAULIC =
  /hydraul|\bhydr?\b|\bphydr?\b|\bout(?:put)?\b|\bpout\b|\bwater\s*(?:power|horse\s*power|hp)\b|\bwhp\b|\bfluid\s+power\b|\buseful\b|nutzleistung|\butile\b|\bpu\b|\bp\s*-?\s*u\b/;

/** Hydraulic power written as one symbol, which the power field's own words do not catch: "Phyd", "Pu", "Pout", "WHP". */
export const HYDRAULIC_POWER_WORD = /\bphydr?\b|\bpu\b|\bpout\b|\bwhp\b/;

/**
 * True when a power header (already normalised) names the hydraulic power. A header that also names P1, P2, the shaft,
 * the brake or the electrical side is not read as hydraulic ("Motor output" is the motor's shaft output: input-power.ts reads it as shaft power).
 */
export function namesHydraulicPower(norm: string): boolean {
  return HYDRAULIC.test(norm) && !namesShaftOrElectrical(norm);
}

/** The hydraulic power, for notShaftPowerMessage (input-power.ts). */
export const HYDRAULIC_POWER: NotShaftPower = {
  names: "the hydraulic power (the power given to the liquid, P_hyd = ρ·g·Q·H)",
  leftOut: ", which holds nothing the flow and head do not",
  values: "the hydraulic power",
  note: "hydraulic power (ρ·g·Q·H), not the shaft power (P2) the importer reads",
  why:
    "Dutymark's power is the pump's shaft power (P2), and P2 = P_hyd / η (η the pump efficiency): hydraulic power read as P2 understates it " +
    "by the pump efficiency (at η = 70 % by 30 %), so efficiencies worked out from it come out at 100 % and the motor is sized too small",
};
