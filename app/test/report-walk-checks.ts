// Tests only: what the report walk (report-walk.test.ts) reads off a rendered selection report or system page — the
// candidates table's columns, tooltips, SI unit words beside numbers (the list and patterns of the US-units browser walk,
// e2e/units.spec.ts), words that are never a figure — and which verdicts shown lack their rule or their numbers.
import { textOf } from "./selection-pages";

/** Words no report or export should carry: a figure that failed (NaN, Infinity), a value never filled, a raw token. */
export const BAD_WORDS = /\bNaN\b|Infinity|\bundefined\b|\bnull\b|\[object |⟦|⟧/g;

const NUM = String.raw`\d(?:[\d.,]*\d)?`;
const SI_WORDS = ["m³/h", "m³/s", "L/s", "L/min", "kPa", "kW", "mm", "m", "°C", "m/s", "kg/m³", "mm²/s", "m²/s", "mPa·s", "bar", "Pa"];
// A trimmed impeller's whole mm in brackets after its inches ("Ø6.65 in [169 mm]"): the step a site sets (e2e/units.spec.ts).
const TRIM_STEP_MM = /(?<=Ø\d[\d.]* in) \[\d+(?:\.\d+)? mm\]/g;
const esc = (s: string) => s.replace(/[.*+?^${}()|[\]\\/]/g, "\\$&");
const UNIT_AFTER_NUMBER = new RegExp(String.raw`(?<![\p{L}\d](?<!Ø))${NUM}\s?(?:${SI_WORDS.map(esc).join("|")})(?![\p{L}\p{N}²³/])`, "gu");
const UNIT_IN_BRACKETS = new RegExp(String.raw`\((?:${SI_WORDS.map(esc).join("|")})\)`, "gu");

/** Each SI unit word beside a number (or a bracketed unit) in `text`, with some context. */
export function noSiWords(text: string): string[] {
  const t = text.replace(TRIM_STEP_MM, "");
  return [...t.matchAll(UNIT_AFTER_NUMBER), ...t.matchAll(UNIT_IN_BRACKETS)].map((m) => t.slice(Math.max(0, m.index! - 40), m.index! + m[0].length + 10));
}

const decode = (s: string) => s.replace(/&amp;/g, "&").replace(/&quot;/g, '"').replace(/&#x27;/g, "'").replace(/&lt;/g, "<").replace(/&gt;/g, ">");
/** Every tooltip (title attribute) of the markup, decoded. */
export const titlesOf = (html: string) => [...html.matchAll(/ title="([^"]*)"/g)].map((m) => decode(m[1]));

/** A cell as the reader gets it: its text, then its tooltips (candidate ids in test ids left out: they differ by page). */
const cellView = (cell: string) => [textOf(cell), ...titlesOf(cell).map((t) => `[title: ${t}]`)].join(" ");

/** The candidates table (`aria-label="Candidates compared"`): one map per candidate column, row label → cell as read. */
export function candidateColumns(html: string): Map<string, string>[] {
  const table = /<table[^>]*aria-label="Candidates compared"[^>]*>([\s\S]*?)<\/table>/.exec(html)?.[1] ?? "";
  const columns: Map<string, string>[] = [];
  for (const row of table.matchAll(/<tr[^>]*>([\s\S]*?)<\/tr>/g)) {
    const label = /<th scope="row"[^>]*>([\s\S]*?)<\/th>/.exec(row[1]);
    if (!label) continue;
    [...row[1].matchAll(/<td[^>]*>([\s\S]*?)<\/td>/g)].forEach((c, i) => (columns[i] ??= new Map()).set(textOf(label[1]), cellView(c[1])));
  }
  return columns;
}

/** Numbers in a text ("1.35", "12,345", "70–120" counts two). */
const numbers = (t: string) => t.match(/(?<![\p{L}])\d[\d.,\u202f]*/gu) ?? [];

/** The element that `testId` opens (up to its own closing tag, `tag` not nested inside it), as visible text. */
function shown(html: string, testId: string, tag: string): string | null {
  const i = html.indexOf(`data-testid="${testId}"`);
  if (i < 0) return null;
  const end = html.indexOf(`</${tag}>`, i);
  return textOf(html.slice(html.indexOf(">", i) + 1, end));
}

/**
 * The verdicts the report shows without their rule or their numbers in its visible text (a tooltip does not print): the
 * headline (its "Rule — …" with the limits, each reason with its figures), every qualifier on its line (NPSH, staged starts,
 * the motor, NPSH at a staged step, the maker's minimum flow), and the verdict words of the figures table — the NPSH
 * status over the band and at the design point against the wanted ratio, a position outside the POR against 70–120 % of
 * BEP flow, the motor's overload check against rating × service factor, the duty against the maker's minimum flow.
 */
export function verdictProblems(html: string): string[] {
  const out: string[] = [];
  const head = shown(html, "report-verdict", "div");
  if (head == null) return ["no headline verdict"];
  const status = /data-testid="report-verdict" data-status="([^"]+)"/.exec(html)![1];
  const rule = /Rule — (.*)$/.exec(head)?.[1];
  if (status !== "not-judged" && status !== "none") {
    if (!rule || !rule.startsWith(`${status}: `) || numbers(rule).length < 2) out.push(`headline ${status}: no rule with its limits (${rule ?? head})`);
    for (const reason of [...html.slice(html.indexOf('data-testid="report-verdict"')).matchAll(/<p class="mt-1 text-xs">([\s\S]*?)<\/p>/g)].slice(0, 1))
      if (numbers(textOf(reason[1])).length < 1) out.push(`headline ${status}: a reason without its figures (${textOf(reason[1])})`);
  }
  for (const q of ["npsh", "start", "motor", "staged-npsh", "min-flow"]) {
    const note = shown(html, `report-verdict-${q}`, "span");
    if (note != null && numbers(note).length < 2) out.push(`qualifier ${q} without its numbers: ${note}`);
  }
  const cells = candidateColumns(html)[0] ?? new Map<string, string>();
  const visible = (label: string) => (cells.get(label) ?? "").replace(/ \[title: [^\]]*\]/g, "");
  for (const label of ["NPSH margin over the band", "NPSH margin"]) {
    const t = visible(label);
    if (/\((ok|low-margin|cavitation-risk)\)/.test(t) && !/NPSHa .*at or below zero|wanted \d|at least \d|below 1\b/.test(t)) out.push(`${label} "${t}": a status without the ratio it is judged against`);
  }
  const bep = visible("Position vs BEP");
  if (/POR/.test(bep) && !/70–120 %/.test(bep)) out.push(`Position vs BEP "${bep}": outside POR without the region's limits`);
  const motor = /data-testid="motor-check-\d+"[^>]*>([\s\S]*?)<\/div>/.exec(html);
  if (motor) {
    const t = textOf(motor[1]);
    if (!/not judged/.test(t) && (!/rating × service factor/.test(t) || numbers(t).length < 2)) out.push(`motor check "${t}": without its rule and numbers`);
  }
  const minFlow = visible("Maker's minimum flow");
  if (/below it|at or above it/.test(minFlow) && numbers(minFlow).length < 2) out.push(`maker's minimum flow "${minFlow}": without its numbers`);
  return out;
}
