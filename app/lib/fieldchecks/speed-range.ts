// The speeds a field check is judged at: the range the curve may be translated in by the affinity laws, and a measured
// speed printed apart from that range's ends. Pure.
import { AFFINITY_SPEED_RANGE } from "~/engine";
import { fmtNumExact } from "~/engine/quantityText";

/** Measured speed / the curve's speed within which a check is judged: the engine's affinity range (about 50–120 %). */
export const SPEED_RANGE = AFFINITY_SPEED_RANGE;

/**
 * A measured speed in rpm (number only) with the decimals that keep it apart from the ends of the range the curve may be
 * translated in (the no-verdict warning's numbers) and from `others`: 1449.7 rpm of a 2900 rpm curve reads "1449.7", not
 * "1450" (50 %, inside); a speed well inside reads to the whole rpm.
 * @param measured the measured speed, rpm
 * @param rated the curve's speed, rpm (null: no range)
 * @param others other speeds printed beside it, rpm
 */
export function measuredRpmText(measured: number, rated: number | null, others: readonly (number | null)[] = []): string {
  return fmtNumExact(measured, [...(rated !== null ? SPEED_RANGE.map((f) => f * rated) : []), ...others], 0);
}
