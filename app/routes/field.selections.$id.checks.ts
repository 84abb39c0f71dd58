import type { Route } from "./+types/field.selections.$id.checks";
import { pageWorkspaceRefusal, requireMember, staleQueuedWorkspace } from "~/lib/auth/guards.server";
import { viewerOf } from "~/lib/auth/viewer.server";
import { readFormSafe, readId } from "~/lib/shared/forms.server";
import { asProblem } from "~/lib/shared/api-errors.server";
import { methodNotAllowed } from "~/lib/shared/problem.server";
import { submitCheckForm } from "~/lib/fieldchecks/submit.server";

// POST /field/selections/:id/checks — a check sent from the phone's queue (multipart: the form's
// fields, `clientId` made on the device, `basedOn` the selection's fingerprint, `pageWorkspaceId` the
// workspace it was queued in, `takenAt` the phone's clock then, photos). Answers JSON: 201 { id } when
// recorded, 200 { id, duplicate: true } when that device id was recorded already (a retry), 409
// { otherWorkspace } when the session has moved to another workspace since (kept on the phone, sent once
// back), 409 { conflict, latest? } when the selection changed or the amended version was amended meanwhile,
// 409 problem { code: "client-id-taken" } when another user's check has that device id, 400/422 { errors }.
export async function action({ request, params }: Route.ActionArgs) {
  try {
    const member = await requireMember(request, "fieldcheck.write");
    const selectionId = readId(params.id);
    const form = await readFormSafe(request);
    // Before the selection is opened: in the workspace moved to, it may be closed (404) or open (recorded as that one's).
    const moved = pageWorkspaceRefusal(member, form.get("pageWorkspaceId"), staleQueuedWorkspace);
    if (moved?.status === 409) return Response.json({ otherWorkspace: moved.message }, { status: 409 });
    if (moved)
      return Response.json(
        { conflict: "Not recorded: this check was kept by an older copy of this page, which did not say which workspace it was entered in. Reload the page, make sure you are in that workspace, and send it again.", latest: null },
        { status: 409 },
      );
    const outcome = await submitCheckForm(viewerOf(member), selectionId, form);
    if (outcome.ok) return Response.json({ id: outcome.id, duplicate: outcome.duplicate, url: `/field/checks/${outcome.id}` }, { status: outcome.duplicate ? 200 : 201 });
    if ("conflict" in outcome) return Response.json({ conflict: outcome.conflict, latest: outcome.latest }, { status: 409 });
    return Response.json({ errors: outcome.errors }, { status: outcome.status });
  } catch (e) {
    return asProblem(e);
  }
}

export const loader = () => methodNotAllowed("POST", "The phone's queue posts checks here; the form is at /field/selections/:id.");
