// The latest outbox rows on the development mailbox page (a record list like the others): sent, or waiting with the last error.
import { ListTable } from "../ListTable";
import { fmtUtc } from "~/lib/shared/format";

export type OutboxRowView = { id: number; toAddress: string; subject: string; attempts: number; lastError: string | null; sentAt: string | null; createdAt: string };

export function OutboxTable({ rows }: { rows: OutboxRowView[] }) {
  return (
    <div className="overflow-x-auto">
      <ListTable head={["#", "To", "Subject", "Written", "State"]} className="">
        {rows.map((r) => (
          <tr key={r.id} className="border-t border-slate-100 align-top">
            <td className="py-1 pr-3 tabular-nums text-slate-500">{r.id}</td>
            <td className="pr-3">{r.toAddress}</td>
            <td className="pr-3">{r.subject}</td>
            <td className="pr-3 tabular-nums text-slate-600">{fmtUtc(r.createdAt, { seconds: true })}</td>
            <td>
              {r.sentAt ? (
                <span className="text-pass">sent {fmtUtc(r.sentAt, { seconds: true })}</span>
              ) : (
                <span className="text-duty-ink">
                  waiting{r.attempts ? ` after ${r.attempts} attempt${r.attempts === 1 ? "" : "s"}` : ""}
                  {r.lastError ? <span className="block text-xs text-slate-600">{r.lastError}</span> : null}
                </span>
              )}
            </td>
          </tr>
        ))}
      </ListTable>
    </div>
  );
}
