// Limits shown in refusals, grouped in thousands as the app writes counts (helper "formkeep"): the system editor's and the
// preview API's ranges ("it takes from 0 to 1000000 m"), the editor's magnitude bound ("±3280839895013 ft"), the field
// check form's ("100000 kPa") and the calculators' ("must be at most 100000") printed long numbers ungrouped. Now their
// whole parts are grouped by the one count formatter (format.ts `fmtInt`, en-GB: "12,345"); decimals, small numbers and
// the readings beside them stay as they were. Since helper "inputedge" the groups are narrow no-break spaces (the
// forms' reader takes them back; commas it refuses) and an end is rounded inward (limits-typed-back.test.ts). Check values: our limits (run-ranges.ts 1000 km and ΣK 10 000; the field
// check's 1000 bar = 100 000 kPa; the calculators' minor K 100 000); 1000 km = 3 280 839.9 ft, 10¹² m = 3 280 839 895 013 ft
// (1 ft = 0.3048 m exactly, NIST SP 811; hand arithmetic).
import { describe, expect, it } from "vitest";
import { calcPipeLoss } from "~/lib/calc-api/calculations";
import { parseCheckFields } from "~/lib/fieldchecks/form";
import { BORE_RANGE, EXTRA_K_RANGE, LENGTH_RANGE, outOfRange, rangeText } from "~/lib/projects/run-ranges";
import { readSystemForm } from "~/lib/projects/system-form";
import { fieldsForHead } from "~/test/fieldcheck-fixture";
import { fmtInt } from "./format";
import { renderUnits, SI_UNITS, US_UNITS } from "./units";

describe("a range's ends in a refusal", () => {
  it("grouped by spaces in the unit of the reader: 1 000 000 m and 3 280 839 ft (were 1,000,000 m, 3,280,840 ft); counts keep fmtInt's commas", () => {
    expect(fmtInt(1000000)).toBe("1,000,000"); // the app's count formatter, for reading only
    expect(renderUnits(outOfRange(LENGTH_RANGE, 2e6), SI_UNITS)).toBe("Length is too high: it takes from 0 to 1\u202f000\u202f000 m, not 2\u202f000\u202f000 m; check the value and its unit.");
    expect(renderUnits(outOfRange(LENGTH_RANGE, 2e6), US_UNITS)).toBe("Length is too high: it takes from 0 to 3\u202f280\u202f839 ft, not 6\u202f561\u202f680 ft; check the value and its unit.");
    expect(outOfRange(EXTRA_K_RANGE, 2e4)).toBe("Extra ΣK is too high: it takes from 0 to 10\u202f000, not 20\u202f000; check the value."); // a plain number too
  });
  it("small ends without trailing zeros, rounded inward: 6.2 mm to 5 000 mm; 0.2441 in to 196 in (5 m is 196.85 in)", () => {
    expect(renderUnits(rangeText({ ...BORE_RANGE, why: undefined }), SI_UNITS)).toBe("from 6.2 mm to 5\u202f000 mm");
    expect(renderUnits(rangeText({ ...BORE_RANGE, why: undefined }, 0.244 * 0.0254), US_UNITS)).toBe("from 0.2441 in to 196 in");
  });
});

describe("the editor's bound past the form's magnitude", () => {
  it("±3 280 839 895 013 ft (was ±3,280,839,895,013 ft)", () => {
    const base: Record<string, string> = { name: "G", temperature: "68", staticLow: "30", staticHigh: "30", suctionSurfacePressure: "14.696", runCount: "0", suctionStaticHead: "1e30" };
    const r = readSystemForm({ get: (k: string) => base[k] ?? null }, US_UNITS);
    expect(r.errors.suctionStaticHead).toBe("The suction static head is far outside any pump system: the form takes nothing beyond ±3\u202f280\u202f839\u202f895\u202f013 ft; check the value and its unit.");
  });
});

describe("other forms and the calculators", () => {
  it("the field check form: “from −101.325 kPa to 100 000 kPa” (was 100,000 kPa)", () => {
    const r = parseCheckFields(fieldsForHead(20, 998.2, { sPressure: "-102" }), { kind: "water" });
    expect(r.ok).toBe(false);
    expect((r as { errors: Record<string, string> }).errors.sPressure).toMatch(/^Suction pressure is too low: the form takes from −101\.325 kPa to 100\u202f000 kPa \(/);
  });
  it("the calculators: minor_k “must be at most 100 000” (was 100,000)", () => {
    const r = calcPipeLoss({ flow_m3s: 0.01, diameter_m: 0.1, length_m: 10, roughness_m: 0.00005, minor_k: 2e5 });
    expect(r.ok).toBe(false);
    expect((r as { errors: { field: string; message: string }[] }).errors).toContainEqual({ field: "minor_k", message: "must be at most 100\u202f000" });
  });
});
