// Tests only: the system editor's fields for a stored input as the page posts them unchanged (systemFormValues read back
// into the form's names), with no energy.* field — the tests add those they need. Used by the editor's save tests.
import type { SystemInput } from "~/lib/projects/hydraulics";
import { systemFormValues } from "~/lib/projects/system-form";
import { SI_UNITS } from "~/lib/shared/units";

/** The editor's fields for `input` (SI units), runs numbered from 0 in its order; `name` the system's name. */
export function editorPost(input: SystemInput, name: string): Record<string, string> {
  const f = systemFormValues(input, SI_UNITS);
  const out: Record<string, string> = {
    intent: "save", name, fluidKind: "water", temperature: f.temperature, mode: f.mode, staticLow: f.staticLow, staticHigh: f.staticHigh,
    pressureDifference: f.pressureDifference, suctionSurfacePressure: f.suctionSurfacePressure, suctionStaticHead: f.suctionStaticHead,
    dutyFlow: f.dutyFlow, dutyHead: f.dutyHead, npshMargin: f.npshMargin, hoursPerYear: f.hoursPerYear, tariffPerKWh: f.tariffPerKWh, runCount: String(f.runs.length),
  };
  f.runs.forEach((r, i) => {
    const p = `run.${i}.`;
    Object.assign(out, { [`${p}side`]: r.side, [`${p}name`]: r.name, [`${p}table`]: r.table, [`${p}nominal`]: r.nominal, [`${p}diameter`]: r.diameter, [`${p}length`]: r.length, [`${p}material`]: r.material, [`${p}materialShown`]: r.materialShown });
  });
  return out;
}
