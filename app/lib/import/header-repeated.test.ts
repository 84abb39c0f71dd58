// The header row written again below it (two exports joined into one file): skipped with a warning at its line, charged to
// no curve. Invented curves (P from ρgQH/η, ρ = 998.2 kg/m³).
import { describe, expect, it } from "vitest";
import { analyseCsv } from "./index";

const H = "model,speed_rpm,impeller_mm,flow_m3h,head_m,efficiency_pct,power_kw,npshr_m";
const A = [
  "A,2900,190,0,40,0,2.5,1.1",
  "A,2900,190,10,39.5,39,2.76,1.2",
  "A,2900,190,20,38.5,60,3.5,1.4",
  "A,2900,190,30,36.5,69,4.33,1.9",
  "A,2900,190,40,33.5,70,5.21,2.6",
];
const B = A.map((r) => r.replace("A,", "B,"));

describe("a header repeated mid-file", () => {
  it("line 7 repeats line 1: a warning there, both curves import (old code: 7 not-a-number errors on line 7 kept the good curve A out)", () => {
    const a = analyseCsv([H, ...A, H, ...B].join("\n"));
    expect(a.result.problems.map((p) => [p.row, p.column, p.code, p.severity])).toEqual([[7, null, "header-repeated", "warning"]]); // source: construction
    expect(a.result.curveSets.map((c) => [c.key, c.ok, c.points.length])).toEqual([["A|2900|190", true, 5], ["B|2900|190", true, 5]]); // source: construction
  });

  it("written again in another case and spacing, still the header", () => {
    const a = analyseCsv([H, ...A, H.toUpperCase().replace(/,/g, " , "), ...B].join("\n"));
    expect(a.result.problems.map((p) => [p.row, p.code])).toEqual([[7, "header-repeated"]]); // source: construction
  });

  it("guard: a different header mid-file (columns in another order) is not skipped: its cells are named as before (passed before too)", () => {
    const other = "model,speed_rpm,impeller_mm,head_m,flow_m3h,efficiency_pct,power_kw,npshr_m";
    const a = analyseCsv([H, ...A, other, ...B].join("\n"));
    expect(a.result.problems.filter((p) => p.row === 7 && p.severity === "error").map((p) => p.column)).toEqual(
      ["speed_rpm", "impeller_mm", "flow_m3h", "head_m", "efficiency_pct", "power_kw", "npshr_m"], // source: construction (each unreadable cell)
    );
    expect(a.result.curveSets[0].ok).toBe(false); // charged to the curve above, as any unreadable row
  });

  it("a units row under the repeated header (“,rpm,mm,m3/h,m,%,kW,m”) is skipped with it (old code: 8 not-a-number errors on its line kept curve A out)", () => {
    const names = "Model,Speed,Impeller,Flow,Head,Eff,Power,NPSHr";
    const units = ",rpm,mm,m3/h,m,%,kW,m";
    const a = analyseCsv([names, units, ...A, names, units, ...B].join("\n"));
    expect(a.result.problems.map((p) => [p.row, p.column, p.code, p.severity])).toEqual([[8, null, "header-repeated", "warning"]]); // source: construction (lines 8–9)
    expect(a.result.problems[0].reason).toContain("with its units row, line 9"); // source: construction
    expect(a.result.curveSets.map((c) => [c.key, c.ok, c.points.length])).toEqual([["A|2900|190", true, 5], ["B|2900|190", true, 5]]); // source: construction
  });

  it("a units row under a repeated header whose first copy had none: skipped too, the columns' units stay those of line 1", () => {
    const units = ",rpm,mm,m3/h,m,%,kW,m";
    const a = analyseCsv([H, ...A, H, units, ...B].join("\n"));
    expect(a.result.problems.map((p) => [p.row, p.code])).toEqual([[7, "header-repeated"]]); // source: construction
    expect(a.result.curveSets.map((c) => [c.key, c.ok])).toEqual([["A|2900|190", true], ["B|2900|190", true]]); // source: construction
  });

  it("guard: a data row under a repeated header is not a units row: read as data (passed before too)", () => {
    const a = analyseCsv([H, ...A, H, ...B].join("\n"));
    expect(a.result.curveSets[1].points).toHaveLength(5); // source: construction (B's five rows)
  });

  it("guard: a units row in other units (l/s under flow_m3h) is not skipped: its cells are named, never read silently in m³/h", () => {
    const a = analyseCsv([H, ...A, H, ",rpm,mm,l/s,m,%,kW,m", ...B].join("\n"));
    expect(a.result.problems.find((p) => p.row === 8 && p.column === "flow_m3h")?.reason).toBe("flow “l/s” is not a number"); // source: construction
    expect(a.result.problems[0].reason).not.toContain("units row"); // source: construction (only the header skipped)
  });
});
