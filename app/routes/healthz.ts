import type { Route } from "./+types/healthz";
import { health } from "~/lib/shared/health.server";
import { methodNotAllowed } from "~/lib/shared/problem.server";

// GET /healthz → { status, db: "ok" | "down", version }; 503 when the database does not answer.
export async function loader(_: Route.LoaderArgs) {
  const h = await health();
  return Response.json(h, {
    status: h.db === "ok" ? 200 : 503,
    headers: { "Cache-Control": "no-store" },
  });
}

export const action = () => methodNotAllowed("GET");
