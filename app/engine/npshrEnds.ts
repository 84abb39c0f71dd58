// Where NPSHr is read at the ends of its published column: the rounding allowance the workbench's curve (pumpCurve.ts
// `npshrAt`) and the search's index (searchIndex.ts `evalNpshrPacked`) share, so both read NPSHr at the same flows.
import { LIMIT_ROUNDING, qtExact, qtLimit } from "./quantityText.ts";

/**
 * The rounding allowance at the NPSHr curve's ends (dimensionless, 1 part in 10⁸). NPSHr is read off the published curve
 * between its first and last published flow, never beyond (decision "npshone"); but a flow that reaches an end through
 * arithmetic — a band corner solved by a root finder, one pump's share of a total, a flow scaled by a speed ratio and back
 * — lands a rounding error either side of it (43.2000000001 m³/h at a curve ending at 43.2 m³/h), and a text showing at
 * most 9 significant digits then read "the NPSHr curve ends at 43.2 m³/h, and the pump runs past it at 43.2000000 m³/h".
 * Rule: a flow within 1 part in 10⁸ of the NPSHr column's first or last published flow is at that flow and reads its
 * NPSHr; further out it has none, and the words tell it from the end. The allowance follows the words' digits
 * (engine quantityText.ts `MAX_SIGNIFICANT`, 9): one step of a value's 9th significant digit is at most 1 part in 10⁸ of
 * it, so a flow further out than that prints apart from the end in every unit — at 1 part in 10⁹ (decision "npshtwo") a
 * flow 1–1.2 parts in 10⁹ past 43.2 m³/h still read "43.2000000", and one up to 5 parts past a flow written with a
 * leading 1. The same in the search's index (searchIndex.ts `evalNpshrPacked`), so the search and the workbench read
 * NPSHr at the same flows. The app's one allowance at a judged limit (quantityText.ts `LIMIT_ROUNDING`).
 * Tests: engine/npshr-end-rounding.test.ts, lib/projects/npshr-end-rounding.test.ts.
 */
export const NPSHR_END_ROUNDING = LIMIT_ROUNDING;

/**
 * The flow NPSHr is read at: `flow` itself, or the NPSHr column's first or last published flow where `flow` lies within
 * {@link NPSHR_END_ROUNDING} of it outside the column. For the engine's own lookups (`npshrAt`, the search's index).
 * @param first the column's first published flow, m³/s (any unit of flow, the same for all three)
 * @param last the column's last published flow, m³/s (same unit)
 * @param flow the flow asked about, m³/s (same unit)
 */
export function npshrFlow(first: number, last: number, flow: number): number {
  if (flow > last && flow <= last * (1 + NPSHR_END_ROUNDING)) return last;
  if (flow < first && flow >= first * (1 - NPSHR_END_ROUNDING)) return first;
  return flow;
}

/**
 * Where the NPSHr column stops, for a flow that reads none (`npshrAt` null), in words with both flows (quantity tokens, each
 * read apart from the other): "the NPSHr curve ends at ⟦flow|0.012⟧, and the pump runs past it at ⟦flow|0.0125⟧", "… starts
 * at …, and the pump runs below it at …", "NPSHr is published at one flow only, ⟦flow|…⟧, which judges no flow" (decision
 * "npshone"), "the curve publishes no NPSHr". The engine's words where NPSHa ≤ 0 meets no NPSHr (figures.ts), as the
 * candidate's words name both flows (lib/projects/npshr-reach.ts; helper "numtext").
 * @param points the curve's points as published (flow m³/s, NPSHr m where given)
 * @param flow the flow without NPSHr, m³/s
 */
export function npshrStopsText(points: readonly { flow: number; npshr?: number | null }[], flow: number): string {
  const given = points.filter((p) => p.npshr != null);
  if (!given.length) return "the curve publishes no NPSHr";
  const first = given[0].flow, last = given[given.length - 1].flow;
  if (given.length === 1) return `NPSHr is published at one flow only, ${qtLimit("flow", first, [flow])}, which judges no flow`;
  if (flow > last) return `the NPSHr curve ends at ${qtLimit("flow", last, [flow])}, and the pump runs past it at ${qtExact("flow", flow, [last])}`;
  if (flow < first) return `the NPSHr curve starts at ${qtLimit("flow", first, [flow])}, and the pump runs below it at ${qtExact("flow", flow, [first])}`;
  return `no NPSHr is read at ${qtExact("flow", flow, [first, last])}`;
}
