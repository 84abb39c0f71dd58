/**
 * One curve's points in file order, as validate.ts collected them (pure): flow strictly increasing (flow-not-increasing,
 * duplicate-flow), the first head above zero and no zero head before a head above zero (zero), the head's shape (point-rules.ts,
 * engine headShape.ts: a rise beyond 5 % of the first head refused at its row — past 25 % above the first head, or again
 * after falling — head-rising; a drooping curve kept with a warning, drooping-curve; one peaking past the middle of its
 * flows refused as a whole, curve-rising), run-out points past zero head at the end dropped (run-out), a fraction written among
 * percents (efficiency-fraction, efficiency-fraction.ts), the best efficiency plausible (efficiency-implausible), η against
 * ρgQH/P (inconsistent), one power at every point (power-constant), at least 3 points (too-few-points), the maker's
 * minimum flow (min-flow) and a speed (no-speed). The accepted points go into the set.
 */
import type { CurvePoint, CurveSet } from "./curve-schema";
import { constantPowerReason, PowerRun } from "./constant-power";
import { fractionsAmongPercents } from "./efficiency-fraction";
import type { MinFlowCells } from "./min-flow";
import {
  BEST_EFFICIENCY, droopingReason, efficiencyPlausible, headRefusalReason, implausibleEfficiencyReason, implausiblePowerReason, importHeadShape,
  powerBelowHydraulicReason, powerEfficiency, powerUnitReason, powerUnitSignature, POWER_EFFICIENCY_MAX,
} from "./point-rules";
import type { HeadShape } from "../../engine/headShape.ts";
import type { Problem, ProblemCode } from "./types";
import type { Unit } from "./units-in-headers";
import { qt } from "../../engine/quantityText.ts"; // quantities in problem texts: rendered in the reader's units

/** The no-speed warning's words (its fix follows them); the tracer names it beside a curve traced without a speed. */
export const NO_SPEED_WARNING = "no speed given for this curve";
/**
 * Water at 20 °C, kg/m³ (from memory, 998.2; the demo data in fixtures/demo/FORMAT.md uses the same) and standard gravity, m/s² (3rd CGPM 1901, exact).
 * The importer's power checks are judged at the engine's DEFAULT_POWER_DENSITY (1000) instead, the density it reads power columns at.
 */
export const WATER_20C_DENSITY = 998.2;
export const G_STANDARD = 9.80665;
/** η from a row versus ρgQH/P: a gap above this (fraction, i.e. 3 points of efficiency) is flagged. */
export const CONSISTENCY_TOLERANCE = 0.03;

/** A curve being collected: its set, where it was written, its columns and its point rows in file order. */
export interface Building {
  set: CurveSet;
  run: number;
  firstLine: number;
  lastLine: number;
  flowColumn: string;
  /** The efficiency column's header and unit (for the best-efficiency check), or null without one. */
  effColumn: string | null;
  effUnit: Unit | null;
  /** The power column's header (for the constant-power check), or null without one. */
  powerColumn: string | null;
  /** effRaw, powerRaw: the efficiency and power cells as written (for efficiency-fraction's and power-below-hydraulic's messages). */
  rows: Array<{ line: number; point: CurvePoint; flowColumn: string; headColumn: string; effRaw?: string; powerRaw?: string; runOut?: Array<Omit<Problem, "curveKey">> }>;
}

export type AddProblem = (row: number, column: string | null, code: ProblemCode, reason: string, curve: string | null, severity?: "error" | "warning") => void;

/** Checks one curve's rows in order and puts the accepted points into `b.set` (and its maker's minimum flow, where it holds). */
export function checkCurve(b: Building, key: string, add: AddProblem, density: number, minFlows: MinFlowCells): void {
    let prev: { line: number; point: CurvePoint; raw?: string } | null = null;
  let shape: HeadShape | null = null; // the head's shape from the curve's first point (the engine's rule, point-rules.ts)
  let firstLine = 0;
  let best = -1; // best efficiency of the accepted points, and its line
  let bestLine = 0;
  let bestPower = -1; // best efficiency the accepted points' powers imply (ρgQH/P, point-rules.ts), and its line
  let bestPowerLine = 0;
  const powers = new PowerRun(); // the accepted points' powers: one figure at every point is a rating (constant-power.ts)
  // Flows written from high to low on every row (3 or more): the curve read in rising order, said once (flow-descending).
  if (b.rows.length >= 3 && b.rows.every((r, k) => k === 0 || r.point.flow < b.rows[k - 1].point.flow)) {
    const [hi, lo] = [b.rows[0], b.rows[b.rows.length - 1]];
    add(hi.line, hi.flowColumn, "flow-descending",
      `flow falls on every row of this curve, from ${qt("flow", hi.point.flow)} (line ${hi.line}) to ${qt("flow", lo.point.flow)} (line ${lo.line}): its points are read in rising order of flow, as a curve runs (no point changed)`, key, "warning");
    b.rows.reverse();
  }
  // Run-out: the trailing rows of a curve whose head went below zero are dropped with a warning;
  // a negative head followed by ordinary points is an error as before.
  let tail = b.rows.length;
  while (tail > 0 && b.rows[tail - 1].runOut) tail--;
  // a fraction written among percents (“0.72” beside 50, 70, 72): neither reading is taken (efficiency-fraction.ts)
  const fractions = fractionsAmongPercents(b.rows.filter((r) => !r.runOut).map((r) => ({ line: r.line, flow: r.point.flow, efficiency: r.point.efficiency, effRaw: r.effRaw })), b.effUnit);
  // A zero head with a head above zero on a later row: a pump's head reaches zero only at the curve's end (run-out). The zero
  // is refused at its own row; the rows after it are judged against the heads before it, never as rises over the zero.
  const aboveAfter: Array<number | null> = new Array(b.rows.length).fill(null);
  for (let k = b.rows.length - 2, next: number | null = null; k >= 0; k--) {
    const r = b.rows[k + 1];
    if (!r.runOut && r.point.head > 0) next = k + 1;
    aboveAfter[k] = next;
  }
  // ρgQH/P over the column's η at each point with flow and both: one hp factor at all of them is a unit mix-up (power-efficiency)
  const ratios = b.rows.flatMap((r) => {
    const q = r.point;
    return !r.runOut && !fractions.has(r.line) && q.flow > 0 && q.efficiency !== undefined && q.efficiency > 0 && q.power !== undefined
      ? [(density * G_STANDARD * q.flow * q.head) / q.power / q.efficiency] : [];
  });
  const unitMixUp = powerUnitSignature(ratios);
  for (let k = 0; k < b.rows.length; k++) {
    const r = b.rows[k];
    if (r.runOut) {
      if (k >= tail)
        add(r.line, r.headColumn, "run-out",
          `run-out point past zero head (head ${qt("head", r.point.head)}) at the end of the curve; dropped, the curve is kept`, key, "warning");
      else for (const p of r.runOut) add(p.row, p.column, p.code, p.reason, key);
      continue;
    }
    const fraction = fractions.get(r.line);
    if (fraction) {
      add(r.line, b.effColumn, "efficiency-fraction", fraction, key);
      continue;
    }
    const p = r.point;
    // a power below the hydraulic power ρgQH: an efficiency above 100 % (point-rules.ts), the point left out
    const powerEta = p.power !== undefined && p.flow > 0 ? powerEfficiency(p.flow, p.head, p.power) : -1;
    if (powerEta > POWER_EFFICIENCY_MAX) {
      add(r.line, b.powerColumn, "power-below-hydraulic", powerBelowHydraulicReason(r.powerRaw ?? String(p.power), p.flow, p.head, p.power!), key);
      continue;
    }
    // the powers carry the hp factor against the efficiencies at every point (point-rules.ts powerUnitSignature): each point left out
    const implied = p.efficiency !== undefined && p.efficiency > 0 && p.power !== undefined && p.flow > 0 ? (density * G_STANDARD * p.flow * p.head) / p.power : -1;
    if (unitMixUp && implied >= 0) {
      add(r.line, b.powerColumn, "power-efficiency", powerUnitReason(unitMixUp,
        { power: r.powerRaw ?? String(p.power), efficiency: r.effRaw ?? String(p.efficiency), powerColumn: b.powerColumn ?? "power", effColumn: b.effColumn ?? "efficiency" },
        { flow: p.flow, head: p.head, power: p.power!, efficiency: p.efficiency! }, implied, density, ratios.length), key);
      continue;
    }
    if (prev) {
      if (p.flow === prev.point.flow) {
        add(r.line, r.flowColumn, "duplicate-flow", `flow equals the flow on line ${prev.line}: a curve has one point per flow`, key);
        continue;
      }
      if (p.flow < prev.point.flow) {
        add(r.line, r.flowColumn, "flow-not-increasing", `flow is lower than on line ${prev.line}: flow must increase along a curve`, key);
        continue;
      }
      const later = aboveAfter[k];
      if (p.head === 0 && later !== null) {
        const n = b.rows[later];
        add(r.line, r.headColumn, "zero",
          `head ${qt("head", 0)} in the middle of the curve (line ${n.line} after it has head ${qt("head", n.point.head)}): a pump's head falls to zero only at the curve's end (run-out); this point is left out`, key);
        continue;
      }
      const refused = shape!.judge(p.head);
      if (refused) {
        // The rise and its limit each read apart from the other (qtExact/qtLimit, fmtPctExact), so a refused rise never reads as the limit.
        add(r.line, r.headColumn, "head-rising", headRefusalReason(refused, shape!), key);
        continue;
      }
      shape!.take(p.head, p.flow, r.line);
    } else if (!(p.head > 0)) {
      add(r.line, r.headColumn, "zero",
        `the curve's first point has head ${qt("head", p.head)}: a pump curve starts above zero head; this point is left out (the next one is the first)`, key);
      continue;
    } else {
      shape = importHeadShape(p.head, p.flow, r.line);
      firstLine = r.line;
    }
    b.set.points.push(p);
    if (p.power !== undefined) powers.add(p.flow, p.power, r.line);
    if (powerEta > bestPower) {
      bestPower = powerEta;
      bestPowerLine = r.line;
    }
    prev = r;
    if (p.efficiency !== undefined && p.efficiency > best) {
      best = p.efficiency;
      bestLine = r.line;
    }
    // Consistency (definition of pump efficiency, η = ρgQH/P): only when all four are given and Q, P > 0 (a unit mix-up across the curve is an error above).
    if (implied > 0 && Math.abs(implied - p.efficiency!) > CONSISTENCY_TOLERANCE)
      add(r.line, b.effColumn, "inconsistent",
        `efficiency ${fmt(p.efficiency! * 100)} % does not agree with ρgQH/P = ${fmt(implied * 100)} % from power “${(r.powerRaw ?? String(p.power)).trim()}” at ${qt("flow", p.flow)} and ${qt("head", p.head)} ` +
        `(ρ = ${qt("density", density)}, water, as the engine reads power columns): more than ${CONSISTENCY_TOLERANCE * 100} points apart — check the power and efficiency columns and their units`,
        key, "warning");
  }
  if (shape) {
    // the whole curve's shape: a rise beyond the allowance peaking past the middle of its flows (curve-rising), else drooping
    const whole = shape.end();
    const headColumn = b.rows.find((r) => r.line === shape!.peakAt)?.headColumn ?? null;
    if (whole) add(shape.peakAt, headColumn, "curve-rising", headRefusalReason(whole, shape), key);
    else if (shape.drooping) add(shape.peakAt, headColumn, "drooping-curve", droopingReason(shape, firstLine), key, "warning");
  }
  if (best > 0 && !efficiencyPlausible(best))
    add(bestLine, b.effColumn, "efficiency-implausible", implausibleEfficiencyReason(best, b.effUnit, b.effColumn ?? "efficiency"), key);
  if (bestPower > 0 && bestPower < BEST_EFFICIENCY.min * (1 - 1e-9))
    add(bestPowerLine, b.powerColumn, "power-implausible", implausiblePowerReason(bestPower, b.powerColumn ?? "power"), key);
  if (powers.flat())
    add(powers.firstLine, b.powerColumn, "power-constant", constantPowerReason(powers, key, b.powerColumn ?? "power"), key, "warning");
  if (b.set.points.length < 3)
    add(b.firstLine, b.flowColumn, "too-few-points", `curve has ${b.set.points.length} good point(s); at least 3 are needed`, key);
  for (const p of minFlows.judge(key, b.set)) add(p.row, p.column, p.code, p.reason, key, p.severity); // sets b.set.minFlow where the figure holds
  if (b.set.speed === null)
    add(b.firstLine, null, "no-speed", `${NO_SPEED_WARNING}; map a speed column or set a default speed`, key, "warning");
}

function fmt(x: number): string {
  return String(Math.round(x * 1000) / 1000);
}
