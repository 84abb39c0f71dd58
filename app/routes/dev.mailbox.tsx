// /dev/mailbox — the messages the SMTP stand-in caught (fixtures/smtp/server.ts), newest first,
// plus the latest outbox rows. Development and test mode only, and only to a request from this machine
// itself (loopback, no proxy): a 404 for anyone else (mailboxOpenTo in lib/mail/mailbox.server.ts).
import { Form, useNavigation } from "react-router";
import type { Route } from "./+types/dev.mailbox";
import { readFormSafe, readQuery } from "~/lib/shared/forms.server";
import { mailboxAction, mailboxOpenTo, mailboxPage } from "~/lib/mail";
import { MessageItem } from "~/components/mailbox/MessageItem";
import { OutboxTable } from "~/components/mailbox/OutboxTable";
import { Section } from "~/components/mailbox/Section";
import { routeErrorBoundary } from "~/components/RouteError";

export const meta: Route.MetaFunction = () => [{ title: "Development mailbox · Dutymark" }, { name: "robots", content: "noindex" }];

function notFound(): never {
  throw new Response("Not Found", { status: 404 });
}

export async function loader({ request }: Route.LoaderArgs) {
  if (!mailboxOpenTo(request)) notFound();
  const url = new URL(request.url);
  return mailboxPage({ to: readQuery(url, "to", 254), open: readQuery(url, "open", 100) });
}

export async function action({ request }: Route.ActionArgs) {
  if (!mailboxOpenTo(request)) notFound();
  return { notice: await mailboxAction(String((await readFormSafe(request)).get("intent") ?? "")) };
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
          This page exists only in development and test mode, and only for this machine itself.
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
          <OutboxTable rows={data.outbox} />
        )}
      </Section>
    </div>
  );
}

export const ErrorBoundary = routeErrorBoundary({ what: "the development mailbox", back: { href: "/", label: "The start page" } });
