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

/** A line break with the blanks around it: a model name is one line, so a quoted “Pump⏎X” is read “Pump X” (DEVELOPERS.md, Decisions). */
const LINE_BREAK = /\s*[\r\n\u2028\u2029]+\s*/g;

/** True when the text holds a line break (a quoted cell written on two lines). */
export function hasLineBreak(s: string): boolean {
  return /[\r\n\u2028\u2029]/.test(s);
}

/** The text on one line: each line break, with the blanks around it, folded to one space. */
export function oneLine(s: string): string {
  return hasLineBreak(s) ? s.replace(LINE_BREAK, " ") : s;
}
