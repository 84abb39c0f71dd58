// The phone's reading of the form before it keeps a check to send (local-check.ts, pure, no browser): gauges that give the
// pump a total head at or below zero are refused at the discharge reading with the server's own words (head-check.ts
// `headRefusal`, as submit.server.ts answers them), never kept as a "fail" to be refused when sent; just above zero the
// check is worked out and kept. Check values: a running pump adds head (common practice); the fixture curve
// H = 40 m − 1000 s²/m⁵ · Q (invented), water at 20 °C (ρ from the engine's table, IAPWS from memory).
import { describe, expect, test } from "vitest";
import { fluidAt } from "~/engine";
import { checkedHeadRefusal, headRefusal, parseCheckFields } from "~/lib/fieldchecks";
import { SI_UNITS } from "~/lib/shared/units";
import { fieldsForHead, frozenFixture } from "~/test/fieldcheck-fixture";
import { checkOnPhone } from "./local-check";

const RHO20 = fluidAt({ kind: "water" }, 20).density;
const frozen = frozenFixture();
/** Fields giving a total head of `head` m with a flow meter reading 0.012 m³/s: below zero the suction gauge reads the more. */
const fieldsAt = (head: number) => (head >= 0 ? fieldsForHead(head, RHO20, { flow: "0.012" }) : fieldsForHead(0, RHO20, { flow: "0.012", sPressure: String((-head * RHO20 * 9.80665) / 1000) }));
/** The server's refusal for the same fields (submit.server.ts reads them so). */
function serverRefusal(fields: Record<string, string>): string | null {
  const p = parseCheckFields(fields, { kind: "water" });
  if (!p.ok) throw new Error(JSON.stringify(p.errors));
  return headRefusal(p.readings, frozen.system.input, p.fields);
}

describe("the phone's check before queueing: a total head at or below zero", () => {
  for (const head of [-28, -0.01, 0]) {
    test(`head ${head} m: refused at dPressure with the server's words, nothing to queue (old phone: kept as "fail")`, () => {
      const fields = fieldsAt(head);
      const r = checkOnPhone(fields, frozen, SI_UNITS);
      expect(r.ok).toBe(false);
      if (r.ok) return;
      expect(r.errors.dPressure).toBe(serverRefusal(fields));
      expect(r.errors.dPressure).toMatch(/^The readings give the pump a total head of −?\d+(\.\d+)? m, (below|at) zero/);
    });
  }
  test("the flip: 0.01 m above zero is worked out and kept (a fail against the curve's 28 m, not refused)", () => {
    const fields = fieldsAt(0.01);
    expect(serverRefusal(fields)).toBeNull();
    const r = checkOnPhone(fields, frozen, SI_UNITS);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.local!.head).toBeCloseTo(0.01, 6);
    expect(r.local!.verdict).toBe("fail");
  });
  test("the other field errors as the server's: no grade, a blank reading", () => {
    const r = checkOnPhone({ ...fieldsAt(20), gradeId: "", dPressure: "" }, frozen, SI_UNITS);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.errors.gradeId).toBe("Choose a tolerance grade from the table.");
    expect(r.errors.dPressure).toBeTruthy();
  });
});

describe("no flow meter and a smaller discharge pipe: the check's own head (the flow inferred from the curve)", () => {
  // At no flow the velocity heads are 0: 200 kPa on both gauges is 0 m and the curve (10–40 m) meets no such head, so the
  // check's head stays 0 m; 200.001 kPa is +1.0e-4 m (0.001 kPa / (998.2 × 9.80665), hand). Decision "storedattack".
  const noMeter = (d: string) => fieldsForHead(0, RHO20, { flow: "", dDiameter: "99", sPressure: "200", dPressure: d });
  test("0 m: refused at dPressure with the server's words (checkedHeadRefusal), nothing to queue (old phone: kept, verdict unknown)", () => {
    const r = checkOnPhone(noMeter("200"), frozen, SI_UNITS);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    const p = parseCheckFields(noMeter("200"), { kind: "water" });
    if (!p.ok) throw new Error("fixture");
    expect(r.errors.dPressure).toBe(checkedHeadRefusal(0, p.readings, p.fields));
    expect(r.errors.dPressure).toMatch(/total head of 0 m, at zero .*no flow reading: at the flow inferred from the curve/);
  });
  test("the flip: +1e-4 m is worked out and kept", () => {
    expect(checkOnPhone(noMeter("200.001"), frozen, SI_UNITS).ok).toBe(true);
  });
});
