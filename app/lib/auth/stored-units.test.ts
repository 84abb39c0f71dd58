// The stored unit settings read against what the account form writes (stored-units.ts). Check values: the engine's unit ids
// (engine/units.ts), the presets (UNIT_SYSTEMS: SI m³/h, US gpm), our product rules. The database side: app/test/stored-units.test.ts.
import { describe, expect, it } from "vitest";
import { readStoredUnits, unitsNotice } from "./stored-units";
import { SI_UNITS, US_UNITS } from "~/lib/shared/units";

describe("readStoredUnits", () => {
  it("sound settings: the preset with the picks, nothing said", () => {
    const s = readStoredUnits("US", '{"flow":"L/s","pressure":"bar"}');
    expect(s).toEqual({ units: { ...US_UNITS, flow: "L/s", pressure: "bar" }, preset: "US", picks: { flow: "L/s", pressure: "bar" }, problems: [] });
    expect(unitsNotice(s)).toBeNull();
    expect(readStoredUnits("SI", "{}").units).toEqual(SI_UNITS); // the column's default
  });
  it("a sound pick beside a bad one is not kept: the defaults until saved, as the notice says (was: the sound picks kept silently)", () => {
    const s = readStoredUnits("SI", '{"flow":"gpm","head":7}');
    expect([s.units, s.picks]).toEqual([SI_UNITS, {}]);
    expect(s.problems.map((p) => [p.label, p.message, p.stored])).toEqual([["unit of head", "Should be one of the units of head: m, ft.", "7"]]);
  });
  it("both parts bad: each named, SI shown; JSON null and a number are not settings", () => {
    const s = readStoredUnits(null, '{"flow":"furlong/s","nonsense":"m"}');
    expect(s.preset).toBe("SI");
    expect(s.problems.map((p) => `${p.label}: ${p.message} (${p.stored})`)).toEqual([
      "unit preset: Should be SI or US. (empty (null))",
      'unit of flow: Should be one of the units of flow: m³/s, m³/h, L/s, L/min, gpm. ("furlong/s")',
      'nonsense: Is not a quantity whose unit the account page sets. ("m")',
    ]);
    expect(unitsNotice(s)?.text).toBe(
      "The unit settings stored with your account cannot be read (3 problems: unit preset; unit of flow; nonsense), so the defaults are shown — the SI preset's units on every page — until you save your profile below.",
    );
    for (const json of ["null", "42", '"L/s"']) expect(readStoredUnits("US", json).problems.map((p) => p.label), json).toEqual(["the stored unit settings"]);
  });
});
