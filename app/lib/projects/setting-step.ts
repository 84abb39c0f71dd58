// The speed or impeller a site can set and the page shows, as ONE rule for both: a speed in whole rpm, a trimmed
// impeller in whole mm, and a ratio in 0.1 % where the curve names no speed (or no impeller diameter). A ratio solved
// to the duty is rounded UP to the next step — more speed or a larger impeller gives more flow and head, so the duty
// is kept — and never past the published curve (ratio 1: a larger impeller or a faster speed than the curve's is not
// this curve); the verdict and every figure are then worked out at the rounded setting (candidate-solve.ts), so the
// setting shown is the setting judged. A value off its step (a ratio typed as a percentage, a selection frozen before
// this rule) is shown with one more decimal, never rounded to a step it is not on. Pure: hydraulics and the pages.
// In US units: the trim is still set in whole mm (one rule for every reader: a selection's setting and verdict never
// change with the units it is read in), so every text that says it was rounded to "the next whole mm", and every place
// that gives the setting a site turns the impeller to, writes the diameter in the reader's unit with the whole mm beside
// it — "Ø6.65 in [169 mm], the next whole mm up" — through one token (`qtAlsoIn`) that every surface renders alike: the
// candidates table's Adjustment and Notes, the report, the oversized verdict's savings, the search row's How (whose rule,
// its title, says the rounding), the field page's Impeller (the report's Adjustment, read on site), CSV and JSON (SI:
// "Ø169 mm" alone) and the API (in the caller's units). A chart label names neither and reads the reader's unit alone.

import { qtAlsoIn, qtExact } from "~/engine/quantityText";

type Method = "speed" | "trim";
/** The published curve's speed (rpm) and impeller diameter (m), null when it names none. */
export type Published = { speed: number | null; impellerDiameter: number | null };

/** Whole rpm (common practice: a drive's speed set point is given in whole rpm). */
export const SPEED_STEP_RPM = 1;
/** Whole mm, m (common practice: an impeller is turned down to a whole millimetre). */
export const DIAMETER_STEP_M = 0.001;
/** 0.1 % of the curve's speed or impeller, where it names none (the percentage the page shows). */
export const RATIO_STEP = 0.001;
/** A value within this share of a step of a step is on it (float noise of a solve, dimensionless). */
const ON_STEP = 1e-6;

type Step = { base: number; step: number; kind: "rpm" | "mm" | "%" };

/** What a setting is made in: rpm of the curve's speed, m of its impeller, or the ratio itself. */
function stepOf(method: Method, pub: Published): Step {
  if (method === "speed" && pub.speed != null && pub.speed > 0) return { base: pub.speed, step: SPEED_STEP_RPM, kind: "rpm" };
  if (method === "trim" && pub.impellerDiameter != null && pub.impellerDiameter > 0) return { base: pub.impellerDiameter, step: DIAMETER_STEP_M, kind: "mm" };
  return { base: 1, step: RATIO_STEP, kind: "%" };
}

/** The ratio set: `solved` rounded up to the next step, capped at the published curve (ratio 1: then `capped`). */
export type RoundedSetting = { ratio: number; solved: number; capped: boolean };

/**
 * A solved ratio rounded up to what a site sets: the next whole rpm, whole mm or 0.1 %; at most the published curve.
 * @param method speed or trim
 * @param solved the ratio solved to the duty (dimensionless)
 * @param pub the published curve's speed (rpm) and impeller (m)
 */
export function roundUpSetting(method: Method, solved: number, pub: Published): RoundedSetting {
  const { base, step } = stepOf(method, pub);
  const steps = (solved * base) / step;
  const up = Math.ceil(steps - ON_STEP) * step;
  if (up >= base * (1 - 1e-12)) return { ratio: 1, solved, capped: up > base * (1 + 1e-12) };
  return { ratio: up / base, solved, capped: false };
}

const onStep = (value: number, step: number) => Math.abs(value / step - Math.round(value / step)) < ON_STEP;

/**
 * The setting in the words the page uses: "1645 rpm", "Ø181 mm", "56.8 %" — the step's precision, one decimal more
 * when the value is off its step ("1644.3 rpm", "Ø181.4 mm", "56.75 %").
 * @param method speed or trim
 * @param ratio the ratio (dimensionless)
 * @param pub the published curve's speed (rpm) and impeller (m)
 */
export function settingText(method: Method, ratio: number, pub: Published): string {
  const { base, step, kind } = stepOf(method, pub);
  const value = ratio * base;
  const extra = onStep(value, step) ? 0 : 1;
  // The shown number carries float noise (0.85 × 295 mm = 250.74999…): read to 12 significant digits first, so a half-way value rounds as written.
  const fixed = (x: number, d: number) => Number(x.toPrecision(12)).toFixed(d);
  if (kind === "rpm") return `${fixed(value, extra)} rpm`;
  if (kind === "mm") return `Ø${fixed(value * 1000, extra)} mm`;
  return `${fixed(value * 100, 1 + extra)} %`;
}

/**
 * The setting for a text rendered in the reader's units: a trimmed impeller as a diameter quantity token (millimetres or
 * inches as the reader chose), with the decimals that keep it apart from the whole-mm steps beside it ("Ø186.3 mm" off its
 * step, "Ø187 mm" or "Ø7.36 in" on it); a speed or a ratio as {@link settingText} (rpm and % read the same in every unit).
 * @param method speed or trim
 * @param ratio the ratio (dimensionless)
 * @param pub the published curve's speed (rpm) and impeller (m)
 * @param stepToo for a text that names the whole-mm step or gives the setting a site makes (the search row's How, the field
 *   page's Impeller): the whole mm beside a diameter read in another unit ("Ø7.36 in [187 mm]")
 */
export function settingToken(method: Method, ratio: number, pub: Published, stepToo = false): string {
  const { base, step, kind } = stepOf(method, pub);
  if (kind !== "mm") return settingText(method, ratio, pub);
  const value = Number((ratio * base).toPrecision(12));
  const below = Math.floor(value / step + ON_STEP) * step;
  const neighbours = onStep(value, step) ? [value - step, value + step] : [below, below + step];
  return `Ø${stepToo ? qtAlsoIn("diameter", value, "mm", neighbours) : qtExact("diameter", value, neighbours)}`;
}

const STEP_WORDS = { rpm: "the next whole rpm", mm: "the next whole mm", "%": "the next 0.1 %" } as const;

/**
 * How the solved setting became the one set, in words with both numbers: "solved 1644.3 rpm, set at 1645 rpm: rounded
 * up to the next whole rpm so the duty is kept", or, capped, why the published curve is set.
 */
export function roundingNote(method: Method, r: RoundedSetting, pub: Published): string {
  const { kind } = stepOf(method, pub);
  const solved = settingToken(method, r.solved, pub, true), set = settingToken(method, r.ratio, pub, true);
  const what = method === "speed" ? (kind === "rpm" ? "speed" : "speed ratio") : kind === "mm" ? "impeller" : "trim ratio";
  if (r.capped) return `solved ${what} ${solved}; rounding up to ${STEP_WORDS[kind]} would pass the published curve's ${set}, so it is set and judged at ${set}`;
  if (r.ratio === r.solved) return `solved ${what} ${solved}, on a step already: set and judged at ${set}`;
  return `solved ${what} ${solved}, set and judged at ${set}: rounded up to ${STEP_WORDS[kind]} (what a site sets) so the duty is kept`;
}

/** The published speed and impeller of an evaluated candidate, from its setting in use and the ratio (null when not known). */
export function publishedOf(method: Method, ratio: number, inUse: { speed: number | null; diameter: number | null }): Published {
  const back = (x: number | null, scaled: boolean) => (x == null ? null : scaled && ratio > 0 ? x / ratio : x);
  return { speed: back(inUse.speed, method === "speed"), impellerDiameter: back(inUse.diameter, method === "trim") };
}
