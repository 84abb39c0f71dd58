import type { Route } from "./+types/api.v1.models.$id";
import { requireApi } from "~/lib/auth/guards.server";
import { viewerOfApi } from "~/lib/auth/viewer.server";
import { getModel } from "~/lib/libraries";
import { answerById, queryProblem } from "~/lib/shared/api-errors.server";
import { refuseMethod } from "~/lib/shared/problem.server";

// GET /api/v1/models/:id — one model with its curves and points, SI units.
export async function loader({ request, params }: Route.LoaderArgs) {
  const c = await requireApi(request, "library.read");
  const odd = queryProblem(request.url);
  if (odd) return odd;
  return answerById(params.id, "Model", async (id) => {
    const m = await getModel(viewerOfApi(c), id);
    return {
      units: { flow: "m3/s", head: "m", efficiency: "fraction", power: "W", npshr: "m", impellerDiameter: "m", speed: "rpm", minFlow: "m3/s" },
      model: { id: m.model.id, name: m.model.name, type: m.model.type, size: m.model.nominalSize, notes: m.model.notes },
      library: m.library,
      revision: m.revision,
      curveSets: m.curves.map((x) => ({ id: x.id, speed: x.speed, impellerDiameter: x.impellerDiameter, minFlow: x.minFlow, points: x.points })),
    };
  });
}

export const action = refuseMethod("GET");
