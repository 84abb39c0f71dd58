// Each candidate over the system's duty cycle (operating point, speed, efficiencies, electrical input
// and energy at each step, the total per year) and its life-cycle cost, with the cumulative-cost chart.
import { Fragment } from "react";
import { Form } from "react-router";
import { lccRangeNoteOf, lccRatesText, lccShown, lccYears, missingStepsText, noStepCounted, pumpsRunningText, type CandidateEnergy as Energy } from "~/lib/projects/energy";
import { typedFor, type TypedForm } from "~/lib/projects/typed-back";
import { fmtFlow, fmtHead, fmtNum, fmtPct, fmtPower, type UnitChoice } from "~/lib/shared/units";
import { LifeCycleChart } from "~/components/LifeCycleChart";
import { cycleWarnings, stepVerdict, stepWarnings } from "~/components/cycle-notes";
import { amountText, column, moneySumNote, moneyText, printedSum } from "~/components/energy-numbers";
import { cycleFiguresBasis, pumpsBasis, STAGED_BASIS, type PumpsBasis } from "~/lib/projects/power-basis";

/** A candidate with its energy; `adjustment` says how many duty pumps the cycle's power and energy are for (absent: one). */
type Cand = { id: number; label: string; energy?: Energy | null; adjustment?: { arrangement: "single" | "parallel" | "series"; dutyPumps: number; standbyPumps?: number } };

/** The basis of a candidate's cycle figures (lib/projects/power-basis.ts): null for a single pump. */
export const cycleBasis = (c: Cand): PumpsBasis | null => (c.adjustment ? pumpsBasis(c.adjustment) : null);
type Cycle = NonNullable<Energy["cycle"]>;

/**
 * The mark beside every energy total and life-cycle cost built on a cycle with steps whose energy is missing (not met,
 * or not computed: the figure is too low and not comparable with a complete one), in the steps' own words: "" when complete.
 */
export function incompleteMark(cycle: Energy["cycle"] | undefined): string {
  if (!cycle || cycle.complete) return "";
  return ` (incomplete: ${missingStepsText(cycle)})`;
}

/** Whether a cycle's pumps in parallel are staged by demand (engine dutyStaging.ts): its steps say how many run; none in cycles frozen before. */
export const cycleStaged = (cycle: Pick<Cycle, "steps"> | null | undefined): boolean => !!cycle?.steps.some((s) => s.pumpsRunning != null);

/** A staged step's shaft power: the running pumps' together, and one pump's beside it where several run. */
const shaftText = (u: UnitChoice, s: Cycle["steps"][number]) =>
  s.pumpsRunning != null && s.pumpsRunning > 1 && s.pumpShaftPower != null ? `${fmtPower(u, s.shaftPower)}, ${fmtPower(u, s.pumpShaftPower)} each` : fmtPower(u, s.shaftPower);

/** The cycle's hours and energy columns, each at one precision with its total (energy-numbers.ts). */
export const cycleColumns = (cycle: Cycle) => ({
  hours: column(cycle.steps.map((s) => s.hours), cycle.totalHours),
  energy: column(cycle.steps.map((s) => s.energyKWh), cycle.annualEnergyKWh),
});

/**
 * The cycle's energy per year as shown in the table and the printed report, marked when incomplete or when no hours are
 * given; after it, with `basis` naming several pumps, whose it is (power-basis.ts `cycleFiguresBasis`): "for 2 duty
 * pumps", or "for the pumps running at each step" where the cycle is staged by demand (the printed line says so before it instead).
 */
export function cycleEnergyText(e: Energy | null | undefined, basis: PumpsBasis | null = null): string {
  if (!e?.cycle) return e?.cycleError ?? "—";
  if (e.cycle.totalHours === 0) return "— (no operating hours given)";
  const none = noStepCounted(e.cycle);
  if (none) return `not computed (${none})`;
  const whose = cycleFiguresBasis(basis, cycleStaged(e.cycle));
  return `${cycleColumns(e.cycle).energy.total} kWh${whose ? ` ${whose.forAll}` : ""}${incompleteMark(e.cycle)}`;
}

/** The life-cycle cost's plausibility warnings (engine lifeCycleCost.ts; none in selections frozen before them). */
export const lccWarnings = (lcc: Energy["lcc"] | undefined): string[] => (lcc?.warnings ?? []).map((w) => w.message);

/** Beside a life-cycle cost with no purchase price: what it is of (a price of 0 is a price: nothing said). */
export const NO_PRICE_WORDS = "purchase price not given: energy alone";

/**
 * The life-cycle cost as one line: its total and years (with `rates`, the tariff escalation and discount rate too), what it
 * is of without a purchase price, marked when incomplete, with the priced steps outside the pump's allowable flow range
 * (lcc-range-note.ts) and its warnings (rule and numbers); why there is none when hours or tariff are not given.
 */
export function lccText(e: Energy | null | undefined, currency: string, rates = false, withRange = true): string {
  const lcc = lccShown(e);
  // `rates`: the period with the rates it was computed with ("over 15 years at a tariff escalation of +3 %/year and a discount rate of 5 %/year"), for the printed line.
  if (lcc) {
    const range = withRange ? lccRangeNoteOf(e) : null;
    return `${moneyText(lcc.total, currency)} ${rates ? lccRatesText(lcc) : `over ${lccYears(lcc)}`}${lcc.purchaseGiven ? "" : ` (${NO_PRICE_WORDS})`}${incompleteMark(e!.cycle)}${range ? ` — ▲ ${range}` : ""}${lccWarnings(lcc).map((w) => ` — ▲ ${w}`).join("")}`;
  }
  const none = noStepCounted(e?.cycle);
  if (none) return `not computed (${none})`;
  return e?.costMissing ? `— (${e.costMissing})` : "—";
}

/**
 * A candidate's line on the cumulative life-cycle cost chart: its label, marked as the table's row is — incomplete, and
 * without a purchase price "energy alone" (a price of 0 is a price: nothing said), so the chart compares what the table does.
 */
export const lccSeriesLabel = (label: string, e: Energy, lcc: NonNullable<Energy["lcc"]>): string =>
  `${label}${lcc.purchaseGiven ? "" : ` (${NO_PRICE_WORDS})`}${incompleteMark(e.cycle)}`;

/**
 * Why a candidate of the table has no line on the chart, in the table's words (null: drawn): no duty cycle (its error), no
 * step counted, or no energy cost (what is not given) — every candidate is drawn or named under the chart.
 */
export function lccNotDrawn(e: Energy | null | undefined): string | null {
  if (lccShown(e)) return null;
  if (!e) return "no energy figures";
  if (!e.cycle) return e.cycleError ?? "no duty cycle";
  const none = noStepCounted(e.cycle);
  if (none) return `not computed (${none})`;
  return e.costMissing ? `no life-cycle cost (${e.costMissing})` : "no life-cycle cost";
}

/** ", 1000 h/yr": the hours a duty cycle's energy and cost count (the profile's, the same for every candidate); "" without a cycle or hours. */
export const cycleHoursText = (cycles: readonly (Energy["cycle"] | undefined)[]): string => {
  const h = cycles.find((x) => x != null)?.totalHours;
  return h != null && h > 0 ? `, ${amountText(h)} h/yr` : "";
};

/** Rows for the candidates table: cycle energy (its hours in the label), purchase price, life-cycle cost. */
export const energyRows = (currency: string, hours = ""): [string, (c: Cand) => React.ReactNode][] => [
  [`Energy per year over the duty cycle${hours}`, (c) => cycleEnergyText(c.energy, cycleBasis(c))],
  // As entered for the candidate as offered: with several pumps, the price of all of them (standby included).
  ["Purchase price", (c) => `${moneyText(c.energy?.purchasePrice, currency)}${c.energy?.purchasePrice != null && cycleBasis(c) ? ` for all ${cycleBasis(c)!.arrangement}` : ""}`],
  // The steps priced outside the allowable flow range beside the cost on screen; printed once, on the report's energy line
  // (SelectionEnergy), so the report keeps to two pages.
  ["Life-cycle cost (present value)", (c) => {
    const range = lccRangeNoteOf(c.energy);
    return range ? <>{lccText(c.energy, currency, false, false)}<span className="no-print"> — ▲ {range}</span></> : lccText(c.energy, currency);
  }],
];

export function CandidateEnergyPanel({ candidates, unitSystem, currency, canWrite, errors, typedForm }: { candidates: Cand[]; unitSystem: UnitChoice; currency: string; canWrite: boolean; errors?: Record<string, string>; typedForm?: TypedForm }) {
  if (candidates.length === 0) return null;
  const first = candidates.find((c) => c.energy)?.energy;
  return (
    <section className="panel space-y-3" aria-labelledby="energy-h">
      <h2 id="energy-h" className="font-semibold">
        Energy over the duty cycle and life-cycle cost
      </h2>
      {first ? (
        <p className="text-xs text-slate-600">
          Control: {first.controlLabel}. Profile: {first.profileSource === "common-practice" ? <strong>common practice</strong> : "given"} — {first.profileLabel}.
        </p>
      ) : null}
      {candidates.map((c, i) => (
        <CandidateCycle key={c.id} c={c} n={i + 1} unitSystem={unitSystem} currency={currency} canWrite={canWrite} error={errors?.[`price.${c.id}`]} typedPrice={typedFor(typedForm, `price.${c.id}`)?.purchasePrice} />
      ))}
      <LifeCycleChart
        title="Cumulative life-cycle cost (present value) by year"
        currency={currency}
        series={candidates.flatMap((c, i) => { const lcc = lccShown(c.energy); return lcc ? [{ id: c.id, label: lccSeriesLabel(`${i + 1} ${c.label}`, c.energy!, lcc), cumulative: lcc.cumulative }] : []; })}
        notDrawn={candidates.flatMap((c, i) => { const why = lccNotDrawn(c.energy); return why ? [`${i + 1} ${c.label}: ${why}`] : []; })}
      />
      {first ? (
        <ul className="list-disc pl-5 text-xs text-slate-600">
          {panelAssumptions(candidates).map((a) => (
            <li key={a}>{a}</li>
          ))}
          {first.lcc ? <li>Life-cycle cost: {lccRatesText(first.lcc)}; {first.lcc.source}.</li> : null}
        </ul>
      ) : null}
    </section>
  );
}

/**
 * The assumptions every candidate's cycle rests on, once; then one candidate's own (a set speed above its curve's, a
 * viscous liquid's B at its slowest step) under its number and label — it showed the first candidate's list only.
 */
export function panelAssumptions(candidates: readonly { label: string; energy?: Energy | null }[]): string[] {
  const lists = candidates.map((c) => c.energy?.assumptions ?? null);
  const given = lists.filter((l): l is string[] => l !== null);
  const shared = (given[0] ?? []).filter((a) => given.every((l) => l.includes(a)));
  const own = candidates.flatMap((c, i) => (lists[i] ?? []).filter((a) => !shared.includes(a)).map((a) => `${i + 1} ${c.label}: ${a}`));
  return [...shared, ...own];
}

/** What the total row says when the rows as printed do not add up to it ("" when they do). */
function roundedNote(cols: ReturnType<typeof cycleColumns>): string {
  const off = [cols.hours.addsUp ? "" : `hours add up to ${printedSum(cols.hours)} h`, cols.energy.addsUp ? "" : `energy adds up to ${printedSum(cols.energy)} kWh`].filter(Boolean);
  return off.length ? `Rows are rounded: as printed, their ${off.join(" and their ")}; the totals are of the unrounded values.` : "";
}

/** `typedPrice`: the price as posted in this form's refused post (typed-back.ts), shown in place of the stored one. */
export function CandidateCycle({ c, n, unitSystem, currency, canWrite, error, typedPrice }: { c: Cand; n: number; unitSystem: UnitChoice; currency: string; canWrite?: boolean; error?: string; typedPrice?: string }) {
  const e = c.energy;
  const lcc = lccShown(e);
  const cols = e?.cycle ? cycleColumns(e.cycle) : null;
  const staged = cycleStaged(e?.cycle);
  const span = staged ? 1 : 0; // the "Pumps running" column
  return (
    <div className="space-y-1" data-testid={`cycle-${c.id}`}>
      <h3 className="text-sm font-semibold">
        <span className="mr-1 inline-block rounded bg-slate-800 px-1 text-xs text-white">{n}</span>
        {c.label}
      </h3>
      {e?.cycle && cycleBasis(c) ? (
        <p className="text-xs text-slate-600" data-testid={`cycle-basis-${c.id}`}>
          {staged
            ? `${cycleBasis(c)!.arrangement}: flow, head, shaft power, electrical input and energy are for ${STAGED_BASIS} (“Pumps running”), staged by demand${c.adjustment?.standbyPumps ? "; standby pumps never run" : ""}; each motor is one pump's.`
            : <>{cycleBasis(c)!.arrangement}: flow, head, shaft power, electrical input and energy are for the {cycleBasis(c)!.together}{c.adjustment?.standbyPumps ? " (standby pumps do not run)" : ""}; each motor is one pump&apos;s.</>}
        </p>
      ) : null}
      {!e ? <p className="text-xs text-slate-600">Not computed.</p> : e.cycleError ? <p className="text-xs text-duty-ink">{e.cycleError}.</p> : null}
      {e?.costMissing ? (
        <p className="text-xs text-duty-ink" data-testid={`cost-missing-${c.id}`}>
          ▲ {e.costMissing}: no energy cost counted and no life-cycle cost.
        </p>
      ) : null}
      {e?.cycle && cols ? (
        <div className="overflow-x-auto">
          <table className="w-full text-xs" aria-label={`Duty cycle of ${c.label}`}>
            <thead>
              <tr className="text-left text-slate-600">
                {["Flow %", ...(staged ? ["Pumps running"] : []), "Flow", "Head", "Speed", "Pump η", "Shaft", "Motor η", "Drive η", "Electrical", "Hours", "Energy"].map((h) => (
                  <th key={h} className="pr-2 font-normal">
                    {h}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {e.cycle.steps.map((s, i) => (
                <Fragment key={i}>
                  <tr className="border-t border-slate-100">
                    <td className="pr-2">{fmtNum(s.flowFraction * 100, 0)} %</td>
                    {staged ? <td className="pr-2" data-testid={`pumps-running-${c.id}-${i}`}>{pumpsRunningText(s)}</td> : null}
                    <td className="pr-2">{fmtFlow(unitSystem, s.flow)}</td>
                    <td className="pr-2">{fmtHead(unitSystem, s.head)}</td>
                    {s.status === "ok" || s.status === "throttled-at-min-on-curve-speed" ? (
                      <>
                        {/* The speed as the engine states it: "full speed, throttled", "84.2 % speed", "held at the lowest speed 30 %, throttled";
                            held at the lowest on-curve speed: the speed here, the engine's rule and numbers on the row below. */}
                        <td className="pr-2">{s.status === "ok" ? s.message || fmtPct(s.speedRatio, 0) : `${fmtPct(s.speedRatio)} speed, throttled`}</td>
                        <td className="pr-2">{fmtPct(s.efficiency)}</td>
                        <td className="pr-2">{shaftText(unitSystem, s)}</td>
                        <td className="pr-2">{fmtPct(s.motorEfficiency)}</td>
                        <td className="pr-2">{s.driveEfficiency == null ? "no drive" : fmtPct(s.driveEfficiency)}</td>
                        <td className="pr-2">{fmtPower(unitSystem, s.electricalPower)}</td>
                      </>
                    ) : s.status === "gravity-flow" || s.status === "no-demand" ? (
                      // No pump head needed, or no demand (0 % flow): met, pump stopped, 0 kWh, with the engine's assumption (not a warning mark).
                      <td colSpan={6} className="pr-2 text-slate-700" data-testid={`step-${c.id}-${i}`}>
                        {stepVerdict(s)}: {s.message}
                      </td>
                    ) : (
                      <td colSpan={6} className="pr-2 text-duty-ink" data-testid={`step-${c.id}-${i}`}>
                        ▲ {stepVerdict(s)}: {s.message}
                      </td>
                    )}
                    <td className="pr-2">{cols.hours.rows[i]}</td>
                    <td className="pr-2">{s.energyKWh == null ? "—" : `${cols.energy.rows[i]} kWh`}</td>
                  </tr>
                  {s.status === "throttled-at-min-on-curve-speed" && (
                    <tr>
                      <td />
                      <td colSpan={10 + span} className="pr-2 text-slate-700" data-testid={`step-${c.id}-${i}`}>
                        {stepVerdict(s)}: {s.message}
                      </td>
                    </tr>
                  )}
                  {stepWarnings(e.cycle!, i).map((w) => (
                    <tr key={w}>
                      <td />
                      <td colSpan={10 + span} className="pr-2 text-duty-ink">
                        ▲ {w}
                      </td>
                    </tr>
                  ))}
                </Fragment>
              ))}
              <tr className="border-t border-slate-300 font-semibold">
                <td colSpan={9 + span} className="pr-2">
                  Total per year{e.cycle.complete ? "" : `${incompleteMark(e.cycle)}: their energy is missing`}
                </td>
                <td className="pr-2">{cols.hours.total}</td>
                <td className="pr-2" data-testid={`cycle-total-${c.id}`}>
                  {e.cycle.totalHours === 0 ? "—" : noStepCounted(e.cycle) ? "not computed" : `${cols.energy.total} kWh · ${moneyText(e.annualCost, currency)} (duty cycle, ${amountText(e.cycle.totalHours)} h/yr)`}
                </td>
              </tr>
              {roundedNote(cols) ? (
                <tr>
                  <td colSpan={11 + span} className="pr-2 text-slate-600" data-testid={`cycle-rounded-${c.id}`}>
                    {roundedNote(cols)}
                  </td>
                </tr>
              ) : null}
            </tbody>
          </table>
        </div>
      ) : null}
      {e?.cycle && cycleWarnings(e.cycle).length > 0 ? (
        <ul className="text-xs text-duty-ink">
          {cycleWarnings(e.cycle).map((w) => (
            <li key={w}>▲ {w}</li>
          ))}
        </ul>
      ) : null}
      {lcc ? (
        <p className="text-xs" data-testid={`lcc-${c.id}`}>
          Life-cycle cost over {lccYears(lcc)}: <strong>{moneyText(lcc.total, currency)}</strong> = purchase {lcc.purchaseGiven ? moneyText(lcc.purchase, currency) : "not given (0)"} + energy {moneyText(lcc.energyPresentValue, currency)} (present value)
          {moneySumNote([lcc.purchase, lcc.energyPresentValue], lcc.total, currency)}
          {e?.cycle && !e.cycle.complete ? ` — understated${incompleteMark(e.cycle)}: their energy is missing` : ""}.
        </p>
      ) : null}
      {lccRangeNoteOf(e) ? (
        <p className="text-xs text-duty-ink" data-testid={`lcc-range-${c.id}`}>
          ▲ Life-cycle cost {lccRangeNoteOf(e)}.
        </p>
      ) : null}
      {lccWarnings(lcc).length > 0 ? (
        <ul className="text-xs text-duty-ink" data-testid={`lcc-warnings-${c.id}`}>
          {lccWarnings(lcc).map((w) => (
            <li key={w}>▲ {w}</li>
          ))}
        </ul>
      ) : null}
      {canWrite ? (
        <Form method="post" className="no-print flex items-end gap-2">
          <input type="hidden" name="candidateId" value={c.id} />
          <label className="text-xs">
            Purchase price ({currency || "currency"}){cycleBasis(c) ? `, all ${cycleBasis(c)!.arrangement}` : ""}
            <input name="purchasePrice" inputMode="decimal" className="field w-32 py-0.5" defaultValue={typedPrice ?? (e?.purchasePrice != null ? String(e.purchasePrice) : "")} placeholder="optional" />
          </label>
          <button className="btn-quiet text-xs" name="intent" value="price">
            Set price
          </button>
          {error ? <span className="text-xs text-fail">{error}</span> : null}
        </Form>
      ) : null}
    </div>
  );
}
