// Tests only: one evaluated candidate on the default system (an invented pump near its duty of 36 m³/h at 15 m) and
// its energy over the duty cycle with some inputs changed; the energy and CandidateEnergy tests start from it.
import { candidateEnergy } from "./energy";
import { defaultSystemInput, fluidOf, systemSpec, type SystemInput } from "./hydraulics";

const M3H = 1 / 3600;
// flow m³/h, head m, efficiency (invented)
const curve = [[5, 21.8, 0.3], [10, 21.5, 0.45], [20, 20, 0.62], [30, 17.5, 0.72], [36, 15.5, 0.74], [45, 12, 0.7], [55, 7, 0.6]].map(([q, h, e]) => ({ flow: q * M3H, head: h, efficiency: e, power: null, npshr: null }));
const evaluated = { adjustment: { method: "none" as const, arrangement: "single" as const, dutyPumps: 1, serviceFactor: 1 }, result: { ratio: 1, curve, operating: { flow: 36.5 * M3H, head: 15.3 }, figures: { motor: { rating: 3000, efficiency: 0.87 } } } };

/** The fixture candidate's energy on the default system with `o` changed, purchase price 2500 (or `priceCents`, null: not given). */
export function fixtureEnergy(o: Partial<SystemInput>, priceCents: number | null = 250000) {
  const input = { ...defaultSystemInput(), ...o };
  return candidateEnergy(input, systemSpec(input), fluidOf(input).density, evaluated, priceCents);
}
