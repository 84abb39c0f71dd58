// A field check's numbers beside the verdict they decide read apart in the reader's units (SI and US):
// - the tolerance cross's sentences: the measured value and the curve's on an arm that allows 0 % on one side (grades 1U
//   and 2U) missed by less than the unit's digits read "the curve gives 28.0 m; the measured 28.0 m is −0.01 % … not met";
// - the speed outside the range the curve may be translated in: a drive's 1449.7 rpm read "1450 rpm is 49.99 % of the
//   curve's 2900 rpm, outside the 50 %–120 %" (1450 rpm is 50 % of 2900 rpm, inside).
// Check values: ISO 9906:2012 grade 1U (flow 0/+10 %, head 0/+6 %) as in TOLERANCE_GRADES and its 50–120 % speed range
// (SPEED_RANGE), from memory; the fixture curve is an invented straight line, H = 40 − 1000·Q (28 m at 12 L/s, 2900 rpm,
// app/test/fieldcheck-fixture.ts); the deviations worked by hand.
import { describe, expect, test } from "vitest";
import { fluidAt } from "~/engine";
import { fmtQExact, renderUnits, SI_UNITS, US_UNITS } from "~/lib/shared/units";
import { fieldsForHead, frozenFixture } from "~/test/fieldcheck-fixture";
import { crossOf, crossSentences, evaluateCheck, parseCheckFields } from "./index";

const RHO20 = fluidAt({ kind: "water" }, 20).density;
const CHOICES = { SI: SI_UNITS, US: US_UNITS };
const NUM = String.raw`(-?\d+(?:\.\d+)?)`;

function evaluate(head: number, extra: Record<string, string>, grade: string) {
  const p = parseCheckFields(fieldsForHead(head, RHO20, { gradeId: grade, ...extra }), { kind: "water" });
  if (!p.ok) throw new Error(JSON.stringify(p.errors));
  return evaluateCheck(frozenFixture(), p.readings, grade);
}

describe("grade 1U's arms, missed by 0.01 % on the side that allows 0 %", () => {
  // Measured 12 L/s at 28 × 0.9999 m: the curve gives 28 m there (head arm −0.01 %, 0 % allowed below: not met) and
  // 28 × 0.9999 m at (40 − 27.9972)/1000 = 12.0028 L/s (flow arm −0.023 %: not met).
  const r = evaluate(28 * 0.9999, { flow: "0.012" }, "1U");
  test("the measured value reads below the curve's on each arm, in SI and US units", () => {
    expect(r.verdict).toBe("fail");
    for (const [name, units] of Object.entries(CHOICES)) {
      // As the field check's page formats them (routes/field.checks.$id.tsx).
      const fmt = {
        flow: (v: number, against: readonly number[] = [], limit?: boolean) => fmtQExact(units, "flow", v, against, limit),
        head: (v: number, against: readonly number[] = [], limit?: boolean) => fmtQExact(units, "head", v, against, limit),
      };
      const said = crossSentences(crossOf(r)!, fmt);
      for (const arm of ["Head", "Flow"]) {
        const s = said.find((x) => x.startsWith(`${arm} arm`))!;
        const m = s.match(new RegExp(`the curve gives ${NUM} \\S+; the measured ${NUM} \\S+ is −0\\.0\\d+ % \\(allowed 0 % to \\+\\d+ %\\) — not met`));
        expect(m, `${name}: ${s}`).not.toBeNull();
        expect(Number(m![2]), `${name}: ${s}`).toBeLessThan(Number(m![1]));
      }
    }
  });
});

describe("the speed outside the range the curve may be translated in", () => {
  test("1449.7 rpm of the curve's 2900 rpm reads below 1450 rpm (50 % of it), beside its 49.99 %", () => {
    const r = evaluate(28, { flow: "0.012", rpm: "1449.7" }, "2B");
    expect(r.verdict).toBe("unknown");
    const w = r.warnings.find((x) => x.startsWith("No tolerance verdict: the measured speed"))!;
    for (const [name, units] of Object.entries(CHOICES)) {
      const m = renderUnits(w, units).match(new RegExp(`the measured speed \\(${NUM} rpm\\) is 49\\.99 % of the curve's ${NUM} rpm, outside the 50 %–120 %`));
      expect(m, `${name}: ${w}`).not.toBeNull();
      expect(Number(m![1]) / Number(m![2]), `${name}: ${w}`).toBeLessThan(0.5);
    }
  });
});
