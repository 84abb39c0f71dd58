/**
 * Text cells (model, type, size, notes) as written, undoing our CSV writer's formula defusing.
 *
 * app/lib/shared/csv.ts (`toCsv`, every export: libraries, selections, field checks, the tracer) puts
 * one apostrophe before text that starts with = + - @ tab or CR, so that a spreadsheet shows it
 * instead of running it as a formula (OWASP "CSV Injection", common practice). This is its inverse:
 * exactly one leading apostrophe is taken off when one of those characters follows it, nothing else.
 * The same characters as the writer's `FORMULA_START` (kept here too: import/ does not import
 * shared/csv.ts, which brings papaparse's writer; `text-cells.test.ts` checks the two agree).
 * Limit: a name that itself starts with an apostrophe before one of them ("'+X") is not defused by
 * the writer and comes back without it ("+X"); the writer would have to defuse a leading apostrophe
 * too to tell them apart.
 */
export const DEFUSED = /^'(?=[=+\-@\t\r])/;

/** The cell's text with the writer's one defusing apostrophe taken off. */
export function undefused(raw: string): string {
  return raw.charCodeAt(0) === 39 ? raw.replace(DEFUSED, "") : raw;
}

/** A text cell as the importer keeps it: undefused, then trimmed. */
export function textCell(raw: string): string {
  return undefused(raw).trim();
}
