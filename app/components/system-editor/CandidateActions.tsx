// What a member may do with one candidate in the table: adjust it (writers), select it into a
// frozen selection (selection writers, only with an operating point), remove it (writers).
import { Form } from "react-router";
import type { FormErrors } from "~/lib/projects/system-form";
import type { UnitChoice } from "~/lib/shared/units";
import type { WorkbenchView } from "~/lib/projects/workbench-view";
import { AdjustForm } from "./AdjustForm";
import { typedFor, type TypedForm } from "~/lib/projects/typed-back";
import { PostButton } from "~/components/PostButton";

export function CandidateActions({ c, unitSystem, errors, canWrite, canSelect, typedForm }: { c: WorkbenchView["candidates"][number]; unitSystem: UnitChoice; errors: FormErrors; canWrite: boolean; canSelect: boolean; typedForm?: TypedForm }) {
  if (!canWrite && !canSelect) return null;
  return (
    <div className="space-y-2">
      {canWrite ? <AdjustForm c={c} unitSystem={unitSystem} error={errors[`adj.${c.id}`]} typed={typedFor(typedForm, `adj.${c.id}`)} /> : null}
      {canSelect && c.result?.operating ? (
        <Form method="post" className="space-y-1">
          <input type="hidden" name="candidateId" value={c.id} />
          <input name="title" className="field py-0.5 text-xs" placeholder="Selection title" defaultValue={c.label} aria-label={`Title for selecting ${c.label}`} />
          <button className="btn w-full justify-center" name="intent" value="select">
            Select this pump
          </button>
        </Form>
      ) : null}
      {canWrite ? (
        <PostButton intent="remove-candidate" field="candidateId" id={c.id} className="text-xs text-slate-600 underline">
          remove
        </PostButton>
      ) : null}
    </div>
  );
}
