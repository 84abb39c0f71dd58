// Shared by the billing tests: the Stripe stand-in (fixtures/stripe) with a webhook receiver that
// forwards to our route, and helpers to subscribe, sign hand-made events and read the results.
import { createServer, type Server } from "node:http";
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, beforeEach, expect } from "vitest";
import Stripe from "stripe";
import { eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { stripeEvents, workspaces } from "@db/schema";
import { startStripeStandIn, type StandIn } from "../../../fixtures/stripe/server";
import { call, makeMember, type TestMember } from "~/test/harness";
import * as billingRoute from "~/routes/workspace.billing";
import * as webhookRoute from "~/routes/api.stripe.webhook";
import { DEFAULT_PRICE_ID, sdkOptions } from "./billing.server";

export const SECRET_KEY = "sk_test_dutymark_unit_0001";
export const WEBHOOK_SECRET = "whsec_dutymark_unit_0123456789abcdef";
const SAVED_ENV = {
  key: process.env.STRIPE_SECRET_KEY,
  secret: process.env.STRIPE_WEBHOOK_SECRET,
  base: process.env.STRIPE_API_BASE,
  price: process.env.STRIPE_PRICE_ID,
  honoured: process.env.STRIPE_PRICE_IDS_HONOURED,
};

export type Delivery = { raw: string; signature: string; type: string; id: string; status: number; body: unknown };

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

/** The running stand-ins, filled by useBillingStandIn()'s beforeAll. */
export const kit = {} as { standIn: StandIn; receiver: Awaited<ReturnType<typeof startReceiver>>; sdk: Stripe; dataDir: string };

/** Starts the Stripe stand-in and a webhook receiver for one test file, and restores the environment after. */
export function useBillingStandIn() {
  beforeAll(async () => {
    kit.dataDir = mkdtempSync(path.join(tmpdir(), "dutymark-billing-"));
    kit.receiver = await startReceiver();
    kit.standIn = await startStripeStandIn({
      port: 0,
      webhookUrl: kit.receiver.url,
      webhookSecret: WEBHOOK_SECRET,
      secretKey: SECRET_KEY,
      dataDir: kit.dataDir,
      retryDelaysMs: [400, 800, 1600, 3200],
      quiet: true,
    });
    process.env.STRIPE_SECRET_KEY = SECRET_KEY;
    process.env.STRIPE_WEBHOOK_SECRET = WEBHOOK_SECRET;
    process.env.STRIPE_API_BASE = kit.standIn.url;
    delete process.env.STRIPE_PRICE_ID;
    delete process.env.STRIPE_PRICE_IDS_HONOURED;
    kit.sdk = new Stripe(SECRET_KEY, sdkOptions(kit.standIn.url));
  });

  afterAll(async () => {
    await kit.standIn?.close();
    await kit.receiver?.close();
    rmSync(kit.dataDir, { recursive: true, force: true });
    for (const [k, v] of [
      ["STRIPE_SECRET_KEY", SAVED_ENV.key],
      ["STRIPE_WEBHOOK_SECRET", SAVED_ENV.secret],
      ["STRIPE_API_BASE", SAVED_ENV.base],
      ["STRIPE_PRICE_ID", SAVED_ENV.price],
      ["STRIPE_PRICE_IDS_HONOURED", SAVED_ENV.honoured],
    ] as const) {
      if (v === undefined) delete process.env[k];
      else process.env[k] = v;
    }
    await closeDb();
  });

  beforeEach(() => {
    kit.receiver.state.paused = false;
  });
}

export const ws = async (id: number) => (await db().select().from(workspaces).where(eq(workspaces.id, id)))[0];
export const eventsOf = async (workspaceId: number) => db().select().from(stripeEvents).where(eq(stripeEvents.workspaceId, workspaceId));
export const pay = (url: string, card: string) => fetch(url, { method: "POST", body: new URLSearchParams({ card_number: card }), redirect: "manual" });

export async function waitFor<T>(fn: () => Promise<T | undefined | false | null>, what: string, tries = 100): Promise<T> {
  for (let i = 0; i < tries; i++) {
    const v = await fn();
    if (v) return v;
    await new Promise((r) => setTimeout(r, 50));
  }
  throw new Error(`gave up waiting for ${what}`);
}

/** Admin presses "Upgrade": our action answers with a redirect to the stand-in's checkout page. */
export async function upgrade(admin: TestMember) {
  const r = await call(billingRoute.action as never, { path: "/workspace/billing", cookie: admin.cookie, form: { intent: "upgrade", pageWorkspaceId: String(admin.workspaceId) } });
  expect(r.status).toBe(302);
  expect(r.location).toMatch(new RegExp(`^${kit.standIn.url}/pay/cs_test_`));
  return r.location!;
}

export async function subscribe(admin: TestMember) {
  const url = await upgrade(admin);
  const res = await pay(url, "4242 4242 4242 4242");
  expect(res.status).toBe(303);
  return waitFor(async () => {
    const w = await ws(admin.workspaceId);
    return w.plan === "network" && w.stripeSubscriptionId ? w : null;
  }, "the Network plan");
}

/** A hand-made event, signed the way Stripe signs (stripe-node's generateTestHeaderString). */
export function signed(event: Record<string, unknown>, opts: { secret?: string; timestamp?: number } = {}) {
  const raw = JSON.stringify(event, null, 2);
  const signature = Stripe.webhooks.generateTestHeaderString({
    payload: raw,
    secret: opts.secret ?? WEBHOOK_SECRET,
    timestamp: opts.timestamp ?? Math.floor(Date.now() / 1000),
  });
  return { raw, signature };
}

/** Stripe moves a stand-in subscription to another state (fixtures/stripe/README.md: /_test/status); its webhook lands before this returns. */
export async function setStatus(subscriptionId: string, status: string) {
  const r = await fetch(`${kit.standIn.url}/_test/status?subscription=${subscriptionId}&status=${status}`, { method: "POST" });
  expect(r.status).toBe(200);
}

const RUN = Date.now().toString(36);
let seq = 0;
/** A subscription id of this run (ids are looked up per workspace, but a run never reuses one). */
export const subId = (name: string) => `sub_unit_${RUN}_${name}_${seq++}`;

/** A hand-made subscription event; its one item is on the configured price unless `price` says otherwise. */
export function subscriptionEvent(
  type: string,
  customer: string,
  sub: { id?: string; status: string; cancelAtPeriodEnd?: boolean; periodEnd?: number; workspaceId?: number; price?: string },
  created = Math.floor(Date.now() / 1000),
) {
  return {
    id: `evt_unit_${RUN}_${seq++}`,
    object: "event",
    api_version: Stripe.API_VERSION,
    created,
    type,
    livemode: false,
    pending_webhooks: 1,
    request: { id: null, idempotency_key: null },
    data: {
      object: {
        id: sub.id ?? `sub_unit_${RUN}_${seq}`,
        object: "subscription",
        customer,
        status: sub.status,
        cancel_at_period_end: sub.cancelAtPeriodEnd ?? false,
        metadata: sub.workspaceId ? { workspace_id: String(sub.workspaceId) } : {},
        items: {
          object: "list",
          data: [
            {
              id: "si_unit",
              object: "subscription_item",
              price: { id: sub.price ?? DEFAULT_PRICE_ID, object: "price" },
              current_period_start: created,
              current_period_end: sub.periodEnd ?? created + 30 * 86400,
            },
          ],
        },
      },
    },
  };
}

export const post = (raw: string, signature?: string) =>
  call(webhookRoute.action as never, {
    path: "/api/stripe/webhook",
    method: "POST",
    headers: signature ? { "stripe-signature": signature, "content-type": "application/json" } : { "content-type": "application/json" },
    body: raw,
  });

/** A free workspace with a customer id of its own, for hand-made events. */
export async function customerWorkspace() {
  const admin = await makeMember("admin");
  const customer = `cus_unit_${Date.now().toString(36)}${seq++}`;
  await db().update(workspaces).set({ stripeCustomerId: customer }).where(eq(workspaces.id, admin.workspaceId));
  return { admin, customer };
}

/** Signs and posts a hand-made event; returns the route's answer. */
export async function deliver(event: Record<string, unknown>) {
  const { raw, signature } = signed(event);
  const r = await post(raw, signature);
  expect(r.status).toBe(200);
  return r.body as { received: boolean; result: string };
}

/**
 * A workspace whose subscription is in `status`: through the stand-in (subscribe, then Stripe moves it), or
 * for `incomplete` — only ever a new subscription's first state — a signed customer.subscription.created.
 */
export async function subscriptionIn(status: string) {
  if (status === "incomplete") {
    const { admin, customer } = await customerWorkspace();
    expect((await deliver(subscriptionEvent("customer.subscription.created", customer, { id: subId("I"), status }))).result).toBe("plan free");
    return admin;
  }
  const admin = await makeMember("admin");
  const w = await subscribe(admin);
  await setStatus(w.stripeSubscriptionId!, status);
  await waitFor(async () => (await ws(admin.workspaceId)).subscriptionStatus === status, `status ${status} from the webhook`);
  return admin;
}
