// One caught message on the development mailbox page: headers, links, text with clickable links, and
// the HTML part in a sandboxed frame.
import type { MailboxMessage } from "~/lib/mail/mailbox-message";
import { Linkified } from "./Linkified";
import { fmtInt, fmtUtc } from "~/lib/shared/format";

/** The HTML part in a sandbox without scripts or same-origin access; its links open a new tab. */
function htmlForFrame(html: string): string {
  const base = '<base target="_blank">';
  return /<head[^>]*>/i.test(html) ? html.replace(/<head[^>]*>/i, (m) => `${m}${base}`) : `${base}${html}`;
}

export function MessageItem({ m, open }: { m: MailboxMessage; open: boolean }) {
  return (
    <details className="group rounded-md border border-slate-200 bg-white open:shadow-sm" open={open} data-message-id={m.id}>
      <summary className="flex cursor-pointer list-none flex-wrap items-baseline gap-x-4 gap-y-1 px-3 py-2 hover:bg-slate-50">
        <span className="min-w-0 flex-1 font-semibold text-slate-900">{m.subject || "(no subject)"}</span>
        <span className="text-sm text-slate-600">to {[...new Set([...m.to, ...m.envelope.to])].join(", ")}</span>
        <time className="text-xs tabular-nums text-slate-500" dateTime={m.receivedAt}>
          {fmtUtc(m.receivedAt, { seconds: true })}
        </time>
      </summary>
      <div className="space-y-3 border-t border-slate-200 px-3 py-3">
        <dl className="grid grid-cols-[max-content_1fr] gap-x-3 gap-y-1 text-sm">
          <dt className="label self-center">From</dt>
          <dd>{m.from}</dd>
          <dt className="label self-center">To</dt>
          <dd>{m.to.join(", ") || m.envelope.to.join(", ")}</dd>
          <dt className="label self-center">Size</dt>
          <dd>{fmtInt(m.size)} bytes</dd>
        </dl>
        {m.links.length > 0 && (
          <div>
            <h3 className="label mb-1">Links in this message</h3>
            <ul className="list-disc space-y-0.5 pl-5 text-sm">
              {m.links.map((l) => (
                <li key={l}>
                  <a href={l} className="break-all">
                    {l}
                  </a>
                </li>
              ))}
            </ul>
          </div>
        )}
        {m.text !== null && (
          <div>
            <h3 className="label mb-1">Plain text</h3>
            <pre className="max-h-96 overflow-auto whitespace-pre-wrap rounded-md bg-slate-50 p-3 font-sans text-sm text-slate-800">
              <Linkified text={m.text} />
            </pre>
          </div>
        )}
        {m.html !== null && (
          <div>
            <h3 className="label mb-1">HTML</h3>
            <iframe
              title={`HTML part of “${m.subject}”`}
              sandbox="allow-popups allow-popups-to-escape-sandbox"
              srcDoc={htmlForFrame(m.html)}
              className="h-[28rem] w-full resize-y rounded-md border border-slate-200 bg-white"
            />
          </div>
        )}
        <p className="text-xs text-slate-500">
          Id {m.id}. The full source is at GET /messages/{m.id} on the stand-in's API.
        </p>
      </div>
    </details>
  );
}
