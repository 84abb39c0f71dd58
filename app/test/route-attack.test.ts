// Every route of app/routes.ts attacked by someone who does not own its data: a signed-in admin of another
// workspace (cookie and API token) and an anonymous visitor, with the owner's own ids in the path, odd ids, ids of
// deleted rows and hostile bodies. Where route-walk.test.ts only asks "no 5xx", this sweep asks for the right
// answer: a 4xx (400/404/405/413/415 as fits; anonymous: 4xx or the redirect to /signin), never another
// workspace's data, never a stack trace, problem+json (RFC 9457) on every API refusal — and, following
// DEVELOPERS.md ("another workspace's answers 404"), another workspace's record answers exactly what a record that
// never existed does, so a stranger cannot tell which ids are taken. The routes come from route-table.ts, so a new
// route is swept here too (route-walk's first test fails until it has GOOD_PARAMS). Requests go through the root
// middleware (method table, CSRF origin check, body limits) to the real route modules and MariaDB.
import { afterAll, beforeAll, expect, test } from "vitest";
import { eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { candidates, libraries, projectShares, tracePictures, uploads } from "@db/schema";
import { createApiToken } from "~/lib/auth/api-tokens.server";
import { createLibrary } from "~/lib/libraries";
import { importCsvText } from "~/lib/projects/test-kit";
import { storePicture } from "~/lib/tracer/pictures.server";
import { chartPdf } from "~/lib/tracer/test-chart";
import { readFileSync } from "node:fs";
import { makeMember, type TestMember } from "./harness";
import { GOOD_PARAMS, isApi, load, paramsOf, pathFor, ROUTES, send, walkRecords, wrongAnswer, type Answer, type WalkRecords, type Who } from "./route-table";

/** The brief's odd ids: zero, signs, fractions, exponents, hex, spaces, NUL, invalid UTF-8, past 2^53, 20 digits, NaN. */
const ODD_IDS = ["0", "-1", "-0", "+1", "1.5", "1e3", "0x10", " 1", "1 ", "%00", "%FF", "%C3%28", String(2 ** 53 + 1), "9".repeat(20), "NaN", "Infinity", "1,5"];
/** A well-formed id no row has (15 digits, the most parseId takes): what "not there" answers. */
const NEVER = "999999999999999";

let owner: WalkRecords;
let own: WalkRecords; // the stranger's own records, for mixing its parent ids with the owner's child ids
let stranger: TestMember;
let strangerToken: string;
let dead: { lib: number; upload: number; picture: number };

beforeAll(async () => {
  process.env.STRIPE_WEBHOOK_SECRET ||= "whsec_route_attack";
  owner = await walkRecords(await makeMember("admin"));
  stranger = await makeMember("admin");
  own = await walkRecords(stranger);
  strangerToken = (await createApiToken({ userId: stranger.userId, workspaceId: stranger.workspaceId, name: "attack", scope: "write" })).token;
  // deleted rows: a library with an upload and a picture, deleted; a candidate removed
  const viewer = { userId: owner.m.userId, workspace: { id: owner.m.workspaceId, name: "W", slug: "w", plan: "free" as const }, role: "admin" as const };
  const lib = await createLibrary(viewer, { name: "Walk doomed", description: "" });
  const upload = await importCsvText(viewer, lib, readFileSync("fixtures/csv/long-si.csv", "utf8"), "d.csv");
  const picture = await storePicture(viewer, lib, new File([chartPdf()], "d.pdf", { type: "application/pdf" }));
  await db().delete(tracePictures).where(eq(tracePictures.libraryId, lib));
  await db().delete(uploads).where(eq(uploads.libraryId, lib));
  await db().delete(libraries).where(eq(libraries.id, lib));
  dead = { lib, upload, picture };
}, 120_000);
afterAll(() => closeDb());

const ANON: Who = { who: "anonymous", headers: {} };
const strangerAs = (api: boolean): Who[] => (api ? [{ who: "stranger's token", headers: { authorization: `Bearer ${strangerToken}` } }] : [{ who: "stranger", cookie: stranger.cookie, headers: {} }]);
const ownerAs = (api: boolean): Who => (api ? { who: "owner's token", headers: { authorization: `Bearer ${owner.token}` } } : { who: "owner", cookie: owner.m.cookie, headers: {} });

const OWNER_DATA = /Walk (project|system|selection|doomed|offer|\d{6,})/;
/** An answer that must refuse: a 4xx (anonymous may be sent to /signin), nothing of the owner's. */
const wrongRefusal = (a: Answer, api: boolean, anonymous: boolean) => wrongAnswer(a, { api, anonymous, refusal: true, secret: OWNER_DATA });

/** A path segment as React Router hands it to the route: percent-decoded, or as sent when that fails (invalid UTF-8). */
function asRouterDecodes(segment: string): string {
  try {
    return decodeURIComponent(segment);
  } catch {
    return segment;
  }
}

const WITH_PARAMS = () => ROUTES.filter((r) => paramsOf(r.path).some((p) => p !== "*"));
/** A POST body every action reads at least its intent from; the stranger's page workspace, so a stale-workspace check cannot answer first. */
const probeForm = (ws: number) => new URLSearchParams({ intent: "x", pageWorkspaceId: String(ws) });

test("odd ids in every path parameter, as anonymous, the stranger and the owner: a refusal (4xx; anonymous may be sent to /signin), problem+json under /api/", async () => {
  const fails: string[] = [];
  let sent = 0;
  for (const r of WITH_PARAMS()) {
    const api = isApi(r.path);
    const mod = await load(r.file);
    for (const name of paramsOf(r.path).filter((p) => p !== "*")) {
      for (const odd of ODD_IDS) {
        const params = { ...GOOD_PARAMS[r.path](owner), [name]: asRouterDecodes(odd) };
        const path = pathFor(r.path, { ...params, [name]: "__ODD__" }).replace("__ODD__", odd.startsWith("%") ? odd : encodeURIComponent(odd));
        for (const as of [ANON, ...strangerAs(api), ownerAs(api)]) {
          for (const method of [mod.loader ? "GET" : null, mod.action ? "POST" : null].filter(Boolean) as string[]) {
            const a = await send(r, as, { params, path, method, ...(method === "POST" ? { body: probeForm(owner.m.workspaceId), headers: { "content-type": "application/x-www-form-urlencoded" } } : {}) });
            sent++;
            const wrong = wrongRefusal(a, api, as === ANON);
            if (wrong) fails.push(`${method} /${r.path} ${name}=${JSON.stringify(odd)} as ${as.who} → ${wrong}`);
          }
        }
      }
    }
  }
  console.info(`odd ids: ${sent} requests`);
  if (fails.length) console.error(`${fails.length} failures:\n${fails.join("\n")}`);
  expect(fails).toEqual([]);
}, 300_000);

test("another workspace's ids (and a mix of the stranger's own parent with the owner's child): answered exactly as an id no row has — 404 on a read — and never its data", async () => {
  const fails: string[] = [];
  let sent = 0;
  for (const r of WITH_PARAMS()) {
    if (r.path === "invite/:token") continue; // the token is the key itself, answered alike to anyone who holds it
    const api = isApi(r.path);
    const mod = await load(r.file);
    const names = paramsOf(r.path);
    const variants: Record<string, string>[] = [GOOD_PARAMS[r.path](owner)];
    if (names.length > 1) for (const n of names) variants.push({ ...GOOD_PARAMS[r.path](own), [n]: GOOD_PARAMS[r.path](owner)[n] });
    for (const params of variants) {
      for (const as of strangerAs(api)) {
        for (const method of [mod.loader ? "GET" : null, mod.action ? "POST" : null].filter(Boolean) as string[]) {
          const post = method === "POST" ? { body: probeForm(stranger.workspaceId), headers: { "content-type": "application/x-www-form-urlencoded" } } : {};
          const taken = await send(r, as, { params, method, ...post });
          const never = await send(r, as, { params: Object.fromEntries(Object.entries(params).map(([k, v]) => [k, v === GOOD_PARAMS[r.path](owner)[k] && v !== GOOD_PARAMS[r.path](own)[k] ? NEVER : v])), method, ...(method === "POST" ? { body: probeForm(stranger.workspaceId), headers: { "content-type": "application/x-www-form-urlencoded" } } : {}) });
          sent += 2;
          const label = `${method} /${r.path} ${JSON.stringify(params)} as ${as.who}`;
          const wrong = wrongRefusal(taken, api, false);
          if (wrong) fails.push(`${label} → ${wrong}`);
          if (method === "GET" && taken.status !== 404 && !(taken.status === 405 && never.status === 405)) fails.push(`${label} → ${taken.status}, not 404`); // 405: the route takes no GET, for any id
          if (taken.status !== never.status) fails.push(`${label} → ${taken.status}, where an id no row has → ${never.status} (tells the id is taken)`);
        }
      }
    }
  }
  console.info(`another workspace's ids: ${sent} requests`);
  if (fails.length) console.error(`${fails.length} failures:\n${fails.join("\n")}`);
  expect(fails).toEqual([]);
}, 300_000);

test("ids of deleted rows (a deleted library, its upload and picture), as the owner: 404", async () => {
  const fails: string[] = [];
  let sent = 0;
  const withDead = { ...owner, lib: dead.lib, upload: dead.upload, picture: dead.picture };
  for (const r of WITH_PARAMS()) {
    const params = GOOD_PARAMS[r.path](withDead);
    if (JSON.stringify(params) === JSON.stringify(GOOD_PARAMS[r.path](owner))) continue; // names no deleted row
    const api = isApi(r.path);
    const mod = await load(r.file);
    for (const method of [mod.loader ? "GET" : null, mod.action ? "POST" : null].filter(Boolean) as string[]) {
      const a = await send(r, ownerAs(api), { params, method, ...(method === "POST" ? { body: probeForm(owner.m.workspaceId), headers: { "content-type": "application/x-www-form-urlencoded" } } : {}) });
      sent++;
      const label = `${method} /${r.path} ${JSON.stringify(params)} as the owner`;
      const wrong = wrongRefusal(a, api, false);
      if (wrong) fails.push(`${label} → ${wrong}`);
      else if (method === "GET" && a.status !== 404 && a.status !== 405) fails.push(`${label} → ${a.status}, not 404`);
    }
  }
  expect(sent).toBeGreaterThan(10);
  console.info(`deleted rows: ${sent} requests`);
  if (fails.length) console.error(`${fails.length} failures:\n${fails.join("\n")}`);
  expect(fails).toEqual([]);
}, 120_000);

/** Ids of the owner's records in a body field or query parameter of a request on the stranger's OWN record (its address passes). */
const FOREIGN_IN_BODY: { route: string; name: string; method: "GET" | "POST"; ask: (foreign: string) => { query?: string; form?: Record<string, string> } }[] = [
  { route: "systems/:id", name: "adjust the owner's candidate", method: "POST", ask: (x) => ({ form: { intent: "adjust", candidateId: x, method: "speed", arrangement: "single", dutyPumps: "1", standbyPumps: "0", serviceFactor: "1" } }) },
  { route: "systems/:id", name: "select the owner's candidate", method: "POST", ask: (x) => ({ form: { intent: "select", candidateId: x, title: "Stolen", notes: "" } }) },
  { route: "systems/:id", name: "remove the owner's candidate", method: "POST", ask: (x) => ({ form: { intent: "remove-candidate", candidateId: x } }) },
  { route: "systems/:id", name: "price the owner's candidate", method: "POST", ask: (x) => ({ form: { intent: "price", candidateId: x } }) },
  { route: "libraries/:id/trace", name: "delete the owner's picture", method: "POST", ask: (x) => ({ form: { intent: "delete", pictureId: x } }) },
  { route: "field/selections/:id", name: "amend the owner's check (form page)", method: "GET", ask: (x) => ({ query: `amend=${x}` }) },
  { route: "api/v1/libraries/:id/curves", name: "the owner's revision", method: "GET", ask: (x) => ({ query: `revision=${x}` }) },
  { route: "workspace/shares", name: "accept an offer to the owner's workspace", method: "POST", ask: (x) => ({ form: { intent: "accept", shareId: x, pageWorkspaceId: String(own.m.workspaceId) } }) },
  { route: "workspace/shares", name: "decline an offer to the owner's workspace", method: "POST", ask: (x) => ({ form: { intent: "decline", shareId: x, pageWorkspaceId: String(own.m.workspaceId) } }) },
];

test("the owner's ids in a body field or query parameter of a request on the stranger's own record: answered as an id no row has, nothing of the owner's read or changed", async () => {
  const [ownerRev] = await db().select({ id: libraries.currentRevisionId }).from(libraries).where(eq(libraries.id, owner.lib));
  const foreign: Record<string, string> = {
    "systems/:id": String(owner.candidate),
    "libraries/:id/trace": String(owner.picture),
    "field/selections/:id": String(owner.check),
    "api/v1/libraries/:id/curves": String(ownerRev.id),
    "workspace/shares": String(owner.offer),
  };
  const fails: string[] = [];
  for (const c of FOREIGN_IN_BODY) {
    const r = ROUTES.find((x) => x.path === c.route)!;
    const api = isApi(r.path);
    const params = GOOD_PARAMS[r.path]?.(own) ?? {}; // a route without path parameters (/workspace/shares): none
    const as = strangerAs(api)[0];
    const go = async (id: string) => {
      const { query, form } = c.ask(id);
      const path = pathFor(r.path, params) + (query ? `?${query}` : "");
      return form ? send(r, as, { params, path, method: "POST", body: new URLSearchParams(form), headers: { "content-type": "application/x-www-form-urlencoded" } }) : send(r, as, { params, path });
    };
    const taken = await go(foreign[c.route]);
    const never = await go(NEVER);
    const label = `${c.method} /${c.route} (${c.name}) as ${as.who}`;
    const wrong = wrongRefusal(taken, api, false);
    if (wrong) fails.push(`${label} → ${wrong}`);
    if (taken.status !== never.status) fails.push(`${label} → ${taken.status}, where an id no row has → ${never.status}`);
    else if (taken.status !== 404) fails.push(`${label} → ${taken.status}, not 404 (the id is what is wrong here)`);
  }
  const [cand] = await db().select().from(candidates).where(eq(candidates.id, owner.candidate));
  const pics = await db().select().from(tracePictures).where(eq(tracePictures.id, owner.picture));
  if (!cand || pics.length !== 1) fails.push(`the owner's candidate (${Boolean(cand)}) or picture (${pics.length}) is gone`);
  const [offer] = await db().select({ state: projectShares.state }).from(projectShares).where(eq(projectShares.id, owner.offer));
  if (offer?.state !== "pending") fails.push(`the offer to the owner's workspace is ${offer?.state ?? "gone"}, not pending`);
  if (fails.length) console.error(`${fails.length} failures:\n${fails.join("\n")}`);
  expect(fails).toEqual([]);
}, 60_000);
