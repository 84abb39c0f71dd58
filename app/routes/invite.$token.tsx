import { Form, redirect, useLoaderData } from "react-router";
import type { Route } from "./+types/invite.$token";
import { acceptInvitation, findInvitation } from "~/lib/workspaces";
import { getAuth } from "~/lib/auth/session.server";
import { requireUser } from "~/lib/auth/guards.server";
import { Card, FormError } from "~/components/forms";
import { routeErrorBoundary } from "~/components/RouteError";

export const meta: Route.MetaFunction = () => [{ title: "Invitation · Dutymark" }];

export async function loader({ request, params }: Route.LoaderArgs) {
  const found = await findInvitation(params.token);
  const auth = await getAuth(request);
  if (!found) return { valid: false as const, signedIn: Boolean(auth) };
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
  if (!res) return { error: "This invitation has expired, was withdrawn, or was already used." };
  throw redirect("/workspace");
}

export default function Invite({ params }: Route.ComponentProps) {
  const d = useLoaderData<typeof loader>();
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
      {d.signedIn ? (
        <Form method="post" className="mt-4 space-y-2">
          {d.signedInAs !== d.email ? (
            <p className="caution">You are signed in as {d.signedInAs}; accepting adds that account to the workspace.</p>
          ) : null}
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

