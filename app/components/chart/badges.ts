/**
 * Where each pump's numbered badge goes on the head panel: just past the right end of its head
 * curve (or above the end when that is too near the plot's right edge), kept inside the panel,
 * then nudged apart so no two badges overlap. Pure (px in, px out).
 */
import type { ChartModel, DisplayPump, PanelLayout } from "./model.ts";
import { clamp } from "./paths.ts";

/** Badge diameter plus a little air (px): closer badges are pushed apart. */
export const BADGE_SPACING = 16;
/** Badge radius (px), so a badge centre stays this far inside the plot. */
const BADGE_R = 7;

export type BadgePlace = { p: DisplayPump; bx: number; by: number };

/** Badge centres, sorted top to bottom. Pumps whose head curve shows no point in the panel get none. */
export function placeBadges(model: ChartModel, panel: PanelLayout, pumps: DisplayPump[]): BadgePlace[] {
  const { x } = model;
  const y = panel.y;
  const [x0, x1] = x.range() as [number, number];
  const top = panel.top;
  const bottom = panel.top + panel.height;
  const inY = (v: number) => v >= y.domain()[0] && v <= y.domain()[1];
  const S = BADGE_SPACING;

  const badges = pumps
    .map((p) => {
      const pts = p.head.filter((q) => q.flow <= model.flowMax && inY(q.y));
      const end = pts[pts.length - 1];
      if (!end) return null;
      const ex = x(end.flow);
      const right = ex + S <= x1;
      return { p, bx: right ? ex + 10 : ex - 4, by: y(end.y) - (right ? 0 : 10) };
    })
    .filter((b): b is BadgePlace => b !== null)
    .map((b) => ({ ...b, bx: clamp(b.bx, x0 + BADGE_R, x1 - BADGE_R), by: clamp(b.by, top + BADGE_R, bottom - BADGE_R) }))
    .sort((a, b) => a.by - b.by);
  // Push overlapping badges down, then, if the stack runs past the panel, back up.
  for (let i = 1; i < badges.length; i++) {
    if (Math.abs(badges[i].bx - badges[i - 1].bx) < S && badges[i].by - badges[i - 1].by < S) {
      badges[i].by = badges[i - 1].by + S;
    }
  }
  for (let i = badges.length - 1; i >= 0; i--) {
    const limit = i === badges.length - 1 ? bottom - BADGE_R : badges[i + 1].by - (Math.abs(badges[i + 1].bx - badges[i].bx) < S ? S : 0);
    if (badges[i].by > limit) badges[i].by = limit;
  }
  return badges;
}
