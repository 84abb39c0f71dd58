// A candidate signed off only where its pump can run (pure): the band, verdict and motor check through evaluateCandidate,
// and the arrangement's start checks. Check values: the rules are common practice, from memory — a pump starts against a
// closed check valve, so its shut-off head must exceed the system's head at zero flow; a crossing where the pump's head rises
// above the system's again is unstable; at zero flow it dead-heads (no delivery). Curves and systems are invented; heads
// quoted are read off them (geometry).
import { describe, expect, it } from "vitest";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, evaluateCandidate, type SystemInput } from "./hydraulics";
import { runsPastCurveEnd } from "./motor-overload";
import { createPumpCurve, prepareSystem } from "~/engine";
import { systemSpec } from "./system-input";
import { inSI } from "~/engine/quantityText";

const pts = (rows: number[][], eff?: number[]) => rows.map(([flow, head], i) => ({ flow, head, efficiency: eff ? eff[i] : null, power: null, npshr: null }));
/** The engine's curve of those points (flow and head only; a drooping curve allowed, as evaluateCandidate does). */
const pumpOf = (points: ReturnType<typeof pts>) => createPumpCurve({ points: points.map(({ flow, head }) => ({ flow, head })), riseTolerance: 1 });
const set = (points: ReturnType<typeof pts>) => ({ points, speed: null, impellerDiameter: null });
const sys = (o: Partial<SystemInput>): SystemInput => ({ ...defaultSystemInput(), ...o });
/** Drooping, m³/s and m: 40 m at shut-off, 44 m at its peak. */
const A1 = pts([[0, 40], [0.005, 43], [0.01, 44], [0.015, 42], [0.02, 37], [0.025, 30]]);
const txt = (xs: readonly string[] | undefined) => (xs ?? []).map(inSI);

describe("A1: a drooping pump whose shut-off head is below the static head", () => {
  const at = (low: number, high: number) => evaluateCandidate(sys({ staticLow: low, staticHigh: high, duty: { flow: 0.0095, head: 43 } }), set(A1), DEFAULT_ADJUSTMENT);
  it("41–42 m static: no operating point at either edge, the reason naming both heads and the unreached crossings", () => {
    const e = at(41, 42);
    expect(e.verdict?.status).toBe("no-operating-point"); // old code: "meets" ("Delivers 35.0 m³/h at most lift…")
    expect(e.band.map((b) => b.flow)).toEqual([null, null]);
    expect(txt(e.verdict?.reasons)[0]).toMatch(/^At least lift, new pipe: shut-off head 40\.0 m is below the system's 41\.0 m at zero flow: the pump cannot open its check valve; the curves cross at .* which it never reaches from rest; the first is unstable/);
  });
  it("the flip: 39.9–42 m static starts at least lift (40 m > 39.9 m) but still not at most lift; 39.5–39.9 m starts at both", () => {
    expect(at(39.9, 42).verdict?.status).toBe("no-operating-point");
    expect(at(39.9, 42).band[0].flow).not.toBeNull();
    expect(at(39.5, 39.9).verdict?.status).not.toBe("no-operating-point");
  });
});

describe("A1's texts beside its verdict: the rule and the drooping-curve warning say what is judged", () => {
  const at = (low: number, high: number) => evaluateCandidate(sys({ staticLow: low, staticHigh: high, duty: { flow: 0.0095, head: 43 } }), set(A1), DEFAULT_ADJUSTMENT);
  const drooping = (e: ReturnType<typeof at>) => txt(e.warnings).filter((w) => /drooping curve/.test(w));
  it("41–42 m static: the rule names a point reached from rest, not a crossing (the curves do cross, out of reach)", () => {
    const e = at(41, 42);
    expect(e.allIntersections.length).toBeGreaterThan(0); // control: the curves cross
    expect(e.verdict?.rule).not.toMatch(/must cross the system curve/); // old code: "no-operating-point: the pump curve must cross the system curve at every edge of the band"
    expect(e.verdict?.rule).toMatch(/^no-operating-point: at every edge of the band the pump must reach an operating point from rest — started against a closed check valve/);
  });
  it("41–42 m static: one drooping-curve warning, true beside 'no operating point' — it names the 40 m shut-off head and that a static above it leaves the pump unable to start", () => {
    const w = drooping(at(41, 42));
    expect(w).toHaveLength(1);
    expect(w[0]).not.toMatch(/more than one operating point is possible/); // old code: "…: more than one operating point is possible"
    expect(w[0]).toBe("head rises from its shut-off head 40.0 m before falling (drooping curve): a system curve may cross it twice, and the point judged is the one the pump reaches from rest, started against its closed check valve (the first crossing where its head falls below the system's); a system head above 40.0 m there leaves it unable to start");
  });
  it("the flip: 39.5–39.9 m static starts at both edges; the same one warning stands beside its verdict", () => {
    const e = at(39.5, 39.9);
    expect(e.verdict?.status).not.toBe("no-operating-point");
    expect(drooping(e)).toEqual(drooping(at(41, 42)));
  });
});

describe("A3: band, verdict and motor check agree where the pump cannot start", () => {
  const curve = pts([[0, 40], [0.01, 42.5], [0.02, 43.5], [0.03, 42.5]]);
  const input = (low: number, high: number) => sys({ runs: [], staticLow: low, staticHigh: high, duty: { flow: 0.0095, head: 41 } });
  it("40.5–41 m static: no point at either edge; the motor check does not say it runs past its curve's end", () => {
    const e = evaluateCandidate(input(40.5, 41), set(curve), DEFAULT_ADJUSTMENT);
    expect(e.band.map((b) => b.flow)).toEqual([null, null]); // old code: 6.88 m³/h and 13.5 m³/h (more lift → more flow)
    expect(e.verdict?.status).toBe("no-operating-point"); // old code: "short", judged at least lift
    const c = pumpOf(curve);
    const ctx = { mode: "open" as const, prepared: prepareSystem(systemSpec(input(40.5, 41))), curve: c, combined: c, arrangement: "single" as const, n: 1 };
    expect(runsPastCurveEnd(ctx)).toEqual([]); // old code: "at least lift, new pipe the pump runs past the published curve's end…"
  });
  it("the flip: 39.5 m static at least lift starts and runs past the curve's end — band and motor check both say so", () => {
    const e = evaluateCandidate(input(39.5, 41), set(curve), DEFAULT_ADJUSTMENT);
    expect(e.verdict?.status).toBe("no-operating-point");
    const reasons = txt(e.verdict?.reasons).join(" ");
    expect(reasons).toMatch(/At least lift, new pipe: the curve ends at 108 m³\/h still giving 42\.5 m against the system's 39\.5 m/); // 40 m > 39.5 m: it starts
    expect(reasons).toMatch(/At most lift, aged pipe: shut-off head 40\.0 m is below the system's 41\.0 m/);
    const c = pumpOf(curve);
    const ctx = { mode: "open" as const, prepared: prepareSystem(systemSpec(input(39.5, 41))), curve: c, combined: c, arrangement: "single" as const, n: 1 };
    expect(runsPastCurveEnd(ctx).map(inSI)).toEqual(["at least lift, new pipe the pump runs past the published curve's end (108 m³/h, still giving 42.5 m against the system's 39.5 m)"]);
  });
});

describe("motor check on a drooping curve that starts: past the curve's end only once pushed past its unstable crossing", () => {
  const c = pumpOf(pts([[0, 40], [0.01, 39], [0.02, 40.5], [0.03, 40.2]]));
  const at = (s: number) => runsPastCurveEnd({ mode: "open", prepared: prepareSystem(systemSpec(sys({ runs: [], staticLow: s, staticHigh: 45 }))), curve: c, combined: c, arrangement: "single", n: 1 }).map(inSI);
  it("39.5 m static: settles on the first falling part; the check says where it would run past the end", () => {
    expect(at(39.5)).toEqual([expect.stringMatching(/^at least lift, new pipe the pump runs past the published curve's end once pushed past the unstable crossing at [\d.]+ m³\/h \(39\.5 m\) \(108 m³\/h, still giving 40\.2 m against the system's 39\.5 m\)$/)]); // old code: said it runs past the end, no crossing named
  });
  it("the flip: 40.3 m static, above its 40.2 m end: nothing past the end (40 m shut-off below 40.3 m: it does not start either)", () => {
    expect(at(40.3)).toEqual([]);
  });
});

describe("B3: static head equal to the shut-off head — dead-head, no delivery", () => {
  const curve = pts([[0, 50], [0.01, 48], [0.02, 42], [0.03, 30]], [0, 0.6, 0.75, 0.6]);
  const at = (s: number) => evaluateCandidate(sys({ staticLow: s, staticHigh: s, duty: { flow: 0.01, head: 51 } }), set(curve), DEFAULT_ADJUSTMENT);
  it("50 m static: the verdict says no delivery, the warnings the dead-head with both heads", () => {
    const e = at(50);
    expect(e.verdict?.status).toBe("short");
    expect(txt(e.verdict?.reasons)[0]).toBe("No delivery at least lift, new pipe: the pump's shut-off head 50.0 m only balances the system's head at zero flow (dead-head), against a duty of 36.0 m³/h.");
    expect(txt(e.warnings).filter((w) => /dead-head/.test(w))).toEqual([ // once: the band's edges sit at the design point's own zero flow
      "no flow: the pump's shut-off head 50.0 m only balances the system's 50.0 m at zero flow, so it runs against the closed check valve (dead-head), churning and heating the liquid; a pump must not run below its minimum continuous flow (the maker's figure)",
    ]);
  });
  it("the flip: 49.99 m static delivers a little: short with its flow, no dead-head", () => {
    const e = at(49.99);
    expect(txt(e.verdict?.reasons)[0]).toMatch(/^Delivers /);
    expect(e.warnings.join(" ")).not.toMatch(/dead-head/);
  });
});

describe("C: a band edge's own cautions reach the candidate's warnings, naming the edge", () => {
  const curve = pts([[0, 40], [0.01, 35], [0.02, 25], [0.03, 12]]);
  const at = (low: number) => evaluateCandidate(sys({ runs: [], staticLow: low, staticHigh: 24, duty: { flow: 0.015, head: 30 } }), set(curve), DEFAULT_ADJUSTMENT);
  it("12.05 m static: at least lift the pump runs at ≥ 98 % of the curve's last flow; the runout caution names that edge", () => {
    const e = at(12.05);
    expect(e.band[0].flow! / 0.03).toBeGreaterThan(0.98);
    expect(e.warnings.map(inSI)).toContain("At least lift, new pipe: operating point at 108 m³/h is at the far end of the published curve (runout): at or past 98 % of its last published flow 108 m³/h, 106 m³/h (to 1 part in 10⁸)"); // old code: dropped; then without its rule and numbers
  });
  it("the flip: 16 m static at least lift is well inside the curve: no runout caution", () => {
    const e = at(16);
    expect(e.band[0].flow! / 0.03).toBeLessThan(0.98);
    expect(e.warnings.join(" ")).not.toMatch(/runout/);
  });
});

describe("A4/E: every pump of the arrangement can deliver", () => {
  const parallel = (low: number, high: number) => evaluateCandidate(sys({ staticLow: low, staticHigh: high, duty: { flow: 0.015, head: 42 } }), set(A1), { ...DEFAULT_ADJUSTMENT, arrangement: "parallel", dutyPumps: 2 });
  it("two drooping pumps in parallel, 36–39 m: one alone holds 42.9 m at most lift, above the 40 m shut-off — the second cannot open its check valve", () => {
    const w = txt(parallel(36, 39).warnings).filter((x) => /cannot open its check valve/.test(x));
    // Least lift fails too (40.2 m held): both edges said once, each with its numbers (arrangement-start-edges.test.ts).
    expect(w.join("\n")).toMatch(/^At both edges of the band, with 1 pump running in parallel the system holds 40\.2 m at [\d.]+ m³\/h \(least lift, new pipe\) and 42\.9 m at [\d.]+ m³\/h \(most lift, aged pipe\), above one pump's shut-off head 40\.0 m: pump 2 of 2, started then, cannot open its check valve/m); // old code: no such warning
  });
  it("the flip: 25–28 m static, one pump alone runs below 40 m: no warning", () => {
    expect(parallel(25, 28).warnings.join(" ")).not.toMatch(/cannot open its check valve/);
  });
  const series = (low: number, high: number) => evaluateCandidate(sys({ staticLow: low, staticHigh: high, duty: { flow: 0.01, head: 60 } }), set(pts([[0, 40], [0.01, 37], [0.02, 30], [0.03, 20]])), { ...DEFAULT_ADJUSTMENT, arrangement: "series", dutyPumps: 2 });
  it("two in series, 50–55 m, each shut-off 40 m: one stopped, the other dead-heads — said with both heads", () => {
    const w = txt(series(50, 55).warnings).filter((x) => /in series stopped or tripped/.test(x));
    expect(w[0]).toMatch(/^At both edges of the band, with one of the 2 pumps in series stopped or tripped, the pump left running gives 40\.0 m at zero flow against the system's 50\.0 m \(least lift, new pipe\) and 55\.0 m \(most lift, aged pipe\): no flow passes/); // both edges, said once // old code: no such warning
  });
  it("the flip: 30–35 m static, one pump alone still lifts it: no warning", () => {
    expect(series(30, 35).warnings.join(" ")).not.toMatch(/stopped or tripped/);
  });
});
