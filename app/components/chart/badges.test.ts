/**
 * Pump badge placement (badges.ts). Geometry by construction: a straight head line ending at
 * 0.2 m³/s = 720 m³/h on an axis 0–800 m³/h over x 56–702 px ends at x 637.4 px; head axis
 * 0–50 m over y 322–22 px puts 20 m at y 202 px and 0 m at 322 px.
 */
import { describe, expect, it } from "vitest";
import { placeBadges, BADGE_SPACING } from "./badges.ts";
import { buildChartModel } from "./model.ts";
import type { PumpSeries } from "./types.ts";
import { UNIT_SYSTEMS } from "../../engine/units.ts";
const SI_UNITS = UNIT_SYSTEMS.SI;

const line = (id: string, h1 = 20, q1 = 0.2, h0 = 40): PumpSeries => ({
  id,
  label: id,
  head: [
    { flow: 0, y: h0 },
    { flow: q1, y: h1 },
  ],
});
const place = (pumps: PumpSeries[]) => {
  const m = buildChartModel({ unitSystem: SI_UNITS, pumps });
  return placeBadges(m, m.panels[0], m.pumps).map((b) => ({ id: b.p.id, bx: b.bx, by: b.by }));
};

describe("placeBadges", () => {
  it("a badge sits 10 px right of its curve's last point (637.4 + 10 = 647.4 px, y 202 px)", () => {
    const [b] = place([line("a")]);
    expect(b.bx).toBeCloseTo(647.4, 9);
    expect(b.by).toBe(202);
  });
  it(`two curves ending at the same point: the second badge goes ${BADGE_SPACING} px lower (202 → 218 px)`, () => {
    expect(place([line("a"), line("b")]).map((b) => b.by)).toEqual([202, 218]);
  });
  it("at the bottom of the panel the stack is pushed back up: both end at 0 m → 315 and 299 px (322 − 7 badge radius, − 16)", () => {
    const bs = place([line("a", 0), line("b", 0)]);
    expect(bs.map((b) => [b.id, b.by])).toEqual([
      ["a", 299],
      ["b", 315],
    ]);
  });
  it("a curve ending at the plot's right edge (800 m³/h) puts its badge above the end, inside the plot (702 − 7 = 695 px, 202 − 10 px)", () => {
    const [b] = place([line("a", 20, 800 / 3600)]);
    expect(b.bx).toBe(695);
    expect(b.by).toBe(192);
  });
  it("no pumps, or a pump with an empty or all-NaN head curve, get no badge", () => {
    expect(place([])).toEqual([]);
    expect(place([line("a"), { id: "e", label: "e", head: [] }]).map((b) => b.id)).toEqual(["a"]);
    expect(place([line("a"), { id: "n", label: "n", head: [{ flow: Number.NaN, y: 10 }, { flow: 0.1, y: Number.NaN }] }]).map((b) => b.id)).toEqual(["a"]);
  });
});
