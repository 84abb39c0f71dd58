// The verdict's headline qualified by the maker's minimum continuous flow. Distributors publish a minimum flow with their
// curves (the curve set's `minFlow`, imported from the library's CSV: import/min-flow.ts); a pump whose duty puts it below
// that figure is one the maker does not allow to run there, so the engineer must not select it. The duty verdict (engine
// verdict.ts) judges delivering the duty and never reads it; wherever the verdict is a headline (the candidates table, the
// report, the chart's label, the CSV, the APIs) a duty below the figure qualifies it on the same line, with its rule and
// both numbers, as NPSH and the motor do (verdict-npsh.ts, verdict-motor.ts): a failure to sign, not a note.
// Rule: each running pump takes the duty flow ÷ the duty pumps in parallel (the whole duty alone or in series, standby
// pumps never run); below the maker's figure — as published at the curve's speed and impeller, × the speed or trim ratio
// the candidate runs at (affinity laws, Q ∝ N and Q ∝ D: common practice, from memory; the maker's data may say
// otherwise) — by more than 1 part in 10⁸ (engine quantityText.ts `LIMIT_ROUNDING`: a flow a rounding error under it is at
// it, and a flow further under prints apart from it; at 1 part in 10⁹ a duty 2 parts in 10⁹ under 12 m³/h read
// "3.33333333 L/s < 3.33333333 L/s"), it runs below the maker's minimum flow. A duty-cycle step below it gets its own note
// (engine stepPor.ts), to the same allowance. Pure; quantities as tokens (quantityText.ts).
import { fmtPct, LIMIT_ROUNDING, qt, qtExact, qtLimit } from "~/engine/quantityText";
import { againstWord } from "./verdict-npsh";

type VerdictLike = { status: string } | null | undefined;

/** The maker's minimum flow against one candidate's duty (SI: m³/s; ratios and counts dimensionless). */
export type MinFlowCheck = {
  /** The maker's figure for the curve set as published (its speed and impeller), m³/s. */
  published: number;
  /** How the candidate runs it: as published, or at a speed or trim ratio (`ratio`, 1 as published). */
  method: "none" | "speed" | "trim";
  ratio: number;
  /** One pump's minimum as the candidate runs: published × ratio, m³/s. */
  atPump: number;
  /** The duty flow, m³/s, and the running pumps sharing it (duty pumps in parallel, else 1); null: no duty. */
  dutyFlow: number | null;
  running: number;
  /** The duty each running pump takes, m³/s (null: no duty). */
  dutyPerPump: number | null;
  /** True when `dutyPerPump` is below `atPump` by more than `LIMIT_ROUNDING` (1 part in 10⁸). */
  below: boolean;
};

export const MIN_FLOW_RULE =
  "A pump runs at or above the maker's minimum continuous flow: the duty each running pump takes (duty ÷ duty pumps in parallel) not below the maker's figure, × the speed or trim ratio it runs at (affinity laws, Q ∝ N, Q ∝ D: common practice, from memory)";

/**
 * The check for a curve set with a maker's minimum flow (null without one).
 * @param published the maker's figure as imported, m³/s (null or absent: none recorded)
 * @param dutyFlow the system's duty flow, m³/s (null: no duty, nothing judged)
 * @param adj how the candidate runs: method, arrangement, duty pumps (count)
 * @param ratio the speed or trim ratio every figure is at (dimensionless; 1 as published)
 */
export function minFlowCheck(
  published: number | null | undefined,
  dutyFlow: number | null | undefined,
  adj: { method: "none" | "speed" | "trim"; arrangement: "single" | "parallel" | "series"; dutyPumps: number },
  ratio: number,
): MinFlowCheck | null {
  if (published == null || !(published > 0) || !Number.isFinite(published)) return null;
  const r = adj.method === "none" ? 1 : ratio;
  const atPump = published * r;
  const running = adj.arrangement === "parallel" ? adj.dutyPumps : 1;
  const duty = dutyFlow != null && dutyFlow > 0 ? dutyFlow : null;
  const dutyPerPump = duty === null ? null : duty / running;
  return { published, method: adj.method, ratio: r, atPump, dutyFlow: duty, running, dutyPerPump, below: dutyPerPump !== null && dutyPerPump < atPump * (1 - LIMIT_ROUNDING) };
}

/** Read from a frozen result: a check with its numbers, or null (selections frozen before it was kept have none). */
export function readMinFlowCheck(x: unknown): MinFlowCheck | null {
  if (!x || typeof x !== "object") return null;
  const c = x as Record<string, unknown>;
  const nums = ["published", "ratio", "atPump", "running"].every((k) => typeof c[k] === "number" && Number.isFinite(c[k] as number));
  return nums && typeof c.below === "boolean" ? (x as MinFlowCheck) : null;
}

/**
 * One pump's maker's minimum flow on the curve a candidate's duty cycle runs on (energy.ts), m³/s, or null without one: as
 * run at a set speed or trim, at the curve's own speed under a drive (the cycle's speeds are fractions of it, and stepPor.ts
 * scales the figure by each step's).
 * @param result the candidate's evaluation (its `minFlow` as checked; absent in selections frozen before)
 * @param vfd whether the cycle runs on a drive
 * @param method how the candidate is adjusted
 */
export function minFlowOnCycle(result: object, vfd: boolean, method: "none" | "speed" | "trim"): number | null {
  const c = readMinFlowCheck((result as { minFlow?: unknown }).minFlow);
  return c ? c.published * (vfd && method === "speed" ? 1 : c.ratio) : null;
}

/** The maker's figure as the candidate runs it, in words: "12.0 m³/h", or "9.60 m³/h (12.0 m³/h at the curve's speed × 80.0 % speed, affinity laws)". */
export function minFlowAsRun(c: MinFlowCheck, against: readonly number[] = []): string {
  const at = qtLimit("flow", c.atPump, against);
  if (c.method === "none" || c.ratio === 1) return at;
  const how = c.method === "speed" ? `at the curve's speed × ${fmtPct(c.ratio)} speed, affinity laws Q ∝ N` : `on the published impeller × ${fmtPct(c.ratio)} trim, affinity laws Q ∝ D`;
  return `${at} (${qt("flow", c.published)} ${how})`;
}

/**
 * What the maker's minimum flow says against the verdict, or null where it says nothing (no figure, no duty, at or above
 * it): "runs below the maker's minimum flow: ⟦flow|8 m³/h⟧ < ⟦flow|12 m³/h⟧", with the pumps' share and the figure's
 * scaling said where they apply.
 */
export function minFlowAgainstVerdict(check: unknown): string | null {
  const c = readMinFlowCheck(check);
  if (!c || !c.below || c.dutyPerPump == null) return null;
  const share = c.running > 1 && c.dutyFlow != null ? ` (each of the ${c.running} duty pumps in parallel takes the duty's ${qt("flow", c.dutyFlow)} ÷ ${c.running})` : "";
  return `runs below the maker's minimum flow: ${qtExact("flow", c.dutyPerPump, [c.atPump])} < ${minFlowAsRun(c, [c.dutyPerPump])}${share}`;
}

/** The qualifier on the verdict's line: "but …" after "meets the duty", "and …" after any other verdict; null where it says nothing. */
export function verdictMinFlowNote(verdict: VerdictLike, check: unknown): string | null {
  const against = verdict ? minFlowAgainstVerdict(check) : null;
  return against ? `${againstWord(verdict!)} ${against}` : null;
}

/** The chart label's short form: ", but runs below the maker's minimum flow" ("" where it says nothing). */
export function verdictMinFlowShort(verdict: VerdictLike, check: unknown): string {
  return verdict && minFlowAgainstVerdict(check) ? `, ${againstWord(verdict)} runs below the maker's minimum flow` : "";
}
