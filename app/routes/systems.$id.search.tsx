import * as v from "valibot";
import { data, Form, redirect, useLoaderData } from "react-router";
import type { Route } from "./+types/systems.$id.search";
import { requireMember } from "~/lib/auth/guards.server";
import { addCandidate, addCandidates, candidateSetIds, MAX_CANDIDATES, MAX_PICKS, PicksSchema, SEARCH_PAGE_ROWS, searchForSystem } from "~/lib/projects";
import { viewerOf } from "~/lib/auth/viewer.server";
import { readId, formId, readFormSafe, readQuery, QueryFlag, QueryId, QueryText } from "~/lib/shared/forms.server";
import { DEFAULT_ADJUSTMENT } from "~/lib/projects/hydraulics";
import { arrangementAdjustment, arrangementWords, pickSuffix, rankedAtText } from "~/lib/projects/search-arrangement";
import { pumpsBasis } from "~/lib/projects/power-basis";
import { totalPowerText } from "~/components/power-text";
import { ArrangementFields, ArrangementFigures } from "~/components/search-arrangement";
import { can } from "~/lib/auth/permissions";
import { FormError } from "~/components/forms";
import { AccessBadge, curveLabel } from "~/components/library-bits";
import { SizingCaution, VerdictView } from "~/components/workbench";
import { verdictNpshNote } from "~/lib/projects/verdict-npsh";
import { verdictStartNote } from "~/lib/projects/verdict-start";
import { verdictMinFlowNote } from "~/lib/projects/verdict-min-flow";
import { npshaAtDutyNote, npshLeftOutText } from "~/lib/projects/search-npsha";
import { bepPercentText, npshJudgedRange, npshLowestText, npshMarginText, npshUnjudgedText } from "~/components/candidate-figures";
import { routeErrorBoundary } from "~/components/RouteError";
import { PageHead } from "~/components/PageHead";
import { renderDeep, fmtFlow, fmtHead, fmtPct, fmtPower, labelOf } from "~/lib/shared/units";
import { readSearchFilters } from "~/lib/projects/search-filters";
import { Pager } from "~/components/Pager";
import { METHOD_TEXT, searchHowText } from "~/lib/projects/search-how";
import { qt } from "~/engine/quantityText";

export const meta: Route.MetaFunction = () => [{ title: "Find pumps · Dutymark" }];

/** Search filters from the query string (odd values fall back to "no filter"). */
const SearchQuery = v.object({
  type: QueryText(),
  size: QueryText(),
  speed: QueryText(40),
  maxPower: QueryText(40),
  method: v.fallback(v.array(v.string()), []),
  beyond: QueryFlag,
  // One pump (default), duty pumps in parallel (with standby pumps) or in series (search-arrangement.ts).
  arrangement: QueryText(40),
  pumps: QueryText(40),
  standby: QueryText(40),
  page: QueryId, // 1.. (a page past the last shows the last)
});

export async function loader({ request, params }: Route.LoaderArgs) {
  const m = await requireMember(request, "project.read");
  const id = readId(params.id);
  const url = new URL(request.url);
  const sys = m.user.units;
  const query = readQuery(url, SearchQuery, { many: ["method"] });
  const q = (k: "maxPower" | "speed" | "type" | "size") => query[k];
  // The forms' strict reader: a value the search cannot use is set aside, and the page says which and why.
  const { filters, methods, arrangement, notes: filterNotes } = readSearchFilters(query, sys);
  const viewer = viewerOf(m);
  const [res, onSystem] = await Promise.all([
    searchForSystem(viewer, id, filters, { page: query.page ?? 1, pageSize: SEARCH_PAGE_ROWS }),
    candidateSetIds(viewer, id),
  ]);
  const already = new Set(onSystem);
  const several = pumpsBasis(res.arrangement) != null;
  return renderDeep({ // quantities in messages, reasons and "why this rank" in the user's units
    id,
    name: res.system.name,
    project: { id: res.system.projectId, name: res.system.projectName },
    duty: res.system.input.duty,
    npshMarginWanted: res.system.input.npshMargin,
    unitSystem: sys,
    message: res.message,
    filterNotes,
    stats: res.stats,
    // The arrangement searched: each pump ranked at its share of the duty, each verdict the arrangement's (search-arrangement.ts).
    arrangement: { ...res.arrangement, words: arrangementWords(res.arrangement) },
    // Pumps left out for NPSH at the duty, and, whenever NPSHa there is at or below zero, the note saying so with its number (search-npsha.ts).
    npshLeftOut: res.stats?.rejectedByNpsh ? npshLeftOutText(res.stats.rejectedByNpsh, res.npshaAtDuty) : null,
    npshaNote: npshaAtDutyNote(res.npshaAtDuty, res.stats?.rejectedByNpsh ?? 0),
    // A custom liquid: searched at the equivalent water duty (ANSI/HI 9.6.7) where the method applies, each verdict on the liquid.
    customLiquid: res.system.input.fluid.kind === "custom" ? res.system.input.fluid.name || "the custom liquid" : null,
    liquidSearch: res.liquidSearch ? { message: res.liquidSearch.message, rule: res.liquidSearch.rule, ranksOnLiquid: res.liquidSearch.ranksOnLiquid } : null,
    // Which point each row's setting and figures are at, and which point ranks it.
    figuresRule: res.dutyCheck && res.system.input.duty ? `How, efficiency, vs BEP and shaft power: each pump as its verdict judges it (as the candidates table would show it): its trim or speed solved to deliver ${res.arrangement.rule ? `the duty flow ${qt("flow", res.system.input.duty.flow)} with ${arrangementWords(res.arrangement)}, each pump its share (of the ${res.arrangement.arrangement === "parallel" ? "flow" : "head"}; efficiency and vs BEP each pump's, shaft power per pump and together)` : `the duty flow ${qt("flow", res.system.input.duty.flow)}`} against the system's head there at the band's demanding edge (${qt("head", res.dutyCheck.governingHead)}, ${res.dutyCheck.governingEdge}), and the figures at its operating point, where that curve meets the system's design curve. The rank is the search's score ${res.arrangement.rule ? rankedAtText(res.system.input.duty, res.arrangement) : `at the typed duty (${qt("flow", res.system.input.duty.flow)} at ${qt("head", res.system.input.duty.head)})`}; "why this rank" quotes its figures there and says so where they differ from the row's.` : null,
    hidden: res.hidden,
    powerFilter: res.powerFilter,
    // Rows outside the catalogue hidden fill no place: whether the list was cut, in words with its numbers (search-fill.ts).
    catalogueCut: res.catalogueFilter?.message ?? null,
    leftOut: res.leftOut,
    dutyCheck: res.dutyCheck,
    npshRule: res.results.find((r) => r.npsh)?.npsh?.rule ?? null,
    locked: res.locked.map((l) => ({ id: l.id, name: l.name, owner: l.owner, description: l.description, visibility: l.visibility })),
    results: res.results.map((r) => ({
      curveSetId: r.curveSetId,
      rank: r.rank,
      model: r.model,
      type: r.type,
      size: r.size,
      curve: curveLabel(r.setSpeed, r.setDiameter),
      method: r.method,
      // The Add value: the row's method and the arrangement it was judged in, stored as the candidate's adjustment.
      pick: `${r.curveSetId}:${r.method}${pickSuffix(r.arrangement)}`,
      // Several pumps: the duty pumps' operating point together and each pump's share (shaftPower is theirs together); one pump shows neither.
      ...(several ? { operatingPoint: r.operatingPoint, perPump: r.perPump } : {}),
      // The setting the verdict judged (setting-step.ts), the rule it was found by (the title), the direct rule's words (printed).
      how: searchHowText(r),
      directRule: r.directRule,
      howRule: r.ratioNote,
      efficiency: r.efficiency,
      bepRatio: r.bepRatio,
      inPor: r.inPor,
      npshMargin: r.npshMargin,
      // NPSH as the workbench judges it: the design point and the band's corners, the lowest deciding.
      // (each point's figure is on the candidate page: npshPointsText for 25 rows cost about 1 ms a page here)
      npsh: r.npsh ? { status: r.npsh.status, range: npshJudgedRange(r.npsh), lowest: r.npsh.status === "unknown" ? null : npshLowestText(sys, r.npsh), unjudged: r.npsh.status === "unknown" ? npshUnjudgedText(r.npsh) : null } : null,
      shaftPower: r.shaftPower,
      reason: r.reason,
      library: r.library,
      alsoIn: r.alsoIn,
      verdict: r.verdict,
      // What NPSH over the band says against the verdict, on its line (verdict-npsh.ts); tokens rendered by renderDeep.
      verdictNpsh: verdictNpshNote(r.verdict, r.npsh),
      // What starting pumps in parallel one after another says against it (verdict-start.ts), on the same line; the key only
      // where there is a note (the search judges one pump, so none today): a row's data stays small.
      ...startOf(r.verdict, r.stagedStart),
      // A duty below the maker's minimum continuous flow (verdict-min-flow.ts), on the same line; the key only where it says so.
      ...minFlowOf(r.verdict, r.minFlow),
      // The cautions that qualify the verdict (dead-head, unstable crossings, band edges', start of a pump in parallel or series).
      cautions: r.cautions,
      // The search's own warnings at the typed duty (the engine's: trim approximate; water figures on a liquid), as the API's `warnings`.
      searchWarnings: searchWarningsOf(r.warnings, r.cautions),
      already: already.has(r.curveSetId),
    })),
    paging: res.paging,
    candidateCount: onSystem.length,
    limits: { candidates: MAX_CANDIDATES, picks: MAX_PICKS },
    canWrite: can(m.role, "project.write"),
    filters: { type: q("type"), size: q("size"), speed: q("speed"), maxPower: q("maxPower"), methods, beyond: filters.allowBeyondCatalogue,
      arrangement: { arrangement: arrangement.arrangement, pumps: query.pumps || "2", standby: query.standby || "0" } },
  }, sys);
}

export async function action({ request, params }: Route.ActionArgs) {
  const m = await requireMember(request, "project.write");
  const id = readId(params.id);
  const form = await readFormSafe(request);
  const viewer = viewerOf(m);
  let r: { ok: true } | { ok: false; reason: string };
  if (form.has("one")) {
    // One row's own "Add" button (`one=<curveSetId>:<method>[:<arrangement>:<duty>:<standby>]`): that pump only, in the
    // arrangement its row was judged in, whatever else is ticked.
    const [{ curveSetId, method, arrangement }] = readPicks([form.get("one")], "one");
    r = await addCandidate(viewer, id, curveSetId, arrangementAdjustment(method, arrangement));
  } else if (form.get("intent") === "add-many" || form.has("add")) {
    // Several ticked rows ("Add the ticked pumps"), all or nothing, in one transaction.
    r = await addCandidates(viewer, id, readPicks(form.getAll("add"), "add"));
  } else {
    // The same as `one`, as two fields (curveSetId, method): kept for scripts that post them.
    const method = form.get("method");
    r = await addCandidate(viewer, id, formId(form, "curveSetId"), { ...DEFAULT_ADJUSTMENT, method: method === "trim" || method === "speed" ? method : "none" });
  }
  if (!r.ok) return data({ error: r.reason }, { status: 409 }); // conflicts with the candidates there (RFC 9110 §15.5.10; was 200)
  throw redirect(`/systems/${id}`);
}

/** The ticked rows posted under `field`, or a 400 naming that field. */
function readPicks(values: unknown[], field: "one" | "add") {
  const picks = v.safeParse(PicksSchema, values);
  if (!picks.success) throw data({ errors: { [field]: picks.issues[0].message } }, { status: 400 });
  return picks.output;
}

/** The engine's warnings of a search row, each once and not already among its cautions. */
const searchWarningsOf = (ws: readonly { message: string }[], cautions: readonly string[]) => [...new Set(ws.map((w) => w.message))].filter((w) => !cautions.includes(w));


/** A row's maker's-minimum-flow note (verdict-min-flow.ts `verdictMinFlowNote`) under `verdictMinFlow`, or nothing where it says nothing. */
function minFlowOf(verdict: { status: string } | null, check: unknown): { verdictMinFlow?: string } {
  const note = verdictMinFlowNote(verdict, check);
  return note ? { verdictMinFlow: note } : {};
}

/** A row's staged-start note (verdict-start.ts `verdictStartNote`) under `verdictStart`, or nothing where it says nothing. */
function startOf(verdict: { status: string } | null, staged: unknown): { verdictStart?: string } {
  const note = verdictStartNote(verdict, staged);
  return note ? { verdictStart: note } : {};
}

export default function Search({ actionData }: Route.ComponentProps) {
  const d = useLoaderData<typeof loader>();
  const sys = d.unitSystem;
  const basis = pumpsBasis(d.arrangement); // several pumps: figures labelled per pump and together, as the candidates table
  const each = basis ? " (each pump)" : "";
  return (
    <div className="space-y-4">
      <PageHead
        trail={[["/projects", "Projects"], [`/projects/${d.project.id}`, d.project.name], [`/systems/${d.id}`, d.name]]}
        title={`Pumps for ${d.duty ? `${fmtFlow(sys, d.duty.flow)} at ${fmtHead(sys, d.duty.head)}` : "this system"}`}
      />
      <FormError error={(actionData as { error?: string } | undefined)?.error} />
      {d.message ? <p className="caution">{d.message}</p> : null}
      {d.filterNotes.length ? (
        <ul className="caution text-sm" data-testid="search-filter-notes">
          {d.filterNotes.map((n) => <li key={n}>{n}</li>)}
        </ul>
      ) : null}
      <Form method="get" className="panel flex flex-wrap items-end gap-3 text-sm">
        <label>
          <span className="label">Type contains</span>
          <input name="type" defaultValue={d.filters.type} className="field w-36" />
        </label>
        <label>
          <span className="label">Size contains</span>
          <input name="size" defaultValue={d.filters.size} className="field w-28" />
        </label>
        <label>
          <span className="label">Speed (rpm, ±10 %)</span>
          <input name="speed" inputMode="numeric" defaultValue={d.filters.speed} className="field w-24" />
        </label>
        <label>
          <span className="label">Max shaft power ({labelOf(sys, "power")}, each pump)</span>
          <input name="maxPower" inputMode="decimal" defaultValue={d.filters.maxPower} className="field w-24" />
        </label>
        <fieldset>
          <legend className="label">Ways to meet the duty</legend>
          {(["direct", "trim", "speed"] as const).map((mth) => (
            <label key={mth} className="mr-2">
              <input type="checkbox" name="method" value={mth} defaultChecked={d.filters.methods.length === 0 || d.filters.methods.includes(mth)} /> {METHOD_TEXT[mth]}
            </label>
          ))}
        </fieldset>
        <ArrangementFields value={d.filters.arrangement} />
        <label className="flex items-center gap-1">
          <input type="checkbox" name="beyond" value="1" defaultChecked={d.filters.beyond} /> allow beyond the catalogue
          <span className="text-xs text-slate-500">(trims or speeds the model does not publish)</span>
        </label>
        <button className="btn">Search</button>
      </Form>
      {d.dutyCheck ? (
        <p className={`text-xs ${d.dutyCheck.differs ? "caution" : "text-slate-600"}`} data-testid="duty-check">
          {d.dutyCheck.message} {d.dutyCheck.governs} Each row's verdict is {basis ? `the ${d.arrangement.words} as offered (their trim or speed, their combined curve)` : "the pump as offered (its trim or speed)"} on the system's band.
        </p>
      ) : null}
      {d.stats ? (
        <p className="text-xs text-slate-600" data-testid="search-stats">
          {d.stats.searched} curves searched · {d.stats.rejectedByEnvelope} ruled out by their range · {d.stats.matched} meet {basis ? "one pump's share of " : ""}the duty
          {d.npshLeftOut ? ` · ${d.npshLeftOut}` : ""} · {d.results.length ? `showing #${d.results[0].rank}–${d.results[d.results.length - 1].rank} of the ${d.paging.total} judged` : "none shown"}
          {d.hidden.duplicates ? ` · ${d.hidden.duplicates} copies of the same curve in other libraries merged` : ""}
          {d.hidden.overPower ? ` · ${d.hidden.overPower} above the max shaft power at their operating point left out` : ""}
          {d.powerFilter?.cut ? (
            <span className="caution" data-testid="search-power-cut">
              {` · list cut: the max shaft power ${fmtPower(sys, d.powerFilter.limit)} is judged at each pump's operating point, so the search judged the ranked pumps in turn and stopped after ${d.powerFilter.judged} (${d.powerFilter.atMost} at most), ${d.powerFilter.overPower} of them above it; pumps further down the ranking that would pass are not shown (a higher limit or narrower filters show them)`}
            </span>
          ) : null}
          {d.hidden.outsideCatalogue ? ` · ${d.hidden.outsideCatalogue} outside the catalogue hidden (tick "allow beyond the catalogue" to see them)` : ""}
          {d.catalogueCut ? <span className="caution" data-testid="search-catalogue-cut">{` · ${d.catalogueCut} (tick "allow beyond the catalogue" to see the hidden ones, or narrow the filters)`}</span> : null}
        </p>
      ) : null}
      {d.stats && d.npshaNote ? <p className="text-xs caution" data-testid="search-npsha">{d.npshaNote}</p> : null}
      {d.stats && d.arrangement.rule ? <p className="text-xs text-slate-600" data-testid="search-arrangement-rule">{d.arrangement.rule}</p> : null}
      {d.stats && d.customLiquid ? (
        <p className="text-xs caution" data-testid="search-liquid">
          {d.liquidSearch?.message}{" "}
          {d.liquidSearch?.ranksOnLiquid ? "" : "Ranked on the water curves: the \"why this rank\" figures are each pump's on water. "}
          Each row's setting, efficiency, vs BEP and shaft power, its verdict and its NPSH over the band are judged on {d.customLiquid}, on the
          pump's own curve corrected for viscosity where ANSI/HI 9.6.7 applies (the verdict says so), and a row that does not meet the duty there
          ranks after those that do; the candidate page shows every figure on the liquid. <span data-testid="search-liquid-rule">Rule: {d.liquidSearch?.rule}.</span>
        </p>
      ) : null}
      {d.stats && d.leftOut.count ? (
        <p className="text-xs caution" data-testid="search-left-out">
          {d.leftOut.count} curve set{d.leftOut.count === 1 ? " was" : "s were"} left out of the search: the engine refuses their points ({d.leftOut.examples.join("; ")}
          {d.leftOut.count > d.leftOut.examples.length ? "; …" : ""}). Import the library's file again to see each problem named.
        </p>
      ) : null}
      <section className="panel overflow-x-auto">
        {d.results.length === 0 ? (
          <p className="text-sm text-slate-600">No pump in the libraries open to you meets this duty with these filters.</p>
        ) : (
          <Form method="post" aria-label="Add ticked pumps">
            <table className="w-full text-sm" aria-label="Ranked pumps">
              <thead className="text-left text-slate-600">
                <tr>
                  {d.canWrite ? <th className="py-1"><span className="sr-only">Tick</span></th> : null}
                  <th className="py-1">#</th>
                  <th>Pump</th>
                  <th>Library</th>
                  <th>How</th>
                  <th>Verdict</th>
                  <th>Efficiency{each}</th>
                  <th>vs BEP{each}</th>
                  <th title={d.npshRule ?? undefined}>NPSH margin over the band</th>
                  <th>Shaft power</th>
                  <th>Why this rank</th>
                  <th />
                </tr>
              </thead>
              <tbody>
                {d.results.map((r) => (
                  <tr key={`${r.curveSetId}-${r.method}`} className="border-t border-slate-100 align-top">
                    {d.canWrite ? (
                      <td className="py-1">
                        {r.already ? null : <input type="checkbox" name="add" value={r.pick} aria-label={`Tick ${r.model} ${r.curve} (${METHOD_TEXT[r.method]})`} />}
                      </td>
                    ) : null}
                    <td className="py-1">{r.rank}</td>
                    <td>
                      <span className="font-semibold">{r.model}</span> <span className="text-xs text-slate-500">{r.curve}</span>
                      <div className="text-xs text-slate-500">{[r.type, r.size].filter(Boolean).join(" · ")}</div>
                    </td>
                    <td className="text-xs">
                      {r.library}
                      {r.alsoIn.length ? <div className="text-slate-500">also in {r.alsoIn.join(", ")}</div> : null}
                    </td>
                    <td title={r.howRule ?? undefined} data-testid={`search-how-${r.curveSetId}`}>
                      {r.how}
                      <div className="text-xs text-slate-600" data-testid={`search-direct-${r.curveSetId}`}>{r.directRule}</div>
                      <ArrangementFigures units={sys} basis={basis} words={d.arrangement.words} operatingPoint={r.operatingPoint ?? null} perPump={r.perPump ?? null} testId={`search-arrangement-${r.curveSetId}`} />
                    </td>
                    <td className="max-w-xs">
                      <VerdictView verdict={r.verdict} testId={`search-verdict-${r.curveSetId}`} npshNote={r.verdictNpsh} npshRule={d.npshRule} startNote={r.verdictStart} minFlowNote={r.verdictMinFlow} />
                      {r.cautions.length ? (
                        <details className="text-xs text-duty-ink" data-testid={`search-cautions-${r.curveSetId}`}>
                          <summary>{r.cautions.length} caution{r.cautions.length === 1 ? "" : "s"}</summary>
                          <ul className="list-disc pl-4">{r.cautions.map((w) => <li key={w}>{w}</li>)}</ul>
                        </details>
                      ) : null}
                      {r.searchWarnings.length ? (
                        <p className="text-xs text-slate-600" data-testid={`search-warnings-${r.curveSetId}`}>{`Search at the typed duty: ${r.searchWarnings.join("; ")}`}</p>
                      ) : null}
                    </td>
                    <td>{fmtPct(r.efficiency)}</td>
                    <td>
                      {r.bepRatio != null ? bepPercentText(r.bepRatio, r.inPor) : "—"}
                      {r.inPor === false ? <span className="text-duty-ink"> outside POR</span> : null}
                    </td>
                    <td data-testid={`search-npsh-${r.curveSetId}`}>
                      {r.npsh ? (
                        <span>
                          {/* No ratio where NPSHa ≤ 0 decides: the lowest NPSHa alone, without a dash for the missing range. */}
                          {r.npsh.range ?? (r.npsh.lowest || r.npsh.unjudged ? "" : "—")}
                          {r.npsh.lowest ? <span className={r.npsh.status === "ok" ? "" : "font-semibold text-fail"}>{`${r.npsh.range ? " — " : ""}${r.npsh.lowest} (${r.npsh.status})`}</span> : null}
                          {r.npsh.unjudged ? <span className="font-semibold text-duty-ink">{`${r.npsh.range ? " — " : ""}${r.npsh.unjudged} (unknown)`}</span> : null}
                        </span>
                      ) : r.npshMargin != null ? `${npshMarginText(r.npshMargin, d.npshMarginWanted)} at duty` : "—"}
                    </td>
                    <td data-testid={`search-power-${r.curveSetId}`}>{totalPowerText(sys, r.shaftPower, basis)}</td>
                    <td className="max-w-md text-xs">{r.reason}</td>
                    <td>
                      {d.canWrite ? (
                        r.already ? (
                          <span className="text-xs text-slate-500">candidate</span>
                        ) : (
                          // Adds this row only (the action reads `one` before the ticked `add` rows).
                          <button name="one" value={r.pick} className="btn-quiet py-0.5 text-xs" disabled={d.candidateCount >= d.limits.candidates} aria-label={`Add ${r.model} ${r.curve} as a candidate`}>
                            Add
                          </button>
                        )
                      ) : null}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
            {d.canWrite ? (
              <p className="mt-3 flex flex-wrap items-center gap-3 text-sm">
                <button className="btn" name="intent" value="add-many" disabled={d.candidateCount >= d.limits.candidates}>
                  Add the ticked pumps
                </button>
                <span className="text-xs text-slate-600">
                  Up to {d.limits.picks} at once; a system keeps at most {d.limits.candidates} candidates ({d.candidateCount} now). Pumps already on the system are left as they are.
                </span>
              </p>
            ) : null}
          </Form>
        )}
        {d.figuresRule && d.results.length ? <p className="mt-2 text-xs text-slate-600" data-testid="search-figures-rule">{d.figuresRule}</p> : null}
        {d.npshRule ? <p className="mt-2 text-xs text-slate-600" data-testid="search-npsh-rule">NPSH margin over the band: {d.npshRule}. A pump that meets the duty but cavitates somewhere on the band ranks after those that do not.</p> : null}
        <Pager label="Result pages" paging={d.paging} />
      </section>
      {d.locked.length ? (
        <section className="panel">
          <h2 className="font-semibold">Not searched: shared libraries your plan does not open</h2>
          <ul className="mt-2 space-y-1 text-sm">
            {d.locked.map((l) => (
              <li key={l.id}>
                <AccessBadge access="locked" visibility={l.visibility} /> {l.name} by {l.owner}
                {l.description ? <span className="text-slate-500"> — {l.description}</span> : null}
              </li>
            ))}
          </ul>
          <p className="mt-2 text-sm">
            <a href="/workspace/billing">See plans</a>
          </p>
        </section>
      ) : null}
      <SizingCaution />
    </div>
  );
}

export const ErrorBoundary = routeErrorBoundary({ what: "the pump search for this system", back: { href: "/projects", label: "Your projects" } });
