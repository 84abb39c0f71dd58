// "Marginal" at the edge of a reading's uncertainty on a low-head circulator, where the grade's head band is narrower than
// the rows of the 5 × 5 grid the verdict once sampled. Decision "gaugebound" changes the coarse-gauge case: ±7 kPa gauges
// (±1.01 m) against 1B's ±0.09 m at 3 m are wider than the grade's own tolerance, so no tolerance verdict (was marginal);
// the solver still finds the point (engine), and gauges within the bound (±0.5 kPa, ±0.072 m) are marginal as before. Pure.
// Check values: ISO 9906 grade 1B (flow ±5 %, head ±3 %, the engine's TOLERANCE_GRADES); water at 20 °C,
// ρ = 998.21 kg/m³ (IAPWS, from memory); the circulator's curve is invented: H = 4 m × (1 − (Q / 3 m³/h)²).
import { describe, expect, test } from "vitest";
import { evalCubic, createPumpCurve, fluidAt, G0, gradeWithinUncertainty, TOLERANCE_GRADES } from "~/engine";
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
  test("2.25 m read with ±7 kPa gauges (±1.01 m): the solver finds 3.0 m inside the box, but the check gives no verdict (±1.01 m > 1B's ±0.09 m)", () => {
    const dH = Math.hypot(7000, 7000) / (RHO20 * G0); // 1.0113 m
    expect(dH).toBeCloseTo(1.0113, 3);
    // The old grid's rows: 2.25 + {−1, −½, 0, ½, 1} × dH = 1.24, 1.74, 2.25, 2.76, 3.26 m; the band is 2.91–3.09 m
    // (head arm) and the flow arm needs 2.89–3.09 m: no row inside. The engine's solver finds it.
    expect(H(q) * 0.97).toBeCloseTo(2.91, 2);
    const curve = createPumpCurve({ points: points.map(({ flow, head }) => ({ flow, head })) });
    expect(gradeWithinUncertainty(curve, { flow: [q, q], head: [2.25 - dH, 2.25 + dH] }, TOLERANCE_GRADES[0])).not.toBeNull();
    // 1B's head tolerance at 3.00 m is ±0.09 m (3 %): the gauges' ±1.01 m is eleven times it (decision "gaugebound"; was marginal).
    const r = check(2.25, "7");
    expect(r.verdict).toBe("unknown");
    expect(r.warnings.some((w) => w.startsWith("At the tolerance limit"))).toBe(false);
    expect(r.warnings.find((w) => w.startsWith("No tolerance verdict: the readings' uncertainty"))).toMatch(/grade 1B's ±⟦head\|0\.09\d*\|limit:1\.011\d*⟧ \(3 % of the curve's ⟦head\|3⟧ at the measured flow\)/);
  });

  test("with gauges within the bound (±0.5 kPa: ±0.072 m ≤ 0.09 m), a reading inside the box's reach is marginal", () => {
    const r = check(3 * 1.03 + 0.05, "0.5");
    expect(r.verdict).toBe("marginal");
    expect(r.warnings.find((w) => w.startsWith("At the tolerance limit"))).toMatch(/meets it \((head|flow) arm of the tolerance cross\)/);
  });

  test("flips where the box's top edge (head + uncertainty) reaches the flow arm's limit, the curve's head at Q / 0.95", () => {
    // Gauges of ±0.5 kPa (±0.0722 m, within 1B's ±0.09 m at 3 m): marginal or fail as before the bound.
    const edge = H(q / 0.95);
    const dH = Math.hypot(500, 500) / (RHO20 * G0);
    expect(check(edge - dH + 1e-6, "0.5").verdict).toBe("marginal");
    expect(check(edge - dH - 1e-6, "0.5").verdict).toBe("fail");
    expect(check(edge - dH - 1e-6, "0.5").warnings.some((w) => w.startsWith("At the tolerance limit"))).toBe(false);
  });
});
