// Bad input that used to answer 500 (issue 14, "Bad input that crashes or is read whole"): each case
// now gets a clean 4xx (or a page that says why) and leaves nothing behind.
import { readFileSync } from "node:fs";
import Stripe from "stripe";
import { afterAll, expect, test } from "vitest";
import { eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { stripeEvents, systems, uploads } from "@db/schema";
import { createApiToken } from "~/lib/auth/api-tokens.server";
import { createLibrary, storeUpload } from "~/lib/libraries";
import { importCsvText } from "~/lib/projects/test-kit";
import { PENDING_UPLOAD_TTL_HOURS } from "~/lib/libraries/uploads.server";
import { createProject, createSystem } from "~/lib/projects";
import { defaultSystemInput } from "~/lib/projects/hydraulics";
import { safeNext } from "~/lib/shared/forms.server";
import * as apiUpload from "~/routes/api.v1.libraries.$id.upload";
import * as searchPage from "~/routes/systems.$id.search";
import * as signin from "~/routes/signin";
import * as webhook from "~/routes/api.stripe.webhook";
import { call, makeMember } from "./harness";

afterAll(() => closeDb());

test("safeNext keeps local paths and refuses every off-site or header-breaking form", () => {
  expect(safeNext("/projects/3?tab=a#x")).toBe("/projects/3?tab=a#x");
  // Browsers drop tabs and newlines inside URLs and read "\" as "/": each of these would leave the site.
  for (const bad of ["/\t/evil.example", "/\n/evil.example", "/\r\n/evil.example", "//evil.example", "/\\evil.example", "/\\/evil.example", "https://evil.example", " /x", "/%0a"].map(decodeURIComponent)) {
    expect(safeNext(bad), JSON.stringify(bad)).toBe("/");
  }
});

test("sign-in with ?next=%0a or next=/\\n…: a redirect to a local path, never a 500", async () => {
  const u = await makeMember("engineer");
  for (const next of ["\n", "/\n/evil.example", "/a\r\nSet-Cookie: x=1"]) {
    const r = await call(signin.action as never, { path: `/signin?next=${encodeURIComponent(next)}`, form: { email: u.email, password: "correct horse battery", next } });
    expect(r.status, JSON.stringify(next)).toBe(302);
    expect(r.location).toBe("/");
  }
  const l = await call(signin.loader as never, { path: "/signin?next=/%0a/evil.example", cookie: u.cookie });
  expect(l.status).toBe(302);
  expect(l.location).toBe("/");
});

test("water at 299 °C on the search page: the page says why it cannot search (no 500)", async () => {
  const m = await makeMember("admin");
  const viewer = { userId: m.userId, workspace: { id: m.workspaceId, name: "W", slug: "w", plan: "free" as const }, role: "admin" as const };
  const project = await createProject(viewer, { name: "Hot", site: "", description: "" });
  const system = await createSystem(viewer, project, "Hot water", { ...defaultSystemInput(), temperatureC: 299, duty: { flow: 0.01, head: 20 } });
  expect((await db().select().from(systems).where(eq(systems.id, system))).length).toBe(1);
  const r = await call(searchPage.loader as never, { path: `/systems/${system}/search`, cookie: m.cookie, params: { id: String(system) } });
  expect(r.status).toBe(200);
  expect((r.body as { message: string }).message).toMatch(/cannot be evaluated/);
});

test("API upload of a,b\\n1,2 with import=1 → 422 problem+json, and no upload row is kept", async () => {
  const m = await makeMember("admin");
  const viewer = { userId: m.userId, workspace: { id: m.workspaceId, name: "W", slug: "w", plan: "free" as const }, role: "admin" as const };
  const lib = await createLibrary(viewer, { name: "Bad import", description: "" });
  const { token } = await createApiToken({ userId: m.userId, workspaceId: m.workspaceId, name: "t", scope: "write" });
  const form = new FormData();
  form.set("file", new File(["a,b\n1,2\n"], "x.csv", { type: "text/csv" }));
  form.set("import", "1");
  const r = await call(apiUpload.action as never, { path: `/api/v1/libraries/${lib}/upload`, method: "POST", params: { id: String(lib) }, headers: { authorization: `Bearer ${token}` }, body: form });
  expect(r.status).toBe(422);
  expect(r.headers.get("content-type")).toBe("application/problem+json");
  // The refusal carries the report (why nothing passed) and the saved-mapping notice (none saved here), as the /api page says.
  expect(r.body).toMatchObject({ status: 422, detail: expect.stringMatching(/^(Nothing imported|No curve in this file passed)/), report: { stats: expect.any(Object) }, savedMappingUnreadable: null });
  expect(await db().select({ id: uploads.id }).from(uploads).where(eq(uploads.libraryId, lib))).toEqual([]);
});

test("a signed webhook whose event id is longer than 80 characters → 400, nothing stored", async () => {
  const prev = process.env.STRIPE_WEBHOOK_SECRET;
  process.env.STRIPE_WEBHOOK_SECRET = "whsec_hardening_test";
  try {
    const id = `evt_${"x".repeat(90)}`;
    const raw = JSON.stringify({ id, object: "event", created: Math.floor(Date.now() / 1000), type: "invoice.paid", data: { object: {} } });
    const signature = Stripe.webhooks.generateTestHeaderString({ payload: raw, secret: "whsec_hardening_test" });
    const r = await call(webhook.action as never, { path: "/api/stripe/webhook", method: "POST", headers: { "stripe-signature": signature, "content-type": "application/json" }, body: raw });
    expect(r.status).toBe(400);
    expect(await db().select().from(stripeEvents).where(eq(stripeEvents.id, id.slice(0, 80)))).toEqual([]);
  } finally {
    if (prev === undefined) delete process.env.STRIPE_WEBHOOK_SECRET;
    else process.env.STRIPE_WEBHOOK_SECRET = prev;
  }
});

test("uploads never imported are swept after a day; imported ones and fresh ones stay", async () => {
  const m = await makeMember("admin");
  const viewer = { userId: m.userId, workspace: { id: m.workspaceId, name: "W", slug: "w", plan: "free" as const }, role: "admin" as const };
  const lib = await createLibrary(viewer, { name: "Sweep", description: "" });
  const csv = readFileSync("fixtures/csv/long-si.csv", "utf8");
  const imported = await importCsvText(viewer, lib, csv, "a.csv");
  const stale = await storeUpload(viewer, lib, new File([csv], "b.csv", { type: "text/csv" }));
  const old = new Date(Date.now() - (PENDING_UPLOAD_TTL_HOURS + 1) * 3_600_000);
  await db().update(uploads).set({ createdAt: old }).where(eq(uploads.libraryId, lib)); // both look old
  const fresh = await storeUpload(viewer, lib, new File([csv], "c.csv", { type: "text/csv" })); // the sweep runs here
  const left = (await db().select({ id: uploads.id }).from(uploads).where(eq(uploads.libraryId, lib))).map((r) => r.id).sort();
  expect(left).toEqual([imported, fresh].sort());
  expect(left).not.toContain(stale);
});
