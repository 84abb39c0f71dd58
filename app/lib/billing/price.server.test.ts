// The paid plan's price on the billing page, read through the Stripe SDK from the local stand-in
// (fixtures/stripe: the configured price is 49.00 EUR a month, fixtures/stripe/README.md), and the
// fallback when it cannot be read. The stand-in shapes every answer needed here (a known price, an
// unknown one → 404), so no msw.
import { describe, expect, test } from "vitest";
import { call, freePort, makeMember } from "~/test/harness";
import * as billingRoute from "~/routes/workspace.billing";
import { paidPlanPrice, priceText } from "./price.server";
import { useBillingStandIn } from "./test-kit";

useBillingStandIn();

type Page = { paid: { price: string | null }; plan: string };
const page = async (cookie: string) => {
  const r = await call(billingRoute.loader as never, { path: "/workspace/billing", cookie });
  expect(r.status).toBe(200);
  return r.body as Page;
};

/** Runs `fn` with environment variables changed, then puts them back. */
async function withEnv<T>(vars: Record<string, string | undefined>, fn: () => Promise<T>): Promise<T> {
  const saved = Object.fromEntries(Object.keys(vars).map((k) => [k, process.env[k]]));
  for (const [k, v] of Object.entries(vars)) if (v === undefined) delete process.env[k];
  else process.env[k] = v;
  try {
    return await fn();
  } finally {
    for (const [k, v] of Object.entries(saved)) if (v === undefined) delete process.env[k];
    else process.env[k] = v;
  }
}

describe("the paid plan's price before checkout", () => {
  test("read from Stripe's price object: amount, currency and interval — Stripe API docs: prices.retrieve (unit_amount, recurring.interval)", async () => {
    expect(await paidPlanPrice()).toEqual({ amountCents: 4900, currency: "eur", interval: "month", intervalCount: 1, text: "49.00 EUR per month" });
    const admin = await makeMember("admin");
    expect((await page(admin.cookie)).paid.price).toBe("49.00 EUR per month");
    const viewer = await makeMember("viewer", admin.workspaceId);
    expect((await page(viewer.cookie)).paid.price).toBe("49.00 EUR per month"); // told what it costs, without the controls
  });

  test("a price id Stripe does not know (404): no price, the page still answers — our rule: never guess a price", async () => {
    const admin = await makeMember("admin");
    await withEnv({ STRIPE_PRICE_ID: "price_not_at_stripe" }, async () => {
      expect(await paidPlanPrice()).toBeNull();
      expect((await page(admin.cookie)).paid.price).toBeNull();
    });
  });

  test("Stripe unreachable, or payments not set up: no price, the page still answers", async () => {
    const admin = await makeMember("admin");
    const closed = `http://127.0.0.1:${await freePort()}`;
    await withEnv({ STRIPE_API_BASE: closed }, async () => expect((await page(admin.cookie)).paid.price).toBeNull());
    await withEnv({ STRIPE_SECRET_KEY: undefined }, async () => expect((await page(admin.cookie)).paid.price).toBeNull());
  });

  test("wording of other intervals — our own format", () => {
    expect(priceText(12000, "eur", "month", 3)).toBe("120.00 EUR every 3 months");
    expect(priceText(49000, "usd", "year")).toBe("490.00 USD per year");
    expect(priceText(990, "gbp", null)).toBe("9.90 GBP once");
  });
});
