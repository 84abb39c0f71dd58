// Calc API: pipe loss, system curve and operating point over JSON, SI units with the unit in
// every field name. Two layers:
//  - pure request→response functions (`calcPipeLoss`, `calcSystemCurve`, `calcOperatingPoint`,
//    or `runCalc(endpoint, body)`): parsed JSON in, `{ ok, body }` or field errors out. No I/O,
//    so a benchmark can call them directly;
//  - `calcAction(request, endpoint)`: the HTTP edge the route modules delegate to — method,
//    credentials or the per-address rate limit, content type, body size, JSON, then the above.
// Bad input never reaches the engine unchecked: valibot validates shape, types, ranges and array
// sizes; an EngineInputError that still escapes is mapped back to the API field name (→ 400).
import * as v from "valibot";
import {
  EngineInputError,
  G0,
  createPumpCurve,
  efficiencyAt,
  pipeHeadLoss,
  prepareSystem,
  solveOperatingPoint,
  systemHead,
  systemHeadFunction,
  waterProperties,
  WATER_RANGE_C,
  type EngineWarning,
  type Fluid,
  type OperatingStatus,
  type PreparedSystem,
} from "~/engine";
import { clientIp } from "./auth.server";
import { requireApi } from "./guards.server";
import { problem } from "./problem.server";
import { hitRateLimit, type RateLimitRule } from "./ratelimit.server";

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

/** A finite number with bounds; `gt` is an exclusive lower bound. Messages carry the unit. */
function num(o: { unit?: string; min?: number; gt?: number; max?: number }) {
  const u = o.unit ? ` ${o.unit}` : "";
  const checks: v.PipeItem<number, number, v.BaseIssue<unknown>>[] = [];
  if (o.gt !== undefined) checks.push(v.gtValue(o.gt, `must be greater than ${o.gt}${u}`));
  if (o.min !== undefined) checks.push(v.minValue(o.min, o.min === 0 ? "must not be negative" : `must be at least ${o.min}${u}`));
  if (o.max !== undefined) checks.push(v.maxValue(o.max, `must be at most ${o.max}${u}`));
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

const MAX_ERRORS = 25;

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

function parse<S extends v.GenericSchema>(schema: S, body: unknown): CalcOutcome<v.InferOutput<S>> {
  if (body === null || typeof body !== "object" || Array.isArray(body)) {
    const got = body === null ? "null" : Array.isArray(body) ? "an array" : typeof body;
    return { ok: false, errors: [{ field: BODY_FIELD, message: `must be a JSON object (got ${got})` }] };
  }
  const r = v.safeParse(schema, body);
  return r.success ? { ok: true, body: r.output } : { ok: false, errors: issuesToErrors(r.issues) };
}

// ───────────────────────────── engine glue ─────────────────────────────

/** Engine parameter leaf → API field leaf. */
const LEAF: Record<string, string> = {
  flow: "flow_m3s",
  head: "head_m",
  efficiency: "efficiency",
  diameter: "diameter_m",
  length: "length_m",
  roughness: "roughness_m",
  agedRoughness: "roughness_m",
  relativeRoughness: "roughness_m",
  minorK: "minor_k",
  kinematicViscosity: "kinematic_viscosity_m2s",
  temperatureC: "temperature_c",
  staticHead: "static_head_m",
};

/**
 * Maps an engine parameter name back to the API field name.
 * @param param engine name, e.g. `discharge[2].diameter` or `points[3].head`
 * @param ctx where segments and pump points live in this request, and where a bare name goes
 */
export function engineFieldToApi(
  param: string,
  ctx: { segments?: string; points?: string; fluid?: string; bare?: Record<string, string> },
): string {
  if (ctx.bare && param in ctx.bare) return ctx.bare[param];
  let m = /^(?:discharge|suction)\[(\d+)\]\.(\w+)$/.exec(param);
  if (m && ctx.segments) return `${ctx.segments}[${m[1]}].${LEAF[m[2]] ?? m[2]}`;
  m = /^points\[(\d+)\]\.(\w+)$/.exec(param);
  if (m && ctx.points) return `${ctx.points}[${m[1]}].${LEAF[m[2]] ?? m[2]}`;
  m = /^points\[(\d+)\]$/.exec(param);
  if (m && ctx.points) return `${ctx.points}[${m[1]}]`;
  if (param === "points" && ctx.points) return ctx.points;
  const fluidPrefix = ctx.fluid ?? "";
  if (param === "kinematicViscosity" || /^fluid\.(kinematic|dynamic)Viscosity$/.test(param)) return `${fluidPrefix}kinematic_viscosity_m2s`;
  if (param === "temperatureC" || param.startsWith("fluid.")) return `${fluidPrefix}temperature_c`;
  if (param in LEAF) return LEAF[param];
  return BODY_FIELD;
}

/** Runs engine code; an EngineInputError becomes a field error, anything else propagates. */
function guarded<T>(fn: () => T, ctx: Parameters<typeof engineFieldToApi>[1]): CalcOutcome<T> {
  try {
    return { ok: true, body: fn() };
  } catch (e) {
    if (e instanceof EngineInputError) return { ok: false, errors: [{ field: engineFieldToApi(e.parameter, ctx), message: e.reason }] };
    throw e;
  }
}

function warningsOut(ws: readonly EngineWarning[], ctx: Parameters<typeof engineFieldToApi>[1]): CalcWarning[] {
  const seen = new Set<string>();
  const out: CalcWarning[] = [];
  for (const w of ws) {
    // One warning per code, parameter and pipe segment (a curve of 1000 flows repeats them).
    const run = /^(segments\[\d+\]):/.exec(w.message)?.[1] ?? w.message;
    const key = `${w.code}|${w.parameter ?? ""}|${run}`;
    if (seen.has(key)) continue;
    seen.add(key);
    const mapped = w.parameter ? engineFieldToApi(w.parameter, ctx) : BODY_FIELD;
    out.push(mapped === BODY_FIELD ? { code: w.code, message: w.message } : { code: w.code, message: w.message, field: mapped });
  }
  return out;
}

type FluidOut = { name: string; temperature_c: number; density_kgm3: number; kinematic_viscosity_m2s: number; viscosity_source: "water" | "given" };

/** Water at `temperature_c` (default 20 °C), with ν replaced when the caller gives one. */
function fluidFor(temperatureC: number | undefined, nu: number | undefined): { fluid: Fluid; out: FluidOut } {
  const t = temperatureC ?? 20;
  const w = waterProperties(t);
  const kinematicViscosity = nu ?? w.kinematicViscosity;
  const fluid: Fluid = {
    name: nu === undefined ? `Water ${t} °C` : `Given ν, water density at ${t} °C`,
    density: w.density,
    dynamicViscosity: kinematicViscosity * w.density,
    kinematicViscosity,
    vaporPressure: w.vaporPressure,
  };
  return {
    fluid,
    out: { name: fluid.name, temperature_c: t, density_kgm3: w.density, kinematic_viscosity_m2s: kinematicViscosity, viscosity_source: nu === undefined ? "water" : "given" },
  };
}

function roughnessErrors(segments: readonly { diameter_m: number; roughness_m: number }[], prefix: string): FieldError[] {
  const errors: FieldError[] = [];
  segments.forEach((s, i) => {
    if (s.roughness_m >= s.diameter_m) {
      errors.push({ field: `${prefix}[${i}].roughness_m`, message: `must be smaller than diameter_m (${s.diameter_m} m)` });
    }
  });
  return errors;
}

// ───────────────────────────── the three calculations ─────────────────────────────

export type PipeLossResponse = {
  velocity_ms: number;
  reynolds: number;
  relative_roughness: number;
  friction_factor: number;
  friction_method: string;
  regime: "laminar" | "transition" | "turbulent" | "no_flow";
  head_loss_m: number;
  friction_loss_m: number;
  minor_loss_m: number;
  velocity_head_m: number;
  pressure_drop_pa: number;
  fluid: FluidOut;
  warnings: CalcWarning[];
};

/** POST /api/v1/calc/pipe-loss, as a pure function of the parsed JSON body. */
export function calcPipeLoss(body: unknown): CalcOutcome<PipeLossResponse> {
  const p = parse(PipeLossRequest, body);
  if (!p.ok) return p;
  const i = p.body;
  if (i.roughness_m >= i.diameter_m) {
    return { ok: false, errors: [{ field: "roughness_m", message: `must be smaller than diameter_m (${i.diameter_m} m)` }] };
  }
  const ctx = { bare: { reynolds: "flow_m3s", headLoss: "flow_m3s" } };
  return guarded(() => {
    const { fluid, out } = fluidFor(i.temperature_c, i.kinematic_viscosity_m2s);
    const r = pipeHeadLoss({
      flow: i.flow_m3s,
      diameter: i.diameter_m,
      length: i.length_m,
      roughness: i.roughness_m,
      minorK: i.minor_k ?? 0,
      kinematicViscosity: fluid.kinematicViscosity,
    });
    const pressure = fluid.density * G0 * r.headLoss;
    if (!Number.isFinite(pressure)) throw new EngineInputError("flow", "gives a loss too large to represent; check the units");
    return {
      velocity_ms: r.velocity,
      reynolds: r.reynolds,
      relative_roughness: i.roughness_m / i.diameter_m,
      friction_factor: r.frictionFactor,
      friction_method: r.method,
      regime: r.regime === "no-flow" ? "no_flow" : r.regime,
      head_loss_m: r.headLoss,
      friction_loss_m: r.frictionLoss,
      minor_loss_m: r.minorLoss,
      velocity_head_m: r.velocityHead,
      pressure_drop_pa: pressure,
      fluid: out,
      warnings: warningsOut(r.warnings, {}),
    };
  }, ctx);
}

export type SystemCurveResponse = {
  points: { flow_m3s: number; head_m: number; pressure_pa: number }[];
  fluid: FluidOut;
  warnings: CalcWarning[];
};

function prepare(
  sys: { static_head_m: number; segments: readonly { length_m: number; diameter_m: number; roughness_m: number; minor_k?: number }[] },
  fluid: Fluid,
): PreparedSystem {
  return prepareSystem({
    fluid,
    staticHead: sys.static_head_m,
    discharge: sys.segments.map((s, i) => ({
      name: `segments[${i}]`,
      length: s.length_m,
      diameter: s.diameter_m,
      roughness: s.roughness_m,
      minorK: s.minor_k ?? 0,
    })),
  });
}

/** POST /api/v1/calc/system-curve, as a pure function of the parsed JSON body. */
export function calcSystemCurve(body: unknown): CalcOutcome<SystemCurveResponse> {
  const p = parse(SystemCurveRequest, body);
  if (!p.ok) return p;
  const i = p.body;
  const rough = roughnessErrors(i.segments, "segments");
  if (rough.length) return { ok: false, errors: rough };
  const ctx = { segments: "segments", bare: { flow: "flows_m3s", reynolds: "flows_m3s", headLoss: "flows_m3s" } };
  return guarded(() => {
    const { fluid, out } = fluidFor(i.temperature_c, i.kinematic_viscosity_m2s);
    const sys = prepare(i, fluid);
    const warnings: EngineWarning[] = [];
    const points = i.flows_m3s.map((q, k) => {
      const r = systemHead(sys, q);
      warnings.push(...r.warnings);
      if (!Number.isFinite(r.pressure)) throw new EngineInputError(`flows[${k}]`, "gives a head too large to represent; check the units");
      return { flow_m3s: q, head_m: r.head, pressure_pa: r.pressure };
    });
    return { points, fluid: out, warnings: warningsOut(warnings, { segments: "segments" }) };
  }, ctx);
}

export type ApiOperatingStatus = "ok" | "no_intersection" | "beyond_curve" | "multiple";

export const STATUS_MAP: Record<OperatingStatus, ApiOperatingStatus> = {
  ok: "ok",
  multiple: "multiple",
  "no-intersection-shutoff-below-static": "no_intersection",
  "beyond-curve-end": "beyond_curve",
};

export type OperatingPointResponse = {
  status: ApiOperatingStatus;
  flow_m3s: number | null;
  head_m: number | null;
  efficiency?: number;
  message: string;
  /** Every crossing, ascending flow (one when ok, several when multiple, none otherwise). */
  intersections: { flow_m3s: number; head_m: number }[];
  fluid: FluidOut;
  warnings: CalcWarning[];
};

/** POST /api/v1/calc/operating-point, as a pure function of the parsed JSON body. */
export function calcOperatingPoint(body: unknown): CalcOutcome<OperatingPointResponse> {
  const p = parse(OperatingPointRequest, body);
  if (!p.ok) return p;
  const i = p.body;
  const rough = roughnessErrors(i.system.segments, "system.segments");
  if (rough.length) return { ok: false, errors: rough };
  const ctx = {
    segments: "system.segments",
    points: "pump.points",
    fluid: "system.",
    bare: { staticHead: "system.static_head_m", flow: "pump.points", reynolds: "pump.points", headLoss: "pump.points" },
  };
  return guarded(() => {
    const { fluid, out } = fluidFor(i.system.temperature_c, i.system.kinematic_viscosity_m2s);
    const curve = createPumpCurve({
      points: i.pump.points.map((pt) => ({ flow: pt.flow_m3s, head: pt.head_m, ...(pt.efficiency !== undefined ? { efficiency: pt.efficiency } : {}) })),
    });
    const sys = prepare(i.system, fluid);
    const r = solveOperatingPoint(curve, systemHeadFunction(sys));
    const eff = r.flow === null ? null : efficiencyAt(curve, r.flow);
    return {
      status: STATUS_MAP[r.status],
      flow_m3s: r.flow,
      head_m: r.head,
      ...(eff !== null && Number.isFinite(eff) ? { efficiency: eff } : {}),
      message: r.message,
      intersections: r.points.map((x) => ({ flow_m3s: x.flow, head_m: x.head })),
      fluid: out,
      warnings: warningsOut([...r.warnings, ...sys.warnings], { segments: "system.segments", points: "pump.points", fluid: "system." }),
    } satisfies OperatingPointResponse;
  }, ctx);
}

/** Any endpoint by name: the single entry point for benchmarks. */
export function runCalc(endpoint: CalcEndpoint, body: unknown): CalcOutcome<unknown> {
  switch (endpoint) {
    case "pipe-loss":
      return calcPipeLoss(body);
    case "system-curve":
      return calcSystemCurve(body);
    case "operating-point":
      return calcOperatingPoint(body);
  }
}

// ───────────────────────────── HTTP edge ─────────────────────────────

export function validationProblem(errors: FieldError[], headers?: HeadersInit): Response {
  const shown = errors.slice(0, MAX_ERRORS);
  const first = shown[0];
  const more = errors.length > shown.length ? ` (${errors.length - shown.length} more not listed)` : "";
  const detail = first
    ? `${first.field}: ${first.message}${errors.length > 1 ? ` (and ${errors.length - 1} more)` : ""}${more}`
    : "The request is not valid.";
  return problem({ title: "Bad Request", status: 400, detail, errors: shown }, headers);
}

/** GET, HEAD and any method other than POST. */
export function calcMethodNotAllowed(request: Request): Response {
  return problem(
    { title: "Method Not Allowed", status: 405, detail: `${request.method} is not supported here: POST a JSON body (see /api).` },
    { Allow: "POST" },
  );
}

type BodyRead = { ok: true; value: unknown } | { ok: false; response: Response };

/** Reads at most `limit` bytes of UTF-8 JSON. */
async function readJson(request: Request, limit: number, headers: Headers): Promise<BodyRead> {
  const tooLarge = () => ({
    ok: false as const,
    response: problem({ title: "Content Too Large", status: 413, detail: `The body is larger than ${limit} bytes.` }, headers),
  });
  const bad = (message: string) => ({ ok: false as const, response: validationProblem([{ field: BODY_FIELD, message }], headers) });
  const declared = Number(request.headers.get("content-length") ?? "");
  if (Number.isFinite(declared) && declared > limit) return tooLarge();
  const chunks: Uint8Array[] = [];
  let size = 0;
  if (request.body) {
    const reader = request.body.getReader();
    for (;;) {
      const { done, value } = await reader.read();
      if (done) break;
      size += value.byteLength;
      if (size > limit) {
        await reader.cancel().catch(() => {});
        return tooLarge();
      }
      chunks.push(value);
    }
  }
  const bytes = new Uint8Array(size);
  let at = 0;
  for (const c of chunks) {
    bytes.set(c, at);
    at += c.byteLength;
  }
  let text: string;
  try {
    text = new TextDecoder("utf-8", { fatal: true }).decode(bytes);
  } catch {
    return bad("is not valid UTF-8");
  }
  if (text.trim() === "") return bad("is empty: send a JSON object");
  try {
    return { ok: true, value: JSON.parse(text) };
  } catch (e) {
    return bad(`is not valid JSON (${(e as Error).message})`);
  }
}

function isJsonContentType(value: string | null): boolean {
  if (!value) return false;
  const mediaType = value.split(";")[0].trim().toLowerCase();
  return mediaType === "application/json";
}

/**
 * The whole POST handling of one calc endpoint. A Bearer token is checked (invalid → 401, never
 * an anonymous fallback) and is not rate-limited; without an Authorization header the caller is
 * anonymous and counted per client address (429 with Retry-After past the limit).
 * @param opts.now clock for the rate-limit window (tests)
 */
export async function calcAction(request: Request, endpoint: CalcEndpoint, opts: { now?: Date } = {}): Promise<Response> {
  if (request.method.toUpperCase() !== "POST") return calcMethodNotAllowed(request);
  const headers = new Headers({ "Cache-Control": "no-store" });
  if (request.headers.has("authorization")) {
    try {
      await requireApi(request, "calc.use");
    } catch (e) {
      if (e instanceof Response) return e;
      throw e;
    }
  } else {
    const address = clientIp(request) || "unknown";
    let rl;
    try {
      rl = await hitRateLimit(`calc:${address}`, ANON_RATE_LIMIT, opts.now ?? new Date());
    } catch (e) {
      console.error("calc rate limit unavailable", e);
      return problem(
        { title: "Service Unavailable", status: 503, detail: "The request counter is not answering; try again shortly, or use an API token." },
        { "Retry-After": "5" },
      );
    }
    headers.set("RateLimit-Limit", String(rl.limit));
    headers.set("RateLimit-Remaining", String(rl.remaining));
    headers.set("RateLimit-Reset", String(rl.resetSeconds));
    if (!rl.allowed) {
      headers.set("Retry-After", String(rl.resetSeconds));
      return problem(
        {
          title: "Too Many Requests",
          status: 429,
          detail: `Anonymous use is limited to ${rl.limit} requests per ${ANON_RATE_LIMIT.windowSeconds} s per address. Try again in ${rl.resetSeconds} s, or send an API token (Authorization: Bearer …) for unlimited use.`,
          retry_after_s: rl.resetSeconds,
        },
        headers,
      );
    }
  }
  if (!isJsonContentType(request.headers.get("content-type"))) {
    const got = request.headers.get("content-type");
    return problem(
      {
        title: "Unsupported Media Type",
        status: 415,
        detail: `Send the body as JSON with Content-Type: application/json (got ${got ? got : "no Content-Type"}).`,
        errors: [{ field: BODY_FIELD, message: "Content-Type must be application/json" }],
      },
      new Headers([...headers, ["Accept-Post", "application/json"]]),
    );
  }
  const body = await readJson(request, CALC_LIMITS.bodyBytes, headers);
  if (!body.ok) return body.response;
  let out: CalcOutcome<unknown>;
  try {
    out = runCalc(endpoint, body.value);
  } catch (e) {
    console.error(`calc ${endpoint} failed`, e);
    return problem({ title: "Internal Server Error", status: 500, detail: "The calculation failed unexpectedly; this is our fault." }, headers);
  }
  if (!out.ok) return validationProblem(out.errors, headers);
  headers.set("Content-Type", "application/json");
  return new Response(JSON.stringify(out.body), { status: 200, headers });
}
