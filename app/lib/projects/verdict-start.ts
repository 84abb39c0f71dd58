// The verdict's headline qualified by how pumps in parallel are started. The duty verdict (engine verdict.ts) judges the
// arrangement's combined curve, as if every duty pump started at once. Started one after another instead — duty/standby
// staging, the usual way (common practice, from memory) — a pump starts against the head of those already running, and
// where that head is at or above its shut-off head its check valve stays shut (arrangement-start.ts): only those running
// deliver. Where their flow is below the least the verdict accepts, the duty is not met that way, and wherever the
// verdict is a headline (the candidates table, the report, the chart's label, the CSV) that qualifies it on the same
// line, with its rule and numbers, as NPSH does (verdict-npsh.ts). Pure; quantities as tokens (quantityText.ts).
import { LIMIT_ROUNDOFF } from "~/engine";
import { fmtPctLimit, pastAbove, qt, qtExact, qtLimit, qtPair } from "~/engine/quantityText";
import type { StagedStart } from "./arrangement-start";
import { againstWord } from "./verdict-npsh";

type VerdictLike = { status: string } | null | undefined;

/** A staged start that leaves the duty unmet: the pumps that deliver, their flow and the least flow the verdict accepts. */
export type StagedShortfall = StagedStart & {
  /** The duty flow and the least flow the verdict accepts, duty × (1 − minus tolerance), m³/s. */
  dutyFlow: number;
  leastFlow: number;
  /** The minus tolerance (fraction). */
  minus: number;
};

export const STAGED_START_RULE =
  "started one after another (duty/standby staging), a pump in parallel starts against the head of those running and cannot open its check valve when that head is at or above its shut-off head, to 1 part in 10⁸ (at equal heads it delivers no flow); the duty is not met that way when those running deliver less than duty × (1 − minus tolerance), by more than the verdict's 1 part in 10⁶ (common practice)";

/**
 * The staged starts that leave the duty unmet: those running deliver less than duty × (1 − minus tolerance) by more than
 * the verdict's own allowance (engine verdict.ts, LIMIT_ROUNDOFF: 1 part in 10⁶), so the two flip at one flow and the flow
 * named prints apart from the limit (before, a flow 1 part in 10¹² under 54 m³/h read "54.0000000 m³/h, below the duty
 * 54.0 m³/h" where the verdict said "meets").
 * @param staged the staged starts at the band's edges (arrangement-start.ts `parallelStaging`; heads m, flows m³/s)
 * @param dutyFlow the duty flow, m³/s (null: no duty, nothing judged)
 * @param minus the flow tolerance below the duty (fraction, 0–1)
 */
export function stagedShortfalls(staged: readonly StagedStart[], dutyFlow: number | null | undefined, minus: number): StagedShortfall[] {
  if (dutyFlow == null || !(dutyFlow > 0)) return [];
  const leastFlow = dutyFlow * (1 - minus);
  return staged.filter((s) => s.flow < leastFlow * (1 - LIMIT_ROUNDOFF)).map((s) => ({ ...s, dutyFlow, leastFlow, minus }));
}

/** Read from a frozen result: a list of shortfalls, or [] (selections frozen before it was kept have none). */
const shortfallsOf = (x: unknown): StagedShortfall[] =>
  Array.isArray(x) ? x.filter((s): s is StagedShortfall => !!s && typeof s === "object" && ["heldHead", "shutoffHead", "flow", "leastFlow", "dutyFlow"].every((k) => typeof (s as Record<string, unknown>)[k] === "number")) : [];

/**
 * What a staged start says against the verdict, or null where it says nothing (one pump, all can start, or those running
 * still meet the duty): "started one after another (duty/standby staging) the duty is not met: at most lift, aged pipe
 * pump 2 of 2 cannot open its check valve against the ⟦head|42.9⟧ pump 1 holds (above its shut-off head ⟦head|40⟧), so
 * only 1 delivers, ⟦flow|0.0136⟧, below the duty ⟦flow|0.015⟧; the verdict assumes the 2 started together".
 */
export function startAgainstVerdict(shortfalls: unknown): string | null {
  const all = shortfallsOf(shortfalls);
  if (!all.length) return null;
  const first = all[0];
  const edges = all.map((s) => {
    const [held, own] = qtPair("head", s.heldHead, s.shutoffHead);
    const those = s.running === 1 ? "pump 1 holds" : `pumps 1–${s.running} hold`;
    const limit = s.minus > 0
      ? `below the least the verdict accepts, ${qtLimit("flow", s.leastFlow, [s.flow])} (duty ${qt("flow", s.dutyFlow)} × (1 − ${fmtPctLimit(s.minus)}))`
      : `below the duty ${qtLimit("flow", s.dutyFlow, [s.flow])}`;
    return `at ${s.at} pump ${s.running + 1} of ${s.of} cannot open its check valve against the ${held} ${those} (${pastAbove(s.heldHead, s.shutoffHead) ? "above" : "at"} its shut-off head ${own}), so only ${s.running} deliver${s.running === 1 ? "s" : ""}, ${qtExact("flow", s.flow, [s.leastFlow, s.dutyFlow])}, ${limit}`;
  });
  return `started one after another (duty/standby staging) the duty is not met: ${edges.join("; ")}; the verdict assumes the ${first.of} started together`;
}

/**
 * The qualifier shown right after the verdict's badge, on its line: " — but …" after "meets the duty", " — and …" after
 * any other verdict; null where a staged start says nothing against it.
 */
export function verdictStartNote(verdict: VerdictLike, shortfalls: unknown): string | null {
  if (!verdict) return null;
  const against = startAgainstVerdict(shortfalls);
  return against ? `${againstWord(verdict)} ${against}` : null;
}

/** The chart label's short form: ", but not met if started one after another" ("" where it says nothing against it). */
export function verdictStartShort(verdict: VerdictLike, shortfalls: unknown): string {
  if (!verdict || !startAgainstVerdict(shortfalls)) return "";
  return `, ${againstWord(verdict)} not met if started one after another`;
}
