// What the system page and its live preview show: the workbench reduced to plain JSON.
import type { CandidateEvaluation, SystemEvaluation, Adjustment } from "./hydraulics";
import type { CandidateEnergy } from "./energy";

export type WorkbenchView = {
  evaluation: SystemEvaluation | null;
  systemError: string | null;
  flowMax: number;
  candidates: { id: number; curveSetId: number; label: string; library: string; adjustment: Adjustment; result: CandidateEvaluation | null; error: string | null; energy?: CandidateEnergy | null }[];
};

export function workbenchView(bench: {
  evaluation: SystemEvaluation | null;
  systemError: string | null;
  flowMax: number;
  candidates: { id: number; curveSetId: number; label: string; library: string; adjustment: Adjustment; result: CandidateEvaluation | null; error: string | null; energy?: CandidateEnergy | null }[];
}): WorkbenchView {
  return {
    evaluation: bench.evaluation,
    systemError: bench.systemError,
    flowMax: bench.flowMax,
    candidates: bench.candidates.map((c) => ({ id: c.id, curveSetId: c.curveSetId, label: c.label, library: c.library, adjustment: c.adjustment, result: c.result, error: c.error, energy: c.energy ?? null })),
  };
}
