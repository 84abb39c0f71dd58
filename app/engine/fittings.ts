/**
 * Minor losses as data. A fitting's K is either fixed, or K = n·fT after Crane Technical
 * Paper No. 410 (from memory), where fT is the fully turbulent Darcy friction factor of
 * clean commercial steel of the fitting's size. ΣK per pipe run sums count × K.
 * Loss = K·V²/(2g) with V the mean velocity in the pipe the fitting sits in.
 */
import { EngineInputError, requireInteger, requirePositive } from "./errors.ts";
import { fullyRoughFrictionFactor } from "./friction.ts";

/** How a fitting's K is obtained. */
export type KModel = { type: "fixed"; k: number } | { type: "ft-multiple"; n: number };

/** One fitting in the catalogue. */
export interface FittingDef {
  id: string;
  name: string;
  model: KModel;
  source: string;
}

const CRANE = "Crane Technical Paper No. 410, K = n·fT (from memory)";
const COMMON = "common practice";

/** Fittings catalogue. */
export const FITTINGS: readonly FittingDef[] = [
  { id: "elbow-90-standard", name: "90° elbow, standard", model: { type: "ft-multiple", n: 30 }, source: CRANE },
  { id: "elbow-90-long-radius", name: "90° bend, long radius (r/d = 1.5)", model: { type: "ft-multiple", n: 14 }, source: CRANE },
  { id: "elbow-45-standard", name: "45° elbow, standard", model: { type: "ft-multiple", n: 16 }, source: CRANE },
  { id: "return-bend", name: "180° close return bend", model: { type: "ft-multiple", n: 50 }, source: CRANE },
  { id: "tee-run", name: "Tee, flow through run", model: { type: "ft-multiple", n: 20 }, source: CRANE },
  { id: "tee-branch", name: "Tee, flow through branch", model: { type: "ft-multiple", n: 60 }, source: CRANE },
  { id: "gate-valve-open", name: "Gate valve, fully open", model: { type: "ft-multiple", n: 8 }, source: CRANE },
  { id: "ball-valve-open", name: "Ball valve, full port, open", model: { type: "ft-multiple", n: 3 }, source: CRANE },
  { id: "globe-valve-open", name: "Globe valve, fully open", model: { type: "ft-multiple", n: 340 }, source: CRANE },
  { id: "angle-valve-open", name: "Angle valve (90°), fully open", model: { type: "ft-multiple", n: 150 }, source: CRANE },
  { id: "butterfly-valve-open", name: "Butterfly valve, open (2–8 in)", model: { type: "ft-multiple", n: 45 }, source: CRANE },
  { id: "plug-valve-open", name: "Plug valve, straight-way, open", model: { type: "ft-multiple", n: 18 }, source: CRANE },
  { id: "swing-check", name: "Swing check valve", model: { type: "ft-multiple", n: 100 }, source: CRANE },
  { id: "lift-check", name: "Lift check valve", model: { type: "ft-multiple", n: 600 }, source: CRANE },
  { id: "foot-valve-strainer", name: "Foot valve with strainer, hinged disc", model: { type: "ft-multiple", n: 75 }, source: CRANE },
  { id: "foot-valve-poppet", name: "Foot valve with strainer, poppet disc", model: { type: "ft-multiple", n: 420 }, source: CRANE },
  { id: "entrance-sharp", name: "Pipe entrance, sharp-edged", model: { type: "fixed", k: 0.5 }, source: COMMON },
  { id: "entrance-projecting", name: "Pipe entrance, inward projecting", model: { type: "fixed", k: 0.78 }, source: CRANE },
  { id: "entrance-rounded", name: "Pipe entrance, well rounded", model: { type: "fixed", k: 0.04 }, source: CRANE },
  { id: "exit", name: "Pipe exit into a tank", model: { type: "fixed", k: 1.0 }, source: COMMON },
];

/**
 * fT by nominal size (inches), Crane TP-410 (from memory), clean commercial steel.
 * Sizes not listed fall back to {@link fullyRoughFrictionFactor} of the inner diameter.
 */
export const CRANE_FT: Readonly<Record<string, number>> = {
  "1/2": 0.027, "3/4": 0.025, "1": 0.023, "1-1/4": 0.022, "1-1/2": 0.021, "2": 0.019,
  "2-1/2": 0.018, "3": 0.018, "4": 0.017, "5": 0.016, "6": 0.015, "8": 0.014, "10": 0.014,
  "12": 0.013, "14": 0.013, "16": 0.013, "18": 0.012, "20": 0.012, "24": 0.012,
};

/**
 * Fully turbulent friction factor fT for K = n·fT: from the Crane table when the nominal
 * size is listed, else the rough-pipe Colebrook limit with ε = 0.045 mm at this diameter.
 * @param diameter inner diameter, m
 * @param nominal nominal size label in inches, e.g. "4" (unitless label; optional)
 */
export function fittingFrictionFactor(diameter: number, nominal?: string): number {
  requirePositive("diameter", diameter);
  if (nominal !== undefined && CRANE_FT[nominal] !== undefined) return CRANE_FT[nominal];
  return fullyRoughFrictionFactor(Math.max(diameter, 1e-3));
}

/**
 * Finds a fitting; throws {@link EngineInputError} if unknown.
 * @param fittingId fitting id (unitless id)
 */
export function fitting(fittingId: string): FittingDef {
  const f = FITTINGS.find((x) => x.id === fittingId);
  if (!f) throw new EngineInputError("fittingId", `unknown fitting "${fittingId}"`);
  return f;
}

/**
 * K of one fitting in a pipe of this size.
 * @param fittingId fitting id (unitless id)
 * @param diameter inner diameter of the pipe, m
 * @param nominal nominal size label in inches (unitless label; optional)
 */
export function fittingK(fittingId: string, diameter: number, nominal?: string): number {
  const f = fitting(fittingId);
  return f.model.type === "fixed" ? f.model.k : f.model.n * fittingFrictionFactor(diameter, nominal);
}

/** A fitting used on a run: catalogue id, or a user K, with a count. */
export type FittingUse = { id: string; count?: number } | { k: number; count?: number; name?: string };

/**
 * ΣK of a pipe run's fittings.
 * @param fittings fittings with counts (unitless; user K dimensionless)
 * @param diameter inner diameter of the run, m
 * @param nominal nominal size label in inches (unitless label; optional)
 */
export function sumK(fittings: readonly FittingUse[], diameter: number, nominal?: string): number {
  let total = 0;
  fittings.forEach((use, i) => {
    const count = requireInteger(`fittings[${i}].count`, use.count ?? 1, 0);
    const k = "id" in use ? fittingK(use.id, diameter, nominal) : use.k;
    if (!Number.isFinite(k) || k < 0) throw new EngineInputError(`fittings[${i}].k`, "must be a finite number ≥ 0");
    total += count * k;
  });
  return total;
}

/**
 * Sudden enlargement K = (1 − β²)², β = d₁/d₂, referred to the upstream (smaller) pipe's
 * velocity (Borda-Carnot; common practice).
 * @param upstreamDiameter smaller, upstream inner diameter, m
 * @param downstreamDiameter larger, downstream inner diameter, m
 */
export function suddenEnlargementK(upstreamDiameter: number, downstreamDiameter: number): number {
  const b = requirePositive("upstreamDiameter", upstreamDiameter) / requirePositive("downstreamDiameter", downstreamDiameter);
  if (b > 1) throw new EngineInputError("upstreamDiameter", "must not exceed the downstream diameter");
  const x = 1 - b * b;
  return x * x;
}

/**
 * Sudden contraction K = 0.5·(1 − β²), β = d₂/d₁, referred to the downstream (smaller)
 * pipe's velocity (Crane TP-410, from memory).
 * @param upstreamDiameter larger, upstream inner diameter, m
 * @param downstreamDiameter smaller, downstream inner diameter, m
 */
export function suddenContractionK(upstreamDiameter: number, downstreamDiameter: number): number {
  const b = requirePositive("downstreamDiameter", downstreamDiameter) / requirePositive("upstreamDiameter", upstreamDiameter);
  if (b > 1) throw new EngineInputError("downstreamDiameter", "must not exceed the upstream diameter");
  return 0.5 * (1 - b * b);
}
