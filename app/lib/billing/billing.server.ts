// Plans and payments. Two plans of our own: Starter (free: own and workspace libraries,
// calculations, projects) and Network (paid: every shared library opens; the gate itself is
// `planOpensShared` in libraries.server.ts). The plan belongs to the workspace.
//
// Stripe through its Node SDK. Configuration only decides where the SDK points and which prices are the plan's:
//   STRIPE_SECRET_KEY, STRIPE_WEBHOOK_SECRET, STRIPE_PRICE_ID (default price_dutymark_network_monthly: what
//   checkout sells), STRIPE_PRICE_IDS_HONOURED (older prices whose subscriptions still open the plan),
//   STRIPE_API_BASE (set → the local stand-in in fixtures/stripe; unset → api.stripe.com).
// Only verified webhooks change a plan (webhook.server.ts); the checkout success redirect never does.
// One subscription per workspace: checkout is refused while the customer has a live one at Stripe.
import Stripe from "stripe";
import { and, eq, sql } from "drizzle-orm";
import { db } from "@db/client.server";
import { workspaces } from "@db/schema";
import type { WorkspaceInfo } from "../auth/guards.server";
import { settings } from "../shared/env.server";
import { OPENS_PLAN, isLive } from "./subscription-states";
import { claimCheckout, releaseCheckout } from "./checkout-claim.server";

export type Plan = WorkspaceInfo["plan"];

export const PLAN_NAMES: Record<Plan, string> = { free: "Starter", network: "Network" };
export const PLAN_SUMMARY: Record<Plan, string> = {
  free: "Your own and workspace libraries, calculations and projects. Shared libraries are listed, locked.",
  network: "Everything in Starter, and every library distributors share with subscribers opens for curves and duty-point search.",
};

export const DEFAULT_PRICE_ID = "price_dutymark_network_monthly";

// ── Configuration and the SDK client ─────────────────────────────────────────────────────────
export type StripeConfig = { secretKey: string; webhookSecret: string; priceId: string; honouredPriceIds: string[]; apiBase: string | null };

export function stripeConfig(env: NodeJS.ProcessEnv = process.env): StripeConfig {
  const s = settings(env).stripe;
  const priceId = s.priceId ?? DEFAULT_PRICE_ID;
  return { ...s, priceId, honouredPriceIds: [...new Set([priceId, ...s.honouredPriceIds])] };
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

/** Checkout refused: the workspace is subscribed, or its customer already has a live subscription at Stripe. */
export class AlreadySubscribed extends Error {}

const PORTAL_HINT = "Fix or change it under “Payment details on Stripe” instead of starting another checkout (a second subscription would be charged as well).";

/** The customer's first subscription at Stripe that is not ended (any status but canceled and incomplete_expired). */
async function liveSubscriptionOf(customer: string): Promise<Stripe.Subscription | null> {
  // Without `status`, Stripe lists every subscription not canceled; the SDK pages through them.
  for await (const sub of stripe().subscriptions.list({ customer, limit: 100 })) if (isLive(sub.status)) return sub;
  return null;
}

/** Expires the customer's open Checkout Sessions, so that no earlier checkout can still be paid. */
async function expireOpenCheckouts(customer: string): Promise<void> {
  for await (const s of stripe().checkout.sessions.list({ customer, status: "open", limit: 100 })) {
    try {
      await stripe().checkout.sessions.expire(s.id);
    } catch (e) {
      // Completed or expired in the meantime: no longer payable. The live-subscription check below sees a completed one.
      if (!(e instanceof Stripe.errors.StripeInvalidRequestError)) throw e;
    }
  }
}

/**
 * A Checkout Session in subscription mode for the Network plan; returns the hosted page's URL. Refused while
 * our row shows a live subscription, or Stripe lists one for the customer (our row may lag: a webhook not
 * landed yet, a subscription made elsewhere). The customer's earlier open sessions are expired first, so two
 * checkouts opened one after the other before paying cannot make two subscriptions. Two admins pressing
 * Upgrade in the same moment do not each get one: the opening is claimed on the workspace's row first
 * (`claimCheckout`), so the second is refused with `CheckoutBeingOpened` until the first's session exists or
 * its call failed (the claim is cleared either way).
 */
export async function startCheckout(ws: { id: number; name: string }, email: string, appUrl: string): Promise<string> {
  const state = await billingState(ws.id);
  if (state.subscriptionId && isLive(state.status)) {
    throw new AlreadySubscribed(
      state.plan === "network" && OPENS_PLAN.has(state.status)
        ? "This workspace is already on the Network plan."
        : `This workspace's subscription at Stripe is ${state.status}. ${PORTAL_HINT}`,
    );
  }
  const mark = await claimCheckout(ws.id);
  try {
    const customer = await ensureCustomer(ws, email);
    await expireOpenCheckouts(customer);
    const live = await liveSubscriptionOf(customer);
    if (live) throw new AlreadySubscribed(`This workspace already has a subscription at Stripe (${live.id}, ${live.status}). ${PORTAL_HINT}`);
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
  } finally {
    await releaseCheckout(ws.id, mark);
  }
}

/** Asks Stripe to end (or keep) the subscription at the close of the period. The webhook records the answer. */
export async function setCancelAtPeriodEnd(workspaceId: number, cancel: boolean) {
  const state = await billingState(workspaceId);
  if (!state.subscriptionId || !state.status || !OPENS_PLAN.has(state.status)) return { ok: false as const, reason: "There is no running subscription to change." };
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

/** Since API 2025-03-31.basil the billing period lives on the subscription item. */
export function periodEndOf(sub: Stripe.Subscription): Date | null {
  const t = sub.items?.data?.[0]?.current_period_end;
  return typeof t === "number" ? new Date(t * 1000) : null;
}
