// The head of a selection's check page (what was selected) and its list of recorded checks.
import { CheckWhen, VerdictBadge } from "../fieldcheck";
import type { CheckTimes, ListedVerdict, Verdict } from "~/lib/fieldchecks";
import { fmtFlow, fmtHead, type UnitChoice } from "~/lib/shared/units";

export type SummarySelection = {
  id: number;
  title: string;
  projectName: string;
  systemName: string;
  ownerWorkspace: string;
  own: boolean;
  pump: string;
  designSpeed: number | null;
  /** The speed as set, in the report's words ("1645 rpm"; "1644.3 rpm" off the whole-rpm step); null when the curve names none. */
  designSpeedText: string | null;
  /** "trimmed to Ø182 mm" ("trimmed to Ø7.17 in [182 mm]" in inches: the whole mm it is set in) when the impeller is trimmed, else null. */
  impeller: string | null;
  duty: { flow: number; head: number } | null | undefined;
  arrangement: string;
  dutyPumps: number;
};

export function SelectionSummary({ selection, unitSystem }: { selection: SummarySelection; unitSystem: UnitChoice }) {
  return (
    <header>
      <p className="text-sm">
        <a href="/field" className="inline-block py-2">
          Field checks
        </a>{" "}
        ›
      </p>
      <h1 className="text-xl font-bold text-brand-900">{selection.title}</h1>
      <p className="text-sm text-slate-700">
        {selection.projectName} · {selection.systemName}
        {selection.own ? "" : ` · shared by ${selection.ownerWorkspace}`}
      </p>
      <dl className="mt-2 grid grid-cols-2 gap-x-3 gap-y-1 text-sm">
        <dt className="text-slate-600">Pump</dt>
        <dd>{selection.pump}</dd>
        <dt className="text-slate-600">Design duty</dt>
        <dd>{selection.duty ? `${fmtFlow(unitSystem, selection.duty.flow)} at ${fmtHead(unitSystem, selection.duty.head)}` : "not set"}</dd>
        <dt className="text-slate-600">Design speed</dt>
        <dd data-testid="design-speed">{selection.designSpeedText ?? "not stated"}</dd>
        {selection.impeller ? (
          <>
            <dt className="text-slate-600">Impeller</dt>
            <dd data-testid="design-impeller">{selection.impeller}</dd>
          </>
        ) : null}
        {selection.arrangement !== "single" ? (
          <>
            <dt className="text-slate-600">Arrangement</dt>
            <dd>
              {selection.dutyPumps} in {selection.arrangement}: take readings across one pump
            </dd>
          </>
        ) : null}
      </dl>
    </header>
  );
}

/** One check of the history (page.server.ts `checkPage`): readable, or what is wrong with its stored record. */
export type HistoryEntry = { id: number; version: number; superseded: boolean; createdAt: string; times: CheckTimes } & (
  | { readable: true; verdict: Verdict; grade: string; flow: number | null; head: number; flowSource: string; cross?: string | null; shown?: ListedVerdict }
  | { readable: false; unreadable: string }
);

export function CheckHistoryList({ selectionId, history, unitSystem }: { selectionId: number; history: HistoryEntry[]; unitSystem: UnitChoice }) {
  return (
    <section className="panel">
      <div className="flex items-center justify-between gap-2">
        <h2 className="font-semibold">History</h2>
        {history.length ? (
          <a className="btn-quiet min-h-12" href={`/field/selections/${selectionId}/export.csv`}>
            CSV
          </a>
        ) : null}
      </div>
      {history.length === 0 ? (
        <p className="mt-2 text-sm text-slate-600">No checks recorded on this selection yet.</p>
      ) : (
        <ul className="mt-2 divide-y divide-slate-100 text-sm">
          {history.map((check) => (
            <li key={check.id} className="flex flex-wrap items-center justify-between gap-2 py-2">
              <a href={`/field/checks/${check.id}`} className="inline-block py-2">
                Check {check.id} v{check.version} · <CheckWhen times={check.times} />
                {check.superseded ? " (amended later)" : ""}
              </a>
              {check.readable ? (
                <>
                  <span className="text-slate-600">
                    {check.flow != null ? fmtFlow(unitSystem, check.flow) : "—"} at {fmtHead(unitSystem, check.head)}
                    {check.flowSource === "measured" ? "" : " (flow inferred)"}
                  </span>
                  {/* Today's verdict with its rule and numbers; the stored one beside it, dated, where they differ (listed-verdict.ts). */}
                  <VerdictBadge verdict={check.shown?.verdict ?? check.verdict} grade={check.grade} />
                  {check.shown ? (
                    <span className="w-full text-xs text-slate-600" data-testid="verdict-shown" data-differs={check.shown.today !== null ? "yes" : "no"}>
                      {check.shown.text}
                    </span>
                  ) : check.cross ? (
                    <span className="w-full text-xs text-slate-600" data-testid="verdict-cross">
                      {check.cross}
                    </span>
                  ) : null}
                </>
              ) : (
                <span className="w-full text-slate-700" data-testid="unreadable-check">
                  {check.unreadable}
                </span>
              )}
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
