// What a duty cycle says about its steps, as the system page's step table and the selection report show it: a step
// that is not met or not computed says so with the engine's message (its rule and numbers), and the engine's warnings
// are shown at the step they name (`parameter` "profile[i]", app/engine/dutyCycle.ts) or under the table. A step below the
// maker's minimum continuous flow (engine stepPor.ts `step-below-maker-min-flow`) is a line of its own, in full. Pure.
import { neverRunMarked } from "~/engine/cycleTotals";
import { NEVER_RUN_NOTE, STEP_MIN_FLOW_FRACTION, STEP_POR_CODES, STEP_POR_RULE, type DutyCycleResult, type StepResult } from "~/engine";
import { fmtPctExact, pastBelow } from "~/engine/quantityText";
import { fmtNum } from "~/lib/shared/units";
import { amountText } from "~/components/energy-numbers";
import { cycleWarnings, stepVerdict, stepWarnings } from "~/lib/projects/energy";

// A step's verdict and the warnings by step are the energy module's (the selection's CSV export says them alike).
export { cycleWarnings, stepVerdict, stepWarnings };

/** The step as named in a note: its flow as a share of the duty flow and its hours, e.g. "45 % flow, 2000 h", "25 % flow, 0.88 h". */
export const stepName = (s: Pick<StepResult, "flowFraction" | "hours">): string => `${fmtNum(s.flowFraction * 100, 0)} % flow, ${amountText(s.hours)} h`;

type Cycle = { steps: readonly Pick<StepResult, "flowFraction" | "hours" | "status" | "message">[]; warnings?: DutyCycleResult["warnings"] };

/** A step's note on where it runs against the BEP (engine stepPor.ts), with the ratio it states; null for any other warning. */
function bepNoteOf(w: NonNullable<Cycle["warnings"]>[number]): number | null {
  const ratio = (w as { bepRatio?: unknown }).bepRatio;
  return (STEP_POR_CODES as readonly (string | undefined)[]).includes(w.code) && typeof ratio === "number" && Number.isFinite(ratio) ? ratio : null;
}

/**
 * Every note of a cycle as one line each, step by step (for the printed report, which shows no step table): a step not
 * met or not computed with its message, a warning at its step, then the cycle's other warnings. The steps that run
 * outside the BEP's preferred operating region (stepPor.ts: a note each on the page, the screen report and the CSV) are
 * printed together on one line with their figures and the rule said once, so a cycle with several such steps keeps the
 * report to its pages.
 */
export function cycleNoteLines(cycle: Cycle): string[] {
  const lines: string[] = [];
  const offBep: string[] = [];
  let belowMin = false;
  let maker = "unsaid" as "recorded" | "none" | "unsaid"; // the maker's minimum flow beside a note below 50 % (cycles frozen before: unsaid)
  cycle.steps.forEach((s, i) => {
    if (s.status !== "ok") lines.push(`Step at ${stepName(s)}: ${stepVerdict(s)} — ${s.message}.`);
    for (const w of (cycle.warnings ?? []).filter((x) => x.parameter === `profile[${i}]`)) {
      const ratio = bepNoteOf(w);
      if (ratio === null) lines.push(`Step at ${stepName(s)}: ${neverRunMarked(w.message, s.hours)}.`); // a 0 h step's note: information only
      else {
        const low = pastBelow(ratio, STEP_MIN_FLOW_FRACTION); // as the engine's note (stepPor.ts): to 1 part in 10⁸
        belowMin ||= low;
        const m = (w as { makerMinFlow?: unknown }).makerMinFlow;
        if (low && m !== undefined) maker = typeof m === "number" ? "recorded" : "none";
        offBep.push(`${stepName(s)} at ${fmtPctExact(ratio, [0.7, 1.2, STEP_MIN_FLOW_FRACTION], 0)}${low ? "*" : ""}${s.hours === 0 ? ` ${NEVER_RUN_NOTE}` : ""}`);
      }
    }
  });
  if (offBep.length) {
    const makerWords =
      maker === "recorded" ? "; at or above the maker's minimum continuous flow recorded for this curve"
      : maker === "none" ? "; no maker's minimum flow is recorded for this curve — check the maker's data sheet"
      : " — check the maker's minimum flow";
    const worst = belowMin ? ` (* below ${fmtNum(STEP_MIN_FLOW_FRACTION * 100, 0)} %, a common lower bound for continuous running, from memory${makerWords}: recirculation, heating, vibration)` : "";
    lines.push(`Steps outside the ${STEP_POR_RULE}, each pump's flow as a share of its BEP flow at its speed: ${offBep.join("; ")}${worst}. Notes, not failures.`);
  }
  for (const w of cycleWarnings(cycle)) lines.push(`${w.charAt(0).toUpperCase()}${w.slice(1)}.`);
  return lines;
}
