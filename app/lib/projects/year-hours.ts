// The hours of a year, where a system or a duty-cycle step takes them (system-input.ts `hoursPerYear`, energy.ts a step's
// `hours`; a duty cycle's steps added up: `stepPastYear`, `stepsOverYear`): from 0 to 8784 h (a leap year: 366 days × 24 h, common arithmetic), and the one way a refusal of them is
// worded — the field, the range, the hours sent, grouped as every range's ends (decision "inputedge"). Pure.
import { decimalSum } from "~/engine/decimalSum";
import { fmtNumExact, groupThousands } from "~/engine/quantityText";

/** Most hours in a year, h: a leap year, 366 days × 24 h. */
export const HOURS_IN_YEAR = 8784;

/** Hours as a refusal writes them: grouped by spaces, told apart from the end they are past ("8 784.01 h"). */
const hoursText = (x: number, end: number) => `${groupThousands(fmtNumExact(x, [end], undefined, false, true).replace("-", "−"))} h`;

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

// A duty cycle's steps against the year (energy.ts schema and engine input).
/** Hours in a year at most (the name energy.ts has always exported): HOURS_IN_YEAR. */
export const HOURS_PER_YEAR_MAX = HOURS_IN_YEAR;
/**
 * A running total of hours is past the year only where its steps' hours, added up as typed (engine decimalSum.ts, the
 * engine's own rule in dutyCycle.ts), exceed 8784 h: steps typed in hundredths that add up to 8784 h exactly are 8784 h
 * (in binary they summed to 8784.000000000002 h), and any total above it is past, however little.
 */
const pastYear = (hours: readonly number[]) => decimalSum(hours).compare(HOURS_PER_YEAR_MAX) > 0;
/** The first step where the running total of hours passes a year (HOURS_PER_YEAR_MAX), or −1. */
export function stepPastYear(profile: readonly { hours: number }[]): number {
  return profile.findIndex((_, i) => pastYear(profile.slice(0, i + 1).map((x) => x.hours)));
}
/** Hours to 2 decimals; a total past the year as typed where those read 8784 h (never "8784 h, more than … 8784 h"). */
const totalText = (hours: readonly number[]) => {
  const sum = decimalSum(hours), h = hours.reduce((t, x) => t + x, 0);
  return `${groupThousands(String(sum.compare(HOURS_PER_YEAR_MAX) > 0 && Number(h.toFixed(2)) <= HOURS_PER_YEAR_MAX ? sum.text : Number(h.toFixed(2))))} h`;
};
/** Why the steps do not fit in a year, with the rule and the numbers (k: the step where the running total passes it). */
export function stepsOverYear(profile: readonly { hours: number }[], k: number): string {
  const hours = profile.map((x) => x.hours);
  return `The steps add up to ${totalText(hours)} a year, more than a year has: at most ${totalText([HOURS_PER_YEAR_MAX])}, a leap year's 366 days × 24 h. With this step they reach ${totalText(hours.slice(0, k + 1))}; take hours off the steps.`;
}
