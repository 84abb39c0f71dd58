// The verdict a list shows for a recorded check — the field home's recent checks, the contractor's history, the engineer's
// list, the CSV and the phone's queue — with its rule and its numbers. Today's verdict (the check's own readings judged
// again with today's engine, judged-today.ts) where it can be had; where the verdict stored when the check was saved
// differs, both, labelled: "within tolerance against grade 2B when saved on 2026-12-03; today: outside tolerance — Tolerance
// cross of grade 2B, …". Where today's rules cannot judge the readings, the stored verdict, said to be the saved one. Pure.
import { fmtDate } from "../shared/format";
import { VERDICT_TEXT, type Verdict } from "./form";
import { MARGINAL_NOTE, verdictNote, type CheckResult } from "./result";
import { crossSummary } from "./cross";
import { powerGradeSummary } from "./power-grade";

/** A verdict with its rule and numbers (quantity tokens): what a list says of one judgement. */
export type RuledVerdict = { verdict: Verdict; rule: string };

/** What a list shows for one check (quantity tokens in `rule` and `text`, rendered by the loader). */
export type ListedVerdict = {
  /** The verdict shown: today's, or the stored one where today's rules cannot judge the readings. */
  verdict: Verdict;
  grade: string;
  /** The verdict stored when the check was saved, and the day it was saved (UTC, or the phone's clock for a kept check). */
  stored: Verdict;
  storedOn: string;
  /** Today's verdict where it differs from the stored one, else null. */
  today: Verdict | null;
  /** False where today's rules cannot judge the readings (a grade no longer offered, readings refused, a frozen document that does not read). */
  judgedToday: boolean;
  /** The shown verdict's rule and numbers. */
  rule: string;
  /** The verdict's words, with the stored one and its day where they differ or today's rules cannot judge ("… when saved on …; today: …"). */
  label: string;
  /** The line a list prints beside the badge: the label, then the rule with its numbers. */
  text: string;
};

/**
 * A check's verdict rule with its numbers, one paragraph (quantity tokens): the tolerance cross's arms as read (cross.ts
 * `crossSummary`), the point within the readings' uncertainty for a marginal check, the note on a curve's published part,
 * and the grade's power and efficiency limits where they were judged; for no verdict, why (`verdictNote`, or no flow meter).
 * @param r a check's result (stored, or worked out today)
 */
export function verdictRule(r: CheckResult): string {
  if (r.verdict === "unknown") {
    if (r.engine.flowSource !== "measured")
      return `No tolerance verdict: no flow meter was read, so the flow is the curve's at the measured head and grade ${r.grade.id}'s tolerance cross cannot be judged.`;
    return verdictNote(r) ?? `No tolerance verdict: ${r.message}.`;
  }
  const pg = r.powerGrade;
  const powerJudged = !!pg && pg.notJudged === null && pg.check !== null && pg.check.pass !== null;
  const parts = [
    crossSummary(r) ?? `${r.message}.`,
    r.verdict === "marginal" ? (r.warnings.find((w) => w.startsWith(MARGINAL_NOTE)) ?? null) : null,
    verdictNote(r),
    powerJudged ? powerGradeSummary(r) : null,
  ];
  return parts.filter((x): x is string => !!x).join(" ");
}

const said = (v: Verdict, grade: string) => `${VERDICT_TEXT[v]}${grade ? ` against grade ${grade}` : ""}`;
/** The rule after the verdict's words: "no tolerance verdict — the measured speed …", not "… — No tolerance verdict: …". */
const after = (v: Verdict, rule: string) => (v === "unknown" ? rule.replace(/^No tolerance verdict: /, "") : rule);

/**
 * The verdict a list shows for a recorded check, and its line: today's with its rule and numbers where it agrees with the
 * stored one ("within tolerance against grade 2B — …"); both where they differ ("outside tolerance against grade 2B when saved
 * on 2026-12-03; today: within tolerance — …"); the stored one, said so, where today's rules cannot judge the readings.
 * @param stored the verdict stored with the check, its grade, when it was saved (ISO) and its stored result (null: unreadable),
 *   or its rule as kept (a check kept on the phone)
 * @param today the readings judged with today's engine (verdict and rule), or null where they cannot be
 * @param why why there is no today's verdict, said after the saved one (default: today's rules cannot judge the readings)
 */
export function listedVerdict(
  stored: { verdict: Verdict; grade: string; savedAt: string; result: CheckResult | null; rule?: string | null },
  today: RuledVerdict | null,
  why = "today's rules cannot judge these readings again",
): ListedVerdict {
  const storedOn = fmtDate(stored.savedAt);
  const base = { grade: stored.grade, stored: stored.verdict, storedOn };
  if (!today) {
    const rule = stored.result ? verdictRule(stored.result) : (stored.rule ?? "");
    const label = `${said(stored.verdict, stored.grade)} when saved on ${storedOn} (${why})`;
    return { ...base, verdict: stored.verdict, today: null, judgedToday: false, rule, label, text: rule ? `${label} — ${after(stored.verdict, rule)}` : label };
  }
  const differs = today.verdict !== stored.verdict;
  const label = differs ? `${said(stored.verdict, stored.grade)} when saved on ${storedOn}; today: ${VERDICT_TEXT[today.verdict]}` : said(today.verdict, stored.grade);
  return { ...base, verdict: today.verdict, today: differs ? today.verdict : null, judgedToday: true, rule: today.rule, label, text: `${label} — ${after(today.verdict, today.rule)}` };
}
