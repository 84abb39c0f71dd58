// The development mailbox page's data: what the SMTP stand-in caught and the latest outbox rows, each
// read on its own so one failing does not hide the other; and its two buttons (empty, retry).
import { flushOutbox, recentOutbox } from "./outbox.server";
import { clearMailbox, listMailbox, mailboxApiUrl, type MailboxMessage } from "./mailbox.server";



const errorText = (err: unknown) => (err instanceof Error ? err.message : String(err));

export async function mailboxPage(q: { to: string; open: string }) {
  let messages: MailboxMessage[] = [];
  let mailboxError: string | null = null;
  try {
    messages = await listMailbox({ to: q.to || undefined, limit: 200 });
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
    to: q.to,
    open: q.open,
    apiUrl: mailboxApiUrl(),
    messages,
    mailboxError,
    outbox: outboxRows.map((r) => ({ ...r, sentAt: r.sentAt ? r.sentAt.toISOString() : null, createdAt: r.createdAt.toISOString() })),
    outboxError,
  };
}

/** "clear" or "flush"; the answer is the notice the page shows. */
export async function mailboxAction(intent: string): Promise<string> {
  try {
    if (intent === "clear") return `Removed ${await clearMailbox()} message(s) from the mailbox.`;
    if (intent === "flush") {
      const r = await flushOutbox();
      return r.held ? "SMTP_URL is not set, so the outbox is being held." : `Outbox flushed: ${r.due} due, ${r.sent} sent, ${r.failed} failed.`;
    }
  } catch (err) {
    return `That did not work: ${errorText(err)}`;
  }
  return "Unknown request.";
}
