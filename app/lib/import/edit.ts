/**
 * Cell corrections made in the browser, applied to the upload's text to make the corrected file
 * (kept as a new upload beside the original). Only the edited lines change; every other line is
 * kept as it was. Pure.
 */
import type { Delimiter } from "./parse";
import { normaliseNewlines, parseRows, stripBom } from "./parse";

export interface CellEdit {
  /** 1-based source line (as in problems and SourceRow.line). */
  line: number;
  /** 0-based column index. */
  index: number;
  value: string;
}

export class EditRefused extends Error {}

export const MAX_EDITS = 2000;
export const MAX_CELL_CHARS = 200;

/** One CSV field, quoted when it holds the delimiter, a quote or leading/trailing spaces. */
export function csvField(x: string, delimiter: Delimiter): string {
  return x.includes(delimiter) || x.includes('"') || /^\s|\s$/.test(x) ? `"${x.replace(/"/g, '""')}"` : x;
}

/**
 * Applies the edits to `text` and returns the corrected text (LF line ends). Throws EditRefused for
 * an edit outside the file, of a line that is not a single record (a quoted cell spanning lines),
 * or with a line break in the value.
 */
export function applyCellEdits(text: string, delimiter: Delimiter, edits: CellEdit[], width: number): string {
  if (edits.length > MAX_EDITS) throw new EditRefused(`at most ${MAX_EDITS} cells can be corrected at once`);
  const body = normaliseNewlines(stripBom(text).text);
  const lines = body.split("\n");
  const byLine = new Map<number, CellEdit[]>();
  for (const e of edits) {
    if (!Number.isInteger(e.line) || e.line < 1 || e.line > lines.length) throw new EditRefused(`line ${e.line} is not in the file`);
    if (!Number.isInteger(e.index) || e.index < 0 || e.index >= Math.max(width, 1)) throw new EditRefused(`column ${e.index + 1} is not in the file`);
    if (/[\r\n]/.test(e.value)) throw new EditRefused(`line ${e.line}: a cell cannot hold a line break`);
    if (e.value.length > MAX_CELL_CHARS) throw new EditRefused(`line ${e.line}: a cell holds at most ${MAX_CELL_CHARS} characters`);
    byLine.set(e.line, [...(byLine.get(e.line) ?? []), e]);
  }
  for (const [line, list] of byLine) {
    const parsed = parseRows(lines[line - 1], { delimiter });
    if (parsed.rows.length > 1 || parsed.issues.length) throw new EditRefused(`line ${line} is not one complete row; correct it in the file`);
    const cells = [...(parsed.rows[0]?.cells ?? [""])];
    if (list.every((e) => (cells[e.index] ?? "") === e.value)) continue; // unchanged: the line stays as written
    for (const e of list) {
      while (cells.length <= e.index) cells.push("");
      cells[e.index] = e.value;
    }
    lines[line - 1] = cells.map((c) => csvField(c, delimiter)).join(delimiter);
  }
  return lines.join("\n");
}
