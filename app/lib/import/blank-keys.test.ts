// Blank cells in the optional key columns (speed, impeller diameter): "not given" for a set of their own,
// refused by line and column where they would split a curve that has the value (blank-keys.ts). Hand-written
// cases with invented models; line numbers are counted in each text (header = line 1).
import { describe, expect, it } from "vitest";
import { analyseCsv } from "./index";

const HEAD = "Model,Speed (rpm),Impeller (mm),Flow (m3/h),Head (m)";
const csv = (...rows: string[]) => [HEAD, ...rows].join("\n") + "\n";
const curve = (model: string, speed: string, mm: string, q0 = 0) => [[0, 40], [10, 39], [20, 36]].map(([q, h]) => `${model},${speed},${mm},${q + q0},${h}`);
const errors = (text: string, mapping?: unknown) =>
  analyseCsv(text, mapping).result.problems.filter((p) => p.severity === "error").map((p) => [p.row, p.column, p.code, p.curveKey]);

describe("a blank key cell as “not given” for a set of its own", () => {
  it("a model without a diameter after one with a diameter: two sets, no problem", () => {
    const r = analyseCsv(csv(...curve("A", "2900", "200"), ...curve("B", "2900", ""))).result;
    expect(r.problems).toEqual([]); // source: blank-keys.ts rule (another model)
    expect(r.curveSets.map((c) => [c.key, c.impellerDiameter, c.points.length, c.ok])).toEqual([["A|2900|200", 0.2, 3, true], ["B|2900|", null, 3, true]]); // source: construction
  });

  it("the same model at another speed without a diameter: a set of its own, either order", () => {
    const r = analyseCsv(csv(...curve("A", "1450", ""), ...curve("A", "2900", "200"))).result;
    expect(r.problems).toEqual([]); // source: blank-keys.ts rule (another speed)
    expect(r.curveSets.map((c) => c.key)).toEqual(["A|1450|", "A|2900|200"]); // source: construction
    expect(analyseCsv(csv(...curve("A", "2900", "200"), ...curve("A", "1450", ""))).result.problems).toEqual([]); // source: same rule
  });

  it("a set without a speed beside a set of another diameter with one: no speed (its warning), no error", () => {
    const r = analyseCsv(csv(...curve("A", "", "250"), ...curve("A", "1450", ""))).result;
    expect(r.problems.map((p) => [p.row, p.code, p.severity])).toEqual([[2, "no-speed", "warning"]]); // source: validate.ts no-speed rule
    expect(r.curveSets.map((c) => [c.key, c.speed, c.impellerDiameter])).toEqual([["A||250", null, 0.25], ["A|1450|", 1450, null]]); // source: construction
  });

  it("a wide file's shared speed column blank for a whole model: that model's sets have no speed", () => {
    const text = "Model,Speed (rpm),Q 250mm (m3/h),H 250mm (m)\n" + [["A", 2900], ["B", ""]].flatMap(([m, n]) => [[0, 40], [10, 39], [20, 36]].map((p) => `${m},${n},${p.join(",")}`)).join("\n") + "\n";
    const r = analyseCsv(text).result;
    expect(r.problems.filter((p) => p.severity === "error")).toEqual([]); // source: blank-keys.ts rule (another model)
    expect(r.curveSets.map((c) => c.key)).toEqual(["A|2900|250", "B||250"]); // source: construction
  });
});

// One model at one speed with and without a diameter, as our export writes it: the set without one after the set with one,
// its flow from the start again. Those rows were refused as a break in the curve above (missing-value on each).
describe("a blank key run where the flow starts again is a set of its own, named", () => {
  it("after the set with a diameter: two sets, a key-not-given warning on the run's first line", () => {
    const r = analyseCsv(csv(...curve("A", "2900", "200"), ...curve("A", "2900", ""))).result;
    expect(r.problems.map((p) => [p.row, p.column, p.code, p.severity, p.curveKey])).toEqual([[5, "Impeller (mm)", "key-not-given", "warning", "A|2900|"]]); // source: construction, lines 5-7 (flow 20 on line 4, then 0)
    expect(r.problems[0].reason).toBe(
      "impeller diameter is empty on lines 5–7: read as a curve of its own without one. Line 4 above it (same model and speed) has 200, but the flow " +
        "starts again where they meet (20 on line 4, 0 on line 5, as written): a curve's flow rises along it, so these rows are not part of that curve " +
        "(rule: a blank key cell is \"not given\" for its set unless it would split a curve). If they are that curve's rows with its impeller diameter left out, fill it in.",
    ); // source: blank-keys.ts besideReason (rule and cells)
    expect(r.curveSets.map((c) => [c.key, c.impellerDiameter, c.points.length, c.ok])).toEqual([["A|2900|200", 0.2, 3, true], ["A|2900|", null, 3, true]]); // source: construction
  });

  it("before the set with a diameter, and between two: each side where they meet starts again", () => {
    expect(analyseCsv(csv(...curve("A", "2900", ""), ...curve("A", "2900", "200"))).result.problems.map((p) => [p.row, p.code])).toEqual([[2, "key-not-given"]]); // source: construction (20 on line 4, then 0 on line 5)
    const between = analyseCsv(csv(...curve("A", "2900", "250"), ...curve("A", "2900", ""), ...curve("A", "2900", "200"))).result;
    expect(between.problems.map((p) => [p.row, p.code])).toEqual([[5, "key-not-given"]]); // source: construction
    expect(between.curveSets.map((c) => c.key)).toEqual(["A|2900|250", "A|2900|", "A|2900|200"]); // source: construction
  });

  it("the flow equal where they meet starts again too; rising on one side is a break, refused as before", () => {
    expect(analyseCsv(csv(...curve("A", "2900", "200"), ...curve("A", "2900", "", 20))).result.problems.map((p) => p.code)).toEqual(["key-not-given"]); // source: 20 then 20: not rising (flow-not-increasing's rule)
    const rising = analyseCsv(csv(...curve("A", "2900", "250"), ...curve("A", "2900", "", 30))).result; // 20 on line 4, then 30
    expect(rising.problems.map((p) => [p.row, p.code])).toEqual([5, 6, 7].map((row) => [row, "missing-value"])); // source: blank-keys.ts rule (a break)
    const oneSide = analyseCsv(csv(...curve("A", "2900", "250"), ...curve("A", "2900", "", 30), ...curve("A", "2900", "200"))).result;
    expect(oneSide.problems.filter((p) => p.severity === "error").map((p) => p.row)).toEqual([5, 6, 7]); // source: same (rising from above; starting again below does not undo it)
  });
});

describe("a blank key cell that would split a curve is refused by line and column", () => {
  it("a blank diameter between rows of the same model and speed that have one: one error on that row, charged to the curve", () => {
    const rows = curve("A", "2900", "200").concat("A,2900,200,30,31");
    rows[2] = "A,2900,,20,36";
    const a = analyseCsv(csv(...rows)).result;
    expect(a.problems.map((p) => [p.row, p.column, p.code, p.curveKey])).toEqual([[4, "Impeller (mm)", "missing-value", "A|2900|200"]]); // source: construction, line 4
    expect(a.problems[0].reason).toContain("line 3 above it (same model and speed) has 200"); // source: construction
    expect(a.curveSets.map((c) => [c.key, c.ok])).toEqual([["A|2900|200", false]]); // source: validate.ts (an error charged to a curve keeps it out)
  });

  it("blank diameters on a set's last rows: each blank row refused", () => {
    const rows = [...curve("A", "2900", "200"), "A,2900,,30,31", "A,2900,,40,25", ...curve("B", "2900", "180")];
    expect(errors(csv(...rows))).toEqual([5, 6].map((row) => [row, "Impeller (mm)", "missing-value", "A|2900|200"])); // source: construction, lines 5-6
  });

  it("blank diameters on a set's first rows: refused, naming the row below", () => {
    const rows = ["A,2900,,0,41", ...curve("A", "2900", "200", 5)];
    const a = analyseCsv(csv(...rows)).result;
    expect(a.problems.map((p) => [p.row, p.column, p.code])).toEqual([[2, "Impeller (mm)", "missing-value"]]); // source: construction, line 2
    expect(a.problems[0].reason).toContain("line 3 below it (same model and speed) has 200"); // source: construction
  });

  it("the diameter written on a set's first row only: the rows below refused; ticked fill-down imports it", () => {
    const rows = ["A,2900,200,0,40", "A,2900,,10,39", "A,2900,,20,36", "A,1450,100,0,10", "A,1450,,5,9.8", "A,1450,,10,9"];
    expect(errors(csv(...rows)).filter((p) => p[2] === "missing-value")).toEqual([ // source: construction, lines 3-4 and 6-7 (each curve is then also too short)
      [3, "Impeller (mm)", "missing-value", "A|2900|200"], [4, "Impeller (mm)", "missing-value", "A|2900|200"],
      [6, "Impeller (mm)", "missing-value", "A|1450|100"], [7, "Impeller (mm)", "missing-value", "A|1450|100"],
    ]);
    const filled = analyseCsv(csv(...rows), { ...analyseCsv(csv(...rows)).mapping, fillDownKeys: true }).result;
    expect(filled.problems).toEqual([]); // source: mapping.ts fillDownKeys
    expect(filled.curveSets.map((c) => [c.key, c.points.length])).toEqual([["A|2900|200", 3], ["A|1450|100", 3]]); // source: construction
  });

  it("a row with both the speed and the diameter blank inside a curve: both cells refused", () => {
    const rows = curve("A", "2900", "200").concat("A,2900,200,30,31");
    rows[2] = "A,,,20,36";
    const a = analyseCsv(csv(...rows)).result;
    expect(a.problems.map((p) => [p.row, p.column, p.code, p.curveKey])).toEqual([[4, "Speed (rpm)", "missing-value", "A|2900|200"], [4, "Impeller (mm)", "missing-value", "A|2900|200"]]); // source: construction, line 4
    expect(a.problems[0].reason).toContain("impeller diameter blank here too"); // source: construction
  });

  it("the same speed written another way (2900.0) is the same group", () => {
    const rows = curve("A", "2900", "200").concat("A,2900,200,30,31");
    rows[2] = "A,2900.0,,20,36";
    expect(errors(csv(...rows))).toEqual([[4, "Impeller (mm)", "missing-value", "A|2900|200"]]); // source: construction (2900.0 rpm = 2900 rpm)
  });

  it("a wide file's shared speed column blank on one row of a curve: refused on that row", () => {
    const text = "Model,Speed (rpm),Q 250mm (m3/h),H 250mm (m)\n" + ["A,2900,0,40", "A,,10,39", "A,2900,20,36", "A,2900,30,31"].join("\n") + "\n";
    expect(errors(text)).toEqual([[3, "Speed (rpm)", "missing-value", "A|2900|250"]]); // source: construction, line 3
  });

  it("a blank flow or head is still refused beside a blank diameter (required columns)", () => {
    const rows = [...curve("A", "2900", "200"), "B,2900,,0,12", "B,2900,,5,", "B,2900,,10,11", "B,2900,,15,10"];
    expect(errors(csv(...rows))).toEqual([[6, "Head (m)", "missing-value", "B|2900|"]]); // source: construction, line 6 (head required)
  });
});
