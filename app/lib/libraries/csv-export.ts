// A revision's curves in our own CSV format (fixtures/demo/FORMAT.md). Pure.
import { toCsv } from "../shared/csv";
import type { LibraryCurveSet } from "./libraries.server";

export const EXPORT_HEADER = "model,type,size,speed_rpm,impeller_mm,flow_m3h,head_m,efficiency_pct,power_kw,npshr_m";

/** A revision's curves in our own CSV format (fixtures/demo/FORMAT.md): long layout, SI-derived display units. */
export function curvesToCsv(curves: LibraryCurveSet[]): string {
  const n = (x: number | null, scale: number, digits: number) => (x == null ? null : +(x * scale).toFixed(digits));
  const rows: unknown[][] = [EXPORT_HEADER.split(",")];
  for (const c of curves) {
    for (const p of c.points) {
      rows.push([c.model, c.type, c.nominalSize, n(c.speed, 1, 1), n(c.impellerDiameter, 1000, 3), n(p.flow, 3600, 6), n(p.head, 1, 6), n(p.efficiency, 100, 4), n(p.power, 1e-3, 6), n(p.npshr, 1, 6)]);
    }
  }
  return toCsv(rows, { newline: "\n" });
}
