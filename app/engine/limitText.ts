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

/** Decimals are added to tell a value from its limits until it shows this many significant digits (count; 1 part in 10⁹). */
export const MAX_SIGNIFICANT = 9;
/**
 * The rounding allowance of a judged limit (dimensionless, 1 part in 10⁸): a value within it of its limit is at the limit,
 * further out it is past it. It follows the words' digits: one step of a value's {@link MAX_SIGNIFICANT}th significant
 * digit is at most 1 part in 10⁸ of it (10^(1 − MAX_SIGNIFICANT), a value written with a leading 1), so a value judged
 * past its limit by more than this prints apart from the limit beside it (quantityText.ts `qtExact` with `qtLimit` or
 * `qtBound`) in every unit. At 1 part in 10⁹ a value 1–10 parts in 10⁹ past read as its limit: "12.0000000 m³/h <
 * 12.0 m³/h" in m³/h, "3.33333333 L/s < 3.33333333 L/s" in L/s. Shared by the NPSHr curve's ends (npshrEnds.ts), the maker's
 * minimum flow (stepPor.ts, lib/projects/verdict-min-flow.ts), the entry ranges (lib/projects/duty-ranges.ts), a duty-cycle
 * step's head against the system's (dutyCycle.ts), the motor's limit and the IEC table's entries (motor.ts `COVERS_SLACK`,
 * `motorEfficiency`) and a run's bore against its table's (lib/projects/system-input.ts, preview-input.ts); and every limit
 * printed as a percentage (pctText.ts `fmtPctExact` gives a value its limits' 9 significant digits; {@link pastAbove},
 * {@link pastBelow}, {@link insideEnds}: the duty check's 3 %, the POR's 70–120 %, a step's 50 % of BEP flow, a motor's
 * 10 % light load, the escalation's ±15 %/year, the life-cycle rates' ends; decision "pctlimit").
 * Tests: lib/projects/limit-rounding.test.ts, engine/limit-rounding.test.ts, engine/npshr-end-rounding.test.ts,
 * engine/pct-limits.test.ts, lib/projects/pct-limits.test.ts.
 */
export const LIMIT_ROUNDING = 1e-8;
/**
 * Whether `x` is past `limit` above it, by more than {@link LIMIT_ROUNDING} of the limit (within it, at the limit): the
 * judgement a value printed beside its limit needs so that one judged past prints apart from it (decision "pctlimit").
 * @param x the value (any unit)
 * @param limit the limit (same unit)
 */
export const pastAbove = (x: number, limit: number): boolean => x > limit + LIMIT_ROUNDING * Math.abs(limit);
/**
 * Whether `x` is past `limit` below it, by more than {@link LIMIT_ROUNDING} of the limit (within it, at the limit).
 * @param x the value (any unit)
 * @param limit the limit (same unit)
 */
export const pastBelow = (x: number, limit: number): boolean => x < limit - LIMIT_ROUNDING * Math.abs(limit);
/**
 * Whether `x` lies from `min` to `max`, each end to {@link LIMIT_ROUNDING} of it ({@link pastBelow}, {@link pastAbove}).
 * @param x the value (any unit)
 * @param min the lower end (same unit)
 * @param max the upper end (same unit)
 */
export const insideEnds = (x: number, min: number, max: number): boolean => !pastBelow(x, min) && !pastAbove(x, max);

/**
 * The allowance at a grade's limit, fraction points: 1 part in 10⁸ of the limit ({@link LIMIT_ROUNDING}), so a
 * deviation judged past prints apart from the limit beside it (at 1e-12 alone, +3 % + 2e-11 was "not met" as "+3.00000000 %"),
 * and 1e-12 at the least (the readings' conversions' rounding). At a 0 % side the limit is the curve's own value, and
 * 1 part in 10⁸ of it, {@link LIMIT_ROUNDING} in fraction points, as every value judged against a limit's value: at 1e-12
 * a reading 2e-11 under the curve was "not met, 2.00e-9 points outside" beside a measured and a curve's value that read
 * the same to their 9 digits (helper "numtext"). The tolerance cross's too (fieldCheck.ts, the field-check pages'
 * cross.ts and power-grade.ts; gradePower.ts; decision "pctlimit").
 * @param allowed the allowance on that side, a fraction ≥ 0 (dimensionless)
 */
export const gradeSlack = (allowed: number): number => (allowed === 0 ? LIMIT_ROUNDING : Math.max(1e-12, LIMIT_ROUNDING * Math.abs(allowed)));
/**
 * Whether a deviation (fraction) lies from −below to +above, each end to its {@link gradeSlack}.
 * @param deviation measured / curve − 1 (dimensionless)
 * @param below the allowance below, a fraction ≥ 0 (dimensionless)
 * @param above the allowance above, a fraction ≥ 0 (dimensionless)
 */
export const gradeAllows = (deviation: number, below: number, above: number): boolean =>
  deviation >= -below - gradeSlack(below) && deviation <= above + gradeSlack(above);

/**
 * Relative slack of an end typed as shown in another unit: the reader's own allowance at a range's end (lib/projects
 * run-ranges.ts `inside`), {@link LIMIT_ROUNDING}.
 */
export const END_SLACK = LIMIT_ROUNDING;

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

/**
 * A quantity's number as shown with the true minus sign "−" (U+2212), as the per cents (pctText.ts: `fmtPct` and its kin, since helper "routeedges"), a refusal's
 * number as typed (shared/format.ts `numberAsTyped`) and the field check's form write theirs: "−50 °C", where it read
 * "-50 °C" (helper "numtext"). Kept here, beside the grouping, so pctText.ts can use it; quantityText.ts re-exports it. The quantity formatters (`fmtQuantity`, `fmtQuantityExact`, `fmtQuantityAboveZero`, so
 * shared/units.ts `fmtQ` and its kin) and every rendered token; bare numbers (`fmtNum`) and CSV's numbers stay ASCII.
 * The forms' reader takes "−" back (shared/decimal.ts).
 * @param t a number as written (unitless)
 */
export const trueMinus = (t: string): string => t.replace(/^-(?=[\d.])/, "−");
