/**
 * Numbers and dates for reading, in one place (server and browser give the same text: fixed
 * locale, times in UTC, so a page hydrates without a difference).
 */

/**
 * A number for reading (fixed decimals per magnitude) and a fraction as a percentage: the engine's, so its messages read the same;
 * their `…Exact` forms for a number shown beside the limits it was judged against. From 1e6 to 1e9 whole digits grouped by a
 * narrow no-break space ("1 234 567"), from 1e9 exponent form, a value too small for its decimals 3 significant digits
 * ("1.00e-15"): quantityText.ts `GROUPED_FROM`, `LARGE_FROM` (decision "numtext").
 */
export { fmtNum, fmtNumExact, fmtPct, fmtPctExact } from "~/engine/quantityText";

/**
 * A number shown to a reader in a text, as {@link fmtNum} with the true minus sign "−" (U+2212) of every shown quantity
 * (quantityText.ts `trueMinus`, decision "numtext"): "−4.00" where fmtNum writes "-4.00". Not for CSV, JSON or a form's
 * value (fmtNum's ASCII stays there; the forms' reader takes both, shared/decimal.ts `readDecimal`).
 * @param x the number, in any unit
 * @param digits decimals wanted instead (count), as fmtNum
 */
export const fmtNumShown = (x: number | null | undefined, digits?: number): string => trueMinus(fmtNum(x, digits));

/** A whole number with thousands separators, e.g. 12345 → "12,345" (the engine's, so a range's end in a refusal groups the same: `groupThousands`). */
export { fmtInt, groupThousands } from "~/engine/quantityText";
import { fmtNum, groupThousands, trueMinus } from "~/engine/quantityText";

/**
 * A number as it was typed, for a refusal or a range's end: every digit of it (the shortest text that reads back as it,
 * never rounded onto an end it is past), its whole part grouped by narrow no-break spaces (`groupThousands`) and the true
 * minus sign: "−101.326", "350 000". The system editor's run ranges and the field check's form refusals.
 * @param x the number (unitless, in the unit typed)
 */
export function numberAsTyped(x: number): string {
  return groupThousands(String(x).replace("-", "−"));
}

/** An amount in Stripe's minor unit of its currency (money.ts: 0, 2 or 3 decimals), e.g. 4900, "eur" → "49.00 EUR"; 4900, "jpy" → "4,900 JPY". */
export { fmtMoney } from "./money";

const DATE_PARTS = new Intl.DateTimeFormat("en-GB", {
  timeZone: "UTC", year: "numeric", month: "2-digit", day: "2-digit", hour: "2-digit", minute: "2-digit", second: "2-digit", hourCycle: "h23",
});

function parts(when: string | Date | null | undefined): Record<string, string> | null {
  if (when == null || when === "") return null;
  // A zone-less "2026-12-02 14:09:00" (how the database connector gives DATETIME) is UTC, as stored; never the browser's zone.
  const text = typeof when === "string" && /^\d{4}-\d{2}-\d{2}([ T]\d{2}:\d{2}(:\d{2}(\.\d+)?)?)?$/.test(when) ? `${when.replace(" ", "T")}${when.length > 10 ? "Z" : "T00:00Z"}` : when;
  const d = text instanceof Date ? text : new Date(text);
  if (Number.isNaN(d.getTime())) return null;
  return Object.fromEntries(DATE_PARTS.formatToParts(d).map((p) => [p.type, p.value]));
}

/** A date (UTC) as "2026-12-02"; "—" when missing or not a date. */
export function fmtDate(when: string | Date | null | undefined): string {
  const p = parts(when);
  return p ? `${p.year}-${p.month}-${p.day}` : "—";
}

/** A moment (UTC) as "2026-12-02 14:09" (with `seconds`, "2026-12-02 14:09:05"); `fmtUtc` adds the zone. */
export function fmtDateTime(when: string | Date | null | undefined, opts: { seconds?: boolean } = {}): string {
  const p = parts(when);
  return p ? `${p.year}-${p.month}-${p.day} ${p.hour}:${p.minute}${opts.seconds ? `:${p.second}` : ""}` : "—";
}

/** A moment with its zone, "2026-12-02 14:09 UTC" (with `seconds`, "2026-12-01 22:54:55 UTC", as mail logs show it); "—" when missing. */
export function fmtUtc(when: string | Date | null | undefined, opts: { seconds?: boolean } = {}): string {
  const t = fmtDateTime(when, opts);
  return t === "—" ? t : `${t} UTC`;
}

/**
 * A fraction the user typed as a per cent, shown as typed: 0.07 → "7 %", 0.0025 → "0.25 %" (never "7.0 %" nor "0.3 %"). The
 * ×100 is read back to 15 significant digits, so the binary noise of the form's ÷100 (7/100 × 100 = 7.000000000000001) is
 * not shown, then `numberAsTyped`. An instrument's accuracy in the field check's words, on its page, in its e-mail.
 * @param x the fraction (dimensionless)
 */
export function pctAsTyped(x: number): string {
  return `${numberAsTyped(Number((x * 100).toPrecision(15)))} %`;
}
