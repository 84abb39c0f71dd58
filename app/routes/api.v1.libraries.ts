import type { Route } from "./+types/api.v1.libraries";
import { requireApi } from "~/lib/auth/guards.server";
import { viewerOfApi } from "~/lib/auth/viewer.server";
import { listLibraries } from "~/lib/libraries";
import { refuseMethod } from "~/lib/shared/problem.server";
import { queryProblem } from "~/lib/shared/api-errors.server";

// GET /api/v1/libraries — every library the caller may see; locked ones are listed without curves.
export async function loader({ request }: Route.LoaderArgs) {
  const c = await requireApi(request, "library.read");
  const odd = queryProblem(request.url);
  if (odd) return odd;
  const list = await listLibraries(viewerOfApi(c));
  return Response.json({ libraries: list });
}

export const action = refuseMethod("GET");
