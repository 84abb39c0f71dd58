import { useEffect, useRef } from "react";
import * as v from "valibot";
import { Form, redirect, useLoaderData, useNavigation, useRevalidator } from "react-router";
import type { Route } from "./+types/workspace.billing";
import { requireMember, staleWorkspacePage } from "~/lib/auth/guards.server";
import { can } from "~/lib/auth/permissions";
import { invalid, PageWorkspaceId, readForm, readQuery } from "~/lib/shared/forms.server";
import { listLibraries } from "~/lib/libraries";
import { viewerOf } from "~/lib/auth/viewer.server";
import {
  AlreadySubscribed,
  billingErrorMessage,
  CheckoutBeingOpened,
  billingState,
  billingView,
  listInvoices,
  PLAN_NAMES,
  PLAN_SUMMARY,
  portalUrl,
  setCancelAtPeriodEnd,
  startCheckout,
  type InvoiceRow,
  paidPlanPrice,
} from "~/lib/billing";
import { FormOutcome, Notice, PageWorkspaceField } from "~/components/forms";
import { settings } from "~/lib/shared/env.server";
import { routeErrorBoundary } from "~/components/RouteError";
import { PageHead } from "~/components/PageHead";
import { useFormResult } from "~/components/useFormResult";
import { fmtDate, fmtMoney } from "~/lib/shared/format";

export const meta: Route.MetaFunction = () => [{ title: "Plan and billing · Dutymark" }];

export async function loader({ request }: Route.LoaderArgs) {
  const m = await requireMember(request, "billing.read");
  const manage = can(m.role, "billing.manage");
  const state = await billingState(m.workspace.id);
  // Three independent reads at once: the invoices (Stripe), the libraries (database) and, before checkout,
  // what the paid plan costs (Stripe; null: shown at checkout).
  const [invoiceRead, libraries, price] = await Promise.all([
    manage && state.customerId
      ? listInvoices(state.customerId).then((rows) => ({ rows, error: null }), (e: unknown) => ({ rows: [] as InvoiceRow[], error: billingErrorMessage(e) }))
      : { rows: [] as InvoiceRow[], error: null },
    listLibraries(viewerOf(m)),
    state.plan === "free" ? paidPlanPrice() : null,
  ]);
  // Library names and descriptions only (the listing never carries curves); a member without library.read sees none.
  const shared = libraries.filter((l) => l.access !== "owner" && l.visibility === "shared");
  const checkout = readQuery(request.url, "checkout", 40) || null;
  return {
    workspace: { id: m.workspace.id, name: m.workspace.name },
    role: m.role,
    manage,
    plan: state.plan,
    planName: state.planName,
    summary: PLAN_SUMMARY[state.plan],
    paid: { name: PLAN_NAMES.network, summary: PLAN_SUMMARY.network, price: price?.text ?? null },
    status: state.status,
    periodEnd: state.currentPeriodEnd,
    cancelAtPeriodEnd: state.cancelAtPeriodEnd,
    // hasSubscription, canUpgrade, canChangeCancel, renews, notice: what the state offers and says (subscription-states.ts).
    ...billingView(state, manage),
    hasCustomer: Boolean(state.customerId),
    invoices: invoiceRead.rows,
    invoicesError: invoiceRead.error as string | null,
    shared: shared.map((l) => ({ id: l.id, name: l.name, owner: l.owner, description: l.description, access: l.access })),
    // Only words: the success redirect never changes the plan; the verified webhook does.
    checkout: checkout === "done" || checkout === "canceled" ? checkout : null,
  };
}

/** One intent, on the workspace the page showed (`pageWorkspaceId`, checked by `staleWorkspacePage`). */
const Intent = v.object({ intent: v.picklist(["upgrade", "cancel", "resume", "portal"], "Unknown action."), pageWorkspaceId: PageWorkspaceId });

export async function action({ request }: Route.ActionArgs) {
  const m = await requireMember(request, "billing.manage");
  const r = await readForm(request, Intent);
  if (!r.ok) return invalid(r.errors);
  const stale = staleWorkspacePage(m, r.value.pageWorkspaceId);
  if (stale) return invalid({ _form: stale }, 409);
  const appUrl = settings().appUrl ?? new URL(request.url).origin;
  try {
    switch (r.value.intent) {
      case "upgrade": {
        const url = await startCheckout(m.workspace, m.user.email, appUrl);
        throw redirect(url);
      }
      case "cancel":
      case "resume": {
        const res = await setCancelAtPeriodEnd(m.workspace.id, r.value.intent === "cancel");
        if (!res.ok) return invalid({ _form: res.reason }, 409);
        const until = res.periodEnd ? ` on ${fmtDate(res.periodEnd.toISOString())}` : " at the close of the period";
        return {
          notice:
            r.value.intent === "cancel"
              ? `Cancellation sent. The Network plan ends${until}; shared libraries stay open until then, and saved selections keep their data.`
              : "The Network plan continues; nothing more will change.",
        };
      }
      case "portal": {
        const url = await portalUrl(m.workspace.id, `${appUrl}/workspace/billing`);
        if (!url) return invalid({ _form: "This workspace has no billing account yet." }, 409);
        throw redirect(url);
      }
    }
  } catch (e) {
    if (e instanceof Response) throw e;
    if (e instanceof AlreadySubscribed || e instanceof CheckoutBeingOpened) return invalid({ _form: e.message }, 409);
    return invalid({ _form: billingErrorMessage(e) }, 502);
  }
}

/** The paid plan's price as Stripe states it, or where to find it when it could not be read. */
function PaidPrice({ price }: { price: string | null }) {
  return (
    <p className="text-sm" data-testid="paid-price">
      {price ? (
        <>
          Price: <strong>{price}</strong> (from Stripe; checkout shows the total before you pay).
        </>
      ) : (
        "The price could not be read just now; it is shown at checkout, before you pay."
      )}
    </p>
  );
}

/** After checkout the webhook may land a moment later: look again for a while, then stop. */
function useWaitForPlan(waiting: boolean) {
  const { revalidate, state } = useRevalidator();
  const tries = useRef(0);
  useEffect(() => {
    if (!waiting || state !== "idle" || tries.current >= 30) return;
    const t = setTimeout(() => {
      tries.current++;
      revalidate();
    }, 1000);
    return () => clearTimeout(t);
  }, [waiting, state, revalidate]);
}

export default function Billing() {
  const d = useLoaderData<typeof loader>();
  const { errors, notice } = useFormResult();
  const busy = useNavigation().state === "submitting";
  useWaitForPlan(d.checkout === "done" && d.plan === "free");
  const locked = d.shared.filter((l) => l.access === "locked");
  return (
    <div className="space-y-6">
      <PageHead trail={[["/workspace", d.workspace.name]]} title="Plan and billing" />

      {d.checkout === "done" ? (
        <Notice>
          {d.plan === "network"
            ? "Payment received, and Stripe has confirmed it: the Network plan is active."
            : "Payment received. Your plan changes as soon as Stripe confirms the payment; this page looks again by itself."}
        </Notice>
      ) : null}
      {d.checkout === "canceled" ? <Notice>Checkout closed without paying. Nothing changed.</Notice> : null}
      <FormOutcome notice={notice} error={errors._form ?? errors.pageWorkspaceId} />

      <section className="panel space-y-2" aria-labelledby="plan-h">
        <h2 id="plan-h" className="text-lg font-semibold">
          Current plan: <span data-testid="plan-name">{d.planName}</span>
        </h2>
        <p className="text-sm text-slate-700">{d.summary}</p>
        {d.plan === "network" && d.periodEnd && d.cancelAtPeriodEnd ? (
          <p className="caution">
            Ends on {fmtDate(d.periodEnd)}. Shared libraries stay open until then; afterwards they lock again, and selections saved earlier keep their
            frozen curves.
          </p>
        ) : d.renews && d.periodEnd ? (
          <p className="text-sm text-slate-600">Renews on {fmtDate(d.periodEnd)}.</p>
        ) : null}
        {d.notice ? (
          <p className="caution" data-testid="subscription-notice">
            {d.notice}
          </p>
        ) : null}
      </section>

      {d.manage ? (
        <section className="panel space-y-3" aria-labelledby="change-h">
          <h2 id="change-h" className="text-lg font-semibold">
            Change the plan
          </h2>
          {d.canUpgrade ? (
            <Form method="post" className="space-y-2">
              <PageWorkspaceField id={d.workspace.id} />
              <p className="text-sm text-slate-700">
                {d.paid.name}: {d.paid.summary} You pay on Stripe's checkout page and can stop at the end of any period.
              </p>
              <PaidPrice price={d.paid.price} />
              <button className="btn" name="intent" value="upgrade" disabled={busy}>
                Upgrade to {d.paid.name}
              </button>
            </Form>
          ) : d.plan === "network" && !d.hasSubscription ? (
            <p className="text-sm text-slate-600">This workspace's {d.paid.name} plan was granted without a subscription; nothing to change here.</p>
          ) : null}
          {d.canChangeCancel || d.hasCustomer ? (
            <div className="flex flex-wrap gap-2">
              {d.canChangeCancel ? (
                <Form method="post">
                  <PageWorkspaceField id={d.workspace.id} />
                  {d.cancelAtPeriodEnd ? (
                    <button className="btn" name="intent" value="resume" disabled={busy}>
                      Keep {d.paid.name}
                    </button>
                  ) : (
                    <button className="btn-quiet" name="intent" value="cancel" disabled={busy}>
                      Cancel at the end of the period
                    </button>
                  )}
                </Form>
              ) : null}
              {d.hasCustomer ? (
                <Form method="post">
                  <PageWorkspaceField id={d.workspace.id} />
                  <button className="btn-quiet" name="intent" value="portal" disabled={busy}>
                    Payment details on Stripe
                  </button>
                </Form>
              ) : null}
            </div>
          ) : null}
        </section>
      ) : (
        <div className="space-y-1">
          <p className="text-sm text-slate-600">Only an admin of {d.workspace.name} changes the plan.</p>
          {d.plan === "free" ? <PaidPrice price={d.paid.price} /> : null}
        </div>
      )}

      {d.shared.length ? (
        <section className="panel" aria-labelledby="shared-h">
          <h2 id="shared-h" className="text-lg font-semibold">
            Shared libraries
          </h2>
          <p className="text-sm text-slate-600">
            {locked.length ? `${locked.length} of ${d.shared.length} locked on ${d.planName}.` : `All ${d.shared.length} open on ${d.planName}.`}
          </p>
          <ul className="mt-2 space-y-1 text-sm">
            {d.shared.map((l) => (
              <li key={l.id}>
                <a href={`/libraries/${l.id}`}>{l.name}</a> · {l.owner} · {l.access === "locked" ? "locked" : "open"}
              </li>
            ))}
          </ul>
        </section>
      ) : null}

      {d.manage && (d.invoices.length || d.invoicesError) ? (
        <section className="panel" aria-labelledby="inv-h">
          <h2 id="inv-h" className="text-lg font-semibold">
            Invoices
          </h2>
          {d.invoicesError ? <p className="caution">{d.invoicesError}</p> : null}
          {d.invoices.length ? (
            <table className="mt-2 w-full text-sm">
              <thead className="text-left text-slate-600">
                <tr>
                  <th className="py-1">Date</th>
                  <th>Number</th>
                  <th className="text-right">Paid</th>
                  <th className="pl-4">State</th>
                </tr>
              </thead>
              <tbody>
                {d.invoices.map((i) => (
                  <tr key={i.id} className="border-t border-slate-100">
                    <td className="py-1">{fmtDate(i.created)}</td>
                    <td>{i.url ? <a href={i.url}>{i.number ?? i.id}</a> : (i.number ?? i.id)}</td>
                    <td className="text-right tabular-nums">{fmtMoney(i.amountPaid, i.currency)}</td>
                    <td className="pl-4">{i.status}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          ) : null}
        </section>
      ) : null}
    </div>
  );
}

export const ErrorBoundary = routeErrorBoundary({ what: "this workspace's plan and billing", back: { href: "/workspace", label: "Your workspace" } });
