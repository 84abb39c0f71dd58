/**
 * Several identical pumps (common practice): in parallel, flows add at equal head; in
 * series, heads add at equal flow. Duty/standby: only duty pumps count — standby pumps
 * add no capacity. Power adds; efficiency is that of one pump at its own share; NPSHr is
 * that of one pump at its own flow (parallel) or of the first pump (series).
 */
import { EngineInputError, requireInteger, requireNonNegative, type EngineWarning } from "./errors.ts";
import { createPumpCurve, ensurePumpCurve, POR_FRACTION, type PumpCurve, type PumpCurveInput, type PumpPoint } from "./pumpCurve.ts";

/**
 * Most duty pumps, and most standby pumps, of one arrangement (count; engine bound). The project form takes 1–8 duty
 * and 0–8 standby; the engine leaves room above it for other callers, but not past where combining identical curves
 * means anything (a hundred pumps on one header are sized by its losses and their unequal sharing, not by n × Q;
 * common practice) nor to counts whose n × Q or n × P lose precision or overflow.
 */
export const MAX_PUMPS = 100;

const pumpCount = (name: string, v: unknown, min: number) => {
  const n = requireInteger(name, v, min);
  if (n > MAX_PUMPS) throw new EngineInputError(name, `must be at most ${MAX_PUMPS} (got ${n})`);
  return n;
};

/** How pumps are combined. */
export interface Arrangement {
  /** "parallel" or "series". */
  mode: "parallel" | "series";
  /** Pumps running (count). */
  duty: number;
  /** Installed standby pumps, not running (count). */
  standby?: number;
}

/** Result of combining pumps. */
export interface CombinedCurve {
  curve: PumpCurve;
  /** Pumps counted in the combined curve (count). */
  running: number;
  /** Installed pumps (count). */
  installed: number;
  warnings: EngineWarning[];
}

/**
 * Combined curve of identical pumps.
 * @param curve one pump's curve (prepared or raw; SI)
 * @param arrangement mode and counts (unitless; counts dimensionless)
 */
export function combinePumps(curve: PumpCurve | PumpCurveInput, arrangement: Arrangement): CombinedCurve {
  const c = ensurePumpCurve(curve);
  if (!arrangement || typeof arrangement !== "object") throw new EngineInputError("arrangement", "is required");
  const n = pumpCount("arrangement.duty", arrangement.duty, 1);
  const standby = pumpCount("arrangement.standby", arrangement.standby ?? 0, 0);
  const mode = arrangement.mode;
  if (mode !== "parallel" && mode !== "series") throw new EngineInputError("arrangement.mode", "must be 'parallel' or 'series'");
  const points: PumpPoint[] = c.points.map((p) => {
    const out: PumpPoint = mode === "parallel" ? { flow: p.flow * n, head: p.head } : { flow: p.flow, head: p.head * n };
    if (p.efficiency !== undefined) out.efficiency = p.efficiency;
    if (p.power !== undefined) out.power = p.power * n;
    if (p.npshr !== undefined) out.npshr = p.npshr;
    return out;
  });
  const combined = createPumpCurve({ points, speed: c.speed ?? undefined, impellerDiameter: c.impellerDiameter ?? undefined,
    minDiameter: c.minDiameter ?? undefined, maxDiameter: c.maxDiameter ?? undefined, powerDensity: c.powerDensity, riseTolerance: 1 });
  // The pumps' BEP is one pump's moved with the points (flow × n in parallel, head × n in series), never read again off
  // the combined points: the same point for a published curve (efficiency is unchanged point by point), and the BEP a
  // caller gave the one pump's curve (a curve rebuilt from samples carrying its figures' BEP, projects/cycle-curve.ts).
  if (c.bep) {
    const bep = mode === "parallel" ? { ...c.bep, flow: c.bep.flow * n } : { ...c.bep, head: c.bep.head * n };
    combined.bep = bep;
    combined.por = { min: POR_FRACTION.min * bep.flow, max: POR_FRACTION.max * bep.flow };
  } else {
    combined.bep = null;
    combined.por = null;
  }
  const warnings: EngineWarning[] = [];
  if (standby > 0) warnings.push({ code: "standby-not-counted", message: `${standby} standby pump(s) installed; only the ${n} duty pump(s) count` });
  return { curve: combined, running: n, installed: n + standby, warnings };
}

/**
 * Flow through each pump for a combined operating flow, m³/s (parallel: Q/n; series: Q).
 * With `single` (one pump's curve, as given to `combinePumps`): a flow inside the combined curve's range is
 * kept inside the one pump's. In floating point n·q/n need not give back q (3 × 0.000651955… / 3 lands one
 * ulp above), so a point at the combined curve's end would fall just off the pump's curve and every figure
 * read there (efficiency, power, NPSHr) would be refused; the combined curve's end is the pump's end.
 * @param totalFlow combined flow, m³/s
 * @param arrangement mode and counts (unitless; counts dimensionless)
 * @param single one pump's curve (prepared or raw; SI), optional
 */
export function flowPerPump(totalFlow: number, arrangement: Arrangement, single?: PumpCurve | PumpCurveInput): number {
  const q = requireNonNegative("totalFlow", totalFlow);
  if (!arrangement || typeof arrangement !== "object") throw new EngineInputError("arrangement", "is required");
  const n = pumpCount("arrangement.duty", arrangement.duty, 1);
  const mode = arrangement.mode;
  if (mode !== "parallel" && mode !== "series") throw new EngineInputError("arrangement.mode", `must be 'parallel' or 'series' (got ${String(mode)})`);
  // A raw curve is prepared (its flowMin/flowMax exist only once prepared; read off a raw one they were undefined → NaN).
  const one = single == null ? undefined : ensurePumpCurve(single);
  if (mode === "series") return q;
  const share = q / n;
  // The combined curve's range as combinePumps builds it (each point's flow × n): the same products, so exact.
  if (!one || q < one.flowMin * n || q > one.flowMax * n) return share;
  return Math.min(one.flowMax, Math.max(one.flowMin, share));
}
