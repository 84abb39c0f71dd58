// Access sweep, pump libraries and projects: every route and API path that takes an id. A member of
// workspace A (admin: the widest role) reaches nothing of workspace B's private libraries, uploads,
// models, projects, systems, candidates or selections — 403 or 404, never data, nothing changed.
import { readFileSync } from "node:fs";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { candidates, libraries, pumpModels, selections, systems, tracePictures, uploads } from "@db/schema";
import { createApiToken } from "~/lib/auth/api-tokens.server";
import { createLibrary } from "~/lib/libraries";
import { importCsvText } from "~/lib/projects/test-kit";
import { addCandidate, createProject, createSystem, selectCandidate } from "~/lib/projects";
import { defaultSystemInput, DEFAULT_ADJUSTMENT } from "~/lib/projects/hydraulics";
import { call, makeMember, type TestMember } from "./harness";
import * as libPage from "~/routes/libraries.$id";
import * as uploadRoute from "~/routes/libraries.$id.upload";
import * as uploadPage from "~/routes/libraries.$id.uploads.$uploadId";
import * as libCsv from "~/routes/libraries.$id.export-csv";
import * as libJson from "~/routes/libraries.$id.export-json";
import * as apiCurves from "~/routes/api.v1.libraries.$id.curves";
import * as apiModels from "~/routes/api.v1.libraries.$id.models";
import * as apiModel from "~/routes/api.v1.models.$id";
import * as apiUpload from "~/routes/api.v1.libraries.$id.upload";
import * as projectPage from "~/routes/projects.$id";
import * as systemPage from "~/routes/systems.$id";
import * as searchPage from "~/routes/systems.$id.search";
import * as apiPreview from "~/routes/api.v1.systems.$id.preview";
import * as apiSystem from "~/routes/api.v1.systems.$id";
import * as apiSystemSearch from "~/routes/api.v1.systems.$id.search";
import * as selectionPage from "~/routes/selections.$id";
import * as selCsv from "~/routes/selections.$id.export-csv";
import * as selJson from "~/routes/selections.$id.export-json";
import * as tracePage from "~/routes/libraries.$id.trace";
import * as traceUpload from "~/routes/libraries.$id.trace.upload";
import * as tracePicture from "~/routes/libraries.$id.trace.$pictureId";
import * as traceFile from "~/routes/libraries.$id.trace.$pictureId.file";
import { storePicture } from "~/lib/tracer/pictures.server";
import { chartPdf } from "~/lib/tracer/test-chart";

type Ctx = { a: TestMember; aToken: string; b: TestMember; lib: number; upload: number; picture: number; model: number; project: number; system: number; set: number; candidate: number; selection: number; marker: string };
let ctx: Ctx;

beforeAll(async () => {
  const a = await makeMember("admin");
  const b = await makeMember("admin");
  const vb = { userId: b.userId, workspace: { id: b.workspaceId, name: "B", slug: "b", plan: "free" as const }, role: "admin" as const };
  const marker = `Secret model ${Date.now().toString(36)}`;
  const lib = await createLibrary(vb, { name: "B private", description: "" });
  const csv = readFileSync("fixtures/csv/long-si.csv", "utf8").replaceAll("Kestrel KR-3", marker);
  const upload = await importCsvText(vb, lib, csv, "b.csv");
  const [model] = await db().select().from(pumpModels).where(eq(pumpModels.name, marker));
  const project = await createProject(vb, { name: marker, site: "", description: "" });
  const input = { ...defaultSystemInput(), duty: { flow: 20 / 3600, head: 25 } };
  const system = await createSystem(vb, project, marker, input);
  const { curvesOfRevisions } = await import("~/lib/libraries");
  const [rev] = await db().select({ id: libraries.currentRevisionId }).from(libraries).where(eq(libraries.id, lib));
  const sets = await curvesOfRevisions([rev.id!]);
  const set = sets.find((s) => s.model === marker)!.id;
  const added = await addCandidate(vb, system, set, DEFAULT_ADJUSTMENT);
  if (!added.ok) throw new Error(added.reason);
  const selection = await selectCandidate(vb, added.id, marker, "");
  const { token } = await createApiToken({ userId: a.userId, workspaceId: a.workspaceId, name: "sweep", scope: "write" });
  const picture = await storePicture(vb, lib, new File([chartPdf()], "b.pdf", { type: "application/pdf" }));
  ctx = { a, aToken: token, b, lib, upload, picture, model: model.id, project, system, set, candidate: added.id, selection, marker };
});
afterAll(() => closeDb());

type Fn = Parameters<typeof call>[0];
const page = (fn: unknown, path: (c: Ctx) => string, params: (c: Ctx) => Record<string, string>, form?: (c: Ctx) => Record<string, string>) => ({ fn: fn as Fn, path, params, form });

const PROBES: [string, ReturnType<typeof page>][] = [
  ["GET /libraries/:id", page(libPage.loader, (c) => `/libraries/${c.lib}`, (c) => ({ id: String(c.lib) }))],
  ["POST /libraries/:id (rename, make shared)", page(libPage.action, (c) => `/libraries/${c.lib}`, (c) => ({ id: String(c.lib) }), () => ({ name: "pwned", description: "", visibility: "shared" }))],
  ["POST /libraries/:id intent=delete", page(libPage.action, (c) => `/libraries/${c.lib}`, (c) => ({ id: String(c.lib) }), () => ({ intent: "delete" }))],
  ["POST /libraries/:id/uploads/:uploadId intent=import (B's upload)", page(uploadPage.action, (c) => `/libraries/${c.lib}/uploads/${c.upload}`, (c) => ({ id: String(c.lib), uploadId: String(c.upload) }), () => ({ intent: "import", base: "{}" }))],
  ["POST /systems/:id intent=adjust (B's candidate)", page(systemPage.action, (c) => `/systems/${c.system}`, (c) => ({ id: String(c.system) }), (c) => ({ intent: "adjust", candidateId: String(c.candidate), method: "speed", arrangement: "single", dutyPumps: "1", standbyPumps: "0", serviceFactor: "1" }))],
  ["GET /libraries/:id/uploads/:uploadId", page(uploadPage.loader, (c) => `/libraries/${c.lib}/uploads/${c.upload}`, (c) => ({ id: String(c.lib), uploadId: String(c.upload) }))],
  ["GET /libraries/:id/trace", page(tracePage.loader, (c) => `/libraries/${c.lib}/trace`, (c) => ({ id: String(c.lib) }))],
  ["GET /libraries/:id/trace/:pictureId", page(tracePicture.loader, (c) => `/libraries/${c.lib}/trace/${c.picture}`, (c) => ({ id: String(c.lib), pictureId: String(c.picture) }))],
  ["GET /libraries/:id/trace/:pictureId/file", page(traceFile.loader, (c) => `/libraries/${c.lib}/trace/${c.picture}/file`, (c) => ({ id: String(c.lib), pictureId: String(c.picture) }))],
  ["POST /libraries/:id/trace/:pictureId intent=import (traced CSV into B's library)", page(tracePicture.action, (c) => `/libraries/${c.lib}/trace/${c.picture}`, (c) => ({ id: String(c.lib), pictureId: String(c.picture) }), () => ({ intent: "import", csv: "model,speed_rpm,impeller_mm,flow_m3h,head_m\nX,2900,200,0,10\nX,2900,200,1,9\nX,2900,200,2,8\n", page: "1" }))],
  ["GET /libraries/:id/export.csv", page(libCsv.loader, (c) => `/libraries/${c.lib}/export.csv`, (c) => ({ id: String(c.lib) }))],
  ["GET /libraries/:id/export.json", page(libJson.loader, (c) => `/libraries/${c.lib}/export.json`, (c) => ({ id: String(c.lib) }))],
  ["GET /projects/:id", page(projectPage.loader, (c) => `/projects/${c.project}`, (c) => ({ id: String(c.project) }))],
  ["POST /projects/:id intent=archive", page(projectPage.action, (c) => `/projects/${c.project}`, (c) => ({ id: String(c.project) }), () => ({ intent: "archive" }))],
  ["GET /systems/:id", page(systemPage.loader, (c) => `/systems/${c.system}`, (c) => ({ id: String(c.system) }))],
  ["POST /systems/:id intent=archive", page(systemPage.action, (c) => `/systems/${c.system}`, (c) => ({ id: String(c.system) }), () => ({ intent: "archive" }))],
  ["POST /systems/:id remove B's candidate", page(systemPage.action, (c) => `/systems/${c.system}`, (c) => ({ id: String(c.system) }), (c) => ({ intent: "remove-candidate", candidateId: String(c.candidate) }))],
  ["POST /systems/:id select B's candidate", page(systemPage.action, (c) => `/systems/${c.system}`, (c) => ({ id: String(c.system) }), (c) => ({ intent: "select", candidateId: String(c.candidate) }))],
  ["GET /systems/:id/search", page(searchPage.loader, (c) => `/systems/${c.system}/search`, (c) => ({ id: String(c.system) }))],
  ["POST /systems/:id/search (add B's curve)", page(searchPage.action, (c) => `/systems/${c.system}/search`, (c) => ({ id: String(c.system) }), () => ({ curveSetId: "1" }))],
  ["POST /systems/:id/search (add several, ticked)", page(searchPage.action, (c) => `/systems/${c.system}/search`, (c) => ({ id: String(c.system) }), (c) => ({ intent: "add-many", add: `${c.set}:direct` }))],
  ["POST /systems/:id/search (add one row, `one`)", page(searchPage.action, (c) => `/systems/${c.system}/search`, (c) => ({ id: String(c.system) }), (c) => ({ one: `${c.set}:direct` }))],
  ["GET /selections/:id", page(selectionPage.loader, (c) => `/selections/${c.selection}`, (c) => ({ id: String(c.selection) }))],
  ["GET /selections/:id/export.csv", page(selCsv.loader, (c) => `/selections/${c.selection}/export.csv`, (c) => ({ id: String(c.selection) }))],
  ["GET /selections/:id/export.json", page(selJson.loader, (c) => `/selections/${c.selection}/export.json`, (c) => ({ id: String(c.selection) }))],
];

const API: [string, (c: Ctx) => { fn: Fn; path: string; params: Record<string, string>; method?: string; body?: BodyInit; headers?: Record<string, string> }][] = [
  ["GET /api/v1/libraries/:id/curves", (c) => ({ fn: apiCurves.loader as Fn, path: `/api/v1/libraries/${c.lib}/curves`, params: { id: String(c.lib) } })],
  ["GET /api/v1/libraries/:id/models", (c) => ({ fn: apiModels.loader as Fn, path: `/api/v1/libraries/${c.lib}/models`, params: { id: String(c.lib) } })],
  ["GET /api/v1/models/:id", (c) => ({ fn: apiModel.loader as Fn, path: `/api/v1/models/${c.model}`, params: { id: String(c.model) } })],
  ["GET /api/v1/systems/:id", (c) => ({ fn: apiSystem.loader as Fn, path: `/api/v1/systems/${c.system}`, params: { id: String(c.system) } })],
  ["GET /api/v1/systems/:id/search", (c) => ({ fn: apiSystemSearch.loader as Fn, path: `/api/v1/systems/${c.system}/search`, params: { id: String(c.system) } })],
  ["POST /api/v1/systems/:id/preview", (c) => ({ fn: apiPreview.action as Fn, path: `/api/v1/systems/${c.system}/preview`, params: { id: String(c.system) }, method: "POST", body: JSON.stringify({ input: defaultSystemInput() }), headers: { "content-type": "application/json" } })],
  [
    "POST /api/v1/libraries/:id/upload",
    (c) => {
      const fd = new FormData();
      fd.append("file", new File(["model,speed,flow,head\nX,2900,0,10\nX,2900,1,9\nX,2900,2,8\n"], "x.csv", { type: "text/csv" }));
      fd.append("import", "1");
      return { fn: apiUpload.action as Fn, path: `/api/v1/libraries/${c.lib}/upload`, params: { id: String(c.lib) }, method: "POST", body: fd };
    },
  ],
];

async function bUnchanged(c: Ctx) {
  const [l] = await db().select().from(libraries).where(eq(libraries.id, c.lib));
  const [s] = await db().select().from(systems).where(eq(systems.id, c.system));
  const cand = await db().select().from(candidates).where(eq(candidates.id, c.candidate));
  const sel = await db().select().from(selections).where(eq(selections.systemId, c.system));
  return l?.name === "B private" && l.visibility === "private" && !l.archivedAt && !s.archivedAt && cand.length === 1 && sel.length === 1;
}

describe("access sweep (libraries, projects, API): workspace A cannot reach workspace B", () => {
  test("control: B itself reads every page probed below (so a 404 for A means refused, not a wrong address)", async () => {
    for (const [, p] of PROBES.filter(([n]) => n.startsWith("GET"))) {
      const r = await call(p.fn, { path: p.path(ctx), params: p.params(ctx), cookie: ctx.b.cookie });
      expect(r.status, p.path(ctx)).toBe(200);
    }
  });

  for (const [name, p] of PROBES) {
    test(name, async () => {
      const r = await call(p.fn, { path: p.path(ctx), params: p.params(ctx), cookie: ctx.a.cookie, form: p.form?.(ctx) });
      expect([403, 404]).toContain(r.status);
      expect(JSON.stringify(r.body ?? "")).not.toContain(ctx.marker);
      expect(await bUnchanged(ctx)).toBe(true);
    });
  }
  test("POST /libraries/:id/uploads/:uploadId intent=fix (corrected copy of B's upload)", async () => {
    const form = { intent: "fix", "cell.2.0": "pwned", "cell.3.4": "1" };
    const r = await call(uploadPage.action as unknown as Fn, { path: `/libraries/${ctx.lib}/uploads/${ctx.upload}`, params: { id: String(ctx.lib), uploadId: String(ctx.upload) }, cookie: ctx.a.cookie, form });
    expect([403, 404]).toContain(r.status);
    expect((await db().select().from(uploads).where(eq(uploads.libraryId, ctx.lib))).length).toBe(1); // no corrected copy in B's library
    // a member of B's own workspace whose role may not edit libraries is refused too
    const e = await makeMember("engineer", ctx.b.workspaceId);
    const r2 = await call(uploadPage.action as unknown as Fn, { path: `/libraries/${ctx.lib}/uploads/${ctx.upload}`, params: { id: String(ctx.lib), uploadId: String(ctx.upload) }, cookie: e.cookie, form });
    expect([403, 404]).toContain(r2.status);
    expect((await db().select().from(uploads).where(eq(uploads.libraryId, ctx.lib))).length).toBe(1);
  });
  test("POST /systems/:id/search on A's own system with B's private curves ticked: 404, nothing added (single and several)", async () => {
    const va = { userId: ctx.a.userId, workspace: { id: ctx.a.workspaceId, name: "A", slug: "a", plan: "free" as const }, role: "admin" as const };
    const system = await createSystem(va, await createProject(va, { name: "A's own", site: "", description: "" }), "A's own system", defaultSystemInput());
    const post = (body: URLSearchParams) => call(searchPage.action as unknown as Fn, { path: `/systems/${system}/search`, params: { id: String(system) }, cookie: ctx.a.cookie, method: "POST", body });
    for (const body of [new URLSearchParams({ curveSetId: String(ctx.set), method: "direct" }), new URLSearchParams([["add", `${ctx.set}:direct`], ["intent", "add-many"]])]) {
      const r = await post(body);
      expect([403, 404]).toContain(r.status);
      expect(JSON.stringify(r.body ?? "")).not.toContain(ctx.marker);
    }
    expect(await db().select().from(candidates).where(eq(candidates.systemId, system))).toEqual([]);
  });
  test("POST /libraries/:id/upload (a file into B's library)", async () => {
    const fd = new FormData();
    fd.append("file", new File(["model,speed,flow,head\nX,2900,0,10\nX,2900,1,9\nX,2900,2,8\n"], "x.csv", { type: "text/csv" }));
    const r = await call(uploadRoute.action as unknown as Fn, { path: `/libraries/${ctx.lib}/upload`, params: { id: String(ctx.lib) }, method: "POST", body: fd, cookie: ctx.a.cookie, headers: { accept: "application/json" } });
    expect([403, 404]).toContain(r.status);
    expect((await db().select().from(uploads).where(eq(uploads.libraryId, ctx.lib))).length).toBe(1); // only B's own upload
  });
  test("POST /libraries/:id/trace/upload (a picture into B's library), also by B's own engineer", async () => {
    const png = new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0]);
    const e = await makeMember("engineer", ctx.b.workspaceId);
    for (const cookie of [ctx.a.cookie, e.cookie]) {
      const fd = new FormData();
      fd.append("file", new File([png], "x.png", { type: "image/png" }));
      const r = await call(traceUpload.action as unknown as Fn, { path: `/libraries/${ctx.lib}/trace/upload`, params: { id: String(ctx.lib) }, method: "POST", body: fd, cookie });
      expect([403, 404]).toContain(r.status);
    }
    expect((await db().select().from(tracePictures).where(eq(tracePictures.libraryId, ctx.lib))).length).toBe(1); // only B's own picture
    expect((await db().select().from(uploads).where(eq(uploads.libraryId, ctx.lib))).length).toBe(1); // no traced CSV either
  });
  for (const [name, make] of API) {
    test(`${name} (Bearer token of A)`, async () => {
      const p = make(ctx);
      const r = await call(p.fn, { path: p.path, params: p.params, method: p.method, body: p.body, headers: { authorization: `Bearer ${ctx.aToken}`, ...p.headers } });
      expect([403, 404]).toContain(r.status);
      expect(r.headers.get("content-type")).toBe("application/problem+json");
      expect(JSON.stringify(r.body ?? "")).not.toContain(ctx.marker);
      expect(await bUnchanged(ctx)).toBe(true);
    });
  }
});
