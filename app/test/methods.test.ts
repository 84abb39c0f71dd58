// Wrong methods on resource routes (found by sending them to the running app, helper "attack", 2026-12-02).
// A resource route without an action (or loader) is answered by React Router itself: POST /api/v1/me,
// PUT /api/v1/models/1, POST /selections/1/export.csv … came back 405 with {"message":"Unexpected Server
// Error"} (not problem+json, no Allow, a stack trace in the server log), and GET /field/selections/1/checks
// a 400 with the same text. Every resource route now answers both itself: 405 problem+json with Allow.
// Pages (helper "methods", 2026-12-02): a POST to a page without an action came back 405 with a stack
// in the server log each time; the root middleware now answers it from lib/shared/methods.ts first,
// and React Router's own 405s (OPTIONS on a page, PROPFIND…) are no longer logged (entry.server.tsx).
import { afterAll, afterEach, expect, test, vi } from "vitest";
import { UNSAFE_ErrorResponseImpl as ErrorResponseImpl } from "react-router";
import { closeDb } from "@db/client.server";
import routeConfig from "~/routes";
import { middleware } from "~/root";
import { handleError } from "~/entry.server";
import { call, makeMember } from "./harness";

type Mod = { default?: unknown; loader?: unknown; action?: unknown };
const modules = import.meta.glob<Mod>("../routes/*.{ts,tsx}", { eager: true });
const resourceRoutes = Object.entries(modules).filter(([, m]) => !m.default);

afterAll(() => closeDb());
afterEach(() => vi.restoreAllMocks());

test("every resource route exports both a loader and an action (else React Router answers a wrong method with 'Unexpected Server Error')", () => {
  expect(resourceRoutes.length).toBeGreaterThan(20);
  const missing = resourceRoutes.filter(([, m]) => !m.loader || !m.action).map(([file, m]) => `${file} (${m.loader ? "" : "no loader"}${m.action ? "" : "no action"})`);
  expect(missing).toEqual([]);
});

test("the method a resource route does not take: 405 problem+json naming the one it does (Allow), signed in or not", async () => {
  const m = await makeMember("admin");
  const cases: [file: string, method: "GET" | "POST", allow: string][] = [
    ["api.v1.me.ts", "POST", "GET"],
    ["api.v1.libraries.ts", "POST", "GET"],
    ["api.v1.libraries.$id.curves.ts", "POST", "GET"],
    ["api.v1.libraries.$id.models.ts", "POST", "GET"],
    ["api.v1.models.$id.ts", "POST", "GET"],
    ["field.selections.$id.checks.ts", "GET", "POST"],
    ["selections.$id.export-csv.ts", "POST", "GET"],
    ["selections.$id.export-json.ts", "POST", "GET"],
    ["libraries.$id.export-csv.ts", "POST", "GET"],
    ["libraries.$id.export-json.ts", "POST", "GET"],
    ["field.selections.$id.export-csv.ts", "POST", "GET"],
    ["field.checks.$id.photos.$photoId.ts", "POST", "GET"],
    ["libraries.$id.trace.$pictureId.file.ts", "POST", "GET"],
    ["healthz.ts", "POST", "GET"],
    ["livez.ts", "POST", "GET"],
  ];
  for (const [file, method, allow] of cases) {
    const mod = modules[`../routes/${file}`];
    expect(mod, file).toBeDefined();
    for (const cookie of [undefined, m.cookie]) {
      const fn = method === "GET" ? mod.loader : mod.action;
      const r = await call(fn as never, { path: "/x", method, cookie, params: { id: "1", photoId: "1", pictureId: "1" }, headers: { origin: "http://127.0.0.1:3999" } });
      expect(r.status, file).toBe(405);
      expect(r.headers.get("content-type"), file).toBe("application/problem+json");
      expect(r.headers.get("allow"), file).toBe(allow === "GET" ? "GET, HEAD, OPTIONS" : `${allow}, OPTIONS`); // RFC 9110 §10.2.1: and OPTIONS, answered on every route; §9.3.2: HEAD with GET
    }
  }
});

test("PUT, PATCH and DELETE on the API's POST actions: 405 problem+json with Allow: POST, OPTIONS, nothing run (DELETE /api/v1/libraries/:id/upload used to store an upload)", async () => {
  for (const file of ["api.v1.libraries.$id.upload.ts", "api.v1.systems.$id.preview.ts"]) {
    const mod = modules[`../routes/${file}`];
    for (const method of ["PUT", "PATCH", "DELETE"]) {
      const r = await call(mod.action as never, { path: "/x", method, params: { id: "1" }, headers: { origin: "http://127.0.0.1:3999", authorization: "Bearer nobody" } });
      expect(r.status, `${method} ${file}`).toBe(405);
      expect(r.headers.get("allow"), `${method} ${file}`).toBe("POST, OPTIONS"); // RFC 9110 §10.2.1: OPTIONS is answered too
    }
  }
});

type Entry = { path?: string; file: string; index?: boolean; children?: Entry[] };
const flatten = (entries: Entry[], parent = ""): { path: string; file: string }[] =>
  entries.flatMap((e) => {
    const path = e.index ? parent : [parent, e.path ?? ""].filter(Boolean).join("/");
    return [{ path, file: e.file }, ...flatten(e.children ?? [], path)];
  });

test("a POST to a page without an action: 405 with Allow: GET, HEAD from the root middleware, the route never reached, nothing logged", async () => {
  const pages = flatten(routeConfig as Entry[]).filter((r) => {
    const mod = modules[`../${r.file}`];
    return mod?.default && !mod.action;
  });
  // Pages of app/routes.ts with no action (home, the API reference, field, a check, a selection, not found).
  expect(pages.length).toBeGreaterThanOrEqual(6);
  const logged = vi.spyOn(console, "error");
  type Mw = (args: unknown, next: () => Promise<Response>) => Promise<Response | void>;
  for (const page of pages) {
    const request = new Request(`http://127.0.0.1:3999/${page.path.replace(/:\w+/g, "1").replace(/\*$/, "x")}`, {
      method: "POST",
      headers: { origin: "http://127.0.0.1:3999", "content-type": "application/x-www-form-urlencoded" },
      body: "intent=x",
    });
    let reached = false;
    const next = async () => ((reached = true), new Response("the route's answer"));
    const chain = (middleware as unknown as Mw[]).reduceRight<() => Promise<Response>>((n, mw) => async () => (await mw({ request, params: {}, pattern: page.path, context: {} }, n)) as Response, next);
    const res = await chain();
    // RFC 9110 §15.5.6: 405 with the methods the resource takes in Allow.
    expect([page.path, res.status, res.headers.get("allow"), reached]).toEqual([page.path, 405, "GET, HEAD, OPTIONS", false]); // §10.2.1: and OPTIONS
  }
  expect(logged).not.toHaveBeenCalled();
});

test("handleError (entry.server.tsx): React Router's own 405s are not logged; every other error is, as React Router logs it", () => {
  const logged = vi.spyOn(console, "error").mockImplementation(() => {});
  const args = { request: new Request("http://127.0.0.1:3999/"), params: {}, context: {} } as never;
  // What React Router throws for a POST to a page without an action, and for PROPFIND (its getInternalRouterError).
  handleError(new ErrorResponseImpl(405, "Method Not Allowed", new Error('You made a POST request to "/" but did not provide an `action`'), true), args);
  handleError(new ErrorResponseImpl(405, "Method Not Allowed", new Error('Invalid request method "PROPFIND"'), true), args);
  expect(logged).not.toHaveBeenCalled();
  const bug = new Error("a real fault");
  handleError(bug, args);
  const inner = new Error("a loader's fault behind a 500");
  handleError(new ErrorResponseImpl(500, "Internal Server Error", inner, true), args);
  expect(logged.mock.calls).toEqual([[bug], [inner]]);
  // A request the client gave up on is not logged (React Router's default does the same).
  const gone = new AbortController();
  gone.abort();
  handleError(new Error("late"), { request: new Request("http://127.0.0.1:3999/", { signal: gone.signal }), params: {}, context: {} } as never);
  expect(logged).toHaveBeenCalledTimes(2);
});

test("every API route says once what it takes: its refusing loader or action is a refuseMethod, whose `allow` app/serve.mjs answers unknown methods with (server-before-router.test.ts)", async () => {
  const api = flatten(routeConfig as Entry[]).filter((r) => r.path.startsWith("api/") && r.path !== "api/*");
  expect(api.length).toBeGreaterThanOrEqual(13);
  const found: string[] = [];
  for (const r of api) {
    const mod = modules[`../${r.file}`] as { loader?: { allow?: string }; action?: { allow?: string } };
    const refusing = [["GET", mod.loader], ["POST", mod.action]].filter(([, f]) => typeof (f as { allow?: unknown })?.allow === "string") as [string, { allow: string }][];
    // Exactly one of the two refuses, and it names the other's method.
    expect([r.path, refusing.length], r.path).toEqual([r.path, 1]);
    const [method, fn] = refusing[0];
    const answer = await call(fn as never, { path: `/${r.path}`, method, params: { id: "1" }, headers: { origin: "http://127.0.0.1:3999" } });
    expect([r.path, answer.status, answer.headers.get("allow")]).toEqual([r.path, 405, fn.allow === "GET" ? "GET, HEAD, OPTIONS" : `${fn.allow}, OPTIONS`]); // the OPTIONS answer's Allow (RFC 9110 §9.3.2: HEAD with GET)
    found.push(`${r.path}: ${fn.allow}`);
  }
  // The API's GET routes and POST routes (app/routes.ts; the /api page documents each).
  expect(found.filter((f) => f.endsWith(": GET")).length + found.filter((f) => f.endsWith(": POST")).length).toBe(api.length);
});
