// A power or efficiency limit judged on its edge says so with the allowance's own number, and one missed prints apart
// from it, instead of "+4.000000 % ≤ +4 %" and "+4.000000 % > +4 %" (the same digits read both ways).
// Check values: grade 1B's power +4 % and efficiency −3 % allowances (ISO 9906, from memory); the engine compares exactly
// to 1e-12 at the least (limitText.ts `gradeSlack`: 1e-8 of the allowance). The limits below are built by hand: measured
// and curve powers invented.
import { describe, expect, test } from "vitest";
import type { GradeLimitCheck } from "~/engine";
import { powerGradeSentences, powerGradeSummary, type PowerGrade } from "./index";

const grade = { id: "1B", powerAbove: 0.04, efficiencyBelow: 0.03 };
/** A judged check with one power limit at deviation `d` (pass as the engine judges it: d ≤ 0.04 + 1e-12). */
function withPower(d: number): PowerGrade {
  const power: GradeLimitCheck = { measured: 5000 * (1 + d), curve: 5000, deviation: d, allowed: 0.04, pass: d <= 0.04 + 1e-12 };
  return { notJudged: null, basis: { input: (5000 * (1 + d)) / 0.9, motorEfficiency: 0.9 }, check: { power, efficiency: null, pass: power.pass }, accuracy: null };
}
function withEfficiency(d: number): PowerGrade {
  const efficiency: GradeLimitCheck = { measured: 0.7 * (1 + d), curve: 0.7, deviation: d, allowed: 0.03, pass: d >= -0.03 - 1e-12 };
  return { notJudged: null, basis: { input: 5000, motorEfficiency: 0.9 }, check: { power: null, efficiency, pass: efficiency.pass }, accuracy: null };
}
const line = (pg: PowerGrade, what: RegExp) => powerGradeSentences({ grade, powerGrade: pg }).find((x) => what.test(x)) ?? "";

describe("a limit on its edge, and one missed by less than the digits show", () => {
  test("power exactly +4 %: '+4 % = +4 % allowed, at the limit' — met; the e-mail says 'met, at the limit'", () => {
    expect(line(withPower(0.04), /^Power:/)).toMatch(/: \+4 % = \+4 % allowed, at the limit \(the allowance includes its edge\) — met\.$/);
    expect(powerGradeSummary({ grade, powerGrade: withPower(0.04) })).toMatch(/shaft power \+4 % \(\+4 % allowed, met, at the limit\)/);
  });
  test("power +4 % + 1e-9 (past the allowance): not met, the per cent itself apart from +4 %, no words about digits", () => {
    const pg = withPower(0.04 + 1e-9);
    expect(line(pg, /^Power:/)).toMatch(/: \+4\.0000001 % > \+4 % allowed — not met\.$/); // was "… allowed (past it by under 0.000001 points)": redundant beside its digits (helper "numtext")
    expect(powerGradeSummary({ grade, powerGrade: pg })).toMatch(/shaft power \+4\.0000001 % \(\+4 % allowed, not met\)/);
  });
  test("power +3.5 % and +4.5 %: the plain comparison, no edge words", () => {
    expect(line(withPower(0.035), /^Power:/)).toMatch(/: \+3\.5 % ≤ \+4 % allowed — met\.$/);
    expect(line(withPower(0.045), /^Power:/)).toMatch(/: \+4\.5 % > \+4 % allowed — not met\.$/);
  });
  test("efficiency exactly −3 % of the curve's: at the limit, met; 1e-9 below it: not met, read apart", () => {
    expect(line(withEfficiency(-0.03), /^Efficiency:/)).toMatch(/: −3 % of it = −3 % allowed, at the limit \(the allowance includes its edge\) — met\.$/);
    expect(line(withEfficiency(-0.03 - 1e-9), /^Efficiency:/)).toMatch(/: −3\.0000001 % of it < −3 % allowed — not met\.$/); // was "−3.000000 %", then "… (past it by under 0.000001 points)"
  });
});
