// A field check's grade judged on power and efficiency too (power-grade.ts, engine gradePower.ts), through the form and
// the evaluation as the app runs them. Check values: ISO 9906:2012 grades as in TOLERANCE_GRADES, from memory (1B: power
// +4 %, efficiency −3 %; 1E: power +4 %, efficiency 0), the efficiency allowance read as a fraction of the curve's
// (our reading, gradePower.ts). The fixture curve is invented: H = 40 − 1000·Q (m, m³/s) at 2900 rpm, efficiency
// 0.4 + 0.3·sin(π·i/6) at its knots, so 70 % at the knot Q = 0.015 m³/s, H = 25 m (app/test/fieldcheck-fixture.ts).
// Hand calculation: curve shaft power there P_c = ρ·g₀·Q·H/η; water at 20 °C through the engine (IAPWS-IF97).
import { describe, expect, test } from "vitest";
import { fluidAt, G0 } from "~/engine";
import { fieldsForHead, frozenFixture, POWER_KNOT, powerCheckFields } from "~/test/fieldcheck-fixture";
import { evaluateCheck, parseCheckFields, powerGradeSentences, powerGradeSummary } from "./index";

const RHO20 = fluidAt({ kind: "water" }, 20).density;
const f = frozenFixture();
const { flow: Q, head: HC } = POWER_KNOT;
const PC = (RHO20 * G0 * Q * HC) / POWER_KNOT.efficiency; // W, ≈ 5243 W

/** A check at Q = 0.015 m³/s and `head` with a shaft power of `shaft` W (input power = shaft / 90 %), judged against `grade`. */
function check(grade: string, head: number, shaft: number | null, extra: Record<string, string> = {}) {
  const p = parseCheckFields(powerCheckFields(head, shaft, RHO20, { gradeId: grade, ...extra }), { kind: "water" });
  if (!p.ok) throw new Error(JSON.stringify(p.errors));
  return evaluateCheck(f, p.readings, grade);
}

describe("a grade is met only when flow/head, power and efficiency all meet it", () => {
  test("head 2.5 % above the curve with power +12 %: 1B met on flow and head, missed on power — fail, and the verdict says why", () => {
    const flowHeadOnly = check("1B", 1.025 * HC, null);
    expect(flowHeadOnly.verdict).toBe("pass"); // control: the flow/head cross alone
    const r = check("1B", 1.025 * HC, 1.12 * PC);
    expect(r.engine.grades[0].cross!.pass).toBe(true);
    expect(r.verdict).toBe("fail");
    expect(r.verdictText).toBe("outside tolerance");
    // Efficiency 1.025/1.12 − 1 = −8.5 % (hand calculation), past 1B's −3 % too.
    expect(r.message).toBe("Delivered point meets grade 1B on flow and head but misses its power limit (+12.0 % against +4 % allowed) and efficiency limit (−8.5 % against −3 % allowed)");
    const said = powerGradeSentences(r);
    expect(said[0]).toMatch(/^Grade 1B also limits the shaft power to at most 4 % above the curve's at the measured flow, and the pump's efficiency to at least the curve's less 3 % of it \(a fraction of the curve's efficiency, not percentage points\) \(ISO 9906:2012 from memory/);
    expect(said[1]).toMatch(/^Power: shaft ⟦power\|[\d.]+\|[\d.]+⟧ \(input ⟦power\|[\d.]+⟧ × motor efficiency 90 %\) vs curve ⟦power\|[\d.]+\|limit:[\d.]+⟧: \+12\.0 % > \+4 % allowed — not met\.$/);
    expect(said[2]).toBe("Efficiency: pump 64.1 % (ρ·g·Q·H / shaft power) vs curve 70.0 %: −8.5 % of it < −3 % allowed — not met."); // 0.7 × 1.025/1.12 = 64.06 %
    expect(powerGradeSummary(r)).toBe("Against grade 1B's power and efficiency limits: shaft power +12.0 % (+4 % allowed, not met), pump efficiency −8.5 % (−3 % allowed, not met); judged as read, no power reading accuracy was given.");
  });

  test("the power threshold flips the verdict: +3.9 % met, +4.1 % not (head 2 % high keeps the efficiency within −3 %)", () => {
    const under = check("1B", 1.02 * HC, 1.039 * PC);
    const over = check("1B", 1.02 * HC, 1.041 * PC);
    expect([under.verdict, over.verdict]).toEqual(["pass", "fail"]);
    expect(under.powerGrade!.check!.efficiency!.pass).toBe(true); // 1.02/1.041 − 1 = −2.0 %
    expect(over.powerGrade!.check!.efficiency!.pass).toBe(true);
    expect(powerGradeSentences(under)[1]).toMatch(/: \+3\.9 % ≤ \+4 % allowed — met\.$/);
    expect(powerGradeSentences(over)[1]).toMatch(/: \+4\.1 % > \+4 % allowed — not met\.$/);
    expect(under.message).toBe("Delivered point is within grade 1B of the curve, power and efficiency included");
  });

  test("efficiency 2 % below the curve's (power +2.04 %): 1B allows 3 % and is met, 1E allows none and is not", () => {
    const b = check("1B", HC, PC / 0.98);
    const e = check("1E", HC, PC / 0.98);
    expect([b.verdict, e.verdict]).toEqual(["pass", "fail"]);
    expect(powerGradeSentences(b)[2]).toBe("Efficiency: pump 68.6 % (ρ·g·Q·H / shaft power) vs curve 70.0 %: −2.0 % of it ≥ −3 % allowed — met.");
    expect(powerGradeSentences(e)[2]).toBe("Efficiency: pump 68.6 % (ρ·g·Q·H / shaft power) vs curve 70.0 %: −2.0 % of it < 0 % allowed — not met.");
    expect(e.message).toBe("Delivered point meets grade 1B on flow and head but misses its efficiency limit (−2.0 % against 0 % allowed)".replace("1B", "1E"));
  });

  test("no power recorded: the flow/head verdict as before, and the check says power and efficiency were not judged", () => {
    for (const head of [HC, 1.02 * HC, 1.1 * HC]) {
      const r = check("1B", head, null);
      expect(r.verdict).toBe(head === 1.1 * HC ? "fail" : "pass"); // head +10 % is past 1B's +3 %
      expect(r.powerGrade).toEqual({ notJudged: "Power and efficiency were not judged against grade 1B: no power was recorded, so the verdict is on flow and head only.", basis: null, check: null });
      expect(powerGradeSentences(r)).toEqual([r.powerGrade!.notJudged]);
    }
    expect(check("1B", HC, null).message).toBe("Delivered point is within grade 1B of the curve on flow and head; power and efficiency not judged (no shaft power measured)");
  });

  test("input power without the motor's efficiency is not compared with the curve's shaft power: not judged, and why", () => {
    const p = parseCheckFields(fieldsForHead(HC, RHO20, { flow: String(Q), powerMode: "input", power: String((1.5 * PC) / 1000) }), { kind: "water" });
    if (!p.ok) throw new Error(JSON.stringify(p.errors));
    const r = evaluateCheck(f, p.readings, "1B");
    expect(r.verdict).toBe("pass"); // 1.5 × the curve's power as input: not shaft power, so not judged
    expect(r.powerGrade!.notJudged).toMatch(/^Power and efficiency were not judged against grade 1B: the motor's input power was recorded without the motor's efficiency, and the curve gives the pump's shaft power/);
  });

  test("no flow meter: no tolerance verdict, and power is not judged either", () => {
    const p = parseCheckFields(fieldsForHead(HC, RHO20, { powerMode: "input", power: String(PC / POWER_KNOT.motorEfficiency / 1000), motorEfficiency: "90" }), { kind: "water" });
    if (!p.ok) throw new Error(JSON.stringify(p.errors));
    const r = evaluateCheck(f, p.readings, "1B");
    expect(r.verdict).toBe("unknown");
    expect(r.powerGrade!.notJudged).toBe("Power and efficiency were not judged against grade 1B: there is no tolerance verdict (the notes on the working say why).");
  });
});
