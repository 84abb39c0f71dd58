// One pressure gauge as read on site (suction or discharge): the reading, its reference, its
// accuracy, where it sits and the pipe at the tap. The same component for both sides.
import { ChoiceSelect, NumberField, type Errors } from "./inputs";
import type { CheckFields } from "~/lib/fieldchecks";

export type GaugeUnits = { pressure: string; elevation: string; diameter: string };

export function GaugeInputs({ side, fields, errors, units }: { side: "suction" | "discharge"; fields: CheckFields; errors: Errors; units: GaugeUnits }) {
  const prefix = side === "suction" ? "s" : "d";
  const Side = side === "suction" ? "Suction" : "Discharge";
  const value = (key: string) => fields[key] ?? "";
  return (
    <fieldset className="panel space-y-3">
      <legend className="font-semibold">{Side} gauge</legend>
      <NumberField name={`${prefix}Pressure`} label={`${Side} reading`} unit={units.pressure} value={value(`${prefix}Pressure`)} errors={errors} />
      <ChoiceSelect name={`${prefix}Ref`} label={`${Side} reference`} value={value(`${prefix}Ref`)}>
        <option value="gauge">gauge</option>
        <option value="absolute">absolute</option>
      </ChoiceSelect>
      <NumberField name={`${prefix}Accuracy`} label={`${Side} accuracy ±`} unit={units.pressure} value={value(`${prefix}Accuracy`)} errors={errors} optional />
      <NumberField name={`${prefix}Elevation`} label={`${Side} gauge elevation`} unit={units.elevation} value={value(`${prefix}Elevation`)} errors={errors} />
      <NumberField name={`${prefix}Diameter`} label={`${Side} pipe inner diameter`} unit={units.diameter} value={value(`${prefix}Diameter`)} errors={errors} />
    </fieldset>
  );
}
