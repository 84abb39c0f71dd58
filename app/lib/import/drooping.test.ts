// Drooping (rising-then-falling, "unstable") curves in the importer (point-rules.ts over engine headShape.ts): a curve
// rising from shut-off to one peak up to 25 % above it, in the first half of its flows, then falling, is kept with a
// drooping-curve warning stating the rule and its numbers; a head more than 25 % above the first, a second rise after
// falling (beyond the 5 % rounding allowance) and a curve rising along most of its length stay errors. Both paths and
// both policies agree, and every set kept is taken by the engine. Check values: invented vendor rows; the bounds are
// ours (25 % from memory — makers' drooping curves peak some 5–15 % above shut-off, common practice; the first half of
// the flows, common practice); the consequences (no start against a static head above shut-off, hunting, parallel
// operation) common practice (from memory).
import { describe, expect, it } from "vitest";
import * as v from "valibot";
import { analyseCsv, CurveSetSchema, type AnalyseResult, type Mapping } from "./index";
import { expectEngineTakes } from "./test-helpers";
import { inSI, renderQuantities } from "~/engine/quantityText";
import { UNIT_SYSTEMS } from "~/engine/units";

const T = "Model,Speed rpm,Flow m3/h,Head m";
const csv = (rows: [number, number][], model = "D") => [T, ...rows.map(([q, h]) => `${model},2900,${q},${h}`)].join("\n") + "\n";
const codes = (a: AnalyseResult) => a.result.problems.map((p) => [p.row, p.code, p.severity]);
/** Both paths under both policies agree, and the engine takes every set kept; the default analysis. */
function both(text: string): AnalyseResult {
  const a = analyseCsv(text);
  expect(a.result).toEqual(analyseCsv(text, undefined, { fast: false }).result); // source: the full path is the reference (fast.test.ts)
  expectEngineTakes(a.result.curveSets);
  const drop = analyseCsv(text, { ...a.mapping, policy: "drop-points" } satisfies Mapping);
  expect(drop.result).toEqual(analyseCsv(text, { ...a.mapping, policy: "drop-points" }, { fast: false }).result);
  expectEngineTakes(drop.result.curveSets);
  return a;
}

/** 40 m at shut-off, 46 m at 36 m³/h (15 %, a quarter along 0–144 m³/h), then falling: invented. */
const D15: [number, number][] = [[0, 40], [18, 44], [36, 46], [54, 45], [72, 42], [108, 34], [144, 22]];

describe("a drooping curve is kept, with a warning that states the rule and its numbers", () => {
  it("15 % above shut-off, peak at 36 m³/h: every point kept, one drooping-curve warning at the peak's line", () => {
    const a = both(csv(D15));
    expect(codes(a)).toEqual([[4, "drooping-curve", "warning"]]); // old code: head-rising errors at lines 3–6 (44, 46, 45, 42 m over 40 m + 2 m)
    expect(a.result.curveSets[0].ok).toBe(true);
    expect(a.result.curveSets[0].points.map((p) => p.head)).toEqual(D15.map(([, h]) => h));
    expect(() => v.parse(CurveSetSchema, a.result.curveSets[0])).not.toThrow(); // the service's re-check (old code: refused)
    const w = inSI(a.result.problems[0].reason);
    expect(w).toContain("drooping curve: head rises from its shut-off head 40.0 m (line 2) to a peak of 46.0 m at 36.0 m³/h (line 4), 6.00 m (15.0 %) above it"); // source: 46 − 40 = 6 m, 6 / 40 = 15 % (arithmetic)
    expect(w).toContain("more than the 5 % taken as rounding, within the 25 % a drooping peak may reach");
    expect(w).toContain("Against a static head (plus pressure difference) between 40.0 m and 46.0 m the pump may not start");
    expect(w).toContain("may hunt between two flows of one head");
    expect(w).toContain("parallel operation is unsafe (common practice)");
    expect(renderQuantities(a.result.problems[0].reason, UNIT_SYSTEMS.US)).toContain("shut-off head 131 ft (line 2) to a peak of 151 ft"); // source: 40 m and 46 m / 0.3048 (NIST SP 811 foot)
  });
  it("a curve published from a flow above zero: its first head stands for the shut-off head, and the warning says so", () => {
    const a = both(csv([[10, 40], [30, 45], [50, 44], [80, 38], [120, 25]]));
    expect(codes(a)).toEqual([[3, "drooping-curve", "warning"]]);
    expect(inSI(a.result.problems[0].reason)).toContain("head at its first published flow 40.0 m (line 2) (its shut-off head is not published; taken from the first point)");
  });
  it("the flip at the 5 % allowance: a 2.0 m hump over 40 m is rounding (no warning, the fast path); 2.1 m droops (the warning, the full path)", () => {
    const at = (h: number) => csv([[0, 40], [36, h], [72, 38], [108, 30], [144, 20]]);
    expect(codes(both(at(42)))).toEqual([]); // source: 42 − 40 = 5 % of 40 m
    expect(analyseCsv(at(42)).fastPath).toBe(true);
    expect(codes(both(at(42.1)))).toEqual([[3, "drooping-curve", "warning"]]); // source: 2.1 m > 2.0 m (old code: head-rising error)
    expect(analyseCsv(at(42.1)).fastPath).toBe(false); // a warning: the fast path steps aside
  });
});

describe("what the rule exists to catch stays an error", () => {
  it("above 25 % of shut-off: 50 m over 40 m is kept (a warning); 50.1 m is refused at its line, the rest judged without it", () => {
    const at = (h: number) => csv([[0, 40], [18, 44], [36, h], [54, 45], [72, 42], [108, 34], [144, 22]]);
    expect(codes(both(at(50)))).toEqual([[4, "drooping-curve", "warning"]]); // source: 10 m = 25 % of 40 m
    const a = both(at(50.1));
    expect(codes(a)).toEqual([[4, "head-rising", "error"], [5, "drooping-curve", "warning"]]); // the peak left out, 45 m at 54 m³/h then the highest
    expect(inSI(a.result.problems[0].reason)).toContain("head rises to 50.1 m, 10.1 m above the curve's shut-off head (40.0 m): 25.3 % of it, more than the 25 % a drooping curve's peak is taken to reach (10.0 m;"); // source: 10.1 / 40 (arithmetic)
    expect(a.result.curveSets[0].ok).toBe(false);
  });
  it("a second rise after falling (a zig-zag): 2.0 m above the lowest since the fall is rounding; 2.01 m is refused at its line", () => {
    const at = (h: number) => csv([[0, 40], [18, 46], [36, 40], [54, h], [72, 30], [90, 20]]);
    expect(codes(both(at(42)))).toEqual([[3, "drooping-curve", "warning"]]); // source: 42 − 40 = 2 m = 5 % of 40 m
    const a = both(at(42.01));
    expect(codes(a)).toEqual([[3, "drooping-curve", "warning"], [5, "head-rising", "error"]]);
    expect(inSI(a.result.problems[1].reason)).toContain("head rises again to 42.0 m, 2.01 m above the lowest head since the curve began to fall (40.0 m, line 4; its peak 46.0 m, line 3)");
  });
  it("a curve rising along most of its length (system-like: 30 → 35 m over 0–50 m³/h, each step under 5 %): refused whole, under either policy", () => {
    const text = csv([[0, 30], [10, 31], [20, 32], [30, 33], [40, 34], [50, 35]]);
    const a = both(text);
    expect(codes(a)).toEqual([[7, "curve-rising", "error"]]); // old code: head-rising at lines 4–7 (2–5 m over 30 m + 1.5 m)
    expect(inSI(a.result.problems[0].reason)).toContain("to its highest, 35.0 m at 50.0 m³/h (line 7), 100.0 % of the way along its flows (0.000 m³/h to 50.0 m³/h), past the 50 %");
    const drop = analyseCsv(text, { ...a.mapping, policy: "drop-points" });
    expect(drop.result.curveSets[0].ok).toBe(false); // no point to drop: the curve is wrong
  });
  it("the flip at the middle of the flows: the peak at 72 of 0–144 m³/h is drooping (kept); at 73 m³/h the curve rises along most of its length", () => {
    const at = (q: number) => csv([[0, 40], [36, 43], [q, 46], [108, 40], [144, 30]]);
    expect(codes(both(at(72)))).toEqual([[4, "drooping-curve", "warning"]]); // source: 72 / 144 = 50 %
    expect(codes(both(at(73)))).toEqual([[4, "curve-rising", "error"]]); // source: 73 / 144 = 50.7 %
  });
  it("swapped columns (heads rising 20 → 60 m): each head past 25 % refused, then the curve as a whole", () => {
    const a = both(csv([[0, 20], [10, 24], [20, 30], [30, 40], [40, 60]]));
    expect(codes(a)).toEqual([[2, "too-few-points", "error"], [3, "curve-rising", "error"], [4, "head-rising", "error"], [5, "head-rising", "error"], [6, "head-rising", "error"]]); // 30, 40, 60 m are 50–200 % over 20 m
  });
});
