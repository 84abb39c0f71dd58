// Where the NPSHr a curve publishes reaches, and the words for a point NPSH is judged at that lies outside it (pure):
// the flows of one pump's curve as run (speed or trim, corrected for viscosity where the figures are) from its first
// published NPSHr to its last, or its one point; why a point has no NPSHr (before the first, past the last, one point
// only, none at all); and those points with both flows, for "NPSH not checked" (verdict-npsh.ts) and the candidates
// table's NPSH margin row. "The curve publishes no NPSHr at 43.2 m³/h" did not tell the flow from where the NPSHr curve
// stops: now "the NPSHr curve ends at 38.0 m³/h, and the pump runs past it at 43.2 m³/h (least lift, new pipe)".
//
// The rule for a single published NPSHr point (one flow with NPSHr, the rest of the column blank; decision "npshone"):
// it is judged nowhere, not even at its own flow. NPSHr is read off the published curve between its points (monotone
// cubic, engine interp.ts), never beyond them; one point is no curve, and NPSHr moves with flow — it rises towards
// runout and, on many pumps, again at part load (suction recirculation; common practice, from memory) — so one figure
// says nothing of any other flow, and a pump over its band never runs at exactly that one. The engine builds no NPSHr
// curve from fewer than two points, in the workbench's curve (pumpCurve.ts `column`) and the search's index
// (searchIndex.ts `PackBuilder.end`) alike: the search neither leaves such a pump out nor passes it on NPSH at the
// duty (its NPSHr there is null), and its row and the candidates table both say "NPSH not checked: the curve publishes
// NPSHr at one flow only (3.20 m at 150 m³/h): one point is no curve to read it at …" with the flows, from one judgement.
import { efficiencyAt, headAt, npshrAt, NPSHR_END_ROUNDING, sampleCurve, shaftPowerAt, type PumpCurve } from "~/engine";
import { qt, qtExact, qtLimit } from "~/engine/quantityText";

/**
 * The NPSHr one pump's curve publishes, as run: its first and last flow with an NPSHr (m³/s; the same with one point), how
 * many points carry one (count), that NPSHr with one point (m; null with more), and how many pumps run together (count;
 * 1 alone, the duty pumps in parallel or series: the words then read "each pump runs at"). `column`: the published points
 * themselves as run (flow m³/s, NPSHr m: moved by the speed or trim as the judgement's curve), which a staged duty-cycle
 * step reads its NPSHr from (cycle-curve.ts `withPublishedNpshr`); absent in results from before it was kept.
 */
export type NpshrPublished = { from: number; to: number; points: number; single: number | null; pumps: number; column?: { flow: number; npshr: number }[] };

/** A point NPSH is judged at, as the words need it (candidate-judgement.ts `NpshPoint`): its flow, m³/s, and one pump's there. */
type At = { at: string; flow: number | null; pumpFlow?: number | null };

/**
 * The NPSHr a curve publishes, or null where it publishes none.
 * @param points the curve's points as run (flow m³/s, NPSHr m or absent)
 * @param pumps pumps running together (count)
 */
export function npshrPublished(points: readonly { flow: number; npshr?: number | null }[], pumps: number): NpshrPublished | null {
  const withNpshr = points.filter((p) => p.npshr != null);
  if (!withNpshr.length) return null;
  const first = withNpshr[0], last = withNpshr[withNpshr.length - 1];
  return { from: first.flow, to: last.flow, points: withNpshr.length, single: withNpshr.length === 1 ? first.npshr! : null, pumps, column: withNpshr.map((p) => ({ flow: p.flow, npshr: p.npshr! })) };
}

/** One pump's flow at a point, m³/s (the point's flow but for pumps in parallel; selections frozen before kept only the flow). */
const pumpFlowOf = (p: At): number => p.pumpFlow ?? p.flow!;

/**
 * Why a point with an operating point has no NPSHr, in a few words for the list of points not judged.
 * @param pub what the curve publishes (undefined: not known, a selection frozen before it was kept)
 * @param p the point (flows m³/s)
 */
export function whyNoNpshr(pub: NpshrPublished | null | undefined, p: At): string {
  if (pub == null) return "no NPSHr at that flow";
  if (pub.points === 1) return "NPSHr published at one flow only";
  const q = pumpFlowOf(p);
  if (q > pub.to) return "past the NPSHr curve's last flow";
  if (q < pub.from) return "before the NPSHr curve's first flow";
  return "no NPSHr at that flow";
}

/**
 * The points without NPSHr in words with both flows, one clause per cause:
 * "the NPSHr curve ends at ⟦flow|0.008⟧, and the pump runs past it at ⟦flow|0.0101⟧ (design point), …";
 * "the NPSHr curve starts at …, and the pump runs below it at …";
 * "the curve publishes NPSHr at one flow only (⟦head|3.2⟧ at ⟦flow|0.0417⟧): one point is no curve to read it at …";
 * "the curve publishes no NPSHr at …" (none at all, or a selection frozen before the reach was kept); pumps in parallel
 * "the curve publishes no NPSHr, and each pump runs at ⟦flow|0.00958⟧ (design point), …" (one pump's flow, not the total).
 * @param pub what the curve publishes (null: none; undefined: not known)
 * @param points the points with an operating point and no NPSHr (flows m³/s)
 * @param named whether each flow is followed by where it is ("(design point)"); the table's row at the operating point leaves it out
 */
export function npshrGapClauses(pub: NpshrPublished | null | undefined, points: readonly At[], named = true): string[] {
  if (!points.length) return [];
  // Several pumps run together: the count kept with what the curve publishes; where it publishes none (no count kept),
  // pumps in parallel are told by their points, whose one pump's flow is not the total (each pump takes its share).
  const several = pub != null ? pub.pumps > 1 : points.some((p) => p.pumpFlow != null && p.flow != null && p.pumpFlow !== p.flow);
  const runs = several ? "each pump runs" : "the pump runs";
  const list = (ps: readonly At[], against: number[]) => ps.map((p) => `${qtExact("flow", pumpFlowOf(p), against)}${named ? ` (${p.at})` : ""}`).join(", ");
  // No NPSHr where the pumps run: with several, each pump's flow, as the words past an end give it, never the total.
  const none = (ps: readonly At[]) => (several ? `the curve publishes no NPSHr, and each pump runs at ${list(ps, [])}` : `the curve publishes no NPSHr at ${list(ps, [])}`);
  if (pub == null) return [several ? none(points) : `the curve publishes no NPSHr at ${points.map((p) => `${qt("flow", p.flow!)}${named ? ` (${p.at})` : ""}`).join(", ")}`];
  if (pub.points === 1)
    return [`the curve publishes NPSHr at one flow only (${qt("head", pub.single!)} at ${qtLimit("flow", pub.from, points.map(pumpFlowOf))}${several ? " for one pump" : ""}): one point is no curve to read it at ${list(points, [pub.from])}`];
  const curve = several ? "one pump's NPSHr curve" : "the NPSHr curve";
  const past = points.filter((p) => pumpFlowOf(p) > pub.to);
  const before = points.filter((p) => pumpFlowOf(p) < pub.from);
  const inside = points.filter((p) => !past.includes(p) && !before.includes(p));
  const out: string[] = [];
  if (past.length) out.push(`${curve} ends at ${qtLimit("flow", pub.to, past.map(pumpFlowOf))}, and ${runs} past it at ${list(past, [pub.to])}`);
  if (before.length) out.push(`${curve} starts at ${qtLimit("flow", pub.from, before.map(pumpFlowOf))}, and ${runs} below it at ${list(before, [pub.from])}`);
  if (inside.length) out.push(none(inside));
  return out;
}

/** One sampled point of a curve as the result keeps it (SI: m³/s, m, fraction, W, m; null where the column has none). */
export type SampledPoint = { flow: number; head: number; efficiency: number | null; power: number | null; npshr: number | null };

/**
 * The curve sampled at `count` evenly spaced flows (engine `sampleCurve`) and at its NPSHr column's first and last published
 * flows where they fall between two samples (m³/s; SI throughout). The result's sampled curve is what the duty cycle
 * rebuilds its curves from (cycle-curve.ts), and its NPSHr stopped at the last sample before the published end — up to a
 * fortieth of the curve's flows short: a staged step one pump runs at 29.5 m³/h, on an NPSHr curve published to 30.0 m³/h,
 * was "not judged". With both ends kept, the rebuilt curve's NPSHr reaches where the published one does (to a rounding
 * error, read by the engine's allowance, npshrEnds.ts `NPSHR_END_ROUNDING`). An end within that allowance of a sample is
 * the sample.
 * @param curve the curve as run (SI)
 * @param count evenly spaced samples (count)
 * @param density the liquid's density for the power column, kg/m³
 */
export function samplesWithNpshrEnds(curve: PumpCurve, count: number, density: number): SampledPoint[] {
  const s = sampleCurve(curve, count, density);
  const out: SampledPoint[] = s.flows.map((q, i) => ({ flow: q, head: s.head[i], efficiency: s.efficiency[i] ?? null, power: s.power[i] ?? null, npshr: s.npshr[i] ?? null }));
  const n = curve.npshr;
  if (!n) return out;
  for (const end of [n.x[0], n.x[n.x.length - 1]]) {
    if (!(end > curve.flowMin && end < curve.flowMax) || out.some((p) => Math.abs(p.flow - end) <= NPSHR_END_ROUNDING * end)) continue;
    const at = out.findIndex((p) => p.flow > end);
    out.splice(at, 0, { flow: end, head: headAt(curve, end)!, efficiency: efficiencyAt(curve, end), power: shaftPowerAt(curve, end, density), npshr: npshrAt(curve, end) });
  }
  return out;
}
