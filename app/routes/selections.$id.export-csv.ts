import type { Route } from "./+types/selections.$id.export-csv";
import { requireMember } from "~/lib/auth/guards.server";
import { getSelection, selectionCsv } from "~/lib/projects";
import { viewerOf } from "~/lib/auth/viewer.server";
import { readId } from "~/lib/shared/forms.server";
import { renderDeep, renderUnits, SI_UNITS } from "~/lib/shared/units";
import { methodNotAllowed } from "~/lib/shared/problem.server";
import { asProblem } from "~/lib/shared/api-errors.server";

export async function loader({ request, params }: Route.LoaderArgs) {
  const m = await requireMember(request, "project.read");
  try {
    const s = await getSelection(viewerOf(m), readId(params.id));
    return new Response(selectionCsv(s.id, renderUnits(s.title, SI_UNITS), renderDeep(s.frozen, SI_UNITS), renderUnits(s.note, SI_UNITS)), {
      headers: { "Content-Type": "text/csv; charset=utf-8", "Content-Disposition": `attachment; filename="dutymark-selection-${s.id}.csv"` },
    });
  } catch (e) {
    return asProblem(e); // a frozen document that cannot be read: 409 problem+json naming where (never a 500)
  }
}

export const action = () => methodNotAllowed("GET");
