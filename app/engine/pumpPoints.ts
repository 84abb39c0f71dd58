/**
 * A pump curve's points checked before any curve is built from them (pure; SI): `checkPumpPoints`, run by `createPumpCurve`
 * (pumpCurve.ts, which re-exports it) and by `prepareSearchIndex` (searchIndex.ts) for every curve set of a library; its
 * head-shape rule is headShape.ts's, the one the CSV importer applies with its own allowance.
 */
import { EngineInputError, requireFinite, requirePositive } from "./errors.ts";
import { HeadShape, headRefusalText } from "./headShape.ts";
import type { PumpPoint } from "./pumpCurve.ts";

/**
 * Validates curve points without copying them (throws {@link EngineInputError} naming the
 * point and field): finite values; flow ≥ 0 strictly increasing; head ≥ 0, first head > 0,
 * its shape falling with rises of at most `riseTol` × first head, or drooping to one peak at most DROOP_MAX (25 %)
 * above the first head in the first half of its flows (headShape.ts); efficiency 0–1 (> 0 where flow > 0);
 * power and NPSHr > 0.
 * @param pts points (flow m³/s, head m, efficiency fraction, power W, NPSHr m)
 * @param riseTol allowed rise of head with flow, fraction of the first head (dimensionless)
 * @returns largest head m, and whether the curve droops: a head above the first point's anywhere, exactly (PumpCurve `drooping`)
 */
export function checkPumpPoints(pts: readonly PumpPoint[], riseTol: number): { headMax: number; drooping: boolean } {
  if (!Array.isArray(pts) || pts.length === 0) throw new EngineInputError("points", "the curve has no points");
  if (pts.length < 2) throw new EngineInputError("points", "a curve needs at least two points");
  for (let i = 0; i < pts.length; i++) {
    const p = pts[i];
    if (!p || typeof p !== "object") throw new EngineInputError(`points[${i}]`, "must be a point");
    // Parameter names are built only on failure (this loop runs for every curve of a library).
    const flow = p.flow;
    const head = p.head;
    if (typeof flow !== "number" || !Number.isFinite(flow)) requireFinite(`points[${i}].flow`, flow);
    if (typeof head !== "number" || !Number.isFinite(head)) requireFinite(`points[${i}].head`, head);
    if (flow < 0) throw new EngineInputError(`points[${i}].flow`, `must not be negative (got ${flow})`);
    if (head < 0) throw new EngineInputError(`points[${i}].head`, `must not be negative (got ${head})`);
    if (i > 0) {
      const prev = pts[i - 1].flow;
      if (flow === prev) throw new EngineInputError(`points[${i}].flow`, `duplicate flow ${flow} (same as points[${i - 1}])`);
      if (flow < prev) throw new EngineInputError(`points[${i}].flow`, "flows must be strictly increasing");
    }
    if (p.efficiency !== undefined && p.efficiency !== null) {
      const e = p.efficiency;
      if (typeof e !== "number" || !Number.isFinite(e)) requireFinite(`points[${i}].efficiency`, e);
      if (e < 0 || e > 1) throw new EngineInputError(`points[${i}].efficiency`, `is a fraction 0–1 (got ${e})`);
      if (e === 0 && flow > 0) throw new EngineInputError(`points[${i}].efficiency`, "must be above zero where flow is above zero");
    }
    if (p.power !== undefined && p.power !== null) {
      if (!(typeof p.power === "number" && p.power > 0 && p.power < Infinity)) requirePositive(`points[${i}].power`, p.power);
    }
    if (p.npshr !== undefined && p.npshr !== null) {
      if (!(typeof p.npshr === "number" && p.npshr > 0 && p.npshr < Infinity)) requirePositive(`points[${i}].npshr`, p.npshr);
    }
  }
  const h0 = pts[0].head;
  if (!(h0 > 0)) throw new EngineInputError("points[0].head", "the first point's head must be above zero");
  // The head's shape (headShape.ts): falling with rises within riseTol × the first head, or drooping to one peak at most
  // DROOP_MAX above it in the first half of the flows; the importer judges the same with a 5 % allowance.
  const shape = new HeadShape(h0, pts[0].flow, riseTol * h0, 0);
  let headMax = h0;
  for (let i = 1; i < pts.length; i++) {
    const h = pts[i].head;
    const refused = shape.judge(h);
    if (refused) throw new EngineInputError(`points[${i}].head`, headRefusalText(refused, riseTol));
    shape.take(h, pts[i].flow, i);
    headMax = Math.max(headMax, h);
  }
  const curve = shape.end();
  if (curve) throw new EngineInputError(`points[${curve.peakAt}].head`, headRefusalText(curve, riseTol));
  // Any head above the first, compared exactly: the solver judges from rest on the heads as given (operatingPoint.ts), so
  // a hump of any height leaves a system head between the first head and the peak without a point from rest (no slack:
  // the heads compared are the points' own, with no rounding to absorb).
  return { headMax, drooping: headMax > h0 };
}
