// Fractions written as percentages in text: for reading (`fmtPct`), beside the limits they are judged against
// (`fmtPctExact`, `fmtPctSignedExact`) and as limits (`fmtPctLimit`, `pctLimitWithDecimals`, `fmtPctSide`). Pure; split
// out of quantityText.ts, which re-exports every name (decision "pctlimit").
import { MAX_SIGNIFICANT, trueMinus } from "./limitText.ts";

/** Decimals of a per cent a value is read apart from zero to at least, before an exponent form (count: 0.000001 %). */
const ZERO_PCT_DECIMALS = 6;
/** Significant digits of a per cent too small for the decimals shown (count; as quantityText.ts `fmtNum`'s "4.00e-7"). */
const TINY_SIGNIFICANT = 3;

/**
 * The most decimals of a per cent a value is given to read apart from its limits: the limits' {@link MAX_SIGNIFICANT}
 * significant digits (one step of the last is at most 1 part in 10⁸ of the largest limit, limitText.ts `LIMIT_ROUNDING`),
 * and {@link ZERO_PCT_DECIMALS} at the least (count).
 * @param limits the limits, fractions (dimensionless)
 */
function mostPctDecimals(limits: readonly number[]): number {
  const m = Math.max(0, ...limits.map((a) => Math.abs(a * 100)));
  return m > 0 ? Math.min(20, Math.max(ZERO_PCT_DECIMALS, MAX_SIGNIFICANT - 1 - Math.floor(Math.log10(m)))) : ZERO_PCT_DECIMALS;
}

/** A per cent's digits as shown: a negative with the true minus "−" (limitText.ts `trueMinus`), a rounded zero unsigned ("-0.0" → "0.0"). */
const shownSign = (t: string) => (/^-0(\.0*)?$/.test(t) ? t.slice(1) : trueMinus(t));

/**
 * A fraction as a percentage for reading, e.g. 0.723 → "72.3 %", −0.05 → "−5.0 %" (the true minus, as every signed number
 * the app shows; a value that rounds to zero unsigned, "0.0 %"); "—" when missing.
 * @param x the fraction (dimensionless)
 * @param digits decimals (count)
 */
export function fmtPct(x: number | null | undefined, digits = 1): string {
  return x == null || !Number.isFinite(x) ? "—" : `${shownSign((x * 100).toFixed(digits))} %`;
}

/**
 * A fraction as a percentage in a text that compares it with thresholds: as fmtPct, with more decimals while it would
 * read the same as one of `against`, or as zero, though it is not — up to the thresholds' {@link MAX_SIGNIFICANT}
 * significant digits (at least 6 decimals) — so a value judged past a limit by more than 1 part in 10⁸ (limitText.ts
 * `LIMIT_ROUNDING`) never reads as the limit ("99.96 %" beside 100 %, "3.00000006 %" beside 3 %, where 6 decimals
 * read "3.000000 %"). One rule for a value those decimals still show as zero though it is not: 3 significant digits in
 * exponent form, more while it reads as one of `against` ("2.50e-7 %", "−1.00e-7 %"; as `fmtNum`'s "4.00e-7" and
 * {@link fmtPctLimit}'s) — a number, never a bound in words, so a refusal or a verdict reads "not −1.00e-7 %" (it read
 * "not −under 0.000001 %").
 * @param x the fraction (dimensionless)
 * @param against the thresholds it is compared with (fractions, dimensionless)
 * @param digits decimals at the least (count)
 */
export function fmtPctExact(x: number | null | undefined, against: readonly number[] = [], digits = 1): string {
  if (x == null || !Number.isFinite(x)) return "—";
  const limits = against.filter((a) => Number.isFinite(a) && a !== x);
  const shown = (v: number, d: number) => Number((v * 100).toFixed(d)); // -0 and 0 read the same
  const most = mostPctDecimals(limits);
  let d = digits;
  while (d < most && [0, ...limits].some((a) => shown(a, d) === shown(x, d))) d++;
  if (x === 0 || shown(x, d) !== 0) return fmtPct(x, d);
  const exp = (v: number, e: number) => Number((v * 100).toExponential(e));
  let e = TINY_SIGNIFICANT - 1;
  while (e < 12 && limits.some((a) => exp(a, e) === exp(x, e))) e++;
  return `${trueMinus((x * 100).toExponential(e))} %`;
}

/**
 * A signed fraction as a percentage with the true minus sign "−" (U+2212) and, with `plus`, a "+" for the rest; the
 * decimals as {@link fmtPctExact}, apart from the sizes in `against` (compared by size): "−3.01 %", "+12.0 %", "−1.00e-7 %".
 * @param x the fraction (dimensionless)
 * @param against values it must not read as (fractions; their sign is ignored)
 * @param plus write "+" before a value ≥ 0 (a flag, unitless)
 */
export function fmtPctSignedExact(x: number | null | undefined, against: readonly number[] = [], plus = false): string {
  if (x == null || !Number.isFinite(x)) return "—";
  return `${x < 0 ? "−" : plus ? "+" : ""}${fmtPctExact(Math.abs(x), against.map(Math.abs))}`;
}

/**
 * A threshold as a percentage with the digits it needs (at most {@link MAX_SIGNIFICANT} significant, as
 * {@link fmtPctExact} gives a value beside it; no trailing zeros): a tolerance or a range end as typed, e.g. 0.025 →
 * "2.5 %", 0.011 → "1.1 %", 0.1 → "10 %", 0.0000125 → "0.00125 %" (a limit that is not zero never reads "0 %"; below
 * 0.000001 % it gets 3 significant digits, "1.00e-7 %").
 * @param x the fraction (dimensionless)
 */
export function fmtPctLimit(x: number): string {
  if (!Number.isFinite(x)) return "—";
  const p = x * 100;
  if (p !== 0 && Number(p.toFixed(ZERO_PCT_DECIMALS)) === 0) return `${trueMinus(p.toPrecision(TINY_SIGNIFICANT))} %`;
  return `${trueMinus(String(Number(p.toPrecision(MAX_SIGNIFICANT))))} %`; // Number(): "-0" reads "0", trailing zeros dropped
}

/**
 * A limit as a percentage (`fmtPctLimit`) and the decimals it is written to, for a value shown beside it to at least
 * as many: a service factor 1.155 → { text: "115.5 %", decimals: 1 }.
 * @param x the fraction (dimensionless)
 */
export function pctLimitWithDecimals(x: number): { text: string; decimals: number } {
  const text = fmtPctLimit(x);
  return { text, decimals: (/\.(\d+)/.exec(text)?.[1] ?? "").length };
}

/**
 * One side of a tolerance, with its sign: "−2.5 %", "+10 %", and "0 %" for none (never "−0 %", which reads as a
 * signed zero beside the limit it gives).
 * @param x the allowance on that side, a fraction ≥ 0 (dimensionless)
 * @param side "−" below, "+" above (unitless)
 */
export function fmtPctSide(x: number, side: "−" | "+"): string {
  return x === 0 ? "0 %" : `${side}${fmtPctLimit(x)}`;
}
