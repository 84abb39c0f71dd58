/** Shared result types of the import core (plain JSON-serialisable objects). */

export type Severity = "error" | "warning";

export type ProblemCode =
  | "not-a-number"
  | "negative"
  | "zero"
  | "zero-dropped"
  | "missing-value"
  | "missing-model"
  | "flow-not-increasing"
  | "head-rising"
  | "curve-rising"
  | "drooping-curve"
  | "efficiency-over-100"
  | "efficiency-implausible"
  | "too-few-points"
  | "duplicate-curve"
  | "duplicate-flow"
  | "no-speed"
  | "no-point-values"
  | "extra-cells"
  | "csv-syntax"
  | "mapping"
  | "header-changed"
  | "run-out"
  | "inconsistent"
  | "power-constant"
  | "npshr-small"
  | "key-not-given"
  | "min-flow"
  | "efficiency-fraction"
  | "model-line-break"
  | "power-below-hydraulic"
  | "power-implausible"
  | "key-stray"
  | "header-repeated"
  | "flow-descending"
  | "power-efficiency";

export interface Problem {
  /** 1-based source line number of the row (the header line for file-wide problems). */
  row: number;
  /** Header text of the column at fault; null when the problem is about the whole row or file. */
  column: string | null;
  reason: string;
  severity: Severity;
  code: ProblemCode;
  /** Key of the curve set the problem belongs to (see curveKey()), or null. */
  curveKey: string | null;
}
