// Tests only: the viewer as the guards build it and CSV text imported as the mapping page does, which many service
// and route tests start from; and a search fixture shared by the search tests (search-cache, search-kept). A workspace on
// the paid plan with a library of part of a demo CSV (invented data, fixtures/demo/) and one system
// whose duty lies among its curves; CSV text imported through the same path as the mapping page.
import { readFileSync } from "node:fs";
import { and, eq, or } from "drizzle-orm";
import { db } from "@db/client.server";
import { projectShares, workspaces } from "@db/schema";
import { analyseStored, createLibrary, getUpload, importUpload, storeUpload, updateLibrary, type Viewer } from "../libraries";
import { workspacesOf } from "../auth/guards.server";
import type { Role } from "../auth/permissions";
import { makeMember } from "~/test/harness";
import { createProject, createSystem } from "./projects.server";
import { defaultSystemInput, type SystemInput } from "./hydraulics";
import { shareProject } from "./shares.server";
import { decideShare } from "./share-offers.server";

export const M3H = 1 / 3600;

/** The viewer as the guards build it on each request (the workspace and its plan read from the database), with `role`. */
export async function viewerOfUser(userId: string, role: Role = "admin"): Promise<Viewer> {
  const ws = (await workspacesOf(userId))[0];
  return { userId, workspace: { id: ws.id, name: ws.name, slug: ws.slug, plan: ws.plan }, role };
}

/** Imports CSV text as a new revision of the library (with `note`), with the mapping the analysis proposes; the upload's id. */
export async function importCsvText(v: Viewer, libId: number, text: string, filename = "t.csv", note = ""): Promise<number> {
  const uploadId = await storeUpload(v, libId, new File([text], filename, { type: "text/csv" }));
  const u = await getUpload(v, libId, uploadId);
  await importUpload(v, libId, uploadId, analyseStored(u.text, u.lib).mapping, note);
  return uploadId;
}

/** A booster the Tallowmere demo curves serve (26–30 m static, duty 40 m³/h at 38 m): search finds pumps for it. */
export const boosterInput = (): SystemInput => ({ ...defaultSystemInput(), staticLow: 26, staticHigh: 30, duty: { flow: 40 * M3H, head: 38 } });

/** A library `name` open to the viewer's workspace, holding a demo file's curves (invented data, fixtures/demo/); its id. */
export async function demoLibrary(v: Viewer, name: string, file = "tallowmere.csv"): Promise<number> {
  const libraryId = await createLibrary(v, { name, description: "" });
  await importCsvText(v, libraryId, readFileSync(`fixtures/demo/${file}`, "utf8"), file);
  await updateLibrary(v, libraryId, { name, description: "", visibility: "workspace" });
  return libraryId;
}

/**
 * A library `name` open to the viewer's workspace holding one invented model: `rows` of flow m³/h, head m, efficiency %
 * at 2900 rpm, end-suction, size `size`, impeller `impellerMm` mm — imported as the mapping page does. Its id.
 */
export async function oneModelLibrary(v: Viewer, name: string, m: { model: string; size: string; impellerMm: number; rows: number[][] }): Promise<number> {
  const libraryId = await createLibrary(v, { name, description: "" });
  const header = "model,type,size,speed_rpm,impeller_mm,flow_m3h,head_m,efficiency_pct";
  const lines = m.rows.map(([q, h, e]) => `${m.model},end-suction,${m.size},2900,${m.impellerMm},${q},${h},${e}`);
  await importCsvText(v, libraryId, [header, ...lines].join("\n"));
  await updateLibrary(v, libraryId, { name, description: "", visibility: "workspace" });
  return libraryId;
}

/** An admin with a workspace library of the Tallowmere demo curves named `library` and an empty project named `project`. */
export async function demoProjectFixture(library: string, project: string) {
  const m = await makeMember("admin");
  const v = await viewerOfUser(m.userId);
  await demoLibrary(v, library);
  const projectId = await createProject(v, { name: project, site: "", description: "" });
  return { m, v, projectId };
}

/**
 * An admin on the paid plan, a workspace library holding the first `fraction` of the demo file's rows
 * (one revision), and a system "Main" (12 m static, 150 mm runs, duty 108 m³/h at 28 m).
 */
export async function searchFixture(o: { demoFile: string; library: string; project: string; fraction: number }) {
  const m = await makeMember("admin");
  await db().update(workspaces).set({ plan: "network" }).where(eq(workspaces.id, m.workspaceId));
  const v = await viewerOfUser(m.userId);
  const csv = readFileSync(`fixtures/demo/${o.demoFile}`, "utf8");
  const libId = await createLibrary(v, { name: o.library, description: "" });
  const lines = csv.split("\n");
  await importCsvText(v, libId, lines.slice(0, Math.floor(lines.length * o.fraction)).join("\n"), o.demoFile);
  await updateLibrary(v, libId, { name: o.library, description: "", visibility: "workspace" });
  const input: SystemInput = { ...defaultSystemInput(), staticLow: 12, staticHigh: 12, duty: { flow: 108 * M3H, head: 28 } };
  input.runs = input.runs.map((r) => ({ ...r, diameter: 0.15 }));
  const systemId = await createSystem(v, await createProject(v, { name: o.project, site: "", description: "" }), "Main", input);
  return { userId: m.userId, viewer: v, libId, systemId, csv };
}

/**
 * The project offered to the workspace of that name or slug (`shareProject`) and the offer accepted by an admin made
 * there for it (`decideShare`): a share as the contractor's tests need it, open. The share's id and that admin.
 */
export async function shareAccepted(owner: Viewer, projectId: number, nameOrSlug: string) {
  const offered = await shareProject(owner, projectId, nameOrSlug);
  if (!offered.ok) throw new Error(offered.error);
  const [w] = await db().select().from(workspaces).where(or(eq(workspaces.slug, nameOrSlug.toLowerCase()), eq(workspaces.name, nameOrSlug)));
  const [share] = await db().select({ id: projectShares.id }).from(projectShares).where(and(eq(projectShares.projectId, projectId), eq(projectShares.workspaceId, w.id)));
  const admin = await makeMember("admin", w.id);
  const adminViewer: Viewer = { userId: admin.userId, workspace: { id: w.id, name: w.name, slug: w.slug, plan: w.plan }, role: "admin" };
  const answer = await decideShare(adminViewer, share.id, "accept");
  if (!answer.ok) throw new Error(answer.error);
  return { shareId: share.id, admin, adminViewer };
}
