// The pipe runs of the editor: one fieldset per run (table size or inner diameter, length,
// material, roughness, fittings), remove on save, and the buttons that add a run.
import { useState } from "react";
import { EDITOR_FITTINGS, MATERIAL_OPTIONS, materialForTable, roughnessHints } from "~/lib/projects/system-form";
import { BORE_RANGE, rangeText } from "~/lib/projects/run-ranges";
import { labelOf, renderUnits } from "~/lib/shared/units";
import { PipePicker } from "./PipePicker";
import { NumberField as In } from "./NumberField";
import type { FieldsetProps, SystemFormValues } from "./types";

export function RunsFieldset({ f, errors, unitSystem }: FieldsetProps) {
  return (
    <section className="panel space-y-3">
      <h2 className="font-semibold">Pipe runs</h2>
      <input type="hidden" name="runCount" value={f.runs.length} />
      {/* Errors on the runs as a whole (their count past the limit, a run count that is not one): no field of their own. */}
      {["runCount", "runs"].map((k) =>
        errors[k] ? (
          <p key={k} className="text-xs text-fail" role="alert">
            {errors[k]}
          </p>
        ) : null,
      )}
      {f.runs.map((r, i) => (
        <RunFieldset key={i} r={r} i={i} removed={f.removeRun[i] ?? false} errors={errors} unitSystem={unitSystem} />
      ))}
      <div className="flex flex-wrap gap-2">
        <button className="btn-quiet" name="addRun" value="suction">
          + suction run
        </button>
        <button className="btn-quiet" name="addRun" value="discharge">
          + discharge run
        </button>
      </div>
    </section>
  );
}

function RunFieldset({ r, i, removed, errors, unitSystem }: Omit<FieldsetProps, "f"> & { r: SystemFormValues["runs"][number]; i: number; removed: boolean }) {
  const u = (q: Parameters<typeof labelOf>[1]) => labelOf(unitSystem, q);
  // The material follows the pipe table while it is the one shown by default (materialForTable, the form's own rule);
  // once picked it stays. The roughness hints are the material's, at once.
  const [material, setMaterial] = useState(r.material);
  const [shown, setShown] = useState(r.materialShown);
  const [table, setTable] = useState(r.table);
  const hints = roughnessHints(material, table, unitSystem);
  return (
    <fieldset className="space-y-2 rounded-md border border-slate-200 p-3">
      <legend className="px-1 text-sm font-semibold">
        {r.side === "suction" ? "Suction" : "Discharge"} · {r.name}
      </legend>
      <div className="grid grid-cols-2 gap-2">
        <In label="Name" name={`run.${i}.name`} def={r.name} errors={errors} />
        <div>
          <label className="label" htmlFor={`f-run.${i}.side`}>
            Side
          </label>
          <select id={`f-run.${i}.side`} name={`run.${i}.side`} defaultValue={r.side} className="field">
            <option value="suction">suction</option>
            <option value="discharge">discharge</option>
          </select>
        </div>
        <PipePicker
          index={i}
          table={r.table}
          nominal={r.nominal}
          stored={r.stored}
          unitSystem={unitSystem}
          error={errors[`run.${i}.nominal`]}
          onTableChange={(id) => {
            setTable(id);
            const next = materialForTable(material, shown, id);
            setMaterial(next);
            if (shown) setShown(next);
          }}
        />
        <In label="Inner diameter" unit={u("diameter")} name={`run.${i}.diameter`} def={r.diameter} placeholder={r.diameterShown} errors={errors} hint={r.stored ? "The stored bore: used while the size above stays as stored." : r.table ? "Used only without a table size (see above)." : `Typed bore: ${renderUnits(rangeText({ ...BORE_RANGE, why: undefined }), unitSystem)}.`} />
        <In label="Length" unit={u("length")} name={`run.${i}.length`} def={r.length} errors={errors} />
        <div>
          <label className="label" htmlFor={`f-run.${i}.material`}>
            Material
          </label>
          <select
            id={`f-run.${i}.material`}
            name={`run.${i}.material`}
            value={material}
            onChange={(e) => {
              setMaterial(e.target.value);
              setShown("");
            }}
            className="field"
            aria-describedby={hints.mismatch ? `f-run.${i}.material-note` : undefined}
          >
            {MATERIAL_OPTIONS.map((m) => (
              <option key={m.id} value={m.id}>
                {m.name}
              </option>
            ))}
          </select>
          <input type="hidden" name={`run.${i}.materialShown`} value={shown} />
          {hints.mismatch ? (
            <p id={`f-run.${i}.material-note`} className="text-xs text-duty-ink">
              {hints.mismatch}
            </p>
          ) : null}
        </div>
        <In label="Extra ΣK" name={`run.${i}.extraK`} def={r.extraK} errors={errors} />
        <In label="Roughness new" unit={u("roughness")} name={`run.${i}.roughness`} def={r.roughness} placeholder={hints.roughness} errors={errors} />
        <In label="Roughness aged" unit={u("roughness")} name={`run.${i}.agedRoughness`} def={r.agedRoughness} placeholder={hints.aged} errors={errors} />
      </div>
      <details className="text-sm" open={Object.keys(r.fittings).length > 0 || EDITOR_FITTINGS.some(([fid]) => errors[`run.${i}.fit.${fid}`])}>
        <summary className="cursor-pointer font-semibold">Fittings (Crane TP-410 K values)</summary>
        <div className="mt-2 grid grid-cols-2 gap-2">
          {EDITOR_FITTINGS.map(([fid, label]) => {
            // Text, not type="number": the browser would send a count it cannot read as blank (0 fittings); the form's reader says why instead.
            const name = `run.${i}.fit.${fid}`;
            const err = errors[name];
            return (
              <div key={fid} className="text-xs">
                <label className="flex items-center justify-between gap-2">
                  {label}
                  <input id={`f-${name}`} name={name} inputMode="numeric" defaultValue={r.fittings[fid] ?? 0} className="field w-16 py-0.5" aria-invalid={err ? true : undefined} aria-describedby={err ? `f-${name}-err` : undefined} />
                </label>
                {err ? (
                  <p id={`f-${name}-err`} className="text-fail" role="alert">
                    {err}
                  </p>
                ) : null}
              </div>
            );
          })}
        </div>
      </details>
      <label className="flex items-center gap-2 text-xs text-slate-600">
        <input type="checkbox" name={`run.${i}.remove`} defaultChecked={removed} /> remove this run on save
      </label>
    </fieldset>
  );
}
