import * as v from "valibot";
import type { Route } from "./+types/api.v1.systems.$id.search";
import { requireApi } from "~/lib/auth/guards.server";
import { viewerOfApi } from "~/lib/auth/viewer.server";
import { renderDeep } from "~/lib/shared/units";
import { badRequest, refuseMethod } from "~/lib/shared/problem.server";
import { asProblem, queryProblem } from "~/lib/shared/api-errors.server";
import { IdField, QueryId, readQuery } from "~/lib/shared/forms.server";
import { pageLinks } from "~/lib/shared/paging";
import { systemSearchView } from "~/lib/projects";
import { readArrangement, severalPumps } from "~/lib/projects/search-arrangement";

const METHODS = ["direct", "trim", "speed"] as const;

/**
 * `method` any number of times; `page`: 1.. as the search page reads it (not a whole number from 1: the first; past the
 * last: the last); `arrangement` single/parallel/series, `pumps` (duty pumps), `standby` (parallel only): once each,
 * read by the page's own rule (search-arrangement.ts), an odd value a 400 naming it.
 */
const SearchQuery = v.object({ method: v.array(v.string()), page: QueryId, arrangement: v.optional(v.string()), pumps: v.optional(v.string()), standby: v.optional(v.string()) });

// GET /api/v1/systems/:id/search[?method=direct&method=trim&method=speed][&arrangement=parallel&pumps=2&standby=1][&page=N] — pumps that meet the
// system's stored duty, ranked, SEARCH_SHOWN a page: { units, system, duty, message, stats, npshaAtDuty, npshaNote, paging, links, results }.
// SI units throughout.
export async function loader({ request, params }: Route.LoaderArgs) {
  const c = await requireApi(request, "project.read");
  const id = v.safeParse(IdField, params.id);
  if (!id.success) return badRequest("System id must be a number.");
  const url = new URL(request.url);
  const odd = queryProblem(url, { one: ["page", "arrangement", "pumps", "standby"], many: ["method"] });
  if (odd) return odd;
  const { method: methods, page, ...asked } = readQuery(url, SearchQuery, { many: ["method"] });
  const bad = methods.find((m) => !(METHODS as readonly string[]).includes(m));
  if (bad !== undefined) return badRequest(`Unknown method "${bad.slice(0, 40)}": use direct, trim or speed.`);
  const { arrangement, problems } = readArrangement(asked, { api: true });
  if (problems.length) return badRequest(`Query parameter "${problems[0].field}": ${problems[0].rule}.`, { errors: problems.map((p) => ({ field: p.field, message: p.rule })) });
  try {
    const view = await systemSearchView(viewerOfApi(c), id.output,
      { methods: methods.length ? (methods as (typeof METHODS)[number][]) : undefined, arrangement: severalPumps(arrangement) ?? undefined }, page);
    return Response.json({ ...renderDeep(view, c.units), links: pageLinks(url, view.paging) });
  } catch (e) {
    return asProblem(e, c.units); // 404; 409 when the stored inputs do not pass the schema
  }
}

export const action = refuseMethod("GET", "Use GET.");
