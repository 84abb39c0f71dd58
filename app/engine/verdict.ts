/**
 * One verdict per candidate pump on a system: what an engineer signs.
 *
 * Rules, in the order they are applied (the first that holds decides):
 * 1. `outside-catalogue` — the pump as configured is not one the maker publishes: a trimmed
 *    impeller below the smallest or above the largest diameter of the model (where the model
 *    publishes no diameters: a trim of more than MAX_TRIM_FRACTION = 20 %, or an impeller larger
 *    than the published curve's), or a speed outside the allowed range (default 30–100 % of the
 *    model's rated speed, common practice for variable-speed centrifugal pumps; the model may state
 *    its own range).
 * 2. `no-operating-point` — at some edge of the system band the pump reaches no operating point
 *    from rest; the reason says why (shut-off head below the system's head at the curve's first
 *    point: it cannot open its check valve, whatever crossings lie further out — common practice;
 *    or the curve ends while the pump still gives more head than the system needs).
 * 3. `short` — at the band's demanding edge (where the pump delivers least: most static lift,
 *    aged pipe) the operating flow is below the duty flow × (1 − minus tolerance); a flow of zero there (shut-off
 *    head equal to the system's head at zero flow: dead-head) says "no delivery".
 * 4. `oversized` — at that edge it is above the duty flow × (1 + plus tolerance); the reasons
 *    say what throttling, trim or speed would save.
 * 5. `meets` — otherwise.
 * A liquid more viscous than the water the curve was measured on (ANSI/HI 9.6.7 parameter B above 1, from
 * memory: viscous.ts): where the caller judged the edges on the curve corrected for viscosity (1 < B ≤ 40,
 * `correctCurveForViscosity`), rules 2–5 stand as judged and the verdict says so, with B and the factors C_Q,
 * C_H at the BEP and C_η. Where it could not correct (B above 40, outside the method; or no water BEP), the
 * water curve's `meets` or `oversized` becomes `viscosity-uncorrected` (the water curve's result kept in the
 * reasons); a `short` stays short (viscosity lowers head, flow and efficiency), with the reason said.
 * Default duty flow tolerance −0 % / +10 % (common practice: the duty flow is a minimum,
 * a tenth more is accepted margin). Comparisons allow 1 part in 10⁶ for solver round-off (LIMIT_ROUNDOFF, affinity.ts:
 * the same allowance as the trim and diameter flags of scaleByTrim).
 * Pure: numbers in, words out.
 */
import { EngineInputError, requireNonNegative, requirePositive } from "./errors.ts";
import { fmtNumExact, fmtPct, fmtPctExact, fmtPctLimit, fmtPctSide, qt, qtExact, qtLimit } from "./quantityText.ts";
import { LIMIT_ROUNDOFF, MAX_TRIM_FRACTION } from "./affinity.ts";
import { HI_VISCOSITY_SOURCE, VISCOSITY_B_MAX, VISCOSITY_B_NO_CORRECTION, viscosityFactors } from "./viscous.ts";

export type VerdictStatus = "meets" | "short" | "oversized" | "outside-catalogue" | "no-operating-point" | "viscosity-uncorrected";

export const VERDICT_STATUSES: readonly VerdictStatus[] = ["meets", "short", "oversized", "outside-catalogue", "no-operating-point", "viscosity-uncorrected"];

/** Duty flow tolerance as fractions of the duty flow (dimensionless): accepted when Qd·(1−minus) ≤ Q ≤ Qd·(1+plus). */
export interface FlowTolerance {
  minus: number;
  plus: number;
}

/** Default −0 % / +10 % (common practice). */
export const DEFAULT_FLOW_TOLERANCE: FlowTolerance = { minus: 0, plus: 0.1 };

/** Default allowed speed range as a fraction of rated speed (common practice, from memory). */
export const DEFAULT_SPEED_RANGE = { min: 0.3, max: 1 } as const;


/** One edge of the system band with the pump's operating point on it (SI). */
export interface BandEdge {
  /** Which edge, in words, e.g. "most lift, aged pipe". */
  name: string;
  /** Operating flow m³/s and head m, null without an intersection. */
  flow: number | null;
  head: number | null;
  /** Why there is no intersection, in words (with numbers), when flow is null. */
  noPointReason?: string;
}

/** What the maker publishes for the model (SI); any field may be absent. */
export interface CatalogueLimits {
  /** Impeller diameter in use, m (after trim). */
  diameter?: number | null;
  /** Smallest and largest impeller the model publishes, m. */
  minDiameter?: number | null;
  maxDiameter?: number | null;
  /** Speed in use, rpm, and the model's rated speed, rpm. */
  speed?: number | null;
  ratedSpeed?: number | null;
  /** Speed ratio in use when no rpm is known (N/N_curve, dimensionless). */
  speedRatio?: number | null;
  /** Allowed speed range as fractions of rated (dimensionless; default 0.3–1.0). */
  speedRange?: { min: number; max: number };
  /**
   * Impeller after trim / the published curve's impeller (dimensionless), when trimmed: judged where the
   * diameters cannot be (no diameter in use, or no published smallest/largest): above 1, or a trim of more
   * than MAX_TRIM_FRACTION (common practice: affinity.ts), is outside what the maker publishes.
   */
  trimRatio?: number | null;
}

/** What a smaller pump duty would cost in power, for the oversized reasons (W). */
export interface SavingOption {
  /** "throttling", "trim" or "speed". */
  means: "throttling" | "trim" | "speed";
  /** Shaft power at the duty flow with this means, W (null when it cannot be found). */
  power: number | null;
  /** How, in words (e.g. "speed 87.2 % (2 529 rpm)"). */
  how: string;
  /** Why the maker's catalogue does not offer this means (catalogueReasons' words), when it does not. */
  outside?: string[];
}

export interface VerdictInput {
  /** Duty flow, m³/s; null when the system has no duty point. */
  dutyFlow: number | null;
  tolerance?: FlowTolerance;
  /** Operating points at the band's edges; the demanding edge is the one with the least flow. */
  edges: BandEdge[];
  catalogue?: CatalogueLimits;
  /** Shaft power now at the demanding edge, W, and the options that would bring it to the duty. */
  powerNow?: number | null;
  savings?: SavingOption[];
  /**
   * The pumped liquid's ANSI/HI 9.6.7 parameter B at the pump's water BEP (dimensionless; viscous.ts) and whether the
   * edges were judged on the curve corrected for it; null or absent when the liquid is the water the curve was measured
   * on. B above 1 uncorrected: the water curve cannot be signed off as is. `corrected` with B above 40 is refused.
   */
  viscosity?: { b: number; corrected: boolean } | null;
}

export interface Verdict {
  status: VerdictStatus;
  /** The rule that decided, with its threshold, in words. */
  rule: string;
  /** Plain words with the numbers. */
  reasons: string[];
  /** The edge the verdict was judged at (the demanding edge), when there is one. */
  edge: string | null;
}

// Quantities as tokens (quantityText.ts): the reader's units are chosen where the text is shown.
// A diameter judged against a published one and that limit: each with the decimals it needs not to read as the other.
const diameterText = (d: number, limit: number) => `Ø${qtExact("diameter", d, [limit])}`;
const limitText = (limit: number, d: number) => `Ø${qtLimit("diameter", limit, [d])}`;

function checkTolerance(t: FlowTolerance | undefined): FlowTolerance {
  if (t === undefined) return DEFAULT_FLOW_TOLERANCE;
  if (!t || typeof t !== "object") throw new EngineInputError("tolerance", "must be { minus, plus }");
  const minus = requireNonNegative("tolerance.minus", t.minus);
  const plus = requireNonNegative("tolerance.plus", t.plus);
  if (minus >= 1) throw new EngineInputError("tolerance.minus", "must be below 1 (a fraction of the duty flow)");
  return { minus, plus };
}

/**
 * Catalogue reasons (empty when the pump is inside what the maker publishes).
 * @param c diameters m, speeds rpm, speed ratio and range (dimensionless)
 */
export function catalogueReasons(c: CatalogueLimits | undefined): string[] {
  if (!c) return [];
  const out: string[] = [];
  const eps = LIMIT_ROUNDOFF;
  const d = c.diameter ?? null;
  if (d !== null) {
    requirePositive("catalogue.diameter", d);
    const lo = c.minDiameter ?? null, hi = c.maxDiameter ?? null;
    if (lo !== null && d < requirePositive("catalogue.minDiameter", lo) * (1 - eps))
      out.push(`impeller ${diameterText(d, lo)} is below the smallest the model publishes (${limitText(lo, d)}): ${fmtPctExact(d / lo, [1])} of it`);
    if (hi !== null && d > requirePositive("catalogue.maxDiameter", hi) * (1 + eps))
      out.push(`impeller ${diameterText(d, hi)} is above the largest the model publishes (${limitText(hi, d)}): ${fmtPctExact(d / hi, [1])} of it`);
  }
  const t = c.trimRatio ?? null;
  if (t !== null) {
    requirePositive("catalogue.trimRatio", t);
    const unpublished = "the model publishes no impeller diameters to back it";
    if ((d === null || c.minDiameter == null) && t < (1 - MAX_TRIM_FRACTION) * (1 - eps))
      out.push(`impeller trimmed to ${fmtPctExact(t, [1 - MAX_TRIM_FRACTION])} of the published one is a trim of more than ${fmtPctLimit(MAX_TRIM_FRACTION)}, and ${unpublished}`);
    if ((d === null || c.maxDiameter == null) && t > 1 + eps) out.push(`impeller at ${fmtPctExact(t, [1])} of the published one is larger than the published curve's, and ${unpublished}`);
  }
  const range = c.speedRange ?? DEFAULT_SPEED_RANGE;
  const rMin = requirePositive("catalogue.speedRange.min", range.min), rMax = requirePositive("catalogue.speedRange.max", range.max);
  if (rMin > rMax) throw new EngineInputError("catalogue.speedRange.min", "must not exceed max");
  let frac: number | null = null;
  let what = "";
  if (c.speed != null && c.ratedSpeed != null) {
    frac = requirePositive("catalogue.speed", c.speed) / requirePositive("catalogue.ratedSpeed", c.ratedSpeed);
    // Each speed with the decimals that keep it apart from the other ("1645.0 rpm … of the rated 1644.5 rpm", never "1645 … 1645").
    what = `${fmtNumExact(c.speed, [c.ratedSpeed], 0)} rpm is ${fmtPctExact(frac, [rMin, rMax])} of the rated ${fmtNumExact(c.ratedSpeed, [c.speed], 0)} rpm`;
  } else if (c.speedRatio != null) {
    frac = requirePositive("catalogue.speedRatio", c.speedRatio);
    what = `speed ${fmtPctExact(frac, [rMin, rMax])} of the curve's speed`;
  }
  if (frac !== null) {
    if (frac < rMin * (1 - eps)) out.push(`${what}, below the allowed ${fmtPctLimit(rMin)}`);
    else if (frac > rMax * (1 + eps)) out.push(`${what}, above the allowed ${fmtPctLimit(rMax)}`);
  }
  return out;
}

/**
 * The verdict for one candidate (see the rules at the top of this module).
 * @param input.dutyFlow duty flow, m³/s (null: no duty set — only catalogue and intersection are judged)
 * @param input.tolerance duty flow tolerance, fractions (dimensionless; default −0/+0.10)
 * @param input.edges operating points at the band edges, m³/s and m
 * @param input.catalogue diameters m, speeds rpm, ratios (dimensionless)
 * @param input.powerNow shaft power at the demanding edge, W
 * @param input.savings shaft power at the duty by throttling, trim or speed, W
 * @returns the verdict, or null when there is no duty and nothing else to say
 */
export function judgeCandidate(input: VerdictInput): Verdict | null {
  if (!input || typeof input !== "object") throw new EngineInputError("input", "is required");
  const visc = input.viscosity ?? null;
  if (visc !== null && (!visc || typeof visc !== "object" || typeof visc.corrected !== "boolean")) throw new EngineInputError("viscosity", "must be { b, corrected }");
  const b = visc === null ? null : requirePositive("viscosity.b", visc.b);
  if (b !== null && visc!.corrected && b > VISCOSITY_B_MAX) throw new EngineInputError("viscosity.corrected", `B above ${VISCOSITY_B_MAX} is outside the ANSI/HI 9.6.7 method: no curve is corrected there`);
  const judged = judgeOnWater(input);
  if (b === null || b <= VISCOSITY_B_NO_CORRECTION || !judged) return judged;
  return visc!.corrected ? onCorrectedCurve(judged, b) : qualifyForViscosity(judged, b);
}

/** B as printed beside its limits: never "1.00 > 1" nor "40.0 > 40". */
const bText = (b: number) => fmtNumExact(b, [VISCOSITY_B_NO_CORRECTION, VISCOSITY_B_MAX], 2);

/**
 * The correction as applied, in words with B and its factors (ANSI/HI 9.6.7, from memory).
 * @param b the parameter B (dimensionless, > 0)
 * @param full add the head law and the source (a flag, unitless)
 */
export function viscosityCorrectionText(b: number, full = true): string {
  const f = viscosityFactors(requirePositive("b", b));
  const short = `curve corrected for viscosity per ANSI/HI 9.6.7: B = ${bText(b)}, C_Q ${f.flow.toFixed(3)}, C_H at BEP ${f.head.toFixed(3)}, C_η ${f.efficiency.toFixed(3)}`;
  return full ? `${short} (head at other flows C_H = 1 − (1 − C_BEP-H)·(Q_W/Q_BEP-W)^0.75; ${HI_VISCOSITY_SOURCE})` : short;
}

/** A verdict judged on the curve corrected for viscosity: as judged, saying so in its rule and first reason. */
function onCorrectedCurve(v: Verdict, b: number): Verdict {
  if (v.status === "outside-catalogue") return v; // the catalogue's limits are not about the curve
  return { ...v, rule: `${v.rule}; judged on the ${viscosityCorrectionText(b, false)}`,
    reasons: [`Figures on the pumped liquid: ${viscosityCorrectionText(b)}.`, ...v.reasons] };
}

/**
 * A verdict on the water curve for a liquid with B above 1 that was not corrected (B above 40, outside the method; or
 * no water BEP): `meets` and `oversized` become `viscosity-uncorrected`, `short` stays short with the reason; the
 * catalogue and no-operating-point verdicts are unchanged.
 */
function qualifyForViscosity(v: Verdict, b: number): Verdict {
  const f = viscosityFactors(b);
  const outside = b > VISCOSITY_B_MAX;
  const less = outside
    ? `far below its water curve: B is above ${VISCOSITY_B_MAX}, outside the ANSI/HI 9.6.7 method's range, so no correction is possible (${HI_VISCOSITY_SOURCE})`
    : `less head, flow and efficiency than its water curve (at the BEP about ${fmtPct(f.head, 0)} of the head and flow and ${fmtPct(f.efficiency, 0)} of the efficiency, ${HI_VISCOSITY_SOURCE}), but the curve gives no water BEP to correct it from (no efficiency, or none peaking inside its data)`;
  const why = `The pumped liquid's ANSI/HI 9.6.7 parameter B is ${bText(b)}, above ${VISCOSITY_B_NO_CORRECTION}: on it the pump gives ${less}.`;
  if (v.status === "short") return { ...v, reasons: [...v.reasons, `${why} On the liquid it falls further short.`] };
  if (v.status !== "meets" && v.status !== "oversized") return v;
  return { status: "viscosity-uncorrected", edge: v.edge,
    rule: outside
      ? `viscosity-uncorrected: outside the method — ANSI/HI 9.6.7 corrects a water curve only for B up to ${VISCOSITY_B_MAX} (B = ${bText(b)})`
      : `viscosity-uncorrected: a pump curve measured on water is judged on a liquid with ANSI/HI 9.6.7 parameter B above ${VISCOSITY_B_NO_CORRECTION} only once corrected for viscosity, which needs the water BEP (B = ${bText(b)})`,
    reasons: [`${why} The water curve is not corrected for viscosity: this pump cannot be signed off as is; ask the maker for its performance on this liquid (a test or their own correction) and judge again.`,
      ...v.reasons.map((r) => `On the water curve (${v.status === "meets" ? "meets the duty" : "oversized"}): ${r}`)] };
}

function judgeOnWater(input: VerdictInput): Verdict | null {
  const tol = checkTolerance(input.tolerance);
  const qd = input.dutyFlow === null || input.dutyFlow === undefined ? null : requirePositive("dutyFlow", input.dutyFlow);
  if (!Array.isArray(input.edges) || input.edges.length === 0) throw new EngineInputError("edges", "needs at least one band edge");
  for (const e of input.edges) {
    if (e.flow !== null) requireNonNegative("edges.flow", e.flow);
    // A pump's head where it meets the system is a head on its curve: never below zero (pumpCurve.ts refuses one).
    if (e.head !== null) requireNonNegative("edges.head", e.head);
  }
  // Shaft powers (W) in the oversized reasons: finite and not below zero, or null where not known.
  if (input.powerNow != null) requireNonNegative("powerNow", input.powerNow);
  if (input.savings !== undefined) {
    if (!Array.isArray(input.savings)) throw new EngineInputError("savings", "must be a list of { means, power, how }");
    input.savings.forEach((s, i) => {
      if (!s || typeof s !== "object") throw new EngineInputError(`savings[${i}]`, "must be { means, power, how }");
      if (s.means !== "throttling" && s.means !== "trim" && s.means !== "speed") throw new EngineInputError(`savings[${i}].means`, "must be 'throttling', 'trim' or 'speed'");
      if (s.power != null) requireNonNegative(`savings[${i}].power`, s.power);
    });
  }
  const eps = LIMIT_ROUNDOFF;

  const cat = catalogueReasons(input.catalogue);
  if (cat.length) {
    return { status: "outside-catalogue", edge: null,
      rule: `outside-catalogue: impeller within the model's published diameters (a trim of at most ${fmtPctLimit(MAX_TRIM_FRACTION)} where none are published) and speed within ${fmtPctLimit((input.catalogue?.speedRange ?? DEFAULT_SPEED_RANGE).min)}–${fmtPctLimit((input.catalogue?.speedRange ?? DEFAULT_SPEED_RANGE).max)} of rated, each ${ROUNDOFF_TEXT}`,
      reasons: cat.map((r) => `The ${r}: no published curve backs this pump.`) };
  }

  const missing = input.edges.filter((e) => e.flow === null || e.head === null);
  if (missing.length) {
    return { status: "no-operating-point", edge: missing[0].name,
      rule: "no-operating-point: at every edge of the band the pump must reach an operating point from rest — started against a closed check valve, its head at the curve's first flow (the shut-off head) not below the system's there, it settles at the first crossing where its head falls below the system's; crossings it never reaches from rest do not count",
      reasons: missing.map((e) => `At ${e.name}: ${e.noPointReason ?? "the pump curve does not cross the system curve"}.`) };
  }
  if (qd === null) return null;

  // The demanding edge: least flow.
  const worst = input.edges.reduce((a, b) => ((b.flow as number) < (a.flow as number) ? b : a));
  const best = input.edges.reduce((a, b) => ((b.flow as number) > (a.flow as number) ? b : a));
  const q = worst.flow as number;
  const lo = qd * (1 - tol.minus), hi = qd * (1 + tol.plus);
  const band = input.edges.length > 1 ? ` (${qt("flow", best.flow as number)} at ${best.name})` : "";
  const ratio = q / qd;
  const tolText = `${fmtPctSide(tol.minus, "−")}/${fmtPctSide(tol.plus, "+")}`; // none below reads "0 %", not "−0 %"
  const ratioText = fmtPctExact(ratio, [1 - tol.minus, 1 + tol.plus]);
  // Beside a short or oversized verdict the flow never reads as the duty or a tolerance limit, nor they as it, in any unit.
  const flowText = qtExact("flow", q, [lo, hi, qd]);
  const apart = (limit: number) => qtLimit("flow", limit, [q]);
  if (q < lo * (1 - eps)) {
    return { status: "short", edge: worst.name,
      rule: `short: operating flow at the demanding edge below duty flow × (1 − ${fmtPctLimit(tol.minus)}) = ${apart(lo)}, ${ROUNDOFF_TEXT}`,
      reasons: [q === 0 // dead-head (common practice, from memory): the pump churns against its closed check valve
        ? `No delivery at ${worst.name}: the pump's shut-off head ${qt("head", worst.head as number)} only balances the system's head at zero flow (dead-head), against a duty of ${apart(qd)}${(best.flow as number) > 0 ? band : ""}.`
        : `Delivers ${flowText} at ${worst.name} against a duty of ${apart(qd)}: ${ratioText} of the duty, outside the tolerance ${tolText}${band}.`] };
  }
  if (q > hi * (1 + eps)) {
    const reasons = [`Delivers ${flowText} at ${worst.name}, its least flow in the band, against a duty of ${apart(qd)}: ${ratioText} of the duty, above the tolerance ${tolText}.`];
    const now = input.powerNow ?? null;
    for (const s of input.savings ?? []) {
      if (s.outside?.length) reasons.push(`${cap(s.means)} to the duty (${s.how}) is not an option the maker publishes: the ${s.outside.join("; the ")}.`);
      else if (s.power === null || now === null) reasons.push(`${cap(s.means)}: ${s.how}; the power at the duty is not known.`);
      else reasons.push(`${cap(s.means)} to the duty (${s.how}): ${qtExact("power", s.power, [now])} shaft instead of ${qtExact("power", now, [s.power])} now, ${s.power < now ? `saving ${qt("power", now - s.power)} (${fmtPctExact((now - s.power) / now, [1], 0)})` : "no saving"}.`);
    }
    return { status: "oversized", edge: worst.name,
      rule: `oversized: operating flow at the demanding edge above duty flow × (1 + ${fmtPctLimit(tol.plus)}) = ${apart(hi)}, ${ROUNDOFF_TEXT}`, reasons };
  }
  return { status: "meets", edge: worst.name,
    rule: `meets: operating flow at the demanding edge within ${qt("flow", lo)}–${qt("flow", hi)} (duty ${qt("flow", qd)}, tolerance ${tolText}), ${ROUNDOFF_TEXT}`,
    reasons: [`Delivers ${qt("flow", q)} at ${worst.name}, ${fmtPct(ratio)} of the duty ${qt("flow", qd)}${band}.`] }; // meets: a rounded limit reads true
}

/** The comparisons' allowance in the rules' words (LIMIT_ROUNDOFF, affinity.ts). */
const ROUNDOFF_TEXT = "to 1 part in 10⁶ (solver round-off)";

const cap = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

/**
 * Short label for a status (tables, legends).
 * @param status verdict status (unitless)
 */
export function verdictLabel(status: VerdictStatus): string {
  switch (status) {
    case "meets": return "meets the duty";
    case "short": return "short of the duty";
    case "oversized": return "oversized";
    case "outside-catalogue": return "outside the catalogue";
    case "no-operating-point": return "no operating point";
    case "viscosity-uncorrected": return "water curve, not corrected for viscosity";
    default: throw new EngineInputError("status", `must be one of ${VERDICT_STATUSES.join(", ")}`);
  }
}
