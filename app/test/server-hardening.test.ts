// The production server (app/serve.mjs on the build) as a client sees it: a nonce CSP through helmet,
// form-action and HSTS, Cache-Control on personal responses, and body limits counted on the bytes
// read — chunked bodies included (issue 14). Runs the built app as its own process, like faults.test.ts.
import http from "node:http";
import { spawn } from "node:child_process";
import { existsSync } from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { createApiToken } from "~/lib/auth/api-tokens.server";
import { eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { libraries } from "@db/schema";
import { createLibrary } from "~/lib/libraries";
import { freePort, makeMember, ROOT, startBuiltApp, type BuiltApp } from "./harness";
import { chunkedPost } from "./wire-bodies";

const built = existsSync(path.join(ROOT, "build/server/index.js"));

let app: BuiltApp | null = null;
let base = "";
let port = 0;
let cookie = "";
let token = "";
let libraryId = 0;

beforeAll(async () => {
  if (!built) return;
  const m = await makeMember("admin");
  cookie = m.cookie;
  token = (await createApiToken({ userId: m.userId, workspaceId: m.workspaceId, name: "srv", scope: "read" })).token;
  const viewer = { userId: m.userId, workspace: { id: m.workspaceId, name: "W", slug: "w", plan: "free" as const }, role: "admin" as const };
  libraryId = await createLibrary(viewer, { name: `Methods ${Date.now()}`, description: "" });
  // APP_URL behind https (a proxy in front): HSTS must be on. Requests here come over plain http.
  // The dev mailbox on as npm start has it (MAILBOX_ENABLED=1), its stand-in's API on a closed port.
  app = await startBuiltApp({ APP_URL: "https://dutymark.example", COOKIE_SECURE: "0", STRIPE_API_BASE: "", MAILBOX_API_URL: `http://127.0.0.1:${await freePort()}`, MAILBOX_ENABLED: "1" });
  ({ base, port } = app);
}, 30_000);
afterAll(() => {
  app?.stop();
  return closeDb();
});

/** Sends `total` bytes in 64 KB chunks (Transfer-Encoding: chunked unless `declare`), stopping at the first answer. */
function send(pathname: string, total: number, opts: { declare?: boolean; headers?: Record<string, string> } = {}) {
  const headers: Record<string, string> = { "content-type": "application/x-www-form-urlencoded", origin: base, ...opts.headers };
  if (opts.declare) headers["content-length"] = String(total);
  return chunkedPost(port, pathname, total, headers, "a");
}

describe.skipIf(!built)("headers", () => {
  test("a nonce CSP: script-src has a fresh nonce per response and no 'unsafe-inline'; every script tag carries it", async () => {
    const a = await fetch(`${base}/signin`);
    const b = await fetch(`${base}/signin`);
    const csp = a.headers.get("content-security-policy")!;
    const scriptSrc = csp.split(";").find((d) => d.trim().startsWith("script-src"))!;
    expect(scriptSrc).not.toContain("unsafe-inline");
    const nonce = /'nonce-([^']+)'/.exec(scriptSrc)![1];
    expect(nonce.length).toBeGreaterThanOrEqual(16);
    expect(b.headers.get("content-security-policy")).not.toContain(nonce);
    const html = await a.text();
    const scripts = [...html.matchAll(/<script\b[^>]*>/g)].map((m) => m[0]);
    expect(scripts.length).toBeGreaterThan(0);
    for (const s of scripts) expect(s).toContain(`nonce="${nonce}"`);
    expect(csp).toContain("frame-ancestors 'none'");
    expect(csp).toContain("default-src 'self'");
  });

  test("a client cannot choose the nonce", async () => {
    const r = await fetch(`${base}/signin`, { headers: { "x-dutymark-csp-nonce": "AAAAAAAAAAAAAAAAAAAAAAAA" } });
    expect(await r.text()).not.toContain('nonce="AAAAAAAAAAAAAAAAAAAAAAAA"');
  });

  test("form-action: our origin and the Stripe checkout only (no local ports); HSTS when APP_URL is https", async () => {
    const r = await fetch(`${base}/`);
    const formAction = r.headers.get("content-security-policy")!.split(";").find((d) => d.trim().startsWith("form-action"))!.trim();
    expect(formAction).toBe("form-action 'self' https://dutymark.example https://checkout.stripe.com https://billing.stripe.com");
    expect(r.headers.get("strict-transport-security")).toMatch(/max-age=31536000/);
    expect(r.headers.get("x-powered-by")).toBeNull();
    expect(r.headers.get("x-frame-options")).toBe("DENY");
  });

  test("Cache-Control: private, no-store on signed-in pages, exports and the API; public pages stay cacheable", async () => {
    expect((await fetch(`${base}/account`, { headers: { cookie } })).headers.get("cache-control")).toBe("private, no-store");
    expect((await fetch(`${base}/libraries/1/export.csv`, { headers: { cookie } })).headers.get("cache-control")).toBe("private, no-store");
    expect((await fetch(`${base}/api/v1/me`, { headers: { authorization: `Bearer ${token}` } })).headers.get("cache-control")).toBe("private, no-store");
    const calc = await fetch(`${base}/api/v1/calc/pipe-loss`, { method: "POST", headers: { "content-type": "application/json" }, body: "{}" });
    expect(calc.headers.get("cache-control")).toMatch(/no-store/);
    expect((await fetch(`${base}/signin`)).headers.get("cache-control")).not.toBe("private, no-store");
  });
});

const SYNC_FLUSH = Buffer.from([0x00, 0x00, 0xff, 0xff]);

describe.skipIf(!built)("documents and files", () => {
  test("a compressed page is compressed whole: no flush per React chunk (a gzip sync flush leaves the bytes 00 00 ff ff)", async () => {
    const raw = await new Promise<Buffer>((resolve, reject) => {
      http.get({ host: "127.0.0.1", port, path: "/projects", headers: { cookie, "accept-encoding": "gzip" } }, (res) => {
        const parts: Buffer[] = [];
        res.on("data", (b: Buffer) => parts.push(b));
        res.on("end", () => resolve(Buffer.concat(parts)));
      }).on("error", reject);
    });
    expect(raw.length).toBeGreaterThan(1000);
    let flushes = 0;
    for (let i = raw.indexOf(SYNC_FLUSH); i >= 0; i = raw.indexOf(SYNC_FLUSH, i + 1)) flushes++;
    // Before: one sync flush per 2 KB chunk React wrote (a dozen or more on this page); now none, or one by chance in the data.
    expect(flushes).toBeLessThanOrEqual(1);
  });

  test("a compressed page arrives as one complete document, gzip and brotli", async () => {
    for (const encoding of ["gzip", "br"]) {
      const r = await fetch(`${base}/projects`, { headers: { cookie, "accept-encoding": encoding } });
      expect(r.status).toBe(200);
      expect(r.headers.get("content-encoding")).toBe(encoding); // fetch decodes it for us below
      const html = await r.text();
      expect(html.startsWith("<!DOCTYPE html>")).toBe(true);
      expect(html.trimEnd().endsWith("</html>")).toBe(true);
      expect(html).toContain("window.__reactRouterContext");
    }
  });

  test("public files are served under their own names; any other path reaches the router (its 404 page, not a file lookup)", async () => {
    const sw = await fetch(`${base}/sw.js`);
    expect(sw.status).toBe(200);
    expect(sw.headers.get("content-type")).toMatch(/javascript/);
    const manifest = await fetch(`${base}/field.webmanifest`);
    expect(manifest.status).toBe(200);
    expect(JSON.parse(await manifest.text())).toHaveProperty("name");
    const stray = await fetch(`${base}/no-such-file.js`);
    expect(stray.status).toBe(404);
    expect(stray.headers.get("content-type")).toMatch(/text\/html/); // the app's own not-found page
    expect(await stray.text()).toContain("</html>");
  });
});

describe.skipIf(!built)("body limits on the bytes read", () => {
  test("a chunked 3 MB POST to /signin is cut at 1 MB with 413 (no sign-in needed), answered as a page (was bare text)", async () => {
    const r = await send("/signin", 3 * 1024 * 1024);
    expect(r.status).toBe(413);
    // lib/shared/refusal.server.ts: the status in the heading, the sentence below it (limit: body-limits.mjs, 1 MiB for forms).
    expect(r.type).toBe("text/html; charset=utf-8");
    expect(r.body).toMatch(new RegExp(`^<!DOCTYPE html>.*<h1[^>]*>413 Content Too Large</h1><p[^>]*>The request is too large: the limit here is ${1024 * 1024} bytes \\(\\d+ read or declared\\)\\.</p>`, "s"));
  }, 30_000);

  test("a chunked 2 MB POST to /projects → 413; a declared 2 MB → 413 before reading", async () => {
    expect((await send("/projects", 2 * 1024 * 1024, { headers: { cookie } })).status).toBe(413);
    expect((await send("/projects", 2 * 1024 * 1024, { declare: true, headers: { cookie } })).status).toBe(413);
  }, 30_000);

  test("a chunked 1 MB POST to the Stripe webhook (limit 512 KB) → 413 problem+json", async () => {
    const r = await send("/api/stripe/webhook", 1024 * 1024, { headers: { "content-type": "application/json", "stripe-signature": "t=1,v1=x" } });
    expect(r.status).toBe(413);
    expect(r.type).toBe("application/problem+json");
    // RFC 9457 members, as every API problem (problem.server.ts problemBody).
    expect(JSON.parse(r.body)).toEqual({ type: "about:blank", title: "Content Too Large", status: 413, detail: expect.stringMatching(/^The request is too large: the limit here is 524288 bytes/) });
  }, 30_000);

  test("uploads take the upload class's limit from the shared table (app/lib/shared/body-limits.mjs): a declared 2 MB passes, 26 MB → 413", async () => {
    // declares the length, sends 64 KB and waits: both answers come before the body is read
    const declare = (bytes: number) =>
      new Promise<number>((resolve, reject) => {
        const headers = { "content-type": "multipart/form-data; boundary=x", authorization: "Bearer not-a-token", "content-length": String(bytes) };
        const req = http.request({ host: "127.0.0.1", port, path: "/api/v1/libraries/1/upload", method: "POST", headers }, (res) => {
          res.resume();
          resolve(res.statusCode ?? 0);
          req.destroy();
        });
        req.on("error", reject);
        req.write(Buffer.alloc(64 * 1024, "a"));
      });
    expect(await declare(2 * 1024 * 1024)).toBe(401); // past both limit checks: the bad token answers
    expect(await declare(26 * 1024 * 1024)).toBe(413);
  }, 30_000);

  test("a small chunked POST still reaches the app (a wrong password is a 400, not a 413)", async () => {
    const body = "email=nobody%40example.test&password=wrong";
    const r = await new Promise<number>((resolve, reject) => {
      const req = http.request({ host: "127.0.0.1", port, path: "/signin", method: "POST", headers: { "content-type": "application/x-www-form-urlencoded", origin: base } }, (res) => {
        res.resume();
        resolve(res.statusCode ?? 0);
      });
      req.on("error", reject);
      req.write(body.slice(0, 10));
      req.end(body.slice(10));
    });
    expect(r).toBe(400);
  });
});

describe.skipIf(!built)("paths with bad percent-escapes (helper \"attack\", 2026-12-02)", () => {
  test("an id that is no UTF-8 once decoded (%FF, %C0%AF): the app's own 404 (problem+json under /api), not Express's HTML 400 with a URIError logged", async () => {
    for (const p of ["/projects/%FF", "/selections/%C0%AF/export.csv", "/libraries/%FF/trace/%C0%AF"]) {
      const r = await fetch(`${base}${p}`, { headers: { cookie } });
      expect(r.status, p).toBe(404);
      expect(await r.text(), p).not.toContain("<pre>Bad Request</pre>");
    }
    for (const p of ["/api/v1/systems/%FF", "/api/v1/models/%C0%AF", "/api/v1/libraries/%FF/curves"]) {
      const r = await fetch(`${base}${p}`, { headers: { authorization: `Bearer ${token}` } });
      expect(r.status, p).toBeGreaterThanOrEqual(400);
      expect(r.status, p).toBeLessThan(500);
      expect(r.headers.get("content-type"), p).toBe("application/problem+json");
    }
  });
});

describe.skipIf(!built)("methods no form sends, and the dev mailbox (helper \"methods\", 2026-12-02)", () => {
  test("PUT, PATCH and DELETE on pages: 405 with Allow and no action run (the session survives DELETE /signout, the library survives intent=delete)", async () => {
    const send = (method: string, p: string) =>
      fetch(`${base}${p}`, { method, redirect: "manual", headers: { cookie, origin: base, "content-type": "application/x-www-form-urlencoded" }, body: "intent=delete&email=a%40b.test&password=x" });
    for (const [method, p, allow] of [["DELETE", "/signout", "GET, HEAD, POST, OPTIONS"], ["PUT", `/libraries/${libraryId}`, "GET, HEAD, POST, OPTIONS"], ["PATCH", "/signin", "GET, HEAD, POST, OPTIONS"], ["DELETE", "/", "GET, HEAD, OPTIONS"]]) {
      const r = await send(method, p);
      // RFC 9110 §15.5.6: 405 names the methods the resource takes in Allow (§10.2.1), OPTIONS among them (answered 204).
      expect([method, p, r.status, r.headers.get("allow")]).toEqual([method, p, 405, allow]);
    }
    expect((await fetch(`${base}/account`, { headers: { cookie }, redirect: "manual" })).status).toBe(200);
    const [lib] = await db().select().from(libraries).where(eq(libraries.id, libraryId));
    expect(lib?.name.startsWith("Methods ")).toBe(true);
  });

  test("a POST to a page without an action and PROPFIND on a page: 405 with Allow; OPTIONS: 204 with Allow and OPTIONS (was 405); no stack in the server's log", async () => {
    const from = app!.stderr().length;
    const cases: [string, string, number, string][] = [["POST", "/field", 405, "GET, HEAD, OPTIONS"], ["POST", "/", 405, "GET, HEAD, OPTIONS"], ["OPTIONS", "/signin", 204, "GET, HEAD, POST, OPTIONS"], ["OPTIONS", "/field", 204, "GET, HEAD, OPTIONS"], ["PROPFIND", "/", 405, "GET, HEAD, OPTIONS"], ["PUT", "/field", 405, "GET, HEAD, OPTIONS"]];
    for (const [method, p, status, allow] of cases) {
      const r = await fetch(`${base}${p}`, { method, headers: { origin: base, "content-type": "application/x-www-form-urlencoded" }, body: method === "OPTIONS" || method === "PROPFIND" ? undefined : "x=1" });
      expect([method, p, r.status, r.headers.get("allow")]).toEqual([method, p, status, allow]);
    }
    await fetch(`${base}/livez`); // the app logs before it answers; one more round trip lets the pipe deliver it
    await new Promise((r) => setTimeout(r, 200));
    expect(app!.stderr().slice(from)).toBe("");
  });

  test("/dev/mailbox: served to this machine (loopback, the client address app/serve.mjs sets); a request through a proxy is a 404", async () => {
    expect((await fetch(`${base}/dev/mailbox`)).status).toBe(200);
    // A client's own value of the address header is overwritten with the socket's (still loopback here).
    expect((await fetch(`${base}/dev/mailbox`, { headers: { "x-dutymark-client-ip": "203.0.113.7" } })).status).toBe(200);
    expect((await fetch(`${base}/dev/mailbox`, { headers: { "x-forwarded-for": "203.0.113.7" } })).status).toBe(404);
    expect((await fetch(`${base}/dev/mailbox`, { headers: { forwarded: "for=203.0.113.7" } })).status).toBe(404);
  });
});

describe.skipIf(!built)("settings checked at start (app/lib/shared/env.server.ts)", () => {
  test("a bad setting stops the server with one line per problem, before it listens", async () => {
    const p = await freePort();
    const child = spawn(process.execPath, ["app/serve.mjs", "build/server/index.js"], {
      cwd: ROOT,
      env: { ...process.env, PORT: String(p), HOST: "127.0.0.1", NODE_ENV: "production", APP_URL: "ftp://dutymark.example", TRUST_PROXY: "yes" },
      stdio: ["ignore", "ignore", "pipe"],
    });
    let stderr = "";
    child.stderr?.on("data", (b) => (stderr += b));
    const code = await new Promise<number | null>((resolve) => child.once("exit", resolve));
    expect(code).toBe(1);
    expect(stderr).toContain("Dutymark cannot start: 2 settings are wrong");
    expect(stderr).toContain("APP_URL must be a URL starting with http:// or https://");
    expect(stderr).toContain("TRUST_PROXY must be 0, a number of proxy hops from 1 to 10, or your proxies' addresses or subnets");
    expect(stderr).not.toMatch(/\n\s+at /); // no stack trace, just the problems
    expect(await fetch(`http://127.0.0.1:${p}/livez`).then((r) => r.status).catch(() => "refused")).toBe("refused");
  }, 30_000);
});
