// Duty-point search of a system over every curve set open to the viewer.
//
// Speed at catalogue scale: library revisions never change once written, so each revision's curve
// sets and the engine's prepared index over them are read and built once per app process and kept
// compactly (revision-curves.server.ts); the index over a list of revisions (and the type/size/speed
// filters) is those indexes joined (no curve prepared again), kept too. Each request then only runs
// `searchDuty` (at one pump's share of the duty for pumps in parallel or series: search-arrangement.ts), groups the
// best rows, judges them in rank order until SEARCH_EVALUATED are kept (rows above a max shaft
// power or hidden outside the catalogue take no place: on down the ranking, at most SEARCH_FILL_JUDGED, search-fill.ts;
// the system's evaluation and its verdicts kept per system input) and returns the page of rows asked for (SEARCH_SHOWN
// by default, SEARCH_PAGE_ROWS on the page). A new revision, a saved input or a plan that opens or closes libraries is a
// new key, so it is seen at once; any other process builds the same.
import { explainRanks, joinSearchIndexes, prepareSearchIndex, searchDuty, verdictLabel, type Candidate as EngineCandidate, type SearchIndex, type SearchOptions, type SearchResult, type Verdict } from "~/engine";
import { evaluateSystem, type SystemInput } from "./hydraulics";
import type { NpshJudgement } from "./candidate-judgement";
import type { StagedShortfall } from "./verdict-start";
import { marginRatioText } from "./npsh-ratio";
import { judgeSearchRow, type Judged, type JudgedSetting } from "./search-judge";
import { directRuleText } from "./search-how";
import { arrangementKey, arrangementRule, dutyShare, rankedAtText, severalPumps, shareName, SINGLE_PUMP, type SearchArrangement } from "./search-arrangement";
import { curvesOfRevisions, searchableRevisions, type LibraryCurveSet, type Viewer } from "../libraries";
import type { MinFlowCheck } from "./verdict-min-flow";
import { catalogueOf, getSystem } from "./projects.server";
import { LRUCache } from "lru-cache";
import { promiseCache } from "../shared/promise-cache";
import { clearKeptRevisions, curveSetAt, revisionCurves, toEngineSet } from "./revision-curves.server";
import { pageOf, type Paging } from "../shared/paging";
import { onWaterFigures, searchOnLiquid, type LiquidSearchPlan } from "./search-liquid";
import { catalogueFilterOutcome, powerFilterOutcome, SEARCH_EVALUATED, SEARCH_FILL_JUDGED, type CatalogueFilterOutcome, type FillCount, type PowerFilterOutcome } from "./search-fill";
export { SEARCH_EVALUATED, SEARCH_FILL_JUDGED, SEARCH_POWER_JUDGED, type CatalogueFilterOutcome, type PowerFilterOutcome } from "./search-fill";


export type SearchFilters = {
  type?: string;
  speed?: number;
  size?: string;
  maxPowerW?: number;
  methods?: ("direct" | "trim" | "speed")[];
  /** Offer pumps whose verdict is outside-catalogue too (trim or speed beyond what the model publishes). */
  allowBeyondCatalogue?: boolean;
  /** Pumps in parallel or series (search-arrangement.ts); absent: one pump. */
  arrangement?: SearchArrangement;
};

/** Rows returned at once by default (the read API); the search page shows SEARCH_PAGE_ROWS a page. */
export const SEARCH_SHOWN = 50;
export const SEARCH_PAGE_ROWS = 25;

/** Which slice of the judged rows a request returns: page 1.. of `pageSize` rows (out-of-range pages clamp to the nearest). */

type OpenRevision = { libraryId: number; name: string; revisionId: number; own?: boolean };
/** A curve set with the revision it came from (library name read per request: names may change, revisions do not). */
type IndexedSet = LibraryCurveSet & { revisionId: number; libraryId: number };

/** The filters that choose which sets are indexed (the others act on the ranked rows). */
function setFilter(filters: SearchFilters) {
  const type = filters.type?.toLowerCase();
  const size = filters.size?.toLowerCase();
  const speed = filters.speed;
  return (setType: string, setSize: string, setSpeed: number | null) =>
    (!type || setType.toLowerCase().includes(type)) &&
    (!size || setSize.toLowerCase().includes(size)) &&
    (!speed || (setSpeed != null && Math.abs(setSpeed - speed) / speed < 0.1));
}

/** A curve set the engine refused to index (its points break `checkPumpPoints`): which one and why. */
export type LeftOut = { id: string; label: string; reason: string };

export type PreparedSearch = {
  index: SearchIndex;
  /** Sets that passed the filters but that the engine left out of the index (stored before the importer applied the engine's rules). */
  leftOut: LeftOut[];
  /** The curve set behind a row's id, with its revision and library. */
  setOf: (id: string) => IndexedSet;
  /** curveKey per set id, filled as rows are grouped. */
  keys: Map<string, string>;
};

/** Builds the index afresh from the open revisions' curve sets as `curvesOfRevisions` gives them (the reference path: tests compare). */
export async function buildPreparedSearch(open: readonly OpenRevision[], filters: SearchFilters): Promise<PreparedSearch> {
  const keep = setFilter(filters);
  const sets: IndexedSet[] = [];
  for (const o of open) for (const s of await curvesOfRevisions([o.revisionId])) if (keep(s.type, s.nominalSize, s.speed)) sets.push({ ...s, revisionId: o.revisionId, libraryId: o.libraryId });
  const byId = new Map(sets.map((s) => [String(s.id), s]));
  const index = prepareSearchIndex(sets.map(toEngineSet));
  const leftOut = index.rejected.map((r) => { const s = byId.get(r.id)!; return leftOutOf(r, s.model, s.speed); });
  return { index, leftOut, setOf: (id) => byId.get(id)!, keys: new Map() };
}

/** Joins the kept revisions' indexes (filtered by type, size and speed); sets are made back into objects only for the rows used. */
async function joinPreparedSearch(open: readonly OpenRevision[], filters: SearchFilters): Promise<PreparedSearch> {
  const parts = await Promise.all(open.map((o) => revisionCurves(o.revisionId)));
  const keep = setFilter(filters);
  const all = !filters.type && !filters.size && !filters.speed;
  const picks = parts.map((r) => {
    if (all) return null;
    const out: number[] = [];
    for (let j = 0; j < r.index.count; j++) {
      const i = r.indexed[j];
      if (keep(r.type[i], r.nominalSize[i], Number.isNaN(r.speed[i]) ? null : r.speed[i])) out.push(j);
    }
    return out;
  });
  const index = parts.length === 1 && all ? parts[0].index : joinSearchIndexes(parts.map((r) => r.index), picks);
  // The sets each revision's index refused, among those the filters keep (a refused set has no index position to pick).
  const leftOut: LeftOut[] = [];
  for (const r of parts)
    for (const rej of r.index.rejected) {
      const i = r.position.get(Number(rej.id))!;
      if (keep(r.type[i], r.nominalSize[i], Number.isNaN(r.speed[i]) ? null : r.speed[i])) leftOut.push(leftOutOf(rej, r.model[i], Number.isNaN(r.speed[i]) ? null : r.speed[i]));
    }
  const made = new Map<string, IndexedSet>();
  const setOf = (id: string) => {
    let s = made.get(id);
    if (s) return s;
    const n = Number(id);
    const k = parts.findIndex((r) => r.position.has(n));
    s = { ...curveSetAt(parts[k], parts[k].position.get(n)!), revisionId: open[k].revisionId, libraryId: open[k].libraryId };
    made.set(id, s);
    return s;
  };
  return { index, leftOut, setOf, keys: new Map() };
}

/** "Model · 2900 rpm" and the engine's reason, its point counted from 1 ("points[0].npshr: …" → "point 1 npshr: …"). */
function leftOutOf(r: { id: string; reason: string }, model: string, speed: number | null): LeftOut {
  const reason = r.reason.replace(/^points\[(\d+)\]\.?(\w*)/, (_, i: string, f: string) => `point ${Number(i) + 1}${f ? ` ${f}` : ""}`);
  return { id: r.id, label: speed == null ? model : `${model} · ${speed} rpm`, reason };
}

/** How many sets the search left out and why (the first few), for the page and the API. */
function leftOutSummary(l: readonly LeftOut[]) {
  return { count: l.length, examples: l.slice(0, 3).map((x) => `${x.label}: ${x.reason}`) };
}

/**
 * Prepared searches per (revisions, set filters): immutable inputs, so never stale; least recently used dropped first
 * past 400 000 sets or 8 lists (a list of 100 000 sets fits four times). A list of more than 400 000 sets is still
 * searched, but not kept: each search joins its revisions' indexes again.
 */
const preparedCache = promiseCache<string, PreparedSearch>({ max: 8, maxSize: 400_000, sizeOf: (p) => p.index.count });

export function preparedKey(open: readonly OpenRevision[], filters: SearchFilters): string {
  return JSON.stringify([open.map((o) => o.revisionId), filters.type?.toLowerCase() ?? "", filters.size?.toLowerCase() ?? "", filters.speed ?? 0]);
}

export function preparedSearch(open: readonly OpenRevision[], filters: SearchFilters): Promise<PreparedSearch> {
  return preparedCache.get(preparedKey(open, filters), () => joinPreparedSearch(open, filters));
}

/**
 * The system's evaluation and the verdicts per system input: both are pure functions of the system
 * document (and, for a verdict, the immutable curve set, the method and the arrangement), so repeat views and filter
 * changes of one system reuse them. Keyed by the stored input JSON and the arrangement; a saved change is a new key.
 * Least recently used dropped first.
 */
const VERDICT_SYSTEMS_LIMIT = 32;
export type { JudgedSetting } from "./search-judge";
type SystemWork = { evaluation: ReturnType<typeof evaluateSystem>; verdicts: Map<string, Judged | null> };
const verdictCache = new LRUCache<string, SystemWork>({ max: VERDICT_SYSTEMS_LIMIT });
function workFor(inputJson: string, input: SystemInput): SystemWork {
  let w = verdictCache.get(inputJson);
  if (!w) verdictCache.set(inputJson, (w = { evaluation: evaluateSystem(input), verdicts: new Map() })); // throws for inputs the engine cannot evaluate: nothing kept
  return w;
}

/** For tests: how many prepared indexes this process keeps, and a way to drop every cache. */
export const preparedCacheStats = () => ({ size: preparedCache.size, keys: preparedCache.keys() });
export const clearSearchCaches = () => { preparedCache.clear(); verdictCache.clear(); clearKeptRevisions(); };

/** The engine options the page searches with (shared with the benchmark, so both time the same search). */
export function searchOptionsFor(input: SystemInput, evaluation: ReturnType<typeof evaluateSystem>, filters: SearchFilters, npshaAtDuty = npshaAtDutyOf(input, evaluation)): SearchOptions {
  return {
    methods: filters.methods?.length ? filters.methods : ["direct", "trim", "speed"],
    npshAvailable: npshaAtDuty != null ? Math.max(0, npshaAtDuty) : undefined, // below zero (a suction lift past the barometric head): no pump with an NPSHr passes, as at zero
    requiredNpshMargin: input.npshMargin,
    density: evaluation.fluid.density,
    minSpeedRatio: 0.3,
    limit: SEARCH_EVALUATED * 2,
  };
}

/**
 * NPSHa at the duty flow through the aged suction pipe, m (what the engine's search judges NPSHr against); null without a
 * duty. At the duty itself: the curve's nearest sample was up to half a grid step off (and further when the system's flow
 * range is set well past the duty).
 */
export function npshaAtDutyOf(input: SystemInput, evaluation: ReturnType<typeof evaluateSystem>): number | null {
  return input.duty ? (evaluation.npshaAtDuty ?? null) : null;
}

/** Same model, speed, impeller and points: one distinct curve, however many libraries reach it. */
function curveKey(s: LibraryCurveSet): string {
  const pts = s.points.map((p) => [p.flow, p.head, p.efficiency, p.power, p.npshr].map((x) => (x == null ? "" : x.toPrecision(9))).join(":")).join("|");
  return `${s.model.trim().toLowerCase()}#${s.speed ?? ""}#${s.impellerDiameter ?? ""}#${pts}`;
}

/**
 * Every curve set open to the viewer, ranked against the system's duty (locked libraries listed,
 * never searched). One row per distinct curve (the libraries that carry it named); each row has
 * the verdict of the pump as offered on the system's band; outside-catalogue rows only on request.
 * `opts.uncached` builds the index afresh from `curvesOfRevisions` with no kept verdicts (tests compare both paths).
 */
export async function searchForSystem(viewer: Viewer, systemId: number, filters: SearchFilters = {}, opts: { uncached?: boolean; page?: number; pageSize?: number } = {}) {
  const [system, { open, locked }] = await Promise.all([getSystem(viewer, systemId), searchableRevisions(viewer)]);
  const pageSize = opts.pageSize ?? SEARCH_SHOWN;
  const arrangement = severalPumps(filters.arrangement) ?? SINGLE_PUMP;
  const none = { arrangement: { ...arrangement, searchedDuty: null as { flow: number; head: number } | null, rule: null as string | null }, stats: null, npshaAtDuty: null as number | null, hidden: { outsideCatalogue: 0, duplicates: 0, overPower: 0 }, leftOut: leftOutSummary([]), dutyCheck: null, liquidSearch: null as LiquidSearchPlan | null, powerFilter: null as PowerFilterOutcome | null, catalogueFilter: null as CatalogueFilterOutcome | null, paging: { page: 1, pages: 1, pageSize, total: 0 } as Paging };
  if (!system.input.duty) return { system, results: [], locked, ...none, message: "Set a duty point (flow and head) first." };
  let work: SystemWork;
  try {
    // Kept per system input and arrangement: each arrangement's verdicts one LRU entry, so trying many stays bounded.
    work = opts.uncached ? { evaluation: evaluateSystem(system.input), verdicts: new Map() } : workFor(system.inputJson + arrangementKey(arrangement), system.input);
  } catch (e) {
    // Inputs the schema accepts but the engine cannot evaluate (e.g. water past the table's range) are the
    // user's to fix, not a server fault: the page says why.
    return { system, results: [], locked, ...none, message: `This system cannot be evaluated: ${e instanceof Error ? e.message : String(e)}` };
  }
  // A system that cannot be evaluated says so first (above). No revision open (no library, or none with curves imported): say so, not "no pump meets this duty".
  if (!open.length) return { system, results: [], locked, ...none, message: `No pump curves are open to you to search: ${locked.length ? "the shared libraries listed below are not open on your plan; import" : "import"} a pump library (or ask for one to be shared) first.` };
  const { evaluation, verdicts } = work;
  const prepared = opts.uncached ? await buildPreparedSearch(open, filters) : await preparedSearch(open, filters);
  const libraryName = new Map(open.map((o) => [o.revisionId, o.name]));
  const own = new Set(open.filter((o) => o.own).map((o) => o.libraryId));
  const npshaAtDuty = npshaAtDutyOf(system.input, evaluation); // judged by the search, and shown with its count
  // Pumps in parallel or series: the engine ranks one pump at its share of the duty (flow / N in parallel, head / N in
  // series) — the ranking's approximation, common practice —; each row's verdict judges the arrangement exactly
  // (search-judge.ts). NPSHa stays the system's at the whole duty flow: the pumps draw through the one suction line.
  const duty = dutyShare(system.input.duty, arrangement);
  const options = searchOptionsFor(system.input, evaluation, filters, npshaAtDuty);
  // A max shaft power filter may leave out many judged rows: the engine ranks enough for SEARCH_FILL_JUDGED groups at once.
  if (filters.maxPowerW) options.limit = SEARCH_FILL_JUDGED * 2;
  // A custom liquid: searched at the equivalent water duty of ANSI/HI 9.6.7 (search-liquid.ts). Water: the engine's search alone.
  const fluid = system.input.fluid;
  const searchAt = (limit: number) => fluid.kind === "custom"
    ? searchOnLiquid(prepared.index, duty, { name: fluid.name || "the custom liquid", kinematicViscosity: evaluation.fluid.kinematicViscosity, density: evaluation.fluid.density }, { ...options, limit }, shareName(arrangement))
    : { result: searchDuty(prepared.index, duty, { ...options, limit }), plan: null };
  const judging = { prepared, libraryName, own, verdicts, input: system.input, filters };
  let found = searchAt(options.limit!);
  let pass = groupAndJudge(judging, found.result);
  // Rows left out after judging (hidden outside the catalogue, above the max shaft power) take no place: when the ranking
  // ran out before the places were filled and the engine matched more than it returned, rank more (the verdicts are kept).
  if (pass.kept.length < SEARCH_EVALUATED && pass.count.judged === pass.count.groups && pass.count.matched > pass.count.returned && options.limit! < SEARCH_FILL_JUDGED * 2) {
    found = searchAt(SEARCH_FILL_JUDGED * 2);
    pass = groupAndJudge(judging, found.result);
  }
  const res = found.result;
  const plan = found.plan;
  const { kept, duplicates, outsideCatalogue, overPower } = pass;
  const powerFilter = filters.maxPowerW ? powerFilterOutcome(filters.maxPowerW, pass.count, overPower) : null;
  const catalogueFilter = filters.allowBeyondCatalogue ? null : catalogueFilterOutcome(pass.count, outsideCatalogue);
  // Pumps that meet the system rank first, then oversized, then those two with a cavitation risk somewhere on the
  // band, then short, no operating point (stable within a class).
  kept.sort((a, b) => rankClass(a) - rankClass(b));
  // The page asked for: ranks and "why this rank" run over every row up to its end, so they read the same on every page.
  const { first, ...paging } = pageOf(kept.length, pageSize, opts.page);
  const upTo = kept.slice(0, first + pageSize);
  const notes = upTo.map((k, i) => (i === 0 ? null : rankClass(k) !== rankClass(upTo[i - 1]) ? `below #${i} because ${classText(k, "row")} where #${i} ${classText(upTo[i - 1], "above")}`
    : plan && onWaterFigures(k.row) && !onWaterFigures(upTo[i - 1].row) ? `below #${i} because its figures are the water curve's where #${i}'s are estimated on ${plan.liquid} (ANSI/HI 9.6.7 equivalent water duty)` : null));
  // Ranks and reasons are written on copies: the engine's rows belong to this request only, but stay safe if that changes.
  const rows = upTo.map((k) => ({ ...k.row }));
  explainRanks(rows, kept.length, system.input.npshMargin, notes);
  const results = upTo.slice(first).map(({ set: s, libraries, verdict, npsh, cautions, stagedStart, minFlow, shown }, j) => ({
    ...rows[first + j],
    ...shownRow(rows[first + j], shown, system.input.duty!, arrangement),
    /** The search's direct rule with this row's numbers (search-how.ts): why it is, or is not, met as published. */
    directRule: directRuleText(rows[first + j].direct, searchedDutyName(rows[first + j].direct, duty, arrangement, plan)),
    /** The arrangement every row is judged in (one pump, or pumps in parallel or series). */
    arrangement,
    curveSetId: s.id,
    modelId: s.modelId,
    model: s.model,
    type: s.type,
    size: s.nominalSize,
    setSpeed: s.speed,
    setDiameter: s.impellerDiameter,
    library: libraryName.get(s.revisionId) ?? "",
    alsoIn: libraries.filter((l) => l !== (libraryName.get(s.revisionId) ?? "")),
    verdict,
    /** NPSH over the design point and the band's corners as the workbench judges it (the engine's `npshMargin` is at the duty only). */
    npsh,
    /** The cautions that qualify the verdict (dead-head, unstable crossings, band edges', a pump in parallel or series that cannot start), as the candidates table's. */
    cautions,
    /** Pumps in parallel started one after another that leave the duty unmet (verdict-start.ts), as the candidate's result ([] for one pump). */
    stagedStart,
    /** The maker's minimum flow against the duty each running pump takes (verdict-min-flow.ts), null without a figure. */
    minFlow,
  }));
  return { system, results, locked, arrangement: { ...arrangement, searchedDuty: duty, rule: arrangementRule(system.input.duty, arrangement) }, stats: res.stats, npshaAtDuty, hidden: { outsideCatalogue: filters.allowBeyondCatalogue ? 0 : outsideCatalogue, duplicates, overPower }, leftOut: leftOutSummary(prepared.leftOut), dutyCheck: evaluation.dutyCheck, liquidSearch: plan, powerFilter, catalogueFilter, paging, message: null as string | null };
}

/** The duty a row was searched at, named where it is not the typed duty: one pump's share, the liquid's water duty. */
function searchedDutyName(d: EngineCandidate["direct"], duty: { flow: number; head: number }, a: SearchArrangement, plan: LiquidSearchPlan | null): string | undefined {
  const onWater = plan && (d.flow !== duty.flow || d.head !== duty.head) ? `the equivalent water duty on ${plan.liquid} (ANSI/HI 9.6.7)` : undefined;
  return [shareName(a), onWater].filter(Boolean).join(", at ") || undefined;
}

/** What `groupAndJudge` reads: the prepared search, library names, the workspace's own libraries, the kept verdicts, the system and the filters. */
type Judging = { prepared: PreparedSearch; libraryName: Map<number, string>; own: Set<number>; verdicts: Map<string, Judged | null>; input: SystemInput; filters: SearchFilters };
type Kept = { row: EngineCandidate; set: IndexedSet; libraries: string[]; verdict: Verdict | null; npsh: NpshJudgement | null; cautions: string[]; stagedStart: StagedShortfall[]; minFlow: MinFlowCheck | null; shown: JudgedSetting | null };

/**
 * The engine's rows grouped, one per distinct curve (the best-ranked copy stays, preferring the workspace's own library on
 * a tie), then judged in rank order: each pump's verdict as it would be added (its method, the ratio solved against the
 * system as the workbench does, the arrangement searched: search-judge.ts) on the band, the row showing that setting and its figures at the operating point (the
 * engine's at the typed duty still rank it). Rows above the max shaft power, and outside the catalogue unless asked for,
 * are left out and fill no place: judged until SEARCH_EVALUATED are kept, the ranking ends or SEARCH_FILL_JUDGED are judged.
 */
function groupAndJudge(j: Judging, res: SearchResult) {
  const { prepared, libraryName, own, verdicts, input, filters } = j;
  // `copies`: rows of the same curve merged into the group (counted for the groups judged: the engine's limit changes none).
  const groups = new Map<string, { row: EngineCandidate; set: IndexedSet; libraries: string[]; copies: number }>();
  for (const c of res.candidates) {
    const s = prepared.setOf(c.id);
    let key = prepared.keys.get(c.id);
    if (key === undefined) prepared.keys.set(c.id, (key = curveKey(s)));
    const lib = libraryName.get(s.revisionId) ?? "";
    const g = groups.get(key);
    if (!g) {
      groups.set(key, { row: c, set: s, libraries: [lib], copies: 0 });
      continue;
    }
    g.copies++;
    if (!g.libraries.includes(lib)) g.libraries.push(lib);
    if (Math.abs(c.score - g.row.score) < 1e-12 && own.has(s.libraryId) && !own.has(g.set.libraryId)) { g.row = c; g.set = s; }
  }
  let outsideCatalogue = 0, overPower = 0, judgedCount = 0, duplicates = 0;
  const kept: Kept[] = [];
  for (const g of groups.values()) {
    if (kept.length >= SEARCH_EVALUATED || judgedCount >= SEARCH_FILL_JUDGED) break;
    judgedCount++;
    duplicates += g.copies;
    const method = g.row.method === "direct" ? "none" : g.row.method;
    const vk = `${g.set.id}#${method}${arrangementKey(filters.arrangement)}`; // the arrangement's verdict is its own
    let judged = verdicts.get(vk);
    if (judged === undefined) verdicts.set(vk, (judged = judgeSearchRow(input, g.set, method, filters.arrangement, catalogueOf(g.set))));
    const verdict = judged?.verdict ?? null;
    // The max shaft power filter acts on one pump's power at the operating point (each pump has its own motor), before paging.
    if (filters.maxPowerW && judged?.shown.shaftPowerPerPump != null && judged.shown.shaftPowerPerPump > filters.maxPowerW) {
      overPower++;
      continue;
    }
    if (verdict?.status === "outside-catalogue") {
      outsideCatalogue++;
      if (!filters.allowBeyondCatalogue) continue;
    }
    kept.push({ row: g.row, set: g.set, libraries: g.libraries, verdict, npsh: judged?.npsh ?? null, cautions: judged?.cautions ?? [], stagedStart: judged?.stagedStart ?? [], minFlow: judged?.minFlow ?? null, shown: judged?.shown ?? null });
  }
  const count: FillCount = { judged: judgedCount, kept: kept.length, groups: groups.size, returned: res.candidates.length, matched: res.stats.matched };
  return { kept, duplicates, outsideCatalogue, overPower, count };
}

/**
 * A row's setting and figures as its verdict judged them (without a verdict: the search's setting, no figures), the
 * search's at the typed duty — one pump's share of it for several pumps — kept apart (`atTypedDuty`: what ranks the row),
 * and its reason saying where it quotes figures from where those differ from what is shown, or always for several pumps.
 */
function shownRow(row: EngineCandidate, shown: JudgedSetting | null, duty: { flow: number; head: number }, a: SearchArrangement) {
  const atTypedDuty = { ratio: row.ratio, speed: row.speed, diameter: row.diameter, efficiency: row.efficiency, shaftPower: row.shaftPower, bepRatio: row.bepRatio, inPor: row.inPor };
  const same = (x: number | null, y: number | null) => x === y || (x != null && y != null && Math.abs(x - y) <= 1e-6 * Math.max(Math.abs(x), Math.abs(y)));
  // Like with like: the engine's figures are one pump's, so against one pump's shaft power.
  const differs = !shown || !same(shown.ratio, row.ratio) || !same(shown.efficiency, row.efficiency) || !same(shown.shaftPowerPerPump, row.shaftPower) || !same(shown.bepRatio, row.bepRatio);
  const at = `${rankedAtText(duty, a)}, where it is ranked (${shown ? "not at the operating point its verdict judged" : "not judged"}): `;
  const reason = differs || severalPumps(a) ? row.reason.replace(/^(#\d+ of \d+: )/, `$1${at}`) : row.reason;
  const none = { ratioNote: "not judged: the search's setting at the typed duty", operatingPoint: null, perPump: null, efficiency: null, shaftPower: null, shaftPowerPerPump: null, bepRatio: null, inPor: null };
  return { ...(shown ?? { ratio: row.ratio, speed: row.speed, diameter: row.diameter, ...none }), atTypedDuty, reason };
}

const VERDICT_ORDER = ["meets", "oversized", "viscosity-uncorrected", "short", "no-operating-point", "outside-catalogue"] as const;
const verdictClass = (v: Verdict | null) => (v ? VERDICT_ORDER.indexOf(v.status) : VERDICT_ORDER.length);
type Ranked = { verdict: Verdict | null; npsh: NpshJudgement | null };
/** A pump that meets the duty (or is oversized) but cavitates at some corner of the band (common practice: NPSHa below NPSHr, or NPSHa ≤ 0). */
const cavitates = (k: Ranked) => verdictClass(k.verdict) <= 1 && k.npsh?.status === "cavitation-risk";
/** Rank class: meets 0, oversized 1, either with a cavitation risk on the band 1.5, then the other verdicts. */
const rankClass = (k: Ranked) => (cavitates(k) ? 1.5 : verdictClass(k.verdict));
/** A row's class in words, for "below #n because <row> where #n <above>". */
function classText(k: Ranked, subject: "row" | "above"): string {
  if (cavitates(k)) return `${subject === "row" ? "it has" : "has"} a cavitation risk on the band (${npshWhere(k.npsh!)})`;
  if (subject === "row") return `its verdict is "${k.verdict ? verdictLabel(k.verdict.status) : "not judged"}"`;
  return k.verdict ? `is "${verdictLabel(k.verdict.status)}"` : "is not judged";
}
/** Where the band's NPSH judgement is decided: "NPSHa / NPSHr 0.94 at least lift, aged pipe" (ratio dimensionless, never read as 1). */
function npshWhere(n: NpshJudgement): string {
  return n.marginRatio != null ? `NPSHa / NPSHr ${marginRatioText(n.marginRatio, n.requiredMargin)} at ${n.at}` : `NPSHa not above zero at ${n.at}`;
}
