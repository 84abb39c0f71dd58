// The operator command (app/cli/admin.ts, run by `npm run admin -- …`) against the test database.
import { spawnSync } from "node:child_process";
import { afterAll, expect, test } from "vitest";
import { and, eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { memberships, users, workspaces } from "@db/schema";
import { checkCredentials } from "~/lib/auth/session.server";
import { requireApi } from "~/lib/auth/guards.server";

afterAll(() => closeDb());
const admin = (...args: string[]) => spawnSync(process.execPath, ["--import", "tsx", "app/cli/admin.ts", ...args], { encoding: "utf8", env: process.env });

test("create-user makes the workspace when missing, marks the address verified; create-token prints the token alone on its last line", async () => {
  const email = `ops-${Date.now().toString(36)}@example.test`;
  const ws = `Ops Works ${Date.now().toString(36)}`;
  const r = admin("create-user", "--email", email, "--password", "a long operator pw", "--workspace", ws, "--role", "engineer");
  expect(r.status, r.stderr).toBe(0);
  const [u] = await db().select().from(users).where(eq(users.email, email));
  const [w] = await db().select().from(workspaces).where(eq(workspaces.name, ws));
  expect(u.emailVerified).toBe(true);
  const [m] = await db().select().from(memberships).where(and(eq(memberships.userId, u.id), eq(memberships.workspaceId, w.id)));
  expect(m.role).toBe("engineer");
  expect((await checkCredentials(email, "a long operator pw", "10.77.0.1")).ok).toBe(true);

  const t = admin("create-token", "--email", email, "--workspace", ws, "--scope", "write");
  expect(t.status, t.stderr).toBe(0);
  const last = t.stdout.trim().split("\n").at(-1)!;
  expect(last).toMatch(/^dmk_[A-Za-z0-9_-]{30,}$/);
  const caller = await requireApi(new Request("http://x/api", { headers: { authorization: `Bearer ${last}` } }), "project.write");
  expect(caller.workspace.id).toBe(w.id);
});

test("bad arguments: a clear message and a non-zero exit, nothing written", async () => {
  const email = `bad-${Date.now().toString(36)}@example.test`;
  const r = admin("create-user", "--email", email, "--password", "short", "--workspace", "X", "--role", "engineer");
  expect(r.status).not.toBe(0);
  expect(r.stderr).toContain("at least 10 characters");
  const r2 = admin("create-user", "--email", email, "--password", "long enough pw!", "--workspace", "X", "--role", "overlord");
  expect(r2.status).not.toBe(0);
  expect(r2.stderr).toContain("--role must be one of");
  expect(await db().select().from(users).where(eq(users.email, email))).toHaveLength(0);
  expect(admin("frobnicate").status).toBe(2);
});
