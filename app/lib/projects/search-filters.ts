// The search page's filters read from its query string (pure): each value that cannot be used is set aside (no filter
// from it, never a 500) and named in a note the page shows, with the rule and what was typed — a max shaft power or a
// speed of 0, below zero, NaN, Infinity, past the range or not a number; a way to meet the duty the search does not know;
// an arrangement it does not know, duty pumps outside 2–8 or standby pumps outside 0 to the duty pumps (search-arrangement.ts).
import { readDecimal, decimalMessage, MAX_MAGNITUDE } from "../shared/decimal";
import { fromChosen, labelOf, type UnitChoice } from "../shared/units";
import type { SearchFilters } from "./search.server";
import { readArrangement, severalPumps, type SearchArrangement } from "./search-arrangement";

export const SEARCH_METHODS = ["direct", "trim", "speed"] as const;
export type SearchMethod = (typeof SEARCH_METHODS)[number];

/** The query's text values as the page's schema reads them. */
export type SearchQueryText = { type: string; size: string; speed: string; maxPower: string; method: string[]; beyond: boolean; arrangement?: string; pumps?: string; standby?: string };

const quoted = (s: string) => `“${s.length > 40 ? `${s.slice(0, 39)}…` : s}”`;

/**
 * One number filter: the value when it is a number above zero and at most MAX_MAGNITUDE (as typed, in `unit`), else
 * undefined with a note: "<Label> … : <what is wrong>; <what the search does instead>."
 */
function positiveWithNote(raw: string, label: string, unit: string, instead: string, notes: string[]): number | undefined {
  const r = readDecimal(raw);
  if (r.kind === "blank") return undefined;
  if (r.kind === "number") {
    if (r.value > 0 && r.value <= MAX_MAGNITUDE) return r.value;
    notes.push(r.value <= 0
      ? `${label} must be a number above 0 ${unit}: ${quoted(raw.trim())} is not, so ${instead}.`
      : `${label} must be at most ${MAX_MAGNITUDE.toExponential().replace("+", "")} ${unit}: ${quoted(raw.trim())} is past it, so ${instead}.`);
    return undefined;
  }
  const why = r.kind === "bad" ? `${label} must be a number above 0 ${unit}: ${quoted(raw.trim())} is not a number.` : decimalMessage(r, label);
  notes.push(`${why.replace(/\.$/, "")}, so ${instead}.`);
  return undefined;
}

/** The filters `searchForSystem` takes, and a note for each value set aside. Power typed in the user's unit, in W after. */
export function readSearchFilters(q: SearchQueryText, units: UnitChoice): { filters: SearchFilters; methods: SearchMethod[]; arrangement: SearchArrangement; notes: string[] } {
  const notes: string[] = [];
  const maxPower = positiveWithNote(q.maxPower, "Max shaft power", labelOf(units, "power"), "no power limit is applied", notes);
  const speed = positiveWithNote(q.speed, "Speed", "rpm", "no speed filter is applied", notes);
  const unknown = [...new Set(q.method.filter((x) => !(SEARCH_METHODS as readonly string[]).includes(x)))];
  const methods = q.method.filter((x): x is SearchMethod => (SEARCH_METHODS as readonly string[]).includes(x)); // in the query's order: the engine tries them so
  const named = [...new Set(methods)];
  if (unknown.length)
    notes.push(`Unknown way to meet the duty ${unknown.slice(0, 3).map(quoted).join(", ")}${unknown.length > 3 ? " …" : ""} (the search knows direct, trim and speed): set aside, so ${named.length ? `only ${named.join(", ")} ${named.length === 1 ? "is" : "are"} searched` : "every way is searched"}.`);
  const { arrangement, problems } = readArrangement(q);
  notes.push(...problems.map((p) => p.note));
  return {
    filters: {
      type: q.type.slice(0, 40) || undefined,
      size: q.size.slice(0, 40) || undefined,
      speed,
      maxPowerW: maxPower === undefined ? undefined : fromChosen(units, "power", maxPower),
      methods: methods.length ? methods : undefined,
      allowBeyondCatalogue: q.beyond,
      arrangement: severalPumps(arrangement) ?? undefined,
    },
    methods,
    arrangement,
    notes,
  };
}
