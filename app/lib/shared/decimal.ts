// Numbers typed into a form field: the one strict reader every form uses (system editor, load profile,
// candidate adjustment, purchase price, field check, mapping defaults, the list filters). Pure: server
// and browser. The grammar of one decimal number is shared with the CSV importer (`import/numbers.ts`,
// which adds thousands groups and a per-file decimal-comma flag on top of it).
//
// Product rules (what the forms accept):
//  - an optional sign (+, - or the minus sign U+2212), digits with at most one decimal separator — a
//    point, or a comma as written in much of Europe — and an optional exponent (1.5e3), the whole
//    within the finite range of a double; whitespace around it is trimmed;
//  - refused: hex/binary/octal prefixes (0x10, 0b11, 0o7: Number() would take them), Infinity, NaN,
//    digit separators other than space groups (1_000, 1'500, 1 50), more than one separator (1,500.5, 1.2.3), an
//    exponent past the range (1e309 overflows; 1e-400 would silently be 0);
//  - a comma followed by exactly three digits and nothing else (1,500, -12,000) is ambiguous — a
//    thousands comma or a decimal comma — so it is refused with a message saying how to write either;
//    1,5 and 12,50 are decimals, and so is 0,500 (no one groups thousands after a lone 0, the CSV
//    importer's rule too). A point with three digits (1.500, 2.125) stays a decimal point: that is how
//    fractional inches and feet are typed, and the importer reads dot-thousands only in comma files;
//  - blank is its own answer: each form decides whether the field is required or what blank means.
//  - thousands grouped by spaces (space, no-break, narrow no-break, thin) strictly in threes after the first one to
//    three digits (2 450,50, 12 500, 3 280 839 ft; not 12 50 or 1 5000), the SI Brochure's and ISO 80000-1's way: a
//    space is never a decimal separator, so it is not ambiguous; the comma or point after them is the decimal. Every
//    field takes them (decision "inputedge"): the limits a refusal names are written so (engine limitText.ts), and a
//    limit copied or typed back as printed is read. The purchase price took them first (`spaceGroups`, now the rule).
//  - counts (fittings of a pipe run, the editor's run count, duty and standby pumps, life-cycle years: `countField`) are
//    stricter: decimal digits only, the field's minimum (0 unless said) to its maximum; a sign, point, comma, exponent or
//    prefix is an error, never rounded or dropped.

/** One number with a decimal point (12, 12.5, .5, 12., -3, 1e-3). Also the CSV importer's dot-decimal cell. */
export const DOT_DECIMAL = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;
/** One number with a decimal comma (12, 12,5, ,5, -3). Also the CSV importer's comma-decimal cell. */
export const COMMA_DECIMAL = /^[+-]?(?:\d+,?\d*|,\d+)(?:[eE][+-]?\d+)?$/;
/** Digits, a comma and exactly three digits: 1,500 could be fifteen hundred or one and a half. */
const AMBIGUOUS_COMMA = /^([+-]?)(\d*[1-9]\d*),(\d{3})$/;
/** Digits grouped by spaces (space, no-break, narrow no-break, thin) in threes, then an optional decimal part. */
const SPACE_GROUPS = /^([+-]?\d{1,3}(?:[ \u00a0\u202f\u2009]\d{3})+)([.,]\d*)?$/;
/** Digits in groups with separators (1,500.5, 1 500, 1.500,25): someone wrote thousands separators. */
const GROUPED = /^[+-]?\d+(?:[\s,.'\u00a0\u202f]\d+){2,}$|^[+-]?\d{1,3}(?:[\s'\u00a0\u202f]\d{3})+$/;

export type DecimalText =
  | { kind: "number"; value: number }
  | { kind: "blank" }
  /**
   * 1,500: the two readings, `thousands` (1500) and `decimalRead` (1.500, the digits typed), and `decimal` (1.5), the
   * shortest way to write the second.
   */
  | { kind: "ambiguous"; text: string; thousands: string; decimalRead: string; decimal: string }
  | { kind: "range"; text: string }
  | { kind: "bad"; text: string; grouped: boolean };

/** Reads a form value (anything that is not a string, such as a File, is bad text). */
export function readDecimal(raw: unknown, opts: { spaceGroups?: boolean } = {}): DecimalText {
  const spaceGroups = opts.spaceGroups ?? true; // every field: the limits are printed with them (decision "inputedge")
  if (raw == null) return { kind: "blank" };
  if (typeof raw !== "string") return { kind: "bad", text: "", grouped: false };
  let s = raw.trim().replace(/^\u2212/, "-");
  if (s === "") return { kind: "blank" };
  const groups = spaceGroups ? SPACE_GROUPS.exec(s) : null;
  if (groups) s = groups[1].replace(/[ \u00a0\u202f\u2009]/g, "") + (groups[2] ?? "");
  const amb = AMBIGUOUS_COMMA.exec(s);
  if (amb) return { kind: "ambiguous", text: s, thousands: `${amb[1]}${amb[2]}${amb[3]}`, decimalRead: `${amb[1]}${amb[2]}.${amb[3]}`, decimal: `${amb[1]}${amb[2]}${`.${amb[3]}`.replace(/\.?0+$/, "")}` };
  if (!DOT_DECIMAL.test(s) && !COMMA_DECIMAL.test(s)) return { kind: "bad", text: s, grouped: GROUPED.test(s) };
  const value = Number(s.replace(",", "."));
  const mantissa = s.split(/[eE]/)[0];
  if (!Number.isFinite(value) || (value === 0 && /[1-9]/.test(mantissa))) return { kind: "range", text: s };
  return { kind: "number", value: value === 0 ? 0 : value }; // -0 reads as 0
}

/**
 * Largest magnitude of a number typed into a form, and of any number in a stored system (SI): a head of 10⁴ m
 * or 10⁹ Pa is already far past any pump, and every value stays convertible to every display unit (factors up
 * to ~10⁷) without overflowing a double.
 */
export const MAX_MAGNITUDE = 1e12;

/** A list filter's number: the value when it is a number above zero, else undefined (junk, blank, 1,500, 0 or below: no filter). */
export function positiveFilter(raw: unknown): number | undefined {
  const x = decimalOrNaN(raw);
  return x > 0 ? x : undefined;
}

/** The number, or NaN for anything else (blank included): for filters where junk means "no filter". */
export function decimalOrNaN(raw: unknown): number {
  const r = readDecimal(raw);
  return r.kind === "number" ? r.value : Number.NaN;
}

const capital = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);
/** A whole number's digits grouped by spaces in threes, as the reader takes them back: "-12500" → "-12 500". */
const spaced = (s: string) => s.replace(/\B(?=(\d{3})+$)/g, " ");
const quoted = (s: string) => `“${s.length > 40 ? `${s.slice(0, 39)}…` : s}”`;

/**
 * The message for text that is not a number, for a field called `label` ("the duty flow", "Hours").
 * A blank field gets "Enter …" (for a required field). A number gets "".
 */
export function decimalMessage(r: DecimalText, label: string): string {
  const L = capital(label);
  switch (r.kind) {
    case "number":
      return "";
    case "blank":
      return `Enter ${label}.`;
    case "ambiguous":
      // Both readings named, never one guessed: "1,000" is 1000 with a thousands comma or 1.000 with a decimal comma.
      return `${L} ${quoted(r.text)} is ambiguous: ${r.thousands} (a thousands comma) or ${r.decimalRead} (a decimal comma)? Write ${r.thousands} or ${spaced(r.thousands)} for the first, ${r.decimal === r.decimalRead ? r.decimal : `${r.decimalRead} or ${r.decimal}`} for the second.`;
    case "range":
      return `${L} must be a number: ${quoted(r.text)} is out of range.`;
    case "bad":
      return r.grouped ? `${L} must be a number with one decimal point or comma, its thousands grouped by spaces in threes or not at all (like 1 500.5 or 1500.5), never by commas or points.` : `${L} must be a number.`;
  }
}

/**
 * One form field read into `errors`: the number; null when blank (with "Enter …" when `required`) or
 * when the text is not a number (its message set under `key`, unless the field already has one).
 */
export function decimalField(raw: unknown, key: string, label: string, errors: Record<string, string>, required = false): number | null {
  const r = readDecimal(raw);
  if (r.kind === "number") return r.value;
  if (r.kind !== "blank" || required) errors[key] ??= decimalMessage(r, label);
  return null;
}

/** A count as typed: decimal digits only (no sign, point, comma, exponent, prefix or separator). */
const COUNT_DIGITS = /^\d+$/;

/**
 * One count field (fittings of a pipe run, the editor's run count, duty and standby pumps, life-cycle years) read into
 * `errors`: a whole number from `min` (default 0) to `max` written in decimal digits, whitespace around it trimmed as for
 * every field; blank (or a missing field) is `blank`. Anything else — 0x10, 1e1, 2.5, 2,0, -1, +3, Infinity, past `max`
 * ("too many"), below `min` ("too few") — is an error under `key` that names the field, its range and what was typed (never a silent 0 or a
 * rounded or clamped count), and null. The form's maxima and minima come from its schema's limits.
 */
export function countField(raw: unknown, key: string, label: string, errors: Record<string, string>, max: number, blank = 0, min = 0): number | null {
  if (raw == null) return blank;
  const s = typeof raw === "string" ? raw.trim() : null;
  if (s === "") return blank;
  if (s !== null && COUNT_DIGITS.test(s)) {
    const n = Number(s);
    if (n >= min && n <= max) return n;
    if (n < min) {
      errors[key] ??= `${capital(label)} must be at least ${min} (a whole number from ${min} to ${max}): ${quoted(s)} is too few.`;
      return null;
    }
    // Digits past max: too many, said so (it read "written in digits: “51” is not", a reason it is not).
    errors[key] ??= `${capital(label)} must be at most ${max} (a whole number from ${min} to ${max}): ${quoted(s)} is too many.`;
    return null;
  }
  errors[key] ??= `${capital(label)} must be a whole number from ${min} to ${max}, written in digits${s === null ? "." : `: ${quoted(s)} is not.`}`;
  return null;
}
