import * as v from "valibot";
import { Form, redirect, useActionData } from "react-router";
import type { Route } from "./+types/workspace.new";
import { createWorkspace } from "~/lib/workspaces";
import { requireUser } from "~/lib/auth/guards.server";
import { invalid, Name, readForm } from "~/lib/shared/forms.server";
import { Card, Field } from "~/components/forms";
import { routeErrorBoundary } from "~/components/RouteError";

export const meta: Route.MetaFunction = () => [{ title: "New workspace · Dutymark" }];

export async function loader({ request }: Route.LoaderArgs) {
  await requireUser(request);
  return null;
}

export async function action({ request }: Route.ActionArgs) {
  const auth = await requireUser(request);
  const r = await readForm(request, v.object({ name: Name("a workspace name") }));
  if (!r.ok) return invalid(r.errors);
  await createWorkspace(auth.user.id, r.value.name);
  throw redirect("/workspace");
}

export default function NewWorkspace() {
  const a = useActionData<typeof action>();
  const errors = (a?.errors ?? {}) as Record<string, string>;
  return (
    <Card title="Create a workspace" narrow>
      <Form method="post" className="space-y-3" noValidate>
        <Field label="Workspace name" name="name" hint="Your team, firm or company." error={errors.name} required />
        <button className="btn">Create workspace</button>
      </Form>
    </Card>
  );
}

export const ErrorBoundary = routeErrorBoundary({ what: "the new-workspace form", back: { href: "/workspace", label: "Your workspace" } });
