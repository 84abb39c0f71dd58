// A pump in parallel started while others run cannot open its check valve when the head they hold is above its shut-off
// head (common practice, from memory: arrangement-start.ts `parallelStaging`). That comparison had no allowance: a held
// head 1 part in 10¹² above the shut-off was "cannot open" and one 1e-12 below was not, so round-off alone decided the
// staged start. Now above by more than LIMIT_ROUNDING (1 part in 10⁸, engine limitText.ts `pastAbove`): within it the held
// head is at the shut-off, as the solver's own start rule takes a shut-off head equal to the system's to rounding (it
// starts, at zero flow). Check values: the rule (common practice); the curve is the invented drooping pump of
// test/droop-pump.ts (40 m shut-off, 41.9 m peak), the system a static head and one pipe run (aged as new, so both band
// edges alike), its static set so that one pump alone holds the head wanted, on its falling branch past the hump
// (geometry: the crossing's flow read off the curve, the pipe's loss there taken off).
import { describe, expect, it } from "vitest";
import { createPumpCurve, flowsAtHead, fluidAt, prepareSystem, systemHeadFunction } from "~/engine";
import { inSI, LIMIT_ROUNDING } from "~/engine/quantityText";
import { DROOP_ROWS } from "~/test/droop-pump";
import { arrangementStartWarnings, parallelStaging } from "./arrangement-start";

const M3H = 1 / 3600; // m³/s per m³/h
const SHUTOFF = 40; // m, droop-pump.ts's first row
const curve = createPumpCurve({ points: DROOP_ROWS.map(([q, h]) => ({ flow: q * M3H, head: h })), riseTolerance: 1 });
const water = fluidAt({ kind: "water" }, 20);
const RUN = [{ length: 50, diameter: 0.1, roughness: 4.5e-5 }]; // m: an invented DN100 steel run
const loss = systemHeadFunction(prepareSystem({ fluid: water, staticHead: 0, discharge: RUN }));
/** Two duty pumps in parallel on a system where one pump alone holds `held` m (both band edges alike). */
function ctx(held: number) {
  const q = Math.max(...flowsAtHead(curve, held)); // past the hump
  return { mode: "open" as const, prepared: prepareSystem({ fluid: water, staticHead: held - loss(q), discharge: RUN }), curve, arrangement: "parallel" as const, n: 2 };
}

describe("pump 2 of 2 against the head pump 1 holds: flagged only above the shut-off by more than 1 part in 10⁸", () => {
  // Relative offsets of the static head (= the held head) from the 40 m shut-off; within the allowance on both sides, the
  // same answer (not flagged); past it above, flagged; past it below, not.
  const cases: [number, boolean][] = [[-2 * LIMIT_ROUNDING, false], [-1e-12, false], [1e-12, false], [0.5 * LIMIT_ROUNDING, false], [2 * LIMIT_ROUNDING, true], [1e-4, true]];
  for (const [off, flagged] of cases)
    it(`held head 40 m × (1 ${off < 0 ? "−" : "+"} ${Math.abs(off)}): ${flagged ? "cannot open its check valve" : "starts"}`, () => {
      const c = ctx(SHUTOFF * (1 + off));
      const staged = parallelStaging(c);
      expect(staged.map((s) => s.running)).toEqual(flagged ? [1, 1] : []);
      if (!flagged) return;
      // The words name the held head apart from the shut-off, above it, and the allowance.
      const [line] = arrangementStartWarnings(c, staged).map(inSI);
      expect(line).toMatch(/holds 40\.0\d* m at [\d.]+ m³\/h \(least lift, new pipe\) and 40\.0\d* m at [\d.]+ m³\/h \(most lift, aged pipe\), above one pump's shut-off head 40\.0 m: pump 2 of 2/);
      expect(line).toContain("above its shut-off head by more than 1 part in 10⁸");
    });
});
