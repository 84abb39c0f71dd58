// A tolerance grade's power and efficiency limits on a field check (the engine's gradePower.ts: shaft power at most
// (1 + tP) × the curve's, pump efficiency at least (1 − tη) × the curve's, ISO 9906:2012 from memory — tη read as a
// fraction of the curve's efficiency, to be verified against the standard). The form records the motor's INPUT power
// (a meter, the drive, or V·I·PF); the curve gives the pump's SHAFT power. They are compared only through the motor
// efficiency the contractor entered (shaft = input × η_motor); without it power and efficiency are not judged, and
// the check says so. Pure: evaluate.ts stores `PowerGrade` with the result, the page and the e-mail read the sentences.
import type { GradeLimitCheck, GradePowerCheck, GradePowerWitness } from "~/engine";
import { fmtPctExact, fmtPctLimit, fmtPctSignedExact, gradeAllows, gradeSlack, qtPair, qt } from "~/engine/quantityText";
import { pctAsTyped } from "../shared/format";
import type { PowerSI } from "./form";
import { efficiencyUpward } from "./uncertainty-bound";

/** What a check judged of its grade's power and efficiency limits, stored with its result. */
export type PowerGrade = {
  /** Why power and efficiency were not judged (plain text, no quantity tokens); null when judged. */
  notJudged: string | null;
  /** The shaft power judged: the input power (W) × the motor efficiency entered (fraction); null when not judged. */
  basis: { input: number; motorEfficiency: number } | null;
  /** The engine's judgement at the measured point; null when not judged. */
  check: GradePowerCheck | null;
  /**
   * When judged: the power reading's accuracy, ± fraction of the reading, or null when none was given (judged as read).
   * Missing from results recorded before it could be entered, and when not judged.
   */
  accuracy?: number | null;
  /**
   * When judged with an accuracy and a limit is missed as read: a shaft power within the accuracy that meets the limits
   * (the engine's `gradePowerWithinAccuracy`), or null when none does (a fail). Missing otherwise.
   */
  within?: GradePowerWitness | null;
};

type GradeWords = { id: string; powerAbove?: number; efficiencyBelow?: number };

/**
 * Whether and how a check's power was judged against its grade.
 * @param grade the grade judged (fractions)
 * @param tolerance whether the check has a tolerance verdict at all (a flow meter, a speed near the curve's)
 * @param power the power as recorded (SI)
 * @param input the motor's input power, W, or null
 * @param check the engine's judgement (fieldCheck's grade entry), or null
 * @param within where `check` misses a limit and the reading has an accuracy: a power within it meeting them, or null
 * @param impossible why the power reading cannot be right (a pump efficiency above 100 %), or null: then not judged, with that reason
 */
export function powerGradeOf(grade: GradeWords, tolerance: boolean, power: PowerSI, input: number | null, check: GradePowerCheck | null, within: GradePowerWitness | null = null, impossible: string | null = null): PowerGrade {
  const not = (why: string): PowerGrade => ({ notJudged: `Power and efficiency were not judged against grade ${grade.id}: ${why}`, basis: null, check: null });
  if (!tolerance) return not("there is no tolerance verdict (the notes on the working say why).");
  if (power.mode === "none" || input === null) return not("no power was recorded, so the verdict is on flow and head only.");
  if (power.motorEfficiency === null)
    return not(
      "the motor's input power was recorded without the motor's efficiency, and the curve gives the pump's shaft power (input × motor efficiency), so the two cannot be compared. The verdict is on flow and head only; enter the motor's nameplate efficiency to judge them.",
    );
  if (grade.powerAbove === undefined && grade.efficiencyBelow === undefined) return not("the grade sets no power or efficiency limit.");
  if (impossible) return not(impossible);
  if (!check || check.pass === null) return not("the curve gives neither power nor efficiency at the measured flow, so the verdict is on flow and head only.");
  const accuracy = power.readingAccuracy ?? null;
  const judged: PowerGrade = { notJudged: null, basis: { input, motorEfficiency: power.motorEfficiency }, check, accuracy };
  return accuracy !== null && check.pass === false ? { ...judged, within } : judged;
}

/** Whether the limits judged are met: as read, within the power reading's accuracy ("marginal"), or not; null when not judged. */
export function powerGradeState(pg: PowerGrade | null | undefined): "met" | "within" | "missed" | null {
  if (!pg || pg.notJudged !== null || !pg.check || pg.check.pass === null) return null;
  if (pg.check.pass) return "met";
  return pg.within ? "within" : "missed";
}

/** A deviation with its sign, never reading as the allowance it is judged against (a fraction ≥ 0). */
const signed = (x: number, allowed: number) => fmtPctSignedExact(x, [allowed], true);
/** An allowance as typed, with its side: "+4 %", "−3 %", and "0 %" for none. */
const allowance = (a: number, side: "+" | "−") => (a === 0 ? "0 %" : `${side}${pctAsTyped(a)}`);

/**
 * A deviation against its allowance as judged (power: above the curve's, side "+"; efficiency: below, side "−"), e.g.
 * "+3.5 % ≤ +4 % allowed"; on the edge within the rounding allowance "+4 % = +4 % allowed, at the limit (the allowance
 * includes its edge)" (it printed "+4.000000 % ≤ +4 %"). A deviation judged past its allowance is past it by more than
 * `gradeSlack` (1 part in 10⁸ of it), which the per cent's own digits show (pctText.ts `fmtPctExact`: "+4.00000005 % >
 * +4 % allowed"); no words for it (it added "(past it by under 0.000001 points)", redundant beside those digits).
 */
function compared(x: GradeLimitCheck & { deviation: number; pass: boolean }, side: "+" | "−", ofIt = ""): string {
  const allowed = `${allowance(x.allowed, side)} allowed`;
  const edge = edgeOf(x, side);
  if (edge === "at") return `${allowance(x.allowed, side)}${ofIt} = ${allowed}, at the limit (the allowance includes its edge)`;
  const sign = side === "+" ? (x.pass ? "≤" : ">") : x.pass ? "≥" : "<";
  return `${signed(x.deviation, x.allowed)}${ofIt} ${sign} ${allowed}`;
}

/** "at": met on the allowance within the rounding allowance (`gradeSlack`); else null. */
function edgeOf(x: GradeLimitCheck & { deviation: number; pass: boolean }, side: "+" | "−"): "at" | null {
  const margin = side === "+" ? x.allowed - x.deviation : x.deviation + x.allowed; // inside ≥ 0
  return x.pass && Math.abs(margin) <= gradeSlack(x.allowed) ? "at" : null;
}

/**
 * One limit's own state, whatever the other limit and the check's verdict: met as read; "within" — missed as read but met
 * at the lowest power within the reading's accuracy (`low`, from {@link lowOf}; a check that fails on the other limit, or on
 * flow and head, still says so of this one); or missed. The check's verdict is the limits together (`powerGradeState`).
 */
function limitState(x: GradeLimitCheck, low: GradeLimitCheck | null): "met" | "within" | "missed" {
  if (x.pass) return "met";
  return low?.pass === true ? "within" : "missed";
}

/**
 * Each limit's own state (met, met within the power reading's accuracy, missed), as {@link limitState}; null for a limit not
 * judged (the grade sets none, or the curve gives no value), or all null when power and efficiency were not judged.
 */
export function powerLimitStates(pg: PowerGrade | null | undefined): { power: "met" | "within" | "missed" | null; efficiency: "met" | "within" | "missed" | null } {
  const check = pg && pg.notJudged === null ? pg.check : null;
  if (!pg || !check || check.pass === null) return { power: null, efficiency: null };
  const low = lowOf(pg, check);
  const one = (x: GradeLimitCheck | null, xLow: GradeLimitCheck | null) => (x && x.deviation !== null && x.pass !== null ? limitState(x, xLow) : null);
  return { power: one(check.power, low?.power ?? null), efficiency: one(check.efficiency, low?.efficiency ?? null) };
}

/** The limit's value the reading is held to: (1 + tP) × the curve's power, or (1 − tη) × the curve's efficiency. */
const limitValue = (x: GradeLimitCheck, side: "+" | "−") => (x.curve ?? NaN) * (side === "+" ? 1 + x.allowed : 1 - x.allowed);

/**
 * A limit missed as read but met within the power reading's accuracy, with the rule and numbers: "met within the meter's
 * ±2 % (read 101.0 % of the limit; at the lowest power within it, reading × (1 − 2 %), +2.9 % ≤ +4 % allowed)".
 */
function withinWords(x: GradeLimitCheck, low: GradeLimitCheck, a: number, side: "+" | "−", nested = false): string {
  const ofLimit = x.measured / limitValue(x, side);
  const why = `read ${fmtPctExact(ofLimit, [1])} of the limit; at the lowest power within it, reading × (1 − ${pctAsTyped(a)}), ${signed(low.deviation!, low.allowed)} ${side === "+" ? "≤" : "≥"} ${allowance(low.allowed, side)} allowed`;
  return `met within the meter's ±${pctAsTyped(a)}${nested ? `: ${why}` : ` (${why})`}`;
}

/**
 * Each limit of `check` at the lowest power within the accuracy; null without one, or with one that is not a fraction in
 * [0, 1) (the form and the stored result refuse such; handed in anyway, no limit reads "met within" it).
 */
const lowOf = (pg: PowerGrade, check: GradePowerCheck) => (pg.accuracy != null && Number.isFinite(pg.accuracy) && pg.accuracy >= 0 && pg.accuracy < 1 ? atLowest(check, pg.accuracy) : null);

function powerLine(p: GradeLimitCheck | null, basis: NonNullable<PowerGrade["basis"]>, pg: PowerGrade, low: GradeLimitCheck | null): string | null {
  if (!p) return null;
  const from = `input ${qt("power", basis.input)} × motor efficiency ${fmtPctLimit(basis.motorEfficiency)}`;
  if (p.curve === null || p.deviation === null || p.pass === null) return `Power: shaft ${qt("power", p.measured)} (${from}); the curve gives no power at the measured flow — not judged.`;
  const [measured, curve] = qtPair("power", p.measured, p.curve);
  const head = `Power: shaft ${measured} (${from}) vs curve ${curve}: ${compared({ ...p, deviation: p.deviation, pass: p.pass }, "+")}`;
  const state = limitState(p, low);
  return state === "within" ? `${head} as read — ${withinWords(p, low!, pg.accuracy!, "+")}.` : `${head} — ${state === "met" ? "met" : "not met"}.`;
}

function efficiencyLine(e: GradeLimitCheck | null, pg: PowerGrade, low: GradeLimitCheck | null): string | null {
  if (!e) return null;
  if (e.curve === null || e.deviation === null || e.pass === null) return `Efficiency: pump ${fmtPctExact(e.measured)} (ρ·g·Q·H / shaft power); the curve gives no efficiency at the measured flow — not judged.`;
  const head = `Efficiency: pump ${fmtPctExact(e.measured, [e.curve])} (ρ·g·Q·H / shaft power) vs curve ${fmtPctExact(e.curve, [e.measured])}: ${compared({ ...e, deviation: e.deviation, pass: e.pass }, "−", " of it")}`;
  const state = limitState(e, low);
  return state === "within" ? `${head} as read — ${withinWords(e, low!, pg.accuracy!, "−")}.` : `${head} — ${state === "met" ? "met" : "not met"}.`;
}

/** "power +3.5 % ≤ +4 % allowed, efficiency −1.2 % ≥ −3 % allowed" for a check of the limits, each judged one. */
function limitsAt(c: Pick<GradePowerCheck, "power" | "efficiency">): string {
  const said: string[] = [];
  const p = c.power;
  const e = c.efficiency;
  if (p && p.deviation !== null && p.pass !== null) said.push(`power ${compared({ ...p, deviation: p.deviation, pass: p.pass }, "+")}`);
  if (e && e.deviation !== null && e.pass !== null) said.push(`efficiency ${compared({ ...e, deviation: e.deviation, pass: e.pass }, "−", " of the curve's")}`);
  return said.join(", ");
}

/**
 * The limits at the lowest power within the accuracy, P(1 − a): the power's deviation (1 + d)(1 − a) − 1, the efficiency's
 * (1 + d)/(1 − a) − 1 (efficiency moves inversely with power), each against its allowance as the engine judges it.
 */
function atLowest(c: GradePowerCheck, a: number): Pick<GradePowerCheck, "power" | "efficiency"> {
  const move = (x: GradeLimitCheck | null, factor: number, side: "above" | "below"): GradeLimitCheck | null => {
    if (!x || x.deviation === null || x.curve === null) return x;
    const deviation = (1 + x.deviation) * factor - 1;
    return { ...x, measured: x.measured * factor, deviation, pass: side === "above" ? gradeAllows(deviation, Infinity, x.allowed) : gradeAllows(deviation, x.allowed, Infinity) };
  };
  return { power: move(c.power, 1 - a, "above"), efficiency: move(c.efficiency, 1 / (1 - a), "below") };
}

/**
 * The sentence on the power reading's accuracy, with its rule and numbers: none given (judged as read), met as read, met
 * within it (marginal: the power that meets the limits), or missed even at the lowest power within it (fail).
 */
function accuracyLine(pg: PowerGrade, check: GradePowerCheck, basis: NonNullable<PowerGrade["basis"]>): string {
  const a = pg.accuracy ?? null;
  if (a === null)
    return "No power reading accuracy was given, so the power and efficiency limits are judged as read: a limit missed by any margin makes the check a fail. Enter the meter's accuracy (± % of the reading) to allow for it.";
  const shaft = basis.input * basis.motorEfficiency;
  const head = `Power reading accuracy ±${pctAsTyped(a)} of the reading (shaft ${qt("power", shaft * (1 - a))} to ${qt("power", shaft * (1 + a))})`;
  if (check.pass) return `${head}: the limits are met as read, which decides (a reading meeting a limit as read is not marked down for its accuracy, as for flow and head).`;
  const rule = `a limit missed as read is met within the accuracy when it is met at the lowest power within it, reading × (1 − ${pctAsTyped(a)}), at the flow and head as read (their uncertainty is allowed for on the tolerance cross only)`;
  const w = pg.within;
  if (w)
    return `${head}: the limits are missed as read, but within that accuracy a shaft power of ${qt("power", w.shaft)} (${fmtPctSignedExact(w.shaft / shaft - 1, [-a], true)} of the reading) meets them — ${limitsAt(w.check)} — so the verdict is at the tolerance limit (marginal), not a fail (${rule}; ${boundWords(check, a)}).`;
  return `${head}: the limits are missed even at the lowest power within it — ${limitsAt(atLowest(check, a))} — so the check is a fail (${rule}).`;
}

/**
 * The bound on a marginal resting on the power reading's accuracy (uncertainty-bound.ts `powerLimitsTooWide`), with its
 * numbers: each limit missed as read against its own tolerance — "and only while ±2 % is no wider than the tolerance of each
 * limit missed as read: the power limit's +4 %; wider, no tolerance verdict".
 */
function boundWords(check: GradePowerCheck, a: number): string {
  // The efficiency's uncertainty from the power reading is a/(1 − a) upward (η = P_hyd / P; uncertainty-bound.ts, decision "effexact").
  const up = efficiencyUpward(a);
  const limits = [
    check.power?.pass === false ? { words: `the power limit's ${allowance(check.power.allowed, "+")}`, allowed: check.power.allowed, uncertainty: a } : null,
    check.efficiency?.pass === false
      ? { words: `the efficiency limit's ${allowance(check.efficiency.allowed, "−")}`, detail: ` (against the efficiency's +${fmtPctExact(up, [check.efficiency.allowed], 2)} within ±${pctAsTyped(a)}, a/(1 − a))`, allowed: check.efficiency.allowed, uncertainty: up }
      : null,
  ].filter((x) => x !== null);
  const rule = `and only while ±${pctAsTyped(a)} is no wider than the tolerance of each limit missed as read: ${limits.map((x) => `${x.words}${"detail" in x ? x.detail : ""}`).join(" and ")}; wider, no tolerance verdict`;
  // A check recorded before each limit was held to its own tolerance (decisions "effbound", "effexact") keeps its stored verdict: said so.
  const wider = limits.filter((x) => x.uncertainty > x.allowed);
  return wider.length
    ? `${rule} — this check was recorded before that bound: ±${pctAsTyped(a)} is wider than ${wider.map((x) => x.words).join(" and ")}, so a check recorded today would give no tolerance verdict; the stored verdict is kept`
    : rule;
}

/**
 * The grade's power and efficiency limits in words, each with its rule and numbers (quantity tokens: render them in the
 * reader's units). A result recorded before these limits were judged (no `powerGrade`) says so.
 * @param r the stored result's grade and power judgement
 */
export function powerGradeSentences(r: { grade: GradeWords; powerGrade?: PowerGrade | null }): string[] {
  const g = r.grade;
  if (!r.powerGrade) return [`Power and efficiency were not judged against grade ${g.id}: this check was recorded before a grade's power and efficiency limits were judged, so its verdict is on flow and head only.`];
  const { notJudged, basis, check } = r.powerGrade;
  if (notJudged !== null || !basis || !check) return [notJudged ?? `Power and efficiency were not judged against grade ${g.id}.`];
  const low = lowOf(r.powerGrade, check);
  const rule = [
    g.powerAbove !== undefined ? `the shaft power to at most ${fmtPctLimit(g.powerAbove)} above the curve's at the measured flow` : null,
    g.efficiencyBelow === undefined ? null
      : g.efficiencyBelow === 0 ? "the pump's efficiency to at least the curve's"
      : `the pump's efficiency to at least the curve's less ${fmtPctLimit(g.efficiencyBelow)} of it (a fraction of the curve's efficiency, not percentage points)`,
  ].filter(Boolean);
  return [
    `Grade ${g.id} also limits ${rule.join(", and ")} (ISO 9906:2012 from memory; our reading, to be verified against the standard). Judged as read${r.powerGrade.accuracy != null ? ", then within the power reading's accuracy (below)" : ""}; the grade is met only when flow/head, power and efficiency all are.`,
    ...[powerLine(check.power, basis, r.powerGrade, low?.power ?? null), efficiencyLine(check.efficiency, r.powerGrade, low?.efficiency ?? null)].filter((x): x is string => x !== null),
    accuracyLine(r.powerGrade, check, basis),
    "The shaft power is the input power × the motor efficiency entered: an error in that efficiency moves the power and the efficiency judged one for one.",
  ];
}

/**
 * One clause for the e-mail: the limits missed with their numbers, "met", or why not judged.
 * @param r the stored result's grade and power judgement
 */
export function powerGradeSummary(r: { grade: GradeWords; powerGrade?: PowerGrade | null }): string {
  const pg = r.powerGrade;
  if (!pg || pg.notJudged !== null || !pg.check) return powerGradeSentences(r)[0];
  const { power, efficiency } = pg.check;
  const low = lowOf(pg, pg.check);
  // Each limit on its own: one missed as read but met within the accuracy says so, whether the check is marginal or fails on the other.
  const part = (name: string, x: GradeLimitCheck | null, xLow: GradeLimitCheck | null, sign: "+" | "−") => {
    if (!x || x.deviation === null || x.pass === null) return `${name} not judged (no curve value)`;
    const state = limitState(x, xLow);
    if (state === "within") return `${name} ${signed(x.deviation, x.allowed)} as read (${allowance(x.allowed, sign)} allowed, ${withinWords(x, xLow!, pg.accuracy!, sign, true)})`;
    const edge = edgeOf({ ...x, deviation: x.deviation, pass: x.pass }, sign);
    const shown = edge === "at" ? allowance(x.allowed, sign) : signed(x.deviation, x.allowed);
    return `${name} ${shown} (${allowance(x.allowed, sign)} allowed, ${state === "met" ? (edge === "at" ? "met, at the limit" : "met") : "not met"})`;
  };
  return `Against grade ${r.grade.id}'s power and efficiency limits: ${[power ? part("shaft power", power, low?.power ?? null, "+") : null, efficiency ? part("pump efficiency", efficiency, low?.efficiency ?? null, "−") : null].filter(Boolean).join(", ")}${accuracyClause(pg, pg.check)}.`;
}

/** The e-mail's clause on the power reading's accuracy: none given (as read), or what the limits are within it, with the numbers. */
function accuracyClause(pg: PowerGrade, check: GradePowerCheck): string {
  const a = pg.accuracy ?? null;
  if (check.pass === null) return "";
  if (a === null) return "; judged as read, no power reading accuracy was given";
  const acc = `the power reading's ±${pctAsTyped(a)}`;
  if (check.pass) return `; met as read (${acc} not needed)`;
  if (pg.within) return `; met within ${acc} at shaft ${qt("power", pg.within.shaft)} (${limitsAt(pg.within.check)}), so at the tolerance limit`;
  return `; missed even at the lowest power within ${acc} (${limitsAt(atLowest(check, a))})`;
}
