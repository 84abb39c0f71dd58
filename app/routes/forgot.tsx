import * as v from "valibot";
import { Form, useActionData } from "react-router";
import type { Route } from "./+types/forgot";
import { requestPasswordReset } from "~/lib/auth/accounts.server";
import { clientIp } from "~/lib/auth/session.server";
import { EMAIL_TOKEN_TTL } from "~/lib/shared/constants";
import { Email, invalid, readForm } from "~/lib/shared/forms.server";
import { Card, Field, Notice } from "~/components/forms";
import { routeErrorBoundary } from "~/components/RouteError";

export const meta: Route.MetaFunction = () => [{ title: "Reset your password · Dutymark" }];

export async function action({ request }: Route.ActionArgs) {
  const r = await readForm(request, v.object({ email: Email }));
  if (!r.ok) return invalid(r.errors);
  await requestPasswordReset(r.value.email, clientIp(request));
  return { sent: true as const };
}

export default function Forgot() {
  const a = useActionData<typeof action>();
  const errors = (a && "errors" in a ? a.errors : {}) as Record<string, string>;
  return (
    <Card title="Reset your password" narrow>
      {a && "sent" in a ? (
        <Notice>
          If that address has an account, a reset link is on its way. It works once, for {EMAIL_TOKEN_TTL.reset} minutes.
        </Notice>
      ) : (
        <Form method="post" className="space-y-3" noValidate>
          <Field label="E-mail" name="email" type="email" autoComplete="email" error={errors.email} required />
          <button className="btn" type="submit">
            Send me a reset link
          </button>
        </Form>
      )}
    </Card>
  );
}

export const ErrorBoundary = routeErrorBoundary({ what: "the password reset form", back: { href: "/signin", label: "Sign in" } });
