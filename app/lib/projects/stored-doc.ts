// A JSON document stored in the database, read honestly: parsed and checked against its valibot schema on every
// read; one that does not pass (stored under an older or looser schema, edited in the database, text that is not
// JSON) is described in plain words — where, what, the value stored there — and never replaced by a default. Each
// kind of document names its keys in words (`DocWords`): the system input (stored-input.ts), a candidate's adjustment
// (stored-adjustment.ts), a frozen selection (stored-selection.ts). Pure.
import * as v from "valibot";
import type { Quantity } from "~/engine";
import { qt } from "~/engine/quantityText";

/** One thing wrong with a stored document: where (`path`, dotted, and `label`, in words), what (`message`) and the value stored there. */
export type DocProblem = { keys: (string | number)[]; path: string; label: string; message: string; stored: string | null };
export type StoredDoc<T> = { ok: true; value: T; raw: unknown } | { ok: false; raw: unknown; problems: DocProblem[] };

/** How a kind of document names its parts. */
export type DocWords = {
  /** The whole document, as the reader knows it: "the stored document", "the stored adjustment". */
  whole: string;
  /** A key in words ("temperatureC" → "temperature"); others are shown as they are. */
  labels: Record<string, string>;
  /** A list's item in words: `runs` 1 → "pipe run 2". */
  items: Record<string, string>;
  /** The quantity of a number stored under this key (shown in the reader's units); others are plain numbers. */
  quantities: Record<string, Quantity>;
  /** A number stored under this key written otherwise (a ratio as a percentage), else undefined. */
  number?: (key: string, x: number) => string | undefined;
};

/** At most this many problems are listed (a document with thousands of bad items says "and N more"). */
export const MAX_PROBLEMS_LISTED = 20;

/** The stored text: its schema's output when it passes, else what is wrong with it (never a default in its place). */
export function readStoredDoc<S extends v.GenericSchema>(json: string, schema: S, words: DocWords): StoredDoc<v.InferOutput<S>> {
  let raw: unknown;
  try {
    raw = JSON.parse(json);
  } catch (e) {
    const why = e instanceof Error ? e.message.slice(0, 120) : "unreadable";
    return { ok: false, raw: undefined, problems: [{ keys: [], path: "", label: words.whole, message: `Is not valid JSON, so none of its values can be read (${why}).`, stored: null }] };
  }
  const r = v.safeParse(schema, raw);
  return r.success ? { ok: true, value: r.output, raw } : { ok: false, raw, problems: r.issues.map((i) => problemOf(i, words)) };
}

/** Where in the document, in words: ["runs", 1, "diameter"] → "pipe run 2, inner diameter". */
export function docPathLabel(keys: readonly (string | number)[], words: DocWords): string {
  const out: string[] = [];
  keys.forEach((k, i) => {
    if (typeof k === "number") {
      const item = words.items[String(keys[i - 1])];
      if (out.length && item) out.pop();
      out.push(`${item ?? "item"} ${k + 1}`);
    } else out.push(words.labels[k] ?? k);
  });
  return out.length ? out.join(", ") : words.whole;
}

/** A valibot limit (">=0", "<=500") in words (also the preview API's, preview-words.ts). */
export function limitWords(expected: string): string {
  const m = /^(>=|<=|>|<|!)(.*)$/.exec(expected);
  if (!m) return expected;
  return `${{ ">=": "at least", "<=": "at most", ">": "more than", "<": "less than", "!": "other than" }[m[1]]} ${m[2]}`;
}
/** A valibot type ("number", "Array", `("open" | "closed-loop")`) in words (also the preview API's, preview-words.ts). */
export function typeWords(expected: string): string {
  const one = (t: string) => ({ number: "a number", string: "text", boolean: "true or false", Array: "a list", Object: "a group of values", null: "empty (null)", undefined: "absent" })[t] ?? t;
  const parts = expected.replace(/^\((.*)\)$/, "$1").split(" | ");
  return parts.length > 2 ? `one of ${parts.map(one).join(", ")}` : parts.map(one).join(" or ");
}

/** The value that was stored (or sent), for the reader: numbers of a known quantity as a token (rendered in the reader's units). */
export function storedText(input: unknown, key: string | number | undefined, words: DocWords): string | null {
  if (input === undefined) return null;
  if (typeof input === "number") {
    if (!Number.isFinite(input)) return "a number too large to hold";
    const own = typeof key === "string" ? words.number?.(key, input) : undefined;
    if (own !== undefined) return own;
    const q = typeof key === "string" ? words.quantities[key] : undefined;
    return q ? qt(q, input) : String(input);
  }
  if (typeof input === "string") return JSON.stringify(input.length > 40 ? `${input.slice(0, 40)}…` : input);
  if (Array.isArray(input)) return `a list of ${input.length}`;
  if (input === null) return "empty (null)";
  return typeof input === "object" ? "a group of values" : String(input);
}

function problemOf(issue: v.BaseIssue<unknown>, words: DocWords): DocProblem {
  const keys = (issue.path ?? []).map((p) => p.key as string | number);
  const last = keys[keys.length - 1];
  const base = { keys, path: keys.join("."), label: docPathLabel(keys, words) };
  if (issue.kind === "schema" && issue.received === "undefined") return { ...base, message: "Missing from the stored document.", stored: null };
  // A check on a whole object forwarded to one of its keys (a run's roughness against its diameter) carries the object
  // as its input: the value stored is the one at the key, in its path.
  const at = issue.path?.length ? issue.path[issue.path.length - 1].value : issue.input;
  const stored = storedText(at, last, words);
  // Our schemas' own messages are sentences already; valibot's defaults ("Invalid type: Expected …") are rewritten.
  if (!issue.message.startsWith("Invalid ")) return { ...base, message: issue.message, stored };
  if (issue.kind === "schema") return { ...base, message: `Should be ${typeWords(issue.expected ?? "")}.`, stored };
  const unit = issue.type.endsWith("_length") ? (typeof issue.input === "string" ? " characters long" : " items") : "";
  return { ...base, message: `Should be ${limitWords(issue.expected ?? "")}${unit}.`, stored };
}

/** The places of the problems, in words, for a refusal or a list: "temperature; pipe run 2, inner diameter and 3 more". */
export function problemPlaces(problems: readonly DocProblem[], max = 6): string {
  const labels = [...new Set(problems.map((p) => p.label))];
  const shown = labels.slice(0, max).join("; ");
  return labels.length > max ? `${shown} and ${labels.length - max} more` : shown;
}

/** One line per problem (for the API's `errors` and tests): "pipe run 2, inner diameter: Inner diameter must be greater than zero. (stored: ⟦diameter|-0.1⟧)". */
export const problemLine = (p: DocProblem) => `${p.label}: ${p.message}${p.stored ? ` (stored: ${p.stored})` : ""}`;

/** How many problems and where, for a sentence: "2 problems: temperature; pipe run 2, inner diameter" (`count` when only some are kept). */
export function problemsSummary(problems: readonly DocProblem[], count = problems.length): string {
  return `${count} problem${count === 1 ? "" : "s"}: ${problemPlaces(problems)}`;
}

/** The problems as an API answer's `errors` (the first MAX_PROBLEMS_LISTED): field (dotted path) and message with the value stored. */
export const problemErrors = (problems: readonly DocProblem[]) => problems.slice(0, MAX_PROBLEMS_LISTED).map((p) => ({ field: p.path, message: problemLine(p) }));
