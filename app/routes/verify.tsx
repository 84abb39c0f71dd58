import * as v from "valibot";
import { data, Form, redirect, useActionData, useSearchParams } from "react-router";
import type { Route } from "./+types/verify";
import { confirmAddressLink } from "~/lib/auth/accounts.server";
import { readForm, safeNext } from "~/lib/shared/forms.server";
import { Card, FormError, Notice } from "~/components/forms";
import { routeErrorBoundary } from "~/components/RouteError";

export const meta: Route.MetaFunction = () => [{ title: "Confirm your address · Dutymark" }];

// The link opens a page with a button: mail scanners that pre-fetch links do not use up the token.
// Confirming signs the account in when nobody is (the link proves the mailbox; sign-up itself starts no
// session, so it can answer the same for a new and a known address) and goes on to `next` when there is one.
// Someone signed in as another account stays signed in as it (confirmAddressLink: no login CSRF) and is told so.
export async function action({ request }: Route.ActionArgs) {
  const r = await readForm(request, v.object({ token: v.pipe(v.string(), v.maxLength(200)), next: v.optional(v.pipe(v.string(), v.maxLength(2000))) }));
  if (!r.ok) return data({ ok: false as const }, { status: 400 }); // a token or next past their lengths: no link of ours
  const res = await confirmAddressLink(r.value.token, request);
  if (res.kind === "unusable") return data({ ok: false as const }, { status: 404 }); // no usable link has this token
  const next = safeNext(r.value.next, "");
  if (res.kind === "other-account") return { ok: true as const, signedInAs: res.signedInAs, confirmed: res.confirmed, next };
  const headers = res.kind === "signed-in" ? { "Set-Cookie": res.cookie } : undefined;
  if (next) throw redirect(next, { headers });
  return data({ ok: true as const }, { headers });
}

export default function Verify() {
  const a = useActionData<typeof action>();
  const [params] = useSearchParams();
  return (
    <Card title="Confirm your e-mail address" narrow>
      {a?.ok && "signedInAs" in a ? (
        <div className="space-y-3">
          <Notice>The address {a.confirmed} is confirmed.</Notice>
          <p className="caution">
            You are signed in as <strong>{a.signedInAs}</strong>, and you still are: this link confirmed the address of another account, <strong>{a.confirmed}</strong>,
            {` and a confirmation link never replaces the account you are signed in as. To use that account, sign out and sign in as ${a.confirmed}.`}
          </p>
          <Form method="post" action="/signout">
            <input type="hidden" name="next" value={a.next} />
            <button className="btn">Sign out and sign in as {a.confirmed}</button>
          </Form>
          <a className="btn-quiet" href="/">
            Stay signed in as {a.signedInAs}
          </a>
        </div>
      ) : a?.ok ? (
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
