// What the phone's queue must not get wrong when it sends late (real MariaDB, through the route modules):
// an amendment of a version that was amended meanwhile is a conflict, never a new latest version built
// from the old one; a check queued in one workspace is answered 409 { staleWorkspace } before its selection is
// opened in the workspace the session has moved to since (the shared case, the page's own form and a post with no
// workspace: app/test/stale-workspace-other-forms.test.ts); a device id another user recorded is never answered
// with that user's check.
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { eq, sql } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { fieldCheckPhotos, fieldChecks, memberships, users, workspaces } from "@db/schema";
import { fluidAt } from "~/engine";
import { call, makeMember, makeWorkspace, type TestMember } from "~/test/harness";
import { fieldsForHead, storeSelection } from "~/test/fieldcheck-fixture";
import * as syncRoute from "~/routes/field.selections.$id.checks";
import * as formRoute from "~/routes/field.selections.$id";
import { shareAccepted } from "../projects/test-kit";
import type { Viewer } from "../libraries";

const RHO20 = fluidAt({ kind: "water" }, 20).density; // IAPWS-IF97 water at 20 °C through the engine (common practice)
const PNG_1PX = Buffer.from("iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNk+M9QDwADhgGAWjR9awAAAABJRU5ErkJggg==", "base64");

describe("the phone's late sends", () => {
  let eng: TestMember, con: TestMember;
  let engV: Viewer;
  let sel: Awaited<ReturnType<typeof storeSelection>>;
  let wsA: { id: number; name: string; slug: string }, wsB: { id: number; name: string; slug: string };

  beforeAll(async () => {
    eng = await makeMember("engineer");
    con = await makeMember("contractor"); // in workspace A
    const [ew] = await db().select().from(workspaces).where(eq(workspaces.id, eng.workspaceId));
    engV = { userId: eng.userId, workspace: { id: ew.id, name: ew.name, slug: ew.slug, plan: "free" }, role: "engineer" };
    const [a] = await db().select().from(workspaces).where(eq(workspaces.id, con.workspaceId));
    wsA = { id: a.id, name: a.name, slug: a.slug };
    const b = await makeWorkspace();
    const [bRow] = await db().select().from(workspaces).where(eq(workspaces.id, b.id));
    wsB = { id: bRow.id, name: bRow.name, slug: bRow.slug };
    await db().insert(memberships).values({ workspaceId: wsB.id, userId: con.userId, role: "contractor" }); // the contractor works for B too
    sel = await storeSelection(eng.workspaceId, eng.userId, undefined, "Late");
    await shareAccepted(engV, sel.projectId, wsA.slug); // shared with A only (offered and accepted), to begin with
  });
  afterAll(() => closeDb());

  const switchTo = (workspaceId: number, who = con) => db().update(users).set({ currentWorkspaceId: workspaceId }).where(eq(users.id, who.userId));
  const send = (clientId: string, extra: Record<string, string> = {}, photos = 0, who = con) => {
    const body = new FormData();
    for (const [k, v] of Object.entries(fieldsForHead(28, RHO20, { flow: "0.012", notes: `queued ${clientId}`, clientId, pageWorkspaceId: String(wsA.id), ...extra }))) body.append(k, v);
    for (let i = 0; i < photos; i++) body.append("photos", new File([PNG_1PX], `gauge-${i}.png`, { type: "image/png" }));
    return call(syncRoute.action as never, { path: `/field/selections/${sel.selectionId}/checks`, cookie: who.cookie, params: { id: String(sel.selectionId) }, body });
  };
  const rowsOf = (clientId: string) => db().select().from(fieldChecks).where(eq(fieldChecks.clientId, clientId));
  const photosOf = async (checkId: number) => (await db().select({ n: sql<number>`COUNT(*)` }).from(fieldCheckPhotos).where(eq(fieldCheckPhotos.fieldCheckId, checkId)))[0].n;

  test("amending a version that another phone amended meanwhile: 409 conflict naming the latest version; the newer amendment stays the latest with its readings and photos", async () => {
    const v1 = await send(crypto.randomUUID(), {}, 2);
    expect(v1.status).toBe(201);
    const v1Id = (v1.body as { id: number }).id;
    // Phone A amends version 1 (online): version 2, with a third photo and its own readings (28 m → 30 m).
    const a = await send(crypto.randomUUID(), { amends: String(v1Id), ...pick(fieldsForHead(30, RHO20), "dPressure") }, 1);
    expect(a.status).toBe(201);
    const v2Id = (a.body as { id: number }).id;
    expect(Number(await photosOf(v2Id))).toBe(3); // 2 carried + 1
    // Phone B had opened version 1 offline and amends it too, later.
    const bClient = crypto.randomUUID();
    const b = await send(bClient, { amends: String(v1Id), notes: "phone B" }, 0);
    expect(b.status).toBe(409);
    expect(b.body).toMatchObject({ latest: { id: v2Id, version: 2 } });
    expect((b.body as { conflict: string }).conflict).toMatch(new RegExp(`check ${v1Id} \\(version 1\\) was amended meanwhile: version 2 \\(check ${v2Id}\\)`));
    expect(await rowsOf(bClient)).toHaveLength(0);
    const chain = await db().select().from(fieldChecks).where(eq(fieldChecks.chainId, v1Id));
    expect(chain.map((c) => c.version).sort()).toEqual([1, 2]);
    // The form opened on version 1 now says it is no longer the latest, with version 2 to amend instead.
    const form = await call(formRoute.loader as never, { path: `/field/selections/${sel.selectionId}?amend=${v1Id}`, cookie: con.cookie, params: { id: String(sel.selectionId) } });
    expect((form.body as { amends: unknown }).amends).toMatchObject({ id: v1Id, version: 1, latest: { id: v2Id, version: 2 } });
    // Amending the latest (what the phone offers) records version 3, carrying version 2's three photos.
    const c = await send(bClient, { amends: String(v2Id), notes: "phone B" }, 0);
    expect(c.status).toBe(201);
    const [v3] = await rowsOf(bClient);
    expect(v3).toMatchObject({ chainId: v1Id, version: 3 });
    expect(Number(await photosOf(v3.id))).toBe(3);
  });

  test("a check queued in A, sent after the session moved to B where the project is not shared: 409 { staleWorkspace } naming both (kept on the phone), not a 404; back in A the same check records as A's", async () => {
    await switchTo(wsB.id);
    const clientId = crypto.randomUUID();
    const res = await send(clientId);
    await switchTo(wsA.id);
    expect(res.status).toBe(409);
    const words = (res.body as { staleWorkspace: string }).staleWorkspace;
    expect(words).toContain(`“${wsA.name}”`);
    expect(words).toContain(`“${wsB.name}”`);
    expect(await rowsOf(clientId)).toHaveLength(0);
    const again = await send(clientId);
    expect(again.status).toBe(201);
    expect((await rowsOf(clientId))[0]).toMatchObject({ workspaceId: wsA.id, createdBy: con.userId });
  });

  test("a device id another user of the same workspace recorded: 409, that user's check is not given back as a duplicate", async () => {
    const colleague = await makeMember("contractor", wsA.id);
    const clientId = crypto.randomUUID();
    const first = await send(clientId);
    expect(first.status).toBe(201);
    const theirs = (first.body as { id: number }).id;
    const res = await send(clientId, { notes: "colleague's readings" }, 0, colleague);
    expect(res.status).toBe(409);
    expect(res.body).toMatchObject({ code: "client-id-taken" });
    expect(JSON.stringify(res.body)).not.toContain(`/field/checks/${theirs}`);
    const rows = await rowsOf(clientId);
    expect(rows).toHaveLength(1);
    expect(rows[0].createdBy).toBe(con.userId);
    // The first user's own retry is still answered with their check.
    expect((await send(clientId)).body).toMatchObject({ id: theirs, duplicate: true });
  });
});

function pick(fields: Record<string, string>, ...keys: string[]): Record<string, string> {
  return Object.fromEntries(keys.map((k) => [k, fields[k]]));
}
