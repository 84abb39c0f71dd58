import { describe, expect, it } from "vitest";
import * as v from "valibot";
import { analyseCsv } from "./index";
import type { Mapping } from "./mapping";
import { CurveSetSchema } from "./validate";
import { fixture } from "./test-helpers";
import { inSI } from "~/engine/quantityText"; // problem texts carry quantity tokens

const HEAD = "Model,Speed (rpm),Impeller (mm),Flow (m3/h),Head (m)";

describe("bad.csv: each problem kind named with row, column and reason", () => {
  const r = analyseCsv(fixture("bad.csv")).result;
  // bad.csv's P and η are hand-typed, not from ρgQH/P: its consistency warnings are tested in consistency.test.ts
  const list = r.problems.filter((p) => p.code !== "inconsistent").map((p) => [p.row, p.column, p.code, p.severity, p.curveKey]);

  it("lists exactly one problem per kind", () => {
    // source: hand-written fixture bad.csv (line numbers counted in the file, header = line 1)
    expect(list).toEqual([
      [9, "Head (m)", "not-a-number", "error", "Brindle BR-40B|2900|160"],
      [13, "Power (kW)", "negative", "error", "Brindle BR-40C|2900|160"],
      [17, "Flow (m3/h)", "flow-not-increasing", "error", "Brindle BR-40D|2900|160"],
      [21, "Head (m)", "curve-rising", "error", "Brindle BR-40E|2900|160"], // 40 → 39.5 → 44 → 37 m at 0–30 m³/h: highest two thirds along (old code: head-rising, 44 m over 39.5 m)
      [25, "Efficiency (%)", "efficiency-over-100", "error", "Brindle BR-40F|2900|160"],
      [27, "Flow (m3/h)", "too-few-points", "error", "Brindle BR-40G|2900|160"],
      [31, "Flow (m3/h)", "duplicate-flow", "error", "Brindle BR-40H|2900|160"],
      [33, "Model", "duplicate-curve", "error", "Brindle BR-40A|2900|160"],
      [38, "Model", "missing-model", "error", "Brindle BR-40J|2900|160"],
    ]);
  });
  it("says why in words", () => {
    const reason = (code: string) => r.problems.find((p) => p.code === code)!.reason;
    expect(reason("not-a-number")).toContain("3l.5"); // source: bad.csv line 9
    expect(reason("negative")).toContain("-1.2"); // source: bad.csv line 13
    expect(reason("flow-not-increasing")).toContain("line 16"); // source: bad.csv line 16 is the previous point
    expect(inSI(reason("curve-rising"))).toContain("44.0 m at 20.0 m³/h (line 21)"); // source: bad.csv line 21, its highest head
    expect(reason("efficiency-over-100")).toContain("104"); // source: bad.csv line 25
    expect(reason("too-few-points")).toContain("2 good point"); // source: bad.csv lines 27-28
    expect(reason("duplicate-curve")).toContain("lines 2–6"); // source: bad.csv first BR-40A block
  });
  it("keeps good curves importable and marks bad ones", () => {
    const ok = r.curveSets.filter((c) => c.ok).map((c) => c.key);
    expect(ok).toEqual(["Brindle BR-40K|1450|160"]); // source: bad.csv, BR-40K is the only clean curve (BR-40A is repeated)
    expect(r.stats.curveSets).toBe(10); // source: bad.csv has models A..H, J, K
    expect(r.stats.errors).toBe(9); // source: one problem per kind above
  });
  it("leaves the bad point out and skips the repeated block", () => {
    const a = r.curveSets.find((c) => c.key === "Brindle BR-40A|2900|160")!;
    expect(a.sourceRows).toEqual([2, 3, 4, 5, 6]); // source: bad.csv lines 33-35 are the skipped repeat
    const b = r.curveSets.find((c) => c.key === "Brindle BR-40B|2900|160")!;
    expect(b.points.map((p) => p.head)).toEqual([30, 29.2, 24.1]); // source: bad.csv lines 7,8,10 (line 9 dropped)
  });
  it("lets the slight rise near shutoff through (BR-40A: 32.0 → 32.6 m is under 5 % of 32 m)", () => {
    const a = r.curveSets.find((c) => c.key === "Brindle BR-40A|2900|160")!;
    expect(a.points[1].head).toBe(32.6); // source: bad.csv line 3; tolerance rule in validate.ts
  });
});

describe("rules on inline cases", () => {
  const rows = (...lines: string[]) => [HEAD, ...lines].join("\n");
  it("head rise: 5 % of shutoff passes as rounding, just above is a drooping curve, kept with a warning", () => {
    const pass = analyseCsv(rows("A,2900,200,0,40,", "A,2900,200,10,42,", "A,2900,200,20,38")).result;
    expect(pass.problems).toEqual([]); // source: 42 − 40 = 2.0 m = 5 % of 40 m (rule: rise ≤ 5 % of shutoff)
    const droop = analyseCsv(rows("A,2900,200,0,40", "A,2900,200,10,42.1", "A,2900,200,20,38", "A,2900,200,30,30")).result;
    expect(droop.problems.map((p) => [p.row, p.code, p.severity])).toEqual([[3, "drooping-curve", "warning"]]); // source: 2.1 m > 2.0 m, peak at 10 of 0–30 m³/h (old code: head-rising error)
    expect(droop.curveSets[0].ok).toBe(true);
  });
  it("efficiency as a fraction column holding percents says so", () => {
    const text = "Model,Speed,Impeller mm,Q m3/h,H m,Eff (-)\nA,2900,200,0,40,0\nA,2900,200,10,39,0.5\nA,2900,200,20,36,78\nA,2900,200,30,30,0.6\nA,2900,200,40,22,0.5\n";
    const p = analyseCsv(text).result.problems;
    expect(p.map((x) => [x.row, x.column, x.code])).toEqual([[4, "Eff (-)", "efficiency-over-100"]]); // source: hand-written case
    expect(p[0].reason).toContain("percent"); // source: hand-written case
  });
  it("zero speed, empty flow, extra cells", () => {
    const p = analyseCsv(rows("A,2900,200,0,40", "A,0,200,10,39", "A,2900,200,20,36", "A,2900,200,,33", "A,2900,200,30,30,x", "A,2900,200,40,22")).result.problems;
    expect(p.map((x) => [x.row, x.column, x.code, x.severity])).toEqual([
      [3, "Speed (rpm)", "zero", "error"], // source: hand-written case
      [5, "Flow (m3/h)", "missing-value", "error"], // source: hand-written case
      [6, null, "extra-cells", "warning"], // source: hand-written case (one stray cell beyond the header)
    ]);
    expect(p.find((x) => x.code === "zero")!.curveKey).toBe("A|2900|200"); // source: charged to the curve above (validate.ts)
  });
  it("an unreadable key cell is charged to the curve above, so that curve is not imported short of a point", () => {
    const r = analyseCsv(rows("A,2900,200,0,40", "A,2900,200,10,39", "A,29OO,200,20,36", "A,2900,200,30,31")).result;
    expect(r.problems.map((p) => [p.row, p.column, p.code, p.curveKey])).toEqual([[4, "Speed (rpm)", "not-a-number", "A|2900|200"]]); // source: hand-written case
    expect(r.curveSets[0].ok).toBe(false); // source: rule in validate.ts
  });
  it("no speed column: warning, curve still importable", () => {
    const r = analyseCsv("Model,Flow,Head\nA,0,40\nA,10,39\nA,20,36\n").result;
    expect(r.problems.map((p) => [p.row, p.code, p.severity])).toEqual([[2, "no-speed", "warning"]]); // source: hand-written case
    expect(r.curveSets[0].ok).toBe(true); // source: warnings do not block import
  });
  it("fillDownModel copies the model into blank model cells", () => {
    const text = "Model,Speed,Flow,Head\nA,2900,0,40\n,2900,10,39\n,2900,20,36\n";
    const base = analyseCsv(text);
    expect(base.result.problems.filter((p) => p.code === "missing-model")).toHaveLength(2); // source: hand-written case, lines 3-4
    const filled = analyseCsv(text, { ...base.suggestedMapping, fillDownModel: true } satisfies Mapping).result;
    expect(filled.problems).toEqual([]); // source: hand-written case
    expect(filled.curveSets[0].points).toHaveLength(3); // source: hand-written case
  });
  it("the same curve from two column blocks is a duplicate", () => {
    // block 1 is 2900 rpm with the shared impeller (200 mm); block 2 says 2900 rpm and Ø200 itself
    const text = "Model;Impeller mm;Q@2900;H@2900;Q@2900 Ø200;H@2900 Ø200\nA;200;0;40;0;40\nA;200;10;39;10;39\nA;200;20;36;20;36\n";
    const p = analyseCsv(text).result.problems;
    expect(p.map((x) => [x.row, x.column, x.code])).toEqual([[2, "Model", "duplicate-curve"]]); // source: hand-written case
  });
  it("two columns with the same qualifier are a mapping problem naming both", () => {
    const text = "Model;Q@2900;H@2900;Q @ 2900 rpm;H @ 2900 rpm\nA;0;40;0;40\nA;10;39;10;39\nA;20;36;20;36\n";
    const p = analyseCsv(text).result.problems;
    expect(p.map((x) => [x.row, x.column, x.code])).toEqual([
      [1, "Q @ 2900 rpm", "mapping"], // source: hand-written case
      [1, "H @ 2900 rpm", "mapping"], // source: hand-written case
    ]);
  });
  it("rows without a model column and without a default model are refused at the header", () => {
    const p = analyseCsv("Speed,Flow,Head\n2900,0,40\n2900,10,39\n2900,20,36\n").result;
    expect(p.problems.map((x) => [x.row, x.code])).toEqual([[1, "mapping"]]); // source: hand-written case
    expect(p.curveSets).toEqual([]); // source: nothing is imported under a broken mapping
  });
  it("a footer line without point values is a warning, not an error", () => {
    const p = analyseCsv(rows("A,2900,200,0,40", "A,2900,200,10,39", "A,2900,200,20,36", "End of export,,,,")).result.problems;
    expect(p.map((x) => [x.row, x.code, x.severity])).toEqual([[5, "no-point-values", "warning"]]); // source: hand-written case
  });
});

describe("CurveSetSchema (for the service to re-check before it writes)", () => {
  it("accepts an imported curve and rejects one whose flow falls", () => {
    const c = analyseCsv(fixture("long-si.csv")).result.curveSets[0];
    expect(v.safeParse(CurveSetSchema, c).success).toBe(true); // source: long-si.csv imports cleanly
    const broken = { ...c, points: [c.points[1], c.points[0], ...c.points.slice(2)] };
    expect(v.safeParse(CurveSetSchema, broken).success).toBe(false); // source: flow must increase
  });
});
