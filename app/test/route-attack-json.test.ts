// Bodies the other sweeps (route-walk, route-attack-bodies) do not send, on every route that takes one: to each JSON
// API (those that read the body as JSON: calcAction or notJsonBody in their module), the wrong content types, JSON with a
// byte-order mark, 10 000 levels deep, duplicate keys, numbers past a double, -0, 400 digits, invalid UTF-8, truncated;
// in each field of a good body, the same odd values; to the upload API, a mapping field of those shapes; to every form
// action, JSON of those shapes and a form with every field repeated and no intent. Expected: never a 5xx or a stack; under
// /api/ RFC 9457 problem+json with type, title, status and detail, a 415 with Accept-Post for a body not declared JSON
// (RFC 9110 §15.5.16), and a refusal of one field's value naming that field; a JSON text that no form of ours sends
// refused by a form action with a 4xx. Routes come from route-table.ts, so a new route is posted to here too. Check
// values: RFC 8259 (JSON; §8.1 a parser MAY ignore a byte-order mark), RFC 9110, RFC 9457, common practice.
import { readFileSync } from "node:fs";
import { afterAll, beforeAll, expect, test } from "vitest";
import { eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { users } from "@db/schema";
import { startSession } from "~/lib/auth/session.server";
import { allowedMethods } from "~/lib/shared/methods";
import { CALC_ENDPOINT_DOCS } from "~/lib/calc-api/examples";
import { defaultSystemInput } from "~/lib/projects/hydraulics";
import { BASE, makeMember } from "./harness";
import { GOOD_PARAMS, isApi, load, ROUTES, send, walkRecords, wrongAnswer, type Answer, type WalkRecords, type Who } from "./route-table";
import { multipart } from "./wire-bodies";

let owner: WalkRecords;
beforeAll(async () => {
  process.env.STRIPE_WEBHOOK_SECRET ||= "whsec_route_attack";
  owner = await walkRecords(await makeMember("admin"));
}, 120_000);
afterAll(() => closeDb());

const token = (): Who => ({ who: "owner's token", headers: { authorization: `Bearer ${owner.token}` } });
const JSON_TYPE = { "content-type": "application/json" };
const DEEP = 10_000;
const deepArray = "[".repeat(DEEP) + "]".repeat(DEEP);
const deepObject = '{"a":'.repeat(DEEP) + "1" + "}".repeat(DEEP);
const report = (what: string, sent: number, fails: string[]) => {
  console.info(`${what}: ${sent} requests`);
  if (fails.length) console.error(`${fails.length} failures:\n${fails.slice(0, 80).join("\n")}`);
};

/** The JSON APIs: a route whose module reads its body as JSON, with a body each answers 200 to. */
function jsonApis(): { r: (typeof ROUTES)[number]; good: Record<string, unknown> }[] {
  const out = ROUTES.filter((r) => isApi(r.path) && /calcAction\(|notJsonBody\(|readJsonBody\(/.test(readFileSync(`app/${r.file}`, "utf8"))).map((r) => {
    const doc = CALC_ENDPOINT_DOCS.find((d) => d.path === `/${r.path}`);
    const good = doc ? (JSON.parse(doc.request) as Record<string, unknown>) : r.path === "api/v1/systems/:id/preview" ? { input: defaultSystemInput() } : null;
    if (!good) throw new Error(`no good JSON body known for /${r.path}: add one here`);
    return { r, good };
  });
  expect(out.length).toBeGreaterThanOrEqual(4);
  return out;
}

const post = (r: { path: string; file: string }, body: BodyInit, headers: Record<string, string> = JSON_TYPE) =>
  send(r, token(), { params: GOOD_PARAMS[r.path]?.(owner) ?? {}, method: "POST", body, headers });

/** An API refusal's shape (problem+json, its status, title, detail) and no 5xx or stack. */
const wrongApi = (a: Answer, refusal: boolean) => wrongAnswer(a, { api: true, refusal });

test("a JSON API sent its body as a form, multipart, text or another JSON-like type: 415 problem+json naming application/json (Accept-Post: route-attack-bodies.test.ts)", async () => {
  const fails: string[] = [];
  let sent = 0;
  for (const { r, good } of jsonApis()) {
    const text = JSON.stringify(good);
    const control = await post(r, text);
    if (control.status !== 200) fails.push(`POST /${r.path} (control, its good body) → ${control.status} ${control.text.slice(0, 160)}`);
    const asks: [string, BodyInit][] = [
      ["application/x-www-form-urlencoded", new URLSearchParams(Object.entries(good).map(([k, x]) => [k, JSON.stringify(x)]))],
      ["multipart/form-data; boundary=QQ", `--QQ\r\nContent-Disposition: form-data; name="body"\r\n\r\n${text}\r\n--QQ--\r\n`],
      ["text/plain;charset=UTF-8", text],
      ["application/json-patch+json", text],
      ["application/merge-patch+json", text],
      ["application/jsonl", text],
      ["text/json", text],
      ["application/json, text/plain", text],
    ];
    for (const [type, body] of asks) {
      const a = await send(r, token(), { params: GOOD_PARAMS[r.path]?.(owner) ?? {}, method: "POST", body, headers: { "content-type": type } });
      sent++;
      const wrong = wrongApi(a, true);
      if (wrong || a.status !== 415 || !a.text.includes("application/json")) fails.push(`POST /${r.path} as ${type} → ${wrong ?? `${a.status} ${a.text.slice(0, 120)}`}`);
    }
  }
  report("JSON APIs, other content types", sent, fails);
  expect(fails).toEqual([]);
}, 60_000);

/** The first field of a JSON object's text as `"name":value`. */
const firstField = (g: string) => {
  const [k, val] = Object.entries(JSON.parse(g) as Record<string, unknown>)[0];
  return `${JSON.stringify(k)}:${JSON.stringify(val)}`;
};

/** Whole bodies: each is refused with a 400 naming the body, or (`mayPass`) answered as its good body is. */
const WHOLE: { name: string; body: (good: string) => BodyInit; mayPass?: boolean; names?: string | ((good: string) => string) }[] = [
  { name: "a byte-order mark before it", body: (g) => "\uFEFF" + g, mayPass: true },
  { name: "two byte-order marks", body: (g) => "\uFEFF\uFEFF" + g },
  // a name twice (JSON.parse kept the last): refused naming it (lib/shared/strict-json.ts)
  { name: "the good body's first field twice, the same value", body: (g) => g.replace(/^\{/, `{${firstField(g)},`), names: (g) => `"${Object.keys(JSON.parse(g))[0]}" twice` },
  { name: "a duplicate key", body: (g) => g.replace(/^\{/, '{"__dup":1,"__dup":2,'), names: '"__dup"' },
  { name: "a duplicate key, once written with an escape", body: (g) => g.replace(/^\{/, '{"__dup":1,"\\u005f_dup":2,'), names: '"__dup"' },
  { name: "a duplicate key in a nested object", body: (g) => g.replace(/\}$/, ',"__n":[{"k":1},{"k":1,"k":2}]}'), names: '"k" twice in the object at /__n/1' },
  { name: "every key twice, the second null", body: (g) => g.replace(/\}$/, "," + Object.keys(JSON.parse(g)).map((k) => `${JSON.stringify(k)}:null`).join(",") + "}") },
  { name: `an array ${DEEP} levels deep`, body: () => deepArray },
  { name: `an object ${DEEP} levels deep`, body: () => deepObject },
  { name: `the good body inside ${DEEP} arrays`, body: (g) => "[".repeat(DEEP) + g + "]".repeat(DEEP) },
  { name: "truncated", body: (g) => g.slice(0, Math.floor(g.length / 2)) },
  { name: "invalid UTF-8 in a string", body: (g) => new Uint8Array([...new TextEncoder().encode(g.replace(/\}$/, ',"x":"')), 0xff, 0xfe, 0xc3, 0x28, ...new TextEncoder().encode('"}')]) },
  { name: "UTF-16 with its byte-order mark", body: (g) => new Uint8Array([0xff, 0xfe, ...[...g].flatMap((c) => [c.charCodeAt(0) & 0xff, c.charCodeAt(0) >> 8])]) },
  { name: "a NUL after it", body: (g) => g + "\u0000" },
  { name: "two documents", body: (g) => g + g },
  { name: "empty", body: () => "" },
  { name: "1e309", body: () => "1e309" },
];

test("whole JSON bodies of odd shapes on every JSON API: never a 5xx or a stack; a 400 problem+json (a duplicate key: naming it), or (a BOM) the good body's answer", async () => {
  const fails: string[] = [];
  let sent = 0;
  for (const { r, good } of jsonApis()) {
    const text = JSON.stringify(good);
    for (const w of WHOLE) {
      const a = await post(r, w.body(text));
      sent++;
      const wrong = wrongApi(a, !w.mayPass);
      if (wrong) fails.push(`POST /${r.path} (${w.name}) → ${wrong}`);
      else if (!w.mayPass && a.status !== 400) fails.push(`POST /${r.path} (${w.name}) → ${a.status}, not 400`);
      else if (w.mayPass && a.status !== 200 && a.status !== 400) fails.push(`POST /${r.path} (${w.name}) → ${a.status}`);
      else if (w.names && !String((JSON.parse(a.text) as { detail?: unknown }).detail).includes(typeof w.names === "string" ? w.names : w.names(text)))
        fails.push(`POST /${r.path} (${w.name}) → ${a.status} not naming it: ${a.text.slice(0, 200)}`);
    }
  }
  report("odd whole JSON bodies", sent, fails);
  expect(fails).toEqual([]);
}, 120_000);

/** Every leaf of a JSON value with its path (arrays: the first element only, enough to reach each kind of field). */
function leaves(x: unknown, path: (string | number)[] = []): (string | number)[][] {
  if (Array.isArray(x)) return x.length ? [path, ...leaves(x[0], [...path, 0])] : [path];
  if (x && typeof x === "object") return [...(path.length ? [path] : []), ...Object.entries(x).flatMap(([k, v]) => leaves(v, [...path, k]))];
  return [path];
}
/** The good body's text with the value at `path` replaced by the raw JSON text `raw`. */
function withRaw(good: unknown, path: (string | number)[], raw: string): string {
  const MARK = "\u0000MARK\u0000";
  const copy = structuredClone(good) as Record<string | number, unknown>;
  let at = copy;
  for (const k of path.slice(0, -1)) at = at[k] as Record<string | number, unknown>;
  at[path[path.length - 1]] = MARK;
  return JSON.stringify(copy).replace(JSON.stringify(MARK), raw);
}
/** Odd values for one field; `refuse`: no field of ours takes it (a 400 naming the field). */
const FIELD_VALUES: { raw: string; refuse: boolean }[] = [
  { raw: "1e309", refuse: true },
  { raw: "-1e309", refuse: true },
  { raw: "1" + "0".repeat(400), refuse: true },
  { raw: deepArray, refuse: true },
  { raw: deepObject, refuse: true },
  { raw: "-0", refuse: false },
  { raw: "1e-400", refuse: false },
  { raw: "0.1e1", refuse: false },
  { raw: '"1e309"', refuse: false },
  { raw: '"NaN"', refuse: false },
  { raw: JSON.stringify("x".repeat(100_000)), refuse: false },
  { raw: '{"__proto__":{"polluted":1}}', refuse: false },
];

test("odd values in each field of a good body on every JSON API: never a 5xx or a stack; a refusal names the field", async () => {
  const fails: string[] = [];
  let sent = 0;
  for (const { r, good } of jsonApis()) {
    for (const path of leaves(good).slice(0, 60)) {
      for (const f of FIELD_VALUES) {
        const a = await post(r, withRaw(good, path, f.raw));
        sent++;
        const label = `POST /${r.path} ${path.join(".")}=${f.raw.slice(0, 24)}`;
        const wrong = wrongApi(a, f.refuse);
        const name = String(path.filter((p) => typeof p === "string").at(-1) ?? "");
        if (wrong) fails.push(`${label} → ${wrong}`);
        else if (a.status >= 400 && name && !a.text.includes(name)) fails.push(`${label} → ${a.status} not naming ${name}: ${a.text.slice(0, 200)}`);
        if ((Object.prototype as Record<string, unknown>).polluted !== undefined) fails.push(`${label}: Object.prototype polluted`);
      }
    }
  }
  report("odd values by field", sent, fails);
  expect(sent).toBeGreaterThan(200);
  expect(fails).toEqual([]);
}, 300_000);

test("the upload API's mapping field as JSON of odd shapes (deep, a BOM, past a double, not an object): 400 or 422 problem+json naming the mapping, never a 5xx", async () => {
  const r = ROUTES.find((x) => x.path === "api/v1/libraries/:id/upload")!;
  const csv = readFileSync("fixtures/csv/long-si.csv", "utf8");
  const fails: string[] = [];
  const mappings = [deepArray, deepObject, "\uFEFF{}", '{"columns":' + deepObject + "}", '{"columns":{"flow":{"column":1e309}}}', '{"policy":' + "1".repeat(400) + "}", "null", "[]", '"x"', "1e309", '{"__proto__":{"polluted":1}}', "{\"a\":1,\"a\":2}"];
  for (const m of mappings) {
    for (const imp of ["0", "1"]) {
      const a = await post(r, multipart([["file", csv, "m.csv"], ["mapping", m], ["import", imp]]), { "content-type": "multipart/form-data; boundary=QQ" });
      const label = `POST /${r.path} mapping=${m.slice(0, 30)} import=${imp}`;
      const wrong = wrongApi(a, true);
      if (wrong) fails.push(`${label} → ${wrong}`);
      else if (!/mapping/i.test(a.text)) fails.push(`${label} → ${a.status} not naming the mapping: ${a.text.slice(0, 160)}`);
      if ((Object.prototype as Record<string, unknown>).polluted !== undefined) fails.push(`${label}: Object.prototype polluted`);
    }
  }
  report("upload API mappings", mappings.length * 2, fails);
  expect(fails).toEqual([]);
}, 120_000);

test("the upload API's mapping with a name twice in one object, valid once JSON.parse kept the last: 400 problem+json naming the name and the object's JSON Pointer (was 201)", async () => {
  // source: RFC 8259 §4 (names SHOULD be unique), RFC 7493 §2.3 (I-JSON: MUST NOT), RFC 6901 (JSON Pointer), RFC 9457
  const r = ROUTES.find((x) => x.path === "api/v1/libraries/:id/upload")!;
  const csv = readFileSync("fixtures/csv/long-si.csv", "utf8");
  const upload = (mapping: string) => post(r, multipart([["file", csv, "m.csv"], ["mapping", mapping]]), { "content-type": "multipart/form-data; boundary=QQ" });
  const first = await upload("");
  expect(first.status).toBe(201);
  const used = JSON.stringify((JSON.parse(first.text) as { report: { mapping: unknown } }).report.mapping);
  expect((await upload(used)).status).toBe(201); // the mapping used, given once: taken
  const inColumn = used.replace('{"index":1,', '{"index":2,"index":1,');
  expect(inColumn).not.toBe(used);
  for (const [text, at] of [['{"layout":"wide",' + used.slice(1), "its top object"], [inColumn, "the object at /columns/1"]]) {
    const a = await upload(text);
    expect([a.status, a.type]).toEqual([400, "application/problem+json"]);
    const body = JSON.parse(a.text) as { detail: string; errors: { field: string; message: string }[] };
    expect(body.detail).toContain(`twice in ${at}`);
    expect(body.errors[0].field).toBe("mapping");
  }
}, 60_000);

/** Every form field name a route module reads (as route-attack-bodies.test.ts finds them). */
function fieldsOf(file: string): string[] {
  const src = readFileSync(`app/${file}`, "utf8");
  const keys = new Set<string>();
  for (const m of src.matchAll(/(?:\.get|\.getAll|formId\(\w+,)\s*\(?\s*"([\w.-]+)"/g)) keys.add(m[1]);
  for (const m of src.matchAll(/\b(\w+):\s*(?:v\.|Name\(|FreeText\(|Email\b|IdField\b|PageWorkspaceId\b|AnyPassword\b|NewPassword\b|decimalField\(|countField\()/g)) keys.add(m[1]);
  keys.delete("intent");
  return [...keys];
}

test("form actions: JSON of odd shapes (a BOM, 10 000 deep) refused with a 4xx; every field twice with no intent, where the action reads one, refused with a 4xx; never a 5xx", async () => {
  const fails: string[] = [];
  let sent = 0;
  for (const r of ROUTES) {
    if (isApi(r.path) || !allowedMethods(r.path).includes("POST")) continue;
    const mod = await load(r.file);
    if (!mod.action) continue;
    const src = readFileSync(`app/${r.file}`, "utf8");
    const params = GOOD_PARAMS[r.path]?.(owner) ?? {};
    const ws = String(owner.m.workspaceId);
    const fields = fieldsOf(r.file);
    const twice = new URLSearchParams([...fields.flatMap((f) => [[f, "1"], [f, "2"]]), ["pageWorkspaceId", ws]]);
    // an action that reads an intent refuses a form without one, unless it names a default (systems/:id: "save", whose field errors answer 400 with the page)
    const needsIntent = /\.get\("intent"\)|intent:/.test(src) && !/get\("intent"\) \?\? "/.test(src);
    const asks: { name: string; body: BodyInit; headers: Record<string, string>; refuse: boolean }[] = [
      { name: "JSON with a byte-order mark", body: "\uFEFF" + JSON.stringify({ intent: "delete", pageWorkspaceId: ws }), headers: JSON_TYPE, refuse: true },
      { name: `JSON ${DEEP} deep`, body: deepObject, headers: JSON_TYPE, refuse: true },
      { name: `a form ${DEEP} brackets deep`, body: `intent${"[a]".repeat(DEEP)}=delete&pageWorkspaceId=${ws}`, headers: { "content-type": "application/x-www-form-urlencoded" }, refuse: needsIntent },
      { name: "every field twice and no intent", body: twice, headers: { "content-type": "application/x-www-form-urlencoded" }, refuse: needsIntent },
    ];
    // a form field that carries JSON (the mapping page's `base`, the upload API's `mapping`), with each intent the module names
    const intents = [...new Set([...src.matchAll(/intent"\) === "([\w-]+)"|intent === "([\w-]+)"|case "([\w-]+)"/g)].map((m) => m[1] ?? m[2] ?? m[3]))];
    // (the mapping page reads its `base` through mapping-form.ts baseMappingOf, not in the route module itself)
    const jsonFields = new Set([...fields.filter((x) => /JSON\.parse\(String\(form\.get\("/.test(src) && ["base", "mapping"].includes(x)), ...(/baseMappingOf\(form\)|mappingFromForm\(form\)/.test(src) ? ["base"] : [])]);
    for (const f of jsonFields) {
      for (const intent of ["check", ...intents]) {
        for (const raw of [deepObject, deepArray, "\uFEFF{}", '{"columns":[{"index":1e309}]}']) {
          asks.push({ name: `${f} = ${raw.slice(0, 12)}…, intent ${intent}`, body: new URLSearchParams({ intent, [f]: raw, pageWorkspaceId: ws }), headers: { "content-type": "application/x-www-form-urlencoded" }, refuse: false });
        }
      }
    }
    for (const b of asks) {
      // a session of its own for each body (a sign-out ends only it), in the workspace the page showed
      await db().update(users).set({ currentWorkspaceId: owner.m.workspaceId }).where(eq(users.id, owner.m.userId));
      const as: Who = { who: "owner", cookie: (await startSession(owner.m.userId, new Request(BASE))).split(";")[0], headers: {} };
      const a = await send(r, as, { params, method: "POST", body: b.body, headers: b.headers });
      sent++;
      const wrong = wrongAnswer(a, { api: false, refusal: b.refuse && r.path !== "signout" });
      if (wrong) fails.push(`POST /${r.path} (${b.name}) → ${wrong}`);
    }
  }
  report("form actions", sent, fails);
  expect(sent).toBeGreaterThan(60);
  expect(fails).toEqual([]);
}, 120_000);
