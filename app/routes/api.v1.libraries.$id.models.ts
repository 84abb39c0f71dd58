import * as v from "valibot";
import type { Route } from "./+types/api.v1.libraries.$id.models";
import { requireApi } from "~/lib/auth/guards.server";
import { viewerOfApi } from "~/lib/auth/viewer.server";
import { listModels, MODEL_PAGE_ROWS } from "~/lib/libraries";
import { answerById, queryProblem } from "~/lib/shared/api-errors.server";
import { refuseMethod } from "~/lib/shared/problem.server";
import { QueryId, readQuery } from "~/lib/shared/forms.server";
import { pageLinks, pageOf } from "~/lib/shared/paging";

/** `page`: 1.. as on the library's page; anything that is not a whole number from 1 is the first, past the last the last. */
const ModelsQuery = v.object({ page: QueryId });

// GET /api/v1/libraries/:id/models[?page=N] — models of the current revision with their curve sets (no points), SI units,
// MODEL_PAGE_ROWS a page in name order (the library page's list): { units, paging, links, models }.
export async function loader({ request, params }: Route.LoaderArgs) {
  const c = await requireApi(request, "library.read");
  const url = new URL(request.url);
  const odd = queryProblem(url, { one: ["page"] });
  if (odd) return odd;
  const { page } = readQuery(url, ModelsQuery);
  return answerById(params.id, "Library", async (id) => {
    const all = await listModels(viewerOfApi(c), id);
    const { first, ...paging } = pageOf(all.length, MODEL_PAGE_ROWS, page);
    return {
      units: { flowMax: "m3/s", headMax: "m", impellerDiameter: "m", speed: "rpm" },
      paging,
      links: pageLinks(url, paging),
      models: all.slice(first, first + MODEL_PAGE_ROWS),
    };
  });
}

export const action = refuseMethod("GET");
