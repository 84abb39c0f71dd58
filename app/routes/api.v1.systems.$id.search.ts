import * as v from "valibot";
import type { Route } from "./+types/api.v1.systems.$id.search";
import { requireApi } from "~/lib/auth/guards.server";
import { viewerOfApi } from "~/lib/auth/viewer.server";
import { renderDeep } from "~/lib/shared/units";
import { badRequest, problem } from "~/lib/shared/problem.server";
import { asProblem } from "~/lib/shared/api-errors.server";
import { IdField, readQuery } from "~/lib/shared/forms.server";
import { systemSearchView } from "~/lib/projects";

const METHODS = ["direct", "trim", "speed"] as const;

// GET /api/v1/systems/:id/search[?method=direct&method=trim&method=speed] — pumps that meet the
// system's stored duty, ranked: { results: [...] }. SI units throughout.
export async function loader({ request, params }: Route.LoaderArgs) {
  const c = await requireApi(request, "project.read");
  const id = v.safeParse(IdField, params.id);
  if (!id.success) return badRequest("System id must be a number.");
  const { method: methods } = readQuery(request.url, v.object({ method: v.array(v.string()) }), { many: ["method"] });
  const bad = methods.find((m) => !(METHODS as readonly string[]).includes(m));
  if (bad !== undefined) return badRequest(`Unknown method "${bad.slice(0, 40)}": use direct, trim or speed.`);
  try {
    const view = await systemSearchView(viewerOfApi(c), id.output,
      { methods: methods.length ? (methods as (typeof METHODS)[number][]) : undefined });
    return Response.json(renderDeep(view, c.units));
  } catch (e) {
    return asProblem(e, c.units); // 404; 409 when the stored inputs do not pass the schema
  }
}

export function action() {
  return problem({ title: "Method Not Allowed", status: 405, detail: "Use GET." }, { Allow: "GET" });
}
