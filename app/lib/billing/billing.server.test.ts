// Plans and payments against the real MariaDB, the real stripe SDK and the local Stripe stand-in
// (fixtures/stripe, in-process on a random port). The stand-in's webhooks are POSTed to a small
// HTTP receiver that hands them, byte for byte, to our webhook route's action.
import { createServer, type Server } from "node:http";
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, beforeEach, describe, expect, test } from "vitest";
import Stripe from "stripe";
import { eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { stripeEvents, workspaces } from "@db/schema";
import { startStripeStandIn, type StandIn } from "../../../fixtures/stripe/server";
import { call, makeMember, type TestMember } from "~/test/harness";
import * as billingRoute from "~/routes/workspace.billing";
import * as webhookRoute from "~/routes/api.stripe.webhook";
import { DEFAULT_PRICE_ID, handleStripeWebhook, sdkOptions, stripeConfig } from "./billing.server";

const SECRET_KEY = "sk_test_dutymark_unit_0001";
const WEBHOOK_SECRET = "whsec_dutymark_unit_0123456789abcdef";
const SAVED_ENV = { key: process.env.STRIPE_SECRET_KEY, secret: process.env.STRIPE_WEBHOOK_SECRET, base: process.env.STRIPE_API_BASE, price: process.env.STRIPE_PRICE_ID };

type Delivery = { raw: string; signature: string; type: string; id: string; status: number; body: unknown };

/** Forwards each POST to the webhook route; `pause` answers 503 without forwarding (an outage on our side). */
function startReceiver() {
  const deliveries: Delivery[] = [];
  const state = { paused: false };
  const server: Server = createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on("data", (c: Buffer) => chunks.push(c));
    req.on("end", async () => {
      const raw = Buffer.concat(chunks).toString("utf8");
      if (state.paused) {
        res.writeHead(503).end("paused");
        return;
      }
      const headers = new Headers();
      for (const [k, v] of Object.entries(req.headers)) if (typeof v === "string") headers.set(k, v);
      const r = await call(webhookRoute.action as never, { path: "/api/stripe/webhook", method: "POST", headers: Object.fromEntries(headers), body: raw });
      const parsed = JSON.parse(raw);
      deliveries.push({ raw, signature: headers.get("stripe-signature") ?? "", type: parsed.type, id: parsed.id, status: r.status, body: r.body });
      res.writeHead(r.status, { "content-type": "application/json" }).end(JSON.stringify(r.body));
    });
  });
  return new Promise<{ url: string; deliveries: Delivery[]; state: typeof state; close(): Promise<void> }>((resolve) => {
    server.listen(0, "127.0.0.1", () => {
      const port = (server.address() as { port: number }).port;
      resolve({ url: `http://127.0.0.1:${port}/api/stripe/webhook`, deliveries, state, close: () => new Promise((r) => server.close(() => r())) });
    });
  });
}

let standIn: StandIn;
let receiver: Awaited<ReturnType<typeof startReceiver>>;
let dataDir: string;
let sdk: Stripe;

beforeAll(async () => {
  dataDir = mkdtempSync(path.join(tmpdir(), "dutymark-billing-"));
  receiver = await startReceiver();
  standIn = await startStripeStandIn({ port: 0, webhookUrl: receiver.url, webhookSecret: WEBHOOK_SECRET, secretKey: SECRET_KEY, dataDir, retryDelaysMs: [400, 800, 1600, 3200], quiet: true });
  process.env.STRIPE_SECRET_KEY = SECRET_KEY;
  process.env.STRIPE_WEBHOOK_SECRET = WEBHOOK_SECRET;
  process.env.STRIPE_API_BASE = standIn.url;
  delete process.env.STRIPE_PRICE_ID;
  sdk = new Stripe(SECRET_KEY, sdkOptions(standIn.url));
});

afterAll(async () => {
  await standIn?.close();
  await receiver?.close();
  rmSync(dataDir, { recursive: true, force: true });
  for (const [k, v] of [["STRIPE_SECRET_KEY", SAVED_ENV.key], ["STRIPE_WEBHOOK_SECRET", SAVED_ENV.secret], ["STRIPE_API_BASE", SAVED_ENV.base], ["STRIPE_PRICE_ID", SAVED_ENV.price]] as const) {
    if (v === undefined) delete process.env[k];
    else process.env[k] = v;
  }
  await closeDb();
});

beforeEach(() => {
  receiver.state.paused = false;
});

const ws = async (id: number) => (await db().select().from(workspaces).where(eq(workspaces.id, id)))[0];
const eventsOf = async (workspaceId: number) => db().select().from(stripeEvents).where(eq(stripeEvents.workspaceId, workspaceId));
const pay = (url: string, card: string) => fetch(url, { method: "POST", body: new URLSearchParams({ card_number: card }), redirect: "manual" });

async function waitFor<T>(fn: () => Promise<T | undefined | false | null>, what: string, tries = 100): Promise<T> {
  for (let i = 0; i < tries; i++) {
    const v = await fn();
    if (v) return v;
    await new Promise((r) => setTimeout(r, 50));
  }
  throw new Error(`gave up waiting for ${what}`);
}

/** Admin presses "Upgrade": our action answers with a redirect to the stand-in's checkout page. */
async function upgrade(admin: TestMember) {
  const r = await call(billingRoute.action as never, { path: "/workspace/billing", cookie: admin.cookie, form: { intent: "upgrade" } });
  expect(r.status).toBe(302);
  expect(r.location).toMatch(new RegExp(`^${standIn.url}/pay/cs_test_`));
  return r.location!;
}

async function subscribe(admin: TestMember) {
  const url = await upgrade(admin);
  const res = await pay(url, "4242 4242 4242 4242");
  expect(res.status).toBe(303);
  return waitFor(async () => {
    const w = await ws(admin.workspaceId);
    return w.plan === "network" && w.stripeSubscriptionId ? w : null;
  }, "the Network plan");
}

/** A hand-made event, signed the way Stripe signs (stripe-node's generateTestHeaderString). */
function signed(event: Record<string, unknown>, opts: { secret?: string; timestamp?: number } = {}) {
  const raw = JSON.stringify(event, null, 2);
  const signature = Stripe.webhooks.generateTestHeaderString({ payload: raw, secret: opts.secret ?? WEBHOOK_SECRET, timestamp: opts.timestamp ?? Math.floor(Date.now() / 1000) });
  return { raw, signature };
}

let seq = 0;
function subscriptionEvent(type: string, customer: string, sub: { id?: string; status: string; cancelAtPeriodEnd?: boolean; periodEnd?: number; workspaceId?: number }, created = Math.floor(Date.now() / 1000)) {
  return {
    id: `evt_unit_${Date.now().toString(36)}_${seq++}`,
    object: "event",
    api_version: Stripe.API_VERSION,
    created,
    type,
    livemode: false,
    pending_webhooks: 1,
    request: { id: null, idempotency_key: null },
    data: {
      object: {
        id: sub.id ?? `sub_unit_${seq}`,
        object: "subscription",
        customer,
        status: sub.status,
        cancel_at_period_end: sub.cancelAtPeriodEnd ?? false,
        metadata: sub.workspaceId ? { workspace_id: String(sub.workspaceId) } : {},
        items: { object: "list", data: [{ id: "si_unit", object: "subscription_item", current_period_start: created, current_period_end: sub.periodEnd ?? created + 30 * 86400 }] },
      },
    },
  };
}

const post = (raw: string, signature?: string) =>
  call(webhookRoute.action as never, { path: "/api/stripe/webhook", method: "POST", headers: signature ? { "stripe-signature": signature, "content-type": "application/json" } : { "content-type": "application/json" }, body: raw });

/** A free workspace with a customer id of its own, for hand-made events. */
async function customerWorkspace() {
  const admin = await makeMember("admin");
  const customer = `cus_unit_${Date.now().toString(36)}${seq++}`;
  await db().update(workspaces).set({ stripeCustomerId: customer }).where(eq(workspaces.id, admin.workspaceId));
  return { admin, customer };
}

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
    const customer = (await sdk.customers.retrieve(w.stripeCustomerId!)) as Stripe.Customer;
    expect(customer.metadata.workspace_id).toBe(String(admin.workspaceId));
  });

  test("the success redirect alone never changes the plan; the webhook does — our product rule", async () => {
    const admin = await makeMember("admin");
    const url = await upgrade(admin);
    receiver.state.paused = true; // our endpoint is down: Stripe's deliveries fail for now
    const res = await pay(url, "4242424242424242");
    expect(res.status).toBe(303);
    const success = res.headers.get("location")!;
    expect(success).toContain("/workspace/billing?checkout=done&session_id=cs_test_");
    const page = await call(billingRoute.loader as never, { path: new URL(success).pathname + new URL(success).search, cookie: admin.cookie });
    expect(page.status).toBe(200);
    expect(page.body).toMatchObject({ plan: "free", planName: "Starter", checkout: "done" });
    expect((await ws(admin.workspaceId)).plan).toBe("free");
    receiver.state.paused = false; // back up: the stand-in's retries land (here after 0.4, 0.8, 1.6, 3.2 s)
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
    const r = await call(billingRoute.action as never, { path: "/workspace/billing", cookie: admin.cookie, form: { intent: "cancel" } });
    expect(r.status).toBe(200);
    expect((r.body as { notice: string }).notice).toContain("ends on");
    await waitFor(async () => (await ws(admin.workspaceId)).cancelAtPeriodEnd, "cancel_at_period_end from the webhook");
    expect((await ws(admin.workspaceId)).plan).toBe("network");
    const page = await call(billingRoute.loader as never, { path: "/workspace/billing", cookie: admin.cookie });
    expect(page.body).toMatchObject({ plan: "network", cancelAtPeriodEnd: true });
    const adv = await fetch(`${standIn.url}/_test/advance?subscription=${w.stripeSubscriptionId}`, { method: "POST" });
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
    const r = await call(billingRoute.action as never, { path: "/workspace/billing", cookie: admin.cookie, form: { intent: "portal" } });
    expect(r.status).toBe(302);
    expect(r.location).toMatch(new RegExp(`^${standIn.url}/portal/bps_`));
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
      const r = await call(billingRoute.action as never, { path: "/workspace/billing", cookie: admin.cookie, form: { intent: "upgrade" } });
      expect(r.status).toBe(502);
      expect(r.location).toBeNull();
      expect((r.body as { errors: { _form: string } }).errors._form).toContain("could not be reached");
    } finally {
      process.env.STRIPE_API_BASE = standIn.url;
    }
    expect((await ws(admin.workspaceId)).plan).toBe("free");
  });
});

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
    const first = receiver.deliveries.find((d) => d.type === "customer.subscription.created" && (d.body as { result?: string }).result === "plan network" && JSON.parse(d.raw).data.object.metadata.workspace_id === String(other.workspaceId))!;
    const before = receiver.deliveries.length;
    const res = await fetch(`${standIn.url}/_test/resend/${first.id}?t=${old}`, { method: "POST" });
    expect(res.status).toBe(200);
    const resent = receiver.deliveries.slice(before).find((d) => d.id === first.id)!;
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
    const created = receiver.deliveries.find((d) => d.type === "customer.subscription.created" && JSON.parse(d.raw).data.object.id === w.stripeSubscriptionId)!;
    // Cancel and let the period end: Starter again.
    await db().update(workspaces).set({ plan: "free", subscriptionStatus: "canceled" }).where(eq(workspaces.id, admin.workspaceId));
    const before = receiver.deliveries.length;
    const res = await fetch(`${standIn.url}/_test/resend/${created.id}`, { method: "POST" });
    expect(res.status).toBe(200);
    const resent = receiver.deliveries.slice(before).find((d) => d.id === created.id)!;
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
