// The setting a site makes and the page shows (setting-step.ts), pure. Check values: whole rpm and whole mm (common
// practice for a drive's set point and a turned-down impeller), worked by hand from the numbers beside them.
import { describe, expect, it } from "vitest";
import { roundingNote, roundUpSetting, settingText } from "./setting-step";

const PUMP = { speed: 2900, impellerDiameter: 0.295 };

describe("a solved ratio rounded up to what a site sets", () => {
  it("speed: the next whole rpm up (1644.07 rpm → 1645 rpm), said with both numbers", () => {
    const r = roundUpSetting("speed", 1644.07 / 2900, PUMP);
    expect(r.ratio * 2900).toBeCloseTo(1645, 9);
    expect(r.capped).toBe(false);
    expect(settingText("speed", r.ratio, PUMP)).toBe("1645 rpm");
    expect(roundingNote("speed", r, PUMP)).toBe("solved speed 1644.1 rpm, set and judged at 1645 rpm: rounded up to the next whole rpm (what a site sets) so the duty is kept");
  });

  it("trim: the next whole mm up (Ø181.386 mm → Ø182 mm), even just above a whole mm", () => {
    expect(roundUpSetting("trim", 0.181386 / 0.295, PUMP).ratio * 295).toBeCloseTo(182, 9);
    expect(roundUpSetting("trim", 0.18101 / 0.295, PUMP).ratio * 295).toBeCloseTo(182, 9); // 181.01 mm: 182, never 181
    expect(settingText("trim", 0.182 / 0.295, PUMP)).toBe("Ø182 mm");
  });

  it("a solve on a step up to float noise stays on it (1645 rpm × (1 + 1e-12))", () => {
    const r = roundUpSetting("speed", (1645 / 2900) * (1 + 1e-12), PUMP);
    expect(r.ratio * 2900).toBeCloseTo(1645, 9);
    expect(roundingNote("speed", r, PUMP)).toMatch(/^solved speed 1645 rpm, set and judged at 1645 rpm/);
  });

  it("never past the published curve: a curve at 2900.4 rpm solved at 2900.1 rpm is set at its own speed, and says so", () => {
    const pub = { speed: 2900.4, impellerDiameter: null };
    const r = roundUpSetting("speed", 2900.1 / 2900.4, pub);
    expect(r).toEqual({ ratio: 1, solved: 2900.1 / 2900.4, capped: true });
    expect(roundingNote("speed", r, pub)).toBe("solved speed 2900.1 rpm; rounding up to the next whole rpm would pass the published curve's 2900.4 rpm, so it is set and judged at 2900.4 rpm");
  });

  it("no speed or impeller named: the next 0.1 % up (86.72 % → 86.8 %)", () => {
    const none = { speed: null, impellerDiameter: null };
    const r = roundUpSetting("trim", 0.8672, none);
    expect(r.ratio).toBeCloseTo(0.868, 12);
    expect(settingText("trim", r.ratio, none)).toBe("86.8 %");
    expect(settingText("trim", r.solved, none)).toBe("86.72 %");
  });

  it("a value off its step is shown with one more decimal, never rounded to a step it is not on", () => {
    expect(settingText("speed", 0.873, PUMP)).toBe("2531.7 rpm"); // 0.873 × 2900
    expect(settingText("trim", 0.86, PUMP)).toBe("Ø253.7 mm"); // 0.86 × 295 = 253.7
    // Half-way values round up as written, not down by float noise: 0.85 × 295 = 250.75 mm (250.74999… in binary).
    expect(0.85 * 0.295 * 1000).toBeLessThan(250.75);
    expect(settingText("trim", 0.85, PUMP)).toBe("Ø250.8 mm");
  });
});
