// What each Stripe subscription status means here (pure; Stripe API docs: Subscriptions, "Subscription
// statuses"): for the plan, for another checkout, for two events in the same second, and in words on the
// billing page.
//
//   status              plan                       another checkout   another subscription's events
//   active, trialing    opens Network              refused            recorded only (this one holds)
//   past_due            stays as it is (retrying)  refused            recorded only (this one holds)
//   incomplete          stays as it is (1st pay)   refused            may take over
//   unpaid, paused      closes (Starter)           refused            may take over
//   canceled,           closes (Starter); final:   allowed            may take over
//   incomplete_expired  never reopened

export type PlanName = "free" | "network";

/** Statuses that open the Network plan. */
export const OPENS_PLAN: ReadonlySet<string> = new Set(["active", "trialing"]);
/** Statuses that close it: Stripe stopped retrying (unpaid), a trial ended without a card (paused), and the ended ones. */
export const CLOSES_PLAN: ReadonlySet<string> = new Set(["unpaid", "paused", "canceled", "incomplete_expired"]);
/** Ended for good: Stripe never moves a subscription out of these, so a subscription id seen in one is never reopened. */
export const ENDED: ReadonlySet<string> = new Set(["canceled", "incomplete_expired"]);
/** The workspace's own subscription in these keeps another subscription's events out (it is paid for, or being retried). */
export const HOLDS: ReadonlySet<string> = new Set(["active", "trialing", "past_due"]);

/**
 * Still there at Stripe and able to charge: every status but the ended ones (today active, trialing,
 * past_due, incomplete, unpaid, paused). A status Stripe adds later counts as live: a refused checkout
 * is better than a second subscription.
 */
export const isLive = (status: string | null | undefined): status is string => Boolean(status) && !ENDED.has(status!);

/**
 * A subscription's stage of life, for two events stamped in the same second (Stripe's `created` is whole
 * seconds): the later stage wins, equal stages apply in arrival order.
 *   incomplete < trialing = active < past_due < unpaid = paused < canceled = incomplete_expired
 * A recovery (past_due → active) in the same second as the failure would be misread; Stripe retries a failed
 * payment hours or days later, so the two do not share a second. An unknown status ranks with active.
 */
const STAGE: Record<string, number> = { incomplete: 0, trialing: 1, active: 1, past_due: 2, unpaid: 3, paused: 3, canceled: 4, incomplete_expired: 4 };
export const stageOf = (status: string): number => STAGE[status] ?? 1;

/** The plan after the workspace's own subscription moves to `status`. */
export function planFor(status: string, current: PlanName): PlanName {
  if (OPENS_PLAN.has(status)) return "network";
  if (CLOSES_PLAN.has(status)) return "free";
  return current;
}

export type SubscriptionFacts = { plan: PlanName; subscriptionId: string | null; status: string | null; customerId: string | null; cancelAtPeriodEnd: boolean };

export type BillingView = {
  /** A subscription is there at Stripe (not ended): no second checkout. */
  hasSubscription: boolean;
  canUpgrade: boolean;
  /** Cancel at period end / keep: while it opens the plan. */
  canChangeCancel: boolean;
  /** "Renews on …" is true only while it opens the plan and is not set to end. */
  renews: boolean;
  /** What the state means, in words, or null when the plan line says it all. */
  notice: string | null;
};

/** What the billing page offers and says for the workspace's subscription state. */
export function billingView(s: SubscriptionFacts, manage: boolean): BillingView {
  const hasSubscription = Boolean(s.subscriptionId) && isLive(s.status);
  const opens = hasSubscription && OPENS_PLAN.has(s.status!);
  return {
    hasSubscription,
    canUpgrade: s.plan === "free" && !hasSubscription,
    canChangeCancel: opens,
    renews: s.plan === "network" && opens && !s.cancelAtPeriodEnd,
    notice: hasSubscription ? statusWords(s.status!, manage) : null,
  };
}

const CARD = (manage: boolean, what: string) => (manage ? `${what} under “Payment details on Stripe” below.` : `An admin of this workspace can ${what.charAt(0).toLowerCase()}${what.slice(1)} on Stripe.`);

/** The words for a live subscription's state (null for active and trialing: the plan line says it). */
function statusWords(status: string, manage: boolean): string | null {
  switch (status) {
    case "active":
    case "trialing":
      return null;
    case "past_due":
      return (
        "The last payment failed and Stripe is retrying it; the Network plan stays open meanwhile. " +
        "If every retry fails, Stripe cancels the subscription or marks it unpaid (as the Stripe account is set up), and this workspace goes back to Starter: " +
        `shared libraries lock again, selections saved earlier keep their frozen curves. ${CARD(manage, "Update the card")}`
      );
    case "incomplete":
      // Stripe API docs (Subscriptions, incomplete; from memory): the first invoice must be paid within 23 hours, else incomplete_expired.
      return (
        "The first payment has not gone through (Stripe: incomplete), so the Network plan is not open yet. " +
        `Stripe ends the subscription without charging if the first payment is not made within 23 hours. ${CARD(manage, "Finish the payment")}`
      );
    case "unpaid":
      return (
        "Stripe has stopped retrying the failed payment (unpaid), so this workspace is on Starter. " +
        `The Network plan opens again once the open invoice is paid and Stripe confirms it. ${CARD(manage, "Pay the open invoice")}`
      );
    case "paused":
      return (
        "The subscription is paused at Stripe (a trial ended without a payment method), so this workspace is on Starter. " +
        `The Network plan opens again when Stripe resumes the subscription. ${CARD(manage, "Add a payment method")}`
      );
    default:
      return `Payment state at Stripe: ${status}.`;
  }
}
