/**
 * Quantities inside text. The engine and the services write messages (warnings, notes, verdict
 * reasons) with each physical value as a token `⟦quantity|SI value⟧`, e.g. `⟦flow|0.0111⟧` for
 * 0.0111 m³/s; the edges (pages, report, e-mail) render the tokens in the reader's units with
 * {@link renderQuantities} (re-exported as `renderUnits` by `app/lib/shared/units.ts`). Text without
 * tokens renders unchanged, so stored messages written before the tokens still display.
 * A reading judged against a limit is written with {@link qtExact} and the limit with {@link qtLimit}
 * (`⟦flow|0.02776|0.027777777777777776⟧`, `⟦flow|0.027777777777777776|limit:0.02776⟧`: each carries the
 * other), so both get the decimals they need to read apart, in their order, in the unit the reader chose.
 * Display helpers, not part of the engine's public face (index.ts): import this file by path.
 */
import { fromSI, UNIT_SYSTEMS, UNITS, unitLabel, type Quantity, type UnitPreset } from "./units.ts";
import { EngineInputError } from "./errors.ts";
import { boundInward, groupThousands, MAX_SIGNIFICANT, trueMinus } from "./limitText.ts";
export { boundInward, gradeAllows, gradeSlack, groupThousands, insideEnds, LIMIT_ROUNDING, MAX_SIGNIFICANT, pastAbove, pastBelow, THOUSANDS_SPACE, trueMinus } from "./limitText.ts";
export { fmtPct, fmtPctExact, fmtPctLimit, fmtPctSide, fmtPctSignedExact, pctLimitWithDecimals } from "./pctText.ts";

/**
 * Matches one token: quantity name (letters), a number as written by {@link qt} (or NaN) and, from
 * {@link qtExact} or {@link qtLimit}, the SI values it must read apart from (comma-separated; `limit:` first for a limit).
 */
export const QUANTITY_TOKEN = /⟦([A-Za-z]+)\|([^⟦⟧|]*)(?:\|([^⟦⟧|]*))?⟧/g;
/** Marks the values of a {@link qtLimit} token. */
const LIMIT_MARK = "limit:";
/** Marks a {@link qtAlsoIn} token, before the unit it is also written in and the values it reads apart from. */
const ALSO_MARK = "also:";
/** Marks a {@link qtAboveZero} token (a reading judged by its side of zero), before the values it reads apart from. */
const ZERO_MARK = "zero:";
/** Marks a {@link qtBound} token (a range's end in a refusal); "bound-min:"/"bound-max:" name the end ({@link boundInward}). */
const BOUND_MARK = "bound:";
const BOUND_MARKS = /^bound(?:-(min|max))?:/;
/** Marks a {@link qtSent} token (a number refused against a range's ends, grouped as they are). */
const SENT_MARK = "sent:";

/**
 * The smallest step the magnitude rule shows below 1 (three decimals), in the unit shown: a reading judged by its side of
 * zero (NPSHa) that those decimals would show as zero though it is not reads "< 0.001 m" above zero (decision "npshzero").
 */
export const NEAR_ZERO_FLOOR = 0.001;

/**
 * What a reading judged by its side of zero (NPSHa: at or below zero the liquid boils at the pump's inlet, whatever the
 * pump) reads as where the magnitude rule's three decimals would round it to zero though it is not — |v| below 0.0005 in
 * the unit shown: "< 0.001" above zero, "below 0" below it; null elsewhere (zero itself, and every value the decimals
 * tell from zero, print as numbers: 0.0005 m reads "0.001 m", −0.0005 m "-0.001 m"). One rule for both sides and every
 * unit (decision "npshone"): a hair below zero printed its digits ("-0.000001 m") where a hair above read "< 0.001 m",
 * and a signed zero ("-0.000 m") would read as zero, which NPSHa below zero is not.
 * @param v the reading in the unit shown (m or ft)
 */
export function nearZeroWords(v: number): string | null {
  if (v === 0 || !Number.isFinite(v) || Number(v.toFixed(3)) !== 0) return null;
  return v > 0 ? `< ${NEAR_ZERO_FLOOR}` : "below 0";
}

/**
 * A quantity token for text: `⟦flow|0.0111⟧`.
 * @param quantity physical quantity of the value (unitless id)
 * @param si the value in SI (temperature in °C, as the engine's public face); kept to 6 significant digits
 */
export function qt(quantity: Quantity, si: number): string {
  return `⟦${quantity}|${Number.isFinite(si) ? String(Number(si.toPrecision(6))) : "NaN"}⟧`;
}

function apartToken(quantity: Quantity, si: number, against: readonly (number | null | undefined)[], mark: string): string {
  if (!Number.isFinite(si)) return qt(quantity, si);
  const others = against.filter((a): a is number => a != null && Number.isFinite(a)).map(String);
  return `⟦${quantity}|${String(si)}${others.length || mark.startsWith("bound") || mark === SENT_MARK ? `|${mark}${others.join(",")}` : ""}⟧`; // a bound keeps its mark alone
}

/**
 * A quantity token for a reading that a text compares with limits: `⟦flow|0.02776|0.027777777777777776⟧`.
 * Rendered as {@link qt}'s, with more decimals (see {@link fmtNumExact}) while, in the reader's unit, it
 * would read as one of `against` though it is not: a flow judged short never reads as the duty
 * ("99.96 m³/h", not "100.0 m³/h"). Write each limit shown beside it with {@link qtLimit}, the reading in
 * its `against`: both then print at decimals where they differ, so they read in the order of their values.
 * Values are kept exactly (not to 6 digits), so the render compares what the engine compared.
 * @param quantity physical quantity of the value and of `against` (unitless id)
 * @param si the reading in SI (temperature in °C)
 * @param against the limits it is compared with, in SI (missing or non-finite ones are left out)
 */
export function qtExact(quantity: Quantity, si: number, against: readonly (number | null | undefined)[]): string {
  return apartToken(quantity, si, against, "");
}

/**
 * A quantity token for a reading whose side of zero decides (NPSHa: at or below zero the liquid boils at the inlet
 * whatever the pump): `⟦head|1e-15|zero:2.25⟧`. Rendered as {@link qtExact}'s, read apart from zero too, except where
 * the reader's unit at three decimals would show it as zero though it is not: "< 0.001 m" above zero, "below 0 m" below
 * ({@link nearZeroWords}) — never an exponent ("1.00e-15 m") nor a string of zeros ("-0.000001 m"; decisions "npshzero",
 * "npshone"; as the NPSH margin ratio's "< 0.01"). Every NPSHa printed in a text is written with it, either side of zero.
 * @param quantity physical quantity of the value and of `against` (unitless id)
 * @param si the reading in SI
 * @param against the values it is compared with besides zero, in SI (missing or non-finite ones are left out)
 */
export function qtAboveZero(quantity: Quantity, si: number, against: readonly (number | null | undefined)[]): string {
  if (!Number.isFinite(si)) return qt(quantity, si);
  const others = against.filter((a): a is number => a != null && Number.isFinite(a)).map(String);
  return `⟦${quantity}|${String(si)}|${ZERO_MARK}${others.join(",")}⟧`;
}

/**
 * A quantity token for a limit shown beside the readings judged against it: as {@link qtExact}, but the
 * decimals added to tell it apart are written without trailing zeros (a limit as typed: "100 m³/h" beside
 * 99.96 m³/h, "440.3 gpm" beside 440.1 gpm).
 * @param quantity physical quantity of the limit and of `readings` (unitless id)
 * @param si the limit in SI (temperature in °C)
 * @param readings the readings judged against it, in SI (missing or non-finite ones are left out)
 */
export function qtLimit(quantity: Quantity, si: number, readings: readonly (number | null | undefined)[]): string {
  return apartToken(quantity, si, readings, LIMIT_MARK);
}

/**
 * A quantity token for the end of a range a refusal names ("it takes from 0 to 3 280 839 ft"): as {@link qtLimit}, grouped
 * by spaces and without trailing zeros; with `side`, rounded inward where the unit shown would round it outside the range
 * (limitText.ts {@link boundInward}), so the number printed, typed back, is taken (decision "inputedge").
 * @param quantity physical quantity of the end and of `readings` (unitless id)
 * @param si the end in SI (temperature in °C)
 * @param readings the values refused against it, in SI (missing or non-finite ones are left out)
 * @param side which end of the range it is ("min", "max"; unitless)
 */
export function qtBound(quantity: Quantity, si: number, readings: readonly (number | null | undefined)[], side?: "min" | "max"): string {
  return apartToken(quantity, si, readings, side ? `bound-${side}:` : BOUND_MARK);
}

/**
 * A quantity token for a number refused against a range's ends ("not 3 600 000 000 m³/h"): as {@link qtExact}, grouped as the ends.
 * @param quantity physical quantity of the value and of `against` (unitless id)
 * @param si the value sent, in SI (temperature in °C)
 * @param against the range's ends it is refused against, in SI
 */
export function qtSent(quantity: Quantity, si: number, against: readonly (number | null | undefined)[]): string {
  return apartToken(quantity, si, against, SENT_MARK);
}

/**
 * A quantity token for a value set in steps of one unit (a trimmed impeller in whole mm, setting-step.ts), read in the
 * reader's unit and, where that is another, in the step's unit too, in brackets as dual dimensions are written: "Ø169 mm"
 * in mm, "Ø6.65 in [169 mm]" in inches, so a text that says "the next whole mm" shows the whole mm it names. Each reading
 * as {@link qtExact}'s, apart from `against` (the steps beside it).
 * @param quantity physical quantity of the value (unitless id)
 * @param si the value in SI
 * @param unit the step's unit id (e.g. "mm"), one of the quantity's units
 * @param against the values it must read apart from (SI; missing or non-finite ones are left out)
 */
export function qtAlsoIn(quantity: Quantity, si: number, unit: string, against: readonly (number | null | undefined)[]): string {
  if (!Number.isFinite(si)) return qt(quantity, si);
  const others = against.filter((a): a is number => a != null && Number.isFinite(a)).map(String);
  return `⟦${quantity}|${String(si)}|${ALSO_MARK}${unit}:${others.join(",")}⟧`;
}

/**
 * A reading and the limit it is judged against, as {@link qtExact} and {@link qtLimit} tokens of each other.
 * @param quantity physical quantity of both (unitless id)
 * @param reading the reading in SI
 * @param limit the limit in SI
 */
export function qtPair(quantity: Quantity, reading: number, limit: number): [string, string] {
  return [qtExact(quantity, reading, [limit]), qtLimit(quantity, limit, [reading])];
}

/** Decimals of the magnitude rule (≥100: 0, ≥10: 1, ≥1: 2, else 3). */
const decimalsFor = (x: number) => (Math.abs(x) >= 100 ? 0 : Math.abs(x) >= 10 ? 1 : Math.abs(x) >= 1 ? 2 : 3);
/** The most decimals that show a value and its limits to MAX_SIGNIFICANT digits (count). */
const maxDecimals = (base: number, values: readonly number[]) => {
  const m = Math.max(...values.map(Math.abs));
  return m > 0 ? Math.min(20, Math.max(base, MAX_SIGNIFICANT - 1 - Math.floor(Math.log10(m)))) : base;
};
/** Significant digits of a non-zero value too small for its decimals, or too large for its whole digits (count). */
const TINY_SIGNIFICANT = 3;
/**
 * From this magnitude up, in the unit shown, a number reads in exponent form, 3 significant digits ("3.28e+12 ft"), more
 * where it is compared and would read as its neighbour (fmtExpExact): its whole digits would pass the 9 significant digits
 * the words ever tell apart (MAX_SIGNIFICANT), printing digits no double or datum holds — 1e12 m read "3280839895013 ft",
 * 1e21 m "3.2808398950131234e+21 ft" (toFixed's own exponent, 17 digits), 1e12 m³/s "15850323141488904 gpm" (decision
 * "npshzero", the numbers' ends). The same rule as a number too small for its decimals ("1.00e-15"): one form at both ends.
 * Not a range's end nor the number refused against it (qtBound, qtSent): those keep their whole digits, grouped
 * ("±3 280 839 895 013 ft"), as the reader types them back.
 */
export const LARGE_FROM = 10 ** MAX_SIGNIFICANT;
/** "-0.000" reads as zero: drop the sign of a rounded zero. */
const unsignedZero = (t: string) => (/^-0(\.0*)?$/.test(t) ? t.slice(1) : t);
/**
 * From this magnitude up to {@link LARGE_FROM}, in the unit shown, a number read as whole digits has them grouped in threes
 * by a narrow no-break space, as a range's end and the number refused are (limitText.ts `groupThousands`; SI Brochure 9th
 * ed. 5.4.4): "1 234 567 m", where it read "1234567 m" (helper "numtext"). Every whole digit is kept: a plain `qt` token
 * carries 6 significant digits of the SI value, so from here its seventh digit on is that rounding ("1 234 570 m" for
 * 1 234 567 m); `qtExact`'s keep up to 9 significant digits where they tell it from a limit. Below it, four to six digits
 * stay ungrouped as before ("12345 m"): the whole-digit numbers of the pages' tables.
 */
export const GROUPED_FROM = 1e6;
/** Whole digits grouped (GROUPED_FROM ≤ |x| < LARGE_FROM); any other text unchanged. */
const grouped = (x: number, t: string) => (Math.abs(x) >= GROUPED_FROM && Math.abs(x) < LARGE_FROM ? groupThousands(t) : t);
/** The significant-digit form of a non-zero number too small for its decimals ("4.00e-7", "0.000400"), with more digits while it would read as one of `others`. */
function tinyExact(x: number, others: readonly number[]): string {
  let p = TINY_SIGNIFICANT;
  while (p < 12 && others.some((a) => a !== x && Number(a.toPrecision(p)) === Number(x.toPrecision(p)))) p++;
  return x.toPrecision(p);
}

const INTEGER = new Intl.NumberFormat("en-GB", { maximumFractionDigits: 0 });
/** A whole number with thousands separators, e.g. 12345 → "12,345"; "—" when missing (re-exported by `app/lib/shared/format.ts`). */
export const fmtInt = (x: number | null | undefined) => (x == null || !Number.isFinite(x) ? "—" : INTEGER.format(x));

/**
 * A number for reading (not a form field): fixed decimals chosen per magnitude (≥100: 0, ≥10: 1, ≥1: 2, else 3); "—" when missing.
 * A non-zero number those decimals would show as zero gets 3 significant digits instead (4e-7 → "4.00e-7",
 * 0.0004 → "0.000400", not "0.000"), and so does one from {@link LARGE_FROM} up (3.28e12 → "3.28e+12"); from
 * {@link GROUPED_FROM} up to it whole digits grouped in threes ("1 234 567", every whole digit kept); a rounded zero never
 * carries a minus sign ("-0.000" → "0.000"). The minus is ASCII here; a quantity's text writes "−" ({@link trueMinus}).
 * @param x the number, in any unit
 * @param digits decimals wanted instead (count; then a small number may read as zero, but unsigned)
 */
export function fmtNum(x: number | null | undefined, digits?: number): string {
  if (x == null || !Number.isFinite(x)) return "—";
  return digits === undefined ? grouped(x, plainNum(x)) : plainNum(x, digits);
}

/** {@link fmtNum} without the grouping of whole digits (a range's end and the number refused are grouped by their own path). */
function plainNum(x: number, digits?: number): string {
  if (digits === undefined && Math.abs(x) >= LARGE_FROM) return x.toPrecision(TINY_SIGNIFICANT);
  const t = x.toFixed(digits ?? decimalsFor(x));
  if (digits === undefined && x !== 0 && Number(t) === 0) return x.toPrecision(TINY_SIGNIFICANT);
  return unsignedZero(t);
}

/**
 * A number in a text that compares it with others (a reading with its limits, or a limit with its
 * readings): as {@link fmtNum}, with more decimals (up to 9 significant digits) while it would read the same as one of
 * `against`, or as zero, though it is not ("1.0996" beside a required 1.1, not "1.10"). Two numbers
 * printed this way, each with the other in `against`, read in the order of their values. A limit
 * (`limit`) drops the trailing zeros of the decimals added only for this ("100" beside 99.96, not "100.00").
 * @param x the number, in any unit
 * @param against the numbers it is compared with, in the same unit
 * @param digits decimals at the least (count; default the magnitude rule)
 * @param limit whether x is the limit (true) or the reading (false, default) (unitless)
 * @param whole (unitless) whether a number from {@link LARGE_FROM} up keeps its whole digits (true: a range's end or the
 *   number refused against it, grouped and typed back, limitText.ts) or reads in exponent form (false, default)
 */
export function fmtNumExact(x: number | null | undefined, against: readonly (number | null | undefined)[] = [], digits?: number, limit = false, whole = false): string {
  if (x == null || !Number.isFinite(x)) return "—";
  const t = exactText(x, against, digits, limit, whole);
  return digits === undefined && !whole ? grouped(x, t) : t; // a range's end and the number refused: grouped by their callers
}

function exactText(x: number, against: readonly (number | null | undefined)[], digits: number | undefined, limit: boolean, whole: boolean): string {
  const base = digits ?? decimalsFor(x);
  const others = [0, ...against].filter((a): a is number => a != null && Number.isFinite(a) && a !== x);
  if (digits === undefined && !whole && Math.abs(x) >= LARGE_FROM) return fmtExpExact(x, others, TINY_SIGNIFICANT - 1); // exponent form, apart
  const shown = (v: number, d: number) => Number(v.toFixed(d)); // -0 and 0 read the same
  // Too small for its decimals: the significant-digit form fmtNum and a plain qt token give it ("1.00e-15 m"), with more
  // digits while it reads as one of `against`; never the run of zeros that decimals added until it is apart from zero
  // wrote ("0.000000000000001 m"; helper "numtext"). A range's end keeps its decimals (typed back, limitText.ts).
  if (digits === undefined && !whole && x !== 0 && shown(x, base) === 0) return tinyExact(x, others);
  const most = maxDecimals(base, [x, ...others]);
  let d = base;
  while (d < most && others.some((a) => shown(a, d) === shown(x, d))) d++;
  if (d === base) return plainNum(x, digits ?? (whole && Math.abs(x) >= LARGE_FROM ? 0 : undefined));
  if (shown(x, d) === 0) return plainNum(x); // still reads as zero: significant digits
  const t = x.toFixed(d);
  return unsignedZero(limit ? t.replace(/0+$/, (zeros) => zeros.slice(d - base)).replace(/\.$/, "") : t);
}

/**
 * A number in exponent form ("4.00e+3") beside the numbers it is judged against, with more digits (up to 12) while it
 * would read as one of them though it is not: a Reynolds number of 3999.6 is "3.9996e+3" beside the turbulent 4000,
 * not "4.00e+3"; "—" when missing.
 * @param x the number (any unit)
 * @param against the numbers it is compared with, as printed beside it (same unit)
 * @param digits digits after the point at the least (count)
 */
export function fmtExpExact(x: number | null | undefined, against: readonly number[] = [], digits = 2): string {
  if (x == null || !Number.isFinite(x)) return "—";
  let d = digits;
  while (d < 12 && against.some((a) => a !== x && Number(x.toExponential(d)) === Number(a.toExponential(d)))) d++;
  return x.toExponential(d);
}

/**
 * An SI value as text in the unit chosen for its quantity, e.g. `"42.0 m³/h"`; "—" for a missing or non-finite value.
 * @param units unit id per quantity (unitless ids)
 * @param q physical quantity (unitless id)
 * @param si the value in SI (temperature in °C)
 * @param digits decimals wanted instead of the magnitude rule (count)
 */
export function fmtQuantity(units: UnitPreset, q: Quantity, si: number | null | undefined, digits?: number): string {
  if (si == null || !Number.isFinite(si)) return "—";
  const unit = units[q];
  return `${trueMinus(fmtNum(fromSI(q, unit, si), digits))} ${unitLabel(q, unit)}`;
}

/**
 * A reading judged by its side of zero (NPSHa), as text in the unit chosen for its quantity: where three decimals in that
 * unit would show it as zero though it is not, "< 0.001 m" above zero and "below 0 m" below ({@link nearZeroWords});
 * otherwise as {@link fmtQuantityExact}, read apart from zero and from `against`.
 * @param units unit id per quantity (unitless ids)
 * @param q physical quantity of the value and of `against` (unitless id)
 * @param si the value in SI
 * @param against the values it is compared with besides zero, in SI
 */
export function fmtQuantityAboveZero(units: UnitPreset, q: Quantity, si: number | null | undefined, against: readonly (number | null | undefined)[] = []): string {
  if (si == null || !Number.isFinite(si)) return "—";
  const unit = units[q];
  const words = nearZeroWords(fromSI(q, unit, si));
  if (words) return `${words} ${unitLabel(q, unit)}`;
  return fmtQuantityExact(units, q, si, [0, ...against]);
}

/**
 * An SI value compared with others, as text in the unit chosen for its quantity: as {@link fmtQuantity}, with
 * the decimals {@link fmtNumExact} adds while it would read as one of `against` in that unit, though it is not.
 * @param units unit id per quantity (unitless ids)
 * @param q physical quantity of the value and of `against` (unitless id)
 * @param si the value in SI (temperature in °C)
 * @param against the values it is compared with, in SI
 * @param limit whether si is the limit (its added decimals without trailing zeros) or the reading (default) (unitless)
 * @param whole (unitless) whether a number from {@link LARGE_FROM} up keeps its whole digits (a number refused, grouped)
 */
export function fmtQuantityExact(units: UnitPreset, q: Quantity, si: number | null | undefined, against: readonly (number | null | undefined)[], limit = false, whole = false): string {
  if (si == null || !Number.isFinite(si)) return "—";
  const unit = units[q];
  const shown = (v: number) => (v === si ? NaN : fromSI(q, unit, v)); // an equal value is no other value
  return `${trueMinus(fmtNumExact(fromSI(q, unit, si), against.filter((a): a is number => a != null && Number.isFinite(a)).map(shown), undefined, limit, whole))} ${unitLabel(q, unit)}`;
}

const isQuantity = (x: string): x is Quantity => Object.prototype.hasOwnProperty.call(UNITS, x);

/**
 * Renders the quantity tokens of a text in the chosen units. A token of an unknown quantity or
 * with a value (or a value to read apart from) that is no number stays as written (visible, so a wrong token is noticed); NaN
 * renders as "—"; text without tokens comes back unchanged.
 * @param text the text with tokens (unitless)
 * @param units unit id per quantity (unitless ids)
 */
export function renderQuantities(text: string, units: UnitPreset): string {
  if (!text.includes("⟦")) return text;
  return text.replace(QUANTITY_TOKEN, (whole, q: string, raw: string, apart: string | undefined) => {
    if (!isQuantity(q)) return whole;
    if (raw === "NaN") return "—";
    const x = raw.trim() === "" ? NaN : Number(raw);
    if (!Number.isFinite(x)) return whole;
    const boundMark = apart === undefined ? null : BOUND_MARKS.exec(apart);
    const sent = apart?.startsWith(SENT_MARK) ?? false;
    const limit = !!boundMark || (apart?.startsWith(LIMIT_MARK) ?? false);
    const zero = apart?.startsWith(ZERO_MARK) ?? false;
    // qtAlsoIn: "also:mm:0.168,0.17" — the step's unit (one of the quantity's), then the values to read apart from.
    const also = apart?.startsWith(ALSO_MARK) ? /^also:([^:]+):(.*)$/.exec(apart) : null;
    if (apart?.startsWith(ALSO_MARK) && (!also || !UNITS[q].some((d) => d.id === also[1]))) return whole;
    const list = also ? also[2] : apart === undefined ? undefined : apart.slice(boundMark ? boundMark[0].length : sent ? SENT_MARK.length : limit ? LIMIT_MARK.length : zero ? ZERO_MARK.length : 0);
    const against = list === undefined || ((zero || boundMark || sent || also) && list === "") ? [] : list.split(",").map((a) => (a.trim() === "" ? NaN : Number(a)));
    if (!against.every(Number.isFinite)) return whole;
    try {
      if (also) {
        const shown = fmtQuantityExact(units, q, x, against);
        return units[q] === also[1] ? shown : `${shown} [${fmtQuantityExact({ ...units, [q]: also[1] }, q, x, against)}]`;
      }
      if (zero) return fmtQuantityAboveZero(units, q, x, against);
      const v = fromSI(q, units[q], x); // a bound: grouped, rounded inward where it names its side (limitText.ts)
      if (boundMark) return `${trueMinus(groupThousands(boundInward(fmtNumExact(v, against.map((a) => (a === x ? NaN : fromSI(q, units[q], a))), undefined, true, true), v, boundMark[1] as "min" | "max" | undefined)))} ${unitLabel(q, units[q])}`;
      if (sent) return groupThousands(fmtQuantityExact(units, q, x, against, false, true)); // both whole, grouped: typed back
      return against.length ? fmtQuantityExact(units, q, x, against, limit) : fmtQuantity(units, q, x);
    } catch (e) {
      if (e instanceof EngineInputError) return whole; // past a double in this unit (a typed ⟦flow|1e308⟧ in m³/h): as written
      throw e;
    }
  });
}

/** Renders in the SI preset (SI: for tests and exports that keep SI). */
export const inSI = (text: string): string => renderQuantities(text, UNIT_SYSTEMS.SI);
