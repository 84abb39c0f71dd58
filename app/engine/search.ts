/**
 * Duty-point search over many curve sets.
 *
 * 1. `prepareSearchIndex` validates and interpolates every curve set once and keeps an
 *    envelope (flow range, largest head) per set.
 * 2. `searchDuty` rejects by envelope first (duty flow beyond the largest reachable flow, or
 *    duty head above the largest reachable head), then evaluates H(Q_duty) and decides:
 *    `direct` when the curve passes within [H_d, H_d·(1 + headTolerance)] at the duty flow;
 *    otherwise `trim` (linear or square law, approximate) or `speed` (affinity laws) when a
 *    ratio within the limits puts the curve through the duty point (first feasible in
 *    `methods` order, default direct → trim → speed).
 * 3. Candidates are ranked by a score built from efficiency at duty (constant-efficiency
 *    assumption for trim/speed), distance from BEP flow, NPSH margin and shaft power; each
 *    gets a reason stating its figures and how it compares with the top candidate.
 */
import { EngineInputError, requireFiniteResult, requirePositive, requireNonNegative, type EngineWarning } from "./errors.ts";
import { evalCubic, type MonotoneCubic } from "./interp.ts";
import { ensurePumpCurve, type PumpCurve, type PumpCurveInput } from "./pumpCurve.ts";
import { brent } from "./roots.ts";
import { G0 } from "./units.ts";
import { MAX_TRIM_FRACTION, type TrimLaw } from "./affinity.ts";

/** A curve set to search: one pump model at one speed and impeller diameter. */
export interface CurveSet {
  /** Id returned with the candidate (e.g. the database id). */
  id: string;
  /** Display label (model, speed, diameter). */
  label?: string;
  curve: PumpCurve | PumpCurveInput;
}

interface Entry {
  id: string;
  label: string;
  c: PumpCurve;
  head: MonotoneCubic;
  eff: MonotoneCubic | null;
  flowMin: number;
  flowMax: number;
  headMax: number;
  bepFlow: number | null;
}

/** Prepared index (reuse it across searches). */
export interface SearchIndex {
  entries: Entry[];
  /** Sets that failed validation, with the reason. */
  rejected: { id: string; reason: string }[];
}

/**
 * Prepares curve sets for searching. Invalid sets are listed in `rejected`, not thrown.
 * @param sets curve sets (SI curves)
 */
export function prepareSearchIndex(sets: readonly CurveSet[]): SearchIndex {
  if (!Array.isArray(sets)) throw new EngineInputError("sets", "must be an array of curve sets");
  const entries: Entry[] = [];
  const rejected: { id: string; reason: string }[] = [];
  for (const s of sets) {
    try {
      const c = ensurePumpCurve(s.curve);
      entries.push({ id: String(s.id), label: s.label ?? String(s.id), c, head: c.head, eff: c.efficiency,
        flowMin: c.flowMin, flowMax: c.flowMax, headMax: c.headMax, bepFlow: c.bep?.flow ?? null });
    } catch (e) {
      rejected.push({ id: String(s?.id), reason: e instanceof Error ? e.message : String(e) });
    }
  }
  return { entries, rejected };
}

/** Search options. Ratios and tolerances are dimensionless fractions. */
export interface SearchOptions {
  /** Direct fit when H(Q_d) is within [H_d, H_d·(1 + headTolerance)] (default 0.05). */
  headTolerance?: number;
  /** Methods tried, in order (default ["direct", "trim", "speed"]). */
  methods?: readonly ("direct" | "trim" | "speed")[];
  /** Trim law (default "linear"). */
  trimLaw?: TrimLaw;
  /** Largest trim as a fraction of the curve's diameter (default 0.2). */
  maxTrimFraction?: number;
  /** Lowest and highest speed ratio (defaults 0.5 and 1.0). */
  minSpeedRatio?: number;
  maxSpeedRatio?: number;
  /** NPSH available at the pump, m (optional; candidates with NPSHa < NPSHr are dropped). */
  npshAvailable?: number;
  /** Required NPSH margin ratio (default 1.1). */
  requiredNpshMargin?: number;
  /** Fluid density for power, kg/m³ (default 998.2, water at 20 °C). */
  density?: number;
  /** Most candidates returned (default 50). */
  limit?: number;
}

/** One candidate that meets the duty. */
export interface Candidate {
  id: string;
  label: string;
  method: "direct" | "trim" | "speed";
  /** Speed or diameter ratio (1 for direct), dimensionless. */
  ratio: number;
  /** Trimmed diameter, m (trim with known diameter). */
  diameter: number | null;
  /** New speed, rpm (speed with known speed). */
  speed: number | null;
  /** Head the (modified) curve gives at the duty flow, m. */
  headAtDuty: number;
  /** Efficiency at duty (fraction), null if the curve has none. */
  efficiency: number | null;
  /** Q_d / Q_BEP of the (modified) curve, dimensionless. */
  bepRatio: number | null;
  inPor: boolean | null;
  /** NPSHr at duty, m. */
  npshr: number | null;
  /** NPSHa / NPSHr, dimensionless. */
  npshMargin: number | null;
  /** Shaft power at duty, W. */
  shaftPower: number | null;
  score: number;
  rank: number;
  reason: string;
  warnings: EngineWarning[];
}

/** Search outcome. */
export interface SearchResult {
  candidates: Candidate[];
  /** Counts: sets searched, rejected by envelope, evaluated, that met the duty. */
  stats: { searched: number; rejectedByEnvelope: number; evaluated: number; matched: number };
}

const pct = (x: number) => `${(x * 100).toFixed(1)} %`;

/**
 * Finds the curve sets that meet a duty, directly or by trim/speed, ranked.
 * @param index prepared index, or raw curve sets (SI)
 * @param duty.flow duty flow, m³/s
 * @param duty.head duty head, m
 * @param options limits and weights (fractions, m, kg/m³; see {@link SearchOptions})
 */
export function searchDuty(
  index: SearchIndex | readonly CurveSet[],
  duty: { flow: number; head: number },
  options: SearchOptions = {},
): SearchResult {
  const idx = Array.isArray(index) ? prepareSearchIndex(index as CurveSet[]) : (index as SearchIndex);
  if (!duty || typeof duty !== "object") throw new EngineInputError("duty", "is required");
  const qd = requirePositive("duty.flow", duty.flow);
  const hd = requirePositive("duty.head", duty.head);
  const tol = requireNonNegative("headTolerance", options.headTolerance ?? 0.05);
  const methods = options.methods ?? ["direct", "trim", "speed"];
  const law = options.trimLaw ?? "linear";
  if (law !== "linear" && law !== "square") throw new EngineInputError("trimLaw", "must be 'linear' or 'square'");
  const k = law === "linear" ? 1 : 2;
  const maxTrim = requireNonNegative("maxTrimFraction", options.maxTrimFraction ?? MAX_TRIM_FRACTION);
  const sLo = requirePositive("minSpeedRatio", options.minSpeedRatio ?? 0.5);
  const sHi = requirePositive("maxSpeedRatio", options.maxSpeedRatio ?? 1);
  if (sLo > sHi) throw new EngineInputError("minSpeedRatio", "must not exceed maxSpeedRatio");
  const npsha = options.npshAvailable === undefined ? null : requireNonNegative("npshAvailable", options.npshAvailable);
  const reqMargin = requirePositive("requiredNpshMargin", options.requiredNpshMargin ?? 1.1);
  const rho = requirePositive("density", options.density ?? 998.2);
  const limit = Math.max(1, Math.round(options.limit ?? 50));
  const useDirect = methods.includes("direct"), useTrim = methods.includes("trim"), useSpeed = methods.includes("speed");
  // Largest factor by which flow and head can grow (speed up), for the envelope test.
  const grow = useSpeed ? Math.max(1, sHi) : 1;
  const trimMinRatio = 1 - maxTrim;
  const hdHigh = hd * (1 + tol);

  const found: Candidate[] = [];
  let rejectedByEnvelope = 0, evaluated = 0;

  for (const e of idx.entries) {
    if (qd > e.flowMax * grow || hd > e.headMax * grow * grow) { rejectedByEnvelope++; continue; }
    evaluated++;
    const h1 = qd >= e.flowMin && qd <= e.flowMax ? (evalCubic(e.head, qd) as number) : null;
    let method: Candidate["method"] | null = null;
    let ratio = 1;
    let kk = 1;
    for (const m of methods) {
      if (m === "direct" && useDirect) {
        if (h1 !== null && h1 >= hd && h1 <= hdHigh) { method = "direct"; break; }
      } else if (m === "trim" && useTrim) {
        if (h1 !== null && h1 > hd || h1 === null && qd < e.flowMin) {
          const r = solveScale(e, qd, hd, k, trimMinRatio, 1);
          if (r !== null && (e.c.minDiameter === null || e.c.impellerDiameter === null || e.c.impellerDiameter * r >= e.c.minDiameter * (1 - 1e-9))) {
            method = "trim"; ratio = r; kk = k; break;
          }
        }
      } else if (m === "speed" && useSpeed) {
        const r = solveScale(e, qd, hd, 1, sLo, sHi);
        if (r !== null) { method = "speed"; ratio = r; kk = 1; break; }
      }
    }
    if (method === null) continue;
    const qOrig = qd / Math.pow(ratio, kk); // flow on the original curve that maps to the duty flow
    const headAtDuty = method === "direct" ? (h1 as number) : hd;
    const eff = e.eff ? evalCubic(e.eff, qOrig) : efficiencyFromPower(e.c, qOrig);
    const bepQ = e.bepFlow === null ? null : e.bepFlow * Math.pow(ratio, kk);
    const bepRatio = bepQ ? qd / bepQ : null;
    let npshr: number | null = null;
    if (e.c.npshr) {
      const n0 = evalCubic(e.c.npshr, qOrig);
      npshr = n0 === null ? null : method === "speed" ? n0 * ratio * ratio : n0;
    }
    const npshMargin = npsha !== null && npshr !== null && npshr > 0 ? npsha / npshr : null;
    if (npshMargin !== null && npshMargin < 1) continue; // cavitation: cannot meet the duty
    const shaftPower = eff !== null && eff > 0 ? (rho * G0 * qd * headAtDuty) / eff : null;
    const warnings: EngineWarning[] = [];
    if (method === "trim") warnings.push({ code: "trim-approximate", message: `trim by the ${law} law is approximate` });
    found.push({
      id: e.id, label: e.label, method, ratio,
      diameter: method === "trim" && e.c.impellerDiameter !== null ? e.c.impellerDiameter * ratio : e.c.impellerDiameter,
      speed: method === "speed" && e.c.speed !== null ? e.c.speed * ratio : e.c.speed,
      headAtDuty, efficiency: eff, bepRatio, inPor: bepRatio === null ? null : bepRatio >= 0.7 && bepRatio <= 1.2,
      npshr, npshMargin, shaftPower, score: 0, rank: 0, reason: "", warnings,
    });
  }

  // Score: efficiency first; penalties for distance from BEP, thin NPSH margin, extra power.
  let minPower = Infinity, bestEff = 0;
  for (const c of found) {
    if (c.shaftPower !== null && c.shaftPower < minPower) minPower = c.shaftPower;
    if (c.efficiency !== null && c.efficiency > bestEff) bestEff = c.efficiency;
  }
  for (const c of found) {
    let s = c.efficiency ?? 0.3;
    if (c.bepRatio !== null) s -= 0.5 * Math.abs(c.bepRatio - 1);
    else s -= 0.1;
    if (c.npshMargin !== null && c.npshMargin < reqMargin) s -= 0.1 * (reqMargin - c.npshMargin) / (reqMargin - 1 || 1) + 0.05;
    if (c.shaftPower !== null && Number.isFinite(minPower)) s -= 0.1 * (c.shaftPower / minPower - 1);
    c.score = s;
  }
  found.sort((a, b) => b.score - a.score || (a.id < b.id ? -1 : a.id > b.id ? 1 : 0));
  const top = found.slice(0, limit);
  top.forEach((c, i) => {
    c.rank = i + 1;
    const parts: string[] = [];
    parts.push(c.method === "direct" ? `meets the duty directly (${c.headAtDuty.toFixed(1)} m at duty flow)`
      : c.method === "trim" ? `meets the duty trimmed to ${pct(c.ratio)} of its diameter${c.diameter !== null ? ` (${(c.diameter * 1000).toFixed(0)} mm)` : ""}`
      : `meets the duty at ${pct(c.ratio)} speed${c.speed !== null ? ` (${Math.round(c.speed)} rpm)` : ""}`);
    parts.push(c.efficiency !== null ? `${pct(c.efficiency)} efficient at duty${c.efficiency >= bestEff - 1e-12 ? " (best found)" : ` (${((bestEff - c.efficiency) * 100).toFixed(1)} points below best)`}` : "no efficiency data (ranked down)");
    if (c.bepRatio !== null) parts.push(`${Math.round(c.bepRatio * 100)} % of BEP flow${c.inPor ? " (inside POR)" : " (outside POR 70–120 %)"}`);
    if (c.npshMargin !== null) parts.push(`NPSH margin ${c.npshMargin.toFixed(2)}${c.npshMargin < reqMargin ? ` (below ${reqMargin})` : ""}`);
    if (c.shaftPower !== null) parts.push(`${(c.shaftPower / 1000).toFixed(2)} kW shaft${c.shaftPower <= minPower * (1 + 1e-12) ? " (lowest)" : ""}`);
    c.reason = `#${c.rank} of ${found.length}: ${parts.join("; ")}`;
  });
  return requireFiniteResult("duty", { candidates: top, stats: { searched: idx.entries.length, rejectedByEnvelope, evaluated, matched: found.length } });
}

function efficiencyFromPower(c: PumpCurve, q: number): number | null {
  if (!c.power || q <= 0) return null;
  const p = evalCubic(c.power, q);
  const h = evalCubic(c.head, q);
  return p === null || h === null || p <= 0 ? null : (c.powerDensity * G0 * q * h) / p;
}

/** Ratio s in [lo, hi] with s²·H(Qd/s^k) = Hd (largest root if several); null if none. */
function solveScale(e: Entry, qd: number, hd: number, k: number, lo: number, hi: number): number | null {
  const sMin = Math.max(lo, k === 1 ? qd / e.flowMax : Math.sqrt(qd / e.flowMax));
  const sMax = e.flowMin > 0 ? Math.min(hi, k === 1 ? qd / e.flowMin : Math.sqrt(qd / e.flowMin)) : hi;
  if (!(sMin <= sMax)) return null;
  const f = (s: number) => s * s * (evalCubic(e.head, qd / (k === 1 ? s : s * s)) ?? 0) - hd;
  const fHi = f(sMax);
  if (fHi === 0) return sMax;
  const fLo = f(sMin);
  if (fLo === 0) return sMin;
  if (fLo * fHi < 0) {
    const r = brent(f, sMin, sMax, 1e-12);
    return r ? r.x : null;
  }
  if (fHi < 0 || !e.c.drooping) return null;
  // Drooping curve with both ends above the duty: scan for a bracket.
  let prev = sMax, fp = fHi;
  for (let i = 1; i <= 16; i++) {
    const s = sMax - ((sMax - sMin) * i) / 16;
    const fs = f(s);
    if (fp * fs <= 0) { const r = brent(f, s, prev, 1e-12); return r ? r.x : null; }
    prev = s; fp = fs;
  }
  return null;
}
