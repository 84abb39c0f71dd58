/**
 * A tolerance side with nothing allowed reads "0 %", never "−0 %" (a signed zero beside the limit it gives), and a limit
 * that is not zero never reads "0 %": the verdict's rule, in SI and US units. Check values: the default duty flow
 * tolerance −0/+10 % of the duty (common practice, DEFAULT_FLOW_TOLERANCE); the system editor keeps a tolerance to
 * 4 decimals of a percent (system-form.ts); the duty flow is made up.
 */
import { describe, expect, it } from "vitest";
import { judgeCandidate, type BandEdge } from "./index.ts";
import { fmtPctLimit, fmtPctSide, renderQuantities } from "./quantityText.ts";
import { UNIT_SYSTEMS } from "./units.ts";

const QD = 100 / 3600; // duty flow, m³/s (made-up: 100 m³/h)
const edge = (q: number): BandEdge => ({ name: "most lift, aged pipe", flow: q, head: 20 });
const CHOICES = { SI: UNIT_SYSTEMS.SI, US: UNIT_SYSTEMS.US };

describe("a tolerance side of zero", () => {
  it("reads 0 %, unsigned; a side that is not zero keeps its sign and its digits as typed", () => {
    expect(fmtPctSide(0, "−")).toBe("0 %");
    expect(fmtPctSide(0, "+")).toBe("0 %");
    expect(fmtPctSide(0.025, "−")).toBe("−2.5 %");
    expect(fmtPctSide(0.1, "+")).toBe("+10 %");
  });

  it("the default tolerance in the verdict's rule and reasons: '0 %/+10 %', in SI and US units", () => {
    for (const [name, units] of Object.entries(CHOICES)) {
      for (const q of [QD, QD * 0.9, QD * 1.2]) { // meets, short, oversized
        const v = judgeCandidate({ dutyFlow: QD, edges: [edge(q)] })!;
        const text = renderQuantities([v.rule, ...v.reasons].join(" "), units);
        expect(text, `${name} ${v.status}`).not.toMatch(/−0 %/);
        if (v.status !== "short") expect(text, `${name} ${v.status}`).toMatch(/tolerance 0 %\/\+10 %/);
      }
    }
  });
});

describe("a limit that is not zero never reads as zero", () => {
  it("a tolerance typed to 4 decimals of a percent reads as typed (0.0004 % read '0 %', 2.0005 % read '2.001 %' or '2 %')", () => {
    expect(fmtPctLimit(0.000004)).toBe("0.0004 %");
    expect(fmtPctLimit(0.020005)).toBe("2.0005 %");
    expect(fmtPctLimit(1e-10)).toBe("1.00e-8 %");
    expect(fmtPctLimit(0.1)).toBe("10 %");
    expect(fmtPctLimit(0.011000000000000001)).toBe("1.1 %");
  });

  it("in the short verdict's rule: 'duty flow × (1 − 0.0004 %)', not '(1 − 0 %)' beside a limit below the duty", () => {
    const tolerance = { minus: 0.000004, plus: 0.1 };
    const v = judgeCandidate({ dutyFlow: QD, edges: [edge(QD * (1 - 0.00001))], tolerance })!;
    expect(v.status).toBe("short");
    for (const [name, units] of Object.entries(CHOICES)) {
      const text = renderQuantities(`${v.rule} ${v.reasons.join(" ")}`, units);
      expect(text, name).toMatch(/× \(1 − 0\.0004 %\)/);
      expect(text, name).toMatch(/tolerance −0\.0004 %\/\+10 %/);
    }
  });
});
