/**
 * Blank cells in a mapped speed or impeller-diameter column: "not given" for their curve set, or a break
 * in a curve. Pure; the full path's rule (validate.ts). The fast path (fast.ts) leaves every blank key cell to it.
 *
 * Rule: a key column is optional, so a blank cell there means the set has no such value (our export writes
 * one for a set without a diameter, or without a speed, beside sets with one) — unless the rows next to it
 * make it part of a curve that has one. Rows of one block that follow each other with the same model and
 * the same other key (speed for a diameter, diameter for a speed) are one group; a group's rows agree on
 * whether the key is given. A run of blank cells is a break, refused on each of its rows by line and column
 * (missing-value), when the row just above or just below it in its block has the same model, a filled cell in
 * that column, and the same other key — or when the run's own other key is blank too (nothing then tells
 * its rows from that curve's). A run whose neighbours are another model, or the same model under another
 * speed (diameter), is a set of its own without that key.
 * Limit: a library holding one model at one speed both with and without a diameter exports the two sets as
 * one group whose rows disagree; the importer refuses the blank rows by line and column.
 */
import type { LongRow } from "./mapping";
import { parseNumber } from "./numbers";
import { textCell } from "./text-cells";

export type KeyColumn = "speed" | "impeller";

/** A refused blank key cell: the neighbour row that has the value (its line, above or below, its cell as written), and whether the other key is blank too. */
export interface SplittingBlank {
  line: number;
  where: "above" | "below";
  raw: string;
  otherBlank: boolean;
}

/** The model a row names, read as the validation reads it ("" when none). */
export function rowModel(lr: LongRow): string {
  const c = lr.cells.model;
  if (!c) return "";
  return c.column === "(default)" ? c.raw.trim() : textCell(c.raw);
}

const OTHER: Record<KeyColumn, KeyColumn> = { speed: "impeller", impeller: "speed" };

/** The state of one key cell: absent (no column), blank, or its value (a number, or the text when unreadable). */
function keyOf(lr: LongRow, f: KeyColumn, decimalComma: boolean): { kind: "absent" } | { kind: "blank" } | { kind: "given"; value: string; raw: string } {
  const c = lr.cells[f];
  if (!c) return { kind: "absent" };
  if (c.preset !== undefined) return { kind: "given", value: `${c.preset} ${c.unit}`, raw: String(c.preset) };
  const raw = c.raw.trim();
  if (raw === "") return { kind: "blank" };
  const x = parseNumber(raw, decimalComma);
  return { kind: "given", value: Number.isNaN(x) ? raw : `${x} ${c.unit}`, raw };
}

const sameKey = (a: ReturnType<typeof keyOf>, b: ReturnType<typeof keyOf>) =>
  a.kind === b.kind && (a.kind !== "given" || a.value === (b as { value: string }).value);

/**
 * For each row (by its index in `rows`) and key column, the blank cells that break a curve, with the neighbour
 * row that has the value. Blank cells not listed are "not given" for their set.
 */
export function splittingBlanks(rows: LongRow[], decimalComma: boolean): Map<number, Partial<Record<KeyColumn, SplittingBlank>>> {
  const out = new Map<number, Partial<Record<KeyColumn, SplittingBlank>>>();
  const blank = (lr: LongRow, f: KeyColumn) => {
    const c = lr.cells[f];
    return c !== undefined && c.preset === undefined && c.raw.trim() === "";
  };
  if (!rows.some((lr) => blank(lr, "speed") || blank(lr, "impeller"))) return out; // the usual file: nothing to look at
  const byBlock = new Map<number, number[]>();
  rows.forEach((lr, i) => {
    const list = byBlock.get(lr.block);
    if (list) list.push(i);
    else byBlock.set(lr.block, [i]);
  });
  for (const f of ["speed", "impeller"] as const) {
    const g = OTHER[f];
    for (const list of byBlock.values()) {
      const model = list.map((i) => rowModel(rows[i]));
      const own = list.map((i) => keyOf(rows[i], f, decimalComma));
      const other = list.map((i) => keyOf(rows[i], g, decimalComma));
      for (let a = 0; a < list.length; ) {
        if (own[a].kind !== "blank") {
          a++;
          continue;
        }
        let e = a; // the run: blank in f, one model, one other key
        while (e + 1 < list.length && own[e + 1].kind === "blank" && model[e + 1] === model[a] && sameKey(other[e + 1], other[a])) e++;
        const breaks = (k: number) =>
          k >= 0 && k < list.length && model[k] === model[a] && own[k].kind === "given" && (other[a].kind === "blank" || sameKey(other[k], other[a]));
        const by = breaks(a - 1) ? a - 1 : breaks(e + 1) ? e + 1 : -1;
        if (by >= 0) {
          const found = own[by] as { raw: string };
          const why: SplittingBlank = { line: rows[list[by]].line, where: by < a ? "above" : "below", raw: found.raw, otherBlank: other[a].kind === "blank" };
          for (let k = a; k <= e; k++) out.set(list[k], { ...out.get(list[k]), [f]: why });
        }
        a = e + 1;
      }
    }
  }
  return out;
}
