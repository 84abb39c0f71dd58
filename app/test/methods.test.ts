// Wrong methods on resource routes (found by sending them to the running app, helper "attack", 2026-12-02).
// A resource route without an action (or loader) is answered by React Router itself: POST /api/v1/me,
// PUT /api/v1/models/1, POST /selections/1/export.csv … came back 405 with {"message":"Unexpected Server
// Error"} (not problem+json, no Allow, a stack trace in the server log), and GET /field/selections/1/checks
// a 400 with the same text. Every resource route now answers both itself: 405 problem+json with Allow.
import { afterAll, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import { call, makeMember } from "./harness";

type Mod = { default?: unknown; loader?: unknown; action?: unknown };
const modules = import.meta.glob<Mod>("../routes/*.{ts,tsx}", { eager: true });
const resourceRoutes = Object.entries(modules).filter(([, m]) => !m.default);

afterAll(() => closeDb());

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
      expect(r.headers.get("allow"), file).toBe(allow);
    }
  }
});

test("PUT, PATCH and DELETE on the API's POST actions: 405 problem+json with Allow: POST, nothing run (DELETE /api/v1/libraries/:id/upload used to store an upload)", async () => {
  for (const file of ["api.v1.libraries.$id.upload.ts", "api.v1.systems.$id.preview.ts"]) {
    const mod = modules[`../routes/${file}`];
    for (const method of ["PUT", "PATCH", "DELETE"]) {
      const r = await call(mod.action as never, { path: "/x", method, params: { id: "1" }, headers: { origin: "http://127.0.0.1:3999", authorization: "Bearer nobody" } });
      expect(r.status, `${method} ${file}`).toBe(405);
      expect(r.headers.get("allow"), `${method} ${file}`).toBe("POST");
    }
  }
});
