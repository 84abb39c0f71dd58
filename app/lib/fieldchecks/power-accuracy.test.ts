// The power reading's accuracy on a field check (form.ts, evaluate.ts `verdictFor`, power-grade.ts, engine gradePower.ts
// `gradePowerWithinAccuracy`): a grade's power or efficiency limit missed as read but met within ± the accuracy is
// "marginal" with the power that meets it, missed beyond it is "fail", and without an accuracy nothing changes.
// Check values: ISO 9906:2012 grades as in TOLERANCE_GRADES, from memory (1B: power +4 %, efficiency −3 %; 1E: power
// +4 %, efficiency 0; 2B: power +8 %, efficiency −5 %); the accuracy is ± % of the reading (as meter data sheets state it, common practice), so the
// lowest power within it is reading × (1 − a) and the power limit flips at (1 + d)(1 − a) = 1 + tP (hand algebra).
// The fixture curve is invented (app/test/fieldcheck-fixture.ts): H = 40 − 1000·Q, efficiency 70 % at Q = 0.015 m³/s,
// H = 25 m; curve shaft power P_c = ρ·g₀·Q·H/η there, water at 20 °C through the engine (IAPWS-IF97).
import { describe, expect, test } from "vitest";
import { fluidAt, G0 } from "~/engine";
import { fieldsForHead, frozenFixture, oneCheckCsv, POWER_KNOT, powerCheckFields } from "~/test/fieldcheck-fixture";
import { deliveredSentence, evaluateCheck, parseCheckFields, powerGradeSentences, type CheckResult, type Readings } from "./index";
import { readStoredCheck } from "./stored-check";

const RHO20 = fluidAt({ kind: "water" }, 20).density;
const f = frozenFixture();
const { flow: Q, head: HC } = POWER_KNOT;
const PC = (RHO20 * G0 * Q * HC) / POWER_KNOT.efficiency; // W, ≈ 5243 W

function parsed(head: number, shaft: number, extra: Record<string, string> = {}) {
  const p = parseCheckFields(powerCheckFields(head, shaft, RHO20, extra), { kind: "water" });
  if (!p.ok) throw new Error(JSON.stringify(p.errors));
  return p;
}
/** A check at Q = 0.015 m³/s, `head` m, shaft power `shaft` W, power read to ± `acc` % (blank: none given). */
const check = (grade: string, head: number, shaft: number, acc = "") => evaluateCheck(f, parsed(head, shaft, { powerAccuracy: acc }).readings, grade);

/** The deviation where `verdict(d)` changes from `a` to `b`, bisected between lo (a) and hi (b) to 1e-12. */
function flip(verdict: (d: number) => string, lo: number, hi: number, a: string, b: string): number {
  expect([verdict(lo), verdict(hi)]).toEqual([a, b]);
  while (hi - lo > 1e-12) {
    const mid = (lo + hi) / 2;
    if (verdict(mid) === a) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

describe("a power limit missed as read but met within the reading's accuracy is marginal", () => {
  // 1B, power read ±2 %, head 2 % above the curve's (flow/head met; the efficiency bound, 1.02/0.97 of the power, is looser).
  const at = (d: number, acc = "2") => check("1B", 1.02 * HC, (1 + d) * PC, acc).verdict;
  const threshold = 1.04 / 0.98 - 1; // (1 + d)(1 − 2 %) = 1 + 4 % → d = 6.1224 % (hand algebra above)

  test("bisected, the verdict flips from marginal to fail at (1 + 4 %)/(1 − 2 %) − 1 = +6.12 %, and at ±1e-6 around it", () => {
    const d = flip((x) => at(x), 0.05, 0.08, "marginal", "fail");
    expect(Math.abs(d - threshold)).toBeLessThan(1e-9);
    expect([at(threshold - 1e-6), at(threshold + 1e-6)]).toEqual(["marginal", "fail"]);
    // Not allowed + accuracy (6 %): the accuracy is a fraction of the reading, so +6.05 % is still met at reading × 0.98.
    expect(at(0.0605)).toBe("marginal");
  });

  test("the other edge: +4 % met as read is a pass with or without an accuracy; past it, fail without one and marginal with ±2 %", () => {
    const d = flip((x) => at(x), 0.03, 0.05, "pass", "marginal");
    expect(Math.abs(d - 0.04)).toBeLessThan(1e-9);
    expect([at(0.039, ""), at(0.041, "")]).toEqual(["pass", "fail"]); // as before: judged as read
  });

  test("efficiency moves inversely with power: 2B's efficiency limit (−5 %) flips where (1 − x)/(1 − 2 %) = 1 − 5 %", () => {
    // Head on the curve, power P_c/(1 − x): efficiency −x as read; the highest within ±2 % is η/(1 − 2 %), met while
    // x ≤ 1 − 0.95 × 0.98 = 6.9 %. Power 1/(1 − x) − 1 ≈ +7.4 % stays within 2B's +8 %. (1E allows no efficiency shortfall:
    // there an accuracy gives no verdict instead, efficiency-bound.test.ts.)
    const eff = (x: number) => check("2B", HC, PC / (1 - x), "2").verdict;
    const x = flip(eff, 0.06, 0.075, "marginal", "fail");
    expect(Math.abs(x - (1 - 0.95 * 0.98))).toBeLessThan(1e-9);
    expect(check("2B", HC, PC / (1 - 0.06), "").verdict).toBe("fail"); // as before without an accuracy
  });

  test("marginal states the shaft power that meets the limits, within the band, with the rule and numbers", () => {
    const r = check("1B", 1.02 * HC, 1.05 * PC, "2");
    expect(r.verdict).toBe("marginal");
    const w = r.powerGrade!.within!;
    const read = 1.05 * PC;
    expect(w.shaft).toBeGreaterThanOrEqual(read * 0.98 - 1e-9);
    expect(w.shaft).toBeLessThan(read);
    expect(w.check.pass).toBe(true);
    expect(r.message).toBe("Delivered point meets grade 1B on flow and head but misses its power limit (+5.0 % against +4 % allowed) as read; within the power reading's accuracy (±2 %) a lower shaft power meets the grade's power and efficiency limits (see power and efficiency)");
    const said = powerGradeSentences(r);
    expect(said[0]).toMatch(/Judged as read, then within the power reading's accuracy \(below\);/);
    const line = said.find((s) => s.startsWith("Power reading accuracy"))!;
    expect(line).toMatch(/^Power reading accuracy ±2 % of the reading \(shaft ⟦power\|[\d.]+⟧ to ⟦power\|[\d.]+⟧\): the limits are missed as read, but within that accuracy a shaft power of ⟦power\|[\d.]+⟧ \(−[\d.]+ % of the reading\) meets them — power \+[\d.]+ % ≤ \+4 % allowed, efficiency −[\d.]+ % of the curve's ≥ −3 % allowed — so the verdict is at the tolerance limit \(marginal\), not a fail/);
    expect(line).toContain("met at the lowest power within it, reading × (1 − 2 %)");
    expect(deliveredSentence(r)).toMatch(/; met within the power reading's ±2 % at shaft ⟦power\|[\d.]+⟧ \(power \+[\d.]+ % ≤ \+4 % allowed, efficiency −[\d.]+ % of the curve's ≥ −3 % allowed\), so at the tolerance limit\.$/);
  });

  test("missed beyond the accuracy stays a fail, and says so at the lowest power within it", () => {
    const r = check("1B", 1.02 * HC, 1.1 * PC, "2");
    expect(r.verdict).toBe("fail");
    expect(r.powerGrade!.within).toBeNull();
    // At reading × 0.98: power 1.1 × 0.98 − 1 = +7.8 %; efficiency 1.02/(1.1 × 0.98) − 1 = −5.4 % (hand calculation).
    const line = powerGradeSentences(r).find((s) => s.startsWith("Power reading accuracy"))!;
    expect(line).toMatch(/: the limits are missed even at the lowest power within it — power \+7\.8 % > \+4 % allowed, efficiency −5\.4 % of the curve's < −3 % allowed — so the check is a fail/);
    expect(deliveredSentence(r)).toMatch(/; missed even at the lowest power within the power reading's ±2 % \(power \+7\.8 % > \+4 % allowed, efficiency −5\.4 % of the curve's < −3 % allowed\)\.$/);
  });

  test("a flow/head miss stays a fail whatever the power accuracy (the accuracy allows for power only)", () => {
    expect(check("1B", 1.1 * HC, 1.05 * PC, "2").verdict).toBe("fail"); // head +10 % past 1B's +3 %
  });
});

describe("without an accuracy, checks read as before", () => {
  const cases: [string, number, number, string][] = [
    // grade, head / H_c, shaft / P_c, verdict as judged before the accuracy existed (power-grade.test.ts's cases)
    ["1B", 1.025, 1.12, "fail"],
    ["1B", 1.02, 1.039, "pass"],
    ["1B", 1.02, 1.041, "fail"],
    ["1B", 1, 1 / 0.98, "pass"],
    ["1E", 1, 1 / 0.98, "fail"],
  ];
  test("blank, or the field missing from the post (an older page or queued check): same verdict, message and judgement", () => {
    for (const [g, h, p, verdict] of cases) {
      const blank = check(g, h * HC, p * PC, "");
      const fields = powerCheckFields(h * HC, p * PC, RHO20);
      delete fields.powerAccuracy;
      const old = parseCheckFields(fields, { kind: "water" });
      if (!old.ok) throw new Error(JSON.stringify(old.errors));
      const missing = evaluateCheck(f, old.readings, g);
      expect(blank.verdict, `${g} ${h} ${p}`).toBe(verdict);
      expect(missing).toEqual(blank);
      expect(blank.powerGrade!.accuracy).toBeNull();
      expect(blank.powerGrade!.within).toBeUndefined();
      expect(powerGradeSentences(blank)).toContain("No power reading accuracy was given, so the power and efficiency limits are judged as read: a limit missed by any margin makes the check a fail. Enter the meter's accuracy (± % of the reading) to allow for it.");
    }
  });

  test("a check stored before the accuracy existed (no readingAccuracy, no powerGrade.accuracy) reads, and says no accuracy was given", () => {
    const p = parsed(1.025 * HC, 1.12 * PC);
    const result = evaluateCheck(f, p.readings, "1B");
    const { readingAccuracy: _a, ...power } = p.readings.power as Extract<Readings["power"], { mode: "input" }>;
    const { accuracy: _b, ...powerGrade } = result.powerGrade!;
    const { powerAccuracy: _c, ...fields } = p.fields;
    const got = readStoredCheck({ readingsJson: JSON.stringify({ readings: { ...p.readings, power }, fields }), resultJson: JSON.stringify({ ...result, powerGrade }) });
    expect(got.ok).toBe(true);
    if (!got.ok) return;
    expect(got.result.verdict).toBe("fail");
    expect(powerGradeSentences(got.result)).toContain(powerGradeSentences(result).find((s) => s.startsWith("No power reading accuracy")));
    const cells = csvRow(got.readings, got.result);
    expect([cells.power_accuracy, cells.power_limits_within_accuracy]).toEqual(["", ""]);
  });

  test("a check with the accuracy and a marginal power reads back as stored; a stored accuracy past 100 % is named", () => {
    const p = parsed(1.02 * HC, 1.05 * PC, { powerAccuracy: "2" });
    const result = evaluateCheck(f, p.readings, "1B");
    const row = { readingsJson: JSON.stringify({ readings: p.readings, fields: p.fields }), resultJson: JSON.stringify(result) };
    const got = readStoredCheck(row);
    expect(got.ok && got.result).toEqual(JSON.parse(JSON.stringify(result)));
    const bad = readStoredCheck({ ...row, resultJson: JSON.stringify({ ...result, powerGrade: { ...result.powerGrade, accuracy: 2 } }) });
    expect(bad.ok ? [] : bad.problems.map((x) => x.label)).toEqual(["result, power and efficiency against the grade, power reading accuracy"]);
  });
});

describe("the form's power reading accuracy", () => {
  const errorOf = (typed: string, mode = "input") => {
    const r = parseCheckFields(fieldsForHead(HC, RHO20, { flow: String(Q), powerMode: mode, power: "5", motorEfficiency: "90", powerAccuracy: typed }), { kind: "water" });
    return r.ok ? (r.readings.power.mode === "none" ? "none" : r.readings.power.readingAccuracy) : r.errors.powerAccuracy;
  };
  test("0 to 20 % is taken as a fraction, blank is none; NaN, negative and past 20 % are refused with the rule and what was typed", () => {
    expect([errorOf("0"), errorOf("2,5"), errorOf("20"), errorOf("")]).toEqual([0, 0.025, 0.2, null]);
    expect(errorOf("NaN")).toBe("The power reading accuracy must be a number from 0 to 20 % (± % of the reading, as the meter's data sheet states it); leave it blank when the accuracy is not known.");
    expect(errorOf("-1")).toBe("The power reading accuracy must be from 0 to 20 % (± % of the reading, as the meter's data sheet states it): “-1” is negative.");
    expect(errorOf("20.5")).toBe("The power reading accuracy must be from 0 to 20 % (± % of the reading, as the meter's data sheet states it): “20.5” is past 20 %.");
    expect(errorOf("1,500")).toMatch(/is ambiguous/); // the forms' one reader (shared/decimal.ts)
  });
  test("with no power measured the field is not read, as the motor efficiency is not", () => {
    expect(errorOf("NaN", "none")).toBe("none");
  });
});

describe("the history CSV", () => {
  test("power_accuracy and power_limits_within_accuracy beside the power columns: 0.02 and met (marginal), not met (fail)", () => {
    const within = parsed(1.02 * HC, 1.05 * PC, { powerAccuracy: "2" });
    const beyond = parsed(1.02 * HC, 1.1 * PC, { powerAccuracy: "2" });
    const rw = csvRow(within.readings, evaluateCheck(f, within.readings, "1B"));
    const rb = csvRow(beyond.readings, evaluateCheck(f, beyond.readings, "1B"));
    expect([rw.verdict, rw.efficiency_allowed_below, rw.power_accuracy, rw.power_limits_within_accuracy]).toEqual(["marginal", "0.03", "0.02", "met"]);
    expect([rb.verdict, rb.power_accuracy, rb.power_limits_within_accuracy]).toEqual(["fail", "0.02", "not met"]);
  });
});

/**
 * One check's CSV row (the last line) by column name, split on commas (no quoted cells in these rows: notes are blank, and
 * verdict_today_rule, the last column, is blank where today's verdict agrees, as it does on a check just worked out).
 */
function csvRow(readings: Readings, result: CheckResult): Record<string, string> {
  const { header, row } = oneCheckCsv(readings, result);
  // Each limit on its own before the notes (power-line-alone.test.ts); today's rule after them (fieldverdicts).
  expect(header.slice(-6)).toEqual(["power_accuracy", "power_limits_within_accuracy", "power_limit", "efficiency_limit", "notes", "verdict_today_rule"]);
  expect(row).toHaveLength(header.length);
  return Object.fromEntries(header.map((h, i) => [h, row[i]]));
}
