// A measured flow outside the flows the pump's curve is published for (beyond its last point, or below its first): the
// curve states nothing there, so the tolerance cross's head arm (the curve's head at the measured flow) cannot be read.
// The grade is judged only where the cross still reaches the published curve: its flow arm runs from the measured flow
// less the grade's flow tolerance to it plus (ISO 9906:2012 6.4.2's cross around the point, from memory; a measured flow
// Q meets the arm when the curve's flow at the measured head lies from Q / (1 + t₊) to Q / (1 − t₋)), widened by the flow
// meter's accuracy (the lowest / highest flow within it). Where that arm reaches the published flows, the check is
// judged on the part that is published and says so; where it does not, no tolerance verdict, with both flows.
// The arm is read at the measured head: where the published curve states no such head (beyond its end a head below the
// lowest it states, below its first point one above the highest), the arm's crossing with the curve lies where the curve
// states nothing too, and neither arm can be read as read (decision "crossunread"). A fail needs an arm read and missed,
// so that is no tolerance verdict, with the heads and the gauges' uncertainty — unless a point within the readings'
// uncertainty reaches the published curve and meets the grade (the crossing off by less than the instruments' accuracy):
// then at the tolerance limit, as anywhere else, and the note says the reading itself could not be read. Was: "outside
// tolerance" with both arms "not read". Pure.
import { headAt, type PumpCurve, type ToleranceGrade } from "~/engine";
import { fmtPctLimit, qtExact, qtLimit } from "~/engine/quantityText";
import { pctAsTyped } from "../shared/format";

/** Where a measured flow lies against the published curve's flows, and how far the flow arm of the cross reaches. */
export type CurveEnd = {
  side: "beyond" | "below";
  /** The measured flow, m³/s. */
  measured: number;
  /** The curve's last (beyond) or first (below) published flow, m³/s. */
  end: number;
  /** Where the flow arm reaches towards the curve, m³/s: the measured flow (its lowest / highest within the meter's accuracy) ÷ (1 ± t). Infinity when a grade allows −100 %. */
  reach: number;
  /** Whether the flow arm reaches the published flows (reach at or past the end). */
  reaches: boolean;
};

/**
 * Null when the measured flow lies within the published flows, ends included (the curve states its head there).
 * @param curve the curve the check holds the readings to (at the measured speed, on the liquid), SI
 * @param flow the measured flow, m³/s
 * @param grade the tolerance grade (flow tolerances as fractions)
 * @param flowAccuracy the flow meter's accuracy, fraction of the reading (0 when not stated)
 */
export function curveEndOf(curve: PumpCurve, flow: number, grade: Pick<ToleranceGrade, "flow">, flowAccuracy: number): CurveEnd | null {
  const first = curve.flowMin;
  const last = curve.flowMax;
  if (flow >= first && flow <= last) return null;
  const beyond = flow > last;
  const end = beyond ? last : first;
  const reach = beyond ? (flow * (1 - flowAccuracy)) / (1 + grade.flow[1]) : grade.flow[0] >= 1 ? Infinity : (flow * (1 + flowAccuracy)) / (1 - grade.flow[0]);
  const reaches = beyond ? reach <= last : reach >= first;
  return { side: beyond ? "beyond" : "below", measured: flow, end, reach, reaches };
}

/** "the measured flow ⟦Q⟧ lies beyond the curve's end at ⟦E⟧": the flow and the end with the digits that keep them apart. */
function where(e: CurveEnd): string {
  const q = qtExact("flow", e.measured, [e.end]);
  const end = qtLimit("flow", e.end, [e.measured]);
  return e.side === "beyond" ? `the measured flow ${q} lies beyond the curve's end at ${end}` : `the measured flow ${q} lies below the curve's first point at ${end}`;
}

/** The flow arm's reach in words: "grade 2B's flow arm (+8 %) reaches back only to ⟦R⟧". */
function armWords(e: CurveEnd, gradeId: string, grade: Pick<ToleranceGrade, "flow">, flowAccuracy: number): string {
  const t = e.side === "beyond" ? `+${fmtPctLimit(grade.flow[1])}` : grade.flow[0] === 0 ? "0 %" : `−${fmtPctLimit(grade.flow[0])}`;
  const meter = flowAccuracy > 0 ? `, from the ${e.side === "beyond" ? "lowest" : "highest"} flow within the meter's ±${pctAsTyped(flowAccuracy)}` : "";
  const reach = Number.isFinite(e.reach) ? qtExact("flow", e.reach, [e.end]) : "any flow";
  return `grade ${gradeId}'s flow arm (${t}${meter}) reaches ${e.side === "beyond" ? "back" : "up"} ${e.reaches ? "to" : "only to"} ${reach}`;
}

/** The no-verdict note (a warning, and the e-mail's reason): the cross does not reach the published curve. */
export function curveEndNoVerdict(e: CurveEnd, gradeId: string, grade: Pick<ToleranceGrade, "flow">, flowAccuracy: number): string {
  return `No tolerance verdict: ${where(e)}, and the curve states nothing there; ${armWords(e, gradeId, grade, flowAccuracy)}, short of it, so neither arm of the tolerance cross can be read. Check at a flow the curve is published for, or ask the maker for the curve ${e.side === "beyond" ? "past its end" : "below its first point"}.`;
}

/** Prefix of the note said when a check off the published flows is judged on the part that is published. */
export const PUBLISHED_PART = "Judged on the published part of the curve:";

/** The note for a check judged on the published part: the head arm cannot be read; the flow arm is read between its reach and the curve's end. */
export function curveEndJudgedNote(e: CurveEnd, gradeId: string, grade: Pick<ToleranceGrade, "flow">, flowAccuracy: number): string {
  const from = e.side === "beyond" ? qtExact("flow", e.reach, [e.end]) : qtLimit("flow", e.end, [e.measured]);
  const to = e.side === "beyond" ? qtLimit("flow", e.end, [e.measured]) : Number.isFinite(e.reach) ? qtExact("flow", e.reach, [e.end]) : "";
  const span = e.side === "beyond" ? `from ${from} to the curve's end at ${to}` : `from the curve's first point at ${from}${to ? ` to ${to}` : ""}`;
  return `${PUBLISHED_PART} ${where(e)}, so the head arm of the tolerance cross cannot be read there; ${armWords(e, gradeId, grade, flowAccuracy)}, and only its part ${span} is read against the published curve — the rest of the arm lies where the curve states nothing.`;
}

/** Where the reading's crossing with the curve is unpublished too: the heads the curve states, the measured head and the gauges' uncertainty. */
export type CrossingOff = {
  /** The measured head, m. */
  head: number;
  /** The lowest and highest head the published curve states, m. */
  low: number;
  high: number;
  /** How far the measured head lies outside them, m (0 where it touches them). */
  gap: number;
  /** The head's uncertainty from the gauges' accuracies given, ± m; null where neither gauge's was given. */
  uncertainty: number | null;
};

/**
 * The lowest and highest head the published curve states, m: over its knots (its head interpolant is monotone between them).
 * @param curve the curve the check holds the readings to, SI
 */
export function publishedHeads(curve: PumpCurve): { low: number; high: number } {
  const heads = curve.head.x.map((x) => headAt(curve, x) ?? NaN).filter(Number.isFinite);
  return { low: Math.min(...heads), high: Math.max(...heads) };
}

/**
 * Where neither arm of the cross can be read as read (the head arm off the published flows, the flow arm's crossing off the
 * published heads): the numbers the words need.
 * @param curve the curve the check holds the readings to, SI
 * @param head the measured head, m
 * @param headUncertainty the gauges' accuracies given, in quadrature over ρ·g, ± m
 * @param gaugesGiven whether either gauge's accuracy was given
 */
export function crossingOff(curve: PumpCurve, head: number, headUncertainty: number, gaugesGiven: boolean): CrossingOff {
  const { low, high } = publishedHeads(curve);
  const gap = head < low ? low - head : head > high ? head - high : 0;
  return { head, low, high, gap, uncertainty: gaugesGiven ? headUncertainty : null };
}

/** "the published curve states heads from ⟦L⟧ to ⟦H⟧ only, and the measured ⟦h⟧ lies ⟦gap⟧ below them". */
function headsWords(c: CrossingOff): string {
  const side = c.head < c.low ? "below" : "above";
  const gap = c.gap > 0 ? `, ${qtExact("head", c.gap, c.uncertainty !== null ? [c.uncertainty] : [])} ${side} them` : "";
  return `the published curve states heads from ${qtLimit("head", c.low, [c.head])} to ${qtLimit("head", c.high, [c.head])} only, and the measured head is ${qtExact("head", c.head, [c.low, c.high])}${gap}`;
}

/** The gauges' uncertainty beside that gap: not given (the head taken as read), or its number. */
function gaugeWords(c: CrossingOff): string {
  return c.uncertainty === null
    ? "the gauges' accuracy was not given, so the head is taken as read"
    : `the gauges' ±${qtExact("head", c.uncertainty, [c.gap])} (in quadrature over ρ·g) ${c.uncertainty >= c.gap ? "reach" : "do not reach"} them`;
}

/**
 * The no-verdict note where neither arm can be read as read and no point within the readings' uncertainty meets the grade on
 * the published curve (a warning, and the e-mail's reason).
 */
export function crossingOffNoVerdict(e: CurveEnd, c: CrossingOff, gradeId: string, grade: Pick<ToleranceGrade, "flow">, flowAccuracy: number): string {
  return `No tolerance verdict: ${where(e)}, so the head arm of the tolerance cross cannot be read there; ${armWords(e, gradeId, grade, flowAccuracy)}, but the arm is read at the measured head, and ${headsWords(c)}: the arm crosses the curve where it states nothing, so neither arm can be read (${gaugeWords(c)}${c.uncertainty !== null && c.uncertainty >= c.gap ? ", and no point within the readings' uncertainty meets the grade on the published curve" : ""}). A fail needs an arm read and missed, so this is no verdict, not a fail. Check at a flow and head the curve is published for, or ask the maker for the curve ${e.side === "beyond" ? "past its end" : "below its first point"}.`;
}

/** Said after the judged note where the reading itself could not be read on either arm and the verdict rests on a point within its uncertainty. */
export function crossingOffJudged(c: CrossingOff): string {
  return ` As read neither arm can be read (${headsWords(c)}; ${gaugeWords(c)}): the verdict rests on the point within the readings' uncertainty that reaches the published curve.`;
}
