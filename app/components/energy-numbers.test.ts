// Money to a currency's minor unit and the column rule of the energy display (energy-numbers.ts), alone; the pages'
// use of them is in energy-display.test.ts. Check values: ISO 4217 minor units (EUR 2, JPY 0, BHD 3; from memory, as
// Intl.NumberFormat's currency data gives them) and hand arithmetic.
import { describe, expect, it } from "vitest";
import { addsUpAsPrinted, column, currencyMinorDigits, moneySumNote, moneyText } from "./energy-numbers";

describe("energy numbers", () => {
  it("digits per currency: EUR 2, JPY 0, BHD 3; unknown or unset codes 2; below the minor unit is said, not printed as 0", () => {
    expect([currencyMinorDigits("EUR"), currencyMinorDigits("jpy"), currencyMinorDigits("BHD"), currencyMinorDigits(""), currencyMinorDigits("not a code")]).toEqual([2, 0, 3, 2, 2]);
    expect(moneyText(1234.4, "JPY")).toBe("1234 JPY");
    expect(moneyText(1.2346, "BHD")).toBe("1.235 BHD");
    expect(moneyText(0.004, "EUR")).toBe("0.00400 EUR"); // was "under 0.01 EUR" (helper "numtext": money-ends.test.ts)
    expect(moneyText(0, "EUR")).toBe("0.00 EUR");
    expect(moneyText(3, "")).toBe("3.00 (currency not set)");
  });
  it("a column keeps three significant digits of its smallest value, drops decimals only the zeros fill, and knows when it adds up", () => {
    expect(column([0.2828, 0.666, 1.354, 1.291], 3.5938)).toEqual({ rows: ["0.283", "0.666", "1.354", "1.291"], total: "3.594", decimals: 3, addsUp: true });
    expect(column([240, 600, 1400, 1760], 4000)).toMatchObject({ rows: ["240", "600", "1400", "1760"], total: "4000", addsUp: true });
    expect(column([0.12, 0.3, 0.7, 0.88], 2)).toMatchObject({ rows: ["0.12", "0.30", "0.70", "0.88"], total: "2.00", addsUp: true });
    // 2356.6 + 3869.6 = 6226.2 (hand arithmetic): whole rows 2357 + 3870 = 6227 ≠ 6226
    expect(column([2356.6, 3869.6, null], 6226.2)).toMatchObject({ rows: ["2357", "3870", "—"], total: "6226", addsUp: false });
    expect(addsUpAsPrinted([500.4, 500.4], 1000.8, 2)).toBe(true);
    expect(addsUpAsPrinted([500.4, 500.4], 1000.8, 0)).toBe(false); // 500 + 500 ≠ 1001
    expect(moneySumNote([0.004, 0.004], 0.008, "EUR")).toMatch(/each rounded to 0\.01 EUR/); // 0.00 + 0.00 ≠ 0.01
    expect(moneySumNote([12.5, 15602.64], 15615.14, "EUR")).toBe("");
  });
});
