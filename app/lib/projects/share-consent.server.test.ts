// A project share needs the receiving workspace's consent (decision "shareconsent"): an offer is pending and opens
// nothing until an admin there accepts; declining or withdrawing closes it; a declined share is final and offering again
// makes a new share; the owner's answers tell a stranger no more than that a workspace has the name typed. Real MariaDB.
// Expected values: our own product rules (DEVELOPERS.md, decision "shareconsent").
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { and, eq, inArray } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { outbox, projectShares, users, workspaces } from "@db/schema";
import { windowStartOf } from "../shared/ratelimit.server";
import { fieldHome, fieldSelectionRecord } from "../fieldchecks/records.server";
import { makeMember, makeWorkspace, type TestMember } from "~/test/harness";
import { storeSelection } from "~/test/fieldcheck-fixture";
import { listShares, NO_SUCH_WORKSPACE, SHARE_OFFER_LIMIT, shareProject, unshareProject } from "./shares.server";
import { decideShare, offersTo, pendingOfferCount } from "./share-offers.server";
import { viewerOfUser } from "./test-kit";
import type { Viewer } from "../libraries";

let eng: TestMember, engV: Viewer;
let con: TestMember, conV: Viewer, conAdminV: Viewer, conSlug: string;
let sel: Awaited<ReturnType<typeof storeSelection>>;

beforeAll(async () => {
  eng = await makeMember("engineer");
  engV = await viewerOfUser(eng.userId, "engineer");
  con = await makeMember("contractor");
  conV = await viewerOfUser(con.userId, "contractor");
  conAdminV = await viewerOfUser((await makeMember("admin", con.workspaceId)).userId, "admin");
  conSlug = conV.workspace.slug;
  sel = await storeSelection(eng.workspaceId, eng.userId, undefined, "Consent");
});
afterAll(() => closeDb());

const shareRow = async () => (await db().select().from(projectShares).where(and(eq(projectShares.projectId, sel.projectId), eq(projectShares.workspaceId, con.workspaceId))))[0];
/** Whether the contractor's workspace can open the selection for field checks, asked of both readers of project_shares. */
async function open(): Promise<{ home: boolean; record: boolean }> {
  const home = (await fieldHome(conV)).selections.some((s) => s.id === sel.selectionId);
  const record = await fieldSelectionRecord(conV, sel.selectionId).then(
    () => true,
    (e: { init?: { status?: number } }) => (e?.init?.status === 404 ? false : Promise.reject(e)),
  );
  return { home, record };
}
const CLOSED = { home: false, record: false };
const OPEN = { home: true, record: true };

describe("a share opens the selections only once the receiving workspace's admin accepts", () => {
  test("pending: closed; accepted: open; stopped by the receiver: closed; offered again: a new share, pending; accepted and withdrawn by the owner: closed", async () => {
    expect(await open()).toEqual(CLOSED);
    expect(await shareProject(engV, sel.projectId, conSlug)).toMatchObject({ ok: true, outcome: "offered" });
    const first = await shareRow();
    expect(first.state).toBe("pending");
    expect(await open()).toEqual(CLOSED); // the old code opened it here
    expect(await pendingOfferCount(con.workspaceId)).toBe(1);

    expect(await decideShare(conAdminV, first.id, "accept")).toMatchObject({ ok: true, state: "accepted", already: false });
    expect(await open()).toEqual(OPEN);
    expect(await shareRow()).toMatchObject({ state: "accepted", decidedBy: conAdminV.userId });
    expect(await decideShare(conAdminV, first.id, "accept")).toMatchObject({ ok: true, state: "accepted", already: true }); // a second click

    expect(await decideShare(conAdminV, first.id, "decline")).toMatchObject({ ok: true, state: "declined" }); // "Stop receiving"
    expect(await open()).toEqual(CLOSED);
    // Declined is final: it cannot be accepted afterwards, and the row stays as it was.
    expect(await decideShare(conAdminV, first.id, "accept")).toMatchObject({ ok: false, status: 409 });
    expect((await shareRow()).state).toBe("declined");
    expect(await open()).toEqual(CLOSED);

    // The owner offers again: a new share with a new id, pending; the old id answers as an id no offer has.
    expect(await shareProject(engV, sel.projectId, conSlug)).toMatchObject({ ok: true, outcome: "again" });
    const second = await shareRow();
    expect(second.id).not.toBe(first.id);
    expect(second).toMatchObject({ state: "pending", decidedBy: null, decidedAt: null });
    await expect(decideShare(conAdminV, first.id, "accept")).rejects.toMatchObject({ init: { status: 404 } });
    expect(await open()).toEqual(CLOSED);

    expect(await decideShare(conAdminV, second.id, "accept")).toMatchObject({ ok: true, state: "accepted" });
    expect(await open()).toEqual(OPEN);
    expect(await unshareProject(engV, sel.projectId, second.id)).toBe("accepted");
    expect(await open()).toEqual(CLOSED);
    await expect(decideShare(conAdminV, second.id, "accept")).rejects.toMatchObject({ init: { status: 404 } }); // withdrawn
  });

  test("a pending offer declined stays closed; the owner's list shows the state and day, never who answered", async () => {
    const s2 = await storeSelection(eng.workspaceId, eng.userId, undefined, "Declined");
    await shareProject(engV, s2.projectId, conSlug);
    const [row] = await db().select().from(projectShares).where(eq(projectShares.projectId, s2.projectId));
    expect(await decideShare(conAdminV, row.id, "decline")).toMatchObject({ ok: true, state: "declined", already: false });
    expect(await decideShare(conAdminV, row.id, "decline")).toMatchObject({ ok: true, state: "declined", already: true });
    expect((await fieldHome(conV)).selections.some((s) => s.id === s2.selectionId)).toBe(false);
    const listed = await listShares(engV, s2.projectId);
    expect(listed.shares).toMatchObject([{ state: "declined", decidedAt: expect.any(String) }]);
    const [admin] = await db().select().from(users).where(eq(users.id, conAdminV.userId));
    const text = JSON.stringify(listed);
    expect(text).not.toContain(admin.email);
    expect(text).not.toContain(admin.id);
    // The receiving side names who answered.
    const offers = await offersTo(conAdminV);
    expect(offers.offers.find((o) => o.id === row.id)).toMatchObject({ state: "declined", decidedBy: admin.name, fromWorkspace: engV.workspace.name });
  });
});

describe("who may answer an offer", () => {
  let shareId = 0;
  beforeAll(async () => {
    const s3 = await storeSelection(eng.workspaceId, eng.userId, undefined, "Who");
    await shareProject(engV, s3.projectId, conSlug);
    [{ id: shareId }] = await db().select({ id: projectShares.id }).from(projectShares).where(eq(projectShares.projectId, s3.projectId));
  });
  const state = async () => (await db().select({ s: projectShares.state }).from(projectShares).where(eq(projectShares.id, shareId)))[0].s;

  test("a member of the receiving workspace who is not an admin: 403, the offer still pending", async () => {
    for (const role of ["contractor", "engineer", "viewer", "distributor"] as const) {
      await expect(decideShare({ ...conV, role }, shareId, "accept")).rejects.toMatchObject({ init: { status: 403 } });
      await expect(offersTo({ ...conV, role })).rejects.toMatchObject({ init: { status: 403 } });
    }
    expect(await state()).toBe("pending");
  });

  test("another workspace's admin (the owner's own included): 404, exactly as an id no share has; the offer still pending", async () => {
    const strangerV = await viewerOfUser((await makeMember("admin")).userId, "admin");
    const engAdminV = await viewerOfUser((await makeMember("admin", eng.workspaceId)).userId, "admin");
    for (const v of [strangerV, engAdminV]) {
      for (const answer of ["accept", "decline"] as const) {
        const taken = await decideShare(v, shareId, answer).catch((e: { init: { status: number }; data: unknown }) => [e.init.status, e.data]);
        const never = await decideShare(v, 999_999_999_999_999, answer).catch((e: { init: { status: number }; data: unknown }) => [e.init.status, e.data]);
        expect(taken).toEqual(never);
        expect(taken).toEqual([404, expect.stringContaining("No such offer")]);
      }
      expect((await offersTo(v)).offers.some((o) => o.id === shareId)).toBe(false);
    }
    expect(await state()).toBe("pending");
  });
});

describe("what the owner's answers tell about a name (enumeration)", () => {
  test("no such name and a name two workspaces have: the same refusal, word for word; one's own workspace is said", async () => {
    const twin = `Twin ${Date.now().toString(36)}`;
    await makeWorkspace(twin);
    await makeWorkspace(twin);
    const none = await shareProject(engV, sel.projectId, `Nobody ${Date.now().toString(36)}`);
    const two = await shareProject(engV, sel.projectId, twin);
    expect(none).toEqual({ ok: false, status: 422, error: NO_SUCH_WORKSPACE });
    expect(two).toEqual(none);
    expect(await shareProject(engV, sel.projectId, engV.workspace.slug)).toMatchObject({ ok: false, status: 422, error: expect.stringContaining("your own workspace") });
  });

  test(`past ${SHARE_OFFER_LIMIT.limit} unknown names and new offers an hour: an unknown name and a real one get the same 429; answers about one's own shares still come`, async () => {
    for (let attempt = 0; attempt < 2; attempt++) {
      const windowAt = windowStartOf(new Date(), SHARE_OFFER_LIMIT.windowSeconds).getTime();
      const prober = await makeMember("engineer");
      const proberV = await viewerOfUser(prober.userId, "engineer");
      const projectId = (await storeSelection(prober.workspaceId, prober.userId, undefined, "Probe")).projectId;
      const target = await makeWorkspace(`Target ${Date.now().toString(36)}`);
      const known = await makeWorkspace(`Known ${Date.now().toString(36)}`);
      expect(await shareProject(proberV, projectId, known.name)).toMatchObject({ ok: true, outcome: "offered" }); // 1 counted
      for (let i = 1; i < SHARE_OFFER_LIMIT.limit; i++) expect(await shareProject(proberV, projectId, `guess-${i}-${Date.now()}`)).toMatchObject({ status: 422 });
      const unknown = await shareProject(proberV, projectId, `guess-past-${Date.now()}`);
      const real = await shareProject(proberV, projectId, target.name);
      const again = await shareProject(proberV, projectId, known.name);
      if (windowStartOf(new Date(), SHARE_OFFER_LIMIT.windowSeconds).getTime() !== windowAt) continue; // the hour turned meanwhile: once more
      const sameWords = (o: typeof unknown) => (o.ok ? o : { ...o, error: o.error.replace(/\d+ minutes?/, "N minutes") });
      expect(unknown).toMatchObject({ ok: false, status: 429, error: expect.stringContaining(`${SHARE_OFFER_LIMIT.limit} at most`) });
      expect(sameWords(real)).toEqual(sameWords(unknown));
      expect(again).toMatchObject({ ok: true, outcome: "pending" }); // not counted, not refused
      expect(await db().select().from(projectShares).where(eq(projectShares.workspaceId, target.id))).toEqual([]); // nothing offered past the limit
      return;
    }
    throw new Error("the rate-limit window turned twice during the test");
  });
});

describe("the offer's e-mail to the receiving workspace's admins", () => {
  test("each admin with a confirmed address is written to (through the outbox), nobody else; the owner is not told how many", async () => {
    const ws = await makeWorkspace(`Mailed ${Date.now().toString(36)}`);
    const [admin1, admin2, unconfirmed, contractor] = [await makeMember("admin", ws.id), await makeMember("admin", ws.id), await makeMember("admin", ws.id), await makeMember("contractor", ws.id)];
    await db().update(users).set({ emailVerified: false }).where(eq(users.id, unconfirmed.userId));
    const s4 = await storeSelection(eng.workspaceId, eng.userId, undefined, "Mail");
    const out = await shareProject(engV, s4.projectId, ws.name);
    expect(out).toEqual({ ok: true, name: ws.name, outcome: "offered" });
    const mails = await db().select().from(outbox).where(inArray(outbox.toAddress, [admin1.email, admin2.email, unconfirmed.email, contractor.email]));
    expect(mails.map((m) => m.toAddress).sort()).toEqual([admin1.email, admin2.email].sort());
    for (const m of mails) {
      expect(m.subject).toContain("Mail project");
      expect(m.textBody).toContain(engV.workspace.name);
      expect(m.textBody).toMatch(/\/workspace\/shares\n/);
      expect(m.textBody).toContain("Until then your workspace sees nothing of the project.");
    }
    // Asking again while it is pending writes no second mail.
    await shareProject(engV, s4.projectId, ws.name);
    expect(await db().select().from(outbox).where(eq(outbox.toAddress, admin1.email))).toHaveLength(1);
    const [w] = await db().select().from(workspaces).where(eq(workspaces.id, ws.id));
    expect(w.name).toBe(ws.name);
  });
});
