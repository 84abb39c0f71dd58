import type { Route } from "./+types/api.v1.me";
import { requireApi } from "~/lib/auth/guards.server";
import { refuseMethod } from "~/lib/shared/problem.server";

// GET /api/v1/me — who the token (or session) speaks for.
export async function loader({ request }: Route.LoaderArgs) {
  const c = await requireApi(request, "workspace.read");
  return Response.json({ userId: c.userId, workspace: c.workspace, role: c.role, scope: c.scope, via: c.via });
}

export const action = refuseMethod("GET");
