/**
 * Where a pump curve and a system curve meet, from samples of g(Q) = pump head − system head: crossings (a sign change, or
 * a sample at equal heads to rounding), touches (curveTouch.ts) and stretches where they coincide; the sign of g past each,
 * and the meeting a pump reaches from rest. The one rule of the engine's solver (operatingPoint.ts: g from the pump's cubic
 * and the system's function, sampled per curve interval) and of the charts' sampled curves (components/chart/curves.ts
 * `crossingOf`: g straight between the stored points, sampled at every one of them).
 */
import { requireFinite, EngineInputError } from "./errors.ts";
import { brent } from "./roots.ts";
import { findTouches, TOUCH_GAP, type Root } from "./curveTouch.ts";
import { fmtPctExact, fmtPctLimit } from "./pctText.ts";

/**
 * Relative head difference (dimensionless) below which two heads are equal to rounding: 1e-12 of the head is a few hundred
 * ulps, far below any published head's digits (a 30 m head to 3e-11 m), and far above the ulps a system curve through a
 * published point is off by. A sample within it is a meeting at that sample (operatingPoint.ts: also the last-point rule).
 */
export const LAST_POINT_MATCH = 1e-12;

/**
 * Least share of the published flows (dimensionless) over which the heads, about one meeting, stay within TOUCH_GAP of the
 * pump's head for the curves to coincide there: 1 %. Narrower, the meeting is a touch (or a crossing). Our choice: two
 * curves whose difference bends by κ of the head across the published flows stay within 1e-8 of it over 2·√(1e-8/κ) of
 * them, so 1 % needs κ ≤ 4e-4 — a bend below the 3–4 digits a curve is published to, across its whole range: curves that
 * run together, not a tangent touch (a pump curve's bend against a system curve's is a few tenths of the head).
 */
export const COINCIDE_SHARE = 0.01;

/**
 * The crossing a pump reaches from rest (common practice, from memory): started against a closed check valve, it runs only
 * when its head at the first flow is not below the system's there (equal: it stays at that point, dead-head), and then
 * settles at the first crossing where its head falls below the system's (a crossing where it rises above it again is
 * unstable: the flow runs on). The one rule `solveOperatingPoint` and the charts' sampled curves (`crossingOf`) apply.
 * @param atFirst pump head − system head at the first flow, m (or any one head unit)
 * @param afterSigns signs (dimensionless), for each crossing in ascending flow (a flow where the heads are equal at the first
 *   one included), of pump head − system head just past it: −1, +1, or 0 where nothing lies past it
 * @returns the index of the crossing reached; "cannot-start" when the pump's head at the first flow is below the system's;
 *   "beyond-curve-end" when no crossing is one where the pump's head falls below the system's
 */
export function crossingFromRest(atFirst: number, afterSigns: readonly number[]): number | "cannot-start" | "beyond-curve-end" {
  requireFinite("atFirst", atFirst);
  if (!Array.isArray(afterSigns)) throw new EngineInputError("afterSigns", "must be a list of signs (−1, 0, +1)");
  afterSigns.forEach((x, i) => requireFinite(`afterSigns[${i}]`, x));
  if (atFirst < 0) return "cannot-start";
  const i = afterSigns.findIndex((x) => x <= 0);
  return i < 0 ? "beyond-curve-end" : i;
}

/** The meetings of two curves (`meetingsOf`): ascending flow, the sign of g past each, the one reached from rest. */
export type Meetings = { roots: Root[]; afterSign: number[]; fromRest: ReturnType<typeof crossingFromRest>; iterations: number; near: (i: number) => boolean };

/**
 * The rule in words with its numbers, for a coincident stretch or a touch: the share of the published flows over which the
 * heads stay within TOUCH_GAP of the pump's head, against COINCIDE_SHARE.
 * @param share that share (dimensionless, 0–1)
 * @returns e.g. "their heads within 1 part in 10⁸ of the pump's head over 35.0 % of the published flows; coincident from 1 %"
 */
export function coincideRuleText(share: number): string {
  return `their heads within 1 part in 10⁸ of the pump's head over ${fmtPctExact(share, [COINCIDE_SHARE])} of the published flows; coincident from ${fmtPctLimit(COINCIDE_SHARE)}`;
}

/**
 * The meetings of a pump curve and a system curve from samples of g = pump head − system head (see the file's comment):
 * a sample within LAST_POINT_MATCH of the pump's head is a meeting there (a run of them a stretch), a sign change between
 * samples a crossing (Brent), dips and crossings a rounding-level apart touches (`findTouches`, TOUCH_GAP); then each
 * meeting — crossing, touch and stretch — is judged by the flows about it where the heads stay within TOUCH_GAP of the
 * pump's head: over COINCIDE_SHARE of the published flows (the samples' first to last) or more, the curves coincide there (a
 * stretch; any meeting inside it is part of it); less, a touch (a stretch's sides the same) or a crossing. Before, a stretch within 1e-8 of the head but
 * not 1e-12 was one "touch", and a run of samples within 1e-12 a stretch however short.
 * @param s g (m³/s → m, or one flow and one head unit throughout), the sample flows `qs` ascending and g there `gs` (with
 *   the first- and last-point rules applied), the pump's head (flow → head), the flow tolerance `xtol` and Brent's
 *   iteration cap `maxIt` (count)
 */
export function meetingsOf(s: { g: (q: number) => number; qs: number[]; gs: number[]; pumpHead: (q: number) => number; xtol: number; maxIt: number }): Meetings {
  const { g, qs, gs, xtol, maxIt } = s;
  const pumpHs = qs.map(s.pumpHead);
  const near = (i: number) => Math.abs(gs[i]) <= LAST_POINT_MATCH * Math.abs(pumpHs[i]);
  const roots: Root[] = [];
  for (let i = 0; i < qs.length; i++) {
    if (near(i)) {
      let j = i;
      while (j + 1 < qs.length && near(j + 1)) j++;
      // One sample at equal heads to rounding: the curves meet there (a crossing, or a touch where g keeps its sign).
      const side = i > 0 && j < qs.length - 1 ? Math.sign(gs[i - 1]) : 0;
      const kind = j > i ? "stretch" : side !== 0 && side === Math.sign(gs[j + 1]) ? "touch" : "cross";
      roots.push({ x: qs[i], ...(j > i ? { xEnd: qs[j] } : {}), fx: gs[i], method: "brent", iterations: 0, kind, side });
      i = j;
      continue;
    }
    if (i < qs.length - 1 && !near(i + 1) && gs[i] * gs[i + 1] < 0) {
      const r = brent(g, qs[i], qs[i + 1], xtol, maxIt);
      if (r) roots.push({ x: r.x, fx: r.fx, method: r.method, iterations: r.iterations, kind: "cross", side: Math.sign(gs[i]) });
    }
  }
  findTouches(roots, { g, qs, gs, near, xtol, maxIt, pumpHead: s.pumpHead });
  judgeCoincidence(roots, s, near, (i) => Math.abs(gs[i]) <= TOUCH_GAP * Math.abs(pumpHs[i]));
  let iterations = 0;
  for (const r of roots) iterations += r.iterations;
  // The sign of g just past each meeting (a stretch's end): below zero the pump's head falls under the system's (stable).
  const afterSign = roots.map((r) => {
    if (r.after !== undefined) return r.after;
    let j = qs.findIndex((q) => q > (r.xEnd ?? r.x));
    while (j >= 0 && j < gs.length && near(j)) j++;
    return j < 0 || j >= gs.length ? 0 : Math.sign(gs[j]);
  });
  // A stretch, and a touch from above, are where a pump flowing up to them stops: its head no longer exceeds the system's.
  const stopsAt = roots.map((r, i) => (r.kind === "stretch" || (r.kind === "touch" && r.side > 0) ? 0 : afterSign[i]));
  const fromRest = crossingFromRest(roots.length && roots[0].x === qs[0] ? 0 : gs[0], stopsAt);
  return { roots, afterSign, fromRest, iterations, near };
}

/** Each meeting judged by the flows about it within TOUCH_GAP of the pump's head (meetingsOf), in place. */
function judgeCoincidence(roots: Root[], s: { g: (q: number) => number; qs: number[]; gs: number[]; pumpHead: (q: number) => number; xtol: number },
  near: (i: number) => boolean, sampleInGap: (i: number) => boolean): void {
  const { g, qs, gs } = s;
  const inGap = (q: number) => Math.abs(g(q)) <= TOUCH_GAP * Math.abs(s.pumpHead(q));
  const span = qs[qs.length - 1] - qs[0];
  // From a flow within the gap, the last flow still within it toward `dir` (±1): the samples first, then bisection.
  const edge = (from: number, dir: number) => {
    let inside = from;
    const order = dir > 0 ? qs.map((_, i) => i) : qs.map((_, i) => qs.length - 1 - i);
    for (const i of order) {
      if (dir * (qs[i] - from) <= 0) continue;
      if (sampleInGap(i)) { inside = qs[i]; continue; }
      let out = qs[i];
      for (let it = 0; it < 200 && Math.abs(out - inside) > s.xtol; it++) {
        const m = (inside + out) / 2;
        if (inGap(m)) inside = m; else out = m;
      }
      return inside;
    }
    return inside;
  };
  const judged = roots.length;
  // A run of samples within the gap with no meeting found in it (g of one sign, no sample at equal heads to rounding, no
  // dip: the curves run together a hair apart): a stretch where it reaches COINCIDE_SHARE (before, none, or one "touch").
  for (let i = 0; i < qs.length; i++) {
    if (!sampleInGap(i)) continue;
    let j = i;
    while (j + 1 < qs.length && sampleInGap(j + 1)) j++;
    const a = qs[i], b = qs[j];
    if (j > i && !roots.some((r) => r.x >= a && r.x <= b) && ![...Array(j - i + 1).keys()].some((k) => near(i + k))) {
      const lo = edge(a, -1), hi = edge(b, 1), share = span > 0 ? (hi - lo) / span : 0;
      if (share >= COINCIDE_SHARE) roots.push({ x: lo, xEnd: hi, lo, hi, share, fx: g(lo), method: "brent", iterations: 0, kind: "stretch", side: i > 0 ? Math.sign(gs[i - 1]) : 0 });
    }
    i = j;
  }
  const half = (COINCIDE_SHARE / 2) * span;
  for (const r of roots.slice(0, judged)) {
    // A crossing by the same rule (before, never judged: a crossing within the gap over 5 % of the flows was one point, a
    // touch's over 1 % coincident). Its flows within the gap reach COINCIDE_SHARE only if they reach half of it either
    // side, so one of the two flows there within the gap: without, it stays a crossing (two evaluations, not a search).
    if (r.kind === "cross" && !(span > 0 && [r.x - half, r.x + half].some((q) => q >= qs[0] && q <= qs[qs.length - 1] && inGap(q)))) continue;
    const lo = edge(r.x, -1), hi = edge(r.xEnd ?? r.x, 1);
    const share = span > 0 ? (hi - lo) / span : 0;
    if (r.kind === "cross" && share < COINCIDE_SHARE) continue;
    r.share = share;
    r.lo = lo; r.hi = hi;
    if (r.share >= COINCIDE_SHARE) {
      if (r.xEnd === undefined) { r.x = lo; r.xEnd = hi; r.fx = g(lo); }
      r.kind = "stretch";
      delete r.after;
    } else if (r.kind === "stretch") {
      // Samples at equal heads to rounding, but over less than COINCIDE_SHARE of the flows: one meeting, by its sides.
      const end = r.xEnd as number;
      let j = qs.findIndex((q) => q > end);
      while (j >= 0 && j < gs.length && near(j)) j++;
      const past = j < 0 || j >= gs.length ? 0 : Math.sign(gs[j]);
      r.kind = r.side !== 0 && r.side === past ? "touch" : "cross";
      delete r.xEnd;
    }
  }
  roots.sort((a, b) => a.x - b.x);
  // Any meeting inside a stretch's flows is part of it; overlapping stretches are one.
  for (let k = 0; k < roots.length; k++) {
    const st = roots[k];
    if (st.kind !== "stretch") continue;
    const lo = st.lo ?? st.x, hi = st.hi ?? (st.xEnd as number);
    for (let m = roots.length - 1; m >= 0; m--) {
      const o = roots[m];
      if (m === k || o.x < lo || o.x > hi) continue;
      if (o.kind === "stretch") { st.xEnd = Math.max(st.xEnd as number, o.xEnd as number); st.hi = Math.max(hi, o.hi ?? hi); st.share = span > 0 ? (st.hi - lo) / span : 0; }
      roots.splice(m, 1);
      if (m < k) k--;
    }
  }
}
