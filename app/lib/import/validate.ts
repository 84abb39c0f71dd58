/**
 * Mapped rows → curve sets in SI, with every bad row named (source line, column header, reason).
 * Pure: valibot only.
 *
 * Rules (see README.md):
 * - numeric cells must read as numbers (not-a-number) and not be negative (negative);
 *   speed and impeller diameter must be above zero (zero);
 * - flow and head are required on a point row (missing-value); the model is required (missing-model);
 * - efficiency must not exceed 100 % (efficiency-over-100);
 * - within a curve, in file order: flow must increase (flow-not-increasing; an equal flow is
 *   duplicate-flow), and head may rise from one point to the next by at most 5 % of the curve's
 *   shutoff head (head of its first point) — this lets through the slight droop/hump near shutoff
 *   and rounding in exports, and catches swapped or mistyped values (head-rising);
 * - a curve needs at least 3 good points (too-few-points);
 * - the same (model, speed, impeller) appearing again after other rows, or from another column
 *   block, is a duplicate (duplicate-curve): the first occurrence is kept, the repeat dropped;
 * - a curve set without speed gets a warning (no-speed).
 * A point with an error is left out of its curve; any error charged to a curve marks it ok: false.
 */
import * as v from "valibot";
import type { Cell, LongRow } from "./mapping";
import { parseNumber } from "./numbers";
import type { Problem, ProblemCode } from "./types";
import { SI_FACTOR, type NumericField, type Unit } from "./units-in-headers";
import { qt } from "../../engine/quantityText.ts"; // quantities in problem texts: rendered in the reader's units

// ---------- output schemas (exported so the service can re-check before it writes) ----------

const NonNegative = v.pipe(v.number(), v.finite(), v.minValue(0));
const PositiveOrNull = v.nullable(v.pipe(v.number(), v.finite(), v.gtValue(0)));

export const CurvePointSchema = v.object({
  flow: NonNegative, // m³/s
  head: NonNegative, // m
  efficiency: v.optional(v.pipe(v.number(), v.finite(), v.minValue(0), v.maxValue(1))), // 0..1
  power: v.optional(NonNegative), // W
  npshr: v.optional(NonNegative), // m
});

export const CurveSetSchema = v.pipe(
  v.object({
    key: v.string(),
    model: v.pipe(v.string(), v.trim(), v.nonEmpty()),
    speed: PositiveOrNull, // rpm
    impellerDiameter: PositiveOrNull, // m
    type: v.optional(v.string()),
    size: v.optional(v.string()),
    notes: v.optional(v.string()),
    points: v.pipe(v.array(CurvePointSchema), v.minLength(3)),
    sourceRows: v.array(v.pipe(v.number(), v.integer(), v.minValue(1))),
    ok: v.boolean(),
  }),
  v.check((c) => c.points.every((p, i) => i === 0 || p.flow > c.points[i - 1].flow), "flow must increase"),
);

export type CurvePoint = v.InferOutput<typeof CurvePointSchema>;
export type CurveSet = v.InferOutput<typeof CurveSetSchema>;

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
  speed: "speed",
  impeller: "impeller diameter",
  flow: "flow",
  head: "head",
  efficiency: "efficiency",
  power: "power",
  npshr: "NPSHr",
};

interface Building {
  set: CurveSet;
  run: number;
  firstLine: number;
  lastLine: number;
  flowColumn: string;
  rows: Array<{ line: number; point: CurvePoint; flowColumn: string; headColumn: string; runOut?: Array<Omit<Problem, "curveKey">> }>;
}

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
  /** Fluid density for the η = ρgQH/P consistency check, kg/m³ (default: water at 20 °C, 998.2). */
  density?: number;
}

/** Water at 20 °C, kg/m³ (from memory, 998.2; the demo data in fixtures/demo/FORMAT.md uses the same) and standard gravity, m/s² (3rd CGPM 1901, exact). */
export const WATER_20C_DENSITY = 998.2;
export const G_STANDARD = 9.80665;
/** η from a row versus ρgQH/P: a gap above this (fraction, i.e. 3 points of efficiency) is flagged. */
export const CONSISTENCY_TOLERANCE = 0.03;

export function validateLongRows(rows: LongRow[], opts: ValidateOptions): ValidationResult {
  const problems: Problem[] = [];
  const density = opts.density ?? WATER_20C_DENSITY;
  const curves = new Map<string, Building>();
  const order: string[] = [];
  const lastKeyInBlock = new Map<number, string>();
  const runOfBlock = new Map<number, number>();
  const discardedRuns = new Set<number>();
  let runCounter = 0;

  const add = (row: number, column: string | null, code: ProblemCode, reason: string, curve: string | null, severity: "error" | "warning" = "error") =>
    problems.push({ row, column, reason, severity, code, curveKey: curve });

  for (const lr of rows) {
    const rowProblems: Array<Omit<Problem, "curveKey">> = [];
    const negatives: Partial<Record<"head" | "power" | "efficiency", number>> = {};
    const bad = (column: string | null, code: ProblemCode, reason: string) =>
      rowProblems.push({ row: lr.line, column, reason, severity: "error", code });

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
          const what = code === "not-a-number" ? "is not a number" : code === "negative" ? "is negative" : "must be greater than zero";
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
      if (field === "efficiency" && value * factor > 1 + 1e-9) {
        bad(cell.column, "efficiency-over-100",
          cell.unit === "%" ? `efficiency ${value} % is above 100 %` : `efficiency ${value} is above 1 (100 %) — is the column in percent?`);
        return null;
      }
      const si = value * factor;
      // Overflowing text ("1e309", or 1e308 kW once in watts) would reach the database as ±Infinity.
      if (!Number.isFinite(si) || Math.abs(si) > 1e12) {
        bad(cell.column, "not-a-number", `${FIELD_LABEL[field]} “${cell.raw.trim()}” is too large to be a real value`);
        return null;
      }
      return si;
    };

    const modelCell = lr.cells.model;
    const model = modelCell?.raw.trim() ?? "";
    if (modelCell && !model) bad(modelCell.column, "missing-model", "model is empty");
    // A blank cell in a mapped speed or diameter column would start a new curve without that value
    // (splitting the curve): it is an error charged to the curve above, with the two ways out.
    const blankKey = (field: "speed" | "impeller") => {
      const cell = lr.cells[field];
      if (!cell || cell.preset !== undefined || cell.raw.trim() !== "") return false;
      bad(cell.column, "missing-value",
        `${FIELD_LABEL[field]} is empty; tick “fill blank key cells from the row above”${field === "speed" ? " or set a speed for blank cells" : ""}, or fill it in`);
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

    // Which curve does this row belong to? When its own key cells are unreadable, charge it to the
    // curve of the row above in the same block, so that curve is not imported silently short of a point.
    const keyReadable = model !== "" && speed !== null && impeller !== null;
    if (!keyReadable) {
      const charged = lastKeyInBlock.get(lr.block) ?? null;
      for (const p of rowProblems) add(p.row, p.column, p.code, p.reason, charged);
      continue;
    }
    const key = curveKey(model, speed ?? null, impeller ?? null);
    if (lastKeyInBlock.get(lr.block) !== key) {
      runOfBlock.set(lr.block, ++runCounter);
      lastKeyInBlock.set(lr.block, key);
    }
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
        rows: [],
      };
      curves.set(key, b);
      order.push(key);
    }
    b.lastLine = lr.line;
    b.set.sourceRows.push(lr.line);
    for (const f of ["type", "size", "notes"] as const) {
      const t = lr.cells[f]?.raw.trim();
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
    if (power != null) point.power = power;
    if (npshr != null) point.npshr = npshr;
    b.rows.push({ line: lr.line, point, flowColumn: lr.cells.flow!.column, headColumn: lr.cells.head!.column });
  }

  // per-curve sequence checks
  const curveSets: CurveSet[] = [];
  for (const key of order) {
    const b = curves.get(key)!;
    let prev: { line: number; point: CurvePoint; raw?: string } | null = null;
    let shutoff = 0;
    // Run-out: the trailing rows of a curve whose head went below zero are dropped with a warning;
    // a negative head followed by ordinary points is an error as before.
    let tail = b.rows.length;
    while (tail > 0 && b.rows[tail - 1].runOut) tail--;
    for (let k = 0; k < b.rows.length; k++) {
      const r = b.rows[k];
      if (r.runOut) {
        if (k >= tail)
          add(r.line, r.headColumn, "run-out",
            `run-out point past zero head (head ${qt("head", r.point.head)}) at the end of the curve; dropped, the curve is kept`, key, "warning");
        else for (const p of r.runOut) add(p.row, p.column, p.code, p.reason, key);
        continue;
      }
      const p = r.point;
      if (prev) {
        if (p.flow === prev.point.flow) {
          add(r.line, r.flowColumn, "duplicate-flow", `flow equals the flow on line ${prev.line}: a curve has one point per flow`, key);
          continue;
        }
        if (p.flow < prev.point.flow) {
          add(r.line, r.flowColumn, "flow-not-increasing", `flow is lower than on line ${prev.line}: flow must increase along a curve`, key);
          continue;
        }
        const rise = p.head - prev.point.head;
        if (rise > 0.05 * shutoff + 1e-12) {
          add(r.line, r.headColumn, "head-rising",
            `head rises by ${qt("head", rise)} from line ${prev.line}, more than 5 % of the shutoff head (${qt("head", shutoff)})`, key);
          continue;
        }
      } else shutoff = p.head;
      b.set.points.push(p);
      prev = r;
      // Consistency (definition of pump efficiency, η = ρgQH/P): only when all four are given and Q, P > 0.
      if (p.efficiency !== undefined && p.power !== undefined && p.power > 0 && p.flow > 0) {
        const eta = (density * G_STANDARD * p.flow * p.head) / p.power;
        if (Math.abs(eta - p.efficiency) > CONSISTENCY_TOLERANCE)
          add(r.line, null, "inconsistent",
            `efficiency ${fmt(p.efficiency * 100)} % does not agree with ρgQH/P = ${fmt(eta * 100)} % (ρ = ${qt("density", density)}): more than ${CONSISTENCY_TOLERANCE * 100} points apart — check the power and efficiency columns and their units`,
            key, "warning");
      }
    }
    if (b.set.points.length < 3)
      add(b.firstLine, b.flowColumn, "too-few-points", `curve has ${b.set.points.length} good point(s); at least 3 are needed`, key);
    if (b.set.speed === null)
      add(b.firstLine, null, "no-speed", "no speed given for this curve; map a speed column or set a default speed", key, "warning");
    curveSets.push(b.set);
  }

  const policy = opts.policy ?? "skip-curves";
  // skip-curves: any error charged to a curve keeps it out. drop-points: only a curve left with
  // fewer than 3 good points (or the later copy of a duplicate, which is never built) is kept out.
  const badKeys = new Set(
    problems.filter((p) => p.severity === "error" && p.curveKey && (policy === "skip-curves" || p.code === "too-few-points")).map((p) => p.curveKey!),
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

function fmt(x: number): string {
  return String(Math.round(x * 1000) / 1000);
}
