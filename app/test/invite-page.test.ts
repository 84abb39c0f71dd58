// The invitation page when the signed-in account is not the invited address: it says so before any
// click (the invitation is for <address>; sign in as that address), and Accept, if posted anyway, says
// the same rather than "expired, withdrawn or already used". Nothing more of the invitation is said than
// the page already shows to whoever holds the link. Real route modules, guards and MariaDB.
// Check values: our own product rules (invitations bound to the invited address) — common practice.
import { createElement } from "react";
import { renderToString } from "react-dom/server";
import { createRoutesStub } from "react-router";
import { afterAll, describe, expect, test } from "vitest";
import { and, eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { invitations, memberships } from "@db/schema";
import { invite, revokeInvitation } from "~/lib/workspaces";
import * as inviteRoute from "~/routes/invite.$token";
import InvitePage from "~/routes/invite.$token";
import * as signoutRoute from "~/routes/signout";
import { call, makeMember, type TestMember } from "./harness";

afterAll(() => closeDb());

const sendInvite = (from: TestMember, email: string) =>
  invite({ workspaceId: from.workspaceId, workspaceName: "W", inviterId: from.userId, inviterName: "A", email, role: "engineer" });
const isMember = async (workspaceId: number, userId: string) =>
  (await db().select().from(memberships).where(and(eq(memberships.workspaceId, workspaceId), eq(memberships.userId, userId)))).length === 1;

/** The page as the server renders it for `cookie` (no script needed to read it). */
async function renderInvite(token: string, cookie: string, actionData?: unknown) {
  const d = (await call(inviteRoute.loader as never, { path: `/invite/${token}`, cookie, params: { token } })).body;
  const Stub = createRoutesStub([{ path: "/invite/:token", Component: InvitePage as never, loader: () => d, action: () => actionData ?? null }]);
  const hydrationData = { loaderData: { "0": d }, ...(actionData ? { actionData: { "0": actionData } } : {}) };
  return renderToString(createElement(Stub, { initialEntries: [`/invite/${token}`], hydrationData } as never));
}

describe("signed in as another address than the invitation's", () => {
  test("the page says whom the invitation is for and to sign in as that address, and offers no Accept", async () => {
    const admin = await makeMember("admin");
    const invited = await makeMember("viewer");
    const other = await makeMember("viewer");
    const token = await sendInvite(admin, invited.email);
    const html = await renderInvite(token, other.cookie);
    expect(html).toContain(`This invitation is for <strong>${invited.email}</strong>`);
    expect(html).toContain(`You are signed in as <strong>${other.email}</strong>`);
    expect(html).toContain(`sign in as ${invited.email}`);
    expect(html).not.toContain("accepting adds that account");
    expect(html).not.toContain("Accept and join");
    // A way out that comes back here: sign out with this page as where to go next.
    const signOut = /<form[^>]*action="\/signout"[^>]*>(.*?)<\/form>/.exec(html);
    expect(signOut?.[1]).toContain(`<input type="hidden" name="next" value="/invite/${token}"/>`);
  });

  test("Accept posted anyway says the invitation is for another address (403), not that it expired; nobody joins", async () => {
    const admin = await makeMember("admin");
    const invited = await makeMember("viewer");
    const other = await makeMember("viewer");
    const token = await sendInvite(admin, invited.email);
    const r = await call(inviteRoute.action as never, { path: `/invite/${token}`, cookie: other.cookie, form: {}, params: { token } });
    expect(r.status).toBe(403);
    const error = (r.body as { error: string }).error;
    expect(error).toBe(`This invitation is for ${invited.email}, and you are signed in as ${other.email}. Sign in as ${invited.email} to accept it.`);
    expect(await isMember(admin.workspaceId, other.userId)).toBe(false);
    // The page shows what the action said.
    expect(await renderInvite(token, other.cookie, r.body)).toContain(error);
    // The invitation is still there for its address.
    const ok = await call(inviteRoute.action as never, { path: `/invite/${token}`, cookie: invited.cookie, form: {}, params: { token } });
    expect(ok.location).toBe("/workspace");
    expect(await isMember(admin.workspaceId, invited.userId)).toBe(true);
  });

  test("a withdrawn invitation says only that, to any account: its address is not given away", async () => {
    const admin = await makeMember("admin");
    const invited = await makeMember("viewer");
    const other = await makeMember("viewer");
    const token = await sendInvite(admin, invited.email);
    const [inv] = await db().select().from(invitations).where(eq(invitations.workspaceId, admin.workspaceId));
    await revokeInvitation(admin.workspaceId, inv.id);
    const r = await call(inviteRoute.action as never, { path: `/invite/${token}`, cookie: other.cookie, form: {}, params: { token } });
    expect(r.status).toBe(404); // no usable invitation has this token (was 200); the page reloads to the "expired, withdrawn or used" card (shouldRevalidate)
    expect(JSON.stringify(r.body)).not.toContain(invited.email);
    expect((r.body as { error: string }).error).toBe("This invitation has expired, was withdrawn, or was already used.");
    expect(await renderInvite(token, other.cookie)).not.toContain(invited.email);
  });
});

describe("sign out and come back", () => {
  test("signing out with a local next goes to sign-in with that next; anything else to plain sign-in — our open-redirect rule (safeNext)", async () => {
    const m = await makeMember("viewer");
    const r = await call(signoutRoute.action as never, { path: "/signout", cookie: m.cookie, form: { next: "/invite/abc" } });
    expect(r.location).toBe(`/signin?next=${encodeURIComponent("/invite/abc")}`);
    const evil = await call(signoutRoute.action as never, { path: "/signout", cookie: m.cookie, form: { next: "//evil.example/x" } });
    expect(evil.location).toBe("/signin");
    const bare = await call(signoutRoute.action as never, { path: "/signout", cookie: m.cookie, form: {} });
    expect(bare.location).toBe("/signin");
    const unreadable = await call(signoutRoute.action as never, { path: "/signout", cookie: m.cookie, method: "POST", body: "x", headers: { "content-type": "multipart/form-data; boundary=none" } });
    expect(unreadable.location).toBe("/signin"); // signing out never fails on its body
  });
});
