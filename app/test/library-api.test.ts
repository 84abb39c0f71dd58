// Library API and lifecycle against the real MariaDB: upload through the API (report, then import),
// models and a model with curves, and delete-or-archive. Fixture files are invented (fixtures/).
import { readFileSync } from "node:fs";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { libraries } from "@db/schema";
import { createApiToken } from "~/lib/auth/api-tokens.server";
import { addCandidate, createProject, createSystem, selectCandidate } from "~/lib/projects";
import { createLibrary, deleteLibrary, libraryCurves, updateLibrary, type Viewer } from "~/lib/libraries";
import { defaultSystemInput } from "~/lib/projects/hydraulics";
import { call, makeMember, type TestMember } from "./harness";
import * as apiUpload from "~/routes/api.v1.libraries.$id.upload";
import * as apiModels from "~/routes/api.v1.libraries.$id.models";
import * as apiModel from "~/routes/api.v1.models.$id";

afterAll(() => closeDb());

let d: TestMember;
let v: Viewer;
let write = "";
let read = "";
beforeAll(async () => {
  d = await makeMember("distributor");
  v = { userId: d.userId, workspace: { id: d.workspaceId, name: "d", slug: "d", plan: "free" }, role: "distributor" };
  write = (await createApiToken({ userId: d.userId, workspaceId: d.workspaceId, name: "w", scope: "write" })).token;
  read = (await createApiToken({ userId: d.userId, workspaceId: d.workspaceId, name: "r", scope: "read" })).token;
});

const upload = (libId: number, token: string, file: string, importIt: boolean) => {
  const fd = new FormData();
  fd.append("file", new File([readFileSync(file)], file.split("/").pop()!, { type: "text/csv" }));
  if (importIt) fd.append("import", "1");
  return call(apiUpload.action as never, { path: `/api/v1/libraries/${libId}/upload`, params: { id: String(libId) }, method: "POST", body: fd, headers: { authorization: `Bearer ${token}` } });
};

describe("API: upload, models, model", () => {
  test("a report without import, then an import; a read token may not upload", async () => {
    const libId = await createLibrary(v, { name: "API lib", description: "" });
    const report = await upload(libId, write, "fixtures/demo/nordquay.broken.csv", false);
    expect(report.status).toBe(201);
    const body = report.body as { report: { stats: { errors: number }; problems: { row: number; column: string; reason: string }[] }; revision?: unknown };
    expect(body.report.stats.errors).toBeGreaterThan(0); // the generator broke five rows (fixtures/demo/generate.ts)
    expect(body.report.problems[0]).toMatchObject({ row: expect.any(Number), reason: expect.any(String) });
    expect(body.revision).toBeUndefined();
    expect(await libraryCurves(v, libId)).toHaveLength(0);

    const imported = await upload(libId, write, "fixtures/demo/nordquay.csv", true);
    expect(imported.status).toBe(201);
    expect((imported.body as { revision: { number: number; curves: number } }).revision).toMatchObject({ number: 1 });
    expect((await upload(libId, read, "fixtures/demo/nordquay.csv", true)).status).toBe(403);

    const models = await call(apiModels.loader as never, { path: `/api/v1/libraries/${libId}/models`, params: { id: String(libId) }, headers: { authorization: `Bearer ${read}` } });
    expect(models.status).toBe(200);
    const list = (models.body as { models: { id: number; name: string; curves: unknown[] }[] }).models;
    expect(list).toHaveLength(13); // nordquay.csv has 13 models (generator)
    const one = await call(apiModel.loader as never, { path: `/api/v1/models/${list[0].id}`, params: { id: String(list[0].id) }, headers: { authorization: `Bearer ${read}` } });
    expect(one.status).toBe(200);
    const m = one.body as { model: { name: string }; curveSets: { points: unknown[] }[] };
    expect(m.model.name).toBe(list[0].name);
    expect(m.curveSets[0].points.length).toBeGreaterThanOrEqual(3);
  });

  test("not CSV → 422 problem+json, no JSON body → 415", async () => {
    const libId = await createLibrary(v, { name: "API lib 2", description: "" });
    const fd = new FormData();
    fd.append("file", new File([new Uint8Array([0, 1, 2, 3])], "x.csv", { type: "text/csv" }));
    const r = await call(apiUpload.action as never, { path: `/api/v1/libraries/${libId}/upload`, params: { id: String(libId) }, method: "POST", body: fd, headers: { authorization: `Bearer ${write}` } });
    expect(r.status).toBe(422);
    expect(r.headers.get("content-type")).toBe("application/problem+json");
    const j = await call(apiUpload.action as never, { path: `/api/v1/libraries/${libId}/upload`, params: { id: String(libId) }, method: "POST", body: "{}", headers: { authorization: `Bearer ${write}`, "content-type": "application/json" } });
    expect(j.status).toBe(415);
  });
});

describe("delete or archive", () => {
  test("an unused library is deleted; one a selection used is archived and the selection keeps its curve", async () => {
    const unused = await createLibrary(v, { name: "Unused", description: "" });
    expect(await deleteLibrary(v, unused)).toBe("deleted");
    expect(await db().select().from(libraries).where(eq(libraries.id, unused))).toHaveLength(0);

    const used = await createLibrary(v, { name: "Used", description: "" });
    await upload(used, write, "fixtures/demo/tallowmere.csv", true);
    await updateLibrary(v, used, { name: "Used", description: "", visibility: "workspace" });
    const eng = await makeMember("engineer", d.workspaceId);
    const ev: Viewer = { userId: eng.userId, workspace: v.workspace, role: "engineer" };
    const p = await createProject(ev, { name: "P", site: "", description: "" });
    const s = await createSystem(ev, p, "S", { ...defaultSystemInput(), duty: { flow: 40 / 3600, head: 35 } });
    const set = (await libraryCurves(ev, used))[0];
    const c = await addCandidate(ev, s, set.id);
    if (!c.ok) throw new Error(c.reason);
    const { getSelection } = await import("~/lib/projects");
    const selId = await selectCandidate(ev, c.id, "kept", "");
    expect(await deleteLibrary(v, used)).toBe("archived");
    const [row] = await db().select().from(libraries).where(eq(libraries.id, used));
    expect(row.archivedAt).not.toBeNull();
    expect((await libraryCurves(ev, used).catch((e) => e))?.init?.status).toBe(404);
    const sel = await getSelection(ev, selId);
    expect(sel.frozen.pump.points).toEqual(set.points);
  });
});
