import type { Route } from "./+types/selections.$id.export-json";
import { requireMember } from "~/lib/auth/guards.server";
import { getSelection } from "~/lib/projects";
import { viewerOf } from "~/lib/auth/viewer.server";
import { readId } from "~/lib/shared/forms.server";
import { renderDeep, renderUnits, SI_UNITS } from "~/lib/shared/units";
import { methodNotAllowed } from "~/lib/shared/problem.server";
import { asProblem } from "~/lib/shared/api-errors.server";

export async function loader({ request, params }: Route.LoaderArgs) {
  const m = await requireMember(request, "project.read");
  try {
    const s = await getSelection(viewerOf(m), readId(params.id));
    const frozen = renderDeep(s.frozen, SI_UNITS); // text written out in SI, like the numbers
    const body = { id: s.id, title: renderUnits(s.title, SI_UNITS), note: s.note, createdAt: s.createdAt.toISOString(), units: "SI (m3/s, m, Pa, W, kg/m3)", verdict: frozen.result.verdict ?? null, ...frozen };
    return new Response(JSON.stringify(body, null, 2), {
      headers: { "Content-Type": "application/json; charset=utf-8", "Content-Disposition": `attachment; filename="dutymark-selection-${s.id}.json"` },
    });
  } catch (e) {
    return asProblem(e); // a frozen document that cannot be read: 409 problem+json naming where (never a 500)
  }
}

export const action = () => methodNotAllowed("GET");
