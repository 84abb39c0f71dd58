/**
 * A duty-cycle step judged against the pump's best efficiency point (BEP): where a step with hours runs outside the
 * preferred operating region (POR, 70–120 % of BEP flow: ANSI/HI 9.6.3, from memory; pumpCurve.ts `POR_FRACTION`), a note
 * at the step with its flow as a percentage of the BEP flow at the speed it runs at, its hours and the rule. Below
 * `STEP_MIN_FLOW_FRACTION` (50 % of BEP flow) the wording is stronger: a common lower bound for continuous running, where
 * a typical minimum continuous stable flow lies (common practice, from memory); the note says whether the maker's own
 * minimum flow is recorded for the curve, and that the step runs at or above it where it is.
 * A step below the maker's minimum continuous flow (`makerMinFlow`, one pump's, from the curve set's library: the maker's
 * figure) gets the stronger note `step-below-maker-min-flow` instead, naming the step's flow and the maker's figure: the
 * maker does not allow continuous running there. On a drive the figure scales with the step's speed as the BEP flow does
 * (Q ∝ N, affinity laws: common practice, from memory — the maker's data may say otherwise); below it by more than 1 part
 * in 10⁸ (quantityText.ts `LIMIT_ROUNDING`, the verdict's too: a flow computed a rounding error under the figure is at it,
 * and one further under prints apart from it). It needs no BEP.
 * Notes, never failures (and at a step of 0 h, information only): hours off the BEP wear a pump (recirculation, heating,
 * vibration, bearing and seal life), they do not stop it meeting the step; the candidate's verdict judges its duty against
 * the maker's figure.
 * The BEP flow at a speed ratio n follows the affinity laws: Q_BEP(n) = Q_BEP × n (Q ∝ N), so a drive that slows the pump
 * on a friction-only system keeps it near its BEP while a throttled fixed-speed pump moves left of it.
 * Pumps in parallel: each running pump takes its share Q/k of the step's flow Q, and the ratio is one pump's (the curve of
 * k pumps has k × one pump's BEP flow, combinePumps keeping efficiency); in series each pump passes the whole Q.
 * A curve with no BEP (`bep-not-published`) gives no note: the design point already says why. Units: SI (m³/s, h).
 */
import type { EngineWarning } from "./errors.ts";
import { POR_FRACTION, type PumpCurve } from "./pumpCurve.ts";
import { fmtPct, fmtPctExact, insideEnds, LIMIT_ROUNDING, pastBelow, qt, qtPair } from "./quantityText.ts";

/** Below this fraction of BEP flow: a common lower bound for continuous running (common practice, from memory). */
export const STEP_MIN_FLOW_FRACTION = 0.5;

/** The rule in words, as each note states it. */
export const STEP_POR_RULE = `preferred operating region ${POR_FRACTION.min * 100}–${POR_FRACTION.max * 100} % of BEP flow (ANSI/HI 9.6.3, from memory)`;
export const STEP_MIN_FLOW_RULE = `below ${STEP_MIN_FLOW_FRACTION * 100} % of BEP flow, a common lower bound for continuous running where a pump's minimum continuous stable flow typically lies (common practice, from memory)`;
/** The rule of the note at a step below the maker's figure (the scaling under a drive is said where it applies). */
export const STEP_MAKER_MIN_FLOW_RULE = "the maker does not allow continuous running below its minimum continuous flow";

export interface StepPorInput {
  /** The curve the cycle runs on (all pumps counted in it), at the speed its speed ratios are fractions of. */
  curve: PumpCurve;
  /** The step's index in the profile (the note's `parameter`, "profile[i]"). */
  index: number;
  /** The step's flow as a fraction of the design flow, and its hours a year. */
  flowFraction: number;
  hours: number;
  /** The step's flow through the curve, m³/s. */
  flow: number;
  /** The speed ratio the BEP flow scales with (a drive's step speed; 1 at fixed speed, where the curve is as run). */
  speed: number;
  /** Whether the step runs on a drive (its speed named in the note). */
  vfd: boolean;
  /** Pumps counted in the curve (count, ≥ 1). */
  units: number;
  /** How they share the flow: in parallel each takes Q/units, in series each passes Q; absent with one pump. */
  arrangement?: "parallel" | "series";
  /**
   * The maker's minimum continuous flow of ONE pump on the curve as given (at its speed: × `speed` under a drive), m³/s;
   * null or absent: none recorded. Judged where one pump's share is known (one pump, or an arrangement given).
   */
  makerMinFlow?: number | null;
}

/**
 * A step's note with the ratio it states: one pump's flow / its BEP flow at the speed it runs at (dimensionless); below 50 %,
 * the maker's minimum flow it was read beside, at the step's speed (m³/s; null: none recorded).
 */
export type StepPorWarning = EngineWarning & { bepRatio: number; makerMinFlow?: number | null; pumpFlow?: number; bepFlow?: number };
/**
 * The note at a step below the maker's minimum continuous flow, with its numbers: one pump's flow and the figure at the
 * step's speed (m³/s). `pumpFlow` and `bepFlow` (one pump's, m³/s) are kept on both notes for the life-cycle cost's line
 * (lib/projects/lcc-range-note.ts); absent in cycles frozen before.
 */
export type StepMakerMinWarning = EngineWarning & { pumpFlow: number; makerMinFlow: number };

/** The codes of the notes against the BEP `stepPorWarning` gives (each with its `bepRatio`). */
export const STEP_POR_CODES = ["step-outside-por", "step-below-min-flow"] as const;

/** The code of the note at a step below the maker's minimum continuous flow: one pump's flow and the figure (no ratio). */
export const STEP_BELOW_MAKER_MIN_FLOW = "step-below-maker-min-flow";

/**
 * The note at a step below the maker's minimum continuous flow, else at a step that runs outside the POR, or null: inside
 * it (70–120 % inclusive, as the design point's `inPor`), no flow, or no BEP on the curve (and no maker's figure above the
 * step's flow). A step of 0 h a year gets its note too, which the cycle marks as information only (cycleTotals.ts
 * `markNeverRun`), as every other note at such a step (it gave none: two rules for one step).
 * @param input see {@link StepPorInput} (SI: m³/s, h; ratios dimensionless)
 */
export function stepPorWarning(input: StepPorInput): StepPorWarning | StepMakerMinWarning | null {
  const { curve, flow, speed, hours, units } = input;
  if (!(hours >= 0) || !(flow > 0) || !(speed > 0)) return null;
  // One pump's flow and BEP flow at this speed: in parallel the curve's are the pumps' together (k × one's).
  const per = input.arrangement === "parallel" ? units : 1;
  const share = flow / per;
  const head = (q: string, tail: string, total = qtPair("flow", flow, share)[0]) => {
    const who =
      input.arrangement === "parallel" && units > 1 ? `each of the ${units} pumps running takes its share, ${q} of the step's ${total}${tail}`
      : input.arrangement === "parallel" ? `the one pump running takes the step's whole ${q}${tail}`
      : input.arrangement === "series" && units > 1 ? `each of the ${units} pumps in series passes the step's ${q}${tail}`
      : units > 1 ? `the ${units} pumps together run at ${q}${tail.replace(/ of its /, " of their ")}`
      : `the pump runs at ${q}${tail}`;
    return `at ${Math.round(input.flowFraction * 100)} % flow ${who}, for ${Number(hours.toFixed(2))} h a year`;
  };
  const parameter = `profile[${input.index}]`;
  // The maker's figure at this speed (affinity laws: Q ∝ N), where one pump's share is known.
  const maker = input.makerMinFlow != null && input.makerMinFlow > 0 && (units === 1 || input.arrangement) ? input.makerMinFlow : null;
  const makerAt = maker === null ? null : maker * speed;
  const makerWords = (qm: string) => (input.vfd && speed !== 1 ? `${qm} at ${fmtPct(speed)} speed (${qt("flow", maker!)} at the curve's speed × ${fmtPct(speed)}, affinity laws: common practice, from memory — the maker's data may say otherwise)` : qm);
  if (makerAt !== null && share < makerAt * (1 - LIMIT_ROUNDING)) {
    const [q, qm] = qtPair("flow", share, makerAt);
    return { code: STEP_BELOW_MAKER_MIN_FLOW, parameter, pumpFlow: share, makerMinFlow: makerAt, message: `${head(q, "")}: below the maker's minimum continuous flow, ${makerWords(qm)} — ${STEP_MAKER_MIN_FLOW_RULE}; expect recirculation in the impeller, heating of the liquid, vibration and bearing and seal damage — pumps staged, a smaller pump for these hours or a minimum-flow bypass (a note at the step; the verdict judges the duty against the same figure)` };
  }
  const bep = curve.bep;
  if (!bep) return null;
  const bepFlow = (bep.flow / per) * speed; // affinity laws: Q_BEP ∝ N
  const ratio = share / bepFlow;
  if (insideEnds(ratio, POR_FRACTION.min, POR_FRACTION.max)) return null; // each end to 1 part in 10⁸, as the verdict's POR
  const low = pastBelow(ratio, STEP_MIN_FLOW_FRACTION);
  const pct = fmtPctExact(ratio, [POR_FRACTION.min, POR_FRACTION.max, STEP_MIN_FLOW_FRACTION], 0);
  const [q, qb] = qtPair("flow", share, bepFlow);
  const bepWords = input.vfd ? `its BEP flow at ${fmtPct(speed)} speed, ${qb} (${qtPair("flow", bep.flow / per, share)[0]} at the curve's speed × ${fmtPct(speed)}, affinity laws)` : `its BEP flow, ${qb}`;
  const at = head(q, `, ${pct} of ${bepWords}`);
  if (low) {
    // The maker's own figure where it is recorded (the step at or above it: above), else that none is.
    const makerSaid = makerAt !== null ? `, though at or above the maker's minimum continuous flow, ${makerWords(qtPair("flow", makerAt, share)[0])},` : "; no maker's minimum flow is recorded for this curve (check the maker's data sheet);";
    return { code: "step-below-min-flow", parameter, bepRatio: ratio, makerMinFlow: makerAt, pumpFlow: share, bepFlow, message: `${at}: ${STEP_MIN_FLOW_RULE}${makerSaid} and outside the ${STEP_POR_RULE}; expect recirculation in the impeller, heating of the liquid, vibration and shorter bearing and seal life — a smaller pump, pumps staged, a drive or a minimum-flow bypass for these hours (a note, not a failure)` };
  }
  const side = ratio < POR_FRACTION.min ? "left of (below)" : "right of (above)";
  const why = ratio < POR_FRACTION.min ? "more vibration and radial load, shorter bearing and seal life the longer it runs there" : "more NPSH needed, more vibration and radial load, shorter bearing and seal life the longer it runs there";
  return { code: "step-outside-por", parameter, bepRatio: ratio, pumpFlow: share, bepFlow, message: `${at}: ${side} the ${STEP_POR_RULE}; ${why} (a note, not a failure)` };
}
