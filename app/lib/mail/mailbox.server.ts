// The SMTP stand-in's mailbox (fixtures/smtp/server.ts), read over its HTTP API by the development
// mailbox page. Configuration: MAILBOX_API_URL (set by npm start / dev / test).
import { settings } from "../shared/env.server";
import { fromThisMachine } from "../shared/client-address";

export type { MailboxMessage, MailboxMessageFull } from "./mailbox-message";
import type { MailboxMessage, MailboxMessageFull } from "./mailbox-message";

/**
 * The dev mailbox shows what the local SMTP stand-in caught: only when the stand-in is what receives
 * mail (MAILBOX_API_URL, set by npm start / dev / test), and outside production unless asked for
 * (npm start asks with MAILBOX_ENABLED=1, npm test's app processes with DUTYMARK_TEST_MODE=1). With a
 * real SMTP_URL there is no stand-in, so never.
 */
export function mailboxEnabled(): boolean {
  const s = settings();
  if (!s.mailboxApiUrl) return false;
  return !s.production || s.testMode || s.mailboxEnabledFlag;
}

/**
 * Whether this request may see the mailbox (every sign-up, reset and invitation link in it): when it
 * is on (mailboxEnabled) and the request comes from this machine itself — a loopback client address,
 * no proxy in between (shared/client-address.ts). Anyone else gets a 404, as if it did not exist:
 * `npm start` on a public address, or behind a reverse proxy, shows it to nobody but the machine.
 */
export function mailboxOpenTo(request: Request): boolean {
  return mailboxEnabled() && fromThisMachine(request, settings().trustProxy);
}

export function mailboxApiUrl(): string | null {
  return settings().mailboxApiUrl;
}

async function mailboxFetch(pathAndQuery: string, init?: RequestInit): Promise<Response> {
  const base = mailboxApiUrl();
  if (!base) throw new Error("MAILBOX_API_URL is not set (npm run dev and npm test start the SMTP stand-in and set it)");
  return fetch(`${base}${pathAndQuery}`, { ...init, signal: AbortSignal.timeout(3_000) });
}

/** Messages the stand-in holds, newest first; `to` keeps those addressed to that address. */
export async function listMailbox(opts: { to?: string; limit?: number } = {}): Promise<MailboxMessage[]> {
  const q = new URLSearchParams();
  if (opts.to) q.set("to", opts.to);
  if (opts.limit) q.set("limit", String(opts.limit));
  const res = await mailboxFetch(`/messages${q.size ? `?${q}` : ""}`);
  if (!res.ok) throw new Error(`mailbox answered ${res.status}`);
  return ((await res.json()) as { messages: MailboxMessage[] }).messages;
}

export async function getMailboxMessage(id: string): Promise<MailboxMessageFull | null> {
  const res = await mailboxFetch(`/messages/${encodeURIComponent(id)}`);
  if (res.status === 404) return null;
  if (!res.ok) throw new Error(`mailbox answered ${res.status}`);
  return (await res.json()) as MailboxMessageFull;
}

export async function clearMailbox(): Promise<number> {
  const res = await mailboxFetch("/messages", { method: "DELETE" });
  if (!res.ok) throw new Error(`mailbox answered ${res.status}`);
  return ((await res.json()) as { deleted: number }).deleted;
}
