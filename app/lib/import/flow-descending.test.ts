// A curve written from its highest flow down to shut-off (flow falling on every row): read in rising order with a warning,
// not refused row by row. Invented curve (P from ρgQH/η, ρ = 998.2 kg/m³).
import { describe, expect, it } from "vitest";
import { analyseCsv } from "./index";
import { FULL_HEADER as H, CURVE_A_ROWS as ROWS, expectEngineTakes } from "./test-helpers";


describe("flows written from high to low", () => {
  it("40 → 0 m³/h on lines 2–6: one warning at line 2 in flow_m3h, the same 5 points as the rising file (old code: 4 flow-not-increasing errors, 1 point, refused)", () => {
    const down = analyseCsv([H, ...[...ROWS].reverse()].join("\n"));
    const up = analyseCsv([H, ...ROWS].join("\n"));
    expect(down.result.problems.map((p) => [p.row, p.column, p.code, p.severity])).toEqual([[2, "flow_m3h", "flow-descending", "warning"]]); // source: construction
    expect(down.result.curveSets[0].ok).toBe(true);
    expect(down.result.curveSets[0].points).toEqual(up.result.curveSets[0].points); // source: the same rows, read in rising order
    expectEngineTakes(down.result.curveSets);
  });

  it("guard: one row out of order is still refused at its row (passed before too)", () => {
    const a = analyseCsv([H, ROWS[0], ROWS[2], ROWS[1], ROWS[3], ROWS[4]].join("\n"));
    expect(a.result.problems.filter((p) => p.severity === "error").map((p) => [p.row, p.column, p.code])).toEqual([[4, "flow_m3h", "flow-not-increasing"]]); // source: construction
  });
});
