import type { Route } from "./+types/api.v1.me";
import { requireApi } from "~/lib/auth/guards.server";
import { refuseMethod } from "~/lib/shared/problem.server";
import { queryProblem } from "~/lib/shared/api-errors.server";

// GET /api/v1/me — who the token (or session) speaks for.
export async function loader({ request }: Route.LoaderArgs) {
  const c = await requireApi(request, "workspace.read");
  const odd = queryProblem(request.url);
  if (odd) return odd;
  return Response.json({ userId: c.userId, workspace: c.workspace, role: c.role, scope: c.scope, via: c.via });
}

export const action = refuseMethod("GET");
