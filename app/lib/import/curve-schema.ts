/**
 * What the importer hands on: a curve set in SI and its points, as valibot schemas, exported so the
 * service can re-check before it writes (import-plan.ts `writable` writes the same rules out for speed).
 * Besides the shapes they hold the engine's rules (point-rules.ts): power and NPSHr above zero, the
 * first head above zero, efficiency above zero where flow is above zero, the head-rise rule, a
 * plausible best efficiency, and a maker's minimum flow below the last published flow (min-flow.ts). Pure.
 */
import * as v from "valibot";
import { BEST_EFFICIENCY, efficiencyPlausible, importHeadShape, POWER_EFFICIENCY_MAX, powerEfficiency, RISE_FRACTION } from "./point-rules";
import { DROOP_MAX } from "../../engine/headShape.ts";
import { MIN_FLOW_RULE, minFlowFits } from "./min-flow";

const NonNegative = v.pipe(v.number(), v.finite(), v.minValue(0));
const Positive = v.pipe(v.number(), v.finite(), v.gtValue(0));
const PositiveOrNull = v.nullable(Positive);

export const CurvePointSchema = v.object({
  flow: NonNegative, // m³/s
  head: NonNegative, // m
  efficiency: v.optional(v.pipe(v.number(), v.finite(), v.minValue(0), v.maxValue(1))), // 0..1
  power: v.optional(Positive), // W (the engine's rule: above zero)
  npshr: v.optional(Positive), // m (the engine's rule: above zero)
});

export const CurveSetSchema = v.pipe(
  v.object({
    key: v.string(),
    model: v.pipe(v.string(), v.trim(), v.nonEmpty()),
    speed: PositiveOrNull, // rpm
    impellerDiameter: PositiveOrNull, // m
    type: v.optional(v.string()),
    size: v.optional(v.string()),
    notes: v.optional(v.string()),
    /** The maker's minimum continuous flow, m³/s (min-flow.ts); absent where the file gives none. */
    minFlow: v.optional(Positive),
    points: v.pipe(v.array(CurvePointSchema), v.minLength(3)),
    sourceRows: v.array(v.pipe(v.number(), v.integer(), v.minValue(1))),
    ok: v.boolean(),
  }),
  v.check((c) => c.points.every((p, i) => i === 0 || p.flow > c.points[i - 1].flow), "flow must increase"),
  // The engine's rules (point-rules.ts, app/engine/pumpCurve.ts checkPumpPoints) and the plausible best efficiency.
  v.check((c) => c.points.length > 0 && c.points[0].head > 0, "the first point's head must be above zero"),
  v.check((c) => c.points.every((p) => !(p.efficiency === 0 && p.flow > 0)), "efficiency must be above zero where flow is above zero"),
  v.check((c) => {
    if (!c.points.length) return true; // refused above
    const shape = importHeadShape(c.points[0].head, c.points[0].flow, 0);
    for (let i = 1; i < c.points.length; i++) {
      if (shape.judge(c.points[i].head)) return false;
      shape.take(c.points[i].head, c.points[i].flow, i);
    }
    return !shape.end();
  }, `head must fall, rising by at most ${RISE_FRACTION * 100} % of the first head, or droop to one peak at most ${DROOP_MAX * 100} % above the first head in the first half of its flows`),
  v.check((c) => c.minFlow === undefined || minFlowFits(c.minFlow, c.points[c.points.length - 1].flow), MIN_FLOW_RULE),
  v.check((c) => {
    const best = c.points.reduce((m, p) => Math.max(m, p.efficiency ?? -1), -1);
    return best <= 0 || efficiencyPlausible(best);
  }, `best efficiency must lie within ${BEST_EFFICIENCY.min * 100}–${BEST_EFFICIENCY.max * 100} %`),
  // Shaft power against ρgQH (point-rules.ts powerEfficiency): never below it at a point, and implying a best efficiency of 5 % or more.
  v.check((c) => {
    let best = -1;
    for (const p of c.points) {
      if (p.power === undefined || !(p.flow > 0)) continue;
      const eta = powerEfficiency(p.flow, p.head, p.power);
      if (eta > POWER_EFFICIENCY_MAX) return false;
      best = Math.max(best, eta);
    }
    return !(best > 0 && best < BEST_EFFICIENCY.min * (1 - 1e-9));
  }, `shaft power must not be below the hydraulic power ρgQH, and must imply a best efficiency of ${BEST_EFFICIENCY.min * 100} % or more`),
);

export type CurvePoint = v.InferOutput<typeof CurvePointSchema>;
export type CurveSet = v.InferOutput<typeof CurveSetSchema>;
