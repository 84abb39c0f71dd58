import type { Route } from "./+types/selections.$id.export-json";
import { requireMember } from "~/lib/auth/guards.server";
import { getSelection, selectionJson } from "~/lib/projects";
import { viewerOf } from "~/lib/auth/viewer.server";
import { readId } from "~/lib/shared/forms.server";
import { renderDeep, renderUnits, SI_UNITS } from "~/lib/shared/units";
import { methodNotAllowed } from "~/lib/shared/problem.server";
import { asProblem } from "~/lib/shared/api-errors.server";

export async function loader({ request, params }: Route.LoaderArgs) {
  const m = await requireMember(request, "project.read");
  try {
    const s = await getSelection(viewerOf(m), readId(params.id));
    // Text written out in SI, like the numbers; with the caution, the units and the verdict as the report's headline reads it.
    const body = selectionJson({ ...s, title: renderUnits(s.title, SI_UNITS) }, renderDeep(s.frozen, SI_UNITS));
    return new Response(JSON.stringify(body, null, 2), {
      headers: { "Content-Type": "application/json; charset=utf-8", "Content-Disposition": `attachment; filename="dutymark-selection-${s.id}.json"` },
    });
  } catch (e) {
    return asProblem(e); // a frozen document that cannot be read: 409 problem+json naming where (never a 500)
  }
}

export const action = () => methodNotAllowed("GET");
