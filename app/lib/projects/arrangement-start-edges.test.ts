// Start warnings of pumps in parallel or series (arrangement-start.ts) where both edges of the band fail: said once, naming
// both edges with each edge's numbers, in the candidate's warnings and cautions (every surface shows those: the candidates
// table, the report, the CSV, the APIs). Check values: the rules are common practice, from memory (in parallel a pump starts
// against the head of those running; in series the rest must lift the liquid alone). The curves are invented; the heads and
// flows quoted are read off them (geometry) and are the ones the old per-edge lines showed.
import { describe, expect, it } from "vitest";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, evaluateCandidate, type SystemInput } from "./hydraulics";
import { inSI } from "~/engine/quantityText";
import { DROOP_ROWS } from "~/test/droop-pump";

const M3H = 1 / 3600;
const sys = (o: Partial<SystemInput>): SystemInput => ({ ...defaultSystemInput(), ...o });
/** droop-pump.ts: 40 m shut-off rising to a 41.9 m peak (invented), flow m³/h → m³/s. */
const DROOP = { points: DROOP_ROWS.map(([q, h, e]) => ({ flow: q * M3H, head: h, efficiency: e / 100, power: null, npshr: null })), speed: 2900, impellerDiameter: 0.2 };
const lines = (xs: readonly string[] | undefined, re: RegExp) => (xs ?? []).map(inSI).filter((x) => re.test(x));

describe("two drooping pumps in parallel: pump 2 cannot start at both edges", () => {
  const parallel = (low: number, high: number) => evaluateCandidate(sys({ staticLow: low, staticHigh: high, duty: { flow: 40 * M3H, head: 40 } }), DROOP, { ...DEFAULT_ADJUSTMENT, arrangement: "parallel", dutyPumps: 2 });
  it("37–38 m static: one line naming both edges, each with the head pump 1 holds and its flow (40.5 m at 56.1 m³/h; 41.5 m at 46.7 m³/h)", () => {
    const e = parallel(37, 38);
    const w = lines(e.warnings, /cannot open its check valve/);
    expect(w).toEqual([ // old code: two lines, "At least lift, new pipe, with 1 pump running … holds 40.5 m at 56.1 m³/h, …" and "At most lift, aged pipe, … 41.5 m at 46.7 m³/h, …"
      "At both edges of the band, with 1 pump running in parallel the system holds 40.5 m at 56.1 m³/h (least lift, new pipe) and 41.5 m at 46.7 m³/h (most lift, aged pipe), above one pump's shut-off head 40.0 m: pump 2 of 2, started then, cannot open its check valve, so only 1 of the 2 deliver and it runs at zero flow against its closed check valve (dead-head), churning and heating the liquid, below any minimum continuous flow (common practice: a pump in parallel starts against the head of those running; at or above its shut-off head, to 1 part in 10⁸, it delivers no flow)",
    ]);
    expect(lines(e.cautions, /cannot open its check valve/)).toEqual(w); // the search row's and the verdict's cautions: the same one line
  });
  it("the flip: 36–37 m static, one pump alone holds less than 40 m at least lift: the one edge that fails, named as before", () => {
    const w = lines(parallel(36, 37).warnings, /cannot open its check valve/);
    expect(w).toHaveLength(1);
    expect(w[0]).toMatch(/^At most lift, aged pipe, with 1 pump running in parallel the system holds 41\.2 m at 50\.8 m³\/h, above one pump's shut-off head 40\.0 m: pump 2 of 2/);
  });
});

describe("two pumps in series, one stopped: the other cannot lift the static at both edges", () => {
  const series = (low: number, high: number) => evaluateCandidate(sys({ staticLow: low, staticHigh: high, duty: { flow: 0.01, head: 60 } }), { points: [[0, 40], [0.01, 37], [0.02, 30], [0.03, 20]].map(([flow, head]) => ({ flow, head, efficiency: null, power: null, npshr: null })), speed: null, impellerDiameter: null }, { ...DEFAULT_ADJUSTMENT, arrangement: "series", dutyPumps: 2 });
  it("50–55 m static: one line with the 40 m shut-off against the system's 50 m and 55 m, each edge named", () => {
    const e = series(50, 55);
    const w = lines(e.warnings, /stopped or tripped/);
    expect(w).toEqual([ // old code: two lines, "At least lift, new pipe, … against the system's 50.0 m: …" and "At most lift, aged pipe, … 55.0 m: …"
      "At both edges of the band, with one of the 2 pumps in series stopped or tripped, the pump left running gives 40.0 m at zero flow against the system's 50.0 m (least lift, new pipe) and 55.0 m (most lift, aged pipe): no flow passes, and it runs at zero flow against its closed check valve (dead-head), churning and heating the liquid, below any minimum continuous flow — trip the rest with it (common practice: pumps in series need each other's head)",
    ]);
    expect(lines(e.cautions, /stopped or tripped/)).toEqual(w);
  });
  it("the flip: 35–45 m static, only most lift is above its 40 m shut-off: that edge alone, named as before", () => {
    expect(lines(series(35, 45).warnings, /stopped or tripped/)).toEqual([
      "At most lift, aged pipe, with one of the 2 pumps in series stopped or tripped, the pump left running gives 40.0 m at zero flow against the system's 45.0 m: no flow passes, and it runs at zero flow against its closed check valve (dead-head), churning and heating the liquid, below any minimum continuous flow — trip the rest with it (common practice: pumps in series need each other's head)",
    ]);
  });
});
