/**
 * The engine's point rules as the importer applies them, and the plausibility of a curve's best
 * efficiency. One place for both paths: validate.ts (full path, with messages) and fast.ts (steps
 * aside to the full path when a rule is hit). Pure.
 *
 * The engine (app/engine/pumpCurve.ts `checkPumpPoints`, also run by `prepareSearchIndex`) refuses a
 * curve whose first head is not above zero, whose head rises above the lowest head before it by
 * more than a fraction of the first head, with an efficiency of 0 where flow is above zero, or with
 * a power or NPSHr that is not above zero. The importer names each of these at its row, so that no
 * curve set it accepts is later left out of the search without a word.
 */
import { fmtPctExact, fmtPctLimit, qt, qtExact, qtLimit } from "../../engine/quantityText.ts";

/**
 * Head may rise above the lowest head so far on the curve (running minimum, the engine's rule) by at
 * most this fraction of the curve's first head. The engine's default is 10 % and the app's searches
 * allow 100 %: 5 % is tighter than both, so a curve the importer accepts passes the engine too. It
 * lets the slight hump near shutoff and export rounding through and catches swapped or mistyped values.
 */
export const RISE_FRACTION = 0.05;

/**
 * Relative slack on the rise limit (fraction of it, 1e-6): absorbs rounding (42 after 40 is exactly 5 %), and leaves every
 * refused rise at least 5e-6 percentage points above 5 % of the first head, so the message prints it apart from the
 * limit: fmtPctExact shows up to 6 decimals of a percent, qtExact up to 9 significant digits.
 */
export const RISE_SLACK = 1e-6;

/** True when `head` rises more than RISE_FRACTION × `first` (× (1 + RISE_SLACK)) above `lowest`. */
export function risesTooMuch(head: number, lowest: number, first: number): boolean {
  return head - lowest > RISE_FRACTION * first * (1 + RISE_SLACK);
}

/**
 * Below this an NPSHr above zero is no figure a maker publishes, m: the smallest NPSHr of a centrifugal pump is some tenths
 * of a metre (common practice, from memory; the demo libraries' smallest is 0.23 m). Below it the column's unit or the
 * cell is likely wrong, and an NPSH check against it passes nearly any suction (5e-324 m, a cell taken as written, made
 * every search of its library throw before the engine took such an NPSHr as none). A warning (`npshr-small`), the point
 * and the curve kept; the engine's own rule stays "above zero".
 */
export const NPSHR_SMALL = 0.1;

/**
 * Why an NPSHr is warned of, with the value as written, what it reads as and the rule: "NPSHr “0.001” (0.001 m at 20.0 m³/h)
 * is below 0.1 m: no centrifugal pump's maker publishes so small an NPSHr …".
 * @param raw the cell as written
 * @param si the NPSHr read, m
 * @param flow the row's flow, m³/s (null when unreadable)
 */
export function npshrSmallReason(raw: string, si: number, flow: number | null): string {
  return `NPSHr “${raw.trim()}” (${qtExact("head", si, [NPSHR_SMALL])}${flow != null ? ` at ${qt("flow", flow)}` : ""}) is below ${qtLimit("head", NPSHR_SMALL, [si])}: no centrifugal pump's maker publishes so small an NPSHr (the smallest are some tenths of a metre, common practice), and NPSH judged against it passes nearly any suction — check the column's unit (m or ft) and the cell; the point is kept with it`;
}

/**
 * Best efficiency of a centrifugal pump's curve, fraction: roughly 20–92 % in practice (common practice);
 * below 5 % or above 95 % the efficiency column's unit (percent versus fraction) or its values are wrong.
 * A best efficiency read 100× too small or too large sizes shaft power and motors 100× wrong, so the
 * curve set is flagged (an error), never imported quietly.
 */
export const BEST_EFFICIENCY = { min: 0.05, max: 0.95 } as const;

/** True when a curve's best efficiency (fraction) lies within BEST_EFFICIENCY (a relative 1e-9 absorbs the % → fraction rounding: 5 % is 5 × 0.01). */
export function efficiencyPlausible(best: number): boolean {
  return best >= BEST_EFFICIENCY.min * (1 - 1e-9) && best <= BEST_EFFICIENCY.max * (1 + 1e-9);
}

/**
 * Why a curve's best efficiency is implausible, with the numbers and the likely fix, e.g. "best efficiency
 * of this curve is 0.72 % (largest value in “Eff %”: 0.72, read as percent): below 5 % — is the column in
 * fractions (0–1)? …".
 * @param best best efficiency of the curve set, fraction (after the column's unit was applied)
 * @param unit the efficiency column's unit ("%" or "fraction")
 * @param column the column's header text
 */
export function implausibleEfficiencyReason(best: number, unit: string | null, column: string): string {
  const limits = [BEST_EFFICIENCY.min, BEST_EFFICIENCY.max];
  const shown = fmtPctExact(best, limits, best < 0.1 ? 2 : 1);
  const raw = Number((unit === "%" ? best * 100 : best).toPrecision(6));
  const read = `largest value in “${column}”: ${raw}, read as ${unit === "%" ? "percent" : "a fraction 0–1"}`;
  const low = best < BEST_EFFICIENCY.min;
  const edge = low ? `below ${fmtPctLimit(BEST_EFFICIENCY.min)}` : `above ${fmtPctLimit(BEST_EFFICIENCY.max)}`;
  const hint = low && unit === "%" ? "is the column in fractions (0–1)? Set its unit to fraction above, or correct the values"
    : !low && unit === "fraction" ? "is the column in percent (0–100)? Set its unit to % above, or correct the values"
    : "check the column's unit and its values";
  return `best efficiency of this curve is ${shown} (${read}): ${edge} — ${hint} (a centrifugal pump's best efficiency lies roughly between 20 and 92 %)`;
}
