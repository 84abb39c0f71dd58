// Every range's ends, as a refusal prints them, typed back into the editor (decision "inputedge"). The ends were printed
// grouped by commas ("3,280,840 ft"), which the forms' reader refuses, and rounded to the nearest digit shown, so an upper
// end could read above the range (1000 km is 3 280 839.9 ft, printed "3,280,840 ft"; 5 m is 196.85 in, "197 in"; 3000 m
// is 9842.5 ft, "9,843 ft") and a lower end below it (6.2 mm is 0.24409 in, "0.244 in"; −1000 m is −3280.8 ft,
// "−3,281 ft"; 0.1 m is 0.328084 ft, "0.328 ft"). Now the ends are grouped by spaces and rounded inward: each end, typed
// exactly as printed, is taken, in SI and US units; the end moved outward by 1 part in 10⁶ is refused (either side).
// Check values: 1 ft = 0.3048 m, 1 in = 25.4 mm, 1 US gal = 3.785411784 L (NIST SP 811); 0 °C = 32 °F, 100 °C = 212 °F.
import { describe, expect, it } from "vitest";
import { readSystemForm } from "./system-form";
import { AGED_ROUGHNESS_RANGE, BORE_RANGE, EXTRA_K_RANGE, LENGTH_RANGE, outOfRange, ROUGHNESS_RANGE, type NumberRange } from "./run-ranges";
import { DUTY_FLOW_RANGE, DUTY_HEAD_RANGE, STATIC_HIGH_RANGE, STATIC_LOW_RANGE } from "./duty-ranges";
import { DISCOUNT_RANGE, ESCALATION_RANGE, rateRefusal, type RateRange } from "./lcc-ranges";
import { LIQUID_TEMPERATURE_RANGE, WATER_TEMPERATURE_RANGE } from "./temperature-range";
import { renderUnits, SI_UNITS, US_UNITS, type UnitChoice } from "~/lib/shared/units";

const SI: Record<string, string> = {
  name: "Ends", fluidKind: "water", temperature: "20", mode: "open", staticLow: "10", staticHigh: "12", suctionSurfacePressure: "101.325",
  suctionStaticHead: "2", runCount: "1", "run.0.side": "discharge", "run.0.diameter": "100", "run.0.length": "60",
  "run.0.material": "steel", "run.0.roughness": "0", "run.0.agedRoughness": "0", dutyFlow: "36", dutyHead: "20", npshMargin: "1.1",
  "energy.control": "fixed-speed", "energy.profileKind": "common-practice", "energy.years": "20", "energy.escalation": "2", "energy.discount": "5",
};
const US: Record<string, string> = { ...SI, temperature: "68", suctionSurfacePressure: "14.696", staticLow: "30", staticHigh: "40", suctionStaticHead: "6", "run.0.diameter": "4", "run.0.length": "200", dutyFlow: "160", dutyHead: "65" };
const errorsOf = (o: Record<string, string>, units: UnitChoice) => {
  const m = new Map(Object.entries({ ...(units === US_UNITS ? US : SI), ...o }));
  return readSystemForm({ get: (k: string) => m.get(k) ?? null }, units).errors;
};

/** The ends a refusal prints, as text: "from A to B". */
function printedEnds(message: string): [string, string] {
  const m = /takes from ([-−]?[\d.][\d.\u202f]*)(?: [^ ]+)? to ([-−]?[\d.][\d.\u202f]*)/.exec(message); // U+202F: the groups
  if (!m) throw new Error(`no range in ${message}`);
  return [m[1], m[2].replace(/\.$/, "")];
}

type Case = { r: NumberRange; field: string; also?: (typed: string) => Record<string, string> };
const CASES: Case[] = [
  { r: BORE_RANGE, field: "run.0.diameter" },
  { r: LENGTH_RANGE, field: "run.0.length" },
  { r: ROUGHNESS_RANGE, field: "run.0.roughness", also: (t) => ({ "run.0.diameter": "4000", "run.0.agedRoughness": t }) },
  { r: AGED_ROUGHNESS_RANGE, field: "run.0.agedRoughness", also: () => ({ "run.0.diameter": "4000" }) },
  { r: EXTRA_K_RANGE, field: "run.0.extraK" },
  { r: STATIC_LOW_RANGE, field: "staticLow", also: (t) => ({ staticHigh: t }) },
  { r: STATIC_HIGH_RANGE, field: "staticHigh", also: (t) => ({ staticLow: t }) },
  { r: DUTY_FLOW_RANGE, field: "dutyFlow" },
  { r: DUTY_HEAD_RANGE, field: "dutyHead" },
  { r: WATER_TEMPERATURE_RANGE, field: "temperature" },
  { r: LIQUID_TEMPERATURE_RANGE, field: "temperature", also: () => ({ fluidKind: "custom", fluidName: "Oil", density: "900", viscosity: "0.01", vaporPressure: "0" }) },
];
// The roughness field in US units is in inches and 4000 mm is no bore in inches: the diameter given in the unit typed.
const usAlso = (o: Record<string, string>) => (o["run.0.diameter"] === "4000" ? { ...o, "run.0.diameter": "150" } : o);

describe.each([["SI", SI_UNITS], ["US", US_UNITS]] as const)("%s units: each end, typed as printed, is taken", (_, units) => {
  it.each(CASES.map((c) => [c.r.label, c] as const))("%s", (_label, c) => {
    const message = renderUnits(outOfRange(c.r, c.r.max * 2 + 1), units);
    const ends = printedEnds(message);
    ends.forEach((typed, i) => {
      const extra = c.also ? c.also(typed) : {};
      const errs = errorsOf({ [c.field]: typed, ...(units === US_UNITS ? usAlso(extra) : extra) }, units);
      expect(errs, `${c.r.label} ${i ? "upper" : "lower"} end “${typed}” of “${message}”`).toEqual({});
    });
  });
});

describe("the ends that were printed outside the range (old words beside the new), either side", () => {
  const end = (r: NumberRange, units: UnitChoice, i: 0 | 1) => printedEnds(renderUnits(outOfRange(r, r.max * 2 + 1), units))[i];
  it("US: length 3 280 839 ft (was “3,280,840 ft”); 3280840 ft refused, 3280839 ft taken", () => {
    expect(end(LENGTH_RANGE, US_UNITS, 1)).toBe("3\u202f280\u202f839");
    expect(errorsOf({ "run.0.length": "3280839" }, US_UNITS)).toEqual({});
    expect(Object.keys(errorsOf({ "run.0.length": "3280840" }, US_UNITS))).toEqual(["run.0.length"]);
  });
  it("US: bore 0.245 in to 196 in (was 0.244 in to 197 in); 196.86 in refused, 196.85 in taken", () => {
    const message = renderUnits(outOfRange(BORE_RANGE, 1e-6), US_UNITS);
    expect(printedEnds(message)).toEqual(["0.245", "196"]);
    expect(errorsOf({ "run.0.diameter": "196.85" }, US_UNITS)).toEqual({});
    expect(Object.keys(errorsOf({ "run.0.diameter": "196.86" }, US_UNITS))).toEqual(["run.0.diameter"]);
  });
  it("US: static head −3 280 ft to 9 842 ft (was −3,281 ft to 9,843 ft); 9842.52 ft refused, 9842.51 ft taken", () => {
    expect(printedEnds(renderUnits(outOfRange(STATIC_LOW_RANGE, 1e5), US_UNITS))).toEqual(["−3\u202f280", "9\u202f842"]);
    expect(errorsOf({ staticLow: "40", staticHigh: "9842.51" }, US_UNITS)).toEqual({});
    expect(Object.keys(errorsOf({ staticLow: "40", staticHigh: "9842.52" }, US_UNITS))).toEqual(["staticHigh"]);
  });
  it("a grouped end is read: “1 000 000” m (a space, a no-break space, a narrow no-break space) and “10 000” ΣK", () => {
    for (const typed of ["1 000 000", "1\u00a0000\u00a0000", "1\u202f000\u202f000"]) expect(errorsOf({ "run.0.length": typed }, SI_UNITS), typed).toEqual({});
    expect(errorsOf({ "run.0.extraK": "10 000" }, SI_UNITS)).toEqual({});
    expect(errorsOf({ "run.0.extraK": "10 000.01" }, SI_UNITS)["run.0.extraK"]).toMatch(/^Extra ΣK is too high: it takes from 0 to 10\u202f000, not 10\u202f000\.01;/);
  });
});

describe("the life-cycle rates' ends (lcc-ranges.ts; percent in every unit system)", () => {
  it.each([[ESCALATION_RANGE, "energy.escalation"], [DISCOUNT_RANGE, "energy.discount"]] as [RateRange, string][])("%s", (r, field) => {
    const [lo, hi] = printedEnds(rateRefusal(r, 5));
    for (const units of [SI_UNITS, US_UNITS]) {
      expect(errorsOf({ [field]: lo.replace("−", "-") }, units)).toEqual({});
      expect(errorsOf({ [field]: hi }, units)).toEqual({});
      expect(Object.keys(errorsOf({ [field]: String(r.max * 100 + 0.001) }, units))).toEqual([field]);
      expect(Object.keys(errorsOf({ [field]: String(r.min * 100 - 0.001) }, units))).toEqual([field]);
    }
  });
});
