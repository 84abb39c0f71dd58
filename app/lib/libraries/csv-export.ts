// A revision's curves in our own CSV format (fixtures/demo/FORMAT.md). Pure.
import { toCsv } from "../shared/csv";
import type { LibraryCurveSet } from "./libraries.server";

export const EXPORT_HEADER = "model,type,size,speed_rpm,impeller_mm,flow_m3h,head_m,efficiency_pct,power_kw,npshr_m,min_flow_m3h";

/**
 * A revision's curves in our own CSV format (fixtures/demo/FORMAT.md): long layout, SI-derived display units.
 * The key columns `speed_rpm` and `impeller_mm` are written only when some curve set carries a value,
 * so a library whose curves have no impeller diameter (or no speed) is written without that column
 * and imports again with the diameter (speed) not given. Each set writes its value on every row, and a
 * set without one writes blank cells beside sets with one: the importer reads them as "not given" for
 * that set (import/blank-keys.ts), so a library mixing both imports again (export-roundtrip.test.ts,
 * export-property.test.ts). One model at one speed both with and without a diameter (only a wide file
 * with a speed-only block and a diameter block at the same speed makes it) writes the two sets one after
 * the other under the same model and speed; the flow starts again between them, so the importer reads the
 * blank rows as a set of their own, with a `key-not-given` warning (blank-keys.ts; it refused them before).
 * The maker's minimum flow (`min_flow_m3h`) is written only when some set has one, on every row of that set, and blank for a
 * set without one (read as none recorded: import/min-flow.ts).
 */
export function curvesToCsv(curves: LibraryCurveSet[]): string {
  const n = (x: number | null, scale: number, digits: number) => (x == null ? null : +(x * scale).toFixed(digits));
  const withSpeed = curves.some((c) => c.speed != null);
  const withImpeller = curves.some((c) => c.impellerDiameter != null);
  const withMinFlow = curves.some((c) => c.minFlow != null);
  const keep = (_: unknown, i: number) => (i !== 3 || withSpeed) && (i !== 4 || withImpeller) && (i !== 10 || withMinFlow);
  const rows: unknown[][] = [EXPORT_HEADER.split(",").filter(keep)];
  for (const c of curves) {
    for (const p of c.points) {
      const row = [c.model, c.type, c.nominalSize, n(c.speed, 1, 1), n(c.impellerDiameter, 1000, 3), n(p.flow, 3600, 6), n(p.head, 1, 6), n(p.efficiency, 100, 4), n(p.power, 1e-3, 6), n(p.npshr, 1, 6), n(c.minFlow, 3600, 6)];
      rows.push(row.filter(keep));
    }
  }
  return toCsv(rows, { newline: "\n" });
}
