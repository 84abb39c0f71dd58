// Plans and payments. Two plans of our own: Starter (free: own and workspace libraries,
// calculations, projects) and Network (paid: every shared library opens; the gate itself is
// `planOpensShared` in libraries.server.ts). The plan belongs to the workspace.
//
// Stripe through its Node SDK. Configuration only decides where the SDK points:
//   STRIPE_SECRET_KEY, STRIPE_WEBHOOK_SECRET, STRIPE_PRICE_ID (default price_dutymark_network_monthly),
//   STRIPE_API_BASE (set → the local stand-in in fixtures/stripe; unset → api.stripe.com).
// Only verified webhooks change a plan (handleStripeWebhook); the checkout success redirect never does.
import Stripe from "stripe";
import { and, eq, gt, inArray, sql } from "drizzle-orm";
import { db, withTransaction, type Db } from "@db/client.server";
import { forgetTokens } from "../auth/token-cache.server";
import { stripeEvents, workspaces } from "@db/schema";
import type { WorkspaceInfo } from "../auth/guards.server";
import { settings } from "../shared/env.server";

export type Plan = WorkspaceInfo["plan"];

export const PLAN_NAMES: Record<Plan, string> = { free: "Starter", network: "Network" };
export const PLAN_SUMMARY: Record<Plan, string> = {
  free: "Your own and workspace libraries, calculations and projects. Shared libraries are listed, locked.",
  network: "Everything in Starter, and every library distributors share with subscribers opens for curves and duty-point search.",
};

export const DEFAULT_PRICE_ID = "price_dutymark_network_monthly";

// ── Configuration and the SDK client ─────────────────────────────────────────────────────────
export type StripeConfig = { secretKey: string; webhookSecret: string; priceId: string; apiBase: string | null };

export function stripeConfig(env: NodeJS.ProcessEnv = process.env): StripeConfig {
  const s = settings(env).stripe;
  return { ...s, priceId: s.priceId ?? DEFAULT_PRICE_ID };
}

/** SDK options: with STRIPE_API_BASE the SDK talks to that host (the stand-in); without, the SDK's defaults (Stripe). */
export function sdkOptions(apiBase: string | null): ConstructorParameters<typeof Stripe>[1] {
  const base = { telemetry: false, maxNetworkRetries: 0 } as const;
  if (!apiBase) return { ...base, maxNetworkRetries: 2 };
  const u = new URL(apiBase);
  const protocol = u.protocol === "http:" ? "http" : "https";
  const port = u.port ? Number(u.port) : protocol === "http" ? 80 : 443;
  return { ...base, host: u.hostname, port, protocol };
}

let cached: { key: string; client: Stripe } | null = null;

export class BillingNotConfigured extends Error {}

/** The SDK client for the current configuration (rebuilt when the environment changes, e.g. in tests). */
export function stripe(): Stripe {
  const cfg = stripeConfig();
  if (!cfg.secretKey) throw new BillingNotConfigured("Payments are not set up on this server (STRIPE_SECRET_KEY is missing).");
  const key = `${cfg.secretKey}\n${cfg.apiBase ?? ""}`;
  if (!cached || cached.key !== key) cached = { key, client: new Stripe(cfg.secretKey, sdkOptions(cfg.apiBase)) };
  return cached.client;
}

/** Our words for a failed call to Stripe, for the billing page. Nothing was charged or changed. */
export function billingErrorMessage(e: unknown): string {
  if (e instanceof BillingNotConfigured) return e.message;
  if (e instanceof Stripe.errors.StripeConnectionError || (e instanceof Stripe.errors.StripeAPIError && (e.statusCode ?? 500) >= 500)) {
    return "The payment service could not be reached. Nothing was charged and your plan is unchanged; try again in a few minutes.";
  }
  if (e instanceof Stripe.errors.StripeAuthenticationError) return "The payment service refused this server's key. Nothing was charged; tell whoever runs Dutymark.";
  if (e instanceof Stripe.errors.StripeError) return `The payment service refused the request (${e.message}). Nothing was charged and your plan is unchanged.`;
  throw e;
}

// ── Reading the workspace's billing state ────────────────────────────────────────────────────
export type BillingState = {
  plan: Plan;
  planName: string;
  customerId: string | null;
  subscriptionId: string | null;
  status: string | null;
  currentPeriodEnd: string | null;
  cancelAtPeriodEnd: boolean;
};

export async function billingState(workspaceId: number): Promise<BillingState> {
  const [w] = await db().select().from(workspaces).where(eq(workspaces.id, workspaceId));
  if (!w) throw new Error(`workspace ${workspaceId} is missing`);
  return {
    plan: w.plan,
    planName: PLAN_NAMES[w.plan],
    customerId: w.stripeCustomerId,
    subscriptionId: w.stripeSubscriptionId,
    status: w.subscriptionStatus,
    currentPeriodEnd: w.currentPeriodEnd?.toISOString() ?? null,
    cancelAtPeriodEnd: w.cancelAtPeriodEnd,
  };
}

// ── Checkout, cancellation, portal, invoices (admin actions; none of them changes the plan) ──
/** The workspace's Stripe customer, created once (idempotency key + a guarded UPDATE against two admins at once). */
export async function ensureCustomer(ws: { id: number; name: string }, email: string): Promise<string> {
  const [w] = await db().select({ customerId: workspaces.stripeCustomerId }).from(workspaces).where(eq(workspaces.id, ws.id));
  if (w?.customerId) return w.customerId;
  const customer = await stripe().customers.create(
    { email, name: ws.name, metadata: { workspace_id: String(ws.id) } },
    { idempotencyKey: `dutymark-customer-ws-${ws.id}` },
  );
  await db()
    .update(workspaces)
    .set({ stripeCustomerId: customer.id })
    .where(and(eq(workspaces.id, ws.id), sql`${workspaces.stripeCustomerId} IS NULL`));
  const [after] = await db().select({ customerId: workspaces.stripeCustomerId }).from(workspaces).where(eq(workspaces.id, ws.id));
  return after!.customerId!;
}

export class AlreadySubscribed extends Error {}

/** A Checkout Session in subscription mode for the Network plan; returns the hosted page's URL. */
export async function startCheckout(ws: { id: number; name: string }, email: string, appUrl: string): Promise<string> {
  const state = await billingState(ws.id);
  if (state.plan === "network" && state.status && ACTIVE.has(state.status)) throw new AlreadySubscribed("This workspace is already on the Network plan.");
  const customer = await ensureCustomer(ws, email);
  const session = await stripe().checkout.sessions.create({
    mode: "subscription",
    customer,
    line_items: [{ price: stripeConfig().priceId, quantity: 1 }],
    client_reference_id: String(ws.id),
    metadata: { workspace_id: String(ws.id) },
    subscription_data: { metadata: { workspace_id: String(ws.id) } },
    success_url: `${appUrl}/workspace/billing?checkout=done&session_id={CHECKOUT_SESSION_ID}`,
    cancel_url: `${appUrl}/workspace/billing?checkout=canceled`,
  });
  if (!session.url) throw new Error("Stripe returned a checkout session without a URL");
  return session.url;
}

/** Asks Stripe to end (or keep) the subscription at the close of the period. The webhook records the answer. */
export async function setCancelAtPeriodEnd(workspaceId: number, cancel: boolean) {
  const state = await billingState(workspaceId);
  if (!state.subscriptionId || !state.status || !ACTIVE.has(state.status)) return { ok: false as const, reason: "There is no running subscription to change." };
  const sub = await stripe().subscriptions.update(state.subscriptionId, { cancel_at_period_end: cancel });
  return { ok: true as const, periodEnd: periodEndOf(sub) };
}

export async function portalUrl(workspaceId: number, returnUrl: string): Promise<string | null> {
  const state = await billingState(workspaceId);
  if (!state.customerId) return null;
  const s = await stripe().billingPortal.sessions.create({ customer: state.customerId, return_url: returnUrl });
  return s.url;
}

export type InvoiceRow = { id: string; number: string | null; created: string; amountPaid: number; currency: string; status: string | null; url: string | null };

export async function listInvoices(customerId: string): Promise<InvoiceRow[]> {
  const list = await stripe().invoices.list({ customer: customerId, limit: 24 });
  return list.data.map((i) => ({
    id: i.id ?? "",
    number: i.number ?? null,
    created: new Date(i.created * 1000).toISOString(),
    amountPaid: i.amount_paid,
    currency: i.currency,
    status: i.status ?? null,
    url: i.hosted_invoice_url ?? null,
  }));
}

// ── Webhook ──────────────────────────────────────────────────────────────────────────────────
/** Subscription states that keep the Network plan open (Stripe API docs: Subscriptions, "Subscription statuses"). */
const ACTIVE = new Set(["active", "trialing"]);
/** States that end it. past_due / incomplete leave the plan as it is (Stripe retries the payment). */
const ENDED = new Set(["canceled", "unpaid", "incomplete_expired", "paused"]);

/** Since API 2025-03-31.basil the billing period lives on the subscription item. */
function periodEndOf(sub: Stripe.Subscription): Date | null {
  const t = sub.items?.data?.[0]?.current_period_end;
  return typeof t === "number" ? new Date(t * 1000) : null;
}

const idOf = (x: string | { id: string } | null | undefined): string | null => (x == null ? null : typeof x === "string" ? x : x.id);

function workspaceIdFrom(...candidates: (string | null | undefined)[]): number | null {
  for (const c of candidates) if (c && /^\d{1,15}$/.test(c)) return Number(c);
  return null;
}

export type WebhookOutcome = { status: number; body: Record<string, unknown>; problem?: boolean };

const bad = (detail: string): WebhookOutcome => ({ status: 400, problem: true, body: { type: "about:blank", title: "Bad Request", status: 400, detail } });

const HANDLED = new Set(["checkout.session.completed", "customer.subscription.created", "customer.subscription.updated", "customer.subscription.deleted", "invoice.paid"]);
/** Events that set the subscription's state; an older one of these never overwrites a newer one (Stripe does not guarantee order). */
const STATEFUL = ["checkout.session.completed", "customer.subscription.created", "customer.subscription.updated", "customer.subscription.deleted"];

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
  // Signed is not the same as well-formed: the columns hold ids and types up to 80 characters.
  if (typeof event.id !== "string" || !event.id || event.id.length > 80 || typeof event.type !== "string" || event.type.length > 80 || !Number.isFinite(event.created)) {
    return bad("The event's id, type or created time is missing or too long.");
  }
  const target = await locate(event);
  try {
    // A plan change must reach cached API callers (token-cache.server.ts) once committed.
    return await withTransaction(async (tx) => {
      // Lock order: the workspace row first (serialises events of one workspace), then the event id.
      const [w] = target ? await tx.select().from(workspaces).where(eq(workspaces.id, target.workspaceId)).for("update") : [];
      await tx.insert(stripeEvents).values({ id: event.id, type: event.type, workspaceId: w?.id ?? null, eventCreatedAt: new Date(event.created * 1000) });
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

async function apply(tx: Db, event: Stripe.Event, t: Target, w: typeof workspaces.$inferSelect): Promise<string> {
  if (STATEFUL.includes(event.type)) {
    const [newer] = await tx
      .select({ id: stripeEvents.id })
      .from(stripeEvents)
      .where(and(eq(stripeEvents.workspaceId, w.id), inArray(stripeEvents.type, STATEFUL), gt(stripeEvents.eventCreatedAt, new Date(event.created * 1000))))
      .limit(1);
    if (newer) return "older than an event already applied; recorded only";
  }
  const currentRunning = w.stripeSubscriptionId && w.subscriptionStatus && !ENDED.has(w.subscriptionStatus);
  const isOtherSubscription = (subId: string | null) => Boolean(subId && w.stripeSubscriptionId && subId !== w.stripeSubscriptionId);
  const base = { stripeCustomerId: w.stripeCustomerId ?? t.customerId };

  switch (event.type) {
    case "checkout.session.completed": {
      const s = event.data.object as Stripe.Checkout.Session;
      if (s.mode !== "subscription") return "not a subscription checkout";
      if (isOtherSubscription(t.subscriptionId) && currentRunning) return "another subscription is running; recorded only";
      const paid = s.payment_status === "paid" || s.payment_status === "no_payment_required";
      await tx
        .update(workspaces)
        .set({
          ...base,
          stripeSubscriptionId: t.subscriptionId ?? w.stripeSubscriptionId,
          ...(paid ? { plan: "network" as const, subscriptionStatus: isOtherSubscription(t.subscriptionId) || !w.subscriptionStatus ? "active" : w.subscriptionStatus } : {}),
        })
        .where(eq(workspaces.id, w.id));
      return paid ? "plan network" : "checkout recorded, not paid";
    }
    case "customer.subscription.created":
    case "customer.subscription.updated":
    case "customer.subscription.deleted": {
      const sub = event.data.object as Stripe.Subscription;
      if (isOtherSubscription(sub.id) && currentRunning) return "another subscription is running; recorded only";
      const status = event.type === "customer.subscription.deleted" ? "canceled" : sub.status;
      const plan = ACTIVE.has(status) ? ("network" as const) : ENDED.has(status) ? ("free" as const) : w.plan;
      await tx
        .update(workspaces)
        .set({
          ...base,
          plan,
          stripeSubscriptionId: sub.id,
          subscriptionStatus: status,
          currentPeriodEnd: periodEndOf(sub),
          cancelAtPeriodEnd: status === "canceled" ? false : Boolean(sub.cancel_at_period_end),
        })
        .where(eq(workspaces.id, w.id));
      return `plan ${plan}`;
    }
    case "invoice.paid": {
      // A paid renewal confirms the running subscription; it never opens a plan on its own.
      if (isOtherSubscription(t.subscriptionId)) return "invoice of another subscription; recorded only";
      if (w.subscriptionStatus && ACTIVE.has(w.subscriptionStatus) && w.plan !== "network") {
        await tx.update(workspaces).set({ plan: "network" }).where(eq(workspaces.id, w.id));
        return "plan network";
      }
      if (!w.stripeCustomerId && t.customerId) await tx.update(workspaces).set(base).where(eq(workspaces.id, w.id));
      return "invoice recorded";
    }
  }
  return "ignored";
}
