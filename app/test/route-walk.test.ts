// Every route in app/routes.ts, walked with bad input: generated bad ids in every path parameter, bad
// query strings (every key any route reads, each with odd values), and malformed urlencoded,
// multipart and JSON bodies — anonymous, signed in (admin) and with an API token. No answer may be a
// 5xx or an uncaught error. Real route modules, real guards, real MariaDB (app/test/harness.ts).
//
// A route in app/routes.ts whose path parameters have no good value in GOOD_PARAMS (route-table.ts) fails the
// first test, so a new route cannot be added without being walked. The last two tests walk every route
// with the methods no form sends (PUT, PATCH, DELETE) through the root middleware: 405 with Allow, no
// action run, and the answer in the shape of its side (problem+json with type, title, status and detail
// under /api/; an HTML page with the status in its heading and the one sentence elsewhere — it was
// problem+json on pages too); and check the method table (app/lib/shared/methods.ts) against the route modules.
// The same refusals as app/serve.mjs gives them on the wire: app/test/server-before-router.test.ts.
import { readFileSync } from "node:fs";
import { afterAll, beforeAll, expect, test } from "vitest";
import { closeDb, getPool } from "@db/client.server";
import { shareProject } from "~/lib/projects";
import { allowedMethods, allowHeader, listedPatterns } from "~/lib/shared/methods";
import { BASE, call, makeMember } from "./harness";
import { asResponse, GOOD_PARAMS, isApi, load, paramsOf, pathFor, ROUTES, throughRoot, walkRecords, type WalkRecords } from "./route-table";

type Ctx = WalkRecords;
let ctx: Ctx;

const BAD_IDS = ["abc", "-1", "1.5", "1e3", "\u0000", "%00", "99999999999999999999", "0x10", " 1", "", "1/2", "9".repeat(16), "0"];
const BAD_VALUES = ["%0a", "\n", "\u0000", "-1", "1e309", "NaN", "Infinity", "abc", "1.5", "//evil.example", "/\t/evil.example", "x".repeat(5000), "%zz", "9".repeat(25), "/%0a", "/%0d%0aSet-Cookie:%20x=1", "/\\evil.example", "/ x"];

/** Every query-string key any route module reads (searchParams.get / getAll, and the q()/qp() helpers). */
function queryKeys(): string[] {
  const keys = new Set<string>(["next", "id", "page"]);
  for (const r of ROUTES) {
    const src = readFileSync(`app/${r.file}`, "utf8");
    for (const m of src.matchAll(/(?:searchParams\.(?:get|getAll)|params\.get|\bqp?|readQuery\([\w.]+,)\s*\(?\s*"([\w.-]+)"/g)) keys.add(m[1]);
    // keys of the valibot schemas read by readQuery(url, schema): `key: QueryText()`, `key: QueryFlag`, `key: QueryId`, `key: v.…`
    for (const m of src.matchAll(/\b([\w]+):\s*(?:Query(?:Text|Flag|Id)\b|v\.(?:fallback|array)\()/g)) keys.add(m[1]);
    for (const m of src.matchAll(/many:\s*\["([\w.-]+)"/g)) keys.add(m[1]);
  }
  return [...keys];
}

const BODIES: { name: string; headers: Record<string, string>; body: () => BodyInit }[] = [
  { name: "malformed multipart", headers: { "content-type": "multipart/form-data; boundary=XyZ" }, body: () => "--XyZ\r\nContent-Disposition: form-data; name=\"a\"\r\n\r\nbroken without end" },
  { name: "multipart without boundary", headers: { "content-type": "multipart/form-data" }, body: () => "a=1" },
  { name: "malformed JSON", headers: { "content-type": "application/json" }, body: () => '{"input": {' },
  { name: "JSON of the wrong shape", headers: { "content-type": "application/json" }, body: () => '[1, "x", null]' },
  { name: "urlencoded with bad escapes and odd ids", headers: { "content-type": "application/x-www-form-urlencoded" }, body: () => "intent=%zz&id=%00&candidateId=1e3&curveSetId=-1&tokenId=abc&membershipId=1.5&shareId=99999999999999999999&sessionId=%0a&base=%7B&mapping=%5B&next=/%0a&email=%00&password=x&token=%0a" },
  { name: "no content type", headers: {}, body: () => "\u0000\u0001garbage" },
  { name: "binary as text/plain", headers: { "content-type": "text/plain" }, body: () => new Uint8Array([0xff, 0xfe, 0, 1, 2]) },
];

beforeAll(async () => {
  process.env.STRIPE_WEBHOOK_SECRET ||= "whsec_route_walk"; // configured as in production: bad bodies are a 400, not "not set up"
  ctx = await walkRecords(await makeMember("admin"));
  const other = await makeMember("admin");
  const viewer = { userId: ctx.m.userId, workspace: { id: ctx.m.workspaceId, name: "W", slug: "w", plan: "free" as const }, role: "admin" as const };
  await shareProject(viewer, ctx.project, String(other.workspaceId)).catch(() => null);
}, 60_000);
afterAll(() => closeDb());

type Failure = string;
const AS = (c: Ctx) => [
  { who: "anonymous", headers: {} as Record<string, string>, cookie: undefined as string | undefined },
  { who: "member", headers: {}, cookie: c.m.cookie },
  { who: "token", headers: { authorization: `Bearer ${c.token}` }, cookie: undefined },
];

async function probe(fails: Failure[], label: string, fn: unknown, opts: Parameters<typeof call>[1]) {
  try {
    const r = await call(fn as never, opts);
    if (r.status >= 500) fails.push(`${label} → ${r.status} ${JSON.stringify(r.body).slice(0, 160)}`);
  } catch (e) {
    fails.push(`${label} → threw ${(e as Error)?.stack?.split("\n").slice(0, 3).join(" | ") ?? String(e)}`);
  }
}

test("every route in app/routes.ts has good parameter values here (a new route must be added to the walk)", () => {
  expect(ROUTES.length).toBeGreaterThan(40);
  const missing = ROUTES.filter((r) => paramsOf(r.path).length && !GOOD_PARAMS[r.path]).map((r) => r.path);
  expect(missing).toEqual([]);
  const stale = Object.keys(GOOD_PARAMS).filter((p) => !ROUTES.some((r) => r.path === p));
  expect(stale).toEqual([]);
});

test("bad ids in every path parameter: no 5xx from any loader or action", async () => {
  const fails: Failure[] = [];
  for (const r of ROUTES) {
    const names = paramsOf(r.path).filter((p) => p !== "*" );
    if (!names.length) continue;
    const mod = await load(r.file);
    const good = GOOD_PARAMS[r.path](ctx);
    for (const name of names) {
      for (const bad of BAD_IDS) {
        const params = { ...good, [name]: bad };
        for (const as of AS(ctx)) {
          const base = { path: pathFor(r.path, params), params, cookie: as.cookie, headers: as.headers };
          if (mod.loader) await probe(fails, `GET ${r.path} ${name}=${JSON.stringify(bad)} as ${as.who}`, mod.loader, base);
          if (mod.action) await probe(fails, `POST ${r.path} ${name}=${JSON.stringify(bad)} as ${as.who}`, mod.action, { ...base, headers: { ...as.headers, origin: BASE }, form: { intent: "x" } });
        }
      }
    }
  }
  if (fails.length) console.error(`${fails.length} failures:\n${fails.join("\n")}`);
  expect(fails).toEqual([]);
}, 300_000);

test("bad query strings on every loader: no 5xx", async () => {
  const fails: Failure[] = [];
  const keys = queryKeys();
  expect(keys).toEqual(expect.arrayContaining(["next", "revision", "model", "amend"]));
  for (const r of ROUTES) {
    const mod = await load(r.file);
    if (!mod.loader) continue;
    const params = GOOD_PARAMS[r.path]?.(ctx) ?? {};
    for (const bad of BAD_VALUES) {
      const qs = keys.map((k) => `${k}=${bad.startsWith("%") ? bad : encodeURIComponent(bad)}`).join("&");
      for (const as of AS(ctx)) {
        await probe(fails, `GET ${r.path}?…=${JSON.stringify(bad.slice(0, 20))} as ${as.who}`, mod.loader, { path: `${pathFor(r.path, params)}?${qs}`, params, cookie: as.cookie, headers: as.headers });
      }
    }
  }
  if (fails.length) console.error(`${fails.length} failures:\n${fails.join("\n")}`);
  expect(fails).toEqual([]);
}, 300_000);

test("malformed urlencoded, multipart and JSON bodies on every action: no 5xx", async () => {
  const fails: Failure[] = [];
  for (const r of ROUTES) {
    const mod = await load(r.file);
    if (!mod.action) continue;
    const params = GOOD_PARAMS[r.path]?.(ctx) ?? {};
    for (const b of BODIES) {
      for (const as of AS(ctx)) {
        await probe(fails, `POST ${r.path} (${b.name}) as ${as.who}`, mod.action, {
          path: pathFor(r.path, params),
          method: "POST",
          params,
          cookie: as.cookie,
          headers: { ...as.headers, ...b.headers, origin: BASE },
          body: b.body(),
        });
      }
    }
  }
  if (fails.length) console.error(`${fails.length} failures:\n${fails.join("\n")}`);
  expect(fails).toEqual([]);
}, 300_000);

/** Every table's checksum (MariaDB CHECKSUM TABLE): any row written, changed or removed changes it. */
async function checksums(): Promise<Record<string, string>> {
  const pool = getPool();
  const tables = (await pool.query("SELECT TABLE_NAME AS name FROM information_schema.TABLES WHERE TABLE_SCHEMA = DATABASE() AND TABLE_TYPE = 'BASE TABLE'")) as { name: string }[];
  const rows = (await pool.query(`CHECKSUM TABLE ${tables.map((t) => `\`${t.name}\``).join(", ")}`)) as { Table: string; Checksum: unknown }[];
  return Object.fromEntries(rows.map((r) => [r.Table, String(r.Checksum)]));
}

/**
 * What is wrong with a refusal's shape (null: nothing). Under /api/: RFC 9457 problem+json with type, title, status (the
 * answer's) and detail, all there. Elsewhere: an HTML document with the status and reason in its heading and one sentence
 * below it (lib/shared/refusal.server.ts), never JSON or bare text.
 */
async function shapeOf(res: Response, api: boolean): Promise<string | null> {
  const type = res.headers.get("content-type") ?? "(none)";
  const text = await res.clone().text();
  if (api) {
    if (type !== "application/problem+json") return `Content-Type ${type}`;
    const body = JSON.parse(text) as Record<string, unknown>;
    const ok = typeof body.type === "string" && typeof body.title === "string" && body.status === res.status && typeof body.detail === "string" && body.detail.length > 0;
    return ok ? null : `problem ${text.slice(0, 120)}`;
  }
  if (!/^text\/html(; charset=utf-8)?$/.test(type)) return `Content-Type ${type}: ${text.slice(0, 80)}`;
  const m = /^<!DOCTYPE html>.*<h1[^>]*>(\d{3}) [^<]+<\/h1><p[^>]*>([^<]+)<\/p>/s.exec(text);
  return m && Number(m[1]) === res.status && /\.$/.test(m[2]) ? null : `page ${text.slice(0, 120)}`;
}

test("PUT, PATCH and DELETE on every route of app/routes.ts: 405 with Allow naming what the route takes, and no action run (no row changed)", async () => {
  const fails: Failure[] = [];
  const before = await checksums();
  // A body each action would act on if it ran (rename, delete, sign out …), as the signed-in admin and with a write token.
  const form = { intent: "delete", name: "Renamed by PUT", id: String(ctx.lib), confirm: ctx.m.email, email: ctx.m.email, password: "correct horse battery" };
  for (const r of ROUTES) {
    const mod = await load(r.file);
    const params = GOOD_PARAMS[r.path]?.(ctx) ?? {};
    for (const method of ["PUT", "PATCH", "DELETE"]) {
      for (const as of AS(ctx)) {
        const label = `${method} /${r.path} as ${as.who}`;
        const headers = new Headers({ ...as.headers, origin: BASE, "content-type": "application/x-www-form-urlencoded" });
        if (as.cookie) headers.set("cookie", as.cookie);
        const request = new Request(BASE + pathFor(r.path, params), { method, headers, body: new URLSearchParams(form) });
        let ran = false;
        const res = await throughRoot(request, r.path, params, async () => {
          ran = true;
          if (!mod.action) return new Response("no action", { status: 405 }); // React Router's own answer (API routes all have one)
          try {
            return asResponse(await (mod.action as (a: unknown) => unknown)({ request, params, context: {} }));
          } catch (thrown) {
            return asResponse(thrown);
          }
        });
        if (r.path === "api/*") {
          if (res.status !== 404) fails.push(`${label} → ${res.status} (no API route here: 404 for any method)`);
          continue;
        }
        // RFC 9110 §15.5.6: a 405 lists the methods the resource takes in Allow.
        const allow = res.headers.get("allow");
        if (res.status !== 405 || !allow) fails.push(`${label} → ${res.status}, Allow ${allow}`);
        const shape = await shapeOf(res, isApi(r.path));
        if (shape) fails.push(`${label}: ${shape}`);
        // Outside /api/ the root middleware answers from the table, before the action; API routes answer themselves.
        if (!isApi(r.path) && (ran || allow !== allowHeader(allowedMethods(r.path)))) fails.push(`${label}: ${ran ? "the action was reached" : `Allow ${allow}`}`);
      }
    }
  }
  expect(ROUTES.length).toBeGreaterThan(40);
  if (fails.length) console.error(`${fails.length} failures:\n${fails.join("\n")}`);
  expect(fails).toEqual([]);
  expect(await checksums()).toEqual(before);
}, 120_000);

test("the method table (lib/shared/methods.ts) says what each route outside /api/ takes: GET for a page or a loader that is not a 405, POST for an action that is not one", async () => {
  const derived: string[] = [];
  const table: string[] = [];
  for (const r of ROUTES.filter((x) => !isApi(x.path))) {
    const mod = await load(r.file);
    const params = GOOD_PARAMS[r.path]?.(ctx) ?? {};
    const path = pathFor(r.path, params);
    const refuses = async (fn: unknown, method: string) => (await call(fn as never, { path, method, params, headers: { origin: BASE }, ...(method === "POST" ? { form: { intent: "x" } } : {}) })).status === 405;
    const get = Boolean(mod.default) || (Boolean(mod.loader) && !(await refuses(mod.loader, "GET")));
    const post = Boolean(mod.action) && !(await refuses(mod.action, "POST"));
    derived.push(`${r.path}: ${[...(get ? ["GET", "HEAD"] : []), ...(post ? ["POST"] : [])].join(", ")}`);
    table.push(`${r.path}: ${allowedMethods(r.path).join(", ")}`);
  }
  expect(table).toEqual(derived);
  const stale = listedPatterns().filter((p) => !ROUTES.some((r) => r.path === p));
  expect(stale).toEqual([]);
});
