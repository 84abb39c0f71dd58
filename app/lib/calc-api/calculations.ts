// Calc API, part 2: the three calculations, parsed JSON in, `{ ok, body }` or field errors out.
// No I/O, so a benchmark can call them directly (`runCalc`). An EngineInputError that still
// escapes validation is mapped back to the API field name (→ 400).
import {
  EngineInputError,
  G0,
  ROUGHNESS_MAX_OF_DIAMETER,
  createPumpCurve,
  efficiencyAt,
  pipeHeadLoss,
  prepareSystem,
  solveOperatingPoint,
  systemHead,
  systemHeadFunction,
  waterProperties,
  type EngineWarning,
  type Fluid,
  type OperatingStatus,
  type PreparedSystem,
} from "~/engine";
import { qt } from "~/engine/quantityText";
import { coincideRuleText } from "~/engine/meetings";
import {
  BODY_FIELD,
  DEFAULT_TEMPERATURE_C,
  OperatingPointRequest,
  PipeLossRequest,
  SystemCurveRequest,
  parse,
  type CalcEndpoint,
  type CalcOutcome,
  type CalcWarning,
  type FieldError,
} from "./schemas";

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

/** Every calculation's answer: its own figures, then the fluid it used and the engine's warnings. */
type Answer<Figures> = Figures & { fluid: FluidOut; warnings: CalcWarning[] };

/** Water at `temperature_c` (default DEFAULT_TEMPERATURE_C), with ν replaced when the caller gives one. */
function fluidFor(temperatureC: number | undefined, nu: number | undefined): { fluid: Fluid; out: FluidOut } {
  const t = temperatureC ?? DEFAULT_TEMPERATURE_C;
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

/**
 * Roughness at or above half the inner diameter refused, with both numbers (ROUGHNESS_MAX_OF_DIAMETER, as the engine's
 * `prepareRun`, the system schema and the editor's field refuse it: roughness that high would close the bore, physically
 * meaningless). The API took anything below the diameter before.
 */
function roughnessError(s: { diameter_m: number; roughness_m: number }, field: string): FieldError | null {
  const limit = s.diameter_m * ROUGHNESS_MAX_OF_DIAMETER;
  if (s.roughness_m < limit) return null;
  return { field, message: `must be below half of diameter_m ${s.diameter_m} m, ${limit} m (got ${s.roughness_m} m, ε/D = ${+(s.roughness_m / s.diameter_m).toPrecision(3)}): roughness that high would close the bore` };
}

function roughnessErrors(segments: readonly { diameter_m: number; roughness_m: number }[], prefix: string): FieldError[] {
  return segments.map((s, i) => roughnessError(s, `${prefix}[${i}].roughness_m`)).filter((e): e is FieldError => e !== null);
}

// ───────────────────────────── the three calculations ─────────────────────────────

export type PipeLossResponse = Answer<{
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
}>;

/** POST /api/v1/calc/pipe-loss, as a pure function of the parsed JSON body. */
export function calcPipeLoss(body: unknown): CalcOutcome<PipeLossResponse> {
  const p = parse(PipeLossRequest, body);
  if (!p.ok) return p;
  const i = p.body;
  const rough = roughnessError(i, "roughness_m");
  if (rough) return { ok: false, errors: [rough] };
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

export type SystemCurveResponse = Answer<{ points: { flow_m3s: number; head_m: number; pressure_pa: number }[] }>;

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

export type ApiOperatingStatus = "ok" | "no_intersection" | "beyond_curve" | "multiple" | "coincident";

export const STATUS_MAP: Record<OperatingStatus, ApiOperatingStatus> = {
  ok: "ok",
  multiple: "multiple",
  "no-intersection-shutoff-below-static": "no_intersection",
  "beyond-curve-end": "beyond_curve",
  coincident: "coincident",
};

export type OperatingPointResponse = Answer<{
  status: ApiOperatingStatus;
  flow_m3s: number | null;
  head_m: number | null;
  efficiency?: number;
  message: string;
  /** Every crossing, ascending flow (one when ok, several when multiple; with no_intersection those the pump never reaches from rest; none with beyond_curve). */
  intersections: { flow_m3s: number; head_m: number }[];
  /** With coincident only: the stretch where the curves run together, its first and last flow and its head. */
  stretch?: { flow_from_m3s: number; flow_to_m3s: number; head_m: number };
}>;

/**
 * The API's words for curves that run together over a stretch (engine status `coincident`: heads within 1 part in 10⁸
 * of the pump's over 1 % of the published flows or more, engine meetings.ts), with the rule and the stretch's flows and head, and where the numbers are.
 */
function coincidentMessage(s: { flowFrom: number; flowTo: number; head: number; share: number }): string {
  return `No single operating point: the pump and system curves run together from ${qt("flow", s.flowFrom)} to ${qt("flow", s.flowTo)} at ${qt("head", s.head)} (${coincideRuleText(s.share)}; the stretch in stretch), so the pump may run anywhere on it and drift along it; change the system or the pump so the curves cross`;
}

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
      message: r.status === "coincident" && r.stretch ? coincidentMessage(r.stretch) : r.message,
      intersections: r.points.map((x) => ({ flow_m3s: x.flow, head_m: x.head })),
      ...(r.stretch ? { stretch: { flow_from_m3s: r.stretch.flowFrom, flow_to_m3s: r.stretch.flowTo, head_m: r.stretch.head } } : {}),
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
