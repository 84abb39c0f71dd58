/**
 * Pipe loss: Darcy friction factor with regime, and Darcy-Weisbach head loss
 * hf = (f·L/D + ΣK)·V²/(2g) (Darcy-Weisbach, common practice), or Hazen-Williams.
 */
import { EngineInputError, requireFiniteResult, requireNonNegative, requirePositive, type EngineWarning } from "./errors.ts";
import { churchill, laminar } from "./friction.ts";
import { CORRELATIONS, findCorrelation, rangeWarning, type DarcyCorrelation, type FrictionMethod, type HeadLossCorrelation } from "./registry.ts";
import { G0 } from "./units.ts";
import { fmtNumExact } from "./quantityText.ts";
// Upper Reynolds number of laminar flow, and lower of fully turbulent (common practice); the transition's words.
import { LAMINAR_MAX_RE, TURBULENT_MIN_RE, transitionMessage } from "./transitionText.ts";
export { LAMINAR_MAX_RE, TURBULENT_MIN_RE };

/** Flow regime. `no-flow` only when the flow is zero. */
export type Regime = "laminar" | "transition" | "turbulent" | "no-flow";


/**
 * Flow regime from Reynolds number: ≤ 2000 laminar, 2000–4000 transition, ≥ 4000 turbulent.
 * @param reynolds Reynolds number (dimensionless)
 */
export function regimeOf(reynolds: number): Regime {
  if (!(reynolds >= 0 && reynolds < Infinity)) throw new EngineInputError("reynolds", `must be a finite number ≥ 0 (got ${reynolds})`);
  if (reynolds === 0) return "no-flow";
  if (reynolds <= LAMINAR_MAX_RE) return "laminar";
  if (reynolds < TURBULENT_MIN_RE) return "transition";
  return "turbulent";
}

/** Friction factor with its regime and any warnings. */
export interface FrictionResult {
  /** Darcy friction factor (dimensionless). */
  frictionFactor: number;
  regime: Regime;
  /** Correlation actually used (`laminar` below Re 2000 unless the method is Churchill). */
  method: string;
  warnings: EngineWarning[];
}

function darcy(method: string): DarcyCorrelation {
  const c = findCorrelation(method);
  if (!c || c.kind !== "darcy-friction" || c.id === "laminar") {
    const ids = CORRELATIONS.filter((x) => x.kind === "darcy-friction" && x.id !== "laminar").map((x) => x.id);
    throw new EngineInputError("method", `unknown friction method "${method}" (one of ${ids.join(", ")})`);
  }
  return c;
}

/**
 * Darcy friction factor with regime and validity warnings. Laminar (Re ≤ 2000): 64/Re
 * (Churchill is used as-is in every regime, being one formula for all). Transition
 * (2000 < Re < 4000): the chosen correlation, flagged with its own wording (see
 * transitionText.ts): a turbulent correlation gives the higher, conservative f there;
 * Churchill passes from the laminar value to the turbulent one, so it may give less.
 * Turbulent: the chosen correlation.
 * @param reynolds Reynolds number (dimensionless, > 0)
 * @param relativeRoughness ε/D (dimensionless, ≥ 0)
 * @param method friction correlation id (unitless id; default "colebrook")
 */
export function frictionFactorDetailed(
  reynolds: number,
  relativeRoughness: number,
  method: FrictionMethod = "colebrook",
): FrictionResult {
  requirePositive("reynolds", reynolds);
  requireNonNegative("relativeRoughness", relativeRoughness);
  if (relativeRoughness >= 1) throw new EngineInputError("relativeRoughness", `must be below 1 (got ${relativeRoughness})`);
  const corr = darcy(method);
  const regime = regimeOf(reynolds);
  const warnings: EngineWarning[] = [];
  if (regime === "laminar" && corr.id !== "churchill") {
    return { frictionFactor: requireFiniteResult("reynolds", laminar(reynolds)), regime, method: "laminar", warnings };
  }
  const f = corr.fn(reynolds, relativeRoughness);
  const failed = !Number.isFinite(f) || f <= 0;
  if (failed && !Number.isFinite(churchill(reynolds, relativeRoughness))) requireFiniteResult("reynolds", f);
  // Never return NaN: fall back to Churchill, which is defined for every Re > 0.
  const used = failed ? (findCorrelation("churchill") as DarcyCorrelation) : corr;
  const fUsed = failed ? churchill(reynolds, relativeRoughness) : f;
  if (regime === "transition") {
    warnings.push({ code: "transition-flow", parameter: "reynolds", message: transitionMessage(used, reynolds, relativeRoughness, fUsed) });
  } else {
    const w = rangeWarning(corr, "Re", reynolds, corr.validity.reynolds);
    if (w) warnings.push(w);
  }
  const w2 = rangeWarning(corr, "ε/D", relativeRoughness, corr.validity.relativeRoughness);
  if (w2) warnings.push(w2);
  if (failed) {
    warnings.push({ code: "fallback", message: `${corr.name} failed at Re = ${reynolds}; Churchill used` });
    return { frictionFactor: fUsed, regime, method: "churchill", warnings };
  }
  return { frictionFactor: f, regime, method: corr.id, warnings };
}

/**
 * Darcy friction factor: 64/Re when laminar, else the chosen correlation (see
 * {@link frictionFactorDetailed} for regime and warnings).
 * @param reynolds Reynolds number (dimensionless, > 0)
 * @param relativeRoughness ε/D (dimensionless, ≥ 0)
 * @param method friction correlation id (unitless id; default "colebrook")
 */
export function frictionFactor(
  reynolds: number,
  relativeRoughness: number,
  method: FrictionMethod = "colebrook",
): number {
  return frictionFactorDetailed(reynolds, relativeRoughness, method).frictionFactor;
}

/** Which loss model a pipe uses. */
export type LossModel =
  | { type: "darcy"; method?: FrictionMethod }
  | { type: "hazen-williams"; c: number };

/** Input to {@link pipeHeadLoss}. */
export interface PipeLossInput {
  /** Volumetric flow, m³/s (≥ 0). */
  flow: number;
  /** Inner diameter, m. */
  diameter: number;
  /** Length, m. */
  length: number;
  /** Absolute roughness, m (Darcy model). */
  roughness: number;
  /** Sum of minor-loss coefficients ΣK on this pipe (dimensionless). */
  minorK?: number;
  /** Kinematic viscosity, m²/s. */
  kinematicViscosity: number;
  /** Loss model (default Darcy-Weisbach with Colebrook). */
  model?: LossModel;
}

/** Result of {@link pipeHeadLoss}. */
export interface PipeLossResult {
  /** Mean velocity, m/s. */
  velocity: number;
  /** Reynolds number (dimensionless). */
  reynolds: number;
  /** Darcy friction factor (dimensionless; 0 at zero flow; for Hazen-Williams the equivalent f). */
  frictionFactor: number;
  /** Total head loss (friction + minor), m. */
  headLoss: number;
  /** Pipe friction part, m. */
  frictionLoss: number;
  /** Minor-loss part ΣK·V²/2g, m. */
  minorLoss: number;
  /** Velocity head V²/2g, m. */
  velocityHead: number;
  regime: Regime;
  /** Correlation used. */
  method: string;
  warnings: EngineWarning[];
}

/**
 * Head loss in one pipe: Darcy-Weisbach hf = f·(L/D)·V²/(2g) plus ΣK·V²/(2g), with g = g₀
 * (or Hazen-Williams for the pipe part). Zero flow gives zero loss.
 * @param input.flow volumetric flow, m³/s
 * @param input.diameter inner diameter, m
 * @param input.length pipe length, m
 * @param input.roughness absolute roughness, m
 * @param input.minorK sum of minor-loss coefficients (dimensionless)
 * @param input.kinematicViscosity kinematic viscosity, m²/s
 * @param input.model loss model (unitless descriptor; Hazen-Williams C dimensionless)
 */
export function pipeHeadLoss(input: PipeLossInput): PipeLossResult {
  if (!input || typeof input !== "object") throw new EngineInputError("input", "is required");
  const flow = requireNonNegative("flow", input.flow);
  const D = requirePositive("diameter", input.diameter);
  const L = requireNonNegative("length", input.length);
  const eps = requireNonNegative("roughness", input.roughness);
  const K = requireNonNegative("minorK", input.minorK ?? 0);
  const nu = requirePositive("kinematicViscosity", input.kinematicViscosity);
  const model: LossModel = input.model ?? { type: "darcy" };
  if (!model || (model.type !== "darcy" && model.type !== "hazen-williams")) {
    throw new EngineInputError("model.type", `must be 'darcy' or 'hazen-williams' (got ${String((model as { type?: unknown } | null)?.type)})`);
  }
  const area = (Math.PI * D * D) / 4;
  const V = flow / area;
  const Re = (V * D) / nu;
  if (flow > 0 && !(V < Infinity && Re < Infinity)) requireFiniteResult("flow, diameter, kinematicViscosity", { V, Re });
  if (flow > 0 && !(Re > 0)) throw new EngineInputError("flow", "too small for this diameter and viscosity (Reynolds number underflows)");
  const vh = (V * V) / (2 * G0);
  const minorLoss = K * vh;
  if (flow === 0) {
    return { velocity: 0, reynolds: 0, frictionFactor: 0, headLoss: 0, frictionLoss: 0, minorLoss: 0,
      velocityHead: 0, regime: "no-flow", method: model.type === "darcy" ? (model.method ?? "colebrook") : "hazen-williams", warnings: [] };
  }
  if (model.type === "hazen-williams") {
    const C = requirePositive("model.c", model.c);
    const hw = findCorrelation("hazen-williams") as HeadLossCorrelation;
    const warnings: EngineWarning[] = [];
    for (const [p, v, r] of [["velocity", V, hw.validity.velocity], ["diameter", D, hw.validity.diameter],
      ["kinematicViscosity", nu, hw.validity.kinematicViscosity]] as const) {
      const w = rangeWarning(hw, p, v, r);
      if (w) warnings.push(w);
    }
    const regime = regimeOf(Re);
    if (regime !== "turbulent") warnings.push({ code: "not-turbulent", parameter: "reynolds",
      message: `Hazen-Williams assumes turbulent flow (Re ≥ ${TURBULENT_MIN_RE}); Re = ${fmtNumExact(Re, [TURBULENT_MIN_RE], 0)}` }); // never "4000" for 3999.6
    const frictionLoss = hw.fn(flow, D, L, C);
    const f = L > 0 && vh > 0 ? frictionLoss / ((L / D) * vh) : 0;
    return requireFiniteResult("flow, diameter, length", { velocity: V, reynolds: Re, frictionFactor: f, headLoss: frictionLoss + minorLoss, frictionLoss,
      minorLoss, velocityHead: vh, regime, method: "hazen-williams", warnings });
  }
  if (model.type !== "darcy") throw new EngineInputError("model.type", "must be 'darcy' or 'hazen-williams'");
  const fr = frictionFactorDetailed(Re, eps / D, model.method ?? "colebrook");
  const frictionLoss = fr.frictionFactor * (L / D) * vh;
  const headLoss = frictionLoss + minorLoss;
  if (!(headLoss < Infinity && vh < Infinity)) requireFiniteResult("flow, diameter, length, kinematicViscosity", { headLoss, vh });
  return { velocity: V, reynolds: Re, frictionFactor: fr.frictionFactor,
    headLoss, frictionLoss, minorLoss, velocityHead: vh, regime: fr.regime, method: fr.method, warnings: fr.warnings };
}
