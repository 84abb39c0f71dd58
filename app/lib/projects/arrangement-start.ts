// Whether every pump of a parallel or series arrangement can run (pure; used by evaluateCandidate). The rule is the one
// solveOperatingPoint applies to the arrangement (common practice, from memory): a pump starts against a closed check
// valve, so its head at zero flow (the shut-off head) must exceed the head it starts against, else it never delivers.
// - Parallel: a pump started while others run starts against the head they hold on the system. When that head is above
//   its shut-off head its check valve stays shut: only the pumps already running deliver, and the one started dead-heads.
// - Series: with one pump stopped or tripped, the rest must lift the liquid alone. When their shut-off head together is
//   below the system's head at zero flow, no flow passes: they dead-head (the stopped pump's own loss is left out, which
//   flatters them).
// Judged at each edge of the band (candidate-judgement.ts bandEdges), each warning with its numbers.
import { bandEdges } from "./candidate-judgement";
import { combinePumps, solveOperatingPoint, systemHeadFunction, type PreparedSystem, type PumpCurve } from "~/engine";
import { qt, qtPair } from "~/engine/quantityText";

type StartCtx = {
  mode: "open" | "closed-loop";
  prepared: PreparedSystem;
  /** One pump's curve as set. */
  curve: PumpCurve;
  arrangement: "single" | "parallel" | "series";
  n: number;
};

const DEAD_HEAD = "it runs at zero flow against its closed check valve (dead-head), churning and heating the liquid, below any minimum continuous flow";

/**
 * The warnings, in words with the numbers, where a pump of the arrangement cannot deliver: in parallel, the first pump
 * that cannot open its check valve against those running; in series, the pumps left running when one stops.
 * @param ctx the system (SI), one pump's curve as set, the arrangement and its duty pumps (count)
 */
export function arrangementStartWarnings(ctx: StartCtx): string[] {
  const n = ctx.n;
  const shutoff = ctx.curve.shutoffHead;
  if (ctx.arrangement === "single" || n < 2) return [];
  const out: string[] = [];
  for (const { name, which } of bandEdges(ctx.mode)) {
    const sys = systemHeadFunction(ctx.prepared, which);
    if (ctx.arrangement === "parallel") {
      if (shutoff === null) continue; // no published shut-off head: the start is not judged
      for (let k = 1; k < n; k++) {
        const op = solveOperatingPoint(k === 1 ? ctx.curve : combinePumps(ctx.curve, { mode: "parallel", duty: k }).curve, sys);
        if (op.head == null || op.flow == null) break; // k pumps do not run here: the band says why
        if (!(op.head > shutoff)) continue;
        const [held, own] = qtPair("head", op.head, shutoff);
        out.push(`At ${name}, with ${k} pump${k > 1 ? "s" : ""} running in parallel the system holds ${held} at ${qt("flow", op.flow)}, above one pump's shut-off head ${own}: pump ${k + 1} of ${n}, started then, cannot open its check valve, so only ${k} of the ${n} deliver and ${DEAD_HEAD} (common practice: a pump in parallel starts against the head of those running)`);
        break;
      }
    } else {
      const left = n - 1;
      const rest = left === 1 ? ctx.curve : combinePumps(ctx.curve, { mode: "series", duty: left }).curve;
      const op = solveOperatingPoint(rest, sys);
      const head0 = rest.shutoffHead;
      if (head0 === null || (op.status !== "no-intersection-shutoff-below-static" && op.flow !== 0)) continue;
      const [theirs, system] = qtPair("head", head0, sys(0));
      out.push(`At ${name}, with one of the ${n} pumps in series stopped or tripped, the ${left === 1 ? "pump left running gives" : `${left} left running give`} ${theirs} at zero flow against the system's ${system}: no flow passes, and ${left === 1 ? DEAD_HEAD : DEAD_HEAD.replace("it runs against its", "they run against their")} — trip the rest with it (common practice: pumps in series need each other's head)`);
    }
  }
  return out;
}
