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
 * Why the row's values cannot be read by their columns, or null when its cells beyond the header hold no number.
 * @param cells the row's cells as parsed
 * @param width the header's columns
 */
export function shiftedRowReason(cells: readonly string[], width: number): string | null {
  const extra = cells.slice(width).filter((x) => x.trim() !== "");
  const numbers = extra.filter((x) => looksNumeric(x.trim()));
  if (numbers.length === 0) return null;
  const written = cells.map((c) => c.trim()).join(" | ");
  const shown = written.length > SHOWN ? `${written.slice(0, SHOWN - 1)}…` : written;
  return (
    `row has ${extra.length} filled cell(s) beyond the ${width} header columns, ${numbers.length === 1 ? "a number" : "numbers"} among them (“${numbers.slice(0, 3).map((x) => x.trim()).join("”, “")}”); ` +
    `its cells as read: ${shown}. A number written with a decimal comma in a comma-separated file (27,5) is split in two and moves the cells after it one column right, ` +
    `so this row's values cannot be read by their columns — write 27.5 (a comma-separated file takes a decimal point), or remove the stray cells; the point is left out`
  );
}
