// The engineer's system and its candidates evaluated through the engine: system curve, band, runs and
// NPSHa; each candidate adjusted, combined, solved, judged. The stored shapes live in system-input.ts
// and candidate-input.ts (re-exported here). Pure: the server renders with it and the browser
// recomputes with it while the engineer types.
import {
  combinePumps,
  flowPerPump,
  createPumpCurve,
  EngineInputError,
  motorLimit,
  operatingFigures,
  pipeHeadLoss,
  prepareSystem,
  scaleBySpeed,
  scaleByTrim,
  solveOperatingPoint,
  suctionLoss,
  systemCurve,
  systemHeadFunction,
  DEFAULT_FLOW_TOLERANCE,
  DEFAULT_IE_CLASS,
  LAMINAR_MAX_RE,
  type CatalogueLimits,
  type EngineWarning,
  type Verdict,
  type PumpCurve,
} from "~/engine";
import { flowMaxOf, runInputWarnings, systemSpec, type SystemInput } from "./system-input";
import { boilingSuction } from "./suction-boiling";
import { toPumpPoints, type Adjustment, type CatalogueData, type CurvePointsIn } from "./candidate-input";

export * from "./system-input";
export * from "./candidate-input";
export * from "./duty-check";
import { dutyCheckOf, noHeadClause, type DutyCheck } from "./duty-check";
import { judgeOverload } from "./motor-overload";
import { arrangementStartWarnings, parallelStaging } from "./arrangement-start";
import { stagedShortfalls, type StagedShortfall } from "./verdict-start";
import { minFlowCheck, type MinFlowCheck } from "./verdict-min-flow";
import { bandCautions, bandPoints, GOVERNING_CASE, governingName, motorFigures, npshCornerPoints, npshOverBand, verdictOnBand, type BandPoint, type MotorFigures, type NpshJudgement } from "./candidate-judgement";
import { fmtNumExact, qt, qtAboveZero, qtPair } from "~/engine/quantityText";
import { marginRatioText } from "./npsh-ratio";
import { viscosityCheck, viscositySummary, verdictViscosity, type Liquid } from "./viscosity-check";
import { adjustedRatio, liquidSolver } from "./candidate-solve";
import { npshrGapClauses, npshrPublished, samplesWithNpshrEnds } from "./npshr-reach";

export type RunReport = {
  name: string;
  side: "suction" | "discharge";
  velocity: number;
  reynolds: number;
  frictionFactor: number;
  regime: string;
  headLoss: number;
  warnings: string[];
};

/** Velocity ranges engineers commonly design for, m/s (common practice, rules of thumb). */
export const VELOCITY_GUIDE = { suction: { min: 0.6, max: 1.5 }, discharge: { min: 0.9, max: 3.0 } } as const;

export type SystemEvaluation = {
  flows: number[];
  design: number[];
  low: number[];
  high: number[];
  pressure: number[];
  dutyFlow: number;
  runs: RunReport[];
  warnings: string[];
  fluid: { density: number; kinematicViscosity: number; vaporPressure: number };
  /** NPSHa over the flow range through the aged suction pipe (the least over the pipe's life), m. */
  npsha: { flow: number; y: number }[];
  /** NPSHa at the duty flow itself (aged suction pipe, as `npsha`), m; null without a duty. Absent in evaluations stored before it was kept. */
  npshaAtDuty?: number | null;
  /** The typed duty head against the system curve's head at the duty flow (null without a duty). */
  dutyCheck: DutyCheck | null;
};

const wText = (w: EngineWarning[]) => w.map((x) => x.message);

/**
 * NPSHa = (p_surface − p_vapour)/(ρ g) + z_suction − h_f is at or below zero already at zero flow (no friction) when
 * p_surface − p_vapour ≤ −ρ g z_suction: a suction lift beyond what the surface pressure holds, or a liquid boiling at
 * its surface. No pump runs there without cavitating, whatever its NPSHr: the warning, with its numbers; null otherwise.
 */
export function npshaAtZeroFlow(input: SystemInput, fluid: { density: number; vaporPressure: number }): string | null {
  const rhoG = fluid.density * 9.80665;
  const net = input.suctionSurfacePressure - fluid.vaporPressure;
  const lift = -rhoG * input.suctionStaticHead;
  const npsha = net / rhoG + input.suctionStaticHead;
  if (npsha > 0) return null;
  const [netText, liftText] = qtPair("pressure", net, lift);
  return `NPSH available is ${qtAboveZero("head", npsha, [])} already at zero flow, not above zero: the surface pressure ${qt("pressure", input.suctionSurfacePressure)} less the vapour pressure ${qt("pressure", fluid.vaporPressure)} is ${netText}, not above −ρ g z_suction ${liftText} for the suction static head ${qt("head", input.suctionStaticHead)}. Any pump cavitates here whatever its NPSHr: raise the liquid level or the surface pressure, lower the pump, or cool the liquid.`;
}

/** System curve, band, per-run figures at the duty flow, and NPSHa over the flow range. */
export function evaluateSystem(input: SystemInput, opts: { flowMax?: number; points?: number } = {}): SystemEvaluation {
  const spec = systemSpec(input);
  const prepared = prepareSystem(spec);
  const flowMax = opts.flowMax ?? flowMaxOf(input);
  const curve = systemCurve(prepared, { flowMax, points: opts.points ?? 41, duty: input.duty?.flow });
  const dutyFlow = input.duty?.flow ?? flowMax / 1.6;
  const fluid = prepared.fluid;
  const warnings: string[] = [];
  const sideIndex = { suction: 0, discharge: 0 };
  const runs: RunReport[] = input.runs.map((r) => {
    const preparedRun = prepared[r.side][sideIndex[r.side]++];
    const res = pipeHeadLoss({
      flow: dutyFlow,
      diameter: r.diameter,
      length: r.length,
      roughness: r.roughness,
      minorK: preparedRun?.k ?? r.extraK,
      kinematicViscosity: fluid.kinematicViscosity,
    });
    const guide = VELOCITY_GUIDE[r.side];
    // One message per cause: where the system's warnings carry this run's transition band (it names the duty flow and
    // its Re, systemCurve's `duty`), the one-flow transition warning at the duty is the same cause said twice: left out.
    const band = preparedRun && curve.warnings.some((w) => w.code === "transition-flow" && w.message.startsWith(`${preparedRun.name}: `) && w.message.includes(`D = ${qt("diameter", preparedRun.diameter)}`));
    const warnings = wText(band ? res.warnings.filter((w) => w.code !== "transition-flow") : res.warnings);
    if (res.velocity > guide.max) warnings.push(`Velocity ${qtPair("velocity", res.velocity, guide.max).join(" is above the usual ")} for a ${r.side} line.`);
    if (res.velocity < guide.min) warnings.push(`Velocity ${qtPair("velocity", res.velocity, guide.min).join(" is below the usual ")} for a ${r.side} line.`);
    const fittings = r.fittings.filter((f) => f.count > 0).length;
    if (fittings && res.reynolds > 0 && res.reynolds < LAMINAR_MAX_RE)
      warnings.push(`${r.name || `A ${r.side} run`}: Re ${fmtNumExact(res.reynolds, [LAMINAR_MAX_RE], 0)} at the duty flow is below ${LAMINAR_MAX_RE} (laminar), but the catalogue fittings' K values (Crane TP-410) are for turbulent flow: at low Re a fitting's K grows roughly as 1/Re (3-K method, Darby, from memory), so this run's fittings loss is underestimated.`);
    return { name: r.name, side: r.side, velocity: res.velocity, reynolds: res.reynolds, frictionFactor: res.frictionFactor, regime: res.regime, headLoss: res.headLoss, warnings };
  });
  const npshaAt = (q: number) => (input.suctionSurfacePressure - fluid.vaporPressure) / (fluid.density * 9.80665) + input.suctionStaticHead - suctionLoss(prepared, q, "aged").headLoss;
  const npsha = curve.flows.map((q) => ({ flow: q, y: npshaAt(q) }));
  const boiling = boilingSuction(input, fluid);
  if (boiling) warnings.push(boiling);
  const noSuction = npshaAtZeroFlow(input, fluid);
  if (noSuction) warnings.push(noSuction);
  return {
    flows: curve.flows,
    design: curve.head,
    low: curve.band.low,
    high: curve.band.high,
    pressure: curve.pressure,
    dutyFlow,
    runs,
    // The curve's warnings hold the prepared system's own (fittings, ignored inputs) once each: not listed twice.
    warnings: [...runInputWarnings(input), ...wText(curve.warnings), ...warnings],
    fluid: { density: fluid.density, kinematicViscosity: fluid.kinematicViscosity, vaporPressure: fluid.vaporPressure },
    npsha,
    npshaAtDuty: input.duty ? npshaAt(input.duty.flow) : null,
    dutyCheck: dutyCheckOf(input, prepared),
  };
}

// ── Candidates ───────────────────────────────────────────────────────────────────────────────
export type CandidateEvaluation = {
  status: string;
  message: string;
  /** The speed or trim ratio every figure is at: as set, or solved to the duty and rounded up to a whole rpm or mm (setting-step.ts). */
  ratio: number;
  /** The ratio solved to the duty before it was rounded up; null when none was solved (absent in selections frozen before). */
  solvedRatio?: number | null;
  ratioNote: string | null;
  speed: number | null;
  diameter: number | null;
  curve: { flow: number; head: number; efficiency: number | null; power: number | null; npshr: number | null }[];
  operating: { flow: number; head: number } | null;
  allIntersections: { flow: number; head: number }[];
  figures: {
    efficiency: number | null;
    hydraulicPower: number;
    shaftPower: number | null;
    bepFlow: number | null;
    bepHead: number | null;
    bepRatio: number | null;
    inPor: boolean | null;
    npshAvailable: number | null;
    npshRequired: number | null;
    npshMarginRatio: number | null;
    npshStatus: string | null;
    maxPower: number | null;
    motorLimit: number | null;
    nonOverloading: boolean | null;
    /** The overload verdict with its rule and numbers (motor-overload.ts); absent in selections frozen before it was kept. */
    motorCheck?: string | null;
    motorLoadAtDuty: number | null;
    /** From the electrical input (shaft / (motor η × drive η)). */
    annualEnergyKWh: number | null;
    annualCost: number | null;
    motor: MotorFigures;
  } | null;
  por: { minFlow: number; maxFlow: number } | null;
  /** Operating points at both edges of the system band (least flow edge decides the verdict). */
  band: BandPoint[];
  /** NPSH over the design point and the band's corners (the lowest margin decides; NPSHa ≤ 0 cavitates whatever the pump). */
  npsh: NpshJudgement;
  /** The verdict (engine rules, app/engine/verdict.ts); null only without a duty when nothing else is wrong. */
  verdict: Verdict | null;
  /**
   * Pumps in parallel started one after another: the band's edges where those running cannot let the next open its check
   * valve and deliver less than the verdict accepts (verdict-start.ts); [] when none. Absent in selections frozen before.
   */
  stagedStart?: StagedShortfall[];
  /** The maker's minimum continuous flow against the duty each running pump takes (verdict-min-flow.ts); null without a figure, absent in selections frozen before. */
  minFlow?: MinFlowCheck | null;
  /** ANSI/HI 9.6.7 parameter B of a custom liquid at one pump's water BEP (dimensionless); null for water or when unknown. */
  viscosityB: number | null;
  /**
   * How the water curve stands on the liquid (viscosity-check.ts): corrected (every figure above is on the corrected
   * curve), no correction needed, outside the method, no BEP, not checked; with B and the factors applied. Null for water.
   */
  viscosity: ReturnType<typeof viscositySummary>;
  warnings: string[];
  /**
   * The warnings that qualify the verdict, also among `warnings`: the design point's dead-head, unstable crossings, runout
   * and curve jump, each band edge's, a pump in parallel or series that cannot start (the search row carries them).
   * Absent in selections frozen before it was kept.
   */
  cautions?: string[];
};

/** The operating point's own warnings (engine solveOperatingPoint) that qualify the verdict beside it. */
const VERDICT_CAUTION_CODES = new Set(["dead-head", "unstable-crossing", "near-curve-end", "system-curve-jump"]);

/** A curve set on the system: adjusted (speed/trim, solved to the duty when asked), combined, solved, with figures. */
export function evaluateCandidate(
  input: SystemInput,
  set: { points: CurvePointsIn; speed: number | null; impellerDiameter: number | null; minFlow?: number | null },
  adj: Adjustment,
  opts: { catalogue?: CatalogueData | null; currency?: string } = {},
): CandidateEvaluation {
  const warnings: string[] = [];
  const base = createPumpCurve({ points: toPumpPoints(set.points), speed: set.speed ?? undefined, impellerDiameter: set.impellerDiameter ?? undefined, riseTolerance: 1 });
  const spec = systemSpec(input);
  const prepared = prepareSystem(spec);
  const sysHead = systemHeadFunction(prepared);
  // Speed/trim solves aim at the band's demanding edge, where the verdict is judged.
  const governingHead = systemHeadFunction(prepared, GOVERNING_CASE);
  // Speed/trim solves aim at the band's demanding edge, where the verdict is judged, on the system's liquid.
  const liquid: Liquid = { kind: input.fluid.kind, name: input.fluid.kind === "custom" ? input.fluid.name : "water", kinematicViscosity: prepared.fluid.kinematicViscosity, density: prepared.fluid.density };
  const solver = liquidSolver(base, liquid, set.speed);
  const n = adj.arrangement === "single" ? 1 : adj.dutyPumps;
  const dutyHead = input.duty ? governingHead(input.duty.flow) : null;
  const adjusted = adjustedRatio(base, adj, input.duty ? { flow: input.duty.flow, systemHead: dutyHead!, edge: governingName(input.mode), typedHead: input.duty.head,
    noHead: dutyHead! <= 0 ? noHeadClause(input, prepared, input.duty.flow, "the duty flow") : null } : null, solver);
  const { ratio } = adjusted;
  const ratioNote = adjusted.note;
  warnings.push(...adjusted.warnings);
  let water: PumpCurve = base;
  if (adj.method !== "none") {
    const scaled = adj.method === "speed" ? scaleBySpeed(base, ratio) : scaleByTrim(base, ratio);
    warnings.push(...wText(scaled.warnings));
    if (adj.method === "trim") warnings.push("Impeller trim figures use the affinity approximation (Q ∝ D, H ∝ D²); confirm with the manufacturer's trimmed curve.");
    water = scaled.curve;
  }
  const combine = (c: PumpCurve) => (adj.arrangement === "single" ? { curve: c, warnings: [] } : combinePumps(c, { mode: adj.arrangement, duty: adj.dutyPumps, standby: adj.standbyPumps }));
  // The water curve on the system's liquid (ANSI/HI 9.6.7 B at one pump's water BEP and the speed in use): corrected
  // for viscosity where the method allows, and every figure below is on it. Without a BEP, B at the water operating point.
  const visc = viscosityCheck(liquid, water, set.speed != null ? set.speed * (adj.method === "speed" ? ratio : 1) : null, () => {
    const o = solveOperatingPoint(combine(water).curve, sysHead);
    return o.flow != null && o.head != null ? { flow: adj.arrangement === "parallel" ? o.flow / n : o.flow, head: adj.arrangement === "series" ? o.head / n : o.head } : null;
  });
  warnings.push(...visc.warnings);
  const curve = visc.curve;
  const both = combine(curve);
  warnings.push(...wText(both.warnings));
  const combined = both.curve;
  const op = solveOperatingPoint(combined, sysHead);
  warnings.push(...wText(op.warnings));
  // 41 samples, and the NPSHr curve's ends between them: the duty cycle's curve reads NPSHr as far as published (npshr-reach.ts).
  const curveOut = samplesWithNpshrEnds(combined, 41, prepared.fluid.density);
  let figures: CandidateEvaluation["figures"] = null;
  let por: CandidateEvaluation["por"] = null;
  let perPumpFlow: number | null = null;
  if (op.flow != null && op.head != null) {
    perPumpFlow = adj.arrangement === "parallel" ? flowPerPump(op.flow, { mode: "parallel", duty: n }, curve) : op.flow; // on the pump's own curve at the combined end
    const perPumpHead = adj.arrangement === "series" ? op.head / n : op.head;
    const sl = suctionLoss(prepared, op.flow, "new").headLoss;
    const f = operatingFigures({
      curve,
      flow: perPumpFlow,
      head: perPumpHead,
      fluid: prepared.fluid,
      suction: { surfacePressure: input.suctionSurfacePressure, staticSuctionHead: input.suctionStaticHead, suctionLoss: sl },
      requiredMargin: input.npshMargin,
    });
    // No NPSHr at the operating point: the engine's "curve has no NPSHr at this flow" named neither flow; the candidate's
    // cautions (table, report, CSV `warning_N`) say where the NPSHr curve stops with one pump's flow, as the verdict's line.
    const noNpshr = (w: EngineWarning) => w.code === "npsh-unknown" && f.npsh?.required == null;
    const opPub = npshrPublished(curve.points, adj.arrangement === "single" ? 1 : n);
    warnings.push(...f.warnings.map((w) => (noNpshr(w) ? `NPSH not judged at the operating point: ${npshrGapClauses(opPub, [{ at: "design point", flow: op.flow!, pumpFlow: perPumpFlow }]).join("; ")}` : w.message)));
    const k = adj.arrangement === "single" ? 1 : n;
    const motor = motorFigures({
      shaftPower: f.shaftPower != null ? f.shaftPower * k : null,
      maxCurvePower: f.maxPower,
      pumps: k,
      userRating: adj.motorRating,
      serviceFactor: adj.serviceFactor,
      ieClass: adj.ieClass ?? DEFAULT_IE_CLASS,
      speedDrive: adj.method === "speed",
      ratedSpeed: set.speed ?? opts.catalogue?.ratedSpeed ?? null, // the curve's own speed sets the motor's poles
      hoursPerYear: input.hoursPerYear,
      tariffPerKWh: input.tariffPerKWh,
      currency: opts.currency ?? "",
    });
    warnings.push(...motor.warnings);
    const limit = motor.rating != null ? motorLimit(motor.rating, adj.serviceFactor) : null;
    const overload = limit != null ? judgeOverload({ mode: input.mode, prepared, curve, combined, arrangement: adj.arrangement, n }, f.maxPower, limit) : null;
    const nonOverloading = overload?.nonOverloading ?? null;
    if (overload?.warning) warnings.push(overload.warning);
    figures = {
      efficiency: f.efficiency,
      hydraulicPower: f.hydraulicPower * k,
      shaftPower: f.shaftPower != null ? f.shaftPower * k : null,
      bepFlow: f.bep?.flow ?? null,
      bepHead: f.bep?.head ?? null,
      bepRatio: f.bepRatio,
      inPor: f.inPor,
      npshAvailable: f.npsh?.available ?? null,
      npshRequired: f.npsh?.required ?? null,
      npshMarginRatio: f.npsh?.marginRatio ?? null,
      npshStatus: f.npsh?.status ?? null,
      maxPower: f.maxPower?.power ?? null,
      motorLimit: limit,
      nonOverloading,
      motorCheck: overload?.text ?? null,
      motorLoadAtDuty: motor.rating != null && f.shaftPower != null ? f.shaftPower / motor.rating : null,
      annualEnergyKWh: motor.annualEnergyKWh,
      annualCost: motor.annualCost,
      motor,
    };
    if (f.bep) {
      const m = adj.arrangement === "parallel" ? n : 1;
      por = { minFlow: f.bep.flow * 0.7 * m, maxFlow: f.bep.flow * 1.2 * m };
    }
  }
  const ctx = { mode: input.mode, prepared, base, curve, combined, arrangement: adj.arrangement, n, suction: { surfacePressure: input.suctionSurfacePressure, staticHead: input.suctionStaticHead }, liquid: visc.status === "corrected" ? solver : null };
  const band = bandPoints(ctx);
  const staged = parallelStaging(ctx);
  const edgeAndStart = [...bandCautions(band, { flow: op.flow, warnings: wText(op.warnings) }), ...arrangementStartWarnings(ctx, staged)];
  warnings.push(...edgeAndStart);
  const cautions = [...new Set([...wText(op.warnings.filter((w) => VERDICT_CAUTION_CODES.has(w.code))), ...edgeAndStart])];
  const design = figures && op.flow != null ? { at: "design point", flow: op.flow, pumpFlow: perPumpFlow, available: figures.npshAvailable, required: figures.npshRequired, marginRatio: figures.npshMarginRatio } : null;
  // Where one pump's NPSHr, as run, is published (a single point judged nowhere: npshr-reach.ts, decision "npshone").
  const published = npshrPublished(curve.points, adj.arrangement === "single" ? 1 : n);
  const npsh = npshOverBand(design, npshCornerPoints(ctx, band), input.npshMargin, input.mode === "open" ? input.suctionStaticHead : undefined, published);
  if (npsh.at !== "design point" && (npsh.status === "cavitation-risk" || npsh.status === "low-margin"))
    warnings.push(npsh.marginRatio == null
      ? `NPSH at ${npsh.at}: NPSHa ${qtAboveZero("head", npsh.available ?? NaN, [])} is not above zero: cavitation risk whatever the pump's NPSHr`
      : `NPSH at ${npsh.at}: margin ratio ${marginRatioText(npsh.marginRatio, input.npshMargin)}, ${npsh.status === "cavitation-risk" ? "NPSHa below NPSHr: cavitation risk" : `below the wanted ${input.npshMargin}`}`);
  const cat = opts.catalogue;
  const catalogue: CatalogueLimits | undefined = cat
    ? {
        diameter: set.impellerDiameter != null ? set.impellerDiameter * (adj.method === "trim" ? ratio : 1) : null,
        minDiameter: cat.impellerMin,
        maxDiameter: cat.impellerMax,
        speed: set.speed != null && cat.ratedSpeed != null ? set.speed * (adj.method === "speed" ? ratio : 1) : null,
        ratedSpeed: cat.ratedSpeed,
        speedRatio: adj.method === "speed" && (set.speed == null || cat.ratedSpeed == null) ? ratio : null,
        trimRatio: adj.method === "trim" ? ratio : null,
      }
    : adj.method === "speed" ? { speedRatio: ratio } : adj.method === "trim" ? { trimRatio: ratio } : undefined;
  const verdict = verdictOnBand(ctx, band, input.duty, input.flowTolerance ?? DEFAULT_FLOW_TOLERANCE, catalogue, verdictViscosity(visc));
  return {
    status: op.status,
    message: op.message,
    ratio,
    solvedRatio: adjusted.solved ?? null,
    ratioNote,
    speed: set.speed != null && adj.method === "speed" ? set.speed * ratio : set.speed,
    diameter: set.impellerDiameter != null && adj.method === "trim" ? set.impellerDiameter * ratio : set.impellerDiameter,
    curve: curveOut,
    operating: op.flow != null && op.head != null ? { flow: op.flow, head: op.head } : null,
    allIntersections: op.points,
    figures,
    por,
    band,
    npsh,
    verdict,
    stagedStart: stagedShortfalls(staged, input.duty?.flow, (input.flowTolerance ?? DEFAULT_FLOW_TOLERANCE).minus),
    minFlow: minFlowCheck(set.minFlow, input.duty?.flow, adj, ratio),
    viscosityB: visc.b,
    viscosity: viscositySummary(visc),
    warnings: [...new Set(warnings)],
    cautions,
  };
}

/** Engine input errors become field messages; anything else propagates. */
export function engineErrorMessage(e: unknown): string | null {
  return e instanceof EngineInputError ? e.message : null;
}
