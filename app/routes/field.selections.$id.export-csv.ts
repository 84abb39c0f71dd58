import type { Route } from "./+types/field.selections.$id.export-csv";
import { requireMember } from "~/lib/auth/guards.server";
import { viewerOf } from "~/lib/auth/viewer.server";
import { readId } from "~/lib/shared/forms.server";
import { checkRecords } from "~/lib/fieldchecks/records.server";
import { historyCsv } from "~/lib/fieldchecks";
import { renderDeep, SI_UNITS } from "~/lib/shared/units";
import { methodNotAllowed } from "~/lib/shared/problem.server";

// GET /field/selections/:id/export.csv — every check of the selection (all versions), SI units.
export async function loader({ request, params }: Route.LoaderArgs) {
  const m = await requireMember(request, "fieldcheck.read");
  const h = await checkRecords(viewerOf(m), readId(params.id)); // the checks' own records: the frozen document is not read
  return new Response(historyCsv(renderDeep(h, SI_UNITS)), {
    headers: { "Content-Type": "text/csv; charset=utf-8", "Content-Disposition": `attachment; filename="dutymark-field-checks-${h.selection.id}.csv"` },
  });
}

export const action = () => methodNotAllowed("GET");
