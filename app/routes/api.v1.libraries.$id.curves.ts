import * as v from "valibot";
import type { Route } from "./+types/api.v1.libraries.$id.curves";
import { requireApi } from "~/lib/auth/guards.server";
import { viewerOfApi } from "~/lib/auth/viewer.server";
import { libraryCurvesPage } from "~/lib/libraries";
import { forbidden, notFound, badRequest, refuseMethod } from "~/lib/shared/problem.server";
import { queryProblem } from "~/lib/shared/api-errors.server";
import { IdField, QueryId, readQuery } from "~/lib/shared/forms.server";
import { pageLinks } from "~/lib/shared/paging";

/** `page`: 1.. as the models list reads it; anything that is not a whole number from 1 is the first, past the last the last. */
const CurvesQuery = v.object({ page: QueryId });

// GET /api/v1/libraries/:id/curves[?revision=N][&page=N] — curve sets with points, SI units
// (flow m³/s, head m, efficiency 0..1, power W, NPSHr m, impeller diameter m, speed rpm), CURVE_PAGE_SETS
// a page: { units, revision, paging, links, curveSets }. The links name the revision answered, so a
// client following links.next reads one revision even when a new import lands between its pages.
export async function loader({ request, params }: Route.LoaderArgs) {
  const c = await requireApi(request, "library.read");
  const id = v.safeParse(IdField, params.id);
  if (!id.success) return badRequest("Library id must be a number.");
  const url = new URL(request.url);
  const odd = queryProblem(url, { one: ["revision", "page"] });
  if (odd) return odd;
  const revParam = readQuery(url, "revision", 40);
  const rev = revParam ? v.safeParse(IdField, revParam) : null;
  if (rev && !rev.success) return badRequest("revision must be a number.");
  const { page } = readQuery(url, CurvesQuery);
  try {
    const { revisionId, paging, curveSets } = await libraryCurvesPage(viewerOfApi(c), id.output, { revisionId: rev?.output, page });
    if (revisionId) url.searchParams.set("revision", String(revisionId));
    return Response.json({
      units: { flow: "m3/s", head: "m", efficiency: "fraction", power: "W", npshr: "m", impellerDiameter: "m", speed: "rpm", minFlow: "m3/s" },
      revision: revisionId,
      paging,
      links: pageLinks(url, paging),
      curveSets,
    });
  } catch (e) {
    const status = (e as { init?: { status?: number } })?.init?.status;
    if (status === 404) return notFound();
    if (status === 403) return forbidden("This shared library opens with the Network plan.");
    throw e;
  }
}

export const action = refuseMethod("GET");
