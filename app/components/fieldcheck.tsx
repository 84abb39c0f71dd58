// Pieces shared by the field-check pages: the safety caution, the labelled grade table, the
// verdict badge and the chart of the delivered point against the curve at the measured speed.
import { DutyChart } from "./chart/DutyChart";
import type { PumpSeries } from "./chart/types";
import { crossingOf, interpolateAt } from "./chart/scales";
import { TOLERANCE_GRADES } from "~/engine";
import { fmtPctLimit, fmtPctSide } from "~/engine/quantityText";
import { measuredRpmText, VERDICT_TEXT, type CheckResult, type CheckTimes, type Verdict } from "~/lib/fieldchecks";
import { fmtFlow, fmtHead, type UnitChoice } from "~/lib/shared/units";

export function FieldCaution() {
  return (
    <p className="caution">
      Pressurised systems, rotating equipment and electrical work are for qualified people. Follow the site's rules, local codes and licensed
      practice; isolate and lock off before fitting gauges or meters. Results are guidance from your readings, not a certification.
    </p>
  );
}


/** The grades table the verdict thresholds come from, with its source label. */
export function GradeTable({ highlight }: { highlight?: string }) {
  const source = TOLERANCE_GRADES[0]?.source ?? "";
  return (
    <details className="text-sm">
      <summary className="cursor-pointer">Tolerance grades (allowed deviation of the delivered point from the curve)</summary>
      <table className="mt-2 w-full text-left">
        <caption className="caption-bottom pt-1 text-left text-xs text-slate-600">Source: {source}.</caption>
        <thead className="text-slate-600">
          <tr>
            <th className="py-1">Grade</th>
            <th>Flow</th>
            <th>Head</th>
            <th>Power</th>
            <th>Efficiency</th>
          </tr>
        </thead>
        <tbody>
          {TOLERANCE_GRADES.map((g) => (
            <tr key={g.id} className={`border-t border-slate-100 ${g.id === highlight ? "font-semibold" : ""}`}>
              <td className="py-1">{g.id}</td>
              <td>
                {fmtPctSide(g.flow[0], "−")} / {fmtPctSide(g.flow[1], "+")}
              </td>
              <td>
                {fmtPctSide(g.head[0], "−")} / {fmtPctSide(g.head[1], "+")}
              </td>
              <td>{g.powerAbove !== undefined ? `≤ +${fmtPctLimit(g.powerAbove)}` : "—"}</td>
              <td>{g.efficiencyBelow !== undefined ? (g.efficiencyBelow === 0 ? "≥ the curve's" : `≥ −${fmtPctLimit(g.efficiencyBelow)}`) : "—"}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <p className="mt-1 text-xs text-slate-600">
        ISO 9906's tolerance cross: a point passes a grade when it meets either arm — its head within the head tolerance of the curve's head at the
        measured flow (head arm), or its flow within the flow tolerance of the curve's flow at the measured head (flow arm), the curve taken at the
        measured speed. “At the tolerance limit”: outside the grade as read, inside it within the gauges' and the flow meter's stated accuracy —
        while that accuracy is no wider than the grade's own tolerance (head: the gauges' in quadrature against the head arm at the
        curve's head; flow: the meter's against the flow arm). Wider, the readings cannot tell a pass from a fail: no tolerance verdict.
        Where a power was recorded with the motor's efficiency, the grade is met only if, as well, the shaft power (input × motor efficiency) is at
        most the allowance above the curve's at the measured flow, and the pump's efficiency (ρ·g·Q·H / shaft power) at most the allowance below the
        curve's — the efficiency allowance read as a fraction of the curve's efficiency, not percentage points (our reading from memory: verify
        against the standard). Without a power, or without the motor's efficiency, power and efficiency are not judged and the check says so. A
        power or efficiency limit missed as read is “at the tolerance limit” when the power reading's accuracy was entered and the limits are met at
        the lowest power within it (reading × (1 − accuracy)); without an accuracy, a limit missed as read is outside tolerance.
      </p>
    </details>
  );
}

const BADGE: Record<Verdict, string> = {
  pass: "border-brand-700 text-brand-800 bg-brand-50",
  marginal: "border-duty text-duty-ink bg-duty-soft",
  fail: "border-fail text-fail bg-fail-soft",
  unknown: "border-slate-400 text-slate-700 bg-slate-50",
};

/** When a check's readings were taken (the phone's clock) and recorded (the server's), with why the first may be wrong (taken-at.ts). */
export function CheckWhen({ times }: { times: CheckTimes }) {
  return (
    <>
      {times.text}
      {times.warnings.map((w) => (
        <span key={w} className="block text-xs text-fail" data-testid="clock-warning">
          {w}
        </span>
      ))}
    </>
  );
}

export function VerdictBadge({ verdict, grade, large }: { verdict: Verdict; grade?: string; large?: boolean }) {
  return (
    <span data-verdict={verdict} className={`inline-block rounded-full border px-2 ${large ? "py-1 text-base" : "text-xs"} font-semibold ${BADGE[verdict]}`}>
      {VERDICT_TEXT[verdict]}
      {grade && verdict !== "unknown" ? ` · grade ${grade}` : ""}
    </span>
  );
}

/**
 * The curve at the measured speed and the curve as selected, each with its operating point where it
 * meets the system curve (when the system curve is drawn), the delivered point from the readings as
 * its own mark, the design duty and (without a flow meter) the flow band.
 */
export function FieldCheckChart({ r, unitSystem, compact }: { r: CheckResult; unitSystem: UnitChoice; compact?: boolean }) {
  const c = r.chart;
  // Operating points on the system curve, from the stored (sampled) curves: before, the chart passed
  // the delivered reading as the measured curve's "operating point" and none for the curve as selected,
  // so the legend read "no operating point on the system curve" where the curves visibly cross.
  const onSystem = (head: PumpSeries["head"], eff: PumpSeries["head"]) => {
    const x = c.system ? crossingOf(head, c.system) : null;
    if (!x) return null;
    const e = interpolateAt(eff, x.flow);
    return { flow: x.flow, head: x.y, efficiency: e ?? undefined };
  };
  const pumps: PumpSeries[] = [
    { id: "selected", label: c.selectedLabel, colorIndex: 1, head: c.selected, efficiency: c.selectedEff.length >= 2 ? c.selectedEff : undefined, adjusted: true, operating: onSystem(c.selected, c.selectedEff) },
    {
      id: "measured",
      // The measured speed apart from the translation range's ends, as the Speed row and the warning (a check stored
      // before this read "At the measured 1450 rpm" for 1449.7 rpm of a 2900 rpm curve).
      label: r.speed.rescaled && r.speed.measured !== null ? `At the measured ${measuredRpmText(r.speed.measured, r.speed.rated)} rpm` : c.measuredLabel,
      colorIndex: 0,
      head: c.measured,
      efficiency: c.measuredEff.length >= 2 ? c.measuredEff : undefined,
      operating: onSystem(c.measured, c.measuredEff),
    },
  ];
  if (r.delivered.flow !== null) {
    pumps.push({ id: "delivered", label: "Delivered point (readings)", colorIndex: 2, head: [{ flow: r.delivered.flow, y: r.delivered.head }], operating: { flow: r.delivered.flow, head: r.delivered.head } });
  }
  if (c.band && c.band.low !== null && c.band.high !== null && c.band.high > c.band.low) {
    pumps.push({ id: "band", label: "Flow band from gauge accuracy", colorIndex: 3, head: [{ flow: c.band.low, y: r.delivered.head }, { flow: c.band.high, y: r.delivered.head }] });
  }
  const delivered = r.delivered.flow !== null ? `${fmtFlow(unitSystem, r.delivered.flow)} at ${fmtHead(unitSystem, r.delivered.head)}` : `head ${fmtHead(unitSystem, r.delivered.head)}, flow not on the curve`;
  return (
    <DutyChart
      unitSystem={unitSystem}
      title="Delivered duty point against the pump curve"
      description={`The delivered point (${delivered}), the pump curve ${r.speed.rescaled ? "rescaled to the measured speed" : "as compared"} and the curve as selected (dashed), each with its operating point on the system curve where it is drawn${r.duty ? ", and the design duty as a cross" : ""}${pumps.some((p) => p.id === "band") ? ", and the inferred flow band" : ""}.`}
      system={c.system ? { design: c.system } : undefined}
      pumps={pumps}
      // The design duty's label never reads as the delivered flow beside it (candidate-figures.ts dutyFlowText, as the report).
      duty={r.duty ? { ...r.duty, apartFrom: [r.delivered.flow] } : r.duty}
      flowMax={c.flowMax}
      compact={compact}
    />
  );
}
