// Throwing guards, called first in every loader and action. The server decides; the UI only hides.
import * as v from "valibot";
import { data, redirect } from "react-router";
import { and, asc, eq, isNull } from "drizzle-orm";
import { db } from "@db/client.server";
import { apiTokens, memberships, sessions, users, workspaces } from "@db/schema";
import { getAuth, sessionIdOfRequest, type Auth } from "./session.server";
import { can, READ_ONLY_PERMISSIONS, type Permission, type Role } from "./permissions";
import { hashSecret } from "./secrets.server";
import { forbidden, unauthorized } from "../shared/problem.server";
import { cachedToken, rememberToken, tokenGeneration } from "./token-cache.server";
import { SI_UNITS, type UnitChoice } from "../shared/units";
import { oncePerRequest, readsShared } from "../shared/request-scope.server";
import { invalid, PageWorkspaceId, readForm, type FieldErrors } from "../shared/forms.server";
import { viewerOf, type Viewer } from "./viewer.server";

export type WorkspaceInfo = { id: number; name: string; slug: string; plan: "free" | "network" };
export type Member = Auth & {
  workspace: WorkspaceInfo;
  role: Role;
  workspaces: (WorkspaceInfo & { role: Role })[];
};

function signInRedirect(request: Request): never {
  const u = new URL(request.url);
  const next = u.pathname + u.search;
  throw redirect(`/signin?next=${encodeURIComponent(next)}`);
}

/** Signed in, or a redirect to the sign-in page that comes back here. */
export async function requireUser(request: Request): Promise<Auth> {
  const auth = await getAuth(request);
  if (!auth) signInRedirect(request);
  return auth;
}

/** A workspace as its members see it in lists, with the member's role. */
const WORKSPACE_ROW = { id: workspaces.id, name: workspaces.name, slug: workspaces.slug, plan: workspaces.plan, role: memberships.role };

export async function workspacesOf(userId: string) {
  return db()
    .select(WORKSPACE_ROW)
    .from(memberships)
    .innerJoin(workspaces, eq(memberships.workspaceId, workspaces.id))
    .where(eq(memberships.userId, userId))
    .orderBy(asc(workspaces.name));
}

/**
 * The workspaces of the user whose session is `sessionId`, by name. It needs only the cookie, so a page
 * starts it beside the session's own check (`requireMember`, the root loader): one round trip to the
 * database before the page's own reads instead of two. Trusted only through `membershipFor`, which takes
 * the checked session. Memoised per request scope (a promise, not drizzle's builder, which would run again
 * on every await).
 */
function workspacesOfSession(sessionId: string): Promise<(WorkspaceInfo & { role: Role })[]> {
  return oncePerRequest(`workspaces-of-session:${sessionId}`, async () =>
    db()
      .select(WORKSPACE_ROW)
      .from(sessions)
      .innerJoin(memberships, eq(memberships.userId, sessions.userId))
      .innerJoin(workspaces, eq(memberships.workspaceId, workspaces.id))
      .where(eq(sessions.id, sessionId))
      .orderBy(asc(workspaces.name)),
  );
}

/** The member's workspaces and the current one (the user's choice, else the first by name); one list per request scope. */
export function membershipFor(auth: Auth) {
  return oncePerRequest(`membership:${auth.session.id}:${auth.user.currentWorkspaceId ?? ""}`, async () => {
    const list = await workspacesOfSession(auth.session.id);
    const current = list.find((w) => w.id === auth.user.currentWorkspaceId) ?? list[0] ?? null;
    return { list, current };
  });
}

/**
 * The signed-in user of this request (or null) with the workspace list read at the same time. Only where
 * reads are shared (a GET's scope): elsewhere the early list could not be reused and would be a wasted query.
 */
export async function authWithWorkspaces(request: Request): Promise<{ auth: Auth; membership: Awaited<ReturnType<typeof membershipFor>> } | null> {
  const sessionId = readsShared() ? sessionIdOfRequest(request) : null;
  // Started now, awaited by membershipFor below once the session checks out; if it does not, nobody awaits it.
  if (sessionId) workspacesOfSession(sessionId).catch(() => {});
  const auth = await getAuth(request);
  return auth ? { auth, membership: await membershipFor(auth) } : null;
}

/**
 * Signed in, a member of a workspace, and (when given) allowed `permission` there.
 * Not signed in → redirect to sign-in; no workspace → redirect to create one; lacking permission → 403.
 */
export async function requireMember(request: Request, permission?: Permission): Promise<Member> {
  const signedIn = await authWithWorkspaces(request);
  if (!signedIn) signInRedirect(request);
  const { auth, membership: { list, current } } = signedIn;
  if (!current) throw redirect("/workspace/new");
  const { role, ...workspace } = current;
  if (permission && !can(role, permission)) {
    throw data(`Your role (${role}) in ${workspace.name} does not allow this.`, { status: 403 });
  }
  return { ...auth, workspace, role, workspaces: list };
}

/**
 * The action of a workspace's "new …" form: a member with `permission` (else 401/403 as `requireMember`), the
 * form read with `schema` and the page's workspace (`pageWorkspaceId`), then its field errors (400), the page's
 * workspace refused when the session has moved to another since (409, `staleWorkspacePage`: nothing created),
 * or `create` and a redirect to `page(id)`; a post without JavaScript lands there too.
 */
export async function createAsMember<E extends v.ObjectEntries>(
  request: Request,
  permission: Permission,
  schema: v.ObjectSchema<E, undefined>,
  create: (viewer: Viewer, value: v.InferOutput<v.ObjectSchema<E, undefined>>) => Promise<number>,
  page: (id: number) => string,
) {
  const m = await requireMember(request, permission);
  const r = await readForm(request, v.object({ ...schema.entries, pageWorkspaceId: PageWorkspaceId }));
  if (!r.ok) return invalid(r.errors);
  // The generic object's output loses its keys' types here: the page's id is the number PageWorkspaceId makes, the rest `schema`'s.
  const { pageWorkspaceId, ...value } = r.value as { pageWorkspaceId: number };
  const stale = staleWorkspacePage(m, pageWorkspaceId);
  if (stale) return invalid({ _form: stale }, 409);
  throw redirect(page(await create(viewerOf(m), value as v.InferOutput<v.ObjectSchema<E, undefined>>)));
}

/**
 * A form acts on the workspace its page showed, or on none. Forms send the page's workspace id
 * (`PageWorkspaceId`); when the session has since moved to another workspace (switched in another tab),
 * the words of the 409 refusal, naming both; null when they are the same.
 */
export function staleWorkspacePage(m: Member, pageWorkspaceId: number): string | null {
  if (pageWorkspaceId === m.workspace.id) return null;
  const shown = m.workspaces.find((w) => w.id === pageWorkspaceId);
  return (
    `Nothing was changed: this page was for ${shown ? `the workspace “${shown.name}”` : "a workspace you are no longer in"}, ` +
    `and you are now working in “${m.workspace.name}” (switched in another tab or window). Reload the page and try again.`
  );
}

/**
 * The phone's queue (not a page to reload): a check entered in another workspace than the session's now waits on the
 * phone until the session is back there; one entered in a workspace the user has left cannot be recorded at all.
 */
export function queuedCheckWaits(m: Member, pageWorkspaceId: number): string {
  const entered = m.workspaces.find((w) => w.id === pageWorkspaceId);
  return entered
    ? `Not sent yet: this check was entered in the workspace “${entered.name}”, and you are now working in “${m.workspace.name}”. Switch back to “${entered.name}” to send it; it stays on this phone until then.`
    : `Not sent: this check was entered in a workspace you are no longer in, so it cannot be recorded there. Its readings stay on this phone: copy them into a new check, or delete it.`;
}

/**
 * For an action that reads its body as FormData (the field-check form and the phone's queue): the page's
 * workspace as posted (`raw`, the form's `pageWorkspaceId`) refused — 400 when missing (a page from before the
 * field), 409 when the session has moved to another workspace (`staleWorkspacePage`) — or null to go on.
 */
export function pageWorkspaceRefusal(m: Member, raw: FormDataEntryValue | null): { status: 400 | 409; errors: FieldErrors } | null {
  const r = v.safeParse(PageWorkspaceId, typeof raw === "string" ? raw : undefined);
  if (!r.success) return { status: 400, errors: { pageWorkspaceId: r.issues[0].message } };
  const stale = staleWorkspacePage(m, r.output);
  return stale ? { status: 409, errors: { _form: stale } } : null;
}

export type ApiCaller = {
  userId: string;
  workspace: WorkspaceInfo;
  role: Role;
  via: "token" | "session";
  scope: "read" | "write";
  /** Units for text with quantities: the user's on our own pages (session), SI for tokens (the API is SI). */
  units: UnitChoice;
};

/**
 * For /api/v1/*: a Bearer token (or, from our own pages, the session cookie). Without valid
 * credentials → 401 problem+json; valid but lacking scope or role → 403 problem+json.
 */
export async function requireApi(request: Request, permission: Permission): Promise<ApiCaller> {
  const authz = request.headers.get("authorization");
  let caller: ApiCaller;
  if (authz) {
    const m = /^Bearer\s+([A-Za-z0-9_\-.]{10,200})$/i.exec(authz.trim());
    if (!m) throw unauthorized("Malformed Authorization header.");
    const tokenHash = hashSecret(m[1]);
    const known = cachedToken(tokenHash);
    if (known) return authorise(known.caller, permission);
    // Read before the lookup: a revocation meanwhile (forgetTokens) keeps this answer out of the cache.
    const since = tokenGeneration();
    const [row] = await db()
      .select({
        id: apiTokens.id,
        userId: apiTokens.userId,
        scope: apiTokens.scope,
        lastUsedAt: apiTokens.lastUsedAt,
        role: memberships.role,
        ws: { id: workspaces.id, name: workspaces.name, slug: workspaces.slug, plan: workspaces.plan },
      })
      .from(apiTokens)
      .innerJoin(memberships, and(eq(memberships.userId, apiTokens.userId), eq(memberships.workspaceId, apiTokens.workspaceId)))
      .innerJoin(workspaces, eq(workspaces.id, apiTokens.workspaceId))
      .where(and(eq(apiTokens.tokenHash, tokenHash), isNull(apiTokens.revokedAt)));
    if (!row) throw unauthorized("Unknown or revoked API token.");
    // "Last used" to the minute: one write per token per minute, not one per request.
    if (!row.lastUsedAt || Date.now() - row.lastUsedAt.getTime() > 60_000) {
      await db().update(apiTokens).set({ lastUsedAt: new Date() }).where(eq(apiTokens.id, row.id));
    }
    caller = { userId: row.userId, workspace: row.ws, role: row.role, via: "token", scope: row.scope, units: SI_UNITS };
    rememberToken(tokenHash, { caller, tokenId: row.id, lastUsedAt: Date.now() }, since);
  } else {
    const auth = await getAuth(request);
    if (!auth) throw unauthorized();
    const { current } = await membershipFor(auth);
    if (!current) throw forbidden("You are not a member of any workspace.");
    const { role, ...workspace } = current;
    caller = { userId: auth.user.id, workspace, role, via: "session", scope: "write", units: auth.user.units };
  }
  return authorise(caller, permission);
}

function authorise(caller: ApiCaller, permission: Permission): ApiCaller {
  if (caller.scope === "read" && !READ_ONLY_PERMISSIONS.has(permission)) {
    throw forbidden("This token has read scope; this call needs a read-write token.");
  }
  if (!can(caller.role, permission)) throw forbidden(`Role ${caller.role} may not do this (${permission}).`);
  return caller;
}

export async function setCurrentWorkspace(userId: string, workspaceId: number): Promise<boolean> {
  const list = await workspacesOf(userId);
  if (!list.some((w) => w.id === workspaceId)) return false;
  await db().update(users).set({ currentWorkspaceId: workspaceId }).where(eq(users.id, userId));
  return true;
}
