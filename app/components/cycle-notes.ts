// What a duty cycle says about its steps, as the system page's step table and the selection report show it: a step
// that is not met or not computed says so with the engine's message (its rule and numbers), and the engine's warnings
// are shown at the step they name (`parameter` "profile[i]", app/engine/dutyCycle.ts) or under the table. Pure.
import type { DutyCycleResult, StepResult } from "~/engine";
import { fmtNum } from "~/lib/shared/units";

/** How a step that is not "ok" reads at the step: not met (the pump or the control cannot reach it) or not computed (no data). */
export function stepVerdict(s: Pick<StepResult, "status">): string {
  if (s.status === "ok") return "";
  return s.status === "no-power-data" ? "not computed" : "not met";
}

/** The step as named in a note: its flow as a share of the duty flow and its hours, e.g. "45 % flow, 2000 h". */
export const stepName = (s: Pick<StepResult, "flowFraction" | "hours">): string => `${fmtNum(s.flowFraction * 100, 0)} % flow, ${fmtNum(s.hours, 0)} h`;

type Cycle = { steps: readonly Pick<StepResult, "flowFraction" | "hours" | "status" | "message">[]; warnings?: DutyCycleResult["warnings"] };

/** The warnings about step `i` (motor below 10 % load, …): their messages. */
export function stepWarnings(cycle: Cycle, i: number): string[] {
  return (cycle.warnings ?? []).filter((w) => w.parameter === `profile[${i}]`).map((w) => w.message);
}

/**
 * The warnings about no single step (those of cycles frozen before warnings named their step included). The
 * incomplete-cycle warning is left out: the totals say it with their "(incomplete: …)" mark.
 */
export function cycleWarnings(cycle: Cycle): string[] {
  return (cycle.warnings ?? []).filter((w) => w.code !== "cycle-incomplete" && !/^profile\[\d+\]$/.test(w.parameter ?? "")).map((w) => w.message);
}

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
