/**
 * Axis calibration of a chart picture: pixel (u right, v down; px) → data (x, y in the axis units
 * the user typed). Pure: no DOM, no Node APIs; runs in the browser and in tests.
 *
 * Model: an affine map from pixels to "axis space" X = a·u + b·v + c, Y = d·u + e·v + f, where
 * X = x on a linear axis and X = log10(x) on a logarithmic one (same for Y). Each reference click
 * on the flow axis gives one equation for (a, b, c); each one on the vertical axis one for (d, e, f);
 * a grid point with both values known gives one of each. The coefficients are the least-squares
 * solution (normal equations, common practice). With only two points on an axis (collinear clicks)
 * the map is completed as a datasheet's axes define it: X is constant along the vertical axis
 * (lines parallel to the vertical axis are lines of constant flow) and Y along the flow axis — so a
 * rotated or sheared scan is still read right. Three or more non-collinear references give the
 * full affine fit; its residual (max and RMS, % of the axis span) tells how well the clicks agree.
 */

export type AxisScale = "linear" | "log";
/** A point of the picture in pixels (u to the right, v downwards). */
export type Px = { u: number; v: number };
/** A click on an axis with the value the user typed there (in that axis's unit). */
export type AxisRef = Px & { value: number };
/** A click where both values are known (a grid crossing). */
export type GridRef = Px & { x: number; y: number };

export class TraceInputError extends Error {}

export interface CalibrationInput {
  xRefs: readonly AxisRef[];
  yRefs: readonly AxisRef[];
  gridRefs?: readonly GridRef[];
  xScale: AxisScale;
  yScale: AxisScale;
}

export interface Calibration {
  /** X = a·u + b·v + c (axis space: value or log10 value) */
  a: number; b: number; c: number;
  /** Y = d·u + e·v + f */
  d: number; e: number; f: number;
  xScale: AxisScale;
  yScale: AxisScale;
  /** How far the fitted map misses the typed values, % of each axis's reference span. */
  residual: { xMaxPct: number; yMaxPct: number; rmsPct: number; refs: number; fullAffine: boolean };
}

const fwd = (s: AxisScale, value: number, what: string) => {
  if (!Number.isFinite(value)) throw new TraceInputError(`${what}: the value must be a number.`);
  if (s === "log") {
    if (value <= 0) throw new TraceInputError(`${what}: a logarithmic axis needs values above zero.`);
    return Math.log10(value);
  }
  return value;
};
const back = (s: AxisScale, t: number) => (s === "log" ? 10 ** t : t);

/** Twice the largest triangle area over the span²: 0 for collinear points (dimensionless). */
function spread(ps: readonly Px[]): number {
  if (ps.length < 3) return 0;
  let far = 0, i0 = 0, i1 = 1;
  for (let i = 0; i < ps.length; i++)
    for (let j = i + 1; j < ps.length; j++) {
      const d = Math.hypot(ps[i].u - ps[j].u, ps[i].v - ps[j].v);
      if (d > far) [far, i0, i1] = [d, i, j];
    }
  if (far === 0) return 0;
  const [p, q] = [ps[i0], ps[i1]];
  let best = 0;
  for (const r of ps) best = Math.max(best, Math.abs((q.u - p.u) * (r.v - p.v) - (q.v - p.v) * (r.u - p.u)));
  return best / (far * far);
}

/** Solves the 3×3 system M·s = r (Cramer's rule); null when singular. */
function solve3(M: number[][], r: number[]): [number, number, number] | null {
  const det = (m: number[][]) =>
    m[0][0] * (m[1][1] * m[2][2] - m[1][2] * m[2][1]) - m[0][1] * (m[1][0] * m[2][2] - m[1][2] * m[2][0]) + m[0][2] * (m[1][0] * m[2][1] - m[1][1] * m[2][0]);
  const D = det(M);
  const scale = Math.abs(M[0][0] * M[1][1] * M[2][2]) || 1;
  if (!Number.isFinite(D) || Math.abs(D) < 1e-12 * scale) return null;
  const col = (k: number) => M.map((row, i) => row.map((x, j) => (j === k ? r[i] : x)));
  return [det(col(0)) / D, det(col(1)) / D, det(col(2)) / D];
}

/**
 * Least squares for t ≈ p·u + q·v + s over the rows, plus (when the points are collinear) the
 * constraint that t does not change along `keep` (a pixel direction).
 */
function fitPlane(rows: { u: number; v: number; t: number }[], keep: Px | null): [number, number, number] | null {
  // Centre the pixels for conditioning.
  const mu = rows.reduce((s, r) => s + r.u, 0) / rows.length;
  const mv = rows.reduce((s, r) => s + r.v, 0) / rows.length;
  const M = [[0, 0, 0], [0, 0, 0], [0, 0, 0]];
  const rhs = [0, 0, 0];
  const add = (x: [number, number, number], t: number, w: number) => {
    for (let i = 0; i < 3; i++) {
      rhs[i] += w * x[i] * t;
      for (let j = 0; j < 3; j++) M[i][j] += w * x[i] * x[j];
    }
  };
  for (const r of rows) add([r.u - mu, r.v - mv, 1], r.t, 1);
  if (keep) {
    const n = Math.hypot(keep.u, keep.v);
    if (n === 0) return null;
    // A heavy row [du, dv, 0]·s = 0 holds the constraint (weight ≫ any data row).
    const span = Math.max(1, ...rows.map((r) => Math.hypot(r.u - mu, r.v - mv)));
    add([(keep.u / n) * span, (keep.v / n) * span, 0], 0, 1e6 * rows.length);
  }
  const s = solve3(M, rhs);
  if (!s) return null;
  return [s[0], s[1], s[2] - s[0] * mu - s[1] * mv];
}

/** Direction (in pixels) of the line through the first and last of these clicks. */
function direction(ps: readonly Px[]): Px | null {
  if (ps.length < 2) return null;
  const [p, q] = [ps[0], ps[ps.length - 1]];
  return q.u === p.u && q.v === p.v ? null : { u: q.u - p.u, v: q.v - p.v };
}

export function calibrate(input: CalibrationInput): Calibration {
  const { xScale, yScale } = input;
  const grid = input.gridRefs ?? [];
  const xs = [
    ...input.xRefs.map((r, i) => ({ u: r.u, v: r.v, t: fwd(xScale, r.value, `Flow reference ${i + 1}`) })),
    ...grid.map((g, i) => ({ u: g.u, v: g.v, t: fwd(xScale, g.x, `Grid point ${i + 1}`) })),
  ];
  const ys = [
    ...input.yRefs.map((r, i) => ({ u: r.u, v: r.v, t: fwd(yScale, r.value, `Vertical reference ${i + 1}`) })),
    ...grid.map((g, i) => ({ u: g.u, v: g.v, t: fwd(yScale, g.y, `Grid point ${i + 1}`) })),
  ];
  for (const r of [...xs, ...ys]) if (!Number.isFinite(r.u) || !Number.isFinite(r.v)) throw new TraceInputError("A reference click lies outside the picture.");
  if (xs.length < 2) throw new TraceInputError("Click at least two points on the flow axis and type their values.");
  if (ys.length < 2) throw new TraceInputError("Click at least two points on the vertical axis and type their values.");
  const spanOf = (rs: { t: number }[]) => Math.max(...rs.map((r) => r.t)) - Math.min(...rs.map((r) => r.t));
  if (!(spanOf(xs) > 0)) throw new TraceInputError("The flow references need two different values.");
  if (!(spanOf(ys) > 0)) throw new TraceInputError("The vertical references need two different values.");
  const fullX = spread(xs) > 1e-3, fullY = spread(ys) > 1e-3;
  const px = fitPlane(xs, fullX ? null : direction(input.yRefs.length >= 2 ? input.yRefs : ys));
  const py = fitPlane(ys, fullY ? null : direction(input.xRefs.length >= 2 ? input.xRefs : xs));
  if (!px || !py) throw new TraceInputError("The reference clicks are too close together or lie on one line; click points further apart on each axis.");
  const [a, b, c] = px;
  const [d, e, f] = py;
  if (Math.abs(a * e - b * d) < 1e-18) throw new TraceInputError("The two axes come out parallel; check which axis each click belongs to.");
  const errX = xs.map((r) => Math.abs(a * r.u + b * r.v + c - r.t) / spanOf(xs));
  const errY = ys.map((r) => Math.abs(d * r.u + e * r.v + f - r.t) / spanOf(ys));
  const all = [...errX, ...errY];
  return {
    a, b, c, d, e, f, xScale, yScale,
    residual: {
      xMaxPct: 100 * Math.max(...errX),
      yMaxPct: 100 * Math.max(...errY),
      rmsPct: 100 * Math.sqrt(all.reduce((s, x) => s + x * x, 0) / all.length),
      refs: xs.length + ys.length,
      fullAffine: fullX && fullY,
    },
  };
}

/** Pixel → data values (axis units). */
export function toData(cal: Calibration, p: Px): { x: number; y: number } {
  return { x: back(cal.xScale, cal.a * p.u + cal.b * p.v + cal.c), y: back(cal.yScale, cal.d * p.u + cal.e * p.v + cal.f) };
}

/** Pixel → axis space (linear in the picture: value or log10 value). */
export function toAxis(cal: Calibration, p: Px): { X: number; Y: number } {
  return { X: cal.a * p.u + cal.b * p.v + cal.c, Y: cal.d * p.u + cal.e * p.v + cal.f };
}

/** Axis space → pixel (inverse of the affine map). */
export function axisToPixel(cal: Calibration, X: number, Y: number): Px {
  const det = cal.a * cal.e - cal.b * cal.d;
  const x = X - cal.c, y = Y - cal.f;
  return { u: (cal.e * x - cal.b * y) / det, v: (cal.a * y - cal.d * x) / det };
}

/** Data values → pixel; null for a value a logarithmic axis cannot show (≤ 0). */
export function toPixel(cal: Calibration, x: number, y: number): Px | null {
  if ((cal.xScale === "log" && !(x > 0)) || (cal.yScale === "log" && !(y > 0))) return null;
  return axisToPixel(cal, cal.xScale === "log" ? Math.log10(x) : x, cal.yScale === "log" ? Math.log10(y) : y);
}

/** Axis-space value ↔ data value for one axis. */
export const axisValue = { fwd: (s: AxisScale, x: number) => fwd(s, x, "Value"), back };
