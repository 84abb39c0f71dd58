/** Tier 3 — operating point: outcomes, limits and agreement with the system model. */
import { describe, expect, it } from "vitest";
import { brent, createPumpCurve, customFluid, fluidAt, headAt, operatingPoint, operatingPointInSystem, pipeHeadLoss, prepareSystem, solveOperatingPoint, systemHead, systemHeadFunction, waterProperties } from "./index.ts";
import { inSI } from "./quantityText.ts";
import { M3H, quadraticPoints, samplePoints } from "./test/curves.ts";

describe("operatingPoint (simple API)", () => {
  const pts = samplePoints();
  const system = { staticHead: 12, segments: [{ length: 120, diameter: 0.1, roughness: 0.045e-3, minorK: 6 }], temperatureC: 20 };
  const r = operatingPoint(pts, system);

  it("finds one intersection with status ok, solved by Brent within the cap", () => {
    expect(r.status).toBe("ok");
    expect(r.method).toBe("brent");
    expect(r.iterations).toBeLessThan(100);
    expect(r.points.length).toBe(1);
  });
  it("at the solution pump head equals system head (static + Darcy-Weisbach loss) to 1e-9 m", () => {
    const nu = waterProperties(20).kinematicViscosity;
    const loss = pipeHeadLoss({ flow: r.flow!, diameter: 0.1, length: 120, roughness: 0.045e-3, minorK: 6, kinematicViscosity: nu }).headLoss;
    expect(Math.abs(r.head! - (12 + loss))).toBeLessThan(1e-9);
    expect(Math.abs(headAt(createPumpCurve({ points: pts }), r.flow!)! - r.head!)).toBeLessThan(1e-12);
  });
  it("more static head → less flow (monotone response)", () => {
    const r2 = operatingPoint(pts, { ...system, staticHead: 20 });
    expect(r2.flow!).toBeLessThan(r.flow!);
  });
});

describe("named outcomes", () => {
  const curve = createPumpCurve({ points: quadraticPoints(40, 0.05) }); // runout at 0.05 m³/s with head 0

  it("zero system resistance and zero static: operating point is the runout (last point, head 0)", () => {
    const r = solveOperatingPoint(curve, () => 0);
    expect(r.status).toBe("ok");
    expect(r.flow).toBe(0.05);
    expect(r.head).toBe(0);
  });
  it("zero resistance with static equal to the last point's head: runout flow", () => {
    const c = createPumpCurve({ points: samplePoints() });
    const r = solveOperatingPoint(c, () => 14.5);
    expect(r.flow! / (80 * M3H)).toBeCloseTo(1, 12);
  });
  it("shutoff below static → no-intersection-shutoff-below-static, flow null, never NaN", () => {
    const r = solveOperatingPoint(curve, (q) => 45 + 1000 * q * q);
    expect(r.status).toBe("no-intersection-shutoff-below-static");
    expect(r.flow).toBeNull();
    expect(r.head).toBeNull();
    expect(r.message).toMatch(/Shutoff head/);
  });
  it("system too weak to meet the curve before its end → beyond-curve-end", () => {
    const c = createPumpCurve({ points: samplePoints() });
    const r = solveOperatingPoint(c, (q) => 5 + 100 * q * q);
    expect(r.status).toBe("beyond-curve-end");
    expect(r.flow).toBeNull();
    expect(r.atLastPoint.pumpHead).toBeGreaterThan(r.atLastPoint.systemHead);
  });
  it("drooping curve with static between shutoff and peak → no operating point from rest (it cannot open its check valve), both crossings listed", () => {
    const c = createPumpCurve({ points: [
      { flow: 0, head: 30 }, { flow: 0.01, head: 32 }, { flow: 0.02, head: 32.5 }, { flow: 0.03, head: 31 }, { flow: 0.04, head: 27 }, { flow: 0.05, head: 20 },
    ] });
    const r = solveOperatingPoint(c, (q) => 31 + 200 * q * q);
    // Common practice (from memory): 30 m at zero flow against 31 m never opens the check valve; the old rule reported the higher crossing.
    expect(r.status).toBe("no-intersection-shutoff-below-static");
    expect(r.flow).toBeNull();
    expect(r.points.length).toBe(2);
    for (const p of r.points) expect(Math.abs(p.head - (31 + 200 * p.flow * p.flow))).toBeLessThan(1e-9);
  });
});

describe("solver: Brent (1973) with bisection fallback", () => {
  it("Brent finds √2 to 1e-15", () => {
    const r = brent((x) => x * x - 2, 0, 2, 1e-15)!;
    expect(Math.abs(r.x - Math.SQRT2)).toBeLessThan(1e-14);
    expect(r.method).toBe("brent");
  });
  it("with an iteration cap of 2, the named fallback (bisection) finishes the job", () => {
    const r = brent((x) => Math.exp(x) - 10, 0, 10, 1e-12, 2)!;
    expect(r.method).toBe("bisection");
    expect(Math.abs(r.x - Math.log(10))).toBeLessThan(1e-11);
  });
  it("no sign change → null", () => {
    expect(brent((x) => x * x + 1, -1, 1)).toBeNull();
  });
});

describe("operatingPointInSystem agrees with systemHead", () => {
  it("aged pipe → less flow than new pipe", () => {
    const fluid = fluidAt({ kind: "water" }, 20);
    const sys = { fluid, staticHead: 10, discharge: [{ length: 300, diameter: 0.08, roughness: 0.045e-3, agedRoughness: 0.5e-3, minorK: 5 }] };
    const c = createPumpCurve({ points: samplePoints() });
    const n = operatingPointInSystem(c, sys, { roughness: "new" });
    const a = operatingPointInSystem(c, sys, { roughness: "aged" });
    expect(a.flow!).toBeLessThan(n.flow!);
    expect(Math.abs(systemHead(sys, a.flow!, { roughness: "aged" }).head - a.head!)).toBeLessThan(1e-9);
  });
});

describe("a system curve that jumps across the pump's head (Darcy friction at Re 2000: 64/Re, then Colebrook)", () => {
  // Invented: an oil of ν = 6.4e-5 m²/s in 200 m of 100 mm pipe after 5 m static. Re = 2000 at Q = 2000·ν·π·D/4.
  const fluid = customFluid("oil", 900, 0.0576, 1000);
  const sys = prepareSystem({ fluid, staticHead: 5, discharge: [{ length: 200, diameter: 0.1, roughness: 0.045e-3 }] });
  const h = systemHeadFunction(sys);
  const qJump = (2000 * 6.4e-5 * Math.PI * 0.1) / 4;
  const below = h(qJump * 0.9999), above = h(qJump * 1.0001);
  const line = (mid: number) => createPumpCurve({ points: [{ flow: 0, head: mid + 3 }, { flow: 2 * qJump, head: mid - 3 }] });

  it("the step is real (definition: f = 64/Re below 2000, Colebrook above): about 10.3 m to 13.3 m here", () => {
    expect(above - below).toBeGreaterThan(2.5);
  });
  it("a pump head inside the step: the point is kept, with a warning naming both heads; the curves do not meet there", () => {
    const op = solveOperatingPoint(line((below + above) / 2), h);
    expect(op.flow! / qJump).toBeCloseTo(1, 6);
    const w = op.warnings.find((x) => x.code === "system-curve-jump");
    expect(w, "jump warning").toBeDefined();
    expect(inSI(w!.message)).toMatch(/^the pump and system curves do not meet at 36\.2 m³\/h: the system's head jumps there from 10\.3\d? m to 13\.3\d? m/);
  });
  it("a pump head clear of the step crosses the curve: no jump warning (the flip)", () => {
    const op = solveOperatingPoint(line(above + 1), h);
    expect(Math.abs(op.head! - h(op.flow!))).toBeLessThan(1e-6);
    expect(op.warnings.map((x) => x.code)).not.toContain("system-curve-jump");
  });
});
