// How one candidate is run: as published, by speed or trim (ratio or solved for the duty),
// single/parallel/series with standby, motor rating, service factor and efficiency class.
import { Form } from "react-router";
import { IE_CLASSES } from "~/engine";
import { labelOf, toChosen, type UnitChoice } from "~/lib/shared/units";
import type { Adjustment } from "~/lib/projects/candidate-input";
import { MAX_DUTY_PUMPS, MAX_STANDBY_PUMPS } from "~/lib/projects/candidate-input";
import type { TypedFields } from "~/lib/projects/typed-back";

/** A number as the form shows it: one stored missing or not a number (NaN, a candidate needing review) is blank. */
const shown = (x: number) => (Number.isFinite(x) ? String(x) : "");

/**
 * `c.adjustment`: the candidate's, or for one needing review the stored values as far as they read (`adjustFormValues`).
 * `typed`: the fields as posted in this form's refused post (typed-back.ts typedFor), shown over the stored ones.
 */
export function AdjustForm({ c, unitSystem, error, typed }: { c: { id: number; adjustment: Adjustment }; unitSystem: UnitChoice; error?: string; typed?: TypedFields }) {
  const a = c.adjustment;
  const t = typed ?? {};
  return (
    <Form method="post" className="space-y-1 text-xs">
      <input type="hidden" name="candidateId" value={c.id} />
      <label className="block">
        Adjust by
        <select name="method" defaultValue={t.method ?? a.method} className="field py-0.5 text-xs">
          <option value="none">nothing (as published)</option>
          <option value="speed">speed (VFD)</option>
          <option value="trim">impeller trim</option>
        </select>
      </label>
      <label className="block">
        Ratio % (blank: solve for the duty)
        <input name="ratio" inputMode="decimal" defaultValue={t.ratio ?? (a.ratio != null ? shown(+(a.ratio * 100).toFixed(2)) : "")} className="field py-0.5 text-xs" />
      </label>
      <label className="block">
        Pumps
        <select name="arrangement" defaultValue={t.arrangement ?? a.arrangement} className="field py-0.5 text-xs">
          <option value="single">one pump</option>
          <option value="parallel">in parallel</option>
          <option value="series">in series</option>
        </select>
      </label>
      <div className="flex gap-1">
        <label className="block">
          duty
          <input name="dutyPumps" type="number" min={1} max={MAX_DUTY_PUMPS} defaultValue={t.dutyPumps ?? shown(a.dutyPumps)} className="field w-14 py-0.5 text-xs" />
        </label>
        <label className="block">
          standby
          <input name="standbyPumps" type="number" min={0} max={MAX_STANDBY_PUMPS} defaultValue={t.standbyPumps ?? shown(a.standbyPumps)} className="field w-14 py-0.5 text-xs" />
        </label>
      </div>
      <div className="flex gap-1">
        <label className="block">
          motor {labelOf(unitSystem, "power")} (blank: suggested)
          <input name="motorRating" inputMode="decimal" defaultValue={t.motorRating ?? (a.motorRating > 0 ? shown(+toChosen(unitSystem, "power", a.motorRating).toFixed(2)) : "")} className="field w-16 py-0.5 text-xs" />
        </label>
        <label className="block">
          service factor
          <input name="serviceFactor" inputMode="decimal" defaultValue={t.serviceFactor ?? shown(a.serviceFactor)} className="field w-14 py-0.5 text-xs" />
        </label>
        <label className="block">
          class
          <select name="ieClass" defaultValue={t.ieClass ?? a.ieClass ?? "IE3"} className="field py-0.5 text-xs">
            {IE_CLASSES.map((k) => (
              <option key={k} value={k}>
                {k}
              </option>
            ))}
          </select>
        </label>
      </div>
      {error ? <p className="text-fail">{error}</p> : null}
      <button className="btn-quiet w-full justify-center py-0.5 text-xs" name="intent" value="adjust">
        Apply
      </button>
    </Form>
  );
}
