import { data, redirect, useActionData, useLoaderData } from "react-router";
import type { Route } from "./+types/field.selections.$id";
import { pageWorkspaceRefusal, requireMember } from "~/lib/auth/guards.server";
import { viewerOf } from "~/lib/auth/viewer.server";
import { readFormSafe, readId, readQuery } from "~/lib/shared/forms.server";
import { can } from "~/lib/auth/permissions";
import { checkPage } from "~/lib/fieldchecks/page.server";
import { submitCheckForm } from "~/lib/fieldchecks/submit.server";
import type { CheckFields } from "~/lib/fieldchecks";
import { FieldCaution } from "~/components/fieldcheck";
import { CheckForm } from "~/components/field/CheckForm";
import { CheckHistoryList, SelectionSummary } from "~/components/field/SelectionSummary";
import { PendingChecks, usePendingChecks } from "~/components/field/PendingChecks";
import { OfflineReady, useOfflineCopies } from "~/components/field/offline";
import { routeErrorBoundary } from "~/components/RouteError";
import { renderDeep } from "~/lib/shared/units";

// GET /field/selections/:id — the check form (phone first, works offline once opened) and the
// selection's check history.
// POST /field/selections/:id/photos (same module; the path ends in /photos for the 12 MB body limit)
// — the form without JavaScript: records a check with its photos, or an amendment (field `amends`), for the
// workspace the page showed (`pageWorkspaceId`: 409 when the session has switched since, 400 when missing).
// With JavaScript the form goes through the phone's queue to /field/selections/:id/checks.

export const meta: Route.MetaFunction = ({ data }) => [{ title: `Field check · ${data?.selection.title ?? "Selection"} · Dutymark` }, { name: "theme-color", content: "#0d4a45" }];
export const links: Route.LinksFunction = () => [{ rel: "manifest", href: "/field.webmanifest" }, { rel: "apple-touch-icon", href: "/icons/field-192.png" }];

export async function loader({ request, params }: Route.LoaderArgs) {
  const member = await requireMember(request, "fieldcheck.read");
  const selectionId = readId(params.id);
  const url = new URL(request.url);
  const page = await checkPage(viewerOf(member), selectionId, member.user.units, readQuery(url, "amend", 20));
  const owner = `${member.user.id}/${member.workspace.id}`;
  return { ...renderDeep(page, member.user.units), owner, workspaceId: member.workspace.id, mayWrite: can(member.role, "fieldcheck.write"), unitSystem: member.user.units };
}

export async function action({ request, params }: Route.ActionArgs) {
  const member = await requireMember(request, "fieldcheck.write");
  const selectionId = readId(params.id);
  const form = await readFormSafe(request);
  // A check is recorded for the workspace the page showed, or not at all (the selection may be open to both).
  const refused = pageWorkspaceRefusal(member, form.get("pageWorkspaceId"));
  if (refused) return data({ errors: refused.errors, fields: typedFields(form) }, { status: refused.status });
  const outcome = await submitCheckForm(viewerOf(member), selectionId, form);
  if (outcome.ok) throw redirect(`/field/checks/${outcome.id}?recorded=1`);
  const errors = "conflict" in outcome ? { _form: outcome.conflict } : outcome.errors;
  return data({ errors: renderDeep(errors, member.user.units), fields: outcome.fields }, { status: outcome.status });
}

/** What was typed, to draw the form again as it was (photos are files: chosen again). */
function typedFields(form: FormData): CheckFields {
  const fields: CheckFields = {};
  for (const [key, value] of form.entries()) if (typeof value === "string") fields[key] = value;
  return fields;
}

export default function FieldSelection() {
  const page = useLoaderData<typeof loader>();
  const answer = useActionData<typeof action>();
  const selection = page.selection;
  const pending = usePendingChecks(page.owner, selection.id);
  const kept = useOfflineCopies([`/field/selections/${selection.id}`]);
  const fields: CheckFields = answer?.fields && Object.keys(answer.fields).length ? answer.fields : page.fields;
  return (
    <article className="mx-auto max-w-xl space-y-4">
      <SelectionSummary selection={selection} unitSystem={page.unitSystem} />
      <FieldCaution />
      <OfflineReady kept={kept} />
      <PendingChecks pending={pending} unitSystem={page.unitSystem} selection={selection} />
      {page.mayWrite ? (
        <CheckForm selection={selection} owner={page.owner} workspaceId={page.workspaceId} units={page.unitSystem} fields={fields} serverErrors={answer?.errors} amends={page.amends} onQueued={() => void pending.refresh()} />
      ) : (
        <p className="panel text-sm">Your role can read field checks but not record them.</p>
      )}
      <CheckHistoryList selectionId={selection.id} history={page.history} unitSystem={page.unitSystem} />
    </article>
  );
}

export const ErrorBoundary = routeErrorBoundary({ what: "this selection's field check form", back: { href: "/field", label: "All field checks" } });
