// The paid plan's price, read from Stripe (prices.retrieve on STRIPE_PRICE_ID) so the billing page
// shows what checkout will charge before the admin goes there. A price that cannot be read (payments
// not set up, Stripe unreachable or refusing, a price without a fixed amount) is not guessed: the page
// says the price is shown at checkout. A good answer is kept 10 minutes per process and configuration.
import Stripe from "stripe";
import { BillingNotConfigured, stripe, stripeConfig } from "./billing.server";
import { fmtMoney } from "../shared/format";

export type PlanPrice = { amountCents: number; currency: string; interval: string; intervalCount: number; text: string };

const KEEP_MS = 10 * 60_000;
let kept: { key: string; at: number; price: PlanPrice } | null = null;

/** "49.00 EUR per month", "120.00 EUR every 3 months", "490.00 EUR once", "4,900 JPY per month" (amounts in Stripe's minor unit of the currency: shared/money.ts). */
export function priceText(amountMinor: number, currency: string, interval: string | null, intervalCount = 1): string {
  const amount = fmtMoney(amountMinor, currency);
  if (!interval) return `${amount} once`;
  return intervalCount === 1 ? `${amount} per ${interval}` : `${amount} every ${intervalCount} ${interval}s`;
}

/** The paid plan's price, or null when it cannot be read now (the page then says it is shown at checkout). */
export async function paidPlanPrice(): Promise<PlanPrice | null> {
  const cfg = stripeConfig();
  const key = `${cfg.apiBase ?? ""}\n${cfg.secretKey}\n${cfg.priceId}`;
  if (kept && kept.key === key && Date.now() - kept.at < KEEP_MS) return kept.price;
  let p: Stripe.Price;
  try {
    p = await stripe().prices.retrieve(cfg.priceId);
  } catch (e) {
    if (e instanceof BillingNotConfigured || e instanceof Stripe.errors.StripeError) return null;
    throw e;
  }
  if (p.unit_amount == null || !p.currency) return null; // tiered or customer-chosen amounts: only checkout knows
  const interval = p.recurring?.interval ?? null;
  const intervalCount = p.recurring?.interval_count ?? 1;
  const price = { amountCents: p.unit_amount, currency: p.currency, interval: interval ?? "once", intervalCount, text: priceText(p.unit_amount, p.currency, interval, intervalCount) };
  kept = { key, at: Date.now(), price };
  return price;
}
