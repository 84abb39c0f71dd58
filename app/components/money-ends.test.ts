// Money at its ends (helper "numtext"): each currency to its minor unit as Intl's currency data writes it (ISO 4217
// through CLDR: EUR 2, JPY 0, and the five 3-decimal currencies BHD, JOD, KWD, OMR, TND — ISO 4217 minor-unit column,
// from memory); an amount that rounds to zero there in the significant-digit form every tiny number takes ("0.00400
// EUR", not "under 0.01 EUR"); a negative amount with the true minus. Amounts are made up.
import { describe, expect, it } from "vitest";
import { moneyText } from "./energy-numbers";

describe("money to its currency's digits, tiny and negative amounts as numbers", () => {
  it("3 decimals for BHD, JOD, KWD, OMR, TND; 2 for EUR; 0 for JPY", () => {
    for (const c of ["BHD", "JOD", "KWD", "OMR", "TND", "kwd"]) expect(moneyText(1.2346, c), c).toBe(`1.235 ${c}`);
    expect(moneyText(1.2346, "EUR")).toBe("1.23 EUR");
    expect(moneyText(1234.4, "JPY")).toBe("1234 JPY");
  });
  it("tiny: '0.00400 EUR', '0.000400 KWD', '1.00e-7 EUR', '0.400 JPY' (old 'under 0.01 EUR', 'under 0.001 KWD', 'under 1 JPY')", () => {
    expect(moneyText(0.004, "EUR")).toBe("0.00400 EUR");
    expect(moneyText(0.0004, "KWD")).toBe("0.000400 KWD");
    expect(moneyText(1e-7, "EUR")).toBe("1.00e-7 EUR");
    expect(moneyText(0.4, "JPY")).toBe("0.400 JPY");
  });
  it("either side of half the minor unit: 0.006 EUR reads 0.01, 0.0049 reads 0.00490; exactly 0 reads 0.00", () => {
    expect(moneyText(0.006, "EUR")).toBe("0.01 EUR");
    expect(moneyText(0.0049, "EUR")).toBe("0.00490 EUR");
    expect(moneyText(0, "EUR")).toBe("0.00 EUR");
    expect(moneyText(-0.0001, "EUR")).toBe("−0.000100 EUR"); // old "above −0.01 EUR"
    expect(moneyText(-12.5, "EUR")).toBe("−12.50 EUR");
  });
});
