import * as v from "valibot";
import type { ReactNode } from "react";
import { useLoaderData } from "react-router";
import type { Route } from "./+types/field.checks.$id";
import { StoredProblems } from "~/components/StoredProblems";
import { requireMember } from "~/lib/auth/guards.server";
import { viewerOf } from "~/lib/auth/viewer.server";
import { QueryFlag, readId, readQuery } from "~/lib/shared/forms.server";
import { can } from "~/lib/auth/permissions";
import { getFieldCheck } from "~/lib/fieldchecks/records.server";
import { armDeviationText, crossOf, crossSentences, verdictNote, gradeRule, inputPowerW, powerGradeSentences, SPEED_RANGE, speedRpm, VERDICT_TEXT, type Readings, type Verdict } from "~/lib/fieldchecks";
import { fmtUtc, pctAsTyped } from "~/lib/shared/format";
import { FieldCaution, FieldCheckChart, GradeTable, VerdictBadge } from "~/components/fieldcheck";
import { routeErrorBoundary } from "~/components/RouteError";
import { fmtPctSignedExact } from "~/engine/quantityText";
import { flowBandHalfWidthText } from "~/engine";
import { Crumbs } from "~/components/Crumbs";
import { renderDeep, renderUnits, fmtFlow, fmtHead, fmtNumExact, fmtPct, fmtPower, fmtPressure, fmtQ, fmtQExact, fmtQZero, type UnitChoice } from "~/lib/shared/units";

// GET /field/checks/:id — the record of one check (any version): verdict, numbers, chart, hints, photos.
// The numbers shown are the ones stored when the check was recorded: both sides read the same record.

export const meta: Route.MetaFunction = ({ data }) => [{ title: `Field check ${data?.check.id ?? ""} · Dutymark` }];

export async function loader({ request, params }: Route.LoaderArgs) {
  const m = await requireMember(request, "fieldcheck.read");
  const c = await getFieldCheck(viewerOf(m), readId(params.id));
  const url = new URL(request.url);
  const record = {
    check: { id: c.check.id, version: c.check.version, chainId: c.check.chainId ?? c.check.id, verdict: c.check.verdict, grade: c.check.grade, notes: c.check.notes, createdAt: c.check.createdAt.toISOString() },
    selection: { id: c.selection.id, title: renderUnits(c.selection.title, m.user.units), projectName: c.selection.projectName, systemName: c.selection.systemName, own: c.selection.own, ownerWorkspace: c.selection.ownerWorkspace },
    recordedBy: c.recordedBy,
    recordedIn: c.recordedIn,
    mayAmend: c.mayAmend && can(m.role, "fieldcheck.write"),
    photos: c.photos,
    versions: c.versions,
    latest: c.latest,
    /** When the readings were taken (the phone's clock) and recorded (the server's), and why the first may be wrong. */
    times: c.times,
    justRecorded: readQuery(url, v.object({ recorded: QueryFlag })).recorded,
    unitSystem: m.user.units,
  };
  // A check whose stored record cannot be read: its page says so and what is wrong (stored values in the reader's units),
  // and keeps what does not come from that record — versions, photos, amending with readings entered again.
  if (!c.readable) return { ...record, readable: false as const, problems: renderDeep(c.problems, m.user.units), problemCount: c.problemCount };
  return {
    ...record,
    readable: true as const,
    readings: c.readings,
    result: renderDeep(c.result, m.user.units), // stored when recorded: its sentences render in the reader's units
    /** The same readings judged under today's rules, where that verdict differs from the stored one (judged-today.ts). */
    judgedToday: c.judgedToday ? renderDeep(c.judgedToday, m.user.units) : null,
  };
}

type RecordData = Awaited<ReturnType<typeof loader>>;

/** A deviation from the design duty (no verdict rests on it), signed with the true minus. */
const signed = (x: number | null | undefined) => fmtPctSignedExact(x, [], true);

/** A pressure with the true minus sign (U+2212), as the app's signed texts: "−20.0 kPa" (a vacuum reading), never "-20.0 kPa". */
const pressureText = (sys: UnitChoice, si: number) => fmtPressure(sys, si).replace(/^-/, "\u2212");

function gaugeText(sys: UnitChoice, g: Readings["suction"], asGauge: number) {
  // Each reading says its reference; an absolute one also shows the gauge value the check used.
  const read = `${pressureText(sys, g.pressure)} ${g.reference === "absolute" ? "absolute" : "gauge"}`;
  const used = g.reference === "absolute" ? ` (${pressureText(sys, asGauge)} gauge against ${pressureText(sys, 101325)})` : "";
  // An accuracy not given is said so (it showed nothing, as an entered 0 did); an entered 0 is "±0 kPa".
  return `${read}${used}${g.accuracy === null ? " (accuracy not given)" : ` ±${fmtQZero(sys, "pressure", g.accuracy)}`} · at ${fmtQ(sys, "length", g.elevation)} · pipe ${fmtQ(sys, "diameter", g.diameter)}`;
}

export default function FieldCheckRecord() {
  const d = useLoaderData<typeof loader>();
  if (!d.readable) return <UnreadableRecord d={d} />;
  const r = d.result;
  const sys = d.unitSystem;
  const rd = d.readings;
  const e = r.engine;
  const band = e.flowBand;
  /** The gauges whose accuracy was not given (null): the band says so rather than a width of ±0. */
  const noGauge = ([["suction", rd.suction.accuracy], ["discharge", rd.discharge.accuracy]] as const).filter(([, a]) => a === null).map(([side]) => side);
  const cross = crossOf(r);
  const note = verdictNote(r);
  const rpm = speedRpm(rd.speed);
  // The measured speed apart from the ends of the range the curve may be translated in (the warning's numbers), never "1450 rpm" for 1449.7.
  const ends = r.speed.rated !== null ? SPEED_RANGE.map((f) => f * r.speed.rated!) : [];
  const rpmApart = fmtNumExact(rpm, ends, 0);
  const pin = inputPowerW(rd.power);
  return (
    <article className="mx-auto max-w-3xl space-y-4">
      <RecordHead d={d} />

      <section className="panel space-y-2" aria-labelledby="verdict-h">
        <h2 id="verdict-h" className="font-semibold">
          Verdict
        </h2>
        <p>
          <VerdictBadge verdict={d.check.verdict} grade={d.check.grade} large />
        </p>
        <p className="text-sm">{renderUnits(r.message, sys)}.</p>
        {note ? <p className="text-sm" data-testid="verdict-note">{renderUnits(note, sys)}</p> : null}
        {d.judgedToday ? <JudgedTodayNote today={d.judgedToday} stored={d.check.verdict} grade={d.check.grade} recordedAt={d.check.createdAt} /> : null}
        {cross ? (
          <div className="rounded-md border border-slate-200 p-2 text-sm" data-testid="grade-cross">
            {crossSentences(cross, { flow: (v, against = [], limit) => fmtQExact(sys, "flow", v, against, limit), head: (v, against = [], limit) => fmtQExact(sys, "head", v, against, limit) }).map((t, i) => (
              <p key={i} className={i === 0 ? "text-slate-600" : ""}>
                {t}
              </p>
            ))}
          </div>
        ) : null}
        {/* The grade's power and efficiency limits: each with its rule and numbers, or why they were not judged. */}
        <div className="rounded-md border border-slate-200 p-2 text-sm" data-testid="grade-power">
          {powerGradeSentences(r).map((t, i) => (
            <p key={i}>{renderUnits(t, sys)}</p>
          ))}
        </div>
        <dl className="grid grid-cols-2 gap-x-3 gap-y-1 text-sm">
          <dt className="text-slate-600">Delivered flow</dt>
          <dd className="font-semibold" data-testid="delivered-flow">
            {e.flow !== null ? fmtFlow(sys, e.flow) : "not on the curve"}
            <span className="font-normal text-slate-600">{e.flowSource === "measured" ? " (flow meter)" : " (inferred from the curve)"}</span>
          </dd>
          <dt className="text-slate-600">Total dynamic head</dt>
          <dd className="font-semibold" data-testid="delivered-head">
            {fmtHead(sys, r.delivered.head)}
          </dd>
          {band ? (
            <>
              <dt className="text-slate-600">Flow band from gauge accuracy</dt>
              <dd>
                {noGauge.length === 2 ? (
                  // Neither gauge's accuracy given: no band to draw (it read "43.2 to 43.2 m³/h (head ±0.00 m), width ±0 %").
                  "none: the gauges' accuracy was not given, so the flow is the curve's at the head as read"
                ) : (
                  <>
                    {band.low !== null ? fmtFlow(sys, band.low) : "beyond the curve"} to {band.high !== null ? fmtFlow(sys, band.high) : "beyond the curve"} (head ±{fmtHead(sys, band.headUncertainty)}
                    {noGauge.length ? `, the ${noGauge[0]} gauge's accuracy not given` : ""})
                  </>
                )}
                {noGauge.length < 2 && band.low !== null && band.high !== null && e.flow ? <span className="block text-xs text-slate-600">width {flowBandHalfWidthText(band.low, band.high, e.flow)} of the flow: the flatter the curve, the wider the band.</span> : null}
              </dd>
            </>
          ) : null}
          <dt className="text-slate-600">Design duty (one pump)</dt>
          <dd>{r.duty ? `${fmtFlow(sys, r.duty.flow)} at ${fmtHead(sys, r.duty.head)}` : "not set"}</dd>
          <dt className="text-slate-600">From the design duty</dt>
          <dd>
            flow {signed(r.deviation.dutyFlow)}, head {signed(r.deviation.dutyHead)}
          </dd>
          <dt className="text-slate-600">From the curve at the measured speed</dt>
          {/* Each arm's deviation apart from its allowance, as the cross reads it ("+5.0001 %" beside a fail, never "+5.0 %"). */}
          <dd>{cross ? `flow ${armDeviationText(cross.flow)}, head ${armDeviationText(cross.head)}` : "— (the flow was taken from the curve)"}</dd>
          <dt className="text-slate-600">Curve head at this flow</dt>
          <dd>{fmtHead(sys, e.curveHead)}</dd>
          <dt className="text-slate-600">Speed</dt>
          <dd>
            {r.speed.measured !== null ? `${fmtNumExact(r.speed.measured, ends, 0)} rpm measured` : "not entered"}
            {r.speed.design !== null ? ` · ${Math.round(r.speed.design)} rpm selected` : ""}
            {r.speed.rated !== null ? ` · curve at ${fmtNumExact(r.speed.rated, [Math.round(r.speed.rated)], 0)} rpm` : ""}
          </dd>
          {r.power ? (
            <>
              <dt className="text-slate-600">Motor input power</dt>
              <dd>{fmtPower(sys, r.power.input)}</dd>
              <dt className="text-slate-600">Hydraulic power ρ·g·Q·H</dt>
              <dd>{fmtPower(sys, r.power.hydraulic)}</dd>
              <dt className="text-slate-600">Overall efficiency (wire to water)</dt>
              <dd>{fmtPct(r.power.overall)}</dd>
              {r.power.pump !== null ? (
                <>
                  <dt className="text-slate-600">Pump efficiency (estimate)</dt>
                  <dd>
                    {fmtPct(r.power.pump)} {r.power.curve !== null ? `· curve ${fmtPct(r.power.curve)}` : ""}
                  </dd>
                </>
              ) : r.power.curve !== null ? (
                <>
                  <dt className="text-slate-600">Curve efficiency at this flow</dt>
                  <dd>{fmtPct(r.power.curve)} (enter the motor efficiency to compare)</dd>
                </>
              ) : null}
            </>
          ) : null}
        </dl>
      </section>

      {r.hints.length ? (
        <Part title="If the point is off" id="hints-h">
          <p className="text-sm">{r.hints[0]}</p>
          <Bullets items={r.hints.slice(1)} className="mt-1" />
        </Part>
      ) : null}

      <Part title="On the curve">
        <FieldCheckChart r={r} unitSystem={sys} compact />
      </Part>

      {r.warnings.length ? (
        <Part title="Notes on the working">
          <Bullets items={r.warnings} />
        </Part>
      ) : null}

      <Part title="Readings">
        <dl className="mt-2 grid grid-cols-1 gap-y-1 text-sm sm:grid-cols-[12rem_1fr]">
          <dt className="text-slate-600">Suction gauge</dt>
          <dd>{gaugeText(sys, rd.suction, r.gauges.suction)}</dd>
          <dt className="text-slate-600">Discharge gauge</dt>
          <dd>{gaugeText(sys, rd.discharge, r.gauges.discharge)}</dd>
          <dt className="text-slate-600">Velocity heads</dt>
          <dd>
            suction {fmtHead(sys, e.velocityHead.suction)}, discharge {fmtHead(sys, e.velocityHead.discharge)}
          </dd>
          <dt className="text-slate-600">Flow meter</dt>
          <dd>{rd.flow !== null ? `${fmtFlow(sys, rd.flow)}${rd.flowAccuracy === null ? " (the meter's accuracy not given)" : ` ±${pctAsTyped(rd.flowAccuracy)}`}` : "none"}</dd>
          <dt className="text-slate-600">Speed</dt>
          <dd>{rd.speed.mode === "vfd" ? `${rd.speed.hz} Hz on a ${rd.speed.baseHz} Hz / ${rd.speed.baseRpm} rpm motor → ${rpmApart} rpm` : rpm !== null ? `${rpmApart} rpm` : "not entered"}</dd>
          <dt className="text-slate-600">Power</dt>
          <dd>
            {rd.power.mode === "electrical"
              ? `${rd.power.volts} V × ${rd.power.amps} A × PF ${rd.power.powerFactor}, ${rd.power.phases === 3 ? "three-phase (√3·V·I·PF)" : "single-phase (V·I·PF)"} = ${fmtPower(sys, pin)}`
              : rd.power.mode === "input"
                ? fmtPower(sys, pin)
                : "not measured"}
            {rd.power.mode !== "none" && rd.power.motorEfficiency ? ` · motor efficiency ${fmtPct(rd.power.motorEfficiency, 0)}` : ""}
            {rd.power.mode !== "none" ? (rd.power.readingAccuracy != null ? ` · reading accuracy ±${pctAsTyped(rd.power.readingAccuracy)}` : " · no reading accuracy given") : ""}
          </dd>
          <dt className="text-slate-600">Fluid</dt>
          <dd>
            {r.fluid.name} · ρ {fmtQ(sys, "density", r.fluid.density)}
          </dd>
          <dt className="text-slate-600">Grade</dt>
          <dd>
            {gradeRule(r.grade)}
          </dd>
          <dt className="text-slate-600">Notes</dt>
          <dd className="whitespace-pre-wrap">{d.check.notes || "—"}</dd>
        </dl>
        <GradeTable highlight={r.grade.id} />
      </Part>

      <RecordFoot d={d} />
      <FieldCaution />
    </article>
  );
}

/** The record's head: whose check, when, and a later version when there is one. */
function RecordHead({ d }: { d: RecordData }) {
  return (
    <>
      <header>
        <Crumbs trail={[["/field", "Field checks"], [`/field/selections/${d.selection.id}`, d.selection.title]]} />
        <h1 className="text-xl font-bold text-brand-900">
          Field check {d.check.id} <span className="text-base font-normal text-slate-600">version {d.check.version}</span>
        </h1>
        <p className="text-sm text-slate-700">
          {d.selection.projectName} · {d.selection.systemName} · {d.times.text} by {d.recordedBy} ({d.recordedIn})
        </p>
      </header>
      {d.times.warnings.length ? (
        <div className="caution text-sm" data-testid="clock-warnings">
          {d.times.warnings.map((w) => (
            <p key={w}>{w}</p>
          ))}
        </div>
      ) : null}
      {d.justRecorded ? (
        <p role="status" className="panel text-sm">
          Check recorded. The engineer of the project has been sent a notice.
        </p>
      ) : null}
      {!d.latest ? (
        <p className="caution">
          This version was amended later: see{" "}
          {d.versions
            .filter((x) => x.version > d.check.version)
            .map((x) => (
              <a key={x.id} href={`/field/checks/${x.id}`} className="mr-2">
                version {x.version}
              </a>
            ))}
        </p>
      ) : null}
    </>
  );
}

/**
 * Where the readings judged under today's rules give another verdict than the one stored (judged-today.ts): both verdicts,
 * each with its words, and how to record today's. The stored verdict stays the record's.
 */
function JudgedTodayNote({ today, stored, grade, recordedAt }: { today: { verdict: Verdict; message: string; note: string | null; rule: string }; stored: Verdict; grade: string; recordedAt: string }) {
  return (
    <div className="caution space-y-1 text-sm" data-testid="judged-today">
      <p>
        Recorded {fmtUtc(recordedAt)} as {VERDICT_TEXT[stored]}, the verdict this record keeps. The same readings against the same frozen curve, judged under
        the rules Dutymark applies today, give another verdict: <VerdictBadge verdict={today.verdict} grade={grade} /> — {today.message}.
      </p>
      {today.note ? <p>{today.note}</p> : null}
      {/* Today's verdict's rule and numbers (listed-verdict.ts `verdictRule`), as the lists say it. */}
      <p data-testid="judged-today-rule">Today&apos;s rule and numbers: {today.rule}</p>
      <p>The sentence above is the one recorded; the tolerance cross and the power and efficiency limits below are read from the stored deviations with today&apos;s allowances. To record today&apos;s verdict, amend this check (a new version with the same readings).</p>
    </div>
  );
}

/** Photos and what can be done next (amend, the CSV, other versions): none of it comes from the stored readings or result. */
function RecordFoot({ d }: { d: RecordData }) {
  return (
    <>
      {d.photos.length ? (
        <Part title="Photos">
          <ul className="mt-2 grid grid-cols-2 gap-2 sm:grid-cols-3">
            {d.photos.map((p) => (
              <li key={p.id}>
                <a href={`/field/checks/${d.check.id}/photos/${p.id}`}>
                  <img src={`/field/checks/${d.check.id}/photos/${p.id}`} alt={p.filename} loading="lazy" className="h-32 w-full rounded object-cover" />
                  <span className="block truncate text-xs">{p.filename}</span>
                </a>
              </li>
            ))}
          </ul>
        </Part>
      ) : null}

      <section className="panel flex flex-wrap items-center gap-2 text-sm">
        {d.mayAmend && d.latest ? (
          <a className="btn" href={`/field/selections/${d.selection.id}?amend=${d.check.id}`}>
            Amend (new version)
          </a>
        ) : null}
        <a className="btn-quiet" href={`/field/selections/${d.selection.id}/export.csv`}>
          History as CSV
        </a>
        {d.versions.length > 1 ? (
          <span>
            Versions:{" "}
            {d.versions.map((x) => (
              <a key={x.id} href={`/field/checks/${x.id}`} className="mr-2" aria-current={x.id === d.check.id ? "page" : undefined}>
                v{x.version}
              </a>
            ))}
          </span>
        ) : null}
      </section>
    </>
  );
}

/** The page of a check whose stored readings or result do not pass their schemas: what is wrong, and no numbers. */
function UnreadableRecord({ d }: { d: Extract<RecordData, { readable: false }> }) {
  return (
    <article className="mx-auto max-w-3xl space-y-4">
      <RecordHead d={d} />
      <section className="panel space-y-2 border-fail" role="alert" aria-labelledby="unreadable-h" data-testid="unreadable-check">
        <h2 id="unreadable-h" className="font-semibold text-fail">
          This check cannot be read: its stored record does not pass the checks
        </h2>
        <p className="text-sm">
          {d.problemCount} problem{d.problemCount === 1 ? "" : "s"} found when its stored readings and result were read (changed outside the app, or cut off). None of its
          numbers, its verdict against grade {d.check.grade} or its chart are shown: nothing from a damaged record. The record itself is kept as it is.
        </p>
        <StoredProblems problems={d.problems} count={d.problemCount} />
        <p className="text-sm">
          {d.mayAmend && d.latest ? "Amend it to record the readings again as a new version (the form starts blank); the photos are carried over." : "The workspace that recorded it can amend it with the readings entered again."}
        </p>
      </section>
      <RecordFoot d={d} />
      <FieldCaution />
    </article>
  );
}

/** One part of the record: a panel under its heading (`id` names the heading for aria-labelledby). */
function Part({ title, id, children }: { title: string; id?: string; children: ReactNode }) {
  return (
    <section className="panel" aria-labelledby={id}>
      <h2 id={id} className="font-semibold">
        {title}
      </h2>
      {children}
    </section>
  );
}

function Bullets({ items, className = "" }: { items: string[]; className?: string }) {
  return (
    <ul className={`ml-5 list-disc text-sm ${className}`.trim()}>
      {items.map((x) => (
        <li key={x}>{x}</li>
      ))}
    </ul>
  );
}

export const ErrorBoundary = routeErrorBoundary({ what: "this field check", back: { href: "/field", label: "All field checks" } });
