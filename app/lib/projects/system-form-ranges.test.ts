// The system editor's pipe-run numbers at their edges (helper "formedge"): each refusal names the field and the range it
// takes in the unit typed. Inner diameter: from the smallest bore any pipe table of the catalogue lists (the engine's
// PIPE_TABLES: EN 10255 medium DN6, 6.2 mm) to 5 m (our rule, system-input.ts); it took 1e-9 mm and 0.5 mm, where a
// fitting's fT is taken at 1 mm (fittings.ts). Length 0 to 1000 km, roughness 0 to 50 mm, extra ΣK 0 to 10000 (our
// rules, system-input.ts). Check values: 1 in = 25.4 mm, 1 ft = 0.3048 m exactly (NIST SP 811); 6.2 mm / 25.4 =
// 0.24409 in; 1000 km / 0.3048 = 3 280 839.9 ft (hand arithmetic).
import { describe, expect, it } from "vitest";
import { PIPE_TABLES } from "~/engine";
import { readSystemForm } from "./system-form";
import { SI_UNITS, US_UNITS } from "~/lib/shared/units";

const si: Record<string, string> = {
  name: "Edges", fluidKind: "water", temperature: "20", mode: "open", staticLow: "10", staticHigh: "12", suctionSurfacePressure: "101.325",
  suctionStaticHead: "2", runCount: "1", "run.0.side": "discharge", "run.0.diameter": "100", "run.0.length": "60",
  "run.0.material": "steel", "run.0.roughness": "0", "run.0.agedRoughness": "0", dutyFlow: "36", dutyHead: "20", npshMargin: "1.1",
};
const us: Record<string, string> = { ...si, temperature: "68", suctionSurfacePressure: "14.696", staticLow: "30", staticHigh: "40", suctionStaticHead: "6", "run.0.diameter": "4", "run.0.length": "200", dutyFlow: "160", dutyHead: "65" };
const read = (o: Record<string, string>, units = SI_UNITS) => {
  const m = new Map(Object.entries({ ...(units === US_UNITS ? us : si), ...o }));
  return readSystemForm({ get: (k: string) => m.get(k) ?? null }, units);
};
const WHY = "(the smallest bore a pipe table of the catalogue lists: Steel tube EN 10255, medium (M) DN6)";

describe("the smallest bore taken is the catalogue's smallest", () => {
  it("control: EN 10255 medium DN6, 6.2 mm, is the smallest inner diameter of every table (pipesDN.ts)", () => {
    const all = PIPE_TABLES.flatMap((t) => t.sizes.map((s) => ({ t: t.name, n: s.nominal, d: s.innerDiameter })));
    const least = all.reduce((a, b) => (b.d < a.d ? b : a));
    expect(least).toEqual({ t: "Steel tube EN 10255, medium (M)", n: "DN6", d: 0.0062 });
  });
});

describe("a typed inner diameter", () => {
  it("SI: 6.2 mm is taken; 6.199 mm, 0.5 mm and 1e-9 mm are refused with the range in mm (were taken)", () => {
    expect(read({ "run.0.diameter": "6.2" }).errors).toEqual({});
    expect(read({ "run.0.diameter": "6.2" }).input!.runs[0].diameter).toBeCloseTo(0.0062, 12);
    for (const typed of ["6.199", "0.5", "1e-9"]) {
      const r = read({ "run.0.diameter": typed });
      expect(r.input, typed).toBeNull();
      expect(r.errors, typed).toEqual({ "run.0.diameter": expect.stringMatching(/^Inner diameter is too low: it takes from 6\.2 mm to 5\u202f000 mm /) });
      expect(r.errors["run.0.diameter"]).toMatch(/, not [\d.e-]+ mm; check the value and its unit\.$/);
    }
  });
  it("the flip at the limit as a field shows it (five significant digits): 6.1994 mm taken, 6.1993 mm refused", () => {
    expect(read({ "run.0.diameter": "6.1994" }).errors).toEqual({});
    expect(Object.keys(read({ "run.0.diameter": "6.1993" }).errors)).toEqual(["run.0.diameter"]);
  });
  it("US: 0.24409 in (6.2 mm as a field shows it) is taken, 0.244 in refused with the range in inches", () => {
    expect(read({ "run.0.diameter": "0.24409" }, US_UNITS).errors).toEqual({});
    expect(read({ "run.0.diameter": "0.2441" }, US_UNITS).errors).toEqual({});
    const r = read({ "run.0.diameter": "0.244" }, US_UNITS);
    expect(r.errors).toEqual({ "run.0.diameter": `Inner diameter is too low: it takes from 0.2441 in to 196 in ${WHY}, not 0.2440 in; check the value and its unit.` });
    expect(read({ "run.0.diameter": "1e-9" }, US_UNITS).errors["run.0.diameter"]).toMatch(/^Inner diameter is too low: it takes from 0\.245 in to 196 in /);
  });
  it("the top: 5000 mm taken, 5000.1 mm refused with the same range (was “Inner diameter above 5000 mm? Check the unit.”)", () => {
    expect(read({ "run.0.diameter": "5000" }).errors).toEqual({});
    expect(read({ "run.0.diameter": "5000.1" }).errors).toEqual({ "run.0.diameter": `Inner diameter is too high: it takes from 6.2 mm to 5\u202f000 mm ${WHY}, not 5\u202f000.1 mm; check the value and its unit.` });
  });
  it("text that is no number, and 1e400, say the range too", () => {
    for (const typed of ["abc", "1e400", "NaN", "Infinity"]) {
      expect(read({ "run.0.diameter": typed }).errors, typed).toEqual({ "run.0.diameter": `Inner diameter must be a number; it takes from 6.2 mm to 5\u202f000 mm ${WHY}.` });
    }
  });
});

describe("huge values in US units", () => {
  it("a length of 1e30 ft or 4e6 ft is refused with the range in ft (was “…far outside any pump system” and “Length above 1000 km?”)", () => {
    const high = (sent: string) => `Length is too high: it takes from 0 to 3\u202f280\u202f839 ft${sent}; check the value and its unit.`;
    expect(read({ "run.0.length": "1e30" }, US_UNITS).errors).toEqual({ "run.0.length": high("") }); // past the form's magnitude: no number to print
    expect(read({ "run.0.length": "4e6" }, US_UNITS).errors).toEqual({ "run.0.length": high(", not 4\u202f000\u202f000 ft") });
    expect(read({ "run.0.length": "3280840" }, US_UNITS).errors).toEqual({ "run.0.length": high(", not 3\u202f280\u202f840.0 ft").replace("839 ft", "839.9 ft") }); // 1000 km is 3 280 839.895 ft (1 ft = 0.3048 m, NIST SP 811): 839.9 lies 1.5 parts in 10⁹ out, within the reader's LIMIT_ROUNDING, so it is printed (at 1 part in 10⁹ it was rounded inward to 839.8)
    expect(read({ "run.0.length": "3280839.9" }, US_UNITS).errors).toEqual({}); // the end as printed, typed back: taken
    expect(read({ "run.0.length": "3280839" }, US_UNITS).errors).toEqual({});
    expect(read({ "run.0.length": "1e400" }, US_UNITS).errors).toEqual({ "run.0.length": "Length must be a number; it takes from 0 to 3\u202f280\u202f839 ft." });
    expect(read({ "run.0.length": "-1" }, US_UNITS).errors).toEqual({ "run.0.length": "Length is too low: it takes from 0 to 3\u202f280\u202f839 ft, not −1.00 ft; check the value and its unit." });
  });
  it("roughness past 50 mm (1.97 in) and extra ΣK past 10000 are refused with their ranges (extra ΣK had valibot's words)", () => {
    expect(read({ "run.0.roughness": "2", "run.0.agedRoughness": "2", "run.0.diameter": "40" }, US_UNITS).errors).toEqual({
      "run.0.roughness": "Roughness is too high: it takes from 0 to 1.96 in, not 2.00 in; check the value and its unit.",
      "run.0.agedRoughness": "Aged roughness is too high: it takes from 0 to 1.96 in, not 2.00 in; check the value and its unit.",
    });
    expect(read({ "run.0.extraK": "1e11" }, US_UNITS).errors).toEqual({ "run.0.extraK": "Extra ΣK is too high: it takes from 0 to 10\u202f000, not 100\u202f000\u202f000\u202f000; check the value." });
    expect(read({ "run.0.extraK": "10000" }, US_UNITS).errors).toEqual({});
  });
  it("any other number past the form's magnitude says the range in the unit typed, grouped (a suction static head of 1e30 ft)", () => {
    // The static heads and the duty have ranges of their own since (duty-ranges.ts, duty-ranges-form.test.ts).
    const r = read({ suctionStaticHead: "1e30" }, US_UNITS);
    expect(r.errors).toEqual({ suctionStaticHead: "The suction static head is far outside any pump system: the form takes nothing beyond ±3\u202f280\u202f839\u202f895\u202f013 ft; check the value and its unit." });
    expect(JSON.stringify(r.errors)).not.toMatch(/\de[+-]?\d/);
  });
});
