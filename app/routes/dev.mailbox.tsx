// /dev/mailbox — the messages the SMTP stand-in caught (fixtures/smtp/server.ts), newest first,
// plus the latest outbox rows. Development and test mode only: a 404 in production otherwise.
// Register in app/routes.ts: route("dev/mailbox", "routes/dev.mailbox.tsx").
import { Form, useNavigation } from "react-router";
import type { Route } from "./+types/dev.mailbox";
import { Fragment, type ReactNode } from "react";
import { readFormSafe, readQuery } from "~/lib/forms.server";
import {
  clearMailbox,
  flushOutbox,
  listMailbox,
  mailboxApiUrl,
  mailboxEnabled,
  recentOutbox,
  type MailboxMessage,
} from "~/lib/mail.server";

export const meta: Route.MetaFunction = () => [{ title: "Development mailbox · Dutymark" }, { name: "robots", content: "noindex" }];

function notFound(): never {
  throw new Response("Not Found", { status: 404 });
}

const errorText = (err: unknown) => (err instanceof Error ? err.message : String(err));

export async function loader({ request }: Route.LoaderArgs) {
  if (!mailboxEnabled()) notFound();
  const url = new URL(request.url);
  const to = readQuery(url, "to");
  const open = readQuery(url, "open");
  let messages: MailboxMessage[] = [];
  let mailboxError: string | null = null;
  try {
    messages = await listMailbox({ to: to || undefined, limit: 200 });
  } catch (err) {
    mailboxError = errorText(err);
  }
  let outboxRows: Awaited<ReturnType<typeof recentOutbox>> = [];
  let outboxError: string | null = null;
  try {
    outboxRows = await recentOutbox(10);
  } catch (err) {
    outboxError = errorText(err);
  }
  return {
    to,
    open,
    apiUrl: mailboxApiUrl(),
    messages,
    mailboxError,
    outbox: outboxRows.map((r) => ({
      ...r,
      sentAt: r.sentAt ? r.sentAt.toISOString() : null,
      createdAt: r.createdAt.toISOString(),
    })),
    outboxError,
  };
}

export async function action({ request }: Route.ActionArgs) {
  if (!mailboxEnabled()) notFound();
  const intent = String((await readFormSafe(request)).get("intent") ?? "");
  try {
    if (intent === "clear") return { notice: `Removed ${await clearMailbox()} message(s) from the mailbox.` };
    if (intent === "flush") {
      const r = await flushOutbox();
      return {
        notice: r.held
          ? "SMTP_URL is not set, so the outbox is being held."
          : `Outbox flushed: ${r.due} due, ${r.sent} sent, ${r.failed} failed.`,
      };
    }
  } catch (err) {
    return { notice: `That did not work: ${errorText(err)}` };
  }
  return { notice: "Unknown request." };
}

/** "2026-12-01 22:54:55 UTC": the same on server and client, so hydration matches. */
const utc = (iso: string | null) => (iso ? `${iso.replace("T", " ").slice(0, 19)} UTC` : "—");

const URL_RE = /(https?:\/\/[^\s<>"']+)/g;

/** Plain text with its http(s) links made clickable. */
function Linkified({ text }: { text: string }) {
  const pieces = text.split(URL_RE);
  return (
    <>
      {pieces.map((p, i) => {
        if (i % 2 === 0) return <Fragment key={i}>{p}</Fragment>;
        const trail = /[.,;:!?)\]]+$/.exec(p)?.[0] ?? "";
        const href = trail ? p.slice(0, -trail.length) : p;
        return (
          <Fragment key={i}>
            <a href={href} className="break-all">
              {href}
            </a>
            {trail}
          </Fragment>
        );
      })}
    </>
  );
}

/** The HTML part in a sandbox without scripts or same-origin access; its links open a new tab. */
function htmlForFrame(html: string): string {
  const base = '<base target="_blank">';
  return /<head[^>]*>/i.test(html) ? html.replace(/<head[^>]*>/i, (m) => `${m}${base}`) : `${base}${html}`;
}

function Section({ title, children, aside }: { title: string; children: ReactNode; aside?: ReactNode }) {
  return (
    <section className="panel space-y-3">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h2 className="text-lg font-semibold text-brand-900">{title}</h2>
        {aside}
      </div>
      {children}
    </section>
  );
}

function MessageItem({ m, open }: { m: MailboxMessage; open: boolean }) {
  return (
    <details className="group rounded-md border border-slate-200 bg-white open:shadow-sm" open={open} data-message-id={m.id}>
      <summary className="flex cursor-pointer list-none flex-wrap items-baseline gap-x-4 gap-y-1 px-3 py-2 hover:bg-slate-50">
        <span className="min-w-0 flex-1 font-semibold text-slate-900">{m.subject || "(no subject)"}</span>
        <span className="text-sm text-slate-600">to {[...new Set([...m.to, ...m.envelope.to])].join(", ")}</span>
        <time className="text-xs tabular-nums text-slate-500" dateTime={m.receivedAt}>
          {utc(m.receivedAt)}
        </time>
      </summary>
      <div className="space-y-3 border-t border-slate-200 px-3 py-3">
        <dl className="grid grid-cols-[max-content_1fr] gap-x-3 gap-y-1 text-sm">
          <dt className="label self-center">From</dt>
          <dd>{m.from}</dd>
          <dt className="label self-center">To</dt>
          <dd>{m.to.join(", ") || m.envelope.to.join(", ")}</dd>
          <dt className="label self-center">Size</dt>
          <dd>{m.size.toLocaleString("en-US")} bytes</dd>
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

export default function DevMailbox({ loaderData: data, actionData: done }: Route.ComponentProps) {
  const nav = useNavigation();
  const busy = nav.state !== "idle";
  return (
    <div className="mx-auto max-w-5xl space-y-4">
      <header className="space-y-1">
        <h1 className="text-2xl font-bold text-brand-900">Development mailbox</h1>
        <p className="text-sm text-slate-700">
          Every e-mail the app sends here goes to the local SMTP stand-in and stops there; nothing reaches a real inbox.
          This page exists only in development and test mode.
        </p>
      </header>
      {done?.notice && (
        <p className="rounded-md border border-brand-200 bg-brand-50 px-3 py-2 text-sm" role="status">
          {done.notice}
        </p>
      )}

      <Section
        title={`Messages (${data.messages.length})`}
        aside={
          <div className="flex flex-wrap items-center gap-2">
            <Form method="get" className="flex items-center gap-2">
              <label className="sr-only" htmlFor="mailbox-to">
                Recipient
              </label>
              <input id="mailbox-to" name="to" type="email" defaultValue={data.to} placeholder="only for this address" className="field w-64" />
              <button className="btn-quiet" type="submit">
                Filter
              </button>
              {data.to && (
                <a className="btn-quiet" href="/dev/mailbox">
                  Show all
                </a>
              )}
            </Form>
            <a className="btn-quiet" href={data.to ? `/dev/mailbox?to=${encodeURIComponent(data.to)}` : "/dev/mailbox"}>
              Refresh
            </a>
            <Form method="post">
              <button className="btn-quiet" type="submit" name="intent" value="clear" disabled={busy}>
                Empty the mailbox
              </button>
            </Form>
          </div>
        }
      >
        {data.mailboxError ? (
          <p className="rounded-md border border-fail bg-fail-soft px-3 py-2 text-sm text-slate-900" role="alert">
            The mailbox could not be read: {data.mailboxError}
          </p>
        ) : data.messages.length === 0 ? (
          <p className="text-sm text-slate-600">{data.to ? `Nothing for ${data.to} yet.` : "No messages yet."}</p>
        ) : (
          <div className="space-y-2">
            {data.messages.map((m, i) => (
              <MessageItem key={m.id} m={m} open={data.open ? data.open === m.id : i === 0} />
            ))}
          </div>
        )}
        {data.apiUrl && <p className="text-xs text-slate-500">Read from {data.apiUrl}</p>}
      </Section>

      <Section
        title="Outbox (latest 10)"
        aside={
          <Form method="post">
            <button className="btn-quiet" type="submit" name="intent" value="flush" disabled={busy}>
              Retry due messages now
            </button>
          </Form>
        }
      >
        {data.outboxError ? (
          <p className="text-sm text-fail">The outbox could not be read: {data.outboxError}</p>
        ) : data.outbox.length === 0 ? (
          <p className="text-sm text-slate-600">The outbox is empty.</p>
        ) : (
          <div className="overflow-x-auto">
            <table className="w-full text-left text-sm">
              <thead className="text-xs uppercase tracking-wide text-slate-500">
                <tr>
                  <th className="py-1 pr-3 font-semibold">#</th>
                  <th className="py-1 pr-3 font-semibold">To</th>
                  <th className="py-1 pr-3 font-semibold">Subject</th>
                  <th className="py-1 pr-3 font-semibold">Written</th>
                  <th className="py-1 pr-3 font-semibold">State</th>
                </tr>
              </thead>
              <tbody className="divide-y divide-slate-100">
                {data.outbox.map((r) => (
                  <tr key={r.id} className="align-top">
                    <td className="py-1 pr-3 tabular-nums text-slate-500">{r.id}</td>
                    <td className="py-1 pr-3">{r.toAddress}</td>
                    <td className="py-1 pr-3">{r.subject}</td>
                    <td className="py-1 pr-3 tabular-nums text-slate-600">{utc(r.createdAt)}</td>
                    <td className="py-1 pr-3">
                      {r.sentAt ? (
                        <span className="text-pass">sent {utc(r.sentAt)}</span>
                      ) : (
                        <span className="text-duty-ink">
                          waiting{r.attempts ? ` after ${r.attempts} attempt${r.attempts === 1 ? "" : "s"}` : ""}
                          {r.lastError ? <span className="block text-xs text-slate-600">{r.lastError}</span> : null}
                        </span>
                      )}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
      </Section>
    </div>
  );
}
