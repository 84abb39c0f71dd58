// A quantity's number at the ends of what the magnitude rule shows (decision "npshzero", the numbers' ends): from 1e9 up in
// the unit shown (LARGE_FROM = 10^MAX_SIGNIFICANT: whole digits past the 9 significant digits the words tell apart) it
// reads in exponent form with 3 significant digits, more where compared and it would read as its neighbour — as a number
// too small for its decimals does ("1.00e-15 m", unchanged). Before: 1e12 m read "3280839895013 ft", 1e21 m
// "3.2808398950131234e+21 ft", 1e12 m³/s "15850323141488904 gpm". Check values: unit factors 1 ft = 0.3048 m and
// 1 US gpm = 3.785411784 L / min (NIST SP 811, from memory); the rest arithmetic.
import { describe, expect, it } from "vitest";
import { fmtNum, fmtNumExact, LARGE_FROM, qt, qtExact, qtLimit, renderQuantities } from "./quantityText";
import { UNIT_SYSTEMS } from "./units";

const US = UNIT_SYSTEMS.US, SI = UNIT_SYSTEMS.SI;

describe("numbers from 1e9 up in the unit shown", () => {
  it("flips at LARGE_FROM: 999 999 999 whole, 1e9 in exponent form (both sides)", () => {
    expect(LARGE_FROM).toBe(1e9);
    expect(fmtNum(999_999_999)).toBe("999\u202f999\u202f999"); // grouped from 1e6 (helper "numtext")
    expect(fmtNum(1e9)).toBe("1.00e+9");
    expect(fmtNum(-1e9)).toBe("-1.00e+9");
    expect(fmtNumExact(999_999_999, [1e9])).toBe("999\u202f999\u202f999");
  });
  it("a head of 1e12 m and 1e21 m in SI and US units", () => {
    expect(renderQuantities(`${qt("head", 1e12)}`, SI)).toBe("1.00e+12 m");
    expect(renderQuantities(`${qt("head", 1e12)}`, US)).toBe("3.28e+12 ft"); // 1e12 / 0.3048 = 3.2808e12
    expect(renderQuantities(`${qt("head", 1e21)}`, US)).toBe("3.28e+21 ft");
    expect(renderQuantities(`${qt("flow", 1e12)}`, US)).toBe("1.59e+16 gpm"); // 1e12 m³/s × 60 000 / 3.785411784 = 1.585e16
  });
  it("a reading past its limit reads apart from it in exponent form, both ways", () => {
    const text = `${qtExact("head", 1.0001e12, [1e12])} > ${qtLimit("head", 1e12, [1.0001e12])}`;
    expect(renderQuantities(text, SI)).toBe("1.0001e+12 m > 1.0000e+12 m");
  });
  it("the small end keeps its rule: 1e-15 m reads 1.00e-15 m", () => {
    expect(renderQuantities(qt("head", 1e-15), SI)).toBe("1.00e-15 m");
    expect(renderQuantities(qt("head", 1e-15), US)).toBe("3.28e-15 ft");
  });
});
