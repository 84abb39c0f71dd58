// Calc API, part 1: limits, request schemas and validation errors. Pure (no I/O): SI units with
// the unit in every field name; valibot checks shape, types, ranges and array sizes.
import * as v from "valibot";
import { WATER_RANGE_C } from "~/engine";
import type { RateLimitRule } from "../shared/ratelimit.server";
import { groupThousands } from "../shared/format";

// ───────────────────────────── limits (documented on /api) ─────────────────────────────

export const CALC_LIMITS = {
  /** Largest number of flows in one system-curve request (count). */
  flows: 1000,
  /** Largest number of pipe segments in one system (count). */
  segments: 200,
  /** Largest number of points on one pump curve (count). */
  pumpPoints: 500,
  /** Largest request body, bytes (the app-wide limit for API bodies). */
  bodyBytes: 1024 * 1024,
  /** Largest flow, m³/s. */
  flowMax: 1000,
  /** Largest pipe inner diameter, m. */
  diameterMax: 20,
  /** Largest pipe length, m. */
  lengthMax: 1_000_000,
  /** Largest ΣK on one pipe (dimensionless). */
  minorKMax: 100_000,
  /** Largest magnitude of static head, m. */
  staticHeadAbsMax: 10_000,
  /** Largest pump head, m. */
  headMax: 10_000,
  /** Largest kinematic viscosity, m²/s. */
  kinematicViscosityMax: 1,
} as const;

/** Water temperature when a request gives none, °C. */
export const DEFAULT_TEMPERATURE_C = 20;

/** Anonymous callers: this many requests per window per client address. */
export const ANON_RATE_LIMIT: RateLimitRule = { limit: 60, windowSeconds: 60 };

export const CALC_ENDPOINTS = ["pipe-loss", "system-curve", "operating-point"] as const;
export type CalcEndpoint = (typeof CALC_ENDPOINTS)[number];

/** One offending input, named the way the caller wrote it (e.g. `segments[0].diameter_m`). */
export type FieldError = { field: string; message: string };
/** A warning from the engine; `field` when it concerns one input. */
export type CalcWarning = { code: string; message: string; field?: string };

export type CalcOutcome<T> = { ok: true; body: T } | { ok: false; errors: FieldError[] };

/** Field name used when the whole body is at fault (not JSON, not an object…). */
export const BODY_FIELD = "(body)";

// ───────────────────────────── schemas ─────────────────────────────

const numberMsg = (issue: v.BaseIssue<unknown>) => `must be a number (got ${issue.received})`;
const finiteMsg = "must be a finite number";

/** A finite number with bounds; `gt` is an exclusive lower bound. Messages carry the unit, the bounds grouped by spaces ("100 000": engine limitText.ts). */
function num(o: { unit?: string; min?: number; gt?: number; max?: number }) {
  const u = o.unit ? ` ${o.unit}` : "";
  const n = (x: number) => groupThousands(String(x));
  const checks: v.PipeItem<number, number, v.BaseIssue<unknown>>[] = [];
  if (o.gt !== undefined) checks.push(v.gtValue(o.gt, `must be greater than ${n(o.gt)}${u}`));
  if (o.min !== undefined) checks.push(v.minValue(o.min, o.min === 0 ? "must not be negative" : `must be at least ${n(o.min)}${u}`));
  if (o.max !== undefined) checks.push(v.maxValue(o.max, `must be at most ${n(o.max)}${u}`));
  return v.pipe(v.number(numberMsg), v.finite(finiteMsg), ...checks);
}

function list<T extends v.GenericSchema>(item: T, o: { min: number; max: number; what: string }) {
  return v.pipe(
    v.array(item, (i) => `must be an array (got ${i.received})`),
    v.minLength(o.min, o.min === 1 ? `must hold at least one ${o.what}` : `must hold at least ${o.min} ${o.what}s`),
    v.maxLength(o.max, (i) => `must hold at most ${o.max} ${o.what}s (got ${(i.input as unknown[]).length})`),
  );
}

const Flow = num({ unit: "m³/s", min: 0, max: CALC_LIMITS.flowMax });
const Diameter = num({ unit: "m", gt: 0, max: CALC_LIMITS.diameterMax });
const Length = num({ unit: "m", min: 0, max: CALC_LIMITS.lengthMax });
const Roughness = num({ unit: "m", min: 0, max: CALC_LIMITS.diameterMax });
const MinorK = num({ min: 0, max: CALC_LIMITS.minorKMax });
const Temperature = num({ unit: "°C", min: WATER_RANGE_C.min, max: WATER_RANGE_C.max });
const KinVisc = num({ unit: "m²/s", gt: 0, max: CALC_LIMITS.kinematicViscosityMax });
const StaticHead = num({ unit: "m", min: -CALC_LIMITS.staticHeadAbsMax, max: CALC_LIMITS.staticHeadAbsMax });

const Segment = v.strictObject({
  length_m: Length,
  diameter_m: Diameter,
  roughness_m: Roughness,
  minor_k: v.optional(MinorK),
});

const FluidFields = {
  temperature_c: v.optional(Temperature),
  kinematic_viscosity_m2s: v.optional(KinVisc),
};

export const PipeLossRequest = v.strictObject({
  flow_m3s: Flow,
  diameter_m: Diameter,
  length_m: Length,
  roughness_m: Roughness,
  minor_k: v.optional(MinorK),
  ...FluidFields,
});

const Segments = list(Segment, { min: 0, max: CALC_LIMITS.segments, what: "segment" });

export const SystemCurveRequest = v.strictObject({
  static_head_m: StaticHead,
  segments: Segments,
  ...FluidFields,
  flows_m3s: list(Flow, { min: 1, max: CALC_LIMITS.flows, what: "flow" }),
});

const PumpPointSchema = v.strictObject({
  flow_m3s: Flow,
  head_m: num({ unit: "m", min: 0, max: CALC_LIMITS.headMax }),
  efficiency: v.optional(
    v.pipe(
      v.number(numberMsg),
      v.finite(finiteMsg),
      v.minValue(0, "must not be negative"),
      v.maxValue(1, (i) => `is a fraction from 0 to 1 (got ${i.input}${Number(i.input) <= 100 ? `; for ${i.input} % send ${Number(i.input) / 100}` : ""})`),
    ),
  ),
});

export const OperatingPointRequest = v.strictObject({
  pump: v.strictObject({ points: list(PumpPointSchema, { min: 2, max: CALC_LIMITS.pumpPoints, what: "point" }) }),
  system: v.strictObject({ static_head_m: StaticHead, segments: Segments, ...FluidFields }),
});

export type PipeLossInput = v.InferOutput<typeof PipeLossRequest>;
export type SystemCurveInput = v.InferOutput<typeof SystemCurveRequest>;
export type OperatingPointInput = v.InferOutput<typeof OperatingPointRequest>;

/** `segments[0].diameter_m` from a valibot path. */
function fieldOf(path: v.IssuePathItem[] | undefined): string {
  if (!path || path.length === 0) return BODY_FIELD;
  let out = "";
  for (const p of path) {
    const key = (p as { key: unknown }).key;
    if (typeof key === "number") out += `[${key}]`;
    else out += out ? `.${String(key)}` : String(key);
  }
  return out;
}

export const MAX_ERRORS = 25;

function issuesToErrors(issues: readonly v.BaseIssue<unknown>[]): FieldError[] {
  const errors: FieldError[] = [];
  const seen = new Set<string>();
  for (const issue of issues) {
    const field = fieldOf(issue.path);
    if (seen.has(field)) continue; // the first complaint per field is enough
    seen.add(field);
    let message = issue.message;
    if (issue.type === "strict_object" || issue.type === "object") {
      if (issue.expected === "never") message = "is not a field of this request (field names carry their unit, see /api)";
      else if (issue.received === "undefined") message = "is required";
      else message = `must be a JSON object (got ${issue.received})`;
    }
    errors.push({ field, message });
  }
  return errors;
}

export function parse<S extends v.GenericSchema>(schema: S, body: unknown): CalcOutcome<v.InferOutput<S>> {
  if (body === null || typeof body !== "object" || Array.isArray(body)) {
    const got = body === null ? "null" : Array.isArray(body) ? "an array" : typeof body;
    return { ok: false, errors: [{ field: BODY_FIELD, message: `must be a JSON object (got ${got})` }] };
  }
  const r = v.safeParse(schema, body);
  return r.success ? { ok: true, body: r.output } : { ok: false, errors: issuesToErrors(r.issues) };
}
