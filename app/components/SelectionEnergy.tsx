// The selection report's duty cycle and life-cycle cost (as frozen with the selection).
import { lccRatesText, lccShown, noStepCounted, pumpsRunningText, type CandidateEnergy } from "~/lib/projects/energy";
import { CandidateCycle, cycleBasis, cycleEnergyText, cycleHoursText, cycleStaged, lccSeriesLabel, lccText } from "~/components/CandidateEnergy";
import { stepName } from "~/components/cycle-notes";
import { PARALLEL_STAGING_RULE } from "~/engine";
import { cycleFiguresBasis } from "~/lib/projects/power-basis";
import { LifeCycleChart } from "~/components/LifeCycleChart";
import { cycleNoteLines } from "~/components/cycle-notes";
import type { UnitChoice } from "~/lib/shared/units";

type Cand = Parameters<typeof cycleBasis>[0] & { energy?: CandidateEnergy | null };

export function SelectionEnergy({ c, unitSystem, currency }: { c: Cand; unitSystem: UnitChoice; currency: string }) {
  const e = c.energy;
  // Whose the cycle's energy is (power-basis.ts): the pumps running at each step when staged, else the duty pumps together.
  const whose = cycleFiguresBasis(cycleBasis(c), cycleStaged(e?.cycle));
  const lcc = lccShown(e);
  if (!e) return null; // selections frozen before load profiles have none
  return (
    <section className="panel break-inside-avoid space-y-2" aria-labelledby="sel-energy-h">
      <h2 id="sel-energy-h" className="font-semibold">
        Energy over the duty cycle and life-cycle cost
      </h2>
      <p className="text-xs text-slate-600">
        Control: {e.controlLabel}. Profile: {e.profileSource === "common-practice" ? <strong>common practice</strong> : "given"} — {e.profileLabel}.
      </p>
      {/* Printed as one summary line (the report stays on two pages); the steps, chart and assumptions on screen and in the exports.
          A staged cycle's energy is of the pumps running at each step, not of every duty pump together (the table's words). */}
      <p className="hidden text-xs print:block" data-testid="energy-print">
        {e.cycle ? `Energy per year${whose ? `, ${whose.together},` : ""} over ${e.cycle.steps.length} step${e.cycle.steps.length === 1 ? "" : "s"}${cycleHoursText([e.cycle])}: ${cycleEnergyText(e)}` : e.cycleError}
        {/* With the rates it was computed with (years, tariff escalation, discount rate), as the screen's assumption line. */}
        {e.lcc || e.costMissing ? `; life-cycle cost (present value): ${lccText(e, currency, true)}` : ""}
        {lcc ? ` (${lcc.source})` : ""}.
      </p>
      {/* Pumps in parallel staged by demand: how many run at each step, with the rule (the screen's "Pumps running" column). */}
      {e.cycle && cycleStaged(e.cycle) ? (
        <p className="hidden text-xs print:block" data-testid="pumps-running-print">
          Pumps running: {e.cycle.steps.map((s) => `${stepName(s)}: ${pumpsRunningText(s)}`).join("; ")} ({PARALLEL_STAGING_RULE}).
        </p>
      ) : null}
      {/* A step not met or not computed, and each warning, printed at its step with the engine's message. */}
      {e.cycle && cycleNoteLines(e.cycle).length > 0 ? (
        <ul className="hidden list-disc pl-5 text-xs text-duty-ink print:block" data-testid="cycle-notes-print">
          {cycleNoteLines(e.cycle).map((l) => (
            <li key={l}>{l}</li>
          ))}
        </ul>
      ) : null}
      <div className="no-print space-y-2">
        <CandidateCycle c={c} n={1} unitSystem={unitSystem} currency={currency} />
        {lcc ? <LifeCycleChart title="Cumulative life-cycle cost (present value) by year" currency={currency} series={[{ id: c.id, label: lccSeriesLabel(c.label, e, lcc), cumulative: lcc.cumulative }]} /> : null}
        {noStepCounted(e.cycle) ? <p className="text-xs text-duty-ink" data-testid="lcc-not-drawn">Life-cycle cost not drawn: not computed ({noStepCounted(e.cycle)}).</p> : null}
        <ul className="list-disc pl-5 text-xs text-slate-600">
          {e.assumptions.map((a) => (
            <li key={a}>{a}</li>
          ))}
          {lcc ? <li>Life-cycle cost: {lccRatesText(lcc)}; {lcc.source}.</li> : null}
        </ul>
      </div>
    </section>
  );
}
