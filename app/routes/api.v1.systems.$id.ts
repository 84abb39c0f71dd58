import * as v from "valibot";
import type { Route } from "./+types/api.v1.systems.$id";
import { requireApi } from "~/lib/auth/guards.server";
import { viewerOfApi } from "~/lib/auth/viewer.server";
import { renderDeep } from "~/lib/shared/units";
import { badRequest, problem } from "~/lib/shared/problem.server";
import { asProblem } from "~/lib/shared/api-errors.server";
import { IdField } from "~/lib/shared/forms.server";
import { systemReadView } from "~/lib/projects";

// GET /api/v1/systems/:id — the stored system evaluated with its candidates: { input, evaluation, candidates }
// (the same view as POST …/preview). SI units throughout.
export async function loader({ request, params }: Route.LoaderArgs) {
  const c = await requireApi(request, "project.read");
  const id = v.safeParse(IdField, params.id);
  if (!id.success) return badRequest("System id must be a number.");
  try {
    return Response.json(renderDeep(await systemReadView(viewerOfApi(c), id.output), c.units));
  } catch (e) {
    return asProblem(e);
  }
}

export function action() {
  return problem({ title: "Method Not Allowed", status: 405, detail: "Use GET." }, { Allow: "GET" });
}
