// The search's arrangement (pure): one pump (the default), N duty pumps in parallel (with standby pumps, which do not
// run) or N duty pumps in series — the candidate's own `arrangement`, `dutyPumps` and `standbyPumps`. The engine's
// `searchDuty` ranks one pump at its share of the duty — the flow / N in parallel, the head / N in series — which is
// the ranking's approximation (common practice: identical pumps share the duty equally); each row's verdict is then
// judged exactly by `evaluateCandidate` with the arrangement's adjustment (the combined curve against the system, staged
// starts, start warnings, the motor per pump), as the candidates table judges it. Read from the search page's query (a
// value set aside named in a note, as search-filters.ts does), the read API's (a 400 naming it) and each row's Add value.
import { DEFAULT_ADJUSTMENT, MAX_DUTY_PUMPS, type Adjustment } from "./candidate-input";
import { countField } from "../shared/decimal";
import { qt } from "~/engine/quantityText";

export type SearchArrangement = Pick<Adjustment, "arrangement" | "dutyPumps" | "standbyPumps">;
export const SINGLE_PUMP: SearchArrangement = { arrangement: "single", dutyPumps: 1, standbyPumps: 0 };
export const SEARCH_ARRANGEMENTS = ["single", "parallel", "series"] as const;
/**
 * Duty pumps of an arrangement searched: 2 to the candidate's own bound (candidate-input.ts MAX_DUTY_PUMPS, 8), so every
 * arrangement searched can be added as it was judged; standby pumps 0 to the duty pumps, in parallel only.
 */
export const SEARCH_MIN_PUMPS = 2;
export const SEARCH_MAX_PUMPS = MAX_DUTY_PUMPS;
/** Duty pumps when an arrangement is asked for without a count (the page's field shows it). */
export const SEARCH_DEFAULT_PUMPS = 2;

/** The query's text values: `arrangement` (single, parallel, series), `pumps` (duty pumps), `standby` (standby pumps). */
export type ArrangementText = { arrangement?: string; pumps?: string; standby?: string };
/** A value that cannot be used: its field, what is wrong with the value in words (`rule`) and the page's note (with what the search does instead). */
export type ArrangementProblem = { field: "arrangement" | "pumps" | "standby"; rule: string; note: string };

const quoted = (s: string) => `“${s.length > 40 ? `${s.slice(0, 39)}…` : s}”`;
const given = (s: string | undefined) => s != null && s.trim() !== "";
const problem = (field: ArrangementProblem["field"], rule: string, instead: string): ArrangementProblem => ({ field, rule, note: `${rule}, so ${instead}.` });

/**
 * The arrangement asked for, and each value that cannot be used. `api`: a count given without an arrangement of several
 * pumps, or standby pumps outside parallel, is a problem too (the page's form always sends its fields, so there only
 * standby pumps above 0 are named).
 */
export function readArrangement(q: ArrangementText, opts: { api?: boolean } = {}): { arrangement: SearchArrangement; problems: ArrangementProblem[] } {
  const problems: ArrangementProblem[] = [];
  const kind = (q.arrangement ?? "").trim();
  if (kind !== "" && !(SEARCH_ARRANGEMENTS as readonly string[]).includes(kind))
    problems.push(problem("arrangement", `Unknown arrangement ${quoted(kind)} (the search knows single, parallel and series)`, "one pump is searched"));
  const several = kind === "parallel" || kind === "series" ? kind : null;
  const standbyText = (q.standby ?? "").trim();
  const standbyOnlyParallel = `Standby pumps ${quoted(standbyText)} are counted with pumps in parallel only`;
  if (!several) {
    if (opts.api) for (const f of ["pumps", "standby"] as const) if (given(q[f])) problems.push(problem(f, `"${f}" is read with arrangement=parallel or arrangement=series only`, "one pump is searched"));
    if (!opts.api && given(q.standby) && standbyText !== "0") problems.push(problem("standby", standbyOnlyParallel, "one pump is searched"));
    return { arrangement: SINGLE_PUMP, problems };
  }
  const errors: Record<string, string> = {};
  const n = countField(q.pumps, "pumps", "duty pumps", errors, SEARCH_MAX_PUMPS, SEARCH_DEFAULT_PUMPS, SEARCH_MIN_PUMPS);
  if (n == null) {
    problems.push(problem("pumps", errors.pumps.replace(/\.$/, ""), "one pump is searched"));
    return { arrangement: SINGLE_PUMP, problems };
  }
  if (several === "series") {
    if (given(q.standby) && (opts.api || standbyText !== "0")) problems.push(problem("standby", standbyOnlyParallel, `${n} duty pumps in series are searched without standby`));
    return { arrangement: { arrangement: "series", dutyPumps: n, standbyPumps: 0 }, problems };
  }
  const standby = countField(q.standby, "standby", "standby pumps (at most the duty pumps)", errors, n, 0, 0);
  if (standby == null) problems.push(problem("standby", errors.standby.replace(/\.$/, ""), "no standby pump is counted"));
  return { arrangement: { arrangement: "parallel", dutyPumps: n, standbyPumps: standby ?? 0 }, problems };
}

/** Several pumps (an arrangement with 2 duty pumps or more), or null for one pump. */
export const severalPumps = (a: SearchArrangement | undefined): SearchArrangement | null => (a && a.arrangement !== "single" && a.dutyPumps >= 2 ? a : null);

/** The candidate's adjustment for a search row: its method, the arrangement searched, the rest as DEFAULT_ADJUSTMENT. */
export function arrangementAdjustment(method: Adjustment["method"], a: SearchArrangement | undefined): Adjustment {
  const s = severalPumps(a);
  return { ...DEFAULT_ADJUSTMENT, method, ...(s ? { arrangement: s.arrangement, dutyPumps: s.dutyPumps, standbyPumps: s.arrangement === "parallel" ? s.standbyPumps : 0 } : {}) };
}

/** The part of a kept verdict's key that names the arrangement ("" for one pump, "#parallel2+1"). */
export function arrangementKey(a: SearchArrangement | undefined): string {
  const s = severalPumps(a);
  return s ? `#${s.arrangement}${s.dutyPumps}+${s.standbyPumps}` : "";
}

/**
 * One pump's share of the duty the engine ranks at (flow / N in parallel, head / N in series, m³/s and m): the ranking's
 * approximation, common practice — identical pumps share the duty equally; the verdict judges the combined curve exactly.
 */
export function dutyShare(duty: { flow: number; head: number }, a: SearchArrangement | undefined): { flow: number; head: number } {
  const s = severalPumps(a);
  if (!s) return { flow: duty.flow, head: duty.head };
  return s.arrangement === "parallel" ? { flow: duty.flow / s.dutyPumps, head: duty.head } : { flow: duty.flow, head: duty.head / s.dutyPumps };
}

/**
 * What the search's duty is called where it is one pump's share, or undefined for one pump (the typed duty itself):
 * "one pump's share of the duty (2 duty pumps in parallel: the duty flow / 2)".
 */
export function shareName(a: SearchArrangement | undefined): string | undefined {
  const s = severalPumps(a);
  return s ? `one pump's share of the duty (${arrangementWords(s)}: the duty ${s.arrangement === "parallel" ? "flow" : "head"} / ${s.dutyPumps})` : undefined;
}

/** "2 duty pumps in parallel + 1 standby", "3 duty pumps in series", "one pump". */
export function arrangementWords(a: SearchArrangement | undefined): string {
  const s = severalPumps(a);
  return s ? `${s.dutyPumps} duty pumps in ${s.arrangement}${s.standbyPumps ? ` + ${s.standbyPumps} standby` : ""}` : "one pump";
}

/**
 * How an arrangement was searched, in words with its numbers (quantity tokens), or null for one pump: "Searched for 2 duty
 * pumps in parallel: each pump ranked at its share of the duty, ⟦flow|…⟧ (the duty flow ⟦flow|…⟧ / 2) at ⟦head|…⟧ …".
 */
export function arrangementRule(duty: { flow: number; head: number }, a: SearchArrangement | undefined): string | null {
  const s = severalPumps(a);
  if (!s) return null;
  const share = dutyShare(duty, s);
  const split = s.arrangement === "parallel"
    ? `${qt("flow", share.flow)} (the duty flow ${qt("flow", duty.flow)} / ${s.dutyPumps}) at ${qt("head", share.head)}`
    : `${qt("flow", share.flow)} at ${qt("head", share.head)} (the duty head ${qt("head", duty.head)} / ${s.dutyPumps})`;
  const standby = s.standbyPumps ? `; ${s.standbyPumps === 1 ? "the standby pump does not run and counts" : `the ${s.standbyPumps} standby pumps do not run and count`} in no figure` : "";
  return `Searched for ${arrangementWords(s)}: each pump is ranked at its share of the duty, ${split} — the ranking's approximation (common practice: identical pumps share the duty equally); each row's verdict judges the ${s.dutyPumps} pumps' combined curve against the system exactly, as the candidates table does, with pumps started one after another, a pump that cannot start and the motor per pump${standby}.`;
}

/**
 * What "why this rank" quotes for an arrangement: one pump's share of the typed duty, where the engine ranked the row;
 * for one pump, the typed duty itself.
 */
export function rankedAtText(duty: { flow: number; head: number }, a: SearchArrangement | undefined): string {
  const s = severalPumps(a);
  const share = dutyShare(duty, s ?? undefined);
  return s ? `at one pump's share of the typed duty (${arrangementWords(s)}), ${qt("flow", share.flow)} at ${qt("head", share.head)}` : `at the typed duty ${qt("flow", duty.flow)} at ${qt("head", duty.head)}`;
}

/** A row's Add value's arrangement part: "" for one pump, ":parallel:2:1" (duty pumps, standby pumps). */
export function pickSuffix(a: SearchArrangement | undefined): string {
  const s = severalPumps(a);
  return s ? `:${s.arrangement}:${s.dutyPumps}:${s.standbyPumps}` : "";
}

/**
 * The arrangement of an Add value's parts (`parallel`, `2`, `1`), or its problem in words: duty pumps SEARCH_MIN_PUMPS to
 * SEARCH_MAX_PUMPS, standby pumps 0 to the duty pumps and in parallel only.
 */
export function pickArrangement(kind: string, pumps: string, standby: string): SearchArrangement | string {
  const n = Number(pumps), k = Number(standby);
  if (kind !== "parallel" && kind !== "series") return "An arrangement is parallel or series.";
  if (!Number.isInteger(n) || n < SEARCH_MIN_PUMPS || n > SEARCH_MAX_PUMPS) return `Duty pumps are a whole number from ${SEARCH_MIN_PUMPS} to ${SEARCH_MAX_PUMPS}.`;
  if (!Number.isInteger(k) || k < 0 || k > n || (kind === "series" && k > 0)) return `Standby pumps are a whole number from 0 to the ${n} duty pumps, with pumps in parallel only.`;
  return { arrangement: kind, dutyPumps: n, standbyPumps: k };
}
