/**
 * Duty-point search over many curve sets.
 *
 * 1. `prepareSearchIndex` (searchIndex.ts) validates and interpolates every curve set once and
 *    keeps an envelope (flow range, largest head) per set.
 * 2. `searchDuty` rejects by envelope first (duty flow beyond the largest reachable flow, or
 *    duty head above the largest reachable head), then evaluates H(Q_duty) and decides:
 *    `direct` when the curve passes within [H_d, H_d·(1 + headTolerance)] at the duty flow, each end to 1 part in 10⁸
 *    (LIMIT_ROUNDING, limitText.ts `insideEnds`: the allowance of the search's NPSH cut and POR too);
 *    otherwise `trim` (linear or square law, approximate) or `speed` (affinity laws) when a
 *    ratio within the limits puts the curve through the duty point (first feasible in
 *    `methods` order, default direct → trim → speed).
 * 3. Candidates are ranked by a score built from efficiency at duty (constant-efficiency
 *    assumption for trim/speed), distance from BEP flow, NPSH margin and shaft power; each
 *    gets a reason stating its figures and how it compares with the row above it
 *    (`explainRanks` in searchExplain.ts, also used by the app after it filters and merges rows).
 */
import { EngineInputError, requireFiniteResult, requirePositive, requireNonNegative, type EngineWarning } from "./errors.ts";
import { brent } from "./roots.ts";
import { G0 } from "./units.ts";
import { insideEnds, LIMIT_ROUNDING } from "./limitText.ts";
import { POR_FRACTION } from "./pumpCurve.ts";
import { LIMIT_ROUNDOFF, MAX_TRIM_FRACTION, type TrimLaw } from "./affinity.ts";
import { evalNpshrPacked, evalPacked, prepareSearchIndex, type CurveSet, type SearchIndex } from "./searchIndex.ts";
import { explainRanks } from "./searchExplain.ts";
import { npshRatioBelow } from "./npshRatio.ts";

export type { CurveSet, SearchIndex } from "./searchIndex.ts";

/** Search options. Ratios and tolerances are dimensionless fractions. */
export interface SearchOptions {
  /** Direct fit when H(Q_d) is within [H_d, H_d·(1 + headTolerance)], each end to 1 part in 10⁸ (default 0.05). */
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
  /**
   * The direct fit's numbers, whatever the method: the duty searched (flow m³/s, head m), the window's top H_d·(1 + tol), m,
   * and the curve's head as published at the duty flow, m (null: the duty flow is outside its published flows). Direct
   * when that head is within [head, headHigh], each end to 1 part in 10⁸ (LIMIT_ROUNDING), so every row can say why.
   */
  direct: { flow: number; head: number; headHigh: number; publishedHead: number | null };
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
  /** Counts: sets searched, rejected by envelope, evaluated, left out for NPSHa below NPSHr at the duty, that met the duty. */
  stats: { searched: number; rejectedByEnvelope: number; evaluated: number; rejectedByNpsh: number; matched: number };
}

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
  if (!idx || typeof idx.count !== "number") throw new EngineInputError("index", "must be a prepared index or an array of curve sets");
  if (!duty || typeof duty !== "object") throw new EngineInputError("duty", "is required");
  const qd = requirePositive("duty.flow", duty.flow);
  const hd = requirePositive("duty.head", duty.head);
  const tol = requireNonNegative("headTolerance", options.headTolerance ?? 0.05);
  const methods = options.methods ?? ["direct", "trim", "speed"];
  if (!Array.isArray(methods) || methods.some((m) => m !== "direct" && m !== "trim" && m !== "speed")) throw new EngineInputError("methods", "must list only 'direct', 'trim' and 'speed'");
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
  const solveScale = scaleSolver(idx, qd, hd);

  // Every match is kept as numbers in parallel arrays (no object per match: a large library can match
  // tens of thousands of sets); only the `limit` best become Candidate objects.
  const fE: number[] = [], fMethod: number[] = [], fRatio: number[] = [], fHead: number[] = [], fH1: (number | null)[] = [];
  const fEff: (number | null)[] = [], fBep: (number | null)[] = [], fNpshr: (number | null)[] = [], fMargin: (number | null)[] = [], fPower: (number | null)[] = [];
  const METHODS = ["direct", "trim", "speed"] as const;
  let rejectedByEnvelope = 0, evaluated = 0, rejectedByNpsh = 0;

  const fMin = idx.flowMin, fMax = idx.flowMax, hMax = idx.headMax;
  for (let e = 0; e < idx.count; e++) {
    if (qd > fMax[e] * grow || hd > hMax[e] * grow * grow) { rejectedByEnvelope++; continue; }
    evaluated++;
    const h1 = qd >= fMin[e] && qd <= fMax[e] ? (evalPacked(idx.head, e, qd) as number) : null;
    let method = -1;
    let ratio = 1;
    let kk = 1;
    for (let mi = 0; mi < methods.length; mi++) {
      const m = methods[mi];
      if (m === "direct" && useDirect) {
        // Each end to LIMIT_ROUNDING (before, none: 1e-12 under H_d was "speed" at 100 % or dropped, 1e-12 over the top trimmed).
        if (h1 !== null && insideEnds(h1, hd, hdHigh)) { method = 0; break; }
      } else if (m === "trim" && useTrim) {
        if ((h1 !== null && h1 > hd) || (h1 === null && qd < fMin[e])) {
          const r = solveScale(e, k, trimMinRatio, 1);
          const dia = idx.diameter[e], dMin = idx.minDiameter[e];
          // The model's smallest impeller with the verdict's and scaleByTrim's one allowance (LIMIT_ROUNDOFF): a trim the
          // verdict finds inside the catalogue is not refused here (it was 1e-9 here, 1e-6 there).
          if (r !== null && (dMin < 0 || dia < 0 || dia * r >= dMin * (1 - LIMIT_ROUNDOFF))) {
            method = 1; ratio = r; kk = k; break;
          }
        }
      } else if (m === "speed" && useSpeed) {
        const r = solveScale(e, 1, sLo, sHi);
        if (r !== null) { method = 2; ratio = r; kk = 1; break; }
      }
    }
    if (method < 0) continue;
    const qOrig = Math.min(fMax[e], qd / Math.pow(ratio, kk)); // flow on the original curve that maps to the duty flow (rounding at the end clamped)
    const headAtDuty = method === 0 ? (h1 as number) : hd;
    const eff = evalPacked(idx.eff, e, qOrig);
    const bepQ = idx.bepFlow[e] < 0 ? null : idx.bepFlow[e] * Math.pow(ratio, kk);
    const bepRatio = bepQ ? qd / bepQ : null;
    let npshr: number | null = null;
    const n0 = evalNpshrPacked(idx.npshr, e, qOrig); // a rounding error past its end reads the end (npshrEnds.ts NPSHR_END_ROUNDING)
    if (n0 !== null) npshr = method === 2 ? n0 * ratio * ratio : n0;
    // An NPSHr so small that NPSHa / NPSHr is no finite number (5e-324 m) is no requirement to judge against: no margin, as
    // without NPSHr (it threw the whole search); at NPSHa 0 the ratio is 0, and the pump is left out as every other.
    const ratioAtDuty = npsha !== null && npshr !== null && npshr > 0 ? npsha / npshr : null;
    const npshMargin = ratioAtDuty !== null && Number.isFinite(ratioAtDuty) ? ratioAtDuty : null;
    // Cavitation: cannot meet the duty — NPSHa / NPSHr below 1 (to 1 part in 10⁸, figures.ts `npshRatioBelow`), or NPSHa
    // at zero (the caller's NPSHa ≤ 0) beside any NPSHr at the duty, 0 included: the liquid boils at the inlet whatever the
    // pump (an NPSHr read as 0, 5e-324 m × a speed ratio² below ½, had no ratio and kept the pump).
    if (npshr !== null && (npsha === 0 || (npshMargin !== null && npshRatioBelow(npshMargin, 1)))) { rejectedByNpsh++; continue; }
    fE.push(e); fMethod.push(method); fRatio.push(ratio); fHead.push(headAtDuty); fH1.push(h1);
    fEff.push(eff); fBep.push(bepRatio); fNpshr.push(npshr); fMargin.push(npshMargin);
    fPower.push(eff !== null && eff > 0 ? (rho * G0 * qd * headAtDuty) / eff : null);
  }
  const matched = fE.length;

  // Score: efficiency first; penalties for distance from BEP, thin NPSH margin, extra power.
  let minPower = Infinity;
  for (let j = 0; j < matched; j++) {
    const p = fPower[j];
    if (p !== null && p < minPower) minPower = p;
  }
  const score = new Float64Array(matched);
  for (let j = 0; j < matched; j++) score[j] = searchScore(fEff[j], fBep[j], fMargin[j], fPower[j], minPower, reqMargin);
  const ids = idx.ids;
  const top: Candidate[] = bestMatches(score, limit, (a, b) => score[b] - score[a] || (ids[fE[a]] < ids[fE[b]] ? -1 : ids[fE[a]] > ids[fE[b]] ? 1 : 0)).map((j) => {
    const e = fE[j], method = METHODS[fMethod[j]], ratio = fRatio[j], bepRatio = fBep[j];
    const warnings: EngineWarning[] = [];
    if (method === "trim") warnings.push({ code: "trim-approximate", message: `trim by the ${law} law is approximate` });
    return {
      id: ids[e], label: idx.labels[e], method, ratio,
      diameter: idx.diameter[e] < 0 ? null : method === "trim" ? idx.diameter[e] * ratio : idx.diameter[e],
      speed: idx.speed[e] < 0 ? null : method === "speed" ? idx.speed[e] * ratio : idx.speed[e],
      headAtDuty: fHead[j], direct: { flow: qd, head: hd, headHigh: hdHigh, publishedHead: fH1[j] }, efficiency: fEff[j], bepRatio, inPor: bepRatio === null ? null : insideEnds(bepRatio, POR_FRACTION.min, POR_FRACTION.max),
      npshr: fNpshr[j], npshMargin: fMargin[j], shaftPower: fPower[j], score: score[j], rank: 0, reason: "", warnings,
    };
  });
  explainRanks(top, matched, reqMargin);
  return requireFiniteResult("duty", { candidates: top, stats: { searched: idx.count, rejectedByEnvelope, evaluated, rejectedByNpsh, matched } });
}

/**
 * A match's score (higher is better, dimensionless): efficiency at duty (0.3 without data), less 0.5 × |Q/Q_BEP − 1|
 * (0.1 without a BEP), less a penalty for an NPSH margin below the required one, less 0.1 × the shaft power's excess
 * over the least among the matches compared.
 * @param efficiency at duty (fraction) or null
 * @param bepRatio Q_d / Q_BEP (dimensionless) or null
 * @param npshMargin NPSHa / NPSHr (dimensionless) or null
 * @param shaftPower at duty, W, or null
 * @param minPower the least shaft power among the matches compared, W (Infinity when none has one)
 * @param reqMargin required NPSH margin ratio (dimensionless)
 */
export function searchScore(efficiency: number | null, bepRatio: number | null, npshMargin: number | null, shaftPower: number | null, minPower: number, reqMargin: number): number {
  let s = efficiency ?? 0.3;
  if (bepRatio !== null) s -= 0.5 * Math.abs(bepRatio - 1);
  else s -= 0.1;
  if (npshMargin !== null && npshRatioBelow(npshMargin, reqMargin)) s -= 0.1 * (reqMargin - npshMargin) / (reqMargin - 1 || 1) + 0.05;
  if (shaftPower !== null && Number.isFinite(minPower)) s -= 0.1 * (shaftPower / minPower - 1);
  return s;
}

/**
 * The `limit` best matches in `order` (score high to low, then id), the same as sorting them all and
 * keeping the first `limit`: only the matches scoring at least the limit-th best score are sorted by
 * `order`; that cut is found by a native sort of the scores alone. (A comparator sort of every match,
 * thousands at catalogue scale, cost more than the rest of the ranking.)
 * @param score each match's score (dimensionless; higher is better)
 * @param limit how many to keep (count)
 * @param order the full order's comparator over match positions (count; negative: a before b)
 */
export function bestMatches(score: Float64Array, limit: number, order: (a: number, b: number) => number): number[] {
  const n = score.length;
  const picked: number[] = [];
  const cut = n > limit ? Float64Array.from(score).sort()[n - limit] : -Infinity; // ascending: the limit-th largest
  // A NaN score (none is made today) would sort last and poison the cut: then every match is sorted.
  for (let j = 0; j < n; j++) if (!(score[j] < cut)) picked.push(j);
  return picked.sort(order).slice(0, limit);
}

/**
 * Ratio s in [lo, hi] with s²·H(Qd/s^k) = Hd (largest root if several); null if none.
 * One solver per search: its residual is one closure over a small state object (set per curve set),
 * not a new closure per call (over 10 000 sets those closures were 1.7 of a search's 4.8 MB of garbage).
 */
function scaleSolver(idx: SearchIndex, qd: number, hd: number) {
  const at = { e: 0, k: 1, qMin: 0, qMax: 0 };
  // Qd/s^k is on the curve for s in [sMin, sMax] up to rounding: clamp it onto the curve (an
  // evaluation past the end by one ulp used to read as head 0 and return a false root at sMin).
  const f = (s: number) => s * s * (evalPacked(idx.head, at.e, Math.min(at.qMax, Math.max(at.qMin, qd / (at.k === 1 ? s : s * s)))) ?? 0) - hd;
  return (e: number, k: number, lo: number, hi: number): number | null => {
    const qMax = idx.flowMax[e], qMin = idx.flowMin[e];
    const sMin = Math.max(lo, k === 1 ? qd / qMax : Math.sqrt(qd / qMax));
    const sMax = qMin > 0 ? Math.min(hi, k === 1 ? qd / qMin : Math.sqrt(qd / qMin)) : hi;
    if (!(sMin <= sMax)) return null;
    at.e = e; at.k = k; at.qMin = qMin; at.qMax = qMax;
    const fHi = f(sMax);
    // At the highest ratio within LIMIT_ROUNDING of the duty head: that ratio, as the direct fit's allowance (was 1e-9:
    // a curve 5e-9 under the duty head was direct and not "speed" at 100 %); affinity.ts `solveRatio` the same.
    if (Math.abs(fHi) <= LIMIT_ROUNDING * hd) return sMax;
    const fLo = f(sMin);
    if (Math.abs(fLo) <= 1e-9 * hd) return sMin;
    if (fLo * fHi < 0) {
      const r = brent(f, sMin, sMax, 1e-12);
      return r ? r.x : null;
    }
    if (fHi < 0 || !idx.drooping[e]) return null;
    // Drooping curve with both ends above the duty: scan for a bracket.
    let prev = sMax, fp = fHi;
    for (let i = 1; i <= 16; i++) {
      const s = sMax - ((sMax - sMin) * i) / 16;
      const fs = f(s);
      if (fp * fs <= 0) { const r = brent(f, s, prev, 1e-12); return r ? r.x : null; }
      prev = s; fp = fs;
    }
    return null;
  };
}
