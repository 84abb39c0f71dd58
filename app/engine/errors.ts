/**
 * Typed errors and warnings for the hydraulic engine, plus the small input guards every
 * module uses. Bad input throws {@link EngineInputError}; a result computed outside a
 * correlation's validity range comes back with an {@link EngineWarning}, never silently.
 */

/** Thrown when an input is unusable (non-finite, out of domain, empty, duplicated…). */
export class EngineInputError extends Error {
  /** Name of the offending parameter, e.g. `"flow"` or `"points[3].head"`. */
  readonly parameter: string;
  /** Short reason, e.g. `"must be finite"`. */
  readonly reason: string;

  /**
   * @param parameter name of the offending parameter (unitless label)
   * @param reason why it was rejected (unitless text)
   */
  constructor(parameter: string, reason: string) {
    super(`${parameter}: ${reason}`);
    this.name = "EngineInputError";
    this.parameter = parameter;
    this.reason = reason;
  }
}

/** A non-fatal note attached to a result (outside a validity range, transition flow…). */
export interface EngineWarning {
  /** Stable machine code, e.g. `"outside-validity"`, `"transition-flow"`. */
  code: string;
  /** Human-readable sentence. */
  message: string;
  /** Parameter the warning is about, when there is one. */
  parameter?: string;
}

/**
 * Throws unless `value` is a finite number.
 * @param name parameter name for the error (unitless label)
 * @param value value to check (any unit)
 */
export function requireFinite(name: string, value: unknown): number {
  if (typeof value !== "number" || !Number.isFinite(value)) {
    throw new EngineInputError(name, `must be a finite number (got ${String(value)})`);
  }
  return value;
}

/**
 * Throws unless `value` is finite and > 0.
 * @param name parameter name for the error (unitless label)
 * @param value value to check (any unit)
 */
export function requirePositive(name: string, value: unknown): number {
  const v = requireFinite(name, value);
  if (!(v > 0)) throw new EngineInputError(name, `must be greater than zero (got ${v})`);
  return v;
}

/**
 * Throws unless `value` is finite and ≥ 0.
 * @param name parameter name for the error (unitless label)
 * @param value value to check (any unit)
 */
export function requireNonNegative(name: string, value: unknown): number {
  const v = requireFinite(name, value);
  if (!(v >= 0)) throw new EngineInputError(name, `must not be negative (got ${v})`);
  return v;
}

/**
 * Throws unless `min ≤ value ≤ max`.
 * @param name parameter name for the error (unitless label)
 * @param value value to check (same unit as min and max)
 * @param min lower bound, inclusive (same unit as value)
 * @param max upper bound, inclusive (same unit as value)
 */
export function requireInRange(name: string, value: unknown, min: number, max: number): number {
  const v = requireFinite(name, value);
  if (v < min || v > max) {
    throw new EngineInputError(name, `must be between ${min} and ${max} (got ${v})`);
  }
  return v;
}

/**
 * Throws unless `value` is an integer ≥ `min`.
 * @param name parameter name for the error (unitless label)
 * @param value value to check (count, dimensionless)
 * @param min smallest allowed value (count, dimensionless)
 */
export function requireInteger(name: string, value: unknown, min = 0): number {
  const v = requireFinite(name, value);
  if (!Number.isInteger(v) || v < min) {
    throw new EngineInputError(name, `must be a whole number ≥ ${min} (got ${v})`);
  }
  return v;
}

/**
 * Guards a result: throws {@link EngineInputError} naming `parameter` if any number in
 * `value` (deeply, including arrays) is NaN or ±Infinity — inputs so extreme that the
 * arithmetic overflows are reported, never passed on as NaN.
 * @param parameter the input(s) to blame in the error (unitless label)
 * @param value the result to scan (any units)
 */
export function requireFiniteResult<T>(parameter: string, value: T): T {
  const bad = firstNonFinite(value, 0);
  if (bad !== null) {
    throw new EngineInputError(parameter, `values are outside any physical range: the result (${bad}) is not finite`);
  }
  return value;
}

function firstNonFinite(v: unknown, depth: number): string | null {
  if (typeof v === "number") return Number.isFinite(v) ? null : String(v);
  if (v === null || typeof v !== "object" || depth > 6) return null;
  if (ArrayBuffer.isView(v)) {
    const a = v as unknown as ArrayLike<number>;
    for (let i = 0; i < a.length; i++) if (!Number.isFinite(a[i])) return String(a[i]);
    return null;
  }
  for (const k in v as Record<string, unknown>) {
    const r = firstNonFinite((v as Record<string, unknown>)[k], depth + 1);
    if (r !== null) return `${k} = ${r}`;
  }
  return null;
}
