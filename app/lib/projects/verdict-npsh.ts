// The verdict's headline qualified by NPSH. The duty verdict (engine verdict.ts) is about delivering the duty and
// never reads NPSH, which has its own judgement over the band (candidate-judgement.ts `npshOverBand`); but a pump
// that "meets the duty" while it cavitates is no pump to sign, so wherever the verdict is shown as a headline (the
// candidates table, the report, the search row, the chart's label, the CSV) a cavitation risk or a low NPSH margin
// qualifies it on the same line, with its rule and numbers. Pure; quantities as tokens (quantityText.ts).
import { qtAboveZero, qtExact } from "~/engine/quantityText";
import { marginRatioText } from "./npsh-ratio";
import type { NpshJudgement } from "./candidate-judgement";

type VerdictLike = { status: string } | null | undefined;

/**
 * What NPSH says against the verdict, or null where it says nothing against it (ok, unknown, or no verdict):
 * "NPSHa ⟦head|0.9⟧ below NPSHr ⟦head|1.2⟧ at least lift, aged pipe (NPSHa / NPSHr 0.75, below 1): cavitation risk";
 * "NPSHa ⟦head|-0.26⟧, at or below zero, at most lift, aged pipe: cavitation risk whatever the pump's NPSHr";
 * "NPSHa / NPSHr 1.05 at design point (NPSHa … / NPSHr …), below the wanted 1.1: low NPSH margin".
 * Frozen selections without NPSHa or the points judged give the ratio alone.
 */
export function npshAgainstVerdict(n: NpshJudgement | null | undefined): string | null {
  if (!n || (n.status !== "cavitation-risk" && n.status !== "low-margin")) return null;
  const a = n.available ?? null;
  if (n.status === "cavitation-risk" && a != null && a <= 0) return `NPSHa ${qtExact("head", a, [0])}, at or below zero, at ${n.at}: cavitation risk whatever the pump's NPSHr`;
  const r = n.marginRatio;
  if (r == null) return null;
  const required = n.judgedAt?.find((p) => p.at === n.at)?.required ?? null;
  const wanted = n.requiredMargin;
  const ratio = marginRatioText(r, wanted); // "< 0.01" just above zero, as the table
  if (n.status === "cavitation-risk") {
    return a != null && required != null
      ? `NPSHa ${qtAboveZero("head", a, [required])} below NPSHr ${qtExact("head", required, [a])} at ${n.at} (NPSHa / NPSHr ${ratio}, below 1): cavitation risk`
      : `NPSHa / NPSHr ${ratio} at ${n.at}, below 1: cavitation risk`;
  }
  const pair = a != null && required != null ? ` (NPSHa ${qtAboveZero("head", a, [required])} / NPSHr ${qtExact("head", required, [a])})` : "";
  return `NPSHa / NPSHr ${ratio} at ${n.at}${pair}, below the wanted ${wanted ?? "margin"}: low NPSH margin`;
}

/** How a qualifier joins the verdict on its line: "but" after "meets the duty", "and" after any other verdict (NPSH, staged starts, the motor alike). */
export const againstWord = (verdict: { status: string }): "but" | "and" => (verdict.status === "meets" ? "but" : "and");

/**
 * The qualifier shown right after the verdict's badge, on its line: " — but …" after "meets the duty", " — and …" after
 * any other verdict; null where NPSH says nothing against it.
 */
export function verdictNpshNote(verdict: VerdictLike, n: NpshJudgement | null | undefined): string | null {
  if (!verdict) return null;
  const against = npshAgainstVerdict(n);
  return against ? `${againstWord(verdict)} ${against}` : null;
}

/** The chart label's short form: ", but NPSH cavitation risk" / ", and NPSH low margin" ("" where NPSH says nothing against it). */
export function verdictNpshShort(verdict: VerdictLike, n: NpshJudgement | null | undefined): string {
  if (!verdict || !npshAgainstVerdict(n)) return "";
  return `, ${againstWord(verdict)} NPSH ${n!.status === "cavitation-risk" ? "cavitation risk" : "low margin"} at ${n!.at}`;
}
