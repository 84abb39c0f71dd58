/**
 * A speed or impeller diameter that differs on one or two rows in the middle or at an end of a curve (a mistyped key cell):
 * those rows read as a set of their own, too short to be a curve (too-few-points), and the curve beside them was imported
 * without its point there — at its end silently short of its range. Pure; the full path's rule (validate.ts); the fast path
 * steps aside for any set with fewer than 3 points.
 *
 * Rule: a run of fewer than 3 rows of one block with one (model, speed, diameter) whose row just above (below) has the same
 * model and the same other key (diameter for a speed, speed for a diameter), another value in this key column, and a flow
 * below the run's first (above the run's last): the flow rises on across them, as along one curve. The neighbour's run is the
 * longer (with the run past the short one, where the rows on both sides share a key), so of 2900, 2950, 2900 only 2950 is named. Each row of the run is
 * a `key-stray` error in that column, charged to the curve above (else below), so that curve is not imported short of a
 * point under `skip-curves`. A run at another key whose flow starts again is a curve of its own (too short: too-few-points).
 *
 * A run of 3 rows or more is a curve of its own, unless it is shorter than its neighbour, the flow rises on across them as
 * above, and its key lies within NEAR_KEY (5 %) of the neighbour's (2990 rpm beside 2900, 195 mm beside 190): then the last
 * (first) points of one curve have their key mistyped, and the short curve is no curve of the maker's. Each row is a
 * `key-stray` error charged to the neighbour, as above, and one more at the run's first row to the run's own curve, which
 * validate.ts keeps out under either policy (`own`).
 */
import type { ProblemCode } from "./types";
import { qt } from "../../engine/quantityText.ts";

/** One run of rows with one curve key in a block, in file order, as validate.ts read them. */
export interface KeyRun {
  block: number;
  key: string;
  model: string;
  speed: number | null;
  impeller: number | null;
  /** Each row's line, its flow (m³/s, null when unreadable) and its speed and diameter cells (column header and cell as written). */
  rows: Array<{ line: number; flow: number | null; speed?: { column: string; raw: string }; impeller?: { column: string; raw: string } }>;
}

/** `own`: charged to the stray run's own curve (3 rows or more), kept out under either policy. */
export type StrayProblem = { row: number; column: string; code: ProblemCode; reason: string; curveKey: string; own?: true };

/**
 * How near a run's key of 3 rows or more must lie to its neighbour's to be read as mistyped, as a fraction of the neighbour's:
 * a maker's published speeds of one model differ by far more (1450/2900 rpm by the poles, 2900/3500 by 50/60 Hz), trims
 * mostly by 5 % or more of the diameter (common practice); the flow going on rather than starting again is the other half.
 */
export const NEAR_KEY = 0.05;

const LABEL = { speed: "speed", impeller: "impeller diameter" } as const;

/** The `key-stray` errors of a file's runs (see the rule above). */
export function strayKeyProblems(all: readonly KeyRun[]): StrayProblem[] {
  const out: StrayProblem[] = [];
  const blocks = new Map<number, KeyRun[]>(); // a wide file's blocks interleave row by row: each block's runs in order
  for (const r of all) blocks.set(r.block, [...(blocks.get(r.block) ?? []), r]);
  for (const runs of blocks.values()) strayIn(runs, out);
  return out;
}

function strayIn(runs: readonly KeyRun[], out: StrayProblem[]): void {
  for (let i = 0; i < runs.length; i++) {
    const r = runs[i];
    const long = r.rows.length >= 3; // a curve of its own unless its key is near the neighbour's (NEAR_KEY)
    const before = i > 0 ? runs[i - 1] : null;
    const after = i + 1 < runs.length ? runs[i + 1] : null;
    for (const f of ["speed", "impeller"] as const) {
      const other = f === "speed" ? "impeller" : "speed";
      // the neighbour's curve is the longer one: its run (with the run across, when the rows both sides share its key) has more rows
      const around = before !== null && after !== null && before.key === after.key ? before.rows.length + after.rows.length : 0;
      const longer = (n: KeyRun) => Math.max(n.rows.length, around) > r.rows.length;
      const near = (n: KeyRun) => !long || (n.rows.length > r.rows.length && Math.abs(r[f]! - n[f]!) <= NEAR_KEY * n[f]! * (1 + 1e-9));
      const beside = (n: KeyRun | null) => n !== null && n.model === r.model && n[other] === r[other] && n[f] !== null && r[f] !== null && n[f] !== r[f] && longer(n) && near(n);
      const upFlow = before?.rows[before.rows.length - 1].flow ?? null;
      const downFlow = after?.rows[0].flow ?? null;
      const first = r.rows[0].flow, last = r.rows[r.rows.length - 1].flow;
      const risesAbove = beside(before) && upFlow !== null && first !== null && first > upFlow;
      const risesBelow = beside(after) && downFlow !== null && last !== null && last < downFlow;
      if (!risesAbove && !risesBelow) continue;
      const n = risesAbove ? before! : after!;
      const nRow = risesAbove ? n.rows[n.rows.length - 1] : n.rows[0];
      const rRow = risesAbove ? r.rows[0] : r.rows[r.rows.length - 1];
      const [lo, hi] = risesAbove ? [nRow.flow!, rRow.flow!] : [rRow.flow!, nRow.flow!];
      const was = `“${nRow[f]?.raw.trim() ?? String(n[f])}” on line ${nRow.line} ${risesAbove ? "above" : "below"}`;
      for (const row of r.rows) {
        const cell = row[f];
        if (!cell) continue;
        out.push({
          row: row.line, column: cell.column, code: "key-stray", curveKey: n.key,
          reason: `${LABEL[f]} “${cell.raw.trim()}” differs from ${was} (same model${other === "impeller" ? " and impeller diameter" : " and speed"}), ` +
            `while the flow rises on across them (${qt("flow", lo)}, then ${qt("flow", hi)}), as along one curve: ${long ? `${r.rows.length} rows at a ${LABEL[f]} within ${NEAR_KEY * 100} % of it make a short curve no maker publishes beside it` : r.rows.length === 1 ? `a row at another ${LABEL[f]} makes no curve (at least 3 points)` : `${r.rows.length} rows at another ${LABEL[f]} make no curve (at least 3 points)`}, ` +
            `so this is likely that curve's point with its ${LABEL[f]} mistyped; the curve is kept out until the cell is corrected (or choose to drop bad points)`,
        });
      }
      const ownCell = r.rows[0][f];
      if (long && ownCell) {
        const lines = `${r.rows[0].line}–${r.rows[r.rows.length - 1].line}`;
        out.push({
          row: r.rows[0].line, column: ownCell.column, code: "key-stray", curveKey: r.key, own: true,
          reason: `${LABEL[f]} “${ownCell.raw.trim()}” on lines ${lines} is within ${NEAR_KEY * 100} % of ${was} (same model${other === "impeller" ? " and impeller diameter" : " and speed"}), ` +
            `and the flow rises on across them (${qt("flow", lo)}, then ${qt("flow", hi)}) instead of starting again: these ${r.rows.length} rows read as a short curve of their own beside that one, ` +
            `but are likely its ${risesAbove ? "last" : "first"} points with the ${LABEL[f]} mistyped; this curve is kept out under either policy, and that one unless bad points are dropped, until the cells are corrected`,
        });
      }
    }
  }
}
