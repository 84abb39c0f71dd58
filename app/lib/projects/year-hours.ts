// The hours of a year, where a system or a duty-cycle step takes them (system-input.ts `hoursPerYear`, energy.ts a step's
// `hours`; a duty cycle's steps added up: `stepPastYear`, `stepsOverYear`): from 0 to 8784 h (a leap year: 366 days × 24 h, common arithmetic), and the one way a refusal of them is
// worded — the field, the range, the hours sent, grouped as every range's ends (decision "inputedge"). Pure.
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
 * A running total of hours is past the year only beyond 1e-9 of it (about 32 ms), the engine's own tolerance (dutyCycle.ts):
 * steps typed in hundredths that add up to 8784 h exactly sum in binary to 8784.000000000002 h.
 */
const pastYear = (t: number) => t > HOURS_PER_YEAR_MAX * (1 + 1e-9);
/** The first step where the running total of hours passes a year (HOURS_PER_YEAR_MAX), or −1. */
export function stepPastYear(profile: readonly { hours: number }[]): number {
  let t = 0;
  return profile.findIndex((x) => pastYear((t += x.hours)));
}
/** Hours to 2 decimals; a total past the year with the decimals that set it apart from 8784 h (never "8784 h, more than … 8784 h"). */
const totalText = (h: number) => `${groupThousands(String(pastYear(h) && Number(h.toFixed(2)) <= HOURS_PER_YEAR_MAX ? fmtNumExact(h, [HOURS_PER_YEAR_MAX]) : Number(h.toFixed(2))))} h`;
/** Why the steps do not fit in a year, with the rule and the numbers (k: the step where the running total passes it). */
export function stepsOverYear(profile: readonly { hours: number }[], k: number): string {
  const total = profile.reduce((t, x) => t + x.hours, 0);
  const upTo = profile.slice(0, k + 1).reduce((t, x) => t + x.hours, 0);
  return `The steps add up to ${totalText(total)} a year, more than a year has: at most ${totalText(HOURS_PER_YEAR_MAX)}, a leap year's 366 days × 24 h. With this step they reach ${totalText(upTo)}; take hours off the steps.`;
}
