import { describe, expect, it } from "vitest";
import { parseNumber } from "./numbers";
import { guessHeader, HP, SI_FACTOR, toSI, unitAllowed } from "./units-in-headers";
import { relClose } from "./test-helpers";

describe("SI factors", () => {
  it("1 gpm = 6.30901964e-5 m³/s", () => {
    expect(relClose(toSI("flow", "gpm", 1), 6.30901964e-5)).toBe(true); // source: NIST SP 811, Appendix B.8 (gallon [U.S.] per minute)
  });
  it("1 UK gallon per minute = 4.54609e-3/60 m³/s", () => {
    expect(relClose(toSI("flow", "imp gpm", 60), 4.54609e-3)).toBe(true); // source: NIST SP 811, Appendix B.8 (gallon [U.K.] = 4.546 09 E-03 m³)
  });
  it("3600 m³/h = 1 m³/s and 1 L/s = 1e-3 m³/s", () => {
    expect(relClose(toSI("flow", "m3/h", 3600), 1)).toBe(true); // source: SI definitions (1 h = 3600 s)
    expect(relClose(toSI("flow", "l/s", 1), 1e-3)).toBe(true); // source: SI definitions (1 L = 1e-3 m³)
    expect(relClose(toSI("flow", "l/min", 60), 1e-3)).toBe(true); // source: SI definitions
  });
  it("1 ft = 0.3048 m for head and NPSHr", () => {
    expect(toSI("head", "ft", 1)).toBe(0.3048); // source: NIST SP 811, Appendix B.8 (foot, exact)
    expect(toSI("npshr", "ft", 10)).toBeCloseTo(3.048, 12); // source: NIST SP 811 (foot, exact)
  });
  it("1 in = 0.0254 m for impeller diameters; 250 mm = 0.25 m", () => {
    expect(toSI("impeller", "in", 1)).toBe(0.0254); // source: NIST SP 811, Appendix B.8 (inch, exact)
    expect(toSI("impeller", "mm", 250)).toBeCloseTo(0.25, 12); // source: SI prefixes
  });
  it("1 hp = 745.69987 W", () => {
    expect(Math.abs(toSI("power", "hp", 1) - 745.69987)).toBeLessThan(1e-5); // source: NIST SP 811 / task brief (745.69987 W)
    expect(relClose(HP, 550 * 0.3048 * 4.4482216152605)).toBe(true); // source: NIST SP 811 (hp = 550 ft·lbf/s; lbf = 4.448 221 615 260 5 N)
    expect(toSI("power", "kW", 1.5)).toBe(1500); // source: SI prefixes
  });
  it("efficiency % → fraction", () => {
    expect(toSI("efficiency", "%", 78)).toBeCloseTo(0.78, 12); // source: definition of percent
    expect(toSI("efficiency", "fraction", 0.78)).toBe(0.78); // source: identity
  });
  it("every unit listed for a field has a factor", () => {
    for (const [field, table] of Object.entries(SI_FACTOR)) for (const f of Object.values(table)) expect(f, field).toBeGreaterThan(0); // source: common practice (no missing factor)
    expect(unitAllowed("head", "gpm")).toBe(false); // source: common practice (gpm is not a length)
    expect(unitAllowed("model", null)).toBe(true); // source: text fields carry no unit
  });
});

describe("parseNumber", () => {
  it.each([
    ["12.5", false, 12.5], // source: hand-written case (dot decimal)
    ["1,450", false, 1450], // source: hand-written case (thousands comma in a dot-decimal file)
    ["12,5", true, 12.5], // source: hand-written case (decimal comma)
    ["1.450,25", true, 1450.25], // source: hand-written case (dot thousands + decimal comma)
    ["0.785", true, 0.785], // source: hand-written case (leading 0 is never a thousands group)
    ["1 450", false, 1450], // source: hand-written case (space as thousands separator)
    ["-3", false, -3], // source: hand-written case
  ])("%s (decimal comma %s) → %d", (raw, dc, want) => {
    expect(parseNumber(raw, dc)).toBe(want);
  });
  it.each([["3l.5"], ["n/a"], ["12 m"], [""], ["1,2,3"]])("%s is not a number", (raw) => {
    expect(Number.isNaN(parseNumber(raw, false))).toBe(true); // source: hand-written case
  });
});

describe("guessHeader — header examples from the task brief", () => {
  const flowHeaders = [
    ["Flow (gpm)", "gpm"],
    ["Q [m3/h]", "m3/h"],
    ["Q l/s", "l/s"],
    ["m³/h", "m3/h"],
    ["US gpm", "gpm"],
  ].map(([header, unit]) => [header, "flow", unit]);
  it.each([
    ...flowHeaders,
    ["H ft", "head", "ft"],
    ["Head [m]", "head", "m"],
    ["Eff %", "efficiency", "%"],
    ["P2 kW", "power", "kW"],
    ["NPSHr (ft)", "npshr", "ft"],
    ["Power (hp)", "power", "hp"],
    ["Impeller (in)", "impeller", "in"],
    ["Speed (rpm)", "speed", "rpm"],
  ])("%s → %s [%s]", (header, field, unit) => {
    const g = guessHeader(header);
    expect(g.field).toBe(field); // source: task brief header examples
    expect(g.unit).toBe(unit); // source: task brief header examples
    expect(g.unitFromHeader).toBe(true); // source: unit is written in each header
    expect(g.qualifier).toBeNull(); // source: no per-curve qualifier in these headers
  });
  it.each([
    ["Pump type", "type", null],
    ["Size", "size", null],
    ["Notes", "notes", null],
    ["Model", "model", null],
    ["Shaft power (W)", "power", "W"],
    ["Eff (-)", "efficiency", "fraction"],
    ["Impeller diameter in mm", "impeller", "mm"],
    ["Speed 1/min", "speed", "rpm"],
    ["Imp. gpm", "flow", "imp gpm"],
    ["Colour", "ignore", null],
  ])("%s → %s [%s]", (header, field, unit) => {
    const g = guessHeader(header);
    expect(g.field).toBe(field); // source: hand-written header variants
    expect(g.unit).toBe(unit); // source: hand-written header variants
  });
  it("a header without a unit gets the field's default, flagged as not read from the header", () => {
    const g = guessHeader("Flow");
    expect([g.field, g.unit, g.unitFromHeader]).toEqual(["flow", "m3/h", false]); // source: DEFAULT_UNIT (design choice, README)
  });
  it.each([
    ["Head 250mm", "head", { impeller: 250, impellerUnit: "mm" }],
    ["H@2900", "head", { speed: 2900 }],
    ["Q@1450", "flow", { speed: 1450 }],
    ["Q @ 1450 rpm", "flow", { speed: 1450 }],
    ["Head 9.5 in", "head", { impeller: 9.5, impellerUnit: "in" }],
    ["H @ 250", "head", { impeller: 250, impellerUnit: "mm" }],
    ["Head (n=1450) [ft]", "head", { speed: 1450 }],
    ["Eff % Ø230", "efficiency", { impeller: 230, impellerUnit: "mm" }],
  ])("wide qualifier: %s", (header, field, qualifier) => {
    const g = guessHeader(header);
    expect(g.field).toBe(field); // source: task brief wide-layout examples + hand-written variants
    expect(g.qualifier).toEqual(qualifier); // source: task brief wide-layout examples (bare @number < 600 read as mm: README)
  });
  it("the unit is still read next to a qualifier", () => {
    expect(guessHeader("Head (n=1450) [ft]").unit).toBe("ft"); // source: hand-written header
  });
});
