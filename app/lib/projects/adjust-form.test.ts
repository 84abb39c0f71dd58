import { describe, expect, it } from "vitest";
import { readAdjustForm } from "./adjust-form";

const form = (o: Record<string, string>) => {
  const f = new FormData();
  for (const [k, v] of Object.entries(o)) f.set(k, v);
  return f;
};
const base = { method: "speed", ratio: "", arrangement: "single", dutyPumps: "1", standbyPumps: "0", motorRating: "", serviceFactor: "1", ieClass: "IE3" };

describe("readAdjustForm", () => {
  it("reads a blank ratio as 'solve for the duty' and a blank motor as 'suggested'", () => {
    const r = readAdjustForm(form(base), "SI");
    expect(r.adjustment).toMatchObject({ method: "speed", ratio: null, motorRating: 0, serviceFactor: 1 });
  });
  it("takes a decimal comma and converts the motor rating from the user's power unit", () => {
    // 1 hp = 745.69987158227 W (NIST SP 811, from 550 ft·lbf/s)
    const us = readAdjustForm(form({ ...base, ratio: "92,5", motorRating: "10", serviceFactor: "1,15" }), "US");
    expect(us.adjustment?.ratio).toBeCloseTo(0.925, 12);
    expect(us.adjustment?.motorRating).toBeCloseTo(7456.9987158227, 6);
    expect(us.adjustment?.serviceFactor).toBeCloseTo(1.15, 12);
    expect(readAdjustForm(form({ ...base, motorRating: "7,5" }), "SI").adjustment?.motorRating).toBe(7500);
  });
  it("refuses a ratio just outside 30–120 % and accepts it at the edge", () => {
    expect(readAdjustForm(form({ ...base, ratio: "29.9" }), "SI").error).toMatch(/0\.3|30|ratio|Invalid/i);
    expect(readAdjustForm(form({ ...base, ratio: "30" }), "SI").adjustment?.ratio).toBeCloseTo(0.3, 12);
    expect(readAdjustForm(form({ ...base, ratio: "120" }), "SI").adjustment?.ratio).toBeCloseTo(1.2, 12);
    expect(readAdjustForm(form({ ...base, ratio: "120.1" }), "SI").adjustment).toBeNull();
  });
  it("refuses an unknown method, NaN and Infinity", () => {
    expect(readAdjustForm(form({ ...base, method: "magic" }), "SI").adjustment).toBeNull();
    expect(readAdjustForm(form({ ...base, ratio: "NaN" }), "SI").adjustment).toBeNull();
    expect(readAdjustForm(form({ ...base, serviceFactor: "Infinity" }), "SI").adjustment).toBeNull();
  });
});
