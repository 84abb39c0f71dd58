import * as v from "valibot";
import { data, Form, redirect, useActionData, useLoaderData, useNavigation } from "react-router";
import type { Route } from "./+types/field.selections.$id";
import { requireMember } from "~/lib/auth/guards.server";
import { viewerOf } from "~/lib/auth/viewer.server";
import { QueryId, readId, readFormSafe, readQuery } from "~/lib/shared/forms.server";
import { can } from "~/lib/auth/permissions";
import {
  checkHistory,
  gradeById,
  getFieldCheck,
  PhotoRejected,
  readPhotos,
  recordFieldCheck,
} from "~/lib/fieldchecks.server";
import {
  blankFields,
  DEFAULT_GRADE,
  MAX_PHOTOS,
  DIAMETER_UNITS,
  ELEVATION_UNITS,
  FLOW_UNITS,
  parseCheckFields,
  POWER_UNITS,
  PRESSURE_UNITS,
  TEMPERATURE_UNITS,
  type CheckFields,
} from "~/lib/fieldcheck-form";
import { EngineInputError, TOLERANCE_GRADES, unitLabel, type Quantity } from "~/engine";
import { fmtFlow, fmtHead, type UnitSystem } from "~/components/units";
import { FieldCaution, GradeTable, VerdictBadge } from "~/components/fieldcheck";

// GET /field/selections/:id — the check form (phone first) and the selection's check history.
// POST /field/selections/:id/photos (same module; the path ends in /photos for the 12 MB body limit)
// — records a check with its photos, or an amendment (field `amends`) as a new version.

export const meta: Route.MetaFunction = ({ data }) => [{ title: `Field check · ${data?.selection.title ?? "Selection"} · Dutymark` }];

export async function loader({ request, params }: Route.LoaderArgs) {
  const m = await requireMember(request, "fieldcheck.read");
  const viewer = viewerOf(m);
  const id = readId(params.id);
  const h = await checkHistory(viewer, id);
  const sel = h.selection;
  const f = sel.frozen;
  const sys = m.user.unitSystem as UnitSystem;
  const url = new URL(request.url);
  let fields: CheckFields = blankFields(sys, {
    suction: f.system.input.runs.find((r) => r.side === "suction")?.diameter,
    discharge: f.system.input.runs.find((r) => r.side === "discharge")?.diameter,
  });
  fields.temperature = sys === "US" ? String(Math.round(f.system.input.temperatureC * 1.8 + 32)) : String(f.system.input.temperatureC);
  fields.gradeId = DEFAULT_GRADE;
  let amends: { id: number; version: number } | null = null;
  const { amend: amendId } = readQuery(url, v.object({ amend: QueryId }));
  if (amendId) {
    const c = await getFieldCheck(viewer, amendId);
    if (c.check.selectionId !== sel.id) throw data("That check belongs to another selection.", { status: 404 });
    if (!c.mayAmend) throw data("Only the workspace that recorded a check may amend it.", { status: 403 });
    fields = { ...c.fields, gradeId: c.check.grade, notes: c.check.notes };
    amends = { id: c.check.id, version: c.check.version };
  }
  return {
    selection: {
      id: sel.id,
      title: sel.title,
      projectName: sel.projectName,
      systemName: sel.systemName,
      ownerWorkspace: sel.ownerWorkspace,
      own: sel.own,
      pump: f.pump.label,
      speed: f.pump.speed != null ? f.pump.speed * (f.adjustment.method === "speed" ? (f.result?.ratio ?? 1) : 1) : null,
      duty: f.system.input.duty,
      arrangement: f.adjustment.arrangement,
      dutyPumps: f.adjustment.dutyPumps,
    },
    history: h.checks.map((c) => ({ id: c.id, version: c.version, superseded: c.superseded, verdict: c.verdict, grade: c.grade, createdAt: c.createdAt, byName: c.byName, byWorkspace: c.byWorkspace, flow: c.result.delivered.flow, head: c.result.delivered.head, flowSource: c.result.engine.flowSource })),
    fields,
    amends,
    mayWrite: can(m.role, "fieldcheck.write"),
    unitSystem: sys,
  };
}

export async function action({ request, params }: Route.ActionArgs) {
  const m = await requireMember(request, "fieldcheck.write");
  const viewer = viewerOf(m);
  const id = readId(params.id);
  let form: FormData;
  try {
    form = await readFormSafe(request);
  } catch {
    return data({ errors: { _form: "The form could not be read (is it larger than 12 MB in all?)." } as Record<string, string>, fields: {} as CheckFields }, { status: 400 });
  }
  const raw: Record<string, string> = {};
  for (const [k, val] of form.entries()) if (typeof val === "string") raw[k] = val;
  const parsed = parseCheckFields(raw);
  const gradeId = raw.gradeId && gradeById(raw.gradeId) ? raw.gradeId : null;
  const amends = raw.amends && /^\d{1,15}$/.test(raw.amends) ? Number(raw.amends) : null;
  const errors: Record<string, string> = parsed.ok ? {} : { ...parsed.errors };
  if (!gradeId) errors.gradeId = "Choose a tolerance grade from the table.";
  const { photos: _p, ...fields } = parsed.fields as CheckFields & { photos?: string };
  if (!parsed.ok || !gradeId) return data({ errors, fields }, { status: 400 });
  try {
    const photos = await readPhotos(form.getAll("photos"));
    const { amends: _a, gradeId: _g, notes: _n, ...kept } = fields;
    const r = await recordFieldCheck(viewer, id, { readings: parsed.readings, fields: kept, notes: parsed.notes, gradeId, amends }, photos);
    throw redirect(`/field/checks/${r.id}?recorded=1`);
  } catch (e) {
    if (e instanceof PhotoRejected) return data({ errors: { photos: e.message }, fields }, { status: 422 });
    if (e instanceof EngineInputError) return data({ errors: { _form: `These readings cannot be worked out: ${e.message}.` }, fields }, { status: 422 });
    throw e;
  }
}

function Err({ e, name }: { e?: Record<string, string>; name: string }) {
  return e?.[name] ? (
    <p id={`${name}-err`} className="text-sm text-fail">
      {e[name]}
    </p>
  ) : null;
}

function UnitSelect({ name, q, units, value, label }: { name: string; q: Quantity; units: readonly string[]; value: string; label: string }) {
  return (
    <label className="block text-sm">
      <span className="label">{label}</span>
      <select name={name} defaultValue={value} className="field">
        {units.map((u) => (
          <option key={u} value={u}>
            {unitLabel(q, u)}
          </option>
        ))}
      </select>
    </label>
  );
}

function Num({ name, label, f, e, hint, optional }: { name: string; label: string; f: CheckFields; e?: Record<string, string>; hint?: string; optional?: boolean }) {
  return (
    <label className="block text-sm">
      <span className="label">
        {label}
        {optional ? <span className="font-normal text-slate-500"> (optional)</span> : null}
      </span>
      <input
        name={name}
        defaultValue={f[name] ?? ""}
        inputMode="decimal"
        autoComplete="off"
        className="field w-full"
        aria-invalid={e?.[name] ? true : undefined}
        aria-describedby={e?.[name] ? `${name}-err` : undefined}
      />
      {hint ? <span className="text-xs text-slate-500">{hint}</span> : null}
      <Err e={e} name={name} />
    </label>
  );
}

export default function FieldSelection() {
  const d = useLoaderData<typeof loader>();
  const a = useActionData<typeof action>();
  const nav = useNavigation();
  const f: CheckFields = a?.fields && Object.keys(a.fields).length ? (a.fields as CheckFields) : d.fields;
  const e = a?.errors as Record<string, string> | undefined;
  const s = d.selection;
  const sys = d.unitSystem;
  const p = (k: string) => f[k] ?? "";
  return (
    <article className="mx-auto max-w-xl space-y-4">
      <header>
        <p className="text-sm">
          <a href="/field">Field checks</a> ›
        </p>
        <h1 className="text-xl font-bold text-brand-900">{s.title}</h1>
        <p className="text-sm text-slate-700">
          {s.projectName} · {s.systemName}
          {s.own ? "" : ` · shared by ${s.ownerWorkspace}`}
        </p>
        <dl className="mt-2 grid grid-cols-2 gap-x-3 gap-y-1 text-sm">
          <dt className="text-slate-600">Pump</dt>
          <dd>{s.pump}</dd>
          <dt className="text-slate-600">Design duty</dt>
          <dd>{s.duty ? `${fmtFlow(sys, s.duty.flow)} at ${fmtHead(sys, s.duty.head)}` : "not set"}</dd>
          <dt className="text-slate-600">Design speed</dt>
          <dd>{s.speed ? `${Math.round(s.speed)} rpm` : "not stated"}</dd>
          {s.arrangement !== "single" ? (
            <>
              <dt className="text-slate-600">Arrangement</dt>
              <dd>
                {s.dutyPumps} in {s.arrangement}: take readings across one pump
              </dd>
            </>
          ) : null}
        </dl>
      </header>

      <FieldCaution />

      {d.mayWrite ? (
        <Form method="post" action={`/field/selections/${s.id}/photos${d.amends ? `?amend=${d.amends.id}` : ""}`} encType="multipart/form-data" className="space-y-4" noValidate>
          {d.amends ? (
            <p className="panel text-sm">
              Amending check {d.amends.id} (version {d.amends.version}). The earlier version stays on record; this one becomes version {d.amends.version + 1}.
              <input type="hidden" name="amends" value={d.amends.id} />
            </p>
          ) : null}
          {e?._form ? (
            <p role="alert" className="caution">
              {e._form}
            </p>
          ) : e && Object.keys(e).length ? (
            <p role="alert" className="caution">
              Some readings need another look: see the messages below.
            </p>
          ) : null}

          <fieldset className="panel space-y-3">
            <legend className="font-semibold">Pressure gauges</legend>
            <UnitSelect name="pressureUnit" q="pressure" units={PRESSURE_UNITS} value={p("pressureUnit")} label="Pressure unit (both gauges and their accuracy)" />
            <div className="grid grid-cols-2 gap-3">
              <div className="space-y-2">
                <Num name="sPressure" label="Suction reading" f={f} e={e} />
                <label className="block text-sm">
                  <span className="label">Suction reference</span>
                  <select name="sRef" defaultValue={p("sRef")} className="field w-full">
                    <option value="gauge">gauge</option>
                    <option value="absolute">absolute</option>
                  </select>
                </label>
                <Num name="sAccuracy" label="Suction accuracy ±" f={f} e={e} optional />
              </div>
              <div className="space-y-2">
                <Num name="dPressure" label="Discharge reading" f={f} e={e} />
                <label className="block text-sm">
                  <span className="label">Discharge reference</span>
                  <select name="dRef" defaultValue={p("dRef")} className="field w-full">
                    <option value="gauge">gauge</option>
                    <option value="absolute">absolute</option>
                  </select>
                </label>
                <Num name="dAccuracy" label="Discharge accuracy ±" f={f} e={e} optional />
              </div>
            </div>
            <p className="text-xs text-slate-600">A vacuum reading on the suction side is a negative gauge pressure. Accuracy is the gauge's stated ± (e.g. 1 % of full scale).</p>
          </fieldset>

          <fieldset className="panel space-y-3">
            <legend className="font-semibold">Where the gauges are</legend>
            <div className="grid grid-cols-2 gap-3">
              <UnitSelect name="elevationUnit" q="length" units={ELEVATION_UNITS} value={p("elevationUnit")} label="Elevation unit" />
              <UnitSelect name="diameterUnit" q="diameter" units={DIAMETER_UNITS} value={p("diameterUnit")} label="Diameter unit" />
              <Num name="sElevation" label="Suction gauge elevation" f={f} e={e} />
              <Num name="dElevation" label="Discharge gauge elevation" f={f} e={e} />
              <Num name="sDiameter" label="Suction pipe inner diameter" f={f} e={e} />
              <Num name="dDiameter" label="Discharge pipe inner diameter" f={f} e={e} />
            </div>
            <p className="text-xs text-slate-600">Elevations of the gauge centres above one datum (e.g. the floor). Diameters are prefilled from the selection's pipe runs: change them to the pipe at each tap.</p>
          </fieldset>

          <fieldset className="panel space-y-3">
            <legend className="font-semibold">Flow</legend>
            <div className="grid grid-cols-2 gap-3">
              <Num name="flow" label="Flow meter reading" f={f} e={e} optional />
              <UnitSelect name="flowUnit" q="flow" units={FLOW_UNITS} value={p("flowUnit")} label="Flow unit" />
              <Num name="flowAccuracy" label="Meter accuracy ± %" f={f} e={e} optional />
            </div>
            <p className="text-xs text-slate-600">Without a flow meter the flow is inferred from the curve, with a band from the gauges' accuracy, and there is no tolerance verdict.</p>
          </fieldset>

          <fieldset className="panel space-y-3">
            <legend className="font-semibold">Speed</legend>
            <div className="flex gap-4 text-sm">
              <label>
                <input type="radio" name="speedMode" value="rpm" defaultChecked={p("speedMode") !== "vfd"} /> rpm measured
              </label>
              <label>
                <input type="radio" name="speedMode" value="vfd" defaultChecked={p("speedMode") === "vfd"} /> drive frequency
              </label>
            </div>
            <div className="grid grid-cols-2 gap-3">
              <Num name="rpm" label="Pump speed, rpm" f={f} e={e} optional hint="for 'rpm measured'" />
              <Num name="hz" label="Drive frequency, Hz" f={f} e={e} hint="for 'drive frequency'" optional />
              <Num name="baseHz" label="Motor base frequency, Hz" f={f} e={e} optional />
              <Num name="baseRpm" label="Motor base speed, rpm" f={f} e={e} optional hint="nameplate" />
            </div>
          </fieldset>

          <fieldset className="panel space-y-3">
            <legend className="font-semibold">Motor power (optional)</legend>
            <label className="block text-sm">
              <span className="label">Power measured as</span>
              <select name="powerMode" defaultValue={p("powerMode")} className="field w-full">
                <option value="none">not measured</option>
                <option value="input">input power (meter or drive)</option>
                <option value="electrical">volts, amps and power factor</option>
              </select>
            </label>
            <div className="grid grid-cols-2 gap-3">
              <Num name="power" label="Input power" f={f} e={e} optional />
              <UnitSelect name="powerUnit" q="power" units={POWER_UNITS} value={p("powerUnit")} label="Power unit" />
              <Num name="volts" label="Volts (line to line)" f={f} e={e} optional />
              <Num name="amps" label="Amps" f={f} e={e} optional />
              <Num name="powerFactor" label="Power factor" f={f} e={e} optional />
              <label className="block text-sm">
                <span className="label">Phases</span>
                <select name="phases" defaultValue={p("phases")} className="field w-full">
                  <option value="3">three-phase</option>
                  <option value="1">single-phase</option>
                </select>
              </label>
              <Num name="motorEfficiency" label="Motor efficiency %" f={f} e={e} optional hint="nameplate; gives pump efficiency" />
            </div>
          </fieldset>

          <fieldset className="panel space-y-3">
            <legend className="font-semibold">Fluid, grade, notes and photos</legend>
            <div className="grid grid-cols-2 gap-3">
              <Num name="temperature" label="Fluid temperature" f={f} e={e} />
              <UnitSelect name="temperatureUnit" q="temperature" units={TEMPERATURE_UNITS} value={p("temperatureUnit")} label="Temperature unit" />
            </div>
            <label className="block text-sm">
              <span className="label">Tolerance grade</span>
              <select name="gradeId" defaultValue={p("gradeId") || DEFAULT_GRADE} className="field w-full">
                {TOLERANCE_GRADES.map((g) => (
                  <option key={g.id} value={g.id}>
                    {g.id}: flow −{(g.flow[0] * 100).toFixed(0)}/+{(g.flow[1] * 100).toFixed(0)} %, head −{(g.head[0] * 100).toFixed(0)}/+{(g.head[1] * 100).toFixed(0)} %
                  </option>
                ))}
              </select>
              <Err e={e} name="gradeId" />
            </label>
            <GradeTable />
            <label className="block text-sm">
              <span className="label">Notes</span>
              <textarea name="notes" defaultValue={p("notes")} rows={3} className="field w-full" maxLength={4000} />
              <Err e={e} name="notes" />
            </label>
            <label className="block text-sm">
              <span className="label">Photos</span>
              <input type="file" name="photos" accept="image/jpeg,image/png,image/webp" multiple className="block w-full text-sm" />
              <span className="text-xs text-slate-500">
                JPEG, PNG or WebP; up to {MAX_PHOTOS} photos, 8 MB each, 12 MB in one submission.
                {d.amends ? " Photos of the earlier version are carried over." : ""}
              </span>
              <Err e={e} name="photos" />
            </label>
          </fieldset>

          <button type="submit" className="btn w-full" disabled={nav.state === "submitting"}>
            {nav.state === "submitting" ? "Working out…" : d.amends ? "Record the amendment" : "Record the check"}
          </button>
          <p className="text-xs text-slate-600">A recorded check is not edited: an amendment makes a new version, and the engineer of the project is told by e-mail.</p>
        </Form>
      ) : (
        <p className="panel text-sm">Your role can read field checks but not record them.</p>
      )}

      <section className="panel">
        <div className="flex items-center justify-between gap-2">
          <h2 className="font-semibold">History</h2>
          {d.history.length ? (
            <a className="btn-quiet" href={`/field/selections/${s.id}/export.csv`}>
              CSV
            </a>
          ) : null}
        </div>
        {d.history.length === 0 ? (
          <p className="mt-2 text-sm text-slate-600">No checks recorded on this selection yet.</p>
        ) : (
          <ul className="mt-2 divide-y divide-slate-100 text-sm">
            {d.history.map((c) => (
              <li key={c.id} className="flex flex-wrap items-center justify-between gap-2 py-2">
                <a href={`/field/checks/${c.id}`}>
                  Check {c.id} v{c.version} · {c.createdAt.slice(0, 16).replace("T", " ")}
                  {c.superseded ? " (amended later)" : ""}
                </a>
                <span className="text-slate-600">
                  {c.flow != null ? fmtFlow(sys, c.flow) : "—"} at {fmtHead(sys, c.head)}
                  {c.flowSource === "measured" ? "" : " (flow inferred)"}
                </span>
                <VerdictBadge verdict={c.verdict} grade={c.grade} />
              </li>
            ))}
          </ul>
        )}
      </section>
    </article>
  );
}
