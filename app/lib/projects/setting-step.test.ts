// The setting a site makes and the page shows (setting-step.ts), pure. Check values: whole rpm and whole mm (common
// practice for a drive's set point and a turned-down impeller), worked by hand from the numbers beside them.
import { describe, expect, it } from "vitest";
import { roundingNote, roundUpSetting, settingText, settingToken } from "./setting-step";
import { renderUnits, SI_UNITS, US_UNITS } from "~/lib/shared/units";

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

describe("the whole mm a site sets, beside inches where the rounding to it is said (decision \"surfaces2\")", () => {
  // 182 mm / 25.4 = 7.165 in, 181.386 mm = 7.141 in (1 in = 25.4 mm exactly, NIST SP 811).
  const r = roundUpSetting("trim", 0.181386 / 0.295, PUMP);
  it("US: the note names the whole mm it rounded to, and the solved value's mm, in brackets after the inches", () => {
    expect(renderUnits(roundingNote("trim", r, PUMP), US_UNITS)).toBe("solved impeller Ø7.14 in [181.4 mm], set and judged at Ø7.17 in [182 mm]: rounded up to the next whole mm (what a site sets) so the duty is kept");
  });
  it("SI (and the CSV, JSON): mm alone, as before", () => {
    expect(renderUnits(roundingNote("trim", r, PUMP), SI_UNITS)).toBe("solved impeller Ø181.4 mm, set and judged at Ø182 mm: rounded up to the next whole mm (what a site sets) so the duty is kept");
  });
  it("a diameter unit picked on its own decides: inches over SI get the bracket, mm over US do not", () => {
    const token = settingToken("trim", r.ratio, PUMP, true);
    expect(renderUnits(token, { ...SI_UNITS, diameter: "in" })).toBe("Ø7.17 in [182 mm]");
    expect(renderUnits(token, { ...US_UNITS, diameter: "mm" })).toBe("Ø182 mm");
    expect(renderUnits(settingToken("trim", r.ratio, PUMP), US_UNITS)).toBe("Ø7.17 in"); // a label naming no rounding: the reader's unit alone
  });
  it("a token naming a unit its quantity does not have stays as written (noticed, never guessed)", () => {
    expect(renderUnits("Ø⟦diameter|0.182|also:rpm:0.181,0.183⟧", US_UNITS)).toBe("Ø⟦diameter|0.182|also:rpm:0.181,0.183⟧");
  });
});
