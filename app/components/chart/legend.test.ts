/**
 * The legend's one-line operating point (Legend.tsx opSummary). Conversions: 0.1 m³/s = 360 m³/h
 * (SI definition of the hour), 36 000 W = 36 kW; numbers as the app's fmtQ writes them (format.ts: ≥100 none, ≥10 1 decimal, 2 below).
 */
import { describe, expect, it } from "vitest";
import { opSummary } from "./Legend.tsx";
import { buildChartModel, type ChartModelInput } from "./model.ts";
import type { PumpSeries } from "./types.ts";
import { UNIT_SYSTEMS } from "../../engine/units.ts";
const SI_UNITS = UNIT_SYSTEMS.SI;

const head = [
  { flow: 0, y: 40 },
  { flow: 0.2, y: 20 },
];
const summary = (p: Partial<PumpSeries>, over: Partial<ChartModelInput> = {}) => {
  const m = buildChartModel({ unitSystem: SI_UNITS, pumps: [{ id: "a", label: "a", head, ...p }], ...over });
  return opSummary(m.pumps[0], m);
};

describe("opSummary", () => {
  it("lists flow, head, efficiency, power and NPSHr in display units", () => {
    expect(summary({ operating: { flow: 0.1, head: 30, efficiency: 0.75, power: 36000, npshr: 2.5 } })).toBe(
      "360 m³/h at 30.0 m · η 75.0 % · 36.0 kW · NPSHr 2.50 m",
    );
  });
  it("leaves out what the operating point does not carry", () => {
    expect(summary({ operating: { flow: 0.1, head: 30 } })).toBe("360 m³/h at 30.0 m");
  });
  it("says so when a pump misses the system curve, and says nothing without a system curve", () => {
    expect(summary({ operating: null }, { system: { design: head } })).toBe("no operating point on the system curve");
    expect(summary({ operating: null })).toBeNull();
  });
});
