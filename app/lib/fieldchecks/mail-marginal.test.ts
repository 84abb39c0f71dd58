// The engineer's e-mail (notify.server.ts, its detail from `deliveredSentence`) for a check at the tolerance limit: the verdict's
// rule and numbers include the point within the readings' uncertainty that meets the grade, with the uncertainty. Was: "at the
// tolerance limit" beside both arms "not met" and no word of why. Pure. Check values: ISO 9906:2012 grade 2B head ±5 % (from
// memory, TOLERANCE_GRADES); the fixture curve is invented (H = 40 − 1000·Q: 28 m at 12 L/s); ±2 kPa gauges in quadrature
// over ρ·g at 20 °C are ±0.289 m (hand, ρ from IAPWS via the engine), well inside 2B's ±1.4 m.
import { expect, test } from "vitest";
import { fluidAt } from "~/engine";
import { fieldsForHead, frozenFixture } from "~/test/fieldcheck-fixture";
import { deliveredSentence, evaluateCheck, parseCheckFields } from "./index";

const RHO20 = fluidAt({ kind: "water" }, 20).density;
const f = frozenFixture();
const check = (head: number) => {
  const p = parseCheckFields(fieldsForHead(head, RHO20, { flow: "0.012", sAccuracy: "2", dAccuracy: "2" }), { kind: "water" });
  if (!p.ok) throw new Error(JSON.stringify(p.errors));
  return evaluateCheck(f, p.readings, "2B");
};

test("marginal (head +6 % as read, +5 % within ±0.289 m): the mail's sentence says the point within the uncertainty that meets 2B", () => {
  const r = check(28 * 1.06);
  expect(r.verdict).toBe("marginal");
  const s = deliveredSentence(r);
  expect(s).toContain("Judged against grade 2B: at the tolerance limit (within the reading uncertainty).");
  expect(s).toMatch(/At the tolerance limit: the reading misses grade 2B, but within its uncertainty \(flow as read: the meter's accuracy not given, head ± ⟦head\|0\.28\d+⟧\) ⟦flow\|[\d.e-]+⟧ at ⟦head\|[\d.]+⟧ meets it \(head arm/); // was: absent
});

test("past the uncertainty (head +7 %): a fail, and no such sentence", () => {
  const r = check(28 * 1.07);
  expect(r.verdict).toBe("fail");
  expect(deliveredSentence(r)).not.toContain("At the tolerance limit");
});
