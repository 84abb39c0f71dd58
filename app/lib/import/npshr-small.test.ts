// An NPSHr that is above zero but too small to be one a maker publishes: the importer refused 0 and negative NPSHr
// (point-rules.ts, with the row and value) but took "5e-324" and "0.001" m silently, and a curve with 5e-324 m (a denormal,
// NPSHa / NPSHr overflowing to Infinity) then made every search of the library throw (engine/npshr-tiny.test.ts). Now an
// NPSHr below 0.1 m is a warning at its row, in the NPSHr column, with the value as written, what it reads as and the rule;
// the curve is kept (a warning: the unit may be wrong, or the cell). 0.1 m and above as before. The fast path steps aside.
// Check values: the smallest NPSHr a centrifugal pump's maker publishes is some tenths of a metre (common practice, from
// memory; the demo libraries' smallest is 0.23 m); 1 ft = 0.3048 m (exact), so 0.3 ft = 0.09144 m.
import { describe, expect, it } from "vitest";
import { analyseCsv } from "./index";
import { inSI } from "~/engine/quantityText";
import { NPSHR_SMALL } from "./point-rules";

const T = "Model,Speed rpm,Flow m3/h,Head m,Eff %";
const text = (cell: string, unit = "m") => [`${T},NPSHr ${unit}`, "A,2900,0,20,0,1", "A,2900,10,19,60,1.1", `A,2900,20,17,70,${cell}`, "A,2900,30,14,65,3.1"].join("\n") + "\n";
const problems = (cell: string, unit = "m") => analyseCsv(text(cell, unit)).result.problems.map((p) => ({ row: p.row, column: p.column, code: p.code, severity: p.severity, reason: inSI(p.reason) }));

describe("an NPSHr above zero and below 0.1 m: a warning with the row and value", () => {
  it("the rule's floor is 0.1 m", () => expect(NPSHR_SMALL).toBe(0.1));
  for (const cell of ["5e-324", "1e-300", "0.001", "0.0999"]) {
    it(`${cell} m: warned at line 4 in "NPSHr m", the curve kept (old code: nothing said)`, () => {
      const p = problems(cell);
      expect(p.map(({ row, column, code, severity }) => ({ row, column, code, severity }))).toEqual([{ row: 4, column: "NPSHr m", code: "npshr-small", severity: "warning" }]);
      expect(p[0].reason).toContain(`NPSHr “${cell}”`);
      expect(p[0].reason).toMatch(/ is below 0\.100? m: no centrifugal pump's maker publishes so small an NPSHr/);
      expect(analyseCsv(text(cell)).result.curveSets[0].ok).toBe(true);
    });
  }
  it("flips at 0.1 m: 0.1 and 0.23 say nothing", () => {
    expect(problems("0.1")).toEqual([]);
    expect(problems("0.23")).toEqual([]);
  });
  it("in ft: 0.3 ft (0.0914 m) is warned, 0.33 ft (0.1006 m) is not", () => {
    expect(problems("0.3", "ft").map((p) => p.code)).toEqual(["npshr-small"]);
    expect(problems("0.33", "ft")).toEqual([]);
  });
  it("the fast path steps aside for it and both paths give one result", () => {
    const fast = analyseCsv(text("0.001"));
    expect(fast.fastPath).toBe(false);
    expect(fast.result).toEqual(analyseCsv(text("0.001"), undefined, { fast: false }).result);
    expect(analyseCsv(text("2.0")).fastPath).toBe(true);
  });
});
