// A power reading that gives the pump an efficiency above 100 % is not judged against the grade's power and efficiency
// limits (it read "met": a shaft power far below the curve's passes the power limit); the verdict is on flow and head
// only, says why, and flips back to judged just below 100 %. Pure.
// Check values: the fixture curve H = 40 m − 1000 s²/m⁵ · Q at 2900 rpm (invented), water at 20 °C (ρ = 998.21 kg/m³,
// IAPWS from memory); hydraulic power at 0.012 m³/s and 28 m: 998.21 × 9.80665 × 0.012 × 28 = 3289.1 W (hand calculation).
import { describe, expect, test } from "vitest";
import { fluidAt } from "~/engine";
import { evaluateCheck, parseCheckFields, powerGradeSentences, powerGradeState } from "./index";
import { fieldsForHead, frozenFixture } from "~/test/fieldcheck-fixture";

const RHO20 = fluidAt({ kind: "water" }, 20).density;
const f = frozenFixture();
const HYDRAULIC_W = RHO20 * 9.80665 * 0.012 * 28;

/** On the curve at 2900 rpm (0.012 m³/s, 28 m), the motor's input `kW` at 80 % motor efficiency, grade 2B (sets power limits: ISO 9906, from memory). */
function check(kW: number) {
  const fields = fieldsForHead(28, RHO20, { flow: "0.012", rpm: "2900", gradeId: "2B", powerMode: "input", power: String(kW), motorEfficiency: "80" });
  const p = parseCheckFields(fields, { kind: "water" });
  if (!p.ok) throw new Error(JSON.stringify(p.errors));
  return evaluateCheck(f, p.readings, "2B");
}

describe("a power reading that makes the pump's efficiency exceed 100 %", () => {
  const edgeKW = HYDRAULIC_W / 0.8 / 1000; // shaft = hydraulic: the pump's efficiency exactly 100 %
  test("well above 100 % (input 0.5 kW, shaft 0.4 kW: 822 %): power and efficiency not judged, with the reason; the verdict on flow and head", () => {
    const r = check(0.5);
    expect(r.verdict).toBe("pass");
    expect(powerGradeState(r.powerGrade)).toBeNull();
    expect(r.powerGrade?.notJudged).toMatch(/^Power and efficiency were not judged against grade 2B: the pump's efficiency comes out at 822\.\d %, above 100 %.*the verdict is on flow and head only\.$/);
    expect(powerGradeSentences(r).join(" ")).not.toMatch(/— met/);
  });
  test("flips at 100 %: just above is not judged, just below is judged (and met: the curve's power is higher)", () => {
    const over = check(edgeKW * 0.999); // pump efficiency 100.1 %
    const under = check(edgeKW * 1.001); // 99.9 %
    expect(powerGradeState(over.powerGrade)).toBeNull();
    expect(over.powerGrade?.notJudged).toMatch(/100\.1 %, above 100 %/);
    expect(powerGradeState(under.powerGrade)).toBe("met");
    expect(under.powerGrade?.notJudged).toBeNull();
    expect([over.verdict, under.verdict]).toEqual(["pass", "pass"]);
  });
});
