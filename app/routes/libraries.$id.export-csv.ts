import type { Route } from "./+types/libraries.$id.export-csv";
import { requireMember } from "~/lib/auth/guards.server";
import { curvesToCsv, libraryCurves } from "~/lib/libraries";
import { viewerOf } from "~/lib/auth/viewer.server";
import { readId } from "~/lib/shared/forms.server";
import { methodNotAllowed } from "~/lib/shared/problem.server";

// GET /libraries/:id/export.csv — the current revision in our own CSV format (fixtures/demo/FORMAT.md).
export async function loader({ request, params }: Route.LoaderArgs) {
  const m = await requireMember(request, "library.read");
  const id = readId(params.id);
  const curves = await libraryCurves(viewerOf(m), id);
  return new Response(curvesToCsv(curves), {
    headers: { "Content-Type": "text/csv; charset=utf-8", "Content-Disposition": `attachment; filename="dutymark-library-${id}.csv"` },
  });
}

export const action = () => methodNotAllowed("GET");
