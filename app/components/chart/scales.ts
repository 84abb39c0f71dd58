/**
 * Pure helpers for the duty chart: extents, nice domains, linear interpolation at a flow,
 * conversion of SI series to display units, number formatting and the pump palette.
 * No React, no DOM: safe on the server and easy to test.
 */
import { scaleLinear } from "d3-scale";
import { fromSI, unitLabel, UNIT_SYSTEMS } from "../../engine/units.ts";
import type { Pt, UnitSystemId } from "./types.ts";

/** What a series measures; decides its display unit. */
export type SeriesKind = "head" | "efficiency" | "power" | "npsh";

/** Display units of one unit system: unit ids (for `fromSI`) and labels. */
export interface DisplayUnits {
  flow: { id: string; label: string };
  head: { id: string; label: string };
  power: { id: string; label: string };
  /** NPSH shares the head unit. */
  npsh: { id: string; label: string };
  efficiency: { id: "%"; label: "%" };
}

/** Display units for a unit system preset (SI: m³/h, m, kW; US: gpm, ft, hp). */
export function displayUnits(system: UnitSystemId): DisplayUnits {
  const preset = UNIT_SYSTEMS[system];
  const head = { id: preset.head, label: unitLabel("head", preset.head) };
  return {
    flow: { id: preset.flow, label: unitLabel("flow", preset.flow) },
    head,
    power: { id: preset.power, label: unitLabel("power", preset.power) },
    npsh: head,
    efficiency: { id: "%", label: "%" },
  };
}

/** Converts a flow in m³/s to the display flow unit. */
export function flowToDisplay(flowSI: number, units: DisplayUnits): number {
  return fromSI("flow", units.flow.id, flowSI);
}

/** Converts a display flow back to m³/s. */
export function flowFromDisplay(flow: number, units: DisplayUnits): number {
  return flow / fromSI("flow", units.flow.id, 1);
}

/** Converts one SI value of a series kind to display units (efficiency 0..1 → %). */
export function valueToDisplay(kind: SeriesKind, valueSI: number, units: DisplayUnits): number {
  switch (kind) {
    case "efficiency":
      return valueSI * 100;
    case "power":
      return fromSI("power", units.power.id, valueSI);
    case "head":
    case "npsh":
      return fromSI("head", units.head.id, valueSI);
  }
}

/**
 * Keeps finite points only and sorts them by flow (stable), so interpolation and drawing
 * never see NaN or a backwards segment.
 */
export function cleanPoints(points: readonly Pt[] | undefined | null): Pt[] {
  if (!points) return [];
  return points
    .filter((p) => p != null && Number.isFinite(p.flow) && Number.isFinite(p.y))
    .slice()
    .sort((a, b) => a.flow - b.flow);
}

/** Converts an SI series to display units (flow and value), dropping non-finite points. */
export function seriesToDisplay(
  points: readonly Pt[] | undefined | null,
  kind: SeriesKind,
  units: DisplayUnits,
): Pt[] {
  return cleanPoints(points).map((p) => ({
    flow: flowToDisplay(p.flow, units),
    y: valueToDisplay(kind, p.y, units),
  }));
}

/** [min, max] of the finite values, or null if there are none. */
export function extent(values: Iterable<number>): [number, number] | null {
  let lo = Infinity;
  let hi = -Infinity;
  for (const v of values) {
    if (!Number.isFinite(v)) continue;
    if (v < lo) lo = v;
    if (v > hi) hi = v;
  }
  return lo <= hi ? [lo, hi] : null;
}

/**
 * A "nice" domain covering [min, max] (rounded outward to tick steps, via d3-scale).
 * A degenerate range is widened so the scale stays invertible.
 * @param ticks approximate tick count the domain is rounded for
 */
export function niceDomain(min: number, max: number, ticks = 6): [number, number] {
  let lo = Number.isFinite(min) ? min : 0;
  let hi = Number.isFinite(max) ? max : 1;
  if (hi < lo) [lo, hi] = [hi, lo];
  if (hi === lo) {
    const pad = lo === 0 ? 1 : Math.abs(lo) * 0.1;
    lo -= lo === 0 ? 0 : pad;
    hi += pad;
  }
  const d = scaleLinear().domain([lo, hi]).nice(ticks).domain();
  return [d[0], d[1]];
}

/**
 * Value of a curve at `flow`, interpolated linearly between the neighbouring points;
 * null outside the curve's flow range (no extrapolation) or for an empty curve.
 * Points need not be sorted; non-finite points are ignored.
 */
export function interpolateAt(points: readonly Pt[] | undefined | null, flow: number): number | null {
  if (!Number.isFinite(flow)) return null;
  const pts = isSortedFinite(points) ? (points as Pt[]) : cleanPoints(points);
  const n = pts.length;
  if (n === 0) return null;
  if (flow < pts[0].flow || flow > pts[n - 1].flow) return null;
  // Binary search for the last point with p.flow <= flow.
  let lo = 0;
  let hi = n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (pts[mid].flow <= flow) lo = mid;
    else hi = mid;
  }
  const a = pts[lo];
  const b = pts[hi];
  if (flow === a.flow) return a.y;
  if (flow === b.flow) return b.y;
  const span = b.flow - a.flow;
  if (span === 0) return a.y;
  return a.y + ((b.y - a.y) * (flow - a.flow)) / span;
}

function isSortedFinite(points: readonly Pt[] | undefined | null): boolean {
  if (!points) return false;
  for (let i = 0; i < points.length; i++) {
    const p = points[i];
    if (!p || !Number.isFinite(p.flow) || !Number.isFinite(p.y)) return false;
    if (i > 0 && p.flow < points[i - 1].flow) return false;
  }
  return true;
}

/** One slice of a band: flow and the lower/upper values there. */
export type BandPt = { flow: number; y0: number; y1: number };

/**
 * The band between two curves, on the union of their flows where both are defined;
 * y0 is the lower of the two values and y1 the upper at every flow.
 */
export function bandBetween(a: readonly Pt[], b: readonly Pt[]): BandPt[] {
  const ca = cleanPoints(a);
  const cb = cleanPoints(b);
  const flows = Array.from(new Set([...ca.map((p) => p.flow), ...cb.map((p) => p.flow)])).sort(
    (x, y) => x - y,
  );
  const out: BandPt[] = [];
  for (const f of flows) {
    const ya = interpolateAt(ca, f);
    const yb = interpolateAt(cb, f);
    if (ya === null || yb === null) continue;
    out.push({ flow: f, y0: Math.min(ya, yb), y1: Math.max(ya, yb) });
  }
  return out;
}

/**
 * Formats a display value: 3 decimals below 1, 2 below 10, else 1 — e.g. 360 → "360.0",
 * 1585.03 → "1585.0", 4.2 → "4.20". Locale-independent (identical on server and client).
 * Exactly 0 → "0"; non-finite or null → "—".
 */
export function formatValue(v: number | null | undefined): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return "—";
  if (v === 0) return "0";
  const a = Math.abs(v);
  const digits = a < 1 ? 3 : a < 10 ? 2 : 1;
  const s = v.toFixed(digits);
  // Avoid "-0.0".
  return /^-0\.?0*$/.test(s) ? s.slice(1) : s;
}

/** Evenly spaced flows from 0 to max inclusive (count intervals). */
export function evenFlows(max: number, count: number): number[] {
  if (!(max > 0) || count < 1) return [0];
  return Array.from({ length: count + 1 }, (_, i) => (max * i) / count);
}

/**
 * Pump palette (our own): distinct in hue and lightness, chosen to stay apart under
 * deuteranopia/protanopia and to avoid amber (reserved for the duty and operating point)
 * and red (failures). Every pump also carries a numbered badge, so colour is never the
 * only cue.
 */
export const PUMP_PALETTE = [
  "#0f766e", // teal
  "#4338ca", // indigo
  "#a21caf", // magenta
  "#5b6b12", // olive
  "#2b6cb0", // slate-blue
  "#7c4a21", // brown
] as const;

/** Palette colour for an index (wraps around). */
export function pumpColor(index: number): string {
  const n = PUMP_PALETTE.length;
  const i = Number.isFinite(index) ? ((Math.trunc(index) % n) + n) % n : 0;
  return PUMP_PALETTE[i];
}

/** Fixed chart colours (SVG attributes, so the chart reads right without any CSS). */
export const CHART_COLORS = {
  system: "#1e293b", // slate-800
  band: "#94a3b8", // slate-400
  npsha: "#1e293b",
  duty: "#d97706", // amber, the app's duty token
  grid: "#e2e8f0", // slate-200
  gridFaint: "#f1f5f9", // slate-100
  axis: "#94a3b8",
  tick: "#475569", // slate-600
  title: "#1e293b",
  cursor: "#0f172a",
  readoutBg: "#ffffff",
  readoutBorder: "#cbd5e1",
} as const;

/**
 * The part of a curve between flows a and b, with interpolated end points (for shading a
 * stretch of a curve, e.g. the preferred operating region). Empty if they do not overlap.
 */
export function sliceCurve(points: readonly Pt[], a: number, b: number): Pt[] {
  const pts = cleanPoints(points);
  if (pts.length < 2) return [];
  const lo = Math.max(Math.min(a, b), pts[0].flow);
  const hi = Math.min(Math.max(a, b), pts[pts.length - 1].flow);
  if (!(hi > lo)) return [];
  const out: Pt[] = [{ flow: lo, y: interpolateAt(pts, lo)! }];
  for (const p of pts) if (p.flow > lo && p.flow < hi) out.push(p);
  out.push({ flow: hi, y: interpolateAt(pts, hi)! });
  return out;
}

/**
 * Where a pump curve meets a system curve, both as points (linear between points): the crossing at
 * the highest flow where pump head − system head changes sign, over the flows both cover; null if
 * they do not meet there. Used where only sampled curves are at hand (stored field-check charts).
 */
export function crossingOf(pump: readonly Pt[] | undefined | null, system: readonly Pt[] | undefined | null): Pt | null {
  const p = cleanPoints(pump);
  const s = cleanPoints(system);
  if (p.length < 2 || s.length < 2) return null;
  const lo = Math.max(p[0].flow, s[0].flow);
  const hi = Math.min(p[p.length - 1].flow, s[s.length - 1].flow);
  if (!(hi > lo)) return null;
  const flows = Array.from(new Set([lo, hi, ...p.map((q) => q.flow), ...s.map((q) => q.flow)].filter((f) => f >= lo && f <= hi))).sort((a, b) => a - b);
  let found: Pt | null = null;
  let prev: { f: number; g: number } | null = null;
  for (const f of flows) {
    const g = (interpolateAt(p, f) as number) - (interpolateAt(s, f) as number);
    if (g === 0) found = { flow: f, y: interpolateAt(p, f) as number };
    else if (prev && prev.g * g < 0) {
      const t = prev.g / (prev.g - g);
      const flow = prev.f + t * (f - prev.f);
      found = { flow, y: interpolateAt(p, flow) as number };
    }
    prev = { f, g };
  }
  return found;
}
