// The phone's queue at the API: POST /field/selections/:id/checks with a device-made id records a
// check exactly once — a retry after a dropped answer, and two copies racing, give the first check
// back and no second row, photo or e-mail; a selection changed since the phone opened it is a
// conflict (409), recorded only when sent again without the old fingerprint; ids are checked.
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { and, eq, sql } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { fieldCheckPhotos, fieldChecks, outbox, selections, workspaces } from "@db/schema";
import { fluidAt } from "~/engine";
import { call, makeMember, type TestMember } from "~/test/harness";
import { fieldsForHead, storeSelection } from "~/test/fieldcheck-fixture";
import * as syncRoute from "~/routes/field.selections.$id.checks";
import * as pageRoute from "~/routes/field.selections.$id";
import { shareAccepted } from "../projects/test-kit";
import type { Viewer } from "../libraries";

const RHO20 = fluidAt({ kind: "water" }, 20).density; // IAPWS-IF97 water at 20 °C through the engine (common practice)
const PNG_1PX = Buffer.from("iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNk+M9QDwADhgGAWjR9awAAAABJRU5ErkJggg==", "base64");

describe("field checks sent from the phone's queue", () => {
  let eng: TestMember, con: TestMember;
  let sel: Awaited<ReturnType<typeof storeSelection>>;
  let fingerprint = "";

  beforeAll(async () => {
    eng = await makeMember("engineer");
    con = await makeMember("contractor");
    const [ew] = await db().select().from(workspaces).where(eq(workspaces.id, eng.workspaceId));
    const [cw] = await db().select().from(workspaces).where(eq(workspaces.id, con.workspaceId));
    const engV: Viewer = { userId: eng.userId, workspace: { id: ew.id, name: ew.name, slug: ew.slug, plan: "free" }, role: "engineer" };
    sel = await storeSelection(eng.workspaceId, eng.userId, undefined, "Sync");
    await shareAccepted(engV, sel.projectId, cw.slug);
    const page = await call(pageRoute.loader as never, { path: `/field/selections/${sel.selectionId}`, cookie: con.cookie, params: { id: String(sel.selectionId) } });
    expect(page.status).toBe(200);
    fingerprint = (page.body as { selection: { fingerprint: string } }).selection.fingerprint;
    expect(fingerprint).toMatch(/^[0-9a-f]{32}$/);
  });
  afterAll(() => closeDb());

  const send = (clientId: string, extra: Record<string, string> = {}, photo = true) => {
    const body = new FormData();
    for (const [k, v] of Object.entries(fieldsForHead(28, RHO20, { flow: "0.012", notes: `queued ${clientId}`, clientId, basedOn: fingerprint, pageWorkspaceId: String(con.workspaceId), ...extra }))) body.append(k, v);
    if (photo) body.append("photos", new File([PNG_1PX], "gauges.png", { type: "image/png" }));
    return call(syncRoute.action as never, { path: `/field/selections/${sel.selectionId}/checks`, cookie: con.cookie, params: { id: String(sel.selectionId) }, body });
  };
  const rowsOf = (clientId: string) => db().select().from(fieldChecks).where(eq(fieldChecks.clientId, clientId));
  const mailCount = async () => (await db().select({ n: sql<number>`COUNT(*)` }).from(outbox).where(eq(outbox.toAddress, eng.email)))[0].n;

  test("a retry of the same device id answers the first check: one row, one photo, one e-mail", async () => {
    const clientId = crypto.randomUUID();
    const mailsBefore = Number(await mailCount());
    const first = await send(clientId);
    expect(first.status).toBe(201);
    const id = (first.body as { id: number }).id;
    expect(id).toBeGreaterThan(0);
    // The answer was lost on the way back: the phone sends the same check again, twice.
    const again = await send(clientId);
    const third = await send(clientId);
    expect(again.status).toBe(200);
    expect(again.body).toMatchObject({ id, duplicate: true });
    expect(third.body).toMatchObject({ id, duplicate: true });
    const rows = await rowsOf(clientId);
    expect(rows).toHaveLength(1);
    expect(rows[0]).toMatchObject({ id, selectionId: sel.selectionId, workspaceId: con.workspaceId, verdict: "pass" });
    expect(await db().select().from(fieldCheckPhotos).where(eq(fieldCheckPhotos.fieldCheckId, id))).toHaveLength(1);
    expect(Number(await mailCount())).toBe(mailsBefore + 1);
  });

  test("two copies of one check racing: one row, both answers name it", async () => {
    const clientId = crypto.randomUUID();
    const answers = await Promise.all([send(clientId), send(clientId), send(clientId)]);
    const ids = answers.map((a) => (a.body as { id: number }).id);
    expect(new Set(ids).size).toBe(1);
    expect(answers.map((a) => a.status).sort()).toEqual([200, 200, 201]);
    expect(await rowsOf(clientId)).toHaveLength(1);
  });

  test("different device ids are different checks", async () => {
    const a = await send(crypto.randomUUID(), {}, false);
    const b = await send(crypto.randomUUID(), {}, false);
    expect(a.status).toBe(201);
    expect(b.status).toBe(201);
    expect((a.body as { id: number }).id).not.toBe((b.body as { id: number }).id);
  });

  test("a device id is checked: too short or with odd characters is a 400 and records nothing", async () => {
    for (const bad of ["short", "has spaces in it", "x".repeat(65), "<script>alert(1)</script>"]) {
      const res = await send(bad, {}, false);
      expect(res.status, bad).toBe(400);
      expect(await rowsOf(bad)).toHaveLength(0);
    }
  });

  test("another workspace cannot take over a device id (409), and without a share the selection is 404", async () => {
    const clientId = crypto.randomUUID();
    expect((await send(clientId, {}, false)).status).toBe(201);
    const stranger = await makeMember("contractor");
    const body = new FormData();
    for (const [k, v] of Object.entries(fieldsForHead(28, RHO20, { clientId, pageWorkspaceId: String(stranger.workspaceId) }))) body.append(k, v);
    const res = await call(syncRoute.action as never, { path: `/field/selections/${sel.selectionId}/checks`, cookie: stranger.cookie, params: { id: String(sel.selectionId) }, body });
    expect(res.status).toBe(404);
    const own = await storeSelection(stranger.workspaceId, stranger.userId, undefined, "Stranger");
    const body2 = new FormData();
    for (const [k, v] of Object.entries(fieldsForHead(28, RHO20, { clientId, pageWorkspaceId: String(stranger.workspaceId) }))) body2.append(k, v);
    const taken = await call(syncRoute.action as never, { path: `/field/selections/${own.selectionId}/checks`, cookie: stranger.cookie, params: { id: String(own.selectionId) }, body: body2 });
    expect(taken.status).toBe(409);
    expect(await rowsOf(clientId)).toHaveLength(1);
  });

  test("the selection changed while the phone was offline: 409 conflict, nothing recorded; sent again without the old fingerprint it records", async () => {
    // Selections are frozen today; a changed document (title or frozen JSON) is what the fingerprint guards.
    await db().update(selections).set({ title: "Sync selection (revised)" }).where(eq(selections.id, sel.selectionId));
    const clientId = crypto.randomUUID();
    const res = await send(clientId);
    expect(res.status).toBe(409);
    expect((res.body as { conflict: string }).conflict).toMatch(/selection changed/);
    expect(res.body).toMatchObject({ latest: null, code: "selection-changed" }); // the phone offers "as it is now" only for this
    expect(await rowsOf(clientId)).toHaveLength(0);
    const decided = await send(clientId, { basedOn: "" });
    expect(decided.status).toBe(201);
    expect(await rowsOf(clientId)).toHaveLength(1);
  });

  test("bad readings answer 400 with the field's message, and no row", async () => {
    const clientId = crypto.randomUUID();
    const res = await send(clientId, { dPressure: "lots", basedOn: "" });
    expect(res.status).toBe(400);
    expect((res.body as { errors: Record<string, string> }).errors.dPressure).toMatch(/must be a number/);
    expect(await db().select().from(fieldChecks).where(and(eq(fieldChecks.clientId, clientId)))).toHaveLength(0);
  });

  test("a water temperature outside the engine's fluid table is refused at its field (400, the range in the unit typed), not 422 after the fact", async () => {
    // The limits are the engine's WATER_RANGE_C (0–100 °C, IAPWS formulations); the selection pumps water (fixture).
    const clientId = crypto.randomUUID();
    const res = await send(clientId, { temperature: "150", basedOn: "" });
    expect(res.status).toBe(400);
    expect((res.body as { errors: Record<string, string> }).errors.temperature).toMatch(/^Fluid temperature is too high: the form takes 0 to 100 °C, not 150 °C — water's properties/);
    const inF = await send(clientId, { temperatureUnit: "F", temperature: "213", basedOn: "" }); // 213 °F = 100.6 °C
    expect((inF.body as { errors: Record<string, string> }).errors.temperature).toMatch(/the form takes 32 to 212 °F/);
    expect(await rowsOf(clientId)).toHaveLength(0);
  });
});
