// Every grade of the acceptance table × each quantity it judges (flow, head, shaft power, pump efficiency): a reading 1 part
// in 10⁷ inside the grade's limit is met and one 1 part in 10⁷ outside is not, on the verdict and on the sentence that states
// its rule and numbers — the tolerance cross (`crossSummary`, the e-mail's and the lists' sentence) for flow and head, the
// power and efficiency limits (`powerGradeSummary`) for power and efficiency — with the deviation printed apart from its
// allowance (never "+3 %" beside a "+3 % allowed" it is past).
// Check values: ISO 9906:2012 acceptance grades as in TOLERANCE_GRADES, from memory (verify against the standard): 1B flow ±5 %,
// head ±3 %, power +4 %, efficiency −3 %; 1E the same with efficiency 0; 1U flow 0/+10 %, head 0/+6 %, power +10 %,
// efficiency 0; 2B ±8 %, ±5 %, +8 %, −5 %; 2U 0/+16 %, 0/+10 %, +16 %, −5 %; 3B ±9 %, ±7 %, +9 %, −7 %. The curve is the
// invented fixture (app/test/fieldcheck-fixture.ts: H = 40 − 1000·Q m, Q in m³/s, straight between its knots), water at
// 20 °C through the engine (IAPWS-IF97). Where each arm is read alone (hand algebra on H = 40 − 1000·Q):
//  - head arm at Q = 0.005 m³/s (H_c = 35 m): a head t off the curve is a flow (t·35/1000)/0.005 = 7·t off it on the flow arm,
//    past every grade's flow allowance, so the head arm alone decides;
//  - flow arm at H = 15 m (Q_c = 0.025 m³/s): a flow t off is a head 1000·t·0.025/(15 − 25·t·…) ≈ 1.7·t off it on the head arm,
//    past every grade's head allowance at the flow edges tried, so the flow arm alone decides;
//  - power and efficiency at Q = 0.025 m³/s on the flow arm (H = H_c(1 + tP)(1 + 10⁻⁵): the head arm is past, the flow arm met),
//    and at H = H_c for efficiency (its power (1 − tη)⁻¹ − 1 ≤ tP for every grade).
import { describe, expect, test } from "vitest";
import { fluidAt, TOLERANCE_GRADES } from "~/engine";
import { inSI } from "~/engine/quantityText";
import { fieldsForHead, frozenFixture, POWER_KNOT } from "~/test/fieldcheck-fixture";
import { crossOf, crossSentences, crossSummary, evaluateCheck, parseCheckFields, powerGradeSentences, powerGradeSummary, type CheckResult } from "./index";

const RHO20 = fluidAt({ kind: "water" }, 20).density;
const f = frozenFixture();
const EPS = 1e-7; // 1 part in 10⁷ of the reading
const curveHead = (q: number) => 40 - 1000 * q; // the fixture's curve, m (q in m³/s)

function check(grade: string, flow: number, head: number, shaft: number | null = null): CheckResult {
  const m = POWER_KNOT.motorEfficiency;
  const power: Record<string, string> = shaft === null ? {} : { powerMode: "input", power: String(shaft / m / 1000), motorEfficiency: String(m * 100) };
  const p = parseCheckFields(fieldsForHead(head, RHO20, { flow: String(flow), gradeId: grade, ...power }), { kind: "water" });
  if (!p.ok) throw new Error(JSON.stringify(p.errors));
  return evaluateCheck(f, p.readings, grade);
}

/** The curve's shaft power (W) and efficiency (fraction) at `flow`, as the check reads them (from a probe reading). */
function curvePower(grade: string, flow: number): { power: number; efficiency: number } {
  const r = check(grade, flow, curveHead(flow), 5000);
  const c = r.powerGrade!.check!;
  return { power: c.power!.curve!, efficiency: c.efficiency!.curve! };
}

const sum = (r: CheckResult) => inSI(crossSummary(r) ?? "");
/** The check page's line for one arm of the cross (numbers in plain SI: the state is what is read here). */
const pageArm = (r: CheckResult, arm: "Head" | "Flow") => crossSentences(crossOf(r)!, { flow: (v) => String(v), head: (v) => String(v) }).find((l) => l.startsWith(`${arm} arm:`))!;
/** The check page's line for a power or efficiency limit. */
const pageLimit = (r: CheckResult, which: "Power" | "Efficiency") => powerGradeSentences(r).find((l) => l.startsWith(`${which}: `))!;
/** "+3 %" / "−3 %" / "0 %": an allowance as the sentences write it. */
const allowed = (a: number, sign: "+" | "−") => (a === 0 ? "0 %" : `${sign}${+(a * 100).toFixed(6)} %`);
const esc = (t: string) => t.replace(/[.+()]/g, "\\$&");
const tol = (band: readonly [number, number]) => esc(`allowed ${allowed(band[0], "−")} to ${allowed(band[1], "+")}`);
/** A deviation printed beside its allowance: its own digits, never the allowance's number alone. */
const apart = (text: string, limit: string) => expect(text).not.toContain(` ${limit} of the curve's`);

for (const g of TOLERANCE_GRADES) {
  describe(`grade ${g.id}`, () => {
    const sides = [["below", 0, -1], ["above", 1, 1]] as const;
    test.each(sides)("head arm %s: 1e-7 inside met, outside not met (Q = 0.005 m³/s)", (_, i, s) => {
      const q = 0.005;
      const edge = curveHead(q) * (1 + s * g.head[i]);
      const inside = check(g.id, q, edge * (1 - s * EPS));
      const outside = check(g.id, q, edge * (1 + s * EPS));
      expect([inside.verdict, outside.verdict]).toEqual(["pass", "fail"]);
      const re = (state: string) => new RegExp(`head [+−][\\d.]+ % of the curve's 35\\.0 m at the measured flow \\(${tol(g.head)}\\), ${state};`);
      expect(sum(inside)).toMatch(re("met"));
      expect(sum(outside)).toMatch(re("not met"));
      apart(sum(outside), allowed(g.head[i], s < 0 ? "−" : "+"));
      expect([pageArm(inside, "Head"), pageArm(outside, "Head")].map((l) => / — (not )?met/.exec(l)?.[0])).toEqual([" — met", " — not met"]);
      expect(inSI(outside.message)).toMatch(/^Delivered point is outside every grade checked \(head: the measured [\d.]+ m is [+−][\d.]+ % of the curve's [\d.]+ m at the measured flow \(allowed [^)]+\); flow(: the measured [\d.]+ m³\/h is [+−][\d.]+ % of the curve's [\d.]+ m³\/h at the measured head \(allowed [^)]+\)| arm not read \(the curve gives no flow at the measured head\))\)$/);
    });

    test.each(sides)("flow arm %s: 1e-7 inside met, outside not met (H = 15 m)", (_, i, s) => {
      const h = 15;
      const qc = (40 - h) / 1000;
      const edge = qc * (1 + s * g.flow[i]);
      const inside = check(g.id, edge * (1 - s * EPS), h);
      const outside = check(g.id, edge * (1 + s * EPS), h);
      expect([inside.verdict, outside.verdict]).toEqual(["pass", "fail"]);
      const re = (state: string) => new RegExp(`; flow [+−][\\d.]+ % of the curve's 90\\.0 m³/h at the measured head \\(${tol(g.flow)}\\), ${state}\\.$`);
      expect(sum(inside)).toMatch(re("met"));
      expect(sum(outside)).toMatch(re("not met"));
      apart(sum(outside), allowed(g.flow[i], s < 0 ? "−" : "+"));
      expect([pageArm(inside, "Flow"), pageArm(outside, "Flow")].map((l) => / — (not )?met/.exec(l)?.[0])).toEqual([" — met", " — not met"]);
    });

    test(`shaft power: 1e-7 inside +${g.powerAbove! * 100} % met, outside not met (Q = 0.025 m³/s, efficiency met)`, () => {
      const q = 0.025;
      const c = curvePower(g.id, q);
      const h = curveHead(q) * (1 + g.powerAbove!) * (1 + 1e-5);
      const edge = c.power * (1 + g.powerAbove!);
      const inside = check(g.id, q, h, edge * (1 - EPS));
      const outside = check(g.id, q, h, edge * (1 + EPS));
      expect([inside.verdict, outside.verdict]).toEqual(["pass", "fail"]);
      expect(powerGradeSummary(inside)).toMatch(new RegExp(`shaft power \\+[\\d.]+ % \\(${esc(allowed(g.powerAbove!, "+"))} allowed, met\\), pump efficiency [+−][\\d.]+ % \\([^)]*, met\\)`));
      expect(powerGradeSummary(outside)).toMatch(new RegExp(`shaft power \\+[\\d.]+ % \\(${esc(allowed(g.powerAbove!, "+"))} allowed, not met\\), pump efficiency [+−][\\d.]+ % \\([^)]*, met\\)`));
      expect(powerGradeSummary(outside)).not.toContain(`shaft power ${allowed(g.powerAbove!, "+")} (`);
      expect([pageLimit(inside, "Power"), pageLimit(outside, "Power")].map((l) => / — (not )?met\.$/.exec(l)?.[0])).toEqual([" — met.", " — not met."]);
      expect(outside.message).toMatch(new RegExp(`misses its power limit \\(\\+[\\d.]+ % against ${esc(allowed(g.powerAbove!, "+"))} allowed\\)$`));
    });

    test(`pump efficiency: 1e-7 inside ${allowed(g.efficiencyBelow!, "−")} met, outside not met (Q = 0.025 m³/s, head on the curve)`, () => {
      const q = 0.025;
      const c = curvePower(g.id, q);
      const h = curveHead(q);
      // η = ρ·g·Q·H / P: the efficiency at its limit (1 − tη)·η_c is a shaft power P_c / (1 − tη); inside is a lower power.
      const edge = c.power / (1 - g.efficiencyBelow!);
      const inside = check(g.id, q, h, edge * (1 - EPS));
      const outside = check(g.id, q, h, edge * (1 + EPS));
      expect([inside.verdict, outside.verdict]).toEqual(["pass", "fail"]);
      const a = allowed(g.efficiencyBelow!, "−");
      expect(powerGradeSummary(inside)).toMatch(new RegExp(`pump efficiency [+−][\\d.]+ % \\(${a} allowed, met\\)`));
      expect(powerGradeSummary(outside)).toMatch(new RegExp(`pump efficiency −[\\d.]+ % \\(${a} allowed, not met\\)`));
      expect(powerGradeSummary(outside)).not.toContain(`pump efficiency ${a} (`);
      expect([pageLimit(inside, "Efficiency"), pageLimit(outside, "Efficiency")].map((l) => / — (not )?met\.$/.exec(l)?.[0])).toEqual([" — met.", " — not met."]);
      expect(outside.message).toMatch(new RegExp(`misses its efficiency limit \\(−[\\d.]+ % against ${a} allowed\\)$`));
    });
  });
}
