import * as v from "valibot";
import { Form, useLoaderData } from "react-router";
import type { Route } from "./+types/workspace";
import { changeRole, invite, listInvitations, listMembers, removeMember, renameWorkspace, revokeInvitation, setWorkspaceCurrency, workspaceCurrency } from "~/lib/workspaces";
import { pendingOfferCount } from "~/lib/projects";
import { requireMember, setCurrentWorkspace, staleWorkspacePage } from "~/lib/auth/guards.server";
import { can, ROLE_LABELS, ROLES, type Permission } from "~/lib/auth/permissions";
import { Email, IdField, invalid, Name, PageWorkspaceId, readForm } from "~/lib/shared/forms.server";
import { data } from "react-router";
import { Field, FormOutcome, Options, PageWorkspaceField } from "~/components/forms";
import { routeErrorBoundary } from "~/components/RouteError";
import { PostButton } from "~/components/PostButton";
import { ListTable } from "~/components/ListTable";
import { useFormResult } from "~/components/useFormResult";
import { fmtDate } from "~/lib/shared/format";

export const meta: Route.MetaFunction = () => [{ title: "Workspace · Dutymark" }];

export async function loader({ request }: Route.LoaderArgs) {
  const m = await requireMember(request, "workspace.read");
  const admin = can(m.role, "members.manage");
  const decides = can(m.role, "shares.decide");
  const [members, invites, currency, offersWaiting] = await Promise.all([
    listMembers(m.workspace.id),
    admin ? listInvitations(m.workspace.id) : Promise.resolve([]),
    workspaceCurrency(m.workspace.id),
    decides ? pendingOfferCount(m.workspace.id) : Promise.resolve(null),
  ]);
  return {
    currency,
    offersWaiting,
    me: m.user.id,
    role: m.role,
    workspace: m.workspace,
    workspaces: m.workspaces,
    members: members.map((x) => ({ ...x, since: x.since.toISOString() })),
    invites: invites.map((i) => ({ ...i, expiresAt: i.expiresAt.toISOString(), createdAt: i.createdAt.toISOString() })),
  };
}

const Role = v.picklist(ROLES, "Pick a role.");
/** Every form but the switch acts on the workspace its page showed (`pageWorkspaceId`, checked by `staleWorkspacePage`). */
const page = { pageWorkspaceId: PageWorkspaceId };
const Intent = v.variant("intent", [
  v.object({ intent: v.literal("switch"), workspaceId: IdField }),
  v.object({ intent: v.literal("rename"), name: Name("a workspace name"), ...page }),
  v.object({ intent: v.literal("currency"), currency: v.pipe(v.string(), v.trim(), v.toUpperCase(), v.regex(/^[A-Z]{3}$/, "Give a three-letter ISO 4217 code, e.g. EUR, USD, GBP.")), ...page }),
  v.object({ intent: v.literal("invite"), email: Email, role: Role, ...page }),
  v.object({ intent: v.literal("revoke-invite"), invitationId: IdField, ...page }),
  v.object({ intent: v.literal("role"), membershipId: IdField, role: Role, ...page }),
  v.object({ intent: v.literal("remove"), membershipId: IdField, ...page }),
]);

const NEEDS: Record<string, Permission> = {
  switch: "workspace.read",
  rename: "workspace.rename",
  currency: "workspace.rename",
  invite: "members.manage",
  "revoke-invite": "members.manage",
  role: "members.manage",
  remove: "members.manage",
};

export async function action({ request }: Route.ActionArgs) {
  const base = await requireMember(request);
  const r = await readForm(request, Intent);
  if (!r.ok) return invalid(r.errors);
  const f = r.value;
  // Before the role check: on the other workspace the role may differ, and the page's workspace is the real story.
  const stale = f.intent === "switch" ? null : staleWorkspacePage(base, f.pageWorkspaceId);
  if (stale) return invalid({ _form: stale }, 409);
  if (!can(base.role, NEEDS[f.intent])) throw data(`Your role (${base.role}) in ${base.workspace.name} does not allow this.`, { status: 403 });
  const ws = base.workspace;
  switch (f.intent) {
    case "switch":
      if (!(await setCurrentWorkspace(base.user.id, f.workspaceId))) return invalid({ _form: "You are not a member of that workspace." }, 404);
      return { notice: "Workspace switched." };
    case "rename":
      await renameWorkspace(ws.id, f.name);
      return { notice: "Workspace renamed." };
    case "currency":
      await setWorkspaceCurrency(ws.id, f.currency);
      return { notice: `Energy costs are now shown in ${f.currency}.` };
    case "invite":
      if (!base.user.emailVerified) return invalid({ _form: "Confirm your e-mail address before inviting people (the link is in your inbox; your account page sends a new one)." }, 403);
      await invite({ workspaceId: ws.id, workspaceName: ws.name, inviterId: base.user.id, inviterName: base.user.name, email: f.email, role: f.role });
      return { notice: `Invitation sent to ${f.email}.` };
    case "revoke-invite":
      if (!(await revokeInvitation(ws.id, f.invitationId))) return invalid({ _form: "No such invitation." }, 404);
      return { notice: "Invitation withdrawn." };
    case "role": {
      const res = await changeRole(ws.id, f.membershipId, f.role);
      return typeof res === "string" ? memberRefusal(res) : { notice: roleNotice(f.role, res.withdrawnSentByThem) };
    }
    case "remove": {
      const res = await removeMember(ws.id, f.membershipId);
      return typeof res === "string" ? memberRefusal(res) : { notice: removalNotice(res) };
    }
  }
}

/** A member change refused: the member is not in this workspace, or the workspace would be left without an admin. */
const memberRefusal = (res: "not-found" | "last-admin") =>
  res === "not-found" ? invalid({ _form: "No such member." }, 404) : invalid({ _form: "A workspace needs at least one admin." }, 409);

/** What a role change did, with its numbers: the role, and the pending invitations withdrawn with it (a role that may not invite). */
function roleNotice(role: string, withdrawn: number): string {
  const what = withdrawn === 1 ? "1 pending invitation they had sent" : `${withdrawn} pending invitations they had sent`;
  return withdrawn ? `Role changed to ${role}; withdrawn with it, as a ${role} may not invite: ${what}.` : `Role changed to ${role}.`;
}

/** What a removal did, with its numbers: the member, and the pending invitations withdrawn with them. */
function removalNotice(r: { withdrawnToThem: number; withdrawnSentByThem: number }): string {
  const n = (k: number) => (k === 1 ? "1 pending invitation" : `${k} pending invitations`);
  const parts = [
    r.withdrawnToThem ? `${n(r.withdrawnToThem)} to their address` : "",
    r.withdrawnSentByThem ? `${n(r.withdrawnSentByThem)} they had sent` : "",
  ].filter(Boolean);
  return parts.length ? `Member removed; withdrawn with them: ${parts.join(" and ")}.` : "Member removed; no pending invitations to or from them.";
}

export default function Workspace() {
  const d = useLoaderData<typeof loader>();
  const { errors, notice } = useFormResult();
  const admin = can(d.role, "members.manage");
  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h1 className="text-2xl font-bold text-brand-900">{d.workspace.name}</h1>
        <p className="text-sm text-slate-600">
          You are <strong>{d.role}</strong> here · plan: <strong>{d.workspace.plan === "network" ? "Network" : "Starter (free)"}</strong> ·{" "}
          <a href="/workspace/billing">Plan and billing</a>
        </p>
      </div>
      <FormOutcome notice={notice} error={errors._form ?? errors.pageWorkspaceId} />

      {d.workspaces.length > 1 ? (
        <section className="panel">
          <h2 className="text-lg font-semibold">Your workspaces</h2>
          <ul className="mt-2 flex flex-wrap gap-2">
            {d.workspaces.map((w) => (
              <li key={w.id}>
                <Form method="post">
                  <input type="hidden" name="workspaceId" value={w.id} />
                  <button name="intent" value="switch" className={w.id === d.workspace.id ? "btn" : "btn-quiet"} disabled={w.id === d.workspace.id}>
                    {w.name} <span className="font-normal">({w.role})</span>
                  </button>
                </Form>
              </li>
            ))}
          </ul>
        </section>
      ) : null}

      {can(d.role, "workspace.rename") ? (
        <section className="panel">
          <h2 className="text-lg font-semibold">Name</h2>
          <Form method="post" className="mt-2 flex flex-wrap items-end gap-3">
            <PageWorkspaceField id={d.workspace.id} />
            <input type="hidden" name="intent" value="rename" />
            <Field label="Workspace name" name="name" defaultValue={d.workspace.name} error={errors.name} required />
            <button className="btn">Rename</button>
          </Form>
          <Form method="post" className="mt-3 flex flex-wrap items-end gap-3">
            <PageWorkspaceField id={d.workspace.id} />
            <input type="hidden" name="intent" value="currency" />
            <Field label="Currency of tariffs and energy costs (ISO 4217)" name="currency" defaultValue={d.currency} error={errors.currency} required />
            <button className="btn-quiet">Set currency</button>
          </Form>
        </section>
      ) : null}

      <section className="panel">
        <h2 className="text-lg font-semibold">People</h2>
        <ListTable head={["Name", "E-mail", "Role", ...(admin ? [""] : [])]}>
            {d.members.map((mem) => (
              <tr key={mem.id} className="border-t border-slate-100">
                <td className="py-1">{mem.name || "—"}</td>
                <td>{mem.email}</td>
                <td>
                  {admin ? (
                    <Form method="post" className="flex items-center gap-2">
                      <PageWorkspaceField id={d.workspace.id} />
                      <input type="hidden" name="membershipId" value={mem.id} />
                      <label className="sr-only" htmlFor={`role-${mem.id}`}>
                        Role of {mem.email}
                      </label>
                      <select id={`role-${mem.id}`} name="role" defaultValue={mem.role} className="field w-auto py-0.5">
                        <Options values={ROLES} />
                      </select>
                      <button className="btn-quiet py-0.5" name="intent" value="role">
                        Set
                      </button>
                    </Form>
                  ) : (
                    mem.role
                  )}
                </td>
                {admin ? (
                  <td className="text-right">
                    {mem.userId !== d.me ? (
                      <PostButton intent="remove" field="membershipId" id={mem.id} fields={{ pageWorkspaceId: d.workspace.id }} className="btn-quiet py-0.5">
                        Remove
                      </PostButton>
                    ) : null}
                  </td>
                ) : null}
              </tr>
            ))}
        </ListTable>
        {admin ? (
          <p className="mt-2 text-sm text-slate-600">
            Removing someone also withdraws the invitations to their address that are still pending here, and the pending invitations they sent;
            giving an admin a role that may not invite withdraws the pending invitations they sent. Invitations already accepted stay. A workspace keeps at least one admin.
          </p>
        ) : null}
      </section>

      {admin ? (
        <section className="panel space-y-3">
          <h2 className="text-lg font-semibold">Invite someone</h2>
          <Form method="post" className="flex flex-wrap items-end gap-3">
            <PageWorkspaceField id={d.workspace.id} />
            <input type="hidden" name="intent" value="invite" />
            <Field label="E-mail" name="email" type="email" error={errors.email} required />
            <div>
              <label className="label" htmlFor="f-invite-role">
                Role
              </label>
              <select id="f-invite-role" name="role" className="field" defaultValue="engineer">
                <Options values={ROLES} label={(r) => ROLE_LABELS[r]} />
              </select>
            </div>
            <button className="btn">Send invitation</button>
          </Form>
          {d.invites.length ? (
            <ul className="text-sm">
              {d.invites.map((i) => (
                <li key={i.id} className="flex items-center justify-between border-t border-slate-100 py-1">
                  <span>
                    {i.email} as {i.role} · expires {fmtDate(i.expiresAt)}
                  </span>
                  <PostButton intent="revoke-invite" field="invitationId" id={i.id} fields={{ pageWorkspaceId: d.workspace.id }} className="btn-quiet py-0.5">
                    Withdraw
                  </PostButton>
                </li>
              ))}
            </ul>
          ) : null}
        </section>
      ) : null}
      {d.offersWaiting !== null ? (
        <section className="panel">
          <h2 className="text-lg font-semibold">Projects offered to this workspace</h2>
          <p className="mt-1 text-sm text-slate-700">
            Other workspaces can offer you their projects for field checks; nothing of a project is open here until an admin accepts it.{" "}
            <a href="/workspace/shares">{d.offersWaiting === 0 ? "See the offers (none waiting for an answer)" : `${d.offersWaiting === 1 ? "1 offer waits" : `${d.offersWaiting} offers wait`} for your answer`}</a>
          </p>
        </section>
      ) : null}
      <p>
        <a href="/workspace/new">Create another workspace</a>
      </p>
    </div>
  );
}

export const ErrorBoundary = routeErrorBoundary({ what: "this workspace", back: { href: "/projects", label: "Your projects" } });
