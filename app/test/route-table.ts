// The routes of app/routes.ts as the route sweeps walk them (route-walk.test.ts, route-attack.test.ts): every
// route with its module, a good value for every path parameter (GOOD_PARAMS: a route without one fails
// route-walk's first test, so a new route cannot be added without being walked by both), one record of each kind
// for those values (`walkRecords`), and the root middleware run around a route as React Router runs it.
import { readFileSync } from "node:fs";
import { eq } from "drizzle-orm";
import { db } from "@db/client.server";
import { fieldCheckPhotos, libraries, projectShares } from "@db/schema";
import routeConfig from "~/routes";
import { createApiToken } from "~/lib/auth/api-tokens.server";
import { invite } from "~/lib/workspaces";
import { createLibrary, curvesOfRevisions } from "~/lib/libraries";
import { importCsvText } from "~/lib/projects/test-kit";
import { addCandidate, createProject, createSystem, selectCandidate } from "~/lib/projects";
import { DEFAULT_ADJUSTMENT, defaultSystemInput } from "~/lib/projects/hydraulics";
import { recordFieldCheck } from "~/lib/fieldchecks/records.server";
import { parseCheckFields } from "~/lib/fieldchecks";
import { storePicture } from "~/lib/tracer/pictures.server";
import { chartPdf } from "~/lib/tracer/test-chart";
import { middleware } from "~/root";
import { fieldsForHead, storeSelection } from "./fieldcheck-fixture";
import { BASE, makeWorkspace, type TestMember } from "./harness";

type Entry = { id?: string; path?: string; file: string; index?: boolean; children?: Entry[] };
export type Mod = { loader?: unknown; action?: unknown; default?: unknown };
const modules = import.meta.glob<Mod>("../routes/*.{ts,tsx}");

function flatten(entries: Entry[], parent = ""): { id: string; path: string; file: string }[] {
  return entries.flatMap((e) => {
    const path = e.index ? parent : [parent, e.path ?? ""].filter(Boolean).join("/");
    const here = { id: e.id ?? e.file.replace(/\.(tsx?|jsx?)$/, ""), path, file: e.file };
    return [here, ...flatten(e.children ?? [], path)];
  });
}
/** Every route of app/routes.ts: its pattern (no leading slash) and module file. */
export const ROUTES = flatten(routeConfig as Entry[]);
export const paramsOf = (path: string) => [...path.matchAll(/:(\w+)/g)].map((m) => m[1]).concat(path.endsWith("*") ? ["*"] : []);
export const isApi = (path: string) => path.startsWith("api/");

/**
 * One record of each kind a path parameter names, all in `m`'s workspace, and `m`'s write token; `offer`: a share of
 * another workspace's project offered to `m`'s workspace (pending), which only its admins may answer (/workspace/shares).
 */
export type WalkRecords = { m: TestMember; token: string; lib: number; upload: number; picture: number; project: number; system: number; candidate: number; model: number; selection: number; check: number; photo: number; invite: string; offer: number };

/** Routes whose one path parameter is `:id`, by the record it names. */
export const ID_ROUTES: [record: "lib" | "project" | "system" | "selection" | "check", paths: string[]][] = [
  ["lib", ["libraries/:id", "libraries/:id/upload", "libraries/:id/export.csv", "libraries/:id/export.json", "libraries/:id/trace", "libraries/:id/trace/upload"]],
  ["lib", ["api/v1/libraries/:id/curves", "api/v1/libraries/:id/models", "api/v1/libraries/:id/upload"]],
  ["project", ["projects/:id", "projects/:id/share"]],
  ["system", ["systems/:id", "systems/:id/search", "api/v1/systems/:id/preview", "api/v1/systems/:id", "api/v1/systems/:id/search"]],
  ["selection", ["selections/:id", "selections/:id/export.csv", "selections/:id/export.json"]],
  ["selection", ["field/selections/:id", "field/selections/:id/photos", "field/selections/:id/export.csv", "field/selections/:id/checks"]],
  ["check", ["field/checks/:id"]],
];

/** Good values for every path parameter of every route (so bodies and queries reach past the id lookup). */
export const GOOD_PARAMS: Record<string, (c: WalkRecords) => Record<string, string>> = {
  ...Object.fromEntries(ID_ROUTES.flatMap(([record, paths]) => paths.map((path) => [path, (c: WalkRecords) => ({ id: String(c[record]) })]))),
  "libraries/:id/uploads/:uploadId": (c) => ({ id: String(c.lib), uploadId: String(c.upload) }),
  "libraries/:id/trace/:pictureId": (c) => ({ id: String(c.lib), pictureId: String(c.picture) }),
  "libraries/:id/trace/:pictureId/file": (c) => ({ id: String(c.lib), pictureId: String(c.picture) }),
  "field/checks/:id/photos/:photoId": (c) => ({ id: String(c.check), photoId: String(c.photo) }),
  "invite/:token": (c) => ({ token: c.invite }),
  "api/v1/models/:id": (c) => ({ id: String(c.model) }),
  "api/*": () => ({ "*": "nothing/here" }),
  "*": () => ({ "*": "nothing/here" }),
};

export function pathFor(route: string, params: Record<string, string>): string {
  return "/" + route.replace(/:(\w+)/g, (_, k) => encodeURIComponent(params[k] ?? "")).replace(/\*$/, params["*"] ?? "");
}

export async function load(file: string): Promise<Mod> {
  const loader = modules[`../${file}`];
  if (!loader) throw new Error(`route module ${file} not found by the walk`);
  return loader();
}

/** A library with an imported upload and a traced picture, a project, system, candidate, selection, field check with a photo, an invitation and a write token, all `m`'s workspace's; and an offer to it. */
export async function walkRecords(m: TestMember): Promise<WalkRecords> {
  const viewer = { userId: m.userId, workspace: { id: m.workspaceId, name: "W", slug: "w", plan: "free" as const }, role: "admin" as const };
  const lib = await createLibrary(viewer, { name: `Walk ${Date.now()}`, description: "" });
  const upload = await importCsvText(viewer, lib, readFileSync("fixtures/csv/long-si.csv", "utf8"), "w.csv");
  const project = await createProject(viewer, { name: "Walk project", site: "", description: "" });
  const system = await createSystem(viewer, project, "Walk system", { ...defaultSystemInput(), duty: { flow: 20 / 3600, head: 25 } });
  const [rev] = await db().select({ id: libraries.currentRevisionId }).from(libraries).where(eq(libraries.id, lib));
  const sets = await curvesOfRevisions([rev.id!]);
  const added = await addCandidate(viewer, system, sets[0].id, DEFAULT_ADJUSTMENT);
  if (!added.ok) throw new Error(added.reason);
  const selection = await selectCandidate(viewer, added.id, "Walk selection", "");
  const png = new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0]);
  const parsed = parseCheckFields(fieldsForHead(25, 998.2, { flow: String(20 / 3600) }), { kind: "water" });
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.errors));
  const rec = await recordFieldCheck(viewer, selection, { readings: parsed.readings, fields: {}, notes: "", gradeId: "2B" }, [{ filename: "g.png", contentType: "image/png", bytes: Buffer.from(png) }], { notify: false });
  const [photo] = await db().select().from(fieldCheckPhotos).where(eq(fieldCheckPhotos.fieldCheckId, rec.id));
  const inv = await invite({ workspaceId: m.workspaceId, workspaceName: "W", inviterId: m.userId, inviterName: "W", email: `walk-${Date.now()}@example.test`, role: "viewer" });
  const { token } = await createApiToken({ userId: m.userId, workspaceId: m.workspaceId, name: "walk", scope: "write" });
  const picture = await storePicture(viewer, lib, new File([chartPdf()], "walk.pdf", { type: "application/pdf" }));
  const giver = await storeSelection((await makeWorkspace()).id, m.userId, undefined, "Walk offer");
  const [{ id: offer }] = await db().insert(projectShares).values({ projectId: giver.projectId, workspaceId: m.workspaceId, createdBy: m.userId }).$returningId();
  return { m, token, lib, upload, picture, project, system, candidate: added.id, model: sets[0].modelId, selection, check: rec.id, photo: photo.id, invite: inv, offer };
}

type Mw = (args: unknown, next: () => Promise<Response>) => Promise<Response | void>;

/** What a loader or action gave back or threw, as the Response React Router would make of it. */
export function asResponse(out: unknown): Response {
  if (out instanceof Response) return out;
  const d = out as { type?: string; init?: ResponseInit | null; data?: unknown };
  if (d?.type === "DataWithResponseInit") return new Response(d.data === undefined ? null : JSON.stringify(d.data), d.init ?? {});
  if (out instanceof Error) return new Response(String(out), { status: 500 });
  return new Response(JSON.stringify(out ?? null), { status: 200 });
}

/** Every root middleware in order, as React Router runs them, around `next` (the route's loader or action here). */
export async function throughRoot(request: Request, pattern: string, params: Record<string, string>, next: () => Promise<Response>): Promise<Response> {
  const chain = (middleware as unknown as Mw[]).reduceRight<() => Promise<Response>>((n, mw) => async () => (await mw({ request, params, pattern, context: {} }, n)) as Response, next);
  try {
    return await chain();
  } catch (thrown) {
    return asResponse(thrown);
  }
}

export type Who = { who: string; cookie?: string; headers: Record<string, string> };
export type Answer = { status: number; type: string; text: string; location: string | null };

/** One request through the root middleware to the route's loader (GET) or action (any other method), as `as`, from our own origin. */
export async function send(route: { path: string; file: string }, as: Who, opts: { params: Record<string, string>; method?: string; path?: string; body?: BodyInit | Uint8Array; headers?: Record<string, string> }): Promise<Answer> {
  const mod: Mod = await load(route.file);
  const method = opts.method ?? "GET";
  const headers = new Headers({ ...as.headers, ...opts.headers, origin: BASE });
  if (as.cookie) headers.set("cookie", as.cookie);
  if (opts.body !== undefined && !headers.has("content-length")) headers.set("content-length", String(new Blob([opts.body as BlobPart]).size));
  const request = new Request(BASE + (opts.path ?? pathFor(route.path, opts.params)), { method, headers, body: opts.body as BodyInit | undefined });
  const fn = (method === "GET" ? mod.loader : mod.action) as ((a: unknown) => unknown) | undefined;
  const res = await throughRoot(request, route.path, opts.params, async () => {
    if (!fn) return new Response(null, { status: 405 }); // React Router's own answer to a method the route has no function for
    try {
      return asResponse(await fn({ request, params: opts.params, context: {} }));
    } catch (thrown) {
      return asResponse(thrown);
    }
  });
  return { status: res.status, type: res.headers.get("content-type") ?? "", text: await res.text(), location: res.headers.get("location") };
}

const STACK = /\n\s+at\s|node_modules|\.server\.ts|\.tsx?:\d+:\d+/;

/**
 * What is wrong with an answer (null: nothing): a 5xx, a stack trace, text matching `secret`, an API refusal that
 * is not RFC 9457 problem+json with its status, title and detail; with `refusal`, also any answer but a 4xx
 * (anonymous outside /api/: or the redirect to /signin).
 */
export function wrongAnswer(a: Answer, o: { api: boolean; anonymous?: boolean; refusal: boolean; secret?: RegExp }): string | null {
  if (a.status >= 500) return `${a.status} ${a.text.slice(0, 160)}`;
  if (STACK.test(a.text)) return `a stack trace: ${a.text.slice(0, 160)}`;
  if (o.secret?.test(a.text)) return `another's data: ${a.text.slice(0, 160)}`;
  const toSignIn = o.anonymous && !o.api && a.status >= 300 && a.status < 400 && (a.location ?? "").startsWith("/signin");
  if (o.refusal && !toSignIn && a.status < 400) return `${a.status} (not a refusal) ${a.location ?? a.text.slice(0, 120)}`;
  if (o.api && a.status >= 400) {
    if (a.type !== "application/problem+json") return `${a.status} as ${a.type || "(no type)"}: ${a.text.slice(0, 120)}`;
    const p = JSON.parse(a.text) as { status?: number; detail?: unknown; title?: unknown };
    if (p.status !== a.status || typeof p.detail !== "string" || !p.detail || typeof p.title !== "string") return `problem ${a.text.slice(0, 120)}`;
  }
  return null;
}
