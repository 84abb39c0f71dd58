import type { Route } from "./+types/field.selections.$id.checks";
import { pageWorkspaceRefusal, requireMember } from "~/lib/auth/guards.server";
import { viewerOf } from "~/lib/auth/viewer.server";
import { readFormSafe, readId } from "~/lib/shared/forms.server";
import { asProblem } from "~/lib/shared/api-errors.server";
import { methodNotAllowed } from "~/lib/shared/problem.server";
import { submitCheckForm } from "~/lib/fieldchecks/submit.server";

// POST /field/selections/:id/checks — a check sent from the phone's queue (multipart: the form's
// fields, `clientId` made on the device, `basedOn` the selection's fingerprint, photos). Answers
// JSON: 201 { id } when recorded, 200 { id, duplicate: true } when that device id was recorded
// already (a retry), 409 { conflict } when the selection changed, 400/422 { errors }. The check is for the
// workspace it was entered in (`pageWorkspaceId`, which the queue sends from the check's owner): 409
// { staleWorkspace } when the session works in another one now (the phone keeps it waiting), 400 when missing.
export async function action({ request, params }: Route.ActionArgs) {
  try {
    const member = await requireMember(request, "fieldcheck.write");
    const selectionId = readId(params.id);
    const form = await readFormSafe(request);
    const refused = pageWorkspaceRefusal(member, form.get("pageWorkspaceId"));
    if (refused?.status === 409) return Response.json({ staleWorkspace: refused.errors._form }, { status: 409 });
    if (refused) return Response.json({ errors: refused.errors }, { status: refused.status });
    const outcome = await submitCheckForm(viewerOf(member), selectionId, form);
    if (outcome.ok) return Response.json({ id: outcome.id, duplicate: outcome.duplicate, url: `/field/checks/${outcome.id}` }, { status: outcome.duplicate ? 200 : 201 });
    if ("conflict" in outcome) return Response.json({ conflict: outcome.conflict }, { status: 409 });
    return Response.json({ errors: outcome.errors }, { status: outcome.status });
  } catch (e) {
    return asProblem(e);
  }
}

export const loader = () => methodNotAllowed("POST", "The phone's queue posts checks here; the form is at /field/selections/:id.");
