// Outgoing e-mail. Every message is written to the `outbox` table first, then handed to the SMTP
// server at SMTP_URL. A failed hand-over leaves the row unsent with `attempts` and `last_error`;
// `flushOutbox()` retries due rows on a backoff schedule, and a light periodic flusher (an unref'd
// interval, started by the first `sendMail` in a process) calls it. Mail is never dropped: a row
// that used up its attempts stays in the table for someone to look at.
//
// Configuration (env):
//   SMTP_URL     smtp://[user:pass@]host:port  (smtps:// for implicit TLS). Unset → mail is held in
//                the outbox and that is logged once (npm start / dev / test set it to the stand-in).
//   MAIL_FROM    the From header, default "Dutymark <no-reply@dutymark.localhost>".
//   MAIL_FLUSH_INTERVAL_MS  period of the flusher, default 30000; 0 turns it off. Off under vitest
//                unless set.
//   MAILBOX_API_URL  the SMTP stand-in's HTTP API, read by the development mailbox page.
import nodemailer, { type Transporter } from "nodemailer";
import { and, desc, eq, inArray, isNull, lt, sql } from "drizzle-orm";
import { affectedRows, db, retryOnConflict } from "@db/client.server";
import { outbox } from "@db/schema";
import { DEFAULT_MAIL_FROM, settings } from "../shared/env.server";

export type MailMessage = { to: string; subject: string; text: string; html: string };
export type SendOutcome = {
  /** The outbox row id. */
  id: number;
  sent: boolean;
  /** True when no SMTP server is configured: the row waits in the outbox. */
  held?: boolean;
  error?: string;
};
export type FlushOutcome = { due: number; sent: number; failed: number; held: boolean };

export const DEFAULT_FROM = DEFAULT_MAIL_FROM;
/**
 * When an unsent row is due again, in seconds after it was created, indexed by attempts made so
 * far: the first try is immediate, retries spread over about eight hours. After the last entry
 * the row is left alone (kept, not deleted).
 */
export const RETRY_AFTER_SECONDS = [0, 60, 3 * 60, 10 * 60, 30 * 60, 60 * 60, 3 * 60 * 60, 8 * 60 * 60] as const;
export const MAX_ATTEMPTS = RETRY_AFTER_SECONDS.length;

// Column limits in db/schema.ts: subject varchar(200), bodies TEXT (65 535 bytes), error varchar(500).
const SUBJECT_MAX_CHARS = 200;
const BODY_MAX_BYTES = 65_535;
const ERROR_MAX_CHARS = 500;

export class MailInputError extends Error {
  override name = "MailInputError";
}

const logged = new Set<string>();
function logOnce(key: string, message: string) {
  if (logged.has(key)) return;
  logged.add(key);
  console.warn(`[mail] ${message}`);
}

export function mailFrom(): string {
  return settings().mailFrom;
}

function smtpUrl(): string | null {
  return settings().smtpUrl;
}

let transport: { url: string; t: Transporter } | null = null;

function isLoopback(host: string): boolean {
  return host === "localhost" || host === "::1" || host === "[::1]" || /^127\./.test(host) || host.endsWith(".localhost");
}

/** The nodemailer transport for the current SMTP_URL (rebuilt when SMTP_URL changes). */
function transportFor(url: string): Transporter {
  if (transport?.url === url) return transport.t;
  transport?.t.close();
  const u = new URL(url);
  const secure = u.protocol === "smtps:";
  const host = u.hostname;
  const t = nodemailer.createTransport({
    host,
    port: u.port ? Number(u.port) : secure ? 465 : 587,
    secure,
    // The loopback stand-in offers no STARTTLS; elsewhere STARTTLS is used when offered.
    ignoreTLS: !secure && (isLoopback(host) || u.searchParams.get("tls") === "off"),
    auth: u.username ? { user: decodeURIComponent(u.username), pass: decodeURIComponent(u.password) } : undefined,
    // Bounded well under the first retry delay, so a hanging server never causes a double send.
    connectionTimeout: 5_000,
    greetingTimeout: 5_000,
    socketTimeout: 15_000,
  });
  transport = { url, t };
  return t;
}

function describeError(err: unknown): string {
  const e = err as { code?: string; responseCode?: number; message?: string };
  const parts = [e?.code, e?.responseCode ? String(e.responseCode) : null, e?.message ?? String(err)].filter(Boolean);
  const s = [...new Set(parts)].join(": ");
  return s.length > ERROR_MAX_CHARS ? `${s.slice(0, ERROR_MAX_CHARS - 1)}…` : s;
}

function validate(m: MailMessage): MailMessage {
  const to = (m.to ?? "").trim();
  if (!/^[^\s@<>,;:"()[\]\\]+@[^\s@<>,;:"()[\]\\]+$/.test(to) || to.length > 254) {
    throw new MailInputError(`not a single e-mail address: ${JSON.stringify(m.to)}`);
  }
  const subject = m.subject ?? "";
  if (/[\r\n]/.test(subject)) throw new MailInputError("the subject must be one line");
  if (!subject.trim()) throw new MailInputError("the subject is empty");
  if ([...subject].length > SUBJECT_MAX_CHARS) throw new MailInputError(`the subject is longer than ${SUBJECT_MAX_CHARS} characters`);
  for (const [name, body] of [["text", m.text], ["html", m.html]] as const) {
    if (typeof body !== "string") throw new MailInputError(`the ${name} body is missing`);
    if (Buffer.byteLength(body, "utf8") > BODY_MAX_BYTES) throw new MailInputError(`the ${name} body is larger than ${BODY_MAX_BYTES} bytes`);
  }
  return { to, subject, text: m.text, html: m.html };
}

type OutboxRow = typeof outbox.$inferSelect;

/**
 * Takes the row for one attempt: raises `attempts` only if nobody else did since we read it, so
 * two workers (the sender and the flusher, or two app processes) never send the same row twice.
 */
async function claim(id: number, attemptsSeen: number): Promise<boolean> {
  // A certification conflict on a Galera cluster (another node claimed it first) is retried: the
  // repeated update then finds `attempts` raised and claims nothing.
  const res = (await retryOnConflict(() =>
    db()
      .update(outbox)
      .set({ attempts: sql`${outbox.attempts} + 1` })
      .where(and(eq(outbox.id, id), eq(outbox.attempts, attemptsSeen), isNull(outbox.sentAt))),
  )) as unknown;
  return affectedRows(res) === 1;
}

/** One delivery attempt of a claimed row; records the outcome on the row. */
async function deliver(row: Pick<OutboxRow, "id" | "toAddress" | "subject" | "textBody" | "htmlBody">, url: string): Promise<string | null> {
  try {
    await transportFor(url).sendMail({
      from: mailFrom(),
      to: row.toAddress,
      subject: row.subject,
      text: row.textBody,
      html: row.htmlBody,
      headers: { "X-Dutymark-Outbox-Id": String(row.id) },
    });
  } catch (err) {
    const error = describeError(err);
    await db().update(outbox).set({ lastError: error }).where(eq(outbox.id, row.id));
    return error;
  }
  await db()
    .update(outbox)
    .set({ sentAt: sql`CURRENT_TIMESTAMP(3)`, lastError: null })
    .where(eq(outbox.id, row.id));
  return null;
}

function holdNotice(): string {
  const msg = "SMTP_URL is not set: e-mail is kept in the outbox until it is configured";
  logOnce("no-smtp", msg);
  return msg;
}

/**
 * Writes the message to the outbox, then tries to send it once. Resolves with the outcome; it
 * rejects only when the message is invalid (MailInputError) or the outbox row cannot be written.
 */
/** Validates the message and writes it to the outbox (the flusher is started); returns the row id and the checked message. */
async function writeToOutbox(message: MailMessage): Promise<{ id: number; m: MailMessage }> {
  const m = validate(message);
  const [{ id }] = await db()
    .insert(outbox)
    .values({ toAddress: m.to, subject: m.subject, textBody: m.text, htmlBody: m.html })
    .$returningId();
  ensureOutboxFlusher();
  return { id, m };
}

export async function sendMail(message: MailMessage): Promise<SendOutcome> {
  const { id, m } = await writeToOutbox(message);
  const url = smtpUrl();
  if (!url) {
    const error = holdNotice();
    await db().update(outbox).set({ lastError: error }).where(eq(outbox.id, id));
    return { id, sent: false, held: true, error };
  }
  if (!(await claim(id, 0))) return { id, sent: false, error: "taken by another sender" };
  const error = await deliver({ id, toAddress: m.to, subject: m.subject, textBody: m.text, htmlBody: m.html }, url);
  if (error) logOnce(`send:${error}`, `outbox row ${id} not sent yet (${error}); it will be retried`);
  return error ? { id, sent: false, error } : { id, sent: true };
}

/**
 * Writes the message to the outbox and returns at once: delivery happens after the request, from a
 * background kick (setImmediate) and the periodic flusher. Account mail uses this, so a request
 * takes the same time whether or not a message was written, and never waits on an SMTP server.
 * Under vitest the kick is off unless MAIL_FLUSH_INTERVAL_MS is set (tests flush by hand).
 */
export async function queueMail(message: MailMessage): Promise<{ id: number }> {
  const { id, m } = await writeToOutbox(message);
  const s = settings();
  if (!(s.underVitest && s.mailFlushIntervalMs === null)) {
    const url = smtpUrl();
    if (url) {
      setImmediate(() => {
        (async () => {
          if (!(await claim(id, 0))) return; // the flusher got there first
          const error = await deliver({ id, toAddress: m.to, subject: m.subject, textBody: m.text, htmlBody: m.html }, url);
          if (error) logOnce(`send:${error}`, `outbox row ${id} not sent yet (${error}); it will be retried`);
        })().catch((err) => logOnce(`kick:${describeError(err)}`, `outbox delivery failed: ${describeError(err)}`));
      });
    } else holdNotice();
  }
  return { id };
}

/** SQL: seconds after creation at which a row with its current `attempts` is due again. */
function retryAfterSql() {
  const cases = RETRY_AFTER_SECONDS.map((s, i) => sql`WHEN ${sql.raw(String(i))} THEN ${sql.raw(String(s))}`);
  return sql`(CASE ${outbox.attempts} ${sql.join(cases, sql` `)} ELSE NULL END)`;
}

let flushing: Promise<FlushOutcome> | null = null;

/**
 * Retries unsent rows that are due (see RETRY_AFTER_SECONDS), oldest first, up to `limit`.
 * `now` moves the clock for the due test (the database's clock is used otherwise; tests pass a
 * later time to skip the wait). `only` limits the run to those rows (a caller retrying its own mail,
 * e.g. a test beside others that queue mail in the same database). Concurrent calls in one process
 * share a single run, unless they name their rows.
 */
export function flushOutbox(opts: { limit?: number; now?: Date; only?: readonly number[] } = {}): Promise<FlushOutcome> {
  if (opts.only) return runFlush(opts);
  if (!flushing) {
    flushing = runFlush(opts).finally(() => {
      flushing = null;
    });
  }
  return flushing;
}

async function runFlush({ limit = 50, now, only }: { limit?: number; now?: Date; only?: readonly number[] }): Promise<FlushOutcome> {
  const url = smtpUrl();
  if (!url) {
    holdNotice();
    return { due: 0, sent: 0, failed: 0, held: true };
  }
  const shift = now ? Math.round((now.getTime() - Date.now()) / 1000) : 0;
  const rows = await db()
    .select({
      id: outbox.id,
      attempts: outbox.attempts,
      toAddress: outbox.toAddress,
      subject: outbox.subject,
      textBody: outbox.textBody,
      htmlBody: outbox.htmlBody,
    })
    .from(outbox)
    .where(
      and(
        isNull(outbox.sentAt),
        lt(outbox.attempts, MAX_ATTEMPTS),
        sql`TIMESTAMPDIFF(SECOND, ${outbox.createdAt}, CURRENT_TIMESTAMP(3)) + ${shift} >= ${retryAfterSql()}`,
        only ? (only.length ? inArray(outbox.id, [...only]) : sql`FALSE`) : undefined,
      ),
    )
    .orderBy(outbox.id)
    .limit(limit);
  let sent = 0;
  let failed = 0;
  for (const row of rows) {
    if (!(await claim(row.id, row.attempts))) continue;
    const error = await deliver(row, url);
    if (error) failed++;
    else sent++;
  }
  return { due: rows.length, sent, failed, held: false };
}

let timer: ReturnType<typeof setInterval> | null = null;

/** Starts the periodic flusher once per process (unref'd: it never keeps the process alive). */
export function ensureOutboxFlusher(): void {
  if (timer) return;
  const s = settings();
  if (s.underVitest && s.mailFlushIntervalMs === null) return;
  const every = s.mailFlushIntervalMs ?? 30_000;
  if (every <= 0) return;
  timer = setInterval(() => {
    flushOutbox().catch((err) => logOnce(`flush:${describeError(err)}`, `outbox flush failed: ${describeError(err)}`));
  }, every);
  timer.unref();
}

export function stopOutboxFlusher(): void {
  if (timer) clearInterval(timer);
  timer = null;
}

/** Latest outbox rows, newest first (for the development mailbox page). */
export async function recentOutbox(limit = 20) {
  return db()
    .select({
      id: outbox.id,
      toAddress: outbox.toAddress,
      subject: outbox.subject,
      attempts: outbox.attempts,
      lastError: outbox.lastError,
      sentAt: outbox.sentAt,
      createdAt: outbox.createdAt,
    })
    .from(outbox)
    .orderBy(desc(outbox.id))
    .limit(limit);
}
