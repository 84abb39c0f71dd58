/**
 * A touch between the solver's samples (operatingPoint.ts, curveTouch.ts): a system curve tangent to the pump's where no
 * sample falls, or with a sample in a rounding-deep dip, is one operating point with the warning `touching-curves`; a gap or
 * a dip within TOUCH_GAP = 1e-8 of the head (LIMIT_ROUNDING) reads the same; further apart, the curves part (no meeting
 * there) or cross twice.
 * Check values: geometry of an invented curve (m³/s, m) — 40 m at shut-off, a dip to 30 m at 0.01 m³/s, 31 m at 0.015,
 * 20 m at 0.03: on 0.01–0.015 the monotone cubic (Fritsch & Carlson 1980) has zero slope at both knots (a data minimum and
 * maximum), and is convex on its first half, where a straight system line tangent to it lies below it on both sides. The
 * solver samples each knot interval in 8 (its default), 0.000625 m³/s apart there. The slope at the tangent point is a
 * central difference (geometry; its error moves the least of the gap by far less than 1e-12 m).
 */
import { describe, expect, it } from "vitest";
import { createPumpCurve, evalCubic, solveOperatingPoint } from "./index.ts";
import { inSI } from "./quantityText.ts";

const c = createPumpCurve({ points: [[0, 40], [0.01, 30], [0.015, 31], [0.03, 20]].map(([flow, head]) => ({ flow, head })) });
const hp = (q: number) => evalCubic(c.head, q) as number;
/** The system line tangent to the pump's curve at q, shifted by `shift` of the pump's head there (+ above, − below). */
function tangent(q: number, shift: number) {
  const d = 1e-7, slope = (hp(q + d) - hp(q - d)) / (2 * d), h = hp(q);
  return (x: number) => h * (1 + shift) + slope * (x - q);
}
const codes = (op: { warnings: { code: string }[] }) => op.warnings.map((w) => w.code);
const between = 0.01 + 2.5 * 0.000625; // halfway between two samples (geometry: 0.01 + 2.5 × 0.005/8)
const atSample = 0.01 + 2 * 0.000625; // on a sample

describe("a system line tangent to the pump's curve between two samples", () => {
  it("tangent, and a gap or a dip of 0.9e-8 of the head: one point, the touch, where a pump flowing up to it stops", () => {
    // old code: all three "ok" at the far crossing (0.01438 m³/s), the touch missed — no sample saw the dip.
    for (const shift of [0, -0.9e-8, 0.9e-8]) {
      const op = solveOperatingPoint(c, tangent(between, shift));
      expect(op.status, `shift ${shift}`).toBe("multiple");
      expect(op.points, `shift ${shift}`).toHaveLength(2); // the touch and the far crossing
      expect(Math.abs(op.flow! - between), `shift ${shift}`).toBeLessThan(1e-7);
      expect(codes(op), `shift ${shift}`).toContain("touching-curves");
      expect(inSI(op.message)).toMatch(/^2 intersections .*no longer exceeds the system's, 41\.6 m³\/h \(30\.2 m\), where they touch, reported/);
    }
  });
  it("the flip below: a gap of 1.1e-8 of the head, the curves part and the pump runs on to the far crossing", () => {
    const op = solveOperatingPoint(c, tangent(between, -1.1e-8));
    expect(op.status).toBe("ok");
    expect(op.points).toHaveLength(1);
    expect(op.flow!).toBeGreaterThan(between + 0.002); // the far crossing, on the concave half (geometry)
    expect(codes(op)).not.toContain("touching-curves");
  });
  it("the flip above: a dip of 1.1e-8 of the head, two crossings near the tangent point, the first reached from rest", () => {
    const op = solveOperatingPoint(c, tangent(between, 1.1e-8)); // old code: "ok" at the far crossing, both missed
    expect(op.status).toBe("multiple");
    expect(op.points).toHaveLength(3);
    expect(op.flow!).toBeLessThan(between);
    expect(op.flow!).toBeGreaterThan(between - 1e-5);
    expect(codes(op)).not.toContain("touching-curves");
    expect(codes(op)).toContain("unstable-crossing"); // the second, where the pump's head rises above the system's again
  });
});

describe("a system line tangent on a sample, shifted by less than 1e-8 of the head: one touch, not two crossings or none", () => {
  it("0.5e-8 above (a sample inside the dip) and below (a sample just above it): the touch", () => {
    // old code: above → "3 intersections", settled at the first of two crossings 2e-6 m³/s apart; below → "ok" at the far
    // crossing (the sample 1.5e-7 m above the system, not equal to rounding).
    for (const shift of [0.5e-8, -0.5e-8]) {
      const op = solveOperatingPoint(c, tangent(atSample, shift));
      expect(op.points, `shift ${shift}`).toHaveLength(2);
      expect(Math.abs(op.flow! - atSample), `shift ${shift}`).toBeLessThan(1e-7);
      expect(codes(op), `shift ${shift}`).toContain("touching-curves");
    }
  });
  it("the flip: 2e-8 above, two crossings; 2e-8 below, the curves part", () => {
    expect(solveOperatingPoint(c, tangent(atSample, 2e-8)).points).toHaveLength(3);
    expect(solveOperatingPoint(c, tangent(atSample, -2e-8)).points).toHaveLength(1);
  });
});
