// Several candidates from one search (issue 17, item 5): the search page's ticked rows (`add` =
// `<curveSetId>:<method>`) are added in one transaction, already-added curves skipped, curves the
// user may not use refused with nothing written, bad bodies a 400 (never a 500). Real MariaDB,
// the route's own action, the way React Router calls it. Expected values: our product rules.
import { readFileSync } from "node:fs";
import { afterAll, beforeAll, beforeEach, describe, expect, test } from "vitest";
import { eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { candidates, curveSets, libraryRevisions, workspaces } from "@db/schema";
import { createLibrary, updateLibrary, type Viewer } from "~/lib/libraries";
import { importCsvText } from "~/lib/projects/test-kit";
import { createProject, createSystem } from "~/lib/projects";
import { defaultSystemInput } from "~/lib/projects/hydraulics";
import { forgetTokens } from "~/lib/auth/token-cache.server";
import { call, makeMember, makeWorkspace, type TestMember } from "./harness";
import * as searchPage from "~/routes/systems.$id.search";

const viewerOf = (m: TestMember, plan: "free" | "network"): Viewer => ({ userId: m.userId, workspace: { id: m.workspaceId, name: "W", slug: "w", plan }, role: m.role });

/** Imports fixtures/csv/long-si.csv (six curve sets) into a new library; returns its curve set ids. ("private": its admins only.) */
async function library(v: Viewer, name: string, visibility: "private" | "workspace" | "shared" = "private") {
  const libraryId = await createLibrary(v, { name, description: "" });
  // Model names of our own: search merges identical curves across libraries, and the plan-gate sweep must never find ours.
  const csv = readFileSync("fixtures/csv/long-si.csv", "utf8").replaceAll("Kestrel", `${name} ${Date.now().toString(36)}`);
  await importCsvText(v, libraryId, csv, "long-si.csv", "add-many test");
  if (visibility !== "private") await updateLibrary(v, libraryId, { name, description: "", visibility });
  const rows = await db().select({ id: curveSets.id }).from(curveSets).innerJoin(libraryRevisions, eq(libraryRevisions.id, curveSets.revisionId)).where(eq(libraryRevisions.libraryId, libraryId));
  return rows.map((r) => r.id);
}

let engineer: TestMember;
let own: number[]; // 12 curve sets of the firm's own two libraries
let foreign: number[]; // another workspace's private library
let sharedSets: number[]; // a distributor's shared library (opens on the paid plan only)
let systemId: number;

beforeAll(async () => {
  const firm = await makeWorkspace(undefined, "free");
  engineer = await makeMember("engineer", firm.id);
  const ev = viewerOf(engineer, "free");
  const av = viewerOf(await makeMember("admin", firm.id), "free"); // an admin keeps the firm's libraries
  own = [...(await library(av, "Own A", "workspace")), ...(await library(av, "Own B", "workspace"))];
  const other = await makeMember("admin");
  foreign = await library(viewerOf(other, "free"), "Someone else's");
  const dist = await makeWorkspace(undefined, "network");
  const d = await makeMember("distributor", dist.id);
  sharedSets = await library({ userId: d.userId, workspace: { id: dist.id, name: "D", slug: "d", plan: "network" }, role: "distributor" }, "Shared range", "shared");
  const projectId = await createProject(ev, { name: "Add many", site: "", description: "" });
  systemId = await createSystem(ev, projectId, "Add many system", { ...defaultSystemInput(), duty: { flow: 17.14 / 3600, head: 28 } });
  expect(own.length).toBe(12);
});
afterAll(() => closeDb());

beforeEach(async () => {
  await db().delete(candidates).where(eq(candidates.systemId, systemId));
  await setPlan("free");
});

async function setPlan(plan: "free" | "network") {
  await db().update(workspaces).set({ plan }).where(eq(workspaces.id, engineer.workspaceId));
  forgetTokens();
}

/** POSTs the search form with repeated `add` values (and any other fields). */
function post(adds: string[], extra: [string, string][] = [["intent", "add-many"]]) {
  const body = new URLSearchParams([...adds.map((a) => ["add", a] as [string, string]), ...extra]);
  return call(searchPage.action as never, { path: `/systems/${systemId}/search`, cookie: engineer.cookie, params: { id: String(systemId) }, body, method: "POST" });
}
const rows = async () => (await db().select().from(candidates).where(eq(candidates.systemId, systemId))).map((c) => ({ curveSetId: c.curveSetId, method: JSON.parse(c.adjustmentJson).method }));

describe("adding several ticked pumps at once", () => {
  test("two ticked rows: both added with their methods, then back to the system page", async () => {
    const r = await post([`${own[0]}:direct`, `${own[1]}:trim`]);
    expect(r.status).toBe(302);
    expect(r.location).toBe(`/systems/${systemId}`);
    expect((await rows()).sort((a, b) => a.curveSetId - b.curveSetId)).toEqual([
      { curveSetId: own[0], method: "none" },
      { curveSetId: own[1], method: "trim" },
    ]);
  });

  test("a curve already on the system is skipped, the others added; a curve ticked twice is added once", async () => {
    expect((await post([`${own[0]}:direct`])).status).toBe(302);
    const r = await post([`${own[0]}:speed`, `${own[2]}:speed`, `${own[2]}:trim`]);
    expect(r.status).toBe(302);
    expect((await rows()).sort((a, b) => a.curveSetId - b.curveSetId)).toEqual([
      { curveSetId: own[0], method: "none" }, // kept as it was
      { curveSetId: own[2], method: "speed" }, // the first tick of the curve wins
    ]);
  });

  test("another workspace's curve among the ticked ones: 404 and nothing written, not even the open ones", async () => {
    const r = await post([`${own[0]}:direct`, `${foreign[0]}:direct`, `${own[1]}:direct`]);
    expect(r.status).toBe(404);
    expect(await rows()).toEqual([]);
  });

  test("a curve id that does not exist: 404, nothing written", async () => {
    const r = await post([`${own[0]}:direct`, "999999999999:direct"]);
    expect(r.status).toBe(404);
    expect(await rows()).toEqual([]);
  });

  test("a shared library's curve on the free plan: 404, nothing written; on the paid plan it is added (the plan gate)", async () => {
    const refused = await post([`${own[0]}:direct`, `${sharedSets[0]}:direct`]);
    expect(refused.status).toBe(404);
    expect(await rows()).toEqual([]);
    await setPlan("network");
    const ok = await post([`${own[0]}:direct`, `${sharedSets[0]}:direct`]);
    expect(ok.status).toBe(302);
    expect((await rows()).map((x) => x.curveSetId).sort((a, b) => a - b)).toEqual([own[0], sharedSets[0]].sort((a, b) => a - b));
  });

  test("more candidates than a system keeps (6): refused with a message, nothing written", async () => {
    expect((await post([`${own[0]}:direct`, `${own[1]}:direct`])).status).toBe(302);
    const r = await post(own.slice(2, 7).map((id) => `${id}:direct`)); // 2 + 5 = 7 > 6
    expect(r.status).toBe(409); // RFC 9110 §15.5.10: refused by the system's current state (was 200: helper "formedges")
    expect((r.body as { error: string }).error).toMatch(/At most 6 candidates/);
    expect((await rows()).length).toBe(2);
    expect((await post(own.slice(2, 6).map((id) => `${id}:direct`))).status).toBe(302); // 2 + 4 = 6 is fine
    expect((await rows()).length).toBe(6);
  });

  test("bad values answer 400 with nothing written, never 500", async () => {
    const bad: string[][] = [
      ["abc:speed"],
      [`${own[0]}:magic`],
      [""],
      ["NaN"],
      ["NaN:speed"],
      [`${own[0]}`],
      [`${own[0]}:direct`, "-1:direct"],
      [`1e3:direct`],
      [`${own[0]}:direct:extra`],
      Array.from({ length: 21 }, (_, i) => `${own[i % 12]}:direct`), // more than 20 at once
      Array.from({ length: 10_000 }, () => `${own[0]}:direct`),
    ];
    for (const adds of bad) {
      const r = await post(adds);
      expect(r.status, JSON.stringify(adds).slice(0, 60)).toBe(400);
    }
    expect((await post([])).status).toBe(400); // "Add the ticked pumps" with nothing ticked
    expect(await rows()).toEqual([]);
  });

  test("the single-row Add (curveSetId + method) still adds one", async () => {
    const r = await post([], [
      ["curveSetId", String(own[3])],
      ["method", "speed"],
    ]);
    expect(r.status).toBe(302);
    expect(await rows()).toEqual([{ curveSetId: own[3], method: "speed" }]);
  });

  test("a row's own Add (`one`) adds that pump only, with its method, whatever else is ticked", async () => {
    const r = await post([`${own[0]}:direct`, `${own[1]}:direct`], [["one", `${own[4]}:trim`]]);
    expect(r.status).toBe(302);
    expect(await rows()).toEqual([{ curveSetId: own[4], method: "trim" }]);
    const again = await post([], [["one", `${own[4]}:trim`]]);
    expect(again.status).toBe(409); // RFC 9110 §15.5.10: a conflict with the candidates the system has (was 200)
    expect((again.body as { error: string }).error).toMatch(/already a candidate/);
    for (const bad of ["", "abc", `${own[5]}:magic`, `${own[5]}`, "-1:direct", `${foreign[0]}:direct:x`]) {
      expect((await post([], [["one", bad]])).status, bad).toBe(400);
    }
    expect((await post([], [["one", `${foreign[0]}:direct`]])).status).toBe(404); // another workspace's curve
    expect(await rows()).toEqual([{ curveSetId: own[4], method: "trim" }]);
  });

  test("a viewer may not add: 403, nothing written", async () => {
    const viewer = await makeMember("viewer", engineer.workspaceId);
    const body = new URLSearchParams([["add", `${own[0]}:direct`], ["intent", "add-many"]]);
    const r = await call(searchPage.action as never, { path: `/systems/${systemId}/search`, cookie: viewer.cookie, params: { id: String(systemId) }, body, method: "POST" });
    expect(r.status).toBe(403);
    expect(await rows()).toEqual([]);
  });
});
