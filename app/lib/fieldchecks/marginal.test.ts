// "Marginal" at the edge of a reading's uncertainty: a low-head circulator read with coarse gauges, where the
// grade's head band is narrower than the rows of the 5 × 5 grid the verdict once sampled. Pure (no database).
// Check values: ISO 9906 grade 1B (flow ±5 %, head ±3 %, the engine's TOLERANCE_GRADES); water at 20 °C,
// ρ = 998.21 kg/m³ (IAPWS, from memory); the circulator's curve is invented: H = 4 m × (1 − (Q / 3 m³/h)²).
import { describe, expect, test } from "vitest";
import { evalCubic, createPumpCurve, fluidAt, G0 } from "~/engine";
import { evaluateCheck, parseCheckFields } from "./index";
import { fieldsForHead, frozenFixture } from "~/test/fieldcheck-fixture";

const M3H = 1 / 3600;
const RHO20 = fluidAt({ kind: "water" }, 20).density;
const points = [0, 0.2, 0.4, 0.5, 0.6, 0.8, 1].map((f) => ({ flow: f * 3 * M3H, head: 4 * (1 - f * f), efficiency: f === 0 ? 0 : 0.2 + 0.3 * f * (2 - f), power: null, npshr: null }));
const f = frozenFixture({ points, duty: { flow: 1.5 * M3H, head: 3 } });
const H = (q: number) => evalCubic(createPumpCurve({ points: points.map(({ flow, head }) => ({ flow, head })) }).head, q) as number;
const q = 1.5 * M3H; // H = 3.00 m here (a knot)

function check(head: number, gaugeKPa: string) {
  const r = parseCheckFields(fieldsForHead(head, RHO20, { flow: String(q), sAccuracy: gaugeKPa, dAccuracy: gaugeKPa, gradeId: "1B" }), { kind: "water" });
  if (!r.ok) throw new Error(JSON.stringify(r.errors));
  return evaluateCheck(f, r.readings, "1B");
}

describe("a field check's marginal verdict over the whole uncertainty box", () => {
  test("2.25 m read with ±7 kPa gauges (±1.01 m) is marginal: 3.0 m, inside the box, meets 1B; the grid's rows missed it", () => {
    const dH = Math.hypot(7000, 7000) / (RHO20 * G0); // 1.0113 m
    expect(dH).toBeCloseTo(1.0113, 3);
    // The old grid's rows: 2.25 + {−1, −½, 0, ½, 1} × dH = 1.24, 1.74, 2.25, 2.76, 3.26 m; the band is 2.91–3.09 m
    // (head arm) and the flow arm needs 2.89–3.09 m: no row inside.
    expect(H(q) * 0.97).toBeCloseTo(2.91, 2);
    const r = check(2.25, "7");
    expect(r.verdict).toBe("marginal");
    const said = r.warnings.find((w) => w.startsWith("At the tolerance limit"));
    expect(said).toMatch(/misses grade 1B, but within its uncertainty/);
    expect(said).toMatch(/meets it \((head|flow) arm of the tolerance cross\)/);
  });

  test("flips where the box's top edge (head + uncertainty) reaches the flow arm's limit, the curve's head at Q / 0.95", () => {
    const edge = H(q / 0.95);
    const dH = Math.hypot(7000, 7000) / (RHO20 * G0);
    expect(check(edge - dH + 1e-6, "7").verdict).toBe("marginal");
    expect(check(edge - dH - 1e-6, "7").verdict).toBe("fail");
    expect(check(edge - dH - 1e-6, "7").warnings.some((w) => w.startsWith("At the tolerance limit"))).toBe(false);
  });
});
