// Edges of the system editor's form (system-form.ts) found by an edge hunt: one message per cause, on the field that
// holds it. Check values: the engine's catalogue (pipes.ts: copper type K is ASTM B88 in inch sizes, no DN100); a leap
// year has 366 × 24 = 8784 h (calendar); a steel pipe's roughness 0.045 mm new, 0.5 mm aged (pipes.ts, from memory).
import { describe, expect, it } from "vitest";
import { readSystemForm } from "./system-form";
import { SI_UNITS, US_UNITS } from "~/lib/shared/units";

// One typed-bore discharge run of 100 mm, SI units (head in m, roughness in mm).
const base: Record<string, string> = {
  name: "Edges", fluidKind: "water", temperature: "20", mode: "open", staticLow: "10", staticHigh: "12", suctionSurfacePressure: "101.325",
  suctionStaticHead: "2", runCount: "1", "run.0.side": "discharge", "run.0.diameter": "100", "run.0.length": "60",
  "run.0.material": "steel", dutyFlow: "36", dutyHead: "20", npshMargin: "1.1",
};
const read = (o: Record<string, string | null>, sys = SI_UNITS) => {
  const m = new Map(Object.entries({ ...base, ...o }));
  return readSystemForm({ get: (k: string) => m.get(k) ?? null }, sys);
};

describe("a size not in the chosen pipe table", () => {
  it("gives its one message, not the inner diameter's and the roughnesses' against a stand-in 0 mm bore", () => {
    const r = read({ "run.0.table": "copper-k", "run.0.nominal": "DN100", "run.0.diameter": "" });
    expect(r.input).toBeNull();
    expect(r.errors).toEqual({ "run.0.nominal": "Pick a size from this pipe table." });
  });
  it("a typed bore that is no number keeps its own message alone too; a roughness refused for itself is still said", () => {
    expect(read({ "run.0.diameter": "abc" }).errors).toEqual({ "run.0.diameter": "Inner diameter must be a number; it takes from 6.2 mm to 5\u202f000 mm (the smallest bore a pipe table of the catalogue lists: Steel tube EN 10255, medium (M) DN6)." });
    const r = read({ "run.0.diameter": "abc", "run.0.roughness": "-1" });
    expect(r.errors["run.0.roughness"]).toBe("Roughness is too low: it takes from 0 to 50 mm, not −1.00 mm; check the value and its unit."); // with its range (run-ranges.ts)
  });
});

describe("roughness against the bore", () => {
  it("49 mm in a 100 mm pipe (ε/D 0.49) is taken, with the correlation's range warning on the system; 50 mm (ε = D/2) is refused with both numbers", () => {
    expect(read({ "run.0.roughness": "49", "run.0.agedRoughness": "49" }).errors).toEqual({});
    expect(read({ "run.0.roughness": "50", "run.0.agedRoughness": "50" }).errors["run.0.roughness"]).toBe(
      "Roughness 50.0 mm is not below half the inner diameter 100 mm (50.0 mm): wall roughness that high would close the bore, which is physically meaningless. Check the unit of each.",
    );
  });
});

describe("static head at low and high level", () => {
  it("high below low is refused at the high level's field naming both (low level is the least lift), not swapped unsaid", () => {
    const r = read({ staticLow: "20", staticHigh: "5" });
    expect(r.input).toBeNull();
    expect(r.errors).toEqual({ staticHigh: "The static head at high level, 5.00 m, is below the one at low level, 20.0 m: high level is the most lift and low level the least, so high must be at least low. Swap them, or type the same value in both for one level." });
    expect(read({ staticLow: "5", staticHigh: "5" }).errors).toEqual({});
    expect(read({ staticLow: "5", staticHigh: "4.999" }).errors.staticHigh).toMatch(/^The static head at high level, 4\.999 m, is below the one at low level, 5\.00 m/);
  });
  it("in US units the heads read in ft (20 m = 65.6 ft, 5 m = 16.4 ft: 0.3048 m/ft, NIST SP 811)", () => {
    const r = read({ staticLow: "65.6168", staticHigh: "16.4042", suctionSurfacePressure: "14.696", "run.0.diameter": "4", temperature: "68" }, US_UNITS);
    expect(r.errors.staticHigh).toMatch(/^The static head at high level, 16\.4 ft, is below the one at low level, 65\.6 ft: /);
  });
  it("a closed loop has no static lift: its static fields are not judged", () => {
    expect(read({ mode: "closed-loop", staticLow: "20", staticHigh: "5", controlHead: "10" }).errors).toEqual({});
  });
});

describe("duty-cycle steps past a year", () => {
  const steps = { "energy.control": "fixed-speed", "energy.profileKind": "user", "energy.step.0.pct": "100", "energy.step.0.hours": "5000", "energy.step.2.pct": "50", "energy.step.2.hours": "4000" };
  it("said on the hours of the step where the total passes 8784 h (a leap year), not on the control mode; the form's row, with a blank row between", () => {
    const r = read(steps);
    expect(r.input).toBeNull();
    expect(r.errors).toEqual({ "energy.step.2.hours": "The steps add up to 9\u202f000 h a year, more than a year has: at most 8\u202f784 h, a leap year's 366 days × 24 h. With this step they reach 9\u202f000 h; take hours off the steps." });
    expect(read({ ...steps, "energy.step.2.hours": "3784" }).errors).toEqual({}); // 8784 h exactly: a leap year, taken
  });
  it("steps typed in hundredths that add up to 8784 h exactly are taken (their binary sum is 8784.000000000002); 0.001 h more is refused, said apart from 8784 h", () => {
    // 2452.01 + 2587.38 + 1516.76 + 966.51 + 528.06 + 733.28 = 8784.00 h (decimal arithmetic); a year of 8784 h (calendar).
    const hours = ["2452.01", "2587.38", "1516.76", "966.51", "528.06", "733.28"];
    const six = (last: string) => Object.fromEntries(hours.flatMap((h, i) => [[`energy.step.${i}.pct`, String(100 - 10 * i)], [`energy.step.${i}.hours`, i === 5 ? last : h]]));
    const exact = read({ ...six("733.28"), "energy.control": "fixed-speed", "energy.profileKind": "user" });
    expect(exact.errors).toEqual({});
    expect(exact.input?.energy?.profile?.map((s) => s.hours)).toEqual(hours.map(Number));
    const over = read({ ...six("733.281"), "energy.control": "fixed-speed", "energy.profileKind": "user" });
    expect(over.errors).toEqual({ "energy.step.5.hours": "The steps add up to 8\u202f784.001 h a year, more than a year has: at most 8\u202f784 h, a leap year's 366 days × 24 h. With this step they reach 8\u202f784.001 h; take hours off the steps." });
  });
});
