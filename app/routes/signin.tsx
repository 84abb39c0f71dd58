import * as v from "valibot";
import { data, Form, redirect, useActionData, useSearchParams } from "react-router";
import type { Route } from "./+types/signin";
import { checkCredentials, clientIp, getAuth, startSession } from "~/lib/auth/session.server";
import { AnyPassword, Email, invalid, readForm, safeNext } from "~/lib/shared/forms.server";
import { Card, Field, FormError, Notice } from "~/components/forms";
import { routeErrorBoundary } from "~/components/RouteError";

export const meta: Route.MetaFunction = () => [{ title: "Sign in · Dutymark" }];

const Schema = v.object({ email: Email, password: AnyPassword, next: v.optional(v.string()) });

export async function loader({ request }: Route.LoaderArgs) {
  const url = new URL(request.url);
  if (await getAuth(request)) throw redirect(safeNext(url.searchParams.get("next")));
  return null;
}

export async function action({ request }: Route.ActionArgs) {
  const r = await readForm(request, Schema);
  if (!r.ok) return invalid(r.errors);
  const res = await checkCredentials(r.value.email, r.value.password, clientIp(request));
  if (!res.ok) {
    if (res.reason === "throttled") {
      const wait = res.retryAfter < 90 ? `${res.retryAfter} seconds` : `${Math.ceil(res.retryAfter / 60)} minutes`;
      return data(
        { errors: { _form: `Too many attempts from here. Try again in ${wait}, or reset your password.` } },
        { status: 429, headers: { "Retry-After": String(res.retryAfter) } },
      );
    }
    return invalid({ _form: "That e-mail and password do not match an account." }, 400);
  }
  const cookie = await startSession(res.user.id, request);
  throw redirect(safeNext(r.value.next), { headers: { "Set-Cookie": cookie } });
}

export default function SignIn() {
  const a = useActionData<typeof action>();
  const [params] = useSearchParams();
  const errors = (a?.errors ?? {}) as Record<string, string>;
  const next = params.get("next") ?? "";
  return (
    <Card title="Sign in to Dutymark" narrow>
      <Form method="post" className="space-y-3" noValidate>
        {params.get("reset") ? <Notice>Your password was changed. Sign in with the new one.</Notice> : null}
        <FormError error={errors._form} />
        <Field label="E-mail" name="email" type="email" autoComplete="username" error={errors.email} required />
        <Field label="Password" name="password" type="password" autoComplete="current-password" error={errors.password} required />
        <input type="hidden" name="next" value={next} />
        <button className="btn w-full justify-center" type="submit">
          Sign in
        </button>
        <p className="flex justify-between text-sm">
          <a href="/forgot">Forgot your password?</a>
          <a href={`/signup${next ? `?next=${encodeURIComponent(next)}` : ""}`}>Create an account</a>
        </p>
      </Form>
    </Card>
  );
}

export const ErrorBoundary = routeErrorBoundary({ what: "the sign-in form", back: { href: "/", label: "The start page" } });
