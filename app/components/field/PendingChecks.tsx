// Checks kept on this phone: "waiting to send" (sent as soon as there is a network; with the server's words
// when it was entered in another workspace than the session's now), a conflict (the selection changed since
// the phone opened it, or the version amended was amended meanwhile: shown, the contractor decides) or
// refused by the server (shown with its reason; refused for its photos, it may go without them). Also what
// this page sent, with links to the recorded checks.
import { useCallback, useEffect, useState } from "react";
import { allQueued, deleteQueued, type QueuedCheck } from "./queue";
import { addSent, sendAsAmendmentOfLatest, sendDespiteConflict, sendWaiting, sendWithoutPhotos, type Sent } from "./sync";
import { fmtFlow, fmtHead, renderUnits, type UnitChoice } from "~/lib/shared/units";
import type { FrozenSelection } from "~/lib/fieldchecks";
import { pendingShown } from "./pending-shown";
import { fmtDateTime } from "~/lib/shared/format";

/** The checks `owner` ("userId/workspaceId") kept on this phone (of one selection, or all), sent whenever the network is there. */
export function usePendingChecks(owner: string, selectionId: number | null) {
  const [queued, setQueued] = useState<QueuedCheck[]>([]);
  const [sent, setSent] = useState<Sent[]>([]);
  const refresh = useCallback(async () => {
    const all = await allQueued().catch(() => [] as QueuedCheck[]);
    setQueued(all.filter((c) => c.owner === owner && (selectionId === null || c.selectionId === selectionId)).sort((a, b) => a.createdAt.localeCompare(b.createdAt)));
  }, [owner, selectionId]);
  const send = useCallback(async () => {
    const done = await sendWaiting(owner).catch(() => [] as Sent[]);
    if (done.length) setSent((s) => addSent(s, done));
    await refresh();
  }, [owner, refresh]);
  useEffect(() => {
    void refresh().then(() => (navigator.onLine ? send() : undefined));
    const online = () => void send();
    window.addEventListener("online", online);
    return () => window.removeEventListener("online", online);
  }, [refresh, send]);
  return { queued, sent, refresh, send, setSent };
}

/**
 * The panel. `selection`: the selection the page shows (its fingerprint and frozen document), against which a check kept
 * before checks carried their own selection is worked out again when it was kept for this one.
 */
export function PendingChecks(props: { pending: ReturnType<typeof usePendingChecks>; unitSystem: UnitChoice; showSelection?: boolean; selection?: { fingerprint: string; frozen: FrozenSelection } }) {
  const { queued, sent, refresh, send, setSent } = props.pending;
  const after = async (done: Sent | null) => {
    if (done) setSent((s) => addSent(s, [done]));
    await refresh();
  };
  const sys = props.unitSystem;
  if (!queued.length && !sent.length) return null;
  const waiting = queued.filter((c) => c.status === "waiting").length;
  return (
    <section className="panel space-y-2" aria-labelledby="pending-title" data-testid="pending-checks">
      <h2 id="pending-title" className="font-semibold">
        On this phone
      </h2>
      <p role="status" className="text-sm">
        {waiting ? `${waiting} ${waiting === 1 ? "check" : "checks"} waiting to send.` : "Nothing waiting to send."}
      </p>
      {queued.length ? (
        <ul className="divide-y divide-slate-100 text-sm">
          {queued.map((c) => (
            <li key={c.clientId} className="space-y-1 py-2" data-status={c.status}>
              <KeptCheck c={c} sys={sys} selection={props.selection} showSelection={props.showSelection} />
              {c.message ? <p className="font-semibold text-fail">{renderUnits(c.message, sys)}</p> : null}
              {c.status === "conflict" && c.latest ? (
                <>
                  <a className="btn-quiet min-h-12" href={`/field/checks/${c.latest.id}`}>
                    Look at version {c.latest.version}
                  </a>
                  <Resend label={`Record as the amendment of version ${c.latest.version} (becomes version ${c.latest.version + 1})`} send={() => sendAsAmendmentOfLatest(c)} after={after} />
                </>
              ) : c.status === "conflict" ? (
                <Resend label={c.selectionChanged ? "Record against the selection as it is now" : "Send again"} send={() => sendDespiteConflict(c)} after={after} />
              ) : null}
              {c.status === "refused" && c.refusedFor === "photos" && c.photos.length ? (
                <Resend
                  label={`Send without the ${c.photos.length === 1 ? "photo" : `${c.photos.length} photos`}`}
                  confirm="Send the readings without the photos? The photos are not kept on this phone once the check is recorded."
                  send={() => sendWithoutPhotos(c)}
                  after={after}
                />
              ) : null}
              {c.status !== "waiting" || c.message ? (
                <button
                  type="button"
                  className="btn-quiet ml-2 min-h-12"
                  onClick={async () => {
                    if (window.confirm("Delete these readings from this phone? They were not recorded.")) await deleteQueued(c.clientId);
                    await refresh();
                  }}
                >
                  Delete from this phone
                </button>
              ) : null}
            </li>
          ))}
        </ul>
      ) : null}
      {waiting ? (
        <button type="button" className="btn-quiet min-h-12" onClick={() => void send()}>
          Send now
        </button>
      ) : null}
      {sent.length ? (
        <ul className="text-sm" aria-label="Sent from this phone">
          {sent.map((s) => (
            <li key={s.clientId}>
              Sent: <a href={`/field/checks/${s.id}`}>check {s.id}</a>
              {s.duplicate ? " (it had arrived already)" : ""}
            </li>
          ))}
        </ul>
      ) : null}
    </section>
  );
}

/**
 * One kept check's heading and verdict: the readings worked out again with the phone's engine now, the verdict kept when it
 * was saved beside it where they differ (pending-shown.ts), with the shown verdict's rule and numbers.
 */
function KeptCheck({ c, sys, selection, showSelection }: { c: QueuedCheck; sys: UnitChoice; selection?: { fingerprint: string; frozen: FrozenSelection }; showSelection?: boolean }) {
  const shown = pendingShown(c, selection ?? null, sys);
  return (
    <>
      <p>
        <span className="font-semibold">{c.status === "waiting" ? "Waiting to send" : c.status === "conflict" ? "Conflict: not recorded" : "Refused by the server"}</span>
        {" · "}
        {showSelection ? `${c.selectionTitle} · ` : ""}
        {fmtDateTime(c.createdAt)}
      </p>
      <p className="text-slate-700">
        Worked out on this phone: {c.local.flow !== null ? fmtFlow(sys, c.local.flow) : "flow not known"} at {fmtHead(sys, c.local.head)}, {renderUnits(shown.label, sys)}. The server works it out again when it is
        sent.
        {c.photos.length ? ` ${c.photos.length} photo${c.photos.length === 1 ? "" : "s"}.` : ""}
      </p>
      {/* The shown verdict's rule and numbers, or why there is none (a check kept before, not worked out again here, may carry neither). */}
      {shown.rule ? (
        <p className="text-xs text-slate-600" data-testid="pending-verdict-numbers" data-differs={shown.today !== null ? "yes" : "no"}>
          {renderUnits(shown.rule, sys)}
        </p>
      ) : null}
    </>
  );
}

/** A button that sends one kept check again, as the contractor decided (after asking `confirm`, when given). */
function Resend(props: { label: string; send: () => Promise<Sent | null>; after: (done: Sent | null) => Promise<void>; confirm?: string }) {
  return (
    <button
      type="button"
      className="btn-quiet min-h-12"
      onClick={async () => {
        if (props.confirm && !window.confirm(props.confirm)) return;
        await props.after(await props.send());
      }}
    >
      {props.label}
    </button>
  );
}
