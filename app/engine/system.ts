/**
 * System curve: H(Q) = static head + Δp/(ρg) + Σ pipe losses (open system), or
 * H(Q) = control head + Σ pipe losses (closed loop, no static lift; the control head is the
 * head held across the controlled point at set point). Δp = ρ·g₀·H. Pipe runs are in series
 * on the suction and discharge sides; each run has its own ΣK.
 */
import { EngineInputError, requireFinite, requireFiniteResult, requireNonNegative, requirePositive, type EngineWarning } from "./errors.ts";
import { checkFluid, type Fluid } from "./fluids.ts";
import { sumKDetailed, type FittingUse } from "./fittings.ts";
import { LAMINAR_MAX_RE, pipeHeadLoss, type LossModel, type PipeLossResult } from "./headLoss.ts";
import { churchill, hazenWilliamsHeadLoss } from "./friction.ts";
import { findCorrelation } from "./registry.ts";
import type { DarcyCorrelation, FrictionMethod } from "./registry.ts";
import { transitionBandWarning } from "./transitionText.ts";
import { G0 } from "./units.ts";

/** One pipe run (straight pipe of one size plus its fittings). */
export interface PipeRunSpec {
  /** Label for reports. */
  name?: string;
  /** Length, m. */
  length: number;
  /** Inner diameter, m. */
  diameter: number;
  /** Absolute roughness when new, m. */
  roughness: number;
  /** Absolute roughness when aged, m (defaults to `roughness`). */
  agedRoughness?: number;
  /** Extra ΣK given directly (dimensionless). */
  minorK?: number;
  /** Fittings on the run; their K are added to `minorK`. */
  fittings?: readonly FittingUse[];
  /** Nominal size in inches, for the Crane fT table (optional). */
  nominal?: string;
  /** Hazen-Williams C new / aged (dimensionless), used when the loss model is Hazen-Williams. */
  hazenWilliamsC?: number;
  hazenWilliamsCAged?: number;
}

/** Static head: one value, or the range from least to most lift (levels vary). */
export type StaticHeadSpec = number | { min: number; max: number; nominal?: number };

/** A pumped system. Elevation/pressure differences are discharge end minus suction end. */
export interface SystemSpec {
  /** Fluid state (see fluids.ts). */
  fluid: Fluid;
  /** Suction-side runs, in series. */
  suction?: readonly PipeRunSpec[];
  /** Discharge-side runs, in series. */
  discharge?: readonly PipeRunSpec[];
  /** `open` (default): static lift and surface pressures; `closed-loop`: control head, no static lift. */
  mode?: "open" | "closed-loop";
  /** Open mode: discharge surface elevation minus suction surface elevation, m. */
  staticHead?: StaticHeadSpec;
  /** Open mode: discharge surface pressure minus suction surface pressure, Pa. */
  pressureDifference?: number;
  /** Closed loop: head held at the set point, m. */
  controlHead?: number;
  /** `darcy` (default) or `hazen-williams`. */
  lossModel?: "darcy" | "hazen-williams";
  /** Darcy friction correlation (default Colebrook). */
  frictionMethod?: FrictionMethod;
}

/** Which corner of the band. */
export interface SystemCase {
  /** Static level: least lift, most lift, or nominal. */
  level?: "min" | "max" | "nominal";
  /** Pipe condition. */
  roughness?: "new" | "aged";
}

/** A validated system, ready for fast evaluation. */
export interface PreparedSystem {
  fluid: Fluid;
  mode: "open" | "closed-loop";
  static: { min: number; max: number; nominal: number };
  /** Fixed head independent of flow besides static: Δp/(ρg) (open) or control head (closed), m. */
  fixedHead: number;
  suction: PreparedRun[];
  discharge: PreparedRun[];
  lossModel: "darcy" | "hazen-williams";
  frictionMethod: FrictionMethod;
  warnings: EngineWarning[];
}

/**
 * Largest roughness a run takes, as a fraction of its inner diameter (ε < D/2, dimensionless): wall bumps half the
 * diameter high would meet in the middle of the bore, so no pipe has one; a value there is a unit slip. Between
 * 0.05 (the top of every friction correlation's stated ε/D range, registry.ts) and this the loss is computed with a
 * range warning.
 */
export const ROUGHNESS_MAX_OF_DIAMETER = 0.5;

interface PreparedRun {
  name: string;
  length: number;
  diameter: number;
  roughness: number;
  agedRoughness: number;
  k: number;
  c: number;
  cAged: number;
}

function prepareRun(run: PipeRunSpec, where: string, lossModel: string, warnings: EngineWarning[]): PreparedRun {
  if (!run || typeof run !== "object") throw new EngineInputError(where, "must be a pipe run");
  const diameter = requirePositive(`${where}.diameter`, run.diameter);
  const roughness = requireNonNegative(`${where}.roughness`, run.roughness);
  const agedRoughness = requireNonNegative(`${where}.agedRoughness`, run.agedRoughness ?? roughness);
  // ε below half the inner diameter (ROUGHNESS_MAX_OF_DIAMETER): said here with the run, not later as a bare relativeRoughness.
  for (const [k, e] of [["roughness", roughness], ["agedRoughness", agedRoughness]] as const) {
    if (e >= diameter * ROUGHNESS_MAX_OF_DIAMETER) throw new EngineInputError(`${where}.${k}`, `must be below half the inner diameter${run.name ? ` of ${run.name},` : ""} ${diameter} m, ${diameter * ROUGHNESS_MAX_OF_DIAMETER} m: roughness that high would close the bore, physically meaningless (got ${e} m, ε/D = ${+(e / diameter).toPrecision(3)})`);
  }
  const fk = sumKDetailed(run.fittings ?? [], diameter, run.nominal);
  for (const w of fk.warnings) warnings.push({ ...w, message: `${run.name ?? where}: ${w.message}` });
  const k = requireNonNegative(`${where}.minorK`, run.minorK ?? 0) + fk.k;
  let c = 1, cAged = 1;
  if (lossModel === "hazen-williams") {
    c = requirePositive(`${where}.hazenWilliamsC`, run.hazenWilliamsC);
    cAged = requirePositive(`${where}.hazenWilliamsCAged`, run.hazenWilliamsCAged ?? c);
  }
  return { name: run.name ?? where, length: requireNonNegative(`${where}.length`, run.length), diameter,
    roughness, agedRoughness, k, c, cAged };
}

/**
 * Validates a system and precomputes ΣK per run.
 * @param spec the system (SI: m, Pa; see {@link SystemSpec})
 */
export function prepareSystem(spec: SystemSpec): PreparedSystem {
  if (!spec || typeof spec !== "object") throw new EngineInputError("system", "is required");
  const fluid = checkFluid(spec.fluid);
  const mode = spec.mode ?? "open";
  if (mode !== "open" && mode !== "closed-loop") throw new EngineInputError("mode", "must be 'open' or 'closed-loop'");
  const lossModel = spec.lossModel ?? "darcy";
  if (lossModel !== "darcy" && lossModel !== "hazen-williams") throw new EngineInputError("lossModel", "must be 'darcy' or 'hazen-williams'");
  const frictionMethod = spec.frictionMethod ?? "colebrook";
  const corr = findCorrelation(frictionMethod);
  if (!corr || corr.kind !== "darcy-friction") throw new EngineInputError("frictionMethod", `unknown friction method "${String(frictionMethod)}"`);
  const warnings: EngineWarning[] = [];
  let st = { min: 0, max: 0, nominal: 0 };
  let fixedHead: number;
  if (mode === "open") {
    const s = spec.staticHead ?? 0;
    if (typeof s === "number") {
      requireFinite("staticHead", s);
      st = { min: s, max: s, nominal: s };
    } else {
      const min = requireFinite("staticHead.min", s.min);
      const max = requireFinite("staticHead.max", s.max);
      if (max < min) throw new EngineInputError("staticHead.max", "must not be below staticHead.min");
      const nominal = requireFinite("staticHead.nominal", s.nominal ?? (min + max) / 2);
      st = { min, max, nominal };
    }
    fixedHead = requireFinite("pressureDifference", spec.pressureDifference ?? 0) / (fluid.density * G0);
    if (spec.controlHead !== undefined) warnings.push({ code: "ignored", parameter: "controlHead", message: "control head applies to closed loops only; ignored" });
  } else {
    fixedHead = requireNonNegative("controlHead", spec.controlHead ?? 0);
    if (spec.staticHead !== undefined && spec.staticHead !== 0) warnings.push({ code: "ignored", parameter: "staticHead", message: "a closed loop has no static lift; static head ignored" });
  }
  const suction = (spec.suction ?? []).map((r, i) => prepareRun(r, `suction[${i}]`, lossModel, warnings));
  const discharge = (spec.discharge ?? []).map((r, i) => prepareRun(r, `discharge[${i}]`, lossModel, warnings));
  return { fluid, mode, static: st, fixedHead, suction, discharge, lossModel,
    frictionMethod, warnings };
}

/** Throws unless `which` names a known level and pipe condition; returns them with defaults. */
function checkCase(which: SystemCase | undefined): { level: "min" | "max" | "nominal"; aged: boolean } {
  const level = which?.level ?? "nominal";
  const roughness = which?.roughness ?? "new";
  if (level !== "min" && level !== "max" && level !== "nominal") throw new EngineInputError("which.level", `must be 'min', 'max' or 'nominal' (got ${String(level)})`);
  if (roughness !== "new" && roughness !== "aged") throw new EngineInputError("which.roughness", `must be 'new' or 'aged' (got ${String(roughness)})`);
  return { level, aged: roughness === "aged" };
}

/** A prepared system as is, anything else through prepareSystem (which refuses what is no object: "system: is required"). */
function asPrepared(system: SystemSpec | PreparedSystem): PreparedSystem {
  return system && typeof system === "object" && "fixedHead" in system && "static" in system ? system : prepareSystem(system as SystemSpec);
}

/** Loss of a list of runs at one flow. */
export interface RunsLoss {
  /** Total head loss, m. */
  headLoss: number;
  /** Per run. */
  runs: PipeLossResult[];
  warnings: EngineWarning[];
}

function runsLoss(sys: PreparedSystem, runs: PreparedRun[], flow: number, aged: boolean): RunsLoss {
  let headLoss = 0;
  const out: PipeLossResult[] = [];
  const warnings: EngineWarning[] = [];
  for (const r of runs) {
    const model: LossModel = sys.lossModel === "hazen-williams"
      ? { type: "hazen-williams", c: aged ? r.cAged : r.c }
      : { type: "darcy", method: sys.frictionMethod };
    const res = pipeHeadLoss({ flow, diameter: r.diameter, length: r.length, roughness: aged ? r.agedRoughness : r.roughness,
      minorK: r.k, kinematicViscosity: sys.fluid.kinematicViscosity, model });
    headLoss += res.headLoss;
    out.push(res);
    for (const w of res.warnings) warnings.push(runWarning(r, w));
  }
  return { headLoss, runs: out, warnings };
}

/** A run's loss warning, its message led by the run's name. */
const runWarning = (r: PreparedRun, w: EngineWarning): EngineWarning => ({ ...w, message: `${r.name}: ${w.message}` });

/**
 * Head loss on the suction side at a flow (for NPSHa).
 * @param system the system (SI)
 * @param flow volumetric flow, m³/s
 * @param roughness pipe condition, "new" or "aged" (unitless)
 */
export function suctionLoss(system: SystemSpec | PreparedSystem, flow: number, roughness: "new" | "aged" = "new"): RunsLoss {
  const sys = asPrepared(system);
  const { aged } = checkCase({ roughness });
  return runsLoss(sys, sys.suction, requireNonNegative("flow", flow), aged);
}

/** System head at one flow, with its parts. */
export interface SystemHeadResult {
  /** Flow, m³/s. */
  flow: number;
  /** Total system head, m. */
  head: number;
  /** Pressure the pump must add, Δp = ρ·g₀·H, Pa. */
  pressure: number;
  /** Static part, m (0 in a closed loop). */
  staticHead: number;
  /** Δp/(ρg) of surface pressures (open) or control head (closed), m. */
  fixedHead: number;
  /** Suction-side loss, m. */
  suctionLoss: number;
  /** Discharge-side loss, m. */
  dischargeLoss: number;
  suctionRuns: PipeLossResult[];
  dischargeRuns: PipeLossResult[];
  warnings: EngineWarning[];
}

/**
 * System head at one flow.
 * @param system the system (SI)
 * @param flow volumetric flow, m³/s
 * @param which level ("min" | "max" | "nominal") and pipe condition ("new" | "aged") (unitless)
 */
export function systemHead(system: SystemSpec | PreparedSystem, flow: number, which: SystemCase = {}): SystemHeadResult {
  const sys = asPrepared(system);
  requireNonNegative("flow", flow);
  const { level, aged } = checkCase(which);
  const staticHead = sys.mode === "closed-loop" ? 0 : sys.static[level];
  const s = runsLoss(sys, sys.suction, flow, aged);
  const d = runsLoss(sys, sys.discharge, flow, aged);
  const head = staticHead + sys.fixedHead + s.headLoss + d.headLoss;
  requireFiniteResult("system", { head, pressure: sys.fluid.density * G0 * head });
  return { flow, head, pressure: sys.fluid.density * G0 * head, staticHead, fixedHead: sys.fixedHead,
    suctionLoss: s.headLoss, dischargeLoss: d.headLoss, suctionRuns: s.runs, dischargeRuns: d.runs,
    warnings: [...sys.warnings, ...s.warnings, ...d.warnings] };
}

/**
 * A function H(Q) for the solver: the same arithmetic as {@link systemHead} (identical
 * results, see system.test.ts) without per-run detail, warnings or allocation.
 * @param system the system (SI)
 * @param which level and pipe condition (unitless)
 * @returns (flow m³/s) → head m
 */
export function systemHeadFunction(system: SystemSpec | PreparedSystem, which: SystemCase = {}): (flow: number) => number {
  const sys = asPrepared(system);
  const { level, aged } = checkCase(which);
  const staticHead = sys.mode === "closed-loop" ? 0 : sys.static[level];
  const nSuction = sys.suction.length;
  const nu = sys.fluid.kinematicViscosity;
  const runs = [...sys.suction, ...sys.discharge];
  const n = runs.length;
  const Dn = new Float64Array(n), L = new Float64Array(n), eD = new Float64Array(n), K = new Float64Array(n), C = new Float64Array(n);
  runs.forEach((r, i) => {
    Dn[i] = r.diameter; L[i] = r.length; K[i] = r.k;
    eD[i] = (aged ? r.agedRoughness : r.roughness) / r.diameter;
    C[i] = aged ? r.cAged : r.c;
  });
  const hw = sys.lossModel === "hazen-williams";
  const corr = findCorrelation(sys.frictionMethod);
  if (!corr || corr.kind !== "darcy-friction") throw new EngineInputError("frictionMethod", `unknown friction method "${sys.frictionMethod}"`);
  const fn = corr.fn;
  const isChurchill = corr.id === "churchill";
  const twoG = 2 * G0;
  return (flow: number) => {
    if (!(flow >= 0)) requireNonNegative("flow", flow);
    // Same operation order as pipeHeadLoss/systemHead, so results are identical.
    let sLoss = 0, dLoss = 0;
    if (flow > 0) {
      for (let i = 0; i < n; i++) {
        const d = Dn[i];
        const V = flow / ((Math.PI * d * d) / 4);
        const vh = (V * V) / twoG;
        let loss: number;
        if (hw) {
          loss = hazenWilliamsHeadLoss(flow, d, L[i], C[i]) + K[i] * vh;
        } else {
          const Re = (V * d) / nu;
          let f = Re <= LAMINAR_MAX_RE && !isChurchill ? 64 / Re : fn(Re, eD[i]);
          if (!(f > 0 && f < Infinity)) f = churchill(Re, eD[i]);
          loss = f * (L[i] / d) * vh + K[i] * vh;
        }
        if (i < nSuction) sLoss += loss; else dLoss += loss;
      }
    }
    const h = staticHead + sys.fixedHead + sLoss + dLoss;
    if (!(h > -Infinity && h < Infinity)) requireFiniteResult("system", h);
    return h;
  };
}

/** A system curve over a flow range, with its band. */
export interface SystemCurve {
  /** Flows, m³/s. */
  flows: number[];
  /** Design curve (nominal level, new pipe unless chosen otherwise), m. */
  head: number[];
  /** Δp = ρ·g₀·H of the design curve, Pa. */
  pressure: number[];
  /** Band: pointwise lowest and highest of the four corners (usually least lift & new pipe to most lift & aged pipe), m. */
  band: { low: number[]; high: number[] };
  /** The four corners, m. */
  corners: { minNew: number[]; minAged: number[]; maxNew: number[]; maxAged: number[] };
  warnings: EngineWarning[];
}

/**
 * System curve over [flowMin, flowMax] with `points` evenly spaced flows.
 * @param system the system (SI)
 * @param range.flowMax largest flow, m³/s
 * @param range.flowMin smallest flow, m³/s (default 0)
 * @param range.points number of points (count, dimensionless; default 41)
 * @param range.design case of the design curve (unitless; default nominal level, new pipe)
 * @param range.duty the duty flow, m³/s (optional: the transition warning then says where it lies)
 */
export function systemCurve(
  system: SystemSpec | PreparedSystem,
  range: { flowMax: number; flowMin?: number; points?: number; design?: SystemCase; duty?: number | null },
): SystemCurve {
  const sys = asPrepared(system);
  const flowMax = requirePositive("flowMax", range?.flowMax);
  const flowMin = requireNonNegative("flowMin", range.flowMin ?? 0);
  if (flowMin >= flowMax) throw new EngineInputError("flowMin", "must be below flowMax");
  const duty = range.duty == null ? null : requirePositive("duty", range.duty);
  const n = Math.round(requireFinite("points", range.points ?? 41));
  if (n < 2 || n > 10_000) throw new EngineInputError("points", "must be between 2 and 10000");
  const flows: number[] = [];
  for (let i = 0; i < n; i++) flows.push(flowMin + ((flowMax - flowMin) * i) / (n - 1));
  // Each warning once per source: the prepared system's own (the same objects at every flow) once each, a run's
  // once per code and parameter of that run (two runs out of the same range each keep their warning). Under Darcy the
  // transition's is judged from its band's flows instead (transitionBandWarning), whatever flows the grid samples.
  const darcy = sys.lossModel === "darcy";
  const seen = new Set<unknown>();
  const warnings: EngineWarning[] = [];
  const note = (key: unknown, w: () => EngineWarning) => {
    if (!seen.has(key)) { seen.add(key); warnings.push(w()); }
  };
  const at = (c: SystemCase) => flows.map((q) => {
    const r = systemHead(sys, q, c);
    for (const w of sys.warnings) note(w, () => w);
    for (const [side, results, runs] of [["suction", r.suctionRuns, sys.suction], ["discharge", r.dischargeRuns, sys.discharge]] as const) {
      results.forEach((res, i) => {
        for (const w of res.warnings) {
          if (!(darcy && w.code === "transition-flow")) note(`${side}[${i}]|${w.code}|${w.parameter ?? ""}`, () => runWarning(runs[i], w));
        }
      });
    }
    return r.head;
  });
  const head = at({ level: "nominal", roughness: "new", ...range.design });
  const corners = {
    minNew: at({ level: "min", roughness: "new" }),
    minAged: at({ level: "min", roughness: "aged" }),
    maxNew: at({ level: "max", roughness: "new" }),
    maxAged: at({ level: "max", roughness: "aged" }),
  };
  if (darcy) {
    const corr = findCorrelation(sys.frictionMethod) as DarcyCorrelation;
    for (const r of [...sys.suction, ...sys.discharge]) {
      const w = transitionBandWarning(r, sys.fluid.kinematicViscosity, corr, { flowMin, flowMax }, duty);
      if (w) warnings.push(runWarning(r, w));
    }
  }
  const rg = sys.fluid.density * G0;
  const all = [corners.minNew, corners.minAged, corners.maxNew, corners.maxAged];
  const low = flows.map((_, i) => Math.min(...all.map((c) => c[i])));
  const high = flows.map((_, i) => Math.max(...all.map((c) => c[i])));
  return { flows, head, pressure: head.map((h) => rg * h), band: { low, high }, corners, warnings };
}
