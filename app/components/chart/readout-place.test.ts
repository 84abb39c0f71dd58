/**
 * Readout box placement (readout-place.ts). Geometry by construction: head panel y 22–322 px,
 * plot x 56–702 px in a 720 px wide chart; a straight head line from (56, 82) to (637.4, 202) px
 * (midpoint 346.7, 142); a duty point at 450 m³/h, 45 m lands at (419.4, 52) px.
 */
import { describe, expect, it } from "vitest";
import { buildChartModel, type ChartModelInput } from "./model.ts";
import { placeReadout } from "./readout-place.ts";
import type { PumpSeries } from "./types.ts";
import { UNIT_SYSTEMS } from "../../engine/units.ts";
const SI_UNITS = UNIT_SYSTEMS.SI;

const linePump = (id = "p1"): PumpSeries => ({
  id,
  label: id,
  head: [
    { flow: 0, y: 40 },
    { flow: 0.2, y: 20 },
  ],
});
const modelOf = (over: Partial<ChartModelInput> = {}) => buildChartModel({ unitSystem: SI_UNITS, pumps: [linePump()], ...over });

describe("placeReadout (100 × 50 px box, cursor at x 379 px)", () => {
  it("with nothing under it, the box goes right of the cursor (379 + 14 px) at the top of the panel (22 + 6 px)", () => {
    expect(placeReadout(modelOf(), new Set(), 379, 100, 50)).toEqual({ bx: 393, by: 28 });
  });
  it("a duty point under that spot moves the box to the bottom of the panel (322 − 6 − 50 = 266 px)", () => {
    const m = modelOf({ duty: { flow: 0.125, head: 45 } });
    expect(m.x(m.duty!.flow)).toBeCloseTo(419.375, 9);
    expect(placeReadout(m, new Set(), 379, 100, 50)).toEqual({ bx: 393, by: 266 });
  });
  it("a hidden pump's curve does not count: its curve under the top-right spot is ignored", () => {
    // A second pump, flat at 46 m (y 46 px), with a point every 0.01 m³/s (every 29.07 px): the
    // readout scores curve points and segment midpoints, so some fall inside x 393–493 px.
    const high: PumpSeries = { id: "hi", label: "hi", head: Array.from({ length: 21 }, (_, i) => ({ flow: i * 0.01, y: 46 })) };
    const m = modelOf({ pumps: [linePump(), high] });
    expect(placeReadout(m, new Set(), 379, 100, 50)).not.toEqual({ bx: 393, by: 28 });
    expect(placeReadout(m, new Set(["hi"]), 379, 100, 50)).toEqual({ bx: 393, by: 28 });
  });
  it("a box too wide for either side goes against the farther edge (cursor at 600 px: left, 56 + 2; at 100 px: right, 720 − 2 − 700)", () => {
    expect(placeReadout(modelOf(), new Set(), 600, 600, 50).bx).toBe(58);
    expect(placeReadout(modelOf(), new Set(), 100, 700, 50).bx).toBe(18);
  });
  it("a box taller than the panel allows only the top spot", () => {
    expect(placeReadout(modelOf({ duty: { flow: 0.125, head: 45 } }), new Set(), 379, 100, 295).by).toBe(28);
  });
});
