// Whether every pump of a parallel or series arrangement can run (pure; used by evaluateCandidate). The rule is the one
// solveOperatingPoint applies to the arrangement (common practice, from memory): a pump starts against a closed check
// valve, so its head at zero flow (the shut-off head) must exceed the head it starts against, else it never delivers.
// - Parallel: a pump started while others run starts against the head they hold on the system. When that head is at or
//   above its shut-off head its check valve stays shut: only the pumps already running deliver, and the one started dead-heads.
// - Series: with one pump stopped or tripped, the rest must lift the liquid alone. When their shut-off head together is
//   at or below the system's head at zero flow, no flow passes: they dead-head (the stopped pump's own loss is left out,
//   which flatters them).
// Both "at" to 1 part in 10⁸ (LIMIT_ROUNDING): a pump whose shut-off head equals the head against it delivers zero flow,
// so it is flagged in both (common practice; before, parallel took equal heads as a start while series flagged them).
// Judged at each edge of the band (candidate-judgement.ts bandEdges), each warning with its numbers.
import { bandEdges } from "./candidate-judgement";
import { combinePumps, solveOperatingPoint, systemHeadFunction, type PreparedSystem, type PumpCurve } from "~/engine";
import { pastAbove, pastBelow, qt, qtExact, qtLimit } from "~/engine/quantityText";

type StartCtx = {
  mode: "open" | "closed-loop";
  prepared: PreparedSystem;
  /** One pump's curve as set. */
  curve: PumpCurve;
  arrangement: "single" | "parallel" | "series";
  n: number;
};

const DEAD_HEAD = "it runs at zero flow against its closed check valve (dead-head), churning and heating the liquid, below any minimum continuous flow";

/** Pumps in parallel started one after another, at one edge of the band: the first that cannot open its check valve. */
export type StagedStart = {
  /** The band's edge ("most lift, aged pipe"). */
  at: string;
  /** Pumps running when the next is started (count), and the duty pumps (count). */
  running: number;
  of: number;
  /** The head those running hold on the system, and one pump's shut-off head, m. */
  heldHead: number;
  shutoffHead: number;
  /** The flow those running deliver, m³/s. */
  flow: number;
};

function stagedAt(ctx: StartCtx, at: string, sys: (q: number) => number): StagedStart | null {
  const shutoff = ctx.curve.shutoffHead;
  if (shutoff === null) return null; // no published shut-off head: the start is not judged
  for (let k = 1; k < ctx.n; k++) {
    const op = solveOperatingPoint(k === 1 ? ctx.curve : combinePumps(ctx.curve, { mode: "parallel", duty: k }).curve, sys);
    if (op.head == null || op.flow == null) return null; // k pumps do not run here: the band says why
    // At or above it, to LIMIT_ROUNDING (1 part in 10⁸, engine limitText.ts `pastBelow`): at equal heads the pump started
    // delivers zero flow, as the series rule below says (before, equal heads were taken as a start here, flagged there).
    if (!pastBelow(op.head, shutoff)) return { at, running: k, of: ctx.n, heldHead: op.head, shutoffHead: shutoff, flow: op.flow };
  }
  return null;
}

/**
 * Pumps in parallel started one after another (duty/standby staging, common practice): at each edge of the band where
 * one cannot open its check valve against those running, who runs, the head they hold and the flow they deliver.
 * Empty for one pump, pumps in series, or a curve without a published shut-off head.
 * @param ctx the system (SI), one pump's curve as set, the arrangement and its duty pumps (count)
 */
export function parallelStaging(ctx: StartCtx): StagedStart[] {
  if (ctx.arrangement !== "parallel" || ctx.n < 2) return [];
  return bandEdges(ctx.mode).flatMap(({ name, which }) => stagedAt(ctx, name, systemHeadFunction(ctx.prepared, which)) ?? []);
}

/** "a and b" / "a, b and c" (a list in words). */
const listed = (xs: readonly string[]) => (xs.length < 2 ? xs.join("") : `${xs.slice(0, -1).join(", ")} and ${xs[xs.length - 1]}`);

/**
 * The warnings, in words with the numbers, where a pump of the arrangement cannot deliver: in parallel, the first pump
 * that cannot open its check valve against those running; in series, the pumps left running when one stops. Said once
 * where both edges of the band fail alike (in parallel, with as many pumps running), naming each edge with its numbers
 * (before, one near-identical line per edge).
 * @param ctx the system (SI), one pump's curve as set, the arrangement and its duty pumps (count)
 * @param staged in parallel, the staged starts already judged (`parallelStaging`; heads m, flows m³/s)
 */
export function arrangementStartWarnings(ctx: StartCtx, staged: readonly StagedStart[] = parallelStaging(ctx)): string[] {
  const n = ctx.n;
  if (ctx.arrangement === "single" || n < 2) return [];
  if (ctx.arrangement === "parallel") {
    // One line per count of pumps running when the next cannot start (the same at both edges: one line for both).
    const groups = new Map<number, StagedStart[]>();
    for (const s of staged) groups.set(s.running, [...(groups.get(s.running) ?? []), s]);
    return [...groups.values()].map((g) => {
      const { running, shutoffHead } = g[0];
      const held = g.map((s) => `${qtExact("head", s.heldHead, [shutoffHead])} at ${qt("flow", s.flow)}`);
      const own = qtLimit("head", shutoffHead, g.map((s) => s.heldHead)); // never read as equal to a held head beside "above"
      const where = g.length === 1 ? `At ${g[0].at}, with` : `At both edges of the band, with`;
      const holds = g.length === 1 ? held[0] : listed(g.map((s, i) => `${held[i]} (${s.at})`));
      const side = g.some((s) => pastAbove(s.heldHead, shutoffHead)) ? "above" : "at"; // at: within 1 part in 10⁸ of it
      return `${where} ${running} pump${running > 1 ? "s" : ""} running in parallel the system holds ${holds}, ${side} one pump's shut-off head ${own}: pump ${running + 1} of ${n}, started then, cannot open its check valve, so only ${running} of the ${n} deliver and ${DEAD_HEAD} (common practice: a pump in parallel starts against the head of those running; at or above its shut-off head, to 1 part in 10⁸, it delivers no flow)`;
    });
  }
  const left = n - 1;
  const rest = left === 1 ? ctx.curve : combinePumps(ctx.curve, { mode: "series", duty: left }).curve;
  const head0 = rest.shutoffHead;
  if (head0 === null) return [];
  const failing = bandEdges(ctx.mode).flatMap(({ name, which }) => {
    const sys = systemHeadFunction(ctx.prepared, which);
    const op = solveOperatingPoint(rest, sys);
    // Not started, or at zero flow, or a shut-off head at the system's to 1 part in 10⁸ (the parallel rule's allowance).
    return op.status !== "no-intersection-shutoff-below-static" && op.flow !== 0 && pastAbove(head0, sys(0)) ? [] : [{ name, system: sys(0) }];
  });
  if (!failing.length) return [];
  const theirs = qtExact("head", head0, failing.map((f) => f.system));
  const against = failing.map((f) => qtLimit("head", f.system, [head0]));
  const where = failing.length === 1 ? `At ${failing[0].name}, with` : "At both edges of the band, with";
  const system = failing.length === 1 ? against[0] : listed(failing.map((f, i) => `${against[i]} (${f.name})`));
  return [`${where} one of the ${n} pumps in series stopped or tripped, the ${left === 1 ? "pump left running gives" : `${left} left running give`} ${theirs} at zero flow against the system's ${system}: no flow passes, and ${left === 1 ? DEAD_HEAD : DEAD_HEAD.replace("it runs against its", "they run against their")} — trip the rest with it (common practice: pumps in series need each other's head)`];
}
