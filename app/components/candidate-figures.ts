// The candidates table's figures that sit beside a status they decide (POR, NPSH), as text in the
// reader's units: each never reads as the limit it was judged against (DEVELOPERS.md, "What the
// product concludes at the edges"). Pure; used by CandidateTable in ./CandidateTable.tsx and the search page's rows.
import { DEFAULT_FLOW_TOLERANCE, POR_FRACTION, type FlowTolerance } from "~/engine";
import { fmtPct, fmtPctExact, fmtQAboveZero, fmtQExact, type UnitChoice } from "~/lib/shared/units";
import { marginRatioText } from "~/lib/projects/npsh-ratio";
import type { NpshJudgement } from "~/lib/projects/candidate-judgement";

/**
 * A flow as a percentage of BEP flow: whole percent, with the decimals it needs outside the POR not to read as its end ("69.96 %", not "70 %").
 * @param ratio Q / Q_BEP (dimensionless)
 * @param inPor inside the preferred operating region (70–120 % of BEP flow), null when not known
 */
export function bepPercentText(ratio: number, inPor: boolean | null | undefined): string {
  return inPor === false ? fmtPctExact(ratio, [POR_FRACTION.min, POR_FRACTION.max], 0) : fmtPct(ratio, 0);
}

/**
 * The motor's load at the operating point (shaft power / rating), whole percent with the decimals it needs not to read as
 * 100 % or as the service factor beside which the motor is judged ("100.4 %", not "100 %").
 * @param load shaft power / motor rating (dimensionless)
 * @param serviceFactor the motor's service factor (dimensionless), null when not known
 */
export function loadText(load: number | null | undefined, serviceFactor: number | null): string {
  return fmtPctExact(load, serviceFactor != null && serviceFactor !== 1 ? [1, serviceFactor] : [1], 0);
}

/** The preferred operating region as the verdict beside it names it: "POR 70–120 %" (engine POR_FRACTION, ANSI/HI 9.6.3). */
export const POR_TEXT = `POR ${Math.round(POR_FRACTION.min * 100)}–${Math.round(POR_FRACTION.max * 100)} %`;

/**
 * The operating flow as a share of BEP flow, e.g. "69.96 % of BEP flow — outside POR 70–120 %" (not "70 %"): the region's
 * limits on the verdict's line, as the search row writes them (a tooltip does not print).
 * @param ratio Q / Q_BEP (dimensionless)
 * @param inPor inside the preferred operating region (70–120 % of BEP flow), null when not known
 */
export function bepPositionText(ratio: number, inPor: boolean | null | undefined): string {
  return `${bepPercentText(ratio, inPor)} of BEP flow${inPor === false ? ` — outside ${POR_TEXT}` : ""}`;
}

/**
 * An NPSH status with the rule that decided it, for the table's cells, which print (their tooltips do not): "ok: at least
 * the wanted 1.2", "low-margin: below the wanted 1.2", "cavitation-risk: below 1", "cavitation-risk: NPSHa at or below zero";
 * the status alone where the selection was frozen before the wanted ratio was kept, and "unknown" as it is.
 * @param status the NPSH status ("ok", "low-margin", "cavitation-risk", "unknown")
 * @param requiredMargin the wanted NPSHa / NPSHr (dimensionless; null or absent where not kept)
 * @param atOrBelowZero NPSHa at or below zero decided it (m), whatever NPSHr
 */
export function npshStatusText(status: string, requiredMargin: number | null | undefined, atOrBelowZero = false): string {
  if (status === "cavitation-risk") return `${status}: ${atOrBelowZero ? "NPSHa at or below zero" : "below 1"}`;
  const wanted = requiredMargin != null && Number.isFinite(requiredMargin) ? String(requiredMargin) : null; // as the verdict's qualifier writes it (verdict-npsh.ts)
  if (wanted == null) return status;
  if (status === "ok") return `${status}: at least the wanted ${wanted}`;
  if (status === "low-margin") return `${status}: below the wanted ${wanted}`;
  return status;
}

/**
 * NPSHa and NPSHr side by side, each with the decimals it needs not to read as the other ("3.998 m / 4.00 m"); NPSHa above
 * zero and below 0.001 in the unit shown "< 0.001 m" (`fmtQAboveZero`), never an exponent.
 * @param units the reader's units
 * @param available NPSHa, m
 * @param required NPSHr, m (null when the curve has none there)
 */
export function npshPairText(units: UnitChoice, available: number, required: number | null | undefined): string {
  return `${fmtQAboveZero(units, "head", available, [required])} / ${fmtQExact(units, "head", required, [available], true)}`;
}

/**
 * An NPSH margin ratio NPSHa / NPSHr that never reads as 1 (cavitation) or the wanted ratio it is judged against ("1.0996",
 * not "1.10"); above zero and below 0.01, "< 0.01" (npsh-ratio.ts `marginRatioText`, the verdict's qualifier's too).
 * @param ratio NPSHa / NPSHr (dimensionless)
 * @param requiredMargin the wanted ratio (dimensionless; absent in selections frozen before it was kept: then only 1)
 */
export const npshMarginText = marginRatioText;

/**
 * Where the NPSH status over the band is decided: "lowest 0.96 at least lift, aged pipe", or where NPSHa at or below
 * zero decides without NPSHr, "NPSHa -1.18 m at least lift, aged pipe" (never read as zero).
 * @param units the reader's units
 * @param n the judgement (`npshOverBand`): ratio (dimensionless) or NPSHa (m) where it is decided
 */
export function npshLowestText(units: UnitChoice, n: NpshJudgement): string {
  return (n.marginRatio == null || atOrBelowZero(n)) && n.available != null
    ? `NPSHa ${fmtQAboveZero(units, "head", n.available)} at ${n.at}`
    : `lowest ${npshMarginText(n.marginRatio, n.requiredMargin)} at ${n.at}`;
}

/** NPSHa at or below zero there (m): its ratio to NPSHr means nothing, NPSHa is shown instead (selections frozen before kept such ratios). */
const atOrBelowZero = (p: { available?: number | null }): boolean => p.available != null && p.available <= 0;

/**
 * The points the NPSH rule names but could not judge, with why: "not judged at least lift, new pipe (no operating point)";
 * null when every point was judged (or the selection was frozen before it was kept). They leave the status unknown.
 * @param n the judgement (`npshOverBand`)
 */
export function npshUnjudgedText(n: NpshJudgement | null | undefined): string | null {
  const u = n?.unjudged ?? [];
  return u.length ? `not judged at ${u.map((p) => `${p.at} (${p.why})`).join("; ")}` : null;
}

/**
 * Every point NPSH was judged at, for the cell's title: "design point 1.63; least lift, new pipe 1.48; …"
 * (NPSHa in the reader's units where NPSHr is unknown); empty for selections frozen before the corners were kept.
 * @param units the reader's units
 * @param n the judgement (`npshOverBand`)
 */
export function npshPointsText(units: UnitChoice, n: NpshJudgement): string {
  return (n.judgedAt ?? [])
    .map((p) => `${p.at} ${p.marginRatio != null && !atOrBelowZero(p) ? npshMarginText(p.marginRatio, n.requiredMargin) : p.available != null ? `NPSHa ${fmtQAboveZero(units, "head", p.available)}` : "—"}`)
    .join("; ");
}

/**
 * The margin ratios over every point NPSH was judged at (the design point and the band's corners), lowest – highest:
 * the range beside "lowest … at <corner>" always holds that lowest value. Selections frozen before the corners were
 * kept have no `judgedAt`: null, and the table shows the band's two edges as before.
 * @param n the judgement (`npshOverBand`), ratios dimensionless
 */
export function npshJudgedRange(n: NpshJudgement | null | undefined): string | null {
  const ratios = (n?.judgedAt ?? []).filter((p) => !atOrBelowZero(p)).map((p) => p.marginRatio).filter((x): x is number => x != null && Number.isFinite(x));
  if (ratios.length === 0) return null;
  const [lo, hi] = [Math.min(...ratios), Math.max(...ratios)];
  const [a, b] = [npshMarginText(lo, n?.requiredMargin), npshMarginText(hi, n?.requiredMargin)];
  return a === b ? a : `${a} – ${b}`;
}

/**
 * The flows the verdict judges a band edge's flow against (engine verdict.ts): duty × (1 − minus), the duty itself and
 * duty × (1 + plus), m³/s; none without a duty.
 * @param dutyFlow the duty flow, m³/s (null: no duty set)
 * @param tolerance the duty flow tolerance (fractions; absent: the default −0 %/+10 %)
 */
export function dutyFlowLimits(dutyFlow: number | null | undefined, tolerance: FlowTolerance | undefined): number[] {
  if (dutyFlow == null || !Number.isFinite(dutyFlow)) return [];
  const t = tolerance ?? DEFAULT_FLOW_TOLERANCE;
  return [dutyFlow * (1 - t.minus), dutyFlow, dutyFlow * (1 + t.plus)];
}

/**
 * A band edge's operating flow beside the verdict it decides: with the decimals it needs not to read as the duty or a
 * limit of its tolerance ("42.35 m³/h" beside "short of the duty" of 42.36 m³/h, never "42.4 m³/h" as the duty prints).
 * @param units the reader's units
 * @param flow the edge's operating flow, m³/s (null: no operating point there)
 * @param limits `dutyFlowLimits`, m³/s
 */
export const bandFlowText = (units: UnitChoice, flow: number | null | undefined, limits: readonly number[]): string => fmtQExact(units, "flow", flow, limits);

/**
 * The duty flow beside the band's flows judged against it (the report's "Duty point"): with the decimals it needs not to
 * read as any of them, as a limit (no trailing zeros gained for this).
 * @param units the reader's units
 * @param dutyFlow the duty flow, m³/s
 * @param bandFlows the band edges' operating flows, m³/s
 */
export const dutyFlowText = (units: UnitChoice, dutyFlow: number, bandFlows: readonly (number | null | undefined)[]): string => fmtQExact(units, "flow", dutyFlow, bandFlows, true);
