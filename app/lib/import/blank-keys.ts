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
 * its rows from that curve's) — and the flow goes on rising across the two rows where they meet (the row above's
 * flow below the run's first, or the run's last below the row below's). A run whose neighbours are another model, or
 * the same model under another speed (diameter), is a set of its own without that key; so is a run where the flow
 * starts again (not above the neighbour's flow) at each neighbour that has the value: a curve's flow rises along it
 * (flow-not-increasing), so its rows are not part of that curve. Our export writes exactly that for one model at one
 * speed held both with and without a diameter (the set without one after the set with one, its flow from the start
 * again); such a run is taken as a set of its own and named (blankSetsBeside, a `key-not-given` warning), since a
 * curve's whole key column left blank by mistake looks the same. A flow cell blank or unreadable where they meet
 * says nothing: the run is refused as before.
 */
import type { LongRow } from "./mapping";
import { parseNumber } from "./numbers";
import { oneLine, textCell } from "./text-cells";

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
  return oneLine(c.column === "(default)" ? c.raw.trim() : textCell(c.raw)); // a model name is one line (text-cells.ts)
}

/**
 * A run of blank cells next to rows of the same model and other key that have the value, read as a set of its own because the
 * flow starts again where they meet: the neighbour (its line, above or below, its cell as written), the run's lines, and the
 * two flow cells as written (the neighbour's, then the run's row next to it).
 */
export interface BlankSetBeside extends SplittingBlank {
  first: number;
  last: number;
  flows: [string, string];
}

const OTHER: Record<KeyColumn, KeyColumn> = { speed: "impeller", impeller: "speed" };

/** A row's flow as written and read (NaN when blank or unreadable). */
function flowOf(lr: LongRow, decimalComma: boolean): { raw: string; value: number } {
  const raw = lr.cells.flow?.raw.trim() ?? "";
  return { raw, value: raw === "" ? NaN : parseNumber(raw, decimalComma) };
}

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
  return blankKeyRuns(rows, decimalComma).splits;
}

/**
 * Both answers of one pass: `splits` (splittingBlanks) and `beside`, for the first row (by its index in `rows`) of each run
 * taken as a set of its own beside rows that have the value, why (BlankSetBeside).
 */
export function blankKeyRuns(rows: LongRow[], decimalComma: boolean) {
  const out = new Map<number, Partial<Record<KeyColumn, SplittingBlank>>>();
  const beside = new Map<number, Partial<Record<KeyColumn, BlankSetBeside>>>();
  const blank = (lr: LongRow, f: KeyColumn) => {
    const c = lr.cells[f];
    return c !== undefined && c.preset === undefined && c.raw.trim() === "";
  };
  if (!rows.some((lr) => blank(lr, "speed") || blank(lr, "impeller"))) return { splits: out, beside }; // the usual file: nothing to look at
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
        const hasIt = (k: number) =>
          k >= 0 && k < list.length && model[k] === model[a] && own[k].kind === "given" && (other[a].kind === "blank" || sameKey(other[k], other[a]));
        // Where the run meets that neighbour: the earlier row's flow and the later one's. Flow rising there (or unknown) continues a curve.
        const meet = (k: number) => (k < a ? [flowOf(rows[list[k]], decimalComma), flowOf(rows[list[a]], decimalComma)] : [flowOf(rows[list[e]], decimalComma), flowOf(rows[list[k]], decimalComma)]);
        const continues = (k: number) => {
          const [x, y] = meet(k);
          return !(x.value >= y.value);
        };
        const why = (k: number): SplittingBlank => ({ line: rows[list[k]].line, where: k < a ? "above" : "below", raw: (own[k] as { raw: string }).raw, otherBlank: other[a].kind === "blank" });
        const by = hasIt(a - 1) && continues(a - 1) ? a - 1 : hasIt(e + 1) && continues(e + 1) ? e + 1 : -1;
        if (by >= 0) for (let k = a; k <= e; k++) out.set(list[k], { ...out.get(list[k]), [f]: why(by) });
        else {
          const next = hasIt(a - 1) ? a - 1 : hasIt(e + 1) ? e + 1 : -1;
          if (next >= 0) {
            const [x, y] = meet(next);
            const first = rows[list[a]].line, last = rows[list[e]].line;
            beside.set(list[a], { ...beside.get(list[a]), [f]: { ...why(next), first, last, flows: next < a ? [x.raw, y.raw] : [y.raw, x.raw] } });
          }
        }
        a = e + 1;
      }
    }
  }
  return { splits: out, beside };
}

const LABEL: Record<KeyColumn, string> = { speed: "speed", impeller: "impeller diameter" };

/** The `key-not-given` warning on a run taken as a set of its own beside rows that have the value, with the rule and the cells. */
export function besideReason(b: BlankSetBeside, f: KeyColumn): string {
  const other = LABEL[OTHER[f]];
  const lines = b.first === b.last ? `line ${b.first}` : `lines ${b.first}–${b.last}`;
  const here = b.where === "above" ? b.first : b.last;
  return (
    `${LABEL[f]} is empty on ${lines}: read as a curve of its own without one. Line ${b.line} ${b.where} it (same model` +
    `${b.otherBlank ? `, ${other} blank here too` : ` and ${other}`}) has ${b.raw}, but the flow starts again where they meet ` +
    `(${b.flows[0]} on line ${b.line}, ${b.flows[1]} on line ${here}, as written): a curve's flow rises along it, so these rows are not ` +
    `part of that curve (rule: a blank key cell is "not given" for its set unless it would split a curve). If they are that curve's ` +
    `rows with its ${LABEL[f]} left out, fill it in.`
  );
}
