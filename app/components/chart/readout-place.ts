/**
 * Where the crosshair's readout box goes: tries right/left of the cursor × top/bottom of the head
 * panel and keeps the spot that hides the fewest curve points and marks (marks weigh 8, the
 * system band edges ½, curve points and segment midpoints 1). Pure (px in, px out).
 */
import type { ChartModel } from "./model.ts";
import type { Pt } from "./types.ts";

/**
 * Where the readout box covers least: tries right/left of the cursor × top/bottom of the head
 * panel and counts the curve points and marks (weighted) the box would hide.
 */
export function placeReadout(
  model: ChartModel,
  hidden: ReadonlySet<string>,
  cx: number,
  boxW: number,
  boxH: number,
): { bx: number; by: number } {
  const head = model.panels[0];
  const [x0] = model.x.range() as [number, number];
  const minX = x0 + 2;
  const maxX = model.width - 2;
  const top = head.top + 6;
  const bottom = head.top + head.height - 6 - boxH;
  const xs = [cx + 14, cx - 14 - boxW].filter((bx) => bx >= minX && bx + boxW <= maxX);
  if (xs.length === 0) xs.push(cx - minX > maxX - cx ? minX : maxX - boxW);
  const ys = bottom > top ? [top, bottom] : [top];
  const pts: { x: number; y: number; w: number }[] = [];
  const addSeries = (s: Pt[], w: number) => {
    for (let i = 0; i < s.length; i++) {
      pts.push({ x: model.x(s[i].flow), y: head.y(s[i].y), w });
      if (i > 0) pts.push({ x: model.x((s[i].flow + s[i - 1].flow) / 2), y: head.y((s[i].y + s[i - 1].y) / 2), w });
    }
  };
  for (const p of model.pumps) {
    if (hidden.has(p.id)) continue;
    addSeries(p.head, 1);
    if (p.operating) pts.push({ x: model.x(p.operating.flow), y: head.y(p.operating.head), w: 8 });
  }
  if (model.system) {
    addSeries(model.system.design, 1);
    addSeries(model.system.low, 0.5);
    addSeries(model.system.high, 0.5);
  }
  if (model.duty) pts.push({ x: model.x(model.duty.flow), y: head.y(model.duty.head), w: 8 });
  let best = { bx: xs[0], by: ys[0], score: Infinity };
  for (const bx of xs)
    for (const by of ys) {
      let score = 0;
      for (const q of pts) {
        const pad = q.w > 1 ? 8 : 0; // keep clear of marks' edges too
        if (q.x >= bx - pad && q.x <= bx + boxW + pad && q.y >= by - pad && q.y <= by + boxH + pad) score += q.w;
      }
      if (score < best.score) best = { bx, by, score };
    }
  return { bx: best.bx, by: best.by };
}
