// Access sweep: every route and API path that takes an id. A member of workspace A (as admin, the
// widest role) reads or changes nothing of workspace B through any of them: 403 or 404, never data.
// New routes that take an id must join SWEEP below (DEVELOPERS.md, "Adding a route").
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { and, eq, isNull } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { apiTokens, fieldCheckPhotos, fieldChecks, invitations, memberships, projectShares, sessions, workspaces } from "@db/schema";
import { createApiToken } from "~/lib/auth/api-tokens.server";
import { invite } from "~/lib/workspaces";
import { call, makeMember, makeWorkspace, type TestMember } from "./harness";
import * as accountRoute from "~/routes/account";
import * as workspaceRoute from "~/routes/workspace";
import * as fieldFormRoute from "~/routes/field.selections.$id";
import * as fieldCheckRoute from "~/routes/field.checks.$id";
import * as fieldPhotoRoute from "~/routes/field.checks.$id.photos.$photoId";
import * as fieldCsvRoute from "~/routes/field.selections.$id.export-csv";
import * as fieldSyncRoute from "~/routes/field.selections.$id.checks";
import * as shareRoute from "~/routes/projects.$id.share";
import * as offersRoute from "~/routes/workspace.shares";
import * as fieldHomeRoute from "~/routes/field";
import { fieldsForHead, storeSelection } from "./fieldcheck-fixture";

type Ctx = {
  a: TestMember;
  b: TestMember;
  bMembershipId: number;
  bInvitationId: number;
  bTokenId: number;
  bSessionId: string;
  /** B's field-check objects: a project (shared with a third workspace), its selection, a check with a photo. */
  bField: { projectId: number; selectionId: number; checkId: number; photoId: number; shareId: number; aSlug: string };
  /** An offer to B (a third workspace's project, pending): only B's admins may answer it. */
  bOfferId: number;
};
const checksOf = async (selectionId: number) => (await db().select().from(fieldChecks).where(eq(fieldChecks.selectionId, selectionId))).length;
type Probe = {
  name: string;
  fn: (ctx: Ctx) => Parameters<typeof call>[0];
  opts: (ctx: Ctx) => Parameters<typeof call>[1];
  /** Reads B's state after the probe; must be unchanged. */
  unchanged: (ctx: Ctx) => Promise<boolean>;
};

/** A GET of one of B's pages by A (its `:id` B's record): it changes nothing, so nothing is read back after it. */
const read = (name: string, fn: Probe["fn"], path: (c: Ctx) => string, id: (c: Ctx) => number): Probe => ({
  name,
  fn,
  opts: (c) => ({ path: path(c), cookie: c.a.cookie, params: { id: String(id(c)) } }),
  unchanged: async () => true,
});

export const SWEEP: Probe[] = [
  {
    name: "POST /workspace intent=role (B's membership id)",
    fn: () => workspaceRoute.action as never,
    opts: (c) => ({ path: "/workspace", cookie: c.a.cookie, form: { intent: "role", membershipId: String(c.bMembershipId), role: "viewer", pageWorkspaceId: String(c.a.workspaceId) } }),
    unchanged: async (c) => (await db().select().from(memberships).where(eq(memberships.id, c.bMembershipId)))[0]?.role === "admin",
  },
  {
    name: "POST /workspace intent=remove (B's membership id)",
    fn: () => workspaceRoute.action as never,
    opts: (c) => ({ path: "/workspace", cookie: c.a.cookie, form: { intent: "remove", membershipId: String(c.bMembershipId), pageWorkspaceId: String(c.a.workspaceId) } }),
    unchanged: async (c) => (await db().select().from(memberships).where(eq(memberships.id, c.bMembershipId))).length === 1,
  },
  {
    name: "POST /workspace intent=revoke-invite (B's invitation id)",
    fn: () => workspaceRoute.action as never,
    opts: (c) => ({ path: "/workspace", cookie: c.a.cookie, form: { intent: "revoke-invite", invitationId: String(c.bInvitationId), pageWorkspaceId: String(c.a.workspaceId) } }),
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
  read("GET /field/selections/:id (B's selection)", () => fieldFormRoute.loader as never, (c) => `/field/selections/${c.bField.selectionId}`, (c) => c.bField.selectionId),
  read("GET /field/selections/:id?amend= (B's check, B's selection)", () => fieldFormRoute.loader as never,
    (c) => `/field/selections/${c.bField.selectionId}?amend=${c.bField.checkId}`, (c) => c.bField.selectionId),
  {
    name: "POST /field/selections/:id/photos (a check on B's selection)",
    fn: () => fieldFormRoute.action as never,
    opts: (c) => ({ path: `/field/selections/${c.bField.selectionId}/photos`, cookie: c.a.cookie, params: { id: String(c.bField.selectionId) }, form: fieldsForHead(20, 998.2, { flow: "0.01", pageWorkspaceId: String(c.a.workspaceId) }) }),
    unchanged: async (c) => (await checksOf(c.bField.selectionId)) === 1,
  },
  {
    name: "POST /field/selections/:id/photos amends= (B's check)",
    fn: () => fieldFormRoute.action as never,
    opts: (c) => ({ path: `/field/selections/${c.bField.selectionId}/photos`, cookie: c.a.cookie, params: { id: String(c.bField.selectionId) }, form: fieldsForHead(20, 998.2, { flow: "0.01", amends: String(c.bField.checkId), pageWorkspaceId: String(c.a.workspaceId) }) }),
    unchanged: async (c) => (await checksOf(c.bField.selectionId)) === 1,
  },
  {
    name: "POST /field/selections/:id/checks (the phone's queue: a check on B's selection)",
    fn: () => fieldSyncRoute.action as never,
    opts: (c) => ({ path: `/field/selections/${c.bField.selectionId}/checks`, cookie: c.a.cookie, params: { id: String(c.bField.selectionId) }, form: fieldsForHead(20, 998.2, { flow: "0.01", clientId: "sweep-probe-0001", pageWorkspaceId: String(c.a.workspaceId) }) }),
    unchanged: async (c) => (await checksOf(c.bField.selectionId)) === 1,
  },
  {
    name: "POST /field/selections/:id/checks amends= (B's check)",
    fn: () => fieldSyncRoute.action as never,
    opts: (c) => ({ path: `/field/selections/${c.bField.selectionId}/checks`, cookie: c.a.cookie, params: { id: String(c.bField.selectionId) }, form: fieldsForHead(20, 998.2, { flow: "0.01", amends: String(c.bField.checkId), clientId: "sweep-probe-0002", pageWorkspaceId: String(c.a.workspaceId) }) }),
    unchanged: async (c) => (await checksOf(c.bField.selectionId)) === 1,
  },
  read("GET /field/checks/:id (B's check)", () => fieldCheckRoute.loader as never, (c) => `/field/checks/${c.bField.checkId}`, (c) => c.bField.checkId),
  {
    name: "GET /field/checks/:id/photos/:photoId (B's photo)",
    fn: () => fieldPhotoRoute.loader as never,
    opts: (c) => ({ path: `/field/checks/${c.bField.checkId}/photos/${c.bField.photoId}`, cookie: c.a.cookie, params: { id: String(c.bField.checkId), photoId: String(c.bField.photoId) } }),
    unchanged: async (c) => (await db().select().from(fieldCheckPhotos).where(eq(fieldCheckPhotos.id, c.bField.photoId))).length === 1,
  },
  read("GET /field/selections/:id/export.csv (B's selection)", () => fieldCsvRoute.loader as never, (c) => `/field/selections/${c.bField.selectionId}/export.csv`, (c) => c.bField.selectionId),
  read("GET /projects/:id/share (B's project)", () => shareRoute.loader as never, (c) => `/projects/${c.bField.projectId}/share`, (c) => c.bField.projectId),
  {
    name: "POST /projects/:id/share intent=share (B's project, to A's workspace)",
    fn: () => shareRoute.action as never,
    opts: (c) => ({ path: `/projects/${c.bField.projectId}/share`, cookie: c.a.cookie, params: { id: String(c.bField.projectId) }, form: { intent: "share", workspace: c.bField.aSlug } }),
    unchanged: async (c) => (await db().select().from(projectShares).where(eq(projectShares.projectId, c.bField.projectId))).length === 1,
  },
  {
    name: "POST /projects/:id/share intent=unshare (B's project and share)",
    fn: () => shareRoute.action as never,
    opts: (c) => ({ path: `/projects/${c.bField.projectId}/share`, cookie: c.a.cookie, params: { id: String(c.bField.projectId) }, form: { intent: "unshare", shareId: String(c.bField.shareId) } }),
    unchanged: async (c) => (await db().select().from(projectShares).where(eq(projectShares.id, c.bField.shareId))).length === 1,
  },
  ...(["accept", "decline"] as const).map(
    (intent): Probe => ({
      name: `POST /workspace/shares intent=${intent} (an offer to B)`,
      fn: () => offersRoute.action as never,
      opts: (c) => ({ path: "/workspace/shares", cookie: c.a.cookie, form: { intent, shareId: String(c.bOfferId), pageWorkspaceId: String(c.a.workspaceId) } }),
      unchanged: async (c) => (await db().select().from(projectShares).where(eq(projectShares.id, c.bOfferId)))[0]?.state === "pending",
    }),
  ),
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
  const sel = await storeSelection(b.workspaceId, b.userId, undefined, "B field");
  const third = await makeWorkspace();
  const [{ id: shareId }] = await db().insert(projectShares).values({ projectId: sel.projectId, workspaceId: third.id, createdBy: b.userId, state: "accepted" }).$returningId();
  const [{ id: checkId }] = await db()
    .insert(fieldChecks)
    .values({ selectionId: sel.selectionId, chainId: null, version: 1, workspaceId: b.workspaceId, createdBy: b.userId, readingsJson: "{}", resultJson: "{}", verdict: "pass", grade: "2B", notes: "" })
    .$returningId();
  await db().update(fieldChecks).set({ chainId: checkId }).where(eq(fieldChecks.id, checkId));
  const jpeg = Buffer.from([0xff, 0xd8, 0xff, 0xe0]);
  const [{ id: photoId }] = await db().insert(fieldCheckPhotos).values({ fieldCheckId: checkId, filename: "b.jpg", contentType: "image/jpeg", sizeBytes: jpeg.length, sha256: "0".repeat(64), content: jpeg }).$returningId();
  const [aw] = await db().select().from(workspaces).where(eq(workspaces.id, a.workspaceId));
  const offered = await storeSelection(third.id, b.userId, undefined, "Offered to B");
  const [{ id: bOfferId }] = await db().insert(projectShares).values({ projectId: offered.projectId, workspaceId: b.workspaceId, createdBy: b.userId }).$returningId();
  ctx = { a, b, bMembershipId: bm.id, bInvitationId: bi.id, bTokenId, bSessionId: bs.id, bField: { projectId: sel.projectId, selectionId: sel.selectionId, checkId, photoId, shareId, aSlug: aw.slug }, bOfferId };
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
    const field = await call(fieldHomeRoute.loader as never, { path: "/field", cookie: ctx.a.cookie });
    const offers = await call(offersRoute.loader as never, { path: "/workspace/shares", cookie: ctx.a.cookie });
    for (const r of [ws, acct, field, offers]) {
      expect(r.status).toBe(200);
      const text = JSON.stringify(r.body);
      expect(text).not.toContain(ctx.b.email);
      expect(text).not.toContain(bws.name);
      expect(text).not.toContain("B field");
      expect(text).not.toContain("Offered to B");
    }
  });
});
