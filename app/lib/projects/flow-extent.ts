// How far a system's or a candidate's flow reaches, m³/s: the flow axis of a chart or report — the user's own end, else
// 1.6 × the duty or 1.05 × the pumps' reach — and each candidate's own curve end with its arrangement and speed. Pure.
import type { Adjustment } from "./candidate-input";
import type { SystemInput } from "./system-input";

/** The flow axis's end, m³/s: the system's own `flowMax` where set, else 1.6 × the duty flow or 1.05 × the pumps' reach (at least 0.1 L/s). */
export function flowMaxOf(input: SystemInput, pumpFlowMax = 0): number {
  if (input.flowMax > 0) return input.flowMax;
  const fromDuty = input.duty ? input.duty.flow * 1.6 : 0;
  return Math.max(fromDuty, pumpFlowMax * 1.05, 1e-4);
}

/**
 * Largest flow one candidate can reach, m³/s: its own curve's last flow × its own duty pumps in
 * parallel × its speed ratio when above 1 (affinity laws, Q ∝ N). Trims only shorten the curve.
 */
export function candidateFlowEnd(c: { set: { points: readonly { flow: number }[] }; adjustment: Adjustment }): number {
  const end = c.set.points[c.set.points.length - 1]?.flow ?? 0;
  const a = c.adjustment;
  const n = a.arrangement === "parallel" ? a.dutyPumps : 1;
  const r = a.method === "speed" && a.ratio != null ? Math.max(1, a.ratio) : 1;
  return Number.isFinite(end) && end > 0 ? end * n * r : 0;
}

/** Largest flow any of the candidates reaches, each with its own arrangement (never one pump's curve × another's pump count). */
export function candidatesFlowMax(cands: readonly { set: { points: readonly { flow: number }[] }; adjustment: Adjustment }[]): number {
  return cands.reduce((m, c) => Math.max(m, candidateFlowEnd(c)), 0);
}

/**
 * Flow range for a chart or report of one evaluated candidate, m³/s: its evaluated (adjusted,
 * combined) curve's end and its operating points, with the duty (see flowMaxOf); other
 * candidates never widen it.
 */
export function resultFlowMax(input: SystemInput, result: { curve: readonly { flow: number }[]; operating: { flow: number } | null; allIntersections?: readonly { flow: number }[] } | null): number {
  let pump = 0;
  if (result) {
    for (const p of [result.curve[result.curve.length - 1], result.operating, ...(result.allIntersections ?? [])]) {
      if (p && Number.isFinite(p.flow) && p.flow > pump) pump = p.flow;
    }
  }
  return flowMaxOf(input, pump);
}
