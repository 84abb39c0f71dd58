// A speed or trim that cannot be solved because the system's head at the duty flow is above what the pump gives there
// says both heads apart in the reader's units: 1 mm above the curve read "28.0 m is above what the pump at full speed
// gives (28.0 m per pump …)", in US units "91.9 ft … (91.9 ft …)". In series each pump's share is another number and
// reads as before. Check values: an invented straight-line curve H = 40 − 1000·Q (28 m at 0.012 m³/s, hand-worked); the
// affinity laws (common practice) cannot raise a curve above its full speed or impeller.
import { describe, expect, test } from "vitest";
import { createPumpCurve } from "~/engine";
import { renderUnits, SI_UNITS, US_UNITS } from "~/lib/shared/units";
import { adjustedRatio } from "./candidate-solve";
import { DEFAULT_ADJUSTMENT } from "./candidate-input";

const CURVE = createPumpCurve({ points: [0, 0.01, 0.02, 0.03].map((q) => ({ flow: q, head: 40 - 1000 * q })) });
const NUM = String.raw`(\d+(?:\.\d+)?)`;

describe("the duty 1 mm above the full-speed curve", () => {
  for (const method of ["speed", "trim"] as const) {
    test(`${method}: the system's head reads above the pump's, in SI and US units`, () => {
      const r = adjustedRatio(CURVE, { ...DEFAULT_ADJUSTMENT, method }, { flow: 0.012, systemHead: 28.001, edge: "most lift, aged pipe", typedHead: 28 }, null);
      expect(r.ratio).toBe(1);
      for (const [name, units] of Object.entries({ SI: SI_UNITS, US: US_UNITS })) {
        const note = renderUnits(r.note!, units);
        const m = note.match(new RegExp(`^could not be solved: the system's head at the duty flow \\S+ \\S+, ${NUM} \\S+ at most lift, aged pipe \\(typed duty head \\S+ \\S+\\) is above what the .*? gives \\(${NUM} \\S+ per pump`));
        expect(m, `${name}: ${note}`).not.toBeNull();
        expect(Number(m![1]), `${name}: ${note}`).toBeGreaterThan(Number(m![2]));
      }
    });
  }
});
