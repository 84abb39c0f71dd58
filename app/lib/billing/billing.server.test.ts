// Plans and payments against the real MariaDB, the real stripe SDK and the local Stripe stand-in
// (fixtures/stripe, in-process on a random port). The stand-in's webhooks are POSTed to a small
// HTTP receiver that hands them, byte for byte, to our webhook route's action.
import { createServer } from "node:http";
import { describe, expect, test } from "vitest";
import Stripe from "stripe";
import { call, makeMember } from "~/test/harness";
import * as billingRoute from "~/routes/workspace.billing";
import { DEFAULT_PRICE_ID, sdkOptions, stripeConfig } from "./billing.server";
import { kit, useBillingStandIn, ws, eventsOf, pay, waitFor, upgrade, subscribe } from "./test-kit";

useBillingStandIn();

describe("configuration", () => {
  test("with STRIPE_API_BASE the SDK points at that host; without it, at the SDK's own default (Stripe) — our design rule", () => {
    expect(sdkOptions("http://127.0.0.1:12211")).toMatchObject({ host: "127.0.0.1", port: 12211, protocol: "http", telemetry: false, maxNetworkRetries: 0 });
    const live = sdkOptions(null) as Record<string, unknown>;
    expect(live.host).toBeUndefined();
    expect(live.port).toBeUndefined();
    expect(live.protocol).toBeUndefined();
    expect(stripeConfig({}).priceId).toBe(DEFAULT_PRICE_ID);
    expect(stripeConfig({}).apiBase).toBeNull();
  });
});

describe("checkout → webhook → plan", () => {
  test("paying on the stand-in's checkout opens the Network plan through the verified webhooks — Stripe API docs: Checkout, fulfil on checkout.session.completed", async () => {
    const admin = await makeMember("admin");
    expect((await ws(admin.workspaceId)).plan).toBe("free");
    const w = await subscribe(admin);
    expect(w.stripeCustomerId).toMatch(/^cus_/);
    expect(w.subscriptionStatus).toBe("active");
    // The stand-in puts a 30-day period on the subscription item (fixtures/stripe/README.md).
    expect(w.currentPeriodEnd!.getTime()).toBeGreaterThan(Date.now() + 29 * 86400_000);
    const types = (await eventsOf(admin.workspaceId)).map((e) => e.type).sort();
    expect(types).toEqual(["checkout.session.completed", "customer.subscription.created", "invoice.paid"]);
    // The customer carries our workspace id (our rule: events map back to the workspace).
    const customer = (await kit.sdk.customers.retrieve(w.stripeCustomerId!)) as Stripe.Customer;
    expect(customer.metadata.workspace_id).toBe(String(admin.workspaceId));
  });

  test("the success redirect alone never changes the plan; the webhook does — our product rule", async () => {
    const admin = await makeMember("admin");
    const url = await upgrade(admin);
    kit.receiver.state.paused = true; // our endpoint is down: Stripe's deliveries fail for now
    const res = await pay(url, "4242424242424242");
    expect(res.status).toBe(303);
    const success = res.headers.get("location")!;
    expect(success).toContain("/workspace/billing?checkout=done&session_id=cs_test_");
    const page = await call(billingRoute.loader as never, { path: new URL(success).pathname + new URL(success).search, cookie: admin.cookie });
    expect(page.status).toBe(200);
    expect(page.body).toMatchObject({ plan: "free", planName: "Starter", checkout: "done" });
    expect((await ws(admin.workspaceId)).plan).toBe("free");
    kit.receiver.state.paused = false; // back up: the stand-in's retries land (here after 0.4, 0.8, 1.6, 3.2 s)
    await waitFor(async () => (await ws(admin.workspaceId)).plan === "network", "the retried webhook", 160);
    const again = await call(billingRoute.loader as never, { path: "/workspace/billing?checkout=done", cookie: admin.cookie });
    expect(again.body).toMatchObject({ plan: "network", planName: "Network" });
  });

  test("a declined card leaves the plan and the event log unchanged — Stripe docs: test card 4000 0000 0000 0002 (generic decline)", async () => {
    const admin = await makeMember("admin");
    const url = await upgrade(admin);
    const res = await pay(url, "4000 0000 0000 0002");
    expect(res.status).toBe(402);
    expect(await res.text()).toContain("Your card was declined.");
    const w = await ws(admin.workspaceId);
    expect(w.plan).toBe("free");
    expect(w.stripeSubscriptionId).toBeNull();
    expect(await eventsOf(admin.workspaceId)).toHaveLength(0);
  });

  test("cancel at period end keeps Network until the period ends, then Starter — Stripe API docs: cancel_at_period_end, customer.subscription.deleted", async () => {
    const admin = await makeMember("admin");
    const w = await subscribe(admin);
    const r = await call(billingRoute.action as never, { path: "/workspace/billing", cookie: admin.cookie, form: { intent: "cancel", pageWorkspaceId: String(admin.workspaceId) } });
    expect(r.status).toBe(200);
    expect((r.body as { notice: string }).notice).toContain("ends on");
    await waitFor(async () => (await ws(admin.workspaceId)).cancelAtPeriodEnd, "cancel_at_period_end from the webhook");
    expect((await ws(admin.workspaceId)).plan).toBe("network");
    const page = await call(billingRoute.loader as never, { path: "/workspace/billing", cookie: admin.cookie });
    expect(page.body).toMatchObject({ plan: "network", cancelAtPeriodEnd: true });
    const adv = await fetch(`${kit.standIn.url}/_test/advance?subscription=${w.stripeSubscriptionId}`, { method: "POST" });
    expect(adv.status).toBe(200);
    const after = await waitFor(async () => {
      const x = await ws(admin.workspaceId);
      return x.plan === "free" ? x : null;
    }, "the plan back to Starter");
    expect(after.subscriptionStatus).toBe("canceled");
    expect(after.cancelAtPeriodEnd).toBe(false);
  });

  test("admins see invoices from Stripe; other roles see the plan without controls or invoices — our product rule", async () => {
    const admin = await makeMember("admin");
    await subscribe(admin);
    const page = await call(billingRoute.loader as never, { path: "/workspace/billing", cookie: admin.cookie });
    const body = page.body as { manage: boolean; invoices: { amountPaid: number; currency: string; status: string }[] };
    expect(body.manage).toBe(true);
    // The stand-in's one price: €49.00 a month (fixtures/stripe/README.md).
    expect(body.invoices).toHaveLength(1);
    expect(body.invoices[0]).toMatchObject({ amountPaid: 4900, currency: "eur", status: "paid" });

    const engineer = await makeMember("engineer", admin.workspaceId);
    const seen = await call(billingRoute.loader as never, { path: "/workspace/billing", cookie: engineer.cookie });
    expect(seen.status).toBe(200);
    expect(seen.body).toMatchObject({ plan: "network", manage: false, invoices: [] });
    for (const intent of ["upgrade", "cancel", "portal"]) {
      const r = await call(billingRoute.action as never, { path: "/workspace/billing", cookie: engineer.cookie, form: { intent } });
      expect(r.status).toBe(403);
    }
    expect((await ws(admin.workspaceId)).cancelAtPeriodEnd).toBe(false);
  });

  test("the billing portal session opens for the workspace's own customer — Stripe API docs: billing_portal.sessions.create", async () => {
    const admin = await makeMember("admin");
    const w = await subscribe(admin);
    const r = await call(billingRoute.action as never, { path: "/workspace/billing", cookie: admin.cookie, form: { intent: "portal", pageWorkspaceId: String(admin.workspaceId) } });
    expect(r.status).toBe(302);
    expect(r.location).toMatch(new RegExp(`^${kit.standIn.url}/portal/bps_`));
    const html = await (await fetch(r.location!)).text();
    expect(html).toContain(w.stripeSubscriptionId!);
  });

  test("Stripe unreachable at checkout: a clear message, no redirect, no plan change — common practice (fail closed, say so)", async () => {
    const admin = await makeMember("admin");
    const dead = createServer();
    await new Promise<void>((r) => dead.listen(0, "127.0.0.1", () => r()));
    const port = (dead.address() as { port: number }).port;
    await new Promise<void>((r) => dead.close(() => r()));
    process.env.STRIPE_API_BASE = `http://127.0.0.1:${port}`;
    try {
      const r = await call(billingRoute.action as never, { path: "/workspace/billing", cookie: admin.cookie, form: { intent: "upgrade", pageWorkspaceId: String(admin.workspaceId) } });
      expect(r.status).toBe(502);
      expect(r.location).toBeNull();
      expect((r.body as { errors: { _form: string } }).errors._form).toContain("could not be reached");
    } finally {
      process.env.STRIPE_API_BASE = kit.standIn.url;
    }
    expect((await ws(admin.workspaceId)).plan).toBe("free");
  });
});
