// A suction reading at or below the liquid's vapour pressure (absolute): the liquid at the suction tap would boil, so either
// the reading is wrong (its reference, unit or zero) or the pump is cavitating — its head, and the verdict on it, are not the
// pump's on its curve. The check still works the readings out as read (a cavitating pump does read about its vapour pressure
// at the suction), and says so with both pressures and the rule. A gauge reading is made absolute against the standard
// atmosphere, as the check takes a mixed pair (local barometric pressure differs: lower at altitude). Pure; quantities as
// tokens (engine quantityText.ts).
import { STANDARD_ATMOSPHERE } from "~/engine";
import { qt, qtPair } from "~/engine/quantityText";
import type { GaugeSI } from "./form";

/**
 * Why a suction reading is not the pump's on its curve — its absolute pressure at or below the vapour pressure (the flip:
 * p_abs ≤ p_v) — as a clause ("the suction reading … would boil …"), or null.
 * @param suction the suction gauge as read (Pa on its reference)
 * @param vaporPressure the liquid's vapour pressure at the fluid temperature read, Pa absolute
 * @param temperatureC the fluid temperature read, °C
 */
export function suctionAtVapour(suction: Pick<GaugeSI, "pressure" | "reference">, vaporPressure: number, temperatureC: number): string | null {
  const absolute = suction.reference === "absolute" ? suction.pressure : suction.pressure + STANDARD_ATMOSPHERE;
  if (!(absolute <= vaporPressure)) return null;
  // A vacuum reading with the true minus sign (U+2212) outside its token: "−99.0 kPa gauge" on every surface (it read "-99.0").
  const [pText, pvText] = qtPair("pressure", absolute, vaporPressure); // never read as equal beside "below"
  const read = suction.reference === "absolute" ? `${pText} absolute` : `${suction.pressure < 0 ? "\u2212" : ""}${qt("pressure", Math.abs(suction.pressure))} gauge, ${pText} absolute against the standard atmosphere ${qt("pressure", STANDARD_ATMOSPHERE)}`;
  return `the suction reading (${read}) is ${absolute === vaporPressure ? "at" : "below"} the liquid's vapour pressure ${pvText} at ${qt("temperature", temperatureC)}: the liquid at the suction tap would boil. Either the reading is wrong (its reference gauge or absolute, its unit, its zero) or the pump is cavitating; the head is worked out from the readings as read, and is not the pump's performance on its curve.`;
}
