/**
 * Mapped rows → curve sets in SI, with every bad row named (source line, column header, reason).
 * Pure.
 *
 * Rules (see README.md):
 * - numeric cells must read as numbers (not-a-number) and not be negative (negative);
 *   speed and impeller diameter must be above zero (zero);
 * - flow and head are required on a point row (missing-value); the model is required (missing-model);
 *   speed and impeller diameter are optional: a blank cell is "not given" for its set, unless the rows
 *   next to it make it a break in a curve that has one (missing-value, blank-keys.ts);
 * - efficiency must not exceed 100 % (efficiency-over-100);
 * - the engine's point rules (point-rules.ts): efficiency above zero where flow is above zero, power and
 *   NPSHr above zero (zero); a power or NPSHr of 0 at shutoff (zero flow) is left out of its point with
 *   a warning (zero-dropped), the point kept;
 * - within a curve, in file order: flow must increase (flow-not-increasing; an equal flow is
 *   duplicate-flow); the first point's head must be above zero (zero, named once: the next point is
 *   then the first); the head's shape (engine headShape.ts, point-rules.ts) with a 5 % rounding allowance
 *   (tighter than the engine's 10 %): falling, or drooping — rising from shut-off to one peak at most 25 %
 *   above it, then falling — kept with a warning (drooping-curve); a head more than 25 % above the first or
 *   rising again after falling is refused at its row (head-rising), a curve whose highest head lies past the
 *   middle of its flows (rising along most of its length: a system curve, swapped columns) as a whole
 *   (curve-rising, kept out under either policy);
 * - in a column read in percent, an efficiency below 1 % at a tenth of the curve's best-efficiency flow or more, on a
 *   curve whose best is 10 % or more, is a fraction among percents (efficiency-fraction, efficiency-fraction.ts);
 * - a curve's best efficiency must lie within 5–95 % (efficiency-implausible: a column in fractions read
 *   as percent, or the reverse); it keeps the curve out under either policy;
 * - a curve needs at least 3 good points (too-few-points);
 * - the same (model, speed, impeller) appearing again after other rows, or from another column
 *   block, is a duplicate (duplicate-curve): the first occurrence is kept, the repeat dropped;
 * - a curve set without speed gets a warning (no-speed);
 * - a power the same at every point over 30 % of the flow or more is a warning (power-constant: a motor rating, constant-power.ts);
 * - an NPSHr above zero and below 0.1 m is a warning at its row (npshr-small, point-rules.ts), the point kept with it;
 * - a maker's minimum flow: one figure per curve, above zero, below its last published flow (min-flow, min-flow.ts).
 * A point with an error is left out of its curve; any error charged to a curve marks it ok: false.
 */
import type { CurvePoint, CurveSet } from "./curve-schema";
import type { Cell, LongRow } from "./mapping";
import { parseNumber, strayInnerSpace, underflows } from "./numbers";
import { NPSHR_SMALL, npshrSmallReason } from "./point-rules";
import type { Problem, ProblemCode } from "./types";
import { SI_FACTOR, type NumericField, type Unit } from "./units-in-headers";
import { hasLineBreak, textCell } from "./text-cells";
import { besideReason, blankKeyRuns, rowModel, type KeyColumn } from "./blank-keys";
import { MinFlowCells } from "./min-flow";
import { strayKeyProblems, type KeyRun } from "./stray-keys";
import { checkCurve, type Building } from "./curve-sequence";
import { DEFAULT_POWER_DENSITY } from "../../engine/pumpCurve.ts";
import { qt } from "../../engine/quantityText.ts"; // quantities in problem texts: rendered in the reader's units

// The output schemas (the service re-checks before it writes) live in curve-schema.ts.
export { CurvePointSchema, CurveSetSchema, type CurvePoint, type CurveSet } from "./curve-schema";
// The per-curve checks and their constants live in curve-sequence.ts.
export { CONSISTENCY_TOLERANCE, G_STANDARD, NO_SPEED_WARNING, WATER_20C_DENSITY } from "./curve-sequence";


export interface ValidationStats {
  /** Point rows read (one per row in the long layout, one per row and block in the wide layout). */
  pointRows: number;
  pointsAccepted: number;
  curveSets: number;
  curveSetsOk: number;
  errors: number;
  warnings: number;
}

export interface ValidationResult {
  /** Every curve set found, in file order; ok: false when any error was charged to it. */
  curveSets: CurveSet[];
  /** Sorted by source row (stable: problems of one row keep the order they were found in). */
  problems: Problem[];
  stats: ValidationStats;
}

/** Stable key of a curve set: "model|speed rpm|impeller mm" (empty parts when not given). */
export function curveKey(model: string, speed: number | null, impellerM: number | null): string {
  const mm = impellerM === null ? "" : String(Math.round(impellerM * 1e6) / 1e3);
  return `${model}|${speed ?? ""}|${mm}`;
}

const FIELD_LABEL: Record<NumericField, string> = {
  speed: "speed", impeller: "impeller diameter", flow: "flow", head: "head", efficiency: "efficiency", power: "power", npshr: "NPSHr", minflow: "maker's minimum flow",
};


export type Policy = "skip-curves" | "drop-points";

export interface ValidateOptions {
  decimalComma: boolean;
  /** Line of the header row; file-wide problems are reported there. */
  headerLine: number;
  /**
   * skip-curves (default): any error charged to a curve keeps the whole curve out.
   * drop-points: a curve is imported when it keeps at least 3 good points; the bad ones are dropped and listed.
   */
  policy?: Policy;
  /** Fluid density for the η = ρgQH/P consistency checks, kg/m³ (default: 1000, the engine's DEFAULT_POWER_DENSITY, which it reads power columns at). */
  density?: number;
}


export function validateLongRows(rows: LongRow[], opts: ValidateOptions): ValidationResult {
  const problems: Problem[] = [];
  const density = opts.density ?? DEFAULT_POWER_DENSITY;
  const curves = new Map<string, Building>();
  const order: string[] = [];
  const lastKeyInBlock = new Map<number, string>();
  const runOfBlock = new Map<number, number>();
  const discardedRuns = new Set<number>();
  let runCounter = 0;
  const keyRuns: KeyRun[] = []; // each block's runs of one key in file order: a key differing on a row or two is named (stray-keys.ts)
  const keyRunOfBlock = new Map<number, KeyRun>();

  const add = (row: number, column: string | null, code: ProblemCode, reason: string, curve: string | null, severity: "error" | "warning" = "error") =>
    problems.push({ row, column, reason, severity, code, curveKey: curve });

  const { splits, beside } = blankKeyRuns(rows, opts.decimalComma);
  const folded = new Set<string>(); // curves whose model cell was folded onto one line (said once each)
  const minFlows = new MinFlowCells(opts.decimalComma); // one figure per curve, judged once its points are known
  for (let ri = 0; ri < rows.length; ri++) {
    const lr = rows[ri];
    const rowProblems: Array<Omit<Problem, "curveKey">> = [];
    const negatives: Partial<Record<"head" | "power" | "efficiency", number>> = {};
    const bad = (column: string | null, code: ProblemCode, reason: string) =>
      rowProblems.push({ row: lr.line, column, reason, severity: "error", code });
    if (lr.shifted) bad(lr.shiftedColumn ?? null, "extra-cells", lr.shifted); // numbers beyond the header, or spilt into an unnamed column: its cells moved (shifted-cells.ts)

    const num = (field: NumericField, required: boolean): number | null | undefined => {
      const cell: Cell | undefined = lr.cells[field];
      if (!cell || cell.raw.trim() === "") {
        if (required) bad(cell?.column ?? null, "missing-value", `${FIELD_LABEL[field]} is empty`);
        return undefined;
      }
      let value: number;
      if (cell.preset !== undefined) value = cell.preset;
      else {
        // Hot path (one call per cell of 100 000-row files): plain checks rather than a valibot
        // pipeline per cell; the curve sets built from them are re-checked with CurveSetSchema.
        const x = parseNumber(cell.raw, opts.decimalComma);
        const positive = field === "speed" || field === "impeller";
        const code = Number.isNaN(x) ? "not-a-number" : x < 0 ? "negative" : positive && x === 0 ? "zero" : null;
        if (code) {
          const what = code === "not-a-number"
            ? underflows(cell.raw, opts.decimalComma) ? "is out of range: too small to be stored (it would read as 0); write 0 if zero is meant"
              : strayInnerSpace(cell.raw) ? "is not a number: a space inside a number only groups thousands in threes (1 450), so this one is not dropped — correct the cell" : "is not a number"
            : code === "negative" ? "is negative" : "must be greater than zero";
          bad(cell.column, code, `${FIELD_LABEL[field]} “${cell.raw.trim()}” ${what}`);
          // Head and power below zero may be a run-out point past zero head: kept aside for the curve check.
          if (code === "negative" && (field === "head" || field === "power" || field === "efficiency")) negatives[field] = x * (SI_FACTOR[field][cell.unit as Unit] ?? NaN);
          return null;
        }
        value = x;
      }
      const factor = SI_FACTOR[field][cell.unit as Unit];
      if (factor === undefined) {
        bad(cell.column, "not-a-number", `unit ${cell.unit ?? "(none)"} does not fit ${FIELD_LABEL[field]}`);
        return null;
      }
      const si = value * factor;
      // Overflowing text ("1e309", or 1e308 kW once in watts) would reach the database as ±Infinity; said before the efficiency's
      // limit, so "1e309" is named as written, not as "Infinity %".
      if (!Number.isFinite(si) || Math.abs(si) > 1e12) {
        bad(cell.column, "not-a-number", `${FIELD_LABEL[field]} “${cell.raw.trim()}” is too large to be a real value`);
        return null;
      }
      if (field === "efficiency" && si > 1 + 1e-9) {
        bad(cell.column, "efficiency-over-100",
          cell.unit === "%" ? `efficiency ${value} % is above 100 %` : `efficiency ${value} is above 1 (100 %) — is the column in percent?`);
        return null;
      }
      return si;
    };

    const modelCell = lr.cells.model;
    // Text cells as written: our CSV writer's formula defusing undone (text-cells.ts); a default typed on the mapping page is kept as typed.
    const model = rowModel(lr);
    if (modelCell && !model) bad(modelCell.column, "missing-model", "model is empty");
    // A blank cell in a mapped speed or diameter column is "not given" for its set, unless the rows next to it
    // make it a break in a curve that has one (blank-keys.ts): that would split the curve, so it is an error
    // charged to the curve above, naming the row that has the value, with the ways out.
    const split = splits.get(ri);
    const blankKey = (field: KeyColumn) => {
      const s = split?.[field];
      if (!s) return false;
      const other = field === "speed" ? "impeller diameter" : "speed";
      bad(lr.cells[field]!.column, "missing-value",
        `${FIELD_LABEL[field]} is empty, but line ${s.line} ${s.where} it (same model${s.otherBlank ? `, ${other} blank here too` : ` and ${other}`}) has ${s.raw}: ` +
        `the rows of one curve all give it or none does, so a blank here would split that curve; tick “fill blank key cells from the row above”${field === "speed" ? " or set a speed for blank cells" : ""}, or fill it in`);
      return true;
    };
    const speedBlank = blankKey("speed");
    const impellerBlank = blankKey("impeller");
    const speed = speedBlank ? null : num("speed", false);
    const impeller = impellerBlank ? null : num("impeller", false);
    const flow = num("flow", true);
    const head = num("head", true);
    const efficiency = num("efficiency", false);
    const power = num("power", false);
    const npshr = num("npshr", false);
    // The engine's point rules: efficiency above zero where flow is above zero; power and NPSHr above zero,
    // except that a 0 at shutoff (zero flow, common in vendor exports) is only left out of the point.
    const dropped: Array<"power" | "npshr"> = [];
    if (flow != null) {
      if (efficiency === 0 && flow > 0)
        bad(lr.cells.efficiency!.column, "zero", "efficiency is 0 at a flow above zero: a pump that delivers flow has an efficiency above zero — correct the cell, or leave it blank");
      for (const f of ["power", "npshr"] as const) {
        if ((f === "power" ? power : npshr) !== 0) continue;
        if (flow === 0) dropped.push(f);
        else bad(lr.cells[f]!.column, "zero", `${FIELD_LABEL[f]} is 0 at a flow above zero: it must be above zero — correct the cell, or leave it blank`);
      }
    }

    // Which curve does this row belong to? When its own key cells are unreadable, charge it to the
    // curve of the row above in the same block, so that curve is not imported silently short of a point.
    const keyReadable = model !== "" && speed !== null && impeller !== null;
    if (!keyReadable) {
      const charged = lastKeyInBlock.get(lr.block) ?? null;
      for (const p of rowProblems) add(p.row, p.column, p.code, p.reason, charged);
      continue;
    }
    const key = curveKey(model, speed ?? null, impeller ?? null);
    const aside = beside.get(ri); // blank key cells read as a set of their own beside a curve that has the value (blank-keys.ts)
    for (const f of ["speed", "impeller"] as const) if (aside?.[f]) add(lr.line, lr.cells[f]!.column, "key-not-given", besideReason(aside[f]!, f), key, "warning");
    if (lastKeyInBlock.get(lr.block) !== key) {
      runOfBlock.set(lr.block, ++runCounter);
      lastKeyInBlock.set(lr.block, key);
      const kr: KeyRun = { block: lr.block, key, model, speed: speed ?? null, impeller: impeller ?? null, rows: [] };
      keyRuns.push(kr);
      keyRunOfBlock.set(lr.block, kr);
    }
    keyRunOfBlock.get(lr.block)!.rows.push({ line: lr.line, flow: flow ?? null, speed: lr.cells.speed, impeller: lr.cells.impeller });
    const run = runOfBlock.get(lr.block)!;
    if (discardedRuns.has(run)) continue;

    let b = curves.get(key);
    if (b && b.run !== run) {
      discardedRuns.add(run);
      add(lr.line, modelCell?.column ?? null, "duplicate-curve",
        `${model} at ${speed ?? "?"} rpm${impeller ? `, impeller ${qt("diameter", impeller)}` : ""} already appears on lines ${b.firstLine}–${b.lastLine}; this repeat was skipped`, key);
      continue;
    }
    if (!b) {
      b = {
        set: { key, model, speed: speed ?? null, impellerDiameter: impeller ?? null, points: [], sourceRows: [], ok: true },
        run,
        firstLine: lr.line,
        lastLine: lr.line,
        flowColumn: lr.cells.flow?.column ?? "flow",
        effColumn: lr.cells.efficiency?.column ?? null,
        effUnit: lr.cells.efficiency?.unit ?? null,
        powerColumn: lr.cells.power?.column ?? null,
        rows: [],
      };
      curves.set(key, b);
      order.push(key);
    }
    // A model cell on two lines ("Pump⏎X", quoted) is read on one ("Pump X"): said once per curve, at its first such row.
    if (modelCell && modelCell.column !== "(default)" && hasLineBreak(modelCell.raw.trim()) && !folded.has(key)) {
      folded.add(key);
      add(lr.line, modelCell.column, "model-line-break",
        `model “${modelCell.raw.trim().replace(/\r?\n|\r/g, "⏎")}” is written on more than one line; a model name is one line, so it is read “${model}” (each line break a space), here and on this curve's other rows`, key, "warning");
    }
    b.lastLine = lr.line;
    b.set.sourceRows.push(lr.line);
    if (!lr.shifted) minFlows.add(key, lr); // a row whose cells moved gives no figure (shifted-cells.ts)
    for (const f of ["type", "size", "notes"] as const) {
      const cell = lr.cells[f];
      const t = cell ? textCell(cell.raw) : undefined;
      if (t && b.set[f] === undefined) b.set[f] = t;
    }
    const runOut =
      rowProblems.length > 0 && negatives.head !== undefined && flow != null && rowProblems.every((p) => p.code === "negative");
    if (runOut) {
      const point: CurvePoint = { flow: flow!, head: negatives.head! };
      b.rows.push({ line: lr.line, point, flowColumn: lr.cells.flow!.column, headColumn: lr.cells.head!.column, runOut: rowProblems });
      continue;
    }
    for (const p of rowProblems) add(p.row, p.column, p.code, p.reason, key);
    if (rowProblems.length) continue;

    const point: CurvePoint = { flow: flow!, head: head! };
    if (efficiency != null) point.efficiency = efficiency;
    if (power != null && !dropped.includes("power")) point.power = power;
    if (npshr != null && !dropped.includes("npshr")) point.npshr = npshr;
    if (point.npshr !== undefined && point.npshr < NPSHR_SMALL)
      add(lr.line, lr.cells.npshr!.column, "npshr-small", npshrSmallReason(lr.cells.npshr!.raw, point.npshr, flow ?? null), key, "warning");
    for (const f of dropped)
      add(lr.line, lr.cells[f]!.column, "zero-dropped",
        `${FIELD_LABEL[f]} 0 at shutoff (zero flow) left out: ${f === "power" ? "shaft power" : "NPSHr"} is above zero on a pump curve; the point is kept without it`, key, "warning");
    b.rows.push({ line: lr.line, point, flowColumn: lr.cells.flow!.column, headColumn: lr.cells.head!.column, effRaw: lr.cells.efficiency?.raw, powerRaw: lr.cells.power?.raw });
  }

  const strayCurves = new Set<string>(); // runs of 3 rows or more read as a mistyped key (stray-keys.ts): kept out under either policy
  for (const p of strayKeyProblems(keyRuns)) {
    add(p.row, p.column, p.code, p.reason, p.curveKey);
    if (p.own) strayCurves.add(p.curveKey);
  }
  // per-curve sequence checks (curve-sequence.ts)
  const curveSets: CurveSet[] = [];
  for (const key of order) {
    const b = curves.get(key)!;
    checkCurve(b, key, add, density, minFlows);
    curveSets.push(b.set);
  }

  const policy = opts.policy ?? "skip-curves";
  // skip-curves: any error charged to a curve keeps it out. drop-points: only a curve left with
  // fewer than 3 good points, or whose best efficiency or maker's minimum flow is wrong (no point to drop: the column's
  // unit or values are wrong), or that rises along most of its length (curve-rising: the curve is wrong), is kept out (the later copy of a duplicate is never built).
  const setWide = (code: ProblemCode) => code === "too-few-points" || code === "efficiency-implausible" || code === "power-implausible" || code === "min-flow" || code === "curve-rising";
  const badKeys = new Set(
    problems.filter((p) => p.severity === "error" && p.curveKey && (policy === "skip-curves" || setWide(p.code) || strayCurves.has(p.curveKey))).map((p) => p.curveKey!),
  );
  for (const c of curveSets) c.ok = !badKeys.has(c.key);
  problems.sort((a, b) => a.row - b.row);
  const errors = problems.filter((p) => p.severity === "error").length;
  return {
    curveSets,
    problems,
    stats: {
      pointRows: rows.length,
      pointsAccepted: curveSets.reduce((n, c) => n + c.points.length, 0),
      curveSets: curveSets.length,
      curveSetsOk: curveSets.filter((c) => c.ok).length,
      errors,
      warnings: problems.length - errors,
    },
  };
}
