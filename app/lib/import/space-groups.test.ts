// A space inside a number cell: only thousands groups (1 450) are read; any other space makes the cell no number,
// named at its row and column (the form reader's rule, shared/decimal.ts, decision "inputedge").
import { describe, expect, it } from "vitest";
import { analyseCsv } from "./index";
import { curveAWithCell as withCell } from "./test-helpers"; // invented curve A, every check passed (test-helpers.ts)
import { parseNumber } from "./numbers";


describe("spaces inside number cells", () => {
  it("thousands groups in threes are read, in dot and comma files (SI Brochure / ISO 80000-1 digit grouping)", () => {
    expect(parseNumber("1 450", false)).toBe(1450); // source: construction
    expect(parseNumber("12 500.5", false)).toBe(12500.5); // source: construction
    expect(parseNumber("1\u00a0450,25", true)).toBe(1450.25); // source: construction (no-break space, decimal comma)
    expect(parseNumber("  38.5  ", false)).toBe(38.5); // source: construction (spaces around the cell are trimmed)
  });

  it("any other space is no number: “1 4” is not 14, “3 5” not 35, “38⏎.5” not 38.5", () => {
    for (const s of ["1 4", "3 5", "12 50", "1 5000", "38\n.5", "- 5", "1 450 5"]) expect(parseNumber(s, false), s).toBeNaN(); // source: the grouping rule (threes only)
    expect(parseNumber("12 5,5", true)).toBeNaN(); // source: the grouping rule
  });

  it("NPSHr “1 4” on line 4: refused at line 4 in npshr_m (old code: stored 14 m on an ok curve, no word)", () => {
    const a = analyseCsv(withCell(2, 7, "1 4"));
    const p = a.result.problems.filter((q) => q.severity === "error");
    expect(p.map((q) => [q.row, q.column, q.code])).toEqual([[4, "npshr_m", "not-a-number"]]); // source: construction (row 3 of the data is line 4)
    expect(p[0].reason).toContain("a space inside a number only groups thousands"); // source: our message
    expect(a.result.curveSets[0].ok).toBe(false);
  });

  it("power “3 5” and a quoted head “38⏎.5” are refused at their rows and columns", () => {
    const pw = analyseCsv(withCell(2, 6, "3 5"));
    expect(pw.result.problems.filter((q) => q.severity === "error").map((q) => [q.row, q.column, q.code])).toEqual([[4, "power_kw", "not-a-number"]]); // source: construction
    const hd = analyseCsv(withCell(2, 4, '"38\n.5"'));
    expect(hd.result.problems.filter((q) => q.severity === "error").map((q) => [q.row, q.column, q.code])).toEqual([[4, "head_m", "not-a-number"]]); // source: construction (the record starts on line 4)
  });

  it("guard: flows grouped in threes (“1 000” l/h) still import (passed before too)", () => {
    const t = ["Model,Speed rpm,Impeller mm,Flow l/h,Head m", "A,2900,190,0,40", "A,2900,190,1 000,39.5", "A,2900,190,2 000,38.5"].join("\n");
    const a = analyseCsv(t);
    expect(a.result.curveSets[0].ok).toBe(true);
    expect(a.result.curveSets[0].points.map((p) => p.flow * 3.6e6)).toEqual([0, 1000, 2000]); // source: 1 l/h = 1e-3/3600 m³/s (SI)
  });
});
