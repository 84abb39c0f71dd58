// The candidates compared side by side at their operating points (system page) and the selected pump's figures
// (selection report, screen and print). Pumps in parallel or series: each power figure names its basis — shaft power
// and electrical input per pump and for the duty pumps together, the largest power on the curve and the motor per pump
// (lib/projects/power-basis.ts); a single pump's figures read as they always did. All inputs SI; shown in the reader's units.
import type { WorkbenchView } from "~/lib/projects/workbench-view";
import type { FlowTolerance } from "~/engine";
import { fmtFlow, fmtHead, fmtPct, fmtPower, fmtQAboveZero, fmtQExact, renderUnits, type UnitChoice } from "~/lib/shared/units";
import { bandFlowText, bepPositionText, dutyFlowLimits, loadText, npshJudgedRange, npshLowestText, npshMarginText, npshPairText, npshPointsText, npshStatusText, npshUnjudgedText } from "./candidate-figures";
import type { BandPoint, NpshJudgement } from "~/lib/projects/candidate-judgement";
import { pumpsBasis, type PumpsBasis } from "~/lib/projects/power-basis";
import { cycleHoursText, energyRows } from "~/components/CandidateEnergy";
import { amountText, moneyText } from "~/components/energy-numbers";
import { serviceFactorNote } from "~/lib/projects/motor-service-factor";
import { adjustmentText, minFlowNoteOf, motorNoteOf, NOT_JUDGED, npshNoteOf, stagedNpshNoteOf, startNoteOf, VerdictView } from "./workbench";
import { minFlowAsRun, MIN_FLOW_RULE, readMinFlowCheck } from "~/lib/projects/verdict-min-flow";
import { perPumpPowerText, totalPowerText } from "./power-text";
import { npshrGapClauses } from "~/lib/projects/npshr-reach";

type Cand = WorkbenchView["candidates"][number];

const yes = (b: boolean | null | undefined, ok: string, bad: string) => (b == null ? "—" : b ? ok : bad);
const basisOf = (c: Cand) => pumpsBasis(c.adjustment);

/** "a – b" over the band's edges (one value when they agree to the shown digits). */
function range(band: BandPoint[] | undefined, pick: (b: BandPoint) => number | null, fmt: (x: number | null) => string): string {
  const xs = (band ?? []).map(pick);
  if (xs.length === 0) return "—";
  const shown = xs.map((x) => fmt(x));
  return shown.every((t) => t === shown[0]) ? shown[0] : shown.join(" – ");
}

/**
 * The NPSH margin ratios over the band, lowest – highest, or null where none means anything: never a ratio where NPSHa ≤ 0
 * (read by NPSHa). The judged points (`judgedAt`) when kept; a selection frozen before them: the band's two edges.
 */
function npshBandRange(band: BandPoint[] | undefined, n: NpshJudgement | null | undefined): string | null {
  if (n?.judgedAt) return npshJudgedRange(n);
  const meaningful = (band ?? []).filter((b) => b.npshMarginRatio != null && !(b.npshAvailable != null && b.npshAvailable <= 0));
  return meaningful.length ? range(meaningful, (b) => b.npshMarginRatio, (x) => npshMarginText(x, n?.requiredMargin)) : null;
}

/** The Crossing cell of a pump at zero flow: its shut-off head only balances the system's there (engine `dead-head`). */
export const deadHeadText = (units: UnitChoice, head: number) => `dead-head at ${fmtHead(units, head)}: no delivery (the shut-off head only balances the system's at zero flow)`;

/** " for 2 duty pumps" after a total of several pumps; "" for a single pump. */
const forAll = (c: Cand) => {
  const b = basisOf(c);
  return b ? ` ${b.forAll}` : "";
};

/** Shaft power over the band's edges: the totals as before for one pump; one pump's share and the duty pumps' for several. */
function bandPowerText(band: BandPoint[] | undefined, b: PumpsBasis | null, units: UnitChoice): string {
  const total = range(band, (e) => e.shaftPower, (x) => fmtPower(units, x));
  if (!b || !(band ?? []).some((e) => e.shaftPower != null)) return total;
  return `${range(band, (e) => (e.shaftPower == null ? null : e.shaftPower / b.n), (x) => fmtPower(units, x))} per pump, ${total} ${b.forAll}`;
}

/** The overload verdict with its rule and numbers; a selection frozen before it was kept says what it holds. */
function overloadText(f: NonNullable<NonNullable<Cand["result"]>["figures"]>): string {
  if (f.motorCheck) return f.motorCheck;
  return f.nonOverloading == null ? "overload not judged (the curve's power does not reach its end)" : yes(f.nonOverloading, "non-overloading", "can overload");
}

/**
 * The maker's minimum flow as the candidate runs it and the duty each running pump takes beside it (verdict-min-flow.ts), in
 * the reader's units: "none recorded" where the curve set has none; "—" for a selection frozen before it was kept. The row is
 * shown where some candidate's curve set records a figure.
 */
function minFlowCell(c: Cand, units: UnitChoice): React.ReactNode {
  const r = c.result;
  if (!r || r.minFlow === undefined) return "—";
  const check = readMinFlowCheck(r.minFlow);
  if (!check) return <span className="text-slate-600">none recorded for this curve</span>;
  const per = check.dutyPerPump;
  const share = check.running > 1 ? " per running pump" : "";
  return (
    <span data-testid={`min-flow-${c.id}`} title={MIN_FLOW_RULE}>
      {renderUnits(minFlowAsRun(check, per != null ? [per] : []), units)}
      {per != null ? (
        <span className={check.below ? "font-semibold text-fail" : ""}>
          {" · duty"}{share} {fmtQExact(units, "flow", per, [check.atPump])}: {check.below ? "below it" : "at or above it"}
        </span>
      ) : null}
    </span>
  );
}

/** " × 8000 h/yr": the hours the operating point's energy and cost count, the system's operating hours, the same for every candidate ("" in selections frozen before they were kept). */
const opHours = (view: WorkbenchView) => {
  const h = view.candidates.find((c) => c.result?.figures?.motor?.hoursPerYear != null)?.result?.figures?.motor.hoursPerYear;
  return h != null ? ` × ${amountText(h)} h/yr` : "";
};

/** Side-by-side figures of the candidates at their operating points. */
export function CandidateTable({ view, unitSystem, actions, duty, tolerance, currency = "" }: {
  view: WorkbenchView;
  unitSystem: UnitChoice;
  actions?: (c: Cand) => React.ReactNode;
  /** The duty and its tolerance the verdicts were judged on: the band's flows are written apart from their limits. */
  duty?: { flow: number } | null;
  tolerance?: FlowTolerance;
  /** The page's currency (the workspace's, or the selection's as frozen), for money where no candidate's figures name one. */
  currency?: string;
}) {
  if (view.candidates.length === 0) return null;
  const limits = dutyFlowLimits(duty?.flow, tolerance);
  const rows: [string, (c: Cand) => React.ReactNode][] = [
    ["Library", (c) => c.library],
    ["Adjustment", (c) => adjustmentText(c, unitSystem, true).replace(/^ \(|\)$/g, "") || "as published"],
    ["Verdict", (c) => (c.error ? <span className="text-fail">{c.error}</span> : c.result && c.result.verdict === undefined ? <span className="text-slate-600" data-testid={`verdict-${c.id}`} data-status="not-judged">{NOT_JUDGED}</span> : <VerdictView verdict={c.result?.verdict} testId={`verdict-${c.id}`} npshNote={npshNoteOf(c.result, unitSystem)} npshRule={c.result?.npsh?.rule} startNote={startNoteOf(c.result, unitSystem)} motorNote={motorNoteOf(c.result, unitSystem)} stagedNpshNote={stagedNpshNoteOf(c.result, c.energy, unitSystem)} minFlowNote={minFlowNoteOf(c.result, unitSystem)} />)],
    ["Operating flow (design curve)", (c) => fmtFlow(unitSystem, c.result?.operating?.flow)],
    ["Operating head (design curve)", (c) => fmtHead(unitSystem, c.result?.operating?.head)],
    ["Crossing", (c) => (c.error ? "—" : c.result?.operating?.flow === 0 ? <span className="text-duty-ink">{deadHeadText(unitSystem, c.result.operating.head)}</span> : c.result?.status === "ok" ? "one crossing" : <span className="text-duty-ink">{c.result?.message}</span>)],
    ["Band edges", (c) => (c.result?.band?.length ? c.result.band.map((b) => b.edge).join(" – ") : "—")],
    // Each edge's flow apart from the duty and its tolerance's limits: the demanding edge's decides the verdict above it.
    ["Flow over the band", (c) => <span data-testid={`band-flow-${c.id}`}>{range(c.result?.band, (b) => b.flow, (x) => bandFlowText(unitSystem, x, limits))}</span>],
    ["Head over the band", (c) => range(c.result?.band, (b) => b.head, (x) => fmtHead(unitSystem, x))],
    ["Efficiency over the band", (c) => range(c.result?.band, (b) => b.efficiency, (x) => fmtPct(x))],
    ["Shaft power over the band", (c) => bandPowerText(c.result?.band, basisOf(c), unitSystem)],
    ["NPSH margin over the band", (c) => {
      const n = c.result?.npsh;
      const bad = n && (n.status === "cavitation-risk" || n.status === "low-margin");
      const ratios = npshBandRange(c.result?.band, n);
      const unjudged = n && n.status === "unknown" ? npshUnjudgedText(n) : null;
      return (
        <span title={n ? [n.rule, npshPointsText(unitSystem, n)].filter(Boolean).join(". ") : undefined}>
          {ratios ?? (n && (n.status !== "unknown" || unjudged) ? null : "—")}
          {n && n.status !== "unknown" ? <span className={bad ? "font-semibold text-fail" : ""}>{ratios ? " — " : ""}{npshLowestText(unitSystem, n)} ({npshStatusText(n.status, n.requiredMargin, n.available != null && n.available <= 0)})</span> : null}
          {n && unjudged ? (
            <span className="font-semibold text-duty-ink">
              {ratios ? " — " : ""}
              {n.at ? `${npshLowestText(unitSystem, n)} among the judged; ` : ""}
              {unjudged} (unknown)
            </span>
          ) : null}
        </span>
      );
    }],
    ["Efficiency", (c) => fmtPct(c.result?.figures?.efficiency)],
    ["Shaft power", (c) => totalPowerText(unitSystem, c.result?.figures?.shaftPower, basisOf(c))],
    // Only where some candidate's curve set records the maker's figure (the table and the printed report stay as they were elsewhere).
    ...(view.candidates.some((c) => readMinFlowCheck(c.result?.minFlow)) ? [["Maker's minimum flow", (c: Cand) => minFlowCell(c, unitSystem)] as [string, (c: Cand) => React.ReactNode]] : []),
    ["Position vs BEP", (c) => (c.result?.figures?.bepRatio != null ? bepPositionText(c.result.figures.bepRatio, c.result.figures.inPor) : "—")],
    ["NPSHa / NPSHr (design curve)", (c) => (c.result?.figures?.npshAvailable != null ? npshPairText(unitSystem, c.result.figures.npshAvailable, c.result.figures.npshRequired) : "—")],
    // NPSHa at or below zero: its ratio to NPSHr means nothing; NPSHa is shown.
    ["NPSH margin", (c) => {
      const f = c.result?.figures;
      if (f?.npshAvailable != null && f.npshAvailable <= 0) return <span className="font-semibold text-fail">NPSHa {fmtQAboveZero(unitSystem, "head", f.npshAvailable)}, at or below zero (cavitation-risk)</span>;
      if (f?.npshMarginRatio != null) return <span className={f.npshStatus === "ok" ? "" : "font-semibold text-fail"}>{npshMarginText(f.npshMarginRatio, c.result?.npsh?.requiredMargin)} ({npshStatusText(f.npshStatus ?? "unknown", c.result?.npsh?.requiredMargin)})</span>;
      // NPSHa above zero and no NPSHr there: nothing was checked, said so with the flow (decision "npshzero") and where the
      // NPSHr curve stops, or its one point (npshr-reach.ts, decision "npshone"), never a bare dash.
      const q = c.result?.operating?.flow;
      if (!(f?.npshAvailable != null && f.npshRequired == null && q != null)) return "—";
      const design = c.result?.npsh?.judgedAt?.find((p) => p.at === "design point") ?? { at: "design point", flow: q };
      return <span className="font-semibold text-duty-ink">not checked: {renderUnits(npshrGapClauses(c.result?.npsh?.npshrPublished, [design], false).join("; "), unitSystem)}</span>;
    }],
    ["Largest power on curve", (c) => (c.result?.figures?.motorLimit != null && c.result.figures.maxPower != null ? `${fmtQExact(unitSystem, "power", c.result.figures.maxPower, [c.result.figures.motorLimit])}${basisOf(c) ? " per pump" : ""}` : perPumpPowerText(unitSystem, c.result?.figures?.maxPower, basisOf(c)))], // apart from the motor's limit beside it
    ["Motor", (c) => {
      const f = c.result?.figures;
      const mo = f?.motor;
      const b = basisOf(c);
      if (!f || !mo) return f?.motorLimit != null ? `${perPumpPowerText(unitSystem, f.motorLimit, b)} limit` : "—";
      return (
        <div>
          <div>
            {mo.rating != null ? `${fmtPower(unitSystem, mo.rating)} ${mo.ratingSource === "user" ? "(yours)" : "(suggested)"}${b ? " on each pump" : ""}` : "—"}
            {f.motorLimit != null ? ` · ${loadText(f.motorLoadAtDuty, mo.rating != null ? f.motorLimit / mo.rating : null)} load${b ? " per pump at the operating point" : ""}` : ""}
          </div>
          {serviceFactorNote(f) ? <div data-testid={`motor-sf-${c.id}`} className="font-semibold text-duty-ink">▲ {renderUnits(serviceFactorNote(f)!, unitSystem)}</div> : null}
          {f.motorLimit != null ? <div data-testid={`motor-check-${c.id}`} className={f.nonOverloading === false ? "font-semibold text-fail" : f.nonOverloading == null ? "font-semibold text-duty-ink" : ""}>{overloadText(f)}{b ? " (one pump)" : ""}</div> : null}
          <div className="text-xs text-slate-600">Suggested{b ? " per pump (each pump has its own motor)" : ""}: {mo.suggestionBasis}.</div>
        </div>
      );
    }],
    ["Motor and drive efficiency", (c) => {
      const mo = c.result?.figures?.motor;
      if (!mo) return "—";
      // No motor rated or suggested (no shaft power known, none typed): nothing to read an efficiency for.
      if (mo.rating == null) return <span className="text-slate-600" data-testid={`motor-eff-${c.id}`}>— (no motor: {mo.suggestionBasis})</span>;
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
    ["Electrical input", (c) => totalPowerText(unitSystem, c.result?.figures?.motor?.electricalPower, basisOf(c))],
    // At the design operating point for every running hour (hoursPerYear); the duty cycle's rows below spread the hours over part loads.
    // Each label names the hours its figures count: the operating point's (the system's operating hours), the duty cycle's (its steps' hours).
    [`Energy per year at the operating point${opHours(view)} (electrical, every running hour there)`, (c) => (c.result?.figures?.annualEnergyKWh != null ? `${amountText(c.result.figures.annualEnergyKWh)} kWh${forAll(c)}` : "—")],
    [`Energy cost per year at the operating point${opHours(view)}`, (c) => (c.result?.figures?.annualCost != null ? `${moneyText(c.result.figures.annualCost, c.result.figures.motor?.currency || currency)}${forAll(c)}` : moneyText(null, ""))],
    // Money in the figures' currency, else the page's: a candidate without an operating point has no figures to name one.
    ...energyRows(view.candidates.find((c) => c.result?.figures?.motor?.currency)?.result?.figures?.motor.currency || currency, cycleHoursText(view.candidates.map((c) => c.energy?.cycle))),
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
          {view.candidates.some((c) => c.result?.warnings.length || c.result?.ratioNote) ? (
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

