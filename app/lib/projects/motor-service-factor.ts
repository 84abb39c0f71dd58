// A motor running into its service factor at the operating point: above its rating, within rating × service factor. Not an
// overload (verdict-motor.ts says those), but a service factor is margin for occasional overload, not for continuous running
// (common practice, from memory: running there shortens the winding insulation's life), so the Motor row and the CSV say
// it with the load, the rating and the service factor. The same rule at a duty-cycle step is the engine's own note
// (dutyCycle.ts `motor-service-factor-step`). Pure; quantities as tokens (quantityText.ts).
import { fmtPctExact, pctLimitWithDecimals, qtExact, qtLimit } from "~/engine/quantityText";
import { limitCovers } from "~/engine/motor";

/** The candidate's figures as far as the motor goes (SI: W, fractions); a frozen selection's may lack any of them. */
type MotorFigures = { motorLimit?: number | null; motorLoadAtDuty?: number | null; motor?: { rating?: number | null } | null } | null | undefined;

/**
 * "runs into its service factor at the operating point: 108.0 % load, one pump's ⟦power|3240⟧ above its ⟦power|3000⟧ rating,
 * within rating × service factor 115 % (⟦power|3450⟧); …"; null at or below 100 % load (within the slack of `limitCovers`),
 * above rating × service factor (an overload: verdict-motor.ts), or where the load, rating or limit is unknown.
 */
export function serviceFactorNote(f: MotorFigures): string | null {
  const rating = f?.motor?.rating;
  const limit = f?.motorLimit;
  const load = f?.motorLoadAtDuty;
  if (rating == null || !(rating > 0) || limit == null || !(limit > 0) || load == null || !Number.isFinite(load) || load < 0) return null;
  const shaft = load * rating;
  if (limitCovers(rating, shaft) || !limitCovers(limit, shaft)) return null;
  const sf = limit / rating;
  const { text: sfText, decimals: sfDecimals } = pctLimitWithDecimals(sf);
  return `runs into its service factor at the operating point: ${fmtPctExact(load, [1, sf], Math.max(1, sfDecimals))} load, one pump's ${qtExact("power", shaft, [rating])} above its ${qtLimit("power", rating, [shaft])} rating, within rating × service factor ${sfText} (${qtLimit("power", limit, [shaft])}); a service factor is margin for occasional overload, not for continuous running (common practice): a motor of the next rating up is the usual choice`;
}
