// Two tabs, two workspaces: what the stale-workspace tests share. A member of A and B with A's page open
// in one tab switches to B in another; each form of A's page must then refuse rather than act on B.
import { expect } from "vitest";
import { db } from "@db/client.server";
import { memberships } from "@db/schema";
import type { Role } from "~/lib/auth/permissions";
import * as workspaceRoute from "~/routes/workspace";
import { call, type TestMember } from "./harness";

/** The 409's words (`staleWorkspacePage` in guards.server.ts): the page's workspace, then the session's. */
export const STALE = /^Nothing was changed: this page was for the workspace “(.+)”, and you are now working in “(.+)” \(switched in another tab or window\)\. Reload the page and try again\.$/;
/** The 400's words for a form without the page's workspace (`PageWorkspaceId` in forms.server.ts). */
export const OLDER_PAGE = "This form came from an older page: reload the page and try again.";

/** `m` becomes a member of `workspaceId` too, as `role`; their current workspace stays what it was. */
export async function alsoMemberOf(m: TestMember, workspaceId: number, role: Role = "admin") {
  await db().insert(memberships).values({ workspaceId, userId: m.userId, role });
}

/** What "switch" in another tab does: the session's workspace is now `workspaceId`. */
export async function switchTo(m: TestMember, workspaceId: number) {
  const r = await call(workspaceRoute.action as never, { path: "/workspace", cookie: m.cookie, form: { intent: "switch", workspaceId: String(workspaceId) } });
  expect(r.status).toBe(200);
}

/** Every form in the server's HTML (its inner HTML). */
export function formsOf(html: string) {
  return [...html.matchAll(/<form\b[^>]*>(.*?)<\/form>/gs)].map((f) => f[1]);
}

/** Whether a form carries `pageWorkspaceId` = `id` as a plain hidden field (no script needed). */
export const carries = (form: string, id: number) => form.includes(`<input type="hidden" name="pageWorkspaceId" value="${id}"/>`);

/** The `_form` words of an action's refusal. */
export const formError = (body: unknown) => (body as { errors: { _form: string } }).errors._form;
