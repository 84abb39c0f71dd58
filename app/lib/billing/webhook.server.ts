// Stripe's signed events → the workspace's plan. Only verified webhooks change a plan; the checkout success
// redirect never does. Each delivery is one transaction: the event's row (its id is the primary key, so a
// replay changes nothing) and the change it makes.
//
// The plan follows the subscription's own events (customer.subscription.created / updated / deleted), which
// carry its status and price. One of them changes the workspace only if, in this order:
//   1. no stored event of the same subscription is newer (Stripe does not guarantee order; `created` is
//      compared per subscription, never with another subscription's or a one-off checkout's events);
//   2. the subscription has not ended: an id seen canceled or incomplete_expired is never reopened;
//   3. no stored event of the same subscription in the same second is at a later stage (stageOf: a tie rule,
//      since `created` is whole seconds);
//   4. an item is on one of the plan's prices (STRIPE_PRICE_ID, STRIPE_PRICE_IDS_HONOURED) — otherwise the
//      event is recorded only, and if it is the workspace's own subscription, the plan closes and the
//      workspace stops tracking it;
//   5. the workspace's own subscription (another id) does not hold it (active, trialing, past_due).
// The order rules compare with the event's payload, not with a fresh read from Stripe: the handler stays one
// database transaction with no network call in it, so Stripe being slow never holds the workspace's lock.
// checkout.session.completed and invoice.paid only store the customer if we had none: neither carries the
// subscription's price, and a subscription checkout is always followed by customer.subscription.created.
import Stripe from "stripe";
import { and, eq, ne } from "drizzle-orm";
import { db, withTransaction, type Db } from "@db/client.server";
import { forgetTokens } from "../auth/token-cache.server";
import { stripeEvents, workspaces } from "@db/schema";
import { periodEndOf, stripeConfig } from "./billing.server";
import { ENDED, HOLDS, planFor, stageOf } from "./subscription-states";

const idOf = (x: string | { id: string } | null | undefined): string | null => (x == null ? null : typeof x === "string" ? x : x.id);

function workspaceIdFrom(...candidates: (string | null | undefined)[]): number | null {
  for (const c of candidates) if (c && /^\d{1,15}$/.test(c)) return Number(c);
  return null;
}

export type WebhookOutcome = { status: number; body: Record<string, unknown>; problem?: boolean };

const bad = (detail: string): WebhookOutcome => ({ status: 400, problem: true, body: { type: "about:blank", title: "Bad Request", status: 400, detail } });

const HANDLED = new Set(["checkout.session.completed", "customer.subscription.created", "customer.subscription.updated", "customer.subscription.deleted", "invoice.paid"]);
const isSubscriptionEvent = (type: string) => type === "customer.subscription.created" || type === "customer.subscription.updated" || type === "customer.subscription.deleted";

/** The status a subscription event states (a deletion is the end: canceled). */
const statusOf = (event: Stripe.Event): string | null =>
  !isSubscriptionEvent(event.type) ? null : event.type === "customer.subscription.deleted" ? "canceled" : String((event.data.object as Stripe.Subscription).status ?? "");

/**
 * Verifies and applies one webhook delivery. The event id is stored in the same transaction as the
 * change, inserted first: a second delivery of the same event hits the primary key and changes nothing.
 */
export async function handleStripeWebhook(rawBody: string, signature: string | null): Promise<WebhookOutcome> {
  const cfg = stripeConfig();
  if (!cfg.webhookSecret) return { status: 503, problem: true, body: { type: "about:blank", title: "Service Unavailable", status: 503, detail: "Webhooks are not set up on this server." } };
  if (!signature) return bad("Missing Stripe-Signature header.");
  let event: Stripe.Event;
  try {
    // Default tolerance 300 s: a signature older than that is refused (Stripe docs: "Prevent replay attacks").
    event = Stripe.webhooks.constructEvent(rawBody, signature, cfg.webhookSecret);
  } catch (e) {
    if (e instanceof Stripe.errors.StripeSignatureVerificationError) return bad(`Signature check failed: ${e.message}`);
    return bad("The body is not a Stripe event.");
  }
  // Signed is not the same as well-formed: the columns hold ids and types up to 80 characters, statuses up to 32.
  const status = statusOf(event);
  if (typeof event.id !== "string" || !event.id || event.id.length > 80 || typeof event.type !== "string" || event.type.length > 80 || !Number.isFinite(event.created) || (status !== null && (!status || status.length > 32))) {
    return bad("The event's id, type, created time or subscription status is missing or too long.");
  }
  const target = await locate(event);
  if (target?.subscriptionId && target.subscriptionId.length > 80) return bad("The event's subscription id is too long.");
  try {
    // A plan change must reach cached API callers (token-cache.server.ts) once committed.
    return await withTransaction(async (tx) => {
      // Lock order: the workspace row first (serialises events of one workspace), then the event id.
      const [w] = target ? await tx.select().from(workspaces).where(eq(workspaces.id, target.workspaceId)).for("update") : [];
      await tx.insert(stripeEvents).values({
        id: event.id,
        type: event.type,
        workspaceId: w?.id ?? null,
        eventCreatedAt: new Date(event.created * 1000),
        subscriptionId: target?.subscriptionId ?? null,
        subscriptionStatus: status,
      });
      if (!HANDLED.has(event.type)) return { status: 200, body: { received: true, result: "ignored", type: event.type } };
      if (!target || !w) return { status: 200, body: { received: true, result: "no workspace for this event" } };
      const result = await apply(tx, event, target, w);
      return { status: 200, body: { received: true, result } };
    }).finally(forgetTokens);
  } catch (e) {
    if (isDuplicateKey(e)) return { status: 200, body: { received: true, result: "already handled" } };
    throw e;
  }
}

function isDuplicateKey(e: unknown): boolean {
  for (let x = e as { errno?: number; code?: string; cause?: unknown } | undefined, i = 0; x && i < 4; x = x.cause as typeof x, i++) {
    if (x.errno === 1062 || x.code === "ER_DUP_ENTRY") return true;
  }
  return false;
}

type Target = { workspaceId: number; subscriptionId: string | null; customerId: string | null };

/** Which workspace an event belongs to: our id in metadata / client_reference_id, else the customer we stored. */
async function locate(event: Stripe.Event): Promise<Target | null> {
  let wsId: number | null = null;
  let customerId: string | null = null;
  let subscriptionId: string | null = null;
  const o = event.data.object as unknown as Record<string, unknown>;
  if (event.type === "checkout.session.completed") {
    const s = event.data.object as Stripe.Checkout.Session;
    wsId = workspaceIdFrom(s.client_reference_id, s.metadata?.workspace_id);
    customerId = idOf(s.customer);
    subscriptionId = idOf(s.subscription);
  } else if (event.type.startsWith("customer.subscription.")) {
    const s = event.data.object as Stripe.Subscription;
    wsId = workspaceIdFrom(s.metadata?.workspace_id);
    customerId = idOf(s.customer);
    subscriptionId = s.id;
  } else if (event.type.startsWith("invoice.")) {
    const inv = event.data.object as Stripe.Invoice;
    customerId = idOf(inv.customer);
    subscriptionId = idOf(inv.parent?.subscription_details?.subscription ?? null);
  } else if (typeof o.customer === "string") {
    customerId = o.customer;
  }
  if (customerId) {
    const [byCustomer] = await db().select({ id: workspaces.id }).from(workspaces).where(eq(workspaces.stripeCustomerId, customerId));
    // The stored customer wins over metadata: metadata is ours, but a customer id cannot be moved between workspaces.
    if (byCustomer) wsId = byCustomer.id;
    else if (wsId != null) {
      const [w] = await db().select({ customerId: workspaces.stripeCustomerId }).from(workspaces).where(eq(workspaces.id, wsId));
      if (!w || (w.customerId && w.customerId !== customerId)) wsId = null;
    }
  }
  if (wsId == null) return null;
  const [exists] = await db().select({ id: workspaces.id }).from(workspaces).where(eq(workspaces.id, wsId));
  return exists ? { workspaceId: wsId, subscriptionId, customerId } : null;
}

type Workspace = typeof workspaces.$inferSelect;

async function apply(tx: Db, event: Stripe.Event, t: Target, w: Workspace): Promise<string> {
  const base = { stripeCustomerId: w.stripeCustomerId ?? t.customerId };
  const storeCustomer = async () => {
    if (!w.stripeCustomerId && t.customerId) await tx.update(workspaces).set(base).where(eq(workspaces.id, w.id));
  };
  switch (event.type) {
    case "checkout.session.completed": {
      const s = event.data.object as Stripe.Checkout.Session;
      if (s.mode !== "subscription") return "not a subscription checkout";
      await storeCustomer();
      return "checkout recorded; the plan follows the subscription's own events";
    }
    case "invoice.paid":
      await storeCustomer();
      return "invoice recorded";
    default:
      return applySubscription(tx, event, w, base);
  }
}

/** Whether an item of the subscription is on one of the plan's prices, and the prices it is on. */
function priceCheck(sub: Stripe.Subscription): { honoured: boolean; prices: string[] } {
  const prices = (sub.items?.data ?? []).map((i) => idOf(i.price)).filter((p): p is string => Boolean(p));
  const allowed = new Set(stripeConfig().honouredPriceIds);
  return { honoured: prices.some((p) => allowed.has(p)), prices };
}

async function applySubscription(tx: Db, event: Stripe.Event, w: Workspace, base: { stripeCustomerId: string | null }): Promise<string> {
  const sub = event.data.object as Stripe.Subscription;
  const status = statusOf(event)!;
  const created = event.created * 1000;
  const own = w.stripeSubscriptionId === sub.id;

  // Rules 1–3: this subscription's stored events (applied or recorded only), never another's.
  const earlier = await tx
    .select({ status: stripeEvents.subscriptionStatus, at: stripeEvents.eventCreatedAt })
    .from(stripeEvents)
    .where(and(eq(stripeEvents.workspaceId, w.id), eq(stripeEvents.subscriptionId, sub.id), ne(stripeEvents.id, event.id)));
  const known = earlier.filter((e): e is { status: string; at: Date } => e.status !== null);
  if (known.some((e) => e.at.getTime() > created)) return `older than an event already stored for ${sub.id}; recorded only`;
  const ended = known.find((e) => ENDED.has(e.status))?.status ?? (own && w.subscriptionStatus && ENDED.has(w.subscriptionStatus) ? w.subscriptionStatus : null);
  if (ended) return `subscription ${sub.id} has ended (${ended}); an ended subscription is never reopened; recorded only`;
  const later = known.find((e) => e.at.getTime() === created && stageOf(e.status) > stageOf(status));
  if (later) return `same second as an event of ${sub.id} at a later stage (${later.status}); recorded only`;

  // Rule 4: only the plan's prices open it.
  const price = priceCheck(sub);
  if (!price.honoured) {
    const what = `price ${price.prices.join(", ") || "(none)"} of ${sub.id} is not a price of the Network plan`;
    console.warn(`[billing] workspace ${w.id}: ${what} (STRIPE_PRICE_ID, STRIPE_PRICE_IDS_HONOURED)${own ? "; plan closed, subscription no longer tracked" : "; recorded only"}`);
    if (!own) return `${what}; recorded only`;
    await tx
      .update(workspaces)
      .set({ ...base, plan: "free", stripeSubscriptionId: null, subscriptionStatus: null, currentPeriodEnd: null, cancelAtPeriodEnd: false })
      .where(eq(workspaces.id, w.id));
    return `${what}; plan free, subscription no longer tracked`;
  }

  // Rule 5: the workspace's own subscription, while it is paid for or being retried, keeps another one out.
  if (!own && w.stripeSubscriptionId && w.subscriptionStatus && HOLDS.has(w.subscriptionStatus)) {
    console.warn(`[billing] workspace ${w.id}: ${event.type} for ${sub.id} (${status}) while ${w.stripeSubscriptionId} is ${w.subscriptionStatus}; recorded only`);
    return "another subscription is running; recorded only";
  }

  const plan = planFor(status, w.plan);
  await tx
    .update(workspaces)
    .set({
      ...base,
      plan,
      stripeSubscriptionId: sub.id,
      subscriptionStatus: status,
      currentPeriodEnd: periodEndOf(sub),
      cancelAtPeriodEnd: ENDED.has(status) ? false : Boolean(sub.cancel_at_period_end),
    })
    .where(eq(workspaces.id, w.id));
  return `plan ${plan}`;
}
