// The life-cycle cost of a duty cycle, or the engine's reason for refusing its inputs. Settings the system form's schema
// refuses (a period past 50 years, a rate outside its range: engine lifeCycleCost.ts), reaching candidateEnergy from a
// stored or hand-made input, make lifeCycleCost throw; the reason then stands where the cost would be (`costMissing`,
// shown by lccText), never as a cycleError beside a cycle that was computed.
import { EngineInputError, lifeCycleCost, type LifeCycleResult } from "~/engine";

/** The life-cycle cost, or why there is none ("life-cycle cost settings refused: years: is at most 50 (got 51)"). */
export function lccOrReason(input: Parameters<typeof lifeCycleCost>[0]): LifeCycleResult | string {
  try {
    return lifeCycleCost(input);
  } catch (e) {
    if (!(e instanceof EngineInputError)) throw e;
    return `life-cycle cost settings refused: ${e.message}`;
  }
}
