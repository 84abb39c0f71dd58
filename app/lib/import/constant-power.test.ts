// A power column with one figure at every point of a curve (a motor rating written on every row) gets a
// `power-constant` warning on that curve (constant-power.ts): the rule, its thresholds (30 % of the largest flow,
// 0.05 % spread, 3 points) and both paths. Invented models and values; line numbers counted in each text (header = line 1).
import { describe, expect, it } from "vitest";
import { analyseCsv } from "./index";
import { CONSTANT_POWER } from "./constant-power";
import { inSI } from "~/engine/quantityText";

const HEAD = "Model,Speed (rpm),Flow (m3/h),Head (m),Power (kW)";
const csv = (...rows: string[]) => [HEAD, ...rows].join("\n") + "\n";
/** One curve: flows and powers as given, heads falling 40, 38, 35, … m (a pump curve). */
const curve = (model: string, flows: number[], powers: (number | string)[]) =>
  flows.map((q, i) => `${model},2900,${q},${40 - i * (i + 3) / 2},${powers[i]}`);
const flat = (a: ReturnType<typeof analyseCsv>) => a.result.problems.filter((p) => p.code === "power-constant");

describe("a power the same at every point of a curve is a warning (constant-power.ts)", () => {
  it("7.5 kW at all 7 points from shutoff: a warning on the curve's first power cell, saying the rule and the numbers; the curve is kept", () => {
    const a = analyseCsv(csv(...curve("Invented 50-200", [0, 10, 20, 30, 40, 50, 60], Array(7).fill("7.5"))));
    expect(flat(a).map((p) => [p.row, p.column, p.severity, p.curveKey])).toEqual([[2, "Power (kW)", "warning", "Invented 50-200|2900|"]]); // source: construction (line 2, the power column)
    const reason = inSI(flat(a)[0].reason);
    expect(reason).toContain("“Power (kW)” reads 7.50 kW at all 7 points of Invented 50-200 · 2900 rpm (flow 0.000 m³/h to 60.0 m³/h, 100.0 % of its largest flow)"); // source: construction
    expect(reason).toContain("a shaft power rises with flow on a centrifugal pump (common practice)"); // source: common practice
    expect(reason).toContain("Rule: the same power (within 0.05 %) at 3 points or more over at least 30 % of the curve's largest flow"); // source: constant-power.ts thresholds
    expect(reason).toContain("set the column to “— ignore —”"); // source: the fix (mapping page's label for ignore)
    expect(a.result.curveSets.map((c) => [c.ok, c.points.map((p) => p.power)])).toEqual([[true, Array(7).fill(7500)]]); // source: a warning keeps the curve (7.5 kW = 7500 W)
  });

  it("flags only the flat curve of a file: a rising power beside it is left alone", () => {
    const text = csv(...curve("A", [0, 10, 20, 30], ["3.1", "4.2", "5.0", "5.6"]), ...curve("B", [0, 10, 20, 30], Array(4).fill("5.5")));
    expect(flat(analyseCsv(text)).map((p) => [p.row, p.curveKey])).toEqual([[6, "B|2900|"]]); // source: construction (B starts on line 6)
  });

  it("flips at 30 % of the largest flow: 70 to 100 m³/h is flagged, 71 to 100 is not", () => {
    expect(CONSTANT_POWER.flowSpan).toBe(0.3); // source: constant-power.ts (radial pump power rises ≈15 % of its BEP value over 30 % of the flow, common practice)
    expect(flat(analyseCsv(csv(...curve("A", [70, 85, 100], Array(3).fill("11")))))).toHaveLength(1); // source: (100 − 70)/100 = 30 %, at the threshold
    expect(flat(analyseCsv(csv(...curve("A", [71, 85, 100], Array(3).fill("11")))))).toEqual([]); // source: (100 − 71)/100 = 29 %, below it
  });

  it("flips at a spread of 0.05 % of the largest power: 7.5 and 7.5037 are one figure, 7.5 and 7.5038 are not", () => {
    // source: 7.5 / (1 − 0.0005) = 7.50375 kW is the largest power within 0.05 % of 7.5 kW
    const at = (last: string) => flat(analyseCsv(csv(...curve("A", [0, 10, 20], ["7.5", "7.5", last]))));
    expect(at("7.5037")).toHaveLength(1); // source: 0.0037/7.5037 = 0.0493 % ≤ 0.05 %
    expect(inSI(at("7.5037")[0].reason)).toContain("reads 7.500 kW to 7.504 kW at all 3 points"); // source: construction (read apart, not "7.50 kW to 7.50 kW")
    expect(at("7.5038")).toEqual([]); // source: 0.0038/7.5038 = 0.0506 % > 0.05 %
    expect(at("7.51")).toEqual([]); // source: differ in the third significant figure (7.50 vs 7.51)
  });

  it("needs 3 points with a power: two equal powers and a blank cell say nothing", () => {
    expect(flat(analyseCsv(csv(...curve("A", [0, 10, 20], ["7.5", "7.5", ""]))))).toEqual([]); // source: CONSTANT_POWER.minPoints = 3
    expect(flat(analyseCsv(csv(...curve("A", [0, 10, 20, 30], ["7.5", "7.5", "", "7.5"]))))).toHaveLength(1); // source: 3 powers over 0–30 m³/h
  });

  it("a power of 0 at shutoff is left out (zero-dropped) and not counted: the rest must span 30 % on their own", () => {
    const a = analyseCsv(csv(...curve("A", [0, 10, 20, 30], ["0", "7.5", "7.5", "7.5"])));
    expect(a.result.problems.map((p) => p.code)).toEqual(["zero-dropped", "power-constant"]); // source: 10 to 30 m³/h is 66.7 % of 30
    expect(inSI(flat(a)[0].reason)).toContain("at all 3 points of A · 2900 rpm (flow 10.0 m³/h to 30.0 m³/h, 66.7 % of its largest flow)"); // source: construction
    expect(flat(a)[0].row).toBe(3); // source: the first point with a power, line 3
  });

  it("the fast path steps aside for a flat power curve and the full path names it; both give one result", () => {
    const text = csv(...curve("A", [0, 10, 20, 30], ["3.1", "4.2", "5.0", "5.6"]), ...curve("B", [0, 10, 20, 30], Array(4).fill("5.5")));
    const fast = analyseCsv(text);
    expect(fast.fastPath).toBe(false); // source: fast.ts returns null on anything that needs a message
    expect(fast.result).toEqual(analyseCsv(text, undefined, { fast: false }).result); // source: the full path is the reference
    const flatLast = csv(...curve("A", [0, 10, 20, 30], Array(4).fill("5.5")));
    expect(analyseCsv(flatLast).fastPath).toBe(false); // source: same, the flat curve last in the file
    expect(analyseCsv(csv(...curve("A", [0, 10, 20, 30], ["3.1", "4.2", "5.0", "5.6"]))).fastPath).toBe(true); // source: a rising power needs no message
  });

  it("a wide file: the warning names the block's power column", () => {
    const text = "Model,Q (m3/h),H 250mm (m),P 250mm (kW),H 230mm (m),P 230mm (kW)\n" +
      [[0, 40, 4, 33, 3], [20, 38, 4, 31, 3.6], [40, 34, 4, 27, 4.1]].map((r) => `A,${r.join(",")}`).join("\n") + "\n";
    const a = analyseCsv(text, undefined);
    expect(flat(a).map((p) => [p.row, p.column, p.curveKey])).toEqual([[2, "P 250mm (kW)", "A||250"]]); // source: construction (the Ø250 block's power is 4 kW on each row)
  });
});
