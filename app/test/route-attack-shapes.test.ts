// Every route of app/routes.ts asked in shapes the other sweeps (route-walk, route-attack, route-attack-bodies) do not
// send: ids past a BIGINT (2^63, 30 digits), with NUL or dot segments, in Arabic-Indic or full-width digits; every query
// parameter a route reads given NaN, Infinity, -0, 1e309, hex, an array (`k[]=1`), twice, or 100 KB long; and HEAD,
// OPTIONS, PUT, PATCH and DELETE as a stranger on the owner's records. Expected (RFC 9110, RFC 9457, DEVELOPERS.md
// "another workspace's answers 404"): never a 5xx, a stack or the owner's data; a refusal as problem+json with type,
// title, status and detail under /api/; an odd id a 4xx; another workspace's record answered exactly as an id no row
// has; an API read's query parameter it cannot take a 400 naming it. The routes come from route-table.ts, so a new
// route is asked here too.
import { readFileSync } from "node:fs";
import { afterAll, beforeAll, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import { createApiToken } from "~/lib/auth/api-tokens.server";
import { allowedMethods, optionsAllow, unknownMethodAnswer } from "~/lib/shared/methods";
import { refusalAnswer } from "~/lib/shared/refusal.server";
import { BASE, makeMember, type TestMember } from "./harness";
import { asResponse, GOOD_PARAMS, isApi, load, paramsOf, pathFor, ROUTES, send, throughRoot, walkRecords, wrongAnswer, type Answer, type WalkRecords, type Who } from "./route-table";

/**
 * Ids the other sweeps do not send: 2^63 (one past BIGINT), 30 digits, NUL inside, dot segments, other scripts' digits
 * ("١", "٣" Arabic-Indic, "１" full-width), past a double (1e309), and 10 000 characters long (digits, letters).
 */
const ODD_IDS = ["9223372036854775808", "1" + "0".repeat(29), "1%00", "%2e%2e", "1%2F..", "..", "%D9%A1", "%D9%A3", "%EF%BC%91", "1%20", "%201", "1_000", "0b1", "1.", "1e309", "9".repeat(10_000), "a".repeat(10_000)];
const NEVER = "999999999999999";

let owner: WalkRecords;
let stranger: TestMember;
let strangerToken: string;

beforeAll(async () => {
  process.env.STRIPE_WEBHOOK_SECRET ||= "whsec_route_attack";
  owner = await walkRecords(await makeMember("admin"));
  stranger = await makeMember("admin");
  strangerToken = (await createApiToken({ userId: stranger.userId, workspaceId: stranger.workspaceId, name: "shapes", scope: "write" })).token;
}, 120_000);
afterAll(() => closeDb());

const ANON: Who = { who: "anonymous", headers: {} };
const strangerAs = (api: boolean): Who => (api ? { who: "stranger's token", headers: { authorization: `Bearer ${strangerToken}` } } : { who: "stranger", cookie: stranger.cookie, headers: {} });
const ownerAs = (api: boolean): Who => (api ? { who: "owner's token", headers: { authorization: `Bearer ${owner.token}` } } : { who: "owner", cookie: owner.m.cookie, headers: {} });
const OWNER_DATA = /Walk (project|system|selection|offer|\d{6,})/;
const FORM = { "content-type": "application/x-www-form-urlencoded" };

function routerDecodes(segment: string): string {
  try {
    return decodeURIComponent(segment);
  } catch {
    return segment;
  }
}
const report = (what: string, sent: number, fails: string[]) => {
  console.info(`${what}: ${sent} requests`);
  if (fails.length) console.error(`${fails.length} failures:\n${fails.slice(0, 80).join("\n")}`);
};

test("ids past a BIGINT, with NUL or dot segments, in other scripts' digits, in every path parameter, as anonymous, the stranger and the owner: a refusal, problem+json under /api/", async () => {
  const fails: string[] = [];
  let sent = 0;
  for (const r of ROUTES.filter((x) => paramsOf(x.path).some((p) => p !== "*"))) {
    const api = isApi(r.path);
    const mod = await load(r.file);
    for (const name of paramsOf(r.path).filter((p) => p !== "*")) {
      for (const odd of ODD_IDS) {
        const params = { ...GOOD_PARAMS[r.path](owner), [name]: routerDecodes(odd) };
        const path = pathFor(r.path, { ...params, [name]: "__ODD__" }).replace("__ODD__", odd);
        for (const as of [ANON, strangerAs(api), ownerAs(api)]) {
          for (const method of [mod.loader ? "GET" : null, mod.action ? "POST" : null].filter((x): x is string => x !== null)) {
            const post = method === "POST" ? { body: new URLSearchParams({ intent: "x", pageWorkspaceId: String(owner.m.workspaceId) }), headers: FORM } : {};
            const a = await send(r, as, { params, path, method, ...post });
            sent++;
            const wrong = wrongAnswer(a, { api, anonymous: as === ANON, refusal: true, secret: OWNER_DATA });
            if (wrong) fails.push(`${method} /${r.path} ${name}=${odd.length > 40 ? `"${odd.slice(0, 8)}…" (${odd.length} characters)` : JSON.stringify(odd)} as ${as.who} → ${wrong}`);
          }
        }
      }
    }
  }
  report("odd ids", sent, fails);
  expect(fails).toEqual([]);
}, 300_000);

/** The query keys a route module reads: searchParams.get/getAll, readQuery's keys and schemas, queryProblem's lists. */
function keysOf(file: string): string[] {
  const src = readFileSync(`app/${file}`, "utf8");
  const keys = new Set<string>(["page"]);
  for (const m of src.matchAll(/(?:searchParams\.(?:get|getAll)|readQuery\([\w.]+,)\s*\(?\s*"([\w.-]+)"/g)) keys.add(m[1]);
  for (const m of src.matchAll(/\b(\w+):\s*(?:Query(?:Text|Flag|Id)\b|v\.(?:fallback|array|optional)\()/g)) keys.add(m[1]);
  for (const m of src.matchAll(/(?:one|many):\s*\[([^\]]*)\]/g)) for (const k of m[1].matchAll(/"([\w.-]+)"/g)) keys.add(k[1]);
  return [...keys];
}
/** Values no number field should take, and some it reads strictly (hex, exponents, other digits). */
const ODD_NUMBERS = ["NaN", "Infinity", "-Infinity", "-0", "1e309", "1e-400", "0x10", "%D9%A1", "9".repeat(30), "%00"];

const reads = async () => {
  const out: { r: (typeof ROUTES)[number]; keys: string[]; params: Record<string, string> }[] = [];
  for (const r of ROUTES) {
    if (r.path === "api/*" || r.path === "*") continue;
    const mod = await load(r.file);
    if (!mod.loader) continue;
    const src = readFileSync(`app/${r.file}`, "utf8");
    if (/export const loader = (refuseMethod|calcMethodNotAllowed)/.test(src)) continue;
    out.push({ r, keys: keysOf(r.file), params: GOOD_PARAMS[r.path]?.(owner) ?? {} });
  }
  return out;
};

/**
 * The keys asked together: an API read's one at a time (its 400 for one key would hide another's answer); a page's all at
 * once (each of its query fields falls back alone, `QueryText`/`QueryId`/`QueryFlag`, so none hides another).
 */
const groupsOf = (keys: string[], api: boolean) => (api ? keys.map((k) => [k]) : [keys]);

/** An API read answers what it can take (200) or a 400 problem+json; a page answers or refuses, never a 5xx or a stack. */
function wrongRead(a: Answer, api: boolean): string | null {
  const w = wrongAnswer(a, { api, refusal: false }); // the owner's own reads: their data is theirs
  if (w) return w;
  if (api && a.status !== 200 && a.status !== 400) return `${a.status} (an API read answers 200 or 400 here) ${a.text.slice(0, 120)}`;
  return null;
}

test("NaN, Infinity, -0, 1e309, hex, other digits in every query parameter each route reads, as the owner (an API read's one at a time): an answer or a 400, never a 5xx", async () => {
  const fails: string[] = [];
  let sent = 0;
  for (const { r, keys, params } of await reads()) {
    const api = isApi(r.path);
    for (const group of groupsOf(keys, api)) {
      for (const odd of ODD_NUMBERS) {
        const path = `${pathFor(r.path, params)}?${group.map((key) => `${key}=${odd.startsWith("%") ? odd : encodeURIComponent(odd)}`).join("&")}`;
        const a = await send(r, ownerAs(api), { params, path });
        sent++;
        const wrong = wrongRead(a, api);
        if (wrong) fails.push(`GET ${path} → ${wrong}`);
      }
    }
  }
  report("odd numbers in queries", sent, fails);
  expect(sent).toBeGreaterThan(200);
  expect(fails).toEqual([]);
}, 300_000);

test("each query parameter as an array (k[]=1, k[0]=1), twice with two values, and 100 KB long, as the owner: pages answer or refuse, API reads refuse what they cannot take with a 400 naming it", async () => {
  const fails: string[] = [];
  let sent = 0;
  const long = "9".repeat(100 * 1024);
  for (const { r, keys, params } of await reads()) {
    const api = isApi(r.path);
    const base = pathFor(r.path, params);
    for (const group of groupsOf(keys, api)) {
      const each = (f: (key: string) => string) => group.map(f).join("&");
      const asks: { q: string; names?: string }[] = [
        { q: each((key) => `${key}%5B%5D=1`), names: `${group[0]}[]` },
        { q: each((key) => `${key}%5B0%5D=1&${key}%5B1%5D=2`), names: `${group[0]}[0]` },
        { q: each((key) => `${key}=1&${key}=2`) },
        { q: each((key) => `${key}=${long}`) },
        { q: each((key) => `${key}=${long}&${key}=${long}`) },
      ];
      for (const { q, names } of asks) {
        const a = await send(r, ownerAs(api), { params, path: `${base}?${q}` });
        sent++;
        const wrong = wrongRead(a, api);
        if (wrong) fails.push(`GET ${base}?${q.slice(0, 60)} → ${wrong}`);
        else if (api && names && (a.status !== 400 || !a.text.includes(JSON.stringify(JSON.stringify(names)).slice(1, -1)))) fails.push(`GET ${base}?${q} → ${a.status} ${a.text.slice(0, 160)} (not a 400 naming ${names})`);
      }
    }
    // every key at once at 100 KB, and an unknown one: 1–2 MB of query string in all
    const all = [...keys, "unknown"].map((k) => `${k}=${long}`).join("&");
    const a = await send(r, ownerAs(api), { params, path: `${base}?${all}` });
    sent++;
    const wrong = wrongRead(a, api);
    if (wrong) fails.push(`GET ${base}?(every key 100 KB) → ${wrong}`);
    else if (api && a.status !== 400) fails.push(`GET ${base}?(every key 100 KB, one unknown) → ${a.status}, not 400`);
  }
  report("arrays, repeats and long queries", sent, fails);
  expect(sent).toBeGreaterThan(100);
  expect(fails).toEqual([]);
}, 300_000);

/** The routes of app/routes.ts with their modules, as the build's route manifest hands them to app/serve.mjs (flat: each its whole path). */
let routeManifest: Record<string, { id: string; path: string; module: unknown }> | null = null;
async function manifest() {
  routeManifest ??= Object.fromEntries(await Promise.all(ROUTES.map(async (r) => [r.id, { id: r.id, path: r.path, module: await load(r.file) }] as const)));
  return routeManifest;
}

/** One request with any method through the root middleware to the loader (GET, HEAD) or the action (the rest), as React Router routes it. */
async function sendMethod(r: { path: string; file: string }, as: Who, method: string, params: Record<string, string>): Promise<Answer & { allow: string | null; ran: boolean }> {
  const mod = await load(r.file);
  const headers = new Headers({ ...as.headers, origin: BASE });
  if (as.cookie) headers.set("cookie", as.cookie);
  const body = method === "GET" || method === "HEAD" ? undefined : new URLSearchParams({ intent: "delete", name: "Renamed", pageWorkspaceId: String(stranger.workspaceId) });
  if (body) headers.set("content-type", FORM["content-type"]);
  const request = new Request(BASE + pathFor(r.path, params), { method, headers, body });
  // what app/serve.mjs answers before React Router (OPTIONS on every route): the same function over the same routes
  const pathname = pathFor(r.path, params);
  const early = unknownMethodAnswer(await manifest(), method, pathname);
  if (early?.status === 204) return { status: 204, type: "", text: "", location: null, allow: early.allow, ran: false };
  if (early) {
    const title = early.status === 405 ? "Method Not Allowed" : "Not Found";
    const a = refusalAnswer(pathname, { status: early.status, title, detail: early.detail, ...("allow" in early ? { allow: early.allow } : {}) });
    return { status: a.status, type: a.headers["Content-Type"], text: a.body, location: null, allow: a.headers.Allow ?? null, ran: false };
  }
  const fn = (method === "GET" || method === "HEAD" ? mod.loader : mod.action) as ((a: unknown) => unknown) | undefined;
  let ran = false;
  const res = await throughRoot(request, r.path, params, async () => {
    ran = true;
    if (!fn) return new Response(null, { status: 405 });
    try {
      return asResponse(await fn({ request, params, context: {} }));
    } catch (thrown) {
      return asResponse(thrown);
    }
  });
  return { status: res.status, type: res.headers.get("content-type") ?? "", text: await res.text(), location: res.headers.get("location"), allow: res.headers.get("allow"), ran };
}

test("HEAD, OPTIONS, PUT, PATCH and DELETE on every route as a stranger on the owner's records, and as anonymous: answered as for an id no row has; OPTIONS 204 with the route's Allow and OPTIONS on every route; no action run outside /api/", async () => {
  const fails: string[] = [];
  let sent = 0;
  for (const r of ROUTES) {
    const api = isApi(r.path);
    const good = GOOD_PARAMS[r.path]?.(owner) ?? {};
    const never = Object.fromEntries(Object.entries(good).map(([k, v]) => [k, k === "*" || k === "token" ? v : NEVER]));
    for (const method of ["HEAD", "OPTIONS", "PUT", "PATCH", "DELETE"]) {
      for (const as of [strangerAs(api), ANON]) {
        const taken = await sendMethod(r, as, method, good);
        const none = await sendMethod(r, as, method, never);
        sent += 2;
        const label = `${method} /${r.path} as ${as.who}`;
        const wrong = wrongAnswer(taken, { api, anonymous: as === ANON, refusal: method !== "OPTIONS" && r.path !== "" && !/^(signin|signup|forgot|reset|verify|healthz|livez|api|dev\/mailbox|\*)$/.test(r.path), secret: OWNER_DATA });
        // a HEAD of a page without an id is the stranger's own page; an invitation's token is the key itself (route-attack.test.ts)
        if (wrong && !(method === "HEAD" && (r.path === "invite/:token" || !paramsOf(r.path).some((p) => p !== "*")) && taken.status < 400)) fails.push(`${label} → ${wrong}`);
        if (taken.status !== none.status) fails.push(`${label} → ${taken.status}, where an id no row has → ${none.status} (tells the id is taken)`);
        if (OWNER_DATA.test(taken.text)) fails.push(`${label}: the owner's data in the answer`);
        // OPTIONS, one rule (decision "wirereq"): 204 with the route's Allow and OPTIONS — pages from the method table, API
        // routes from their refusing export's Allow (api/*, no route: 404)
        const allowOf = async () => (api ? ((await load(r.file)) as { loader?: { allow?: string }; action?: { allow?: string } }) : null);
        if (method === "OPTIONS" && r.path !== "api/*") {
          const m = await allowOf();
          const want = optionsAllow(api ? (m?.loader?.allow ?? m?.action?.allow ?? "?") : allowedMethods(r.path));
          if (taken.status !== 204 || taken.allow !== want || taken.text !== "") fails.push(`${label} → ${taken.status}, Allow ${taken.allow} (not 204 with Allow ${want})`);
        }
        if (["PUT", "PATCH", "DELETE"].includes(method) && r.path !== "api/*" && (taken.status !== 405 || !taken.allow)) fails.push(`${label} → ${taken.status}, Allow ${taken.allow} (not 405 with Allow)`);
        if (!api && method !== "HEAD" && taken.ran) fails.push(`${label}: the route was reached`);
      }
    }
  }
  report("methods", sent, fails);
  expect(fails).toEqual([]);
}, 300_000);
