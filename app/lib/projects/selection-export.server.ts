// Selection exports: CSV (our own layout, documented in the header lines) and JSON (the frozen record).
import type { FrozenSelection } from "./selections.server";
import { toCsv } from "../shared/csv";

const row = (xs: unknown[]) => xs;

/** Three sections, each with its own header row: system curve points, pump curve as used, and figures. SI units named in every header. */
export function selectionCsv(id: number, title: string, f: FrozenSelection): string {
  const lines: unknown[][] = [];
  lines.push(row(["# Dutymark selection export", `DM-${String(id).padStart(5, "0")}`, title]));
  lines.push(row(["# Figures are for design guidance; verify against the manufacturer's certified data, local codes and a licensed engineer."]));
  lines.push([]);
  lines.push(row(["section", "flow_m3s", "head_m", "head_low_m", "head_high_m", "pressure_pa", "npsha_m"]));
  const sc = f.systemCurve;
  if (sc) sc.flows.forEach((q, i) => lines.push(row(["system_curve", q, sc.design[i], sc.low[i], sc.high[i], sc.pressure[i], sc.npsha[i]?.y])));
  lines.push([]);
  lines.push(row(["section", "flow_m3s", "head_m", "efficiency", "shaft_power_w", "npshr_m"]));
  for (const p of f.result.curve) lines.push(row(["pump_curve", p.flow, p.head, p.efficiency, p.power, p.npshr]));
  lines.push([]);
  lines.push(row(["section", "edge", "flow_m3s", "head_m", "efficiency", "shaft_power_w", "npsh_margin_ratio", "no_operating_point_reason"]));
  for (const b of f.result.band ?? []) lines.push(row(["band", b.edge, b.flow, b.head, b.efficiency, b.shaftPower, b.npshMarginRatio, b.reason]));
  lines.push([]);
  lines.push(row(["section", "figure", "value", "unit"]));
  const fig = f.result.figures;
  const add = (name: string, value: unknown, unit: string) => lines.push(row(["figures", name, value, unit]));
  add("operating_flow", f.result.operating?.flow, "m3/s");
  add("operating_head", f.result.operating?.head, "m");
  const verdict = f.result.verdict;
  add("verdict", verdict?.status ?? (f.result.verdict === undefined ? "not judged (selected before verdicts existed)" : "no duty point set"), "");
  add("verdict_rule", verdict?.rule, "");
  (verdict?.reasons ?? []).forEach((r, i) => add(`verdict_reason_${i + 1}`, r, ""));
  add("verdict_edge", verdict?.edge, "");
  add("crossing_status", f.result.status, "");
  add("adjustment_method", f.adjustment.method, "");
  add("adjustment_ratio", f.result.ratio, "1");
  add("arrangement", `${f.adjustment.arrangement} x${f.adjustment.dutyPumps} (+${f.adjustment.standbyPumps} standby)`, "");
  add("efficiency", fig?.efficiency, "1");
  add("hydraulic_power", fig?.hydraulicPower, "W");
  add("shaft_power", fig?.shaftPower, "W");
  add("bep_ratio", fig?.bepRatio, "1");
  add("npsh_available", fig?.npshAvailable, "m");
  add("npsh_required", fig?.npshRequired, "m");
  add("npsh_margin_ratio", fig?.npshMarginRatio, "1");
  // Over the design point and the band's edges (selections saved before this was judged have none).
  add("npsh_status_over_band", f.result.npsh?.status ?? null, "");
  add("npsh_lowest_margin_ratio", f.result.npsh?.marginRatio ?? null, "1");
  add("npsh_lowest_at", f.result.npsh?.at ?? null, "");
  add("max_power_on_curve", fig?.maxPower, "W");
  add("motor_non_overloading", fig?.nonOverloading, "");
  add("motor_rating", fig?.motor?.rating ?? null, "W");
  add("motor_rating_source", fig?.motor?.ratingSource ?? null, "");
  add("motor_suggested", fig?.motor?.suggestedRating ?? null, "W");
  add("motor_suggestion_basis", fig?.motor?.suggestionBasis ?? null, "");
  add("motor_efficiency", fig?.motor?.efficiency ?? null, "1");
  add("motor_efficiency_source", fig?.motor?.efficiencySource ?? null, "");
  add("drive_efficiency", fig?.motor?.driveEfficiency ?? null, "1");
  add("electrical_input", fig?.motor?.electricalPower ?? null, "W");
  add("annual_energy_electrical", fig?.annualEnergyKWh, "kWh");
  add("annual_cost", fig?.annualCost, fig?.motor?.currency || "currency");
  add("library", f.pump.library.name, "");
  add("library_revision", f.pump.library.revision, "");
  add("model", f.pump.model, "");
  return toCsv(lines, { precision: 10 });
}
