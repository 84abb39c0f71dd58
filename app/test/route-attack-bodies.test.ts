// Every action of app/routes.ts, posted hostile bodies by the record's own owner (so the guard lets the body through):
// wrong content types, JSON that is not an object, duplicate fields, a field repeated 10 000 times, 1 MB strings,
// invalid UTF-8, numbers written "1,5", "  ", "1e309", and prototype keys ("__proto__", "constructor"). None may be a
// 5xx or show a stack trace, every API refusal is RFC 9457 problem+json, Object.prototype stays clean, and the bodies
// no form of ours could send (wrong type, not an object, invalid UTF-8, a field past any limit, too large) are refused
// with a 4xx. Also: a POST to every route that takes none, and odd query strings on every API read. The routes come
// from route-table.ts (a new route is posted to here too). Check values: RFC 9110 (405, 413, 415), RFC 9457, common practice.
import { readFileSync } from "node:fs";
import { afterAll, beforeAll, expect, test } from "vitest";
import { eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { users } from "@db/schema";
import { startSession } from "~/lib/auth/session.server";
import { allowedMethods } from "~/lib/shared/methods";
import { defaultSystemInput } from "~/lib/projects/hydraulics";
import { BASE, makeMember } from "./harness";
import { GOOD_PARAMS, isApi, load, ROUTES, send, walkRecords, wrongAnswer, type Answer, type Mod, type WalkRecords, type Who } from "./route-table";
import { multipart } from "./wire-bodies";

let owner: WalkRecords;
beforeAll(async () => {
  process.env.STRIPE_WEBHOOK_SECRET ||= "whsec_route_attack";
  owner = await walkRecords(await makeMember("admin"));
}, 120_000);
afterAll(() => closeDb());

/** Every form field name a route module reads: form.get / getAll / formId, and its valibot schemas' keys. */
function fieldsOf(file: string): string[] {
  const src = readFileSync(`app/${file}`, "utf8");
  const keys = new Set<string>(["intent"]);
  for (const m of src.matchAll(/(?:\.get|\.getAll|formId\(\w+,)\s*\(?\s*"([\w.-]+)"/g)) keys.add(m[1]);
  for (const m of src.matchAll(/\b(\w+):\s*(?:v\.|Name\(|FreeText\(|Email\b|IdField\b|PageWorkspaceId\b|AnyPassword\b|NewPassword\b|decimalField\(|countField\()/g)) keys.add(m[1]);
  return [...keys];
}

const urlencoded = (pairs: [string, string][]) => pairs.map(([k, v]) => `${encodeURIComponent(k)}=${encodeURIComponent(v)}`).join("&");
const FORM = { "content-type": "application/x-www-form-urlencoded" };
const JSON_TYPE = { "content-type": "application/json" };

type Body = { name: string; refuse: boolean; headers: Record<string, string>; body: (fields: string[], ws: string) => BodyInit };
const each = (fields: string[], value: string, ws: string): [string, string][] => [...fields.map((f): [string, string] => [f, value]), ["pageWorkspaceId", ws]];
const MiB = 1024 * 1024;

const BODIES: Body[] = [
  { name: 'numbers written "1,5"', refuse: false, headers: FORM, body: (f, ws) => urlencoded(each(f, "1,5", ws)) },
  { name: "blank fields of spaces", refuse: false, headers: FORM, body: (f, ws) => urlencoded(each(f, "  ", ws)) },
  { name: '"1e309" (past a double)', refuse: false, headers: FORM, body: (f, ws) => urlencoded(each(f, "1e309", ws)) },
  { name: "every field twice, two values", refuse: false, headers: FORM, body: (f, ws) => urlencoded([...each(f, "1", ws), ...each(f, "2", ws)]) },
  { name: "intent repeated 10 000 times", refuse: false, headers: FORM, body: (f, ws) => urlencoded([...each(f, "1", ws), ...Array.from({ length: 10_000 }, (): [string, string] => ["intent", "x"])]) },
  { name: "every field repeated 10 000 times in all", refuse: false, headers: FORM, body: (f, ws) => urlencoded([...Array.from({ length: 10_000 }, (_, i): [string, string] => [f[i % f.length], "1"]), ["pageWorkspaceId", ws]]) },
  { name: "prototype keys", refuse: false, headers: FORM, body: (f, ws) => urlencoded([...each(f, "1", ws), ["__proto__", "x"], ["constructor", "x"], ["prototype", "x"], ["__proto__[polluted]", "1"], ["constructor[prototype][polluted]", "1"], ["toString", "x"], ["hasOwnProperty", "x"]]) },
  { name: "1 MB of text over its fields (each past any length limit), just under the body limit", refuse: true, headers: FORM, body: (f, ws) => urlencoded(each(f, "x".repeat(Math.floor((MiB - 200) / f.length) - 30), ws)) },
  { name: "a body of 2 MiB", refuse: true, headers: FORM, body: (f, ws) => urlencoded(each(f, "x".repeat(Math.ceil((2 * MiB) / f.length)), ws)) },
  { name: "invalid UTF-8 in percent escapes", refuse: true, headers: FORM, body: (f, ws) => [...f.map((k) => `${k}=%FF%FE%C3%28`), `pageWorkspaceId=${ws}`].join("&") },
  { name: "invalid UTF-8 bytes in a multipart body", refuse: true, headers: { "content-type": "multipart/form-data; boundary=QQ" }, body: (f, ws) => multipart([...f.map((k): [string, Uint8Array] => [k, new Uint8Array([0xff, 0xfe, 0xc3, 0x28])]), ["pageWorkspaceId", new TextEncoder().encode(ws)]]) },
  { name: "a JSON object posted to it", refuse: true, headers: JSON_TYPE, body: (f, ws) => JSON.stringify(Object.fromEntries(each(f, "1", ws))) },
  ...["\"x\"", "42", "null", "true", "[]", "[{}]"].map((j): Body => ({ name: `JSON that is not an object: ${j}`, refuse: true, headers: JSON_TYPE, body: () => j })),
  { name: "JSON with prototype keys", refuse: false, headers: JSON_TYPE, body: () => '{"__proto__":{"polluted":1},"constructor":{"prototype":{"polluted":1}},"input":{"__proto__":{"polluted":1}}}' },
  { name: "XML", refuse: true, headers: { "content-type": "application/xml" }, body: () => "<intent>delete</intent>" },
  { name: "a form as text/plain", refuse: true, headers: { "content-type": "text/plain" }, body: (f, ws) => urlencoded(each(f, "1", ws)) },
];

/** Whether a route takes POST: outside /api/ by the method table, under it by an action that is not `refuseMethod("GET")`. */
const takesPost = (r: { path: string; file: string }, mod: Mod) =>
  isApi(r.path) ? Boolean(mod.action) && !/export const action = refuseMethod\("GET"/.test(readFileSync(`app/${r.file}`, "utf8")) : allowedMethods(r.path).includes("POST");
/** An API read: a loader that is not `refuseMethod("POST")`. */
const apiRead = (r: { path: string; file: string }, mod: Mod) => isApi(r.path) && Boolean(mod.loader) && !/export const loader = (refuseMethod|calcMethodNotAllowed)/.test(readFileSync(`app/${r.file}`, "utf8"));

/** The routes a body is posted to: those with an action that takes POST (the JSON APIs get the JSON bodies). */
const POSTED = () => ROUTES.filter((r) => r.path !== "api/*" && r.path !== "*");

test("hostile bodies on every action, as the owner: never a 5xx or a stack, problem+json under /api/, the unsendable ones refused, Object.prototype clean", async () => {
  const fails: string[] = [];
  let sent = 0;
  const tally = new Map<number, number>();
  for (const r of POSTED()) {
    const mod = await load(r.file);
    if (!mod.action || !takesPost(r, mod)) continue;
    const api = isApi(r.path);
    const params = GOOD_PARAMS[r.path]?.(owner) ?? {};
    const fields = fieldsOf(r.file);
    for (const b of BODIES) {
      // a session of its own for each body (a sign-out ends only it); the user's workspace as the page showed it
      await db().update(users).set({ currentWorkspaceId: owner.m.workspaceId }).where(eq(users.id, owner.m.userId));
      const cookie = (await startSession(owner.m.userId, new Request(BASE))).split(";")[0];
      const as: Who = api ? { who: "owner's token", headers: { authorization: `Bearer ${owner.token}` } } : { who: "owner", cookie, headers: {} };
      let a: Answer;
      try {
        a = await send(r, as, { params, method: "POST", body: b.body(fields, String(owner.m.workspaceId)) as BodyInit, headers: b.headers });
      } catch (e) {
        fails.push(`POST /${r.path} (${b.name}) → threw ${String(e).slice(0, 160)}`);
        continue;
      }
      sent++;
      tally.set(a.status, (tally.get(a.status) ?? 0) + 1);
      const wrong = wrongAnswer(a, { api, refusal: b.refuse && r.path !== "signout" }); // signing out never fails on its body (its one field, next, is optional)
      if (wrong) fails.push(`POST /${r.path} (${b.name}) as ${as.who} → ${wrong}`);
      if ((Object.prototype as Record<string, unknown>).polluted !== undefined) fails.push(`POST /${r.path} (${b.name}): Object.prototype polluted`);
    }
  }
  console.info(`hostile bodies: ${sent} requests, answers ${JSON.stringify(Object.fromEntries(tally))}`);
  if (fails.length) console.error(`${fails.length} failures:\n${fails.join("\n")}`);
  expect(sent).toBeGreaterThan(300);
  expect(fails).toEqual([]);
}, 300_000);

test("POST to every route that takes none (GET-only pages and files, API reads): 405 with Allow, problem+json under /api/", async () => {
  const fails: string[] = [];
  let sent = 0;
  for (const r of POSTED()) {
    const mod = await load(r.file);
    const api = isApi(r.path);
    if (takesPost(r, mod)) continue;
    for (const as of [{ who: "anonymous", headers: {} }, { who: "owner", cookie: owner.m.cookie, headers: {} }, { who: "owner's token", headers: { authorization: `Bearer ${owner.token}` } }] as Who[]) {
      const a = await send(r, as, { params: GOOD_PARAMS[r.path]?.(owner) ?? {}, method: "POST", body: "intent=delete", headers: FORM });
      sent++;
      const wrong = wrongAnswer(a, { api, refusal: true });
      if (wrong || a.status !== 405) fails.push(`POST /${r.path} as ${as.who} → ${wrong ?? a.status}`);
    }
  }
  console.info(`POST where none is taken: ${sent} requests`);
  if (fails.length) console.error(`${fails.length} failures:\n${fails.join("\n")}`);
  expect(sent).toBeGreaterThan(20);
  expect(fails).toEqual([]);
}, 120_000);

const ODD_QUERIES = ["page=1&page=2&page=abc", "method=direct&method=direct&method=warp", "units=furlong", "unit=furlong&flowUnit=bogus", "revision=1&revision=2", "revision=-1", "revision=1e3", "page=1e309", "page=%FF", "bogus=1&__proto__=1&constructor=1", "page=" + "9".repeat(20)];

test("odd query strings on every API read, with the owner's token: a 4xx or an answer, never a 5xx, a stack or a refusal that is not problem+json", async () => {
  const fails: string[] = [];
  const tally = new Map<string, number>();
  let sent = 0;
  for (const r of POSTED().filter((x) => isApi(x.path))) {
    const mod = await load(r.file);
    if (!apiRead(r, mod)) continue;
    const params = GOOD_PARAMS[r.path]?.(owner) ?? {};
    for (const q of ODD_QUERIES) {
      const base = "/" + r.path.replace(/:(\w+)/g, (_, k: string) => params[k] ?? "");
      const a = await send(r, { who: "owner's token", headers: { authorization: `Bearer ${owner.token}` } }, { params, path: `${base}?${q}` });
      sent++;
      tally.set(`${a.status}`, (tally.get(`${a.status}`) ?? 0) + 1);
      const wrong = wrongAnswer(a, { api: true, refusal: false });
      if (wrong) fails.push(`GET ${base}?${q} → ${wrong}`);
    }
  }
  console.info(`odd API queries: ${sent} requests, answers ${JSON.stringify(Object.fromEntries(tally))}`);
  if (fails.length) console.error(`${fails.length} failures:\n${fails.join("\n")}`);
  expect(fails).toEqual([]);
}, 120_000);

test("an API read refuses a query parameter it does not take, or a single-valued one given twice: 400 problem+json naming it (an answer in SI to ?units=us would be misread)", async () => {
  const fails: string[] = [];
  let sent = 0;
  const token: Who = { who: "owner's token", headers: { authorization: `Bearer ${owner.token}` } };
  for (const r of POSTED()) {
    const mod = await load(r.file);
    if (!apiRead(r, mod)) continue;
    const params = GOOD_PARAMS[r.path]?.(owner) ?? {};
    const base = "/" + r.path.replace(/:(\w+)/g, (_, k: string) => params[k] ?? "");
    const plain = await send(r, token, { params, path: base });
    if (plain.status !== 200) fails.push(`GET ${base} → ${plain.status} (control: the read itself)`);
    const asks = ["units=us", "bogus=1", "Page=2"];
    if ((await send(r, token, { params, path: `${base}?page=1` })).status === 200) asks.push("page=1&page=2", "page=1&page=1");
    for (const q of asks) {
      const a = await send(r, token, { params, path: `${base}?${q}` });
      sent++;
      const key = q.split("=")[0];
      const wrong = wrongAnswer(a, { api: true, refusal: true });
      if (wrong || a.status !== 400 || !a.text.includes(`\\"${key}\\"`)) fails.push(`GET ${base}?${q} → ${wrong ?? `${a.status} ${a.text.slice(0, 160)}`}`);
    }
  }
  console.info(`unknown or repeated API query parameters: ${sent} requests`);
  if (fails.length) console.error(`${fails.length} failures:\n${fails.join("\n")}`);
  expect(sent).toBeGreaterThan(15);
  expect(fails).toEqual([]);
}, 120_000);

test("the JSON API that previews a system takes JSON only: the same body as text/plain or a form is 415 problem+json with Accept-Post, as the calculators answer (RFC 9110 §15.5.16)", async () => {
  const r = ROUTES.find((x) => x.path === "api/v1/systems/:id/preview")!;
  const params = GOOD_PARAMS[r.path](owner);
  const token: Who = { who: "owner's token", headers: { authorization: `Bearer ${owner.token}` } };
  const body = JSON.stringify({ input: defaultSystemInput() });
  const control = await send(r, token, { params, method: "POST", body, headers: JSON_TYPE });
  expect(control.status).toBe(200);
  for (const type of ["text/plain", "application/x-www-form-urlencoded", "application/jsonx", ""]) {
    const a = await send(r, token, { params, method: "POST", body: type ? body : new TextEncoder().encode(body), headers: type ? { "content-type": type } : {} }); // bytes: no type of their own
    expect(wrongAnswer(a, { api: true, refusal: true }), type).toBeNull();
    expect([a.status, JSON.parse(a.text).detail], type).toEqual([415, `Send the body as JSON with Content-Type: application/json (got ${type || "no Content-Type"}).`]);
  }
});
