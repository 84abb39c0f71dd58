/**
 * Where the system curve runs along the pump's curve (operatingPoint.ts): a stretch where they coincide is no single
 * operating point, said with the stretch's flows; a touch without crossing is one operating point, whatever side of zero
 * rounding puts the heads' difference there.
 * Check values: geometry of invented curves (m³/s, m). Published points at equal heads interpolate to a flat stretch (the
 * monotone cubic of interp.ts keeps a flat interval flat, Fritsch & Carlson 1980) and a data minimum is the curve's
 * minimum; a system with zero friction is flat at its static head. The readings of a coinciding stretch and of a touch are
 * common practice, from memory: a duty point needs the curves to cross; on a shared stretch the flow wanders along it.
 */
import { describe, expect, it } from "vitest";
import { createPumpCurve, solveOperatingPoint } from "./index.ts";
import { inSI } from "./quantityText.ts";

const curve = (rows: number[][]) => createPumpCurve({ points: rows.map(([flow, head]) => ({ flow, head })) });
const flat = (h: number) => () => h;

describe("a system curve coinciding with the pump's over a stretch: undefined operating point, stated with its flows", () => {
  it("flat from shut-off: 30 m from 0 to 0.01 m³/s against a flat 30 m system (zero friction)", () => {
    const op = solveOperatingPoint(curve([[0, 30], [0.005, 30], [0.01, 30], [0.02, 20]]), flat(30));
    // old code: status "multiple", "17 intersections (drooping curve)", dead-head at zero flow reported as the point
    expect(op.status).toBe("coincident");
    expect(op.flow).toBeNull();
    expect(op.head).toBeNull();
    expect(op.stretch).toMatchObject({ flowFrom: 0, flowTo: 0.01, head: 30 });
    // the rule's numbers: within 1e-8 of the head from 0 to just past 0.01 (where the curve starts to fall) of 0–0.02 m³/s
    expect(inSI(op.message)).toBe("The pump and system curves coincide from 0.000 m³/h to 36.0 m³/h at 30.0 m (their heads within 1 part in 10⁸ of the pump's head over 50.0 % of the published flows; coincident from 1 %): the operating point is undefined — the pump may run at any flow on that stretch and drifts along it; change the system or the pump so the curves cross");
    expect(op.warnings.map((w) => w.code)).not.toContain("dead-head");
  });
  it("mid-curve: 40 m falling to a 30 m stretch from 0.01 to 0.02 m³/s; the flip 1e-6 of the head either side", () => {
    const c = curve([[0, 40], [0.01, 30], [0.015, 30], [0.02, 30], [0.03, 20]]);
    const on = solveOperatingPoint(c, flat(30));
    expect(on.status).toBe("coincident"); // old code: "multiple", 17 intersections, the first (0.01 m³/s) reported
    expect(on.stretch).toMatchObject({ flowFrom: 0.01, flowTo: 0.02, head: 30 });
    expect(on.points).toHaveLength(1);
    // 1e-6 of the head below the stretch: one crossing past its end (the curve falls from 30 m there), a point;
    // 1e-6 above it: one crossing before its start.
    const below = solveOperatingPoint(c, flat(30 * (1 - 1e-6)));
    expect(below.status).toBe("ok");
    expect(below.flow!).toBeGreaterThan(0.02);
    expect(below.flow!).toBeLessThan(0.0201);
    const above = solveOperatingPoint(c, flat(30 * (1 + 1e-6)));
    expect(above.status).toBe("ok");
    expect(above.flow!).toBeLessThan(0.01);
    expect(above.flow!).toBeGreaterThan(0.0099);
  });
});

describe("a system curve touching the pump's without crossing: one operating point", () => {
  // 40 m at shut-off, a dip to 30 m at 0.01 m³/s (the data's minimum: the curve's), 31 m at 0.015, 20 m at 0.03: a flat
  // system at 30 m touches it at 0.01 m³/s and crosses it once more further out (near 0.0184 m³/s, 66.2 m³/h).
  const c = curve([[0, 40], [0.01, 30], [0.015, 31], [0.03, 20]]);
  it("at 30 m exactly and a rounding-level 3e-12 m above or below it: the same one point, the touch, with its warning", () => {
    // old code, three answers for one geometry: exact → "multiple", settled at the far crossing with 0.01 called
    // unstable; 3e-12 m above → "3 intersections", settled just below 0.01; 3e-12 m below → "ok" at the far crossing.
    for (const d of [0, 1e-13, -1e-13]) {
      const op = solveOperatingPoint(c, flat(30 * (1 + d)));
      expect(op.flow, `d ${d}`).toBeCloseTo(0.01, 12);
      expect(op.points, `d ${d}`).toHaveLength(2); // the touch and the far crossing
      expect(op.warnings.map((w) => w.code), `d ${d}`).toContain("touching-curves");
      expect(op.warnings.map((w) => w.code), `d ${d}`).not.toContain("unstable-crossing");
      expect(inSI(op.message), `d ${d}`).toMatch(/^2 intersections .*the first where its head no longer exceeds the system's, 36\.0 m³\/h \(30\.0 m\), where they touch, reported/);
    }
  });
  it("the flip: 1e-6 of the head below, the curves part and the flow runs on to the far crossing; above, two crossings near 0.01", () => {
    const part = solveOperatingPoint(c, flat(30 * (1 - 1e-6)));
    expect(part.status).toBe("ok");
    expect(part.flow!).toBeGreaterThan(0.0183);
    const two = solveOperatingPoint(c, flat(30 * (1 + 1e-6)));
    expect(two.status).toBe("multiple");
    expect(two.points).toHaveLength(3);
    expect(two.flow!).toBeLessThan(0.01);
    expect(two.flow!).toBeGreaterThan(0.0099);
    expect(two.warnings.map((w) => w.code)).not.toContain("touching-curves");
  });
});
