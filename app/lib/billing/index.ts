// Plans and payments: the workspace plan, Stripe checkout and portal, and the webhook that changes
// the plan (server only). test-kit.ts (the Stripe stand-in and helpers) is for tests and stays out.
export * from "./billing.server";
export * from "./price.server";
