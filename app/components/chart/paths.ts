/**
 * SVG path strings for the duty chart: curves and bands through d3-shape, and the small mark
 * shapes (BEP diamond, duty cross). Coordinates of marks are rounded to 0.1 px (`r1`) so the
 * markup stays short and identical on server and client.
 */
import { area, line } from "d3-shape";
import type { ScaleLinear } from "d3-scale";
import type { BandPt } from "./curves.ts";
import type { Pt } from "./types.ts";

type Scale = ScaleLinear<number, number>;

/** Rounds a coordinate to 0.1 px. */
export const r1 = (v: number) => Math.round(v * 10) / 10;

/** v limited to [lo, hi]. */
export const clamp = (v: number, lo: number, hi: number) => Math.min(hi, Math.max(lo, v));

/** Straight segments through the points (display units → px); "" for no points. */
export function linePath(pts: Pt[], x: Scale, y: Scale): string {
  return (
    line<Pt>()
      .x((p) => x(p.flow))
      .y((p) => y(p.y))(pts) ?? ""
  );
}

/** The filled area between y0 and y1 along the band; "" for no points. */
export function bandPath(pts: BandPt[], x: Scale, y: Scale): string {
  return (
    area<BandPt>()
      .x((p) => x(p.flow))
      .y0((p) => y(p.y0))
      .y1((p) => y(p.y1))(pts) ?? ""
  );
}

/** A diamond of half-diagonal r centred on (cx, cy): the BEP mark. */
export function diamond(cx: number, cy: number, r: number): string {
  return `M${r1(cx)},${r1(cy - r)}L${r1(cx + r)},${r1(cy)}L${r1(cx)},${r1(cy + r)}L${r1(cx - r)},${r1(cy)}Z`;
}

/** Four arms from `inner` to `outer` px around (cx, cy), open in the middle: the duty cross. */
export function crossPath(cx: number, cy: number, inner: number, outer: number): string {
  const a = r1(cx);
  const b = r1(cy);
  return (
    `M${a - outer},${b}H${a - inner}M${a + inner},${b}H${a + outer}` +
    `M${a},${b - outer}V${b - inner}M${a},${b + inner}V${b + outer}`
  );
}
