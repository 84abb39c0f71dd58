// What the production server (app/serve.mjs on the build) answers before React Router, where React Router
// would answer first and log (found by sending them to the running app, 2026-12-03):
//  - methods React Router does not take (PROPFIND, MKCOL, TRACE, LOCK…) on resource routes came back 405 with
//    {"message":"Unexpected Server Error"} and no Allow; now 405 with the route's Allow (problem+json under /api/,
//    text elsewhere), an /api/ path no route serves 404, and TRACE echoes nothing;
//  - a POST with a foreign Origin to a page or its `.data` came back 400 from React Router's own origin check with
//    two stacks in the log per request; now our CSRF check (lib/auth/csrf.server.ts) answers 403 first, log quiet;
//  - these answers were bare text outside /api/ (and PUT/PATCH/DELETE on a page problem+json, from the root middleware);
//    now every one is an HTML page with a heading and the sentence outside /api/, problem+json with type, title, status
//    and detail under /api/ (lib/shared/refusal.server.ts), swept over every route of app/routes.ts below.
// Expected values: RFC 9110 (§15.5.6: a 405 names the methods the resource takes in Allow; §9.3.8: TRACE
// reflects the request, so a server that does not serve it must echo nothing), each route's own 405 (its Allow,
// asked with a method it refuses) and the method table (lib/shared/methods.ts).
import http from "node:http";
import net from "node:net";
import { existsSync } from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import { createApiToken } from "~/lib/auth/api-tokens.server";
import { allowedMethods, allowHeader } from "~/lib/shared/methods";
import routeConfig from "~/routes";
import { makeMember, ROOT, startBuiltApp, type BuiltApp } from "./harness";

const built = existsSync(path.join(ROOT, "build/server/index.js"));

let app: BuiltApp | null = null;
let port = 0;
let base = "";
let cookie = "";
let token = "";

beforeAll(async () => {
  if (!built) return;
  const m = await makeMember("admin");
  cookie = m.cookie;
  token = (await createApiToken({ userId: m.userId, workspaceId: m.workspaceId, name: "early", scope: "read" })).token;
  app = await startBuiltApp({ APP_URL: "https://dutymark.example", COOKIE_SECURE: "0", STRIPE_API_BASE: "" });
  ({ base, port } = app);
}, 30_000);
afterAll(() => {
  app?.stop();
  return closeDb();
});

type Answer = { status: number; headers: http.IncomingHttpHeaders; body: string };
/** Any method (fetch refuses TRACE), with the session cookie, a token and a canary header that must never come back. */
function send(method: string, p: string, headers: Record<string, string> = {}, body?: string): Promise<Answer> {
  return new Promise((resolve, reject) => {
    // Content-Length given: Node's client sends a TRACE body unframed otherwise.
    const length = body === undefined ? {} : { "content-length": String(Buffer.byteLength(body)) };
    const req = http.request({ host: "127.0.0.1", port, path: p, method, headers: { cookie, "x-canary": "canary-4711", ...length, ...headers } }, (res) => {
      let text = "";
      res.on("data", (b) => (text += b));
      res.on("end", () => resolve({ status: res.statusCode ?? 0, headers: res.headers, body: text }));
    });
    req.on("error", reject);
    req.end(body);
  });
}

/** A page's refusal: an HTML document (no script) with the status in its heading and the one sentence below it, escaped. */
function expectPage(r: Answer, label: string, status: number, sentence: string | RegExp) {
  expect([label, r.status, /^text\/html(; charset=utf-8)?$/.test(String(r.headers["content-type"]))]).toEqual([label, status, true]);
  expect(r.body.startsWith("<!DOCTYPE html>"), label).toBe(true);
  const m = /<h1[^>]*>(\d{3}) ([^<]+)<\/h1><p[^>]*>([^<]+)<\/p>/.exec(r.body);
  expect([label, m?.[1]], r.body.slice(0, 600)).toEqual([label, String(status)]);
  const text = m![3].replace(/&lt;/g, "<").replace(/&gt;/g, ">").replace(/&quot;/g, '"').replace(/&#(39|x27);/g, "'").replace(/&amp;/g, "&");
  if (typeof sentence === "string") expect(text, label).toBe(sentence);
  else expect(text, label).toMatch(sentence);
}

/** An API refusal: RFC 9457 problem+json with type, title, status (the answer's) and detail, nothing else. */
function expectProblem(r: Answer, label: string, status: number) {
  expect([label, r.status, r.headers["content-type"]]).toEqual([label, status, "application/problem+json"]);
  const body = JSON.parse(r.body) as Record<string, unknown>;
  expect([label, Object.keys(body).sort(), typeof body.type, typeof body.title, body.status, typeof body.detail]).toEqual([label, ["detail", "status", "title", "type"], "string", "string", status, "string"]);
}

/** Lets the app's log reach us: one more round trip, then a moment for the pipe. */
async function quietSince(from: number) {
  await fetch(`${base}/livez`);
  await new Promise((r) => setTimeout(r, 200));
  return app!.stderr().slice(from);
}

describe.skipIf(!built)("methods React Router does not take, answered before it", () => {
  // path, the route's pattern in app/routes.ts, a method the route itself refuses (its own 405 says what it takes)
  const API: [string, string][] = [
    ["/api/v1/me", "POST"],
    ["/api/v1/libraries/1/curves", "POST"],
    ["/api/v1/systems/1/search", "POST"],
    ["/api/v1/libraries/1/upload", "GET"],
    ["/api/v1/systems/1/preview", "GET"],
    ["/api/v1/calc/pipe-loss", "GET"],
    ["/api/stripe/webhook", "GET"],
  ];
  const PAGES: [string, string][] = [
    ["/signout", "signout"],
    ["/livez", "livez"],
    ["/libraries/1/export.csv", "libraries/:id/export.csv"],
    ["/selections/1/export.json", "selections/:id/export.json"],
    ["/field/selections/1/checks", "field/selections/:id/checks"],
    ["/projects/%FF", "projects/:id"], // no UTF-8 once decoded: matched without a warning in the log
    ["/signin.data", "signin"],
  ];

  test("on API routes: 405 problem+json with the Allow the route gives for a method it refuses itself; an /api/ path no route serves: 404", async () => {
    const from = app!.stderr().length;
    for (const [p, wrong] of API) {
      const own = await send(wrong, p, { authorization: `Bearer ${token}`, origin: base, "content-type": "application/json" }, wrong === "GET" ? undefined : "{}");
      expect([p, own.status], "the route's own refusal").toEqual([p, 405]);
      for (const method of ["PROPFIND", "MKCOL", "TRACE", "LOCK"]) {
        const r = await send(method, p, { authorization: `Bearer ${token}` });
        expect([method, p, r.status, r.headers.allow, r.headers["content-type"]]).toEqual([method, p, 405, own.headers.allow, "application/problem+json"]);
        expect(JSON.parse(r.body)).toMatchObject({ title: "Method Not Allowed", status: 405 });
        expect(r.body).not.toContain("Unexpected Server Error");
      }
    }
    const none = await send("PROPFIND", "/api/no/such/route");
    expect([none.status, none.headers["content-type"], JSON.parse(none.body).detail]).toEqual([404, "application/problem+json", "No API route at this path."]);
    expect(await quietSince(from)).toBe("");
  });

  test("OPTIONS on an API route: 204 with the route's Allow and OPTIONS, no body, the loader not run (it had answered as a GET: 200 with the caller's data)", async () => {
    for (const [p, wrong] of API) {
      const own = await send(wrong, p, { authorization: `Bearer ${token}`, origin: base, "content-type": "application/json" }, wrong === "GET" ? undefined : "{}");
      const r = await send("OPTIONS", p, { authorization: `Bearer ${token}` });
      expect([p, r.status, r.headers.allow, r.body]).toEqual([p, 204, own.headers.allow, ""]); // the 405's Allow names OPTIONS too
    }
    expect((await send("OPTIONS", "/api/no/such/route")).status).toBe(404);
  });

  test("outside /api/: 405 as an HTML page with Allow from the method table (lib/shared/methods.ts)", async () => {
    const from = app!.stderr().length;
    for (const [p, pattern] of PAGES) {
      for (const method of ["PROPFIND", "MKCOL", "TRACE", "UNLOCK"]) {
        const r = await send(method, p);
        expect([method, p, r.status, r.headers.allow]).toEqual([method, p, 405, allowHeader(allowedMethods(pattern))]);
        expectPage(r, `${method} ${p}`, 405, `${method} is not taken here: use ${allowedMethods(pattern).join(" or ")}.`);
      }
    }
    expect(await quietSince(from)).toBe("");
  });

  test("TRACE echoes nothing of the request (no header, cookie, token, path or body), nor does any other refusal", async () => {
    for (const p of ["/api/v1/me", "/signout", "/"]) {
      const r = await send("TRACE", `${p}?q=path-canary`, { authorization: `Bearer ${token}`, "content-type": "text/plain" }, "body-canary");
      expect(r.status, p).toBe(405);
      const all = JSON.stringify(r.headers) + r.body;
      for (const secret of ["canary-4711", "path-canary", "body-canary", token, cookie.split("=")[1].split(";")[0]]) expect(all, `${p}: ${secret.slice(0, 12)}`).not.toContain(secret);
    }
  });

  test("a method Node's HTTP parser does not know (BREW) is refused by Node itself: 400, the connection closed, nothing echoed or logged", async () => {
    const from = app!.stderr().length;
    const reply = await new Promise<string>((resolve, reject) => {
      const s = net.connect(port, "127.0.0.1", () => s.write(`BREW /api/v1/me HTTP/1.1\r\nHost: 127.0.0.1\r\nX-Canary: canary-4711\r\n\r\n`));
      let text = "";
      s.on("data", (b) => (text += b));
      s.on("end", () => resolve(text));
      s.on("error", reject);
    });
    expect(reply).toMatch(/^HTTP\/1\.1 400 Bad Request\r\n/);
    expect(reply).not.toContain("canary-4711");
    expect(await quietSince(from)).toBe("");
  });
});

describe.skipIf(!built)("cross-site writes refused by our own check before React Router's", () => {
  test("a POST with a foreign Origin to a page or its .data: 403 from our CSRF check, and nothing in the server's log", async () => {
    const from = app!.stderr().length;
    const form = { "content-type": "application/x-www-form-urlencoded" };
    for (const p of ["/signin", "/signin.data", "/projects", "/projects.data", "/workspace", "/workspace.data", "/libraries/1", "/_root.data"]) {
      for (const origin of ["http://evil.example", "null", "not a url", `${base}.evil.example`]) {
        const r = await send("POST", p, { ...form, origin }, "intent=delete&name=x");
        expect([p, origin, r.status]).toEqual([p, origin, 403]);
        expectPage(r, `POST ${p} from ${origin}`, 403, /^Cross-site request refused \(origin .+\)\.$/);
      }
    }
    expect(await quietSince(from)).toBe("");
  });

  test("the same check on resource and API routes (problem+json under /api/); our own origin and APP_URL still pass; no Origin with a session cookie is still refused", async () => {
    const form = { "content-type": "application/x-www-form-urlencoded" };
    const api = await send("POST", "/api/v1/systems/1/preview", { "content-type": "application/json", origin: "http://evil.example" }, "{}");
    expect([api.status, api.headers["content-type"], JSON.parse(api.body).title]).toEqual([403, "application/problem+json", "Forbidden"]);
    expect((await send("POST", "/signout", { ...form, origin: "http://evil.example" }, "")).status).toBe(403);
    // Past the check: a wrong password is the sign-in form's own 400 (same origin, and the origin APP_URL names).
    for (const origin of [base, "https://dutymark.example"]) expect((await send("POST", "/signin", { ...form, origin, cookie: "" }, "email=nobody%40example.test&password=wrong")).status, origin).toBe(400);
    expect((await send("POST", "/workspace", form, "intent=rename&name=x")).status).toBe(403); // no Origin, no Sec-Fetch-Site, a cookie
  });
});

type Entry = { path?: string; file: string; index?: boolean; children?: Entry[] };
const flatten = (entries: Entry[], parent = ""): string[] =>
  entries.flatMap((e) => {
    const p = e.index ? parent : [parent, e.path ?? ""].filter(Boolean).join("/");
    return [p, ...flatten(e.children ?? [], p)];
  });
/** Every route pattern of app/routes.ts once, with a path that matches it (ids 1: a refusal comes before any lookup). */
const EVERY_ROUTE = [...new Set(flatten(routeConfig as Entry[]))].map((pattern) => ({ pattern, path: `/${pattern.replace(/:\w+/g, "1").replace(/\*$/, "no/such/thing")}` }));
/** Paths the CSRF check does not cover (lib/auth/csrf.server.ts EXEMPT_PATHS / EXEMPT_PATTERNS): signed webhooks, cookie-less calculators. */
const CSRF_EXEMPT = (p: string) => p === "/api/stripe/webhook" || p.startsWith("/api/v1/calc/");

describe.skipIf(!built)("every route of app/routes.ts: its refusals are problem+json under /api/ and an HTML page elsewhere", () => {
  test("a method React Router does not take (PROPFIND), PUT, and a cross-site POST: content type and body shape", async () => {
    expect(EVERY_ROUTE.length).toBeGreaterThan(40);
    const from = app!.stderr().length;
    const form = { "content-type": "application/x-www-form-urlencoded" };
    for (const { pattern, path: p } of EVERY_ROUTE) {
      const api = p.startsWith("/api/");
      const none = pattern === "api/*"; // no API route here: 404 for any method
      const dav = await send("PROPFIND", p);
      const put = await send("PUT", p, { ...form, origin: base }, "intent=delete");
      const foreign = await send("POST", p, { ...form, origin: "http://evil.example" }, "intent=delete");
      if (none) {
        for (const [m, r] of [["PROPFIND", dav], ["PUT", put], ["POST", foreign]] as const) expectProblem(r, `${m} ${p}`, m === "POST" ? 403 : 404);
        continue;
      }
      // RFC 9110 §15.5.6: the 405 names what the resource takes; PUT is taken by no route of ours.
      expect([p, dav.headers.allow], "Allow on PROPFIND").toEqual([p, put.headers.allow]);
      if (api) {
        expectProblem(dav, `PROPFIND ${p}`, 405);
        expectProblem(put, `PUT ${p}`, 405);
        if (!CSRF_EXEMPT(p)) expectProblem(foreign, `POST ${p} from evil.example`, 403);
      } else {
        expect([p, put.headers.allow]).toEqual([p, allowHeader(allowedMethods(pattern))]);
        const use = `use ${allowedMethods(pattern).join(" or ")}.`;
        expectPage(dav, `PROPFIND ${p}`, 405, `PROPFIND is not taken here: ${use}`);
        expectPage(put, `PUT ${p}`, 405, `PUT is not taken here: ${use}`);
        expectPage(foreign, `POST ${p} from evil.example`, 403, "Cross-site request refused (origin http://evil.example).");
      }
    }
    expect(await quietSince(from)).toBe("");
  }, 60_000);

  test("every 405's Allow is the OPTIONS answer's Allow, on every route: the methods the route takes and OPTIONS (RFC 9110 §10.2.1)", async () => {
    // source: RFC 9110 §10.2.1 (Allow lists the methods the target resource supports), §9.3.7 (OPTIONS); every route
    // answers OPTIONS with 204 (unknownMethodAnswer), so OPTIONS is one of them. The 405s left it out until helper "formedges".
    const form = { "content-type": "application/x-www-form-urlencoded" };
    const fails: string[] = [];
    let refusals = 0;
    for (const { pattern, path: p } of EVERY_ROUTE) {
      if (pattern === "api/*") continue; // no API route here: 404 for any method
      const options = await send("OPTIONS", p, { authorization: `Bearer ${token}` });
      if (options.status !== 204 || !String(options.headers.allow ?? "").split(", ").includes("OPTIONS")) fails.push(`OPTIONS ${p} → ${options.status}, Allow ${options.headers.allow}`);
      const asks: [string, Record<string, string>, string | undefined][] = [
        ["PROPFIND", {}, undefined],
        ["PUT", { ...form, origin: base }, "intent=delete"],
        ["DELETE", { ...form, origin: base }, "intent=delete"],
        ["POST", { ...form, origin: base }, "intent=x"], // 405 where the route takes no POST (a page without an action, an export)
        ["GET", {}, undefined], // 405 where the route takes only POST (its loader refuses)
      ];
      for (const [method, headers, body] of asks) {
        const r = await send(method, p, { authorization: `Bearer ${token}`, ...headers }, body);
        if (r.status !== 405) continue;
        refusals++;
        if (r.headers.allow !== options.headers.allow) fails.push(`${method} ${p} → 405 Allow ${r.headers.allow}; OPTIONS → Allow ${options.headers.allow}`);
      }
    }
    if (fails.length) console.error(fails.join("\n"));
    expect(refusals).toBeGreaterThan(EVERY_ROUTE.length * 2); // PROPFIND and PUT at least on every route but api/*
    expect(fails).toEqual([]);
  }, 120_000);

  test("what a refusal says of the request is escaped on the page (the Origin it names)", async () => {
    const r = await send("POST", "/signin", { "content-type": "application/x-www-form-urlencoded", origin: "http://<b>evil</b>.example" }, "a=1");
    expect(r.body).not.toContain("<b>evil</b>");
    expectPage(r, "an Origin with markup", 403, "Cross-site request refused (origin http://<b>evil</b>.example).");
  });
});
