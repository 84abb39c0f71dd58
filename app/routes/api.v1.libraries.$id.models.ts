import * as v from "valibot";
import type { Route } from "./+types/api.v1.libraries.$id.models";
import { requireApi } from "~/lib/auth/guards.server";
import { viewerOfApi } from "~/lib/auth/viewer.server";
import { listModels } from "~/lib/libraries";
import { badRequest } from "~/lib/shared/problem.server";
import { asProblem } from "~/lib/shared/api-errors.server";
import { IdField } from "~/lib/shared/forms.server";

// GET /api/v1/libraries/:id/models — models of the current revision with their curve sets (no points). SI units.
export async function loader({ request, params }: Route.LoaderArgs) {
  const c = await requireApi(request, "library.read");
  const id = v.safeParse(IdField, params.id);
  if (!id.success) return badRequest("Library id must be a number.");
  try {
    const models = await listModels(viewerOfApi(c), id.output);
    return Response.json({ units: { flowMax: "m3/s", headMax: "m", impellerDiameter: "m", speed: "rpm" }, models });
  } catch (e) {
    return asProblem(e);
  }
}
