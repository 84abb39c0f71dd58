/**
 * The engine's point rules as the importer applies them, and the plausibility of a curve's best
 * efficiency. One place for both paths: validate.ts (full path, with messages) and fast.ts (steps
 * aside to the full path when a rule is hit). Pure.
 *
 * The engine (app/engine/pumpCurve.ts `checkPumpPoints`, also run by `prepareSearchIndex`) refuses a
 * curve whose first head is not above zero, whose head's shape breaks engine/headShape.ts (a rise beyond
 * a fraction of the first head, other than one drooping peak up to 25 % above it in the first half of its flows), with an efficiency of 0 where flow is above zero, or with
 * a power or NPSHr that is not above zero. The importer names each of these at its row, so that no
 * curve set it accepts is later left out of the search without a word.
 */
import { fmtPct, fmtPctExact, fmtPctLimit, qt, qtExact, qtLimit } from "../../engine/quantityText.ts";
import { DROOP_MAX, HeadShape, PEAK_BY, type HeadRefusal } from "../../engine/headShape.ts";
import { DEFAULT_POWER_DENSITY } from "../../engine/pumpCurve.ts";
import { G0 } from "../../engine/units.ts";

/**
 * The rounding allowance of the head's shape (engine headShape.ts), as a fraction of the curve's first head: a head may
 * rise above the lowest head before it (once falling, the lowest since the fall began) by at most this. The engine's
 * default is 10 % and the app's searches allow 100 %: 5 % is tighter than both, so a curve the importer accepts passes
 * the engine too (the shape rule is monotone in it). It lets the slight hump near shutoff and export rounding through
 * and catches mistyped values (a second rise after falling). A rise above the first head beyond it is a drooping curve:
 * kept with a warning (`drooping-curve`) up to DROOP_MAX (25 %) with its peak in the first half of the flows, else refused.
 */
export const RISE_FRACTION = 0.05;

/**
 * Relative slack on the rise limit (fraction of it, 1e-6): absorbs rounding (42 after 40 is exactly 5 %), and leaves every
 * refused rise at least 5e-6 percentage points above 5 % of the first head, so the message prints it apart from the
 * limit: fmtPctExact shows up to 6 decimals of a percent, qtExact up to 9 significant digits.
 */
export const RISE_SLACK = 1e-6;

/**
 * The head's shape as the importer judges it (engine headShape.ts at RISE_FRACTION × the first head × (1 + RISE_SLACK)):
 * `judge` each next head, `take` the accepted ones, `end` the curve. Indexes are source lines.
 * @param first the curve's first head, m @param flow its flow, m³/s @param line its source line
 */
export function importHeadShape(first: number, flow: number, line: number): HeadShape {
  return new HeadShape(first, flow, RISE_FRACTION * first * (1 + RISE_SLACK), line);
}

/** "shut-off head" where the first point is at zero flow, else "head at its first published flow". */
const firstHeadName = (shape: HeadShape) => (shape.flowFirst === 0 ? "shut-off head" : "head at its first published flow");

/**
 * Why a head (`above-droop`, `second-rise`: code head-rising, the point left out) or a curve (`rising-curve`: code
 * curve-rising, the curve kept out) is refused, with its numbers, each apart from its limit (qtExact/qtLimit, fmtPctExact).
 * @param r the refusal (heads m, flows m³/s, indexes source lines)
 * @param shape the curve's shape so far
 */
export function headRefusalReason(r: HeadRefusal, shape: HeadShape): string {
  const first = shape.first;
  switch (r.kind) {
    case "above-droop": {
      const rise = r.head - first;
      return `head rises to ${qt("head", r.head)}, ${qtExact("head", rise, [r.limit])} above the curve's ${firstHeadName(shape)} (${qt("head", first)}): ` +
        `${fmtPctExact(rise / first, [DROOP_MAX])} of it, more than the ${fmtPctLimit(DROOP_MAX)} a drooping curve's peak is taken to reach (${qtLimit("head", r.limit, [rise])}; ` +
        "makers' drooping curves peak some 5–15 % above shut-off, common practice) — a mistyped value, or the head column read in the wrong unit";
    }
    case "second-rise": {
      const limit = RISE_FRACTION * first;
      return `head rises again to ${qt("head", r.head)}, ${qtExact("head", r.rise, [limit])} above the lowest head since the curve began to fall ` +
        `(${qt("head", r.low)}, line ${r.lowAt}; its peak ${qt("head", r.peak)}, line ${r.peakAt}): ${fmtPctExact(r.rise / first, [RISE_FRACTION])} of the first point's head (${qt("head", first)}), more than the ${fmtPctLimit(RISE_FRACTION)} allowed (${qtLimit("head", limit, [r.rise])}) ` +
        "— a pump curve rises at most once, from shut-off to one peak, then falls: a second rise is a mistyped value or a shifted row";
    }
    case "rising-curve": {
      const span = r.flowLast - r.flowFirst;
      return `head rises from the curve's ${firstHeadName(shape)} ${qt("head", first)} to its highest, ${qt("head", r.peak)} at ${qt("flow", r.peakFlow)} (line ${r.peakAt}), ` +
        `${fmtPctExact((r.peakFlow - r.flowFirst) / span, [PEAK_BY])} of the way along its flows (${qt("flow", r.flowFirst)} to ${qt("flow", r.flowLast)}), past the ${fmtPctLimit(PEAK_BY)} by which a drooping curve has peaked ` +
        "(common practice: well before its BEP): a curve rising along most of its length is a system curve, or the head and flow columns are swapped — not a pump curve";
    }
  }
}

/**
 * The drooping-curve warning: the rule and its numbers (the rise above shut-off, the peak's flow) and what it means
 * (common practice, from memory).
 * @param shape the curve's shape, ended without a refusal and drooping
 * @param firstLine the curve's first point's source line
 */
export function droopingReason(shape: HeadShape, firstLine: number): string {
  const rise = shape.peak - shape.first;
  const [shutoff, peak] = [qt("head", shape.first), qt("head", shape.peak)];
  const unpublished = shape.flowFirst === 0 ? "" : " (its shut-off head is not published; taken from the first point)";
  return `drooping curve: head rises from its ${firstHeadName(shape)} ${shutoff} (line ${firstLine})${unpublished} to a peak of ${peak} at ${qt("flow", shape.peakFlow)} (line ${shape.peakAt}), ` +
    `${qt("head", rise)} (${fmtPct(rise / shape.first)}) above it: more than the ${fmtPctLimit(RISE_FRACTION)} taken as rounding, within the ${fmtPctLimit(DROOP_MAX)} a drooping peak may reach, peaking in the first half of its flows; kept. ` +
    `Against a static head (plus pressure difference) between ${shutoff} and ${peak} the pump may not start, its check valve held shut, or may hunt between two flows of one head, ` +
    "and in parallel a pump started after others may not open its check valve: parallel operation is unsafe (common practice). The search judges each system's operating point from rest";
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

/**
 * The efficiency a point's shaft power implies, η = ρ·g·Q·H/P (definition of pump efficiency), at the density the engine reads
 * a curve's power column at (pumpCurve.ts `DEFAULT_POWER_DENSITY`, water 1000 kg/m³; g = 9.80665 m/s², 3rd CGPM), fraction.
 * Above 1 the power is below the hydraulic power ρgQH, which no pump gives (the engine warns "power column implies efficiency
 * above 100 %"): the importer refuses the point (`power-below-hydraulic`). A curve whose best such η is below
 * BEST_EFFICIENCY.min (5 %) has its power column in the wrong unit, W read as kW (`power-implausible`, set-wide).
 * @param flow m³/s, above zero @param head m @param power shaft power, W, above zero
 */
export function powerEfficiency(flow: number, head: number, power: number): number {
  return (DEFAULT_POWER_DENSITY * G0 * flow * head) / power;
}

/** Above this implied efficiency (1, with 1e-9 for rounding) a point's power is below its hydraulic power. */
export const POWER_EFFICIENCY_MAX = 1 + 1e-9;

/**
 * Why a power below the hydraulic power is refused, with its numbers and the rule.
 * @param raw the power cell as written @param flow m³/s @param head m @param power W
 */
export function powerBelowHydraulicReason(raw: string, flow: number, head: number, power: number): string {
  const hyd = power * powerEfficiency(flow, head, power);
  const eta = powerEfficiency(flow, head, power);
  return `power “${raw.trim()}” (${qtExact("power", power, [hyd])}) at ${qt("flow", flow)} and ${qt("head", head)} is below the hydraulic power ` +
    `ρ·g·Q·H = ${qtLimit("power", hyd, [power])} (ρ = ${DEFAULT_POWER_DENSITY} kg/m³, water, as the engine reads power columns; g = ${G0} m/s²): ` +
    `the efficiency it implies, ${fmtPctExact(eta, [1])}, is above 100 %, which no pump reaches — check the power column's unit (kW, W, hp) and the cell; this point is left out`;
}

/**
 * Why a curve's powers are implausibly large: the best efficiency they imply is below BEST_EFFICIENCY.min.
 * @param best the best implied efficiency, fraction @param column the power column's header
 */
export function implausiblePowerReason(best: number, column: string): string {
  return `the best efficiency this curve's powers imply, ρ·g·Q·H/P (ρ = ${DEFAULT_POWER_DENSITY} kg/m³), is ${fmtPctExact(best, [BEST_EFFICIENCY.min], best < 0.1 ? 2 : 1)}: ` +
    `below ${fmtPctLimit(BEST_EFFICIENCY.min)} — are the values in “${column}” in W rather than kW, or in another unit? Set the column's unit above, or correct the values ` +
    "(a centrifugal pump's best efficiency lies roughly between 20 and 92 %, common practice)";
}

/** 1 hp = 550 ft·lbf/s = 745.69987158227022 W (NIST SP 811, Appendix B): a power in hp read as kW reads this many times too high, inverted. */
export const HP_PER_KW = 745.6998715822702 / 1000;
/**
 * The power-unit signature of a curve (`power-efficiency`): at every point with flow whose efficiency and power are both given
 * (3 or more), the ratio of the efficiency the power implies (ρgQH/P) to the column's lies within HP_SPREAD of the ratios'
 * median, and the median within HP_NEAR of 0.7457 (the powers in hp under a kW header: 1.341× high) or of 1.341 (in kW under
 * an hp header: 0.746× low). Rounding of published η (a whole percent) and P (3 significant figures) moves a ratio by about
 * 2 % at η ≥ 30 % (common practice); a common factor of hp is no rounding. Any other disagreement is the 3-point warning
 * (`inconsistent`, at the point): a power with an allowance over the η column, or one mistyped point, is not a unit.
 */
export const HP_NEAR = 0.03;
export const HP_SPREAD = 0.05;

/**
 * Which unit mix-up a curve's implied-to-given efficiency ratios show: "hp-as-kW", "kW-as-hp", or null (see HP_NEAR).
 * @param ratios ρgQH/P ÷ the column's η at each point with flow where both are given (dimensionless)
 */
export function powerUnitSignature(ratios: readonly number[]): "hp-as-kW" | "kW-as-hp" | null {
  if (ratios.length < 3) return null;
  const sorted = [...ratios].sort((a, b) => a - b);
  const median = sorted.length % 2 ? sorted[(sorted.length - 1) / 2] : (sorted[sorted.length / 2 - 1] + sorted[sorted.length / 2]) / 2;
  if (!ratios.every((r) => Math.abs(r / median - 1) <= HP_SPREAD)) return null;
  if (Math.abs(median / HP_PER_KW - 1) <= HP_NEAR) return "hp-as-kW";
  if (Math.abs(median * HP_PER_KW - 1) <= HP_NEAR) return "kW-as-hp";
  return null;
}

/**
 * Why a point of a curve whose powers carry the hp factor against its efficiencies is refused: both cells, the efficiency the
 * power implies, the factor and the rule.
 * @param kind the signature @param cells the power and efficiency cells as written, and the columns' headers
 * @param p the point (SI: m³/s, m, W, fraction) @param implied ρgQH/P, fraction @param density kg/m³ @param n the points that show it (count)
 */
export function powerUnitReason(
  kind: "hp-as-kW" | "kW-as-hp",
  cells: { power: string; efficiency: string; powerColumn: string; effColumn: string },
  p: { flow: number; head: number; power: number; efficiency: number },
  implied: number, density: number, n: number,
): string {
  const hpAsKw = kind === "hp-as-kW";
  return `power “${cells.power.trim()}” in “${cells.powerColumn}” (read as ${qt("power", p.power)}) at ${qt("flow", p.flow)} and ${qt("head", p.head)} implies an efficiency ρ·g·Q·H/P = ${fmtPct(implied)} ` +
    `(ρ = ${qt("density", density)}, water, as the engine reads power columns), while the efficiency “${cells.efficiency.trim()}” in “${cells.effColumn}” on this row is ${fmtPct(p.efficiency)}: ` +
    `${(implied / p.efficiency).toFixed(3)} times it, and at all ${n} points of this curve with both one factor within ${fmtPctLimit(HP_NEAR)} of ${hpAsKw ? "0.746 (1 hp = 0.7457 kW)" : "1.341 (1 kW = 1.341 hp)"} — ` +
    `the powers are ${hpAsKw ? "in hp under a kW header, read 1.341× too high" : "in kW under an hp header, read 0.746× too low"}: set the column's unit to ${hpAsKw ? "hp" : "kW"} above, or correct the values; this point is left out`;
}
