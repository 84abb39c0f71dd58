// Every write of app/routes.ts attempted by a viewer of the workspace that owns the records (permissions.ts: "Viewer —
// read only"): each route that takes a POST, with each intent its module names (and none), the owner's own ids in the
// path and in every id field a form reads, through the root middleware to the real route modules and MariaDB; API routes
// with the viewer's own write-scope token. Expected (permissions.ts; RFC 9110 §15.5.4; RFC 9457): a 4xx — problem+json
// under /api/ — and not one row of the workspace's records changed, except where a viewer may act: on its own account and
// session (account, signout, a new workspace of its own, the switch), the public calculators and the preview, which store
// nothing. The routes come from route-table.ts, so a new route that takes a POST is attempted here too.
import { readFileSync } from "node:fs";
import { afterAll, beforeAll, expect, test } from "vitest";
import { eq, inArray, ne, and } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { apiTokens, candidates, fieldCheckPhotos, fieldChecks, imports, invitations, libraries, libraryRevisions, memberships, projects, projectShares, selections, systems, tracePictures, uploads, workspaces } from "@db/schema";
import { createApiToken } from "~/lib/auth/api-tokens.server";
import { allowedMethods } from "~/lib/shared/methods";
import { makeMember, type TestMember } from "./harness";
import { GOOD_PARAMS, isApi, load, pathFor, ROUTES, send, walkRecords, wrongAnswer, type WalkRecords, type Who } from "./route-table";

let owner: WalkRecords;
let viewer: TestMember;
let viewerToken: string;

beforeAll(async () => {
  process.env.STRIPE_WEBHOOK_SECRET ||= "whsec_route_attack";
  owner = await walkRecords(await makeMember("admin"));
  viewer = await makeMember("viewer", owner.m.workspaceId);
  viewerToken = (await createApiToken({ userId: viewer.userId, workspaceId: owner.m.workspaceId, name: "viewer", scope: "write" })).token;
}, 120_000);
afterAll(() => closeDb());

/** Where a viewer may post (its own account and session, the public calculators, pages anyone posts to); a route absent here must refuse it. */
const VIEWER_MAY = new Set(["signin", "signup", "signout", "verify", "forgot", "reset", "account", "workspace/new", "invite/:token", "dev/mailbox", "api/v1/calc/pipe-loss", "api/v1/calc/system-curve", "api/v1/calc/operating-point", "api/v1/systems/:id/preview", "api/stripe/webhook"]);
/** Posts that change the viewer's own session or current workspace: sent last, so the rest are sent as the viewer of the owner's workspace. */
const LAST = ["account", "workspace/new", "signout"];

/** The intents a route module names (buttons, comparisons, picklists), and "" for a post without one (a form's default action). */
function intentsOf(file: string): string[] {
  const src = readFileSync(`app/${file}`, "utf8");
  const found = new Set<string>([""]);
  for (const re of [/name="intent" value="([\w-]+)"/g, /intent="([\w-]+)"/g, /intent === "([\w-]+)"/g, /get\("intent"\) === "([\w-]+)"/g, /case "([\w-]+)"/g, /intent: v\.literal\("([\w-]+)"\)/g]) for (const m of src.matchAll(re)) found.add(m[1]);
  for (const m of src.matchAll(/intent: v\.picklist\(\[([^\]]+)\]/g)) for (const x of m[1].matchAll(/"([\w-]+)"/g)) found.add(x[1]);
  return [...found];
}

const takesPost = (r: { path: string; file: string }) =>
  isApi(r.path) ? r.path !== "api/*" && !/export const action = refuseMethod\(/.test(readFileSync(`app/${r.file}`, "utf8")) : allowedMethods(r.path).includes("POST");

/** Every id field the forms read, filled with the owner's records, and the fields a write needs to get past its schema. */
const fieldsFor = (o: WalkRecords, intent: string): Record<string, string> => ({
  ...(intent ? { intent } : {}),
  pageWorkspaceId: String(o.m.workspaceId),
  candidateId: String(o.candidate),
  pictureId: String(o.picture),
  shareId: String(o.offer),
  uploadId: String(o.upload),
  selectionId: String(o.selection),
  systemId: String(o.system),
  projectId: String(o.project),
  memberId: o.m.userId,
  userId: o.m.userId,
  invitationId: "1",
  workspaceId: String(o.m.workspaceId),
  role: "admin",
  email: `viewer-${Date.now()}@example.test`,
  name: "Viewer was here",
  title: "Viewer was here",
  site: "",
  description: "",
  notes: "",
  visibility: "public",
  currency: "usd",
  method: "speed",
  arrangement: "single",
  dutyPumps: "1",
  standbyPumps: "0",
  serviceFactor: "1",
});

/** The owner's workspace's records, as rows: what no refused post may change (the viewer's own token aside: its use is stamped). */
async function snapshot(o: WalkRecords): Promise<string> {
  const ws = o.m.workspaceId;
  const libs = (await db().select({ id: libraries.id }).from(libraries).where(eq(libraries.workspaceId, ws))).map((x) => x.id);
  const sels = (await db().select({ id: selections.id }).from(selections).where(eq(selections.workspaceId, ws))).map((x) => x.id);
  const checks = (await db().select({ id: fieldChecks.id }).from(fieldChecks).where(eq(fieldChecks.workspaceId, ws))).map((x) => x.id);
  const inLibs = <T>(q: Promise<T[]>) => (libs.length ? q : Promise.resolve([]));
  const rows = {
    workspace: await db().select().from(workspaces).where(eq(workspaces.id, ws)),
    members: await db().select().from(memberships).where(eq(memberships.workspaceId, ws)),
    invitations: await db().select().from(invitations).where(eq(invitations.workspaceId, ws)),
    tokens: await db().select().from(apiTokens).where(and(eq(apiTokens.workspaceId, ws), ne(apiTokens.userId, viewer.userId))),
    libraries: await db().select().from(libraries).where(eq(libraries.workspaceId, ws)),
    uploads: await inLibs(db().select().from(uploads).where(inArray(uploads.libraryId, libs))),
    pictures: await inLibs(db().select().from(tracePictures).where(inArray(tracePictures.libraryId, libs))),
    revisions: await inLibs(db().select().from(libraryRevisions).where(inArray(libraryRevisions.libraryId, libs))),
    imports: await inLibs(db().select().from(imports).where(inArray(imports.libraryId, libs))),
    projects: await db().select().from(projects).where(eq(projects.workspaceId, ws)),
    systems: await db().select().from(systems).where(eq(systems.workspaceId, ws)),
    candidates: await db().select().from(candidates).where(eq(candidates.systemId, o.system)),
    selections: await db().select().from(selections).where(eq(selections.workspaceId, ws)),
    shares: await db().select().from(projectShares).where(eq(projectShares.workspaceId, ws)),
    checks: sels.length ? await db().select().from(fieldChecks).where(inArray(fieldChecks.selectionId, sels)) : [],
    photos: checks.length ? await db().select().from(fieldCheckPhotos).where(inArray(fieldCheckPhotos.fieldCheckId, checks)) : [],
  };
  return JSON.stringify(rows, (_k, v) => (typeof v === "bigint" ? String(v) : v));
}

test("a viewer's posts to every route that takes one, with every intent and the owner's ids: a 4xx where a viewer may not act, problem+json under /api/, never a 5xx, and not one of the workspace's rows changed", async () => {
  const before = await snapshot(owner);
  const fails: string[] = [];
  const statuses: Record<string, number> = {};
  const order = ROUTES.filter(takesPost).sort((a, b) => LAST.indexOf(a.path) - LAST.indexOf(b.path));
  let sent = 0;
  for (const r of order) {
    const api = isApi(r.path);
    const params = GOOD_PARAMS[r.path]?.(owner) ?? {};
    await load(r.file);
    const as: Who = api ? { who: "the viewer's token", headers: { authorization: `Bearer ${viewerToken}` } } : { who: "the viewer", cookie: viewer.cookie, headers: {} };
    for (const intent of api ? [""] : intentsOf(r.file)) {
      const body = api ? "{}" : new URLSearchParams(fieldsFor(owner, intent));
      const a = await send(r, as, { params, path: pathFor(r.path, params), method: "POST", body, headers: { "content-type": api ? "application/json" : "application/x-www-form-urlencoded" } });
      sent++;
      statuses[a.status] = (statuses[a.status] ?? 0) + 1;
      const label = `POST /${r.path}${intent ? ` intent=${intent}` : ""} as ${as.who}`;
      const may = VIEWER_MAY.has(r.path) || (r.path === "workspace" && intent === "switch");
      const wrong = wrongAnswer(a, { api, refusal: !may });
      if (wrong) fails.push(`${label} → ${wrong}`);
    }
  }
  const after = await snapshot(owner);
  if (after !== before) {
    const [b, x] = [JSON.parse(before) as Record<string, unknown[]>, JSON.parse(after) as Record<string, unknown[]>];
    for (const k of Object.keys(b)) if (JSON.stringify(b[k]) !== JSON.stringify(x[k])) fails.push(`${k} changed: ${JSON.stringify(b[k]).slice(0, 200)} → ${JSON.stringify(x[k]).slice(0, 200)}`);
  }
  console.info(`viewer: ${sent} posts on ${order.length} routes; statuses ${JSON.stringify(statuses)}`);
  if (fails.length) console.error(`${fails.length} failures:\n${fails.join("\n")}`);
  expect(sent).toBeGreaterThan(order.length);
  expect(fails).toEqual([]);
}, 300_000);
