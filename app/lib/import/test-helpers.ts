// Test-only helper (Node APIs allowed here; not imported by the library code).
import { readFileSync } from "node:fs";
import { expect } from "vitest";
import { createPumpCurve, prepareSearchIndex } from "~/engine";
import type { CurveSet } from "./validate";

export function fixture(name: string): string {
  return readFileSync(new URL(`../../../fixtures/csv/${name}`, import.meta.url), "utf8");
}

/** |a - b| ≤ rel · |b| */
export function relClose(a: number, b: number, rel = 1e-12): boolean {
  return Math.abs(a - b) <= rel * Math.abs(b);
}

/**
 * Every curve set the importer marks ok is taken by the engine: createPumpCurve at the engine's default
 * rise tolerance (10 %, its strictest; the app searches with 100 %), and prepareSearchIndex (the search's
 * index) rejects none of them at either tolerance. Source: app/engine/pumpCurve.ts checkPumpPoints.
 */
export function expectEngineTakes(curveSets: readonly CurveSet[]): void {
  const ok = curveSets.filter((c) => c.ok);
  for (const c of ok) {
    const input = { points: c.points, speed: c.speed ?? undefined, impellerDiameter: c.impellerDiameter ?? undefined };
    expect(() => createPumpCurve(input), c.key).not.toThrow();
  }
  for (const riseTolerance of [undefined, 1]) {
    const idx = prepareSearchIndex(ok.map((c, i) => ({ id: String(i), label: c.key, curve: { points: c.points, speed: c.speed ?? undefined, riseTolerance } })));
    expect(idx.rejected).toEqual([]);
    expect(idx.count).toBe(ok.length);
  }
}

/** Our CSV format's header with every column a point may carry (fixtures/demo/FORMAT.md). */
export const FULL_HEADER = "model,speed_rpm,impeller_mm,flow_m3h,head_m,efficiency_pct,power_kw,npshr_m";
/**
 * One invented curve "A" (2900 rpm, 190 mm) under FULL_HEADER, shut-off to 40 m³/h; power from ρgQH/η (ρ = 998.2 kg/m³,
 * g = 9.80665 m/s²) within the importer's 3-point consistency rule: a curve every check passes, for tests to break one cell of.
 */
export const CURVE_A_ROWS: readonly string[] = [
  "A,2900,190,0,40,0,2.5,1.1",
  "A,2900,190,10,39.5,39,2.76,1.2",
  "A,2900,190,20,38.5,60,3.5,1.4",
  "A,2900,190,30,36.5,69,4.33,1.9",
  "A,2900,190,40,33.5,70,5.21,2.6",
];
/** FULL_HEADER and CURVE_A_ROWS as a file, with the cell at data row `row` (0-based) and column `col` replaced by `v`. */
export const curveAWithCell = (row: number, col: number, v: string) =>
  [FULL_HEADER, ...CURVE_A_ROWS.map((r, k) => (k === row ? r.split(",").map((c, j) => (j === col ? v : c)).join(",") : r))].join("\n");
