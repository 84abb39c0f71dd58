// Read API for systems: the workbench view (as the live preview) and the duty-point search, for
// GET /api/v1/systems/:id and GET /api/v1/systems/:id/search. Workspace-scoped through the
// services it calls (getSystem → 404 for another workspace's system, 409 for stored inputs that fail the schema).
import type { Viewer } from "../libraries";
import { storedForEditor, systemWorkbench } from "./projects.server";
import { readPreviewBody, type PreviewProblem } from "./preview-input";
import { SEARCH_SHOWN, searchForSystem, type SearchFilters } from "./search.server";
import { workbenchApiView, workbenchView } from "./workbench-view";
import { searchResultView } from "./search-view";
import { npshaAtDutyNote } from "./search-npsha";

export const SI_UNITS = { flow: "m3/s", head: "m", pressure: "Pa", power: "W", diameter: "m", length: "m", speed: "rpm", efficiency: "fraction" } as const;

/** { system, input, evaluation, candidates } — the same view as POST …/preview, from the stored inputs. */
export async function systemReadView(viewer: Viewer, systemId: number) {
  const bench = await systemWorkbench(viewer, systemId);
  const view = workbenchApiView(workbenchView(bench));
  return {
    units: SI_UNITS,
    system: { id: bench.system.id, name: bench.system.name, projectId: bench.system.projectId, projectName: bench.system.projectName },
    input: bench.system.input,
    ...view,
  };
}

/**
 * POST …/preview: the workbench view of unsaved inputs (nothing stored), or why the body is refused (preview-input.ts:
 * the entry rules and the catalogue, against the stored runs). The system is looked up first: another workspace's is a
 * 404 whatever the body (its stored runs open no size to this caller).
 */
export async function systemPreviewView(viewer: Viewer, systemId: number, body: unknown): Promise<{ ok: true; view: ReturnType<typeof workbenchApiView> } | { ok: false; errors: PreviewProblem[]; count: number }> {
  const read = readPreviewBody(body, (await storedForEditor(viewer, systemId)).runs);
  if (!read.ok) return read;
  return { ok: true, view: workbenchApiView(workbenchView(await systemWorkbench(viewer, systemId, read.input))) };
}

/**
 * { system, duty, paging, results } — the duty-point search against the stored duty, one row per result,
 * SEARCH_SHOWN a page (`page` 1..; not a whole number from 1 or none: the first; past the last: the last).
 */
export async function systemSearchView(viewer: Viewer, systemId: number, filters: SearchFilters = {}, page?: number | null) {
  // Each result carries its model id and library: nothing here reads the catalogue again.
  const res = await searchForSystem(viewer, systemId, filters, { page: page ?? 1, pageSize: SEARCH_SHOWN });
  return {
    units: SI_UNITS,
    system: { id: res.system.id, name: res.system.name, projectId: res.system.projectId, projectName: res.system.projectName },
    duty: res.system.input.duty,
    message: res.message,
    stats: res.stats,
    /** NPSHa at the duty flow, m (the true value: below zero where the suction cannot give any; null without a duty). */
    npshaAtDuty: res.npshaAtDuty,
    /** Where NPSHa at the duty is at or below zero, that no pump can run there, with NPSHa and the pumps left out for it (search-npsha.ts); else null. */
    npshaNote: npshaAtDutyNote(res.npshaAtDuty, res.stats?.rejectedByNpsh ?? 0),
    /**
     * The arrangement searched: { arrangement (single, parallel, series), dutyPumps, standbyPumps, searchedDuty (one pump's
     * share of the duty the engine ranked at, m³/s and m; null without a duty), rule (in words; null for one pump) }.
     */
    arrangement: res.arrangement,
    /** Curve sets the engine left out of the search (their points break its rules), with the first reasons. */
    leftOut: res.leftOut,
    /**
     * A custom liquid: how the water curves were searched (ANSI/HI 9.6.7 equivalent water duty per speed: B, C_Q, C_H,
     * C_η, the water duty in SI; or why the duty itself), the rule and the same line as the page; null for water.
     */
    liquidSearch: res.liquidSearch,
    /** Rows left out of the results: pumps whose verdict is outside the catalogue (hidden: this API never offers them), copies of the curves judged merged from other libraries. */
    hidden: { outsideCatalogue: res.hidden.outsideCatalogue, duplicates: res.hidden.duplicates },
    /**
     * Hidden rows fill none of the places, so the search judges on down the ranking: pumps judged (of `atMost`), rows kept
     * for the `places`, pumps outside the catalogue among them, and whether the list was cut, with `message` saying so (search-fill.ts).
     */
    catalogueFilter: res.catalogueFilter,
    paging: res.paging,
    results: res.results.map(searchResultView),
  };
}
