import * as v from "valibot";
import { Form, redirect, useActionData, useSearchParams } from "react-router";
import type { Route } from "./+types/reset";
import { resetPassword } from "~/lib/auth/accounts.server";
import { invalid, NewPassword, readForm } from "~/lib/shared/forms.server";
import { Card, Field, FormError } from "~/components/forms";
import { routeErrorBoundary } from "~/components/RouteError";

export const meta: Route.MetaFunction = () => [{ title: "Choose a new password · Dutymark" }];

const Schema = v.object({ token: v.pipe(v.string(), v.maxLength(200)), password: NewPassword });

export async function action({ request }: Route.ActionArgs) {
  const r = await readForm(request, Schema);
  if (!r.ok) return invalid(r.errors);
  const ok = await resetPassword(r.value.token, r.value.password);
  if (!ok) return invalid({ _form: "This reset link has expired or was already used. Ask for a new one." }, 400);
  throw redirect("/signin?reset=1");
}

export default function Reset() {
  const a = useActionData<typeof action>();
  const [params] = useSearchParams();
  const errors = (a?.errors ?? {}) as Record<string, string>;
  return (
    <Card title="Choose a new password" narrow>
      <Form method="post" className="space-y-3" noValidate>
        <FormError error={errors._form} />
        <input type="hidden" name="token" value={params.get("token") ?? ""} />
        <Field label="New password" name="password" type="password" autoComplete="new-password" hint="At least 10 characters." error={errors.password} required />
        <button className="btn" type="submit">
          Save the new password
        </button>
        {errors._form ? (
          <p className="text-sm">
            <a href="/forgot">Ask for a new link</a>
          </p>
        ) : null}
      </Form>
    </Card>
  );
}

export const ErrorBoundary = routeErrorBoundary({ what: "the new-password form", back: { href: "/forgot", label: "Ask for a new reset link" } });
