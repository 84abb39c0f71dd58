// Who may see the development mailbox (routes/dev.mailbox.tsx, mailboxOpenTo in mailbox.server.ts):
// every sign-up, reset and invitation link the app sends sits there. Found by helper "methods",
// 2026-12-02: /dev/mailbox showed them to anyone who could reach the app whenever the SMTP stand-in ran
// (npm start serves it with MAILBOX_ENABLED=1, on whatever HOST it is given). Now only a request from
// this machine itself sees it (loopback client address, no proxy); anyone else gets a 404 and its
// buttons do nothing. A real stand-in (fixtures/smtp) on free ports, the route module called directly.
import { afterAll, afterEach, beforeAll, expect, test } from "vitest";
import { like } from "drizzle-orm";
import { mkdtempSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { closeDb, db } from "@db/client.server";
import { outbox } from "@db/schema";
import { startMailbox, type RunningMailbox } from "../../../fixtures/smtp/server";
import * as mailboxRoute from "~/routes/dev.mailbox";
import { call } from "~/test/harness";
import { listMailbox, sendMail } from ".";

const KEYS = ["SMTP_URL", "MAILBOX_API_URL", "NODE_ENV", "MAILBOX_ENABLED", "DUTYMARK_TEST_MODE", "TRUST_PROXY"] as const;
const saved = Object.fromEntries(KEYS.map((k) => [k, process.env[k]]));
const tmp = mkdtempSync(path.join(os.tmpdir(), "dutymark-mailbox-access-"));
const tag = `ma${Date.now().toString(36)}`;
const to = `reset.${tag}@example.test`;
const link = `http://127.0.0.1:3999/reset?token=${tag}secret`;
let box: RunningMailbox;

beforeAll(async () => {
  box = await startMailbox({ smtpPort: 0, webPort: 0, dir: tmp });
  process.env.SMTP_URL = `smtp://127.0.0.1:${box.smtpPort}`;
  process.env.MAILBOX_API_URL = `http://127.0.0.1:${box.webPort}`;
});
const restore = (keys: readonly (typeof KEYS)[number][]) => {
  for (const k of keys) {
    if (saved[k] === undefined) delete process.env[k];
    else process.env[k] = saved[k];
  }
};
afterEach(() => restore(KEYS.slice(2)));
afterAll(async () => {
  restore(KEYS);
  await db().delete(outbox).where(like(outbox.toAddress, `%.${tag}@example.test`));
  await box.close();
  rmSync(tmp, { recursive: true, force: true });
  await closeDb();
});

const open = (headers: Record<string, string>) => call(mailboxRoute.loader as never, { path: `/dev/mailbox?to=${encodeURIComponent(to)}`, headers });
const clear = (headers: Record<string, string>) => call(mailboxRoute.action as never, { path: "/dev/mailbox", form: { intent: "clear" }, headers: { origin: "http://127.0.0.1:3999", ...headers } });
const LOCAL = { "x-dutymark-client-ip": "127.0.0.1" };
const shown = (r: Awaited<ReturnType<typeof open>>) => JSON.stringify(r.body).includes(link);

test("a request from this machine sees the reset link; another address, a proxied request or no address gets a 404 without it", async () => {
  process.env.NODE_ENV = "development";
  expect((await sendMail({ to, subject: "Reset your password", text: `Open ${link}`, html: `<a href="${link}">Reset</a>` })).sent).toBe(true);
  const mine = await open(LOCAL);
  expect([mine.status, shown(mine)]).toEqual([200, true]);
  expect(shown(await open({ "x-dutymark-client-ip": "::1" }))).toBe(true);
  // Addresses from RFC 5737 (documentation) and RFC 1918 (private): not this machine.
  const elsewhere: Record<string, string>[] = [{ "x-dutymark-client-ip": "203.0.113.7" }, { "x-dutymark-client-ip": "192.168.1.20" }, {}, { ...LOCAL, "x-forwarded-for": "203.0.113.7" }, { ...LOCAL, forwarded: "for=203.0.113.7" }];
  for (const headers of elsewhere) {
    const r = await open(headers);
    expect([JSON.stringify(headers), r.status, shown(r)]).toEqual([JSON.stringify(headers), 404, false]);
  }
  process.env.TRUST_PROXY = "1"; // the client address then comes from X-Forwarded-For, which a client writes itself
  expect((await open(LOCAL)).status).toBe(404);
});

test("off in production unless asked for (MAILBOX_ENABLED=1 as npm start sets it, or test mode as npm test's app processes), and then still only for this machine", async () => {
  // Neither opt-in from the environment this test runs in (npm test sets test mode for its processes).
  delete process.env.MAILBOX_ENABLED;
  delete process.env.DUTYMARK_TEST_MODE;
  process.env.NODE_ENV = "production";
  expect((await open(LOCAL)).status).toBe(404);
  process.env.MAILBOX_ENABLED = "1";
  expect((await open(LOCAL)).status).toBe(200);
  expect((await open({ "x-dutymark-client-ip": "203.0.113.7" })).status).toBe(404);
  delete process.env.MAILBOX_ENABLED;
  process.env.DUTYMARK_TEST_MODE = "1";
  expect((await open(LOCAL)).status).toBe(200);
  expect((await open({ "x-dutymark-client-ip": "203.0.113.7" })).status).toBe(404);
});

test("its buttons: 'Empty the mailbox' from elsewhere is a 404 and removes nothing; from this machine it empties it", async () => {
  process.env.NODE_ENV = "development";
  expect((await sendMail({ to, subject: "Confirm your address", text: `Open ${link}`, html: `<a href="${link}">Confirm</a>` })).sent).toBe(true);
  const before = (await listMailbox({ to })).length;
  expect(before).toBeGreaterThan(0);
  expect((await clear({ "x-dutymark-client-ip": "203.0.113.7" })).status).toBe(404);
  expect((await listMailbox({ to })).length).toBe(before);
  const done = await clear(LOCAL);
  expect(done.status).toBe(200);
  expect(await listMailbox({ to })).toEqual([]);
});
