import { describe, expect, it } from "vitest";
import { qt, qtExact, qtLimit, qtPair } from "~/engine/quantityText";
import { unitLabel } from "~/engine";
import { fmtQ, fmtQExact, picksOf, presetOf, QUANTITIES, renderDeep, renderUnits, SI_UNITS, unitsOf, US_UNITS } from "./units";
import { fmtDate, fmtDateTime, fmtInt, fmtNum, fmtNumExact, fmtUtc } from "./format";

describe("unitsOf", () => {
  it("takes the preset and valid overrides, one quantity at a time", () => {
    const u = unitsOf("SI", { flow: "L/s", pressure: "bar" });
    expect(u.flow).toBe("L/s");
    expect(u.pressure).toBe("bar");
    expect(u.head).toBe("m");
    expect(unitsOf("US", {}).flow).toBe("gpm");
  });
  it("falls back to the preset for unknown ids, quantities and presets", () => {
    const u = unitsOf("US", { flow: "furlong/s", head: "m3/h", nonsense: "m", power: 7 });
    expect(u.flow).toBe("gpm");
    expect(u.head).toBe("ft");
    expect(u.power).toBe("hp");
    expect(unitsOf("metric", null)).toEqual(SI_UNITS);
  });
  it("reads the stored JSON text, and bad JSON as no overrides", () => {
    expect(unitsOf("SI", '{"head":"ft"}').head).toBe("ft");
    expect(unitsOf("SI", "{not json")).toEqual(SI_UNITS);
    expect(unitsOf("SI", "[1]")).toEqual(SI_UNITS);
  });
  it("keeps only valid picks; presetOf names a pure preset", () => {
    expect(picksOf({ ...SI_UNITS, flow: "L/s", head: "zz" })).toEqual({ ...SI_UNITS, flow: "L/s", head: undefined });
    expect(picksOf('{"head":"ft","flow":"gpm2"}')).toEqual({ head: "ft" });
    expect(presetOf(unitsOf("US"))).toBe("US");
    expect(presetOf(unitsOf("SI", { flow: "L/s" }))).toBeNull();
  });
});

describe("renderUnits", () => {
  // 0.0111 m³/s = 39.96 m³/h = 11.1 L/s = 175.94 US gpm (1 gal = 3.785411784 L, NIST SP 811).
  it("renders every quantity token in the chosen unit", () => {
    expect(renderUnits(`Flow ${qt("flow", 0.0111)} here`, SI_UNITS)).toBe("Flow 40.0 m³/h here");
    expect(renderUnits(`Flow ${qt("flow", 0.0111)}`, US_UNITS)).toBe("Flow 176 gpm");
    expect(renderUnits(qt("flow", 0.0111), unitsOf("SI", { flow: "L/s" }))).toBe("11.1 L/s");
    // 12.3 m = 40.35 ft (1 ft = 0.3048 m exact); 250 kPa = 36.26 psi; 5.5 kW = 7.376 hp (NIST SP 811).
    expect(renderUnits(`${qt("head", 12.3)} / ${qt("pressure", 250e3)} / ${qt("power", 5500)}`, US_UNITS)).toBe("40.4 ft / 36.3 psi / 7.38 hp");
    expect(renderUnits(`Ø${qt("diameter", 0.25)}`, SI_UNITS)).toBe("Ø250 mm");
    expect(renderUnits(`Ø${qt("diameter", 0.25)}`, US_UNITS)).toBe("Ø9.84 in");
    // 20 °C = 68 °F (exact).
    expect(renderUnits(`Water ${qt("temperature", 20)}`, US_UNITS)).toBe("Water 68.0 °F");
    expect(renderUnits(qt("velocity", 1.61), US_UNITS)).toBe("5.28 ft/s");
  });
  it("parses a token of every quantity and writes it in that quantity's chosen unit", () => {
    // 2 SI units of each quantity, in the US preset: the same conversion as the formatters (factors: NIST SP 811).
    for (const q of QUANTITIES) {
      const out = renderUnits(`[${qt(q, 2)}]`, US_UNITS);
      expect(out, q).toBe(`[${fmtQ(US_UNITS, q, 2)}]`);
      expect(out.endsWith(` ${unitLabel(q, US_UNITS[q])}]`), q).toBe(true);
    }
  });
  it("rounds by magnitude in the shown unit", () => {
    expect(renderUnits(qt("head", 123.456), SI_UNITS)).toBe("123 m");
    expect(renderUnits(qt("head", 0.01234), SI_UNITS)).toBe("0.012 m");
    expect(qt("flow", 1 / 3)).toBe("⟦flow|0.333333⟧");
  });
  it("renders NaN as a dash and leaves unknown or broken tokens as written", () => {
    expect(renderUnits(`at ${qt("head", NaN)}`, SI_UNITS)).toBe("at —");
    expect(renderUnits("⟦furlongs|3⟧ and ⟦head|abc⟧ and ⟦head|⟧", SI_UNITS)).toBe("⟦furlongs|3⟧ and ⟦head|abc⟧ and ⟦head|⟧");
  });
  it("leaves text without tokens unchanged (old stored SI text still displays)", () => {
    const old = "Velocity 1.61 m/s is above the usual 1.5 m/s for a suction line.";
    expect(renderUnits(old, US_UNITS)).toBe(old);
  });
  it("renders strings deep in a value and keeps what has no token", () => {
    const v = { a: [qt("head", 10), 3, null], b: { c: "plain" } };
    const r = renderDeep(v, US_UNITS);
    expect(r).toEqual({ a: ["32.8 ft", 3, null], b: { c: "plain" } });
    expect(r.b).toBe(v.b);
    expect(renderDeep(v.b, US_UNITS)).toBe(v.b);
  });
  it("formats a missing value as a dash", () => {
    expect(fmtQ(SI_UNITS, "flow", null)).toBe("—");
    expect(fmtQ(SI_UNITS, "flow", Infinity)).toBe("—");
  });
});

describe("a reading and its limit as tokens of each other (qtExact, qtLimit)", () => {
  const M3H = 1 / 3600;
  it("the reading gets the decimals it needs not to read as the limit; the limit shows as typed", () => {
    const [q, duty] = qtPair("flow", 99.96 * M3H, 100 * M3H);
    expect(renderUnits(`${q} against ${duty}`, SI_UNITS)).toBe("99.96 m³/h against 100 m³/h"); // qt alone: "100.0 m³/h against 100 m³/h"
    // 100 m³/h = 440.287 US gpm, 99.96 m³/h = 440.111 gpm (1 gal = 3.785411784 L, NIST SP 811): one decimal tells them apart, in order.
    expect(renderUnits(`${q} against ${duty}`, US_UNITS)).toBe("440.1 gpm against 440.3 gpm");
    expect(renderUnits(qtExact("head", 20, [20.02]), SI_UNITS)).toBe("20.00 m"); // a reading keeps the decimals it was given
    expect(renderUnits(qtLimit("head", 20, [19.98]), SI_UNITS)).toBe("20.0 m"); // a limit drops the added decimals' zeros
    expect(renderUnits(qtExact("head", 12.3, [4]), SI_UNITS)).toBe(renderUnits(qt("head", 12.3), SI_UNITS)); // apart already
    expect(fmtQExact(SI_UNITS, "head", 3.998, [4])).toBe("3.998 m");
    expect(fmtQExact(SI_UNITS, "head", 4, [3.998], true)).toBe("4.00 m");
  });
  it("keeps values exactly and renders broken tokens as written", () => {
    expect(qtExact("flow", 1 / 3, [0.5, null, NaN])).toBe("⟦flow|0.3333333333333333|0.5⟧");
    expect(qtLimit("flow", 0.5, [1 / 3])).toBe("⟦flow|0.5|limit:0.3333333333333333⟧");
    expect(qtExact("flow", 0.5, [])).toBe("⟦flow|0.5⟧");
    expect(renderUnits(qtExact("flow", NaN, [1]), SI_UNITS)).toBe("—");
    for (const broken of ["⟦head|1|x⟧", "⟦head|1|⟧", "⟦head|1|limit:⟧", "⟦head|1|2,⟧", "⟦flow|1|1e308⟧"]) expect(renderUnits(broken, SI_UNITS)).toBe(broken);
  });
  it("fmtNumExact: more decimals only while a number would read as one it is compared with (or zero)", () => {
    expect(fmtNumExact(1.0996, [1, 1.1], 2)).toBe("1.0996"); // toFixed(2): "1.10" beside a required 1.1
    expect(fmtNumExact(0.99996, [1, 1.1], 2)).toBe("0.99996");
    expect(fmtNumExact(1.1, [1, 1.1], 2)).toBe("1.10"); // equal to the limit: reads as it
    expect(fmtNumExact(1.5, [1, 1.1], 2)).toBe("1.50");
    expect(fmtNumExact(100, [99.96])).toBe("100.00");
    expect(fmtNumExact(100, [99.96], undefined, true)).toBe("100");
    expect(fmtNumExact(-0.00004, [])).toBe("-0.0000400"); // not "-0.000"; fmtNum's 3 significant digits (helper "numtext": was "-0.00004")
    expect(fmtNumExact(null, [1])).toBe("—");
  });
});

describe("format", () => {
  it("numbers and dates in one way", () => {
    expect(fmtNum(12.345)).toBe("12.3");
    expect(fmtNum(undefined)).toBe("—");
    expect(fmtInt(1234567)).toBe("1,234,567");
    expect(fmtDate("2026-12-02T23:59:00.000Z")).toBe("2026-12-02");
    expect(fmtDateTime("2026-12-02T09:05:59.000Z")).toBe("2026-12-02 09:05");
    expect(fmtDateTime(new Date("2026-01-31T00:00:00Z"))).toBe("2026-01-31 00:00");
    expect(fmtDate("not a date")).toBe("—");
    // Zone-less database text is UTC as stored (not the machine's zone).
    expect(fmtDateTime("2026-12-02 23:30:00.000")).toBe("2026-12-02 23:30");
    expect(fmtDate("2026-12-02")).toBe("2026-12-02");
    // To the second with the zone (mail logs): seconds are kept, not rounded (source: hand-written cases).
    expect(fmtDateTime("2026-12-02T09:05:59.900Z", { seconds: true })).toBe("2026-12-02 09:05:59");
    expect(fmtUtc("2026-12-01T22:54:55.123Z", { seconds: true })).toBe("2026-12-01 22:54:55 UTC");
    expect(fmtUtc(null, { seconds: true })).toBe("—");
    expect(fmtUtc("garbage", { seconds: true })).toBe("—");
  });
});
