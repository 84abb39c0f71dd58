/**
 * Axis domains for the duty chart: extents of finite values, "nice" rounded domains (d3-scale)
 * and evenly spaced flows. Pure; no React, no DOM.
 *
 * Also re-exports the other chart helpers (units, curves, formatting, colours) that used to
 * live here, so existing `./scales` imports keep working; new code imports the module itself.
 */
import { scaleLinear } from "d3-scale";

export * from "./display-units.ts";
export * from "./curves.ts";
export * from "./format.ts";
export * from "./colors.ts";

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

/** Evenly spaced flows from 0 to max inclusive (count intervals). */
export function evenFlows(max: number, count: number): number[] {
  if (!(max > 0) || count < 1) return [0];
  return Array.from({ length: count + 1 }, (_, i) => (max * i) / count);
}
