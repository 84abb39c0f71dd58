// The field checks recorded against a selection, on its report page (not printed: the report is the
// frozen selection; checks come later). Each links to its own page at /field/checks/:id.
import type { CheckTimes, ListedVerdict, Verdict } from "~/lib/fieldchecks";
import { CheckWhen, VerdictBadge } from "./fieldcheck";
import { ListTable } from "./ListTable";
import { fmtFlow, fmtHead, type UnitChoice } from "~/lib/shared/units";
import { fmtDate } from "~/lib/shared/format";

/** One check as `checksOfSelection` (app/lib/fieldchecks/selection-checks.server.ts) gives it: readable, or what is wrong with its stored record. */
export type SelectionCheckRow = { id: number; version: number; superseded: boolean; createdAt: string; times: CheckTimes; byName: string; byWorkspace: string } & (
  | { readable: true; flow: number | null; head: number; flowSource: string; verdict: Verdict; rule: string; cross: string | null; power: string; note: string | null; today?: Verdict | null; shown?: ListedVerdict }
  | { readable: false; unreadable: string }
);

export function SelectionFieldChecks({ checks, unitSystem, selectionId }: { checks: SelectionCheckRow[]; unitSystem: UnitChoice; selectionId: number }) {
  return (
    <section className="no-print panel text-sm" aria-labelledby="field-checks-h">
      <h2 id="field-checks-h" className="font-semibold">
        Field checks
      </h2>
      {checks.length === 0 ? (
        <p className="mt-1 text-slate-600">
          No field check recorded yet. <a href={`/field/selections/${selectionId}`}>Record one</a> when the pump runs on site.
        </p>
      ) : (
        <ListTable head={["Taken", "Recorded by", "Delivered", "Verdict", "Rule", ""]} label="Field checks of this selection">
          {checks.map((c) => (
            <tr key={c.id} className={`border-t border-slate-100 align-top ${c.superseded ? "text-slate-500" : ""}`}>
              <td className="py-1">
                <CheckWhen times={c.times} />
                {c.version > 1 ? <span className="text-xs"> · version {c.version}</span> : null}
                {c.superseded ? <span className="text-xs"> · amended since</span> : null}
              </td>
              <td>
                {c.byName || "a former member"}
                <div className="text-xs text-slate-500">{c.byWorkspace}</div>
              </td>
              {c.readable ? (
                <>
                  <td>
                    {c.flow !== null ? fmtFlow(unitSystem, c.flow) : "flow not measured"} at {fmtHead(unitSystem, c.head)}
                    {c.flowSource !== "measured" && c.flow !== null ? <div className="text-xs text-slate-500">flow read off the curve</div> : null}
                  </td>
                  <td>
                    {/* Today's verdict; where the one stored when the check was saved differs (or today's rules cannot judge), both, labelled. */}
                    <VerdictBadge verdict={c.shown?.verdict ?? c.verdict} />
                    {c.shown && (c.shown.today !== null || !c.shown.judgedToday) ? (
                      <div className="max-w-xs text-xs text-slate-600" data-testid="verdict-today">
                        {c.shown.label}. The record keeps the verdict saved; amend it to record today&apos;s.
                      </div>
                    ) : null}
                    {c.note && !c.shown ? <div className="max-w-xs text-xs text-slate-600" data-testid="verdict-note">{c.note}</div> : null}
                  </td>
                  <td className="max-w-xs text-xs">
                    {c.rule}
                    {/* The shown verdict's rule and numbers (today's where judged; its note included). */}
                    {c.shown ? <div data-testid="verdict-cross">{c.shown.rule}</div> : c.cross ? <div data-testid="verdict-cross">{c.cross}</div> : null}
                    <div className="text-slate-600">{c.power}</div>
                  </td>
                </>
              ) : (
                <td colSpan={3} className="max-w-md text-xs" data-testid="unreadable-check">
                  <strong className="font-semibold">Check {c.id}.</strong> {c.unreadable}
                </td>
              )}
              <td>
                <a href={`/field/checks/${c.id}`} aria-label={`Open the field check of ${fmtDate(c.times.takenAt ?? c.createdAt)}`}>
                  Open
                </a>
              </td>
            </tr>
          ))}
        </ListTable>
      )}
    </section>
  );
}
