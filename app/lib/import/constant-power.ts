/**
 * A power column that holds one figure at every point of a curve: a motor rating written on every row (the motor's size),
 * not the pump's shaft power at each point. The header words (input-power.ts, rated-power.ts) catch the ratings their
 * headers name; this looks at the values, whatever the header. Pure; both paths (validate.ts names it, fast.ts steps aside).
 *
 * Rule: a curve set whose accepted points carry a power at CONSTANT_POWER.minPoints points or more, all within
 * CONSTANT_POWER.spread of the largest of them, over a flow span (largest flow with a power less the smallest) of at least
 * CONSTANT_POWER.flowSpan of that largest flow, gets a `power-constant` warning on its first point with a power, in the power
 * column. Flow rises along every accepted curve (flow-not-increasing refuses the rest), so the span is a span of rising flow.
 *
 * A warning, not an error: the curve is imported (the user may keep a curve the vendor rounded flat) and the warning says
 * what to do if it is a rating. Not an error, because values written to 2 significant figures (7.5 kW) cannot tell a rating
 * from a real curve flat to within ±0.7 % over the span (near the peak of a mixed-flow pump's non-overloading power curve),
 * and an error would keep such a curve out with no way to import it but editing the file.
 *
 * Thresholds:
 * - spread 0.05 %: half the smallest step of the third significant figure (one unit there is 0.1–1 % of the value), so
 *   powers that differ when written to 3 significant figures (7.50 and 7.51) are never taken as one figure, while a rating
 *   written with more digits on some rows (7.5 and 7.502) or converted with float noise is.
 * - flow span 30 % of the largest flow: a radial centrifugal pump's shaft power rises with flow from about half its BEP
 *   value at shutoff (common practice), 15 % of the BEP power or more over 30 % of the flow, hundreds of times the
 *   spread allowed; a short span (a curve traced or tabled near its BEP only, or near the peak of a flat power curve) may be
 *   flat within rounding, so it is not flagged.
 * - 3 points: the importer's smallest curve (too-few-points); two points are equal by chance too easily.
 */
import { fmtPctExact, fmtPctLimit, qt, qtExact } from "../../engine/quantityText.ts";
import { curveNameOfKey } from "./names";

export const CONSTANT_POWER = { minPoints: 3, spread: 5e-4, flowSpan: 0.3 } as const;

/**
 * True when `count` powers between `min` and `max` (W) at flows from `firstFlow` to `lastFlow` (m³/s, rising) make the
 * rule's constant power (a relative 1e-9 on the span absorbs the unit conversion: 70 to 100 m³/h is 30 % exactly).
 */
export function looksLikeRating(count: number, min: number, max: number, firstFlow: number, lastFlow: number): boolean {
  return (
    count >= CONSTANT_POWER.minPoints &&
    max > 0 &&
    max - min <= CONSTANT_POWER.spread * max &&
    lastFlow > 0 &&
    lastFlow - firstFlow >= CONSTANT_POWER.flowSpan * lastFlow * (1 - 1e-9)
  );
}

/** A curve's powers as its accepted points give them, in flow order: add each, then ask `flat()`. */
export class PowerRun {
  count = 0;
  min = Infinity;
  max = -Infinity;
  firstFlow = NaN;
  lastFlow = NaN;
  /** Source line of the first point with a power (where the warning goes), 0 before one. */
  firstLine = 0;

  add(flow: number, power: number, line: number): void {
    if (this.count++ === 0) {
      this.firstFlow = flow;
      this.firstLine = line;
    }
    this.lastFlow = flow;
    if (power < this.min) this.min = power;
    if (power > this.max) this.max = power;
  }

  flat(): boolean {
    return looksLikeRating(this.count, this.min, this.max, this.firstFlow, this.lastFlow);
  }
}

/**
 * The warning for a flat run, with its numbers and the rule, e.g. "“P2 (kW)” reads 7.5 kW at all 7 points of Model · 2900 rpm
 * (flow 0 to 60 m³/h, 100.0 % of its largest flow): …".
 */
export function constantPowerReason(run: PowerRun, key: string, column: string): string {
  const power = run.min === run.max ? qt("power", run.max) : `${qtExact("power", run.min, [run.max])} to ${qtExact("power", run.max, [run.min])}`; // read apart
  const span = (run.lastFlow - run.firstFlow) / run.lastFlow;
  return (
    `“${column}” reads ${power} at all ${run.count} points of ${curveNameOfKey(key)} (flow ${qt("flow", run.firstFlow)} to ` +
    `${qt("flow", run.lastFlow)}, ${fmtPctExact(span, [CONSTANT_POWER.flowSpan])} of its largest flow): a shaft power rises with flow on a ` +
    `centrifugal pump (common practice), so one figure at every point looks like a motor rating (the motor's size, written on ` +
    `every row), not the pump's shaft power at each point. Rule: the same power (within ${fmtPctLimit(CONSTANT_POWER.spread)}) at ` +
    `${CONSTANT_POWER.minPoints} points or more over at least ${fmtPctLimit(CONSTANT_POWER.flowSpan)} of the curve's largest flow. ` +
    `If it is a rating, set the column to “— ignore —” (API: field "ignore"): read as shaft power, the motor suggested, the ` +
    `overload check and the efficiency checks would all rest on it; keep it only if the pump's power really is this flat.`
  );
}
