// Demo data, idempotent: running it twice changes nothing. All names are invented.
// Run by `npm start` and `npm test` (db/cli.mjs) after the migrations.
import path from "node:path";
import { fileURLToPath } from "node:url";
import { eq } from "drizzle-orm";
import { hash } from "@node-rs/argon2";
import { closeDb, db, withTransaction } from "../../db/client.server";
import { libraries, memberships, users, workspaces, type Role } from "../../db/schema";
import { analyseStored, createLibrary, getUpload, importUpload, storeUpload, updateLibrary, type Viewer } from "../lib/libraries";
import { addCandidate, createProject, createSystem, listProjects, selectCandidate } from "../lib/projects";
import { searchForSystem } from "../lib/projects";
import { DEFAULT_ADJUSTMENT, evaluateSystem } from "../lib/projects/hydraulics";
import { demoLibraries } from "../../fixtures/demo";
import { seedFieldChecks } from "./seed-fieldchecks";
import { demoSystems, type DemoSystem } from "./demo-systems";

export const DEMO_PASSWORD = "duty-demo-2026";

export const DEMO_WORKSPACES = [
  { name: "Kestrel Building Services", slug: "kestrel", plan: "free" as const },
  { name: "Harrow & Vell Pumps", slug: "harrow-vell", plan: "network" as const },
  { name: "Lowmoor Commissioning", slug: "lowmoor", plan: "free" as const },
  { name: "Nordquay Hydraulics", slug: "nordquay", plan: "network" as const },
  { name: "Tallowmere Fluid Systems", slug: "tallowmere", plan: "network" as const },
];

export const DEMO_USERS: { email: string; name: string; workspace: string; role: Role }[] = [
  { email: "admin@kestrel.example", name: "Ada Kestrel", workspace: "kestrel", role: "admin" },
  { email: "engineer@kestrel.example", name: "Ravi Patel", workspace: "kestrel", role: "engineer" },
  { email: "distributor@harrow-vell.example", name: "Mina Vell", workspace: "harrow-vell", role: "distributor" },
  { email: "contractor@lowmoor.example", name: "Tom Lowmoor", workspace: "lowmoor", role: "contractor" },
  { email: "admin@lowmoor.example", name: "Nell Okafor", workspace: "lowmoor", role: "admin" },
  { email: "viewer@kestrel.example", name: "Iris Moss", workspace: "kestrel", role: "viewer" },
];

export async function seed(): Promise<{ created: number }> {
  let created = 0;
  const passwordHash = await hash(DEMO_PASSWORD);
  await withTransaction(async (tx) => {
    for (const w of DEMO_WORKSPACES) {
      const found = await tx.select({ id: workspaces.id }).from(workspaces).where(eq(workspaces.slug, w.slug));
      if (found.length === 0) {
        await tx.insert(workspaces).values(w);
        created++;
      }
    }
    for (const u of DEMO_USERS) {
      const found = await tx.select({ id: users.id }).from(users).where(eq(users.email, u.email));
      let userId = found[0]?.id;
      if (!userId) {
        userId = `demo-${u.email.split("@")[0]}-${u.workspace}`;
        const [w] = await tx.select({ id: workspaces.id }).from(workspaces).where(eq(workspaces.slug, u.workspace));
        await tx
          .insert(users)
          .values({ id: userId, email: u.email, name: u.name, passwordHash, emailVerified: true, currentWorkspaceId: w.id });
        created++;
      }
      const [ws] = await tx.select({ id: workspaces.id }).from(workspaces).where(eq(workspaces.slug, u.workspace));
      const m = await tx
        .select({ id: memberships.id })
        .from(memberships)
        .where(eq(memberships.userId, userId));
      if (!m.some(() => true)) {
        await tx.insert(memberships).values({ workspaceId: ws.id, userId, role: u.role });
        created++;
      }
    }
  });
  return { created };
}

const viewerFor = async (slug: string, role: Role, userId = "seed"): Promise<Viewer> => {
  const [w] = await db().select().from(workspaces).where(eq(workspaces.slug, slug));
  return { userId, workspace: { id: w.id, name: w.name, slug: w.slug, plan: w.plan }, role };
};

/** Demo libraries: each distributor's clean file, shared; a copy of one kept by the engineering firm for itself. */
export async function seedLibraries(): Promise<number> {
  const plans = [
    { slug: "harrow-vell", from: "Harrow & Vell Pumps", visibility: "shared" as const },
    { slug: "nordquay", from: "Nordquay Hydraulics", visibility: "shared" as const },
    { slug: "tallowmere", from: "Tallowmere Fluid Systems", visibility: "shared" as const },
    { slug: "kestrel", from: "Tallowmere Fluid Systems", visibility: "workspace" as const, name: "Kestrel preferred pumps", description: "Tallowmere range the firm specifies most, kept as its own copy" },
  ];
  let made = 0;
  const libs = demoLibraries();
  for (const p of plans) {
    const demo = libs.find((l) => l.distributor === p.from);
    if (!demo) continue;
    const name = p.name ?? demo.library;
    // Created by the workspace's demo member when it has one (distributor, engineer), else by nobody.
    const member = await db().select({ id: memberships.userId }).from(memberships).innerJoin(workspaces, eq(workspaces.id, memberships.workspaceId)).where(eq(workspaces.slug, p.slug)).limit(1);
    const v = await viewerFor(p.slug, "admin", member[0]?.id ?? "");
    const existing = await db().select().from(libraries).where(eq(libraries.workspaceId, v.workspace.id));
    if (existing.some((l) => l.name === name)) continue;
    const id = await createLibrary(v, { name, description: p.description ?? demo.description });
    const clean = demo.files.find((f) => !f.variantOf)!;
    const uploadId = await storeUpload(v, id, new File([clean.text], clean.name, { type: "text/csv" }));
    const { text, lib } = await getUpload(v, id, uploadId);
    await importUpload(v, id, uploadId, analyseStored(text, lib).mapping, "demo data");
    await updateLibrary(v, id, { name, description: p.description ?? demo.description, visibility: p.visibility });
    made++;
  }
  return made;
}

/** The engineering firm's demo projects: systems from pipe runs, three candidates each, one selection each. */
export async function seedProjects(): Promise<number> {
  const [eng] = await db().select().from(users).where(eq(users.email, "engineer@kestrel.example"));
  const v = await viewerFor("kestrel", "engineer", eng.id);
  const have = await listProjects(v);
  let made = 0;
  for (const d of demoSystems()) {
    if (have.some((p) => p.name === d.project.name)) continue;
    await seedDemoProject(v, d);
    made++;
  }
  return made;
}

/**
 * One demo project as the seed makes it, in the viewer's workspace: the system with its duty head at the band's demanding
 * edge, the search's best three distinct pumps as candidates (and one held at a fixed drive speed where none meets as
 * published), the first selected. Also the report walk's fixture (app/test/report-walk.test.ts). Returns the system's id
 * and its candidates' ids in the order added.
 */
export async function seedDemoProject(v: Viewer, d: DemoSystem): Promise<{ systemId: number; candidateIds: number[] }> {
  // The duty head is the system's head at the duty flow at the band's demanding edge (most lift,
  // aged pipe: where the verdicts are judged), rounded up to 0.5 m.
  const ev = evaluateSystem(d.input, { flowMax: d.input.duty!.flow, points: 2 });
  const input = { ...d.input, duty: { flow: d.input.duty!.flow, head: Math.ceil(ev.high[1] * 2) / 2 } };
  const projectId = await createProject(v, d.project);
  const systemId = await createSystem(v, projectId, d.system, input);
  const found = await searchForSystem(v, systemId);
  const picks = found.results.filter((r, i, all) => all.findIndex((x) => x.curveSetId === r.curveSetId) === i).slice(0, 3);
  const ids: number[] = [];
  for (const r of picks) {
    const added = await addCandidate(v, systemId, r.curveSetId, { ...DEFAULT_ADJUSTMENT, method: r.method === "direct" ? "none" : r.method });
    if (added.ok) ids.push(added.id);
  }
  const first = ids[0];
  // No pump meets the duty as published: one more candidate held at a fixed drive speed (the
  // search's speed rounded up to the next whole percent), as an engineer would set a drive.
  if (!picks.some((r) => r.method === "direct")) {
    const fixed = found.results.find((r) => r.method === "speed" && !picks.some((p) => p.curveSetId === r.curveSetId));
    if (fixed) {
      const held = await addCandidate(v, systemId, fixed.curveSetId, { ...DEFAULT_ADJUSTMENT, method: "speed", ratio: Math.ceil(fixed.ratio * 100 + 0.5) / 100 });
      if (held.ok) ids.push(held.id);
    }
  }
  if (first) await selectCandidate(v, first, "", "Demo selection: best-ranked candidate, adjusted to the duty.");
  return { systemId, candidateIds: ids };
}

if (process.argv[1] && fileURLToPath(import.meta.url) === path.resolve(process.argv[1])) {
  seed()
    .then(async ({ created }) => {
      const libs = await seedLibraries();
      const projects = await seedProjects();
      await seedFieldChecks();
      process.stderr.write(
        `[db] demo data: ${created || libs || projects ? `${created} accounts rows, ${libs} libraries, ${projects} projects created` : "already present"}\n`,
      );
      await closeDb();
    })
    .catch(async (err) => {
      process.stderr.write(`[db] seed failed: ${err?.stack ?? err}\n`);
      await closeDb().catch(() => {});
      process.exit(1);
    });
}
