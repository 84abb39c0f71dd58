// What a candidate's power figures are worked out over, for pumps in parallel or series (hydraulics.ts
// evaluateCandidate): shaft and hydraulic power, electrical input, energy and cost are for all duty pumps together
// (k × one pump's); efficiency, NPSH, the BEP position, the largest power on the curve and the motor (rating, overload
// check, load, suggestion) are one pump's — identical pumps share the duty equally (common practice). Standby pumps do
// not run and count in neither. A single pump has no basis to name: its figures read as they always did. Pure.

type Arrangement = { arrangement: "single" | "parallel" | "series"; dutyPumps: number; standbyPumps?: number };

export type PumpsBasis = {
  /** Duty pumps (≥ 2). */
  n: number;
  /** "2 duty pumps together": the basis of a total (the CSV's basis column). */
  together: string;
  /** "for 2 duty pumps": after a total in a sentence. */
  forAll: string;
  /** "2 pumps in parallel + 1 standby". */
  arrangement: string;
};

/** The basis words of a candidate run as several pumps, or null for a single pump (or one duty pump alone). */
export function pumpsBasis(a: Arrangement): PumpsBasis | null {
  if (a.arrangement === "single" || a.dutyPumps < 2) return null;
  const n = a.dutyPumps;
  const standby = a.standbyPumps ? ` + ${a.standbyPumps} standby` : "";
  return { n, together: `${n} duty pumps together`, forAll: `for ${n} duty pumps`, arrangement: `${n} pumps in ${a.arrangement}${standby}` };
}

/** The CSV figures that are one pump's (the others a total of the duty pumps, or not a power-related figure). */
export const PER_PUMP_FIGURES: ReadonlySet<string> = new Set([
  "efficiency", "bep_ratio", "npsh_available", "npsh_required", "npsh_margin_ratio", "max_power_on_curve", "motor_non_overloading", "motor_overload_check", "motor_rating",
  "motor_rating_source", "motor_suggested", "motor_suggestion_basis", "motor_efficiency", "motor_efficiency_source", "drive_efficiency",
  "shaft_power_per_pump", "electrical_input_per_pump", "maker_min_flow", "maker_min_flow_as_run", "duty_flow_per_running_pump",
]);

/** The CSV figures that are a total of the duty pumps. */
export const ALL_PUMPS_FIGURES: ReadonlySet<string> = new Set([
  "operating_flow", "operating_head", "hydraulic_power", "shaft_power", "electrical_input", "annual_energy_electrical", "annual_cost",
  "cycle_annual_energy_electrical", "cycle_energy_cost_per_year", "lcc_total_present_value", "lcc_energy_present_value",
]);

/** A power column's CSV name: `shaft_power_w` as it was for a single pump, `shaft_power_all_duty_pumps_w` for several. */
export const powerColumn = (b: PumpsBasis | null, name: string) => (b ? name.replace(/_w$/, "_all_duty_pumps_w") : name);
