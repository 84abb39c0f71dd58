// The verdict's sentence for a reading that misses the tolerance cross names both arms' numbers — the measured value, the
// curve's value it is taken of and the arm's allowance — not the head arm's alone: it read "Delivered point is outside every
// grade checked (head +7.1 % from curve)" whatever the flow arm said. Check values: ISO 9906:2012 grade 2B as in
// TOLERANCE_GRADES, from memory (flow ±8 %, head ±5 %), 1U (flow 0 % to +10 %, head 0 % to +6 %); the fixture curve is
// invented (H = 40 − 1000·Q): at 30 m and 12 L/s the head arm reads 30/28 − 1 = +7.1 % and the flow arm, the curve's
// 10 L/s at 30 m, 12/10 − 1 = +20 % (hand algebra).
import { describe, expect, test } from "vitest";
import { fluidAt } from "~/engine";
import { inSI } from "~/engine/quantityText";
import { fieldsForHead, frozenFixture } from "~/test/fieldcheck-fixture";
import { evaluateCheck, parseCheckFields } from "./index";

const RHO20 = fluidAt({ kind: "water" }, 20).density;
const f = frozenFixture();

function check(head: number, flow: number, grade = "2B") {
  const p = parseCheckFields(fieldsForHead(head, RHO20, { flow: String(flow) }), { kind: "water" });
  if (!p.ok) throw new Error(JSON.stringify(p.errors));
  return evaluateCheck(f, p.readings, grade);
}

describe("a fail on the cross: each arm with its numbers", () => {
  test("2B at 30 m, 12 L/s: the head arm and the flow arm, each measured, curve and allowance", () => {
    const r = check(30, 0.012);
    expect(r.verdict).toBe("fail");
    const m = inSI(r.message);
    expect(m).toContain("head: the measured 30.0 m is +7.1 % of the curve's 28.0 m at the measured flow (allowed −5 % to +5 %)");
    // Was absent: the flow arm's numbers.
    expect(m).toContain("flow: the measured 43.2 m³/h is +20.0 % of the curve's 36.0 m³/h at the measured head (allowed −8 % to +8 %)");
  });
  test("the flip at the flow arm's edge: 1U, the flow +10 % × (1 ∓ 1e-6) of the curve's at the measured head", () => {
    // At 25 m the curve's flow is 15 L/s: 16.5 L/s × (1 − 1e-6) meets the flow arm's +10 %, × (1 + 1e-6) does not; the head
    // arm there, 25/(40 − 16.5) − 1 = +6.4 %, misses 1U's +6 % either way.
    const met = check(25, 0.0165 * (1 - 1e-6), "1U");
    const missed = check(25, 0.0165 * (1 + 1e-6), "1U");
    expect([met.verdict, missed.verdict]).toEqual(["pass", "fail"]);
    expect(inSI(missed.message)).toMatch(/flow: the measured 59\.4\d* m³\/h is \+10\.0001 % of the curve's 54\.0 m³\/h at the measured head \(allowed 0 % to \+10 %\)/);
  });
});
