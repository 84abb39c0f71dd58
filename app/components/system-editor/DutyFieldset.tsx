// The duty section of the editor: duty point, margins, hours, tariff, the verdict's flow band,
// and the check of the duty head against the system curve.
import { labelOf } from "~/lib/shared/units";
import type { DutyCheck } from "~/lib/projects/hydraulics";
import { NumberField as In } from "./NumberField";
import type { FieldsetProps } from "./types";

export function DutyFieldset({ f, errors, unitSystem, currency, dutyCheck }: FieldsetProps & { currency: string; dutyCheck: DutyCheck | null | undefined }) {
  const u = (q: Parameters<typeof labelOf>[1]) => labelOf(unitSystem, q);
  return (
    <section className="panel space-y-3">
      <h2 className="font-semibold">Duty point</h2>
      <div className="grid grid-cols-2 gap-3">
        <In label="Flow" unit={u("flow")} name="dutyFlow" def={f.dutyFlow} errors={errors} />
        <In label="Head" unit={u("head")} name="dutyHead" def={f.dutyHead} errors={errors} />
        <In label="Largest flow drawn" unit={u("flow")} name="flowMax" def={f.flowMax} errors={errors} hint="Blank: from the duty and pumps" />
        <In label="NPSH margin ratio" name="npshMargin" def={f.npshMargin} errors={errors} hint="NPSHa/NPSHr wanted, 1.1–2.5 by application (ANSI/HI 9.6.1)" />
        <In label="Operating hours per year" unit="h" name="hoursPerYear" def={f.hoursPerYear} errors={errors} hint="Blank or 0: not given (no energy cost, no life-cycle cost)" />
        <In label="Energy tariff" unit={`${currency} per kWh`} name="tariffPerKWh" def={f.tariffPerKWh} errors={errors} hint="Workspace currency (set on the workspace page); blank or 0: not given" />
        <In label="Flow tolerance below the duty" unit="%" name="tolMinus" def={f.tolMinus} errors={errors} hint="Verdict: the pump must deliver at least the duty flow less this" />
        <In label="Flow tolerance above the duty" unit="%" name="tolPlus" def={f.tolPlus} errors={errors} hint="More than this above the duty: oversized" />
      </div>
      {dutyCheck ? (
        <div className={`rounded-md border p-2 text-xs ${dutyCheck.differs ? "border-amber-400 bg-amber-50" : "border-slate-200"}`} data-testid="duty-check" data-differs={dutyCheck.differs ? "yes" : "no"}>
          <p>
            {dutyCheck.differs ? "▲ " : ""}
            {dutyCheck.message}
          </p>
          <p className="mt-1 text-slate-600">{dutyCheck.governs}</p>
        </div>
      ) : null}
    </section>
  );
}
