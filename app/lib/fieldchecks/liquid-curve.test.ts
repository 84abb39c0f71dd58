// A field check on a viscous custom liquid compares with the curve the selection was judged on: the water curve
// corrected per ANSI/HI 9.6.7 (from memory; app/engine/viscous.ts), and draws that curve as the one selected. Above B = 40 (outside the method) there is no curve
// to hold the pump to: no tolerance verdict, with the reason. Pure. Check values: the fixture curve (invented,
// H = 40 m − 1000 s²/m⁵·Q, 70 % at 0.015 m³/s, 2900 rpm, app/test/fieldcheck-fixture.ts); B ≈ 0.61·√ν(cSt) for it (hand
// calculation from B = 26.6·ν^0.5·H^0.0625/(Q^0.375·N^0.25) with Q 237.8 gpm, H 82.0 ft, N 2900 rpm): 170 cSt → B ≈ 8,
// 5 000 cSt → B ≈ 43.
import { describe, expect, test } from "vitest";
import { correctCurveForViscosity, createPumpCurve, headAt, viscosityParameterB } from "~/engine";
import { evaluateCheck, parseCheckFields } from "./index";
import { fieldsForHead, frozenFixture, linearPoints } from "~/test/fieldcheck-fixture";
import { toPumpPoints } from "../projects/hydraulics";

const RHO = 900; // kg/m³, the invented oil's
const oil = (cst: number) => ({ kind: "custom" as const, name: "Test oil", density: RHO, dynamicViscosity: cst * 1e-6 * RHO, vaporPressure: 100 });
const water = createPumpCurve({ points: toPumpPoints(linearPoints()), speed: 2900 });

function check(cst: number, head: number) {
  const f = frozenFixture({ input: { fluid: oil(cst) } });
  const p = parseCheckFields(fieldsForHead(head, RHO, { flow: "0.012", gradeId: "2B" }), { kind: "custom" });
  if (!p.ok) throw new Error(JSON.stringify(p.errors));
  return evaluateCheck(f, p.readings, "2B");
}

describe("a field check on a viscous liquid", () => {
  test("readings on the corrected curve pass, and say which curve they were held to; the water curve would fail them", () => {
    const b = viscosityParameterB({ kinematicViscosity: 170e-6, bepFlow: water.bep!.flow, bepHead: water.bep!.head, speed: 2900 }).b;
    expect(b).toBeGreaterThan(6); // well inside the method (hand estimate ≈ 8)
    expect(b).toBeLessThan(10);
    const corrected = correctCurveForViscosity(water, { kinematicViscosity: 170e-6, speed: 2900 }).curve;
    const h = headAt(corrected, 0.012)!;
    expect(h / headAt(water, 0.012)!).toBeLessThan(0.95); // the oil costs more than grade 2B's 5 % of head
    const r = check(170, h);
    expect(r.verdict).toBe("pass");
    expect(r.warnings.join(" ")).toMatch(/Compared with the curve corrected for viscosity per ANSI\/HI 9\.6\.7: B = \d\.\d+, C_Q 0\.\d{3}, C_H at BEP 0\.\d{3}, C_η 0\.\d{3} \(at 2900 rpm, on Test oil\)/);
    // The same pump on water readings: on the water curve, still a pass (nothing to correct there).
    const f = frozenFixture();
    const p = parseCheckFields(fieldsForHead(headAt(water, 0.012)!, 998.2, { flow: "0.012", gradeId: "2B" }), { kind: "water" });
    if (!p.ok) throw new Error("fields");
    expect(evaluateCheck(f, p.readings, "2B").verdict).toBe("pass");
  });

  test("the chart's curve as selected is the corrected one too, so its point on the system curve is the report's (it was the water curve)", () => {
    const corrected = correctCurveForViscosity(water, { kinematicViscosity: 170e-6, speed: 2900 }).curve;
    const r = check(170, headAt(corrected, 0.012)!);
    const at = (pts: { flow: number; y: number }[], q: number) => {
      const i = pts.findIndex((p) => p.flow >= q);
      const a = pts[i - 1], b = pts[i];
      return a.y + ((b.y - a.y) * (q - a.flow)) / (b.flow - a.flow);
    };
    expect(at(r.chart.selected, 0.012)).toBeCloseTo(headAt(corrected, 0.012)!, 1); // within 0.05 m (41 samples, linear between)
    expect(Math.abs(at(r.chart.selected, 0.012) - headAt(water, 0.012)!)).toBeGreaterThan(1); // the water curve is over 5 % higher there
    expect(r.chart.selectedLabel).toBe("As selected (2900 rpm, corrected for Test oil)");
    // On water nothing is corrected: the label as before.
    const p = parseCheckFields(fieldsForHead(headAt(water, 0.012)!, 998.2, { flow: "0.012", gradeId: "2B" }), { kind: "water" });
    if (!p.ok) throw new Error("fields");
    expect(evaluateCheck(frozenFixture(), p.readings, "2B").chart.selectedLabel).toBe("As selected (2900 rpm)");
  });

  test("above B = 40 there is no curve to hold the pump to: no tolerance verdict, with the reason", () => {
    const r = check(5000, 20);
    expect(r.verdict).toBe("unknown");
    expect(r.warnings.join(" ")).toMatch(/No tolerance verdict: the ANSI\/HI 9\.6\.7 parameter B for Test oil is 4\d\.\d, above 40, outside the method's range/);
    expect(r.message).toBe("Delivered point not judged against grade 2B: no curve for this liquid (see the warnings)");
    // Just inside the method (B ≤ 40) a verdict is given again.
    expect(check(3500, 20).verdict).not.toBe("unknown");
  });
});
