/**
 * Text cells (model, type, size, notes) as written, undoing our CSV writer's formula defusing.
 *
 * app/lib/shared/csv.ts (`toCsv`, every export: libraries, selections, field checks, the tracer) puts
 * one apostrophe before text that starts with = + - @ tab or CR, so that a spreadsheet shows it
 * instead of running it as a formula (OWASP "CSV Injection", common practice), and one before text
 * that starts with apostrophes followed by one of them ("'=X" is written "''=X"), so that no name is
 * written as another one's defused form. This is its inverse: exactly one leading apostrophe is taken
 * off when none or more apostrophes and then one of those characters follow it, nothing else; every
 * name the writer wrote comes back as it was ("'=X", "=X", "''+Y"). The same characters as the
 * writer's `DEFUSE_START` (kept here too: import/ does not import shared/csv.ts, which brings
 * papaparse's writer; `text-cells.test.ts` checks the two agree).
 * A vendor's own "'+X" (a spreadsheet's text marker) is read as "+X", as before.
 */
export const DEFUSED = /^'(?='*[=+\-@\t\r])/;

/** The cell's text with the writer's one defusing apostrophe taken off. */
export function undefused(raw: string): string {
  return raw.charCodeAt(0) === 39 ? raw.replace(DEFUSED, "") : raw;
}

/** A text cell as the importer keeps it: undefused, then trimmed. */
export function textCell(raw: string): string {
  return undefused(raw).trim();
}
