// The search page's arrangement: its form fields (plain GET fields, no JavaScript needed: one pump, duty pumps in
// parallel with standby pumps, or duty pumps in series) and a row's figures for several pumps, labelled as the
// candidates table labels them — the operating point of the duty pumps together on the design curve and each pump's
// share (identical pumps share the duty equally, common practice; lib/projects/search-arrangement.ts).
import { fmtFlow, fmtHead, type UnitChoice } from "~/lib/shared/units";
import { SEARCH_MAX_PUMPS, SEARCH_MIN_PUMPS } from "~/lib/projects/search-arrangement";
import type { PumpsBasis } from "~/lib/projects/power-basis";

/** The fields as typed (or their defaults): `arrangement` single/parallel/series, `pumps`, `standby`. */
export type ArrangementFieldValues = { arrangement: string; pumps: string; standby: string };

export function ArrangementFields({ value }: { value: ArrangementFieldValues }) {
  return (
    <fieldset className="flex flex-wrap items-end gap-2">
      <legend className="label">Arrangement</legend>
      <label>
        <span className="sr-only">How the pumps run</span>
        <select name="arrangement" defaultValue={value.arrangement} className="field">
          <option value="single">one pump</option>
          <option value="parallel">duty pumps in parallel</option>
          <option value="series">duty pumps in series</option>
        </select>
      </label>
      <label>
        <span className="label">Duty pumps ({SEARCH_MIN_PUMPS}–{SEARCH_MAX_PUMPS})</span>
        <input name="pumps" inputMode="numeric" defaultValue={value.pumps} className="field w-16" />
      </label>
      <label>
        <span className="label">Standby (parallel, 0–duty)</span>
        <input name="standby" inputMode="numeric" defaultValue={value.standby} className="field w-16" />
      </label>
    </fieldset>
  );
}

/**
 * A row's operating point for several pumps: "2 duty pumps in parallel + 1 standby: together 400 m³/h at 62.1 m (design
 * curve), each pump 200 m³/h at 62.1 m"; nothing for one pump.
 */
export function ArrangementFigures({ units, basis, words, operatingPoint, perPump, testId }: {
  units: UnitChoice; basis: PumpsBasis | null; words: string; operatingPoint: { flow: number; head: number } | null; perPump: { flow: number; head: number } | null; testId: string;
}) {
  if (!basis) return null;
  return (
    <div className="text-xs text-slate-600" data-testid={testId}>
      {words}
      {operatingPoint && perPump
        ? `: together ${fmtFlow(units, operatingPoint.flow)} at ${fmtHead(units, operatingPoint.head)} (design curve), each pump ${fmtFlow(units, perPump.flow)} at ${fmtHead(units, perPump.head)}`
        : ": no operating point on the design curve"}
    </div>
  );
}
