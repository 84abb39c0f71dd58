// A form acts on the workspace its page showed, never on the one the session switched to since. With
// workspace A's page open, switching to B in another tab and then submitting A's form used to act on B
// (an invitation sent from B, B's plan upgraded or cancelled, B renamed). Each form now carries the page's
// workspace id (a hidden field: no script needed) and the action refuses with 409 when it differs.
// Real route modules, guards and MariaDB; Stripe is the local stand-in (fixtures/stripe).
// Check values: our own product rule (act only on what the page showed) — common practice for forms.
import { describe, expect, test } from "vitest";
import { and, eq, isNull } from "drizzle-orm";
import { db } from "@db/client.server";
import { invitations, memberships } from "@db/schema";
import { invite } from "~/lib/workspaces";
import * as workspaceRoute from "~/routes/workspace";
import WorkspacePage from "~/routes/workspace";
import * as billingRoute from "~/routes/workspace.billing";
import BillingPage from "~/routes/workspace.billing";
import { kit, subscribe, useBillingStandIn, ws } from "~/lib/billing/test-kit";
import { call, makeMember, type TestMember } from "./harness";
import { renderPage } from "./render-page";
import { alsoMemberOf, carries, formsOf, STALE, switchTo } from "./workspace-tabs";

useBillingStandIn();

/** `m` (admin of their own workspace A) becomes admin of B too; A stays the current one. */
const alsoAdminOf = (m: TestMember, workspaceId: number) => alsoMemberOf(m, workspaceId, "admin");
const wsName = async (id: number) => (await ws(id)).name;
const pendingInvites = async (workspaceId: number) =>
  (await db().select().from(invitations).where(and(eq(invitations.workspaceId, workspaceId), isNull(invitations.revokedAt)))).length;
const memberRow = async (id: number) => (await db().select().from(memberships).where(eq(memberships.id, id)))[0];
const membershipId = async (workspaceId: number, userId: string) =>
  (await db().select().from(memberships).where(and(eq(memberships.workspaceId, workspaceId), eq(memberships.userId, userId))))[0].id;

describe("the workspace page's forms", () => {
  test("A's forms posted after switching to B: 409 naming both, nothing changed in A or B; from B's own page they work", async () => {
    const a = await makeMember("admin"); // admin of A
    const b = await makeMember("admin"); // admin of B
    await alsoAdminOf(a, b.workspaceId);
    const colleagueA = await makeMember("engineer", a.workspaceId);
    const colleagueB = await makeMember("engineer", b.workspaceId);
    await invite({ workspaceId: a.workspaceId, workspaceName: "A", inviterId: a.userId, inviterName: "A", email: "pending-a@example.test", role: "viewer" });
    await invite({ workspaceId: b.workspaceId, workspaceName: "B", inviterId: b.userId, inviterName: "B", email: "pending-b@example.test", role: "viewer" });
    const [invA] = await db().select().from(invitations).where(eq(invitations.workspaceId, a.workspaceId));
    const page = await call(workspaceRoute.loader as never, { path: "/workspace", cookie: a.cookie });
    expect((page.body as { workspace: { id: number } }).workspace.id).toBe(a.workspaceId); // the page shows A
    const [nameA, nameB] = [await wsName(a.workspaceId), await wsName(b.workspaceId)];
    const mA = await membershipId(a.workspaceId, colleagueA.userId);

    await switchTo(a, b.workspaceId); // another tab

    const fromA = { pageWorkspaceId: String(a.workspaceId) };
    const posts: Record<string, string>[] = [
      { intent: "invite", email: "newcomer@example.test", role: "admin" },
      { intent: "rename", name: "Renamed by mistake" },
      { intent: "currency", currency: "GBP" },
      { intent: "role", membershipId: String(mA), role: "viewer" },
      { intent: "remove", membershipId: String(mA) },
      { intent: "revoke-invite", invitationId: String(invA.id) },
    ];
    for (const form of posts) {
      const r = await call(workspaceRoute.action as never, { path: "/workspace", cookie: a.cookie, form: { ...form, ...fromA } });
      expect(r.status, form.intent).toBe(409);
      const said = (r.body as { errors: { _form: string } }).errors._form;
      expect(said.match(STALE)?.slice(1), form.intent).toEqual([nameA, nameB]);
    }
    for (const id of [a.workspaceId, b.workspaceId]) {
      const w = await ws(id);
      expect(w.name).not.toBe("Renamed by mistake");
      expect(w.currency ?? "EUR").toBe("EUR");
      expect(await pendingInvites(id)).toBe(1); // the one each had; none sent, none withdrawn
    }
    expect((await memberRow(mA)).role).toBe("engineer");

    // B's own page (after the reload) carries B's id, and its forms do what they say.
    const fromB = { pageWorkspaceId: String(b.workspaceId) };
    const sent = await call(workspaceRoute.action as never, { path: "/workspace", cookie: a.cookie, form: { intent: "invite", email: "newcomer@example.test", role: "viewer", ...fromB } });
    expect(sent.status).toBe(200);
    expect(await pendingInvites(b.workspaceId)).toBe(2);
    const mB = await membershipId(b.workspaceId, colleagueB.userId);
    const changed = await call(workspaceRoute.action as never, { path: "/workspace", cookie: a.cookie, form: { intent: "role", membershipId: String(mB), role: "viewer", ...fromB } });
    expect(changed.status).toBe(200);
    expect((await memberRow(mB)).role).toBe("viewer");
  });

  test("a page's workspace the member no longer belongs to: 409, said without its name, nothing done", async () => {
    const a = await makeMember("admin");
    const gone = await makeMember("admin"); // a workspace `a` is not (or no longer) a member of
    const r = await call(workspaceRoute.action as never, { path: "/workspace", cookie: a.cookie, form: { intent: "rename", name: "Elsewhere", pageWorkspaceId: String(gone.workspaceId) } });
    expect(r.status).toBe(409);
    const said = (r.body as { errors: { _form: string } }).errors._form;
    expect(said).toContain("this page was for a workspace you are no longer in");
    expect(said).not.toContain(await wsName(gone.workspaceId));
    expect(await wsName(a.workspaceId)).not.toBe("Elsewhere");
    expect(await wsName(gone.workspaceId)).not.toBe("Elsewhere");
  });

  test("a form without the page's workspace (an older page) is refused with a reload message, nothing done", async () => {
    const a = await makeMember("admin");
    const r = await call(workspaceRoute.action as never, { path: "/workspace", cookie: a.cookie, form: { intent: "rename", name: "No page id" } });
    expect(r.status).toBe(400);
    expect((r.body as { errors: Record<string, string> }).errors.pageWorkspaceId).toBe("This form came from an older page: reload the page and try again.");
    expect(await wsName(a.workspaceId)).not.toBe("No page id");
  });

  test("every form on the page but the workspace switch carries the page's workspace id (plain HTML, works without JavaScript)", async () => {
    const a = await makeMember("admin");
    const b = await makeMember("admin");
    await alsoAdminOf(a, b.workspaceId);
    await makeMember("engineer", a.workspaceId);
    await invite({ workspaceId: a.workspaceId, workspaceName: "A", inviterId: a.userId, inviterName: "A", email: "pending@example.test", role: "viewer" });
    const d = (await call(workspaceRoute.loader as never, { path: "/workspace", cookie: a.cookie })).body;
    const html = renderPage("/workspace", WorkspacePage, "/workspace", d);
    const forms = formsOf(html);
    const switches = forms.filter((f) => f.includes('value="switch"'));
    const others = forms.filter((f) => !f.includes('value="switch"'));
    expect(switches).toHaveLength(2); // one button per workspace (A, B)
    // rename, currency, two role forms (the admin's own and the engineer's), one remove, invite, withdraw
    expect(others).toHaveLength(7);
    for (const f of others) expect(carries(f, a.workspaceId), f.slice(0, 200)).toBe(true);
    for (const f of switches) expect(f).not.toContain("pageWorkspaceId");
  });
});

describe("the billing page's forms", () => {
  test("upgrade from A's page after switching to B: 409, no checkout started for B", async () => {
    const a = await makeMember("admin");
    const b = await makeMember("admin");
    await alsoAdminOf(a, b.workspaceId);
    const page = await call(billingRoute.loader as never, { path: "/workspace/billing", cookie: a.cookie });
    expect(page.body).toMatchObject({ workspace: { name: await wsName(a.workspaceId) }, plan: "free" }); // the page shows A
    await switchTo(a, b.workspaceId);
    const r = await call(billingRoute.action as never, { path: "/workspace/billing", cookie: a.cookie, form: { intent: "upgrade", pageWorkspaceId: String(a.workspaceId) } });
    expect(r.status).toBe(409);
    expect(r.location).toBeNull(); // no redirect to a checkout page
    expect((r.body as { errors: { _form: string } }).errors._form.match(STALE)?.slice(1)).toEqual([await wsName(a.workspaceId), await wsName(b.workspaceId)]);
    expect((await ws(b.workspaceId)).stripeCustomerId).toBeNull(); // checkout makes the customer first (billing.server.ts)
  });

  test("cancel, resume and the payment portal from A's page after switching to B: 409, B's subscription untouched", async () => {
    const a = await makeMember("admin");
    const b = await makeMember("admin");
    await subscribe(a);
    await subscribe(b);
    await alsoAdminOf(a, b.workspaceId);
    await switchTo(a, b.workspaceId);
    for (const intent of ["cancel", "resume", "portal"]) {
      const r = await call(billingRoute.action as never, { path: "/workspace/billing", cookie: a.cookie, form: { intent, pageWorkspaceId: String(a.workspaceId) } });
      expect(r.status, intent).toBe(409);
      expect(r.location, intent).toBeNull();
      expect((r.body as { errors: { _form: string } }).errors._form, intent).toMatch(STALE);
    }
    const sub = await kit.sdk.subscriptions.retrieve((await ws(b.workspaceId)).stripeSubscriptionId!);
    expect(sub.cancel_at_period_end).toBe(false); // at Stripe (the stand-in), not only in our row
    expect((await ws(b.workspaceId)).cancelAtPeriodEnd).toBe(false);
  });

  test("the page's forms carry its workspace id: upgrade on the free plan; cancel and portal on a subscription", async () => {
    const free = await makeMember("admin");
    const paid = await makeMember("admin");
    await subscribe(paid);
    for (const [m, count] of [[free, 1], [paid, 2]] as const) {
      const d = (await call(billingRoute.loader as never, { path: "/workspace/billing", cookie: m.cookie })).body;
      const html = renderPage("/workspace/billing", BillingPage, "/workspace/billing", d);
      const forms = formsOf(html);
      expect(forms).toHaveLength(count);
      for (const f of forms) expect(carries(f, m.workspaceId)).toBe(true);
    }
  });
});
