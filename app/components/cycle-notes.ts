// What a duty cycle says about its steps, as the system page's step table and the selection report show it: a step
// that is not met or not computed says so with the engine's message (its rule and numbers), and the engine's warnings
// are shown at the step they name (`parameter` "profile[i]", app/engine/dutyCycle.ts) or under the table. Pure.
import type { DutyCycleResult, StepResult } from "~/engine";
import { fmtNum } from "~/lib/shared/units";
import { amountText } from "~/components/energy-numbers";
import { cycleWarnings, stepVerdict, stepWarnings } from "~/lib/projects/energy";

// A step's verdict and the warnings by step are the energy module's (the selection's CSV export says them alike).
export { cycleWarnings, stepVerdict, stepWarnings };

/** The step as named in a note: its flow as a share of the duty flow and its hours, e.g. "45 % flow, 2000 h", "25 % flow, 0.88 h". */
export const stepName = (s: Pick<StepResult, "flowFraction" | "hours">): string => `${fmtNum(s.flowFraction * 100, 0)} % flow, ${amountText(s.hours)} h`;

type Cycle = { steps: readonly Pick<StepResult, "flowFraction" | "hours" | "status" | "message">[]; warnings?: DutyCycleResult["warnings"] };

/**
 * Every note of a cycle as one line each, step by step (for the printed report, which shows no step table): a step not
 * met or not computed with its message, a warning at its step, then the cycle's other warnings.
 */
export function cycleNoteLines(cycle: Cycle): string[] {
  const lines: string[] = [];
  cycle.steps.forEach((s, i) => {
    if (s.status !== "ok") lines.push(`Step at ${stepName(s)}: ${stepVerdict(s)} — ${s.message}.`);
    for (const w of stepWarnings(cycle, i)) lines.push(`Step at ${stepName(s)}: ${w}.`);
  });
  for (const w of cycleWarnings(cycle)) lines.push(`${w.charAt(0).toUpperCase()}${w.slice(1)}.`);
  return lines;
}
