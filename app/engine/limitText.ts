// A range's end and the number refused against it, as written in a refusal: thousands grouped by a narrow no-break space
// (the forms' reader takes such groups back), an end rounded inward where its unit would round it outside the range
// (decision "inputedge"). Pure; the engine's display helpers (quantityText.ts) render `qtBound`/`qtSent` tokens with it.

/** How a range's ends and the number refused against them group thousands: a narrow no-break space (U+202F). */
export const THOUSANDS_SPACE = "\u202f";

/** "-0.000" reads as zero: drop the sign of a rounded zero. */
const unsignedZero = (t: string) => (/^-0(\.0*)?$/.test(t) ? t.slice(1) : t);

/**
 * A number as written (by {@link fmtNum}, {@link fmtNumExact}, or plainly) with its whole part grouped in threes by a narrow
 * no-break space, as the SI Brochure (9th ed., 5.4.4) and ISO 80000-1 group digits: "3280840" → "3 280 840", "−1000.5" →
 * "−1 000.5"; "0.244", "4.00e-7" and text that is no number unchanged. The ends of a range a refusal names and the number
 * refused are written so; the forms' reader (shared/decimal.ts) takes such groups back, where a comma would be ambiguous
 * with the decimal comma it takes (decision "inputedge"). Counts shown for reading keep quantityText.ts `fmtInt`'s commas.
 * @param text the number as written (unitless)
 */
export function groupThousands(text: string): string {
  return text.replace(/^([-−]?)(\d{4,})(?=$|[.eE\s])/, (_, sign: string, whole: string) => `${sign}${whole.replace(/\B(?=(\d{3})+$)/g, THOUSANDS_SPACE)}`);
}

/** Relative slack of an end typed as shown in another unit (duty-ranges.ts `inside`: 1 part in 10⁹). */
const END_SLACK = 1e-9;

/**
 * A range's end as written in a unit (`text`, by {@link fmtNumExact}), rounded inward where it lies outside the range by
 * more than {@link END_SLACK} of the end: an upper end down, a lower end up, at the same decimals (significant digits
 * for an exponent form); trailing zeros of the decimals dropped ("6.20" → "6.2", "0.000" → "0").
 * @param text the end as written (unitless)
 * @param v the end in the unit shown (unitless here: any unit, as `text`)
 * @param side which end (unitless)
 * @param slack how far outside still reads as the end, a fraction of it (dimensionless; {@link END_SLACK} where the reader allows it)
 */
export function boundInward(text: string, v: number, side: "min" | "max" | undefined, slack = END_SLACK): string {
  const shown = Number(text);
  let t = text;
  const outside = side === "max" ? shown > v : side === "min" ? shown < v : false;
  if (outside && Math.abs(shown - v) > slack * Math.abs(v)) {
    const round = side === "max" ? Math.floor : Math.ceil;
    const exp = /^([-+]?\d(?:\.(\d+))?)e([-+]?\d+)$/.exec(text);
    if (exp) {
      const digits = exp[2]?.length ?? 0;
      const scale = 10 ** (Number(exp[3]) - digits);
      t = (round(v / scale) * scale).toExponential(digits);
    } else {
      const d = (/\.(\d+)$/.exec(text)?.[1] ?? "").length;
      t = (round(v * 10 ** d) / 10 ** d).toFixed(d);
    }
  }
  return unsignedZero(t.includes("e") ? t : t.replace(/\.(\d*?)0+$/, ".$1").replace(/\.$/, ""));
}
