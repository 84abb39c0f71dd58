// The tracer page's working state and what is derived from it (calibrations, data points, CSV).
// Pure TypeScript: the maths lives in app/lib/tracer; this only wires the page's choices to it.
import {
  axisValue, calibrate, crossings, efficiencyFromContours, resample, toAxis, toData, tracedCsv,
  type AxisRef, type AxisScale, type Calibration, type Contour, type Px, type Quantity, type TracedSet, type TraceUnits, type XY,
} from "~/lib/tracer";
import type { Unit } from "~/lib/import";

export type Panel = { id: number; quantity: Quantity; unit: Unit; scale: AxisScale; refs: AxisRef[] };
export type Curve = {
  id: number;
  panelId: number;
  /** "curve": a head/efficiency/power/NPSHr curve of one impeller; "contour": an iso-efficiency line (head panel). */
  kind: "curve" | "contour";
  impellerMm: number;
  speedRpm: number;
  /** Efficiency of a contour, %. */
  level: number;
  points: Px[];
};
export type TracerState = {
  model: string;
  flowUnit: Unit;
  flowScale: AxisScale;
  xRefs: AxisRef[];
  panels: Panel[];
  curves: Curve[];
  activePanel: number;
  activeCurve: number;
  pointsPerCurve: number;
};

export const UNITS: Record<Quantity | "flow", Unit[]> = {
  flow: ["m3/h", "l/s", "l/min", "m3/s", "gpm", "imp gpm"],
  head: ["m", "ft"],
  efficiency: ["%"],
  power: ["kW", "W", "hp"],
  npshr: ["m", "ft"],
};
export const QUANTITY_LABEL: Record<Quantity, string> = { head: "Head", efficiency: "Efficiency", power: "Shaft power", npshr: "NPSHr" };

/** The tracer's id for one of the user's units (the importer spells "L/s" as "l/s"), else the fallback. */
const tracerUnit = (list: Unit[], id: string, fallback: Unit): Unit => list.find((u) => u.toLowerCase() === id.toLowerCase()) ?? fallback;

/** A fresh page, axes in the user's flow and head units where the tracer knows them. */
export function initialState(units: { flow: string; head: string } = { flow: "m3/h", head: "m" }): TracerState {
  return {
    model: "",
    flowUnit: tracerUnit(UNITS.flow, units.flow, "m3/h"),
    flowScale: "linear",
    xRefs: [],
    panels: [{ id: 1, quantity: "head", unit: tracerUnit(UNITS.head, units.head, "m"), scale: "linear", refs: [] }],
    curves: [{ id: 1, panelId: 1, kind: "curve", impellerMm: 0, speedRpm: 2900, level: 0, points: [] }],
    activePanel: 1,
    activeCurve: 1,
    pointsPerCurve: 15,
  };
}

/** Each panel's calibration, or the reason it has none yet. */
export function calibrations(s: TracerState): Map<number, Calibration | string> {
  const out = new Map<number, Calibration | string>();
  for (const p of s.panels) {
    try {
      out.set(p.id, calibrate({ xRefs: s.xRefs, yRefs: p.refs, xScale: s.flowScale, yScale: p.scale }));
    } catch (e) {
      out.set(p.id, e instanceof Error ? e.message : String(e));
    }
  }
  return out;
}

/** A curve's traced points in data units (empty without a calibration). */
export function dataPoints(c: Curve, cals: Map<number, Calibration | string>): XY[] {
  const cal = cals.get(c.panelId);
  if (!cal || typeof cal === "string") return [];
  return c.points.map((p) => {
    const d = toData(cal, p);
    return { x: d.x, y: d.y };
  });
}

/** Crossings of one head curve with the head panel's contours → efficiency (%) along it. */
export function contourEfficiency(s: TracerState, head: Curve, cals: Map<number, Calibration | string>): XY[] {
  const cal = cals.get(head.panelId);
  if (!cal || typeof cal === "string") return [];
  const ax = (p: Px) => {
    const a = toAxis(cal, p);
    return { x: a.X, y: a.Y };
  };
  const contours: Contour[] = s.curves
    .filter((c) => c.kind === "contour" && c.panelId === head.panelId && c.points.length >= 2 && c.level > 0)
    .map((c) => ({ level: c.level, closed: c.points.length > 2, points: c.points.map(ax) }));
  if (!contours.length) return [];
  const xs = crossings(head.points.map(ax).sort((a, b) => a.x - b.x), contours);
  if (xs.length < 2) return xs.map((x) => ({ x: axisValue.back(s.flowScale, x.x), y: x.level }));
  // Read between the crossings as the engine would, at the head curve's own traced flows.
  return head.points
    .map(ax)
    .map((p) => ({ x: axisValue.back(s.flowScale, p.x), y: efficiencyFromContours(xs, p.x) }))
    .filter((p): p is XY => p.y != null);
}

/** The traced sets (one per impeller and speed) ready for our CSV. */
export function tracedSets(s: TracerState, cals: Map<number, Calibration | string>): TracedSet[] {
  const panelOf = new Map(s.panels.map((p) => [p.id, p]));
  const groups = new Map<string, TracedSet>();
  const heads = s.curves.filter((c) => c.kind === "curve" && panelOf.get(c.panelId)?.quantity === "head");
  for (const h of heads) {
    const key = `${h.speedRpm}|${h.impellerMm}`;
    if (groups.has(key)) continue;
    const set: TracedSet = { model: s.model.trim() || "Traced model", speedRpm: h.speedRpm, impellerMm: h.impellerMm, curves: { head: dataPoints(h, cals) } };
    for (const c of s.curves) {
      const q = panelOf.get(c.panelId)?.quantity;
      if (c.kind !== "curve" || c === h || !q || q === "head" || c.speedRpm !== h.speedRpm || c.impellerMm !== h.impellerMm) continue;
      set.curves[q] = dataPoints(c, cals);
    }
    if (!set.curves.efficiency) {
      const eff = contourEfficiency(s, h, cals);
      if (eff.length >= 2) set.curves.efficiency = eff;
    }
    groups.set(key, set);
  }
  return [...groups.values()];
}

export function traceUnits(s: TracerState): TraceUnits {
  const unitOf = (q: Quantity, fallback: Unit) => s.panels.find((p) => p.quantity === q)?.unit ?? fallback;
  return { flow: s.flowUnit, head: unitOf("head", "m"), efficiency: "%", power: unitOf("power", "kW"), npshr: unitOf("npshr", "m") };
}

export function csvOf(s: TracerState, cals: Map<number, Calibration | string>): string {
  return tracedCsv(tracedSets(s, cals), traceUnits(s), s.pointsPerCurve);
}

/** The points the import will keep for a curve (resampled), for drawing the smoothed overlay. */
export function keptPoints(c: Curve, cals: Map<number, Calibration | string>, n: number): XY[] {
  const pts = dataPoints(c, cals);
  return c.kind === "curve" && pts.length > 2 ? resample(pts, n) : pts;
}
