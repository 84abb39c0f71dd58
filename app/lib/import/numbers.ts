/**
 * Number parsing for vendor CSV cells. Pure: no Node or DOM APIs.
 *
 * Accepted (dot-decimal files):   12  12.5  .5  -3  1e-3  1,450 (thousands, only 1-3 leading digits then ,ddd groups)
 * Accepted (decimal-comma files): 12  12,5  ,5  -3  1.450 (thousands: leading digit 1-9, then .ddd groups)  1.450,25
 *   and, because mixed exports happen, a plain dot decimal like 0.785 or 12.5 that is not a thousands pattern.
 * Spaces around the cell are trimmed; inside it a space (also no-break, narrow no-break, thin) only groups thousands in threes
 * after the first one to three digits (1 450, 12 500,5 → 1450, 12500.5; the form reader's rule, shared/decimal.ts): any other
 * space ("1 4", "12 50", "38⏎.5" from a quoted cell) makes the cell no number — it was dropped, so "1 4" read as 14.
 * Anything else (units inside the cell, "n/a", "12.x") is NaN, and so is a number too small for a double
 * (1e-400 would read as 0; the form reader refuses it too): `underflows()` tells the two apart for the message.
 */

import { COMMA_DECIMAL, DOT_DECIMAL } from "../shared/decimal";

// One decimal number (DOT_DECIMAL, COMMA_DECIMAL) is the forms' grammar too (shared/decimal.ts); cells add thousands groups.
const EDGE_SPACES = /^[\s\u00a0\u202f\u2009]+|[\s\u00a0\u202f\u2009]+$/g;
const INNER_SPACE = /[\s\u00a0\u202f\u2009]/;
/** Digits grouped by one space in threes, then an optional decimal part (the form reader's SPACE_GROUPS). */
const SPACE_GROUPED = /^[+-]?\d{1,3}(?:[ \u00a0\u202f\u2009]\d{3})+(?:[.,]\d*)?$/;

/** The cell without the spaces around it and its thousands-group spaces; a cell with any other space inside gives "" + a space (no number). */
function compact(raw: string): string {
  const s = raw.replace(EDGE_SPACES, "");
  if (!INNER_SPACE.test(s)) return s;
  return SPACE_GROUPED.test(s) ? s.replace(/[ \u00a0\u202f\u2009]/g, "") : " ";
}

/** True when the cell has a space inside it that is no thousands group ("1 4", "38⏎.5"): parseNumber gives NaN, and the message says why. */
export function strayInnerSpace(raw: string): boolean {
  return compact(raw) === " ";
}
const DOT_THOUSANDS = /^[+-]?[1-9]\d{0,2}(?:,\d{3})+(?:\.\d+)?$/;
const COMMA_THOUSANDS = /^[+-]?[1-9]\d{0,2}(?:\.\d{3})+(?:,\d+)?$/;

/** The cell's number by the grammar (NaN when it is none), before the range check: 1e-400 reads 0 here. */
function grammarValue(s: string, decimalComma: boolean): number {
  if (s === "") return Number.NaN;
  if (decimalComma) {
    if (COMMA_THOUSANDS.test(s)) return Number(s.replace(/\./g, "").replace(",", "."));
    if (COMMA_DECIMAL.test(s)) return Number(s.replace(",", "."));
    if (DOT_DECIMAL.test(s)) return Number(s);
    return Number.NaN;
  }
  if (DOT_DECIMAL.test(s)) return Number(s);
  if (DOT_THOUSANDS.test(s)) return Number(s.replace(/,/g, ""));
  return Number.NaN;
}

/** Read as 0 though its digits are not all zero (1e-400, or 0.000…1 past a double's range): refused, as the form reader refuses it (shared/decimal.ts). */
const underflowed = (x: number, s: string) => x === 0 && /[1-9]/.test(s.split(/[eE]/)[0]);

export function parseNumber(raw: string, decimalComma: boolean): number {
  const s = compact(raw);
  const x = grammarValue(s, decimalComma);
  return underflowed(x, s) ? Number.NaN : x;
}

/** True when the cell is a number by the grammar but too small for a double (it would read as 0): parseNumber gives NaN, and the message says why. */
export function underflows(raw: string, decimalComma: boolean): boolean {
  const s = compact(raw);
  return underflowed(grammarValue(s, decimalComma), s);
}

/** True when the cell reads as a number under either convention (used by the sniffer before the convention is known). */
export function looksNumeric(raw: string): boolean {
  const s = compact(raw);
  return !Number.isNaN(grammarValue(s, false)) || !Number.isNaN(grammarValue(s, true));
}

/** A cell like 12,5 or -0,75: digits, one comma, digits, no dot. Evidence for a decimal comma. */
export function isCommaDecimalCell(raw: string): boolean {
  return /^[+-]?\d+,\d+$/.test(compact(raw));
}

/** A cell like 12.5 (dot, not a possible thousands group like 1.450). Evidence against a decimal comma. */
export function isDotDecimalCell(raw: string): boolean {
  const s = compact(raw);
  return /^[+-]?\d*\.\d+$/.test(s) && !COMMA_THOUSANDS.test(s);
}
