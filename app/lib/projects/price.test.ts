// The candidate's purchase price as typed (readPriceCents, energy.ts): the forms' strict reader with
// space-grouped thousands allowed. Expected values are the product's rules, not measurements.
import { describe, expect, it } from "vitest";
import { readPriceCents } from "./energy";

describe("readPriceCents", () => {
  it("refuses 12,500 as ambiguous (thousands or decimal comma), says how to write it; 12500 and 12,50 are read", () => {
    expect(readPriceCents("12,500")).toEqual({ error: "The purchase price “12,500” is ambiguous: 12500 (a thousands comma) or 12.500 (a decimal comma)? Write 12500 or 12 500 for the first, 12.500 or 12.5 for the second." });
    expect(readPriceCents("12500")).toEqual({ cents: 1_250_000 });
    expect(readPriceCents("12,50")).toEqual({ cents: 1250 });
  });
  it("space-grouped thousands are unambiguous; a comma with a point is not", () => {
    expect(readPriceCents("2 450,50")).toEqual({ cents: 245_050 });
    expect(readPriceCents("12\u00a0500")).toEqual({ cents: 1_250_000 });
    expect(readPriceCents("1,234.56").error).toMatch(/group thousands with spaces only/);
    expect(readPriceCents("1 23").error).toMatch(/must be a number/);
  });
  it("refuses hex, negative and absurd prices; blank clears", () => {
    expect(readPriceCents("0x10").error).toBe("The purchase price must be a number.");
    expect(readPriceCents("-1").error).toMatch(/≥ 0/);
    expect(readPriceCents("1e13").error).toMatch(/≥ 0/);
    expect(readPriceCents("  ")).toEqual({ cents: null });
    expect(readPriceCents(null)).toEqual({ cents: null });
  });
  it("refuses more decimals than the currency's minor unit (ISO 4217 via Intl: JPY 0, EUR 2) or than the hundredths kept, never rounding on the way in", () => {
    expect(readPriceCents("12.50", "JPY")).toEqual({ error: "JPY prices are whole numbers here: 12.5 has decimals." });
    expect(readPriceCents("12", "JPY")).toEqual({ cents: 1200 });
    expect(readPriceCents("12.505", "EUR")).toEqual({ error: "EUR prices are kept to 2 decimals here: 12.505 has more." });
    expect(readPriceCents("12.50", "EUR")).toEqual({ cents: 1250 });
    expect(readPriceCents("0.29", "EUR")).toEqual({ cents: 29 }); // 0.29 × 100 is 28.999… in floating point: not refused
    expect(readPriceCents("1.234", "BHD").error).toBe("BHD prices are kept to 2 decimals here: 1.234 has more."); // BHD has 3, kept in hundredths
    expect(readPriceCents("12.505")).toEqual({ error: "Prices are kept to 2 decimals here: 12.505 has more." }); // no currency set: 2
  });
});
