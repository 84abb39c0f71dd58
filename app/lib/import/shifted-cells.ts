/**
 * A row with numbers beyond the header's columns (pure; full path only — the fast path steps aside for any extra cell).
 * In a comma-separated file a number written with a decimal comma and no quotes, “27,5”, is two cells, “27” and “5”:
 * every cell after it moves one column right and the last spills past the header. Read by their columns, head 27.5 was
 * taken as 27 and the efficiency column got the “5” (5 %) — with a warning only that “they were ignored”. Now a row whose
 * cells beyond the header hold a number is an `extra-cells` error charged to its curve, naming the row's cells as written
 * and the rule; its point is left out (the curve too under skip-curves). Text beyond the header (a note) stays a warning.
 */
import { looksNumeric } from "./numbers";

/** Cells of a row quoted in a message: at most this many characters, then “…”. */
const SHOWN = 160;

/**
 * How many of the row's cells beyond the header's columns are filled (not blank once trimmed): one pass, no copy of the
 * row (a 10 MB line is 5 M cells).
 * @param cells the row's cells as parsed
 * @param width the header's columns
 */
export function filledCellsBeyond(cells: readonly string[], width: number): number {
  let n = 0;
  for (let i = width; i < cells.length; i++) if (cells[i].trim() !== "") n++;
  return n;
}

/**
 * The row's cells as written, trimmed and joined by " | ", cut to `SHOWN` characters with "…": joined only as far as the
 * message shows (the same text as joining them all and cutting).
 */
function shownCells(cells: readonly string[]): string {
  let written = "";
  for (let i = 0; i < cells.length; i++) {
    written += (i ? " | " : "") + cells[i].trim();
    if (written.length > SHOWN) return `${written.slice(0, SHOWN - 1)}…`;
  }
  return written;
}

/**
 * Why the row's values cannot be read by their columns, or null when its cells beyond the header hold no number.
 * @param cells the row's cells as parsed
 * @param width the header's columns
 */
export function shiftedRowReason(cells: readonly string[], width: number): string | null {
  // The first three numbers beyond the header are all the message names (one, or more than one).
  const numbers: string[] = [];
  for (let i = width; i < cells.length && numbers.length < 3; i++) {
    const x = cells[i].trim();
    if (x !== "" && looksNumeric(x)) numbers.push(x);
  }
  if (numbers.length === 0) return null;
  return (
    `row has ${filledCellsBeyond(cells, width)} filled cell(s) beyond the ${width} header columns, ${numbers.length === 1 ? "a number" : "numbers"} among them (“${numbers.join("”, “")}”); ` +
    `its cells as read: ${shownCells(cells)}. A number written with a decimal comma in a comma-separated file (27,5) is split in two and moves the cells after it one column right, ` +
    `so this row's values cannot be read by their columns — write 27.5 (a comma-separated file takes a decimal point), or remove the stray cells; the point is left out`
  );
}

/**
 * A decimal comma in the LAST named column spills into a column with no header ("Model,Flow,Head,Min flow" over
 * "A,10,20,12,5"): on every row, so the sniffer widens the header to an unnamed “Column 5”, which the mapping leaves out,
 * and “12” was read as the minimum flow without a word. A number in an unnamed column after the last named one, beside
 * a number in that last named column, is read as such a split (comma-separated files only: a `;` or tab file keeps
 * “12,5” in one cell). Text there (a note column without a header) is not: it stays an ignored column, as before.
 */
export interface UnnamedTail {
  /** Index of the last column whose header cell was written. */
  last: number;
  /** The unmapped columns after it whose header cell was blank (“Column N”, sniff.ts). */
  tail: number[];
}

/**
 * The unnamed, unmapped columns after the last named one, or null when there are none.
 * @param headers the sniffed names (a blank header cell is named “Column N”, 1-based)
 * @param mapped indices of the columns the mapping reads (any field but ignore)
 */
export function unnamedTailOf(headers: readonly string[], mapped: ReadonlySet<number>): UnnamedTail | null {
  const unnamed = (n: number) => headers[n] === `Column ${n + 1}`;
  let last = headers.length - 1;
  while (last >= 0 && unnamed(last)) last--;
  if (last < 0 || last === headers.length - 1) return null;
  const tail: number[] = [];
  for (let n = last + 1; n < headers.length; n++) if (!mapped.has(n)) tail.push(n);
  return tail.length ? { last, tail } : null;
}

/**
 * Why the row's last named cell cannot be taken as written (the column to charge and the reason), or null when no unnamed
 * cell after it holds a number, or the last named cell holds none.
 */
export function unnamedNumberReason(cells: readonly string[], headers: readonly string[], t: UnnamedTail): { column: string; reason: string } | null {
  const lastRaw = (cells[t.last] ?? "").trim();
  if (!looksNumeric(lastRaw)) return null;
  const at = t.tail.find((n) => looksNumeric((cells[n] ?? "").trim()));
  if (at === undefined) return null;
  const spill = (cells[at] ?? "").trim();
  const shown = shownCells(cells);
  const name = headers[t.last];
  return {
    column: name,
    reason:
      `${name} “${lastRaw}” is followed by a number, “${spill}”, in ${headers[at]}, a column with no header; its cells as read: ${shown}. ` +
      `A number in a column with no header beside a numeric last column is likely a decimal comma (${lastRaw},${spill}) split in two by the comma-separated file, ` +
      `so ${name} would read ${lastRaw} — write ${lastRaw}.${spill} (a comma-separated file takes a decimal point), or give the column a header if it holds values of its own; the point is left out`,
  };
}
