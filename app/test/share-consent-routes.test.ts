// A project share needs the receiving workspace's consent, through the routes (decision "shareconsent"): the engineer
// offers on /projects/:id/share, an admin of the contractor's workspace accepts or declines on /workspace/shares, and
// every field-check surface — the list, the form and its post, the phone's queue, a check, its photo, the CSV — opens
// the selection only while the share is accepted; the systems API never does. Then the answer forms attacked by people
// who may not answer: a member who is not admin, other workspaces' admins, odd ids, another share's id, a stale page, a
// cross-site post. Real route modules, guards, root middleware and MariaDB. Expected values: our own product rules.
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { fieldCheckPhotos, memberships, projectShares, users } from "@db/schema";
import { createApiToken } from "~/lib/auth/api-tokens.server";
import { recordFieldCheck } from "~/lib/fieldchecks/records.server";
import { parseCheckFields } from "~/lib/fieldchecks";
import { shareProject } from "~/lib/projects";
import { viewerOfUser } from "~/lib/projects/test-kit";
import { BASE, call, makeMember, makeWorkspace, type TestMember } from "./harness";
import { fieldsForHead, storeSelection } from "./fieldcheck-fixture";
import { asResponse, throughRoot } from "./route-table";
import * as shareRoute from "~/routes/projects.$id.share";
import * as offersRoute from "~/routes/workspace.shares";
import * as workspaceRoute from "~/routes/workspace";
import * as fieldHomeRoute from "~/routes/field";
import * as fieldFormRoute from "~/routes/field.selections.$id";
import * as fieldQueueRoute from "~/routes/field.selections.$id.checks";
import * as fieldCheckRoute from "~/routes/field.checks.$id";
import * as fieldPhotoRoute from "~/routes/field.checks.$id.photos.$photoId";
import * as fieldCsvRoute from "~/routes/field.selections.$id.export-csv";
import * as systemsApi from "~/routes/api.v1.systems.$id";

const PNG = Buffer.from("iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNk+M9QDwADhgGAWjR9awAAAABJRU5ErkJggg==", "base64");
const RHO = 998.2; // water at 20 °C, kg/m³ (IAPWS, common practice), as access-sweep.test.ts

let eng: TestMember, con: TestMember, conAdmin: TestMember, stranger: TestMember, engAdmin: TestMember;
let conToken = "";
let sel: Awaited<ReturnType<typeof storeSelection>>;
let checkId = 0, photoId = 0;
let seq = 0;

beforeAll(async () => {
  eng = await makeMember("engineer");
  engAdmin = await makeMember("admin", eng.workspaceId);
  con = await makeMember("contractor");
  conAdmin = await makeMember("admin", con.workspaceId);
  stranger = await makeMember("admin");
  conToken = (await createApiToken({ userId: con.userId, workspaceId: con.workspaceId, name: "c", scope: "read" })).token;
  sel = await storeSelection(eng.workspaceId, eng.userId, undefined, "Consent route");
  // A check the engineer's own workspace recorded, with a photo: what the contractor may read only while the share is accepted.
  const parsed = parseCheckFields(fieldsForHead(20, RHO, { flow: "0.01" }), { kind: "water" });
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.errors));
  const rec = await recordFieldCheck(await viewerOfUser(eng.userId, "engineer"), sel.selectionId, { readings: parsed.readings, fields: {}, notes: "", gradeId: "2B" }, [{ filename: "g.png", contentType: "image/png", bytes: PNG }], { notify: false });
  checkId = rec.id;
  [{ id: photoId }] = await db().select({ id: fieldCheckPhotos.id }).from(fieldCheckPhotos).where(eq(fieldCheckPhotos.fieldCheckId, checkId));
}, 60_000);
afterAll(() => closeDb());

const conSlug = async () => (await viewerOfUser(con.userId, "contractor")).workspace.slug;
const share = async (projectId = sel.projectId) => (await db().select().from(projectShares).where(eq(projectShares.projectId, projectId))).find((s) => s.workspaceId === con.workspaceId);
const answer = (who: TestMember, form: Record<string, string>) => call(offersRoute.action as never, { path: "/workspace/shares", cookie: who.cookie, form });
const decide = (who: TestMember, intent: string, shareId: number | string, pageWorkspaceId = who.workspaceId) => answer(who, { intent, shareId: String(shareId), pageWorkspaceId: String(pageWorkspaceId) });

/** What the contractor reaches of the selection on every field-check surface (status, or listed/absent for the list). */
async function reach(): Promise<Record<string, number | string>> {
  const id = String(sel.selectionId);
  const as = { cookie: con.cookie };
  const home = await call(fieldHomeRoute.loader as never, { path: "/field", ...as });
  const listed = (home.body as { selections: { id: number }[] }).selections.some((s) => s.id === sel.selectionId);
  const form = await call(fieldFormRoute.loader as never, { path: `/field/selections/${id}`, ...as, params: { id } });
  const post = await call(fieldFormRoute.action as never, { path: `/field/selections/${id}/photos`, ...as, params: { id }, form: fieldsForHead(20, RHO, { flow: "0.01", pageWorkspaceId: String(con.workspaceId) }) });
  const queue = new FormData();
  for (const [k, v] of Object.entries(fieldsForHead(20, RHO, { flow: "0.01", clientId: `consent-${Date.now()}-${seq++}`, pageWorkspaceId: String(con.workspaceId) }))) queue.append(k, v);
  const queued = await call(fieldQueueRoute.action as never, { path: `/field/selections/${id}/checks`, ...as, params: { id }, body: queue });
  const check = await call(fieldCheckRoute.loader as never, { path: `/field/checks/${checkId}`, ...as, params: { id: String(checkId) } });
  const photo = await call(fieldPhotoRoute.loader as never, { path: `/field/checks/${checkId}/photos/${photoId}`, ...as, params: { id: String(checkId), photoId: String(photoId) } });
  const csv = await call(fieldCsvRoute.loader as never, { path: `/field/selections/${id}/export.csv`, ...as, params: { id } });
  const api = await call(systemsApi.loader as never, { path: `/api/v1/systems/${sel.systemId}`, headers: { authorization: `Bearer ${conToken}` }, params: { id: String(sel.systemId) } });
  return { list: listed ? "listed" : "absent", form: form.status, post: post.status, queue: queued.status, check: check.status, photo: photo.status, csv: csv.status, api: api.status };
}
const CLOSED = { list: "absent", form: 404, post: 404, queue: 404, check: 404, photo: 404, csv: 404, api: 404 };
// Open: the form posts a check (redirect to it), the queue records one (201); the systems API stays the owner's alone.
const OPEN = { list: "listed", form: 200, post: 302, queue: 201, check: 200, photo: 200, csv: 200, api: 404 };

describe("every field-check surface opens only while the share is accepted", () => {
  test("offered (pending): closed; accepted: open; declined: closed; offered again and accepted: open; withdrawn: closed", async () => {
    expect(await reach()).toEqual(CLOSED);
    const offered = await call(shareRoute.action as never, { path: `/projects/${sel.projectId}/share`, cookie: eng.cookie, params: { id: String(sel.projectId) }, form: { intent: "share", workspace: await conSlug() } });
    expect(offered.status).toBe(200);
    expect((offered.body as { message: string }).message).toMatch(/^Offered to .+\. Nothing is open to its members until one of its admins accepts/);
    expect(await reach()).toEqual(CLOSED); // the old code: open here, "Shared with …"

    // The receiving admin sees it waiting, on the Workspace page and the offers page.
    const ws = await call(workspaceRoute.loader as never, { path: "/workspace", cookie: conAdmin.cookie });
    expect((ws.body as { offersWaiting: number }).offersWaiting).toBe(1);
    const page = await call(offersRoute.loader as never, { path: "/workspace/shares", cookie: conAdmin.cookie });
    expect(page.status).toBe(200);
    expect((page.body as { offers: unknown[] }).offers).toMatchObject([{ state: "pending", projectName: "Consent route project", selections: 1 }]);

    const first = (await share())!;
    const accepted = await decide(conAdmin, "accept", first.id);
    expect(accepted.status).toBe(200);
    expect((accepted.body as { notice: string }).notice).toContain("Accepted “Consent route project”");
    expect(await reach()).toEqual(OPEN);
    const ownerSees = await call(shareRoute.loader as never, { path: `/projects/${sel.projectId}/share`, cookie: eng.cookie, params: { id: String(sel.projectId) } });
    expect((ownerSees.body as { shares: unknown[] }).shares).toMatchObject([{ state: "accepted", decidedAt: expect.any(String) }]);

    expect((await decide(conAdmin, "decline", first.id)).status).toBe(200); // "Stop receiving"
    expect(await reach()).toEqual(CLOSED);
    expect((await decide(conAdmin, "accept", first.id)).status).toBe(409); // declined is final

    const again = await call(shareRoute.action as never, { path: `/projects/${sel.projectId}/share`, cookie: eng.cookie, params: { id: String(sel.projectId) }, form: { intent: "share", workspace: await conSlug() } });
    expect((again.body as { message: string }).message).toMatch(/^Offered again to .+, as a new offer \(they had declined the last one on /);
    const second = (await share())!;
    expect(second.id).not.toBe(first.id);
    expect(await reach()).toEqual(CLOSED);
    expect((await decide(conAdmin, "accept", second.id)).status).toBe(200);
    expect(await reach()).toEqual(OPEN);

    const withdrawn = await call(shareRoute.action as never, { path: `/projects/${sel.projectId}/share`, cookie: eng.cookie, params: { id: String(sel.projectId) }, form: { intent: "unshare", shareId: String(second.id) } });
    expect((withdrawn.body as { message: string }).message).toMatch(/^Share stopped/);
    expect(await reach()).toEqual(CLOSED);
    expect((await decide(conAdmin, "accept", second.id)).status).toBe(404);
  }, 60_000);
});

describe("the answer forms attacked by someone who may not answer", () => {
  let target = 0;
  let otherShare = 0;
  let projectId = 0;
  beforeAll(async () => {
    projectId = (await storeSelection(eng.workspaceId, eng.userId, undefined, "Attacked")).projectId;
    const engV = await viewerOfUser(eng.userId, "engineer");
    await shareProject(engV, projectId, await conSlug());
    target = (await share(projectId))!.id;
    // Another share of the same project, to a third workspace with an admin of its own.
    const third = await makeWorkspace();
    await makeMember("admin", third.id);
    [{ id: otherShare }] = await db().insert(projectShares).values({ projectId, workspaceId: third.id, createdBy: eng.userId }).$returningId();
  });
  const stateOf = async (id: number) => (await db().select({ s: projectShares.state }).from(projectShares).where(eq(projectShares.id, id)))[0]?.s;
  afterAll(async () => {
    expect(await stateOf(target)).toBe("pending"); // nothing below changed it
    expect(await stateOf(otherShare)).toBe("pending");
  });

  test("a member of the receiving workspace who is not an admin: 403 on the page and on each answer", async () => {
    expect((await call(offersRoute.loader as never, { path: "/workspace/shares", cookie: con.cookie })).status).toBe(403);
    for (const intent of ["accept", "decline"]) expect((await decide(con, intent, target)).status).toBe(403);
    const ws = await call(workspaceRoute.loader as never, { path: "/workspace", cookie: con.cookie });
    expect((ws.body as { offersWaiting: unknown }).offersWaiting).toBeNull();
  });

  test("another workspace's admin (a stranger, the offering workspace's own): 404, word for word as an id no share has", async () => {
    for (const who of [stranger, engAdmin]) {
      for (const intent of ["accept", "decline"]) {
        const taken = await decide(who, intent, target);
        const never = await decide(who, intent, 999_999_999_999_999);
        expect(taken.status).toBe(404);
        expect(taken.body).toEqual(never.body);
      }
      const page = await call(offersRoute.loader as never, { path: "/workspace/shares", cookie: who.cookie });
      expect(JSON.stringify(page.body)).not.toContain("Attacked project");
    }
  });

  test("another share's id (the same project offered to a third workspace), by the receiving admin: 404", async () => {
    for (const intent of ["accept", "decline"]) expect((await decide(conAdmin, intent, otherShare)).status).toBe(404);
  });

  test("odd ids and odd intents: a 4xx, never a 5xx", async () => {
    const odd = ["0", "-1", "-0", "+1", "1.5", "1e3", "0x10", " 1", "1 ", "\u0000", String(2 ** 53 + 1), "9".repeat(20), "NaN", "Infinity", "1,5", ""];
    for (const id of odd) {
      const r = await decide(conAdmin, "accept", id);
      expect([400, 404], `shareId ${JSON.stringify(id)} → ${r.status}`).toContain(r.status);
    }
    for (const intent of ["", "ACCEPT", "share", "unshare", "accept "]) expect((await decide(conAdmin, intent, target)).status).toBe(400);
    expect((await answer(conAdmin, { intent: "accept", pageWorkspaceId: String(con.workspaceId) })).status).toBe(400); // no id
  });

  test("a stale page (the session moved to another workspace since) answers 409, a page without its workspace 400", async () => {
    const elsewhere = await makeWorkspace();
    await db().insert(memberships).values({ workspaceId: elsewhere.id, userId: conAdmin.userId, role: "admin" });
    await db().update(users).set({ currentWorkspaceId: elsewhere.id }).where(eq(users.id, conAdmin.userId));
    try {
      const r = await decide(conAdmin, "accept", target, con.workspaceId);
      expect(r.status).toBe(409);
      expect(JSON.stringify(r.body)).toContain("Nothing was changed");
    } finally {
      await db().update(users).set({ currentWorkspaceId: con.workspaceId }).where(eq(users.id, conAdmin.userId));
    }
    expect((await answer(conAdmin, { intent: "accept", shareId: String(target) })).status).toBe(400);
  });

  test("a cross-site post (foreign Origin, or none) is refused by the CSRF check before the action: 403", async () => {
    for (const origin of ["http://evil.example", null]) {
      const headers = new Headers({ cookie: conAdmin.cookie, "content-type": "application/x-www-form-urlencoded" });
      if (origin) headers.set("origin", origin);
      const request = new Request(`${BASE}/workspace/shares`, { method: "POST", headers, body: new URLSearchParams({ intent: "accept", shareId: String(target), pageWorkspaceId: String(con.workspaceId) }) });
      let ran = false;
      const res = await throughRoot(request, "workspace/shares", {}, async () => {
        ran = true;
        return asResponse(await (offersRoute.action as (a: unknown) => unknown)({ request, params: {}, context: {} }));
      });
      expect(res.status).toBe(403);
      expect(ran).toBe(false);
    }
  });
});
