// The hours of a year, where a system or a duty-cycle step takes them (system-input.ts `hoursPerYear`, energy.ts a step's
// `hours`): from 0 to 8784 h (a leap year: 366 days × 24 h, common arithmetic), and the one way a refusal of them is
// worded — the field, the range, the hours sent, grouped as every range's ends (decision "inputedge"). Pure.
import { fmtNumExact, groupThousands } from "~/engine/quantityText";

/** Most hours in a year, h: a leap year, 366 days × 24 h. */
export const HOURS_IN_YEAR = 8784;

/** Hours as a refusal writes them: grouped by spaces, told apart from the end they are past ("8 784.01 h"). */
const hoursText = (x: number, end: number) => `${groupThousands(fmtNumExact(x, [end]).replace("-", "−"))} h`;

/**
 * The refusal of hours outside 0 to 8784 a year (null or not finite: not a number): "Operating hours must be from 0 to
 * 8 784 h a year (a leap year: 366 days × 24 h), not 9 000 h."
 * @param label the field ("Operating hours", "Hours of a step")
 * @param x the hours sent, h a year
 */
export function yearHoursRefusal(label: string, x: number | null): string {
  const range = `from 0 to ${groupThousands(String(HOURS_IN_YEAR))} h a year (a leap year: 366 days × 24 h)`;
  if (x === null || !Number.isFinite(x)) return `${label} must be a number ${range}.`;
  return `${label} must be ${range}, not ${hoursText(x, x < 0 ? 0 : HOURS_IN_YEAR)}.`;
}
