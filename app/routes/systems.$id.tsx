import * as v from "valibot";
import { useEffect, useMemo, useRef, useState } from "react";
import { Form, redirect, useActionData, useLoaderData, useNavigation } from "react-router";
import useSWR from "swr";
import type { Route } from "./+types/systems.$id";
import { requireMember } from "~/lib/auth/guards.server";
import { adjustCandidate, archiveSystem, copySystem, removeCandidate, saveSystem, selectCandidate, setCandidatePrice, systemWorkbench } from "~/lib/projects.server";
import { DEFAULT_ENERGY_SETTINGS, readPriceCents } from "~/lib/projects/energy";
import { viewerOf } from "~/lib/auth/viewer.server";
import { workspaceCurrency } from "~/lib/workspaces";
import { workbenchView, type WorkbenchView } from "~/lib/workbench-view";
import { can } from "~/lib/auth/permissions";
import { readId, formId, readFormSafe } from "~/lib/shared/forms.server";
import { AdjustmentSchema } from "~/lib/hydraulics";
import { EDITOR_FITTINGS, labelOf, MATERIAL_OPTIONS, readSystemForm, systemFormValues, type FormErrors, type UnitSystem } from "~/lib/system-form";
import { FormError, Notice } from "~/components/forms";
import { PipePicker } from "~/components/system-editor/PipePicker";
import { DutyCycleFieldset } from "~/components/system-editor/DutyCycleFieldset";
import { CandidateEnergyPanel } from "~/components/CandidateEnergy";
import { CandidateTable, RunTable, SizingCaution, WorkbenchChart } from "~/components/workbench";
import { fromSI, IE_CLASSES, toSI } from "~/engine";
import { routeErrorBoundary } from "~/components/RouteError";

export const meta: Route.MetaFunction = ({ data }) => [{ title: `${data?.name ?? "System"} · Dutymark` }];

export async function loader({ request, params }: Route.LoaderArgs) {
  const m = await requireMember(request, "project.read");
  const id = readId(params.id);
  const bench = await systemWorkbench(viewerOf(m), id);
  return {
    id,
    name: bench.system.name,
    project: { id: bench.system.projectId, name: bench.system.projectName },
    input: bench.system.input,
    view: workbenchView(bench),
    unitSystem: m.user.unitSystem as UnitSystem,
    canWrite: can(m.role, "project.write"),
    canSelect: can(m.role, "selection.write"),
    currency: await workspaceCurrency(m.workspace.id),
  };
}

export async function action({ request, params }: Route.ActionArgs) {
  const m = await requireMember(request, "project.read");
  const viewer = viewerOf(m);
  const id = readId(params.id);
  const form = await readFormSafe(request);
  const intent = String(form.get("intent") ?? "save");
  const needs = intent === "select" ? "selection.write" : "project.write";
  if (!can(m.role, needs)) throw new Response(`Your role (${m.role}) cannot do this.`, { status: 403 });
  const sys = m.user.unitSystem as UnitSystem;
  switch (intent) {
    case "save": {
      const { input, name, errors } = readSystemForm(form, sys);
      if (!input) return { errors, notice: null };
      await saveSystem(viewer, id, name, input);
      const structural = form.get("addRun") != null || [...form.keys()].some((k) => k.endsWith(".remove"));
      return { errors: {} as FormErrors, notice: structural ? "Pipe runs updated and saved." : "System saved." };
    }
    case "copy":
      throw redirect(`/systems/${await copySystem(viewer, id)}`);
    case "archive":
      throw redirect(`/projects/${await archiveSystem(viewer, id)}`);
    case "remove-candidate":
      await removeCandidate(viewer, formId(form, "candidateId"));
      return { errors: {}, notice: "Candidate removed." };
    case "adjust": {
      const candidateId = formId(form, "candidateId");
      const ratioRaw = String(form.get("ratio") ?? "").trim();
      const motorRaw = Number(String(form.get("motorRating") ?? "").replace(",", ".") || 0);
      const adj = v.safeParse(AdjustmentSchema, {
        method: form.get("method"),
        ratio: ratioRaw === "" ? null : Number(ratioRaw.replace(",", ".")) / 100,
        arrangement: form.get("arrangement"),
        dutyPumps: Number(form.get("dutyPumps") || 1),
        standbyPumps: Number(form.get("standbyPumps") || 0),
        motorRating: Number.isFinite(motorRaw) && motorRaw > 0 ? toSI("power", sys === "US" ? "hp" : "kW", motorRaw) : 0,
        serviceFactor: Number(String(form.get("serviceFactor") ?? "1").replace(",", ".") || 1),
        ieClass: form.get("ieClass") ?? undefined,
      });
      if (!adj.success) return { errors: { [`adj.${candidateId}`]: adj.issues.map((i) => i.message).join("; ") }, notice: null };
      await adjustCandidate(viewer, candidateId, adj.output);
      return { errors: {}, notice: "Candidate adjusted." };
    }
    case "price": {
      const candidateId = formId(form, "candidateId");
      const cents = readPriceCents(form.get("purchasePrice"));
      if (cents === undefined) return { errors: { [`price.${candidateId}`]: "The purchase price is a number ≥ 0 (blank clears it)." }, notice: null };
      await setCandidatePrice(viewer, candidateId, cents);
      return { errors: {}, notice: cents === null ? "Purchase price cleared." : "Purchase price set." };
    }
    case "select": {
      const candidateId = formId(form, "candidateId");
      const sid = await selectCandidate(viewer, candidateId, String(form.get("title") ?? "").slice(0, 200), String(form.get("note") ?? "").slice(0, 2000));
      throw redirect(`/selections/${sid}`);
    }
  }
  throw new Response("Unknown action.", { status: 400 });
}

async function postPreview([url, input]: [string, string]): Promise<WorkbenchView> {
  const res = await fetch(url, { method: "POST", headers: { "Content-Type": "application/json" }, body: JSON.stringify({ input: JSON.parse(input) }) });
  if (!res.ok) throw new Error((await res.json().catch(() => ({})))?.detail ?? `preview failed (${res.status})`);
  return res.json();
}

export default function SystemPage() {
  const d = useLoaderData<typeof loader>();
  const a = useActionData<typeof action>() as { errors?: FormErrors; notice?: string | null } | undefined;
  const nav = useNavigation();
  const formRef = useRef<HTMLFormElement>(null);
  const [draft, setDraft] = useState<string | null>(null);
  const [liveErrors, setLiveErrors] = useState<FormErrors>({});
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  // Live preview: while the engineer types, the form is read in the browser (same codec as the
  // server) and the unsaved inputs go to the preview API; swr keeps the last good answer.
  const { data: live, isValidating } = useSWR(draft ? [`/api/v1/systems/${d.id}/preview`, draft] : null, postPreview, { keepPreviousData: true, revalidateOnFocus: false });
  useEffect(() => setDraft(null), [d]);
  const onInput = () => {
    if (timer.current) clearTimeout(timer.current);
    timer.current = setTimeout(() => {
      if (!formRef.current) return;
      const r = readSystemForm(new FormData(formRef.current), d.unitSystem);
      setLiveErrors(r.errors);
      if (r.input) setDraft(JSON.stringify(r.input));
    }, 350);
  };
  const view = (draft && live) || d.view;
  const draftInput = useMemo(() => (draft ? JSON.parse(draft) : d.input), [draft, d.input]);
  const errors = { ...(a?.errors ?? {}), ...liveErrors };
  const f = systemFormValues(d.input, d.unitSystem);
  const u = (q: Parameters<typeof labelOf>[1]) => labelOf(d.unitSystem, q);
  const ro = !d.canWrite;
  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-end justify-between gap-2">
        <div>
          <p className="text-sm">
            <a href="/projects">Projects</a> › <a href={`/projects/${d.project.id}`}>{d.project.name}</a> ›
          </p>
          <h1 className="text-2xl font-bold text-brand-900">{d.name}</h1>
        </div>
        <div className="no-print flex gap-2">
          <a className="btn" href={`/systems/${d.id}/search`}>
            Find pumps for this duty
          </a>
        </div>
      </div>
      {a?.notice ? <Notice>{a.notice}</Notice> : null}
      <div className="grid gap-4 xl:grid-cols-[minmax(22rem,30rem)_1fr]">
        <Form method="post" ref={formRef} onInput={onInput} className="space-y-4" aria-label="System inputs">
          <fieldset disabled={ro} className="space-y-4">
            <section className="panel space-y-3">
              <h2 className="font-semibold">System</h2>
              <In label="Name" name="name" def={d.name} errors={errors} wide />
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
              {draftInput.fluid?.kind === "custom" || f.fluidKind === "custom" ? (
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

            <section className="panel space-y-3">
              <h2 className="font-semibold">Duty point</h2>
              <div className="grid grid-cols-2 gap-3">
                <In label="Flow" unit={u("flow")} name="dutyFlow" def={f.dutyFlow} errors={errors} />
                <In label="Head" unit={u("head")} name="dutyHead" def={f.dutyHead} errors={errors} />
                <In label="Largest flow drawn" unit={u("flow")} name="flowMax" def={f.flowMax} errors={errors} hint="Blank: from the duty and pumps" />
                <In label="NPSH margin ratio" name="npshMargin" def={f.npshMargin} errors={errors} hint="NPSHa/NPSHr wanted, 1.1–2.5 by application (ANSI/HI 9.6.1)" />
                <In label="Operating hours per year" unit="h" name="hoursPerYear" def={f.hoursPerYear} errors={errors} />
                <In label="Energy tariff" unit={`${d.currency} per kWh`} name="tariffPerKWh" def={f.tariffPerKWh} errors={errors} hint="Workspace currency (set on the workspace page)" />
                <In label="Flow tolerance below the duty" unit="%" name="tolMinus" def={f.tolMinus} errors={errors} hint="Verdict: the pump must deliver at least the duty flow less this" />
                <In label="Flow tolerance above the duty" unit="%" name="tolPlus" def={f.tolPlus} errors={errors} hint="More than this above the duty: oversized" />
              </div>
              {view.evaluation?.dutyCheck ? (
                <div className={`rounded-md border p-2 text-xs ${view.evaluation.dutyCheck.differs ? "border-amber-400 bg-amber-50" : "border-slate-200"}`} data-testid="duty-check" data-differs={view.evaluation.dutyCheck.differs ? "yes" : "no"}>
                  <p>{view.evaluation.dutyCheck.differs ? "▲ " : ""}{view.evaluation.dutyCheck.message}</p>
                  <p className="mt-1 text-slate-600">{view.evaluation.dutyCheck.governs}</p>
                </div>
              ) : null}
            </section>

            <DutyCycleFieldset energy={d.input.energy ?? DEFAULT_ENERGY_SETTINGS} hoursPerYear={d.input.hoursPerYear} errors={errors} currency={d.currency} />
            <section className="panel space-y-3">
              <h2 className="font-semibold">Pipe runs</h2>
              <input type="hidden" name="runCount" value={f.runs.length} />
              {f.runs.map((r, i) => (
                <fieldset key={i} className="space-y-2 rounded-md border border-slate-200 p-3">
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
                    <PipePicker index={i} table={r.table} nominal={r.nominal} unitSystem={d.unitSystem} error={errors[`run.${i}.nominal`]} />
                    <In label="Inner diameter" unit={u("diameter")} name={`run.${i}.diameter`} def={r.diameter} placeholder={r.diameterShown} errors={errors} hint={r.table ? "Used only without a table size (see above)." : undefined} />
                    <In label="Length" unit={u("length")} name={`run.${i}.length`} def={r.length} errors={errors} />
                    <div>
                      <label className="label" htmlFor={`f-run.${i}.material`}>
                        Material
                      </label>
                      <select id={`f-run.${i}.material`} name={`run.${i}.material`} defaultValue={r.material} className="field">
                        {MATERIAL_OPTIONS.map((m) => (
                          <option key={m.id} value={m.id}>
                            {m.name}
                          </option>
                        ))}
                      </select>
                    </div>
                    <In label="Extra ΣK" name={`run.${i}.extraK`} def={r.extraK} errors={errors} />
                    <In label="Roughness new" unit={u("roughness")} name={`run.${i}.roughness`} def={r.roughness} placeholder={r.roughnessPlaceholder} errors={errors} />
                    <In label="Roughness aged" unit={u("roughness")} name={`run.${i}.agedRoughness`} def={r.agedRoughness} placeholder={r.agedPlaceholder} errors={errors} />
                  </div>
                  <details className="text-sm" open={Object.keys(r.fittings).length > 0}>
                    <summary className="cursor-pointer font-semibold">Fittings (Crane TP-410 K values)</summary>
                    <div className="mt-2 grid grid-cols-2 gap-2">
                      {EDITOR_FITTINGS.map(([fid, label]) => (
                        <label key={fid} className="flex items-center justify-between gap-2 text-xs">
                          {label}
                          <input name={`run.${i}.fit.${fid}`} type="number" min={0} max={500} step={1} defaultValue={r.fittings[fid] ?? 0} className="field w-16 py-0.5" />
                        </label>
                      ))}
                    </div>
                  </details>
                  <label className="flex items-center gap-2 text-xs text-slate-600">
                    <input type="checkbox" name={`run.${i}.remove`} /> remove this run on save
                  </label>
                </fieldset>
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
            {!ro ? (
              <div className="sticky bottom-2 flex items-center gap-3">
                <button className="btn shadow-lg" name="intent" value="save">
                  {nav.state === "submitting" ? "Saving…" : "Save system"}
                </button>
                {draft ? <span className="text-xs text-slate-600">Chart shows unsaved changes{isValidating ? " (updating…)" : ""}</span> : null}
              </div>
            ) : null}
          </fieldset>
        </Form>

        <div className="space-y-4">
          <section className="panel space-y-3">
            <h2 className="font-semibold">System curve{view.candidates.length ? " and candidates" : ""}</h2>
            {view.systemError ? <FormError error={`The system cannot be computed: ${view.systemError}`} /> : null}
            <WorkbenchChart view={view} unitSystem={d.unitSystem} duty={draftInput.duty} title={`${d.name}: head against flow`} />
            {view.evaluation?.warnings.length ? (
              <ul className="text-xs text-duty-ink">
                {view.evaluation.warnings.map((w, i) => (
                  <li key={i}>▲ {w}</li>
                ))}
              </ul>
            ) : null}
            <RunTable view={view} unitSystem={d.unitSystem} />
            <SizingCaution />
          </section>
          <section className="panel space-y-3">
            <h2 className="font-semibold">Candidates</h2>
            {view.candidates.length === 0 ? (
              <p className="text-sm text-slate-600">
                No candidates yet. <a href={`/systems/${d.id}/search`}>Search the libraries open to you</a> for pumps that meet the duty.
              </p>
            ) : (
              <CandidateTable
                view={view}
                unitSystem={d.unitSystem}
                actions={(c) =>
                  d.canWrite || d.canSelect ? (
                    <div className="space-y-2">
                      {d.canWrite ? <AdjustForm c={c} unitSystem={d.unitSystem} error={errors[`adj.${c.id}`]} /> : null}
                      {d.canSelect && c.result?.operating ? (
                        <Form method="post" className="space-y-1">
                          <input type="hidden" name="candidateId" value={c.id} />
                          <input name="title" className="field py-0.5 text-xs" placeholder="Selection title" defaultValue={c.label} aria-label={`Title for selecting ${c.label}`} />
                          <button className="btn w-full justify-center" name="intent" value="select">
                            Select this pump
                          </button>
                        </Form>
                      ) : null}
                      {d.canWrite ? (
                        <Form method="post">
                          <input type="hidden" name="candidateId" value={c.id} />
                          <button className="text-xs text-slate-600 underline" name="intent" value="remove-candidate">
                            remove
                          </button>
                        </Form>
                      ) : null}
                    </div>
                  ) : null
                }
              />
            )}
          </section>
          <CandidateEnergyPanel candidates={view.candidates} unitSystem={d.unitSystem} currency={d.currency} canWrite={d.canWrite} errors={errors} />
          {d.canWrite ? (
            <div className="no-print flex gap-2">
              <Form method="post">
                <button className="btn-quiet" name="intent" value="copy">
                  Copy system
                </button>
              </Form>
              <Form method="post">
                <button className="btn-quiet" name="intent" value="archive">
                  Archive system
                </button>
              </Form>
            </div>
          ) : null}
        </div>
      </div>
    </div>
  );
}

function AdjustForm({ c, unitSystem, error }: { c: WorkbenchView["candidates"][number]; unitSystem: UnitSystem; error?: string }) {
  const a = c.adjustment;
  return (
    <Form method="post" className="space-y-1 text-xs">
      <input type="hidden" name="candidateId" value={c.id} />
      <label className="block">
        Adjust by
        <select name="method" defaultValue={a.method} className="field py-0.5 text-xs">
          <option value="none">nothing (as published)</option>
          <option value="speed">speed (VFD)</option>
          <option value="trim">impeller trim</option>
        </select>
      </label>
      <label className="block">
        Ratio % (blank: solve for the duty)
        <input name="ratio" inputMode="decimal" defaultValue={a.ratio != null ? String(+(a.ratio * 100).toFixed(2)) : ""} className="field py-0.5 text-xs" />
      </label>
      <label className="block">
        Pumps
        <select name="arrangement" defaultValue={a.arrangement} className="field py-0.5 text-xs">
          <option value="single">one pump</option>
          <option value="parallel">in parallel</option>
          <option value="series">in series</option>
        </select>
      </label>
      <div className="flex gap-1">
        <label className="block">
          duty
          <input name="dutyPumps" type="number" min={1} max={8} defaultValue={a.dutyPumps} className="field w-14 py-0.5 text-xs" />
        </label>
        <label className="block">
          standby
          <input name="standbyPumps" type="number" min={0} max={8} defaultValue={a.standbyPumps} className="field w-14 py-0.5 text-xs" />
        </label>
      </div>
      <div className="flex gap-1">
        <label className="block">
          motor {unitSystem === "US" ? "hp" : "kW"} (blank: suggested)
          <input name="motorRating" inputMode="decimal" defaultValue={a.motorRating > 0 ? String(+fromSI("power", unitSystem === "US" ? "hp" : "kW", a.motorRating).toFixed(2)) : ""} className="field w-16 py-0.5 text-xs" />
        </label>
        <label className="block">
          service factor
          <input name="serviceFactor" inputMode="decimal" defaultValue={a.serviceFactor} className="field w-14 py-0.5 text-xs" />
        </label>
        <label className="block">
          class
          <select name="ieClass" defaultValue={a.ieClass ?? "IE3"} className="field py-0.5 text-xs">
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

function In({ label, name, def, errors, unit, hint, wide, placeholder }: { label: string; name: string; def: string; errors: FormErrors; unit?: string; hint?: string; wide?: boolean; placeholder?: string }) {
  const id = `f-${name}`;
  const err = errors[name];
  return (
    <div className={wide ? "col-span-2" : ""}>
      <label htmlFor={id} className="label">
        {label}
        {unit ? <span className="ml-1 font-normal normal-case text-slate-500">({unit})</span> : null}
      </label>
      <input id={id} name={name} defaultValue={def} placeholder={placeholder} inputMode="decimal" className="field" aria-invalid={err ? true : undefined} aria-describedby={err ? `${id}-err` : undefined} />
      {err ? (
        <p id={`${id}-err`} className="text-xs text-fail" role="alert">
          {err}
        </p>
      ) : hint ? (
        <p className="text-xs text-slate-500">{hint}</p>
      ) : null}
    </div>
  );
}

export const ErrorBoundary = routeErrorBoundary({ what: "this system", back: { href: "/projects", label: "Your projects" } });
