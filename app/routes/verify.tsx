import * as v from "valibot";
import { data, Form, redirect, useActionData, useSearchParams } from "react-router";
import type { Route } from "./+types/verify";
import { verifyEmailUser } from "~/lib/auth/accounts.server";
import { startSession } from "~/lib/auth/session.server";
import { readForm, safeNext } from "~/lib/shared/forms.server";
import { Card, FormError, Notice } from "~/components/forms";
import { routeErrorBoundary } from "~/components/RouteError";

export const meta: Route.MetaFunction = () => [{ title: "Confirm your address · Dutymark" }];

// The link opens a page with a button: mail scanners that pre-fetch links do not use up the token.
// Confirming signs the account in (the link proves the mailbox; sign-up itself starts no session, so
// it can answer the same for a new and a known address) and goes on to `next` when there is one.
export async function action({ request }: Route.ActionArgs) {
  const r = await readForm(request, v.object({ token: v.pipe(v.string(), v.maxLength(200)), next: v.optional(v.pipe(v.string(), v.maxLength(2000))) }));
  if (!r.ok) return { ok: false };
  const userId = await verifyEmailUser(r.value.token);
  if (!userId) return { ok: false };
  const cookie = await startSession(userId, request);
  const next = safeNext(r.value.next, "");
  if (next) throw redirect(next, { headers: { "Set-Cookie": cookie } });
  return data({ ok: true }, { headers: { "Set-Cookie": cookie } });
}

export default function Verify() {
  const a = useActionData<typeof action>();
  const [params] = useSearchParams();
  return (
    <Card title="Confirm your e-mail address" narrow>
      {a?.ok ? (
        <div className="space-y-3">
          <Notice>Your address is confirmed. Thank you.</Notice>
          <a className="btn" href="/">
            Continue
          </a>
        </div>
      ) : (
        <Form method="post" className="space-y-3">
          {a && !a.ok ? <FormError error="This link has expired or was already used. Ask for a new one from your account page." /> : null}
          <input type="hidden" name="token" value={params.get("token") ?? ""} />
          <input type="hidden" name="next" value={params.get("next") ?? ""} />
          <button className="btn" type="submit">
            Confirm my address
          </button>
        </Form>
      )}
    </Card>
  );
}

export const ErrorBoundary = routeErrorBoundary({ what: "the address confirmation", back: { href: "/signin", label: "Sign in" } });
