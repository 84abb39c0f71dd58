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
