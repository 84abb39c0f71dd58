// NPSH at the steps of a duty cycle where pumps in parallel staged by demand (engine dutyStaging.ts) run fewer than all
// duty pumps. Each running pump then takes the share Q/k of the step's flow Q, further out on its curve than Q/N, where it
// needs more NPSH; the suction still carries the step's whole flow Q. Judged by the rule the candidate's own NPSH is
// judged by (engine figures.ts `npshStatus`, common practice): NPSHa / NPSHr at least the system's wanted margin ratio;
// below 1, or NPSHa at or below zero whatever the pump, a cavitation risk. Pure. Units: SI (m³/s, m, Pa).
import { markNeverRun } from "~/engine/cycleTotals";
import {
  COUNTED_STEP_STATUSES,
  npshAvailable,
  npshMarginRatio,
  npshrAt,
  npshStatus,
  suctionLoss,
  type DutyCycleResult,
  type EngineWarning,
  type PreparedSystem,
  type PumpCurve,
} from "~/engine";
import { fmtPct, qt, qtAboveZero, qtExact } from "~/engine/quantityText";
import { npshRatioText } from "~/engine/npshRatio";
import { npshrGapClauses, npshrPublished, type NpshrPublished } from "./npshr-reach";

/** The rule in words, with the wanted ratio (dimensionless), as each warning states it. */
export const stagedNpshRule = (wanted: number): string =>
  `common practice: NPSHa / NPSHr at least the wanted ${wanted}; below 1, or NPSHa at or below zero whatever the pump, a cavitation risk`;

/** A staged step's NPSH warning with what it found (`npshStatus`; absent in cycles frozen before it was kept, and on "not judged"). */
export type StagedNpshWarning = EngineWarning & { npshStatus?: "cavitation-risk" | "low-margin" };

export type StagedNpshInput = {
  cycle: Pick<DutyCycleResult, "mode" | "steps">;
  /** ONE pump's curve at the speed the cycle's speed ratios are fractions of (the one the staged cycle ran on), with its NPSHr column where published. */
  pumpCurve: PumpCurve;
  /** The system the cycle runs on: its suction runs (loss at the step's flow, aged pipe: the lower NPSHa, as the band's demanding corners) and liquid. */
  prepared: PreparedSystem;
  /** Suction surface pressure, Pa absolute, and static suction head, m (as the candidate's NPSHa takes them, hydraulics.ts). */
  suction: { surfacePressure: number; staticHead: number };
  /** The system's wanted NPSHa / NPSHr (`npshMargin`, dimensionless). */
  requiredMargin: number;
  /**
   * The NPSHr one pump's curve publishes, at `pumpCurve`'s speed (the candidate's judgement's, cycle-curve.ts
   * `npshrOnCycle`): where a step's share has none, the words say where the NPSHr curve stops, or that it publishes one
   * point only, as the verdict's line does (npshr-reach.ts). Null: none published; absent: read off `pumpCurve`'s points.
   */
  npshrPublished?: NpshrPublished | null;
};

/**
 * What one pump's curve publishes at a step run at `speed` × the curve's speed, k pumps running: its flows × speed and its
 * one NPSHr × speed² (affinity laws, Q ∝ N and NPSHr ∝ N², as the step's NPSHr is read), the words' count k.
 */
function publishedAtStep(pub: NpshrPublished | null, speed: number, k: number): NpshrPublished | null {
  if (pub == null) return null;
  return { from: pub.from * speed, to: pub.to * speed, points: pub.points, single: pub.single == null ? null : pub.single * speed * speed, pumps: k };
}

/**
 * Warnings at each counted step where fewer than all duty pumps run (`parameter` "profile[i]", shown at the step): a low
 * margin or a cavitation risk with NPSHa, NPSHr, their ratio and the rule; "not judged" where the curve has no NPSHr at
 * one pump's share, saying where the NPSHr curve stops with one pump's flow ("not judged: the NPSHr curve ends at 30.0 m³/h,
 * and the pump runs past it at 36.0 m³/h"; npshr-reach.ts, as the verdict's line). Under a drive one pump's NPSHr is taken at the step's speed by the affinity laws (NPSHr ∝ N², as the
 * engine's `scaleBySpeed` takes the NPSHr column): s² · NPSHr(share / s). No warning where the margin is met. A step of
 * 0 h a year is judged too, its warning marked "(0 h a year: information only)" as every note at such a step
 * (engine `markNeverRun`); it qualifies no verdict (verdict-staged-npsh.ts).
 */
export function stagedNpshWarnings(input: StagedNpshInput): StagedNpshWarning[] {
  const out: StagedNpshWarning[] = [];
  const fluid = input.prepared.fluid;
  const wanted = input.requiredMargin;
  const published = input.npshrPublished !== undefined ? input.npshrPublished : npshrPublished(input.pumpCurve.points, 1);
  input.cycle.steps.forEach((s, i) => {
    const k = s.pumpsRunning;
    const n = s.dutyPumps;
    if (k == null || n == null || !(k >= 1) || !(k < n) || !(COUNTED_STEP_STATUSES as readonly string[]).includes(s.status) || !(s.flow > 0)) return;
    const share = s.flow / k;
    const speed = input.cycle.mode === "fixed-speed" ? 1 : (s.speedRatio ?? 1);
    const atFull = npshrAt(input.pumpCurve, share / speed);
    const nr = atFull == null ? null : atFull * speed * speed;
    const na = npshAvailable({ surfacePressure: input.suction.surfacePressure, vaporPressure: fluid.vaporPressure, density: fluid.density, staticSuctionHead: input.suction.staticHead, suctionLoss: suctionLoss(input.prepared, s.flow, "aged").headLoss });
    const where = `NPSH at ${Math.round(s.flowFraction * 100)} % flow, ${k} of ${n} pumps running: each takes ${qt("flow", share)} of the step's ${qt("flow", s.flow)}, further out on its curve than with all ${n} running (${qt("flow", s.flow / n)} each)`;
    const npsha = `NPSHa ${qtAboveZero("head", na, [nr])} at the step's whole flow through the suction (aged pipe, the lower NPSHa)`;
    const npshr = `NPSHr ${nr == null ? "" : qtExact("head", nr, [na])} of one pump at its share${speed !== 1 ? ` at ${fmtPct(speed)} speed (NPSHr ∝ N², affinity laws)` : ""}`;
    if (!(na > 0)) {
      out.push({ code: "staged-npsh", parameter: `profile[${i}]`, npshStatus: "cavitation-risk", message: `${where}; ${npsha}, at or below zero: cavitation risk whatever the pump (${stagedNpshRule(wanted)})` });
      return;
    }
    // The engine's ratio (figures.ts `npshMarginRatio`): none where NPSHr × speed² reads 0 or so small that NPSHa / NPSHr
    // is no finite number (a cell of 5e-324 m: Infinity threw the whole cycle at `npshStatus`), as the operating point's.
    const ratio = nr == null ? null : npshMarginRatio(na, nr);
    if (nr == null || ratio == null) {
      // Where the NPSHr curve stops and one pump's share beside it, the verdict's line's words (npshr-reach.ts).
      const why = nr == null
        ? `${npshrGapClauses(publishedAtStep(published, speed, k), [{ at: "", flow: s.flow, pumpFlow: share }], false).join("; ")}${speed !== 1 ? ` (its flows at ${fmtPct(speed)} speed, Q ∝ N, affinity laws)` : ""}`
        : `one pump's NPSHr at its share, ${qt("head", nr)}, is too small to judge NPSHa against (NPSHa / NPSHr is no finite number)`;
      out.push({ code: "staged-npsh-not-judged", parameter: `profile[${i}]`, message: `${where}; not judged: ${why} (${npsha}; ${stagedNpshRule(wanted)})` });
      return;
    }
    const status = npshStatus(ratio, wanted);
    if (status === "ok") return;
    const verdict = status === "cavitation-risk" ? "below 1, NPSHa below NPSHr: cavitation risk" : `below the wanted ${wanted}: low NPSH margin`;
    out.push({ code: "staged-npsh", parameter: `profile[${i}]`, npshStatus: status === "cavitation-risk" ? "cavitation-risk" : "low-margin", message: `${where}; ${npsha} / ${npshr} = ${npshRatioText(ratio, wanted)}, ${verdict} (${stagedNpshRule(wanted)})` });
  });
  markNeverRun(input.cycle.steps, out);
  return out;
}
