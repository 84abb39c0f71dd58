// The field-check form's numbers through the forms' strict reader (shared/decimal.ts). Product rules.
import { describe, expect, it } from "vitest";
import { fluidAt, fromSI, WATER_RANGE_C } from "~/engine";
import { parseCheckFields, temperatureRangeText } from "./form";
import { fieldsForHead } from "~/test/fieldcheck-fixture";

const RHO20 = fluidAt({ kind: "water" }, 20).density;

describe("parseCheckFields: numbers as typed", () => {
  it("refuses 1,500 rpm as ambiguous on its field and says how to write it; 1500 and 1,5 are read", () => {
    const r = parseCheckFields(fieldsForHead(20, RHO20, { rpm: "1,500" }), { kind: "water" });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.errors.rpm).toBe("The speed “1,500” is ambiguous: 1500 (a thousands comma) or 1.500 (a decimal comma)? Write 1500 or 1 500 for the first, 1.500 or 1.5 for the second.");
    expect(parseCheckFields(fieldsForHead(20, RHO20, { rpm: "1500" }), { kind: "water" }).ok).toBe(true);
    const comma = parseCheckFields(fieldsForHead(20, RHO20, { sElevation: "0,5" }), { kind: "water" });
    expect(comma.ok && comma.readings.suction.elevation).toBe(0.5);
  });
  it("refuses hex and numbers out of range", () => {
    const r = parseCheckFields(fieldsForHead(20, RHO20, { sDiameter: "0x64", dDiameter: "1e309" }), { kind: "water" });
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.errors.sDiameter).toBe("The suction pipe inner diameter must be a number, not “0x64”; the form takes from 5 mm to 3\u202f000 mm."); // the range in the unit typed (helper "fieldedge2")
      expect(r.errors.dDiameter).toMatch(/must be a number: “1e309” is out of range/);
    }
  });
});

describe("parseCheckFields: the fluid temperature follows the selection's liquid", () => {
  // Water: the engine's table range (WATER_RANGE_C, fluids.ts: IAPWS formulations, 0–100 °C) — read from it, not copied.
  // A user-defined liquid: the form's plausibility bounds, −20 to 200 °C (common practice; its properties do not depend on it).
  const water = { kind: "water" } as const;
  const custom = { kind: "custom" } as const;
  const at = (liquid: { kind: "water" | "custom" }, temperature: number | string, unit = "C") =>
    parseCheckFields(fieldsForHead(20, RHO20, { temperature: String(temperature), temperatureUnit: unit }), liquid);

  it("water: each end of the engine's range is taken, just past it is refused with the range in the unit typed", () => {
    expect(at(water, WATER_RANGE_C.min).ok).toBe(true);
    expect(at(water, WATER_RANGE_C.max).ok).toBe(true);
    const high = at(water, WATER_RANGE_C.max + 0.1);
    const low = at(water, WATER_RANGE_C.min - 0.1);
    expect(high.ok || high.errors.temperature).toBe(
      "Fluid temperature is too high: the form takes 0 to 100 °C, not 100.1 °C — water's properties are computed for this range only (IAPWS formulations; describe another liquid or temperature as a user-defined fluid on the system).",
    );
    expect(low.ok || low.errors.temperature).toMatch(/^Fluid temperature is too low: the form takes 0 to 100 °C/);
    // In °F: 212 °F is 100 °C (taken), 212.5 °F is past it.
    expect(at(water, fromSI("temperature", "F", WATER_RANGE_C.max), "F").ok).toBe(true);
    const f = at(water, 212.5, "F");
    expect(f.ok || f.errors.temperature).toMatch(/^Fluid temperature is too high: the form takes 32 to 212 °F/);
  });

  it("a user-defined liquid takes 150 °C (past water's range) and refuses 201 °C", () => {
    expect(at(custom, 150).ok).toBe(true);
    const r = at(custom, 201);
    expect(r.ok || r.errors.temperature).toMatch(/^Fluid temperature is too high: the form takes −20 to 200 °C, not 201 °C — the form's plausibility bounds for a user-defined liquid/);
  });

  it("each end the hint shows in °F is taken as typed: 392 °F (200 °C, 200.00000000000003 once converted) and −4 °F", () => {
    // 200 °C = 392 °F and −20 °C = −4 °F exactly (°F = °C × 9/5 + 32, by definition); 392 °F was refused as too high.
    expect(temperatureRangeText(custom, "F")).toBe("−4 to 392 °F");
    for (const t of [392, -4]) {
      const r = at(custom, t, "F");
      expect(r.ok || r.errors.temperature, `${t} °F`).toBe(true);
      if (r.ok) expect(r.readings.temperatureC, `${t} °F`).toBe(t === 392 ? 200 : -20);
    }
    expect(at(custom, 392.01, "F").ok).toBe(false);
  });

  it("the verdict flips exactly at the stated ends, as typed: 392.000000001 °F and −4.000000001 °F refused, 391.999999999 °F taken", () => {
    // Before, a slack of 1e-9 °C on the converted value took 392.000000001 °F (200.00000000056 °C) and −4.000000001 °F.
    // °F = °C × 9/5 + 32 by definition: 200 °C = 392 °F, −20 °C = −4 °F (arithmetic).
    const high = at(custom, 392.000000001, "F");
    expect(high.ok || high.errors.temperature).toMatch(/^Fluid temperature is too high: the form takes −4 to 392 °F, not 392\.000000001 °F — /);
    const low = at(custom, -4.000000001, "F");
    expect(low.ok || low.errors.temperature).toMatch(/^Fluid temperature is too low: the form takes −4 to 392 °F, not −4\.000000001 °F — /);
    const inside = at(custom, 391.999999999, "F");
    expect(inside.ok).toBe(true);
    if (inside.ok) expect(inside.readings.temperatureC).toBeCloseTo(200, 8);
  });

  it("the field's hint says the same range in the unit chosen", () => {
    expect(temperatureRangeText(water, "C")).toBe("0 to 100 °C");
    expect(temperatureRangeText(water, "F")).toBe("32 to 212 °F");
    expect(temperatureRangeText(custom, "C")).toBe("−20 to 200 °C");
  });
});
