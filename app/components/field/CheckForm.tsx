// The field-check form, phone first. Without JavaScript it posts to the page (the server records
// and redirects). With JavaScript every check is first kept on the phone (IndexedDB, photos too),
// worked out there with the same engine, then sent with its device id; offline it waits to send.
import { useState, type FormEvent } from "react";
import { Form, useNavigation } from "react-router";
import { TOLERANCE_GRADES, unitLabel } from "~/engine";
import {
  DEFAULT_GRADE,
  DIAMETER_UNITS,
  ELEVATION_UNITS,
  FLOW_UNITS,
  gradeRule,
  photoLimitsText,
  photoProblem,
  POWER_ACCURACY_MAX_PCT,
  POWER_UNITS,
  PRESSURE_UNITS,
  TEMPERATURE_UNITS,
  temperatureRangeText,
  type CheckFields,
  type FrozenSelection,
} from "~/lib/fieldchecks";
import { GradeTable } from "../fieldcheck";
import { PageWorkspaceField } from "../forms";
import { ErrorSummary } from "./ErrorSummary";
import { GaugeInputs } from "./GaugeInputs";
import { BIG_INPUT, ChoiceSelect, FieldError, inputId, NumberField, UnitSelect, type Errors } from "./inputs";
import { putQueued, type QueuedCheck } from "./queue";
import { deviceId, sendWaiting } from "./sync";
import { checkOnPhone } from "./local-check";
import { renderUnits, type UnitChoice } from "~/lib/shared/units";

/** Field names as the summary at the top names them. */
const LABELS: Record<string, string> = {
  sPressure: "Suction reading", sAccuracy: "Suction accuracy", sElevation: "Suction gauge elevation", sDiameter: "Suction pipe inner diameter",
  dPressure: "Discharge reading", dAccuracy: "Discharge accuracy", dElevation: "Discharge gauge elevation", dDiameter: "Discharge pipe inner diameter",
  flow: "Flow meter reading", flowAccuracy: "Meter accuracy", rpm: "Pump speed", hz: "Drive frequency", baseHz: "Motor base frequency", baseRpm: "Motor base speed",
  power: "Input power", volts: "Volts", amps: "Amps", powerFactor: "Power factor", motorEfficiency: "Motor efficiency", powerAccuracy: "Power reading accuracy",
  temperature: "Fluid temperature", gradeId: "Tolerance grade", notes: "Notes", photos: "Photos",
};

export type FormSelection = { id: number; title: string; fingerprint: string; frozen: FrozenSelection };

type Props = {
  selection: FormSelection;
  /** "userId/workspaceId" of the signed-in contractor: the queue sends only their checks. */
  owner: string;
  /** The workspace the page showed: the check is recorded for it or refused (`PageWorkspaceField`). */
  workspaceId: number;
  /** The reader's units: messages worked out on the phone are rendered in them. */
  units: UnitChoice;
  fields: CheckFields;
  serverErrors: Errors;
  amends: { id: number; version: number; unreadable?: boolean; latest?: { id: number; version: number } | null } | null;
  onQueued: () => void;
};

export function CheckForm(props: Props) {
  const { selection, owner, fields, serverErrors, amends, onQueued } = props;
  const navigation = useNavigation();
  const [clientErrors, setClientErrors] = useState<Errors>(undefined);
  const [saved, setSaved] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const [units, setUnits] = useState({
    pressure: fields.pressureUnit || "kPa",
    elevation: fields.elevationUnit || "m",
    diameter: fields.diameterUnit || "mm",
    flow: fields.flowUnit || "m3/h",
    power: fields.powerUnit || "kW",
    temperature: fields.temperatureUnit || "C",
  });
  const errors = clientErrors ?? serverErrors;
  // The liquid the selection pumps decides the temperatures the form takes (water: the engine's table range).
  const liquid = selection.frozen.system.input.fluid;
  const value = (key: string) => fields[key] ?? "";
  const gaugeUnits = { pressure: unitLabel("pressure", units.pressure), elevation: unitLabel("length", units.elevation), diameter: unitLabel("diameter", units.diameter) };

  async function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = event.currentTarget;
    const data = new FormData(form);
    const raw: Record<string, string> = {};
    for (const [key, entry] of data.entries()) if (typeof entry === "string") raw[key] = entry;
    const files = data.getAll("photos").filter((f): f is File => f instanceof File && f.size > 0);
    // The server's own reading of the fields (a total head at or below zero refused at the discharge reading), then the
    // check worked out here; photos as the server holds them (photo-limits.ts): never queued to be refused whole.
    const checked = checkOnPhone(raw, selection.frozen, props.units, photoProblem(files));
    if (!checked.ok) {
      setClientErrors(checked.errors);
      return;
    }
    const local = checked.local;
    setClientErrors({});
    setBusy(true);
    const takenAt = new Date().toISOString();
    const check: QueuedCheck = {
      clientId: deviceId(),
      owner,
      selectionId: selection.id,
      selectionTitle: selection.title,
      basedOn: selection.fingerprint,
      fields: raw,
      photos: files.map((f) => ({ name: f.name, type: f.type, blob: f })),
      createdAt: takenAt,
      local,
      // The selection worked against: the queue works the readings out again with the phone's engine on every page (pending-shown.ts).
      frozen: selection.frozen,
      status: "waiting",
    };
    try {
      await putQueued(check);
    } catch {
      // No IndexedDB (private mode, full disk): the plain form post still records it online, with the phone's time.
      setBusy(false);
      const taken = document.createElement("input");
      Object.assign(taken, { type: "hidden", name: "takenAt", value: takenAt });
      form.append(taken);
      form.submit();
      return;
    }
    form.reset();
    onQueued();
    const sent = navigator.onLine ? await sendWaiting(owner) : [];
    setBusy(false);
    const mine = sent.find((s) => s.clientId === check.clientId);
    if (mine) {
      // A full load, not a client navigation: the address and the page change together (a client
      // navigation pushes the address before a slow phone has drawn the new page).
      window.location.assign(`/field/checks/${mine.id}?recorded=1`);
      return;
    }
    onQueued();
    setSaved(`Kept on this phone: ${renderUnits(local.verdictText, props.units)} as worked out here. It is waiting to send and goes to the server when there is a network.`);
  }

  const submitting = busy || navigation.state === "submitting";
  return (
    <Form
      method="post"
      action={`/field/selections/${selection.id}/photos${amends ? `?amend=${amends.id}` : ""}`}
      encType="multipart/form-data"
      className="space-y-4"
      noValidate
      onSubmit={onSubmit}
    >
      <PageWorkspaceField id={props.workspaceId} />
      <ErrorSummary errors={errors} labels={LABELS} />
      {saved ? (
        <p role="status" className="panel text-sm">
          {saved}
        </p>
      ) : null}
      {amends ? (
        <p className="panel text-sm">
          Amending check {amends.id} (version {amends.version}). The earlier version stays on record; this one becomes version {amends.version + 1}.
          {amends.unreadable ? " Its stored record cannot be read, so the form starts blank: enter the readings again." : ""}
          {amends.latest ? (
            <strong className="block font-semibold text-fail">
              Version {amends.version} is no longer the latest: version {amends.latest.version} (check {amends.latest.id}) was recorded since, and only the latest version may be
              amended. <a href={`/field/selections/${selection.id}?amend=${amends.latest.id}`}>Amend version {amends.latest.version} instead</a>.
            </strong>
          ) : null}
          <input type="hidden" name="amends" value={amends.id} />
        </p>
      ) : null}

      <fieldset className="panel space-y-3">
        <legend className="font-semibold">Units</legend>
        <UnitSelect name="pressureUnit" quantity="pressure" units={PRESSURE_UNITS} value={value("pressureUnit")} label="Pressure unit (both gauges and their accuracy)" onChange={(u) => setUnits((s) => ({ ...s, pressure: u }))} />
        <div className="grid grid-cols-2 gap-3">
          <UnitSelect name="elevationUnit" quantity="length" units={ELEVATION_UNITS} value={value("elevationUnit")} label="Elevation unit" onChange={(u) => setUnits((s) => ({ ...s, elevation: u }))} />
          <UnitSelect name="diameterUnit" quantity="diameter" units={DIAMETER_UNITS} value={value("diameterUnit")} label="Diameter unit" onChange={(u) => setUnits((s) => ({ ...s, diameter: u }))} />
        </div>
        <p className="text-xs text-slate-600">
          A vacuum reading on the suction side is a negative gauge pressure. Accuracy is the gauge's stated ± (e.g. 1 % of full scale). Elevations are of the gauge
          centres above one datum (e.g. the floor); diameters are prefilled from the selection's pipe runs: change them to the pipe at each tap.
        </p>
      </fieldset>

      <GaugeInputs side="suction" fields={fields} errors={errors} units={gaugeUnits} />
      <GaugeInputs side="discharge" fields={fields} errors={errors} units={gaugeUnits} />

      <fieldset className="panel space-y-3">
        <legend className="font-semibold">Flow</legend>
        <UnitSelect name="flowUnit" quantity="flow" units={FLOW_UNITS} value={value("flowUnit")} label="Flow unit" onChange={(u) => setUnits((s) => ({ ...s, flow: u }))} />
        <NumberField name="flow" label="Flow meter reading" unit={unitLabel("flow", units.flow)} value={value("flow")} errors={errors} optional />
        <NumberField name="flowAccuracy" label="Meter accuracy ±" unit="%" value={value("flowAccuracy")} errors={errors} optional />
        <p className="text-xs text-slate-600">Without a flow meter the flow is inferred from the curve, with a band from the gauges' accuracy, and there is no tolerance verdict.</p>
      </fieldset>

      <fieldset className="panel space-y-3">
        <legend className="font-semibold">Speed</legend>
        <div className="flex flex-wrap gap-2 text-base">
          <label className="flex min-h-12 items-center gap-2 rounded-md border border-slate-300 px-3">
            <input type="radio" name="speedMode" value="rpm" defaultChecked={value("speedMode") !== "vfd"} className="size-5" /> rpm measured
          </label>
          <label className="flex min-h-12 items-center gap-2 rounded-md border border-slate-300 px-3">
            <input type="radio" name="speedMode" value="vfd" defaultChecked={value("speedMode") === "vfd"} className="size-5" /> drive frequency
          </label>
        </div>
        <NumberField name="rpm" label="Pump speed, rpm" unit="rpm" value={value("rpm")} errors={errors} optional hint="for 'rpm measured'" />
        <NumberField name="hz" label="Drive frequency, Hz" unit="Hz" value={value("hz")} errors={errors} optional hint="for 'drive frequency'" />
        <NumberField name="baseHz" label="Motor base frequency, Hz" unit="Hz" value={value("baseHz")} errors={errors} optional />
        <NumberField name="baseRpm" label="Motor base speed, rpm" unit="rpm" value={value("baseRpm")} errors={errors} optional hint="nameplate" />
      </fieldset>

      <fieldset className="panel space-y-3">
        <legend className="font-semibold">Motor power (optional)</legend>
        <ChoiceSelect name="powerMode" label="Power measured as" value={value("powerMode")}>
          <option value="none">not measured</option>
          <option value="input">input power (meter or drive)</option>
          <option value="electrical">volts, amps and power factor</option>
        </ChoiceSelect>
        <UnitSelect name="powerUnit" quantity="power" units={POWER_UNITS} value={value("powerUnit")} label="Power unit" onChange={(u) => setUnits((s) => ({ ...s, power: u }))} />
        <NumberField name="power" label="Input power" unit={unitLabel("power", units.power)} value={value("power")} errors={errors} optional />
        <NumberField name="volts" label="Volts (line to line)" unit="V" value={value("volts")} errors={errors} optional />
        <NumberField name="amps" label="Amps" unit="A" value={value("amps")} errors={errors} optional />
        <NumberField name="powerFactor" label="Power factor" unit="" value={value("powerFactor")} errors={errors} optional />
        <ChoiceSelect name="phases" label="Phases" value={value("phases")}>
          <option value="3">three-phase</option>
          <option value="1">single-phase</option>
        </ChoiceSelect>
        <NumberField name="motorEfficiency" label="Motor efficiency %" unit="%" value={value("motorEfficiency")} errors={errors} optional hint="nameplate; gives pump efficiency, and without it power and efficiency are not judged against the grade" />
        <NumberField
          name="powerAccuracy"
          label="Power reading accuracy ±"
          unit="%"
          value={value("powerAccuracy")}
          errors={errors}
          optional
          hint={`of the reading, 0 to ${POWER_ACCURACY_MAX_PCT} % (the meter's or drive's data sheet); a power or efficiency limit missed as read but met within it is marginal, not a fail — without it a limit is judged as read`}
        />
      </fieldset>

      <fieldset className="panel space-y-3">
        <legend className="font-semibold">Fluid, grade, notes and photos</legend>
        <UnitSelect name="temperatureUnit" quantity="temperature" units={TEMPERATURE_UNITS} value={value("temperatureUnit")} label="Temperature unit" onChange={(u) => setUnits((s) => ({ ...s, temperature: u }))} />
        <NumberField
          name="temperature"
          label="Fluid temperature"
          unit={unitLabel("temperature", units.temperature)}
          value={value("temperature")}
          errors={errors}
          hint={`${temperatureRangeText(liquid, units.temperature)} (${liquid.kind === "water" ? "the range water's properties are computed for" : "user-defined liquid"})`}
          last
        />
        <label className="block text-sm">
          <span className="label">Tolerance grade</span>
          <select id={inputId("gradeId")} name="gradeId" defaultValue={value("gradeId") || DEFAULT_GRADE} className={BIG_INPUT}>
            {TOLERANCE_GRADES.map((g) => (
              <option key={g.id} value={g.id}>
                {gradeRule(g, { withSource: false })}
              </option>
            ))}
          </select>
          <FieldError errors={errors} name="gradeId" />
        </label>
        <GradeTable />
        <label className="block text-sm">
          <span className="label">Notes</span>
          <textarea id={inputId("notes")} name="notes" defaultValue={value("notes")} rows={3} className="field w-full text-base" maxLength={4000} enterKeyHint="enter" />
          <FieldError errors={errors} name="notes" />
        </label>
        <label className="block text-sm">
          <span className="label">Photos</span>
          <input id={inputId("photos")} type="file" name="photos" accept="image/jpeg,image/png,image/webp" multiple className="block min-h-12 w-full text-base" />
          <span className="text-xs text-slate-600">
            JPEG, PNG or WebP; {photoLimitsText()}.
            {amends ? " Photos of the earlier version are carried over." : ""}
          </span>
          <FieldError errors={errors} name="photos" />
        </label>
      </fieldset>

      <button type="submit" className="btn min-h-12 w-full justify-center text-base" disabled={submitting}>
        {submitting ? "Working out…" : amends ? "Record the amendment" : "Record the check"}
      </button>
      <p className="text-xs text-slate-600">
        A recorded check is not edited: an amendment makes a new version, and the engineer of the project is told by e-mail. Without a network the check is
        kept on this phone and sent when the network returns.
      </p>
    </Form>
  );
}
