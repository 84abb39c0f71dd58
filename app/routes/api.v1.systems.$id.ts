import type { Route } from "./+types/api.v1.systems.$id";
import { requireApi } from "~/lib/auth/guards.server";
import { viewerOfApi } from "~/lib/auth/viewer.server";
import { renderDeep } from "~/lib/shared/units";
import { refuseMethod } from "~/lib/shared/problem.server";
import { answerById, queryProblem } from "~/lib/shared/api-errors.server";
import { systemReadView } from "~/lib/projects";

// GET /api/v1/systems/:id — the stored system evaluated with its candidates: { input, evaluation, candidates }
// (the same view as POST …/preview). SI units throughout. Stored inputs that do not pass the schema: 409 problem+json.
export async function loader({ request, params }: Route.LoaderArgs) {
  const c = await requireApi(request, "project.read");
  const odd = queryProblem(request.url);
  if (odd) return odd;
  return answerById(params.id, "System", async (id) => renderDeep(await systemReadView(viewerOfApi(c), id), c.units), c.units);
}

export const action = refuseMethod("GET", "Use GET.");
