import type { Route } from "./+types/libraries.$id.export-json";
import { requireMember } from "~/lib/auth/guards.server";
import { getLibrary, libraryCurves } from "~/lib/libraries";
import { viewerOf } from "~/lib/auth/viewer.server";
import { readId } from "~/lib/shared/forms.server";
import { methodNotAllowed } from "~/lib/shared/problem.server";

// GET /libraries/:id/export.json — the current revision, SI units (flow m³/s, head m, efficiency 0..1, power W, NPSHr m).
export async function loader({ request, params }: Route.LoaderArgs) {
  const m = await requireMember(request, "library.read");
  const id = readId(params.id);
  const viewer = viewerOf(m);
  const lib = await getLibrary(viewer, id);
  const curves = await libraryCurves(viewer, id);
  const body = { format: "dutymark-library/1", units: { flow: "m3/s", head: "m", efficiency: "fraction", power: "W", npshr: "m", impellerDiameter: "m", speed: "rpm", minFlow: "m3/s" }, library: { id: lib.id, name: lib.name, owner: lib.ownerName, description: lib.description }, curveSets: curves };
  return new Response(JSON.stringify(body, null, 2), {
    headers: { "Content-Type": "application/json; charset=utf-8", "Content-Disposition": `attachment; filename="dutymark-library-${id}.json"` },
  });
}

export const action = () => methodNotAllowed("GET");
