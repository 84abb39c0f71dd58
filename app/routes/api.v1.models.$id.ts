import * as v from "valibot";
import type { Route } from "./+types/api.v1.models.$id";
import { requireApi } from "~/lib/auth/guards.server";
import { viewerOfApi } from "~/lib/auth/viewer.server";
import { getModel } from "~/lib/libraries";
import { badRequest } from "~/lib/shared/problem.server";
import { asProblem } from "~/lib/shared/api-errors.server";
import { IdField } from "~/lib/shared/forms.server";

// GET /api/v1/models/:id — one model with its curves and points, SI units.
export async function loader({ request, params }: Route.LoaderArgs) {
  const c = await requireApi(request, "library.read");
  const id = v.safeParse(IdField, params.id);
  if (!id.success) return badRequest("Model id must be a number.");
  try {
    const m = await getModel(viewerOfApi(c), id.output);
    return Response.json({
      units: { flow: "m3/s", head: "m", efficiency: "fraction", power: "W", npshr: "m", impellerDiameter: "m", speed: "rpm" },
      model: { id: m.model.id, name: m.model.name, type: m.model.type, size: m.model.nominalSize, notes: m.model.notes },
      library: m.library,
      revision: m.revision,
      curveSets: m.curves.map((x) => ({ id: x.id, speed: x.speed, impellerDiameter: x.impellerDiameter, points: x.points })),
    });
  } catch (e) {
    return asProblem(e);
  }
}
