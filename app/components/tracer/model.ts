// The tracer page's working state and what is derived from it (calibrations, data points, CSV).
// Pure TypeScript: the maths lives in app/lib/tracer; this only wires the page's choices to it.
import {
  axisValue, calibrate, cleanPoints, contourGaps, crossings, efficiencyFromContours, startsInside, csvImpellerMm, resample, toAxis, toData, tracedCsv,
  type AxisRef, type AxisScale, type Calibration, type Contour, type Crossing, type Px, type Quantity, type TracedSet, type TraceUnits, type XY,
} from "~/lib/tracer";
import type { UnreadPeak } from "~/lib/tracer/peak";
import type { Unit } from "~/lib/import";

export type Panel = { id: number; quantity: Quantity; unit: Unit; scale: AxisScale; refs: AxisRef[] };
export type Curve = {
  id: number;
  panelId: number;
  /** "curve": a head/efficiency/power/NPSHr curve of one impeller; "contour": an iso-efficiency line (head panel). */
  kind: "curve" | "contour";
  /** Impeller Ø, mm; blank is NaN (pages before this wrote 0, read as blank too). */
  impellerMm: number;
  speedRpm: number;
  /** Efficiency of a contour, %. */
  level: number;
  points: Px[];
  /**
   * A contour that is a closed loop (its last point joins its first): the island tracer's outline, or
   * the user's choice in the sidebar. Open when absent: a line clicked by hand may be one arm of a
   * contour that leaves the chart, and a chord between its ends would cross curves it never meets.
   */
  closed?: boolean;
  /** A head curve whose efficiency comes from contours: the user took the middle of its span inside the innermost contour it crosses as its BEP (peak.ts). */
  peakAtMidpoint?: boolean;
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
    curves: [{ id: 1, panelId: 1, kind: "curve", impellerMm: NaN, speedRpm: 2900, level: 0, points: [] }],
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

/**
 * The page with a new curve on the active panel, made active: a blank impeller Ø (copying the last one
 * made a second curve of the same key, which the CSV dropped without a word) and the active curve's
 * speed; a contour open.
 */
export function withNewCurve(s: TracerState, kind: Curve["kind"]): TracerState {
  const id = Math.max(0, ...s.curves.map((c) => c.id)) + 1;
  const prev = s.curves.find((c) => c.id === s.activeCurve);
  const curve: Curve = { id, panelId: s.activePanel, kind, impellerMm: NaN, speedRpm: prev?.speedRpm ?? 2900, level: 0, points: [], ...(kind === "contour" ? { closed: false } : {}) };
  return { ...s, curves: [...s.curves, curve], activeCurve: id };
}

/** The island tracer's outline for a contour: a closed loop by construction. */
export const takeIsland = (c: Curve, points: Px[]): Curve => ({ ...c, points, closed: true });
/** A curve with its points cleared: a contour open again (lines clicked by hand are open until closed). */
export const cleared = (c: Curve): Curve => (c.kind === "contour" ? { ...c, points: [], closed: false } : { ...c, points: [] });

/** What the head panel's contours say along one head curve: crossings, efficiency and the spans they leave unread (flows in the axis unit). */
export type ContourReading = {
  /** x in the flow axis's unit */
  crossings: Crossing[];
  efficiency: XY[];
  /**
   * `toEnd`: from the last crossing to the curve's end, which lies inside the innermost contour; `fromStart`: from the curve's start, inside it,
   * to the first crossing; `outside`: between two crossings of a level, outside its contour (the curve left it and comes back in; contours.ts);
   * `fromTouch`/`toTouch`: that end of the span is a touch of the contour, not a crossing (Crossing `touch`).
   */
  gaps: {
    from: number; to: number; level: number; innermost: boolean; toEnd: boolean; fromStart: boolean; outside: boolean; midpoint: number; fromTouch: boolean; toTouch: boolean;
    /** An innermost span between two meetings that starts at the curve's first flow (`onStart`) or ends at its last (`onEnd`): the curve starts or ends on the contour. */
    onStart: boolean; onEnd: boolean;
  }[];
  levels: number[];
};

export function contourReading(s: TracerState, head: Curve, cals: Map<number, Calibration | string>): ContourReading {
  const none: ContourReading = { crossings: [], efficiency: [], gaps: [], levels: [] };
  const cal = cals.get(head.panelId);
  if (!cal || typeof cal === "string") return none;
  const ax = (p: Px) => {
    const a = toAxis(cal, p);
    return { x: a.X, y: a.Y };
  };
  const contours: Contour[] = s.curves
    .filter((c) => c.kind === "contour" && c.panelId === head.panelId && c.points.length >= 2 && c.level > 0)
    .map((c) => ({ level: c.level, closed: c.closed === true, points: c.points.map(ax) }));
  if (!contours.length) return none;
  const back = (x: number) => axisValue.back(s.flowScale, x);
  const along = cleanPoints(head.points.map(ax));
  const xs = crossings(along, contours);
  const levels = [...new Set(contours.map((c) => c.level))].sort((a, b) => a - b);
  const end = along.length ? along[along.length - 1].x : undefined;
  const start = along.length ? along[0].x : undefined;
  // Inside or outside each level's contour at the curve's start, from the closed loops' geometry (null for an open contour), read
  // clear of the contour when the curve's first point lies on it.
  const startInside = (level: number) => startsInside(along, xs, contours, level);
  const gaps = contourGaps(xs, end, start, startInside).map((g) => ({
    from: back(g.from), to: back(g.to), level: g.level, innermost: g.innermost, toEnd: g.toEnd === true, fromStart: g.fromStart === true,
    outside: g.outside === true, midpoint: back((g.from + g.to) / 2), fromTouch: g.fromTouch === true, toTouch: g.toTouch === true,
    onStart: g.onStart === true, onEnd: g.onEnd === true,
  }));
  const crossingsOut = xs.map((x) => ({ ...x, x: back(x.x) }));
  if (xs.length < 2) return { crossings: crossingsOut, efficiency: crossingsOut.map((x) => ({ x: x.x, y: x.level })), gaps, levels };
  // Read between the crossings as the engine would, at the head curve's own traced flows; nothing inside a gap.
  const efficiency = head.points
    .map(ax)
    .map((p) => ({ x: back(p.x), y: efficiencyFromContours(xs, p.x) }))
    .filter((p): p is XY => p.y != null);
  return { crossings: crossingsOut, efficiency, gaps, levels };
}

/** Crossings of one head curve with the head panel's contours → efficiency (%) along it. */
export function contourEfficiency(s: TracerState, head: Curve, cals: Map<number, Calibration | string>): XY[] {
  return contourReading(s, head, cals).efficiency;
}

/** A curve's (or a traced set's) key in the CSV: speed and impeller Ø as the CSV writes it (0.1 mm, csvImpellerMm; blank when not given). */
export const keyOf = (c: Pick<Curve, "speedRpm" | "impellerMm">) => `${c.speedRpm}|${csvImpellerMm(c.impellerMm) ?? ""}`;

/** The head curves of the page, and each curve's quantity and unit (its panel's). */
function panelsOf(s: TracerState) {
  const panelOf = new Map(s.panels.map((p) => [p.id, p]));
  const quantityOf = (c: Curve) => panelOf.get(c.panelId)?.quantity;
  const unitOf = (c: Curve) => panelOf.get(c.panelId)?.unit;
  const heads = s.curves.filter((c) => c.kind === "curve" && quantityOf(c) === "head");
  return { heads, quantityOf, unitOf };
}

/**
 * A head curve that crosses contours of one level only, once or more: its efficiency is known at those crossings
 * only, which make no efficiency row (once: one value; twice or more: the ends of the spans inside and outside the
 * contour, unread between them, nothing past them). `tracedSets` writes no efficiency for it, `unreadPeaks` says so.
 */
export const oneContourOnly = (xs: readonly Crossing[]) => xs.length >= 1 && xs.every((x) => x.level === xs[0].level);

/**
 * The innermost contour spans of the head curves whose efficiency comes from contours (one per span),
 * the spans where a curve is outside a contour between two of its crossings (`valley`: it left it and comes back in),
 * a head curve that crosses one contour only (oneContourOnly): once (`lone`), its efficiency is known at that
 * flow only; twice or more (`twice`, with `at` the flows when more), at those flows only, no row between or past them; and one that crosses none of
 * its panel's contours (`uncrossed`: no efficiency at all).
 */
export function unreadPeaks(s: TracerState, cals: Map<number, Calibration | string>): UnreadPeak[] {
  const out: UnreadPeak[] = [];
  const { heads, quantityOf } = panelsOf(s);
  const seen = new Set<string>();
  for (const h of heads) {
    if (seen.has(keyOf(h))) continue;
    seen.add(keyOf(h));
    if (s.curves.some((c) => c.kind === "curve" && quantityOf(c) === "efficiency" && keyOf(c) === keyOf(h))) continue;
    const r = contourReading(s, h, cals);
    const who = { curveId: h.id, curve: `Curve ${h.id}`, impellerMm: h.impellerMm, speedRpm: h.speedRpm };
    const next = (level: number) => r.levels.find((L) => L > level) ?? null;
    if (r.crossings.length === 1) {
      const [x] = r.crossings;
      out.push({ ...who, level: x.level, from: x.x, to: x.x, lone: true, ...(x.touch ? { fromTouch: true, toTouch: true } : {}), next: next(x.level), midpoint: x.x, taken: false });
    }
    if (r.crossings.length >= 2 && oneContourOnly(r.crossings)) {
      const [a, b] = r.crossings, z = r.crossings[r.crossings.length - 1];
      const midpoint = r.gaps.find((g) => g.innermost && !g.toEnd && !g.fromStart)?.midpoint ?? (a.x + b.x) / 2;
      const touched = r.crossings.filter((x) => x.touch).map((x) => x.x);
      const at = r.crossings.length > 2 ? { at: r.crossings.map((x) => x.x), ...(touched.length ? { touchedAt: touched } : {}) } : {};
      const last = r.crossings.length > 2 ? z : b;
      const ends = { ...(a.touch ? { fromTouch: true } : {}), ...(last.touch ? { toTouch: true } : {}) };
      out.push({ ...who, level: a.level, from: a.x, to: last.x, twice: true, ...at, ...ends, next: next(a.level), midpoint, taken: false });
      continue;
    }
    if (!r.crossings.length && r.levels.length && h.points.length >= 2) {
      out.push({ ...who, level: NaN, from: NaN, to: NaN, uncrossed: r.levels, next: null, midpoint: NaN, taken: false });
    }
    if (r.crossings.length < 2) continue;
    // Two spans or more inside the top level's contours: ticked, every middle is written at the level and the engine takes the first of
    // equal rows as the BEP, none when that is the middle of the span at the curve's start (the first efficiency row).
    const inner = r.gaps.filter((x) => x.innermost);
    // A first span that starts on the contour at the curve's first flow has that row at the level too, first of the equal rows: no BEP either.
    const bepMidpoint = inner.length > 1 ? { bepMidpoint: inner[0].fromStart || inner[0].onStart ? null : inner[0].midpoint } : {};
    for (const g of r.gaps.filter((x) => x.innermost || x.outside)) {
      const span = { ...who, level: g.level, from: g.from, to: g.to, next: next(g.level), midpoint: g.midpoint };
      const touches = { ...(g.fromTouch ? { fromTouch: true } : {}), ...(g.toTouch ? { toTouch: true } : {}) };
      if (g.outside) out.push({ ...span, valley: true, ...touches, taken: false });
      else out.push({ ...span, toEnd: g.toEnd, fromStart: g.fromStart, ...touches, ...(g.onStart ? { onStart: true } : {}), ...(g.onEnd ? { onEnd: true } : {}), ...bepMidpoint, taken: h.peakAtMidpoint === true });
    }
  }
  return out;
}

/** The traced sets (one per impeller and speed) ready for our CSV; each curve in its own panel's unit. */
export function tracedSets(s: TracerState, cals: Map<number, Calibration | string>): TracedSet[] {
  const groups = new Map<string, TracedSet>();
  const { heads, quantityOf, unitOf } = panelsOf(s);
  for (const h of heads) {
    const key = keyOf(h);
    if (groups.has(key)) continue; // a second head curve of one key: curve-checks.ts blocks the import
    const set: TracedSet = { model: s.model.trim() || "Traced model", speedRpm: h.speedRpm, impellerMm: h.impellerMm, curves: { head: dataPoints(h, cals) }, units: { head: unitOf(h) } };
    for (const c of s.curves) {
      const q = quantityOf(c);
      if (c.kind !== "curve" || c === h || !q || q === "head" || keyOf(c) !== key) continue;
      set.curves[q] = dataPoints(c, cals);
      set.units![q] = unitOf(c);
    }
    if (!set.curves.efficiency) {
      const r = contourReading(s, h, cals);
      // One contour crossed once or twice: no efficiency row (a vertex exactly on a crossing gave one at the level, or the box's middle one).
      if (r.efficiency.length >= 2 && !oneContourOnly(r.crossings)) {
        set.curves.efficiency = r.efficiency;
        set.units!.efficiency = "%";
        set.efficiencyGaps = r.gaps.map((g) => ({ from: g.from, to: g.to }));
        if (h.peakAtMidpoint) set.peaks = r.gaps.filter((g) => g.innermost).map((g) => ({ x: g.midpoint, y: g.level }));
      }
    }
    groups.set(key, set);
  }
  return [...groups.values()];
}

/** The CSV's units where a set does not carry its own: the flow axis's, and each quantity's first panel's. */
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
