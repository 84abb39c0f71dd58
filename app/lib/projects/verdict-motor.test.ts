// The verdict's line qualified by the motor: a candidate that meets the duty on a motor that overloads says so beside its
// verdict ("but the motor is overloaded at the operating point …" / "but the motor can overload …"), with the numbers;
// flips where one pump's shaft power at the operating point crosses motor rating × service factor, and where the curve's
// largest power does. Check values: the product rule (verdict-motor.ts, common practice: a motor runs within its rating ×
// service factor), an invented radial pump (below; power 2 + 0.05 Q kW on water of 1000 kg/m³, largest 3.99 kW at its end
// at 20 °C, as motor-edges.test.ts).
import { describe, expect, it } from "vitest";
import { inSI } from "~/engine/quantityText";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, evaluateCandidate, type CurvePointsIn, type SystemInput } from "./hydraulics";
import { verdictMotorNote, verdictMotorShort } from "./verdict-motor";

const M3H = 1 / 3600;
const points: CurvePointsIn = [0, 10, 20, 30, 40].map((q) => ({ flow: q * M3H, head: 30 - 0.008 * q * q, efficiency: null, power: 2000 + 50 * q, npshr: null }));
const set = { points, speed: 2900, impellerDiameter: 0.2 };
/** Meets at 30 m³/h (operating point ≈ 33.7 m³/h, one pump ≈ 3.68 kW), the curve running on to 3.99 kW at its end. */
const system: SystemInput = { ...defaultSystemInput(), staticLow: 19, staticHigh: 20, duty: { flow: 30 * M3H, head: 20.5 } };
const judged = (motorRating: number) => evaluateCandidate(system, set, { ...DEFAULT_ADJUSTMENT, motorRating });
const note = (motorRating: number) => {
  const r = judged(motorRating);
  const n = verdictMotorNote(r.verdict, r.figures);
  return n ? inSI(n) : null;
};

describe("the motor on the verdict's line", () => {
  const base = judged(4000);
  const shaftAtDuty = base.figures!.motorLoadAtDuty! * 4000; // one pump's shaft power at the operating point, W
  const largest = 3990; // ≈ the curve's largest power (3.99 kW at 40 m³/h on water at 20 °C, motor-edges.test.ts)

  it("a motor that covers the curve's largest power: nothing said against the verdict", () => {
    expect(base.verdict?.status).toBe("meets");
    expect(base.figures!.nonOverloading).toBe(true);
    expect(note(4000)).toBeNull();
    expect(verdictMotorShort(base.verdict, base.figures)).toBe("");
  });

  it("a motor below the curve's largest power but above the duty's: 'but the motor can overload', with the check's numbers", () => {
    const r = judged(shaftAtDuty * 1.05);
    expect(r.verdict?.status).toBe("meets");
    expect(note(shaftAtDuty * 1.05)).toMatch(/^but the motor can overload: largest power on the curve 3\.99 kW at 40\.0 m³\/h exceeds motor rating × service factor \d\.\d+ kW$/);
    expect(verdictMotorShort(r.verdict, r.figures)).toBe(", but the motor can overload");
  });

  it("a motor below one pump's shaft power at the operating point: 'overloaded at the operating point', with both powers; flips across it", () => {
    expect(shaftAtDuty).toBeGreaterThan(2000);
    expect(shaftAtDuty).toBeLessThan(largest);
    const over = note(shaftAtDuty * (1 - 1e-6));
    const within = note(shaftAtDuty * (1 + 1e-6));
    expect(over).toMatch(/^but the motor is overloaded at the operating point: one pump takes \d\.\d+ kW, above motor rating × service factor \d\.\d+ kW$/);
    expect(within).toMatch(/^but the motor can overload: /);
    const r = judged(shaftAtDuty * 0.5);
    expect(verdictMotorShort(r.verdict, r.figures)).toBe(", but the motor overloads at the operating point");
  });

  it("after a verdict other than meets it reads 'and …'; with no verdict, or no motor figures, nothing", () => {
    expect(verdictMotorNote({ status: "oversized" }, judged(3000).figures)).toMatch(/^and the motor /);
    expect(verdictMotorNote(null, judged(3000).figures)).toBeNull();
    expect(verdictMotorNote({ status: "meets" }, null)).toBeNull();
    expect(verdictMotorNote({ status: "meets" }, { motorLimit: null })).toBeNull();
  });
});
