// The system page's candidates whose stored adjustment does not pass the checks (app/lib/projects/stored-adjustment.ts):
// each named with its problems in plain words and the value stored, left out of the chart, the comparison, the energy
// panel and selection (no default adjustment stands in for theirs), with the adjust form filled with the stored values
// and removal, for writers. Applying an adjustment that passes brings the candidate back into the comparison.
import type { FormErrors } from "~/lib/projects/system-form";
import type { UnitChoice } from "~/lib/shared/units";
import type { CandidateReviewView } from "~/lib/projects/workbench-view";
import { AdjustForm } from "./AdjustForm";
import { typedFor, type TypedForm } from "~/lib/projects/typed-back";
import { PostButton } from "~/components/PostButton";
import { StoredProblems } from "~/components/StoredProblems";

export function CandidatesNeedingReview({ items, unitSystem, errors, canWrite, typedForm }: { items: readonly CandidateReviewView[]; unitSystem: UnitChoice; errors: FormErrors; canWrite: boolean; typedForm?: TypedForm }) {
  if (items.length === 0) return null;
  const n = items.length;
  return (
    <div className="space-y-3 rounded border border-fail p-3" role="alert" aria-labelledby="candidates-review-h" data-testid="candidates-needing-review">
      <h3 id="candidates-review-h" className="text-sm font-semibold text-fail">
        {n === 1 ? "1 candidate needs" : `${n} candidates need`} review: the stored adjustment does not pass the checks
      </h3>
      <p className="text-xs">
        Read from the database, the adjustment (speed or trim, pumps, motor) was stored under an older version of the checks or changed outside this page.
        {n === 1 ? " This candidate is" : " These candidates are"} not evaluated, drawn, compared or selectable, and no default adjustment (as published, one pump) stands in
        for the stored one.{" "}
        {canWrite
          ? "Apply an adjustment below — the form shows the values as stored; one that is missing or not a number is blank — or remove the candidate."
          : "Someone with write access to this project can apply an adjustment again or remove the candidate."}
      </p>
      {items.map((c) => (
        <div key={c.id} className="space-y-1 border-t border-slate-200 pt-2" data-testid={`candidate-review-${c.id}`}>
          <p className="text-sm">
            <span className="font-semibold">{c.label}</span> <span className="text-xs text-slate-600">({c.library})</span>
          </p>
          <StoredProblems problems={c.problems} count={c.count} small />
          {canWrite ? (
            <div className="flex flex-wrap items-end gap-3">
              <div className="w-64">
                <AdjustForm c={{ id: c.id, adjustment: c.form }} unitSystem={unitSystem} error={errors[`adj.${c.id}`]} typed={typedFor(typedForm, `adj.${c.id}`)} />
              </div>
              <PostButton intent="remove-candidate" field="candidateId" id={c.id} className="text-xs text-slate-600 underline">
                remove
              </PostButton>
            </div>
          ) : null}
        </div>
      ))}
    </div>
  );
}
