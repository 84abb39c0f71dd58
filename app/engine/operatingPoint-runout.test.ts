// The runout caution (operatingPoint.ts `near-curve-end`, one of the verdict's cautions: lib/projects/hydraulics.ts) at its
// threshold, 98 % of the curve's last published flow. It compared with no allowance and said neither rule nor numbers: an
// operating point 0.98 × the last flow × (1 − 1e-12) had no caution and × (1 + 1e-12) "operating point is at the far end
// of the published curve (runout)". Now at or past 98 % to 1 part in 10⁸ (LIMIT_ROUNDING, `pastBelow`), the words with the
// flow, the limit and the last flow. Check values: the 98 % rule (operatingPoint.ts, common practice, from memory); the
// curves are the demo sets (fixtures/demo, invented), each met by a system that crosses it at the flow wanted (geometry).
import { describe, expect, it } from "vitest";
import { createPumpCurve, evalCubic, solveOperatingPoint } from "./index.ts";
import { inSI, LIMIT_ROUNDING } from "./quantityText.ts";
import { demoCurveInputs } from "./test/demoCurves";

const demo = demoCurveInputs().map((d) => ({ id: d.id, c: createPumpCurve(d.curve) }));

describe("runout caution at 98 % of the last published flow, to 1 part in 10⁸", () => {
  const cases: [number, boolean][] = [[-2 * LIMIT_ROUNDING, false], [-0.5 * LIMIT_ROUNDING, true], [-1e-12, true], [1e-12, true], [0.01, true]];
  for (const [off, said] of cases)
    it(`every demo curve set (${demo.length}) met at 98 % × (1 ${off < 0 ? "−" : "+"} ${Math.abs(off)}): ${said ? "runout, with its numbers" : "no runout caution"}`, () => {
      const wrong: string[] = [];
      for (const { id, c } of demo) {
        const q = 0.98 * c.flowMax * (1 + off), h = evalCubic(c.head, q) as number;
        const op = solveOperatingPoint(c, (x) => (evalCubic(c.head, x) as number) + (h / c.flowMax) * (x - q));
        const w = op.warnings.find((x) => x.code === "near-curve-end");
        if (op.status !== "ok") wrong.push(`${id}: ${op.status}`);
        else if (!!w !== said) wrong.push(`${id}: ${w ? "runout" : "none"} at ${op.flow! / c.flowMax} of the last flow`);
        else if (w && !/^operating point at [\d.]+ m³\/h is at the far end of the published curve \(runout\): at or past 98 % of its last published flow [\d.]+ m³\/h, [\d.]+ m³\/h \(to 1 part in 10⁸\)$/.test(inSI(w.message))) wrong.push(`${id}: ${inSI(w.message)}`);
      }
      expect(wrong).toEqual([]);
    });
});
