// A duty cycle's hours against the year, and a drive's highest speed, judged exactly at the stated limit (no 1e-9
// slack): the hours are added up as typed (engine decimalSum.ts), so a total of exactly 8784 h (a leap year, 366 × 24 h,
// arithmetic) is taken however its hundredths sum in binary, and any total above it is refused with its digits; the
// drive's highest speed ratio is taken up to the candidate's bound 1.2 (candidate-input.ts, a typed 120 %) exactly.
// Before, both allowed 1 part in 10⁹ past the limit: a cycle of 4392 h + 4392.0000001 h (8784.0000001 h) was priced as
// within the year, and a ratio 1.2000000000000002 taken as "to 1.2". Check values: arithmetic.
import * as v from "valibot";
import { describe, expect, it } from "vitest";
import { createPumpCurve, dutyCycleEnergy } from "~/engine";
import { decimalSum } from "~/engine/decimalSum";
import { M3H, samplePoints } from "~/engine/test/curves";
import { EnergySettingsSchema } from "./energy";
import { defaultSystemInput } from "./hydraulics";
import { stepPastYear } from "./year-hours";

const base = defaultSystemInput();
const settings = (hours: number[]) => ({ ...base.energy!, control: "fixed-speed" as const, profile: hours.map((h, i) => ({ flowFraction: i === 0 ? 1 : 0.5, hours: h })) });
const cycle = (hours: number[], maxSpeedRatio?: number) =>
  dutyCycleEnergy({ curve: createPumpCurve({ points: samplePoints() }), systemHead: (q) => 10 + 0.01 * (q / M3H) ** 2, designFlow: 40 * M3H, mode: "system-curve", profile: hours.map((h) => ({ flowFraction: 1, hours: h })),
    density: 1000, motor: { rating: 30000, efficiency: 0.9 }, driveEfficiency: 0.97, maxSpeedRatio });

describe("the year's 8784 h, exactly", () => {
  it("4411.66 + 4293.97 + 78.37 h is 8784 h (in binary 8784.000000000002): taken by the schema and the engine", () => {
    expect(4411.66 + 4293.97 + 78.37).toBeGreaterThan(8784); // the binary sum the slack was there for
    expect(decimalSum([4411.66, 4293.97, 78.37]).compare(8784)).toBe(0);
    expect(stepPastYear([{ hours: 4411.66 }, { hours: 4293.97 }, { hours: 78.37 }])).toBe(-1);
    expect(v.safeParse(EnergySettingsSchema, settings([4411.66, 4293.97, 78.37])).success).toBe(true);
    expect(() => cycle([4411.66, 4293.97, 78.37])).not.toThrow();
  });

  it("4392 + 4392.0000001 h (1e-7 h past): refused by the schema and the engine, the total as typed", () => {
    expect(stepPastYear([{ hours: 4392 }, { hours: 4392.0000001 }])).toBe(1);
    const r = v.safeParse(EnergySettingsSchema, settings([4392, 4392.0000001]));
    expect(r.success).toBe(false);
    expect(r.issues![0].message).toBe("The steps add up to 8\u202f784.0000001 h a year, more than a year has: at most 8\u202f784 h, a leap year's 366 days × 24 h. With this step they reach 8\u202f784.0000001 h; take hours off the steps.");
    expect(() => cycle([4392, 4392.0000001])).toThrow("profile: adds up to 8784.0000001 h, more than a year (8784 h)");
  });

  it("the sum as typed: 0.1 + 0.2 is 0.3; 8000 + 784.01 is 8784.01; 1e-7 + 1 is 1.0000001", () => {
    expect(decimalSum([0.1, 0.2]).text).toBe("0.3");
    expect(decimalSum([0.1, 0.2]).compare(0.3)).toBe(0);
    expect(decimalSum([8000, 784.01]).text).toBe("8784.01");
    expect(decimalSum([1e-7, 1]).text).toBe("1.0000001");
    expect(decimalSum([]).compare(0)).toBe(0);
  });
});

describe("a drive's highest speed ratio, up to 1.2 exactly", () => {
  it("1.2 taken; the next number up, 1.2000000000000002, refused with its digits", () => {
    expect(() => cycle([1000], 1.2)).not.toThrow();
    expect(() => cycle([1000], 1.2000000000000002)).toThrow("maxSpeedRatio: must be from 1 (full speed) to 1.2 (the candidate's ratio's bound, exactly), not 1.2000000000000002");
  });
});
