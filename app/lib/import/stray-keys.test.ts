// A speed or diameter mistyped on one row of a curve (stray-keys.ts): named at that row in its key column, charged to the
// curve it breaks, so that curve is not imported short of a point. Invented curve (P from ρgQH/η, ρ = 998.2 kg/m³).
import { describe, expect, it } from "vitest";
import { analyseCsv } from "./index";
import { FULL_HEADER as H, CURVE_A_ROWS as ROWS } from "./test-helpers";

const file = (rows: string[]) => [H, ...rows].join("\n");
const errors = (t: string) => analyseCsv(t).result.problems.filter((p) => p.severity === "error").map((p) => [p.row, p.column, p.code, p.curveKey]);

describe("a key mistyped on a row or two of a curve", () => {
  it("speed 2950 on the last row (line 6): named in speed_rpm and charged to A · 2900, which is kept out (old code: imported ok with 4 of its 5 points)", () => {
    const a = analyseCsv(file([...ROWS.slice(0, 4), ROWS[4].replace(",2900,", ",2950,")]));
    expect(errors(file([...ROWS.slice(0, 4), ROWS[4].replace(",2900,", ",2950,")]))).toEqual([
      [6, "speed_rpm", "key-stray", "A|2900|190"], // source: construction (line 6, flow 40 after 30 m³/h)
      [6, "flow_m3h", "too-few-points", "A|2950|190"], // source: construction (one row at 2950)
    ]);
    expect(a.result.curveSets.map((c) => [c.key, c.ok])).toEqual([["A|2900|190", false], ["A|2950|190", false]]);
    expect(a.result.problems.find((p) => p.code === "key-stray")!.reason).toContain("speed “2950” differs from “2900” on line 5 above");
  });

  it("diameter 19 on the first row (line 2): named in impeller_mm and charged to the curve below", () => {
    expect(errors(file([ROWS[0].replace(",190,", ",19,"), ...ROWS.slice(1)]))).toEqual([
      [2, "impeller_mm", "key-stray", "A|2900|190"], // source: construction (flow 0, then 10 m³/h on line 3)
      [2, "flow_m3h", "too-few-points", "A|2900|19"], // source: construction
    ]);
  });

  it("2900, 2950, 2900: only the 2950 row is named, not the rows around it", () => {
    const e = errors(file([...ROWS.slice(0, 2), ROWS[2].replace(",2900,", ",2950,"), ...ROWS.slice(3)]));
    expect(e.filter((p) => p[2] === "key-stray")).toEqual([[4, "speed_rpm", "key-stray", "A|2900|190"]]); // source: construction
  });

  it("guard: the next curve at another speed starting again from zero flow is no stray (passed before too)", () => {
    expect(errors(file([...ROWS, ...ROWS.map((r) => r.replace(",2900,", ",1450,"))]))).toEqual([]); // source: construction (flow starts again)
  });

  it("guard: a two-point curve at another speed whose flow starts again is only too short, nothing charged to its neighbour (passed before too)", () => {
    expect(errors(file([...ROWS, ROWS[0].replace(",2900,", ",1450,"), ROWS[1].replace(",2900,", ",1450,")]))).toEqual([[7, "flow_m3h", "too-few-points", "A|1450|190"]]); // source: construction
  });
});
