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

  // Curve A carried on past 40 m³/h (invented: heads falling on, P from ρgQH/η at 1000 kg/m³ rounded to 2 decimals, python3)
  const ON = ["A,2900,190,50,29.5,66,6.09,3.4", "A,2900,190,60,24.5,60,6.67,4.3", "A,2900,190,70,18.5,50,7.06,5.4"];
  const last3 = (speed: string) => file([...ROWS, ...ON.map((r) => r.replace(",2900,", `,${speed},`))]);

  it("the last 3 rows at 2990 rpm (3.1 % from 2900) while the flow rises on: key-stray on each, A · 2900 and the 3-row curve both kept out (old code: both imported ok, A short of 50–70 m³/h)", () => {
    const a = analyseCsv(last3("2990"));
    expect(errors(last3("2990"))).toEqual([
      [7, "speed_rpm", "key-stray", "A|2900|190"], // source: construction (flow 50 after 40 m³/h on line 6)
      [7, "speed_rpm", "key-stray", "A|2990|190"], // source: construction (the run's own curve, kept out)
      [8, "speed_rpm", "key-stray", "A|2900|190"],
      [9, "speed_rpm", "key-stray", "A|2900|190"],
    ]);
    expect(a.result.curveSets.map((c) => [c.key, c.ok])).toEqual([["A|2900|190", false], ["A|2990|190", false]]);
    const own = a.result.problems.find((p) => p.curveKey === "A|2990|190")!.reason;
    expect(own).toContain("speed “2990” on lines 7–9 is within 5 % of “2900” on line 6 above"); // source: our rule (NEAR_KEY)
    expect(own).toContain("3 rows"); // source: construction
  });

  it("kept out under drop-points too: the 3-row curve is not a curve of its own", () => {
    const t = last3("2990");
    const a = analyseCsv(t, { ...analyseCsv(t).mapping, policy: "drop-points" });
    expect(a.result.curveSets.map((c) => [c.key, c.ok])).toEqual([["A|2900|190", true], ["A|2990|190", false]]); // source: construction (A keeps its 5 good points)
  });

  it("the verdict flips at 5 %: 3045 rpm (5.0 %) is named, 3050 rpm (5.2 %) is a curve of its own", () => {
    expect(errors(last3("3045")).map((e) => e[2])).toEqual(["key-stray", "key-stray", "key-stray", "key-stray"]); // source: 145/2900 = 5.0 %
    expect(errors(last3("3050"))).toEqual([]); // source: 150/2900 = 5.17 %
  });

  it("a diameter too: the last 3 rows at 195 mm (2.6 % from 190) are named in impeller_mm", () => {
    const t = file([...ROWS, ...ON.map((r) => r.replace(",190,", ",195,"))]);
    expect(errors(t).map((e) => [e[0], e[1], e[3]])).toEqual([[7, "impeller_mm", "A|2900|190"], [7, "impeller_mm", "A|2900|195"], [8, "impeller_mm", "A|2900|190"], [9, "impeller_mm", "A|2900|190"]]); // source: construction
  });

  it("guard: 3 rows at 2990 rpm whose flow starts again are a curve of their own (passed before too)", () => {
    expect(errors(file([...ROWS, ...ROWS.slice(0, 3).map((r) => r.replace(",2900,", ",2990,"))]))).toEqual([]); // source: construction (0, 10, 20 m³/h)
  });
});
