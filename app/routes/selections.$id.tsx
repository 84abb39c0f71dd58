import { useLoaderData } from "react-router";
import type { Route } from "./+types/selections.$id";
import { requireMember } from "~/lib/auth/guards.server";
import { getSelection } from "~/lib/projects";
import { viewerOf } from "~/lib/auth/viewer.server";
import { readId } from "~/lib/shared/forms.server";
import { minFlowNoteOf, motorNoteOf, npshNoteOf, stagedNpshNoteOf, RunTable, startNoteOf, SizingCaution, SystemWarnings, VerdictView, WorkbenchChart } from "~/components/workbench";
import { CandidateTable, deadHeadText } from "~/components/CandidateTable";
import { ReportMethods } from "~/components/ReportMethods";
import { dutyFlowText } from "~/components/candidate-figures";
import { EDITOR_FITTINGS } from "~/lib/projects/system-form";
import { PrintButton } from "~/components/PrintButton";
import { SelectionEnergy } from "~/components/SelectionEnergy";
import type { WorkbenchView } from "~/lib/projects/workbench-view";
import { selectionCurrency } from "~/lib/projects/stored-selection";
import { resultFlowMax } from "~/lib/projects/hydraulics";
import { routeErrorBoundary } from "~/components/RouteError";
import { checksOfSelection } from "~/lib/fieldchecks/selection-checks.server";
import { SelectionFieldChecks } from "~/components/SelectionFieldChecks";
import { Crumbs } from "~/components/Crumbs";
import { renderDeep, renderUnits, fmtFlow, fmtHead, fmtPressure, fmtQ, fmtQZero } from "~/lib/shared/units";
import { DEFAULT_FLOW_TOLERANCE, type FlowTolerance } from "~/engine";
import { fmtPctSide } from "~/engine/quantityText";
import { fmtDate } from "~/lib/shared/format";
import { ListTable } from "~/components/ListTable";

export const meta: Route.MetaFunction = ({ data }) => [{ title: `${data?.title ?? "Selection"} · Dutymark report` }];

export async function loader({ request, params }: Route.LoaderArgs) {
  const m = await requireMember(request, "project.read");
  const id = readId(params.id);
  const viewer = viewerOf(m);
  const s = await getSelection(viewer, id);
  const fieldChecks = renderDeep(await checksOfSelection(s), m.user.units);
  // Text in the frozen document (notes, verdict reasons, warnings) is rendered in the reader's units; stored SI text shows as it is.
  return { id: s.id, title: renderUnits(s.title, m.user.units), note: s.note, createdAt: s.createdAt.toISOString(), frozen: renderDeep(s.frozen, m.user.units), unitSystem: m.user.units, workspace: m.workspace.name, fieldChecks, currency: selectionCurrency(s.frozen) };
}

const FITTING_NAMES = Object.fromEntries(EDITOR_FITTINGS) as Record<string, string>;

/** The duty flow tolerance as the verdict's rule writes it ("−2.5 %/+12.5 %", engine verdict.ts): never rounded to whole percent beside it. */
const toleranceText = (t: FlowTolerance | undefined) => {
  const tol = t ?? DEFAULT_FLOW_TOLERANCE;
  return `${fmtPctSide(tol.minus, "−")}/${fmtPctSide(tol.plus, "+")}`;
};

export default function SelectionReport() {
  const d = useLoaderData<typeof loader>();
  const f = d.frozen;
  const sys = d.unitSystem;
  const input = f.system.input;
  const currency = d.currency;
  const view: WorkbenchView = {
    evaluation: f.systemCurve,
    systemError: null,
    // The selected pump's own range (frozen curve and operating point) with the duty: never another candidate's.
    flowMax: resultFlowMax(input, f.result),
    candidates: [{ id: 0, curveSetId: f.pump.curveSetId, label: f.pump.label, library: `${f.pump.library.name ?? ""} rev. ${f.pump.library.revision ?? "?"}`, adjustment: f.adjustment, result: f.result, error: null, energy: f.energy ?? null }],
    needsReview: [],
  };
  return (
    <article className="print-compact mx-auto max-w-5xl space-y-5 print:max-w-none print:space-y-2">
      <header className="flex flex-wrap items-start justify-between gap-3 border-b border-slate-300 pb-3">
        <div>
          <Crumbs trail={[[`/projects/${f.project.id}`, f.project.name], [`/systems/${f.system.id}`, f.system.name]]} className="no-print text-sm" />
          <p className="text-xs uppercase tracking-wide text-slate-500">Pump selection report · {d.workspace}</p>
          <h1 className="text-2xl font-bold text-brand-900">{d.title}</h1>
          <p className="text-sm text-slate-700">
            {f.project.name} · {f.system.name} · selected {fmtDate(d.createdAt)} · report no. DM-{String(d.id).padStart(5, "0")}
          </p>
        </div>
        <div className="no-print flex flex-wrap gap-2">
          <PrintButton />
          <a className="btn-quiet" href={`/selections/${d.id}/export.csv`}>
            CSV
          </a>
          <a className="btn-quiet" href={`/selections/${d.id}/export.json`}>
            JSON
          </a>
        </div>
      </header>
      <SizingCaution />
      {d.note ? <p className="text-sm">{d.note}</p> : null}

      <section className="panel break-inside-avoid">
        <h2 className="font-semibold">Verdict</h2>
        {f.result.verdict === undefined ? (
          <p className="text-sm text-slate-600" data-testid="report-verdict" data-status="not-judged">
            Selected before Dutymark judged candidates: no verdict was frozen with this report.
          </p>
        ) : (
          <div className="mt-1 text-sm">
            <VerdictView verdict={f.result.verdict} testId="report-verdict" npshNote={npshNoteOf(f.result, sys)} npshRule={f.result.npsh?.rule} startNote={startNoteOf(f.result, sys)} motorNote={motorNoteOf(f.result, sys)} stagedNpshNote={stagedNpshNoteOf(f.result, f.energy, sys)} minFlowNote={minFlowNoteOf(f.result, sys)} />
          </div>
        )}
        {f.systemCurve?.dutyCheck ? (
          <p className={`mt-2 text-xs ${f.systemCurve.dutyCheck.differs ? "text-duty-ink" : "text-slate-600"}`}>
            {f.systemCurve.dutyCheck.message} {f.systemCurve.dutyCheck.governs}
          </p>
        ) : null}
      </section>

      <section className="grid gap-4 md:grid-cols-2">
        <div className="panel">
          <h2 className="font-semibold">Duty and result</h2>
          <dl className="mt-2 grid grid-cols-2 gap-x-3 gap-y-1 text-sm">
            <dt className="text-slate-600">Duty point</dt>
            {/* The duty flow apart from the band's flows judged against it (the figures table's "Flow over the band"). */}
            <dd>{input.duty ? `${dutyFlowText(sys, input.duty.flow, (f.result.band ?? []).map((b) => b.flow))} at ${fmtHead(sys, input.duty.head)}` : "not set"}</dd>
            <dt className="text-slate-600">Operating point (design curve)</dt>
            <dd className="font-semibold" data-testid="report-operating">
              {f.result.operating
                ? f.result.operating.flow === 0
                  ? deadHeadText(sys, f.result.operating.head)
                  : `${fmtFlow(sys, f.result.operating.flow)} at ${fmtHead(sys, f.result.operating.head)}`
                : f.result.message}
            </dd>
            <dt className="text-slate-600">Pump added pressure</dt>
            <dd>{f.result.operating && f.systemCurve ? `${fmtPressure(sys, f.result.operating.head * f.systemCurve.fluid.density * 9.80665)}${f.result.operating.flow === 0 ? " at zero flow (shut-off)" : ""}` : "—"}</dd>
            <dt className="text-slate-600">Pump</dt>
            <dd>
              {f.pump.model}
              {f.pump.type ? ` · ${f.pump.type}` : ""}
              {f.pump.size ? ` · ${f.pump.size}` : ""}
            </dd>
            <dt className="text-slate-600">Curve data</dt>
            <dd>
              {f.pump.library.name} revision {f.pump.library.revision}
              {f.pump.speed ? ` · ${Math.round(f.pump.speed)} rpm` : ""}
              {f.pump.impellerDiameter ? ` · Ø${fmtQ(sys, "diameter", f.pump.impellerDiameter)}` : ""}
              {f.pump.library.traced ? (
                <span className="mt-0.5 block text-xs text-duty-ink" data-testid="report-traced">
                  ▲ {f.pump.library.traced.source}. {f.pump.library.traced.caution}
                </span>
              ) : null}
            </dd>
          </dl>
        </div>
        <div className="panel">
          <h2 className="font-semibold">System inputs</h2>
          <dl className="mt-2 grid grid-cols-2 gap-x-3 gap-y-1 text-sm">
            <dt className="text-slate-600">Fluid</dt>
            <dd>
              {input.fluid.kind === "water" ? "Water" : input.fluid.name || "Custom liquid"} at {fmtQ(sys, "temperature", input.temperatureC, 1)}
              {f.systemCurve ? ` · ρ ${fmtQ(sys, "density", f.systemCurve.fluid.density)} · ν ${fmtQ(sys, "kinematicViscosity", f.systemCurve.fluid.kinematicViscosity)}` : ""}
            </dd>
            <dt className="text-slate-600">Kind</dt>
            <dd>{input.mode === "closed-loop" ? `closed loop, control head ${fmtHead(sys, input.controlHead)}` : "open, static lift"}</dd>
            {input.mode === "open" ? (
              <>
                <dt className="text-slate-600">Static head</dt>
                <dd>
                  {fmtHead(sys, input.staticLow)} to {fmtHead(sys, input.staticHigh)}
                </dd>
                <dt className="text-slate-600">Pressure difference</dt>
                {/* None at all reads "0 kPa"; a tiny one never reads as zero (units.ts fmtQZero). */}
                <dd data-testid="report-pressure-difference">{fmtQZero(sys, "pressure", input.pressureDifference)}</dd>
              </>
            ) : null}
            <dt className="text-slate-600">Suction surface</dt>
            <dd>
              {fmtPressure(sys, input.suctionSurfacePressure)} abs., {fmtHead(sys, input.suctionStaticHead)} above the pump
            </dd>
            <dt className="text-slate-600">Operation</dt>
            <dd>
              {input.hoursPerYear} h/year at {input.tariffPerKWh} {currency} per kWh; NPSH margin wanted {input.npshMargin}; duty flow tolerance {toleranceText(input.flowTolerance)}
            </dd>
          </dl>
        </div>
      </section>

      {/* May break between the chart and its tables when printed (the chart itself stays whole). */}
      <section className="panel">
        <h2 className="font-semibold">Curves</h2>
        <WorkbenchChart view={view} unitSystem={sys} duty={input.duty} title={`${f.pump.label} on ${f.system.name}`} />
      </section>

      <section className="panel break-inside-avoid print-two-columns">
        <h2 className="font-semibold">Figures at the operating point</h2>
        <CandidateTable view={view} unitSystem={sys} duty={input.duty} tolerance={input.flowTolerance} currency={currency} />
      </section>

      <SelectionEnergy c={view.candidates[0]} unitSystem={sys} currency={currency} />

      <section className="panel break-inside-avoid">
        <h2 className="font-semibold">Pipe runs</h2>
        <ListTable head={["Run", "Inner diameter", "Length", "Roughness new / aged", "Fittings and ΣK"]}>
          {input.runs.map((r, i) => (
            <tr key={i} className="border-t border-slate-100 align-top">
              <td className="py-1">
                {r.name} ({r.side})
              </td>
              <td>
                {fmtQ(sys, "diameter", r.diameter)}
                {r.pipeTable ? ` (${r.pipeTable} ${r.nominal})` : ""}
              </td>
              <td>{fmtQ(sys, "length", r.length)}</td>
              <td>
                {fmtQ(sys, "roughness", r.roughness, 4)} / {fmtQ(sys, "roughness", r.agedRoughness, 4)}
              </td>
              <td className="text-xs">
                {r.fittings.map((x) => `${x.count} × ${FITTING_NAMES[x.id] ?? x.id}`).join(", ") || "none"}
                {r.extraK ? `; extra K ${r.extraK}` : ""}
              </td>
            </tr>
          ))}
        </ListTable>
        <div className="mt-3 space-y-2">
          <RunTable view={view} unitSystem={sys} />
          <SystemWarnings warnings={f.systemCurve?.warnings} />
        </div>
      </section>

      <SelectionFieldChecks checks={d.fieldChecks} unitSystem={sys} selectionId={d.id} />

      <ReportMethods f={f} unitSystem={sys} />

      <section className="panel break-inside-avoid text-sm">
        <h2 className="font-semibold">Sign-off</h2>
        <div className="mt-4 grid grid-cols-3 gap-6">
          {["Prepared by", "Checked by", "Approved by"].map((who) => (
            <div key={who}>
              <div className="h-10 border-b border-slate-400" />
              <p className="mt-1 text-xs text-slate-600">{who} · date</p>
            </div>
          ))}
        </div>
      </section>
      <SizingCaution />
    </article>
  );
}

export const ErrorBoundary = routeErrorBoundary({ what: "this selection report", back: { href: "/projects", label: "Your projects" } });
