/**
 * A Reynolds number (dimensionless: the same in every unit system) beside the regime or range it is judged against reads
 * apart from the ends: Re 3999.6 (transition; turbulent from 4000) read "Re = 4000 is in the laminar–turbulent
 * transition (2000–4000)", and a value a hair past a correlation's stated end read as the end ("Re = 1.00e+8 is outside
 * its stated range 4.00e+3–1.00e+8"). Check values: the regimes ≤ 2000 laminar, ≥ 4000 turbulent (common practice,
 * headLoss.ts regimeOf); Colebrook's stated range Re 4000–1e8 and Swamee–Jain's ε/D 1e-6–1e-2 (the registry's, from memory).
 */
import { describe, expect, it } from "vitest";
import { frictionFactorDetailed } from "./index.ts";
import { fmtExpExact } from "./quantityText.ts";

const NUM = String.raw`(\d+(?:\.\d+)?(?:e[-+]\d+)?)`;

describe("Re beside the ends it is judged against", () => {
  it("inside the transition a hair from each end: printed strictly between 2000 and 4000", () => {
    for (const re of [3999.6, 2000.4]) {
      const r = frictionFactorDetailed(re, 1e-4);
      expect(r.regime).toBe("transition");
      const w = r.warnings.find((x) => x.code === "transition-flow")!;
      const m = w.message.match(new RegExp(`^Re = ${NUM} is in the laminar–turbulent transition \\(2000–4000\\)`));
      expect(m, w.message).not.toBeNull();
      expect(Number(m![1]), w.message).toBeGreaterThan(2000);
      expect(Number(m![1]), w.message).toBeLessThan(4000);
    }
  });

  it("a hair past a correlation's stated end: printed past it", () => {
    const cases = [
      { re: 1.00000001e8, eD: 1e-4, method: "colebrook", parameter: "Re", end: 1e8, past: 1 },
      { re: 1e5, eD: 0.9999e-6, method: "swamee-jain", parameter: "ε/D", end: 1e-6, past: -1 },
    ] as const;
    for (const c of cases) {
      const w = frictionFactorDetailed(c.re, c.eD, c.method).warnings.find((x) => x.code === "outside-validity" && x.parameter === c.parameter)!;
      expect(w, `${c.method} ${c.parameter}`).toBeDefined();
      const m = w.message.match(new RegExp(`${c.parameter} = ${NUM} is outside its stated range`));
      expect(m, w.message).not.toBeNull();
      expect(Math.sign(Number(m![1]) - c.end), w.message).toBe(c.past);
    }
  });

  it("fmtExpExact: as toExponential(2) unless that reads as a number it is judged against", () => {
    expect(fmtExpExact(71050, [2000, 4000])).toBe("7.11e+4");
    expect(fmtExpExact(3999.6, [2000, 4000])).toBe("3.9996e+3");
    expect(fmtExpExact(4000, [2000, 4000])).toBe("4.00e+3"); // equal to the end: no digits to add
    expect(fmtExpExact(null)).toBe("—");
  });
});
