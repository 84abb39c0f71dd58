// Bad input to the account forms: oversized and malformed fields get a 4xx with a message, never a 500,
// and change nothing (our product rules; valibot limits in app/lib/shared/forms.server.ts).
import { afterAll, expect, test } from "vitest";
import { eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { users, workspaces } from "@db/schema";
import { call, makeMember } from "./harness";
import * as signup from "~/routes/signup";
import * as signin from "~/routes/signin";
import * as workspaceRoute from "~/routes/workspace";
import * as reset from "~/routes/reset";

afterAll(() => closeDb());

test("sign-up with an oversized e-mail, a malformed e-mail, a 10 000-character name or a short password → 400 with field messages", async () => {
  const cases: Record<string, string>[] = [
    { email: `${"a".repeat(250)}@example.test`, name: "A", password: "long enough pw" },
    { email: "not-an-address", name: "A", password: "long enough pw" },
    { email: "ok@example.test", name: "n".repeat(10_000), password: "long enough pw" },
    { email: "ok2@example.test", name: "A", password: "short" },
    { email: "ok3@example.test", name: "A", password: "p".repeat(201) },
  ];
  for (const form of cases) {
    const r = await call(signup.action as never, { path: "/signup", form });
    expect(r.status, JSON.stringify(Object.keys(form))).toBe(400);
    expect(Object.keys((r.body as { errors: object }).errors).length).toBeGreaterThan(0);
  }
  expect(await db().select().from(users).where(eq(users.email, "ok@example.test"))).toHaveLength(0);
});

test("sign-in with missing fields → 400; a reused or forged reset token → 400 with a message", async () => {
  expect((await call(signin.action as never, { path: "/signin", form: { email: "" } })).status).toBe(400);
  const r = await call(reset.action as never, { path: "/reset", form: { token: "forged-token-value", password: "a long new password" } });
  expect(r.status).toBe(400);
  expect(JSON.stringify(r.body)).toContain("expired or was already used");
});

test("workspace actions with a malformed id or an unknown intent → 400, nothing changed", async () => {
  const a = await makeMember("admin");
  const before = (await db().select().from(workspaces).where(eq(workspaces.id, a.workspaceId)))[0].name;
  const page = { pageWorkspaceId: String(a.workspaceId) };
  const forms: Record<string, string>[] = [
    { intent: "role", membershipId: "1; DROP TABLE users", role: "viewer", ...page },
    { intent: "explode", ...page },
    { intent: "rename", name: "x".repeat(500), ...page },
    { intent: "rename", name: "fine", pageWorkspaceId: "1; DROP TABLE users" },
  ];
  for (const form of forms) {
    const r = await call(workspaceRoute.action as never, { path: "/workspace", cookie: a.cookie, form });
    expect(r.status).toBe(400);
  }
  expect((await db().select().from(workspaces).where(eq(workspaces.id, a.workspaceId)))[0].name).toBe(before);
});
