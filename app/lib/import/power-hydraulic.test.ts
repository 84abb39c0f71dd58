// Shaft power against the hydraulic power ρgQH (definition of pump efficiency, η = ρgQH/P; ρ = 1000 kg/m³, the engine's
// power density, pumpCurve.ts; g = 9.80665 m/s², 3rd CGPM): a power below ρgQH implies an efficiency above 100 %, which no
// pump reaches (the engine warns "power column implies efficiency above 100 %"), and a curve whose powers imply a best
// efficiency below 5 % has its power column in the wrong unit (W read as kW).
import { describe, expect, it } from "vitest";
import * as v from "valibot";
import { analyseCsv, CurveSetSchema } from "./index";
import { expectEngineTakes } from "./test-helpers";

const ROWS = [
  "A,2900,190,0,40,2.5,1.1",
  "A,2900,190,10,39.5,2.76,1.2",
  "A,2900,190,20,38.5,3.5,1.4",
  "A,2900,190,30,36.5,4.33,1.9",
  "A,2900,190,40,33.5,5.21,2.6",
];
const file = (powerHeader: string, rows = ROWS) => ["model,speed_rpm,impeller_mm,flow_m3h,head_m," + powerHeader + ",npshr_m", ...rows].join("\n");
const withPower = (k: number, p: string) => ROWS.map((r, i) => (i === k ? r.split(",").map((c, j) => (j === 5 ? p : c)).join(",") : r));
const errors = (t: string, fast = true) => analyseCsv(t, undefined, { fast }).result.problems.filter((p) => p.severity === "error").map((p) => [p.row, p.column, p.code]);

describe("shaft power below the hydraulic power", () => {
  it("flip at 100 %: 2.99 kW at 30 m³/h and 36.5 m passes (η 99.76 %), 2.98 kW is refused at line 5 in power_kw (η 100.10 %)", () => {
    // ρgQH = 1000 × 9.80665 × 30/3600 × 36.5 = 2982.86 W (python3); 2982.86/2990 = 0.99761, 2982.86/2980 = 1.00096
    for (const fast of [true, false]) {
      expect(errors(file("power_kw", withPower(3, "2.99")), fast)).toEqual([]);
      expect(errors(file("power_kw", withPower(3, "2.98")), fast)).toEqual([[5, "power_kw", "power-below-hydraulic"]]); // source: construction (4th data row)
    }
    const a = analyseCsv(file("power_kw", withPower(3, "2.98")));
    const p = a.result.problems.find((q) => q.code === "power-below-hydraulic")!;
    expect(p.reason).toContain("100.1 %"); // source: python3 above
    expect(p.reason).toContain("1000 kg/m³");
    expect(a.result.curveSets[0].ok).toBe(false);
  });

  it("power 2.33 kW at 30 m³/h (η 128 %, no efficiency column): refused (old code: imported ok, no word)", () => {
    expect(errors(file("power_kw", withPower(3, "2.33")))).toEqual([[5, "power_kw", "power-below-hydraulic"]]); // source: 2982.86/2330 = 1.280 (python3)
  });

  it("kW values under a W header: every point above zero flow is refused (η 38 986 % at 10 m³/h)", () => {
    const a = analyseCsv(file("power_w"));
    expect(a.result.problems.filter((p) => p.severity === "error").map((p) => [p.row, p.column, p.code])).toEqual([
      [2, "flow_m3h", "too-few-points"], // source: construction (only the shut-off point is left)
      ...[3, 4, 5, 6].map((r) => [r, "power_w", "power-below-hydraulic"]), // source: 1000 × 9.80665 × 10/3600 × 39.5 / 2.76 = 389.86 (python3)
    ]);
    expect(a.result.curveSets[0].ok).toBe(false);
  });

  it("W values under a kW header: the best efficiency they imply is 0.07 %, below 5 %: the curve is refused under either policy", () => {
    const rows = ROWS.map((r) => r.split(",").map((c, j) => (j === 5 ? String(Math.round(Number(c) * 1000)) : c)).join(","));
    for (const policy of ["skip-curves", "drop-points"] as const) {
      const first = analyseCsv(file("power_kw", rows));
      const a = analyseCsv(file("power_kw", rows), { ...first.mapping, policy });
      expect(a.result.problems.filter((p) => p.severity === "error").map((p) => [p.row, p.column, p.code])).toEqual([[6, "power_kw", "power-implausible"]]); // source: best ρgQH/P = 0.0700 % at 40 m³/h, line 6 (python3)
      expect(a.result.curveSets[0].ok).toBe(false);
    }
  });

  it("guard: the clean curve passes on both paths and the engine takes it (passed before too)", () => {
    for (const fast of [true, false]) {
      const a = analyseCsv(file("power_kw"), undefined, { fast });
      expect(a.result.problems).toEqual([]);
      expectEngineTakes(a.result.curveSets);
    }
  });

  it("the service's re-check (CurveSetSchema) refuses the same set: 2.98 kW at 30 m³/h and 36.5 m; 2.99 kW passes", () => {
    const set = (p30: number) => ({
      key: "A|2900|190", model: "A", speed: 2900, impellerDiameter: 0.19, sourceRows: [2, 3, 4], ok: true,
      points: [{ flow: 0, head: 40 }, { flow: 20 / 3600, head: 38.5, power: 3500 }, { flow: 30 / 3600, head: 36.5, power: p30 }],
    });
    expect(v.safeParse(CurveSetSchema, set(2990)).success).toBe(true); // source: η 99.76 % (python3, above)
    expect(v.safeParse(CurveSetSchema, set(2980)).success).toBe(false); // source: η 100.10 % (python3, above)
  });
});
