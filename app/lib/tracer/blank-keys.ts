/**
 * Which traced sets the importer would refuse for a blank speed or impeller Ø: the importer's own rule
 * (app/lib/import/blank-keys.ts `splittingBlanks`, not a copy of it) applied to the key cells our CSV writes (to-csv.ts),
 * in the CSV's order. Pure.
 *
 * The importer reads a blank key cell as "not given" for a set of its own, and refuses it where it would split a curve:
 * the rows just above or below it have the same model and the same other key (speed for a Ø, Ø for a speed) and a value
 * in that column — or its own other key is blank too (or, for a speed, the CSV has no impeller column: nothing then tells
 * its rows apart) — and the flow rises on from one to the other where they meet. A blank Ø at another speed, or a blank speed at another Ø, is a set of its own without it (the importer
 * warns of a set without a speed: validate.ts `NO_SPEED_WARNING`).
 * Two rows stand here for each set in the CSV, its first and its last, with their key cells and flows: a set's rows all carry
 * the same key cells, so only the rows where two sets meet decide — their keys, and whether the flow goes on rising there
 * (a blank beside a curve with the value where the flow starts again is a set of its own, with the importer's key-not-given
 * warning). A set with no rows in the CSV (`inCsv`) takes no place in it.
 */
import { splittingBlanks, type KeyColumn, type LongRow, type Unit } from "~/lib/import";
import { csvFlowEnds, csvHasImpeller, csvKeyCells, inCsv, type TracedSet } from "./to-csv";

/**
 * A set refused for a blank key cell: the set next to it in the CSV (index into the sets given) that has the value, where,
 * its value as written (rpm or mm), and whether the set's other key is blank too.
 */
export type RefusedBlank = { by: number; where: "above" | "below"; value: string; otherBlank: boolean };

const written = (x: number | null) => (x == null || !Number.isFinite(x) ? "" : String(x)); // as toCsv writes a number or a blank

/**
 * For each set (by its index in `sets`, the order tracedRows writes them) whose blank speed or Ø the importer would refuse: why,
 * per column. `flowUnit`: the flow axis's unit (the CSV's flows are converted from it).
 */
export function refusedBlankKeys(sets: readonly TracedSet[], flowUnit: Unit): Map<number, Partial<Record<KeyColumn, RefusedBlank>>> {
  const withImpeller = csvHasImpeller(sets); // no impeller column: no Ø cell at all
  const rows: LongRow[] = [];
  sets.forEach((s, i) => {
    if (!inCsv(s)) return;
    const k = csvKeyCells(s);
    for (const flow of csvFlowEnds(s, flowUnit))
      rows.push({
        line: i, // the set's index: splittingBlanks names the neighbour by its line
        block: 0,
        cells: {
          model: { raw: s.model, column: "model", unit: null },
          speed: { raw: written(k.speed), column: "speed_rpm", unit: "rpm" },
          ...(withImpeller ? { impeller: { raw: written(k.impeller), column: "impeller_mm", unit: "mm" } } : {}),
          flow: { raw: written(flow), column: "flow_m3h", unit: "m3/h" },
        },
      });
  });
  const out = new Map<number, Partial<Record<KeyColumn, RefusedBlank>>>();
  for (const [row, why] of splittingBlanks(rows, false)) {
    const refused: Partial<Record<KeyColumn, RefusedBlank>> = {};
    for (const f of ["speed", "impeller"] as const) {
      const b = why[f];
      if (b) refused[f] = { by: b.line, where: b.where, value: b.raw, otherBlank: b.otherBlank };
    }
    out.set(rows[row].line, refused);
  }
  return out;
}
