// The preview API's refusals (POST /api/v1/systems/:id/preview, preview-input.ts) in plain words, as the editor says them
// (helper "formkeep"): valibot's own wording ("Invalid type: Expected (\"open\" | \"closed-loop\") but received \"x\"",
// "Invalid key: Expected \"staticLow\" but received undefined") becomes the field in words, what it takes and what was sent
// — the words a stored document's problems are said in (stored-doc.ts `typeWords`, `limitWords`, `storedText`); a static
// head or the duty is refused as the editor refuses it, with its range in the caller's units (duty-ranges.ts, `outOfRange`).
// Our schemas' own sentences are kept. Pure.
import type * as v from "valibot";
import { ENTRY_RANGES, inside } from "./duty-ranges";
import { outOfRange, rangeText } from "./run-ranges";
import { docPathLabel, limitWords, storedText, typeWords, type DocWords } from "./stored-doc";
import { INPUT_ITEMS, INPUT_LABELS, INPUT_QUANTITIES } from "./stored-input";
import { SystemInputSchema } from "./system-input";

const WORDS: DocWords = { whole: "the input", labels: INPUT_LABELS, items: INPUT_ITEMS, quantities: INPUT_QUANTITIES };

type Walked = { expects?: string; entries?: Record<string, Walked>; item?: Walked; wrapped?: Walked; options?: Walked[] };

/** The schema of the value at `keys` inside the system input (through pipes, nullable and optional parts, lists, the fluid's kinds). */
function schemaAt(keys: readonly (string | number)[]): Walked | null {
  let s: Walked | undefined = SystemInputSchema as unknown as Walked;
  for (const k of keys) {
    while (s?.wrapped) s = s.wrapped;
    if (!s) return null;
    if (typeof k === "number") s = s.item;
    else s = s.entries?.[k] ?? s.options?.find((o) => o.entries?.[k])?.entries?.[k];
  }
  return s ?? null;
}

const capital = (t: string) => t.charAt(0).toUpperCase() + t.slice(1);

/** What was sent, in words: text by its length where the issue is its length, else as a stored value is said. */
function sentText(issue: v.BaseIssue<unknown>, value: unknown, key: string | number | undefined): string {
  if (issue.type.endsWith("_length") && typeof value === "string") return `${value.length} characters`;
  return storedText(value, key, WORDS) ?? "nothing";
}

/**
 * The words of one refusal of the preview's body at `path` (its keys from the body: "input", then the system input's):
 * a static head or the duty outside its range, not a number or missing, in the editor's words with what was sent; an
 * issue worded by valibot in plain words; any other (our schemas' sentences) as it is.
 */
export function previewMessage(issue: v.BaseIssue<unknown>, path: readonly (string | number)[]): string {
  const keys = path[0] === "input" ? path.slice(1) : path;
  const last = keys[keys.length - 1];
  const missing = issue.kind === "schema" && issue.received === "undefined";
  const value = issue.path?.length ? issue.path[issue.path.length - 1].value : issue.input;
  const r = ENTRY_RANGES[keys.join(".")];
  // A ranged number: the editor's words unless the number sent is inside its range (then the issue is another rule's,
  // the static head at high level below the one at low level).
  if (r && missing) return `${r.label} is missing; it takes ${rangeText(r)}.`;
  if (r && !(typeof value === "number" && Number.isFinite(value) && inside(r, value))) {
    // A number: `outOfRange` names it, grouped as the ends and with the decimals that tell it from them (−1000.01 m never
    // reads as the −1 000 m it is below); anything else is said as sent.
    if (typeof value === "number" && Number.isFinite(value)) return outOfRange(r, value);
    return `${outOfRange(r, null)} Sent: ${sentText(issue, value, last)}.`;
  }
  if (!issue.message.startsWith("Invalid ")) return issue.message; // our own sentence
  const label = capital(docPathLabel(keys, WORDS));
  if (missing) {
    const expects = schemaAt(keys)?.expects;
    return `${label} is missing${expects ? `: send ${typeWords(expects)}` : ""}.`;
  }
  const unit = issue.type.endsWith("_length") ? (typeof issue.input === "string" ? " characters long" : " items") : "";
  // A part that may be empty (the duty: null) says so: valibot's issue names only the object it expected.
  const whole = schemaAt(keys);
  const should = issue.kind === "schema" ? typeWords((whole?.wrapped ? whole.expects : undefined) ?? issue.expected ?? "") : `${limitWords(issue.expected ?? "")}${unit}`;
  return `${label} must be ${should}. Sent: ${sentText(issue, value, last)}.`;
}
