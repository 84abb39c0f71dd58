// A field check whose total head comes out at or below zero (discharge reading not above the suction reading) names the
// likely slips — swapped readings, gauge references, units, elevations — with the head; a positive head does not. Pure.
// Check values: a running pump adds head (common practice); the fixture curve H = 40 m − 1000 s²/m⁵ · Q (invented),
// water at 20 °C (ρ = 998.21 kg/m³, IAPWS from memory).
import { expect, test } from "vitest";
import { fluidAt } from "~/engine";
import { evaluateCheck, parseCheckFields } from "./index";
import { fieldsForHead, frozenFixture } from "~/test/fieldcheck-fixture";

const RHO20 = fluidAt({ kind: "water" }, 20).density;
const f = frozenFixture();
/** A head of `head` m across the gauges; below zero the suction gauge reads the more (discharge at 0 kPa). */
const check = (head: number) => {
  const fields = head >= 0 ? fieldsForHead(head, RHO20, { flow: "0.012" }) : fieldsForHead(0, RHO20, { flow: "0.012", sPressure: String((-head * RHO20 * 9.80665) / 1000) });
  const p = parseCheckFields(fields, { kind: "water" });
  if (!p.ok) throw new Error(JSON.stringify(p.errors));
  return evaluateCheck(f, p.readings, "2B");
};
const swapHint = (hints: string[]) => hints.find((h) => /not swapped/.test(h));

test("a total head below zero (suction gauge 28 m of water above the discharge's) names the swapped-readings check with the head", () => {
  const r = check(-28);
  expect(r.verdict).toBe("fail");
  expect(r.delivered.head).toBeCloseTo(-28, 6);
  expect(swapHint(r.hints)).toMatch(/^The pump's total head comes out at ⟦head\|-28(\.\d+)?⟧, below zero, but a running pump adds head: check that the suction and discharge readings are not swapped/);
  // Not "air in the pump … wear": a head below zero is a misreading, not a worn pump.
  expect(r.hints.join(" ")).not.toMatch(/delivering less head than its curve/);
  expect(check(20).hints.join(" ")).toMatch(/delivering less head than its curve/); // 20 m against the curve's 28 m: that hint stays
});

test("flips at zero: at zero it is said ('at zero'), just above it is not", () => {
  expect(swapHint(check(0).hints)).toMatch(/, at zero, but a running pump adds head/);
  expect(swapHint(check(0.01).hints)).toBeUndefined();
  expect(swapHint(check(28).hints)).toBeUndefined();
});
