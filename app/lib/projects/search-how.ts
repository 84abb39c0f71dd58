// A search row's How cell (pure): the setting its verdict judged, by the candidates table's rule (setting-step.ts), and
// the search's direct rule with that row's numbers — the pump as published meets the duty when its head at the duty flow
// lies within the duty head to duty head × (1 + tolerance), 1.05 by default, each end to 1 part in 10⁸ (engine search.ts,
// limitText.ts `insideEnds`, LIMIT_ROUNDING); otherwise it is trimmed or run at another speed. Printed, not a tooltip
// only. Quantities as tokens (renderDeep renders them in the reader's units).
import type { Candidate } from "~/engine";
import { fmtNum, qt, qtExact, qtLimit } from "~/engine/quantityText";
import { insideEnds, pastAbove } from "~/engine/limitText";
import { publishedOf, settingToken } from "./setting-step";

export const METHOD_TEXT = { direct: "as published", trim: "trim", speed: "slow down" } as const;

/**
 * The row's setting in words: "as published", or "trim to 93.1 %" / "slow down to 88.0 %" with the rpm or Ø a site sets.
 * @param r the row's method, ratio and the speed (rpm) and diameter (m) as set, or null
 */
export function searchHowText(r: { method: keyof typeof METHOD_TEXT; ratio: number; speed: number | null; diameter: number | null }): string {
  if (r.method === "direct") return METHOD_TEXT.direct;
  const known = (r.method === "speed" && r.speed != null) || (r.method === "trim" && r.diameter != null);
  return `${METHOD_TEXT[r.method]} to ${fmtNum(r.ratio * 100, 1)} %${known ? ` (${settingToken(r.method, r.ratio, publishedOf(r.method, r.ratio, { speed: r.speed, diameter: r.diameter }), true)})` : ""}`;
}

/**
 * The direct rule with the row's numbers: why the pump as published does or does not meet the duty searched.
 * @param d the engine row's `direct` (duty searched: flow m³/s, head m; window top m; head as published at the duty flow m, or null)
 * @param searched what the duty searched is where it is not the typed duty ("one pump's share of the duty (…)", "the
 *   equivalent water duty (ANSI/HI 9.6.7)"), said after the words; absent: the typed duty
 */
export function directRuleText(d: Candidate["direct"], searched?: string): string {
  return `${directWords(d)}${searched ? ` (the duty searched: ${searched})` : ""}`;
}

function directWords(d: Candidate["direct"]): string {
  const { flow, head, headHigh, publishedHead: h } = d;
  const window = `the duty head ${qtLimit("head", head, [h])} to duty head × ${fmtNum(headHigh / head, 2)} = ${qtLimit("head", headHigh, [h])}`;
  if (h === null) return `Not direct: the published curve has no head at the duty flow ${qt("flow", flow)}; direct (as published) only when its head there is within ${window}, each end to 1 part in 10⁸`;
  const its = `its head as published at the duty flow ${qt("flow", flow)} is ${qtExact("head", h, [head, headHigh])}`;
  if (insideEnds(h, head, headHigh)) return `Direct: ${its}, within ${window} (each end to 1 part in 10⁸)`;
  return `Not direct: ${its}, ${pastAbove(h, headHigh) ? "above" : "below"} the window of ${window} (direct only within it, each end to 1 part in 10⁸)`;
}
