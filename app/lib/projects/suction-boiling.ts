// A suction tank whose surface pressure (absolute) is at or below the liquid's vapour pressure at the temperature: the
// liquid boils at its surface (a saturated tank), or would flash until the tank's pressure rose to the vapour pressure.
// NPSHa = (p_surface − p_vapour)/(ρ g) + z_suction − h_f (common practice) is then the static head alone, less the suction
// losses, at best; computed with a pressure term below zero as entered it is understated (the safe side). Said as a
// system warning with its numbers. Pure; quantities as tokens (engine quantityText.ts).
import { G0 } from "~/engine"; // standard gravity, m/s², as the engine's NPSHa
import { qt, qtExact, qtPair } from "~/engine/quantityText";
import type { SystemInput } from "./system-input";

/**
 * The warning for a suction surface pressure at or below the vapour pressure (the flip: p_surface ≤ p_vapour), or null.
 * @param input the system (suction surface pressure Pa absolute, suction static head m, temperature °C)
 * @param fluid the liquid at the system's temperature (density kg/m³, vapour pressure Pa absolute)
 */
export function boilingSuction(input: Pick<SystemInput, "suctionSurfacePressure" | "suctionStaticHead" | "temperatureC">, fluid: { density: number; vaporPressure: number }): string | null {
  const p = input.suctionSurfacePressure;
  const pv = fluid.vaporPressure;
  if (!(p <= pv)) return null;
  const [pText, pvText] = qtPair("pressure", p, pv); // never read as equal beside "below"
  const term = (p - pv) / (fluid.density * G0);
  const rule = `NPSHa then comes from the static head alone, less the suction losses (common practice): at most the suction static head ${qt("head", input.suctionStaticHead)} less the suction pipe's loss`;
  const state = p === pv
    ? `equal to the liquid's vapour pressure ${pvText} at ${qt("temperature", input.temperatureC)}: the liquid is boiling at its surface (a saturated tank). ${rule}.`
    : `below the liquid's vapour pressure ${pvText} at ${qt("temperature", input.temperatureC)}: the liquid would flash until the tank's pressure rose to its vapour pressure. ${rule}; here it is computed with the pressure term (p − p_vapour)/(ρ g) ${qtExact("head", term, [0])} as entered, so NPSHa is understated (the safe side).`;
  return `The suction tank's surface pressure ${pText} (absolute) is ${state} Check that the surface pressure is absolute (not gauge) and the temperature is the liquid's at the pump.`;
}
