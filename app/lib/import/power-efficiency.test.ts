// Powers in hp under a kW header beside an efficiency column: at every point the efficiency the power implies (ρgQH/P) is
// 0.746× the column's — one factor, 1 hp = 0.7457 kW — an error at each point naming both cells (power-efficiency), the
// points left out; any other disagreement stays the 3-point warning at its row (inconsistent), now with the power's numbers.
// Judged at ρ = 1000 kg/m³, the density the engine reads power columns at (pumpCurve.ts DEFAULT_POWER_DENSITY).
// Invented curve A (test-helpers.ts); ratios from python3: 1000 * 9.80665 * Q/3600 * H / P / η.
import { describe, expect, it } from "vitest";
import { analyseCsv } from "./index";
import { CURVE_A_ROWS, FULL_HEADER } from "./test-helpers";

const list = (t: string, policy?: "drop-points") => {
  const a = analyseCsv(t, policy ? { ...analyseCsv(t).mapping, policy } : undefined);
  return { a, rows: a.result.problems.map((p) => [p.row, p.column, p.code, p.severity]) };
};
/** Curve A with every power × f, 2 decimals (a power in hp under a kW header: f = 1/0.7457 = 1.341, NIST SP 811). */
const scaled = (f: number) => [FULL_HEADER, ...CURVE_A_ROWS.map((r) => r.split(",").map((c, j) => (j === 6 ? (Number(c) * f).toFixed(2) : c)).join(","))].join("\n");
const MIXED_UP = [3, 4, 5, 6].map((l) => [l, "power_kw", "power-efficiency", "error"]);

describe("powers in hp under a kW header, beside an efficiency column", () => {
  it("an error at each point with flow, in the power column; the curve kept out (old code: 4 inconsistent warnings, imported with its powers 1.341× high)", () => {
    const { a, rows } = list(scaled(1.341));
    expect(rows).toEqual([[2, "flow_m3h", "too-few-points", "error"], ...MIXED_UP]); // source: construction (lines 3–6 have flow; line 2 is left alone)
    expect(a.result.curveSets[0].ok).toBe(false);
    const r6 = a.result.problems.find((p) => p.row === 6)!.reason;
    expect(r6).toContain("power “6.99” in “power_kw”"); // source: 5.21 × 1.341 = 6.99 (the cell as written)
    expect(r6).toContain("efficiency “70” in “efficiency_pct”"); // source: the efficiency cell as written
    expect(r6).toContain("52.2 %"); // source: python3, 1000 * 9.80665 * 40/3600 * 33.5 / 6990 = 0.52221
    expect(r6).toContain("0.746 times it, and at all 4 points"); // source: python3, 0.52221 / 0.70
    expect(r6).toContain("in hp under a kW header"); // source: our message
    expect(r6).toContain("⟦density|1000⟧"); // source: pumpCurve.ts DEFAULT_POWER_DENSITY
  });

  it("under drop-points the points are dropped too, so the curve is left with its shut-off point and kept out", () => {
    expect(list(scaled(1.341), "drop-points").a.result.curveSets.map((c) => [c.ok, c.points.length])).toEqual([[false, 1]]); // source: construction
  });

  it("the verdict flips at 3 % from 0.7457: powers × 1.318 (ratios' median 0.758, 1.7 % off) an error; × 1.28 (0.781, 4.7 %) and × 1.40 (0.714, 4.2 %) warnings", () => {
    expect(list(scaled(1.318)).rows).toEqual([[2, "flow_m3h", "too-few-points", "error"], ...MIXED_UP]); // source: python3 (median 0.7581)
    for (const f of [1.28, 1.4]) {
      const { a, rows } = list(scaled(f));
      expect(rows).toEqual([3, 4, 5, 6].map((l) => [l, "efficiency_pct", "inconsistent", "warning"])); // source: python3 (medians 0.7810, 0.7141)
      expect(a.result.curveSets[0].ok).toBe(true);
    }
  });

  it("kW under an hp header (powers × 0.7457 read as hp): the same error, the other way", () => {
    const t = scaled(1).replace("power_kw", "power_hp");
    const rows = list(t).rows.filter((r) => r[2] === "power-efficiency");
    expect(rows.map((r) => r[0])).toEqual([3, 4, 5, 6]); // source: construction (2.76 kW read as 2.76 hp = 2.058 kW: ρgQH/P 1.341× the column's)
    expect(list(t).a.result.problems.find((p) => p.row === 6)!.reason).toContain("in kW under an hp header"); // source: our message
  });

  it("guard: powers 12 % above the efficiency column's at every point (an allowance, not a unit) stay warnings, the curve imported (passed before too)", () => {
    const { a, rows } = list(scaled(1.12));
    expect(rows.every((r) => r[2] === "inconsistent" && r[3] === "warning")).toBe(true); // source: python3 (median 0.892)
    expect(a.result.curveSets[0].ok).toBe(true);
  });

  it("the warning names the power cell, the flow and the head beside both efficiencies", () => {
    const reason = list(scaled(1.12)).a.result.problems.find((p) => p.row === 6)!.reason;
    expect(reason).toContain("efficiency 70 % does not agree with ρgQH/P = 62.5"); // source: python3, 1000 * 9.80665 * 40/3600 * 33.5 / 5840 = 0.6254
    expect(reason).toContain("from power “5.84” at ⟦flow|0.0111111⟧ and ⟦head|33.5⟧"); // source: 5.21 × 1.12 = 5.84; 40 m³/h in m³/s as the token carries it
  });
});

describe("the density the η-vs-ρgQH/P check is judged at", () => {
  // Q 36 m³/h = 0.01 m³/s, H 10 m, P 1.25 kW: ρgQH/P = 78.4532 % at 1000 kg/m³, 78.3120 % at 998.2 (python3)
  const t = (eff: string) => `Model,Speed (rpm),Flow (m3/h),Head (m),Efficiency (%),Power (kW)\nA,2900,0,12,0,0.5\nA,2900,36,10,${eff},1.25\nA,2900,40,9,,\n`;
  it("75.43 % is 3.02 points from ρgQH/P at 1000 kg/m³, the engine's density: a warning (old code: none, judged at 998.2, 2.88 points)", () => {
    const p = analyseCsv(t("75.43")).result.problems;
    expect(p.map((q) => [q.row, q.code])).toEqual([[3, "inconsistent"]]); // source: python3 above
    expect(p[0].reason).toContain("ρgQH/P = 78.453 %"); // source: python3 above
    expect(p[0].reason).toContain("⟦density|1000⟧"); // source: pumpCurve.ts DEFAULT_POWER_DENSITY
    expect(p[0].reason).toContain("as the engine reads power columns"); // source: our message
  });
  it("guard: 75.5 % is 2.95 points: nothing, on both paths (passed before too)", () => {
    expect(analyseCsv(t("75.5")).result.problems).toEqual([]); // source: python3 above
    expect(analyseCsv(t("75.5"), undefined, { fast: false }).result.problems).toEqual([]);
  });
});
