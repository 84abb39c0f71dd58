/**
 * The units row: a row under the names that holds units only (",rpm,l/h,m"), merged by the sniffer into the names above
 * ("Flow" + "l/h" → "Flow l/h"). A cell of it is a unit some field reads or refuses (isUnitCell), or a unit no field knows
 * ("°C", "V": isUnknownUnitCell); the row is a units row when every filled cell is one of the two and the known units are
 * more than the unknown ones (unitsRowOf). Each unknown one is named to the user (unknownUnitProblems): the column is then
 * left unmapped, or read in an assumed unit, and the user is told which. Pure: no Node or DOM APIs.
 */
import type { Mapping } from "./mapping";
import type { SniffResult } from "./sniff";
import type { Problem } from "./types";
import { detectField, detectUnit, headerUnitRefusal, normaliseHeader, NUMERIC_FIELDS } from "./units-in-headers";
import { withoutExponentFlow } from "./flow-exponents";

/** Digits that belong to a unit's spelling (m3, 1/min, min-1, mH2O, ft3, cm2): any other digit is a value or a name. */
const UNIT_DIGITS = /m3|ft3|[ck]?m2|1\s*\/\s*min|min\s*-\s*1|h2o/g;

/** Longest unit no field knows that the row may hold ("dB(A)", "mm²/s", "kg/m³", "Celsius"): longer text is a name. */
const UNKNOWN_UNIT_CHARS = 10;

/** No digit outside a unit's spelling (a model "CM 32-160" above its points, a group label "2900 rpm" are not units). */
const unitDigitsOnly = (norm: string) => !/\d/.test(withoutExponentFlow(norm).replace(UNIT_DIGITS, "")); // "l·s⁻¹": flow-exponents.ts

/**
 * A cell of a units row: a unit word some field reads ("l/h", "rpm", "m", "(ft)", "%", "-", "Imp. gpm", "bkW") or refuses
 * ("kPa", "bar": merged into the header, the refusal is then named), with no field word of its own besides its unit's
 * ("rpm" is speed, "gpm" flow) and no number (a model "CM 32-160" above its points, a group label "2900 rpm" are not units).
 */
export function isUnitCell(cell: string): boolean {
  const norm = normaliseHeader(cell);
  if (norm === "" || !unitDigitsOnly(norm)) return false;
  const own = detectField(norm);
  return NUMERIC_FIELDS.some((f) => (own === "ignore" || own === f) && (detectUnit(f, norm) !== null || headerUnitRefusal(cell, f) !== null));
}

/** A cell that reads as a unit no field knows ("°C", "V", "A", "dB(A)", "cSt"): short, no digits outside a unit's spelling, no field word. */
export function isUnknownUnitCell(cell: string): boolean {
  const norm = normaliseHeader(cell);
  return norm !== "" && norm.length <= UNKNOWN_UNIT_CHARS && unitDigitsOnly(norm) && detectField(norm) === "ignore" && !isUnitCell(cell);
}

/** A row that is a units row: how many of its cells are known units, and which are unknown ones (0-based); null when it is not one. */
export function unitsRowOf(cells: readonly string[]): { known: number; unknown: number[] } | null {
  let known = 0;
  const unknown: number[] = [];
  for (let i = 0; i < cells.length; i++) {
    if (cells[i].trim() === "") continue;
    if (isUnitCell(cells[i])) known++;
    else if (isUnknownUnitCell(cells[i])) unknown.push(i);
    else return null;
  }
  return known > unknown.length ? { known, unknown } : null;
}

/** The units row as the sniffer found it: its line, its known units' count and its unknown units (column, unit, name above). */
export type UnitsRow = { line: number; known: number; unknown: { index: number; unit: string; name: string }[] };

/**
 * A `mapping` warning on the units row's line for each unit in it that no field knows, naming the unit, the column and
 * what becomes of the column under `mapping` (left unmapped, or read in a unit that is only assumed); none for a column
 * whose unit the user chose.
 */
export function unknownUnitProblems(sniff: Pick<SniffResult, "unitsRow" | "headers">, mapping: Mapping): Problem[] {
  const row = sniff.unitsRow;
  if (!row) return [];
  const filled = row.known + row.unknown.length;
  return row.unknown.flatMap(({ index, unit, name }) => {
    const header = sniff.headers[index] ?? unit;
    const c = mapping.columns.find((m) => m.index === index);
    if (c?.unitSource === "user") return [];
    const fate =
      !c || c.field === "ignore"
        ? "is left unmapped: if it holds curve values, choose its field and unit on the mapping page"
        : c.unit === null
          ? `is read as ${c.field}`
          : `is read as ${c.field} in ${c.unit}${c.unitSource === "default" ? ", assumed: check that unit, choose the right one on the mapping page, or convert the column" : ""}`;
    const reason =
      `“${unit}” in the units row (line ${row.line}, under “${name || `column ${index + 1}`}”) is not a unit the importer reads or refuses for any field ` +
      `(flow, head, NPSHr, impeller diameter, efficiency, power, speed). The row is still read as the units row, since ${row.known} of its ${filled} filled cells are units it knows ` +
      `(rule: the row under the names is a units row when each filled cell is a unit and the known units outnumber the unknown ones), so the column is named “${header}” and ${fate}.`;
    return [{ row: row.line, column: header, reason, severity: "warning" as const, code: "mapping" as const, curveKey: null }];
  });
}

/**
 * A row under a header written again mid-file that is a units row whose every unit is the unit its column is read in
 * (",rpm,mm,m3/h,m,%,kW,m" under columns read in those units): skipped with the header (index.ts). A unit another than the
 * column's ("l/s" under a flow read in m³/h) is not skipped: read as data, its cells are named, so rows in other units below
 * it are never read silently in the first header's units.
 */
export function unitsRowAgrees(cells: readonly string[], mapping: Mapping): boolean {
  if (unitsRowOf(cells) === null) return false;
  return cells.every((cell, i) => {
    if (cell.trim() === "") return true;
    const col = mapping.columns.find((c) => c.index === i);
    if (!col || col.field === "ignore" || !(NUMERIC_FIELDS as readonly string[]).includes(col.field)) return isUnknownUnitCell(cell);
    return detectUnit(col.field, normaliseHeader(cell)) === col.unit;
  });
}
