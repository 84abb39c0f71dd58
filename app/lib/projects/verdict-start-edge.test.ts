// A staged start (pumps in parallel started one after another) says "the duty is not met" where those running deliver
// "below the least the verdict accepts": it must flip where the verdict's own short rule flips (engine verdict.ts: below
// duty × (1 − minus) by more than LIMIT_ROUNDOFF, 1 part in 10⁶, affinity.ts), and the flow it names must print apart from
// that limit (helper "verdictaudit"). Before, it held the flow to duty × (1 − minus) with no allowance: a flow 1 part in
// 10¹² under a 54 m³/h duty read "only 1 delivers, 54.0000000 m³/h, below the duty 54.0 m³/h", where the verdict at the same
// flow says "meets". Check values: the rules (verdict.ts's −0 %/+10 % default, common practice; the staged start, common
// practice, from memory: verdict-start.ts); the flows and heads are invented.
import { describe, expect, it } from "vitest";
import { judgeCandidate, LIMIT_ROUNDOFF } from "~/engine";
import { inSI } from "~/engine/quantityText";
import { startAgainstVerdict, stagedShortfalls } from "./verdict-start";
import type { StagedStart } from "./arrangement-start";

const M3H = 1 / 3600; // m³/s per m³/h
const staged = (flow: number): StagedStart => ({ at: "most lift, aged pipe", running: 1, of: 2, heldHead: 42.9, shutoffHead: 40, flow });
/** The number a rendered flow reads as, in m³/h. */
const num = (t: string) => Number(t.replace(/\u202f/g, "").replace(/,/g, ""));

describe("the staged start's shortfall flips where the verdict's short does, and names numbers apart", () => {
  const offs = [0, 1e-12, 1e-9, 5e-7, 0.99 * LIMIT_ROUNDOFF, 1.01 * LIMIT_ROUNDOFF, 2e-6, 1e-3];
  for (const minus of [0, 0.05, 0.025])
    for (const duty of [54, 0.36, 1234.5])
      it(`duty ${duty} m³/h, tolerance −${minus * 100} %: ${offs.length} flows under the least accepted`, () => {
        const qd = duty * M3H, least = qd * (1 - minus);
        const wrong: string[] = [];
        for (const k of offs) {
          const q = least * (1 - k);
          const short = judgeCandidate({ dutyFlow: qd, tolerance: { minus, plus: 0.1 }, edges: [{ name: "most lift, aged pipe", flow: q, head: 42 }] })!.status === "short";
          const got = stagedShortfalls([staged(q)], qd, minus);
          if ((got.length > 0) !== short) wrong.push(`least × (1 − ${k}): staged ${got.length > 0 ? "short" : "met"}, verdict ${short ? "short" : "not short"}`);
          if (!got.length) continue;
          // "so only 1 delivers, <flow>, below …, <limit>": the two numbers read apart.
          const words = inSI(startAgainstVerdict(got)!);
          const m = /only 1 delivers, ([\d.,\u202f]+) m³\/h, below (?:the least the verdict accepts, |the duty )([\d.,\u202f]+) m³\/h/.exec(words);
          if (!m) wrong.push(`least × (1 − ${k}): words unread: ${words}`);
          else if (num(m[1]) >= num(m[2])) wrong.push(`least × (1 − ${k}): ${m[1]} not below ${m[2]} in "${words}"`);
        }
        expect(wrong).toEqual([]);
      });
});
