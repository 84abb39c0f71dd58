// The tolerance cross's sentences at the arms' exact edges and where one arm cannot be read (cross.ts `crossSentences`):
// a reading exactly at the allowance is met (the allowance includes its edge; the engine's and cross.ts's 1e-12 allowance
// for rounding) and says so with the limit's number — never "met, … outside" — while a millionth past it is not met; and a
// grade met on one arm while the other is off the curve says the other cannot be read, not that its percentage is larger.
// Check values: ISO 9906:2012 grade 2B as in TOLERANCE_GRADES, from memory (flow ±8 %, head ±5 %); the fixture curves are
// invented straight lines (app/test/fieldcheck-fixture.ts), deviations worked by hand.
import { describe, expect, test } from "vitest";
import { fluidAt } from "~/engine";
import { fieldsForHead, frozenFixture, linearPoints } from "~/test/fieldcheck-fixture";
import { crossOf, crossSentences, evaluateCheck, parseCheckFields, type CheckResult } from "./index";

const RHO20 = fluidAt({ kind: "water" }, 20).density;
const fmt = { flow: (v: number) => `${(v * 1000).toFixed(3)} L/s`, head: (v: number) => `${v.toFixed(3)} m` };

function check(f: ReturnType<typeof frozenFixture>, head: number, flow: number): { r: CheckResult; head: string; flow: string; last: string } {
  const p = parseCheckFields(fieldsForHead(head, RHO20, { flow: String(flow) }), { kind: "water" });
  if (!p.ok) throw new Error(JSON.stringify(p.errors));
  const r = evaluateCheck(f, p.readings, "2B");
  const said = crossSentences(crossOf(r)!, fmt);
  return { r, head: said.find((s) => s.startsWith("Head arm"))!, flow: said.find((s) => s.startsWith("Flow arm"))!, last: said.at(-1)! };
}

describe("the head arm at its edges (H = 40 − 1000·Q: 28 m at 12 L/s; 2B head ±5 %)", () => {
  const f = frozenFixture();
  test("exactly +5 % and exactly −5 % are met, said at the limit with its number", () => {
    for (const [ratio, shown] of [[1.05, "\\+5 %"], [0.95, "−5 %"]] as const) {
      const s = check(f, 28 * ratio, 0.012);
      expect(s.r.verdict, String(ratio)).toBe("pass");
      // Was: "… is +5.000000 % (allowed −5 % to +5 %) — met, under 0.000001 points outside." (floating-point noise shown as a miss)
      expect(s.head, String(ratio)).toMatch(new RegExp(`is ${shown} \\(allowed −5 % to \\+5 %\\) — met, at the limit \\(the allowance includes its edge\\)\\.$`));
      expect(s.head).not.toMatch(/outside/);
    }
  });
  test("a millionth inside is met and said inside; a millionth outside is a fail and said outside", () => {
    const inside = check(f, 28 * (1.05 - 1e-6), 0.012);
    const outside = check(f, 28 * (1.05 + 1e-6), 0.012);
    expect([inside.r.verdict, outside.r.verdict]).toEqual(["pass", "fail"]);
    expect(inside.head).toMatch(/is \+4\.9999 % \(allowed −5 % to \+5 %\) — met, 0\.0001 points inside\.$/);
    expect(outside.head).toMatch(/is \+5\.0001 % \(allowed −5 % to \+5 %\) — not met, 0\.0001 points outside\.$/);
  });
});

describe("the flow arm at its edge (steep H = 40 − 3000·Q: 10 m at 10 L/s; 2B flow ±8 %)", () => {
  const f = frozenFixture({ points: linearPoints(40, 3000, 0.013) });
  test("exactly +8 % is met at the limit (the head arm, 31.6 % off here, is not); a millionth past it fails", () => {
    const at = check(f, 10, 0.0108); // curve flow at 10 m: 10 L/s; 10.8/10 − 1 = +8 %; curve head at 10.8 L/s 7.6 m, 10/7.6 − 1 = +31.6 %
    const past = check(f, 10, 0.01 * (1.08 + 1e-6));
    expect([at.r.verdict, past.r.verdict]).toEqual(["pass", "fail"]);
    expect(at.flow).toMatch(/is \+8 % \(allowed −8 % to \+8 %\) — met, at the limit \(the allowance includes its edge\)\.$/);
    expect(past.flow).toMatch(/is \+8\.0001 % \(allowed −8 % to \+8 %\) — not met, 0\.0001 points outside\.$/);
  });
});

describe("one arm met, the other off the curve", () => {
  const f = frozenFixture();
  test("head above shut-off at 0.5 L/s: met on the head arm; the flow arm cannot be read there (no 'larger percentage')", () => {
    const s = check(f, 41, 0.0005); // curve 39.5 m at 0.5 L/s: 41/39.5 − 1 = +3.8 % ≤ 5 %; no flow on the curve gives 41 m (shut-off 40 m)
    expect(s.r.verdict).toBe("pass");
    expect(s.flow).toMatch(/the curve gives no flow — not met \(off the curve\)\.$/);
    // Was: "Met on the head arm. The flow arm's larger percentage is not a contradiction: …"
    expect(s.last).toBe("Met on the head arm. The flow arm cannot be read here: the curve gives no flow above zero at the measured head, so the grade is judged on the head arm alone.");
  });
  test("past the curve's last flow (30 L/s, 10 m) at 30.5 L/s and 10 m: met on the flow arm; the head arm cannot be read there", () => {
    const s = check(f, 10, 0.0305); // curve flow at 10 m: 30 L/s; 30.5/30 − 1 = +1.7 % ≤ 8 %; no curve head past 30 L/s
    expect(s.r.verdict).toBe("pass");
    expect(s.head).toMatch(/the curve gives no head — not met \(off the curve\)\.$/);
    expect(s.last).toBe("Met on the flow arm. The head arm cannot be read here: the published curve gives no head at the measured flow, so the grade is judged on the flow arm alone.");
  });
});

describe("no flow through the meter (0 L/s) at a head the curve reaches (20 m at 20 L/s)", () => {
  test("the flow arm names the curve's flow at the measured head, never NaN: 0 against 20 L/s is −100 %", () => {
    const s = check(frozenFixture(), 20, 0); // H = 40 − 1000·Q: 20 m at 0.02 m³/s; curve head at 0 L/s 40 m, 20/40 − 1 = −50 %
    expect(s.r.verdict).toBe("fail");
    // Was: "… the curve gives NaN L/s; …" (the curve's flow worked back from the deviation, 0 / (1 − 1)).
    expect(s.flow).toBe("Flow arm: at the measured 20.000 m the curve gives 20.000 L/s; the measured 0.000 L/s is −100.0 % (allowed −8 % to +8 %) — not met, 92.0 points outside.");
  });
});
