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
 * Each curve is converted from its own unit (`TracedSet.units`: its panel's; two head panels may be in
 * m and ft), else from the call's. Efficiency is left blank over a set's `efficiencyGaps` (read from
 * contours: between two crossings of one level, contours.ts) and written at its `peaks`, rows of their
 * own (the middle of the innermost contour, when the user took it as the BEP). The impeller column is
 * left out when no set gives an impeller Ø (> 0): the importer reads such curves without one; a blank
 * Ø beside others is written blank: "not given" for its set, unless the set next to it has the same speed and a Ø and the
 * flow rises on from one to the other, which the importer refuses. A blank speed is written blank too: "not given" for its set
 * (with the importer's no-speed warning), unless the set next to it has the same Ø (or its own Ø is blank too) and a speed,
 * the flow rising on. blank-keys.ts says which the importer refuses; the page asks for those first.
 */
import { toCsv } from "~/lib/shared/csv";
import { SI_FACTOR, type Unit } from "~/lib/import";
import { cleanPoints, resample, valueAt, type XY } from "./curves";

export const CSV_HEADER = ["model", "type", "size", "speed_rpm", "impeller_mm", "flow_m3h", "head_m", "efficiency_pct", "power_kw", "npshr_m"];
const IMPELLER_COLUMN = CSV_HEADER.indexOf("impeller_mm");

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
  /** The unit each curve was traced in (its panel's), over the units given to tracedRows. */
  units?: Partial<Record<Quantity, Unit>>;
  /** Flow spans (axis unit) where efficiency is not known: left blank. */
  efficiencyGaps?: { from: number; to: number }[];
  /** Rows of their own: flow (axis unit) and efficiency (in its unit) taken as the peak. */
  peaks?: XY[];
};

/** An impeller Ø given (a number above zero): a blank field is NaN, older pages wrote 0. */
export const impellerGiven = (mm: number) => Number.isFinite(mm) && mm > 0;

/** Value in `unit` of `field` → value in `target` unit. */
function convert(field: "flow" | "head" | "efficiency" | "power" | "npshr", unit: Unit, target: Unit, x: number): number {
  const f = SI_FACTOR[field][unit], t = SI_FACTOR[field][target];
  if (f === undefined || t === undefined) throw new Error(`unit ${unit} does not fit ${field}`);
  return (x * f) / t;
}

const round = (x: number | null, digits: number) => (x == null || !Number.isFinite(x) ? null : +x.toFixed(digits));

/** A set's head curve as the CSV takes it: a stroke's end cap reaches a pixel or two left of zero flow, and those points are not data. */
const csvHead = (s: TracedSet) => (s.curves.head ?? []).filter((p) => p.x >= 0);

/** Whether a set has rows in the CSV: a head curve of 3+ points at or right of zero flow. */
export const inCsv = (s: TracedSet) => csvHead(s).length >= 3;

/** Whether the CSV has an impeller column: some set gives a Ø. */
export const csvHasImpeller = (sets: readonly TracedSet[]) => sets.some((s) => impellerGiven(s.impellerMm));

/**
 * An impeller Ø (mm) as the CSV writes it: to 0.1 mm, or null (blank) when not given. The one rounding of a Ø: the CSV's
 * cells (csvKeyCells) and the page's curve keys (components/tracer/model.ts `keyOf`) both take it, so two curves typed
 * 190 and 190.04 mm are one key on the page as they are one key in the CSV.
 */
export const csvImpellerMm = (mm: number): number | null => (impellerGiven(mm) ? round(mm, 1) : null);

/** A set's key cells as the CSV writes them on each of its rows: speed, and impeller Ø (mm, 0.1 mm: csvImpellerMm) or blank. */
export const csvKeyCells = (s: TracedSet) => ({ speed: s.speedRpm, impeller: csvImpellerMm(s.impellerMm) });

/** A set's first and last flow as the CSV writes them (m³/h, 4 decimals), from the axis's `flowUnit`; the set must be inCsv. */
export function csvFlowEnds(s: TracedSet, flowUnit: Unit): [number, number] {
  const ps = cleanPoints(csvHead(s));
  const at = (x: number) => round(convert("flow", flowUnit, "m3/h", x), 4)!;
  return [at(ps[0].x), at(ps[ps.length - 1].x)];
}

/** The CSV rows (header first) for the traced sets; a set without a head curve of 3+ points is left out. */
export function tracedRows(sets: readonly TracedSet[], units: TraceUnits, points = 15): unknown[][] {
  const withImpeller = csvHasImpeller(sets);
  const keep = (row: unknown[]) => (withImpeller ? row : row.filter((_, i) => i !== IMPELLER_COLUMN));
  const rows: unknown[][] = [keep(CSV_HEADER)];
  for (const s of sets) {
    if (!inCsv(s)) continue;
    const head = csvHead(s);
    const unitOf = (q: Quantity) => s.units?.[q] ?? units[q];
    const kept = resample(head, Math.max(3, points));
    const x0 = kept[0].x, x1 = kept[kept.length - 1].x;
    // The peaks the user took become rows of their own (on a row's flow already: that row).
    const peaks = (s.peaks ?? []).filter((p) => p.x >= x0 && p.x <= x1);
    const near = (a: number, b: number) => Math.abs(a - b) <= 1e-9 * (1 + Math.abs(b));
    const flows = [...kept.map((p) => p.x), ...peaks.map((p) => p.x).filter((x) => !kept.some((p) => near(p.x, x)))].sort((a, b) => a - b);
    for (const x of flows) {
      const y = kept.find((p) => p.x === x)?.y ?? valueAt(kept, x);
      if (y == null) continue;
      const peak = peaks.find((p) => near(p.x, x));
      const unread = (s.efficiencyGaps ?? []).some((g) => x > g.from && x < g.to);
      const at = (q: Exclude<Quantity, "head">, target: Unit) => {
        if (q === "efficiency" && peak) return convert(q, unitOf(q), target, peak.y);
        if (q === "efficiency" && unread) return null;
        const c = s.curves[q];
        const v = c && c.length >= 2 ? valueAt(c, x) : null;
        return v == null ? null : convert(q, unitOf(q), target, v);
      };
      rows.push(keep([
        s.model, s.type ?? "", s.size ?? "", csvKeyCells(s).speed, csvKeyCells(s).impeller,
        round(convert("flow", units.flow, "m3/h", x), 4), round(convert("head", unitOf("head"), "m", y), 4),
        round(at("efficiency", "%"), 2), round(at("power", "kW"), 4), round(at("npshr", "m"), 4),
      ]));
    }
  }
  return rows;
}

export function tracedCsv(sets: readonly TracedSet[], units: TraceUnits, points = 15): string {
  return toCsv(tracedRows(sets, units, points), { newline: "\n" });
}
