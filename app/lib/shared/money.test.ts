// Amounts as Stripe gives them (an integer in the currency's minor unit) written for reading. The
// minor units per currency follow Stripe's currency list (docs.stripe.com/currencies: zero-decimal,
// three-decimal and special cases; from memory) — not "always cents".
import { describe, expect, test } from "vitest";
import { fmtMoney } from "./format";
import { priceText } from "../billing/price.server";

describe("money in a currency's minor unit — Stripe API docs: Currencies, minor units", () => {
  test("two-decimal currencies as before: 4900 EUR cents is 49.00 EUR", () => {
    expect(fmtMoney(4900, "eur")).toBe("49.00 EUR");
    expect(fmtMoney(990, "gbp")).toBe("9.90 GBP");
    expect(priceText(4900, "eur", "month")).toBe("49.00 EUR per month");
  });

  test("zero-decimal currencies: Stripe's 4900 JPY is ¥4,900, not 49.00 — Stripe's zero-decimal list (JPY, KRW, CLP, VND, UGX…)", () => {
    expect(priceText(4900, "jpy", "month")).toBe("4,900 JPY per month");
    expect(fmtMoney(55000, "krw")).toBe("55,000 KRW");
    expect(fmtMoney(25000, "clp")).toBe("25,000 CLP");
    expect(fmtMoney(180000, "ugx")).toBe("180,000 UGX");
  });

  test("three-decimal currencies: 4900 KWD fils is 4.900 KWD — Stripe's three-decimal list (BHD, JOD, KWD, OMR, TND)", () => {
    expect(fmtMoney(4900, "kwd")).toBe("4.900 KWD");
    expect(fmtMoney(15250, "bhd")).toBe("15.250 BHD");
  });

  test("Stripe's special cases: ISK and HUF stay two-decimal in the API (500 = 5 ISK), shown whole when whole — Stripe docs: Currencies, special cases; Stripe support: fractional ISK (2023)", () => {
    expect(fmtMoney(500, "isk")).toBe("5 ISK");
    expect(fmtMoney(1500000, "huf")).toBe("15,000 HUF");
    expect(fmtMoney(1500050, "huf")).toBe("15,000.50 HUF"); // a fraction Stripe allows for HUF is never hidden
    expect(fmtMoney(150000, "twd")).toBe("1,500.00 TWD");
  });

  test("thousands are grouped; a code Intl does not know is written with two decimals", () => {
    expect(fmtMoney(123456789, "usd")).toBe("1,234,567.89 USD");
    expect(fmtMoney(4900, "xts")).toBe("49.00 XTS");
    expect(fmtMoney(4900, "e1")).toBe("49.00 E1");
  });

  test("Node's ICU gives the digits the display relies on: 0 for JPY, 3 for KWD, 2 for EUR — CLDR currency data", () => {
    const digits = (c: string) => new Intl.NumberFormat("en-GB", { style: "currency", currency: c }).resolvedOptions().maximumFractionDigits;
    expect([digits("JPY"), digits("KWD"), digits("EUR")]).toEqual([0, 3, 2]);
  });
});
