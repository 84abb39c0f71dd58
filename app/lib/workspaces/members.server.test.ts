// Removing a member and keeping an admin, against the real MariaDB. Check values are our own product
// rules (a removed member cannot come back through an invitation sent before the removal; a workspace
// always keeps an admin, also when two admins act at the same moment) — common practice for access control.
import { afterAll, describe, expect, test } from "vitest";
import { and, eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { invitations, memberships } from "@db/schema";
import { call, makeMember, makeWorkspace, type TestMember } from "~/test/harness";
import * as workspaceRoute from "~/routes/workspace";
import { acceptInvitation, changeRole, invite, removeMember } from ".";
import type { Role } from "../auth/permissions";

afterAll(() => closeDb());

const membershipOf = async (workspaceId: number, userId: string) =>
  (await db().select().from(memberships).where(and(eq(memberships.workspaceId, workspaceId), eq(memberships.userId, userId))))[0];
const sendInvite = (from: TestMember, email: string, role: Role) =>
  invite({ workspaceId: from.workspaceId, workspaceName: "W", inviterId: from.userId, inviterName: "A", email, role });
const invitationsTo = (workspaceId: number, email: string) =>
  db().select().from(invitations).where(and(eq(invitations.workspaceId, workspaceId), eq(invitations.email, email))).orderBy(invitations.id);
const adminsOf = async (workspaceId: number) =>
  (await db().select().from(memberships).where(and(eq(memberships.workspaceId, workspaceId), eq(memberships.role, "admin")))).length;

describe("a removed member does not come back through an older invitation", () => {
  test("invited twice (engineer, then admin), accepted once, removed: the second invitation is withdrawn with the removal", async () => {
    const admin = await makeMember("admin");
    const bob = await makeMember("viewer"); // bob's own workspace elsewhere; his address is confirmed
    const asEngineer = await sendInvite(admin, bob.email, "engineer");
    const asAdmin = await sendInvite(admin, bob.email, "admin");
    const joined = await acceptInvitation(asEngineer, bob.userId);
    const m = await membershipOf(admin.workspaceId, bob.userId);
    expect(m.role).toBe("engineer");

    const removal = await removeMember(admin.workspaceId, m.id);
    const [first, second] = await invitationsTo(admin.workspaceId, bob.email);
    expect(first.acceptedAt).not.toBeNull(); // used: stays as it was
    expect(first.revokedAt).toBeNull();
    expect(second.revokedAt).not.toBeNull(); // pending at the removal: withdrawn in the same transaction

    const rejoin = await acceptInvitation(asAdmin, bob.userId);
    expect(await membershipOf(admin.workspaceId, bob.userId)).toBeUndefined();
    expect(rejoin).toEqual({ ok: false, reason: "unusable" });
    expect(joined).toEqual({ ok: true, workspaceId: admin.workspaceId });
    expect(removal).toEqual({ removed: true, withdrawnToThem: 1, withdrawnSentByThem: 0 });
  });

  test("an admin invited again after the removal can bring the person back (a new decision, not an old link)", async () => {
    const admin = await makeMember("admin");
    const bob = await makeMember("viewer");
    const first = await sendInvite(admin, bob.email, "engineer");
    await acceptInvitation(first, bob.userId);
    await removeMember(admin.workspaceId, (await membershipOf(admin.workspaceId, bob.userId)).id);
    const again = await sendInvite(admin, bob.email, "viewer");
    expect(await acceptInvitation(again, bob.userId)).toEqual({ ok: true, workspaceId: admin.workspaceId });
    expect((await membershipOf(admin.workspaceId, bob.userId)).role).toBe("viewer");
  });

  test("removing an admin withdraws the invitations they sent that are still pending; used ones and other admins' stay", async () => {
    const admin = await makeMember("admin");
    const leaver = await makeMember("admin", admin.workspaceId);
    const carol = await makeMember("viewer");
    const dan = await makeMember("viewer");
    const erin = await makeMember("viewer");
    const toCarol = await sendInvite(leaver, carol.email, "admin");
    const toDan = await sendInvite(leaver, dan.email, "engineer");
    const toErin = await sendInvite(admin, erin.email, "engineer");
    await acceptInvitation(toDan, dan.userId); // used before the removal

    const gone = await removeMember(admin.workspaceId, (await membershipOf(admin.workspaceId, leaver.userId)).id);
    expect((await invitationsTo(admin.workspaceId, carol.email))[0].revokedAt).not.toBeNull();
    const late = await acceptInvitation(toCarol, carol.userId);
    expect(await membershipOf(admin.workspaceId, carol.userId)).toBeUndefined();
    expect(late).toEqual({ ok: false, reason: "unusable" });
    expect(gone).toEqual({ removed: true, withdrawnToThem: 0, withdrawnSentByThem: 1 });
    expect((await membershipOf(admin.workspaceId, dan.userId)).role).toBe("engineer"); // joined earlier: stays
    expect(await acceptInvitation(toErin, erin.userId)).toEqual({ ok: true, workspaceId: admin.workspaceId }); // another admin's invitation
  });

  test("invitations of the same address to another workspace are left alone", async () => {
    const admin = await makeMember("admin");
    const elsewhere = await makeMember("admin");
    const bob = await makeMember("viewer");
    await acceptInvitation(await sendInvite(admin, bob.email, "engineer"), bob.userId);
    const other = await sendInvite(elsewhere, bob.email, "engineer");
    await removeMember(admin.workspaceId, (await membershipOf(admin.workspaceId, bob.userId)).id);
    expect(await acceptInvitation(other, bob.userId)).toEqual({ ok: true, workspaceId: elsewhere.workspaceId });
  });
});

describe("a demoted admin no longer vouches for the invitations they sent", () => {
  // Our own rule, as for a removal: only a role that may invite (members.manage, permissions.ts) vouches for the
  // people it invited; demoted below it, their pending invitations go in the demotion's transaction.
  test("demoted to engineer: their pending invitations are withdrawn and counted; used ones and other admins' stay", async () => {
    const admin = await makeMember("admin");
    const demoted = await makeMember("admin", admin.workspaceId);
    const carol = await makeMember("viewer");
    const dan = await makeMember("viewer");
    const erin = await makeMember("viewer");
    const frank = await makeMember("viewer");
    const toCarol = await sendInvite(demoted, carol.email, "admin");
    await sendInvite(demoted, frank.email, "viewer");
    const toDan = await sendInvite(demoted, dan.email, "engineer");
    const toErin = await sendInvite(admin, erin.email, "engineer");
    await acceptInvitation(toDan, dan.userId); // used before the demotion: stays

    const change = await changeRole(admin.workspaceId, (await membershipOf(admin.workspaceId, demoted.userId)).id, "engineer");
    expect((await membershipOf(admin.workspaceId, demoted.userId)).role).toBe("engineer");
    expect((await invitationsTo(admin.workspaceId, carol.email))[0].revokedAt).not.toBeNull();
    expect((await invitationsTo(admin.workspaceId, frank.email))[0].revokedAt).not.toBeNull();
    expect(await acceptInvitation(toCarol, carol.userId)).toEqual({ ok: false, reason: "unusable" });
    expect(await membershipOf(admin.workspaceId, carol.userId)).toBeUndefined();
    expect(change).toEqual({ changed: true, withdrawnSentByThem: 2 });
    expect((await invitationsTo(admin.workspaceId, dan.email))[0].revokedAt).toBeNull();
    expect(await acceptInvitation(toErin, erin.userId)).toEqual({ ok: true, workspaceId: admin.workspaceId }); // another admin's
  });

  test("the workspace page's notice says the new role and how many invitations went with it", async () => {
    const admin = await makeMember("admin");
    const demoted = await makeMember("admin", admin.workspaceId);
    await sendInvite(demoted, "one-pending@example.test", "viewer");
    const form = (membershipId: number, role: Role) => ({ intent: "role", membershipId: String(membershipId), role, pageWorkspaceId: String(admin.workspaceId) });
    const m = (await membershipOf(admin.workspaceId, demoted.userId)).id;
    const r = await call(workspaceRoute.action as never, { path: "/workspace", cookie: admin.cookie, form: form(m, "contractor") });
    expect(r.body).toEqual({ notice: "Role changed to contractor; withdrawn with it, as a contractor may not invite: 1 pending invitation they had sent." });
    const again = await call(workspaceRoute.action as never, { path: "/workspace", cookie: admin.cookie, form: form(m, "viewer") });
    expect(again.body).toEqual({ notice: "Role changed to viewer." }); // nothing pending left
  });

  test("a role that may still invite (admin to admin) withdraws nothing; refused changes withdraw nothing", async () => {
    const admin = await makeMember("admin");
    const other = await makeMember("admin", admin.workspaceId);
    const carol = await makeMember("viewer");
    const toCarol = await sendInvite(admin, carol.email, "viewer");
    const mAdmin = (await membershipOf(admin.workspaceId, admin.userId)).id;
    expect(await changeRole(admin.workspaceId, mAdmin, "admin")).toEqual({ changed: true, withdrawnSentByThem: 0 });
    await removeMember(admin.workspaceId, (await membershipOf(admin.workspaceId, other.userId)).id);
    expect(await changeRole(admin.workspaceId, mAdmin, "viewer")).toBe("last-admin"); // refused: the invitation stays
    expect(await acceptInvitation(toCarol, carol.userId)).toEqual({ ok: true, workspaceId: admin.workspaceId });
  });
});

/** A workspace with two admins (A and B) and their membership ids. */
async function twoAdmins() {
  const ws = await makeWorkspace();
  const a = await makeMember("admin", ws.id);
  const b = await makeMember("admin", ws.id);
  return { ws: ws.id, mA: (await membershipOf(ws.id, a.userId)).id, mB: (await membershipOf(ws.id, b.userId)).id };
}
const outcome = (r: Awaited<ReturnType<typeof removeMember>> | Awaited<ReturnType<typeof changeRole>>) => (typeof r === "string" ? r : "ok");

// Two requests at once: each transaction alone sees two admins, so without a lock both go through.
// Repeated so that the interleaving has its chances; no timing is asserted, only the end state.
describe("two admins acting on each other at the same moment leave one admin", () => {
  const ROUNDS = 6; // our choice: before the lock, each of these lost all 6 rounds here (0 admins left)
  const cases: [string, (ws: number, mA: number, mB: number) => Promise<unknown>[]][] = [
    ["each demotes the other", (ws, mA, mB) => [changeRole(ws, mB, "viewer"), changeRole(ws, mA, "viewer")]],
    ["each removes the other", (ws, mA, mB) => [removeMember(ws, mB), removeMember(ws, mA)]],
    ["one demotes, the other removes", (ws, mA, mB) => [changeRole(ws, mB, "engineer"), removeMember(ws, mA)]],
  ];
  for (const [name, act] of cases) {
    test(name, async () => {
      for (let i = 0; i < ROUNDS; i++) {
        const { ws, mA, mB } = await twoAdmins();
        const results = (await Promise.all(act(ws, mA, mB))) as Parameters<typeof outcome>[0][];
        expect(await adminsOf(ws)).toBe(1);
        expect(results.map(outcome).sort()).toEqual(["last-admin", "ok"]);
      }
    });
  }
});
