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
 *    gets a reason stating its figures and how it compares with the row above it
 *    (`explainRanks`, also used by the app after it filters and merges rows).
 */
import { EngineInputError, requireFiniteResult, requirePositive, requireNonNegative, type EngineWarning } from "./errors.ts";
import { evalCubic, fritschCarlsonTangents, hermiteIn, monotoneCubic, type MonotoneCubic } from "./interp.ts";
import { checkPumpPoints, type PumpCurve, type PumpCurveInput } from "./pumpCurve.ts";
import { brent } from "./roots.ts";
import { G0 } from "./units.ts";
import { MAX_TRIM_FRACTION, type TrimLaw } from "./affinity.ts";
import { qt } from "./quantityText.ts";

/** A curve set to search: one pump model at one speed and impeller diameter. */
export interface CurveSet {
  /** Id returned with the candidate (e.g. the database id). */
  id: string;
  /** Display label (model, speed, diameter). */
  label?: string;
  curve: PumpCurve | PumpCurveInput;
}

/** Curves of one column for all sets, packed end to end (knots x, values y, tangents m). */
interface Packed {
  /** Set i's knots are [off[i], off[i+1]); an empty range means the set lacks this column. */
  off: Int32Array;
  x: Float64Array;
  y: Float64Array;
  m: Float64Array;
}

/**
 * Prepared index (reuse it across searches). Curves are packed into a few typed arrays so a
 * large library costs little memory and garbage collection; the per-set scalars below use −1
 * for "not given".
 */
export interface SearchIndex {
  count: number;
  ids: string[];
  labels: string[];
  /** m³/s */
  flowMin: Float64Array;
  /** m³/s */
  flowMax: Float64Array;
  /** m */
  headMax: Float64Array;
  /** m³/s, −1 without BEP */
  bepFlow: Float64Array;
  /** rpm, −1 if not given */
  speed: Float64Array;
  /** m, −1 if not given */
  diameter: Float64Array;
  /** m, −1 if not given */
  minDiameter: Float64Array;
  drooping: Uint8Array;
  head: Packed;
  /** Efficiency (given, or derived from power at the power column's points). */
  eff: Packed;
  npshr: Packed;
  /** Sets that failed validation, with the reason. */
  rejected: { id: string; reason: string }[];
}

/** Growable Float64Array (doubling), to pack many small curves without per-curve objects. */
class DoubleBuffer {
  buf = new Float64Array(1024);
  length = 0;
  push(v: number) {
    if (this.length === this.buf.length) {
      const next = new Float64Array(this.buf.length * 2);
      next.set(this.buf);
      this.buf = next;
    }
    this.buf[this.length++] = v;
  }
  done(): Float64Array {
    return this.buf.slice(0, this.length);
  }
}

class PackBuilder {
  off: number[] = [0];
  x = new DoubleBuffer();
  y = new DoubleBuffer();
  m = new DoubleBuffer();
  add(c: MonotoneCubic | null) {
    if (c) for (let k = 0; k < c.x.length; k++) { this.x.push(c.x[k]); this.y.push(c.y[k]); this.m.push(c.m[k]); }
    this.off.push(this.x.length);
  }
  /** Start of a curve whose knots are pushed next. */
  begin(): number { return this.x.length; }
  push(x: number, y: number) { this.x.push(x); this.y.push(y); this.m.push(0); }
  /** Ends the curve started at `start`: Fritsch-Carlson tangents in place (fewer than 2 knots: no curve). */
  end(start: number) {
    const n = this.x.length - start;
    if (n < 2) { this.x.length = start; this.y.length = start; this.m.length = start; }
    else fritschCarlsonTangents(this.x.buf, this.y.buf, this.m.buf, start, n);
    this.off.push(this.x.length);
  }
  build(): Packed {
    return { off: Int32Array.from(this.off), x: this.x.done(), y: this.y.done(), m: this.m.done() };
  }
}

/** Monotone cubic (Fritsch-Carlson, see interp.ts) of set i in a packed column; null outside or absent. */
function evalPacked(p: Packed, i: number, t: number): number | null {
  const lo = p.off[i];
  const hi = p.off[i + 1] - 1;
  if (hi < lo) return null;
  const x = p.x;
  if (!(t >= x[lo] && t <= x[hi])) return null;
  if (hi === lo) return p.y[lo];
  return hermiteIn(x, p.y, p.m, lo, hi, t);
}

/** Efficiency cubic from the power column when the curve gives no efficiency (η = ρ·g₀·Q·H/P at its points). */
function derivedEfficiency(c: PumpCurve): MonotoneCubic | null {
  if (c.efficiency) return c.efficiency;
  if (!c.power) return null;
  const xs: number[] = [], ys: number[] = [];
  for (let k = 0; k < c.power.x.length; k++) {
    const q = c.power.x[k];
    const h = evalCubic(c.head, q);
    if (h === null) continue;
    xs.push(q);
    ys.push((c.powerDensity * G0 * q * h) / c.power.y[k]);
  }
  return xs.length >= 2 ? monotoneCubic(xs, ys) : null;
}

/**
 * Prepares curve sets for searching. Invalid sets are listed in `rejected`, not thrown.
 * @param sets curve sets (SI curves)
 */
export function prepareSearchIndex(sets: readonly CurveSet[]): SearchIndex {
  if (!Array.isArray(sets)) throw new EngineInputError("sets", "must be an array of curve sets");
  const ids: string[] = [], labels: string[] = [];
  const flowMin: number[] = [], flowMax: number[] = [], headMax: number[] = [], bepFlow: number[] = [];
  const speed: number[] = [], diameter: number[] = [], minDiameter: number[] = [], drooping: number[] = [];
  const head = new PackBuilder(), eff = new PackBuilder(), npshr = new PackBuilder();
  const rejected: { id: string; reason: string }[] = [];
  const optional = (name: string, v: number | undefined) => (v === undefined || v === null ? -1 : requirePositive(name, v));
  for (const s of sets) {
    const curve = s?.curve;
    if (curve && "head" in curve && (curve as PumpCurve).head && "x" in (curve as PumpCurve).head) {
      // Already prepared: copy its columns.
      const c = curve as PumpCurve;
      ids.push(String(s.id)); labels.push(s.label ?? String(s.id));
      flowMin.push(c.flowMin); flowMax.push(c.flowMax); headMax.push(c.headMax); bepFlow.push(c.bep ? c.bep.flow : -1);
      speed.push(c.speed ?? -1); diameter.push(c.impellerDiameter ?? -1); minDiameter.push(c.minDiameter ?? -1);
      drooping.push(c.drooping ? 1 : 0);
      head.add(c.head); eff.add(derivedEfficiency(c)); npshr.add(c.npshr);
      continue;
    }
    // Raw input: the same checks as createPumpCurve, packed straight into the index (no
    // per-curve objects, so a large library loads quickly and costs little memory).
    let v: { headMax: number; drooping: boolean };
    let sp: number, dia: number, dMin: number, dMax: number, rhoP: number;
    const input = curve as PumpCurveInput;
    try {
      if (!input || typeof input !== "object") throw new EngineInputError("curve", "is required");
      const tol = input.riseTolerance ?? 0.1;
      if (!(tol >= 0 && tol <= 1)) throw new EngineInputError("riseTolerance", "must be between 0 and 1");
      v = checkPumpPoints(input.points, tol);
      sp = optional("speed", input.speed); dia = optional("impellerDiameter", input.impellerDiameter);
      dMin = optional("minDiameter", input.minDiameter); dMax = optional("maxDiameter", input.maxDiameter);
      if (dMin > 0 && dMax > 0 && dMin > dMax) throw new EngineInputError("minDiameter", "must not exceed maxDiameter");
      rhoP = requirePositive("powerDensity", input.powerDensity ?? 1000);
    } catch (e) {
      rejected.push({ id: String(s?.id), reason: e instanceof Error ? e.message : String(e) });
      continue;
    }
    const pts = input.points;
    ids.push(String(s.id)); labels.push(s.label ?? String(s.id));
    flowMin.push(pts[0].flow); flowMax.push(pts[pts.length - 1].flow); headMax.push(v.headMax);
    speed.push(sp); diameter.push(dia); minDiameter.push(dMin); drooping.push(v.drooping ? 1 : 0);
    let st = head.begin();
    for (const p of pts) head.push(p.flow, p.head);
    head.end(st);
    // Efficiency column, or efficiency derived from power at the power column's points; BEP.
    let hasEff = 0;
    for (const p of pts) if (p.efficiency !== undefined && p.efficiency !== null) hasEff++;
    let best = -1, bestQ = -1;
    st = eff.begin();
    for (const p of pts) {
      const e = hasEff >= 2
        ? p.efficiency
        : hasEff < 2 && p.power !== undefined && p.power !== null ? (rhoP * G0 * p.flow * p.head) / p.power : undefined;
      if (e === undefined || e === null) continue;
      eff.push(p.flow, e);
      if (e > 0 && e > best) { best = e; bestQ = p.flow; }
    }
    eff.end(st);
    bepFlow.push(best > 0 && bestQ > 0 ? bestQ : -1);
    st = npshr.begin();
    for (const p of pts) if (p.npshr !== undefined && p.npshr !== null) npshr.push(p.flow, p.npshr);
    npshr.end(st);
  }
  return {
    count: ids.length, ids, labels,
    flowMin: Float64Array.from(flowMin), flowMax: Float64Array.from(flowMax), headMax: Float64Array.from(headMax),
    bepFlow: Float64Array.from(bepFlow), speed: Float64Array.from(speed), diameter: Float64Array.from(diameter),
    minDiameter: Float64Array.from(minDiameter), drooping: Uint8Array.from(drooping),
    head: head.build(), eff: eff.build(), npshr: npshr.build(), rejected,
  };
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

  // Every match is kept as numbers in parallel arrays (no object per match: a large library can match
  // tens of thousands of sets); only the `limit` best become Candidate objects.
  const fE: number[] = [], fMethod: number[] = [], fRatio: number[] = [], fHead: number[] = [];
  const fEff: (number | null)[] = [], fBep: (number | null)[] = [], fNpshr: (number | null)[] = [], fMargin: (number | null)[] = [], fPower: (number | null)[] = [];
  const METHODS = ["direct", "trim", "speed"] as const;
  let rejectedByEnvelope = 0, evaluated = 0;

  const fMin = idx.flowMin, fMax = idx.flowMax, hMax = idx.headMax;
  for (let e = 0; e < idx.count; e++) {
    if (qd > fMax[e] * grow || hd > hMax[e] * grow * grow) { rejectedByEnvelope++; continue; }
    evaluated++;
    const h1 = qd >= fMin[e] && qd <= fMax[e] ? (evalPacked(idx.head, e, qd) as number) : null;
    let method = -1;
    let ratio = 1;
    let kk = 1;
    for (const m of methods) {
      if (m === "direct" && useDirect) {
        if (h1 !== null && h1 >= hd && h1 <= hdHigh) { method = 0; break; }
      } else if (m === "trim" && useTrim) {
        if ((h1 !== null && h1 > hd) || (h1 === null && qd < fMin[e])) {
          const r = solveScale(idx, e, qd, hd, k, trimMinRatio, 1);
          const dia = idx.diameter[e], dMin = idx.minDiameter[e];
          if (r !== null && (dMin < 0 || dia < 0 || dia * r >= dMin * (1 - 1e-9))) {
            method = 1; ratio = r; kk = k; break;
          }
        }
      } else if (m === "speed" && useSpeed) {
        const r = solveScale(idx, e, qd, hd, 1, sLo, sHi);
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
    const n0 = evalPacked(idx.npshr, e, qOrig);
    if (n0 !== null) npshr = method === 2 ? n0 * ratio * ratio : n0;
    const npshMargin = npsha !== null && npshr !== null && npshr > 0 ? npsha / npshr : null;
    if (npshMargin !== null && npshMargin < 1) continue; // cavitation: cannot meet the duty
    fE.push(e); fMethod.push(method); fRatio.push(ratio); fHead.push(headAtDuty);
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
  for (let j = 0; j < matched; j++) {
    let s = fEff[j] ?? 0.3;
    const bepRatio = fBep[j], npshMargin = fMargin[j], shaftPower = fPower[j];
    if (bepRatio !== null) s -= 0.5 * Math.abs(bepRatio - 1);
    else s -= 0.1;
    if (npshMargin !== null && npshMargin < reqMargin) s -= 0.1 * (reqMargin - npshMargin) / (reqMargin - 1 || 1) + 0.05;
    if (shaftPower !== null && Number.isFinite(minPower)) s -= 0.1 * (shaftPower / minPower - 1);
    score[j] = s;
  }
  const order = Array.from({ length: matched }, (_, j) => j);
  const ids = idx.ids;
  order.sort((a, b) => score[b] - score[a] || (ids[fE[a]] < ids[fE[b]] ? -1 : ids[fE[a]] > ids[fE[b]] ? 1 : 0));
  const top: Candidate[] = order.slice(0, limit).map((j) => {
    const e = fE[j], method = METHODS[fMethod[j]], ratio = fRatio[j], bepRatio = fBep[j];
    const warnings: EngineWarning[] = [];
    if (method === "trim") warnings.push({ code: "trim-approximate", message: `trim by the ${law} law is approximate` });
    return {
      id: ids[e], label: idx.labels[e], method, ratio,
      diameter: idx.diameter[e] < 0 ? null : method === "trim" ? idx.diameter[e] * ratio : idx.diameter[e],
      speed: idx.speed[e] < 0 ? null : method === "speed" ? idx.speed[e] * ratio : idx.speed[e],
      headAtDuty: fHead[j], efficiency: fEff[j], bepRatio, inPor: bepRatio === null ? null : bepRatio >= 0.7 && bepRatio <= 1.2,
      npshr: fNpshr[j], npshMargin: fMargin[j], shaftPower: fPower[j], score: score[j], rank: 0, reason: "", warnings,
    };
  });
  explainRanks(top, matched, reqMargin);
  return requireFiniteResult("duty", { candidates: top, stats: { searched: idx.count, rejectedByEnvelope, evaluated, matched } });
}

/** What a row is, in words (how it meets the duty and its figures). */
function describe(c: Candidate, reqMargin: number): string {
  const parts: string[] = [];
  parts.push(c.method === "direct" ? `reaches the duty point as published (${qt("head", c.headAtDuty)} at duty flow)`
    : c.method === "trim" ? `reaches the duty point trimmed to ${pct(c.ratio)} of its diameter${c.diameter !== null ? ` (${qt("diameter", c.diameter)})` : ""}`
    : `reaches the duty point at ${pct(c.ratio)} speed${c.speed !== null ? ` (${Math.round(c.speed)} rpm)` : ""}`);
  parts.push(c.efficiency !== null ? `${pct(c.efficiency)} efficient at duty` : "no efficiency data (ranked down)");
  if (c.bepRatio !== null) parts.push(`${Math.round(c.bepRatio * 100)} % of BEP flow${c.inPor ? " (inside POR)" : " (outside POR 70–120 %)"}`);
  if (c.npshMargin !== null) parts.push(`NPSH margin ${c.npshMargin.toFixed(2)}${c.npshMargin < reqMargin ? ` (below ${reqMargin})` : ""}`);
  if (c.shaftPower !== null) parts.push(`${qt("power", c.shaftPower)} shaft`);
  return parts.join("; ");
}

/** How row b (ranked below) compares with row a (the row above), in words. */
function compareWithAbove(a: Candidate, b: Candidate): string {
  const diffs: string[] = [];
  if (a.efficiency !== null && b.efficiency !== null) {
    const d = (a.efficiency - b.efficiency) * 100;
    if (Math.abs(d) >= 0.05) diffs.push(`${Math.abs(d).toFixed(1)} points ${d > 0 ? "less" : "more"} efficient`);
  } else if (a.efficiency !== null && b.efficiency === null) diffs.push("no efficiency data where it has some");
  if (a.bepRatio !== null && b.bepRatio !== null) {
    const da = Math.abs(a.bepRatio - 1), db = Math.abs(b.bepRatio - 1);
    if (Math.abs(da - db) >= 0.005) diffs.push(`${db > da ? "further from" : "nearer"} BEP (${Math.round(b.bepRatio * 100)} % against ${Math.round(a.bepRatio * 100)} %)`);
  }
  if (a.shaftPower !== null && b.shaftPower !== null) {
    const d = b.shaftPower - a.shaftPower;
    if (Math.abs(d) >= 5) diffs.push(`${qt("power", Math.abs(d))} ${d > 0 ? "more" : "less"} shaft power`);
  }
  if (a.npshMargin !== null && b.npshMargin !== null && Math.abs(a.npshMargin - b.npshMargin) >= 0.005) {
    diffs.push(`NPSH margin ${b.npshMargin.toFixed(2)} against ${a.npshMargin.toFixed(2)}`);
  }
  const score = a.score - b.score;
  return diffs.length
    ? `below #${a.rank} because: ${diffs.join(", ")} (score ${b.score.toFixed(3)} against ${score >= 0 ? "" : "only "}${a.score.toFixed(3)})`
    : `below #${a.rank} on score ${b.score.toFixed(3)} against ${a.score.toFixed(3)} (figures alike)`;
}

/**
 * Numbers the rows 1…n in their order and writes each one's reason: what it is, and how it
 * compares with the row above it (the first row: why it leads). Rows must already be sorted.
 * @param rows ranked candidates (SI figures; rank and reason are rewritten)
 * @param total how many met the duty in all (count)
 * @param reqMargin required NPSH margin ratio (dimensionless)
 * @param notes per row, a comparison with the row above that replaces the score comparison (unitless text; null: compare figures)
 */
export function explainRanks(rows: Candidate[], total: number, reqMargin: number, notes: readonly (string | null)[] = []): Candidate[] {
  if (!Array.isArray(rows)) throw new EngineInputError("rows", "must be an array of ranked candidates");
  if (!Number.isInteger(requireNonNegative("total", total)) || total < rows.length) throw new EngineInputError("total", "must be a whole count, at least the number of rows");
  requirePositive("reqMargin", reqMargin);
  rows.forEach((c, i) => {
    c.rank = i + 1;
    const what = describe(c, reqMargin);
    c.reason = i === 0
      ? `#1 of ${total}: ${what}; highest score ${c.score.toFixed(3)} (efficiency less penalties for distance from BEP, thin NPSH margin and extra power)`
      : `#${c.rank} of ${total}: ${what}; ${notes[i] ?? compareWithAbove(rows[i - 1], c)}`;
  });
  return rows;
}

/** Ratio s in [lo, hi] with s²·H(Qd/s^k) = Hd (largest root if several); null if none. */
function solveScale(idx: SearchIndex, e: number, qd: number, hd: number, k: number, lo: number, hi: number): number | null {
  const qMax = idx.flowMax[e], qMin = idx.flowMin[e];
  const sMin = Math.max(lo, k === 1 ? qd / qMax : Math.sqrt(qd / qMax));
  const sMax = qMin > 0 ? Math.min(hi, k === 1 ? qd / qMin : Math.sqrt(qd / qMin)) : hi;
  if (!(sMin <= sMax)) return null;
  // Qd/s^k is on the curve for s in [sMin, sMax] up to rounding: clamp it onto the curve (an
  // evaluation past the end by one ulp used to read as head 0 and return a false root at sMin).
  const f = (s: number) => s * s * (evalPacked(idx.head, e, Math.min(qMax, Math.max(qMin, qd / (k === 1 ? s : s * s)))) ?? 0) - hd;
  const fHi = f(sMax);
  if (Math.abs(fHi) <= 1e-9 * hd) return sMax;
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
}
