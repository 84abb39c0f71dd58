// Test fixtures shared by the chart's tests (not shipped: only *.test.ts import this).
import type { PumpSeries } from "./types.ts";

/** A straight head line 40 m at 0 → 20 m at 0.2 m³/s: 30 m at 0.1 m³/s by construction. */
export const linePump = (over: Partial<PumpSeries> = {}): PumpSeries => ({
  id: "p1",
  label: "Line pump",
  head: [
    { flow: 0, y: 40 },
    { flow: 0.2, y: 20 },
  ],
  ...over,
});
