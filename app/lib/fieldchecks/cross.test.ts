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
