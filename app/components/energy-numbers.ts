// Numbers of the energy display (duty cycle, energy cost, life-cycle cost), pure: money to its currency's minor unit,
// and a column of step values (kWh, hours) printed at one precision with its total, so that the rows add up to the
// total as printed, or the total says they do not. Money here is a computed amount in the workspace's currency (a
// float); shared/format.ts's fmtMoney is for integer cents from billing and stays as it is.
import { trueMinus } from "~/engine/quantityText";
import { currencyDigits } from "~/lib/shared/money";

/** Digits of a currency's minor unit as written (shared/money.ts `currencyDigits`: EUR 2, JPY 0, BHD 3; 2 when unknown). */
export const currencyMinorDigits = currencyDigits;

const unitOf = (currency: string) => currency || "(currency not set)";
const unsignedZero = (t: string) => (/^-0(\.0+)?$/.test(t) ? t.slice(1) : t);

/**
 * An amount of money to its currency's minor unit (Intl's currency digits, ISO 4217 through CLDR: `currencyDigits`):
 * 0.4 EUR → "0.40 EUR", 12.5 → "12.50 EUR", 1234 JPY → "1234 JPY", 1.2346 BHD → "1.235 BHD". An amount that is not zero
 * but rounds to zero there is written as every other number too small for its decimals, 3 significant digits
 * (quantityText.ts `fmtNum`: "0.00400 EUR", "1.00e-7 EUR"), never a false "0.00" nor a bound in words (it read
 * "under 0.01 EUR"; helper "numtext"); a negative amount with the true minus "−". "—" when missing.
 */
export function moneyText(x: number | null | undefined, currency: string): string {
  if (x == null || !Number.isFinite(x)) return "—";
  const d = currencyMinorDigits(currency);
  const t = unsignedZero(x.toFixed(d));
  return `${trueMinus(x !== 0 && Number(t) === 0 ? x.toPrecision(3) : t)} ${unitOf(currency)}`;
}

/** Whether amounts printed at `d` decimals add up, as printed, to their total printed alike. */
export function addsUpAsPrinted(parts: readonly number[], total: number, d: number): boolean {
  const units = (x: number) => Math.round(Number(x.toFixed(d)) * 10 ** d);
  return parts.reduce((s, x) => s + units(x), 0) === units(total);
}

/** The note after a sum of money whose parts, each rounded to the minor unit, do not add up to its total as printed ("" when they do). */
export function moneySumNote(parts: readonly number[], total: number, currency: string): string {
  const d = currencyMinorDigits(currency);
  return addsUpAsPrinted(parts, total, d) ? "" : ` (each rounded to ${(10 ** -d).toFixed(d)} ${unitOf(currency)}, so the parts as printed differ from the total by the rounding)`;
}

/** Significant digits a column's smallest value keeps (common practice for a table of estimates: three). */
const SIGNIFICANT = 3;
const MAX_DECIMALS = 6;
const decimalsFor = (x: number) => Math.min(MAX_DECIMALS, Math.max(0, SIGNIFICANT - 1 - Math.floor(Math.log10(Math.abs(x)))));

export type Column = { rows: string[]; total: string; decimals: number; addsUp: boolean };

/**
 * Step values and their total at one precision: enough decimals for the smallest value that is not zero to keep three
 * significant digits (at most 6), less any the whole column only fills with zeros. So 0.283 kWh shows as 0.283, not 0,
 * and beside 1760 kWh the rows stay whole. `addsUp`: the rows as printed add up to the total as printed (a missing row
 * counts nothing); when they do not, the page says the rows are rounded.
 * @param rows the steps' values (null: not computed, printed "—")
 * @param total their total
 */
export function column(rows: readonly (number | null)[], total: number): Column {
  const all = [...rows.filter((x): x is number => x != null && Number.isFinite(x)), total].filter((x) => Number.isFinite(x));
  const nonzero = all.filter((x) => x !== 0);
  let d = nonzero.length ? Math.max(...nonzero.map(decimalsFor)) : 0;
  while (d > 0 && all.every((x) => Number(x.toFixed(d - 1)) === Number(x.toFixed(d)))) d--;
  const text = (x: number | null) => (x == null || !Number.isFinite(x) ? "—" : unsignedZero(x.toFixed(d)));
  const counted = rows.filter((x): x is number => x != null && Number.isFinite(x));
  return { rows: rows.map(text), total: text(total), decimals: d, addsUp: addsUpAsPrinted(counted, total, d) };
}

/** The rows as printed, added up, at the column's precision (for the note beside a total they do not reach). */
export function printedSum(c: Column): string {
  const sum = c.rows.filter((t) => t !== "—").reduce((s, t) => s + Math.round(Number(t) * 10 ** c.decimals), 0) / 10 ** c.decimals;
  return unsignedZero(sum.toFixed(c.decimals));
}

/** One quantity (kWh, hours) with three significant digits when small, whole from 100 up: 0.283, 3.59, 42.1, 1760. */
export const amountText = (x: number | null | undefined): string => (x == null || !Number.isFinite(x) ? "—" : column([], x).total);
