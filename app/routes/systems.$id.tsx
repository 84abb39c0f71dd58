import { useEffect, useMemo, useRef, useState } from "react";
import { data, Form, redirect, useActionData, useLoaderData, useNavigation } from "react-router";
import useSWR from "swr";
import type { Route } from "./+types/systems.$id";
import { requireMember } from "~/lib/auth/guards.server";
import { adjustCandidate, archiveSystem, copySystem, problemFieldErrors, removeCandidate, saveSystem, selectCandidate, setCandidatePrice, storedForEditor, systemPage } from "~/lib/projects";
import { DEFAULT_ENERGY_SETTINGS, readPriceCents } from "~/lib/projects/energy";
import { viewerOf } from "~/lib/auth/viewer.server";
import { workspaceCurrency } from "~/lib/workspaces";
import { workbenchView, type WorkbenchView } from "~/lib/projects/workbench-view";
import { can } from "~/lib/auth/permissions";
import { readId, formId, readFormSafe } from "~/lib/shared/forms.server";
import { readAdjustForm } from "~/lib/projects/adjust-form";
import { readSystemForm, systemFormValues, type FormErrors } from "~/lib/projects/system-form";
import { ADJUST_FIELDS, PRICE_FIELDS, typedCandidateForm, typedFields, typedOver, type TypedForm, type TypedFields } from "~/lib/projects/typed-back";
import { FormError, Notice } from "~/components/forms";
import { SystemFieldset } from "~/components/system-editor/SystemFieldset";
import { DutyFieldset } from "~/components/system-editor/DutyFieldset";
import { RunsFieldset } from "~/components/system-editor/RunsFieldset";
import { CandidateActions } from "~/components/system-editor/CandidateActions";
import { CandidatesNeedingReview } from "~/components/system-editor/CandidatesNeedingReview";
import { DutyCycleFieldset } from "~/components/system-editor/DutyCycleFieldset";
import { useUnsavedChanges } from "~/components/system-editor/useUnsavedChanges";
import { LeaveQuestion } from "~/components/system-editor/LeaveQuestion";
import { StoredInputReview } from "~/components/system-editor/StoredInputReview";
import { ReadOnlyNotice } from "~/components/ReadOnlyNotice";
import { CandidateEnergyPanel } from "~/components/CandidateEnergy";
import { RunTable, SizingCaution, SystemWarnings, WorkbenchChart } from "~/components/workbench";
import { CandidateTable } from "~/components/CandidateTable";
import { routeErrorBoundary } from "~/components/RouteError";
import { PageHead } from "~/components/PageHead";
import { PostButton } from "~/components/PostButton";
import { renderDeep } from "~/lib/shared/units";

export const meta: Route.MetaFunction = ({ data }) => [{ title: `${data?.name ?? "System"} · Dutymark` }];

export async function loader({ request, params }: Route.LoaderArgs) {
  const m = await requireMember(request, "project.read");
  const id = readId(params.id);
  const { system, bench, review } = await systemPage(viewerOf(m), id);
  return {
    id,
    name: system.name,
    project: { id: system.projectId, name: system.projectName },
    input: system.input,
    // Stored inputs that do not pass the checks: what is wrong (in the list and beside the fields) and nothing computed.
    review: review ? renderDeep({ ...review, fields: problemFieldErrors(review.problems) }, m.user.units) : null,
    view: bench ? renderDeep(workbenchView(bench), m.user.units) : null,
    unitSystem: m.user.units,
    role: m.role,
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
  const sys = m.user.units;
  switch (intent) {
    case "save": {
      // Read against the stored document: a size the catalogue no longer lists is kept only where a stored run holds it, and
      // a post without the energy fields keeps the stored settings.
      const { input, name, errors } = readSystemForm(form, sys, await storedForEditor(viewer, id));
      // Field errors answer 400, as every other form's (the page is rendered again with them, with or without JavaScript),
      // with the fields as posted: without JavaScript the page shows them in place of the stored values (typed-back.ts).
      if (!input) return data({ errors, notice: null, typed: typedFields(form) }, { status: 400 });
      await saveSystem(viewer, id, name, input);
      const structural = form.get("addRun") != null || [...form.keys()].some((k) => k.endsWith(".remove"));
      return { errors: {} as FormErrors, notice: structural ? "Pipe runs updated and saved." : "System saved.", saved: true };
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
      const adj = readAdjustForm(form, sys);
      // A refused adjustment answers 400 as the save does, with the fields as posted: without JavaScript the candidate's form
      // shows them in place of the stored adjustment (typed-back.ts typedCandidateForm).
      if (!adj.adjustment) return data({ errors: { [`adj.${candidateId}`]: adj.error }, notice: null, typedForm: typedCandidateForm(form, `adj.${candidateId}`, ADJUST_FIELDS) }, { status: 400 });
      await adjustCandidate(viewer, candidateId, adj.adjustment);
      return { errors: {}, notice: "Candidate adjusted." };
    }
    case "price": {
      const candidateId = formId(form, "candidateId");
      const { cents, error } = readPriceCents(form.get("purchasePrice"), await workspaceCurrency(m.workspace.id));
      if (cents === undefined) return data({ errors: { [`price.${candidateId}`]: error }, notice: null, typedForm: typedCandidateForm(form, `price.${candidateId}`, PRICE_FIELDS) }, { status: 400 });
      await setCandidatePrice(viewer, candidateId, cents);
      return { errors: {}, notice: cents === null ? "Purchase price cleared." : "Purchase price set." };
    }
    case "select": {
      const candidateId = formId(form, "candidateId");
      const sid = await selectCandidate(viewer, candidateId, String(form.get("title") ?? ""), String(form.get("note") ?? ""), sys); // cut to their limits by the service
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
  const a = useActionData<typeof action>() as { errors?: FormErrors; notice?: string | null; saved?: boolean; typed?: TypedFields; typedForm?: TypedForm } | undefined;
  const nav = useNavigation();
  const formRef = useRef<HTMLFormElement>(null);
  const [draft, setDraft] = useState<string | null>(null);
  const [liveErrors, setLiveErrors] = useState<FormErrors>({});
  const [typed, setTyped] = useState(false);
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  // Live preview: while the engineer types, the form is read in the browser (same codec as the
  // server) and the unsaved inputs go to the preview API; swr keeps the last good answer.
  // No preview while the stored inputs need review: nothing is computed until they are fixed and saved.
  const { data: live, isValidating } = useSWR(draft && !d.review ? [`/api/v1/systems/${d.id}/preview`, draft] : null, postPreview, { keepPreviousData: true, revalidateOnFocus: false });
  useEffect(() => {
    setDraft(null);
    setTyped(false);
  }, [d]);
  // A refused save (posted without JavaScript, or with it) leaves its typed values in the form: not stored, so unsaved.
  const unsaved = useUnsavedChanges(formRef, d.id, a?.saved ? a : null, Boolean(a?.typed));
  const onInput = () => {
    unsaved.check();
    if (timer.current) clearTimeout(timer.current);
    timer.current = setTimeout(() => {
      if (!formRef.current) return;
      const r = readSystemForm(new FormData(formRef.current), d.unitSystem, d.input);
      setLiveErrors(r.errors);
      setTyped(true);
      if (r.input) setDraft(JSON.stringify(r.input));
    }, 350);
  };
  const view = (draft && live) || d.view;
  const draftInput = useMemo(() => (draft ? JSON.parse(draft) : d.input), [draft, d.input]);
  // The inputs the view shown was computed on (the live preview's, else the stored): its duty and tolerance judged the verdicts.
  const viewInput: typeof d.input = draft && live ? draftInput : d.input;
  // The stored inputs' problems stand beside the fields until the form is read again (typing, or a save refused).
  const storedErrors = d.review && !typed && !Object.keys(a?.errors ?? {}).length ? d.review.fields : {};
  const errors = { ...storedErrors, ...(a?.errors ?? {}), ...liveErrors };
  // After a refused save, every field as typed in that post (the stored values otherwise).
  const f = typedOver(systemFormValues(d.input, d.unitSystem), a?.typed, d.unitSystem);
  const ro = !d.canWrite;
  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-end justify-between gap-2">
        <PageHead trail={[["/projects", "Projects"], [`/projects/${d.project.id}`, d.project.name]]} title={d.name} />
        {d.review ? null : (
          <div className="no-print flex gap-2">
            <a className="btn" href={`/systems/${d.id}/search`}>
              Find pumps for this duty
            </a>
          </div>
        )}
      </div>
      {ro ? <ReadOnlyNotice what="system" role={d.role} /> : null}
      {a?.notice ? <Notice>{a.notice}</Notice> : null}
      <LeaveQuestion blocker={unsaved.blocker} />
      {d.review ? <StoredInputReview problems={d.review.problems} count={d.review.count} canWrite={d.canWrite} /> : null}
      <div className="grid gap-4 xl:grid-cols-[minmax(22rem,30rem)_1fr]">
        <Form method="post" ref={formRef} onInput={onInput} className="space-y-4" aria-label="System inputs" data-unsaved={unsaved.watching ? (unsaved.dirty ? "yes" : "no") : undefined}>
          <fieldset disabled={ro} className="space-y-4">
            <SystemFieldset f={f} errors={errors} unitSystem={d.unitSystem} name={a?.typed?.name ?? d.name} customFluid={draftInput.fluid?.kind === "custom" || f.fluidKind === "custom"} />
            <DutyFieldset f={f} errors={errors} unitSystem={d.unitSystem} currency={d.currency} dutyCheck={view?.evaluation?.dutyCheck} />
            <DutyCycleFieldset energy={d.input.energy ?? DEFAULT_ENERGY_SETTINGS} hoursPerYear={d.input.hoursPerYear} errors={errors} currency={d.currency} typed={a?.typed} />
            <RunsFieldset f={f} errors={errors} unitSystem={d.unitSystem} />
            {!ro ? (
              <div className="sticky bottom-2 flex items-center gap-3">
                <button className="btn shadow-lg" name="intent" value="save">
                  {nav.state === "submitting" ? "Saving…" : "Save system"}
                </button>
                {draft ? <span className="text-xs text-slate-600">Chart shows unsaved changes{isValidating ? " (updating…)" : ""}</span> : null}
                {unsaved.dirty && !draft ? <span className="text-xs text-slate-600">Unsaved changes</span> : null}
              </div>
            ) : null}
          </fieldset>
        </Form>

        <div className="space-y-4">
          {view ? (
            <>
              <section className="panel space-y-3">
                <h2 className="font-semibold">System curve{view.candidates.length ? " and candidates" : ""}</h2>
                {view.systemError ? <FormError error={`The system cannot be computed: ${view.systemError}`} /> : null}
                <WorkbenchChart view={view} unitSystem={d.unitSystem} duty={draftInput.duty} title={`${d.name}: head against flow`} />
                <SystemWarnings warnings={view.evaluation?.warnings} />
                <RunTable view={view} unitSystem={d.unitSystem} />
                <SizingCaution />
              </section>
              <section className="panel space-y-3">
                <h2 className="font-semibold">Candidates</h2>
                {view.candidates.length === 0 && view.needsReview.length === 0 ? (
                  <p className="text-sm text-slate-600">
                    No candidates yet. <a href={`/systems/${d.id}/search`}>Search the libraries open to you</a> for pumps that meet the duty.
                  </p>
                ) : (
                  <CandidateTable
                    view={view}
                    unitSystem={d.unitSystem}
                    duty={viewInput.duty}
                    tolerance={viewInput.flowTolerance}
                    currency={d.currency}
                    actions={(c) => <CandidateActions c={c} unitSystem={d.unitSystem} errors={errors} canWrite={d.canWrite} canSelect={d.canSelect} typedForm={a?.typedForm} />}
                  />
                )}
                <CandidatesNeedingReview items={view.needsReview} unitSystem={d.unitSystem} errors={errors} canWrite={d.canWrite} typedForm={a?.typedForm} />
              </section>
              <CandidateEnergyPanel candidates={view.candidates} unitSystem={d.unitSystem} currency={d.currency} canWrite={d.canWrite} errors={errors} typedForm={a?.typedForm} />
            </>
          ) : null}
          {d.canWrite ? (
            <div className="no-print flex gap-2">
              <PostButton intent="copy">
                Copy system
              </PostButton>
              <PostButton intent="archive">
                Archive system
              </PostButton>
            </div>
          ) : null}
        </div>
      </div>
    </div>
  );
}

export const ErrorBoundary = routeErrorBoundary({ what: "this system", back: { href: "/projects", label: "Your projects" } });
