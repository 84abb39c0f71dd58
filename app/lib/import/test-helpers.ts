// Test-only helper (Node APIs allowed here; not imported by the library code).
import { readFileSync } from "node:fs";

export function fixture(name: string): string {
  return readFileSync(new URL(`../../../fixtures/csv/${name}`, import.meta.url), "utf8");
}

/** |a - b| ≤ rel · |b| */
export function relClose(a: number, b: number, rel = 1e-12): boolean {
  return Math.abs(a - b) <= rel * Math.abs(b);
}
