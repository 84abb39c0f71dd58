import * as v from "valibot";
import type { Route } from "./+types/api.v1.systems.$id.preview";
import { requireApi } from "~/lib/auth/guards.server";
import { viewerOfApi } from "~/lib/auth/viewer.server";
import { systemPreviewView } from "~/lib/projects";
import { badRequest, methodNotAllowed, notFound, notJsonBody, refuseMethod } from "~/lib/shared/problem.server";
import { IdField, readJsonBody } from "~/lib/shared/forms.server";
import { renderDeep, renderUnits } from "~/lib/shared/units";

// POST /api/v1/systems/:id/preview { input } — the system and its candidates evaluated with
// unsaved inputs (the editor's live chart). Nothing is stored. SI units throughout. The input is one entered now, so it
// follows the editor's rules (`SystemInputEntrySchema`: a static head at high level below the low one is a 400 naming both)
// and its catalogue (a table and size the catalogue lists, on the table's bore, or one a run of this system is stored
// with: preview-input.ts). Each refusal names its field (`pointer`, RFC 6901; `field`, the dot path); at most 25 listed.
export async function action({ request, params }: Route.ActionArgs) {
  if (request.method !== "POST") return methodNotAllowed("POST"); // an action runs on any method but GET: PUT/PATCH/DELETE are not ours
  const c = await requireApi(request, "project.read");
  const id = v.safeParse(IdField, params.id);
  if (!id.success) return badRequest("System id must be a number.");
  const notJson = notJsonBody(request);
  if (notJson) return notJson;
  const body = await readJsonBody(request);
  if (!body.ok) return badRequest(`The body must be JSON: { input: {…} }; ${body.problem}.`);
  try {
    const out = await systemPreviewView(viewerOfApi(c), id.output, body.value);
    if (!out.ok) {
      const more = out.count > out.errors.length ? `: ${out.count} problems, the first ${out.errors.length} listed` : "";
      return badRequest(`The system inputs are not valid${more}.`, { errors: out.errors.map((e) => ({ ...e, message: renderUnits(e.message, c.units) })) });
    }
    return Response.json(renderDeep(out.view, c.units)); // text in the caller's units (SI for tokens)
  } catch (e) {
    if ((e as { init?: { status?: number } })?.init?.status === 404) return notFound();
    throw e;
  }
}

export const loader = refuseMethod("POST", "Use POST.");
