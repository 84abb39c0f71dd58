/**
 * A fraction written among percents: one efficiency cell such as “0.72” in a column read in percent, on a curve whose
 * other cells are percents (50, 70, 72…), read as 0.72 % — a point efficiency 100× too small, which sizes that point's
 * shaft power (P = ρgQH/η) 100× too large — while the curve's best efficiency, the only check on the column's unit
 * (`efficiency-implausible`), stays plausible. Pure; both paths (fast.ts steps aside for any cell below 1 %).
 *
 * The rule (`efficiency-fraction`, an error at the cell): in a column read in percent, an efficiency above zero and
 * below 1 % (`FRACTION_BELOW`) at a flow of at least a tenth of the flow at the curve's best efficiency
 * (`FROM_BEST_FLOW`), on a curve whose best efficiency is at least 10 % (`BEST_AT_LEAST`). At a tenth of its
 * best-efficiency flow a centrifugal pump's efficiency is still some tens of percent of its best (common practice,
 * from memory), so such a cell is a fraction or a slip, never a published point; nearer shut-off a small efficiency
 * is real and is left alone. Neither reading is taken: the point is left out, the curve too under `skip-curves`.
 */
import { fmtPctExact, qt } from "../../engine/quantityText.ts";

/** An efficiency read below this (fraction: 1 %) in a percent column is looked at. */
export const FRACTION_BELOW = 0.01;
/** …only on a curve whose best efficiency is at least this (fraction: 10 %)… */
export const BEST_AT_LEAST = 0.1;
/** …and at a flow of at least this share of the flow at the curve's best efficiency. */
export const FROM_BEST_FLOW = 0.1;

/** One point row as the validator keeps it: its line, flow and efficiency (SI), and the efficiency cell as written. */
export type EfficiencyRow = { line: number; flow: number; efficiency?: number; effRaw?: string };

/**
 * The rows whose efficiency is a fraction written among percents, with the reason for each.
 * @param rows the curve's point rows in file order (run-out rows left out by the caller)
 * @param unit the efficiency column's unit ("%" or "fraction"); nothing is flagged unless "%"
 */
export function fractionsAmongPercents(rows: readonly EfficiencyRow[], unit: string | null): Map<number, string> {
  const out = new Map<number, string>();
  if (unit !== "%") return out;
  let best = -1;
  let bestFlow = 0;
  for (const r of rows) if (r.efficiency !== undefined && r.efficiency > best) [best, bestFlow] = [r.efficiency, r.flow];
  if (!(best >= BEST_AT_LEAST * (1 - 1e-9))) return out;
  for (const r of rows) {
    const e = r.efficiency;
    if (e === undefined || !(e > 0 && e < FRACTION_BELOW) || !(r.flow > 0 && r.flow >= FROM_BEST_FLOW * bestFlow * (1 - 1e-9))) continue;
    const raw = (r.effRaw ?? String(e * 100)).trim();
    out.set(r.line,
      `efficiency “${raw}” in this column of percents reads as ${raw} %, at ${qt("flow", r.flow)}, on a curve whose best is ${fmtPctExact(best)} (at ${qt("flow", bestFlow)}): ` +
      `below 1 % at a tenth of the best-efficiency flow or more, which no pump publishes, so it is likely a fraction (${fmtPctExact(e * 100)}) — ` +
      `write it in percent, or correct the cell; the point is left out`);
  }
  return out;
}
