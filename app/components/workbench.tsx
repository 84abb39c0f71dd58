// Pieces of the system page and the selection report: the chart built from a workbench, the
// per-run table and the candidate comparison table. All inputs SI; display through ./units.
import { DutyChart } from "./chart/DutyChart";
import type { PumpSeries } from "./chart/types";
import type { WorkbenchView } from "~/lib/projects/workbench-view";
import { fmtFlow, fmtHead, fmtNum, fmtPct, fmtPower, fmtQ, type UnitChoice } from "~/lib/shared/units";
import { bepPositionText, npshJudgedRange, npshLowestText, npshMarginText, npshPairText, npshPointsText } from "./candidate-figures";
import { verdictLabel, type Verdict } from "~/engine";
import type { BandPoint } from "~/lib/projects/candidate-judgement";
import { energyRows } from "~/components/CandidateEnergy";
import { amountText, moneyText } from "~/components/energy-numbers";
import { ListTable } from "./ListTable";

type Cand = WorkbenchView["candidates"][number];

export function candidateSeries(c: Cand, i: number, units: UnitChoice): PumpSeries | null {
  const r = c.result;
  if (!r) return null;
  const pick = (k: "efficiency" | "power" | "npshr") => {
    const pts = r.curve.filter((p) => p[k] != null).map((p) => ({ flow: p.flow, y: p[k] as number }));
    return pts.length >= 2 ? pts : undefined;
  };
  return {
    id: String(c.id),
    label: `${c.label}${adjustmentText(c, units)} — ${r.verdict ? verdictLabel(r.verdict.status) : "no duty to judge"}`,
    colorIndex: i,
    head: r.curve.map((p) => ({ flow: p.flow, y: p.head })),
    efficiency: pick("efficiency"),
    power: pick("power"),
    npshr: pick("npshr"),
    adjusted: c.adjustment.method !== "none" || c.adjustment.arrangement !== "single",
    por: r.por ?? undefined,
    bep: r.figures?.bepFlow != null && r.figures.bepHead != null ? { flow: r.figures.bepFlow * (c.adjustment.arrangement === "parallel" ? c.adjustment.dutyPumps : 1), head: r.figures.bepHead * (c.adjustment.arrangement === "series" ? c.adjustment.dutyPumps : 1) } : undefined,
    operating: r.operating
      ? { flow: r.operating.flow, head: r.operating.head, efficiency: r.figures?.efficiency ?? undefined, power: r.figures?.shaftPower ?? undefined, npshr: r.figures?.npshRequired ?? undefined }
      : null,
  };
}

/** How the candidate runs, in words, with the trimmed diameter in the reader's units. */
export function adjustmentText(c: { adjustment: Cand["adjustment"]; result: Cand["result"] }, units: UnitChoice): string {
  const a = c.adjustment;
  const parts: string[] = [];
  if (a.method === "speed") parts.push(`at ${fmtNum((c.result?.ratio ?? 1) * 100, 1)} % speed${c.result?.speed ? ` (${Math.round(c.result.speed)} rpm)` : ""}`);
  if (a.method === "trim") parts.push(`trimmed to ${c.result?.diameter ? `Ø${fmtQ(units, "diameter", c.result.diameter)}` : `${fmtNum((c.result?.ratio ?? 1) * 100, 1)} %`}`);
  if (a.arrangement !== "single") parts.push(`${a.dutyPumps} in ${a.arrangement}${a.standbyPumps ? ` + ${a.standbyPumps} standby` : ""}`);
  return parts.length ? ` (${parts.join(", ")})` : "";
}

export function WorkbenchChart({ view, unitSystem, duty, title, compact }: { view: WorkbenchView; unitSystem: UnitChoice; duty: { flow: number; head: number } | null; title: string; compact?: boolean }) {
  const ev = view.evaluation;
  const pumps = view.candidates.map((c, i) => candidateSeries(c, i, unitSystem)).filter((x): x is PumpSeries => x != null);
  return (
    <DutyChart
      unitSystem={unitSystem}
      title={title}
      description={`System curve with its band (low/high static level × new/aged pipe)${pumps.length ? `, ${pumps.length} candidate pump curve(s) and their operating points` : ""}${duty ? ", and the duty point" : ""}.`}
      system={ev ? { design: ev.flows.map((q, i) => ({ flow: q, y: ev.design[i] })), low: ev.flows.map((q, i) => ({ flow: q, y: ev.low[i] })), high: ev.flows.map((q, i) => ({ flow: q, y: ev.high[i] })) } : undefined}
      pumps={pumps}
      npsha={ev?.npsha}
      duty={duty}
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
            <td>{r.reynolds.toExponential(2)}</td>
            <td>{r.frictionFactor.toFixed(4)}</td>
            <td>{r.regime}</td>
            <td>{fmtHead(unitSystem, r.headLoss)}</td>
          </tr>
        ))}
      </ListTable>
    </div>
  );
}

const yes = (b: boolean | null | undefined, ok: string, bad: string) => (b == null ? "—" : b ? ok : bad);

const VERDICT_TONE: Record<Verdict["status"], string> = {
  meets: "bg-emerald-100 text-emerald-900",
  short: "bg-red-100 text-red-900",
  oversized: "bg-amber-100 text-amber-900",
  "outside-catalogue": "bg-red-100 text-red-900",
  "no-operating-point": "bg-red-100 text-red-900",
  "viscosity-uncorrected": "bg-amber-100 text-amber-900",
};

/** The verdict as a badge (status), with its rule and reasons below unless `compact`. */
export function VerdictView({ verdict, compact, testId }: { verdict: Verdict | null | undefined; compact?: boolean; testId?: string }) {
  if (!verdict) return <span className="text-slate-600" data-testid={testId} data-status="none">no duty point set: nothing to judge</span>;
  return (
    <div data-testid={testId} data-status={verdict.status}>
      <span className={`inline-block rounded px-1.5 py-0.5 text-xs font-semibold ${VERDICT_TONE[verdict.status]}`}>{verdictLabel(verdict.status)}</span>
      {compact ? null : (
        <>
          {verdict.reasons.map((r, i) => (
            <p key={i} className="mt-1 text-xs">
              {r}
            </p>
          ))}
          <p className="mt-1 text-xs text-slate-500">Rule — {verdict.rule}</p>
        </>
      )}
    </div>
  );
}

/** "a – b" over the band's edges (one value when they agree to the shown digits). */
function range(band: BandPoint[] | undefined, pick: (b: BandPoint) => number | null, fmt: (x: number | null) => string): string {
  const xs = (band ?? []).map(pick);
  if (xs.length === 0) return "—";
  const shown = xs.map((x) => fmt(x));
  return shown.every((t) => t === shown[0]) ? shown[0] : shown.join(" – ");
}

/** Side-by-side figures of the candidates at their operating points. */
export function CandidateTable({ view, unitSystem, actions }: { view: WorkbenchView; unitSystem: UnitChoice; actions?: (c: Cand) => React.ReactNode }) {
  if (view.candidates.length === 0) return null;
  const rows: [string, (c: Cand) => React.ReactNode][] = [
    ["Library", (c) => c.library],
    ["Adjustment", (c) => adjustmentText(c, unitSystem).replace(/^ \(|\)$/g, "") || "as published"],
    ["Verdict", (c) => (c.error ? <span className="text-fail">{c.error}</span> : <VerdictView verdict={c.result?.verdict} testId={`verdict-${c.id}`} />)],
    ["Operating flow (design curve)", (c) => fmtFlow(unitSystem, c.result?.operating?.flow)],
    ["Operating head (design curve)", (c) => fmtHead(unitSystem, c.result?.operating?.head)],
    ["Crossing", (c) => (c.error ? "—" : c.result?.status === "ok" ? "one crossing" : <span className="text-duty-ink">{c.result?.message}</span>)],
    ["Band edges", (c) => (c.result?.band?.length ? c.result.band.map((b) => b.edge).join(" – ") : "—")],
    ["Flow over the band", (c) => <span data-testid={`band-flow-${c.id}`}>{range(c.result?.band, (b) => b.flow, (x) => fmtFlow(unitSystem, x))}</span>],
    ["Head over the band", (c) => range(c.result?.band, (b) => b.head, (x) => fmtHead(unitSystem, x))],
    ["Efficiency over the band", (c) => range(c.result?.band, (b) => b.efficiency, (x) => fmtPct(x))],
    ["Shaft power over the band", (c) => range(c.result?.band, (b) => b.shaftPower, (x) => fmtPower(unitSystem, x))],
    ["NPSH margin over the band", (c) => {
      const n = c.result?.npsh;
      const bad = n && (n.status === "cavitation-risk" || n.status === "low-margin");
      return (
        <span title={n ? [n.rule, npshPointsText(unitSystem, n)].filter(Boolean).join(". ") : undefined}>
          {npshJudgedRange(n) ?? range(c.result?.band, (b) => b.npshMarginRatio, (x) => npshMarginText(x, n?.requiredMargin))}
          {n && n.status !== "unknown" ? <span className={bad ? "font-semibold text-fail" : ""}> — {npshLowestText(unitSystem, n)} ({n.status})</span> : null}
        </span>
      );
    }],
    ["Efficiency", (c) => fmtPct(c.result?.figures?.efficiency)],
    ["Shaft power", (c) => fmtPower(unitSystem, c.result?.figures?.shaftPower)],
    ["Position vs BEP", (c) => (c.result?.figures?.bepRatio != null ? bepPositionText(c.result.figures.bepRatio, c.result.figures.inPor) : "—")],
    ["NPSHa / NPSHr", (c) => (c.result?.figures?.npshAvailable != null ? npshPairText(unitSystem, c.result.figures.npshAvailable, c.result.figures.npshRequired) : "—")],
    ["NPSH margin", (c) => (c.result?.figures?.npshMarginRatio != null ? <span className={c.result.figures.npshStatus === "ok" ? "" : "font-semibold text-fail"}>{npshMarginText(c.result.figures.npshMarginRatio, c.result.npsh?.requiredMargin)} ({c.result.figures.npshStatus})</span> : "—")],
    ["Largest power on curve", (c) => fmtPower(unitSystem, c.result?.figures?.maxPower)],
    ["Motor", (c) => {
      const f = c.result?.figures;
      const mo = f?.motor;
      if (!f || !mo) return f?.motorLimit != null ? `${fmtPower(unitSystem, f.motorLimit)} limit` : "—";
      return (
        <div>
          <div>
            {mo.rating != null ? `${fmtPower(unitSystem, mo.rating)} ${mo.ratingSource === "user" ? "(yours)" : "(suggested)"}` : "—"}
            {f.motorLimit != null ? ` · ${f.nonOverloading == null ? "overload not judged (the curve's power does not reach its end)" : yes(f.nonOverloading, "non-overloading", "can overload")} · ${fmtPct(f.motorLoadAtDuty, 0)} load` : ""}
          </div>
          <div className="text-xs text-slate-600">Suggested: {mo.suggestionBasis}.</div>
        </div>
      );
    }],
    ["Motor and drive efficiency", (c) => {
      const mo = c.result?.figures?.motor;
      if (!mo) return "—";
      return (
        <div>
          <div>
            motor {fmtPct(mo.efficiency)} ({mo.ieClass}){mo.driveEfficiency != null ? ` · drive ${fmtPct(mo.driveEfficiency, 0)}` : " · no drive"}
          </div>
          <div className="text-xs text-slate-600">
            {mo.efficiencySource}
            {mo.driveSource ? `; ${mo.driveSource}` : ""}
          </div>
        </div>
      );
    }],
    ["Electrical input", (c) => fmtPower(unitSystem, c.result?.figures?.motor?.electricalPower)],
    ["Energy per year (electrical)", (c) => (c.result?.figures?.annualEnergyKWh != null ? `${amountText(c.result.figures.annualEnergyKWh)} kWh` : "—")],
    ["Energy cost per year", (c) => moneyText(c.result?.figures?.annualCost, c.result?.figures?.motor?.currency ?? "")],
    ...energyRows(view.candidates.find((c) => c.result?.figures?.motor?.currency)?.result?.figures?.motor.currency ?? ""),
  ];
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-sm" aria-label="Candidates compared">
        <thead>
          <tr className="text-left">
            <th className="py-1 pr-2 text-slate-600">Figure</th>
            {view.candidates.map((c, i) => (
              <th key={c.id} className="min-w-40 px-2 align-bottom">
                <span className="mr-1 inline-block rounded bg-slate-800 px-1 text-xs text-white">{i + 1}</span>
                {c.label}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {rows.map(([label, cell]) => (
            <tr key={label} className="border-t border-slate-100 align-top">
              <th scope="row" className="py-1 pr-2 text-left font-normal text-slate-600">
                {label}
              </th>
              {view.candidates.map((c) => (
                <td key={c.id} className="px-2 py-1">
                  {cell(c)}
                </td>
              ))}
            </tr>
          ))}
          {view.candidates.some((c) => c.result?.warnings.length) ? (
            <tr className="border-t border-slate-100 align-top">
              <th scope="row" className="py-1 pr-2 text-left font-normal text-slate-600">
                Notes
              </th>
              {view.candidates.map((c) => (
                <td key={c.id} className="px-2 py-1 text-xs text-duty-ink">
                  {c.result?.ratioNote ? <div>Ratio {c.result.ratioNote}.</div> : null}
                  {c.result?.warnings.map((w, j) => (
                    <div key={j}>▲ {w}</div>
                  ))}
                </td>
              ))}
            </tr>
          ) : null}
          {actions ? (
            <tr className="no-print border-t border-slate-100 align-top">
              <td />
              {view.candidates.map((c) => (
                <td key={c.id} className="px-2 py-2">
                  {actions(c)}
                </td>
              ))}
            </tr>
          ) : null}
        </tbody>
      </table>
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
