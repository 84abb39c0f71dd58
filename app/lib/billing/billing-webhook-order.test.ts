// Which subscription events change the workspace: order per subscription (not per workspace), ties in
// the same second, ended subscriptions, and the prices that open the plan. Hand-made events signed
// as Stripe signs them, against the real MariaDB (the Stripe stand-in only supplies the environment).
import { describe, expect, test } from "vitest";
import Stripe from "stripe";
import { useBillingStandIn, ws, subscriptionEvent, deliver, customerWorkspace, subId } from "./test-kit";

useBillingStandIn();

const T0 = Math.floor(Date.now() / 1000) - 3600;

/** A completed Checkout Session in payment mode (a one-off purchase): no subscription. */
const paymentCheckout = (customer: string, created: number) => ({
  id: `evt_unit_pay_${created}_${Math.random().toString(36).slice(2)}`,
  object: "event",
  api_version: Stripe.API_VERSION,
  created,
  type: "checkout.session.completed",
  livemode: false,
  pending_webhooks: 1,
  request: { id: null, idempotency_key: null },
  data: { object: { id: `cs_test_pay_${created}`, object: "checkout.session", mode: "payment", customer, subscription: null, payment_status: "paid", metadata: {}, client_reference_id: null } },
});

describe("order per subscription — Stripe API docs: event ordering is not guaranteed", () => {
  test("a late cancellation of A is applied although B's (only recorded) event is newer; B then expires: Starter, not Network on a dead subscription", async () => {
    const { admin, customer } = await customerWorkspace();
    const A = subId("A");
    const B = subId("B");
    expect((await deliver(subscriptionEvent("customer.subscription.created", customer, { id: A, status: "active" }, T0))).result).toBe("plan network");
    expect((await deliver(subscriptionEvent("customer.subscription.created", customer, { id: B, status: "incomplete" }, T0 + 20))).result).toMatch(/recorded only/);
    const late = await deliver(subscriptionEvent("customer.subscription.deleted", customer, { id: A, status: "canceled" }, T0 + 10));
    expect(late.result).not.toMatch(/older/);
    expect(late.result).toBe("plan free");
    await deliver(subscriptionEvent("customer.subscription.updated", customer, { id: B, status: "incomplete_expired" }, T0 + 30));
    const w = await ws(admin.workspaceId);
    expect(w.plan).toBe("free");
    expect(["canceled", "incomplete_expired"]).toContain(w.subscriptionStatus);
  });

  test("a one-off (mode=payment) checkout after the subscription's last event does not make a late cancellation 'older'", async () => {
    const { admin, customer } = await customerWorkspace();
    const A = subId("A");
    await deliver(subscriptionEvent("customer.subscription.created", customer, { id: A, status: "active" }, T0));
    expect((await deliver(paymentCheckout(customer, T0 + 20))).result).toBe("not a subscription checkout");
    expect((await deliver(subscriptionEvent("customer.subscription.deleted", customer, { id: A, status: "canceled" }, T0 + 10))).result).toBe("plan free");
    expect((await ws(admin.workspaceId)).plan).toBe("free");
  });

  test("an older event of the same subscription still never undoes a newer one", async () => {
    const { admin, customer } = await customerWorkspace();
    const A = subId("A");
    await deliver(subscriptionEvent("customer.subscription.created", customer, { id: A, status: "active" }, T0));
    await deliver(subscriptionEvent("customer.subscription.updated", customer, { id: A, status: "past_due" }, T0 + 20));
    expect((await deliver(subscriptionEvent("customer.subscription.updated", customer, { id: A, status: "active", cancelAtPeriodEnd: true }, T0 + 10))).result).toMatch(/older/);
    const w = await ws(admin.workspaceId);
    expect(w.subscriptionStatus).toBe("past_due");
    expect(w.cancelAtPeriodEnd).toBe(false);
  });
});

describe("ties and ended subscriptions — Stripe API docs: event.created is whole seconds; canceled and incomplete_expired are terminal", () => {
  test("deleted(T) then updated(active, T) in the same second: the canceled subscription stays canceled", async () => {
    const { admin, customer } = await customerWorkspace();
    const A = subId("A");
    await deliver(subscriptionEvent("customer.subscription.created", customer, { id: A, status: "active" }, T0));
    expect((await deliver(subscriptionEvent("customer.subscription.deleted", customer, { id: A, status: "canceled" }, T0 + 50))).result).toBe("plan free");
    const r = await deliver(subscriptionEvent("customer.subscription.updated", customer, { id: A, status: "active" }, T0 + 50));
    expect(r.result).toMatch(/has ended/);
    const w = await ws(admin.workspaceId);
    expect(w.plan).toBe("free");
    expect(w.subscriptionStatus).toBe("canceled");
  });

  test("a canceled subscription is never reopened, even by an event stamped later", async () => {
    const { admin, customer } = await customerWorkspace();
    const A = subId("A");
    await deliver(subscriptionEvent("customer.subscription.deleted", customer, { id: A, status: "canceled" }, T0));
    expect((await deliver(subscriptionEvent("customer.subscription.updated", customer, { id: A, status: "active" }, T0 + 5))).result).toMatch(/has ended/);
    expect((await ws(admin.workspaceId)).plan).toBe("free");
  });

  test("incomplete_expired is final for its subscription too", async () => {
    const { admin, customer } = await customerWorkspace();
    const B = subId("B");
    await deliver(subscriptionEvent("customer.subscription.updated", customer, { id: B, status: "incomplete_expired" }, T0));
    expect((await deliver(subscriptionEvent("customer.subscription.updated", customer, { id: B, status: "active" }, T0 + 5))).result).toMatch(/has ended/);
    expect((await ws(admin.workspaceId)).plan).toBe("free");
  });

  test("unpaid(T) then past_due(T) in the same second: the later stage (unpaid) stands — our tie rule, by status rank", async () => {
    const { admin, customer } = await customerWorkspace();
    const A = subId("A");
    await deliver(subscriptionEvent("customer.subscription.created", customer, { id: A, status: "active" }, T0));
    await deliver(subscriptionEvent("customer.subscription.updated", customer, { id: A, status: "unpaid" }, T0 + 40));
    expect((await deliver(subscriptionEvent("customer.subscription.updated", customer, { id: A, status: "past_due" }, T0 + 40))).result).toMatch(/same second/);
    const w = await ws(admin.workspaceId);
    expect(w.subscriptionStatus).toBe("unpaid");
    expect(w.plan).toBe("free");
  });

  test("two updates of the same stage in the same second are applied in arrival order (cancel_at_period_end set, then cleared)", async () => {
    const { admin, customer } = await customerWorkspace();
    const A = subId("A");
    await deliver(subscriptionEvent("customer.subscription.created", customer, { id: A, status: "active" }, T0));
    await deliver(subscriptionEvent("customer.subscription.updated", customer, { id: A, status: "active", cancelAtPeriodEnd: true }, T0 + 40));
    expect((await deliver(subscriptionEvent("customer.subscription.updated", customer, { id: A, status: "active", cancelAtPeriodEnd: false }, T0 + 40))).result).toBe("plan network");
    expect((await ws(admin.workspaceId)).cancelAtPeriodEnd).toBe(false);
  });
});

describe("only the plan's prices open it — our rule: STRIPE_PRICE_ID and STRIPE_PRICE_IDS_HONOURED", () => {
  test("a subscription of the stored customer on another price is recorded, not honoured", async () => {
    const { admin, customer } = await customerWorkspace();
    const r = await deliver(subscriptionEvent("customer.subscription.created", customer, { id: subId("X"), status: "active", price: "price_consulting_retainer" }, T0));
    expect(r.result).toContain("price_consulting_retainer");
    expect(r.result).toMatch(/not a price of the Network plan; recorded only/);
    const w = await ws(admin.workspaceId);
    expect(w.plan).toBe("free");
    expect(w.stripeSubscriptionId).toBeNull();
  });

  test("an older price listed in STRIPE_PRICE_IDS_HONOURED still opens the plan", async () => {
    const { admin, customer } = await customerWorkspace();
    process.env.STRIPE_PRICE_IDS_HONOURED = "price_network_2025, price_network_2024";
    try {
      expect((await deliver(subscriptionEvent("customer.subscription.created", customer, { id: subId("O"), status: "active", price: "price_network_2024" }, T0))).result).toBe("plan network");
    } finally {
      delete process.env.STRIPE_PRICE_IDS_HONOURED;
    }
    expect((await ws(admin.workspaceId)).plan).toBe("network");
  });

  test("the tracked subscription moved to a price not honoured: the plan closes and the workspace stops tracking it", async () => {
    const { admin, customer } = await customerWorkspace();
    const A = subId("A");
    await deliver(subscriptionEvent("customer.subscription.created", customer, { id: A, status: "active" }, T0));
    const r = await deliver(subscriptionEvent("customer.subscription.updated", customer, { id: A, status: "active", price: "price_cheap_test" }, T0 + 10));
    expect(r.result).toMatch(/price_cheap_test/);
    const w = await ws(admin.workspaceId);
    expect(w.plan).toBe("free");
    expect(w.stripeSubscriptionId).toBeNull();
  });
});
