// The mailer against the real MariaDB (DATABASE_URL) and an SMTP stand-in started in this process
// on free ports (so the test does not depend on, or disturb, the one npm test starts).
import { afterAll, afterEach, beforeAll, describe, expect, test, vi } from "vitest";
import { eq, like } from "drizzle-orm";
import { mkdtempSync, rmSync } from "node:fs";
import net from "node:net";
import os from "node:os";
import path from "node:path";
import { closeDb, db } from "@db/client.server";
import { outbox } from "@db/schema";
import { startMailbox, type RunningMailbox } from "../../../fixtures/smtp/server";
import {
  MAX_ATTEMPTS,
  MailInputError,
  RETRY_AFTER_SECONDS,
  flushOutbox,
  getMailboxMessage,
  listMailbox,
  mailboxEnabled,
  sendMail,
} from ".";
import { fieldCheckMail } from "./templates";

const tag = `mt${Date.now().toString(36)}`;
const addr = (name: string) => `${name}.${tag}@example.test`;
const saved = { SMTP_URL: process.env.SMTP_URL, MAILBOX_API_URL: process.env.MAILBOX_API_URL, NODE_ENV: process.env.NODE_ENV };
const tmp = mkdtempSync(path.join(os.tmpdir(), "dutymark-mail-test-"));
let box: RunningMailbox;

/** A loopback port with nothing listening: the OS picks a free one and we close it again. */
async function closedPort(): Promise<number> {
  const srv = net.createServer();
  await new Promise<void>((r) => srv.listen(0, "127.0.0.1", () => r()));
  const port = (srv.address() as net.AddressInfo).port;
  await new Promise<void>((r) => srv.close(() => r()));
  return port;
}

function restoreEnv(k: keyof typeof saved) {
  if (saved[k] === undefined) delete process.env[k];
  else process.env[k] = saved[k];
}

const row = async (id: number) => (await db().select().from(outbox).where(eq(outbox.id, id)))[0];
const useLiveSmtp = () => {
  process.env.SMTP_URL = `smtp://127.0.0.1:${box.smtpPort}`;
};
const inMinutes = (m: number) => new Date(Date.now() + m * 60_000);

beforeAll(async () => {
  box = await startMailbox({ smtpPort: 0, webPort: 0, dir: tmp });
  process.env.MAILBOX_API_URL = `http://127.0.0.1:${box.webPort}`;
});

afterEach(() => {
  vi.restoreAllMocks();
});

afterAll(async () => {
  await db().delete(outbox).where(like(outbox.toAddress, `%.${tag}@example.test`));
  await closeDb();
  await box?.close();
  rmSync(tmp, { recursive: true, force: true });
  for (const k of Object.keys(saved) as Array<keyof typeof saved>) restoreEnv(k);
});

describe("sendMail", () => {
  test("with the SMTP server up: the row is written, sent_at is set and the message arrives", async () => {
    useLiveSmtp();
    const to = addr("up");
    const out = await sendMail({ to, subject: "Δp 1033 kPa — 15.6 °C", text: "Δp 1033 kPa — 15.6 °C\n", html: "<p>Δp 1033 kPa — 15.6 °C</p>" });
    expect(out).toEqual({ id: expect.any(Number), sent: true });
    const r = await row(out.id);
    expect(r.sentAt).toBeInstanceOf(Date);
    expect(r.attempts).toBe(1);
    expect(r.lastError).toBeNull();

    const got = await listMailbox({ to });
    expect(got).toHaveLength(1);
    expect(got[0].subject).toBe("Δp 1033 kPa — 15.6 °C");
    expect(got[0].text).toBe("Δp 1033 kPa — 15.6 °C\n");
    expect(got[0].html).toBe("<p>Δp 1033 kPa — 15.6 °C</p>");
    expect(got[0].from).toBe("Dutymark <no-reply@dutymark.localhost>"); // the default in the brief
    const full = await getMailboxMessage(got[0].id);
    expect(full?.headers["x-dutymark-outbox-id"]).toBe(String(out.id));
  });

  test("with the SMTP server down: the mail is kept unsent with the error; a later flush sends it", async () => {
    process.env.SMTP_URL = `smtp://127.0.0.1:${await closedPort()}`;
    const to = addr("down");
    const out = await sendMail({ to, subject: "Kept for later", text: "kept", html: "<p>kept</p>" });
    expect(out.sent).toBe(false);
    // ECONNREFUSED: the system error for a refused TCP connection (Node.js docs, "Common system errors").
    expect(out.error).toMatch(/ECONNREFUSED/);
    let r = await row(out.id);
    expect(r.sentAt).toBeNull();
    expect(r.attempts).toBe(1);
    expect(r.lastError).toMatch(/ECONNREFUSED/);

    // Server back, but the row is not due yet (first retry after RETRY_AFTER_SECONDS[1] s).
    useLiveSmtp();
    await flushOutbox({ only: [out.id] });
    r = await row(out.id);
    expect(r.sentAt).toBeNull();
    expect(r.attempts).toBe(1);
    expect(await listMailbox({ to })).toHaveLength(0);

    // Once due, the flush sends it and clears the error.
    const flushed = await flushOutbox({ now: new Date(Date.now() + (RETRY_AFTER_SECONDS[1] + 5) * 1000), only: [out.id] });
    expect(flushed).toMatchObject({ due: 1, sent: 1, failed: 0 });
    r = await row(out.id);
    expect(r.sentAt).toBeInstanceOf(Date);
    expect(r.attempts).toBe(2);
    expect(r.lastError).toBeNull();
    const got = await listMailbox({ to });
    expect(got.map((m) => m.subject)).toEqual(["Kept for later"]);

    // A sent row is never sent again.
    await flushOutbox({ now: inMinutes(24 * 60), only: [out.id] });
    expect(await listMailbox({ to })).toHaveLength(1);
    expect((await row(out.id)).attempts).toBe(2);
  });

  test("a flush of named rows sends those only, however many older rows are due", async () => {
    useLiveSmtp();
    // 60 older due rows (more than a flush's default limit of 50): a plain flush, oldest first, would
    // not reach ours; rows other tests queue in the same database are such rows.
    const others = addr("older");
    await db()
      .insert(outbox)
      .values(Array.from({ length: 60 }, (_, i) => ({ toAddress: others, subject: `older ${i}`, textBody: "x", htmlBody: "x", attempts: 0 })));
    const to = addr("named");
    const [{ id }] = await db().insert(outbox).values({ toAddress: to, subject: "named", textBody: "x", htmlBody: "x", attempts: 0 }).$returningId();
    const out = await flushOutbox({ only: [id] });
    expect(out).toMatchObject({ due: 1, sent: 1, failed: 0 });
    expect((await row(id)).sentAt).toBeInstanceOf(Date);
    expect(await listMailbox({ to: others })).toHaveLength(0);
    // An empty list names no row: nothing is sent.
    expect(await flushOutbox({ only: [] })).toMatchObject({ due: 0, sent: 0 });
    expect(await listMailbox({ to: others })).toHaveLength(0);
    await db().delete(outbox).where(eq(outbox.toAddress, others));
  });

  test("a row that used up its attempts is kept but no longer retried", async () => {
    useLiveSmtp();
    const to = addr("spent");
    const [{ id }] = await db()
      .insert(outbox)
      .values({ toAddress: to, subject: "spent", textBody: "x", htmlBody: "x", attempts: MAX_ATTEMPTS, lastError: "old failure" })
      .$returningId();
    await flushOutbox({ now: inMinutes(7 * 24 * 60), only: [id] });
    const r = await row(id);
    expect(r.sentAt).toBeNull();
    expect(r.attempts).toBe(MAX_ATTEMPTS);
    expect(await listMailbox({ to })).toHaveLength(0);
  });

  test("without SMTP_URL the mail is held in the outbox and that is logged once", async () => {
    delete process.env.SMTP_URL;
    process.env.NODE_ENV = "production";
    const warn = vi.spyOn(console, "warn").mockImplementation(() => {});
    const a = await sendMail({ to: addr("held"), subject: "held 1", text: "x", html: "x" });
    const b = await sendMail({ to: addr("held"), subject: "held 2", text: "x", html: "x" });
    restoreEnv("NODE_ENV");
    expect(a).toMatchObject({ sent: false, held: true });
    expect(b).toMatchObject({ sent: false, held: true });
    expect(warn).toHaveBeenCalledTimes(1);
    expect(String(warn.mock.calls[0][0])).toMatch(/SMTP_URL/);
    for (const id of [a.id, b.id]) {
      const r = await row(id);
      expect(r.sentAt).toBeNull();
      expect(r.attempts).toBe(0); // holding is not a failed attempt
    }
    // Configured again: the held rows go out on the next flush.
    useLiveSmtp();
    await flushOutbox({ only: [a.id, b.id] });
    expect((await row(a.id)).sentAt).toBeInstanceOf(Date);
    expect((await listMailbox({ to: addr("held") })).map((m) => m.subject).sort()).toEqual(["held 1", "held 2"]);
  });

  test("rejects what would not make a single safe message, and writes nothing", async () => {
    useLiveSmtp();
    const bad = [
      { to: `${addr("one")}, ${addr("two")}`, subject: "s", text: "t", html: "h" },
      { to: addr("inject"), subject: "Hi\r\nBcc: someone@example.test", text: "t", html: "h" },
      { to: addr("long"), subject: "x".repeat(201), text: "t", html: "h" }, // subject is varchar(200) in db/schema.ts
    ];
    for (const m of bad) await expect(sendMail(m)).rejects.toBeInstanceOf(MailInputError);
    const rows = await db().select().from(outbox).where(like(outbox.toAddress, `%inject.${tag}%`));
    expect(rows).toHaveLength(0);
  });

  test("a template goes through end to end with its link intact", async () => {
    useLiveSmtp();
    const to = addr("engineer");
    const link = "https://dutymark.localhost/field/42?from=mail&unit=si";
    const mail = fieldCheckMail({
      projectName: "Pumphouse <North>",
      selectionName: "CHW-P1",
      verdict: "fail",
      detail: "Delivered Δp 1033 kPa — 15.6 °C.",
      link,
    });
    expect((await sendMail({ to, ...mail })).sent).toBe(true);
    const [m] = await listMailbox({ to });
    expect(m.subject).toBe(mail.subject);
    expect(m.text).toBe(mail.text);
    expect(m.html).toBe(mail.html);
    expect(m.links).toContain(link);
  });
});

describe("mailboxEnabled", () => {
  afterEach(() => {
    restoreEnv("NODE_ENV");
    delete process.env.DUTYMARK_TEST_MODE;
    delete process.env.MAILBOX_ENABLED;
  });

  test("off in production unless test mode or MAILBOX_ENABLED=1", () => {
    process.env.MAILBOX_API_URL ??= "http://127.0.0.1:9/";
    process.env.NODE_ENV = "production";
    delete process.env.DUTYMARK_TEST_MODE;
    delete process.env.MAILBOX_ENABLED;
    expect(mailboxEnabled()).toBe(false);
    process.env.DUTYMARK_TEST_MODE = "1";
    expect(mailboxEnabled()).toBe(true);
    delete process.env.DUTYMARK_TEST_MODE;
    process.env.MAILBOX_ENABLED = "1";
    expect(mailboxEnabled()).toBe(true);
    delete process.env.MAILBOX_ENABLED;
    process.env.NODE_ENV = "development";
    expect(mailboxEnabled()).toBe(true);
  });

  test("off whenever no stand-in catches the mail (a real SMTP_URL), whatever MAILBOX_ENABLED says", () => {
    const saved = process.env.MAILBOX_API_URL;
    try {
      delete process.env.MAILBOX_API_URL;
      process.env.NODE_ENV = "development";
      process.env.MAILBOX_ENABLED = "1";
      expect(mailboxEnabled()).toBe(false);
      process.env.MAILBOX_API_URL = "http://127.0.0.1:9/";
      expect(mailboxEnabled()).toBe(true);
    } finally {
      if (saved === undefined) delete process.env.MAILBOX_API_URL;
      else process.env.MAILBOX_API_URL = saved;
    }
  });
});
