// A zero head in the middle of a curve: the old importer took the zero as a point and flagged the rows after it, each as a
// rise above the zero ("head rises to 20 m, 20 m above the lowest head before it (0 m, line 4)…"), and never the zero
// itself. Now the zero is refused at its row (row, column, value, rule) and the rows after it are judged against the heads
// before it. A zero head at the end (run-out at zero head) stays a point. Hand-written cases, invented pumps.
import { describe, expect, it } from "vitest";
import { analyseCsv } from "./index";

const H = "Model,Speed (rpm),Flow (m3/h),Head (m)";
const file = (heads: number[]) => [H, ...heads.map((h, i) => `A,2900,${i * 10},${h}`)].join("\n") + "\n";
const said = (t: string) => analyseCsv(t).result;

describe("a zero head", () => {
  it("in the middle (30, 28, 0, 20, 14): refused at line 4, the rows after it not flagged as rises (old code: head-rising at lines 5 and 6, none at 4)", () => {
    const r = said(file([30, 28, 0, 20, 14]));
    expect(r.problems.map((p) => [p.row, p.column, p.code, p.severity])).toEqual([[4, "Head (m)", "zero", "error"]]);
    expect(r.problems[0].reason).toContain("in the middle of the curve (line 5 after it has head");
    expect(r.problems[0].reason).toContain("a pump's head falls to zero only at the curve's end (run-out); this point is left out");
    expect(r.curveSets[0].ok).toBe(false); // skip-curves: an error keeps the curve out
  });
  it("drop-points: the zero left out, the other four points imported as written", () => {
    const t = file([30, 28, 0, 20, 14]);
    const r = analyseCsv(t, { ...analyseCsv(t).suggestedMapping, policy: "drop-points" }).result;
    expect(r.curveSets[0].ok).toBe(true);
    expect(r.curveSets[0].points.map((p) => p.head)).toEqual([30, 28, 20, 14]); // source: the cells
  });
  it("at the end (30, 28, 20, 14, 0): a point, no problem (both sides of the rule)", () => {
    const r = said(file([30, 28, 20, 14, 0]));
    expect(r.problems.filter((p) => p.severity === "error")).toEqual([]);
    expect(r.curveSets[0].points.map((p) => p.head)).toEqual([30, 28, 20, 14, 0]);
  });
  it("a small head above zero in the middle (0.001 m) is no zero: judged as before, the next rows as rises over it", () => {
    const r = said(file([30, 28, 0.001, 20, 14]));
    expect(r.problems.map((p) => [p.row, p.code])).toEqual([[5, "head-rising"], [6, "head-rising"]]);
  });
});
