/**
 * Which traced sets the importer would refuse for a blank impeller Ø: the importer's own rule (app/lib/import/blank-keys.ts
 * `splittingBlanks`, not a copy of it) applied to the key cells our CSV writes (to-csv.ts), in the CSV's order. Pure.
 *
 * The importer reads a blank Ø as "not given" for a set of its own (another model, or the same model at another speed),
 * and refuses it where it would split a curve: the rows just above or below it have the same model and speed and a Ø.
 * One row stands here for each set in the CSV: a set's rows all carry the same key cells, so only the rows where two sets
 * meet decide, and they are the same with one row a set. A set with no rows in the CSV (`inCsv`) takes no place in it.
 */
import { splittingBlanks, type LongRow } from "~/lib/import";
import { csvHasImpeller, csvKeyCells, inCsv, type TracedSet } from "./to-csv";

/** A set refused for its blank Ø: the set next to it in the CSV (index into the sets given) that has the Ø, where, and its Ø as written. */
export type RefusedBlank = { by: number; where: "above" | "below"; impellerMm: string };

const written = (x: number | null) => (x == null || !Number.isFinite(x) ? "" : String(x)); // as toCsv writes a number or a blank

/** For each set (by its index in `sets`, the order tracedRows writes them) whose blank Ø the importer would refuse: why. */
export function refusedBlankImpellers(sets: readonly TracedSet[]): Map<number, RefusedBlank> {
  const out = new Map<number, RefusedBlank>();
  if (!csvHasImpeller(sets)) return out; // no impeller column: no blank Ø cell
  const rows: LongRow[] = [];
  sets.forEach((s, i) => {
    if (!inCsv(s)) return;
    const k = csvKeyCells(s);
    rows.push({
      line: i, // the set's index: splittingBlanks names the neighbour by its line
      block: 0,
      cells: {
        model: { raw: s.model, column: "model", unit: null },
        speed: { raw: written(k.speed), column: "speed_rpm", unit: "rpm" },
        impeller: { raw: written(k.impeller), column: "impeller_mm", unit: "mm" },
      },
    });
  });
  for (const [row, why] of splittingBlanks(rows, false)) {
    const b = why.impeller;
    if (b) out.set(rows[row].line, { by: b.line, where: b.where, impellerMm: b.raw });
  }
  return out;
}
