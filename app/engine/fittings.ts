/**
 * Minor losses as data. A fitting's K is either fixed, or K = n·fT after Crane Co., "Flow of
 * Fluids Through Valves, Fittings, and Pipe", Technical Paper No. 410, 2009 edition (from
 * memory; the butterfly and tee values cross-checked against python3-fluids, which implements
 * that edition), where fT is the fully turbulent Darcy friction factor of clean commercial steel
 * of the fitting's size. Where the reference gives n by size (butterfly valve), the entry holds
 * size bands and a size range; a size outside the range (or outside the fT table, ½–24 in)
 * gives a warning. Where editions differ, the larger (conservative) K is used.
 * ΣK per pipe run sums count × K. Loss = K·V²/(2g) with V the mean velocity in the pipe.
 */
import { EngineInputError, requireInteger, requirePositive, type EngineWarning } from "./errors.ts";
import { fullyRoughFrictionFactor } from "./friction.ts";
import { qt, qtExact, qtLimit } from "./quantityText.ts";

/** n by nominal size: the first band whose `upTo` (in, inclusive) is ≥ the size applies. */
export interface SizeBand {
  /** Largest nominal size of the band, in (Infinity for the last band). */
  upTo: number;
  /** K = n·fT in this band (dimensionless). */
  n: number;
}

/** How a fitting's K is obtained. `atLeast`: a floor on n·fT from another edition (conservative). */
export type KModel =
  | { type: "fixed"; k: number }
  | { type: "ft-multiple"; n: number; atLeast?: number }
  | { type: "ft-by-size"; bands: readonly SizeBand[] };

/** One fitting in the catalogue. */
export interface FittingDef {
  id: string;
  name: string;
  model: KModel;
  source: string;
  /** Nominal sizes the reference covers, in (inclusive); outside → warning. */
  sizeRange?: { min: number; max: number };
}

const CRANE = "Crane TP-410, 2009 edition, K = n·fT (from memory)";
const COMMON = "common practice";

/** Crane TP-410 (2009) tee, all flow through the branch, 90°, equal bore: K = G[1 + H·1²] with G = 1.3, H = 0.3 (J = 0) → 1.69. */
export const TEE_BRANCH_K_2009 = 1.69;

/** Fittings catalogue. */
export const FITTINGS: readonly FittingDef[] = [
  { id: "elbow-90-standard", name: "90° elbow, standard", model: { type: "ft-multiple", n: 30 }, source: CRANE },
  { id: "elbow-90-long-radius", name: "90° bend, long radius (r/d = 1.5)", model: { type: "ft-multiple", n: 14 }, source: CRANE },
  { id: "elbow-45-standard", name: "45° elbow, standard", model: { type: "ft-multiple", n: 16 }, source: CRANE },
  { id: "return-bend", name: "180° close return bend", model: { type: "ft-multiple", n: 50 }, source: CRANE },
  // 2009 edition's tee method gives K ≈ 0 for the run with no branch flow; the older 20·fT is larger: kept (conservative).
  { id: "tee-run", name: "Tee, flow through run", model: { type: "ft-multiple", n: 20 },
    source: "Crane TP-410, 20·fT (1988 edition; the 2009 tee method gives less with no branch flow), from memory" },
  // 2009 edition, diverging tee, all flow through the branch (python3-fluids K_branch_diverging_Crane: 1.69);
  // the older 60·fT (0.72–1.62 over the ½–24 in fT table) is lower at every tabled size, kept only as a floor.
  { id: "tee-branch", name: "Tee, flow through branch", model: { type: "ft-multiple", n: 60, atLeast: TEE_BRANCH_K_2009 },
    source: "Crane TP-410, 2009 edition: diverging 90° tee, equal bore, all flow through the branch, K = 1.69 (not below 60·fT)" },
  { id: "gate-valve-open", name: "Gate valve, fully open", model: { type: "ft-multiple", n: 8 }, source: CRANE },
  { id: "ball-valve-open", name: "Ball valve, full port, open", model: { type: "ft-multiple", n: 3 }, source: CRANE },
  { id: "globe-valve-open", name: "Globe valve, fully open", model: { type: "ft-multiple", n: 340 }, source: CRANE },
  { id: "angle-valve-open", name: "Angle valve (90°), fully open", model: { type: "ft-multiple", n: 150 }, source: CRANE },
  // Centric butterfly: 45·fT for 2–8 in, 35·fT for 10–14 in, 25·fT for 16–24 in (band edges at 9 and 15 in, as python3-fluids).
  { id: "butterfly-valve-open", name: "Butterfly valve, open (2–24 in)",
    model: { type: "ft-by-size", bands: [{ upTo: 9, n: 45 }, { upTo: 15, n: 35 }, { upTo: Infinity, n: 25 }] },
    source: "Crane TP-410, 2009 edition, centric butterfly valve: 45·fT (2–8 in), 35·fT (10–14 in), 25·fT (16–24 in), from memory",
    sizeRange: { min: 2, max: 24 } },
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

/** Nominal sizes the fT table covers, in. */
export const CRANE_FT_RANGE = { min: 0.5, max: 24 } as const;

const INCH = 0.0254; // m, exact (NIST SP 811)

/** "4" → 4, "1-1/2" → 1.5, "3/4" → 0.75; null if not a size in inches. */
function parseNominal(label: string): number | null {
  const m = /^\s*(?:(\d+(?:\.\d+)?)(?:[- ](\d+)\/(\d+))?|(\d+)\/(\d+))\s*(?:in|")?\s*$/.exec(label);
  if (!m) return null;
  const v = m[4] !== undefined ? Number(m[4]) / Number(m[5]) : Number(m[1]) + (m[2] !== undefined ? Number(m[2]) / Number(m[3]) : 0);
  return v > 0 && Number.isFinite(v) ? v : null;
}

/**
 * Size used to pick a band and check a range: the nominal size when the label reads as inches,
 * else the inner diameter in inches (then a range's lower end is taken 10 % lower, as schedule
 * pipe's bore is below its nominal size).
 * @param diameter inner diameter, m
 * @param nominal nominal size label in inches (unitless label; optional)
 */
function sizeOf(diameter: number, nominal?: string): { inches: number; fromNominal: boolean } {
  const n = nominal !== undefined ? parseNominal(nominal) : null;
  return n !== null ? { inches: n, fromNominal: true } : { inches: diameter / INCH, fromNominal: false };
}

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

/** K of one fitting with the warnings its size raises. */
export interface FittingKResult {
  /** Loss coefficient (dimensionless). */
  k: number;
  warnings: EngineWarning[];
}

const fmtIn = (v: number) => (Number.isInteger(v) ? String(v) : v.toFixed(2));

/**
 * K of one fitting in a pipe of this size, with a warning when the size is outside the entry's
 * range or outside the fT table.
 * @param fittingId fitting id (unitless id)
 * @param diameter inner diameter of the pipe, m
 * @param nominal nominal size label in inches (unitless label; optional)
 */
export function fittingKDetailed(fittingId: string, diameter: number, nominal?: string): FittingKResult {
  const f = fitting(fittingId);
  requirePositive("diameter", diameter);
  if (f.model.type === "fixed") return { k: f.model.k, warnings: [] };
  const warnings: EngineWarning[] = [];
  const size = sizeOf(diameter, nominal);
  // A nominal size is a name; a bore a length, read apart from the range's ends (a 610 mm bore read "610 mm is outside the 50.8 mm–610 mm").
  const ends = f.sizeRange ? [f.sizeRange.min * INCH, f.sizeRange.max * INCH] : [];
  const what = size.fromNominal ? `nominal size ${fmtIn(size.inches)} in` : `bore ${qtExact("diameter", diameter, ends)}`;
  const end = (inches: number) => (size.fromNominal ? qt("diameter", inches * INCH) : qtLimit("diameter", inches * INCH, [diameter]));
  const slack = size.fromNominal ? 1 : 0.9;
  const ft = fittingFrictionFactor(diameter, nominal);
  let n: number;
  if (f.model.type === "ft-by-size") {
    const bands = f.model.bands;
    n = (bands.find((b) => size.inches <= b.upTo * (1 + 1e-9)) ?? bands[bands.length - 1]).n; // 1e-9: m → in rounding at an edge
  } else n = f.model.n;
  const floor = f.model.type === "ft-multiple" ? f.model.atLeast : undefined;
  const k = floor !== undefined ? Math.max(n * ft, floor) : n * ft;
  // The K used, with how it was made, on every warning about the size (an engineer signs the number, not "extrapolated").
  const used = `K = ${n} × fT ${ft.toFixed(4)} = ${(n * ft).toFixed(3)}${floor !== undefined && n * ft < floor ? `, raised to its floor ${floor}` : ""} used`;
  if (f.sizeRange && (size.inches < f.sizeRange.min * slack || size.inches > f.sizeRange.max)) {
    warnings.push({ code: "fitting-size-outside-range", parameter: "nominal",
      message: `${f.name}: ${what} is outside the ${end(f.sizeRange.min)}–${end(f.sizeRange.max)} the reference covers; K extrapolated with the nearest size band's n: ${used}` });
  }
  const listed = nominal !== undefined && CRANE_FT[nominal] !== undefined;
  if (!listed && (size.inches < CRANE_FT_RANGE.min * slack || size.inches > CRANE_FT_RANGE.max)) {
    // fittingFrictionFactor takes the rough-pipe limit at the bore, but never below 1 mm (the formula's domain).
    warnings.push({ code: "ft-outside-table", parameter: "nominal",
      message: `${f.name}: ${what} is outside Crane's fT table (½–24 in); fT from the rough-pipe Colebrook limit of clean steel (ε 0.045 mm) at a bore of ${qt("diameter", Math.max(diameter, 1e-3))}: ${used}` });
  }
  return { k, warnings };
}

/**
 * K of one fitting in a pipe of this size (see {@link fittingKDetailed} for the warnings).
 * @param fittingId fitting id (unitless id)
 * @param diameter inner diameter of the pipe, m
 * @param nominal nominal size label in inches (unitless label; optional)
 */
export function fittingK(fittingId: string, diameter: number, nominal?: string): number {
  return fittingKDetailed(fittingId, diameter, nominal).k;
}

/** A fitting used on a run: catalogue id, or a user K, with a count. */
export type FittingUse = { id: string; count?: number } | { k: number; count?: number; name?: string };

/**
 * ΣK of a pipe run's fittings, with the size warnings of its catalogue fittings.
 * @param fittings fittings with counts (unitless; user K dimensionless)
 * @param diameter inner diameter of the run, m
 * @param nominal nominal size label in inches (unitless label; optional)
 */
export function sumKDetailed(fittings: readonly FittingUse[], diameter: number, nominal?: string): FittingKResult {
  if (!Array.isArray(fittings)) throw new EngineInputError("fittings", "must be an array");
  requirePositive("diameter", diameter);
  let total = 0;
  const warnings: EngineWarning[] = [];
  fittings.forEach((use, i) => {
    if (!use || typeof use !== "object") throw new EngineInputError(`fittings[${i}]`, "must be a fitting");
    const count = requireInteger(`fittings[${i}].count`, use.count ?? 1, 0);
    let k: number;
    if ("id" in use) {
      const r = fittingKDetailed(use.id, diameter, nominal);
      k = r.k;
      if (count > 0) for (const w of r.warnings) if (!warnings.some((x) => x.message === w.message)) warnings.push(w);
    } else k = use.k;
    if (!Number.isFinite(k) || k < 0) throw new EngineInputError(`fittings[${i}].k`, "must be a finite number ≥ 0");
    total += count * k;
  });
  return { k: total, warnings };
}

/**
 * ΣK of a pipe run's fittings.
 * @param fittings fittings with counts (unitless; user K dimensionless)
 * @param diameter inner diameter of the run, m
 * @param nominal nominal size label in inches (unitless label; optional)
 */
export function sumK(fittings: readonly FittingUse[], diameter: number, nominal?: string): number {
  return sumKDetailed(fittings, diameter, nominal).k;
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
