import * as v from "valibot";
import { Form, redirect, useActionData, useSearchParams } from "react-router";
import type { Route } from "./+types/signup";
import { getAuth } from "~/lib/auth/session.server";
import { signUp } from "~/lib/auth/accounts.server";
import { Email, FreeText, NewPassword, Name, invalid, readForm, safeNext } from "~/lib/shared/forms.server";
import { Card, Field, FormError, Notice } from "~/components/forms";
import { routeErrorBoundary } from "~/components/RouteError";

export const meta: Route.MetaFunction = () => [{ title: "Create an account · Dutymark" }];

const Schema = v.object({
  email: Email,
  name: Name("your name"),
  password: NewPassword,
  workspace: v.optional(FreeText("workspace name", 120)),
  next: v.optional(v.string()),
});

export async function loader({ request }: Route.LoaderArgs) {
  if (await getAuth(request)) throw redirect("/");
  return null;
}

export async function action({ request }: Route.ActionArgs) {
  const r = await readForm(request, Schema);
  if (!r.ok) return invalid(r.errors);
  const next = safeNext(r.value.next, "");
  await signUp({
    email: r.value.email,
    password: r.value.password,
    name: r.value.name,
    workspaceName: next.startsWith("/invite/") ? undefined : r.value.workspace || `${r.value.name}'s workspace`,
    next,
  });
  // Same words (and the same work: a hash, a row or two, one outbox mail) whether or not the address
  // already had an account. A new account is signed in by its confirmation link, not here.
  return { sent: true as const };
}

export default function SignUp() {
  const a = useActionData<typeof action>();
  const [params] = useSearchParams();
  const errors = a && "errors" in a ? (a.errors as Record<string, string>) : {};
  const next = params.get("next") ?? "";
  const invited = next.startsWith("/invite/");
  return (
    <Card title="Create your Dutymark account" narrow>
      {a && "sent" in a ? (
        <Notice>Check your inbox: we sent a message to that address with the next step. The link in it signs you in.</Notice>
      ) : (
        <Form method="post" className="space-y-3" noValidate>
          <FormError error={errors._form} />
          <Field label="E-mail" name="email" type="email" autoComplete="email" defaultValue={params.get("email") ?? undefined} error={errors.email} required />
          <Field label="Your name" name="name" autoComplete="name" error={errors.name} required />
          <Field label="Password" name="password" type="password" autoComplete="new-password" error={errors.password} hint="At least 10 characters." required />
          {invited ? null : (
            <Field label="Workspace name" name="workspace" hint="Your team or company; you can invite people later." error={errors.workspace} />
          )}
          <input type="hidden" name="next" value={next} />
          <button className="btn w-full justify-center" type="submit">
            Create account
          </button>
          <p className="text-sm">
            Already have an account? <a href={`/signin${next ? `?next=${encodeURIComponent(next)}` : ""}`}>Sign in</a>
          </p>
        </Form>
      )}
    </Card>
  );
}

export const ErrorBoundary = routeErrorBoundary({ what: "the sign-up form", back: { href: "/signin", label: "Sign in instead" } });
