// The forms beyond the workspace and billing pages that act on the session's current workspace with no
// id in the address to pin it: "new project" (/projects), "new library" (/libraries), "create token"
// (/account: a token belongs to one workspace) and a field check (/field/selections/:id, and the phone's
// queue): a selection shared with another workspace is open to both, and the check is recorded for the
// session's. With A's page open and B chosen in another tab, each acted on B; now each refuses (409, the
// words of `staleWorkspacePage`), is refused without the page's workspace (400; the phone's queue: a 409
// conflict asking for a reload), and works from B's page.
// Forms whose address pins the workspace (a project's share form, a library's or system's page…) are not
// here: another workspace's id answers 404 (access-sweep*.test.ts). Real route modules, guards, MariaDB.
// Check values: our own product rule (act only on what the page showed) — common practice for forms.
import { afterAll, describe, expect, test } from "vitest";
import { and, eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { apiTokens, fieldChecks, libraries, projects, workspaces } from "@db/schema";
import { fluidAt } from "~/engine";
import { shareAccepted } from "~/lib/projects/test-kit";
import { viewerOf } from "~/lib/auth/viewer.server";
import { requireMember } from "~/lib/auth/guards.server";
import * as projectsRoute from "~/routes/projects";
import ProjectsPage from "~/routes/projects";
import * as librariesRoute from "~/routes/libraries";
import LibrariesPage from "~/routes/libraries";
import * as accountRoute from "~/routes/account";
import AccountPage from "~/routes/account";
import * as fieldRoute from "~/routes/field.selections.$id";
import FieldPage from "~/routes/field.selections.$id";
import * as queueRoute from "~/routes/field.selections.$id.checks";
import { BASE, call, makeMember, type TestMember } from "./harness";
import { renderPage } from "./render-page";
import { fieldsForHead, storeSelection } from "./fieldcheck-fixture";
import { alsoMemberOf, carries, formError, formsOf, OLDER_PAGE, STALE, switchTo } from "./workspace-tabs";

afterAll(() => closeDb());

const RHO20 = fluidAt({ kind: "water" }, 20).density; // IAPWS-IF97 water at 20 °C through the engine (common practice)
const wsName = async (id: number) => (await db().select({ name: workspaces.name }).from(workspaces).where(eq(workspaces.id, id)))[0].name;
const page = (id: number) => ({ pageWorkspaceId: String(id) });

/** A (the member's own, current) and B (also theirs, as `roleInB`); the page was loaded for A. */
async function twoWorkspaces(role: TestMember["role"] = "admin", roleInB: TestMember["role"] = "admin") {
  const a = await makeMember(role);
  const other = await makeMember("admin"); // B's own admin
  await alsoMemberOf(a, other.workspaceId, roleInB);
  return { a, A: a.workspaceId, B: other.workspaceId, names: [await wsName(a.workspaceId), await wsName(other.workspaceId)] };
}

/** The page of `path` as the server renders it for `m` (plain HTML: what a browser without JavaScript posts). */
async function rendered(m: TestMember, path: string, Component: unknown, loader: unknown, params: Record<string, string> = {}) {
  const d = (await call(loader as never, { path, cookie: m.cookie, params })).body;
  return renderPage(path.replace(/\d+$/, ":id"), Component, path, d);
}

const creates = [
  { what: "project", path: "/projects", route: projectsRoute, Page: ProjectsPage, table: projects, fields: { site: "", description: "" } },
  { what: "library", path: "/libraries", route: librariesRoute, Page: LibrariesPage, table: libraries, fields: { description: "" } },
] as const;

describe.each(creates)("the new $what form", ({ what, path, route, Page, table, fields }) => {
  const post = (m: TestMember, form: Record<string, string>) => call(route.action as never, { path, cookie: m.cookie, form: { ...fields, ...form } });
  const named = (name: string) => db().select({ id: table.id, workspaceId: table.workspaceId }).from(table).where(eq(table.name, name));

  test("from A's page after switching to B: 409 naming both, nothing created; from B's page it is created in B", async () => {
    const { a, A, B, names } = await twoWorkspaces();
    const name = `Stale ${what} ${Date.now()}`;
    await switchTo(a, B);
    const r = await post(a, { name, ...page(A) });
    expect(r.status).toBe(409);
    expect(r.location).toBeNull();
    expect(formError(r.body).match(STALE)?.slice(1)).toEqual(names);
    expect(await named(name)).toEqual([]); // neither in A nor in B
    const ok = await post(a, { name, ...page(B) });
    expect(ok.status).toBe(302);
    const rows = await named(name);
    expect(rows).toHaveLength(1);
    expect(rows[0].workspaceId).toBe(B);
    expect(ok.location).toBe(`${path}/${rows[0].id}`);
  });

  test("without the page's workspace (a page from before the field): 400 asking for a reload, nothing created", async () => {
    const { a } = await twoWorkspaces();
    const name = `Older page ${what} ${Date.now()}`;
    const r = await post(a, { name });
    expect(r.status).toBe(400);
    expect((r.body as { errors: Record<string, string> }).errors.pageWorkspaceId).toBe(OLDER_PAGE);
    expect(await named(name)).toEqual([]);
  });

  test("the page's form carries its workspace id as a hidden field", async () => {
    const { a, A } = await twoWorkspaces();
    const forms = formsOf(await rendered(a, path, Page, route.loader)).filter((f) => f.includes('name="name"'));
    expect(forms).toHaveLength(1);
    expect(carries(forms[0], A)).toBe(true);
  });
});

describe("the account page's API token form (a token belongs to one workspace)", () => {
  const tokensIn = async (userId: string, workspaceId: number) =>
    (await db().select().from(apiTokens).where(and(eq(apiTokens.userId, userId), eq(apiTokens.workspaceId, workspaceId)))).length;
  const create = (m: TestMember, extra: Record<string, string>) =>
    call(accountRoute.action as never, { path: "/account", cookie: m.cookie, form: { intent: "create-token", name: "script", scope: "read", ...extra } });

  test("from A's page after switching to B: 409 naming both, no token in A or B; from B's page the token is B's", async () => {
    const { a, A, B, names } = await twoWorkspaces("engineer", "viewer");
    await switchTo(a, B);
    const r = await create(a, page(A));
    expect(r.status).toBe(409);
    expect(formError(r.body).match(STALE)?.slice(1)).toEqual(names);
    expect((r.body as { token?: string }).token).toBeUndefined();
    expect([await tokensIn(a.userId, A), await tokensIn(a.userId, B)]).toEqual([0, 0]);
    const ok = await create(a, page(B));
    expect(ok.status).toBe(200);
    expect((ok.body as { token: string }).token).toMatch(/^dmk_/);
    expect([await tokensIn(a.userId, A), await tokensIn(a.userId, B)]).toEqual([0, 1]);
  });

  test("without the page's workspace: 400 asking for a reload, no token", async () => {
    const { a, A } = await twoWorkspaces();
    const r = await create(a, {});
    expect(r.status).toBe(400);
    expect((r.body as { errors: Record<string, string> }).errors.pageWorkspaceId).toBe(OLDER_PAGE);
    expect(await tokensIn(a.userId, A)).toBe(0);
  });

  test("the token form carries the page's workspace; the profile, device and revoke forms act on the account and do not", async () => {
    const { a, A } = await twoWorkspaces();
    await create(a, page(A)); // a token to list, with its revoke form
    const forms = formsOf(await rendered(a, "/account", AccountPage, accountRoute.loader));
    const token = forms.filter((f) => f.includes('value="create-token"'));
    expect(token).toHaveLength(1);
    expect(carries(token[0], A)).toBe(true);
    const others = forms.filter((f) => !f.includes('value="create-token"'));
    expect(others.some((f) => f.includes('value="revoke-token"'))).toBe(true);
    for (const f of others) expect(f).not.toContain("pageWorkspaceId");
  });
});

describe("a field check on a selection open to both workspaces", () => {
  /** A selection of A's project, shared with B: the member is engineer in A and contractor in B. */
  async function sharedSelection() {
    const { a, A, B, names } = await twoWorkspaces("engineer", "contractor");
    const sel = await storeSelection(A, a.userId, undefined, `Tabs ${Date.now()}`);
    const asA = viewerOf(await requireMember(new Request(BASE, { headers: { cookie: a.cookie } })));
    const [{ slug }] = await db().select({ slug: workspaces.slug }).from(workspaces).where(eq(workspaces.id, B));
    await shareAccepted(asA, sel.projectId, slug);
    const params = { id: String(sel.selectionId) };
    const loaded = await call(fieldRoute.loader as never, { path: `/field/selections/${sel.selectionId}`, cookie: a.cookie, params });
    expect(loaded.status).toBe(200);
    const fingerprint = (loaded.body as { selection: { fingerprint: string } }).selection.fingerprint;
    const checks = async () => db().select({ workspaceId: fieldChecks.workspaceId }).from(fieldChecks).where(eq(fieldChecks.selectionId, sel.selectionId));
    const readings = (extra: Record<string, string>) => fieldsForHead(28, RHO20, { flow: "0.012", ...extra });
    /** The form without JavaScript (POST …/photos). */
    const byForm = (extra: Record<string, string>) => call(fieldRoute.action as never, { path: `/field/selections/${sel.selectionId}/photos`, cookie: a.cookie, params, form: readings(extra) });
    /** The phone's queue (POST …/checks, multipart with a device id and the fingerprint). */
    const byQueue = (extra: Record<string, string>) => {
      const body = new FormData();
      for (const [k, v] of Object.entries(readings({ clientId: crypto.randomUUID(), basedOn: fingerprint, ...extra }))) body.append(k, v);
      return call(queueRoute.action as never, { path: `/field/selections/${sel.selectionId}/checks`, cookie: a.cookie, params, body });
    };
    return { a, A, B, names, sel, checks, byForm, byQueue };
  }

  test("from A's page after switching to B: the form and the queue answer 409 naming both, nothing recorded; from B's page it is B's check", async () => {
    const s = await sharedSelection();
    await switchTo(s.a, s.B); // the selection is open to B too (shared): without the guard, the check became B's
    const form = await s.byForm(page(s.A));
    expect(form.status).toBe(409);
    expect(form.location).toBeNull();
    expect(formError(form.body).match(STALE)?.slice(1)).toEqual(s.names);
    expect((form.body as { fields: Record<string, string> }).fields.dPressure).toBe(fieldsForHead(28, RHO20).dPressure); // drawn again as typed
    const queued = await s.byQueue(page(s.A));
    expect(queued.status).toBe(409);
    // The queue's check is not a page to reload: it waits on the phone until the session is back in A.
    const waits = /^Not sent yet: this check was entered in the workspace “(.+)”, and you are now working in “(.+)”\. Switch back to “\1” to send it; it stays on this phone until then\.$/;
    expect((queued.body as { staleWorkspace: string }).staleWorkspace.match(waits)?.slice(1)).toEqual(s.names);
    expect(await s.checks()).toEqual([]);
    const ok = await s.byForm(page(s.B));
    expect(ok.status).toBe(302);
    expect(ok.location).toMatch(/^\/field\/checks\/\d+\?recorded=1$/);
    const viaQueue = await s.byQueue(page(s.B));
    expect(viaQueue.status).toBe(201);
    expect(await s.checks()).toEqual([{ workspaceId: s.B }, { workspaceId: s.B }]);
  });

  test("without the page's workspace: 400 from the form; from the queue (an older page's script) a 409 conflict asking for a reload, so the phone keeps the readings; nothing recorded", async () => {
    const s = await sharedSelection();
    const form = await s.byForm({});
    expect(form.status).toBe(400);
    expect((form.body as { errors: Record<string, string> }).errors.pageWorkspaceId).toBe(OLDER_PAGE);
    const queued = await s.byQueue({});
    expect(queued.status).toBe(409); // a 400 was shown as "refused", which the phone can only delete
    expect(queued.body).toMatchObject({ latest: null });
    expect((queued.body as { code?: string }).code).toBeUndefined(); // not the selection's change: the phone sends it again with its fingerprint
    expect((queued.body as { conflict: string }).conflict).toMatch(/older copy of this page.*Reload the page, make sure you are in that workspace, and send it again\./);
    expect(await s.checks()).toEqual([]);
  });

  test("the check form carries the page's workspace as a hidden field; it is not stored among the readings", async () => {
    const s = await sharedSelection();
    const html = await rendered(s.a, `/field/selections/${s.sel.selectionId}`, FieldPage, fieldRoute.loader, { id: String(s.sel.selectionId) });
    const forms = formsOf(html).filter((f) => f.includes('name="gradeId"'));
    expect(forms).toHaveLength(1);
    expect(carries(forms[0], s.A)).toBe(true);
    expect((await s.byForm(page(s.A))).status).toBe(302);
    const [row] = await db().select({ readings: fieldChecks.readingsJson }).from(fieldChecks).where(eq(fieldChecks.selectionId, s.sel.selectionId));
    expect(row.readings).not.toContain("pageWorkspaceId");
  });
});
