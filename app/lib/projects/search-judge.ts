// A search row's verdict (pure): the pump judged as it would be added — its method, the ratio solved against the system
// as the workbench does, the arrangement searched (search-arrangement.ts) — by `evaluateCandidate`, as the candidates
// table judges it: on the band, with its NPSH, cautions, staged starts and figures at the operating point. For pumps in
// parallel or series the figures are kept as the candidates table shows them: the operating point and the shaft power
// for the duty pumps together, one pump's share beside them; efficiency and BEP position one pump's (power-basis.ts).
import type { Verdict } from "~/engine";
import { evaluateCandidate, type CatalogueData, type SystemInput } from "./hydraulics";
import type { NpshJudgement } from "./candidate-judgement";
import type { StagedShortfall } from "./verdict-start";
import type { MinFlowCheck } from "./verdict-min-flow";
import { arrangementAdjustment, severalPumps, type SearchArrangement } from "./search-arrangement";

/**
 * The pump as its verdict judged it (evaluateCandidate, as the candidates table): the setting solved to the system's
 * head at the duty flow at the band's demanding edge (`ratioNote` says how) and its figures at the operating point,
 * where that curve meets the system's design curve (figures null without one). Several pumps: `operatingPoint` and
 * `shaftPower` are the duty pumps' together, `perPump` and `shaftPowerPerPump` one pump's (identical pumps share the
 * duty equally, common practice); `efficiency`, `bepRatio` and `inPor` one pump's. One pump: both alike.
 */
export type JudgedSetting = {
  ratio: number; ratioNote: string | null; speed: number | null; diameter: number | null;
  operatingPoint: { flow: number; head: number } | null;
  perPump: { flow: number; head: number } | null;
  efficiency: number | null; shaftPower: number | null; shaftPowerPerPump: number | null; bepRatio: number | null; inPor: boolean | null;
};

/**
 * What the search keeps of a pump judged as offered on the band: its verdict, its NPSH over the band's corners, the
 * cautions that qualify the verdict, its staged starts that leave the duty unmet (verdict-start.ts; pumps in parallel),
 * the maker's minimum flow against the duty (verdict-min-flow.ts; null without a figure) and what it judged.
 */
export type Judged = { verdict: Verdict; npsh: NpshJudgement | null; cautions: string[]; stagedStart: StagedShortfall[]; minFlow: MinFlowCheck | null; shown: JudgedSetting };

/**
 * The row's verdict, or null where evaluateCandidate gives none or cannot evaluate the curve (the row keeps its search
 * figures without a verdict).
 * @param input the system (SI)
 * @param set the curve set (points SI, speed rpm, impeller m)
 * @param method the search row's way to meet the duty ("none" for as published)
 * @param arrangement the arrangement searched (absent: one pump)
 * @param catalogue what the model publishes, for the catalogue rule
 */
export function judgeSearchRow(
  input: SystemInput,
  set: Parameters<typeof evaluateCandidate>[1],
  method: "none" | "trim" | "speed",
  arrangement: SearchArrangement | undefined,
  catalogue: CatalogueData | null,
): Judged | null {
  try {
    const e = evaluateCandidate(input, set, arrangementAdjustment(method, arrangement), { catalogue });
    if (!e.verdict) return null;
    const f = e.figures;
    const s = severalPumps(arrangement);
    const n = s?.dutyPumps ?? 1;
    const op = e.operating;
    const perPump = op && s ? (s.arrangement === "parallel" ? { flow: op.flow / n, head: op.head } : { flow: op.flow, head: op.head / n }) : op;
    const shaftPower = f?.shaftPower ?? null;
    return {
      verdict: e.verdict, npsh: e.npsh, cautions: e.cautions ?? [], stagedStart: e.stagedStart ?? [], minFlow: e.minFlow ?? null,
      shown: { ratio: e.ratio, ratioNote: e.ratioNote, speed: e.speed, diameter: e.diameter, operatingPoint: op, perPump,
        efficiency: f?.efficiency ?? null, shaftPower, shaftPowerPerPump: shaftPower == null ? null : shaftPower / n, bepRatio: f?.bepRatio ?? null, inPor: f?.inPor ?? null },
    };
  } catch {
    return null; // a curve the workbench cannot evaluate keeps its search row without a verdict
  }
}
