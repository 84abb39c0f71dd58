// A measured flow outside the flows the pump's curve is published for (beyond its last point, or below its first): the
// curve states nothing there, so the tolerance cross's head arm (the curve's head at the measured flow) cannot be read.
// The grade is judged only where the cross still reaches the published curve: its flow arm runs from the measured flow
// less the grade's flow tolerance to it plus (ISO 9906:2012 6.4.2's cross around the point, from memory; a measured flow
// Q meets the arm when the curve's flow at the measured head lies from Q / (1 + t₊) to Q / (1 − t₋)), widened by the flow
// meter's accuracy (the lowest / highest flow within it). Where that arm reaches the published flows, the check is
// judged on the part that is published and says so; where it does not, no tolerance verdict, with both flows. Pure.
import { type PumpCurve, type ToleranceGrade } from "~/engine";
import { fmtPctExact, fmtPctLimit, qtExact, qtLimit } from "~/engine/quantityText";

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
  const meter = flowAccuracy > 0 ? `, from the ${e.side === "beyond" ? "lowest" : "highest"} flow within the meter's ±${fmtPctExact(flowAccuracy)}` : "";
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
