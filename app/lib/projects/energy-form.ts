// The editor's load-profile, control and life-cycle fields ↔ the system document's `energy` part.
// Percent in the form, fractions in the document; hours per year as typed. Pure (browser and server).
import { countField, decimalField, decimalMessage, readDecimal } from "../shared/decimal";
import { DEFAULT_ENERGY_SETTINGS, MAX_LCC_YEARS, MAX_PROFILE_STEPS, MIN_LCC_YEARS, type EnergySettings } from "./energy";
import { DISCOUNT_RANGE, ESCALATION_RANGE, rateKept, rateRefusal, rateTaken, type RateRange } from "./lcc-ranges";

type FormLike = { get(name: string): FormDataEntryValue | null; keys?(): Iterable<string> };

const STEP_FIELD = /^energy\.step\.(\d+)\.(?:pct|hours)$/;

/**
 * The first row past the form's MAX_PROFILE_STEPS that carries a value (a post no page of ours makes: the form has that many
 * rows), or null. Read from the form's keys where it has them (FormData, URLSearchParams); such rows were dropped unsaid.
 */
function rowPastLimit(f: FormLike): number | null {
  if (typeof f.keys !== "function") return null;
  let first: number | null = null;
  for (const k of f.keys()) {
    const m = STEP_FIELD.exec(k);
    if (!m) continue;
    const row = Number(m[1]);
    if (row < MAX_PROFILE_STEPS || String(f.get(k) ?? "").trim() === "") continue;
    if (first === null || row < first) first = row;
  }
  return first;
}

/** A number, or null for blank or bad text (bad text: its message under `key`; the forms' strict reader, shared/decimal.ts). */

/**
 * Reads the energy fields. A form without them (an older page, a script) keeps the stored settings
 * (`current`), else the defaults. Ranges are checked by the schema (EnergySettingsSchema).
 */
export function readEnergyForm(f: FormLike, errors: Record<string, string>, current?: EnergySettings, formSteps: number[] = []): EnergySettings {
  const base = current ?? DEFAULT_ENERGY_SETTINGS;
  if (f.get("energy.control") == null) return { ...base };
  const control = String(f.get("energy.control")) as EnergySettings["control"];
  let profile: EnergySettings["profile"] = null;
  if (f.get("energy.profileKind") === "user") {
    profile = [];
    for (let i = 0; i < MAX_PROFILE_STEPS; i++) {
      const pct = decimalField(f.get(`energy.step.${i}.pct`), `energy.step.${i}.pct`, "Flow", errors);
      const hours = decimalField(f.get(`energy.step.${i}.hours`), `energy.step.${i}.hours`, "Hours", errors);
      if (pct == null && hours == null) continue;
      if (pct == null || hours == null) {
        errors[`energy.step.${i}.${pct == null ? "pct" : "hours"}`] ??= "Give both the flow (%) and the hours of this step, or neither.";
        continue;
      }
      formSteps.push(i); // the form row of this profile step (blank rows are left out): where its issues are said
      profile.push({ flowFraction: pct / 100, hours });
    }
    const past = rowPastLimit(f);
    if (past !== null) errors["energy.profileKind"] ??= `At most ${MAX_PROFILE_STEPS} steps: the form has ${MAX_PROFILE_STEPS} rows, and a value was sent for row ${past + 1}. Put the hours into ${MAX_PROFILE_STEPS} steps or fewer.`;
  }
  // A rate left blank is 0 %/year — no escalation, no discounting — as the form's hint says (DutyCycleFieldset.tsx); it
  // took the example 3 % and 5 % (DEFAULT_ENERGY_SETTINGS), a value nobody typed, into the life-cycle cost. Outside its
  // range, or no number, a rate is refused naming the field and the range (`rateRefusal`, the schema's words).
  const pct = (key: string, r: RateRange) => {
    const d = readDecimal(f.get(key));
    if (d.kind === "blank") return 0;
    if (d.kind === "ambiguous") errors[key] ??= decimalMessage(d, r.label);
    if (d.kind !== "number") {
      errors[key] ??= rateRefusal(r, null);
      return 0;
    }
    const x = d.value / 100;
    if (!rateTaken(r, x)) errors[key] ??= rateRefusal(r, x);
    return rateKept(r, x);
  };
  return {
    control,
    profile,
    // A count, digits only (shared/decimal.ts countField): "1e1" or "15,0" were read as years. Blank is the default 15
    // years, as the form's hint says — never the years stored before (which a cleared field no longer shows).
    years: countField(f.get("energy.years"), "energy.years", "Years", errors, MAX_LCC_YEARS, DEFAULT_ENERGY_SETTINGS.years, MIN_LCC_YEARS) ?? base.years,
    escalation: pct("energy.escalation", ESCALATION_RANGE),
    discountRate: pct("energy.discount", DISCOUNT_RANGE),
  };
}

/**
 * Form field of a schema issue inside `energy` (path after "energy"). `formStep` gives the form row of profile step K
 * (readEnergyForm leaves blank rows out, so step K of the document need not be row K); by default the same K.
 */
export function energyField(path: unknown[], formStep: (k: number) => number | undefined = (k) => k): string {
  const [b, c, d] = path;
  if (b === "profile") return typeof c === "number" ? `energy.step.${formStep(c) ?? c}.${d === "hours" ? "hours" : "pct"}` : "energy.profileKind";
  if (b === "discountRate") return "energy.discount";
  return `energy.${String(b ?? "control")}`;
}
