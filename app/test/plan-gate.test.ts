// Plan gate sweep: every route and API path that returns pump curves, called for a workspace on
// the free plan (Starter), gives no curve data of another workspace's shared library; the same
// calls on the paid plan (Network) do. Selections frozen earlier keep their data either way.
// Our product rule (issue 7): "locked libraries can be listed with their description, never their curves".
import { readFileSync } from "node:fs";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { eq, inArray } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { candidates, curveSets, libraries, libraryRevisions, workspaces } from "@db/schema";
import { createApiToken } from "~/lib/auth/api-tokens.server";
import { createLibrary, deleteLibrary, updateLibrary, type Viewer } from "~/lib/libraries";
import { importCsvText } from "~/lib/projects/test-kit";
import { createProject, createSystem, selectCandidate } from "~/lib/projects";
import { defaultSystemInput } from "~/lib/projects/hydraulics";
import { call, makeMember, makeWorkspace, type TestMember } from "./harness";
import * as libraryPage from "~/routes/libraries.$id";
import * as librariesApi from "~/routes/api.v1.libraries";
import * as curvesApi from "~/routes/api.v1.libraries.$id.curves";
import * as searchPage from "~/routes/systems.$id.search";
import * as systemPage from "~/routes/systems.$id";
import * as previewApi from "~/routes/api.v1.systems.$id.preview";
import * as systemApi from "~/routes/api.v1.systems.$id";
import * as systemSearchApi from "~/routes/api.v1.systems.$id.search";
import * as selectionPage from "~/routes/selections.$id";
import * as selectionJson from "~/routes/selections.$id.export-json";
import { forgetTokens } from "~/lib/auth/token-cache.server";

type Ctx = {
  /** The distributor who shares the library (removes it when the sweep ends). */
  distributor: Viewer;
  engineer: TestMember;
  token: string;
  libraryId: number;
  description: string;
  sharedSets: Set<number>;
  systemId: number;
  /** A curve set of the shared library, not yet a candidate (for addCandidate). */
  freshSetId: number;
  /** Candidate added and selection frozen while the workspace was on Network. */
  earlierSetId: number;
  selectionId: number;
  frozenPoints: unknown;
};
let c: Ctx;

/**
 * The plan written straight to the table, as another app process would see it. In the product a plan
 * only changes through the Stripe webhook, which clears the verified-token cache; written directly,
 * this process's cache is cleared by hand, as its TOKEN_CACHE_MS window would (token-cache.server.ts).
 */
const setPlan = async (workspaceId: number, plan: "free" | "network") => {
  await db().update(workspaces).set({ plan }).where(eq(workspaces.id, workspaceId));
  forgetTokens();
};
const viewerFor = (m: TestMember, plan: "free" | "network", ws: { id: number; name: string }): Viewer => ({ userId: m.userId, workspace: { id: ws.id, name: ws.name, slug: "x", plan }, role: m.role });
const M3H = 1 / 3600;

beforeAll(async () => {
  // A distributor on Network publishes a library (fixtures/csv/long-si.csv, hand-written) as shared.
  const dist = await makeWorkspace(undefined, "network");
  const d = await makeMember("distributor", dist.id);
  const dv = viewerFor(d, "network", dist);
  const description = "Gate sweep range — description may be read by anyone";
  const libraryId = await createLibrary(dv, { name: `Gate sweep ${dist.id}`, description });
  // Model names of this run (the workspace id): search merges identical curves across libraries into one row, and other
  // shared copies of long-si.csv (libraries.server.test.ts, earlier runs) would otherwise hold the row instead of this library.
  const csv = readFileSync("fixtures/csv/long-si.csv", "utf8").replaceAll("Kestrel", `Gate ${dist.id}`);
  await importCsvText(dv, libraryId, csv, "long-si.csv", "gate sweep");
  await updateLibrary(dv, libraryId, { name: `Gate sweep ${dist.id}`, description, visibility: "shared" });
  const sets = await db()
    .select({ id: curveSets.id })
    .from(curveSets)
    .innerJoin(libraryRevisions, eq(libraryRevisions.id, curveSets.revisionId))
    .innerJoin(libraries, eq(libraries.id, libraryRevisions.libraryId))
    .where(eq(libraries.id, libraryId));
  const sharedSets = new Set(sets.map((s) => s.id));
  expect(sharedSets.size).toBeGreaterThan(1);

  // An engineering firm: starts on Network, adds a candidate from the shared library and freezes a selection.
  const firm = await makeWorkspace(undefined, "network");
  const engineer = await makeMember("engineer", firm.id);
  const ev = viewerFor(engineer, "network", firm);
  const projectId = await createProject(ev, { name: "Gate sweep project", site: "", description: "" });
  // Duty on the (renamed) Kestrel KR-3 2900 rpm / 165 mm curve of long-si.csv (17.14 m³/h, 31.52 m), a little below it.
  const systemId = await createSystem(ev, projectId, "Gate sweep system", { ...defaultSystemInput(), duty: { flow: 17.14 * M3H, head: 28 } });
  const [earlierSetId, freshSetId] = [...sharedSets];
  const add = await call(searchPage.action as never, { path: `/systems/${systemId}/search`, cookie: engineer.cookie, params: { id: String(systemId) }, form: { curveSetId: String(earlierSetId), method: "none" } });
  expect(add.status).toBe(302);
  const [cand] = await db().select().from(candidates).where(eq(candidates.systemId, systemId));
  const selectionId = await selectCandidate(ev, cand.id, "Chosen on Network", "");
  const sel = await call(selectionPage.loader as never, { path: `/selections/${selectionId}`, cookie: engineer.cookie, params: { id: String(selectionId) } });
  const frozenPoints = (sel.body as { frozen: { pump: { points: unknown[] } } }).frozen.pump.points;
  expect((frozenPoints as unknown[]).length).toBeGreaterThan(2);

  const { token } = await createApiToken({ userId: engineer.userId, workspaceId: firm.id, name: "gate", scope: "read" });
  c = { distributor: dv, engineer, token, libraryId, description, sharedSets, systemId, freshSetId, earlierSetId, selectionId, frozenPoints };
});
// The shared library goes when the sweep ends (archived: a selection uses it), so the database does not keep
// one more shared library for each run.
afterAll(async () => {
  if (c) await deleteLibrary(c.distributor, c.libraryId);
  await closeDb();
});

const asEngineer = (path: string, extra: Partial<Parameters<typeof call>[1]> = {}) => ({ path, cookie: c.engineer.cookie, ...extra });
type View = { candidates: { curveSetId: number; result: { curve: unknown[] } | null }[] };
/** Candidates in a workbench view that carry curve data of the shared library. */
const sharedCurvesIn = (view: View) => view.candidates.filter((x) => c.sharedSets.has(x.curveSetId) && x.result != null && x.result.curve.length > 0);

const PROBES = {
  "GET /libraries/:id (page loader)": async () => {
    const r = await call(libraryPage.loader as never, asEngineer(`/libraries/${c.libraryId}`, { params: { id: String(c.libraryId) } }));
    const b = r.body as { locked: boolean; curves: unknown[]; models: unknown[]; revisions: unknown[]; lib: { description: string } };
    return { status: r.status, curves: b.curves?.length ?? 0, models: b.models?.length ?? 0, locked: b.locked, description: b.lib?.description };
  },
  "GET /api/v1/libraries/:id/curves (session)": async () => {
    const r = await call(curvesApi.loader as never, asEngineer(`/api/v1/libraries/${c.libraryId}/curves`, { params: { id: String(c.libraryId) } }));
    return { status: r.status, curves: (r.body as { curveSets?: unknown[] }).curveSets?.length ?? 0 };
  },
  "GET /api/v1/libraries/:id/curves (Bearer token)": async () => {
    const r = await call(curvesApi.loader as never, { path: `/api/v1/libraries/${c.libraryId}/curves`, headers: { authorization: `Bearer ${c.token}` }, params: { id: String(c.libraryId) } });
    return { status: r.status, curves: (r.body as { curveSets?: unknown[] }).curveSets?.length ?? 0 };
  },
  "GET /systems/:id/search (duty-point search results)": async () => {
    const r = await call(searchPage.loader as never, asEngineer(`/systems/${c.systemId}/search`, { params: { id: String(c.systemId) } }));
    const b = r.body as { results: { curveSetId: number }[]; locked: { id: number; description: string }[] };
    return { status: r.status, curves: b.results.filter((x) => c.sharedSets.has(x.curveSetId)).length, lockedListed: b.locked.filter((l) => l.id === c.libraryId).map((l) => l.description) };
  },
  "GET /systems/:id (workbench with a candidate added earlier)": async () => {
    const r = await call(systemPage.loader as never, asEngineer(`/systems/${c.systemId}`, { params: { id: String(c.systemId) } }));
    return { status: r.status, curves: sharedCurvesIn((r.body as { view: View }).view).length };
  },
  "POST /api/v1/systems/:id/preview (live preview with a candidate added earlier)": async () => {
    const r = await call(previewApi.action as never, {
      path: `/api/v1/systems/${c.systemId}/preview`,
      method: "POST",
      headers: { authorization: `Bearer ${c.token}`, "content-type": "application/json" },
      body: JSON.stringify({ input: { ...defaultSystemInput(), duty: { flow: 17.14 * M3H, head: 28 } } }),
      params: { id: String(c.systemId) },
    });
    return { status: r.status, curves: r.status === 200 ? sharedCurvesIn(r.body as View).length : 0 };
  },
  "GET /api/v1/systems/:id (stored system with a candidate added earlier)": async () => {
    const r = await call(systemApi.loader as never, { path: `/api/v1/systems/${c.systemId}`, headers: { authorization: `Bearer ${c.token}` }, params: { id: String(c.systemId) } });
    return { status: r.status, curves: r.status === 200 ? sharedCurvesIn(r.body as View).length : 0 };
  },
  "GET /api/v1/systems/:id/search (duty-point search by token)": async () => {
    const r = await call(systemSearchApi.loader as never, { path: `/api/v1/systems/${c.systemId}/search`, headers: { authorization: `Bearer ${c.token}` }, params: { id: String(c.systemId) } });
    return { status: r.status, curves: ((r.body as { results?: { curveSetId: number }[] }).results ?? []).filter((x) => c.sharedSets.has(x.curveSetId)).length };
  },
};

async function addFresh() {
  const r = await call(searchPage.action as never, asEngineer(`/systems/${c.systemId}/search`, { params: { id: String(c.systemId) }, form: { curveSetId: String(c.freshSetId), method: "none" } }));
  const rows = await db().select().from(candidates).where(inArray(candidates.curveSetId, [c.freshSetId]));
  return { status: r.status, rows: rows.filter((x) => x.systemId === c.systemId).length };
}

/** The search page's "Add the ticked pumps" with two more curves of the shared library ticked. */
async function addSeveral() {
  const ids = [...c.sharedSets].filter((id) => id !== c.freshSetId && id !== c.earlierSetId).slice(0, 2);
  const body = new URLSearchParams([...ids.map((id) => ["add", `${id}:direct`]), ["intent", "add-many"]]);
  const r = await call(searchPage.action as never, asEngineer(`/systems/${c.systemId}/search`, { params: { id: String(c.systemId) }, method: "POST", body }));
  const rows = await db().select().from(candidates).where(inArray(candidates.curveSetId, ids));
  return { status: r.status, rows: rows.filter((x) => x.systemId === c.systemId).length };
}

describe("Starter (free): shared libraries listed, never their curves", () => {
  beforeAll(async () => {
    await setPlan(c.engineer.workspaceId, "free");
  });

  test("library page: listed with its description, locked, no curves, no models", async () => {
    const r = await PROBES["GET /libraries/:id (page loader)"]();
    expect(r).toEqual({ status: 200, curves: 0, models: 0, locked: true, description: c.description });
  });

  test("curves API by session and by token: 403 problem, no curve sets", async () => {
    expect(await PROBES["GET /api/v1/libraries/:id/curves (session)"]()).toEqual({ status: 403, curves: 0 });
    expect(await PROBES["GET /api/v1/libraries/:id/curves (Bearer token)"]()).toEqual({ status: 403, curves: 0 });
  });

  test("libraries API lists the shared library as locked with its description and no curve data", async () => {
    const r = await call(librariesApi.loader as never, { path: "/api/v1/libraries", headers: { authorization: `Bearer ${c.token}` } });
    const row = (r.body as { libraries: Record<string, unknown>[] }).libraries.find((l) => l.id === c.libraryId)!;
    expect(row).toMatchObject({ access: "locked", description: c.description });
    expect(Object.keys(row)).not.toContain("curves");
    expect(Object.keys(row)).not.toContain("curveSets");
  });

  test("duty-point search: no result from the shared library; the library is listed as locked with its description", async () => {
    const r = await PROBES["GET /systems/:id/search (duty-point search results)"]();
    expect(r).toEqual({ status: 200, curves: 0, lockedListed: [c.description] });
  });

  test("adding a curve of the locked library as a candidate: 404, nothing stored", async () => {
    expect(await addFresh()).toEqual({ status: 404, rows: 0 });
  });

  test("adding several ticked curves of the locked library at once: 404, nothing stored", async () => {
    expect(await addSeveral()).toEqual({ status: 404, rows: 0 });
  });

  test("system workbench: a candidate added while on Network shows no curve of the now locked library", async () => {
    expect(await PROBES["GET /systems/:id (workbench with a candidate added earlier)"]()).toMatchObject({ curves: 0 });
  });

  test("live preview API: the same candidate shows no curve of the now locked library", async () => {
    expect(await PROBES["POST /api/v1/systems/:id/preview (live preview with a candidate added earlier)"]()).toMatchObject({ curves: 0 });
  });

  test("system read API and search API by token: no curve or result of the now locked library", async () => {
    expect(await PROBES["GET /api/v1/systems/:id (stored system with a candidate added earlier)"]()).toEqual({ status: 200, curves: 0 });
    expect(await PROBES["GET /api/v1/systems/:id/search (duty-point search by token)"]()).toEqual({ status: 200, curves: 0 });
  });

  test("a selection frozen on Network keeps its frozen curve points (page and JSON export)", async () => {
    const page = await call(selectionPage.loader as never, asEngineer(`/selections/${c.selectionId}`, { params: { id: String(c.selectionId) } }));
    expect(page.status).toBe(200);
    expect((page.body as { frozen: { pump: { points: unknown } } }).frozen.pump.points).toEqual(c.frozenPoints);
    const json = await call(selectionJson.loader as never, asEngineer(`/selections/${c.selectionId}/export.json`, { params: { id: String(c.selectionId) } }));
    expect(json.status).toBe(200);
    expect((json.body as { pump: { points: unknown } }).pump.points).toEqual(c.frozenPoints);
    // The export writes every quantity out in SI, the top-level verdict's rule and reasons included (no ⟦…⟧ token left).
    expect((json.body as { verdict: { rule: string } | null }).verdict?.rule).toBeTruthy();
    expect(JSON.stringify(json.body)).not.toContain("⟦");
  });
});

describe("Network: the same paths open the shared library", () => {
  beforeAll(async () => {
    await setPlan(c.engineer.workspaceId, "network");
  });

  test("library page shows models and curves", async () => {
    const r = await PROBES["GET /libraries/:id (page loader)"]();
    expect(r.status).toBe(200);
    expect(r.locked).toBe(false);
    expect(r.models).toBeGreaterThan(0);
    expect(r.curves).toBeGreaterThan(0);
  });

  test("curves API by session and by token returns every curve set", async () => {
    expect(await PROBES["GET /api/v1/libraries/:id/curves (session)"]()).toEqual({ status: 200, curves: c.sharedSets.size });
    expect(await PROBES["GET /api/v1/libraries/:id/curves (Bearer token)"]()).toEqual({ status: 200, curves: c.sharedSets.size });
  });

  test("duty-point search returns curves of the shared library", async () => {
    const r = await PROBES["GET /systems/:id/search (duty-point search results)"]();
    expect(r.status).toBe(200);
    expect(r.curves).toBeGreaterThan(0);
    expect(r.lockedListed).toEqual([]);
  });

  test("system workbench and live preview show the candidate's curve", async () => {
    expect((await PROBES["GET /systems/:id (workbench with a candidate added earlier)"]()).curves).toBe(1);
    expect(await PROBES["POST /api/v1/systems/:id/preview (live preview with a candidate added earlier)"]()).toEqual({ status: 200, curves: 1 });
    expect(await PROBES["GET /api/v1/systems/:id (stored system with a candidate added earlier)"]()).toEqual({ status: 200, curves: 1 });
  });

  test("search API by token returns results of the shared library", async () => {
    const r = await PROBES["GET /api/v1/systems/:id/search (duty-point search by token)"]();
    expect(r.status).toBe(200);
    expect(r.curves).toBeGreaterThan(0);
  });

  test("a curve of the shared library can be added as a candidate", async () => {
    expect(await addFresh()).toEqual({ status: 302, rows: 1 });
  });

  test("several ticked curves of the shared library can be added at once", async () => {
    expect(await addSeveral()).toEqual({ status: 302, rows: 2 });
  });
});
