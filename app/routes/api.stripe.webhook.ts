import type { Route } from "./+types/api.stripe.webhook";
import { handleStripeWebhook } from "~/lib/billing";
import { problem, refuseMethod } from "~/lib/shared/problem.server";

// POST /api/stripe/webhook — Stripe's (or the local stand-in's) signed events. No session, no
// CSRF origin check (exempt in csrf.server.ts): the Stripe-Signature header is the credential.
// The body is read raw, exactly as signed; the middleware caps it at 512 KB.
export async function action({ request }: Route.ActionArgs) {
  if (request.method !== "POST") return loader();
  let raw: string;
  try {
    raw = await request.text();
  } catch {
    // cut by app/serve.mjs past the 512 KB limit, which has answered 413 already: nothing of it is read
    return problem({ title: "Bad Request", status: 400, detail: "The body could not be read to its end." });
  }
  const out = await handleStripeWebhook(raw, request.headers.get("stripe-signature"));
  if (out.problem) return problem(out.body as { title: string; status: number });
  return Response.json(out.body, { status: out.status, headers: { "Cache-Control": "no-store" } });
}

export const loader = refuseMethod("POST", "Stripe posts events here.");
