// An efficiency limit met only within the power reading's accuracy is "at the tolerance limit" only while the efficiency's
// uncertainty from it, a/(1 − a) upward (decision "effexact"; efficiency-exact-bound.test.ts), is no wider than the grade's
// efficiency tolerance t_η (uncertainty-bound.ts `powerLimitsTooWide`, decision "effbound"), as the
// power limit is held to t_P (power-bound.test.ts): wider, no tolerance verdict with both numbers. 1E and 1U allow no
// efficiency shortfall (t_η = 0): any accuracy is wider, so a shortfall as read is never marginal there. Was: held to t_P
// only, so ±7 % made 2B's efficiency 6.5 % short marginal, and ±9 % a 1U pump 8.7 % short of its curve's efficiency.
// Check values: ISO 9906:2012 grades as in TOLERANCE_GRADES, from memory (t_P / t_η: 1B +4 % / −3 %, 1E +4 % / 0, 1U +10 % / 0,
// 2B +8 % / −5 %, 2U +16 % / −5 %, 3B +9 % / −7 %). The fixture curve is invented (app/test/fieldcheck-fixture.ts: its knot
// Q = 0.015 m³/s, H = 25 m, 70 % efficient), water at 20 °C (IAPWS-IF97). Hand algebra: with the head on the curve and a shaft
// power P_c(1 + p), the pump's efficiency is η_c/(1 + p) (η = ρ·g·Q·H / P); p is taken just above t_η/(1 − t_η), below t_P (the
// efficiency missed as read, the power met as read; t_P/2 where t_η = 0), so only the efficiency limit rests on the accuracy;
// at the reading × (1 − a) it is met from a_min = 1 − 1/((1 + p)(1 − t_η)), below t_η for every grade.
import { describe, expect, test } from "vitest";
import { fluidAt, G0, TOLERANCE_GRADES } from "~/engine";
import { inSI } from "~/engine/quantityText";
import { frozenFixture, POWER_KNOT, powerCheckFields } from "~/test/fieldcheck-fixture";
import { evaluateCheck, parseCheckFields, powerGradeSentences, verdictNote } from "./index";

const RHO20 = fluidAt({ kind: "water" }, 20).density;
const f = frozenFixture();
const { flow: Q, head: HC } = POWER_KNOT;
const PC = (RHO20 * G0 * Q * HC) / POWER_KNOT.efficiency; // the curve's shaft power at the knot, W

/** A fraction as typed in percent, without binary noise: 0.07 → "7". */
const pct = (x: number) => String(+(x * 100).toPrecision(12));

/** A check on the curve's head at the knot, shaft power (1 + p) × P_c read ± `acc` (a fraction; null: blank). */
function check(grade: string, p: number, acc: number | null) {
  const r = parseCheckFields(powerCheckFields(HC, (1 + p) * PC, RHO20, { powerAccuracy: acc === null ? "" : pct(acc) }), { kind: "water" });
  if (!r.ok) throw new Error(JSON.stringify(r.errors));
  return evaluateCheck(f, r.readings, grade);
}

describe("each grade: an efficiency limit met only within the power reading's accuracy, against the grade's t_η", () => {
  for (const g of TOLERANCE_GRADES) {
    const tP = g.powerAbove!;
    const tE = g.efficiencyBelow!;
    const p = tE === 0 ? tP / 2 : 1.02 * (tE / (1 - tE)); // 2 % of the shortfall past t_η: a_min below t_η/(1 + t_η) for 2U's +16 % too
    const aMin = 1 - 1 / ((1 + p) * (1 - tE));
    if (tE > 0) {
      const edge = tE / (1 + tE); // a/(1 − a) = t_η
      test(`${g.id} (t_η −${pct(tE)} %): ±t_η/(1 + t_η) × (1 − 1e-6) marginal, × (1 + 1e-6) no tolerance verdict with both numbers`, () => {
        expect(aMin).toBeLessThan(edge * (1 - 1e-6)); // met at the reading × (1 − a) on both sides of the bound
        const below = check(g.id, p, edge * (1 - 1e-6));
        const above = check(g.id, p, edge * (1 + 1e-6));
        expect([below.verdict, above.verdict]).toEqual(["marginal", "unknown"]);
        const lim = `−${pct(tE)} %`;
        expect(inSI(above.message)).toMatch(new RegExp(`^Delivered point not judged against grade ${g.id}: the readings' uncertainty is wider than the grade's tolerance \\(efficiency \\+[\\d.]+ % \\(the power reading's ±[\\d.]+ %, a/\\(1 − a\\)\\) against ${lim}\\), so they cannot tell a pass from a fail`));
        expect(above.message).not.toContain(`+${pct(tE)} % (the power reading's`); // the uncertainty printed apart from the tolerance
        expect(inSI(verdictNote(above) ?? "")).toContain(`in efficiency the power reading's ±`);
        expect(inSI(verdictNote(above) ?? "")).toContain(`against grade ${g.id}'s ${lim} below the curve's efficiency`);
        // The marginal one states the bound it is within, with its number.
        expect(powerGradeSentences(below).find((s) => s.startsWith("Power reading accuracy"))).toContain(
          `is no wider than the tolerance of each limit missed as read: the efficiency limit's ${lim} (against the efficiency's +`,
        );
      });
    } else {
      test(`${g.id} (no efficiency shortfall allowed): any accuracy that would rescue the efficiency gives no tolerance verdict; none, or too little, fails`, () => {
        const rescued = check(g.id, p, aMin * (1 + 1e-6)); // met at the reading × (1 − a): was "marginal"
        const short = check(g.id, p, aMin * (1 - 1e-6)); // missed there too
        expect([rescued.verdict, short.verdict, check(g.id, p, 0.2).verdict]).toEqual(["unknown", "fail", "unknown"]);
        expect([check(g.id, p, null).verdict, check(g.id, p, 0).verdict]).toEqual(["fail", "fail"]); // judged as read
        expect(inSI(rescued.message)).toMatch(/\(efficiency \+[\d.]+ % \(the power reading's ±[\d.]+ %, a\/\(1 − a\)\) against 0 %\)/);
        const note = inSI(verdictNote(rescued) ?? "");
        expect(note).toContain(`against grade ${g.id}'s 0 % below the curve's efficiency (it allows no shortfall, so any accuracy is wider)`);
        expect(note).toMatch(new RegExp(`Grade ${g.id} allows no efficiency shortfall, so the efficiency is judged as read: a shortfall as read is never at the tolerance limit, whatever the power reading's accuracy\\.$`));
        expect(note).not.toContain("Check again with");
      });
    }
  }
});

describe("a limit met as read is held to nothing", () => {
  test("1B, power +5 % (missed), efficiency met as read: ±3.5 % (wider than −3 %, within +4 %) stays marginal", () => {
    const r = parseCheckFields(powerCheckFields(1.02 * HC, 1.05 * PC, RHO20, { powerAccuracy: "3.5" }), { kind: "water" });
    if (!r.ok) throw new Error("fields");
    const c = evaluateCheck(f, r.readings, "1B");
    expect(c.verdict).toBe("marginal"); // efficiency 1.02/1.05 − 1 = −2.86 % ≥ −3 % as read
    expect(powerGradeSentences(c).find((s) => s.startsWith("Power reading accuracy"))).toContain("no wider than the tolerance of each limit missed as read: the power limit's +4 %;");
  });
});

describe("a check recorded before the bound keeps its stored verdict, and its words say the rule changed", () => {
  test("a stored 1E check marginal on efficiency within ±2 % (as recorded before): the accuracy line says a check today would give no verdict", () => {
    // Re-creates such a stored result: 2B's marginal on efficiency (−6.9 % as read, met within ±2 %), its grade read as 1E's 0 %.
    const r = parseCheckFields(powerCheckFields(HC, PC / (1 - 0.06), RHO20, { powerAccuracy: "2" }), { kind: "water" });
    if (!r.ok) throw new Error("fields");
    const c = evaluateCheck(f, r.readings, "2B");
    expect(c.verdict).toBe("marginal");
    const eff = c.powerGrade!.check!.efficiency!;
    const stored = { ...c, grade: { ...c.grade, id: "1E" }, powerGrade: { ...c.powerGrade!, check: { ...c.powerGrade!.check!, efficiency: { ...eff, allowed: 0 } } } };
    const line = powerGradeSentences(stored).find((s) => s.startsWith("Power reading accuracy"))!;
    expect(line).toContain("so the verdict is at the tolerance limit (marginal), not a fail");
    expect(line).toContain("the efficiency limit's 0 % (against the efficiency's +2.04 % within ±2 %, a/(1 − a)); wider, no tolerance verdict — this check was recorded before that bound: ±2 % is wider than the efficiency limit's 0 %, so a check recorded today would give no tolerance verdict; the stored verdict is kept).");
  });
});
