// The time the readings were taken (the phone's clock, `takenAt`) is kept beside the time the server recorded
// the check: sent by the queue, stored, shown on the record and in the e-mail, flagged when it cannot be right,
// and the history and the field home's recent checks are ordered by it (real MariaDB, through the route modules).
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { desc, eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { fieldChecks, outbox, selections, workspaces } from "@db/schema";
import { fluidAt } from "~/engine";
import { call, makeMember, type TestMember } from "~/test/harness";
import { fieldsForHead, storeSelection } from "~/test/fieldcheck-fixture";
import * as syncRoute from "~/routes/field.selections.$id.checks";
import * as recordRoute from "~/routes/field.checks.$id";
import * as fieldHomeRoute from "~/routes/field";
import { checkHistory } from "./records.server";
import { shareAccepted } from "../projects/test-kit";
import type { Viewer } from "../libraries";

const RHO20 = fluidAt({ kind: "water" }, 20).density; // IAPWS-IF97 water at 20 °C through the engine (common practice)
const MIN = 60_000;

describe("the time the readings were taken", () => {
  let eng: TestMember, con: TestMember;
  let engV: Viewer;
  let sel: Awaited<ReturnType<typeof storeSelection>>;
  let selectionMade: Date;

  beforeAll(async () => {
    eng = await makeMember("engineer");
    con = await makeMember("contractor");
    const [ew] = await db().select().from(workspaces).where(eq(workspaces.id, eng.workspaceId));
    const [cw] = await db().select().from(workspaces).where(eq(workspaces.id, con.workspaceId));
    engV = { userId: eng.userId, workspace: { id: ew.id, name: ew.name, slug: ew.slug, plan: "free" }, role: "engineer" };
    sel = await storeSelection(eng.workspaceId, eng.userId, undefined, "Clock");
    await shareAccepted(engV, sel.projectId, cw.slug);
    // The selection was made two hours ago (readings from the last two hours are plausible).
    selectionMade = new Date(Math.floor((Date.now() - 120 * MIN) / 1000) * 1000);
    await db().update(selections).set({ createdAt: selectionMade }).where(eq(selections.id, sel.selectionId));
  });
  afterAll(() => closeDb());

  const send = (takenAt: string | null, extra: Record<string, string> = {}) => {
    const body = new FormData();
    const fields = fieldsForHead(28, RHO20, { flow: "0.012", clientId: crypto.randomUUID(), pageWorkspaceId: String(con.workspaceId), ...extra });
    if (takenAt !== null) fields.takenAt = takenAt;
    for (const [k, v] of Object.entries(fields)) body.append(k, v);
    return call(syncRoute.action as never, { path: `/field/selections/${sel.selectionId}/checks`, cookie: con.cookie, params: { id: String(sel.selectionId) }, body });
  };
  const idOf = (r: { body: unknown }) => (r.body as { id: number }).id;
  const page = (id: number) => call(recordRoute.loader as never, { path: `/field/checks/${id}`, cookie: eng.cookie, params: { id: String(id) } });
  type Times = { takenAt: string | null; recordedAt: string; warnings: string[]; text: string };

  test("the phone's time is stored beside the server's, shown as 'taken (device clock) … · recorded …', and in the e-mail", async () => {
    const taken = new Date(Date.now() - 30 * MIN).toISOString(); // taken half an hour ago, sent now
    const res = await send(taken);
    expect(res.status).toBe(201);
    const [row] = await db().select().from(fieldChecks).where(eq(fieldChecks.id, idOf(res)));
    expect(row.takenAt?.toISOString()).toBe(taken);
    expect(row.createdAt.getTime()).toBeGreaterThan(row.takenAt!.getTime());
    const times = (await page(row.id)).body as { times: Times };
    expect(times.times).toMatchObject({ takenAt: taken, warnings: [] });
    expect(times.times.text).toMatch(/^taken \d{4}-\d\d-\d\d \d\d:\d\d UTC \(device clock\) · recorded \d{4}-\d\d-\d\d \d\d:\d\d UTC$/);
    const [mail] = await db().select().from(outbox).where(eq(outbox.toAddress, eng.email)).orderBy(desc(outbox.id)).limit(1);
    expect(mail.textBody).toContain(times.times.text.replace(/^taken/, "Readings taken"));
  });

  test("the history is ordered by the time taken: a check taken earlier but sent later comes after", async () => {
    const later = await send(new Date(Date.now() - 20 * MIN).toISOString());
    const earlier = await send(new Date(Date.now() - 50 * MIN).toISOString()); // sent second, taken first
    const order = (await checkHistory(engV, sel.selectionId)).checks.map((c) => c.id);
    expect(order.indexOf(idOf(later))).toBeLessThan(order.indexOf(idOf(earlier)));
  });

  test("the field home's recent checks are ordered by the time taken too, each with both times", async () => {
    const later = await send(new Date(Date.now() - 25 * MIN).toISOString());
    const earlier = await send(new Date(Date.now() - 55 * MIN).toISOString()); // sent second, taken first
    const home = (await call(fieldHomeRoute.loader as never, { path: "/field", cookie: con.cookie })).body as { checks: { id: number; times: Times }[] };
    const ids = home.checks.map((c) => c.id);
    expect(ids.indexOf(idOf(later))).toBeGreaterThanOrEqual(0);
    expect(ids.indexOf(idOf(later))).toBeLessThan(ids.indexOf(idOf(earlier)));
    const listed = home.checks.find((c) => c.id === idOf(earlier))!;
    expect(listed.times.text).toMatch(/^taken \d{4}-\d\d-\d\d \d\d:\d\d UTC \(device clock\) · recorded \d{4}-\d\d-\d\d \d\d:\d\d UTC$/);
    expect(listed.times.warnings).toEqual([]);
  });

  test("a device clock ahead of the server's, or before the selection was made, is flagged with its numbers", async () => {
    const ahead = await send(new Date(Date.now() + 10 * MIN).toISOString());
    const warnAhead = ((await page(idOf(ahead))).body as { times: Times }).times.warnings;
    expect(warnAhead).toHaveLength(1);
    expect(warnAhead[0]).toMatch(/^The device clock read .* UTC when the readings were taken, (9|10) min \d+ s after the server recorded the check at .* UTC \(more than the 60 s allowed/);
    const before = await send(new Date(selectionMade.getTime() - 3 * 60 * MIN).toISOString());
    const warnBefore = ((await page(idOf(before))).body as { times: Times }).times.warnings;
    expect(warnBefore).toHaveLength(1);
    expect(warnBefore[0]).toMatch(/, 3 h 0 min before the selection was made \(/);
  });

  test("without a device time (the page's own form, a phone from before) only the recorded time is shown; a time that is not one is a 400", async () => {
    const none = await send(null);
    expect(none.status).toBe(201);
    const t = ((await page(idOf(none))).body as { times: Times }).times;
    expect(t).toMatchObject({ takenAt: null, warnings: [] });
    expect(t.text).toMatch(/^recorded \d{4}-\d\d-\d\d \d\d:\d\d UTC$/);
    for (const bad of ["yesterday", "2026-13-01T00:00:00.000Z", "0999-01-01T00:00:00.000Z"]) {
      const res = await send(bad);
      expect(res.status, bad).toBe(400);
      expect((res.body as { errors: Record<string, string> }).errors._form).toMatch(/time the readings were taken/);
    }
  });
});
