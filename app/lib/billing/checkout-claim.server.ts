// One checkout opened at a time per workspace. Two admins pressing Upgrade in the same moment each listed
// no open Checkout Session at Stripe and each created one: no lock spans the Stripe calls, and GET_LOCK is
// not used because under Galera it holds on one node only. The claim is one conditional UPDATE of the
// workspace's row — atomic on one server, and on Galera a write set certified against any other write to
// that row — so of two Upgrades at once exactly one changes the row and goes on to Stripe; the other is
// refused (409 on the billing page) and may press again once the first is done. A claim its request never
// cleared (the process stopped halfway) lapses after CHECKOUT_CLAIM_MINUTES. Times are the database's own
// (UTC_TIMESTAMP(), in SQL only), never the app server's clock.
import { and, eq, sql } from "drizzle-orm";
import { affectedRows, db, retryOnConflict } from "@db/client.server";
import { workspaces } from "@db/schema";

/** How long a claim holds at most: longer than a checkout takes to open (a few calls to Stripe), short enough to wait out. */
export const CHECKOUT_CLAIM_MINUTES = 2;

/** Upgrade refused: another request is opening this workspace's checkout. */
export class CheckoutBeingOpened extends Error {}

const free = sql`(${workspaces.checkoutStartedAt} IS NULL OR ${workspaces.checkoutStartedAt} < UTC_TIMESTAMP() - INTERVAL ${sql.raw(String(CHECKOUT_CLAIM_MINUTES))} MINUTE)`;

/**
 * Claims the opening of the workspace's checkout, or throws `CheckoutBeingOpened` when another request holds it
 * (claimed less than CHECKOUT_CLAIM_MINUTES ago). Returns the claim's mark, which `releaseCheckout` clears by.
 */
export async function claimCheckout(workspaceId: number): Promise<string> {
  // Safe to repeat as a whole (a conditional update): a Galera certification conflict is tried again, and then finds the row claimed.
  const r = await retryOnConflict(() => db().update(workspaces).set({ checkoutStartedAt: sql`UTC_TIMESTAMP()` }).where(and(eq(workspaces.id, workspaceId), free)));
  if (affectedRows(r) !== 1) {
    throw new CheckoutBeingOpened(
      `A checkout for this workspace is being opened (another Upgrade started less than ${CHECKOUT_CLAIM_MINUTES} minutes ago); try again in a moment.`,
    );
  }
  const [row] = await db().select({ mark: workspaces.checkoutStartedAt }).from(workspaces).where(eq(workspaces.id, workspaceId));
  return row!.mark!;
}

/** Clears this request's claim — and not a later one that took over after it had lapsed (its mark differs). */
export async function releaseCheckout(workspaceId: number, mark: string): Promise<void> {
  await retryOnConflict(() => db().update(workspaces).set({ checkoutStartedAt: null }).where(and(eq(workspaces.id, workspaceId), eq(workspaces.checkoutStartedAt, mark))));
}
