// Field checks explained with ISO 9906's tolerance cross (2012, 6.4.2, from memory), and the field
// chart's operating points on the system curve. Check values: hand-worked on straight-line curves.
import { describe, expect, test } from "vitest";
import { fluidAt, solveOperatingPoint, createPumpCurve } from "~/engine";
import { evaluateCheck } from "./evaluate";
import { parseCheckFields } from "./form";
import { crossOf, crossSentences } from "./cross";
import { evaluateSystem } from "../projects/hydraulics";
import { crossingOf, interpolateAt } from "~/components/chart/scales";
import { fieldsForHead, frozenFixture, linearPoints } from "~/test/fieldcheck-fixture";

const RHO20 = fluidAt({ kind: "water" }, 20).density;
const readings = (f: Record<string, string>) => {
  const r = parseCheckFields(f, { kind: "water" });
  if (!r.ok) throw new Error(JSON.stringify(r.errors));
  return r.readings;
};
const fmt = { flow: (v: number) => `${(v * 3600).toFixed(1)} m³/h`, head: (v: number) => `${v.toFixed(2)} m` };

describe("the grade as a tolerance cross: which arm, by how much", () => {
  // Flat curve H = 30 − 100·Q (m, m³/s). Flow meter 0.012 m³/s: the curve gives 28.8 m there. Measured
  // head 2 % low, 28.224 m: head arm −2.0 % (2B allows ±5 %) → met, 3.0 points inside. The curve reaches
  // 28.224 m at Q = 0.01776 m³/s: flow arm 0.012/0.01776 − 1 = −32.4 % (2B allows ±8 %) → not met.
  const f = frozenFixture({ points: linearPoints(30, 100, 0.03) });
  const r = evaluateCheck(f, readings(fieldsForHead(28.224, RHO20, { flow: "0.012" })), "2B");

  test("passes on the head arm with the numbers; the flow arm is outside and said so", () => {
    expect(r.verdict).toBe("pass");
    const x = crossOf(r)!;
    expect(x.passedOn).toBe("head");
    expect(x.head.deviation!).toBeCloseTo(-0.02, 3);
    expect(x.head.margin!).toBeCloseTo(0.03, 3);
    expect(x.head.curveValue!).toBeCloseTo(28.8, 6);
    expect(x.flow.deviation!).toBeCloseTo(0.012 / 0.01776 - 1, 3);
    expect(x.flow.pass).toBe(false);
    expect(x.flow.curveValue!).toBeCloseTo(0.01776, 4);
    // The engine's own cross gives the same two numbers.
    const engineCross = r.engine.grades[0].cross!;
    expect(engineCross.head.deviation).toBeCloseTo(x.head.deviation!, 12);
    expect(engineCross.flow.deviation).toBeCloseTo(x.flow.deviation!, 12);
    const text = crossSentences(x, fmt).join(" ");
    expect(text).toContain("Head arm: at the measured 43.2 m³/h the curve gives 28.80 m; the measured 28.22 m is −2.0 % (allowed −5 % to +5 %) — met, 3.0 points inside.");
    expect(text).toMatch(/Flow arm: .* is −32\.4 % \(allowed −8 % to \+8 %\) — not met, 24\.4 points outside\./);
    expect(text).toContain("Met on the head arm");
    expect(text).toContain("not a contradiction");
  });

  test("the grade flips where both arms are missed: head 5.1 % low on this flat curve fails 2B", () => {
    const out = evaluateCheck(f, readings(fieldsForHead(28.8 * 0.949, RHO20, { flow: "0.012" })), "2B");
    expect(out.verdict).toBe("fail");
    expect(crossOf(out)!.passedOn).toBe("neither");
    const justIn = evaluateCheck(f, readings(fieldsForHead(28.8 * 0.951, RHO20, { flow: "0.012" })), "2B");
    expect(justIn.verdict).toBe("pass");
  });

  test("at the edge the numbers never read as the limit: head 5.004 % low fails 2B and says −5.004 %, 0.004 points outside", () => {
    // Hand-worked: 28.8 × (1 − 0.05004) m measured against the curve's 28.8 m at 0.012 m³/s.
    const out = evaluateCheck(f, readings(fieldsForHead(28.8 * (1 - 0.05004), RHO20, { flow: "0.012" })), "2B");
    expect(out.verdict).toBe("fail");
    const text = crossSentences(crossOf(out)!, fmt).join(" ");
    expect(text).toContain("is −5.004 % (allowed −5 % to +5 %) — not met, 0.004 points outside.");
    expect(text).not.toMatch(/−5\.0 % \(allowed/);
  });

  test("no flow meter: no cross (no verdict)", () => {
    const r2 = evaluateCheck(f, readings(fieldsForHead(28.8, RHO20)), "2B");
    expect(crossOf(r2)).toBeNull();
  });
});

describe("field chart: operating points on the system curve", () => {
  test("crossingOf: two straight lines meet where the algebra says (H = 40 − 1000·Q and H = 10 + 1500·Q → Q = 0.012, H = 28)", () => {
    const pump = [0, 0.01, 0.02, 0.03].map((q) => ({ flow: q, y: 40 - 1000 * q }));
    const sys = [0, 0.015, 0.03].map((q) => ({ flow: q, y: 10 + 1500 * q }));
    const x = crossingOf(pump, sys)!;
    expect(x.flow).toBeCloseTo(0.012, 12);
    expect(x.y).toBeCloseTo(28, 12);
    expect(crossingOf(pump, sys.map((p) => ({ ...p, y: p.y + 40 })))).toBeNull(); // system above the pump everywhere
    expect(crossingOf([], sys)).toBeNull();
  });

  // Drooping curves (invented, m³/s and m), the rule common practice (from memory): a pump starts against a closed check
  // valve, so it runs only when its head at the first flow exceeds the system's; then it settles at the first crossing
  // where its head falls below the system's. The chart marks the point the engine reports, or none.
  const droop = [[0, 40], [0.005, 42], [0.01, 42.5], [0.015, 41], [0.02, 37], [0.025, 30]].map(([flow, y]) => ({ flow, y }));
  const sysOf = (stat: number) => [0, 0.005, 0.01, 0.015, 0.02, 0.025].map((q) => ({ flow: q, y: stat + 10_000 * q * q }));
  const engineAt = (pump: { flow: number; y: number }[], sys: { flow: number; y: number }[]) =>
    solveOperatingPoint(createPumpCurve({ points: pump.map((p) => ({ flow: p.flow, head: p.y })), riseTolerance: 1 }), (q) => interpolateAt(sys, q) as number);

  test("a drooping curve whose static head (41 m) is above its shut-off head (40 m): no operating point, as the engine says", () => {
    const sys = sysOf(41); // crossings near 0.003 m³/s (unstable) and 0.011 m³/s (stable), both out of reach from rest
    expect(crossingOf(droop, sys)).toBeNull(); // old code: the highest-flow crossing, 0.0109 m³/s
    expect(engineAt(droop, sys).status).toBe("no-intersection-shutoff-below-static");
  });

  test("the flip: static 39.5 m, below the 40 m shut-off: the one stable crossing, near where the engine finds it", () => {
    const x = crossingOf(droop, sysOf(39.5))!;
    // Linear between 0.01 (pump 2 m above) and 0.015 m³/s (0.75 m below): 0.01 + 0.005 · 2/2.75 (geometry).
    expect(x.flow).toBeCloseTo(0.01 + 0.005 * (2 / 2.75), 12);
    const op = engineAt(droop, sysOf(39.5));
    expect(op.status).toBe("ok");
    expect(Math.abs(x.flow / op.flow! - 1)).toBeLessThan(0.05); // the engine's curve is cubic between the points, the chart's linear
  });

  test("down, up and down again (flat 39 m system): the first stable crossing, not the highest-flow one", () => {
    const pump = [[0, 40], [0.005, 38], [0.01, 39.5], [0.015, 41], [0.02, 37], [0.025, 30]].map(([flow, y]) => ({ flow, y }));
    const sys = [{ flow: 0, y: 39 }, { flow: 0.025, y: 39 }];
    const x = crossingOf(pump, sys)!;
    expect(x.flow).toBeCloseTo(0.0025, 12); // linear: 40 → 38 over 0.005 m³/s passes 39 m half way (geometry); old code: 0.0175
    const op = engineAt(pump, sys);
    expect(op.status).toBe("multiple");
    expect(op.flow!).toBeLessThan(0.005); // the engine's reported point is the first one too (cubic between the points)
  });

  test("the stored chart's curve at the measured speed meets the system curve where the engine's operating point is (sampling, 0.5 %)", () => {
    // The fixture pump on the default system, checked at 2755 rpm (0.95 × 2900): the chart must show an
    // operating point for both curves, not "no operating point on the system curve".
    const base = frozenFixture();
    const systemCurve = evaluateSystem(base.system.input, { flowMax: 0.03, points: 41 });
    const f = { ...base, systemCurve };
    const r = evaluateCheck(f, readings(fieldsForHead(25, RHO20, { flow: "0.011", rpm: "2755" })), "2B");
    expect(r.chart.system).not.toBeNull();
    const sysHead = (q: number) => interpolateAt(r.chart.system!, q) as number;
    for (const [series, ratio] of [[r.chart.measured, 2755 / 2900], [r.chart.selected, 1]] as const) {
      const x = crossingOf(series, r.chart.system)!;
      expect(x).not.toBeNull();
      const pts = linearPoints().map((p) => ({ flow: p.flow * ratio, head: p.head * ratio * ratio })); // affinity laws
      const op = solveOperatingPoint(createPumpCurve({ points: pts }), sysHead);
      expect(op.flow).not.toBeNull();
      expect(Math.abs(x.flow / op.flow! - 1)).toBeLessThan(0.005);
    }
  });
});

describe("the speed hint names the selection's speed as the report does", () => {
  // A selection frozen before settings were rounded up holds a solved 1644.3 rpm (ratio × the curve's 2900 rpm, affinity
  // laws, common practice); a measured 2900 rpm is 76 % off it (> 3 %: the hint). It said "1644 rpm", a speed the pump is short at.
  test("an off-step design speed keeps its decimal; a whole one reads whole", () => {
    const f = frozenFixture({ points: linearPoints(30, 100, 0.03), adjustment: { ...frozenFixture().adjustment, method: "speed" } });
    const hint = (ratio: number) => evaluateCheck({ ...f, result: { ...f.result, ratio } }, readings(fieldsForHead(28, RHO20, { flow: "0.012" })), "2B").hints.find((h) => h.startsWith("The measured speed differs"));
    expect(hint(1644.3 / 2900)).toContain("(2900 rpm against 1644.3 rpm)");
    expect(hint(1645 / 2900)).toContain("(2900 rpm against 1645 rpm)");
  });
});
