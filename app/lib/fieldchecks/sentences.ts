// The check's sentences built from its numbers: the readings' uncertainty as the marginal sentence states it, the
// marginal verdict's sentence, and the delivered duty point with the verdict's rule and numbers for the e-mail. Pure.
import { qt } from "~/engine/quantityText";
import { pctAsTyped } from "../shared/format";
import type { Readings } from "./form";
import { MARGINAL_NOTE, type CheckResult } from "./result";
import { PUBLISHED_PART } from "./curve-ends";
import { crossSummary } from "./cross";
import { powerGradeSummary } from "./power-grade";

/**
 * The readings' uncertainty as the marginal sentence states it, an accuracy not given said so (never as ±0): "flow ± 2 %,
 * head ± 0.36 m", "flow as read: the meter's accuracy not given, head ± 0.25 m (the discharge gauge's accuracy not given)",
 * "…, head as read: the gauges' accuracy not given". An entered 0 is stated as given ("flow ± 0 %").
 * @param r the readings (accuracies ± Pa and ± fraction, null when not given)
 * @param headUncertainty the gauges' given accuracies in quadrature over ρ·g, m
 */
export function uncertaintyWords(r: Pick<Readings, "suction" | "discharge" | "flowAccuracy">, headUncertainty: number): string {
  const flow = r.flowAccuracy === null ? "flow as read: the meter's accuracy not given" : `flow ± ${pctAsTyped(r.flowAccuracy)}`;
  const missing = [r.suction.accuracy === null ? "suction" : null, r.discharge.accuracy === null ? "discharge" : null].filter((x) => x !== null);
  const head = missing.length === 2 ? "head as read: the gauges' accuracy not given"
    : `head ± ${qt("head", headUncertainty)}${missing.length ? ` (the ${missing[0]} gauge's accuracy not given)` : ""}`;
  return `${flow}, ${head}`;
}

/**
 * The verdict's sentence for a check marginal as read: the engine's (missed as read), then what meets the grade within the
 * readings' uncertainty (`withinWords`: the uncertainty and the point with their numbers, quantity tokens) and/or within the power reading's
 * accuracy (`powerAccuracy`, a fraction); the engine's alone when neither.
 */
export function marginalMessage(engineMessage: string, withinWords: string | null, powerAccuracy: number | null): string {
  const parts = [
    withinWords ? `the readings' uncertainty ${withinWords}; see the notes on the working)` : null,
    powerAccuracy !== null ? `the power reading's accuracy (±${pctAsTyped(powerAccuracy)}) a lower shaft power meets the grade's power and efficiency limits (see power and efficiency)` : null,
  ].filter((x): x is string => x !== null);
  return parts.length ? `${engineMessage} as read; ${parts.map((x) => `within ${x}`).join("; and ")}` : engineMessage;
}

/** The sentence with the delivered duty point, quantities as tokens (rendered in the reader's units), for the e-mail. */
export function deliveredSentence(r: CheckResult): string {
  const q = r.delivered.flow;
  const src = r.engine.flowSource === "measured" ? "measured" : "inferred from the curve";
  const first = q !== null ? `Delivered ${qt("flow", q)} (${src}) at ${qt("head", r.delivered.head)}` : `Measured head ${qt("head", r.delivered.head)}; flow could not be inferred`;
  const duty = r.duty ? ` (design duty ${qt("flow", r.duty.flow)} at ${qt("head", r.duty.head)})` : "";
  // Off the curve's published flows, judged on the part published: said with the verdict (curve-ends.ts).
  const published = r.warnings.find((w) => w.startsWith(PUBLISHED_PART));
  // The verdict's rule and numbers: each arm of the cross with the curve's value and the grade's allowance (cross.ts).
  const arms = crossSummary(r);
  // A marginal check: the point within the readings' uncertainty that meets the grade, with the uncertainty (evaluate.ts's note).
  const within = r.verdict === "marginal" ? r.warnings.find((w) => w.startsWith(MARGINAL_NOTE)) : undefined;
  return `${first}${duty}. Judged against grade ${r.grade.id}: ${r.verdictText}.${arms ? ` ${arms}` : ""}${within ? ` ${within}` : ""}${published ? ` ${published}` : ""} ${powerGradeSummary(r)}`;
}
