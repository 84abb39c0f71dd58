import { data, Form, redirect, useLoaderData } from "react-router";
import type { Route } from "./+types/invite.$token";
import { acceptInvitation, findInvitation } from "~/lib/workspaces";
import { getAuth } from "~/lib/auth/session.server";
import { requireUser } from "~/lib/auth/guards.server";
import { Card, FormError } from "~/components/forms";
import { useFormResult } from "~/components/useFormResult";
import { routeErrorBoundary } from "~/components/RouteError";

export const meta: Route.MetaFunction = () => [{ title: "Invitation · Dutymark" }];

export async function loader({ request, params }: Route.LoaderArgs) {
  const found = await findInvitation(params.token);
  const auth = await getAuth(request);
  // No usable invitation has this token: the page says so, with 404 (a link to nothing, not a page that worked).
  if (!found) return data({ valid: false as const, signedIn: Boolean(auth) }, { status: 404 });
  return {
    valid: true as const,
    signedIn: Boolean(auth),
    signedInAs: auth?.user.email ?? null,
    email: found.inv.email,
    role: found.inv.role,
    workspace: found.workspaceName,
  };
}

export async function action({ request, params }: Route.ActionArgs) {
  const auth = await requireUser(request);
  const res = await acceptInvitation(params.token, auth.user.id);
  if (res.ok) throw redirect("/workspace");
  if (res.reason === "wrong-address") {
    // Only of an invitation that could still be used, whose address the page shows to whoever holds the link.
    return data({ error: `This invitation is for ${res.email}, and you are signed in as ${auth.user.email}. Sign in as ${res.email} to accept it.` }, { status: 403 });
  }
  return data({ error: "This invitation has expired, was withdrawn, or was already used." }, { status: 404 });
}

// Accept answered 404 (the invitation was withdrawn, used or expired meanwhile): the page is read again, so it shows
// the "expired, withdrawn or used" card instead of an Accept button (React Router reads no loader after a 4xx by default).
export const shouldRevalidate = () => true;

export default function Invite({ params }: Route.ComponentProps) {
  const d = useLoaderData<typeof loader>();
  const { data: answer } = useFormResult<{ error: string }>();
  const here = `/invite/${params.token}`;
  if (!d.valid) {
    return (
      <Card title="Invitation" narrow>
        <FormError error="This invitation has expired, was withdrawn, or was already used. Ask whoever invited you for a new one." />
      </Card>
    );
  }
  return (
    <Card title={`Join ${d.workspace}`} narrow>
      <p className="text-sm">
        You are invited as <strong>{d.role}</strong> ({d.email}).
      </p>
      {answer?.error ? (
        <div className="mt-4">
          <FormError error={answer.error} />
        </div>
      ) : null}
      {d.signedIn && d.signedInAs !== d.email ? (
        <div className="mt-4 space-y-2">
          <p className="caution">
            This invitation is for <strong>{d.email}</strong>. You are signed in as <strong>{d.signedInAs}</strong>, which cannot accept it:{" "}
            {`sign out, then sign in as ${d.email} (or create an account with that address) and open this link again.`}
          </p>
          <Form method="post" action="/signout">
            <input type="hidden" name="next" value={here} />
            <button className="btn">Sign out and sign in as {d.email}</button>
          </Form>
        </div>
      ) : d.signedIn ? (
        <Form method="post" className="mt-4 space-y-2">
          <button className="btn">Accept and join</button>
        </Form>
      ) : (
        <div className="mt-4 flex gap-3">
          <a className="btn" href={`/signup?next=${encodeURIComponent(here)}&email=${encodeURIComponent(d.email)}`}>
            Create an account
          </a>
          <a className="btn-quiet" href={`/signin?next=${encodeURIComponent(here)}`}>
            I have an account
          </a>
        </div>
      )}
    </Card>
  );
}

export const ErrorBoundary = routeErrorBoundary({ what: "this invitation", back: { href: "/", label: "The start page" } });

