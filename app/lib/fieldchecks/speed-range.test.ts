// A field check at a speed far from the curve's: the affinity laws translate the curve to the measured speed, which a
// test may use only within about 50–120 % of it (ISO 9906, from memory; SPEED_RANGE). Outside, no tolerance verdict,
// with the reason; inside, the verdict as before. Also the pump's own efficiency above 100 % is said. Pure.
// Check values: the fixture curve H = 40 m − 1000 s²/m⁵ · Q at 2900 rpm (invented), water at 20 °C
// (ρ = 998.21 kg/m³, IAPWS from memory); affinity laws Q ∝ N, H ∝ N² (common practice).
import { describe, expect, test } from "vitest";
import { fluidAt } from "~/engine";
import { evaluateCheck, parseCheckFields } from "./index";
import { SPEED_RANGE } from "./speed-range";
import { fieldsForHead, frozenFixture } from "~/test/fieldcheck-fixture";

const RHO20 = fluidAt({ kind: "water" }, 20).density;
const f = frozenFixture();

/** A reading on the curve translated to `rpm` (Q = 0.012 × r m³/s, H = (40 − 1000 × 0.012) × r² m): a pass wherever judged. */
function atSpeed(rpm: number, extra: Record<string, string> = {}) {
  const r = rpm / 2900;
  const fields = fieldsForHead(28 * r * r, RHO20, { flow: String(0.012 * r), rpm: String(rpm), gradeId: "2B", ...extra });
  const p = parseCheckFields(fields, { kind: "water" });
  if (!p.ok) throw new Error(JSON.stringify(p.errors));
  return evaluateCheck(f, p.readings, "2B");
}

describe("the measured speed's distance from the curve's", () => {
  test("flips at 50 % and 120 % of the curve's speed: a verdict inside, none outside, with the reason", () => {
    for (const [rpm, verdict] of [[1450, "pass"], [1449, "unknown"], [3480, "pass"], [3481, "unknown"]] as const) {
      const r = atSpeed(rpm);
      expect([rpm, r.verdict], r.warnings.join(" | ")).toEqual([rpm, verdict]);
      const said = r.warnings.find((w) => w.startsWith("No tolerance verdict: the measured speed"));
      if (verdict === "unknown") expect(said, String(rpm)).toMatch(/outside the 50 %–120 % within which the curve may be translated/);
      else expect(said, String(rpm)).toBeUndefined();
      // The page's sentence agrees with the verdict: never "within grade 2B" where no verdict is given.
      if (verdict === "unknown") expect(r.message, String(rpm)).toBe("Delivered point not judged against grade 2B: the measured speed is outside the range the curve may be translated to (see the warnings)");
      else expect(r.message, String(rpm)).toMatch(/^Delivered point is within grade 2B/);
    }
    expect(atSpeed(1449).verdictText).toBe("no tolerance verdict");
    expect(SPEED_RANGE).toEqual([0.5, 1.2]);
  });

  test("the pump's own efficiency above 100 % is said (hydraulic power over input × motor efficiency), and not below it", () => {
    // Hydraulic power at 0.012 m³/s and 28 m: 998.21 × 9.80665 × 0.012 × 28 = 3289 W (hand calculation).
    const over = atSpeed(2900, { powerMode: "input", power: "4", motorEfficiency: "80" }); // shaft 3.2 kW < 3.289 kW
    expect(over.power?.pump ?? 0).toBeGreaterThan(1);
    expect(over.warnings.join(" ")).toMatch(/The pump's efficiency comes out at 102\.\d %, above 100 %/);
    const under = atSpeed(2900, { powerMode: "input", power: "4.2", motorEfficiency: "80" }); // shaft 3.36 kW > 3.289 kW
    expect(under.power?.pump ?? 2).toBeLessThan(1);
    expect(under.warnings.join(" ")).not.toMatch(/pump's efficiency comes out/);
  });
});

describe("the measured speed beside the range's ends, in the hint and the chart's label", () => {
  test("1449.7 rpm (49.99 % of 2900 rpm): the hint and the label read 1449.7 rpm, as the warning, never 1450 rpm (50 %, inside)", () => {
    const r = atSpeed(1449.7);
    expect(r.warnings.join(" ")).toContain("the measured speed (1449.7 rpm) is 49.99 % of the curve's 2900 rpm");
    expect(r.hints).toContain("The measured speed differs from the selection's speed (1449.7 rpm against 2900 rpm): check the drive's set point and limits, the motor's poles and the nameplate.");
    expect(r.chart.measuredLabel).toBe("At the measured 1449.7 rpm");
  });
  test("1500.4 rpm, well inside: to the whole rpm, as before", () => {
    const r = atSpeed(1500.4);
    expect(r.hints.join(" ")).toContain("(1500 rpm against 2900 rpm)");
    expect(r.chart.measuredLabel).toBe("At the measured 1500 rpm");
  });
});
