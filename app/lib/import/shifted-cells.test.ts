// A decimal comma written unquoted in a comma-separated file: "A,2900,20,27,5,70" is six cells under five names. The old
// importer read the row by its columns — head 27 (for 27.5), efficiency 5 % (the “5”), the “70” ignored — and said only
// "row has 1 filled cell(s) beyond the 5 header columns; they were ignored" (a warning): the curve imported with both
// values wrong. Now a row whose cells beyond the header hold a number is an extra-cells error at its line, charged to its
// curve, naming the numbers, the row's cells as read and the rule; the point is left out under either policy. Text beyond
// the header (a note) stays the warning. Hand-written cases, invented pumps.
import { describe, expect, it } from "vitest";
import { analyseCsv } from "./index";

const H = "Model,Speed (rpm),Flow (m3/h),Head (m),Efficiency (%)";
const text = (row4: string) => [H, "A,2900,0,30,", "A,2900,10,29,50", row4, "A,2900,30,23,72", "A,2900,40,18,65"].join("\n") + "\n";
const said = (t: string, policy?: "drop-points") => analyseCsv(t, policy ? { ...analyseCsv(t).suggestedMapping, policy } : undefined).result;

describe("a number beyond the header's columns", () => {
  it("“27,5” unquoted: an error at line 4 naming the numbers, the cells and the rule; never head 27 and 5 % (old code: a warning, both imported)", () => {
    const r = said(text("A,2900,20,27,5,70"));
    expect(r.problems.map((p) => [p.row, p.column, p.code, p.severity])).toEqual([[4, null, "extra-cells", "error"]]);
    expect(r.problems[0].reason).toContain("row has 1 filled cell(s) beyond the 5 header columns, a number among them (“70”); its cells as read: A | 2900 | 20 | 27 | 5 | 70.");
    expect(r.problems[0].reason).toContain("A number written with a decimal comma in a comma-separated file (27,5) is split in two");
    expect(r.problems[0].curveKey).toBe("A|2900|");
    expect(r.curveSets[0].ok).toBe(false);
  });
  it("drop-points: the point is left out, the others imported as written", () => {
    const set = said(text("A,2900,20,27,5,70"), "drop-points").curveSets[0];
    expect(set.ok).toBe(true);
    expect(set.points.map((p) => [Math.round(p.flow * 3600), p.head, p.efficiency])).toEqual([[0, 30, undefined], [10, 29, 0.5], [30, 23, 0.72], [40, 18, 0.65]]); // source: the cells, % ÷ 100
  });
  it("several numbers beyond: each named, up to three", () => {
    const r = said(text("A,2900,20,27,5,70,1,2,3"));
    expect(r.problems[0].reason).toContain("row has 4 filled cell(s) beyond the 5 header columns, numbers among them (“70”, “1”, “2”)");
  });
});

describe("left as it was", () => {
  it("text beyond the header (a note): the warning, the point kept", () => {
    const r = said(text("A,2900,20,27,70,see note"));
    expect(r.problems.map((p) => [p.row, p.code, p.severity])).toEqual([[4, "extra-cells", "warning"]]);
    expect(r.curveSets[0].ok).toBe(true);
    expect(r.curveSets[0].points).toHaveLength(5);
  });
  it("the decimal comma quoted, “27,5”: one cell, refused at its column as not a number (a comma file takes a decimal point), as before", () => {
    const r = said(text('A,2900,20,"27,5",70'));
    expect(r.problems.map((p) => [p.row, p.column, p.code, p.reason])).toEqual([[4, "Head (m)", "not-a-number", "head “27,5” is not a number"]]);
  });
});
