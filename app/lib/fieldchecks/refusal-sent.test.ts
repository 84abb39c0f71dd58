// Every numeric refusal of the field-check form names the field, the range it takes in the unit typed and the number sent
// (", not −350 kPa"), as the system editor's refusals do (projects/run-ranges.ts `outOfRange`); each end printed, typed back
// as printed (narrow no-break spaces and all), is taken. Product rule. The form's bounds are its own (form.ts, common
// practice); the fixture's check is invented (app/test/fieldcheck-fixture.ts).
import { describe, expect, it } from "vitest";
import { fluidAt } from "~/engine";
import { parseCheckFields } from "./form";
import { fieldsForHead } from "~/test/fieldcheck-fixture";

const RHO20 = fluidAt({ kind: "water" }, 20).density;
const water = { kind: "water" } as const;
const errorOf = (key: string, extra: Record<string, string>) => {
  const r = parseCheckFields(fieldsForHead(20, RHO20, extra), water);
  return r.ok ? null : (r.errors[key] ?? null);
};
const takes = (extra: Record<string, string>) => parseCheckFields(fieldsForHead(20, RHO20, extra), water).ok;

// [field, too low, too high, unit word, fields beside it] — each just past an end of its range, in the unit typed.
const CASES: [key: string, low: string | null, high: string, word: string, extra?: Record<string, string>][] = [
  ["sPressure", "-101.326", "100000.1", "kPa"],
  ["sPressure", "-14.7", "14504", "psi", { pressureUnit: "psi", dPressure: "29" }],
  ["dPressure", null, "1000.001", "bar", { pressureUnit: "bar", sPressure: "0" }],
  ["sAccuracy", "-0.5", "10000.1", "kPa"],
  ["dElevation", "-100.01", "100.01", "m"],
  ["sElevation", "-328.1", "328.1", "ft", { elevationUnit: "ft" }],
  ["sDiameter", "4.999", "3000.1", "mm"],
  ["dDiameter", "0.19", "118.2", "in", { diameterUnit: "in", sDiameter: "4" }],
  ["flow", "-1", "360000.5", "m³/h", { flowUnit: "m3/h" }],
  ["flowAccuracy", "-0.1", "50.5", "%"],
  ["rpm", "0", "10001", "rpm"],
  ["hz", "4.9", "120.5", "Hz", { speedMode: "vfd", baseHz: "50", baseRpm: "2900" }],
  ["power", "0", "5000.01", "kW", { powerMode: "input" }],
  ["motorEfficiency", "29.9", "100.1", "%", { powerMode: "input", power: "5" }],
  ["volts", "49", "15001", "V", { powerMode: "electrical", amps: "10", powerFactor: "0.85" }],
  ["amps", "0", "5000.5", "A", { powerMode: "electrical", volts: "400", powerFactor: "0.85" }],
];

/** "−101.326" → the text the refusal prints for it: a minus sign, thousands grouped by narrow no-break spaces. */
const printed = (typed: string) => {
  const [whole, frac] = typed.replace("-", "").split(".");
  return `${typed.startsWith("-") ? "−" : ""}${whole.replace(/\B(?=(\d{3})+$)/g, "\u202f")}${frac ? `.${frac}` : ""}`;
};
const escape = (s: string) => s.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");

describe("a number out of range is named in the refusal, in the unit typed", () => {
  for (const [key, low, high, word, extra = {}] of CASES)
    for (const typed of [low, high].filter((t): t is string => t !== null))
      it(`${key} ${typed} ${word}`, () => {
        const e = errorOf(key, { ...extra, [key]: typed });
        const unit = word === "%" ? " %" : ` ${word}`;
        // Was: "… is too high: the form takes from … to …; check the value and its unit." (the number sent not said)
        expect(e, `${key}=${typed}`).toMatch(new RegExp(`^.+ is too (low|high): the form takes .+, not ${escape(printed(typed))}${escape(unit)}; check the value and its unit\\.$`));
        // Each end as printed, typed back in the same unit, is taken (at that field; the rest of the form unchanged).
        const range = e!.slice(e!.indexOf("takes ")).split(/ \(|, not /)[0]; // the range alone, not its reason's numbers
        const ends = [...range.matchAll(/(?:from|than|to|most) (−?[\d\u202f]+(?:\.\d+)?)(?= )/g)].map((m) => m[1]);
        expect(ends.length, e!).toBe(2);
        for (const end of ends) {
          const back = end.replace("−", "-");
          const again = errorOf(key, { ...extra, [key]: back });
          // An open end ("more than 0 kW") is refused as itself, and says so; a closed one is taken.
          if (e!.includes(`more than ${end}`)) expect(again).toMatch(/is too low/);
          else expect(again, `${key}=${back}`).toBeNull();
        }
      });

  it("the ends printed in psi are rounded inward and taken; the number sent is not rounded onto them", () => {
    // 100 000 kPa = 14 503.7738 psi (1 psi = 6.894757293 kPa, NIST SP 811): printed "14 503.7", taken; 14 503.8 is past it.
    const e = errorOf("sPressure", { pressureUnit: "psi", sPressure: "14503.8", dPressure: "29" });
    expect(e).toBe("Suction pressure is too high: the form takes from −14.6959 psi to 14\u202f503.7 psi (a gauge reads no lower than full vacuum, −1 standard atmosphere gauge; up to 1\u202f000 bar), not 14\u202f503.8 psi; check the value and its unit.");
    expect(takes({ pressureUnit: "psi", sPressure: "14\u202f503.7", dPressure: "14\u202f503.8" })).toBe(false); // the discharge still past
    expect(takes({ pressureUnit: "psi", sPressure: "0", dPressure: "14\u202f503.7" })).toBe(true);
  });

  it("a number past the form's magnitude is named too", () => {
    expect(errorOf("dPressure", { dPressure: "2e12" })).toMatch(/^Discharge pressure is too high: the form takes from −101\.325 kPa to 100\u202f000 kPa .*, not 2\u202f000\u202f000\u202f000\u202f000 kPa; check the value and its unit\.$/);
  });

  it("the fluid temperature's refusal names the number sent, in the unit typed", () => {
    expect(errorOf("temperature", { temperature: "100.001" })).toMatch(/^Fluid temperature is too high: the form takes 0 to 100 °C, not 100\.001 °C — water's properties/);
    expect(errorOf("temperature", { temperature: "-4", temperatureUnit: "F" })).toMatch(/^Fluid temperature is too low: the form takes 32 to 212 °F, not −4 °F — /);
  });
});

it("text that is not a number is named beside the range (it was '… must be a number; the form takes …')", () => {
  expect(errorOf("sDiameter", { sDiameter: "0x64" })).toBe("The suction pipe inner diameter must be a number, not “0x64”; the form takes from 5 mm to 3\u202f000 mm.");
  expect(errorOf("flow", { flow: "NaN" })).toMatch(/^The flow reading must be a number, not “NaN”; the form takes from 0 m³\/s to 100 m³\/s/);
  expect(errorOf("rpm", { rpm: "1e400" })).toMatch(/^The speed must be a number: “1e400” is out of range; the form takes from 100 rpm/); // named already
});
