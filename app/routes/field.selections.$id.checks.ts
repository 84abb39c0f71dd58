import type { Route } from "./+types/field.selections.$id.checks";
import { pageWorkspaceRefusal, queuedCheckWaits, requireMember } from "~/lib/auth/guards.server";
import { viewerOf } from "~/lib/auth/viewer.server";
import { readFormSafe, readId } from "~/lib/shared/forms.server";
import { asProblem } from "~/lib/shared/api-errors.server";
import { methodNotAllowed } from "~/lib/shared/problem.server";
import { submitCheckForm } from "~/lib/fieldchecks/submit.server";

/** The 409 to a queued check without its workspace: kept on the phone as a conflict, with what to do. */
const OLDER_SCRIPT =
  "Not recorded: this check was kept by an older copy of this page, which did not say which workspace it was entered in. Reload the page, make sure you are in that workspace, and send it again.";

// POST /field/selections/:id/checks — a check sent from the phone's queue (multipart: the form's
// fields, `clientId` made on the device, `basedOn` the selection's fingerprint, `takenAt` the phone's clock
// when it was kept, photos). Answers JSON: 201 { id } when recorded, 200 { id, duplicate: true } when that
// device id was recorded already by the same user (a retry), 409 { conflict, latest? } when the selection
// changed or the amended version was amended meanwhile, 409 problem { code: "client-id-taken" } when another
// user's check has that device id, 400/422 { errors }. The selection's change carries `code: "selection-changed"`:
// only that conflict may be recorded against the selection as it is now (sent without `basedOn`). The check is for
// the workspace it was entered in (`pageWorkspaceId`, which the queue sends from the check's owner), checked before
// the selection is opened:
// 409 { staleWorkspace } when the session works in another one now (the phone keeps it waiting); without
// the field (an older page's script) 409 { conflict } asking for a reload, never a refusal the phone could
// only delete.
export async function action({ request, params }: Route.ActionArgs) {
  try {
    const member = await requireMember(request, "fieldcheck.write");
    const selectionId = readId(params.id);
    const form = await readFormSafe(request);
    const refused = pageWorkspaceRefusal(member, form.get("pageWorkspaceId"));
    if (refused?.status === 409) return Response.json({ staleWorkspace: queuedCheckWaits(member, Number(form.get("pageWorkspaceId"))) }, { status: 409 });
    if (refused) return Response.json({ conflict: OLDER_SCRIPT, latest: null }, { status: 409 });
    const outcome = await submitCheckForm(viewerOf(member), selectionId, form);
    if (outcome.ok) return Response.json({ id: outcome.id, duplicate: outcome.duplicate, url: `/field/checks/${outcome.id}` }, { status: outcome.duplicate ? 200 : 201 });
    if ("conflict" in outcome)
      return Response.json({ conflict: outcome.conflict, latest: outcome.latest, ...(outcome.selectionChanged ? { code: "selection-changed" } : {}) }, { status: 409 });
    return Response.json({ errors: outcome.errors }, { status: outcome.status });
  } catch (e) {
    return asProblem(e);
  }
}

export const loader = () => methodNotAllowed("POST", "The phone's queue posts checks here; the form is at /field/selections/:id.");
