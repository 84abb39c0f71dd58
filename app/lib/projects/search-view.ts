// One duty-point search result as the read API returns it (pure; SI units): the search's own result,
// which carries the figures, the curve set's model id and library, and the verdict. The adjustment and the
// efficiency, shaft power and BEP position are the verdict's (at the operating point); the search's own at the
// typed duty, which rank the result, are `atTypedDuty`. Pumps in parallel or series (search-arrangement.ts): the
// operating point and shaft power are the duty pumps' together, `perPump` and `shaftPowerPerPump` one pump's, efficiency
// and BEP position one pump's, as the candidates table shows them (power-basis.ts); `atTypedDuty` one pump's at its share.
import type { Candidate } from "~/engine";
import type { NpshJudgement } from "./candidate-judgement";
import { SINGLE_PUMP, type SearchArrangement } from "./search-arrangement";
import { verdictNpshNote } from "./verdict-npsh";
import { verdictStartNote } from "./verdict-start";
import { verdictMinFlowNote } from "./verdict-min-flow";

/** The fields of a search result this view reads (a search result has more): the engine's ranked candidate plus the curve set. */
export type SearchResultIn = Pick<
  Candidate,
  "id" | "rank" | "label" | "method" | "ratio" | "speed" | "diameter" | "headAtDuty" | "efficiency" | "bepRatio" | "inPor" | "npshr" | "npshMargin" | "shaftPower" | "score" | "reason" | "warnings"
> & {
  curveSetId: number;
  modelId: number;
  model: string;
  type: string;
  size: string;
  library: string;
  setSpeed: number | null;
  setDiameter: number | null;
  /** The search's verdict of the pump as offered, or null when it gives none. */
  verdict: unknown;
  /** NPSH over the design point and the band's corners (the lowest deciding), or null without a verdict. */
  npsh: { status: string; marginRatio: number | null; at: string | null; available?: number | null; rule: string; unjudged?: { at: string; why: string }[] } | null;
  /** The cautions that qualify the verdict (evaluateCandidate's `cautions`); absent: none. */
  cautions?: string[];
  /** Staged starts of pumps in parallel that leave the duty unmet (verdict-start.ts `StagedShortfall[]`); absent or []: none. */
  stagedStart?: unknown;
  /** The maker's minimum flow against the duty (verdict-min-flow.ts `MinFlowCheck`); absent or null: no figure. */
  minFlow?: unknown;
  /** How the verdict's ratio was found (solved against the system's head at the band's demanding edge), in words. */
  ratioNote: string | null;
  /** The search's direct rule with the row's numbers: its head as published at the duty flow against the window (search-how.ts). */
  directRule: string;
  /** The operating point the figures are at (m³/s, m), null without one: the duty pumps' together for several. */
  operatingPoint: { flow: number; head: number } | null;
  /** The arrangement judged (absent: one pump), one pump's operating point and shaft power (absent: as the row's). */
  arrangement?: SearchArrangement;
  perPump?: { flow: number; head: number } | null;
  shaftPowerPerPump?: number | null;
  /** The search's setting and figures at the typed duty (what ranks the result). */
  atTypedDuty: Pick<Candidate, "ratio" | "speed" | "diameter" | "efficiency" | "shaftPower" | "bepRatio" | "inPor">;
};

export type SearchResultView = {
  rank: number;
  modelId: number;
  curveSetId: number;
  label: string;
  model: string;
  type: string;
  size: string;
  library: string;
  /** The published curve searched: speed, rpm; impeller diameter, m. */
  curve: { speed: number | null; impellerDiameter: number | null };
  /**
   * How the pump meets the duty as its verdict judged it: none (as published), speed (affinity laws) or trim (approximate); `note` how
   * the ratio was found; `directRule` why it is or is not met as published, with the row's numbers (search-how.ts).
   */
  adjustment: { kind: "none" | "speed" | "trim"; ratio: number; speed: number | null; diameter: number | null; note: string | null; directRule: string } & SearchArrangement;
  /** The verdict the search gives this result ({ status, rule, reasons }), or null when the search gives none. */
  verdict: unknown;
  /** What NPSH over the band says against the verdict, in words with its numbers ("but NPSHa … below NPSHr … at …: cavitation risk"), or null (verdict-npsh.ts). */
  verdictNpsh: string | null;
  /**
   * What starting pumps in parallel one after another says against the verdict, in words with its numbers ("but started one after
   * another (duty/standby staging) the duty is not met: …"), or null (verdict-start.ts; null for one pump).
   */
  verdictStart: string | null;
  /** A duty below the maker's minimum continuous flow ("but runs below the maker's minimum flow: 8.00 m³/h < 12.0 m³/h"), or null: no figure recorded, or at or above it (verdict-min-flow.ts). */
  verdictMinFlow: string | null;
  /**
   * NPSH as the workbench judges it: { status, marginRatio (NPSHa/NPSHr), at (where it is decided), available (NPSHa there, m), rule,
   * unjudged (the points the rule names that could not be judged, each { at, why }: any of them leaves the status "unknown") }, or null.
   */
  npsh: { status: string; marginRatio: number | null; at: string | null; available: number | null; rule: string; unjudged: { at: string; why: string }[] } | null;
  /**
   * operatingPoint, perPump, efficiency, shaftPower, shaftPowerPerPump, bepRatio, inPor: at the operating point judged (several
   * pumps: operatingPoint and shaftPower the duty pumps' together, the rest one pump's); headAtDuty, npshRequired, npshMargin,
   * score: the search's at the typed duty (one pump's share of it for several).
   */
  figures: {
    operatingPoint: { flow: number; head: number } | null;
    perPump: { flow: number; head: number } | null;
    shaftPowerPerPump: number | null;
    headAtDuty: number;
    efficiency: number | null;
    shaftPower: number | null;
    npshRequired: number | null;
    npshMargin: number | null;
    bepRatio: number | null;
    inPor: boolean | null;
    score: number;
  };
  atTypedDuty: SearchResultIn["atTypedDuty"];
  reason: string;
  /** The cautions that qualify the verdict (as the candidates table's: dead-head, unstable crossings, band edges', a pump in parallel or series that cannot start), then the search's own at the typed duty; each once. */
  warnings: string[];
};

const KIND = { direct: "none", trim: "trim", speed: "speed" } as const;

export function searchResultView(r: SearchResultIn): SearchResultView {
  return {
    rank: r.rank,
    modelId: r.modelId,
    curveSetId: r.curveSetId,
    label: r.label,
    model: r.model,
    type: r.type,
    size: r.size,
    library: r.library,
    curve: { speed: r.setSpeed, impellerDiameter: r.setDiameter },
    adjustment: { kind: KIND[r.method], ratio: r.ratio, speed: r.speed, diameter: r.diameter, note: r.ratioNote, directRule: r.directRule, ...(r.arrangement ?? SINGLE_PUMP) },
    verdict: r.verdict ?? null,
    verdictNpsh: verdictNpshNote(r.verdict as { status: string } | null | undefined, r.npsh as NpshJudgement | null | undefined),
    verdictStart: verdictStartNote(r.verdict as { status: string } | null | undefined, r.stagedStart),
    verdictMinFlow: verdictMinFlowNote(r.verdict as { status: string } | null | undefined, r.minFlow),
    npsh: r.npsh ? { status: r.npsh.status, marginRatio: r.npsh.marginRatio, at: r.npsh.at, available: r.npsh.available ?? null, rule: r.npsh.rule, unjudged: r.npsh.unjudged ?? [] } : null,
    figures: {
      operatingPoint: r.operatingPoint,
      perPump: r.perPump !== undefined ? r.perPump : r.operatingPoint,
      shaftPowerPerPump: r.shaftPowerPerPump !== undefined ? r.shaftPowerPerPump : r.shaftPower,
      headAtDuty: r.headAtDuty, efficiency: r.efficiency, shaftPower: r.shaftPower, npshRequired: r.npshr,
      npshMargin: r.npshMargin, bepRatio: r.bepRatio, inPor: r.inPor, score: r.score,
    },
    atTypedDuty: r.atTypedDuty,
    reason: r.reason,
    warnings: [...new Set([...(r.cautions ?? []), ...r.warnings.map((w) => w.message)])],
  };
}
