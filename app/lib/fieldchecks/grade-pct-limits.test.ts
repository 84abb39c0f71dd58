// A field check's tolerance-cross arm at its ends: judged to 1 part in 10⁸ of the allowance (of the curve's value at a 0 %
// side), so a deviation called past prints apart from the allowance beside it, and one within it reads as the allowance
// (decision "pctlimit"). Check values: ISO 9906 grades' head allowances 1B ±3 %, 2B ±5 %, 1U 0 %/+6 % (from memory;
// engine fieldCheck.ts TOLERANCE_GRADES); the engine's sample curve (test/curves.ts). Deviations are made up.
import { describe, expect, it } from "vitest";
import { createPumpCurve, gradeCross, headAt, TOLERANCE_GRADES } from "~/engine";
import { samplePoints } from "~/engine/test/curves";
import { armDeviationText } from "./cross";

const curve = createPumpCurve({ points: samplePoints() });
const flow = curve.bep!.flow;
const H = headAt(curve, flow)!;
const said = (t: string) => Number(t.replace("−", "-").replace(/\s*%$/, "").replace(/^\+/, ""));
/** The head arm at a head deviation `d` from the curve, as the cross's words read it. */
function headArm(id: string, d: number) {
  const grade = TOLERANCE_GRADES.find((g) => g.id === id)!;
  const a = gradeCross(curve, flow, H * (1 + d), grade).head;
  return { pass: a.pass, text: armDeviationText({ ...a, arm: "head", measured: H * (1 + d) }), d: a.deviation! };
}

describe("the head arm's ends: within 1 part in 10⁸ met and read as the allowance; past it not met, read apart", () => {
  const ENDS: [string, number][] = [["1B", 0.03], ["1B", -0.03], ["2B", 0.05], ["2B", -0.05], ["1U", 0.06]];
  for (const [id, end] of ENDS) {
    it(`grade ${id}, ${end > 0 ? "+" : "−"}${Math.abs(end) * 100} %`, () => {
      const side = Math.sign(end);
      for (const k of [0, 0.5e-8, 0.99e-8]) {
        const a = headArm(id, end * (1 + k));
        expect(a.pass, `${k}`).toBe(true); // 2e-11 past 3 % was "not met" as "+3.00000000 %" (1e-12 allowance)
        expect(said(a.text), `${k}: ${a.text}`).toBe(end * 100);
      }
      for (const k of [1.01e-8, 2e-8, 1e-7, 1e-6]) {
        const a = headArm(id, end * (1 + k));
        expect(a.pass, `${k}`).toBe(false);
        expect(Math.sign(said(a.text) - end * 100), `${k}: ${a.text}`).toBe(side);
      }
    });
  }
  it("grade 1U's 0 % side: within 1 part in 10⁸ of the curve's value (−5e-13, −0.99e-8) met as 0 %; −1.01e-8 not met, read apart from 0 %", () => {
    expect(headArm("1U", -5e-13)).toMatchObject({ pass: true, text: "0 %" });
    expect(headArm("1U", -0.99e-8)).toMatchObject({ pass: true, text: "0 %" }); // was not met at 1e-12 (helper "numtext")
    const past = headArm("1U", -1.01e-8);
    expect(past.pass).toBe(false);
    expect(said(past.text)).toBeLessThan(0);
  });
});
