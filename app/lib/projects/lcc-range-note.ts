// The life-cycle cost beside the duty-cycle steps where the pump runs outside its allowable flow range. The cost prices
// every counted step's energy as if the pump ran there as well as anywhere else; at a step below 50 % of its BEP flow (a
// common lower bound for continuous running, common practice, from memory: engine stepPor.ts `STEP_MIN_FLOW_RULE`) or
// below the maker's minimum continuous flow (`STEP_MAKER_MIN_FLOW_RULE`) it wears (recirculation, heating, vibration,
// bearing and seal life), and that cost is not in the figure. The step's own note says so at the step; the cost's line
// names those steps too, with one pump's flow, the limit and the rule, so nobody compares the cost without them.
// Only steps with hours that are priced (counted and run: a 0 h step never runs, decision "npshzero"). Pure; quantities
// as tokens (quantityText.ts), rendered by the caller's `renderDeep` with the rest of the energy.
import { COUNTED_STEP_STATUSES, STEP_BELOW_MAKER_MIN_FLOW, STEP_MIN_FLOW_FRACTION } from "~/engine";
import { fmtPctExact, pastBelow, qtExact, qtLimit, qtPair } from "~/engine/quantityText";

type CycleLike = {
  steps: readonly { flowFraction: number; hours: number; status: string }[];
  warnings?: readonly { code?: string | null; parameter?: string | null; message: string; bepRatio?: number; pumpFlow?: number; bepFlow?: number; makerMinFlow?: number | null }[];
} | null | undefined;

/** The step as named on the cost's line: "25 % flow, 3000 h". */
const stepWords = (s: { flowFraction: number; hours: number }) => `${Math.round(s.flowFraction * 100)} % flow, ${Number(s.hours.toFixed(2))} h`;

/** Each priced step outside the allowable range, in words with its numbers (a cycle frozen before the numbers were kept: its ratio, or the rule alone). */
function outsideSteps(cycle: CycleLike): { maker: string[]; bep: string[] } {
  const out = { maker: [] as string[], bep: [] as string[] };
  if (!cycle) return out;
  for (const w of cycle.warnings ?? []) {
    const i = Number(/^profile\[(\d+)\]$/.exec(w.parameter ?? "")?.[1] ?? NaN);
    const s = Number.isInteger(i) ? cycle.steps[i] : undefined;
    if (!s || !(s.hours > 0) || !(COUNTED_STEP_STATUSES as readonly string[]).includes(s.status)) continue;
    if (w.code === STEP_BELOW_MAKER_MIN_FLOW) {
      const nums = typeof w.pumpFlow === "number" && typeof w.makerMinFlow === "number" ? qtPair("flow", w.pumpFlow, w.makerMinFlow) : null;
      out.maker.push(nums ? `${stepWords(s)}: ${nums[0]} a pump < ${nums[1]}` : stepWords(s));
    } else if (w.code === "step-below-min-flow" && typeof w.bepRatio === "number" && pastBelow(w.bepRatio, STEP_MIN_FLOW_FRACTION)) {
      const pct = fmtPctExact(w.bepRatio, [STEP_MIN_FLOW_FRACTION], 0);
      // One pump's flow told apart from the BEP flow and from half of it (the rule's limit), the BEP flow apart from it.
      const nums = typeof w.pumpFlow === "number" && typeof w.bepFlow === "number" ? [qtExact("flow", w.pumpFlow, [w.bepFlow, w.bepFlow * STEP_MIN_FLOW_FRACTION]), qtLimit("flow", w.bepFlow, [w.pumpFlow])] : null;
      out.bep.push(nums ? `${stepWords(s)}: ${nums[0]} a pump, ${pct} of its BEP flow ${nums[1]}` : `${stepWords(s)}: ${pct} of its BEP flow`);
    }
  }
  return out;
}

/**
 * What the life-cycle cost's line says beside the cost where the pump is priced at steps outside its allowable flow range,
 * or null where no priced step is: "priced as if the pump ran normally at 1 step outside its allowable flow range — below
 * 50 % of BEP flow (a common lower bound …): 25 % flow, 3000 h: 9.00 m³/h a pump, 25 % of its BEP flow 36.0 m³/h; their
 * wear (…) is not in this cost".
 */
export function lccRangeNote(cycle: CycleLike): string | null {
  const { maker, bep } = outsideSteps(cycle);
  const n = maker.length + bep.length;
  if (n === 0) return null;
  // The rules in short (the step's own note says them in full, stepPor.ts): the printed report keeps to its two pages.
  const parts = [
    maker.length ? `below the maker's minimum continuous flow (no continuous running below it, the maker's rule): ${maker.join("; ")}` : "",
    bep.length ? `below ${STEP_MIN_FLOW_FRACTION * 100} % of BEP flow (a common lower bound for continuous running; common practice, from memory): ${bep.join("; ")}` : "",
  ].filter(Boolean);
  return `priced as if the pump ran normally at ${n === 1 ? "1 step" : `${n} steps`} outside its allowable flow range — ${parts.join("; and ")}; their wear (recirculation, heating, vibration, bearings and seals) is not in this cost`;
}
