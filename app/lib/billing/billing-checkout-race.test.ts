// Two admins pressing Upgrade in the same moment: before, each listed no open Checkout Session and each
// created one (no lock spans the Stripe calls), so Stripe held two payable checkouts for one workspace. Now
// the opening is claimed on the workspace's row by one conditional UPDATE (checkout-claim.server.ts; no
// GET_LOCK, which holds on one Galera node only): one Upgrade opens its session, the other is refused (409)
// and the claim is cleared once the session exists or the call failed. The two Upgrades are made to overlap
// by a relay in front of the Stripe stand-in that holds "create a Checkout Session" until one Upgrade has
// answered or both have reached it — an order of events, not a timing. Real MariaDB, the real stripe SDK.
// Check values: our rule (one checkout opened at a time per workspace; a claim lapses after
// CHECKOUT_CLAIM_MINUTES = 2, our choice); Stripe API docs: Checkout Sessions (list, create, expire).
import { createServer, type IncomingMessage } from "node:http";
import { describe, expect, test } from "vitest";
import { eq, sql } from "drizzle-orm";
import { db } from "@db/client.server";
import { workspaces } from "@db/schema";
import { call, freePort, makeMember, type TestMember } from "~/test/harness";
import * as billingRoute from "~/routes/workspace.billing";
import { CHECKOUT_CLAIM_MINUTES, claimCheckout, releaseCheckout } from "./checkout-claim.server";
import { kit, pay, upgrade, useBillingStandIn, ws } from "./test-kit";

useBillingStandIn();

const BEING_OPENED = `A checkout for this workspace is being opened (another Upgrade started less than ${CHECKOUT_CLAIM_MINUTES} minutes ago); try again in a moment.`;

/** The billing page's Upgrade form, posted with the page's workspace (stale-workspace-forms). */
const pressUpgrade = (m: TestMember) =>
  call(billingRoute.action as never, { path: "/workspace/billing", cookie: m.cookie, form: { intent: "upgrade", pageWorkspaceId: String(m.workspaceId) } });
/** Every Checkout Session Stripe holds for the customer, whatever its status. */
const sessionsOf = async (customer: string) => (await kit.sdk.checkout.sessions.list({ customer, limit: 100 })).data;
/** The Checkout Session id in the stand-in's checkout page address (`…/pay/cs_test_…`). */
const sessionId = (url: string | null) => url?.split("/pay/")[1] ?? null;
const mark = async (workspaceId: number) => (await ws(workspaceId)).checkoutStartedAt;
const setMark = (workspaceId: number, secondsAgo: number) =>
  db().update(workspaces).set({ checkoutStartedAt: sql`UTC_TIMESTAMP() - INTERVAL ${sql.raw(String(secondsAgo))} SECOND` }).where(eq(workspaces.id, workspaceId));

const bodyOf = (req: IncomingMessage) =>
  new Promise<Buffer>((resolve) => {
    const chunks: Buffer[] = [];
    req.on("data", (c: Buffer) => chunks.push(c));
    req.on("end", () => resolve(Buffer.concat(chunks)));
  });

/** A relay to the stand-in that holds each "create a Checkout Session" until `release()`; `held(n)` resolves once n are held. */
async function holdingRelay(target: string) {
  let release!: () => void;
  const released = new Promise<void>((r) => (release = r));
  let count = 0;
  const waiters: { n: number; resolve: () => void }[] = [];
  const server = createServer(async (req, res) => {
    const body = await bodyOf(req);
    if (req.method === "POST" && req.url === "/v1/checkout/sessions") {
      count++;
      for (const w of waiters) if (count >= w.n) w.resolve();
      await released;
    }
    const headers = new Headers();
    for (const [k, x] of Object.entries(req.headers)) if (typeof x === "string" && !["host", "connection", "content-length"].includes(k)) headers.set(k, x);
    const r = await fetch(target + req.url, { method: req.method, headers, body: req.method === "GET" ? undefined : new Uint8Array(body) });
    res.writeHead(r.status, { "content-type": r.headers.get("content-type") ?? "application/json" }).end(Buffer.from(await r.arrayBuffer()));
  });
  await new Promise<void>((r) => server.listen(0, "127.0.0.1", () => r()));
  return {
    url: `http://127.0.0.1:${(server.address() as { port: number }).port}`,
    held: (n: number) => new Promise<void>((resolve) => (count >= n ? resolve() : waiters.push({ n, resolve }))),
    release,
    close: () => new Promise<void>((r) => server.close(() => r())),
  };
}

/** Runs `fn` with the app's Stripe calls going through `base`, then back to the stand-in. */
async function viaStripeAt<T>(base: string, fn: () => Promise<T>): Promise<T> {
  process.env.STRIPE_API_BASE = base;
  try {
    return await fn();
  } finally {
    process.env.STRIPE_API_BASE = kit.standIn.url;
  }
}

describe("two Upgrades of one workspace at once", () => {
  for (const before of ["no checkout before (no Stripe customer yet)", "a checkout opened and left before (the customer exists)"] as const) {
    test(`${before}: both admins press Upgrade together (Promise.all): one checkout session is created, the other press is refused with 409, and the claim is cleared after`, async () => {
      const admin = await makeMember("admin");
      const other = await makeMember("admin", admin.workspaceId);
      const earlier = before.startsWith("a checkout") ? await upgrade(admin) : null;
      const relay = await holdingRelay(kit.standIn.url);
      const answers = await viaStripeAt(relay.url, async () => {
        const presses = [pressUpgrade(admin), pressUpgrade(other)];
        // Hold the session's creation until one press has answered (the guard refused it) or both reach Stripe (no guard).
        await Promise.race([Promise.race(presses), relay.held(2)]);
        relay.release();
        return Promise.all(presses);
      }).finally(() => relay.close());
      expect(answers.map((r) => r.status).sort(), JSON.stringify(answers.map((r) => r.body))).toEqual([302, 409]);
      const opened = answers.find((r) => r.status === 302)!;
      expect(opened.location).toMatch(new RegExp(`^${kit.standIn.url}/pay/cs_test_`));
      const refused = answers.find((r) => r.status === 409)!;
      expect(refused.location).toBeNull();
      expect((refused.body as { errors: { _form: string } }).errors._form).toBe(BEING_OPENED);
      const customer = (await ws(admin.workspaceId)).stripeCustomerId!;
      const sessions = await sessionsOf(customer);
      // Exactly one created by the two presses, and it is the only one open (an earlier one was expired).
      expect(sessions.filter((s) => s.id !== sessionId(earlier)).map((s) => s.id)).toEqual([sessionId(opened.location)]);
      expect(sessions.filter((s) => s.status === "open").map((s) => s.id)).toEqual([sessionId(opened.location)]);
      expect(await mark(admin.workspaceId)).toBeNull(); // cleared once the session existed

      // Pressed again after the first is done, it opens a new checkout and expires the first (billing.server.ts).
      const again = await upgrade(other);
      expect((await sessionsOf(customer)).filter((s) => s.status === "open").map((s) => s.id)).toEqual([sessionId(again)]);
    });
  }

  test("a claim less than 2 minutes old (110 s) refuses Upgrade with the rule in its words and opens nothing; one older (130 s) has lapsed and is taken over", async () => {
    const admin = await makeMember("admin");
    await setMark(admin.workspaceId, 110);
    const r = await pressUpgrade(admin);
    expect(r.status).toBe(409);
    expect((r.body as { errors: { _form: string } }).errors._form).toBe(BEING_OPENED);
    expect((await ws(admin.workspaceId)).stripeCustomerId).toBeNull(); // refused before any call to Stripe (the customer comes first)
    await setMark(admin.workspaceId, 130);
    await upgrade(admin); // 302 to the stand-in's checkout page
    expect(await mark(admin.workspaceId)).toBeNull();
  });

  test("the claim is cleared when the call to Stripe fails (502) and when Stripe already lists a subscription (409)", async () => {
    const admin = await makeMember("admin");
    const nobody = `http://127.0.0.1:${await freePort()}`; // nothing listens there: a connection error
    const failed = await viaStripeAt(nobody, () => pressUpgrade(admin));
    expect(failed.status).toBe(502);
    expect(await mark(admin.workspaceId)).toBeNull();

    const url = await upgrade(admin);
    kit.receiver.state.paused = true; // the webhook does not land: our row shows no subscription, Stripe has one
    expect((await pay(url, "4242 4242 4242 4242")).status).toBe(303);
    const subscribed = await pressUpgrade(admin);
    kit.receiver.state.paused = false;
    expect(subscribed.status).toBe(409);
    expect((subscribed.body as { errors: { _form: string } }).errors._form).toMatch(/already has a subscription at Stripe/);
    expect(await mark(admin.workspaceId)).toBeNull();
  });

  test("a request whose claim lapsed and was taken over does not clear the new holder's claim", async () => {
    const admin = await makeMember("admin");
    await setMark(admin.workspaceId, 600); // the first request's claim, 10 minutes old: it hung past the limit
    const lapsed = (await mark(admin.workspaceId))!;
    const taken = await claimCheckout(admin.workspaceId); // a second request takes over
    expect(taken).not.toBe(lapsed);
    await releaseCheckout(admin.workspaceId, lapsed); // the first request finally clears "its" claim
    expect(await mark(admin.workspaceId)).toBe(taken);
    await releaseCheckout(admin.workspaceId, taken);
    expect(await mark(admin.workspaceId)).toBeNull();
  });
});
