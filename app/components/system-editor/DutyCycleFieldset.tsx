// The system's load profile, control mode and life-cycle settings, inside the system form.
// Works without JavaScript: every field posts; the step rows are fixed (blank rows are ignored).
import { CONTROL_MODES, CIRCULATOR_PROFILE_SOURCE, defaultCirculatorProfile } from "~/engine";
import { DEFAULT_ENERGY_SETTINGS, MAX_LCC_YEARS, MAX_PROFILE_STEPS, MIN_LCC_YEARS, type EnergySettings } from "~/lib/projects/energy";
import { DISCOUNT_RANGE, ESCALATION_RANGE, rateRangeText } from "~/lib/projects/lcc-ranges";
import { NumberField } from "./NumberField";

// Blank for NaN: a stored value that is missing or not a number (stored-input.ts `editorInput`).
const pctText = (x: number) => (Number.isFinite(x) ? String(Math.round(x * 10000) / 100) : "");

// `typed`: the fields as posted in a save the server refused (typed-back.ts), shown in place of the stored settings.
export function DutyCycleFieldset({ energy, hoursPerYear, errors, currency, typed }: { energy: EnergySettings; hoursPerYear: number; errors: Record<string, string>; currency: string; typed?: Record<string, string> | null }) {
  const common = defaultCirculatorProfile(Number.isFinite(hoursPerYear) ? Math.min(Math.max(hoursPerYear, 0), 8784) : 0);
  const rows = energy.profile ?? common;
  const kind = typed?.["energy.profileKind"];
  const err = (k: string) => (errors[k] ? <p className="text-xs text-fail" role="alert">{errors[k]}</p> : null);
  return (
    <section className="panel space-y-3" aria-labelledby="duty-cycle-h">
      <h2 id="duty-cycle-h" className="font-semibold">
        Load profile, control and life-cycle cost
      </h2>
      <div>
        <label className="label" htmlFor="f-energy.control">
          Control
        </label>
        <select id="f-energy.control" name="energy.control" defaultValue={typed?.["energy.control"] ?? energy.control} className="field">
          {CONTROL_MODES.map((m) => (
            <option key={m.id} value={m.id}>
              {m.label}
            </option>
          ))}
        </select>
        <p className="text-xs text-slate-500">Proportional pressure: H = H_set × (0.5 + 0.5 × Q/Q_duty); H_set is the system's head at the duty flow (common practice).</p>
        {err("energy.control")}
      </div>
      <fieldset className="space-y-2">
        <legend className="label">Load profile (flow as % of the duty flow, hours per year; 0 % flow: hours with no demand, the pump stopped)</legend>
        <label className="flex items-start gap-2 text-sm">
          <input type="radio" name="energy.profileKind" value="common-practice" defaultChecked={kind !== undefined ? kind === "common-practice" : !energy.profile} />
          <span>
            Common-practice circulator profile (labelled as such in every result): {common.map((s) => `${pctText(s.flowFraction)} % for ${Math.round(s.hours)} h`).join(", ")}.
            <span className="block text-xs text-slate-500">{CIRCULATOR_PROFILE_SOURCE}; follows the operating hours above.</span>
          </span>
        </label>
        <label className="flex items-center gap-2 text-sm">
          <input type="radio" name="energy.profileKind" value="user" defaultChecked={kind !== undefined ? kind === "user" : !!energy.profile} />
          My own profile (the rows below; blank rows are ignored)
        </label>
        {err("energy.profileKind")}
        <table className="text-sm">
          <thead>
            <tr className="text-left text-xs text-slate-600">
              <th className="pr-2 font-normal">Step</th>
              <th className="pr-2 font-normal">Flow (%)</th>
              <th className="font-normal">Hours per year</th>
            </tr>
          </thead>
          <tbody>
            {Array.from({ length: MAX_PROFILE_STEPS }, (_, i) => (
              <tr key={i}>
                <td className="pr-2 text-xs text-slate-500">{i + 1}</td>
                <td className="pr-2">
                  <input name={`energy.step.${i}.pct`} aria-label={`Step ${i + 1} flow, %`} inputMode="decimal" className="field w-20 py-0.5" defaultValue={typed?.[`energy.step.${i}.pct`] ?? (rows[i] ? pctText(rows[i].flowFraction) : "")} />
                  {err(`energy.step.${i}.pct`)}
                </td>
                <td>
                  <input name={`energy.step.${i}.hours`} aria-label={`Step ${i + 1} hours per year`} inputMode="decimal" className="field w-24 py-0.5" defaultValue={typed?.[`energy.step.${i}.hours`] ?? (rows[i] && Number.isFinite(rows[i].hours) ? String(Math.round(rows[i].hours * 100) / 100) : "")} />
                  {err(`energy.step.${i}.hours`)}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </fieldset>
      <div className="grid grid-cols-3 gap-2">
        <NumberField label="Years" name="energy.years" def={typed?.["energy.years"] ?? (Number.isFinite(energy.years) ? String(energy.years) : "")} errors={errors} inputMode="numeric" />
        <NumberField label="Tariff escalation (% per year)" name="energy.escalation" def={typed?.["energy.escalation"] ?? pctText(energy.escalation)} errors={errors} />
        <NumberField label="Discount rate (% per year)" name="energy.discount" def={typed?.["energy.discount"] ?? pctText(energy.discountRate)} errors={errors} />
      </div>
      <p className="text-xs text-slate-500">
        Left blank: tariff escalation and discount rate 0 % a year (no escalation, no discounting), years {DEFAULT_ENERGY_SETTINGS.years}. Years: a whole number from {MIN_LCC_YEARS} to {MAX_LCC_YEARS}. Tariff escalation: {rateRangeText(ESCALATION_RANGE)}. Discount rate: {rateRangeText(DISCOUNT_RANGE)}. Life-cycle cost = purchase price + present value of the energy cost over the years (tariff escalating, discounted at the end of each year; {currency || "workspace currency"}). Maintenance and disposal are not included.
      </p>
    </section>
  );
}
