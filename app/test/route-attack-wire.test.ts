// Every route of app/routes.ts sent, on the wire to the built app (app/serve.mjs), a POST over its body limit
// (lib/shared/body-limits.mjs) without a Content-Length (Transfer-Encoding: chunked), as its owner with real ids, so the
// guard lets the body through to whatever reads it; then an odd JSON body to every JSON API (invalid UTF-8, 10 000 levels
// deep). Expected (RFC 9110 §15.5.14, RFC 9457): a 4xx — 413 when the body is read, else the refusal that came first —
// never a 5xx, problem+json under /api/ and an HTML page elsewhere, nothing in the server's log, and the app still
// answering. The routes come from route-table.ts, so a new route is sent it too. server-hardening.test.ts checks the
// limits' numbers on a few routes; this one sweeps them all.
import http from "node:http";
import { existsSync, readFileSync } from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { users } from "@db/schema";
import { startSession } from "~/lib/auth/session.server";
import { allowedMethods } from "~/lib/shared/methods";
import { bodyLimitFor } from "~/lib/shared/body-limits.mjs";
import { CALC_ENDPOINT_DOCS } from "~/lib/calc-api/examples";
import { defaultSystemInput } from "~/lib/projects/hydraulics";
import { BASE, makeMember, ROOT, startBuiltApp, type BuiltApp } from "./harness";
import { GOOD_PARAMS, isApi, pathFor, ROUTES, walkRecords, type WalkRecords } from "./route-table";
import { chunkedPost, type WireAnswer } from "./wire-bodies";

const built = existsSync(path.join(ROOT, "build/server/index.js"));
let app: BuiltApp | null = null;
let owner: WalkRecords;

beforeAll(async () => {
  if (!built) return;
  owner = await walkRecords(await makeMember("admin"));
  app = await startBuiltApp({ COOKIE_SECURE: "0", STRIPE_API_BASE: "", STRIPE_WEBHOOK_SECRET: "whsec_route_attack" });
}, 120_000);
afterAll(() => {
  app?.stop();
  return closeDb();
});

type Answer = WireAnswer;

/** Sends `total` bytes in 64 KB chunks with no Content-Length, stopping at the first answer. */
const chunked = (pathname: string, total: number, headers: Record<string, string>): Promise<Answer> =>
  chunkedPost(app!.port, pathname, total, { origin: app!.base, ...headers });

/** What is wrong with a refusal on the wire (null: nothing): not a 4xx, or not in its side's shape. */
function wrongOnWire(a: Answer, api: boolean): string | null {
  if (a.status < 400 || a.status >= 500) return `${a.status} ${a.body.slice(0, 160)}`;
  if (api) {
    if (a.type !== "application/problem+json") return `${a.status} as ${a.type}: ${a.body.slice(0, 120)}`;
    const p = JSON.parse(a.body) as Record<string, unknown>;
    return p.status === a.status && typeof p.title === "string" && typeof p.detail === "string" && typeof p.type === "string" ? null : `problem ${a.body.slice(0, 120)}`;
  }
  return /^text\/html/.test(a.type) && a.body.startsWith("<!DOCTYPE html>") ? null : `${a.status} as ${a.type}: ${a.body.slice(0, 120)}`;
}

/**
 * The routes that take a POST (outside /api/ by the method table; under it, an action that is not a refusal of POST): those
 * that read a body. A route that refuses POST answers 405 before reading it: the test after the next holds every early
 * answer to reaching a client still sending (app/serve.mjs lingers before closing, RFC 9112 §9.6).
 */
const takesPost = (r: { path: string; file: string }) =>
  isApi(r.path) ? r.path !== "api/*" && !/export const action = refuseMethod\(/.test(readFileSync(`app/${r.file}`, "utf8")) : allowedMethods(r.path).includes("POST");

const typeFor = (p: string) => (/upload$|photos$|checks$/.test(p) ? "multipart/form-data; boundary=QQ" : isApi(p) ? "application/json" : "application/x-www-form-urlencoded");

describe.skipIf(!built)("bodies on the wire, every route", () => {
  test("a chunked POST past the route's body limit, no Content-Length, as the owner: a 4xx in its side's shape (413 where the body is read), the log quiet, the app still up", async () => {
    const fails: string[] = [];
    const tally = new Map<number, number>();
    const from = app!.stderr().length;
    for (const r of ROUTES.filter(takesPost)) {
      const params = GOOD_PARAMS[r.path]?.(owner) ?? {};
      const p = pathFor(r.path, params);
      const api = isApi(r.path);
      // a session of its own for each request (a sign-out ends only it), in the workspace its records are in
      await db().update(users).set({ currentWorkspaceId: owner.m.workspaceId }).where(eq(users.id, owner.m.userId));
      const session = (await startSession(owner.m.userId, new Request(BASE))).split(";")[0];
      const auth: Record<string, string> = api ? { authorization: `Bearer ${owner.token}` } : { cookie: session };
      const logAt = app!.stderr().length;
      const limit = bodyLimitFor(p);
      let a: Answer;
      try {
        a = await chunked(p, limit + 128 * 1024, { ...auth, "content-type": typeFor(r.path), ...(r.path === "api/stripe/webhook" ? { "stripe-signature": "t=1,v1=x" } : {}) });
      } catch (e) {
        fails.push(`POST ${p} (${limit + 128 * 1024} bytes chunked) → no answer: ${String(e)} after ${(e as { sent?: number }).sent} bytes`);
        continue;
      }
      tally.set(a.status, (tally.get(a.status) ?? 0) + 1);
      const wrong = wrongOnWire(a, api);
      if (wrong) fails.push(`POST ${p} (${limit + 128 * 1024} bytes chunked) → ${wrong}`);
      const logged = app!.stderr().slice(logAt);
      if (logged.trim()) fails.push(`POST ${p}: the server's log: ${logged.slice(0, 300)}`);
    }
    console.info(`chunked past the limit: ${ROUTES.filter(takesPost).length} routes, answers ${JSON.stringify(Object.fromEntries(tally))}`);
    expect((await fetch(`${app!.base}/healthz`)).status).toBe(200);
    await new Promise((done) => setTimeout(done, 200)); // the pipe's last lines (the log is read, not timed)
    const log = app!.stderr().slice(from);
    if (log.trim() && !fails.some((f) => f.includes("the server's log"))) fails.push(`the server's log: ${log.slice(0, 400)}`);
    if (fails.length) console.error(`${fails.length} failures:\n${fails.join("\n")}`);
    expect(fails).toEqual([]);
  }, 180_000);

  test("a chunked POST answered before its body is read (cross-site 403, anonymous 401 or redirect, a bad token's 401, a route that refuses POST 405), on every route: the client reads the answer, never a reset; the log quiet", async () => {
    const fails: string[] = [];
    const tally = new Map<string, number>();
    const from = app!.stderr().length;
    // Past what the kernel's buffers hold on either side, so the client is still sending when the answer comes;
    // the same size everywhere (a route's own limit may be 25 MB), within every route's limit + 128 KB
    const total = bodyLimitFor("/") + 128 * 1024;
    await db().update(users).set({ currentWorkspaceId: owner.m.workspaceId }).where(eq(users.id, owner.m.userId));
    const session = (await startSession(owner.m.userId, new Request(BASE))).split(";")[0];
    for (const r of ROUTES) {
      const p = pathFor(r.path, GOOD_PARAMS[r.path]?.(owner) ?? {});
      const api = isApi(r.path);
      const senders: [string, Record<string, string>][] = [
        ["cross-site with the owner's cookie", { origin: "http://evil.example", cookie: session }],
        ["anonymous", {}],
        ...(api ? [["a token that is none", { authorization: "Bearer dm_not_a_token" }] as [string, Record<string, string>]] : []),
        ...(takesPost(r) ? [] : [["the owner, where POST is refused", api ? { authorization: `Bearer ${owner.token}` } : { cookie: session }] as [string, Record<string, string>]]),
      ];
      for (const [who, headers] of senders) {
        let a: Answer;
        try {
          a = await chunkedPost(app!.port, p, total, { origin: app!.base, "content-type": typeFor(r.path), ...headers });
        } catch (e) {
          fails.push(`POST ${p} as ${who} (${total} bytes chunked) → no answer: ${String(e)} after ${(e as { sent?: number }).sent} bytes`);
          continue;
        }
        tally.set(`${who} ${a.status}`, (tally.get(`${who} ${a.status}`) ?? 0) + 1);
        // anonymous on a page: the redirect to sign in is its answer
        const wrong = a.status >= 300 && a.status < 400 && !api && a.body.startsWith("/signin") ? null : wrongOnWire(a, api);
        if (wrong) fails.push(`POST ${p} as ${who} → ${wrong}`);
      }
    }
    console.info(`answered before the body: ${JSON.stringify(Object.fromEntries(tally))}`);
    expect((await fetch(`${app!.base}/healthz`)).status).toBe(200);
    await new Promise((done) => setTimeout(done, 200)); // the pipe's last lines (the log is read, not timed)
    const log = app!.stderr().slice(from);
    if (log.trim()) fails.push(`the server's log: ${log.slice(0, 400)}`);
    if (fails.length) console.error(`${fails.length} failures:\n${fails.join("\n")}`);
    expect(fails).toEqual([]);
  }, 300_000);

  test("OPTIONS on every route, as the owner and anonymous: 204, no body, Allow the route's methods and OPTIONS — the methods of its 405 to PUT (api/*: 404)", async () => {
    const fails: string[] = [];
    const from = app!.stderr().length;
    const ask = async (method: string, p: string, headers: Record<string, string>) => {
      const res = await fetch(`${app!.base}${p}`, { method, headers: { origin: app!.base, ...headers }, redirect: "manual" });
      return { status: res.status, allow: res.headers.get("allow"), body: await res.text() };
    };
    const session = (await startSession(owner.m.userId, new Request(BASE))).split(";")[0];
    for (const r of ROUTES) {
      const p = pathFor(r.path, GOOD_PARAMS[r.path]?.(owner) ?? {});
      const api = isApi(r.path);
      const put = await ask("PUT", p, api ? { authorization: `Bearer ${owner.token}`, "content-type": "application/json" } : { cookie: session });
      for (const [who, headers] of [["the owner", api ? { authorization: `Bearer ${owner.token}` } : { cookie: session }], ["anonymous", {}]] as const) {
        const o = await ask("OPTIONS", p, headers);
        if (r.path === "api/*") {
          if (o.status !== 404) fails.push(`OPTIONS ${p} as ${who} → ${o.status}, not 404`);
          continue;
        }
        const want = put.allow; // the 405's Allow names OPTIONS too (RFC 9110 §10.2.1; helper "formedges")
        if (put.status !== 405 || o.status !== 204 || o.allow !== want || o.body !== "") fails.push(`OPTIONS ${p} as ${who} → ${o.status} Allow ${o.allow} ${o.body.slice(0, 60)} (PUT: ${put.status} Allow ${put.allow})`);
      }
    }
    const log = app!.stderr().slice(from);
    if (log.trim()) fails.push(`the server's log: ${log.slice(0, 400)}`);
    if (fails.length) console.error(`${fails.length} failures:\n${fails.join("\n")}`);
    expect(fails).toEqual([]);
  }, 120_000);

  test("odd JSON on the wire to every JSON API (invalid UTF-8, inside 10 000 arrays, a BOM twice): 400 problem+json, the log quiet", async () => {
    const fails: string[] = [];
    const from = app!.stderr().length;
    const apis = ROUTES.filter((r) => isApi(r.path) && (r.path.startsWith("api/v1/calc/") || r.path.endsWith("/preview")));
    expect(apis.length).toBeGreaterThanOrEqual(4);
    for (const r of apis) {
      const p = pathFor(r.path, GOOD_PARAMS[r.path]?.(owner) ?? {});
      // the route's good body (its /api example, or the default system), spoilt
      const good = CALC_ENDPOINT_DOCS.find((d) => d.path === `/${r.path}`)?.request ?? JSON.stringify({ input: defaultSystemInput() });
      const bodies: [string, Buffer][] = [
        ["invalid UTF-8 in a string", Buffer.concat([Buffer.from(good.trim().replace(/\}$/, ',"x":"')), Buffer.from([0xff, 0xfe]), Buffer.from('"}')])],
        ["inside 10 000 arrays", Buffer.from("[".repeat(10_000) + good + "]".repeat(10_000))],
        ["two byte-order marks", Buffer.from("\uFEFF\uFEFF" + good)],
      ];
      for (const [name, body] of bodies) {
        const a = await new Promise<Answer>((resolve, reject) => {
          const req = http.request({ host: "127.0.0.1", port: app!.port, path: p, method: "POST", agent: false, headers: { authorization: `Bearer ${owner.token}`, "content-type": "application/json", "content-length": String(body.length) } }, (res) => {
            let text = "";
            res.on("data", (b) => (text += b));
            res.on("end", () => resolve({ status: res.statusCode ?? 0, type: String(res.headers["content-type"] ?? ""), body: text, sent: body.length }));
          });
          req.on("error", reject);
          req.end(body);
        });
        const wrong = wrongOnWire(a, true);
        if (wrong || a.status !== 400) fails.push(`POST ${p} (${name}) → ${wrong ?? `${a.status} ${a.body.slice(0, 120)}`}`);
      }
    }
    const log = app!.stderr().slice(from);
    if (log.trim()) fails.push(`the server's log: ${log.slice(0, 400)}`);
    if (fails.length) console.error(`${fails.length} failures:\n${fails.join("\n")}`);
    expect(fails).toEqual([]);
  }, 60_000);
});
