// What the system page and its live preview show: the workbench reduced to plain JSON.
import type { CandidateEvaluation, SystemEvaluation, Adjustment } from "./hydraulics";
import type { CandidateEnergy } from "./energy";
import type { DocProblem } from "./stored-doc";
import { verdictNpshNote } from "./verdict-npsh";
import { verdictStartNote } from "./verdict-start";
import { verdictMotorNote } from "./verdict-motor";
import { verdictStagedNpshNote } from "./verdict-staged-npsh";
import { verdictMinFlowNote } from "./verdict-min-flow";
import { resultRatiosShown } from "./npsh-ratio";

type EvaluatedCandidate = { id: number; curveSetId: number; label: string; library: string; adjustment: Adjustment; result: CandidateEvaluation | null; error: string | null; energy?: CandidateEnergy | null };
/**
 * A candidate whose stored adjustment does not pass the checks (stored-adjustment.ts): its problems (the first
 * MAX_PROBLEMS_LISTED of `count`) and the stored values for the adjust form (`form`); never evaluated or compared.
 */
export type CandidateReviewView = { id: number; curveSetId: number; label: string; library: string; count: number; problems: DocProblem[]; form: Adjustment };

export type WorkbenchView = {
  evaluation: SystemEvaluation | null;
  systemError: string | null;
  flowMax: number;
  candidates: EvaluatedCandidate[];
  /** Candidates left out of the chart, the comparison and selection until their adjustment is set again (or they are removed). */
  needsReview: CandidateReviewView[];
};

export function workbenchView(bench: {
  evaluation: SystemEvaluation | null;
  systemError: string | null;
  flowMax: number;
  candidates: EvaluatedCandidate[];
  needsReview: CandidateReviewView[];
}): WorkbenchView {
  return {
    evaluation: bench.evaluation,
    systemError: bench.systemError,
    flowMax: bench.flowMax,
    candidates: bench.candidates.map((c) => ({ id: c.id, curveSetId: c.curveSetId, label: c.label, library: c.library, adjustment: c.adjustment, result: c.result, error: c.error, energy: c.energy ?? null })),
    needsReview: bench.needsReview.map((c) => ({ id: c.id, curveSetId: c.curveSetId, label: c.label, library: c.library, count: c.count, problems: c.problems, form: c.form })),
  };
}

/**
 * The read API's view (GET /api/v1/systems/:id, POST …/preview): the workbench view with each candidate's `result.verdictNpsh`,
 * what NPSH over the band says against the verdict on its line (verdict-npsh.ts, as the search API and every page showing the
 * verdict), its `result.verdictStart`, what starting pumps in parallel one after another says against it on the same line
 * (verdict-start.ts), with `result.stagedStart` (the numbers behind it, documented, [] where none), its `result.verdictMotor`,
 * what the motor check says against it (verdict-motor.ts: overloaded at the operating point, or can overload), its
 * `result.verdictStagedNpsh`, what NPSH at a staged duty-cycle step says against it (verdict-staged-npsh.ts), its `result.verdictMinFlow`,
 * a duty below the maker's minimum continuous flow (verdict-min-flow.ts, with `result.minFlow` its numbers), and no NPSH margin ratio
 * where NPSHa ≤ 0 (figures, band, judged points: null, NPSHa beside it).
 */
export function workbenchApiView(view: WorkbenchView) {
  return {
    ...view,
    candidates: view.candidates.map((c) => {
      const r = c.result;
      if (!r) return { ...c, result: null };
      return {
        ...c,
        result: {
          // No NPSH margin ratio where NPSHa ≤ 0 (npsh-ratio.ts): figures, band, judged points.
          ...resultRatiosShown(r),
          verdictNpsh: verdictNpshNote(r.verdict, r.npsh),
          verdictStart: verdictStartNote(r.verdict, r.stagedStart),
          verdictMotor: verdictMotorNote(r.verdict, r.figures),
          // NPSH at a duty-cycle step where fewer pumps in parallel run (verdict-staged-npsh.ts), on the same line.
          verdictStagedNpsh: verdictStagedNpshNote(r.verdict, c.energy?.cycle),
          // A duty below the maker's minimum continuous flow (verdict-min-flow.ts), on the same line; result.minFlow: its numbers.
          verdictMinFlow: verdictMinFlowNote(r.verdict, r.minFlow),
          minFlow: r.minFlow ?? null,
          stagedStart: r.stagedStart ?? [],
        },
      };
    }),
  };
}
