// The verdict's headline qualified by NPSH at a staged step of the duty cycle. Pumps in parallel staged by demand (engine
// dutyStaging.ts) run fewer than all duty pumps at low demand; each then takes the larger share Q/k of the step's flow,
// further out on its curve, where it needs more NPSH (staging-npsh.ts judges it, common practice: NPSHa / NPSHr at least
// the wanted ratio; below 1, or NPSHa ≤ 0, a cavitation risk). A shortfall there is the pump cavitating or short of margin
// for the hours of that step: no pump to sign as plainly "meets the duty", so wherever the verdict is a headline (the
// candidates table, the report, the chart's label, the CSV, the JSON export and the systems API) it qualifies the verdict on
// the same line, as NPSH over the band does (verdict-npsh.ts), with the step, the pumps running, NPSHa, NPSHr and the rule
// (the step's own warning, which states them). A step of 0 h never runs and qualifies nothing (its warning stays at the step).
// Pure; quantities as tokens (quantityText.ts).
import { againstWord } from "./verdict-npsh";

type VerdictLike = { status: string } | null | undefined;
/** A duty cycle as computed or frozen: its steps and its warnings (a staged step's NPSH warning: code "staged-npsh"). */
type CycleLike = {
  steps: readonly { flowFraction: number; hours: number; pumpsRunning?: number; dutyPumps?: number }[];
  warnings?: readonly { code?: string | null; parameter?: string | null; message: string; npshStatus?: string }[];
} | null | undefined;

/** The staged steps with hours whose NPSH falls short: the step, its warning and what it found (null: frozen before it was kept). */
function shortSteps(cycle: CycleLike) {
  if (!cycle) return [];
  return (cycle.warnings ?? []).flatMap((w) => {
    const i = w.code === "staged-npsh" ? Number(/^profile\[(\d+)\]$/.exec(w.parameter ?? "")?.[1] ?? NaN) : NaN;
    const s = Number.isInteger(i) ? cycle.steps[i] : undefined;
    if (!s || !(s.hours > 0)) return [];
    return [{ step: s, message: w.message, status: w.npshStatus === "cavitation-risk" || w.npshStatus === "low-margin" ? w.npshStatus : null }];
  });
}

/**
 * What NPSH at the staged steps says against the verdict, or null where it says nothing: "at a duty-cycle step with fewer
 * pumps running (staged by demand): NPSH at 40 % flow, 1 of 2 pumps running: each takes …; NPSHa … / NPSHr … = 0.95,
 * below 1, NPSHa below NPSHr: cavitation risk (common practice: …)"; several steps joined by "; and ".
 */
export function stagedNpshAgainstVerdict(cycle: CycleLike): string | null {
  const all = shortSteps(cycle);
  if (!all.length) return null;
  return `at ${all.length === 1 ? "a duty-cycle step" : `${all.length} duty-cycle steps`} with fewer pumps running (staged by demand): ${all.map((x) => x.message).join("; and ")}`;
}

/** The qualifier on the verdict's line: "but …" after "meets the duty", "and …" after any other verdict; null where it says nothing. */
export function verdictStagedNpshNote(verdict: VerdictLike, cycle: CycleLike): string | null {
  if (!verdict) return null;
  const against = stagedNpshAgainstVerdict(cycle);
  return against ? `${againstWord(verdict)} ${against}` : null;
}

/** The chart label's short form: ", but NPSH cavitation risk at 40 % flow, 1 of 2 pumps running" ("" where it says nothing). */
export function verdictStagedNpshShort(verdict: VerdictLike, cycle: CycleLike): string {
  const all = verdict ? shortSteps(cycle) : [];
  if (!all.length) return "";
  const worst = all.find((x) => x.status === "cavitation-risk") ?? all[0];
  const what = worst.status === "cavitation-risk" ? "cavitation risk" : worst.status === "low-margin" ? "low margin" : "short";
  return `, ${againstWord(verdict!)} NPSH ${what} at ${Math.round(worst.step.flowFraction * 100)} % flow, ${worst.step.pumpsRunning ?? "fewer"} of ${worst.step.dutyPumps ?? "the"} pumps running${all.length > 1 ? ` (${all.length} steps)` : ""}`;
}
