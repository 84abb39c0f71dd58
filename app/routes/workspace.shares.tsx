import * as v from "valibot";
import { useLoaderData } from "react-router";
import type { Route } from "./+types/workspace.shares";
import { requireMember, staleWorkspacePage } from "~/lib/auth/guards.server";
import { viewerOf } from "~/lib/auth/viewer.server";
import { decideShare, offersTo } from "~/lib/projects";
import { IdField, invalid, PageWorkspaceId, QueryId, readForm, readQuery } from "~/lib/shared/forms.server";
import { fmtDate } from "~/lib/shared/format";
import { FormOutcome } from "~/components/forms";
import { Crumbs } from "~/components/Crumbs";
import { ListTable } from "~/components/ListTable";
import { Pager } from "~/components/Pager";
import { PostButton } from "~/components/PostButton";
import { routeErrorBoundary } from "~/components/RouteError";
import { useFormResult } from "~/components/useFormResult";

// GET/POST /workspace/shares — "Projects offered to this workspace": the workspace's admins see the projects other
// workspaces offer it for field checks and accept or decline each (or stop one accepted earlier). Only an accepted share
// opens a project's selections to the members here (lib/projects/share-offers.server.ts).

export const meta: Route.MetaFunction = () => [{ title: "Projects offered to this workspace · Dutymark" }];

export async function loader({ request }: Route.LoaderArgs) {
  const m = await requireMember(request, "shares.decide");
  const { page } = readQuery(request.url, v.object({ page: QueryId }));
  return { workspace: { id: m.workspace.id, name: m.workspace.name }, ...(await offersTo(viewerOf(m), page)) };
}

const Answer = v.object({ intent: v.picklist(["accept", "decline"], "Choose Accept or Decline."), shareId: IdField, pageWorkspaceId: PageWorkspaceId });

export async function action({ request }: Route.ActionArgs) {
  const m = await requireMember(request);
  const r = await readForm(request, Answer);
  if (!r.ok) return invalid(r.errors);
  // Before the role check, as the Workspace page: on the other workspace the role may differ.
  const stale = staleWorkspacePage(m, r.value.pageWorkspaceId);
  if (stale) return invalid({ _form: stale }, 409);
  // The role (shares.decide) is checked by the service: 403 for any other.
  const out = await decideShare(viewerOf(m), r.value.shareId, r.value.intent);
  if (!out.ok) return invalid({ _form: out.error }, out.status);
  const what = `“${out.projectName}” from ${out.fromWorkspace}`;
  if (out.state === "accepted") return { notice: out.already ? `${what} was already accepted.` : `Accepted ${what}: its selections are now under Field checks for every member here.` };
  return { notice: out.already ? `${what} was already declined.` : `Declined ${what}: nothing of it is open to this workspace. Checks recorded here stay with its owner.` };
}

type Offer = Awaited<ReturnType<typeof loader>>["offers"][number];

function stateText(o: Offer): string {
  const by = o.decidedBy ? ` by ${o.decidedBy}` : "";
  if (o.state === "pending") return "Waiting for an admin's answer";
  if (o.state === "accepted") return o.decidedAt ? `Accepted${by} on ${fmtDate(o.decidedAt)}` : "Accepted (shared before offers needed accepting)";
  return `Declined${by}${o.decidedAt ? ` on ${fmtDate(o.decidedAt)}` : ""}`;
}

export default function WorkspaceShares() {
  const d = useLoaderData<typeof loader>();
  const { errors, notice } = useFormResult();
  const page = { pageWorkspaceId: d.workspace.id };
  return (
    <div className="space-y-6">
      <header>
        <Crumbs trail={[["/workspace", d.workspace.name]]} />
        <h1 className="text-2xl font-bold text-brand-900">Projects offered to this workspace</h1>
        <p className="text-sm text-slate-700">
          Another workspace can offer you a project so that your contractors check its pumps on site. Once you accept, every member of {d.workspace.name} sees
          the project's selections under Field checks, can record checks against them and sees every check recorded on them; the project itself stays theirs.
          Declining, or stopping a share you accepted, closes it again; checks already recorded stay with the project's owner. A declined offer stays declined:
          the owner can offer the project again, as a new offer.
        </p>
      </header>
      <FormOutcome notice={notice} error={errors._form ?? errors.pageWorkspaceId ?? errors.shareId ?? errors.intent} />
      <section className="panel">
        {d.offers.length === 0 ? (
          <p className="text-sm text-slate-600">No project has been offered to this workspace.</p>
        ) : (
          <ListTable head={["Project", "Offered by", "State", ""]} label="Projects offered to this workspace">
            {d.offers.map((o) => (
              <tr key={o.id} className="border-t border-slate-100 align-top" data-share-state={o.state}>
                <td className="py-1">
                  {o.projectName}
                  <span className="block text-xs text-slate-600">
                    {o.selections === 1 ? "1 selection" : `${o.selections} selections`}
                  </span>
                </td>
                <td>
                  {o.fromWorkspace}
                  <span className="block text-xs text-slate-600">
                    {o.offeredBy ? `${o.offeredBy}, ` : ""}
                    {fmtDate(o.createdAt)}
                  </span>
                </td>
                <td>{stateText(o)}</td>
                <td className="text-right">
                  <div className="flex flex-wrap justify-end gap-2">
                    {o.state === "pending" ? (
                      <PostButton intent="accept" field="shareId" id={o.id} fields={page} className="btn py-0.5">
                        Accept
                      </PostButton>
                    ) : null}
                    {o.state !== "declined" ? (
                      <PostButton intent="decline" field="shareId" id={o.id} fields={page} className="btn-quiet py-0.5">
                        {o.state === "pending" ? "Decline" : "Stop receiving"}
                      </PostButton>
                    ) : null}
                  </div>
                </td>
              </tr>
            ))}
          </ListTable>
        )}
        <Pager paging={d.paging} label="Pages of offers" />
      </section>
    </div>
  );
}

export const ErrorBoundary = routeErrorBoundary({ what: "the projects offered to this workspace", back: { href: "/workspace", label: "Workspace" } });
