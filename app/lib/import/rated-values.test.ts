// A rating column mapped to shaft power all the same (a user's or a saved mapping) is kept, and its warning states the rule and
// the numbers: the one figure and the flows it covers on each curve, or the range where the values change (rated-values.ts).
// Files are hand-written; values are invented.
import { describe, expect, it } from "vitest";
import { analyseCsv } from "./index";
import type { Mapping } from "./mapping";
import { inSI } from "~/engine/quantityText";

/** Long file: model, speed 2900 rpm, flow m³/h, head m, then the power column under `header`. */
const file = (header: string, rows: string[]) => `Model,Speed rpm,Flow m3/h,Head m,${header}\n${rows.join("\n")}\n`;
/** A saved mapping: the suggestion with column 4 (the power column) set to shaft power in kW, as the mapping page posts it. */
const saved = (text: string): Mapping => {
  const m = analyseCsv(text).suggestedMapping;
  return { ...m, columns: m.columns.map((c) => (c.index === 4 ? { ...c, field: "power" as const, unit: "kW" as const, unitSource: "user" as const } : c)) };
};
const warningOn = (a: ReturnType<typeof analyseCsv>, header: string) =>
  a.result.problems.filter((p) => p.code === "mapping" && p.severity === "warning" && p.column === header).map((p) => inSI(p.reason));

describe("a rating column mapped to shaft power is kept, and its warning gives the values", () => {
  it("“Rated power kW” at 7.5 on every row: kept at 7500 W, the warning names the figure, the points and the flows", () => {
    const text = file("Rated power kW", ["A,2900,0,20,7.5", "A,2900,10,19,7.5", "A,2900,20,17,7.5"]);
    const a = analyseCsv(text, saved(text));
    expect(a.mapping.columns[4].field).toBe("power"); // source: the saved mapping (the user's choice is kept)
    expect(a.result.curveSets[0].points.map((p) => p.power)).toEqual([7500, 7500, 7500]); // source: 7.5 kW (SI prefixes), as mapped
    const [reason] = warningOn(a, "Rated power kW");
    expect(reason).toContain("“Rated power kW” is mapped to shaft power, but its header reads as a rating"); // source: rated-power.ts (the header's rule, as before)
    expect(reason).toContain("by the constant-power rule (the same power within 0.05 % at 3 points or more over at least 30 % of the curve's largest flow"); // source: constant-power.ts thresholds
    expect(reason).toContain("one figure at every point on 1 of 1 curves with a power — 7.50 kW at all 3 points of A · 2900 rpm (flow 0.000 m³/h to 20.0 m³/h, 100.0 % of its largest flow)"); // source: the file (0, 10, 20 m³/h; span (20 − 0)/20)
    expect(reason).toContain("so they read as a rating: kept as mapped (your choice)"); // source: the decision in rated-values.ts
  });

  it("“Rated power P2” saved as shaft power with values that change: kept, the warning gives the range and the flows", () => {
    const text = file("Rated power P2", ["B,2900,0,20,1.0", "B,2900,10,19,1.2", "B,2900,20,17,1.4"]);
    const a = analyseCsv(text, saved(text));
    expect(a.result.curveSets[0].points.map((p) => p.power)).toEqual([1000, 1200, 1400]); // source: 1.0, 1.2, 1.4 kW (SI prefixes), as mapped
    const [reason] = warningOn(a, "Rated power P2");
    expect(reason).toContain("not one figure by that rule on 1 of 1 — 1.00 kW to 1.40 kW at 3 points of B · 2900 rpm (flow 0.000 m³/h to 20.0 m³/h)"); // source: the file
    expect(reason).toContain("so nothing in the values says rating: kept as mapped (your choice)"); // source: the decision in rated-values.ts
  });

  it("two models, one flat and one short: each named with its own numbers", () => {
    // C: 5.5 kW over 10 to 40 m³/h (75 % of its largest flow); D: 3 kW at 30 and 35 m³/h only (two points: not judged by the rule).
    const text = file("Motor kW", ["C,2900,10,30,5.5", "C,2900,20,29,5.5", "C,2900,40,25,5.5", "D,2900,0,15,", "D,2900,30,14,3", "D,2900,35,12,3"]);
    const a = analyseCsv(text, saved(text));
    const [reason] = warningOn(a, "Motor kW");
    expect(reason).toContain("“Motor kW” is mapped to shaft power, but its header reads as the motor's rated output"); // source: rated-power.ts (kind motor)
    expect(reason).toContain("one figure at every point on 1 of 2 curves with a power — 5.50 kW at all 3 points of C · 2900 rpm (flow 10.0 m³/h to 40.0 m³/h, 75.0 % of its largest flow)"); // source: the file ((40 − 10)/40)
    expect(reason).toContain("not one figure by that rule on 1 of 2 — 3.00 kW at 2 points of D · 2900 rpm (flow 30.0 m³/h to 35.0 m³/h)"); // source: the file (2 points < 3)
    expect(reason).toContain("kept as mapped (your choice): the curves with one figure take it as their shaft power at every point"); // source: rated-values.ts
  });

  it("a shaft power column mapped to power gets no such words", () => {
    const text = file("P2 kW", ["E,2900,0,20,7.5", "E,2900,10,19,7.5", "E,2900,20,17,7.5"]);
    const a = analyseCsv(text, saved(text));
    expect(warningOn(a, "P2 kW")).toEqual([]); // source: a P2 header is a reading (no mapping warning); the values are left to power-constant
    expect(a.result.problems.map((p) => p.code)).toEqual(["power-constant"]); // source: constant-power.ts (7.5 kW over the whole curve)
  });
});
