import * as v from "valibot";
import { Form, useActionData, useLoaderData } from "react-router";
import type { Route } from "./+types/projects.$id.share";
import { requireMember } from "~/lib/auth/guards.server";
import { viewerOf } from "~/lib/auth/viewer.server";
import { IdField, invalid, readForm, readId } from "~/lib/shared/forms.server";
import { listShares, shareProject, unshareProject } from "~/lib/projects";
import { routeErrorBoundary } from "~/components/RouteError";
import { Crumbs } from "~/components/Crumbs";
import { fmtDate } from "~/lib/shared/format";
import { PostButton } from "~/components/PostButton";

// GET/POST /projects/:id/share — the engineer offers a project to another workspace (e.g. the commissioning
// contractor) by its exact name or short name; lists each share with its state (waiting for the other workspace's
// admins, accepted, declined) and withdraws it. Nothing opens until an admin there accepts (/workspace/shares).

export const meta: Route.MetaFunction = ({ data }) => [{ title: `Share ${data?.project.name ?? "project"} · Dutymark` }];

export async function loader({ request, params }: Route.LoaderArgs) {
  const m = await requireMember(request, "project.write");
  return listShares(viewerOf(m), readId(params.id));
}

const ShareForm = v.variant("intent", [
  v.object({ intent: v.literal("share"), workspace: v.pipe(v.string(), v.trim(), v.minLength(1, "Enter the workspace's exact name or short name."), v.maxLength(140, "That name is too long.")) }),
  v.object({ intent: v.literal("unshare"), shareId: IdField }),
]);

export async function action({ request, params }: Route.ActionArgs) {
  const m = await requireMember(request, "project.write");
  const viewer = viewerOf(m);
  const projectId = readId(params.id);
  const r = await readForm(request, ShareForm);
  if (!r.ok) return invalid(r.errors);
  if (r.value.intent === "share") {
    const out = await shareProject(viewer, projectId, r.value.workspace);
    if (!out.ok) return invalid({ workspace: out.error }, out.status);
    return { message: offerMessage(out) };
  }
  const removed = await unshareProject(viewer, projectId, r.value.shareId);
  if (!removed) return invalid({ _form: "No such share on this project." }, 404);
  return { message: WITHDRAWN[removed] };
}

const WAITING = "Nothing is open to its members until one of its admins accepts; this page shows their answer.";

function offerMessage(out: Extract<Awaited<ReturnType<typeof shareProject>>, { ok: true }>): string {
  switch (out.outcome) {
    case "offered":
      return `Offered to ${out.name}. ${WAITING}`;
    case "again":
      return `Offered again to ${out.name}, as a new offer (they had declined the last one${out.declinedAt ? ` on ${fmtDate(out.declinedAt)}` : ""}). ${WAITING}`;
    case "pending":
      return `Already offered to ${out.name}, waiting for its admins to accept.`;
    case "accepted":
      return `Already shared with ${out.name}: they accepted, and their members can record field checks on this project's selections.`;
  }
}

const WITHDRAWN = {
  pending: "Offer withdrawn: it no longer waits for their answer.",
  accepted: "Share stopped: their members no longer see this project. Checks already recorded stay on record.",
  declined: "Declined offer removed from this list.",
} as const;

/** Each state in the owner's words: who is to act, and since when. */
function stateText(s: { state: "pending" | "accepted" | "declined"; decidedAt: string | null }): string {
  if (s.state === "pending") return "waiting for their admins to accept";
  if (s.state === "accepted") return s.decidedAt ? `accepted on ${fmtDate(s.decidedAt)}` : "accepted (shared before offers needed accepting)";
  return `declined${s.decidedAt ? ` on ${fmtDate(s.decidedAt)}` : ""}: share with them again to make a new offer`;
}
const BUTTON = { pending: "Withdraw the offer", accepted: "Stop sharing", declined: "Remove" } as const;

export default function ShareProject() {
  const d = useLoaderData<typeof loader>();
  const a = useActionData<typeof action>() as { message?: string; errors?: Record<string, string> } | undefined;
  return (
    <article className="mx-auto max-w-xl space-y-4">
      <header>
        <Crumbs trail={[[`/projects/${d.project.id}`, d.project.name]]} />
        <h1 className="text-xl font-bold text-brand-900">Share with a contractor</h1>
        <p className="text-sm text-slate-700">
          Sharing offers the project to the other workspace; once one of its admins accepts, its members see this project's selections under Field checks,
          record checks against them, and see every check recorded on them. They cannot change the project. You can withdraw an offer or stop a share at any
          time.
        </p>
      </header>
      {a?.message ? (
        <p role="status" className="panel text-sm">
          {a.message}
        </p>
      ) : null}
      {a?.errors?._form ? (
        <p role="alert" className="caution">
          {a.errors._form}
        </p>
      ) : null}
      <Form method="post" className="panel space-y-2">
        <input type="hidden" name="intent" value="share" />
        <label className="block text-sm">
          <span className="label">Workspace name or short name</span>
          <input name="workspace" className="field w-full" autoComplete="off" aria-describedby="workspace-help" aria-invalid={a?.errors?.workspace ? true : undefined} />
        </label>
        <p id="workspace-help" className="text-xs text-slate-600">
          Exactly as the other workspace shows it on its Workspace page.
        </p>
        {a?.errors?.workspace ? <p className="text-sm text-fail">{a.errors.workspace}</p> : null}
        <button type="submit" className="btn">
          Share
        </button>
      </Form>
      <section className="panel">
        <h2 className="font-semibold">Offered to and shared with</h2>
        {d.shares.length === 0 ? (
          <p className="mt-2 text-sm text-slate-600">Nobody outside this workspace.</p>
        ) : (
          <ul className="mt-2 divide-y divide-slate-100 text-sm">
            {d.shares.map((s) => (
              <li key={s.id} className="flex items-center justify-between gap-2 py-2" data-share-state={s.state}>
                <span>
                  <span>
                    {s.workspaceName} <span className="text-slate-500">({s.workspaceSlug})</span> · offered {fmtDate(s.createdAt)}
                  </span>
                  <span className="block text-xs text-slate-600">{stateText(s)}</span>
                </span>
                <PostButton intent="unshare" field="shareId" id={s.id}>
                  {BUTTON[s.state]}
                </PostButton>
              </li>
            ))}
          </ul>
        )}
      </section>
    </article>
  );
}

export const ErrorBoundary = routeErrorBoundary({ what: "this project's sharing", back: { href: "/projects", label: "Your projects" } });
