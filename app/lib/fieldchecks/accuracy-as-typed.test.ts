// An instrument's accuracy the contractor typed — the flow meter's and the power reading's, in % of the reading — reads back
// in the verdict's words as typed ("±7 %"), the same on every surface, never padded to a decimal ("±7.0 %") nor rounded to one
// ("0.25" as "±0.3 %"): `pctAsTyped` (shared/format.ts, over `numberAsTyped`). Check values: ISO 9906:2012 grade 2B as in
// TOLERANCE_GRADES, from memory (flow ±8 %, head ±5 %); the fixture curve is invented (H = 40 − 1000·Q, 28 m at 12 L/s, to
// 0.03 m³/s at 10 m). Hand algebra: at 29.6 m and 12 L/s the head arm reads +5.7 % (missed) and the flow arm +15.4 % (the
// curve's 10.4 L/s at 29.6 m; missed); within ±7 % the flow 11.16 L/s has the curve's 28.84 m, +2.6 %: met (marginal).
import { describe, expect, test } from "vitest";
import { fluidAt, G0 } from "~/engine";
import { inSI } from "~/engine/quantityText";
import { fieldsForHead, frozenFixture, POWER_KNOT, powerCheckFields } from "~/test/fieldcheck-fixture";
import { pctAsTyped } from "~/lib/shared/format";
import { evaluateCheck, parseCheckFields, powerGradeSentences, powerGradeSummary, verdictNote } from "./index";

const RHO20 = fluidAt({ kind: "water" }, 20).density;
const f = frozenFixture();

function check(fields: Record<string, string>, grade = "2B") {
  const p = parseCheckFields(fields, { kind: "water" });
  if (!p.ok) throw new Error(JSON.stringify(p.errors));
  return evaluateCheck(f, p.readings, grade);
}

describe("pctAsTyped", () => {
  test("a fraction entered as a per cent reads back as typed (common practice: what was typed is what is shown)", () => {
    // 7/100 × 100 = 7.000000000000001 and 0.7/100 = 0.006999999999999999 in doubles: neither shows its noise.
    expect([0.07, 0.7 / 100, 0.25 / 100, 0, 0.5, 7.123456789 / 100, 1.1 / 100].map(pctAsTyped)).toEqual(["7 %", "0.7 %", "0.25 %", "0 %", "50 %", "7.123456789 %", "1.1 %"]);
  });
});

describe("the verdict's words give an accuracy as typed", () => {
  test("a marginal within the flow meter's ±7: 'flow ± 7 %' in the message and the note", () => {
    const r = check(fieldsForHead(29.6, RHO20, { flow: "0.012", flowAccuracy: "7" }));
    expect(r.verdict).toBe("marginal");
    expect(r.message).toContain("(flow ± 7 %, head as read"); // was "flow ± 7.0 %"
    expect(r.message).not.toContain("7.0 %");
    expect(r.warnings.join(" ")).not.toContain("7.0 %");
  });
  test("the meter wider than the grade's flow arm: 'flow ±12 % against ±8 %'", () => {
    const r = check(fieldsForHead(29.6, RHO20, { flow: "0.012", flowAccuracy: "12" }));
    expect(r.verdict).toBe("unknown");
    expect(r.message).toContain("(flow ±12 % against ±8 %)"); // was "±12.0 %"
    expect(inSI(verdictNote(r) ?? "")).toContain("in flow the meter's ±12 % against grade 2B's ±8 %");
  });
  test("beyond the curve's end, the flow arm from the lowest flow within the meter's ±7 %", () => {
    const r = check(fieldsForHead(10, RHO20, { flow: String(0.03 * 1.05), flowAccuracy: "7" }));
    expect(r.warnings.map(inSI).join(" ")).toContain("from the lowest flow within the meter's ±7 %)"); // was "±7.0 %"
  });
  test("a power reading typed ±0.25: every power sentence says ±0.25 %", () => {
    const PC = (RHO20 * G0 * POWER_KNOT.flow * POWER_KNOT.head) / POWER_KNOT.efficiency;
    const r = check(powerCheckFields(POWER_KNOT.head, 1.0535 * PC, RHO20, { powerAccuracy: "0.25" }));
    // 2B: efficiency 1/1.0535 − 1 = −5.08 % misses −5 % as read; at the reading × (1 − 0.25 %), 1/(1.0535 × 0.9975) − 1 =
    // −4.84 %: met (hand algebra); the power, +5.35 %, is met as read.
    expect(r.verdict).toBe("marginal");
    const words = [...powerGradeSentences(r), powerGradeSummary(r), r.message].join(" ");
    expect(words).toContain("±0.25 %");
    expect(words).not.toMatch(/±0\.3 %|±0\.250 %/);
  });
});
