/**
 * Coincident or touching (meetings.ts): curves whose heads stay within TOUCH_GAP (1e-8) of the pump's over COINCIDE_SHARE
 * (1 %) of the published flows or more coincide there (status `coincident`, the rule and its numbers in the message);
 * narrower, a touch (warning `touching-curves`, its share in the words); touches from either side of zero.
 * Check values: geometry — the system head is built from the pump's own interpolated head P(Q) so that the difference
 * g = P − system is a chosen function of x = Q / 0.04 m³/s (the published span): g = κ·P·(x − 0.45)² stays within 1e-8 of
 * P over 2·√(1e-8/κ) of the span (algebra), 1.026 % at κ = 3.8e-4 and 0.976 % at κ = 4.2e-4 either side of 1 %.
 */
import { describe, expect, it } from "vitest";
import { createPumpCurve, solveOperatingPoint } from "./index.ts";
import { evalCubic } from "./interp.ts";
import { inSI } from "./quantityText.ts";

const c = createPumpCurve({ points: [[0, 40], [0.01, 38], [0.02, 34], [0.03, 28], [0.04, 20]].map(([flow, head]) => ({ flow, head })) });
const P = (q: number) => evalCubic(c.head, q) as number;
const x = (q: number) => q / 0.04;
/** The system whose head lies g(x)·P below the pump's. */
const sys = (g: (x: number) => number) => (q: number) => P(q) * (1 - g(x(q)));
const codes = (op: ReturnType<typeof solveOperatingPoint>) => op.warnings.map((w) => w.code);

describe("a touch against curves that run together: COINCIDE_SHARE of the published flows within 1e-8 of the head", () => {
  it("κ = 3.8e-4: within 1e-8 over 1.03 % of the flows, coincident; κ = 4.2e-4: 0.98 %, a touch (the flip)", () => {
    const wide = solveOperatingPoint(c, sys((v) => 3.8e-4 * (v - 0.45) ** 2));
    expect(wide.status).toBe("coincident"); // old code: "ok" at 0.018 m³/s with touching-curves (one point on a 1 % stretch)
    expect(wide.stretch!.share).toBeCloseTo(2 * Math.sqrt(1e-8 / 3.8e-4), 5); // algebra: 0.010260
    expect(wide.stretch!.flowFrom).toBeLessThan(0.018);
    expect(wide.stretch!.flowTo).toBeGreaterThan(0.018);
    expect(inSI(wide.message)).toMatch(/^The pump and system curves coincide from 64\.\d m³\/h to 65\.\d m³\/h at 35\.1 m \(their heads within 1 part in 10⁸ of the pump's head over 1\.03 % of the published flows; coincident from 1 %\): the operating point is undefined/);
    const narrow = solveOperatingPoint(c, sys((v) => 4.2e-4 * (v - 0.45) ** 2));
    expect(narrow.flow!).toBeCloseTo(0.018, 7);
    expect(codes(narrow)).toContain("touching-curves");
    expect(inSI(narrow.warnings.find((w) => w.code === "touching-curves")!.message)).toContain("(their heads within 1 part in 10⁸ of the pump's head over 0.98 % of the published flows; coincident from 1 %)");
  });
  it("the system 5e-9 of the head below (and above) the pump's at every flow: coincident over all of them; 2e-8 apart, no meeting", () => {
    for (const d of [5e-9, -5e-9]) {
      const op = solveOperatingPoint(c, sys(() => d));
      // old code: "beyond-curve-end" (5e-9 below: the pump's head above the system's at its last point), "no-intersection" (above)
      expect(op.status, `d ${d}`).toBe("coincident");
      expect(op.stretch, `d ${d}`).toMatchObject({ flowFrom: 0, flowTo: 0.04, share: 1 });
      expect(inSI(op.message), `d ${d}`).toContain("over 100.0 % of the published flows; coincident from 1 %");
    }
    expect(solveOperatingPoint(c, sys(() => 2e-8)).status).toBe("beyond-curve-end");
    expect(solveOperatingPoint(c, sys(() => -2e-8)).status).toBe("no-intersection-shutoff-below-static");
  });
  it("a long stretch 5e-9 of the head apart mid-curve (x 0.3–0.6), steep either side: coincident over 30 % of the flows", () => {
    const g = (v: number) => (v < 0.3 ? 0.5 * (0.3 - v) : v > 0.6 ? -0.5 * (v - 0.6) : 0) + 5e-9;
    const op = solveOperatingPoint(c, sys(g));
    expect(op.status).toBe("coincident"); // old code: "ok" at the stretch's far end, 0.024 m³/s
    expect(op.stretch!.flowFrom).toBeCloseTo(0.012, 8); // g reaches 1e-8 4e-10 m³/s before 0.012 (algebra)
    expect(op.stretch!.flowTo).toBeCloseTo(0.024, 8); // and −1e-8 1.2e-9 m³/s past 0.024
    expect(op.stretch!.share).toBeCloseTo(0.3, 6); // (0.012 + 0.0000000016) / 0.04 (algebra)
  });
});

describe("a touch between the samples from either side", () => {
  // From above (the pump's head above the system's on both sides, g's least ~0 where the system bends up to it) with a far
  // crossing at x 0.8–1; the mirror: the pump settles at a crossing at x = 0.3 first, then the system bends down to touch the
  // pump's head from above (g = −2·(x − 0.3)·(x − 0.6)², its greatest ~0 at x = 0.6): a touch the pump, already settled, never reaches, and no crossing.
  const above = (off: number) => (v: number) => 0.5 * (v - 0.45) ** 2 + off - Math.max(0, v - 0.8);
  const mirror = (off: number) => (v: number) => -2 * (v - 0.3) * (v - 0.6) ** 2 + off;
  it("from above: exact and 0.5e-8 of the head either side, one touch at 0.018 m³/s; 2e-8 apart, none; 2e-8 deep, two crossings", () => {
    for (const off of [0, 0.5e-8, -0.5e-8]) {
      const op = solveOperatingPoint(c, sys(above(off)));
      expect(op.flow!, `off ${off}`).toBeCloseTo(0.018, 6);
      expect(codes(op), `off ${off}`).toContain("touching-curves");
      expect(op.points, `off ${off}`).toHaveLength(2); // the touch and the far crossing
    }
    const apart = solveOperatingPoint(c, sys(above(2e-8)));
    expect(apart.points).toHaveLength(1); // the far crossing only, where the pump settles
    expect(apart.flow!).toBeGreaterThan(0.032);
    const deep = solveOperatingPoint(c, sys(above(-2e-8)));
    expect(deep.points).toHaveLength(3);
    expect(codes(deep)).not.toContain("touching-curves");
  });
  it("the mirror (from below): the pump settles at the crossing at 0.012 m³/s; the touch at 0.024 m³/s listed as one, no unstable crossing", () => {
    for (const off of [0, 0.5e-8, -0.5e-8]) {
      const op = solveOperatingPoint(c, sys(mirror(off)));
      expect(op.status, `off ${off}`).toBe("multiple");
      expect(op.flow!, `off ${off}`).toBeCloseTo(0.012, 8); // off moves it by off / 0.18 of the span (g's slope there)
      expect(op.points.map((p) => p.flow), `off ${off}`).toHaveLength(2);
      expect(op.points[1].flow, `off ${off}`).toBeCloseTo(0.024, 6);
      expect(codes(op), `off ${off}`).not.toContain("unstable-crossing");
      expect(inSI(op.message), `off ${off}`).toMatch(/^2 intersections .*43\.2 m³\/h \(\d+\.\d m\), reported; operation may be unstable$/);
    }
    const apart = solveOperatingPoint(c, sys(mirror(-2e-8))); // 2e-8 apart: the crossing only
    expect(apart.status).toBe("ok");
    expect(apart.flow!).toBeCloseTo(0.012, 7); // moved by 2e-8 / 0.18 of the span
    const two = solveOperatingPoint(c, sys(mirror(2e-8))); // 2e-8 above: the pump's head rises over the system's and falls back
    expect(two.points).toHaveLength(3);
    expect(codes(two)).toContain("unstable-crossing");
  });
});
