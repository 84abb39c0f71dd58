// The verdict's headline qualified by NPSH. The duty verdict (engine verdict.ts) is about delivering the duty and
// never reads NPSH, which has its own judgement over the band (candidate-judgement.ts `npshOverBand`); but a pump
// that "meets the duty" while it cavitates is no pump to sign, so wherever the verdict is shown as a headline (the
// candidates table, the report, the search row, the chart's label, the CSV) a cavitation risk or a low NPSH margin
// qualifies it on the same line, with its rule and numbers. A pump that passes (meets the duty, or oversized) whose NPSH
// could not be judged everywhere the rule names (no NPSHr published at a point's flow: the NPSHr curve ends before it,
// or none at all; or no operating point there) is no plain pass either: its line says "NPSH not checked" with the flows
// and where (decision "npshzero"), and where the NPSHr curve stops with both flows, or that it publishes one point only,
// which is judged nowhere (npshr-reach.ts, decision "npshone"). Pure; quantities as tokens (quantityText.ts).
import { qt, qtAboveZero, qtExact } from "~/engine/quantityText";
import { marginRatioText } from "./npsh-ratio";
import { npshrGapClauses } from "./npshr-reach";
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
  if (n.status === "cavitation-risk" && a != null && a <= 0) return `NPSHa ${qtAboveZero("head", a, [])}, at or below zero, at ${n.at}: cavitation risk whatever the pump's NPSHr`;
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

/** Verdicts that read as a pass: an NPSH not judged everywhere qualifies them ("NPSH not checked"). */
const PASSES: readonly string[] = ["meets", "oversized"];

/**
 * Where NPSH over the band could not be judged, in words with the flows: "NPSH not checked: the NPSHr curve ends at
 * ⟦flow|0.0111⟧, and the pump runs past it at ⟦flow|0.0119⟧ (design point), ⟦flow|0.0131⟧ (least lift, new pipe); no
 * operating point at least lift, aged pipe; where judged, the lowest NPSHa / NPSHr is 1.52 at most lift, aged pipe"
 * (before its first flow "starts at …, and the pump runs below it at …"; one published point "the curve publishes NPSHr at
 * one flow only (…): one point is no curve to read it at …"; none "the curve publishes no NPSHr at …": npshr-reach.ts).
 * A point whose NPSHa is at or below zero is judged by NPSHa (a cavitation risk), never listed here. A selection frozen
 * before the points (or the NPSHr's reach) were kept names what it holds.
 * @param n the judgement (`npshOverBand`), status "unknown"; flows m³/s, ratios dimensionless
 */
export function npshNotCheckedText(n: NpshJudgement): string {
  const unjudged = (n.judgedAt ?? []).filter((p) => p.flow != null && p.marginRatio == null && !(p.available != null && p.available <= 0));
  const noNpshr = unjudged.filter((p) => p.required == null);
  const tiny = unjudged.filter((p) => p.required != null); // an NPSHr so small that NPSHa / NPSHr is no number (engine npshMarginRatio)
  const noPoint = (n.unjudged ?? []).filter((u) => u.why === "no operating point").map((u) => u.at);
  const parts: string[] = [];
  parts.push(...npshrGapClauses(n.npshrPublished, noNpshr));
  if (tiny.length) parts.push(`the curve's NPSHr is too small to judge against at ${tiny.map((p) => `${qt("flow", p.flow!)} (${p.at}: ${qt("head", p.required!)})`).join(", ")}`);
  if (noPoint.length) parts.push(`no operating point at ${noPoint.join(", ")}`);
  if (!parts.length) parts.push(n.unjudged?.length ? n.unjudged.map((u) => `${u.at} (${u.why})`).join(", ") : "the NPSH status over the band is unknown");
  const judged = n.marginRatio != null && n.at ? `; where judged, the lowest NPSHa / NPSHr is ${marginRatioText(n.marginRatio, n.requiredMargin)} at ${n.at}` : "";
  return `NPSH not checked: ${parts.join("; ")}${judged}`;
}

/**
 * What NPSH says against this verdict: a cavitation risk or low margin (`npshAgainstVerdict`) after any verdict; where
 * the status is unknown, "NPSH not checked: …" after a verdict that passes (meets, oversized); else null.
 */
function againstThis(verdict: { status: string }, n: NpshJudgement | null | undefined): string | null {
  const against = npshAgainstVerdict(n);
  if (against) return against;
  return n?.status === "unknown" && PASSES.includes(verdict.status) ? npshNotCheckedText(n) : null;
}

/** How a qualifier joins the verdict on its line: "but" after "meets the duty", "and" after any other verdict (NPSH, staged starts, the motor alike). */
export const againstWord = (verdict: { status: string }): "but" | "and" => (verdict.status === "meets" ? "but" : "and");

/**
 * The qualifier shown right after the verdict's badge, on its line: " — but …" after "meets the duty", " — and …" after
 * any other verdict; "but NPSH not checked: …" after a pass whose NPSH is unknown; null where NPSH says nothing against it.
 */
export function verdictNpshNote(verdict: VerdictLike, n: NpshJudgement | null | undefined): string | null {
  if (!verdict) return null;
  const against = againstThis(verdict, n);
  return against ? `${againstWord(verdict)} ${against}` : null;
}

/** The chart label's short form: ", but NPSH cavitation risk at …" / ", and NPSH low margin at …" / ", but NPSH not checked" ("" where NPSH says nothing against it). */
export function verdictNpshShort(verdict: VerdictLike, n: NpshJudgement | null | undefined): string {
  if (!verdict || !againstThis(verdict, n)) return "";
  if (n!.status === "unknown") return `, ${againstWord(verdict)} NPSH not checked`;
  return `, ${againstWord(verdict)} NPSH ${n!.status === "cavitation-risk" ? "cavitation risk" : "low margin"} at ${n!.at}`;
}
