import * as v from "valibot";
import { Form, useActionData, useSearchParams } from "react-router";
import type { Route } from "./+types/verify";
import { verifyEmail } from "~/lib/accounts.server";
import { readForm } from "~/lib/forms.server";
import { Card, FormError, Notice } from "~/components/forms";

export const meta: Route.MetaFunction = () => [{ title: "Confirm your address · Dutymark" }];

// The link opens a page with a button: mail scanners that pre-fetch links do not use up the token.
export async function action({ request }: Route.ActionArgs) {
  const r = await readForm(request, v.object({ token: v.pipe(v.string(), v.maxLength(200)) }));
  if (!r.ok) return { ok: false };
  return { ok: await verifyEmail(r.value.token) };
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
          <button className="btn" type="submit">
            Confirm my address
          </button>
        </Form>
      )}
    </Card>
  );
}
