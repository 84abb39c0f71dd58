/**
 * The maker's minimum continuous flow of a curve set, from an optional column (field `minflow`, in any flow unit the
 * importer reads): distributors publish it with their curves, and an engineer must not select a pump that runs below it.
 * One figure per curve set, written on every row of the curve alike or on some of its rows (blank elsewhere). Rules (code
 * `min-flow`, an error charged to the curve set, which keeps it out under either policy: a bad maker's figure is never
 * imported as none):
 * - each written cell reads as a number (the importer's one-number grammar, numbers.ts), above zero and finite;
 * - every written cell of a curve gives the same figure (the first written decides; each cell that differs is named);
 * - the figure lies below the curve's last published flow: a minimum at or past the curve's end leaves no flow to run at
 *   (a unit mix-up — l/s read as m³/h — is the usual cause).
 * Each finding names its row and column, the value as written and in the reader's units, and the rule. The fast path
 * (fast.ts) applies the same rules through `minFlowFits` and steps aside for anything that needs a message. Pure.
 */
import { parseNumber, underflows } from "./numbers";
import { SI_FACTOR, type Unit } from "./units-in-headers";
import type { LongRow } from "./mapping";
import type { Problem } from "./types";
import type { CurveSet } from "./curve-schema";
import { qtExact, qtLimit, qtPair } from "../../engine/quantityText.ts"; // quantities in problem texts: rendered in the reader's units

/** The rule in words, as each finding states it. */
export const MIN_FLOW_RULE = "a curve's maker's minimum flow is one figure, above zero and below the curve's last published flow";

/** True when `min` (m³/s) may be a curve's maker's minimum flow: finite, above zero and below its last published flow (m³/s). */
export const minFlowFits = (min: number, lastFlow: number): boolean => Number.isFinite(min) && min > 0 && min < lastFlow;

type Written = { line: number; column: string; raw: string; unit: Unit | null };

/** The minimum-flow cells of each curve as the rows are read, judged once the curve's points are known. */
export class MinFlowCells {
  private readonly byKey = new Map<string, Written[]>();

  constructor(private readonly decimalComma: boolean) {}

  /** Keeps row `lr`'s minimum-flow cell, when it holds one, for the curve `key`. */
  add(key: string, lr: LongRow): void {
    const cell = lr.cells.minflow;
    if (!cell || cell.raw.trim() === "") return;
    const list = this.byKey.get(key) ?? [];
    list.push({ line: lr.line, column: cell.column, raw: cell.raw.trim(), unit: cell.unit });
    this.byKey.set(key, list);
  }

  /**
   * The findings on curve `key`'s cells, judged against `set`'s accepted points (the last one's flow; with none kept, only the
   * cells are read); where none is found, `set.minFlow` is set to the figure (m³/s) — left absent where none is written.
   */
  judge(key: string, set: Pick<CurveSet, "points" | "minFlow">): Problem[] {
    const lastFlow = set.points.length ? set.points[set.points.length - 1].flow : null;
    const cells = this.byKey.get(key) ?? [];
    const problems: Problem[] = [];
    const bad = (w: Written, reason: string) =>
      problems.push({ row: w.line, column: w.column, reason: `maker's minimum flow “${w.raw}” ${reason}`, severity: "error", code: "min-flow", curveKey: key });
    const read: { w: Written; si: number }[] = [];
    for (const w of cells) {
      const x = parseNumber(w.raw, this.decimalComma);
      const si = x * (SI_FACTOR.minflow[w.unit as Unit] ?? NaN);
      if (Number.isNaN(x)) bad(w, underflows(w.raw, this.decimalComma) ? "is out of range: too small to be stored (it would read as 0)" : "is not a number");
      else if (!(x > 0)) bad(w, `is not above zero: ${MIN_FLOW_RULE}`);
      else if (!Number.isFinite(si) || si > 1e12) bad(w, "is too large to be a real value");
      else read.push({ w, si });
    }
    if (read.length === 0) return problems;
    const first = read[0];
    for (const r of read.slice(1)) {
      if (r.si === first.si) continue;
      const [mine, theirs] = qtPair("flow", r.si, first.si);
      bad(r.w, `(${mine}) differs from “${first.w.raw}” (${theirs}) on line ${first.w.line}: ${MIN_FLOW_RULE} — write the same figure on every row of the curve, or on one row only`);
    }
    if (lastFlow !== null && !minFlowFits(first.si, lastFlow)) {
      for (const r of read.filter((x) => x.si === first.si))
        bad(r.w, `(${qtExact("flow", first.si, [lastFlow])}) is not below the curve's last published flow, ${qtLimit("flow", lastFlow, [first.si])}: ${MIN_FLOW_RULE} — is the column in another flow unit?`);
    }
    if (problems.length === 0) set.minFlow = first.si;
    return problems;
  }
}
