// Stripe webhooks against the real MariaDB and the Stripe stand-in: signatures, replays, ordering.
import { describe, expect, test } from "vitest";
import { eq } from "drizzle-orm";
import { db } from "@db/client.server";
import { stripeEvents, workspaces } from "@db/schema";
import { call, makeMember } from "~/test/harness";
import * as webhookRoute from "~/routes/api.stripe.webhook";
import { handleStripeWebhook } from "./webhook.server";
import { kit, useBillingStandIn, ws, subscribe, signed, subscriptionEvent, post, customerWorkspace } from "./test-kit";

useBillingStandIn();

describe("webhook signatures and replays", () => {
  test("a valid signature is accepted and applied — Stripe API docs: Webhooks, verify with constructEvent", async () => {
    const { admin, customer } = await customerWorkspace();
    const evt = subscriptionEvent("customer.subscription.created", customer, { status: "active" });
    const { raw, signature } = signed(evt);
    const r = await post(raw, signature);
    expect(r.status).toBe(200);
    expect(r.body).toMatchObject({ received: true, result: "plan network" });
    expect((await ws(admin.workspaceId)).plan).toBe("network");
    expect((await db().select().from(stripeEvents).where(eq(stripeEvents.id, evt.id)))[0]?.workspaceId).toBe(admin.workspaceId);
  });

  test("a wrong secret, a changed body or no signature: 400 problem+json, nothing stored, plan unchanged — Stripe API docs: Webhooks signatures", async () => {
    const { admin, customer } = await customerWorkspace();
    const evt = subscriptionEvent("customer.subscription.created", customer, { status: "active" });
    const wrong = signed(evt, { secret: "whsec_someone_else" });
    const good = signed(evt);
    for (const [raw, sig] of [
      [wrong.raw, wrong.signature],
      [good.raw.replace('"status": "active"', '"status": "trialing"'), good.signature],
      [good.raw, undefined],
      [good.raw, "t=1,v1=zz"],
    ] as const) {
      const r = await post(raw, sig);
      expect(r.status).toBe(400);
      expect(r.headers.get("content-type")).toBe("application/problem+json");
    }
    expect((await ws(admin.workspaceId)).plan).toBe("free");
    expect(await db().select().from(stripeEvents).where(eq(stripeEvents.id, evt.id))).toHaveLength(0);
  });

  test("a stale signature (older than 300 s) is refused, even from the stand-in's own resend — Stripe API docs: replay attacks, default tolerance 5 minutes", async () => {
    const { admin, customer } = await customerWorkspace();
    const evt = subscriptionEvent("customer.subscription.created", customer, { status: "active" });
    const old = Math.floor(Date.now() / 1000) - 301;
    const { raw, signature } = signed(evt, { timestamp: old });
    const r = await post(raw, signature);
    expect(r.status).toBe(400);
    expect((r.body as { detail: string }).detail).toMatch(/tolerance/i);
    expect((await ws(admin.workspaceId)).plan).toBe("free");

    // The same through the stand-in: a recorded event re-signed with an old time.
    const other = await makeMember("admin");
    await subscribe(other);
    const first = kit.receiver.deliveries.find((d) => d.type === "customer.subscription.created" && (d.body as { result?: string }).result === "plan network" && JSON.parse(d.raw).data.object.metadata.workspace_id === String(other.workspaceId))!;
    const before = kit.receiver.deliveries.length;
    const res = await fetch(`${kit.standIn.url}/_test/resend/${first.id}?t=${old}`, { method: "POST" });
    expect(res.status).toBe(200);
    const resent = kit.receiver.deliveries.slice(before).find((d) => d.id === first.id)!;
    expect(resent.status).toBe(400);
  });

  test("a replayed delivery (same body, same signature) is answered 'already handled' and changes nothing — Stripe API docs: handle duplicate events", async () => {
    const { admin, customer } = await customerWorkspace();
    const evt = subscriptionEvent("customer.subscription.deleted", customer, { id: "sub_unit_replay", status: "canceled" });
    await db().update(workspaces).set({ plan: "network", stripeSubscriptionId: "sub_unit_replay", subscriptionStatus: "active" }).where(eq(workspaces.id, admin.workspaceId));
    const { raw, signature } = signed(evt);
    const first = await post(raw, signature);
    expect(first.body).toMatchObject({ result: "plan free" });
    expect((await ws(admin.workspaceId)).plan).toBe("free");
    // Something else moves the plan on (say, an operator grant); the old event arriving again must not undo it.
    await db().update(workspaces).set({ plan: "network" }).where(eq(workspaces.id, admin.workspaceId));
    const again = await post(raw, signature);
    expect(again.status).toBe(200);
    expect(again.body).toMatchObject({ result: "already handled" });
    expect((await ws(admin.workspaceId)).plan).toBe("network");
    expect(await db().select().from(stripeEvents).where(eq(stripeEvents.id, evt.id))).toHaveLength(1);
  });

  test("the same event delivered twice at once changes the plan once — Stripe API docs: handle duplicate events", async () => {
    const { admin, customer } = await customerWorkspace();
    const evt = subscriptionEvent("customer.subscription.created", customer, { status: "active" });
    const { raw, signature } = signed(evt);
    const results = await Promise.all([post(raw, signature), post(raw, signature), post(raw, signature)]);
    expect(results.map((r) => r.status)).toEqual([200, 200, 200]);
    const outcomes = results.map((r) => (r.body as { result: string }).result).sort();
    expect(outcomes).toEqual(["already handled", "already handled", "plan network"]);
    expect((await ws(admin.workspaceId)).plan).toBe("network");
  });

  test("the stand-in resending a delivered event changes nothing — Stripe API docs: handle duplicate events", async () => {
    const admin = await makeMember("admin");
    const w = await subscribe(admin);
    const created = kit.receiver.deliveries.find((d) => d.type === "customer.subscription.created" && JSON.parse(d.raw).data.object.id === w.stripeSubscriptionId)!;
    // Cancel and let the period end: Starter again.
    await db().update(workspaces).set({ plan: "free", subscriptionStatus: "canceled" }).where(eq(workspaces.id, admin.workspaceId));
    const before = kit.receiver.deliveries.length;
    const res = await fetch(`${kit.standIn.url}/_test/resend/${created.id}`, { method: "POST" });
    expect(res.status).toBe(200);
    const resent = kit.receiver.deliveries.slice(before).find((d) => d.id === created.id)!;
    expect(resent.status).toBe(200);
    expect(resent.body).toMatchObject({ result: "already handled" });
    expect((await ws(admin.workspaceId)).plan).toBe("free");
  });

  test("an older subscription event arriving after a newer one does not undo it — Stripe API docs: event ordering is not guaranteed", async () => {
    const { admin, customer } = await customerWorkspace();
    const t = Math.floor(Date.now() / 1000);
    const deleted = subscriptionEvent("customer.subscription.deleted", customer, { id: "sub_unit_order", status: "canceled" }, t);
    const olderUpdate = subscriptionEvent("customer.subscription.updated", customer, { id: "sub_unit_order", status: "active" }, t - 60);
    expect((await post(...Object.values(signed(deleted)) as [string, string])).body).toMatchObject({ result: "plan free" });
    const r = await post(...(Object.values(signed(olderUpdate)) as [string, string]));
    expect(r.status).toBe(200);
    expect((r.body as { result: string }).result).toMatch(/older/);
    expect((await ws(admin.workspaceId)).plan).toBe("free");
  });

  test("an event for a customer we do not know is stored and changes no workspace — common practice (acknowledge, do not retry forever)", async () => {
    const evt = subscriptionEvent("customer.subscription.created", "cus_nobody_here", { status: "active" });
    const { raw, signature } = signed(evt);
    const r = await handleStripeWebhook(raw, signature);
    expect(r.status).toBe(200);
    expect(r.body).toMatchObject({ result: "no workspace for this event" });
    const [row] = await db().select().from(stripeEvents).where(eq(stripeEvents.id, evt.id));
    expect(row.workspaceId).toBeNull();
  });

  test("metadata naming another workspace does not move a plan there when the customer is someone else's — our product rule", async () => {
    const victim = await makeMember("admin");
    const { customer } = await customerWorkspace();
    const evt = subscriptionEvent("customer.subscription.created", `${customer}_x`, { status: "active", workspaceId: victim.workspaceId });
    await db().update(workspaces).set({ stripeCustomerId: `cus_other_${victim.workspaceId}` }).where(eq(workspaces.id, victim.workspaceId));
    const { raw, signature } = signed(evt);
    const r = await post(raw, signature);
    expect(r.status).toBe(200);
    expect((await ws(victim.workspaceId)).plan).toBe("free");
  });

  test("GET on the webhook path answers 405 — common practice (HTTP semantics, RFC 9110 §15.5.6)", async () => {
    const r = await call(webhookRoute.loader as never, { path: "/api/stripe/webhook" });
    expect(r.status).toBe(405);
  });
});
