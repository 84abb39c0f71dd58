// Plans and payments: the workspace plan, Stripe checkout and portal (billing.server.ts), the webhook that
// changes the plan (webhook.server.ts), one checkout opened at a time (checkout-claim.server.ts), what each subscription status means (subscription-states.ts, pure)
// and the plan's price (price.server.ts); server only. test-kit.ts (the Stripe stand-in and helpers) is for
// tests and stays out.
export * from "./billing.server";
export * from "./webhook.server";
export * from "./checkout-claim.server";
export * from "./subscription-states";
export * from "./price.server";
