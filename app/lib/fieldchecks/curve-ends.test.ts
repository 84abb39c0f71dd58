// A measured flow beyond the curve's last published point or below its first (curve-ends.ts): the curve states nothing
// there, so the check is judged only where the tolerance cross's flow arm still reaches the published curve — and says so —
// and otherwise gives no tolerance verdict with the measured flow and the curve's end. Was: a plain "fail" ("Delivered point
// is outside every grade checked") wherever the flow lay past the curve, with no word of the curve's end.
// Check values: ISO 9906:2012 grade 2B as in TOLERANCE_GRADES, from memory (flow ±8 %, head ±5 %), 1U (flow 0 %/+10 %); the
// fixture curve is invented (app/test/fieldcheck-fixture.ts: H = 40 − 1000·Q from 0 to 0.03 m³/s, 10 m at its end, so
// 108 m³/h), deviations and reaches worked by hand: the flow arm reaches back to Q / 1.08 (2B, beyond the end) or up to
// Q / 0.92 (2B, below the first point); its edge is where the arm's reach meets the curve's end.
import { describe, expect, test } from "vitest";
import { fluidAt } from "~/engine";
import { inSI } from "~/engine/quantityText";
import { fieldsForHead, frozenFixture, linearPoints } from "~/test/fieldcheck-fixture";
import { deliveredSentence, evaluateCheck, parseCheckFields, type CheckResult } from "./index";

const RHO20 = fluidAt({ kind: "water" }, 20).density;
const END = 0.03; // m³/s, the fixture curve's last point (10 m)

function check(head: number, flow: number, opts: { grade?: string; points?: ReturnType<typeof linearPoints>; extra?: Record<string, string> } = {}): CheckResult {
  const p = parseCheckFields(fieldsForHead(head, RHO20, { flow: String(flow), ...opts.extra }), { kind: "water" });
  if (!p.ok) throw new Error(JSON.stringify(p.errors));
  return evaluateCheck(frozenFixture(opts.points ? { points: opts.points } : {}), p.readings, opts.grade ?? "2B");
}
const noted = (r: CheckResult) => r.warnings.filter((w) => /lies (beyond the curve's end|below the curve's first point)/.test(w)).map(inSI);

describe("beyond the curve's last point (0.03 m³/s at 10 m)", () => {
  test("just inside and exactly at the end: judged on the curve as before, nothing said of its end", () => {
    for (const q of [END * (1 - 1e-6), END]) {
      const r = check(40 - 1000 * q, q);
      expect(r.verdict, String(q)).toBe("pass");
      expect(noted(r), String(q)).toEqual([]);
    }
  });

  test("just beyond, the cross reaching back and met there: a pass judged on the published part, and said", () => {
    const r = check(10, END * (1 + 1e-6)); // the curve's flow at 10 m is its end: +0.0001 %, inside 2B's +8 %
    expect(r.verdict).toBe("pass");
    expect(r.message).toMatch(/within grade 2B .* — judged on the published part of the curve only/);
    const [note] = noted(r);
    expect(note).toMatch(/^Judged on the published part of the curve: the measured flow 108\.0001\d* m³\/h lies beyond the curve's end at 108 m³\/h, so the head arm of the tolerance cross cannot be read there; grade 2B's flow arm \(\+8 %\) reaches back to 100 m³\/h, and only its part from 100 m³\/h to the curve's end at 108 m³\/h is read against the published curve — the rest of the arm lies where the curve states nothing\.$/);
    expect(inSI(deliveredSentence(r))).toContain("Judged on the published part of the curve: the measured flow 108.0001 m³/h");
  });

  test("the flip where the flow arm stops reaching the curve: Q = 0.03 × 1.08 ∓ a millionth, at the end's 10 m", () => {
    const inside = check(10, END * 1.08 * (1 - 1e-6)); // reaches back to 0.03 × (1 − 1e-6): flow arm +7.9999 %, met
    const beyond = check(10, END * 1.08 * (1 + 1e-6)); // reaches back only to 0.03 × (1 + 1e-6), past the end
    // Was: "pass" and "fail" (flow arm +8.0001 %, not met, read against a curve that stops short of the arm).
    expect([inside.verdict, beyond.verdict]).toEqual(["pass", "unknown"]);
    expect(inside.message).toContain("judged on the published part of the curve only");
    expect(beyond.message).toBe("Delivered point not judged against grade 2B: the measured flow is outside the flows the curve is published for, and the tolerance cross does not reach them (see the warnings)");
    expect(noted(beyond)[0]).toMatch(/^No tolerance verdict: the measured flow 117 m³\/h lies beyond the curve's end at 108 m³\/h, and the curve states nothing there; grade 2B's flow arm \(\+8 %\) reaches back only to 108\.0001 m³\/h, short of it, so neither arm of the tolerance cross can be read\./);
  });

  test("beyond, the cross reaching back but the published part not met: a fail judged on that part, and said", () => {
    const r = check(25, END * 1.05); // 113.4 m³/h at 25 m: the arm reaches back to 105 m³/h; the curve gives 25 m at 54 m³/h (+110 %)
    expect(r.verdict).toBe("fail");
    expect(noted(r)[0]).toMatch(/^Judged on the published part of the curve: the measured flow 113 m³\/h lies beyond the curve's end at 108 m³\/h, .* reaches back to 105 m³\/h, and only its part from 105 m³\/h to the curve's end at 108 m³\/h is read/);
  });

  test("far beyond (the brief's 412 against 380 m³/h, here 123.48 against 108 m³/h): no verdict, both flows said", () => {
    const r = check(25, END * 1.1433);
    expect(r.verdict).toBe("unknown"); // was "fail"
    expect(noted(r)[0]).toContain("No tolerance verdict: the measured flow 123 m³/h lies beyond the curve's end at 108 m³/h, and the curve states nothing there; grade 2B's flow arm (+8 %) reaches back only to 114 m³/h, short of it");
  });

  test("a flow meter's accuracy widens the arm: ±2 % reaches the end from 0.03 × 1.08 / 0.98", () => {
    const q = END * 1.08 * 1.01; // as read the arm stops at 0.0303 m³/s; from 0.98 × Q it reaches 0.0297
    expect(check(10, q).verdict).toBe("unknown");
    const r = check(10, q, { extra: { flowAccuracy: "2" } });
    expect(r.verdict).not.toBe("unknown");
    expect(noted(r)[0]).toContain("grade 2B's flow arm (+8 %, from the lowest flow within the meter's ±2 %) reaches back to");
  });
});

describe("below the curve's first point (a curve published from 0.005 m³/s = 18 m³/h, 35 m)", () => {
  const points = linearPoints().slice(1);
  const FIRST = 0.005;
  test("exactly at the first point: judged as before", () => {
    const r = check(35, FIRST, { points });
    expect(r.verdict).toBe("pass");
    expect(noted(r)).toEqual([]);
  });
  test("the flip where the arm stops reaching the first point: Q = 0.005 × 0.92 ± a millionth, at its 35 m", () => {
    const reaches = check(35, FIRST * 0.92 * (1 + 1e-6), { points }); // up to 0.005 × (1 + 1e-6): flow arm −7.9999 %, met
    const short = check(35, FIRST * 0.92 * (1 - 1e-6), { points });
    expect([reaches.verdict, short.verdict]).toEqual(["pass", "unknown"]); // was "pass" and "fail"
    expect(noted(reaches)[0]).toMatch(/^Judged on the published part of the curve: the measured flow 16\.6 m³\/h lies below the curve's first point at 18\.0 m³\/h, .*grade 2B's flow arm \(−8 %\) reaches up to 18\.00002 m³\/h, and only its part from the curve's first point at 18\.0 m³\/h to 18\.00002 m³\/h is read/);
    expect(noted(short)[0]).toMatch(/^No tolerance verdict: the measured flow 16\.6 m³\/h lies below the curve's first point at 18\.0 m³\/h, and the curve states nothing there; grade 2B's flow arm \(−8 %\) reaches up only to 17\.99998 m³\/h, short of it/);
  });
  test("grade 1U allows no flow below (0 %): a millionth below the first point is not judged", () => {
    const r = check(35, FIRST * (1 - 1e-6), { points, grade: "1U" });
    expect(r.verdict).toBe("unknown");
    expect(noted(r)[0]).toContain("grade 1U's flow arm (0 %) reaches up only to");
  });
});

describe("a curve from zero flow", () => {
  test("a zero flow reading is on the published curve: judged on both arms, nothing said of its ends", () => {
    const on = check(40, 0);
    const above = check(40 * 1.06, 0); // head +6 %, past 2B's +5 %; the curve never reaches 42.4 m
    expect([on.verdict, above.verdict]).toEqual(["pass", "fail"]);
    expect([...noted(on), ...noted(above)]).toEqual([]);
  });
});
