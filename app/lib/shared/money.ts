// Money as Stripe states it: an integer in the currency's minor unit (pure; server and browser).
//
// How many decimals the minor unit has is Stripe's rule, not the currency's general one: Stripe's currency
// list (docs.stripe.com/currencies, "Zero-decimal currencies", "Three-decimal currencies", "Special cases";
// from memory) —
//   zero-decimal: BIF CLP DJF GNF JPY KMF KRW MGA PYG RWF UGX VND VUV XAF XOF XPF (4900 JPY is ¥4,900);
//   three-decimal: BHD JOD KWD OMR TND (4900 KWD is 4.900 KWD);
//   every other currency two-decimal — including the special cases ISK (zero-decimal in practice, but kept
//   two-decimal in the API for backwards compatibility: 500 is 5 ISK; Stripe support, "fractional ISK", 2023),
//   HUF and TWD (two-decimal in charges, whole units only in payouts).
// Intl's currency digits (CLDR, via Node's ICU) are not that rule: Node 20 gives 0 for ISK, HUF, IDR and COP,
// which Stripe counts in hundredths, so they only decide how many decimals are *shown* (5 ISK, not 5.00 ISK),
// and never hide a fraction the amount has.
const ZERO_DECIMAL = new Set(["BIF", "CLP", "DJF", "GNF", "JPY", "KMF", "KRW", "MGA", "PYG", "RWF", "UGX", "VND", "VUV", "XAF", "XOF", "XPF"]);
const THREE_DECIMAL = new Set(["BHD", "JOD", "KWD", "OMR", "TND"]);

/** Decimals of Stripe's minor unit for a currency code (any case): 0, 2 or 3. */
export function minorUnitDigits(currency: string): number {
  const c = currency.toUpperCase();
  return ZERO_DECIMAL.has(c) ? 0 : THREE_DECIMAL.has(c) ? 3 : 2;
}

const CLDR_DIGITS = new Map<string, number | null>();
/** Decimals CLDR writes for the currency (JPY 0, EUR 2, KWD 3), or null for a code Intl refuses. */
function shownDigits(currency: string): number | null {
  const code = (currency ?? "").trim().toUpperCase();
  let d = CLDR_DIGITS.get(code);
  if (d === undefined) {
    try {
      d = new Intl.NumberFormat("en-GB", { style: "currency", currency: code }).resolvedOptions().maximumFractionDigits ?? null;
    } catch {
      d = null;
    }
    CLDR_DIGITS.set(code, d);
  }
  return d;
}

/**
 * Digits of a currency's minor unit as it is written (ISO 4217 through CLDR, Intl's currency data): EUR and GBP 2, JPY 0,
 * BHD 3; 2 for a code Intl does not take or a currency not set. For amounts the app computes or a user types in the
 * workspace's currency (energy cost, purchase prices); Stripe's own amounts use `minorUnitDigits`.
 */
export function currencyDigits(currency: string): number {
  return shownDigits(currency) ?? 2;
}

const formats = new Map<number, Intl.NumberFormat>();
const grouped = (digits: number) => {
  let f = formats.get(digits);
  if (!f) formats.set(digits, (f = new Intl.NumberFormat("en-GB", { minimumFractionDigits: digits, maximumFractionDigits: digits })));
  return f;
};

/** An amount in Stripe's minor unit for reading: 4900 "eur" → "49.00 EUR", 4900 "jpy" → "4,900 JPY", 4900 "kwd" → "4.900 KWD". */
export function fmtMoney(minor: number, currency: string): string {
  const digits = minorUnitDigits(currency);
  const scale = 10 ** digits;
  // Fewer decimals only when CLDR writes fewer and the amount has no fraction there (5 ISK; 15,000.50 HUF keeps its .50).
  const shown = shownDigits(currency);
  let d = digits;
  if (shown !== null && shown < digits && minor % 10 ** (digits - shown) === 0) d = shown;
  return `${grouped(d).format(minor / scale)} ${currency.toUpperCase()}`;
}
