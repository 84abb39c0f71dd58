// One subscription per workspace: checkout is refused while the customer has a live subscription at
// Stripe (whatever our row says), and a new checkout expires the customer's earlier open ones. Real
// MariaDB, the real stripe SDK, the local Stripe stand-in (fixtures/stripe).
import { describe, expect, test } from "vitest";
import Stripe from "stripe";
import { call, makeMember } from "~/test/harness";
import * as billingRoute from "~/routes/workspace.billing";
import { kit, useBillingStandIn, ws, pay, upgrade, subscriptionIn, waitFor } from "./test-kit";

useBillingStandIn();

/** The billing page's Upgrade form as the admin's page posts it (with the page's workspace: stale-workspace-forms). */
const pressUpgrade = (m: { cookie: string; workspaceId: number }) =>
  call(billingRoute.action as never, { path: "/workspace/billing", cookie: m.cookie, form: { intent: "upgrade", pageWorkspaceId: String(m.workspaceId) } });
/** Checkout Sessions Stripe holds for the customer (the stand-in lists none for a customer it does not know). */
const openedFor = async (customer: string) => (await kit.sdk.checkout.sessions.list({ customer, limit: 100 })).data.length;
const liveAtStripe = async (customer: string) => (await kit.sdk.subscriptions.list({ customer, status: "all" })).data.filter((s) => s.status !== "canceled" && s.status !== "incomplete_expired");

describe("checkout opens no second subscription", () => {
  test("two checkouts opened before paying: the second expires the first, so one payment makes one subscription — Stripe API docs: checkout.sessions.expire; our rule: one subscription per workspace", async () => {
    const admin = await makeMember("admin");
    const other = await makeMember("admin", admin.workspaceId);
    const first = await upgrade(admin);
    const second = await upgrade(other);
    const firstId = first.split("/pay/")[1];
    expect(((await kit.sdk.checkout.sessions.retrieve(firstId)) as Stripe.Checkout.Session).status).toBe("expired");
    const late = await pay(first, "4242 4242 4242 4242");
    expect(late.status).toBe(409); // the stand-in's page for a session that is no longer open
    expect((await pay(second, "4242 4242 4242 4242")).status).toBe(303);
    const w = await waitFor(async () => {
      const x = await ws(admin.workspaceId);
      return x.plan === "network" ? x : null;
    }, "the Network plan");
    expect(await liveAtStripe(w.stripeCustomerId!)).toHaveLength(1);
  });

  test("a subscription already live at Stripe that our row does not show yet (webhook not landed): Upgrade is refused and points to the payment portal — our rule", async () => {
    const admin = await makeMember("admin");
    const url = await upgrade(admin);
    kit.receiver.state.paused = true; // our endpoint is down: the row knows nothing yet
    expect((await pay(url, "4242 4242 4242 4242")).status).toBe(303);
    expect((await ws(admin.workspaceId)).stripeSubscriptionId).toBeNull();
    const r = await pressUpgrade(admin);
    expect(r.status).toBe(409);
    expect(r.location).toBeNull();
    const message = (r.body as { errors: { _form: string } }).errors._form;
    expect(message).toMatch(/already has a subscription at Stripe \(sub_[^,]+, active\)/);
    expect(message).toContain("Payment details on Stripe");
    kit.receiver.state.paused = false;
    const customer = (await ws(admin.workspaceId)).stripeCustomerId!;
    expect(await liveAtStripe(customer)).toHaveLength(1);
    // No open checkout was left behind for it either.
    expect((await kit.sdk.checkout.sessions.list({ customer, status: "open" })).data).toHaveLength(0);
  });

  for (const status of ["past_due", "incomplete", "unpaid", "paused"]) {
    test(`a subscription that is ${status}: a crafted intent=upgrade is refused (409, no checkout) and the page offers no Upgrade — Stripe API docs: Subscriptions, status (${status} is not ended)`, async () => {
      const admin = await subscriptionIn(status);
      const customer = (await ws(admin.workspaceId)).stripeCustomerId!;
      const before = await openedFor(customer);
      const r = await pressUpgrade(admin);
      expect(r.status).toBe(409);
      expect(r.location).toBeNull();
      expect((r.body as { errors: { _form: string } }).errors._form).toContain("Payment details on Stripe");
      expect(await openedFor(customer)).toBe(before);
      const page = await call(billingRoute.loader as never, { path: "/workspace/billing", cookie: admin.cookie });
      expect(page.body).toMatchObject({ canUpgrade: false, hasSubscription: true, hasCustomer: true });
    });
  }
});
