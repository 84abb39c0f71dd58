// Speed and trim solves whose duty lies off the curve at every ratio that would meet it: the answer names the curve's
// end (or first point) and the ratio at which the duty's flow reaches it, not the ratio limit. Each case flips at its
// threshold. Check values: hand algebra with the affinity laws (Q ∝ N, H ∝ N², common practice) on a made-up curve.
import { describe, expect, it } from "vitest";
import { createPumpCurve, headAt, speedForDuty, trimForDuty } from "./index.ts";

const M3H = 1 / 3600;
// H = 20 − 0.02·Q² (Q in m³/h) at the knots 0…20 m³/h: the curve ends at 20 m³/h, 12 m.
const knots = [0, 5, 10, 15, 20].map((q) => ({ flow: q * M3H, head: 20 - 0.02 * q * q, efficiency: 0.3 + 0.02 * q }));
const curve = createPumpCurve({ points: knots });
const qd = 13 * M3H;
// 13 m³/h reaches the curve's end (20 m³/h) at s = 13/20 = 0.65, where the scaled curve gives 0.65² × 12 = 5.07 m (hand algebra).
const END_HEAD = 0.65 ** 2 * 12;

describe("a duty past the curve's end at every speed that would meet it", () => {
  it("just below the end's head: outside-curve, naming the speed where the flow reaches the end and the head there", () => {
    const sol = speedForDuty(curve, { flow: qd, head: END_HEAD * (1 - 1e-6) }, { min: 0.3, max: 1 });
    expect(sol.status).toBe("outside-curve"); // was duty-below-limit: "duty needs a speed below the lowest allowed" (30 %)
    expect(sol.message).toMatch(/^the duty flow ⟦flow\|[^⟧]+⟧ reaches the curve's end \(⟦flow\|0\.00555556⟧ as published\) only at 65\.0 % speed, where the pump gives ⟦head\|[^⟧]+⟧, more than the duty's ⟦head\|[^⟧]+⟧; below that the flow lies past the curve's end/);
    expect(Number(/pump gives ⟦head\|([\d.]+)\|/.exec(sol.message)![1])).toBeCloseTo(END_HEAD, 9); // the head at the end, kept apart from the duty's
  });
  it("just above it: met, at a speed just above 65 % (the root lies inside the curve)", () => {
    const sol = speedForDuty(curve, { flow: qd, head: END_HEAD * (1 + 1e-6) }, { min: 0.3, max: 1 });
    expect(sol.status).toBe("ok");
    expect(sol.ratio!).toBeGreaterThan(0.65);
    expect(sol.ratio!).toBeLessThan(0.6501);
  });
  it("where the speed limit binds first (min 70 % > 65 %), a duty below the curve there still needs a speed below the lowest allowed", () => {
    // at 70 %: 13/0.7 = 18.57 m³/h on the curve, 0.49 × H(18.57) ≈ 6.4 m (hand algebra) > 3 m
    const sol = speedForDuty(curve, { flow: qd, head: 3 }, { min: 0.7, max: 1 });
    expect(sol.status).toBe("duty-below-limit");
    expect(0.49 * headAt(curve, qd / 0.7)!).toBeGreaterThan(3);
  });
  it("a linear trim reads the same way, naming the diameter ratio", () => {
    const sol = trimForDuty(curve, { flow: qd, head: END_HEAD * (1 - 1e-6) });
    expect(sol.status).toBe("outside-curve");
    expect(sol.message).toMatch(/reaches the curve's end \(⟦flow\|0\.00555556⟧ as published\) only at a diameter ratio of 65\.0 %/);
    expect(trimForDuty(curve, { flow: qd, head: END_HEAD * (1 + 1e-6) }).status).toBe("ok");
  });
});

describe("a duty before the curve's first point at every speed that would meet it", () => {
  // The same curve published from 5 m³/h (19.5 m). 4 m³/h lies on it only up to s = 4/5 = 0.8, where it gives 0.64 × 19.5 = 12.48 m.
  const late = createPumpCurve({ points: knots.slice(1) });
  it("a duty above that head: outside-curve at 80 % speed (was duty-above-curve, 'even at the highest allowed speed', 100 %)", () => {
    const sol = speedForDuty(late, { flow: 4 * M3H, head: 12.48 * (1 + 1e-6) }, { min: 0.3, max: 1 });
    expect(sol.status).toBe("outside-curve");
    expect(sol.message).toMatch(/leaves the curve's first point \(⟦flow\|0\.00138889⟧ as published\) at 80\.0 % speed, where the pump gives ⟦head\|[^⟧]+⟧, less than the duty's/);
    expect(Number(/pump gives ⟦head\|([\d.]+)\|/.exec(sol.message)![1])).toBeCloseTo(12.48, 9);
    expect(speedForDuty(late, { flow: 4 * M3H, head: 12.48 * (1 - 1e-6) }, { min: 0.3, max: 1 }).status).toBe("ok");
  });
  it("where the curve starts at zero flow, a duty above the full-speed curve is still duty-above-curve", () => {
    expect(speedForDuty(curve, { flow: 4 * M3H, head: 25 }).status).toBe("duty-above-curve");
  });
});
