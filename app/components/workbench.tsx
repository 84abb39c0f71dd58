// Pieces of the system page and the selection report: the chart built from a workbench, the per-run table, the
// system's warnings and the verdict badge (the candidates table is ./CandidateTable.tsx). All inputs SI; display through ./units.
import { DutyChart } from "./chart/DutyChart";
import type { PumpSeries } from "./chart/types";
import { pumpsBasis } from "~/lib/projects/power-basis";
import { publishedOf, settingToken } from "~/lib/projects/setting-step";
import type { WorkbenchView } from "~/lib/projects/workbench-view";
import { fmtFlow, fmtHead, fmtPctExact, fmtQ, renderUnits, type UnitChoice } from "~/lib/shared/units";
import { DEFAULT_SPEED_RANGE, LAMINAR_MAX_RE, TURBULENT_MIN_RE, verdictLabel, type Verdict } from "~/engine";
import { fmtExpExact } from "~/engine/quantityText";
import { ListTable } from "./ListTable";
import { verdictNpshNote, verdictNpshShort } from "~/lib/projects/verdict-npsh";
import { STAGED_START_RULE, verdictStartNote, verdictStartShort } from "~/lib/projects/verdict-start";
import { MOTOR_RULE, verdictMotorNote, verdictMotorShort } from "~/lib/projects/verdict-motor";
import { verdictStagedNpshNote, verdictStagedNpshShort } from "~/lib/projects/verdict-staged-npsh";
import { MIN_FLOW_RULE, verdictMinFlowNote, verdictMinFlowShort } from "~/lib/projects/verdict-min-flow";

/** What NPSH says against a candidate's verdict, in the reader's units, for `VerdictView`'s `npshNote` (null: nothing). */
export const npshNoteOf = (r: Cand["result"] | null | undefined, units: UnitChoice): string | null => {
  const note = r ? verdictNpshNote(r.verdict, r.npsh) : null;
  return note ? renderUnits(note, units) : null;
};

/** What starting pumps in parallel one after another says against a candidate's verdict, in the reader's units, for `VerdictView`'s `startNote`. */
export const startNoteOf = (r: Cand["result"] | null | undefined, units: UnitChoice): string | null => {
  const note = r ? verdictStartNote(r.verdict, r.stagedStart) : null;
  return note ? renderUnits(note, units) : null;
};

/** What the motor check says against a candidate's verdict, in the reader's units, for `VerdictView`'s `motorNote`. */
export const motorNoteOf = (r: Cand["result"] | null | undefined, units: UnitChoice): string | null => {
  const note = r ? verdictMotorNote(r.verdict, r.figures) : null;
  return note ? renderUnits(note, units) : null;
};

/** What the maker's minimum flow says against a candidate's verdict (a duty below it), in the reader's units, for `VerdictView`'s `minFlowNote`. */
export const minFlowNoteOf = (r: Cand["result"] | null | undefined, units: UnitChoice): string | null => {
  const note = r ? verdictMinFlowNote(r.verdict, r.minFlow) : null;
  return note ? renderUnits(note, units) : null;
};

/**
 * What NPSH at a staged duty-cycle step (fewer pumps in parallel running) says against a candidate's verdict, in the reader's
 * units, for `VerdictView`'s `stagedNpshNote` (verdict-staged-npsh.ts; null: nothing).
 */
export const stagedNpshNoteOf = (r: Cand["result"] | null | undefined, e: Cand["energy"] | null | undefined, units: UnitChoice): string | null => {
  const note = r ? verdictStagedNpshNote(r.verdict, e?.cycle) : null;
  return note ? renderUnits(note, units) : null;
};

type Cand = WorkbenchView["candidates"][number];

/**
 * A result with no verdict kept (`verdict` absent: a selection frozen before Dutymark judged candidates), in the words the
 * report's headline uses; never read as "no duty point set", which is a verdict of null.
 */
export const NOT_JUDGED = "not judged: selected before Dutymark judged candidates, no verdict was frozen";

export function candidateSeries(c: Cand, i: number, units: UnitChoice): PumpSeries | null {
  const r = c.result;
  if (!r) return null;
  const pick = (k: "efficiency" | "power" | "npshr") => {
    const pts = r.curve.filter((p) => p[k] != null).map((p) => ({ flow: p.flow, y: p[k] as number }));
    return pts.length >= 2 ? pts : undefined;
  };
  return {
    id: String(c.id),
    label: `${c.label}${adjustmentText(c, units)} — ${r.verdict ? `${verdictLabel(r.verdict.status)}${verdictNpshShort(r.verdict, r.npsh)}${verdictStartShort(r.verdict, r.stagedStart)}${verdictMotorShort(r.verdict, r.figures)}${verdictStagedNpshShort(r.verdict, c.energy?.cycle)}${verdictMinFlowShort(r.verdict, r.minFlow)}` : r.verdict === undefined ? "not judged" : "no duty to judge"}`,
    colorIndex: i,
    head: r.curve.map((p) => ({ flow: p.flow, y: p.head })),
    efficiency: pick("efficiency"),
    power: pick("power"),
    // The combined curve's power is the duty pumps' together (hydraulics.ts): named on the chart beside it.
    powerBasis: pumpsBasis(c.adjustment)?.together,
    npshr: pick("npshr"),
    adjusted: c.adjustment.method !== "none" || c.adjustment.arrangement !== "single",
    por: r.por ?? undefined,
    bep: r.figures?.bepFlow != null && r.figures.bepHead != null ? { flow: r.figures.bepFlow * (c.adjustment.arrangement === "parallel" ? c.adjustment.dutyPumps : 1), head: r.figures.bepHead * (c.adjustment.arrangement === "series" ? c.adjustment.dutyPumps : 1) } : undefined,
    operating: r.operating
      ? { flow: r.operating.flow, head: r.operating.head, efficiency: r.figures?.efficiency ?? undefined, power: r.figures?.shaftPower ?? undefined, npshr: r.figures?.npshRequired ?? undefined }
      : null,
  };
}

/**
 * How the candidate runs, in words: the speed or trimmed impeller as set and judged, in whole rpm or mm (setting-step.ts:
 * the one rule for what is set and shown), in the reader's unit; with `solvedToo`, the solved value it was rounded up from
 * (the candidates table's and the report's "Adjustment"; chart labels and legends stay short).
 */
export function adjustmentText(c: { adjustment: Cand["adjustment"]; result: Cand["result"] }, units: UnitChoice, solvedToo = false): string {
  const a = c.adjustment;
  const r = c.result;
  const parts: string[] = [];
  if (a.method === "speed" || a.method === "trim") {
    const ratio = r?.ratio ?? 1;
    const pub = publishedOf(a.method, ratio, { speed: r?.speed ?? null, diameter: r?.diameter ?? null });
    // In the reader's units: a trimmed impeller in mm or inches (its step is a whole millimetre whatever the unit shown);
    // where the solved value and its rounding are shown, the whole mm beside inches (setting-step.ts: "Ø6.65 in [169 mm]").
    const shown = (x: number) => renderUnits(settingToken(a.method as "speed" | "trim", x, pub, solvedToo), units);
    const set = shown(ratio);
    // The value solved before rounding: in the candidates table's "Adjustment" (and the report's), not in every chart label.
    const solved = solvedToo && r?.solvedRatio != null && r.solvedRatio !== ratio ? `solved ${shown(r.solvedRatio)}, rounded up to keep the duty` : null;
    const more = (xs: (string | null)[]) => (xs.some(Boolean) ? ` (${xs.filter(Boolean).join("; ")})` : "");
    // A speed past the allowed range never reads as its end beside the outside-catalogue verdict ("100.04 %", not "100.0 %").
    const { min, max } = DEFAULT_SPEED_RANGE;
    const pct = fmtPctExact(ratio, ratio > max ? [max] : ratio < min ? [min] : [], 1);
    if (a.method === "speed") parts.push(pub.speed != null ? `at ${pct} speed${more([set, solved])}` : `at ${set} speed${more([solved])}`);
    else parts.push(`trimmed to ${set}${more([solved])}`);
  }
  if (a.arrangement !== "single") parts.push(`${a.dutyPumps} in ${a.arrangement}${a.standbyPumps ? ` + ${a.standbyPumps} standby` : ""}`);
  return parts.length ? ` (${parts.join(", ")})` : "";
}

export function WorkbenchChart({ view, unitSystem, duty, title, compact }: { view: WorkbenchView; unitSystem: UnitChoice; duty: { flow: number; head: number } | null; title: string; compact?: boolean }) {
  const ev = view.evaluation;
  const pumps = view.candidates.map((c, i) => candidateSeries(c, i, unitSystem)).filter((x): x is PumpSeries => x != null);
  // The duty's label is written apart from every flow delivered against it (each candidate's band edges), as the report's duty row.
  const apartFrom = view.candidates.flatMap((c) => (c.result?.band ?? []).map((b) => b.flow));
  return (
    <DutyChart
      unitSystem={unitSystem}
      title={title}
      description={`System curve with its band (low/high static level × new/aged pipe)${pumps.length ? `, ${pumps.length} candidate pump curve(s) and their operating points` : ""}${duty ? ", and the duty point" : ""}.`}
      system={ev ? { design: ev.flows.map((q, i) => ({ flow: q, y: ev.design[i] })), low: ev.flows.map((q, i) => ({ flow: q, y: ev.low[i] })), high: ev.flows.map((q, i) => ({ flow: q, y: ev.high[i] })) } : undefined}
      pumps={pumps}
      npsha={ev?.npsha}
      duty={duty ? { ...duty, apartFrom } : null}
      flowMax={view.flowMax}
      compact={compact}
    />
  );
}

export function RunTable({ view, unitSystem }: { view: WorkbenchView; unitSystem: UnitChoice }) {
  const ev = view.evaluation;
  if (!ev) return null;
  return (
    <div className="overflow-x-auto">
      <ListTable
        head={["Run", "Velocity", "Re", "f (Darcy)", "Regime", "Loss"]}
        className=""
        label="Pipe runs at the duty flow"
        caption={`Each run at ${fmtFlow(unitSystem, ev.dutyFlow)} (the duty flow), new pipe`}
      >
        {ev.runs.map((r, i) => (
          <tr key={i} className="border-t border-slate-100 align-top">
            <td className="py-1">
              {r.name} <span className="text-xs text-slate-500">({r.side})</span>
              {r.warnings.map((w, j) => (
                <div key={j} className="text-xs text-duty-ink">
                  ▲ {w}
                </div>
              ))}
            </td>
            <td>{fmtQ(unitSystem, "velocity", r.velocity)}</td>
            <td>{fmtExpExact(r.reynolds, [LAMINAR_MAX_RE, TURBULENT_MIN_RE])}</td>
            <td>{r.frictionFactor.toFixed(4)}</td>
            <td>{r.regime}</td>
            <td>{fmtHead(unitSystem, r.headLoss)}</td>
          </tr>
        ))}
      </ListTable>
    </div>
  );
}

/** The system curve's own warnings (flow regime, method limits), as the system page and the report show them. */
export function SystemWarnings({ warnings }: { warnings: readonly string[] | undefined }) {
  if (!warnings?.length) return null;
  return (
    <ul className="text-xs text-duty-ink" data-testid="system-warnings">
      {warnings.map((w, i) => (
        <li key={i}>▲ {w}</li>
      ))}
    </ul>
  );
}

const VERDICT_TONE: Record<Verdict["status"], string> = {
  meets: "bg-emerald-100 text-emerald-900",
  short: "bg-red-100 text-red-900",
  oversized: "bg-amber-100 text-amber-900",
  "outside-catalogue": "bg-red-100 text-red-900",
  "no-operating-point": "bg-red-100 text-red-900",
  "viscosity-uncorrected": "bg-amber-100 text-amber-900",
};

/**
 * The verdict as a badge (status), with its rule and reasons below unless `compact`. `npshNote`: what NPSH says against it
 * (verdict-npsh.ts `verdictNpshNote`, rendered in the reader's units), on the badge's line, with the NPSH rule. `startNote`:
 * what starting pumps in parallel one after another says against it (verdict-start.ts `verdictStartNote`), on the same line;
 * `motorNote`: what the motor check says against it (verdict-motor.ts `verdictMotorNote`), on the same line;
 * `stagedNpshNote`: what NPSH at a staged duty-cycle step says against it (verdict-staged-npsh.ts), on the same line;
 * `minFlowNote`: a duty below the maker's minimum flow (verdict-min-flow.ts), on the same line.
 */
export function VerdictView({ verdict, compact, testId, npshNote, npshRule, startNote, motorNote, stagedNpshNote, minFlowNote }: { verdict: Verdict | null | undefined; compact?: boolean; testId?: string; npshNote?: string | null; npshRule?: string | null; startNote?: string | null; motorNote?: string | null; stagedNpshNote?: string | null; minFlowNote?: string | null }) {
  if (!verdict) return <span className="text-slate-600" data-testid={testId} data-status="none">no duty point set: nothing to judge</span>;
  return (
    <div data-testid={testId} data-status={verdict.status} data-npsh={npshNote ? "against" : undefined} data-start={startNote ? "against" : undefined} data-motor={motorNote ? "against" : undefined} data-staged-npsh={stagedNpshNote ? "against" : undefined} data-min-flow={minFlowNote ? "against" : undefined}>
      <span className={`inline-block rounded px-1.5 py-0.5 text-xs font-semibold ${VERDICT_TONE[verdict.status]}`}>{verdictLabel(verdict.status)}</span>
      {npshNote ? (
        <span className="text-xs font-semibold text-fail" data-testid={testId ? `${testId}-npsh` : undefined} title={npshRule ?? undefined}>
          {" — "}
          {npshNote}
        </span>
      ) : null}
      {startNote ? (
        <span className="text-xs font-semibold text-fail" data-testid={testId ? `${testId}-start` : undefined} title={STAGED_START_RULE}>
          {" — "}
          {startNote}
        </span>
      ) : null}
      {motorNote ? (
        <span className="text-xs font-semibold text-fail" data-testid={testId ? `${testId}-motor` : undefined} title={MOTOR_RULE}>
          {" — "}
          {motorNote}
        </span>
      ) : null}
      {stagedNpshNote ? (
        <span className="text-xs font-semibold text-fail" data-testid={testId ? `${testId}-staged-npsh` : undefined}>
          {" — "}
          {stagedNpshNote}
        </span>
      ) : null}
      {minFlowNote ? (
        <span className="text-xs font-semibold text-fail" data-testid={testId ? `${testId}-min-flow` : undefined} title={MIN_FLOW_RULE}>
          {" — "}
          {minFlowNote}
        </span>
      ) : null}
      {compact ? null : (
        <>
          {verdict.reasons.map((r, i) => (
            <p key={i} className="mt-1 text-xs">
              {r}
            </p>
          ))}
          <p className="mt-1 text-xs text-slate-500">{`Rule — ${verdict.rule}`}</p>
        </>
      )}
    </div>
  );
}

export function SizingCaution() {
  return (
    <p className="caution">
      Figures are for design guidance. Verify against the manufacturer's certified data, local codes and a licensed engineer before
      sizing pumps, pressures or motors.
    </p>
  );
}
