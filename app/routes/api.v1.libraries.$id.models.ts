import type { Route } from "./+types/api.v1.libraries.$id.models";
import { requireApi } from "~/lib/auth/guards.server";
import { viewerOfApi } from "~/lib/auth/viewer.server";
import { listModels } from "~/lib/libraries";
import { answerById } from "~/lib/shared/api-errors.server";
import { methodNotAllowed } from "~/lib/shared/problem.server";

// GET /api/v1/libraries/:id/models — models of the current revision with their curve sets (no points). SI units.
export async function loader({ request, params }: Route.LoaderArgs) {
  const c = await requireApi(request, "library.read");
  return answerById(params.id, "Library", async (id) => ({
    units: { flowMax: "m3/s", headMax: "m", impellerDiameter: "m", speed: "rpm" },
    models: await listModels(viewerOfApi(c), id),
  }));
}

export const action = () => methodNotAllowed("GET");
