// The fluid temperature a system is entered at, and the one way a refusal of it is worded (decision "inputedge"): water
// within the range its properties are computed for (engine fluids.ts `WATER_RANGE_C`, IAPWS formulations: 0 °C to
// 100 °C, the engine refuses outside it), any liquid within the plausibility bounds every system is held to (−50 °C to
// 300 °C, our rule; a user-defined liquid's properties are taken as given, so it has no range of its own). The editor
// (system-form.ts), the preview API and every save (`SystemInputEntrySchema`) refuse at the temperature's field in
// these words: the field, the range in the unit typed, the temperature sent. Pure.
import { WATER_RANGE_C } from "~/engine";
import { outOfRange, type NumberRange } from "./run-ranges";

/** Any liquid, °C: −50 to 300 (our rule: past them a unit was mistaken); the stored schema's too. */
export const LIQUID_TEMPERATURE_RANGE: NumberRange = { label: "Temperature", q: "temperature", min: -50, max: 300 };

/** Water, °C: the engine's fluid table (fluids.ts), the one source. */
export const WATER_TEMPERATURE_RANGE: NumberRange = {
  label: "Temperature",
  q: "temperature",
  min: WATER_RANGE_C.min,
  max: WATER_RANGE_C.max,
  why: "water's properties are computed for this range only; for a temperature outside it, describe the liquid as a user-defined fluid",
};

/**
 * The refusal of a water temperature outside the range its properties are computed for, or null (another liquid, or
 * inside it). Exact at the ends, as the engine's own check (fluids.ts `waterProperties`).
 * @param fluidKind the system's liquid
 * @param temperatureC the temperature, °C
 */
export function waterTemperatureProblem(fluidKind: "water" | "custom", temperatureC: number): string | null {
  if (fluidKind !== "water" || !Number.isFinite(temperatureC)) return null;
  const r = WATER_TEMPERATURE_RANGE;
  return temperatureC < r.min || temperatureC > r.max ? outOfRange(r, temperatureC) : null;
}
