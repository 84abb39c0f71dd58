// The system section of the editor: name, fluid, kind of system, static heads, suction conditions.
import { labelOf } from "~/lib/shared/units";
import { NumberField as In } from "./NumberField";
import type { FieldsetProps } from "./types";

export function SystemFieldset({ f, errors, unitSystem, name, customFluid }: FieldsetProps & { name: string; customFluid: boolean }) {
  const u = (q: Parameters<typeof labelOf>[1]) => labelOf(unitSystem, q);
  return (
    <section className="panel space-y-3">
      <h2 className="font-semibold">System</h2>
      <In label="Name" name="name" def={name} errors={errors} wide />
      <div className="grid grid-cols-2 gap-3">
        <div>
          <label className="label" htmlFor="f-fluidKind">
            Fluid
          </label>
          <select id="f-fluidKind" name="fluidKind" defaultValue={f.fluidKind} className="field">
            <option value="water">Water (IAPWS)</option>
            <option value="custom">Other liquid</option>
          </select>
        </div>
        <In label="Temperature" unit={u("temperature")} name="temperature" def={f.temperature} errors={errors} />
      </div>
      {customFluid ? (
        <div className="grid grid-cols-2 gap-3">
          <In label="Liquid name" name="fluidName" def={f.fluidName} errors={errors} />
          <In label="Density" unit={u("density")} name="density" def={f.density} errors={errors} />
          <In label="Viscosity" unit={u("dynamicViscosity")} name="viscosity" def={f.viscosity} errors={errors} />
          <In label="Vapour pressure (abs.)" unit={u("pressure")} name="vaporPressure" def={f.vaporPressure} errors={errors} />
        </div>
      ) : null}
      <div>
        <span className="label">Kind of system</span>
        <div className="mt-1 flex gap-4 text-sm">
          <label className="flex items-center gap-1">
            <input type="radio" name="mode" value="open" defaultChecked={f.mode === "open"} /> Open: lift between two surfaces
          </label>
          <label className="flex items-center gap-1">
            <input type="radio" name="mode" value="closed-loop" defaultChecked={f.mode === "closed-loop"} /> Closed loop
          </label>
        </div>
      </div>
      <div className="grid grid-cols-2 gap-3">
        <In label="Static head, low level" unit={u("head")} name="staticLow" def={f.staticLow} errors={errors} hint="Discharge surface minus suction surface, least lift" />
        <In label="Static head, high level" unit={u("head")} name="staticHigh" def={f.staticHigh} errors={errors} hint="…most lift" />
        <In label="Pressure difference" unit={u("pressure")} name="pressureDifference" def={f.pressureDifference} errors={errors} hint="Discharge minus suction surface, gauge" />
        <In label="Control head (closed loop)" unit={u("head")} name="controlHead" def={f.controlHead} errors={errors} />
      </div>
      <h3 className="pt-2 text-sm font-semibold">Suction conditions (NPSH available)</h3>
      <div className="grid grid-cols-2 gap-3">
        <In label="Suction surface pressure (abs.)" unit={u("pressure")} name="suctionSurfacePressure" def={f.suctionSurfacePressure} errors={errors} />
        <In label="Surface above pump" unit={u("head")} name="suctionStaticHead" def={f.suctionStaticHead} errors={errors} hint="Negative for a suction lift" />
      </div>
    </section>
  );
}
