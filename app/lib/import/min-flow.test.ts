// The maker's minimum flow column (min-flow.ts): read in its unit, one figure per curve, above zero and below the curve's
// last published flow; every bad value named with its row, value and rule, and the curve kept out under either policy.
// Sources: hand-written CSVs below (invented model names); unit factors NIST SP 811 (1 US gal = 3.785411784 L).
import { describe, expect, it } from "vitest";
import * as v from "valibot";
import { analyseCsv } from "./index";
import { CurveSetSchema } from "./validate";
import { guessHeader } from "./units-in-headers";
import { inSI } from "~/engine/quantityText";

const HEAD = "Model,Speed (rpm),Impeller (mm),Flow (m3/h),Head (m),Min flow (m3/h)";
/** One curve, 0–40 m³/h, with the minimum-flow cells given (blank: none written on that row). */
const curve = (model: string, cells: [string, string, string, string]) =>
  [`${model},2900,160,0,30,${cells[0]}`, `${model},2900,160,20,28,${cells[1]}`, `${model},2900,160,30,25,${cells[2]}`, `${model},2900,160,40,20,${cells[3]}`];
const csv = (...rows: string[][]) => [HEAD, ...rows.flat()].join("\n");
const both = (text: string, mapping?: unknown) => [analyseCsv(text, mapping), analyseCsv(text, mapping, { fast: false })];
const M3H = 1 / 3600; // m³/s per m³/h (SI definition)

describe("the column is read", () => {
  it("headers name it in their own words, with the flow unit read as for flow", () => {
    // source: the header words of units-in-headers.ts MIN_FLOW (our reading of common vendor wording)
    for (const [h, unit] of [["Min flow (m3/h)", "m3/h"], ["min_flow_m3h", "m3/h"], ["Minimum continuous flow l/s", "l/s"], ["Qmin gpm", "gpm"], ["Q_min", "m3/h"], ["MCSF (m3/h)", "m3/h"], ["Mindestförderstrom m³/h", "m3/h"]] as const)
      expect([h, guessHeader(h).field, guessHeader(h).unit]).toEqual([h, "minflow", unit]);
    // a flow column stays a flow, a flow in l/min is no minimum (source: FIELD_RULES, the flow words)
    for (const h of ["Flow (m3/h)", "Q l/min", "Nominal flow", "Flow m3/min"]) expect([h, guessHeader(h).field]).toEqual([h, "flow"]);
    expect(guessHeader("Min flow % BEP").refused?.why).toContain("BEP flow"); // source: unit-words.ts, a share of the BEP flow is refused
  });

  it("one figure on every row, or on one row only: the curve carries it in m³/s, on both paths", () => {
    const text = csv(curve("MF-A", ["12", "12", "12", "12"]), curve("MF-B", ["", "9.5", "", ""]), curve("MF-C", ["", "", "", ""]));
    for (const a of both(text)) {
      expect(a.result.problems).toEqual([]);
      const by = Object.fromEntries(a.result.curveSets.map((c) => [c.model, c.minFlow]));
      expect(by["MF-A"]).toBeCloseTo(12 * M3H, 15); // source: 12 m³/h ÷ 3600
      expect(by["MF-B"]).toBeCloseTo(9.5 * M3H, 15); // source: 9.5 m³/h ÷ 3600
      expect(by["MF-C"]).toBeUndefined(); // source: no figure written: none recorded
      for (const c of a.result.curveSets) expect(v.safeParse(CurveSetSchema, c).success).toBe(true);
    }
    expect(analyseCsv(text).fastPath).toBe(true); // a clean file with the column keeps the fast path
  });

  it("a US-gallon header converts exactly", () => {
    const text = ["Model,Speed (rpm),Impeller (mm),Flow (gpm),Head (ft),Qmin (gpm)", "MF-G,1750,160,0,100,30", "MF-G,1750,160,100,95,", "MF-G,1750,160,200,80,"].join("\n");
    for (const a of both(text)) expect(a.result.curveSets[0].minFlow).toBeCloseTo((30 * 3.785411784e-3) / 60, 15); // source: NIST SP 811, 1 gpm = 3.785411784 L/min
  });
});

describe("bad values are flagged with row, value and rule", () => {
  const problemsOf = (cells: [string, string, string, string]) => {
    const [fast, full] = both(csv(curve("MF-X", cells)));
    expect(fast.result).toEqual(full.result); // source: the full path is the reference (fast.ts steps aside)
    return full.result;
  };

  it.each([
    ["abc", "is not a number"],
    ["0", "is not above zero"],
    ["-5", "is not above zero"],
    ["1e400", "is too large"],
    ["1e-400", "too small to be stored"],
  ])("%s: %s", (raw, words) => {
    const r = problemsOf([raw, "", "", ""]);
    expect(r.problems.map((p) => [p.row, p.column, p.code, p.severity, p.curveKey])).toEqual([[2, "Min flow (m3/h)", "min-flow", "error", "MF-X|2900|160"]]); // source: construction, line 2 holds the cell
    expect(r.problems[0].reason).toContain(`“${raw}”`);
    expect(r.problems[0].reason).toContain(words);
    expect(r.curveSets[0].ok).toBe(false);
    expect(r.curveSets[0].minFlow).toBeUndefined();
  });

  it("at or past the curve's last published flow (40 m³/h): each row holding it named, with both flows and the rule", () => {
    for (const raw of ["40", "41", "40.0"]) {
      const r = problemsOf([raw, raw, "", ""]);
      expect(r.problems.map((p) => [p.row, p.code])).toEqual([[2, "min-flow"], [3, "min-flow"]]); // source: construction, lines 2 and 3
      const said = inSI(r.problems[0].reason);
      expect(said).toContain("is not below the curve's last published flow, 40");
      expect(said).toContain("below the curve's last published flow");
      expect(r.curveSets[0].ok).toBe(false);
    }
  });

  it("just below the last flow is taken (flip at 40 m³/h, 1e-6 relative)", () => {
    const r = problemsOf([String(40 * (1 - 1e-6)), "", "", ""]);
    expect(r.problems).toEqual([]);
    expect(r.curveSets[0].minFlow).toBeCloseTo((40 * (1 - 1e-6)) / 3600, 15); // source: construction
    expect(problemsOf([String(40 * (1 + 1e-6)), "", "", ""]).problems.map((p) => p.code)).toEqual(["min-flow"]);
  });

  it("two figures on one curve: the row that differs is named with both", () => {
    const r = problemsOf(["12", "12", "15", ""]);
    expect(r.problems.map((p) => [p.row, p.code])).toEqual([[4, "min-flow"]]); // source: construction, line 4 holds 15
    expect(inSI(r.problems[0].reason)).toMatch(/“15” \(15\.0 m³\/h\) differs from “12” \(12\.0 m³\/h\) on line 2/);
  });

  it("drop-points keeps the curve out too: a bad maker's figure is never imported as none", () => {
    const text = csv(curve("MF-X", ["n/a", "", "", ""]), curve("MF-Y", ["", "", "", ""]));
    const mapping = { ...analyseCsv(text).mapping, policy: "drop-points" };
    const r = analyseCsv(text, mapping).result;
    expect(r.curveSets.map((c) => [c.model, c.ok])).toEqual([["MF-X", false], ["MF-Y", true]]);
  });

  it("the service's re-check refuses a figure at or past the last flow", () => {
    const set = { key: "k", model: "M", speed: 2900, impellerDiameter: 0.16, points: [{ flow: 0, head: 30 }, { flow: 0.005, head: 28 }, { flow: 0.01, head: 20 }], sourceRows: [2, 3, 4], ok: true };
    expect(v.safeParse(CurveSetSchema, { ...set, minFlow: 0.0099 }).success).toBe(true);
    expect(v.safeParse(CurveSetSchema, { ...set, minFlow: 0.01 }).success).toBe(false); // source: the rule, below the last flow
    expect(v.safeParse(CurveSetSchema, { ...set, minFlow: 0 }).success).toBe(false); // source: the rule, above zero
  });
});

describe("wide layout: one figure per block", () => {
  it("“Qmin 250mm” belongs to its block, and its cell alone makes no point", () => {
    const text = [
      "Model,Q 250mm (m3/h),H 250mm (m),Qmin 250mm (m3/h),Q 230mm (m3/h),H 230mm (m),Qmin 230mm (m3/h)",
      "MF-W,0,40,14,0,33,11",
      "MF-W,30,36,,27,30,",
      "MF-W,60,28,,54,23,",
      "MF-W,,,,,,",
    ].join("\n");
    const a = analyseCsv(text, { ...analyseCsv(text).mapping, defaults: { speed: 2900 } });
    expect(a.mapping.columns.filter((c) => c.field === "minflow").map((c) => c.block?.impeller)).toEqual([250, 230]);
    expect(a.result.problems.filter((p) => p.severity === "error")).toEqual([]);
    expect(a.result.curveSets.map((c) => [c.impellerDiameter, Math.round(c.minFlow! * 3600 * 1e9) / 1e9])).toEqual([[0.25, 14], [0.23, 11]]); // source: construction
  });
});
