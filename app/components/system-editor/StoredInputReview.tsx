// The system page when the stored inputs do not pass the checks (app/lib/projects/stored-input.ts): each problem named
// in plain words with the value stored, and why nothing is computed. The editor below shows the stored values and
// the same problems beside its fields; saving the fixed inputs brings the system curve and candidates back.
import type { InputProblem } from "~/lib/projects/stored-input";
import { StoredProblems } from "~/components/StoredProblems";

/** `problems`: the first MAX_PROBLEMS_LISTED of `count`. */
export function StoredInputReview({ problems, count, canWrite }: { problems: readonly InputProblem[]; count: number; canWrite: boolean }) {
  return (
    <section className="panel space-y-2 border-fail" role="alert" aria-labelledby="stored-input-review-h" data-testid="stored-input-review">
      <h2 id="stored-input-review-h" className="font-semibold text-fail">
        This system needs review: its stored inputs do not pass the checks
      </h2>
      <p className="text-sm">
        {count} problem{count === 1 ? "" : "s"} found when the stored inputs were read (saved under an older version of the checks, or changed outside the editor).
        Nothing is computed from them — no system curve, operating points, candidate results, verdicts or pump search — and no default values stand in for them.
      </p>
      <StoredProblems problems={problems} count={count} />
      <p className="text-sm">
        {canWrite
          ? "The editor shows the values as stored; a value that is missing or not a number is blank. Correct the fields marked, then save: the checks run again and the results come back."
          : "Someone with write access to this project can correct them in the editor and save."}
      </p>
    </section>
  );
}
