// What a candidate's power figures are worked out over, for pumps in parallel or series (hydraulics.ts
// evaluateCandidate): shaft and hydraulic power, electrical input, energy and cost are for all duty pumps together
// (k × one pump's); efficiency, NPSH, the BEP position, the largest power on the curve and the motor (rating, overload
// check, load, suggestion) are one pump's — identical pumps share the duty equally (common practice). Standby pumps do
// not run and count in neither. A single pump has no basis to name: its figures read as they always did. Pure.
// Pumps in parallel staged by demand over a duty cycle (engine dutyStaging.ts): the cycle's flows, powers, energy and its
// cost are of the pumps running at each step (one of two at a low step), never "for 2 duty pumps" (`cycleFiguresBasis`).

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

/** The one wording of a staged cycle's basis, on every surface (candidates table, report and its printed line, methods, CSV). */
export const STAGED_BASIS = "the pumps running at each step";

/** What a duty cycle's figures are for: `together` and `forAll` as {@link PumpsBasis}'s, or the pumps running at each step when staged. */
export type CycleBasis = { together: string; forAll: string };

/**
 * The basis of a candidate's duty-cycle figures (energy, its cost, the life-cycle cost's energy): the pumps running at each
 * step where the cycle is staged by demand, else the duty pumps together; null for a single pump.
 * @param b the arrangement's basis (null: a single pump)
 * @param staged whether the cycle's steps say how many pumps run (engine dutyStaging.ts)
 */
export function cycleFiguresBasis(b: PumpsBasis | null, staged: boolean): CycleBasis | null {
  if (!b) return null;
  return staged ? { together: STAGED_BASIS, forAll: `for ${STAGED_BASIS}` } : { together: b.together, forAll: b.forAll };
}

/** The CSV figures of the duty cycle (and the life-cycle cost's energy on it): their basis is the cycle's (`cycleFiguresBasis`). */
export const CYCLE_FIGURES: ReadonlySet<string> = new Set(["cycle_annual_energy_electrical", "cycle_energy_cost_per_year", "lcc_energy_present_value"]);

/** The CSV figures that are one pump's (the others a total of the duty pumps, or not a power-related figure). */
export const PER_PUMP_FIGURES: ReadonlySet<string> = new Set([
  "efficiency", "bep_ratio", "npsh_available", "npsh_required", "npsh_margin_ratio", "max_power_on_curve", "motor_non_overloading", "motor_overload_check", "motor_rating",
  "motor_rating_source", "motor_suggested", "motor_suggestion_basis", "motor_efficiency", "motor_efficiency_source", "drive_efficiency",
  "shaft_power_per_pump", "electrical_input_per_pump", "maker_min_flow", "maker_min_flow_as_run", "duty_flow_per_running_pump",
]);

/** The CSV figures that are a total of the duty pumps. */
export const ALL_PUMPS_FIGURES: ReadonlySet<string> = new Set([
  "operating_flow", "operating_head", "hydraulic_power", "shaft_power", "electrical_input", "annual_energy_electrical", "annual_cost",
  ]);

/**
 * The basis-column words of a CSV figure: per pump, the duty pumps together, the cycle's basis (`cycleFiguresBasis`) for its
 * energy figures, the purchase of every pump offered (standby included, as the price is entered) with the cycle's energy
 * for the life-cycle cost's total; "" where none applies.
 * @param b the arrangement's basis
 * @param cycle the duty cycle's basis (null: no cycle)
 * @param name the CSV figure's name
 */
export function csvFigureBasis(b: PumpsBasis, cycle: CycleBasis | null, name: string): string {
  if (PER_PUMP_FIGURES.has(name)) return "per pump";
  if (ALL_PUMPS_FIGURES.has(name)) return b.together;
  if (CYCLE_FIGURES.has(name)) return (cycle ?? b).together;
  if (name === "purchase_price") return `all ${b.arrangement}`;
  if (name === "lcc_total_present_value") return `purchase: all ${b.arrangement}; energy: ${(cycle ?? b).together}`;
  return "";
}

/** A power column's CSV name: `shaft_power_w` as it was for a single pump, `shaft_power_all_duty_pumps_w` for several. */
export const powerColumn = (b: PumpsBasis | null, name: string) => (b ? name.replace(/_w$/, "_all_duty_pumps_w") : name);
