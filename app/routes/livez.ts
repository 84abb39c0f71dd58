import type { Route } from "./+types/livez";
import { liveness } from "~/lib/shared/health.server";
import { methodNotAllowed } from "~/lib/shared/problem.server";

// GET /livez → { status: "ok", version, uptime }: the process is alive. Never touches the
// database (that is /healthz, readiness), so a load balancer does not restart a healthy
// process because the database is away.
export function loader(_: Route.LoaderArgs) {
  return Response.json(liveness(), { headers: { "Cache-Control": "no-store" } });
}

export const action = () => methodNotAllowed("GET");
