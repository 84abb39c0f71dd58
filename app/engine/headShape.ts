/**
 * The shapes a pump curve's head may take along its flow (pure; heads m, flows m³/s), one rule for the engine
 * (pumpCurve.ts `checkPumpPoints`, run by `createPumpCurve` and `prepareSearchIndex`) and the CSV importer
 * (app/lib/import/point-rules.ts), each with its own rounding allowance `allow` (m): the engine's `riseTolerance` × the
 * first head (10 % by default), the importer's 5 %. Two shapes are taken:
 * - falling (stable): from the first point on the head rises above the lowest head before it by no more than `allow`
 *   (rounding of published values, a slight hump near shut-off);
 * - drooping (unstable): the head rises from the first point — the shut-off head where its flow is 0 — to one peak, at
 *   most {@link DROOP_MAX} above that first head, then falls. Once falling (a head more than `allow` below the highest
 *   so far) it may rise again by no more than `allow` above the lowest head since it began to fall.
 * Refused: a head more than {@link DROOP_MAX} above the first head (`above-droop`), a second rise after falling
 * (`second-rise`: a zig-zag, mistyped or shifted values), and a curve whose head rises beyond `allow` above its first
 * head with its highest head past the middle of its published flows (`rising-curve`, {@link PEAK_BY}, judged to 1 part
 * in 10⁸ of the half span: a curve rising
 * along most of its length, a system curve or swapped columns).
 * Why (common practice, from memory): drooping (unstable) curves are common in low-specific-speed radial pumps and
 * suit many single-pump services, not parallel operation, where the shut-off head may be below the head the running
 * pumps hold; such a pump may hunt between two flows of one head. The bounds
 * {@link DROOP_MAX} and {@link PEAK_BY} are ours (from memory, see each).
 *
 * Monotone in `allow`: a curve taken with a smaller allowance is taken with any larger one (the highest head and where
 * it lies do not depend on it; a larger allowance begins the fall later, from a lowest head no lower), so every curve the
 * importer takes at 5 % the engine takes at 10 % (test: engine/headShape.test.ts).
 */
import { pastAbove } from "./limitText.ts";
import { fmtPctLimit } from "./pctText.ts";
import { qt } from "./quantityText.ts";

/**
 * The highest a drooping curve's peak may lie above its first head, as a fraction of that head: 25 %. Makers' drooping
 * curves peak some 5–15 % above shut-off (low-specific-speed radial impellers; common practice, from memory), seldom
 * over 20 %; a head further above shut-off is more likely a mistyped value or a column read in the wrong unit (from
 * memory: no published source for the bound). Judged to 1 part in 10⁸ of it (limitText.ts `pastAbove`).
 */
export const DROOP_MAX = 0.25;

/**
 * Where a drooping curve's peak may lie at the latest, as a fraction of the published flow span from the first flow:
 * 50 %. A drooping curve peaks well left of its BEP (common practice, from memory: some 20–60 % of BEP flow), and a
 * published curve runs on past its BEP, so a curve whose highest head lies past the middle of its flows rises along
 * most of its length: a system curve, or head and flow columns swapped (ours).
 */
export const PEAK_BY = 0.5;

/** Why a head is refused: `above-droop` and `second-rise` at a point, `rising-curve` at the curve's end (see the module). */
export type HeadRefusal =
  | { kind: "above-droop"; head: number; first: number; limit: number }
  | { kind: "second-rise"; head: number; low: number; lowAt: number; peak: number; peakAt: number; rise: number; allow: number }
  | { kind: "rising-curve"; first: number; peak: number; peakAt: number; peakFlow: number; flowFirst: number; flowLast: number; by: number };

/**
 * One curve's heads taken in flow order (`take`), each judged before it is taken (`judge`), and the curve's shape judged
 * once all are taken (`end`). Indexes `at` are the caller's (a point's position, a source line).
 */
export class HeadShape {
  readonly first: number;
  readonly allow: number;
  /** The highest head so far and where it was first reached (the peak). */
  peak: number;
  peakAt: number;
  peakFlow: number;
  /** The first and last flows taken, m³/s. */
  readonly flowFirst: number;
  flowLast: number;
  /** The lowest head so far (the old running minimum) and, once falling, the lowest since the fall began. */
  private lowest: number;
  private falling = false;
  low = Infinity;
  lowAt = -1;

  /**
   * @param first the curve's first head, m (> 0)
   * @param flow the first point's flow, m³/s
   * @param allow the rounding allowance, m
   * @param at the first point's index
   */
  constructor(first: number, flow: number, allow: number, at: number) {
    this.first = this.peak = this.lowest = first;
    this.peakAt = at;
    this.peakFlow = this.flowFirst = this.flowLast = flow;
    this.allow = allow;
  }

  /** Whether the curve droops beyond the allowance: its peak more than `allow` above its first head (the shape's rules). */
  get drooping(): boolean {
    return this.peak - this.first > this.allow;
  }


  /** The limit of a drooping peak, m: DROOP_MAX × the first head. */
  get droopLimit(): number {
    return DROOP_MAX * this.first;
  }

  /** Why `head` would be refused as the next point, or null where it is taken; nothing changes. */
  judge(head: number): HeadRefusal | null {
    if (!this.falling && head >= this.peak - this.allow) {
      // still rising (or level within the allowance): a rise within the allowance above the lowest head is rounding
      // (the old rule, kept for a large allowance), else the peak's bound
      if (head - this.lowest <= this.allow || !pastAbove(head - this.first, this.droopLimit)) return null;
      return { kind: "above-droop", head, first: this.first, limit: this.droopLimit };
    }
    const low = this.falling ? this.low : head;
    if (head - low > this.allow) {
      return { kind: "second-rise", head, low, lowAt: this.lowAt, peak: this.peak, peakAt: this.peakAt, rise: head - low, allow: this.allow };
    }
    return null;
  }

  /** Takes a head `judge` let through. @param flow its flow, m³/s @param at its index */
  take(head: number, flow: number, at: number): void {
    this.flowLast = flow;
    if (head < this.lowest) this.lowest = head;
    if (!this.falling && head >= this.peak - this.allow) {
      if (head > this.peak) {
        this.peak = head;
        this.peakAt = at;
        this.peakFlow = flow;
      }
      return;
    }
    if (!this.falling || head < this.low) {
      this.low = head;
      this.lowAt = at;
    }
    this.falling = true;
  }

  /** Why the whole curve is refused once every point is taken, or null: a rise beyond the allowance peaking past PEAK_BY of its flows. */
  end(): Extract<HeadRefusal, { kind: "rising-curve" }> | null {
    if (!this.drooping) return null;
    const by = this.flowFirst + PEAK_BY * (this.flowLast - this.flowFirst);
    if (!pastAbove(this.peakFlow - this.flowFirst, by - this.flowFirst)) return null; // to 1 part in 10⁸ of the half span
    return { kind: "rising-curve", first: this.first, peak: this.peak, peakAt: this.peakAt, peakFlow: this.peakFlow, flowFirst: this.flowFirst, flowLast: this.flowLast, by };
  }
}

/**
 * A head or curve refused by the shape, in the engine's words with its numbers (the importer words its own, point-rules.ts).
 * @param r the refusal (heads m, flows m³/s)
 * @param riseTol the allowance as a fraction of the first head (dimensionless)
 */
export function headRefusalText(r: HeadRefusal, riseTol: number): string {
  switch (r.kind) {
    case "above-droop":
      return `head ${qt("head", r.head)} is more than ${fmtPctLimit(DROOP_MAX)} above the first point's head (${qt("head", r.first)}): a drooping curve peaks at most that far above it (${qt("head", r.first + r.limit)})`;
    case "second-rise":
      return `head rises again to ${qt("head", r.head)} after falling to ${qt("head", r.low)} from its peak ${qt("head", r.peak)}: more than ${fmtPctLimit(riseTol)} of the first point's head; a curve rises at most once, from its first point to one peak`;
    case "rising-curve":
      return `head rises from ${qt("head", r.first)} to its highest, ${qt("head", r.peak)} at ${qt("flow", r.peakFlow)}, past the middle of its flows (${fmtPctLimit(PEAK_BY)} of ${qt("flow", r.flowFirst)}–${qt("flow", r.flowLast)}): a curve rising along most of its length is no pump curve (a system curve, or columns swapped)`;
  }
}
