/**
 * Operating point reached from rest (operatingPoint.ts). Check values: the rule is common practice, from memory — a pump
 * starts against a closed check valve, so its shut-off head must exceed the system's head at zero flow; a crossing where
 * the pump's head rises above the system's again at higher flow is unstable; at zero flow the pump dead-heads. The curves
 * are invented; the heads quoted are read off them (geometry).
 */
import { describe, expect, it } from "vitest";
import { createPumpCurve, solveOperatingPoint } from "./index.ts";
import { fmtPctExact, inSI } from "./quantityText.ts";
import { quadraticPoints } from "./test/curves.ts";

const curveOf = (rows: number[][]) => createPumpCurve({ points: rows.map(([flow, head]) => ({ flow, head })), riseTolerance: 1 });
/** A drooping curve, m³/s and m: 40 m at shut-off, 44 m at its peak. */
const A1 = curveOf([[0, 40], [0.005, 43], [0.01, 44], [0.015, 42], [0.02, 37], [0.025, 30]]);
/** Rising to its peak near its end, m³/s and m. */
const A2 = curveOf([[0, 40], [0.01, 43], [0.02, 44], [0.03, 43]]);

describe("shut-off head below the system's head at zero flow: no operating point from rest, whatever crossings lie further out", () => {
  it("A1, 41 m static: two crossings, neither reached — the status says no point, the message names both heads and both crossings", () => {
    const r = solveOperatingPoint(A1, (q) => 41 + 1000 * q * q);
    expect(r.status).toBe("no-intersection-shutoff-below-static"); // old code: "multiple" at the higher crossing
    expect(r.flow).toBeNull();
    expect(r.points).toHaveLength(2);
    expect(inSI(r.message)).toMatch(/^Shutoff head 40\.0 m is below the system head 41\.0 m at zero flow: the pump cannot open its check valve; the curves cross at 5\.\d\d m³\/h \(41\.0 m\), \d\d\.\d m³\/h \(4\d\.\d m\), which it never reaches from rest; the first is unstable: .* runs on to the crossing at /);
    expect(r.unreached).toBeDefined();
  });
  it("the flip at the shut-off head: 40.001 m static → no point; 39.999 m → it starts and settles on the falling part", () => {
    const above = solveOperatingPoint(A1, (q) => 40.001 + 1000 * q * q);
    const below = solveOperatingPoint(A1, (q) => 39.999 + 1000 * q * q);
    expect(above.status).toBe("no-intersection-shutoff-below-static");
    expect(below.status).toBe("ok");
    expect(below.flow!).toBeGreaterThan(0.01); // past the 44 m peak at 0.01 m³/s (geometry)
    expect(below.warnings.map((w) => w.code)).not.toContain("unstable-crossing");
  });
  it("A2, one crossing with the pump's head above the system's at the curve's end: unstable, not 'ok' — said with the last point's heads", () => {
    const r = solveOperatingPoint(A2, (q) => 41 + 1000 * q * q);
    expect(r.status).toBe("no-intersection-shutoff-below-static"); // old code: "ok" at 0.00314 m³/s
    expect(r.points).toHaveLength(1);
    expect(inSI(r.unreached!)).toMatch(/^the curves cross at 11\.\d m³\/h \(41\.0 m\), which it never reaches from rest; that crossing is unstable: the pump's head rises above the system's again past it, so a pump pushed past it runs on past the published curve's end \(at its last point the pump still gives 43\.0 m against the system's 41\.9 m\)$/);
  });
  it("a curve published from a flow above zero: its first point decides, and the message says the shut-off head is not published", () => {
    const c = curveOf([[0.002, 40], [0.01, 43], [0.02, 44], [0.03, 43]]);
    const r = solveOperatingPoint(c, (q) => 41 + 1000 * q * q);
    expect(r.status).toBe("no-intersection-shutoff-below-static");
    expect(r.message).toMatch(/does not show the pump starting from rest \(its shut-off head is not published\)/);
  });
});

describe("from rest the pump settles at the first stable crossing; an unstable one above it is a warning", () => {
  // Invented S-shaped curve: dips to 39 m, rises to 40.5 m, falls again. A flat 39.5 m system cuts it three times.
  const S = curveOf([[0, 40], [0.01, 39], [0.02, 40.5], [0.03, 38]]);
  it("three crossings: the first (stable) reported, the second unstable, running on to the third", () => {
    const r = solveOperatingPoint(S, () => 39.5);
    expect(r.status).toBe("multiple");
    expect(r.points).toHaveLength(3);
    expect(r.flow).toBe(r.points[0].flow); // old code: the highest-flow crossing
    const w = r.warnings.find((x) => x.code === "unstable-crossing");
    expect(inSI(w!.message)).toMatch(/^the crossing at .* is unstable: the pump's head rises above the system's again past it, so a pump pushed past it runs on to the crossing at /);
  });
  it("the last crossing unstable, the curve ending above the system: the old rule reported the unstable point, now the stable one", () => {
    const c = curveOf([[0, 40], [0.01, 39], [0.02, 40.5], [0.03, 40.2]]);
    const r = solveOperatingPoint(c, () => 39.5);
    expect(r.status).toBe("multiple");
    expect(r.points).toHaveLength(2);
    expect(r.flow).toBe(r.points[0].flow);
    expect(r.flow!).toBeLessThan(0.01); // on the first falling part (geometry)
    expect(inSI(r.warnings.find((x) => x.code === "unstable-crossing")!.message)).toMatch(/runs on past the published curve's end \(at its last point the pump still gives 40\.2 m against the system's 39\.5 m\)$/);
  });
  it("the flip: below the dip (38.9 m) there is one crossing, stable, and no unstable warning", () => {
    const r = solveOperatingPoint(S, () => 38.9);
    expect(r.status).toBe("ok");
    expect(r.warnings.map((w) => w.code)).not.toContain("unstable-crossing");
  });
});

describe("dead-head: shut-off head equal to the system's head at zero flow", () => {
  const c = createPumpCurve({ points: quadraticPoints(40, 0.05) }); // 40 m at zero flow, falling
  it("40 m static: the point at zero flow, with a dead-head warning naming both heads", () => {
    const r = solveOperatingPoint(c, (q) => 40 + 1000 * q * q);
    expect(r.status).toBe("ok");
    expect(r.flow).toBe(0);
    expect(inSI(r.message)).toMatch(/dead-head/);
    const w = r.warnings.find((x) => x.code === "dead-head");
    expect(inSI(w!.message)).toMatch(/^no flow: the pump's shut-off head 40\.0 m only balances the system's 40\.0 m at zero flow, .*minimum continuous flow/);
  });
  it("the flip: 39.99 m static delivers a little and carries no dead-head warning", () => {
    const r = solveOperatingPoint(c, (q) => 39.99 + 1000 * q * q);
    expect(r.flow!).toBeGreaterThan(0);
    expect(r.message).toBe("Operating point found");
    expect(r.warnings.map((w) => w.code)).not.toContain("dead-head");
  });
  it("a share that reads as zero at 6 decimals reads in exponent form, never '0.000000 %' nor a bound in words (definition, decision \"pctlimit\")", () => {
    expect(fmtPctExact(2.5e-9, [0.7, 1.2], 0)).toBe("2.50e-7 %"); // older code: "0.000000 %", then "under 0.000001 %"
    expect(fmtPctExact(3e-8, [0.7, 1.2], 0)).toBe("0.000003 %");
  });
});
