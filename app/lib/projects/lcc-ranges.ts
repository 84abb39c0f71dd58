// The life-cycle cost's rates at the edges of what the system form takes: each rate's field and range, and the one way a
// refusal of one is worded (the form, energy-form.ts, and the schema, energy.ts, say the same): the field, the range and
// the rate sent, grouped as every range's ends (decision "inputedge"). Pure.
import { fmtPctSignedExact, groupThousands, insideEnds } from "~/engine/quantityText";

/** A life-cycle rate's field and range, fractions a year (our rules): the form and the schema refuse in the same words. */
export type RateRange = { label: string; min: number; max: number };
export const ESCALATION_RANGE: RateRange = { label: "Tariff escalation", min: -0.5, max: 1 };
export const DISCOUNT_RANGE: RateRange = { label: "Discount rate", min: 0, max: 1 };
const pctText = (x: number) => `${String(Math.round(x * 1e6) / 1e4).replace("-", "−")} %`;
/** "from −50 % to 100 % a year". */
export const rateRangeText = (r: RateRange) => `from ${pctText(r.min)} to ${pctText(r.max)} a year`;
/**
 * Whether a rate (fraction a year) is taken: from the range's min to its max, each end to 1 part in 10⁸ of it (engine
 * `LIMIT_ROUNDING`), so a rate refused prints apart from the end beside it (100.0000001 % read "not 100.000000 %").
 */
export const rateTaken = (r: RateRange, x: number) => Number.isFinite(x) && insideEnds(x, r.min, r.max);
/** A rate taken ({@link rateTaken}) as the form and the schema keep it: one within the allowance past an end is the end. */
export const rateKept = (r: RateRange, x: number) => Math.min(r.max, Math.max(r.min, x));
/** A rate (fraction a year; null: not a number) refused, naming its field, its range and the rate sent. */
export function rateRefusal(r: RateRange, x: number | null): string {
  if (x === null || !Number.isFinite(x)) return `${r.label} must be a number; it takes ${rateRangeText(r)}.`;
  const sent = groupThousands(fmtPctSignedExact(x, [x < r.min ? r.min : r.max]));
  return `${r.label} is too ${x < r.min ? "low" : "high"}: it takes ${rateRangeText(r)}, not ${sent}; check the value.`;
}
