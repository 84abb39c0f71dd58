/**
 * Numbers added up as the decimals they were typed as (pure; any unit): each finite number read as its shortest
 * decimal (JavaScript's `String(x)`, the digits a typed "784.01" parses back to), summed exactly in integers, so a total
 * is compared with a limit without a binary rounding: 8000 h + 784 h is 8784 h, and 0.1 + 0.2 is 0.3, not
 * 0.30000000000000004. Used where a sum of typed numbers is judged against a stated limit (a duty cycle's hours against
 * the year, dutyCycle.ts and app/lib/projects/year-hours.ts), so the verdict flips exactly at it.
 */

/** An exact decimal: `digits` × 10^`exp`. */
type Dec = { digits: bigint; exp: number };

function toDec(x: number): Dec {
  const m = /^(-?)(\d+)(?:\.(\d+))?(?:e([+-]\d+))?$/.exec(String(x));
  if (!m) throw new Error(`decimalSum: ${x} is not a finite number`);
  const frac = m[3] ?? "";
  const digits = BigInt(`${m[1]}${m[2]}${frac}`);
  return { digits, exp: Number(m[4] ?? 0) - frac.length };
}

const scaled = (d: Dec, exp: number) => d.digits * 10n ** BigInt(d.exp - exp);

/** An exact sum of typed decimals. */
export interface DecimalSum {
  /** The sum as a plain decimal ("8784.01", "9000", "0.3"). */
  readonly text: string;
  /** −1, 0 or 1 as the sum is below, equal to or above `limit` (a finite number read as its shortest decimal). */
  compare(limit: number): number;
}

/**
 * The exact sum of finite numbers, each read as its shortest decimal.
 * @param values the numbers, finite (any unit, one for all)
 */
export function decimalSum(values: readonly number[]): DecimalSum {
  const decs = values.map(toDec);
  const exp = Math.min(0, ...decs.map((d) => d.exp));
  const total = decs.reduce((t, d) => t + scaled(d, exp), 0n);
  const neg = total < 0n;
  const abs = (neg ? -total : total).toString().padStart(1 - exp, "0");
  const whole = exp === 0 ? abs : abs.slice(0, abs.length + exp);
  const frac = exp === 0 ? "" : abs.slice(abs.length + exp).replace(/0+$/, "");
  return {
    text: `${neg ? "-" : ""}${whole}${frac ? `.${frac}` : ""}`,
    compare(limit: number): number {
      const l = toDec(limit);
      const e = Math.min(exp, l.exp);
      const a = total * 10n ** BigInt(exp - e), b = scaled(l, e);
      return a < b ? -1 : a > b ? 1 : 0;
    },
  };
}
