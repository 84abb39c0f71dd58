// Each limit's line says what that limit is — met, met within the power reading's accuracy, or not met — on its own,
// whatever the overall verdict: a failing check (the other limit missed even at the lowest power within the accuracy)
// still says of a limit met there that it is met within the accuracy, on the check's page (`powerGradeSentences`), the
// selection's list and the e-mail (`powerGradeSummary`), and the history CSV (`power_limit`, `efficiency_limit`).
// Check values: ISO 9906:2012 grade 1B as in TOLERANCE_GRADES, from memory (power +4 %, efficiency −3 % of the curve's);
// the accuracy is ± % of the reading (common practice); at the lowest power within it, reading × (1 − a), the power's
// deviation is (1 + d)(1 − a) − 1 and the efficiency's (H/Hc)/((P/Pc)(1 − a)) − 1 (hand algebra, as power-lines.test.ts).
// The fixture curve is invented (app/test/fieldcheck-fixture.ts: H = 40 − 1000·Q, 70 % at Q = 0.015 m³/s, H = 25 m).
import { describe, expect, test } from "vitest";
import { fluidAt, G0 } from "~/engine";
import { frozenFixture, oneCheckCsv, POWER_KNOT, powerCheckFields } from "~/test/fieldcheck-fixture";
import { evaluateCheck, parseCheckFields, powerGradeSentences, powerGradeSummary } from "./index";

const RHO20 = fluidAt({ kind: "water" }, 20).density;
const f = frozenFixture();
const { flow: Q, head: HC } = POWER_KNOT;
const PC = (RHO20 * G0 * Q * HC) / POWER_KNOT.efficiency; // W, the curve's shaft power at the knot

/** A 1B check with a ±2 % power reading: its verdict, page lines, summary and the CSV's per-limit cells. */
function surfaces(headRatio: number, powerRatio: number) {
  const p = parseCheckFields(powerCheckFields(headRatio * HC, powerRatio * PC, RHO20, { powerAccuracy: "2" }), { kind: "water" });
  if (!p.ok) throw new Error(JSON.stringify(p.errors));
  const r = evaluateCheck(f, p.readings, "1B");
  const said = powerGradeSentences(r);
  const { header, row } = oneCheckCsv(p.readings, r);
  const cell = (name: string) => (header.includes(name) ? row[header.indexOf(name)] : `(no ${name} column)`);
  return {
    verdict: r.verdict,
    power: said.find((s) => s.startsWith("Power: "))!,
    efficiency: said.find((s) => s.startsWith("Efficiency: "))!,
    accuracy: said.find((s) => s.startsWith("Power reading accuracy"))!,
    summary: powerGradeSummary(r),
    csv: { limits: cell("power_limits"), power: cell("power_limit"), efficiency: cell("efficiency_limit") },
  };
}

describe("a failing check: the power limit met within ±2 %, the efficiency limit missed even there (1B, head −2 %, power +5 %)", () => {
  // Power at reading × 0.98: 1.05 × 0.98 − 1 = +2.9 % ≤ +4 %, met within. Efficiency as read 0.98/1.05 − 1 = −6.7 %; at reading
  // × 0.98 0.98/1.029 − 1 = −4.8 % < −3 %: missed there too, so the check fails (hand calculation).
  const s = surfaces(0.98, 1.05);
  test("the verdict is a fail, and the accuracy sentence gives both limits at the lowest power", () => {
    expect(s.verdict).toBe("fail");
    expect(s.accuracy).toMatch(/missed even at the lowest power within it — power \+2\.9 % ≤ \+4 % allowed, efficiency −4\.8 % of the curve's < −3 % allowed — so the check is a fail/);
  });
  test("the page's power line says met within the meter's ±2 %, the efficiency line not met", () => {
    // Was: "… +5.0 % > +4 % allowed — not met." beside an accuracy sentence showing +2.9 % ≤ +4 %.
    expect(s.power).toMatch(/: \+5\.0 % > \+4 % allowed as read — met within the meter's ±2 % \(read 101\.0 % of the limit; at the lowest power within it, reading × \(1 − 2 %\), \+2\.9 % ≤ \+4 % allowed\)\.$/);
    expect(s.efficiency).toMatch(/: −6\.7 % of it < −3 % allowed — not met\.$/);
  });
  test("the selection's list and the e-mail say the same, limit by limit", () => {
    expect(s.summary).toMatch(/shaft power \+5\.0 % as read \(\+4 % allowed, met within the meter's ±2 %: read 101\.0 % of the limit; at the lowest power within it, reading × \(1 − 2 %\), \+2\.9 % ≤ \+4 % allowed\), pump efficiency −6\.7 % \(−3 % allowed, not met\); missed even at the lowest power within the power reading's ±2 %/);
  });
  test("the history CSV: power_limits (both together) not met; power_limit met within accuracy; efficiency_limit not met", () => {
    expect(s.csv).toEqual({ limits: "not met", power: "met within accuracy", efficiency: "not met" });
  });
});

describe("each limit's line flips at its own edge while the verdict stays a fail", () => {
  test("power (head −2 %): reading × 0.98 just under +4 % reads met within, just over not met; both checks fail on efficiency", () => {
    const t = 1.04 / 0.98 - 1; // the power ratio whose reading × 0.98 is the +4 % limit (hand algebra)
    const inside = surfaces(0.98, 1 + t - 1e-6);
    const outside = surfaces(0.98, 1 + t + 1e-6);
    expect([inside.verdict, outside.verdict]).toEqual(["fail", "fail"]);
    expect(inside.power).toMatch(/ as read — met within the meter's ±2 % \(read 102\.0 % of the limit; at the lowest power within it, reading × \(1 − 2 %\), \+3\.9999 % ≤ \+4 % allowed\)\.$/);
    expect(outside.power).toMatch(/: \+6\.1 % > \+4 % allowed — not met\.$/);
    expect([inside.efficiency, outside.efficiency].map((x) => x.endsWith("— not met."))).toEqual([true, true]);
    expect([inside.csv.power, outside.csv.power]).toEqual(["met within accuracy", "not met"]);
  });
  test("efficiency (power +7 %, missed even at reading × 0.98 = +4.86 %): head ratio 0.97 × 1.07 × 0.98 ± 1e-6 flips its line", () => {
    const h = 0.97 * 1.07 * 0.98; // efficiency at reading × 0.98 exactly −3 % of the curve's, so read at (1 − a) = 98.0 % of the limit (hand algebra); head +1.7 %, inside the ±3 % cross
    const inside = surfaces(h + 1e-6, 1.07);
    const outside = surfaces(h - 1e-6, 1.07);
    expect([inside.verdict, outside.verdict]).toEqual(["fail", "fail"]);
    expect(inside.efficiency).toMatch(/ < −3 % allowed as read — met within the meter's ±2 % \(read 98\.0 % of the limit; at the lowest power within it, reading × \(1 − 2 %\), −2\.9999 % ≥ −3 % allowed\)\.$/);
    expect(outside.efficiency).toMatch(/: −4\.9 % of it < −3 % allowed — not met\.$/);
    expect([inside.power, outside.power].map((x) => x.endsWith("— not met."))).toEqual([true, true]);
    expect(inside.summary).toMatch(/pump efficiency −4\.9 % as read \(−3 % allowed, met within the meter's ±2 %: /);
    expect(outside.summary).toMatch(/pump efficiency −4\.9 % \(−3 % allowed, not met\)/);
    expect([inside.csv.efficiency, outside.csv.efficiency]).toEqual(["met within accuracy", "not met"]);
  });
});
