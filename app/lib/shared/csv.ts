// The one CSV writer for every export (selections, libraries, field checks): papaparse's unparse,
// with text that a spreadsheet would run as a formula (=, +, -, @, tab, CR first) prefixed by an
// apostrophe (OWASP "CSV Injection", common practice). Text that already starts with apostrophes
// before one of those characters ("'=X", "''+Y") gets one more too ("''=X", "'''+Y"), so that the
// importer, which takes exactly one apostrophe off such a cell (app/lib/import/text-cells.ts), gives
// back every name as it was; a spreadsheet also eats one leading apostrophe and shows the name.
// Numbers are written as numbers, never escaped, so negative values stay numeric.
import Papa from "papaparse";

/** Text starting with one of these is a formula to a spreadsheet. No `$` anchor: a newline must not end the test. */
export const FORMULA_START = /^[=+\-@\t\r]/;
/** Text the writer defuses with one more leading apostrophe: a formula start after none or more apostrophes. */
export const DEFUSE_START = /^'*[=+\-@\t\r]/;

export type CsvOptions = { newline?: "\r\n" | "\n"; /** significant digits for numbers (default: as given) */ precision?: number };

export function toCsv(rows: unknown[][], opts: CsvOptions = {}): string {
  const newline = opts.newline ?? "\r\n";
  const clean = rows.map((r) =>
    r.map((x) => {
      if (x == null) return "";
      if (typeof x === "number") return Number.isFinite(x) ? (opts.precision ? +x.toPrecision(opts.precision) : x) : "";
      return typeof x === "string" ? x : String(x);
    }),
  );
  return Papa.unparse(clean, { newline, escapeFormulae: DEFUSE_START, quotes: (v: unknown) => typeof v === "string" && /[;]/.test(v) }) + newline;
}
