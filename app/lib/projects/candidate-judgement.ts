// What the product concludes about one candidate on a system: operating points at both edges of
// the band, the verdict (engine rules in app/engine/verdict.ts), the motor suggestion and the
// energy from electrical input (app/engine/motor.ts). Pure: used by evaluateCandidate in
// hydraulics.ts on the server and in the browser.
import {
  annualEnergy,
  catalogueReasons,
  judgeCandidate,
  motorEfficiency,
  npshAvailable,
  npshMarginRatio,
  npshrAt,
  npshStatus,
  polesForSpeed,
  scaleBySpeed,
  scaleByTrim,
  shaftPowerAt,
  efficiencyAt,
  flowPerPump,
  solveOperatingPoint,
  speedForDuty,
  suggestMotor,
  suctionLoss,
  systemHeadFunction,
  trimForDuty,
  DEFAULT_DRIVE_EFFICIENCY,
  MOTOR_EFFICIENCY_SOURCE,
  type CatalogueLimits,
  type IeClass,
  type MaxShaftPower,
  type NpshStatus,
  type OperatingPointResult,
  type PreparedSystem,
  type PumpCurve,
  type RatioSolution,
  type SavingOption,
  type SystemCase,
  type Verdict,
} from "~/engine";
import { fmtPct, qt, qtPair } from "~/engine/quantityText";
import { coincideRuleText } from "~/engine/meetings";
import type { LiquidSolver } from "./candidate-solve";
import { whyNoNpshr, type NpshrPublished } from "./npshr-reach";
import { roundUpSetting, settingText, settingToken } from "./setting-step";

/** The two edges of the band: where the pump delivers most and least. */
export function bandEdges(mode: "open" | "closed-loop"): { name: string; which: SystemCase }[] {
  return mode === "open"
    ? [
        { name: "least lift, new pipe", which: { level: "min", roughness: "new" } },
        { name: "most lift, aged pipe", which: { level: "max", roughness: "aged" } },
      ]
    : [
        { name: "new pipe", which: { level: "nominal", roughness: "new" } },
        { name: "aged pipe", which: { level: "nominal", roughness: "aged" } },
      ];
}

/**
 * Where NPSH is judged besides the design point: every level × pipe combination. The band's edges are not enough: at
 * least lift the pump pulls the most flow and through an aged suction loses the most head, a corner neither edge is
 * (the flow verdict needs only the edges: the system head rises with the level and with the roughness at every flow).
 */
export function npshCorners(mode: "open" | "closed-loop"): { name: string; which: SystemCase }[] {
  if (mode !== "open") return bandEdges(mode);
  const corners: { name: string; which: SystemCase }[] = [];
  for (const level of ["min", "max"] as const) for (const roughness of ["new", "aged"] as const)
    corners.push({ name: `${level === "min" ? "least" : "most"} lift, ${roughness} pipe`, which: { level, roughness } });
  return corners;
}

/** The demanding edge (most lift, aged pipe): the system head that governs speed/trim solves. */
export const GOVERNING_CASE: SystemCase = { level: "max", roughness: "aged" };
export const governingName = (mode: "open" | "closed-loop") => (mode === "open" ? "most lift, aged pipe" : "aged pipe");

// Quantities as tokens: rendered in the reader's units where the text is shown.

/**
 * Why a solve found no operating point, in words with the numbers. A pump whose head at zero flow is below the system's
 * cannot open its check valve from rest (common practice, from memory): no point is reachable, whatever crossings lie
 * further out (the engine names them, and the first one's instability, in `unreached`).
 */
export function noPointReason(op: OperatingPointResult): string {
  const f = op.atFirstPoint, l = op.atLastPoint;
  if (op.status === "no-intersection-shutoff-below-static") {
    const [pump, system] = qtPair("head", f.pumpHead, f.systemHead); // never read as equal beside "below"
    const unreached = op.unreached ? `; ${op.unreached}` : "";
    if (f.flow === 0) return `shut-off head ${pump} is below the system's ${system} at zero flow: the pump cannot open its check valve${unreached}`;
    return unreached
      ? `the pump gives ${pump} at its first published point (${qt("flow", f.flow)}), below the system's ${system} there: the published curve does not show it starting from rest (its shut-off head is not published)${unreached}`
      : `the pump gives ${pump} at its first published point (${qt("flow", f.flow)}), below the system's ${system} there, and the curves never meet`;
  }
  if (op.status === "beyond-curve-end") {
    const [pump, system] = qtPair("head", l.pumpHead, l.systemHead);
    return `the curve ends at ${qt("flow", l.flow)} still giving ${pump} against the system's ${system}: the pump would run past its published curve`;
  }
  if (op.status === "coincident" && op.stretch) return coincidentReason(op.stretch);
  return op.message;
}

/**
 * Curves that run together over a stretch (engine status `coincident`: heads within 1 part in 10⁸ of the pump's over 1 % of
 * the published flows or more, engine meetings.ts), in words with the rule and the stretch's flows and head: no single operating point (common
 * practice, from memory: a duty point needs the curves to cross; on a shared stretch the flow wanders along it).
 */
export function coincidentReason(stretch: { flowFrom: number; flowTo: number; head: number; share: number }): string {
  return `the pump and system curves run together from ${qt("flow", stretch.flowFrom)} to ${qt("flow", stretch.flowTo)} at ${qt("head", stretch.head)} (${coincideRuleText(stretch.share)}), so the pump has no single operating point: it may run anywhere on that stretch and drift along it; change the system or the pump so the curves cross`;
}

export type BandPoint = {
  edge: string;
  flow: number | null;
  head: number | null;
  efficiency: number | null;
  shaftPower: number | null;
  /** NPSHa / NPSHr (dimensionless); null without NPSHr and where NPSHa ≤ 0 (engine `npshMarginRatio`; selections frozen before kept one there). */
  npshMarginRatio: number | null;
  /** NPSHa and NPSHr there, m (null without an operating point; NPSHr null where the curve has none); absent in selections frozen before they were kept. */
  npshAvailable?: number | null;
  npshRequired?: number | null;
  reason: string | null;
  /** One pump's flow on its own curve, m³/s (the flow but for pumps in parallel); absent without an operating point and in selections frozen before it was kept. */
  pumpFlow?: number | null;
  /** The engine's cautions at this point (runout, dead-head, an unstable crossing…), the curve's own left out; absent in selections frozen before. */
  warnings?: string[];
};

/**
 * NPSH at one point where the pump runs: NPSHa, NPSHr (m; null where unknown) and their ratio (dimensionless); `pumpFlow`
 * one pump's flow on its curve, m³/s (the flow but for pumps in parallel; absent in selections frozen before it was kept).
 */
export type NpshPoint = { at: string; flow: number | null; pumpFlow?: number | null; available: number | null; required: number | null; marginRatio: number | null };

/** NPSH judged where the pump runs: the design point and each corner of the band; the lowest margin decides. */
export type NpshJudgement = {
  status: NpshStatus;
  /** NPSHa / NPSHr (dimensionless) where the status is decided: the lowest found; null when NPSHr is known nowhere, or where NPSHa ≤ 0 decides without it. */
  marginRatio: number | null;
  at: string | null;
  /** NPSHa there, m; absent in selections frozen before it was kept. */
  available?: number | null;
  /** The rule with its threshold, in words. */
  rule: string;
  /** The wanted NPSHa / NPSHr (dimensionless); absent in selections frozen before it was kept. */
  requiredMargin?: number;
  /** Every point judged, the design point first; absent in selections frozen before the band's four corners were judged. */
  judgedAt?: NpshPoint[];
  /**
   * Points the rule names that could not be judged: no operating point there (the pump runs off its curve), or no NPSHr
   * at that flow (the published NPSHr curve ends before it). Any of them leaves the status "unknown" unless a judged point
   * already shows a cavitation risk. Absent in selections frozen before it was kept.
   */
  unjudged?: { at: string; why: string }[];
  /**
   * The NPSHr one pump's curve publishes, as run (npshr-reach.ts): first and last flow, or its one point — judged nowhere
   * (decision "npshone"); null where it publishes none. Absent in selections frozen before it was kept (then the words
   * say "no NPSHr at that flow" as they did).
   */
  npshrPublished?: NpshrPublished | null;
};

/**
 * The NPSH status over the design point and the band's corners (common practice: NPSHa below NPSHr is a
 * cavitation risk; below the wanted margin ratio, a low margin; NPSHa at or below zero cavitates whatever the
 * pump, NPSHr known or not). A pump that runs at least lift pulls the most flow and needs the most NPSH, and an
 * aged suction loses the most head, so the design point alone can read "ok" while a corner cavitates.
 * @param design NPSH at the design operating point, null without one
 * @param corners NPSH at each level × pipe combination of the band (`npshCorners`)
 * A point with NPSHa at or below zero is judged by that alone: a ratio NPSHa / NPSHr ≤ 0 means nothing, so where any
 * point has NPSHa ≤ 0 the lowest NPSHa decides (`marginRatio` null), and the text reads "NPSHa … at or below zero".
 * @param requiredMargin the wanted NPSHa / NPSHr (dimensionless, > 1)
 * @param suctionStaticHead the suction static head as entered, m (the same at every corner: the band's lift is the
 *   system's static head, not the suction level); named in the rule when given
 * @param published the NPSHr one pump's curve publishes, as run (`npshrPublished`; null: none): why a point has none
 *   names where the NPSHr curve stops, or that it has one point only (never judged, decision "npshone")
 */
export function npshOverBand(design: NpshPoint | null, corners: readonly NpshPoint[], requiredMargin: number, suctionStaticHead?: number, published?: NpshrPublished | null): NpshJudgement {
  const where = corners.map((c) => c.at).join("; ");
  const suction = suctionStaticHead != null ? `, NPSHa at each with the suction static head as entered (${qt("head", suctionStaticHead)}), the same at every corner: the band's lift varies the system's static head, not the suction level` : "";
  const rule = `NPSHa / NPSHr at least ${requiredMargin} at the design point and at each corner of the band (${where})${suction}; below 1, or NPSHa at or below zero whatever the pump: cavitation risk; a point with no operating point or no NPSHr leaves it unknown, unless another already shows a cavitation risk`;
  const judgedAt = design ? [design, ...corners] : [...corners];
  const unjudged = [
    ...(design ? [] : [{ at: "design point", why: "no operating point" }]),
    ...judgedAt.filter((p) => p.marginRatio == null && !(p.available != null && p.available <= 0)).map((p) => ({ at: p.at, why: p.flow == null ? "no operating point" : p.required == null ? whyNoNpshr(published, p) : "NPSHr there too small to judge against" })),
  ];
  let lowest: NpshPoint | null = null;
  let zero: NpshPoint | null = null;
  for (const p of judgedAt) {
    if (p.marginRatio != null && !(p.available != null && p.available <= 0) && (lowest === null || p.marginRatio < lowest.marginRatio!)) lowest = p;
    if (p.available != null && p.available <= 0 && (zero === null || p.available < zero.available!)) zero = p;
  }
  // NPSHa ≤ 0 anywhere decides, by NPSHa: a ratio with NPSHa ≤ 0 (NPSHr known there) means nothing and is never the one shown.
  const byZero = zero !== null;
  const decides = byZero ? zero : lowest;
  const judged: NpshStatus = byZero ? "cavitation-risk" : npshStatus(lowest?.marginRatio ?? null, requiredMargin);
  // "ok" or a low margin over part of the band is no conclusion for the rest: a point not judged leaves it unknown.
  const status: NpshStatus = judged !== "cavitation-risk" && unjudged.length > 0 ? "unknown" : judged;
  return { status, marginRatio: byZero ? null : (decides?.marginRatio ?? null), at: decides?.at ?? null, available: decides?.available ?? null, rule, requiredMargin, judgedAt, unjudged,
    ...(published !== undefined ? { npshrPublished: published } : {}) };
}

/** A band point's NPSH as judged (`npshOverBand`). */
export const npshPointOf = (b: BandPoint): NpshPoint => ({ at: b.edge, flow: b.flow, pumpFlow: b.pumpFlow ?? b.flow, available: b.npshAvailable ?? null, required: b.npshRequired ?? null, marginRatio: b.npshMarginRatio });

/** The efficiency table's largest rating, W (IEC 60034-30-1 stops at 1000 kW; motor.ts). */
const IE_TABLE_END = 1e6;

export type MotorFigures = {
  suggestedRating: number | null;
  suggestionBasis: string;
  /** Rating used for the checks and the energy: the user's, else the suggestion, W. */
  rating: number | null;
  ratingSource: "user" | "suggested" | null;
  ieClass: IeClass;
  efficiency: number | null;
  efficiencySource: string;
  driveEfficiency: number | null;
  driveSource: string | null;
  electricalPower: number | null;
  annualEnergyKWh: number | null;
  annualCost: number | null;
  /** The hours a year `annualEnergyKWh` and `annualCost` count at the operating point (the system's operating hours); absent in selections frozen before it was kept. */
  hoursPerYear?: number;
  currency: string;
  warnings: string[];
};

type Ctx = {
  mode: "open" | "closed-loop";
  prepared: PreparedSystem;
  base: PumpCurve;
  /** One pump's curve as adjusted. */
  curve: PumpCurve;
  combined: PumpCurve;
  arrangement: "single" | "parallel" | "series";
  n: number;
  suction: { surfacePressure: number; staticHead: number };
  /** On a liquid the curve is corrected for (candidate-solve.ts): speed and trim for the savings are solved on it. */
  liquid?: LiquidSolver | null;
};

/** Operating points and figures at both edges of the band. */
export function bandPoints(ctx: Ctx): BandPoint[] {
  return bandEdges(ctx.mode).map(({ name, which }) => pointAt(ctx, name, which));
}

/** NPSH at every corner of the band (`npshCorners`): the band's edges as solved, the other corners solved here. */
export function npshCornerPoints(ctx: Ctx, band: readonly BandPoint[]): NpshPoint[] {
  return npshCorners(ctx.mode).map(({ name, which }) => npshPointOf(band.find((b) => b.edge === name) ?? pointAt(ctx, name, which)));
}

/** The operating point and its figures on one level × pipe combination. */
function pointAt(ctx: Ctx, name: string, which: SystemCase): BandPoint {
  const rho = ctx.prepared.fluid.density;
  const k = ctx.arrangement === "single" ? 1 : ctx.n;
  const op = solveOperatingPoint(ctx.combined, systemHeadFunction(ctx.prepared, which));
  if (op.flow == null || op.head == null) return { edge: name, flow: null, head: null, efficiency: null, shaftPower: null, npshMarginRatio: null, npshAvailable: null, npshRequired: null, reason: noPointReason(op) };
  const q1 = ctx.arrangement === "parallel" ? flowPerPump(op.flow, { mode: "parallel", duty: ctx.n }, ctx.curve) : op.flow;
  const inCurve = q1 >= ctx.curve.flowMin && q1 <= ctx.curve.flowMax;
  const p = inCurve ? shaftPowerAt(ctx.curve, q1, rho) : null;
  const nr = inCurve ? npshrAt(ctx.curve, q1) : null;
  const na = npshAvailable({ surfacePressure: ctx.suction.surfacePressure, vaporPressure: ctx.prepared.fluid.vaporPressure, density: rho,
    staticSuctionHead: ctx.suction.staticHead, suctionLoss: suctionLoss(ctx.prepared, op.flow, which.roughness ?? "new").headLoss });
  return { edge: name, flow: op.flow, head: op.head, efficiency: inCurve ? efficiencyAt(ctx.curve, q1) : null,
    shaftPower: p != null ? p * k : null, npshMarginRatio: npshMarginRatio(na, nr), npshAvailable: na, npshRequired: nr, reason: null, pumpFlow: q1,
    warnings: op.warnings.filter((w) => !ctx.combined.warnings.some((c) => c.code === w.code)).map((w) => w.message) };
}

/**
 * The band's edges' cautions for the candidate's warnings, each naming the edges it holds at ("At least lift, new pipe
 * and most lift, aged pipe: …"): the same caution once. An edge runs at its own flow: a runout or dead-head there is
 * not the design point's (one at the design point's own flow, already among its warnings, is not repeated).
 */
export function bandCautions(band: readonly BandPoint[], design: { flow: number | null; warnings: readonly string[] }): string[] {
  const at = new Map<string, string[]>();
  for (const b of band) for (const w of b.warnings ?? []) {
    if (b.flow === design.flow && design.warnings.includes(w)) continue; // the design point itself, already said
    at.set(w, [...(at.get(w) ?? []), b.edge]);
  }
  return [...at].map(([w, edges]) => `At ${edges.join(" and ")}: ${w}`);
}

/**
 * Shaft power at the duty by throttling, trim or speed (for the oversized verdict), W. A trim or speed the
 * model's catalogue does not offer (below its smallest impeller, outside its speed range) says so instead
 * of a saving: judged with the same limits as the pump itself (`catalogueReasons`).
 */
export function savingOptions(ctx: Ctx, duty: { flow: number; head: number }, catalogue?: CatalogueLimits): SavingOption[] {
  const rho = ctx.prepared.fluid.density;
  const k = ctx.arrangement === "single" ? 1 : ctx.n;
  const per = ctx.arrangement === "parallel" ? { flow: duty.flow / ctx.n, head: duty.head } : ctx.arrangement === "series" ? { flow: duty.flow, head: duty.head / ctx.n } : duty;
  const at = (c: PumpCurve) => (per.flow >= c.flowMin && per.flow <= c.flowMax ? shaftPowerAt(c, per.flow, rho) : null);
  const times = (p: number | null) => (p == null ? null : p * k);
  const out: SavingOption[] = [{ means: "throttling", power: times(at(ctx.curve)), how: `a valve closed until ${qt("flow", duty.flow)} flows` }];
  // On the liquid: the ratio solved on the corrected curve (null when even full speed or impeller falls short), rounded up
  // to the whole rpm or mm a site sets (setting-step.ts, as the candidate's own solve), and its power there.
  const onLiquid = (method: "speed" | "trim", water: RatioSolution) => {
    const solved = ctx.liquid ? ctx.liquid.solve(method, per, water) : water.ratio;
    if (solved == null) return null;
    const set = roundUpSetting(method, solved, { speed: ctx.base.speed, impellerDiameter: ctx.base.impellerDiameter });
    const r = set.ratio;
    // How the setting was reached, in the same words as the candidate's own note: rounded up, on a step already, or the published curve.
    const how = set.capped ? "the published curve's: rounding up would pass it" : r === solved ? "as solved" : `the next whole ${method === "speed" ? "rpm" : "mm"} up`;
    return { r, how, curve: ctx.liquid ? ctx.liquid.at(method, r) : (method === "speed" ? scaleBySpeed(ctx.base, r) : scaleByTrim(ctx.base, r)).curve };
  };
  const sp = speedForDuty(ctx.base, per, { min: 0.3, max: 1 });
  const spl = sp.status === "ok" && sp.ratio ? onLiquid("speed", sp) : null;
  if (spl) {
    const rated = catalogue?.ratedSpeed ?? null;
    const speed = ctx.base.speed != null ? ctx.base.speed * spl.r : null;
    const outside = catalogueReasons({ speedRange: catalogue?.speedRange, ...(speed != null && rated != null ? { speed, ratedSpeed: rated } : { speedRatio: spl.r }) });
    out.push({ means: "speed", power: times(at(spl.curve)), how: `${fmtPct(spl.r)} speed${speed ? ` (${settingText("speed", spl.r, ctx.base)}, ${spl.how})` : ""}`, outside });
  }
  const tr = trimForDuty(ctx.base, per);
  const trl = tr.status === "ok" && tr.ratio ? onLiquid("trim", tr) : null;
  if (trl) {
    const d = ctx.base.impellerDiameter != null ? ctx.base.impellerDiameter * trl.r : null;
    const outside = catalogueReasons({ diameter: d, minDiameter: catalogue?.minDiameter, maxDiameter: catalogue?.maxDiameter, trimRatio: trl.r });
    out.push({ means: "trim", power: times(at(trl.curve)), how: `impeller trimmed to ${fmtPct(trl.r)}${d ? ` (${settingToken("trim", trl.r, ctx.base, true)}, ${trl.how})` : ""}, approximate`, outside });
  }
  return out;
}

/**
 * The verdict on the band (worst edge), with savings when oversized; `viscosity` (B dimensionless, ANSI/HI 9.6.7, and
 * whether the band was solved on the curve corrected for it: viscosity-check.ts) for a liquid more viscous than water.
 */
export function verdictOnBand(ctx: Ctx, band: BandPoint[], duty: { flow: number; head: number } | null, tolerance: { minus: number; plus: number }, catalogue: CatalogueLimits | undefined, viscosity: { b: number; corrected: boolean } | null = null): Verdict | null {
  const edges = band.map((b) => ({ name: b.edge, flow: b.flow, head: b.head, noPointReason: b.reason ?? undefined }));
  const first = judgeCandidate({ dutyFlow: duty?.flow ?? null, tolerance, edges, catalogue });
  if (first?.status !== "oversized" || !duty) return viscosity == null ? first : judgeCandidate({ dutyFlow: duty?.flow ?? null, tolerance, edges, catalogue, viscosity });
  const worst = band.reduce((a, b) => ((b.flow ?? Infinity) < (a.flow ?? Infinity) ? b : a));
  const governing = systemHeadFunction(ctx.prepared, bandEdges(ctx.mode).find((e) => e.name === worst.edge)!.which)(duty.flow);
  return judgeCandidate({ dutyFlow: duty.flow, tolerance, edges, catalogue, powerNow: worst.shaftPower, savings: savingOptions(ctx, { flow: duty.flow, head: governing }, catalogue), viscosity });
}

/**
 * Motor suggestion (IEC series), efficiency by IE class, drive losses when a speed is set, and the
 * energy per year from the electrical input at the design operating point.
 */
export function motorFigures(o: {
  shaftPower: number | null;
  /** The curve's largest shaft power and how far it is known (the engine's maxShaftPower), null when none is. */
  maxCurvePower: MaxShaftPower | null;
  pumps: number;
  userRating: number;
  serviceFactor: number;
  ieClass: IeClass;
  speedDrive: boolean;
  ratedSpeed: number | null;
  hoursPerYear: number;
  tariffPerKWh: number;
  currency: string;
}): MotorFigures {
  const warnings: string[] = [];
  const perPump = o.shaftPower != null ? o.shaftPower / o.pumps : null;
  const m = o.maxCurvePower;
  const s = perPump != null ? suggestMotor({ dutyPower: perPump, maxCurvePower: m?.power ?? null, maxCurvePowerUpTo: m && !m.toEnd ? m.upTo : null, maxCurvePowerFrom: m && !m.fromStart ? m.from : null, serviceFactor: o.serviceFactor }) : null;
  const rating = o.userRating > 0 ? o.userRating : s?.rating ?? null;
  let efficiency: number | null = null;
  if (rating != null) {
    const me = motorEfficiency(Math.min(rating, IE_TABLE_END), o.ieClass, polesForSpeed(o.ratedSpeed));
    efficiency = me.efficiency;
    warnings.push(...me.warnings.map((w) => w.message));
    // A rating typed past the table's end takes its last value, said so (the table stops at 1000 kW).
    if (rating > IE_TABLE_END) warnings.push(`motor ${qt("power", rating)} is above the efficiency table (${qt("power", IE_TABLE_END)}): the ${qt("power", IE_TABLE_END)} efficiency is used`);
  }
  const drive = o.speedDrive ? DEFAULT_DRIVE_EFFICIENCY : null;
  let energy: ReturnType<typeof annualEnergy> | null = null;
  if (o.shaftPower != null && efficiency != null) {
    energy = annualEnergy({ shaftPower: o.shaftPower, motorEfficiency: efficiency, driveEfficiency: drive, hoursPerYear: o.hoursPerYear, tariffPerKWh: o.tariffPerKWh });
  }
  return {
    suggestedRating: s?.rating ?? null,
    suggestionBasis: s ? `${s.basis} (${s.source})` : "no shaft power at the operating point: no motor suggested",
    rating,
    ratingSource: o.userRating > 0 ? "user" : rating != null ? "suggested" : null,
    ieClass: o.ieClass,
    efficiency,
    efficiencySource: `${o.ieClass}, ${polesForSpeed(o.ratedSpeed)}-pole, full-load value; ${MOTOR_EFFICIENCY_SOURCE}`,
    driveEfficiency: drive,
    driveSource: drive != null ? "variable-speed drive 97 % (common practice, from memory)" : null,
    electricalPower: energy?.electricalPower ?? null,
    annualEnergyKWh: o.hoursPerYear > 0 ? (energy?.annualEnergyKWh ?? null) : null,
    annualCost: o.hoursPerYear > 0 && o.tariffPerKWh > 0 ? (energy?.annualCost ?? null) : null, // 0 per kWh: tariff not given
    hoursPerYear: o.hoursPerYear,
    currency: o.currency,
    warnings,
  };
}
