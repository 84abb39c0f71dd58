import * as v from "valibot";
import { Form, useLoaderData, useSearchParams } from "react-router";
import type { Route } from "./+types/account";
import { deviceId, listSessions, revokeDevice } from "~/lib/auth/session.server";
import { sendVerification, updateProfile } from "~/lib/auth/accounts.server";
import { unitsNotice } from "~/lib/auth/stored-units";
import { createApiToken, listApiTokens, revokeApiToken } from "~/lib/auth/api-tokens.server";
import { requireMember, staleWorkspacePage } from "~/lib/auth/guards.server";
import { IdField, invalid, Name, PageWorkspaceId, readForm } from "~/lib/shared/forms.server";
import { Field, FormOutcome, Notice, PageWorkspaceField } from "~/components/forms";
import { routeErrorBoundary } from "~/components/RouteError";
import { ListTable } from "~/components/ListTable";
import { PostButton } from "~/components/PostButton";
import { UnitsFieldset } from "~/components/UnitsFieldset";
import { StoredProblems } from "~/components/StoredProblems";
import { useFormResult } from "~/components/useFormResult";
import { PRESET_IDS, SETTABLE } from "~/lib/shared/units";
import { UNITS, type Quantity } from "~/engine";
import { fmtUtc } from "~/lib/shared/format";

export const meta: Route.MetaFunction = () => [{ title: "Your account · Dutymark" }];

export async function loader({ request }: Route.LoaderArgs) {
  const m = await requireMember(request);
  const [devices, tokens] = await Promise.all([listSessions(m.user.id), listApiTokens(m.user.id, m.workspace.id)]);
  return {
    user: { email: m.user.email, name: m.user.name, emailVerified: m.user.emailVerified, unitSystem: m.user.unitSystem, overrides: m.user.unitPicks },
    /** The stored unit settings that cannot be read, said above the form (null when they can). */
    unitsUnreadable: unitsNotice({ preset: m.user.unitSystem, problems: m.user.unitProblems }),
    workspace: m.workspace,
    devices: devices.map((d) => ({
      id: deviceId(d.id), // opaque: the session id is the cookie's value and never leaves the server
      current: d.id === m.session.id,
      createdAt: d.createdAt.toISOString(),
      userAgent: d.userAgent,
      ipAddress: d.ipAddress,
    })),
    tokens: tokens.map((t) => ({ ...t, lastUsedAt: t.lastUsedAt?.toISOString() ?? null, createdAt: t.createdAt.toISOString() })),
  };
}

/** One select per quantity: "" follows the preset, else one of the engine's unit ids for it. */
const UnitPicks = Object.fromEntries(
  SETTABLE.map((q) => [`unit.${q}`, v.optional(v.picklist(["", ...UNITS[q].map((d) => d.id)], `That is not a unit of ${q}: pick one from the list.`), "")]),
) as unknown as Record<`unit.${Quantity}`, v.OptionalSchema<v.PicklistSchema<string[], string>, "">>;

const Intent = v.variant("intent", [
  v.object({ intent: v.literal("profile"), name: Name("your name"), unitSystem: v.picklist(PRESET_IDS, "Pick SI or US units."), ...UnitPicks }),
  v.object({ intent: v.literal("resend") }),
  v.object({ intent: v.literal("revoke-device"), sessionId: v.pipe(v.string(), v.maxLength(255)) }),
  // A token belongs to the workspace the page showed (`pageWorkspaceId`, checked by `staleWorkspacePage`). The other
  // intents act on the account (profile, devices) or on one token by its id (revoke), whatever the workspace.
  v.object({ intent: v.literal("create-token"), name: Name("a token name", 80), scope: v.picklist(["read", "write"], "Pick a scope."), pageWorkspaceId: PageWorkspaceId }),
  v.object({ intent: v.literal("revoke-token"), tokenId: IdField }),
]);

export async function action({ request }: Route.ActionArgs) {
  const m = await requireMember(request);
  const r = await readForm(request, Intent);
  if (!r.ok) return invalid(r.errors);
  const f = r.value;
  switch (f.intent) {
    case "profile":
      await updateProfile(m.user.id, {
        name: f.name,
        unitSystem: f.unitSystem,
        units: Object.fromEntries(SETTABLE.flatMap((q) => (f[`unit.${q}`] ? [[q, f[`unit.${q}`]]] : []))),
      });
      return { notice: "Profile saved." };
    case "resend":
      await sendVerification(m.user.id);
      return { notice: "A new confirmation link is on its way." };
    case "revoke-device":
      if (!(await revokeDevice(m.user.id, f.sessionId))) return invalid({ _form: "No such device." }, 404);
      return { notice: "That device is signed out." };
    case "create-token": {
      const stale = staleWorkspacePage(m, f.pageWorkspaceId);
      if (stale) return invalid({ _form: stale }, 409);
      if (!m.user.emailVerified) return invalid({ _form: "Confirm your e-mail address before creating API tokens (the link is in your inbox; you can ask for a new one below)." }, 403);
      const { token } = await createApiToken({ userId: m.user.id, workspaceId: m.workspace.id, name: f.name, scope: f.scope });
      return { notice: "Token created. Copy it now: it is shown only this once.", token };
    }
    case "revoke-token":
      if (!(await revokeApiToken(m.user.id, f.tokenId))) return invalid({ _form: "No such token." }, 404);
      return { notice: "Token revoked." };
  }
}

const fmt = (iso: string | null) => (iso ? fmtUtc(iso) : "never");

export default function Account() {
  const d = useLoaderData<typeof loader>();
  const { errors, notice, data: a } = useFormResult<{ token?: string }>();
  const [params] = useSearchParams();
  return (
    <div className="space-y-6">
      <h1 className="text-2xl font-bold text-brand-900">Your account</h1>
      {params.get("welcome") ? <Notice>Welcome to Dutymark. We sent a link to {d.user.email} to confirm the address.</Notice> : null}
      <FormOutcome notice={notice} error={errors._form ?? errors.pageWorkspaceId} />
      {a?.token ? (
        <div className="panel border-duty">
          <p className="text-sm font-semibold">New API token (shown once):</p>
          <code data-testid="new-token" className="mt-1 block break-all rounded bg-slate-100 p-2 text-sm">
            {a.token}
          </code>
        </div>
      ) : null}
      <section className="panel space-y-3">
        <h2 className="text-lg font-semibold">Profile</h2>
        <p className="text-sm">
          {d.user.email} ·{" "}
          {d.user.emailVerified ? (
            <span className="text-brand-700">address confirmed</span>
          ) : (
            <span className="text-duty-ink">address not confirmed yet</span>
          )}
        </p>
        {!d.user.emailVerified ? (
          <PostButton intent="resend">Send the confirmation link again</PostButton>
        ) : null}
        <Form method="post" className="grid max-w-lg gap-3">
          <input type="hidden" name="intent" value="profile" />
          <Field label="Name" name="name" defaultValue={d.user.name} error={errors.name} required />
          {d.unitsUnreadable ? (
            <div className="space-y-1 rounded-md border border-duty px-3 py-2" role="note">
              <p className="text-sm" data-testid="units-unreadable">
                {d.unitsUnreadable.text}
              </p>
              <StoredProblems problems={d.unitsUnreadable.problems} count={d.unitsUnreadable.count} />
            </div>
          ) : null}
          <UnitsFieldset preset={d.user.unitSystem} overrides={d.user.overrides} errors={errors} />
          <div>
            <button className="btn">Save profile</button>
          </div>
        </Form>
      </section>
      <section className="panel">
        <h2 className="text-lg font-semibold">Signed-in devices</h2>
        <ListTable head={["Device", "Address", "Signed in", ""]}>
            {d.devices.map((dev) => (
              <tr key={dev.id} className="border-t border-slate-100">
                <td className="max-w-xs truncate py-1">{dev.userAgent || "unknown"}</td>
                <td>{dev.ipAddress || "—"}</td>
                <td>{fmt(dev.createdAt)}</td>
                <td className="text-right">
                  {dev.current ? (
                    <span className="text-slate-500">this device</span>
                  ) : (
                    <PostButton intent="revoke-device" field="sessionId" id={dev.id}>
                      Sign out
                    </PostButton>
                  )}
                </td>
              </tr>
            ))}
        </ListTable>
      </section>
      <section className="panel space-y-3">
        <h2 className="text-lg font-semibold">API tokens for {d.workspace.name}</h2>
        <p className="text-sm text-slate-600">
          For scripts calling <code>/api/v1/…</code> with <code>Authorization: Bearer &lt;token&gt;</code>. Stored hashed; shown only when
          created.
        </p>
        {d.tokens.length ? (
          <ListTable head={["Name", "Starts with", "Scope", "Last used", ""]} className="">
              {d.tokens.map((t) => (
                <tr key={t.id} className="border-t border-slate-100">
                  <td className="py-1">{t.name}</td>
                  <td>
                    <code>{t.prefix}…</code>
                  </td>
                  <td>{t.scope === "write" ? "read-write" : "read"}</td>
                  <td>{fmt(t.lastUsedAt)}</td>
                  <td className="text-right">
                    <PostButton intent="revoke-token" field="tokenId" id={t.id}>
                      Revoke
                    </PostButton>
                  </td>
                </tr>
              ))}
          </ListTable>
        ) : (
          <p className="text-sm text-slate-600">No tokens yet.</p>
        )}
        <Form method="post" className="flex flex-wrap items-end gap-3">
          <input type="hidden" name="intent" value="create-token" />
          <PageWorkspaceField id={d.workspace.id} />
          <Field label="Token name" name="name" error={errors.name} required />
          <div>
            <label className="label" htmlFor="f-scope">
              Scope
            </label>
            <select id="f-scope" name="scope" className="field">
              <option value="read">read</option>
              <option value="write">read-write</option>
            </select>
          </div>
          <button className="btn">Create token</button>
        </Form>
      </section>
    </div>
  );
}

export const ErrorBoundary = routeErrorBoundary({ what: "your account", back: { href: "/", label: "The start page" } });
