// The billing page in each subscription state: what the loader gives (real MariaDB, the Stripe stand-in
// moving the subscription through its states) and what the page then says, rendered on the server.
import { describe, expect, test } from "vitest";
import { call, makeMember, type TestMember } from "~/test/harness";
import { renderPage } from "~/test/render-page";
import * as billingRoute from "~/routes/workspace.billing";
import { kit, useBillingStandIn, subscribe, subscriptionIn, waitFor, ws } from "./test-kit";

useBillingStandIn();

async function pageOf(admin: TestMember) {
  const r = await call(billingRoute.loader as never, { path: "/workspace/billing", cookie: admin.cookie });
  expect(r.status).toBe(200);
  const data = r.body as Record<string, unknown>;
  const html = renderPage("/workspace/billing", billingRoute.default, "/workspace/billing", data);
  const text = html.replace(/<[^>]*>/g, "").replace(/&#x27;/g, "'").replace(/&quot;/g, '"').replace(/&amp;/g, "&");
  return { data, text };
}

describe("the billing page follows the subscription's state", () => {
  test("active: renews on the period's end, cancel and payment details offered — our product rule", async () => {
    const admin = await makeMember("admin");
    await subscribe(admin);
    const { data, text } = await pageOf(admin);
    expect(data).toMatchObject({ plan: "network", hasSubscription: true, canUpgrade: false });
    expect(text).toMatch(/Renews on \d{4}-\d{2}-\d{2}\./);
    expect(text).toContain("Cancel at the end of the period");
    expect(text).toContain("Payment details on Stripe");
  });

  test("past_due: says the payment failed, that Stripe is retrying and what happens if it keeps failing; no 'Renews on', no 'granted without a subscription'; the payment details button is there — Stripe API docs: Subscriptions, past_due", async () => {
    const admin = await subscriptionIn("past_due");
    const { data, text } = await pageOf(admin);
    expect(text).not.toContain("granted without a subscription");
    expect(text).toContain("Payment details on Stripe");
    expect(text).not.toContain("Renews on");
    expect(text).toContain("The last payment failed and Stripe is retrying it");
    expect(text).toContain("If every retry fails, Stripe cancels the subscription or marks it unpaid");
    expect(text).toContain("this workspace goes back to Starter");
    expect(data).toMatchObject({ plan: "network", status: "past_due", hasSubscription: true, hasCustomer: true, canUpgrade: false });
  });

  test("incomplete: the first payment is not through; payment details offered, no Upgrade — Stripe API docs: Subscriptions, incomplete (23 hours)", async () => {
    const admin = await subscriptionIn("incomplete");
    const { data, text } = await pageOf(admin);
    expect(data).toMatchObject({ status: "incomplete", hasSubscription: true, canUpgrade: false });
    expect(text).toContain("The first payment has not gone through");
    expect(text).toContain("23 hours");
    expect(text).not.toContain("Renews on");
    expect(text).not.toContain("granted without a subscription");
    expect(text).toContain("Payment details on Stripe");
  });

  for (const status of ["unpaid", "paused"]) {
    test(`${status}: Starter, no Upgrade (the subscription is still there), payment details offered — Stripe API docs: Subscriptions, ${status}`, async () => {
      const admin = await subscriptionIn(status);
      const { data, text } = await pageOf(admin);
      expect(data).toMatchObject({ plan: "free", status, hasSubscription: true, canUpgrade: false });
      expect(text).not.toContain("Upgrade to Network");
      expect(text).toContain("Payment details on Stripe");
      expect(text).toContain(status === "unpaid" ? "Stripe has stopped retrying" : "paused");
    });
  }

  test("canceled: Starter with Upgrade offered again, and the payment details still reachable for past invoices — our product rule", async () => {
    const admin = await makeMember("admin");
    const w = await subscribe(admin);
    await kit.sdk.subscriptions.cancel(w.stripeSubscriptionId!); // immediate: customer.subscription.deleted
    await waitFor(async () => (await ws(admin.workspaceId)).subscriptionStatus === "canceled", "the cancellation");
    const { data, text } = await pageOf(admin);
    expect(data).toMatchObject({ plan: "free", hasSubscription: false, canUpgrade: true });
    expect(text).toContain("Upgrade to Network");
    expect(text).toContain("Payment details on Stripe");
  });
});

