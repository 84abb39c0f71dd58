// The static heads and the duty at the ends of their ranges (helper "formkeep"), in the editor's form and the preview
// API's body: they took any number below the form's magnitude, 10¹² SI (a static head of 1e9 m, a duty of 1e6 m³/s).
// Ranges (duty-ranges.ts; common practice, from memory): static head −1000 m to 3000 m, duty flow 1e-5 m³/s (0.036 m³/h)
// to 100 m³/s (360 000 m³/h), duty head 0.1 m to 5000 m. Each end: just inside is taken, just outside refused naming the
// field and its range in the unit typed. Conversions (NIST SP 811): 1 ft = 0.3048 m, 1 gpm = 6.30901964e-5 m³/s, so
// 3000 m = 9842.52 ft, −1000 m = −3280.84 ft, 5000 m = 16404.2 ft, 0.1 m = 0.328084 ft, 1e-5 m³/s = 0.158503 gpm,
// 100 m³/s = 1585032.3 gpm (hand arithmetic).
import { describe, expect, it } from "vitest";
import { readSystemForm } from "./system-form";
import { readPreviewBody } from "./preview-input";
import { defaultSystemInput, type SystemInput } from "./hydraulics";
import { renderUnits, SI_UNITS, US_UNITS } from "~/lib/shared/units";

const si: Record<string, string> = {
  name: "Ends", fluidKind: "water", temperature: "20", mode: "open", staticLow: "10", staticHigh: "12", suctionSurfacePressure: "101.325",
  suctionStaticHead: "2", runCount: "1", "run.0.side": "discharge", "run.0.diameter": "100", "run.0.length": "60", "run.0.material": "steel",
  dutyFlow: "36", dutyHead: "20", npshMargin: "1.1",
};
const us: Record<string, string> = { ...si, temperature: "68", suctionSurfacePressure: "14.696", staticLow: "30", staticHigh: "40", suctionStaticHead: "6", "run.0.diameter": "4", "run.0.length": "200", dutyFlow: "160", dutyHead: "65" };
const read = (o: Record<string, string>, units = SI_UNITS) => {
  const m = new Map(Object.entries({ ...(units === US_UNITS ? us : si), ...o }));
  return readSystemForm({ get: (k: string) => m.get(k) ?? null }, units);
};
/** The only refusal of a form read (its field and words), or "taken". */
const said = (o: Record<string, string>, units = SI_UNITS) => {
  const r = read(o, units);
  const keys = Object.keys(r.errors);
  if (keys.length === 0 && r.input) return "taken";
  return keys.map((k) => `${k}: ${r.errors[k]}`).join(" | ");
};
const check = " check the value and its unit.";

describe("the editor's form, SI units", () => {
  it("static head: −1000 m and 3000 m taken, −1000.01 m and 3000.01 m refused at the field typed", () => {
    expect(said({ staticLow: "-1000" })).toBe("taken");
    expect(said({ staticLow: "3000", staticHigh: "3000" })).toBe("taken");
    expect(said({ staticLow: "-1000.01" })).toBe(`staticLow: Static head at low level is too low: it takes from −1\u202f000 m to 3\u202f000 m, not −1\u202f000.01 m;${check}`);
    expect(said({ staticLow: "12", staticHigh: "3000.01" })).toBe(`staticHigh: Static head at high level is too high: it takes from −1\u202f000 m to 3\u202f000 m, not 3\u202f000.01 m;${check}`);
    expect(said({ staticLow: "1e9", staticHigh: "1e9" })).toMatch(/^staticLow: Static head at low level is too high: .* \| staticHigh: Static head at high level is too high: /); // was taken
  });
  it("duty flow: 0.036 m³/h (the end as shown: 9.999999999999999e-6 m³/s after the conversion) and 360000 m³/h taken; 0.0359 and 360001 refused", () => {
    expect(said({ dutyFlow: "0.036" })).toBe("taken");
    expect(said({ dutyFlow: "360000" })).toBe("taken");
    expect(said({ dutyFlow: "0.0359" })).toBe(`dutyFlow: Duty flow is too low: it takes from 0.036 m³/h to 360\u202f000 m³/h, not 0.0359 m³/h;${check}`);
    expect(said({ dutyFlow: "360001" })).toBe(`dutyFlow: Duty flow is too high: it takes from 0.036 m³/h to 360\u202f000 m³/h, not 360\u202f001 m³/h;${check}`);
  });
  it("duty head: 0.1 m and 5000 m taken; 0.099 m and 5000.1 m refused", () => {
    expect(said({ dutyHead: "0.1" })).toBe("taken");
    expect(said({ dutyHead: "5000" })).toBe("taken");
    expect(said({ dutyHead: "0.099" })).toBe(`dutyHead: Duty head is too low: it takes from 0.1 m to 5\u202f000 m, not 0.099 m;${check}`);
    expect(said({ dutyHead: "5000.1" })).toBe(`dutyHead: Duty head is too high: it takes from 0.1 m to 5\u202f000 m, not 5\u202f000.1 m;${check}`);
  });
  it("blank: a static head asks for its value with the range; a duty left blank on both fields is no duty", () => {
    expect(said({ staticLow: "" })).toBe("staticLow: Enter the static head at low level; it takes from −1\u202f000 m to 3\u202f000 m.");
    expect(read({ dutyFlow: "", dutyHead: "" }).input!.duty).toBeNull();
  });
});

describe("the editor's form, US units: the range in ft and gpm", () => {
  it("static head: 9842.5 ft taken, 9842.6 ft refused; −3280.8 ft taken, −3280.9 ft refused", () => {
    expect(said({ staticLow: "9842.5", staticHigh: "9842.5" }, US_UNITS)).toBe("taken");
    expect(said({ staticLow: "40", staticHigh: "9842.6" }, US_UNITS)).toBe(`staticHigh: Static head at high level is too high: it takes from −3\u202f280 ft to 9\u202f842.5 ft, not 9\u202f842.6 ft;${check}`);
    expect(said({ staticLow: "-3280.8" }, US_UNITS)).toBe("taken");
    expect(said({ staticLow: "-3280.9" }, US_UNITS)).toBe(`staticLow: Static head at low level is too low: it takes from −3\u202f280.8 ft to 9\u202f842 ft, not −3\u202f280.9 ft;${check}`);
  });
  it("duty flow: 0.1586 gpm and 1585032 gpm taken; 0.1584 gpm and 1585033 gpm refused", () => {
    expect(said({ dutyFlow: "0.1586" }, US_UNITS)).toBe("taken");
    expect(said({ dutyFlow: "1585032" }, US_UNITS)).toBe("taken");
    expect(said({ dutyFlow: "0.1584" }, US_UNITS)).toBe(`dutyFlow: Duty flow is too low: it takes from 0.159 gpm to 1\u202f585\u202f032 gpm, not 0.158 gpm;${check}`); // 0.158503 at the magnitude's 3 decimals
    expect(said({ dutyFlow: "1585033" }, US_UNITS)).toBe(`dutyFlow: Duty flow is too high: it takes from 0.159 gpm to 1\u202f585\u202f032 gpm, not 1\u202f585\u202f033 gpm;${check}`);
  });
  it("duty head: 0.3281 ft and 16404 ft taken; 0.328 ft and 16405 ft refused", () => {
    expect(said({ dutyHead: "0.3281" }, US_UNITS)).toBe("taken");
    expect(said({ dutyHead: "16404" }, US_UNITS)).toBe("taken");
    expect(said({ dutyHead: "0.328" }, US_UNITS)).toBe(`dutyHead: Duty head is too low: it takes from 0.3281 ft to 16\u202f404 ft, not 0.3280 ft;${check}`);
    expect(said({ dutyHead: "16405" }, US_UNITS)).toBe(`dutyHead: Duty head is too high: it takes from 0.329 ft to 16\u202f404 ft, not 16\u202f405 ft;${check}`);
  });
});

describe("the preview API's body (SI numbers), refused in the same words with its JSON pointer", () => {
  const base = (): SystemInput => ({ ...defaultSystemInput(), staticLow: 10, staticHigh: 12, duty: { flow: 0.01, head: 20 } });
  const preview = (o: Partial<SystemInput>) => {
    const r = readPreviewBody({ input: { ...base(), ...o } }, []);
    return r.ok ? "taken" : r.errors.map((e) => `${e.pointer}: ${renderUnits(e.message, SI_UNITS)}`).join(" | ");
  };
  it("static head at both ends", () => {
    expect(preview({ staticLow: -1000 })).toBe("taken");
    expect(preview({ staticLow: 3000, staticHigh: 3000 })).toBe("taken");
    expect(preview({ staticLow: -1000.01 })).toBe(`/input/staticLow: Static head at low level is too low: it takes from −1\u202f000 m to 3\u202f000 m, not −1\u202f000.01 m;${check}`);
    expect(preview({ staticHigh: 3000.01 })).toBe(`/input/staticHigh: Static head at high level is too high: it takes from −1\u202f000 m to 3\u202f000 m, not 3\u202f000.01 m;${check}`);
  });
  it("duty flow and head at both ends", () => {
    expect(preview({ duty: { flow: 1e-5, head: 0.1 } })).toBe("taken");
    expect(preview({ duty: { flow: 100, head: 5000 } })).toBe("taken");
    expect(preview({ duty: { flow: 0.99e-5, head: 20 } })).toBe(`/input/duty/flow: Duty flow is too low: it takes from 0.036 m³/h to 360\u202f000 m³/h, not 0.0356 m³/h;${check}`);
    expect(preview({ duty: { flow: 100.01, head: 20 } })).toBe(`/input/duty/flow: Duty flow is too high: it takes from 0.036 m³/h to 360\u202f000 m³/h, not 360\u202f036 m³/h;${check}`);
    expect(preview({ duty: { flow: 0.01, head: 0.099 } })).toBe(`/input/duty/head: Duty head is too low: it takes from 0.1 m to 5\u202f000 m, not 0.099 m;${check}`);
    expect(preview({ duty: { flow: 0.01, head: 5000.1 } })).toBe(`/input/duty/head: Duty head is too high: it takes from 0.1 m to 5\u202f000 m, not 5\u202f000.1 m;${check}`);
  });
});
