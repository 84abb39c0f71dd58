// The mapping page's maker's-minimum-flow editor, read back (pure): one field per listed curve (`minflow.<n>`, n its number
// in the page's list, upload-min-flows.ts), typed in the reader's flow unit; blank clears the curve's figure. A changed
// figure becomes cell edits of the upload — the figure on every row of the curve, in the minimum-flow column's unit, or in a
// column added after the last ("Min flow (m3/h)" in the reader's unit, which the importer reads back) — that the service
// applies to make a corrected copy, as the fix grid's edits (upload-fix.server.ts). Refused, never a 500: a field for a
// curve the list does not hold (404), a figure that is not a number above zero (NaN, Infinity, 1e400, negative, 0, text
// of any length: 400 with the field's words), a figure at or past the curve's last published flow (400, both flows and
// the rule), column blocks (422: each block's figure is written in the file).
import type { CellEdit } from "../import";
import { SI_FACTOR, type Unit } from "../import/units-in-headers";
import { MIN_FLOW_RULE } from "../import/min-flow";
import { decimalMessage, MAX_MAGNITUDE, readDecimal } from "../shared/decimal";
import { fmtQExact, fromChosen, toChosen, type UnitChoice } from "../shared/units";
import type { MinFlowList } from "./upload-min-flows";

/** The importer's unit for the reader's flow unit (shared/units.ts ids), written in the header of an added column. */
const IMPORT_UNIT: Readonly<Record<string, Unit>> = { "m3/s": "m3/s", "m3/h": "m3/h", "L/s": "l/s", "L/min": "l/min", gpm: "gpm" };

/** A number as a cell or an input holds it: up to 12 significant digits, no trailing zeros (never the display's rounding). */
const plain = (x: number) => String(Number(x.toPrecision(12)));

/** The figure as the editor's input shows it: in the reader's flow unit, as the file gives it; "" for none. */
export const shownFigure = (si: number | null, units: UnitChoice): string => (si == null ? "" : plain(toChosen(units, "flow", si)));

export type MinFlowSave = { ok: true; edits: CellEdit[]; extraColumns: number; changed: number } | { ok: false; status: 400 | 404 | 422; error: string };

/**
 * The posted figures as edits of the upload's text.
 * @param list the page's curves (upload-min-flows.ts) as analysed with the mapping the page was served with
 * @param file the header's line, the header's width (columns) and whether numbers are written with a decimal comma
 */
export function readMinFlowForm(form: FormData, list: MinFlowList, units: UnitChoice, file: { headerLine: number; width: number; decimalComma: boolean }): MinFlowSave {
  const posted: [MinFlowList["rows"][number], FormDataEntryValue][] = [];
  for (const [k, value] of form) {
    if (!k.startsWith("minflow.")) continue;
    const id = k.slice("minflow.".length);
    const row = /^\d{1,6}$/.test(id) ? list.rows.find((r) => r.n === Number(id)) : undefined;
    if (!row) return { ok: false, status: 404, error: `No curve ${id.slice(0, 12)} on this page of the upload's curves (${list.rows.length ? `${list.rows[0].n}–${list.rows[list.rows.length - 1].n} of ${list.total}` : "none"}): reload the page.` };
    posted.push([row, value]);
  }
  const errors: string[] = [];
  const figures: { row: MinFlowList["rows"][number]; si: number | null }[] = [];
  for (const [row, value] of posted) {
    const raw = typeof value === "string" ? value.trim() : null;
    if (raw === shownFigure(row.minFlow, units)) continue; // unchanged: the file's cells stay as written
    const r = readDecimal(raw ?? value);
    const label = `the maker's minimum flow of ${row.name}`;
    if (r.kind === "blank") {
      if (row.minFlow !== null) figures.push({ row, si: null });
      continue;
    }
    if (r.kind !== "number") {
      errors.push(decimalMessage(r, label));
      continue;
    }
    const si = fromChosen(units, "flow", r.value);
    if (!(r.value > 0) || !(Math.abs(r.value) <= MAX_MAGNITUDE) || !Number.isFinite(si)) errors.push(`The maker's minimum flow of ${row.name} must be a number above zero (blank: none recorded).`);
    else if (row.lastFlow !== null && !(si < row.lastFlow))
      errors.push(`The maker's minimum flow of ${row.name}, ${fmtQExact(units, "flow", si, [row.lastFlow])}, is not below the curve's last published flow, ${fmtQExact(units, "flow", row.lastFlow, [si], true)}: ${MIN_FLOW_RULE}.`);
    else figures.push({ row, si });
  }
  if (errors.length) return { ok: false, status: 400, error: errors.join(" ") };
  if (figures.length && list.wide)
    return { ok: false, status: 422, error: "This file has column blocks (one per impeller or speed): write each curve's maker's minimum flow in a column of its block (“Qmin 250mm”) in the file, and upload it again." };
  const column = list.column ? { index: list.column.index, unit: list.column.unit as Unit } : { index: file.width, unit: IMPORT_UNIT[units.flow] ?? "m3/h" };
  const factor = SI_FACTOR.minflow[column.unit] ?? 1 / 3600;
  const cell = (si: number | null) => (si === null ? "" : file.decimalComma ? plain(si / factor).replace(".", ",") : plain(si / factor));
  const edits: CellEdit[] = figures.flatMap(({ row, si }) => row.lines.map((line) => ({ line, index: column.index, value: cell(si) })));
  const added = !list.column && figures.length > 0;
  if (added) edits.unshift({ line: file.headerLine, index: column.index, value: `Min flow (${column.unit})` });
  return { ok: true, edits, extraColumns: added ? 1 : 0, changed: figures.length };
}
