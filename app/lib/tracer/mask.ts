/**
 * Colour tracing on an RGBA buffer (the browser's ImageData or a decoded PNG). Pure: no DOM.
 *
 * The mask takes the pixels whose colour lies within `tolerance` of the picked colour (Euclidean
 * distance in 8-bit RGB, 0–441; common practice for colour picking) inside a drawn box. The tracer
 * walks the flow axis in equal steps of axis space; at each step it follows the line of constant
 * flow across the box (in a skewed scan that line is not a pixel column), finds the runs of masked
 * pixels on it and takes the weighted centre of the run nearest to the previous point (weights
 * fall with colour distance, so anti-aliased edges count less). Units: pixels unless said.
 */
import { axisToPixel, toAxis, type Calibration, type Px } from "./calibrate";

export type Rgba = { width: number; height: number; data: ArrayLike<number> };
export type Rgb = [number, number, number];
/** A box in pixels (u0 ≤ u1, v0 ≤ v1), inclusive of its edges. */
export type Box = { u0: number; v0: number; u1: number; v1: number };

export function normaliseBox(b: Box, img: { width: number; height: number }): Box {
  const u0 = Math.max(0, Math.floor(Math.min(b.u0, b.u1))), u1 = Math.min(img.width - 1, Math.ceil(Math.max(b.u0, b.u1)));
  const v0 = Math.max(0, Math.floor(Math.min(b.v0, b.v1))), v1 = Math.min(img.height - 1, Math.ceil(Math.max(b.v0, b.v1)));
  return { u0, v0, u1, v1 };
}

/** Colour at a pixel (nearest). */
export function colourAt(img: Rgba, p: Px): Rgb {
  const i = 4 * (Math.round(p.v) * img.width + Math.round(p.u));
  return [img.data[i], img.data[i + 1], img.data[i + 2]];
}

/**
 * Mask weights (0 = not taken, 1..255 = taken, higher = closer in colour) for every pixel of the
 * picture; pixels outside the box are 0. Also used for the live preview.
 */
export function colourMask(img: Rgba, colour: Rgb, tolerance: number, box: Box): Uint8Array {
  const out = new Uint8Array(img.width * img.height);
  const b = normaliseBox(box, img);
  const tol = Math.max(1, tolerance);
  for (let v = b.v0; v <= b.v1; v++) {
    for (let u = b.u0; u <= b.u1; u++) {
      const k = v * img.width + u;
      const i = 4 * k;
      if (img.data[i + 3] < 128) continue;
      const dist = Math.hypot(img.data[i] - colour[0], img.data[i + 1] - colour[1], img.data[i + 2] - colour[2]);
      if (dist <= tol) out[k] = Math.max(1, Math.round(255 * (1 - dist / (tol + 1))));
    }
  }
  return out;
}

export interface TraceOptions {
  /** Number of equal steps along the flow axis across the box (default: one per 2 px of box width). */
  steps?: number;
  /** Where to start following (a click on the curve); default: the longest run of the first step. */
  seed?: Px;
  /** Largest jump between neighbouring steps, px (default 40): farther runs are a different curve. */
  maxJump?: number;
}

type Run = { p: Px; w: number; len: number };

/** Runs of masked pixels along the segment a→b, sampled every half pixel. */
function runsAlong(mask: Uint8Array, width: number, height: number, a: Px, b: Px): Run[] {
  const len = Math.hypot(b.u - a.u, b.v - a.v);
  const n = Math.max(1, Math.ceil(len * 2));
  const runs: Run[] = [];
  let cur: { su: number; sv: number; w: number; len: number } | null = null;
  for (let i = 0; i <= n; i++) {
    const t = i / n;
    const u = a.u + (b.u - a.u) * t, v = a.v + (b.v - a.v) * t;
    const ru = Math.round(u), rv = Math.round(v);
    const w = ru >= 0 && rv >= 0 && ru < width && rv < height ? mask[rv * width + ru] : 0;
    if (w > 0) {
      cur ??= { su: 0, sv: 0, w: 0, len: 0 };
      cur.su += w * u;
      cur.sv += w * v;
      cur.w += w;
      cur.len++;
    }
    if ((w === 0 || i === n) && cur) {
      runs.push({ p: { u: cur.su / cur.w, v: cur.sv / cur.w }, w: cur.w, len: cur.len / 2 });
      cur = null;
    }
  }
  return runs;
}

/** The segment of the line of constant axis-X through the box (clipped to the box), or null. */
function isoFlowSegment(cal: Calibration, X: number, box: Box): [Px, Px] | null {
  // Two pixels on the line X = const: move along Y.
  const p = axisToPixel(cal, X, 0), q = axisToPixel(cal, X, 1);
  const du = q.u - p.u, dv = q.v - p.v;
  let t0 = -Infinity, t1 = Infinity;
  const clip = (p0: number, d: number, lo: number, hi: number) => {
    if (Math.abs(d) < 1e-12) {
      if (p0 < lo || p0 > hi) t0 = Infinity;
      return;
    }
    let a = (lo - p0) / d, b = (hi - p0) / d;
    if (a > b) [a, b] = [b, a];
    t0 = Math.max(t0, a);
    t1 = Math.min(t1, b);
  };
  clip(p.u, du, box.u0, box.u1);
  clip(p.v, dv, box.v0, box.v1);
  if (!(t0 <= t1)) return null;
  return [{ u: p.u + du * t0, v: p.v + dv * t0 }, { u: p.u + du * t1, v: p.v + dv * t1 }];
}

/**
 * Follows one curve of the masked colour across the box along the flow axis. Returns pixel points
 * in order of rising flow (the caller turns them into data values with toData).
 */
export function traceMask(mask: Uint8Array, img: { width: number; height: number }, cal: Calibration, box: Box, opts: TraceOptions = {}): Px[] {
  const b = normaliseBox(box, img);
  const corners = [{ u: b.u0, v: b.v0 }, { u: b.u1, v: b.v0 }, { u: b.u0, v: b.v1 }, { u: b.u1, v: b.v1 }].map((c) => toAxis(cal, c).X);
  const lo = Math.min(...corners), hi = Math.max(...corners);
  const steps = Math.max(2, Math.round(opts.steps ?? (b.u1 - b.u0) / 2));
  const maxJump = opts.maxJump ?? 40;
  const perStep: Run[][] = [];
  for (let k = 0; k <= steps; k++) {
    const seg = isoFlowSegment(cal, lo + ((hi - lo) * k) / steps, b);
    perStep.push(seg ? runsAlong(mask, img.width, img.height, seg[0], seg[1]) : []);
  }
  // Start at the step nearest the seed (or the heaviest run), then follow both ways by continuity.
  let start = -1, startRun: Run | null = null;
  if (opts.seed) {
    const sx = toAxis(cal, opts.seed).X;
    const k0 = Math.round(((sx - lo) / (hi - lo)) * steps);
    let best = Infinity;
    for (let dk = 0; dk <= steps; dk++) {
      for (const k of [k0 - dk, k0 + dk]) {
        for (const r of perStep[k] ?? []) {
          const d = Math.hypot(r.p.u - opts.seed.u, r.p.v - opts.seed.v);
          if (d < best) [best, start, startRun] = [d, k, r];
        }
      }
      if (startRun) break;
    }
  } else {
    for (let k = 0; k <= steps && !startRun; k++) {
      const heaviest = [...perStep[k]].sort((x, y) => y.w - x.w)[0];
      if (heaviest) [start, startRun] = [k, heaviest];
    }
  }
  if (!startRun) return [];
  const picked = new Map<number, Px>([[start, startRun.p]]);
  for (const dir of [1, -1]) {
    let prev = startRun.p;
    for (let k = start + dir; k >= 0 && k <= steps; k += dir) {
      let best: Run | null = null, bestD = Infinity;
      for (const r of perStep[k]) {
        const d = Math.hypot(r.p.u - prev.u, r.p.v - prev.v);
        if (d < bestD) [best, bestD] = [r, d];
      }
      if (best && bestD <= maxJump) {
        picked.set(k, best.p);
        prev = best.p;
      }
    }
  }
  return [...picked.entries()].sort((x, y) => x[0] - y[0]).map(([, p]) => p);
}

/**
 * All masked pixels' run centres met when walking the box along both axes: the outline of a closed
 * contour (an iso-efficiency island), ordered by angle about its centre.
 */
export function traceIsland(mask: Uint8Array, img: { width: number; height: number }, box: Box, steps = 120): Px[] {
  const b = normaliseBox(box, img);
  const pts: Px[] = [];
  for (let k = 0; k <= steps; k++) {
    const u = b.u0 + ((b.u1 - b.u0) * k) / steps, v = b.v0 + ((b.v1 - b.v0) * k) / steps;
    for (const r of runsAlong(mask, img.width, img.height, { u, v: b.v0 }, { u, v: b.v1 })) pts.push(r.p);
    for (const r of runsAlong(mask, img.width, img.height, { u: b.u0, v }, { u: b.u1, v })) pts.push(r.p);
  }
  if (pts.length < 3) return pts;
  const cu = pts.reduce((s, p) => s + p.u, 0) / pts.length, cv = pts.reduce((s, p) => s + p.v, 0) / pts.length;
  return pts.sort((p, q) => Math.atan2(p.v - cv, p.u - cu) - Math.atan2(q.v - cv, q.u - cu));
}
