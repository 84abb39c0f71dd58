// The verdict's rule and numbers where a check is shown without its page (cross.ts `crossSummary`): the engineer's e-mail
// (`deliveredSentence`), the selection's list of checks and the field page's history. Was: "Judged against grade 2B: outside
// tolerance." with the delivered point alone — no allowance, no deviation, nothing to check the verdict against.
// Check values: ISO 9906:2012 grades as in TOLERANCE_GRADES, from memory (2B flow ±8 %, head ±5 %; 1U flow 0/+10 %, head
// 0/+6 %); the fixture curves are invented straight lines (app/test/fieldcheck-fixture.ts), deviations worked by hand.
import { describe, expect, test } from "vitest";
import { fluidAt } from "~/engine";
import { inSI } from "~/engine/quantityText";
import { fieldsForHead, frozenFixture, linearPoints } from "~/test/fieldcheck-fixture";
import { crossSummary, deliveredSentence, evaluateCheck, parseCheckFields, type CheckResult } from "./index";

const RHO20 = fluidAt({ kind: "water" }, 20).density;

function check(head: number, flow: number | null, grade = "2B", points?: ReturnType<typeof linearPoints>, extra: Record<string, string> = {}): CheckResult {
  const p = parseCheckFields(fieldsForHead(head, RHO20, { flow: flow === null ? "" : String(flow), ...extra }), { kind: "water" });
  if (!p.ok) throw new Error(JSON.stringify(p.errors));
  return evaluateCheck(frozenFixture(points ? { points } : {}), p.readings, grade);
}
const mail = (r: CheckResult) => inSI(deliveredSentence(r));

describe("the head arm either side of 2B's +5 % (H = 40 − 1000·Q: 28 m at 12 L/s; flow arm +13.2 % / +13.2 %)", () => {
  test("a millionth inside: within tolerance, +4.9999 % of the curve's 28.0 m, met; a millionth past: outside, +5.0001 %, not met", () => {
    const inside = check(28 * (1.05 - 1e-6), 0.012);
    const outside = check(28 * (1.05 + 1e-6), 0.012);
    expect([inside.verdict, outside.verdict]).toEqual(["pass", "fail"]);
    expect(mail(inside)).toContain("Judged against grade 2B: within tolerance. Tolerance cross of grade 2B, as read (either arm meets it): head +4.9999 % of the curve's 28.0 m at the measured flow (allowed −5 % to +5 %), met; flow +13.2 % of the curve's");
    // Was: "… Judged against grade 2B: outside tolerance. Power and efficiency …" (no numbers for flow and head).
    expect(mail(outside)).toContain("Judged against grade 2B: outside tolerance. Tolerance cross of grade 2B, as read (either arm meets it): head +5.0001 % of the curve's 28.0 m at the measured flow (allowed −5 % to +5 %), not met; flow +13.2 % of the curve's");
    expect(mail(outside)).toMatch(/at the measured head \(allowed −8 % to \+8 %\), not met\. /);
  });
  test("exactly at +5 %: met, at the limit, with the limit's own number", () => {
    expect(mail(check(28 * 1.05, 0.012))).toContain("head +5 % of the curve's 28.0 m at the measured flow (allowed −5 % to +5 %), met, at the limit;");
  });
});

describe("the flow arm either side of 2B's −8 % (H = 40 − 3000·Q: 10 m at 10 L/s)", () => {
  test("9.2 L/s ± a millionth at 10 m: −7.9999 % met (pass), −8.0001 % not met (fail)", () => {
    const pts = linearPoints(40, 3000, 0.013);
    const inside = check(10, 0.01 * (0.92 + 1e-6), "2B", pts);
    const outside = check(10, 0.01 * (0.92 - 1e-6), "2B", pts);
    expect([inside.verdict, outside.verdict]).toEqual(["pass", "fail"]);
    expect(crossSummary(inside)).toMatch(/; flow −7\.9999 % of the curve's ⟦flow\|0\.01\d*⟧ at the measured head \(allowed −8 % to \+8 %\), met\.$/);
    expect(crossSummary(outside)).toMatch(/; flow −8\.0001 % of the curve's ⟦flow\|0\.01\d*⟧ at the measured head \(allowed −8 % to \+8 %\), not met\.$/);
  });
});

describe("grade 1U, nothing allowed below (head 0/+6 %)", () => {
  test("a millionth below the curve's 28 m fails and says −0.0001 % against 0 %; on the curve it is met at the limit", () => {
    const below = check(28 * (1 - 1e-6), 0.012, "1U");
    const on = check(28, 0.012, "1U");
    expect([on.verdict, below.verdict]).toEqual(["pass", "fail"]);
    expect(crossSummary(below)).toContain("head −0.0001 % of the curve's ⟦head|28⟧ at the measured flow (allowed 0 % to +6 %), not met;");
    expect(crossSummary(on)).toContain("(allowed 0 % to +6 %), met, at the limit;");
  });
});

describe("where the cross says nothing or one arm cannot be read", () => {
  test("no flow meter: no summary (no verdict rests on the cross), and the e-mail's sentence is as before", () => {
    const r = check(28, null);
    expect(r.verdict).toBe("unknown");
    expect(crossSummary(r)).toBeNull();
    expect(mail(r)).not.toContain("Tolerance cross");
  });
  test("a measured speed outside the affinity range: no tolerance verdict, no summary", () => {
    const r = check(28 * 0.16, 0.012 * 0.4, "2B", undefined, { rpm: "1160" }); // 40 % of 2900 rpm
    expect(r.verdict).toBe("unknown");
    expect(crossSummary(r)).toBeNull();
  });
  test("above shut-off at 0.5 L/s: the flow arm is not read, said so", () => {
    const r = check(41, 0.0005); // curve 39.5 m at 0.5 L/s: +3.8 %; no flow on the curve gives 41 m
    expect(r.verdict).toBe("pass");
    expect(crossSummary(r)).toMatch(/; flow arm not read \(the curve gives no flow at the measured head\)\.$/);
  });
});
