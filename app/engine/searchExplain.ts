/**
 * Reasons of the duty-point search's ranked rows (search.ts): what each row is, in words, and
 * how it compares with the row above it.
 */
import { EngineInputError, requirePositive, requireNonNegative } from "./errors.ts";
import type { Candidate } from "./search.ts";
import { fmtNumExact, fmtPct, fmtPctExact, qt } from "./quantityText.ts";
import { npshRatioBelow, npshRatioText } from "./npshRatio.ts";

/** What a row is, in words (how it meets the duty and its figures). */
function describe(c: Candidate, reqMargin: number): string {
  const parts: string[] = [];
  parts.push(c.method === "direct" ? `reaches the duty point as published (${qt("head", c.headAtDuty)} at duty flow)`
    : c.method === "trim" ? `reaches the duty point trimmed to ${fmtPct(c.ratio)} of its diameter${c.diameter !== null ? ` (${qt("diameter", c.diameter)})` : ""}`
    : `reaches the duty point at ${fmtPct(c.ratio)} speed${c.speed !== null ? ` (${Math.round(c.speed)} rpm)` : ""}`);
  parts.push(c.efficiency !== null ? `${fmtPct(c.efficiency)} efficient at duty` : "no efficiency data (ranked down)");
  // Beside "outside POR" or "below" the figure never reads as the limit it was judged against.
  if (c.bepRatio !== null) parts.push(c.inPor ? `${Math.round(c.bepRatio * 100)} % of BEP flow (inside POR)` : `${fmtPctExact(c.bepRatio, [0.7, 1.2], 0)} of BEP flow (outside POR 70–120 %)`);
  if (c.npshMargin !== null) parts.push(`NPSH margin at duty ${npshRatioText(c.npshMargin, reqMargin)}${npshRatioBelow(c.npshMargin, reqMargin) ? ` (below ${reqMargin})` : ""}`);
  if (c.shaftPower !== null) parts.push(`${qt("power", c.shaftPower)} shaft`);
  return parts.join("; ");
}

/** How row b (ranked below) compares with row a (the row above), in words. */
function compareWithAbove(a: Candidate, b: Candidate): string {
  const diffs: string[] = [];
  if (a.efficiency !== null && b.efficiency !== null) {
    const d = (a.efficiency - b.efficiency) * 100;
    if (Math.abs(d) >= 0.05) diffs.push(`${Math.abs(d).toFixed(1)} points ${d > 0 ? "less" : "more"} efficient`);
  } else if (a.efficiency !== null && b.efficiency === null) diffs.push("no efficiency data where it has some");
  if (a.bepRatio !== null && b.bepRatio !== null) {
    const da = Math.abs(a.bepRatio - 1), db = Math.abs(b.bepRatio - 1);
    if (Math.abs(da - db) >= 0.005) diffs.push(`${db > da ? "further from" : "nearer"} BEP (${fmtPctExact(b.bepRatio, [a.bepRatio], 0)} against ${fmtPctExact(a.bepRatio, [b.bepRatio], 0)})`); // never "100 % against 100 %"
  }
  if (a.shaftPower !== null && b.shaftPower !== null) {
    const d = b.shaftPower - a.shaftPower;
    if (Math.abs(d) >= 5) diffs.push(`${qt("power", Math.abs(d))} ${d > 0 ? "more" : "less"} shaft power`);
  }
  if (a.npshMargin !== null && b.npshMargin !== null && Math.abs(a.npshMargin - b.npshMargin) >= 0.005) {
    diffs.push(`NPSH margin at duty ${fmtNumExact(b.npshMargin, [a.npshMargin], 2)} against ${fmtNumExact(a.npshMargin, [b.npshMargin], 2)}`);
  }
  const score = a.score - b.score;
  // Scores apart at their printed digits: a row below "on score" never shows the same score as the row above.
  const [sb, sa] = [fmtNumExact(b.score, [a.score], 3), fmtNumExact(a.score, [b.score], 3)];
  return diffs.length
    ? `below #${a.rank} because: ${diffs.join(", ")} (score ${sb} against ${score >= 0 ? "" : "only "}${sa})`
    : `below #${a.rank} on score ${sb} against ${sa} (figures alike)`;
}

/**
 * Numbers the rows 1…n in their order and writes each one's reason: what it is, and how it
 * compares with the row above it (the first row: why it leads). Rows must already be sorted.
 * @param rows ranked candidates (SI figures; rank and reason are rewritten)
 * @param total how many met the duty in all (count)
 * @param reqMargin required NPSH margin ratio (dimensionless)
 * @param notes per row, a comparison with the row above that replaces the score comparison (unitless text; null: compare figures)
 */
export function explainRanks(rows: Candidate[], total: number, reqMargin: number, notes: readonly (string | null)[] = []): Candidate[] {
  if (!Array.isArray(rows)) throw new EngineInputError("rows", "must be an array of ranked candidates");
  if (!Number.isInteger(requireNonNegative("total", total)) || total < rows.length) throw new EngineInputError("total", "must be a whole count, at least the number of rows");
  requirePositive("reqMargin", reqMargin);
  rows.forEach((c, i) => {
    c.rank = i + 1;
    const what = describe(c, reqMargin);
    c.reason = i === 0
      ? `#1 of ${total}: ${what}; highest score ${c.score.toFixed(3)} (efficiency less penalties for distance from BEP, thin NPSH margin and extra power)`
      : `#${c.rank} of ${total}: ${what}; ${notes[i] ?? compareWithAbove(rows[i - 1], c)}`;
  });
  return rows;
}

