// The field-check form's numbers through the forms' strict reader (shared/decimal.ts). Product rules.
import { describe, expect, it } from "vitest";
import { fluidAt } from "~/engine";
import { parseCheckFields } from "./form";
import { fieldsForHead } from "~/test/fieldcheck-fixture";

const RHO20 = fluidAt({ kind: "water" }, 20).density;

describe("parseCheckFields: numbers as typed", () => {
  it("refuses 1,500 rpm as ambiguous on its field and says how to write it; 1500 and 1,5 are read", () => {
    const r = parseCheckFields(fieldsForHead(20, RHO20, { rpm: "1,500" }));
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.errors.rpm).toBe("The speed “1,500” is ambiguous (a thousands comma or a decimal comma?): write 1500, or 1.5.");
    expect(parseCheckFields(fieldsForHead(20, RHO20, { rpm: "1500" })).ok).toBe(true);
    const comma = parseCheckFields(fieldsForHead(20, RHO20, { sElevation: "0,5" }));
    expect(comma.ok && comma.readings.suction.elevation).toBe(0.5);
  });
  it("refuses hex and numbers out of range", () => {
    const r = parseCheckFields(fieldsForHead(20, RHO20, { sDiameter: "0x64", dDiameter: "1e309" }));
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.errors.sDiameter).toBe("The suction pipe inner diameter must be a number.");
      expect(r.errors.dDiameter).toMatch(/must be a number: “1e309” is out of range/);
    }
  });
});
