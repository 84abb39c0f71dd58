// Access sweep: every route and API path that takes an id. A member of workspace A (as admin, the
// widest role) reads or changes nothing of workspace B through any of them: 403 or 404, never data.
// New routes that take an id must join SWEEP below (DEVELOPERS.md, "Adding a route").
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { and, eq, isNull } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { apiTokens, invitations, memberships, sessions, workspaces } from "@db/schema";
import { createApiToken, invite } from "~/lib/accounts.server";
import { call, makeMember, type TestMember } from "./harness";
import * as accountRoute from "~/routes/account";
import * as workspaceRoute from "~/routes/workspace";

type Ctx = { a: TestMember; b: TestMember; bMembershipId: number; bInvitationId: number; bTokenId: number; bSessionId: string };
type Probe = {
  name: string;
  fn: (ctx: Ctx) => Parameters<typeof call>[0];
  opts: (ctx: Ctx) => Parameters<typeof call>[1];
  /** Reads B's state after the probe; must be unchanged. */
  unchanged: (ctx: Ctx) => Promise<boolean>;
};

export const SWEEP: Probe[] = [
  {
    name: "POST /workspace intent=role (B's membership id)",
    fn: () => workspaceRoute.action as never,
    opts: (c) => ({ path: "/workspace", cookie: c.a.cookie, form: { intent: "role", membershipId: String(c.bMembershipId), role: "viewer" } }),
    unchanged: async (c) => (await db().select().from(memberships).where(eq(memberships.id, c.bMembershipId)))[0]?.role === "admin",
  },
  {
    name: "POST /workspace intent=remove (B's membership id)",
    fn: () => workspaceRoute.action as never,
    opts: (c) => ({ path: "/workspace", cookie: c.a.cookie, form: { intent: "remove", membershipId: String(c.bMembershipId) } }),
    unchanged: async (c) => (await db().select().from(memberships).where(eq(memberships.id, c.bMembershipId))).length === 1,
  },
  {
    name: "POST /workspace intent=revoke-invite (B's invitation id)",
    fn: () => workspaceRoute.action as never,
    opts: (c) => ({ path: "/workspace", cookie: c.a.cookie, form: { intent: "revoke-invite", invitationId: String(c.bInvitationId) } }),
    unchanged: async (c) =>
      (await db().select().from(invitations).where(and(eq(invitations.id, c.bInvitationId), isNull(invitations.revokedAt)))).length === 1,
  },
  {
    name: "POST /workspace intent=switch (B's workspace id)",
    fn: () => workspaceRoute.action as never,
    opts: (c) => ({ path: "/workspace", cookie: c.a.cookie, form: { intent: "switch", workspaceId: String(c.b.workspaceId) } }),
    unchanged: async (c) => {
      const r = await call(workspaceRoute.loader as never, { path: "/workspace", cookie: c.a.cookie });
      return (r.body as { workspace: { id: number } }).workspace.id === c.a.workspaceId;
    },
  },
  {
    name: "POST /account intent=revoke-token (B's API token id)",
    fn: () => accountRoute.action as never,
    opts: (c) => ({ path: "/account", cookie: c.a.cookie, form: { intent: "revoke-token", tokenId: String(c.bTokenId) } }),
    unchanged: async (c) => (await db().select().from(apiTokens).where(and(eq(apiTokens.id, c.bTokenId), isNull(apiTokens.revokedAt)))).length === 1,
  },
  {
    name: "POST /account intent=revoke-device (B's session id)",
    fn: () => accountRoute.action as never,
    opts: (c) => ({ path: "/account", cookie: c.a.cookie, form: { intent: "revoke-device", sessionId: c.bSessionId } }),
    unchanged: async (c) => (await db().select().from(sessions).where(eq(sessions.id, c.bSessionId))).length === 1,
  },
];

let ctx: Ctx;
beforeAll(async () => {
  const a = await makeMember("admin");
  const b = await makeMember("admin");
  const [bm] = await db().select().from(memberships).where(eq(memberships.userId, b.userId));
  await invite({ workspaceId: b.workspaceId, workspaceName: "B", inviterId: b.userId, inviterName: "B", email: "someone@example.test", role: "viewer" });
  const [bi] = await db().select().from(invitations).where(eq(invitations.workspaceId, b.workspaceId));
  const { id: bTokenId } = await createApiToken({ userId: b.userId, workspaceId: b.workspaceId, name: "b", scope: "write" });
  const [bs] = await db().select().from(sessions).where(eq(sessions.userId, b.userId));
  ctx = { a, b, bMembershipId: bm.id, bInvitationId: bi.id, bTokenId, bSessionId: bs.id };
});
afterAll(() => closeDb());

describe("access sweep: workspace A cannot reach workspace B", () => {
  for (const p of SWEEP) {
    test(p.name, async () => {
      const r = await call(p.fn(ctx), p.opts(ctx));
      expect([403, 404]).toContain(r.status);
      expect(JSON.stringify(r.body ?? "")).not.toContain(ctx.b.email);
      expect(await p.unchanged(ctx)).toBe(true);
    });
  }

  test("B's data never appears in A's pages", async () => {
    const ws = await call(workspaceRoute.loader as never, { path: "/workspace", cookie: ctx.a.cookie });
    const acct = await call(accountRoute.loader as never, { path: "/account", cookie: ctx.a.cookie });
    const [bws] = await db().select().from(workspaces).where(eq(workspaces.id, ctx.b.workspaceId));
    for (const r of [ws, acct]) {
      expect(r.status).toBe(200);
      const text = JSON.stringify(r.body);
      expect(text).not.toContain(ctx.b.email);
      expect(text).not.toContain(bws.name);
    }
  });
});
