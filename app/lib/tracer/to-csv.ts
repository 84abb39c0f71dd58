/**
 * Traced curves → our CSV (fixtures/demo/FORMAT.md, long layout), so that traced data goes through
 * the same validation and import as an uploaded file. Pure: no DOM.
 *
 * One row per point of the head curve (resampled to `points` evenly spaced flows); efficiency,
 * power and NPSHr, traced on their own panels at their own flows, are read at those flows with the
 * engine's interpolation and left empty outside the range they were traced over. Values are
 * converted from the axis units to the format's units (m³/h, m, %, kW, m) with the importer's SI
 * factors (app/lib/import/units-in-headers.ts, NIST SP 811). Traced points left of zero flow (the
 * stroke's end cap at the axis) are dropped, so the curve starts at or after zero flow.
 */
import { toCsv } from "~/lib/shared/csv";
import { SI_FACTOR, type Unit } from "~/lib/import";
import { resample, valueAt, type XY } from "./curves";

export const CSV_HEADER = ["model", "type", "size", "speed_rpm", "impeller_mm", "flow_m3h", "head_m", "efficiency_pct", "power_kw", "npshr_m"];

export type Quantity = "head" | "efficiency" | "power" | "npshr";
export type TraceUnits = { flow: Unit; head: Unit; efficiency: Unit; power: Unit; npshr: Unit };

/** One impeller (or speed) of one model: its traced curves in the axis units. */
export type TracedSet = {
  model: string;
  type?: string;
  size?: string;
  speedRpm: number;
  impellerMm: number;
  curves: Partial<Record<Quantity, XY[]>>;
};

/** Value in `unit` of `field` → value in `target` unit. */
function convert(field: "flow" | "head" | "efficiency" | "power" | "npshr", unit: Unit, target: Unit, x: number): number {
  const f = SI_FACTOR[field][unit], t = SI_FACTOR[field][target];
  if (f === undefined || t === undefined) throw new Error(`unit ${unit} does not fit ${field}`);
  return (x * f) / t;
}

const round = (x: number | null, digits: number) => (x == null || !Number.isFinite(x) ? null : +x.toFixed(digits));

/** The CSV rows (header first) for the traced sets; a set without a head curve of 3+ points is left out. */
export function tracedRows(sets: readonly TracedSet[], units: TraceUnits, points = 15): unknown[][] {
  const rows: unknown[][] = [CSV_HEADER];
  for (const s of sets) {
    // A stroke's end cap reaches a pixel or two left of zero flow: those points are not data.
    const head = (s.curves.head ?? []).filter((p) => p.x >= 0);
    if (head.length < 3) continue;
    for (const p of resample(head, Math.max(3, points))) {
      const at = (q: Exclude<Quantity, "head">, target: Unit) => {
        const c = s.curves[q];
        const y = c && c.length >= 2 ? valueAt(c, p.x) : null;
        return y == null ? null : convert(q, units[q], target, y);
      };
      rows.push([
        s.model, s.type ?? "", s.size ?? "", s.speedRpm, round(s.impellerMm, 1),
        round(convert("flow", units.flow, "m3/h", p.x), 4), round(convert("head", units.head, "m", p.y), 4),
        round(at("efficiency", "%"), 2), round(at("power", "kW"), 4), round(at("npshr", "m"), 4),
      ]);
    }
  }
  return rows;
}

export function tracedCsv(sets: readonly TracedSet[], units: TraceUnits, points = 15): string {
  return toCsv(tracedRows(sets, units, points), { newline: "\n" });
}
