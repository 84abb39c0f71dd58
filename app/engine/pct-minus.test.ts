// A negative per cent is written with the true minus sign "−" (U+2212), as every other signed number the app shows
// (quantityText.ts `trueMinus`: the quantities, `fmtPctSignedExact`, money, the chart's axes); a value that rounds to
// zero reads without a sign, as `fmtNum`'s "-0.000" → "0.000" (helper "routeedges").
import { describe, expect, test } from "vitest";
import { fmtPct, fmtPctExact, fmtPctLimit, fmtPctSignedExact } from "./quantityText.ts";

const HYPHEN = /(?<!e)-(?=\d)/; // an ASCII hyphen before a digit: a minus sign written as "-" (exponents "e-7" are not signs)

describe("per cents with the true minus", () => {
  test("fmtPct: −5.0 % for −0.05, no sign on a value that rounds to zero", () => {
    expect(fmtPct(-0.05)).toBe("−5.0 %"); // 0.05 = 5 % (from memory)
    expect(fmtPct(-0.723, 0)).toBe("−72 %"); // 72.3 % to no decimals (from memory)
    expect(fmtPct(-0.0004)).toBe("0.0 %"); // −0.04 % to one decimal is zero (from memory), as fmtNum's "-0.000" → "0.000"
    expect(fmtPct(0.05)).toBe("5.0 %"); // unsigned positive (from memory)
  });
  test("fmtPctExact: the true minus on every form, the exponent's own sign left as written", () => {
    expect(fmtPctExact(-0.0301, [-0.03])).toBe("−3.01 %"); // −3.01 % read apart from −3 % (from memory)
    expect(fmtPctExact(-0.00004)).toBe("−0.004 %"); // 0.004 % (from memory)
    expect(fmtPctExact(-1e-12)).toBe("−1.00e-10 %"); // 1e-12 = 1e-10 % (from memory)
  });
  test("fmtPctLimit of a negative limit: −2 %", () => {
    expect(fmtPctLimit(-0.02)).toBe("−2 %"); // 0.02 = 2 % (from memory)
  });
  test("no per cent formatter writes a hyphen for a minus, over a sweep of negative fractions", () => {
    const bad: string[] = [];
    for (const x of [-1e-15, -1e-9, -3e-7, -0.0004, -0.004, -0.03, -0.5, -1, -12.5, -1e6]) {
      for (const t of [fmtPct(x), fmtPct(x, 0), fmtPct(x, 3), fmtPctExact(x), fmtPctExact(x, [0.03]), fmtPctLimit(x), fmtPctSignedExact(x)]) if (HYPHEN.test(t)) bad.push(`${x} → ${t}`);
    }
    expect(bad).toEqual([]);
  });
});
