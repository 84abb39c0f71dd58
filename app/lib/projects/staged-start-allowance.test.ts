// A pump in parallel started while others run cannot open its check valve when the head they hold is at or above its
// shut-off head (common practice: a pump whose shut-off head equals the head against it delivers zero flow, so it cannot
// open its check valve against it; arrangement-start.ts `parallelStaging`), to LIMIT_ROUNDING (1 part in 10⁸, engine
// limitText.ts `pastBelow`). Pumps in series left running when one stops are flagged by the same rule: their shut-off
// head at or below the system's head at zero flow. Before, parallel took equal heads as a start while series flagged
// them. Check values: the rule (common practice); the curve is the invented drooping pump of test/droop-pump.ts (40 m
// shut-off, 41.9 m peak), the system a static head and one pipe run (aged as new, so both band edges alike); in
// parallel its static set so that one pump alone holds the head wanted, on its falling branch past the hump (geometry:
// the crossing's flow read off the curve, the pipe's loss there taken off); in series the static head is the system's
// head at zero flow.
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

describe("pump 2 of 2 against the head pump 1 holds: flagged at or above the shut-off, to 1 part in 10⁸", () => {
  // Relative offsets of the held head from the 40 m shut-off; at it and within the allowance on both sides, flagged (no
  // flow at equal heads); past it below, not.
  const cases: [number, boolean][] = [[-1e-6, false], [-2 * LIMIT_ROUNDING, false], [-1e-12, true], [0, true], [1e-12, true], [0.5 * LIMIT_ROUNDING, true], [2 * LIMIT_ROUNDING, true], [1e-6, true], [1e-4, true]];
  for (const [off, flagged] of cases)
    it(`held head 40 m × (1 ${off < 0 ? "−" : "+"} ${Math.abs(off)}): ${flagged ? "cannot open its check valve" : "starts"}`, () => {
      const c = ctx(SHUTOFF * (1 + off));
      const staged = parallelStaging(c);
      expect(staged.map((s) => s.running)).toEqual(flagged ? [1, 1] : []);
      if (!flagged) return;
      // The words name the held head apart from the shut-off, above it, and the allowance.
      const [line] = arrangementStartWarnings(c, staged).map(inSI);
      const side = off > LIMIT_ROUNDING ? "above" : "at"; // within the allowance the held head is at the shut-off
      expect(line).toMatch(new RegExp(`holds 40\\.0\\d* m at [\\d.]+ m³/h \\(least lift, new pipe\\) and 40\\.0\\d* m at [\\d.]+ m³/h \\(most lift, aged pipe\\), ${side} one pump's shut-off head 40\\.0 m: pump 2 of 2`));
      expect(line).toContain("at or above its shut-off head, to 1 part in 10⁸, it delivers no flow");
    });
});

describe("2 pumps in series, one stopped: the one left is flagged by the same rule, its shut-off head at or below the system's at zero flow", () => {
  // Relative offsets of the static head (the system's head at zero flow) from the 40 m shut-off: at it, and above it,
  // flagged; 1e-6 below it, the pump left starts.
  const series = (off: number) => ({ mode: "open" as const, prepared: prepareSystem({ fluid: water, staticHead: SHUTOFF * (1 + off), discharge: RUN }), curve, arrangement: "series" as const, n: 2 });
  const cases: [number, boolean][] = [[-1e-6, false], [0, true], [0.5 * LIMIT_ROUNDING, true], [-0.5 * LIMIT_ROUNDING, true], [1e-6, true]];
  for (const [off, flagged] of cases)
    it(`system at zero flow 40 m × (1 ${off < 0 ? "−" : "+"} ${Math.abs(off)}): ${flagged ? "no flow passes" : "the pump left delivers"}`, () => {
      const w = arrangementStartWarnings(series(off)).map(inSI);
      expect(w.length).toBe(flagged ? 1 : 0);
      if (flagged) expect(w[0]).toMatch(/^At both edges of the band, with one of the 2 pumps in series stopped or tripped, the pump left running gives (40|39\.9)[\d.]* m at zero flow against the system's (40|39\.9)[\d.]* m \(least lift, new pipe\)/);
    });
  it("the same case both ways: held head = shut-off head in parallel is flagged as series flags it", () => {
    expect(parallelStaging(ctx(SHUTOFF)).length).toBe(2);
    expect(arrangementStartWarnings(series(0)).length).toBe(1);
  });
});
