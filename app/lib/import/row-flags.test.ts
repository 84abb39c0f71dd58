// Every flag on a data row names its line and a column (the brief of the mapping page's problem list and fix grid).
import { describe, expect, it } from "vitest";
import { analyseCsv } from "./index";
import { curveAWithCell as withCell } from "./test-helpers"; // invented curve A, every check passed (test-helpers.ts)


describe("row flags name their column and the cell as written", () => {
  it("efficiency “1e309”: named as written, too large (old code: “efficiency Infinity % is above 100 %”)", () => {
    const p = analyseCsv(withCell(2, 5, "1e309")).result.problems.filter((q) => q.severity === "error");
    expect(p.map((q) => [q.row, q.column, q.code])).toEqual([[4, "efficiency_pct", "not-a-number"]]); // source: construction
    expect(p[0].reason).toBe("efficiency “1e309” is too large to be a real value"); // source: our message (as for every other field)
  });

  it("the η-vs-ρgQH/P warning names the efficiency column (old code: no column)", () => {
    // 5 % given at 20 m³/h and 38.5 m with 3.5 kW: ρgQH/P = 59.9 % (1000 × 9.80665 × 20/3600 × 38.5 / 3500, python3; ρ the engine's DEFAULT_POWER_DENSITY)
    const p = analyseCsv(withCell(2, 5, "5")).result.problems;
    expect(p.map((q) => [q.row, q.column, q.code, q.severity])).toEqual([[4, "efficiency_pct", "inconsistent", "warning"]]); // source: construction
    expect(p[0].reason).toContain("ρgQH/P = 59.93 %"); // source: python3 above
  });

  it("guard: efficiency 100.5 % is still above 100 % (passed before too)", () => {
    const p = analyseCsv(withCell(4, 5, "100.5")).result.problems.filter((q) => q.severity === "error");
    expect(p.map((q) => [q.row, q.column, q.code])).toEqual([[6, "efficiency_pct", "efficiency-over-100"]]); // source: construction
  });
});
