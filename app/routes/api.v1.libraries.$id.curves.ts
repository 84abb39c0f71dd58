import * as v from "valibot";
import type { Route } from "./+types/api.v1.libraries.$id.curves";
import { requireApi } from "~/lib/auth/guards.server";
import { viewerOfApi } from "~/lib/auth/viewer.server";
import { libraryCurves } from "~/lib/libraries";
import { forbidden, notFound, badRequest, methodNotAllowed } from "~/lib/shared/problem.server";
import { IdField, readQuery } from "~/lib/shared/forms.server";

// GET /api/v1/libraries/:id/curves[?revision=N] — curve sets with points, SI units
// (flow m³/s, head m, efficiency 0..1, power W, NPSHr m, impeller diameter m, speed rpm).
export async function loader({ request, params }: Route.LoaderArgs) {
  const c = await requireApi(request, "library.read");
  const id = v.safeParse(IdField, params.id);
  if (!id.success) return badRequest("Library id must be a number.");
  const revParam = readQuery(request.url, "revision", 40);
  const rev = revParam ? v.safeParse(IdField, revParam) : null;
  if (rev && !rev.success) return badRequest("revision must be a number.");
  try {
    const curves = await libraryCurves(viewerOfApi(c), id.output, rev?.output);
    return Response.json({ units: { flow: "m3/s", head: "m", efficiency: "fraction", power: "W", npshr: "m", impellerDiameter: "m", speed: "rpm" }, curveSets: curves });
  } catch (e) {
    const status = (e as { init?: { status?: number } })?.init?.status;
    if (status === 404) return notFound();
    if (status === 403) return forbidden("This shared library opens with the Network plan.");
    throw e;
  }
}

export const action = () => methodNotAllowed("GET");
