import { UNITS, type Quantity } from "~/engine";
import { labelOf, PRESET_IDS, PRESETS, QUANTITY_NAMES, SETTABLE, type PresetId } from "~/lib/shared/units";
import { Options } from "./forms";

const presetText = (p: PresetId) => SETTABLE.slice(0, 4).map((q) => labelOf(PRESETS[p], q)).join(", ");

/** The account page's units: a preset, then one select per quantity ("as the preset" or a unit of it). Plain form fields, no script. */
export function UnitsFieldset({ preset, overrides, errors }: { preset: PresetId; overrides: Partial<Record<Quantity, string>>; errors: Record<string, string> }) {
  return (
    <fieldset className="space-y-2" data-testid="units">
      <legend className="label">Units</legend>
      <div>
        <label className="label" htmlFor="f-units">
          Preset
        </label>
        <select id="f-units" name="unitSystem" defaultValue={preset} className="field">
          <Options values={PRESET_IDS} label={(p) => `${p} — ${presetText(p)}`} />
        </select>
      </div>
      <p className="text-xs text-slate-600">Each quantity follows the preset unless you pick its unit here; pages, reports, warnings and e-mails use these units.</p>
      <div className="grid gap-2 sm:grid-cols-2">
        {SETTABLE.map((q) => (
          <div key={q}>
            <label className="label" htmlFor={`f-unit-${q}`}>
              {QUANTITY_NAMES[q]}
            </label>
            <select id={`f-unit-${q}`} name={`unit.${q}`} defaultValue={overrides[q] ?? ""} className="field" aria-invalid={errors[`unit.${q}`] ? true : undefined}>
              <option value="">as the preset</option>
              {UNITS[q].map((d) => (
                <option key={d.id} value={d.id}>
                  {d.label}
                </option>
              ))}
            </select>
            {errors[`unit.${q}`] ? <p className="text-sm text-fail" role="alert">{errors[`unit.${q}`]}</p> : null}
          </div>
        ))}
      </div>
    </fieldset>
  );
}
