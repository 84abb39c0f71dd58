// The life-cycle fields of the system form at their edges (helper "formedge"). Blank means the value the form's hint
// states: tariff escalation and discount rate 0 % a year, Years the default 15 (energy.ts DEFAULT_ENERGY_SETTINGS) —
// never the value stored before, which nothing on the page shows once the field is cleared. A refusal names the field and
// the range it takes: escalation −50 % to 100 % a year, discount rate 0 % to 100 % a year, years 1 to 50 (our rules,
// energy.ts EnergySettingsSchema). Check values: those rules and the form's hint (DutyCycleFieldset.tsx).
import { describe, expect, it } from "vitest";
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { DutyCycleFieldset } from "~/components/system-editor/DutyCycleFieldset";
import { DEFAULT_ENERGY_SETTINGS } from "./energy";
import { readEnergyForm } from "./energy-form";

const FIELDS = { "energy.control": "fixed-speed", "energy.profileKind": "common-practice", "energy.years": "20", "energy.escalation": "2", "energy.discount": "5" };
const read = (o: Record<string, string> = {}, stored = { ...DEFAULT_ENERGY_SETTINGS, years: 30 }) => {
  const m = new Map(Object.entries({ ...FIELDS, ...o }));
  const errors: Record<string, string> = {};
  const out = readEnergyForm({ get: (k) => m.get(k) ?? null }, errors, stored);
  return { out, errors };
};
const text = (html: string) => html.replace(/<[^>]*>/g, " ").replace(/&#x27;/g, "'").replace(/&amp;/g, "&").replace(/\s+/g, " ");

describe("blank means what the hint says", () => {
  it("Years blank: the default 15, not the 30 stored (was 30 when the stored settings were passed, 15 when not)", () => {
    expect(read({ "energy.years": "" })).toEqual({ out: expect.objectContaining({ years: 15 }), errors: {} });
    expect(read({ "energy.years": "   " }).out.years).toBe(15);
    expect(read({ "energy.years": "" }, { ...DEFAULT_ENERGY_SETTINGS, years: 15 }).out.years).toBe(15);
    expect(read({ "energy.years": "31" }).out.years).toBe(31); // typed: as typed
  });
  it("rates blank: 0 % a year (unchanged)", () => {
    expect(read({ "energy.escalation": "", "energy.discount": "" }).out).toMatchObject({ escalation: 0, discountRate: 0 });
  });
  it("the form's hint says both: rates blank 0 %, Years blank 15, and each field's range", () => {
    const page = text(renderToStaticMarkup(createElement(DutyCycleFieldset, { energy: { ...DEFAULT_ENERGY_SETTINGS, years: 30 }, hoursPerYear: 4000, errors: {}, currency: "EUR" })));
    expect(page).toContain("Left blank: tariff escalation and discount rate 0 % a year (no escalation, no discounting), years 15.");
    expect(page).toContain("Years: a whole number from 1 to 50. Tariff escalation: from −50 % to 100 % a year. Discount rate: from 0 % to 100 % a year.");
  });
});

describe("each rate refused with its field and range, both sides of each end", () => {
  const ESC = "Tariff escalation is too RANGE: it takes from −50 % to 100 % a year, not SENT; check the value.";
  const DISC = "Discount rate is too RANGE: it takes from 0 % to 100 % a year, not SENT; check the value.";
  it("escalation: −50 and 100 taken; −50.001 and 100.001 refused (was “Escalation at least −50 % a year.” / “at most 100 %”)", () => {
    expect(read({ "energy.escalation": "-50" }).errors).toEqual({});
    expect(read({ "energy.escalation": "100" }).errors).toEqual({});
    expect(read({ "energy.escalation": "-50.001" }).errors).toEqual({ "energy.escalation": ESC.replace("RANGE", "low").replace("SENT", "−50.001 %") });
    expect(read({ "energy.escalation": "100.001" }).errors).toEqual({ "energy.escalation": ESC.replace("RANGE", "high").replace("SENT", "100.001 %") });
  });
  it("discount rate: 0 and 100 taken; −0.001 and 100.001 refused", () => {
    expect(read({ "energy.discount": "0" }).errors).toEqual({});
    expect(read({ "energy.discount": "100" }).errors).toEqual({});
    expect(read({ "energy.discount": "-0.001" }).errors).toEqual({ "energy.discount": DISC.replace("RANGE", "low").replace("SENT", "−0.001 %") });
    expect(read({ "energy.discount": "100.001" }).errors).toEqual({ "energy.discount": DISC.replace("RANGE", "high").replace("SENT", "100.001 %") });
  });
  it("no number (1e400, NaN, Infinity, abc) names the range too", () => {
    for (const typed of ["1e400", "NaN", "Infinity", "abc"]) {
      expect(read({ "energy.escalation": typed }).errors, typed).toEqual({ "energy.escalation": "Tariff escalation must be a number; it takes from −50 % to 100 % a year." });
      expect(read({ "energy.discount": typed }).errors, typed).toEqual({ "energy.discount": "Discount rate must be a number; it takes from 0 % to 100 % a year." });
    }
  });
  it("years: 1 and 50 taken, 0 and 51 refused with the range, 51 as too many (countField)", () => {
    expect(read({ "energy.years": "1" }).out.years).toBe(1);
    expect(read({ "energy.years": "50" }).out.years).toBe(50);
    expect(read({ "energy.years": "0" }).errors["energy.years"]).toBe("Years must be at least 1 (a whole number from 1 to 50): “0” is too few.");
    expect(read({ "energy.years": "51" }).errors["energy.years"]).toBe("Years must be at most 50 (a whole number from 1 to 50): “51” is too many.");
  });
});
