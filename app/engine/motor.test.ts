/** Motor rating, IE efficiency and energy from electrical input. */
import { describe, expect, it } from "vitest";
import { annualEnergy, EngineInputError, IEC_MOTOR_RATINGS_KW, motorEfficiency, nextStandardRating, polesForSpeed, suggestMotor } from "./index.ts";
import { inSI } from "./quantityText.ts";

describe("standard ratings (IEC 60034-1 / IEC 60072-1 series, from memory)", () => {
  it("the series is ascending and holds the familiar steps", () => {
    for (let i = 1; i < IEC_MOTOR_RATINGS_KW.length; i++) expect(IEC_MOTOR_RATINGS_KW[i]).toBeGreaterThan(IEC_MOTOR_RATINGS_KW[i - 1]);
    for (const r of [0.75, 5.5, 7.5, 11, 18.5, 22, 37, 45, 55, 75, 90, 110, 132, 160]) expect(IEC_MOTOR_RATINGS_KW).toContain(r);
  });
  it("6.9 kW shaft → 7.5 kW; 7.5 kW exactly → 7.5 kW; 7.51 kW → 11 kW (series, from memory)", () => {
    expect(nextStandardRating(6900)).toBe(7500);
    expect(nextStandardRating(7500)).toBe(7500);
    expect(nextStandardRating(7510)).toBe(11000);
    expect(nextStandardRating(1.2e6)).toBeNull();
  });
});

describe("suggestMotor: non-overloading over the curve, with the service factor (common practice)", () => {
  it("duty 6.9 kW, curve maximum 6.9 kW, SF 1.0 → 7.5 kW", () => {
    expect(suggestMotor({ dutyPower: 6900, maxCurvePower: 6900 }).rating).toBe(7500);
  });
  it("curve maximum 8.0 kW beyond the duty: SF 1.0 → 11 kW; SF 1.15 → 7.5 kW (7.5 × 1.15 = 8.625 kW)", () => {
    const a = suggestMotor({ dutyPower: 6900, maxCurvePower: 8000 });
    expect(a.rating).toBe(11000);
    expect(inSI(a.basis)).toContain("largest power on the curve to its end 8.00 kW");
    expect(suggestMotor({ dutyPower: 6900, maxCurvePower: 8000, serviceFactor: 1.15 }).rating).toBe(7500);
  });
  it("at the edge: maximum 8.625 kW with SF 1.15 → 7.5 kW, 8.63 kW → 11 kW", () => {
    expect(suggestMotor({ dutyPower: 5000, maxCurvePower: 8625, serviceFactor: 1.15 }).rating).toBe(7500);
    expect(suggestMotor({ dutyPower: 5000, maxCurvePower: 8630, serviceFactor: 1.15 }).rating).toBe(11000);
  });
  it("bad service factor is refused", () => {
    expect(() => suggestMotor({ dutyPower: 5000, maxCurvePower: 6000, serviceFactor: 0.9 })).toThrow(EngineInputError);
    expect(() => suggestMotor({ dutyPower: NaN, maxCurvePower: 6000 })).toThrow(EngineInputError);
  });
});

describe("motor efficiency by IE class (IEC 60034-30-1:2014, from memory)", () => {
  it("7.5 kW 4-pole: IE2 88.7 %, IE3 90.4 %, IE4 92.6 %", () => {
    expect(motorEfficiency(7500, "IE2", 4).efficiency).toBeCloseTo(0.887, 6);
    expect(motorEfficiency(7500, "IE3", 4).efficiency).toBeCloseTo(0.904, 6);
    expect(motorEfficiency(7500, "IE4", 4).efficiency).toBeCloseTo(0.926, 6);
  });
  it("7.5 kW 2-pole IE3 90.1 %; 200 kW and above 95.8 % (IEC 60034-30-1, from memory)", () => {
    expect(motorEfficiency(7500, "IE3", 2).efficiency).toBeCloseTo(0.901, 6);
    expect(motorEfficiency(315000, "IE3", 2).efficiency).toBeCloseTo(0.958, 6);
  });
  it("below the table (0.12 kW) warns and uses 0.12 kW's 64.8 %; unknown class refused", () => {
    const r = motorEfficiency(90, "IE3", 4);
    expect(r.efficiency).toBeCloseTo(0.648, 6);
    expect(r.warnings[0].code).toBe("motor-below-table");
    expect(() => motorEfficiency(7500, "IE9" as never, 4)).toThrow(EngineInputError);
    expect(() => motorEfficiency(2e6, "IE3", 4)).toThrow(EngineInputError);
  });
  it("2-pole above 2200 rpm on 50 Hz (common practice)", () => {
    expect(polesForSpeed(2900)).toBe(2);
    expect(polesForSpeed(1450)).toBe(4);
    expect(polesForSpeed(null)).toBe(4);
  });
});

describe("energy from electrical input (definition P_el = P_shaft / (η_motor · η_drive))", () => {
  it("6.9 kW shaft, IE3 90.4 %, drive 97 %, 4000 h, 0.20/kWh", () => {
    const e = annualEnergy({ shaftPower: 6900, motorEfficiency: 0.904, driveEfficiency: 0.97, hoursPerYear: 4000, tariffPerKWh: 0.2 });
    // 6.9 / (0.904 · 0.97) = 7.868808 kW (hand calculation: 0.904 · 0.97 = 0.87688)
    expect(e.electricalPower).toBeCloseTo(6900 / (0.904 * 0.97), 9);
    expect(e.electricalPower / 1000).toBeCloseTo(7.868808, 5);
    expect(e.annualEnergyKWh).toBeCloseTo(31475.23, 1);
    expect(e.annualCost).toBeCloseTo(6295.05, 2);
  });
  it("no drive: only the motor's losses", () => {
    const e = annualEnergy({ shaftPower: 6900, motorEfficiency: 0.904, driveEfficiency: null, hoursPerYear: 1000, tariffPerKWh: 1 });
    expect(e.annualEnergyKWh).toBeCloseTo(6.9 / 0.904 * 1000, 6);
  });
  it("bad input refused", () => {
    expect(() => annualEnergy({ shaftPower: 1, motorEfficiency: 1.2, driveEfficiency: null, hoursPerYear: 1, tariffPerKWh: 1 })).toThrow(EngineInputError);
    expect(() => annualEnergy({ shaftPower: 1, motorEfficiency: 0.9, driveEfficiency: null, hoursPerYear: 9000, tariffPerKWh: 1 })).toThrow(EngineInputError);
  });
});
