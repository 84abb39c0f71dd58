// Every Allow the app answers, on the wire to the built app (app/serve.mjs), for every route of app/routes.ts (route-table.ts,
// so a new route is asked too): the 405s to PUT, PROPFIND and the method the route does not take (POST on a GET-only route,
// GET on a POST-only one), and the 204 to OPTIONS. RFC 9110 §9.3.2: a server that supports GET on a resource supports HEAD
// on it too, and §10.2.1: Allow lists the methods the resource supports — so an Allow that names GET names HEAD, every Allow
// names OPTIONS (every route answers it), all of one route's Allows are one list, and a route whose Allow names HEAD answers
// HEAD (not 405). A GET-only resource route's own 405 (`refuseMethod("GET")`, `methodNotAllowed`) said "GET, OPTIONS".
import { existsSync, readFileSync } from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import { startSession } from "~/lib/auth/session.server";
import { allowedMethods } from "~/lib/shared/methods";
import { BASE, makeMember, ROOT, startBuiltApp, type BuiltApp } from "./harness";
import { GOOD_PARAMS, isApi, pathFor, ROUTES, walkRecords, type WalkRecords } from "./route-table";

const built = existsSync(path.join(ROOT, "build/server/index.js"));
let app: BuiltApp | null = null;
let owner: WalkRecords;

beforeAll(async () => {
  if (!built) return;
  owner = await walkRecords(await makeMember("admin"));
  app = await startBuiltApp({ COOKIE_SECURE: "0", STRIPE_API_BASE: "", STRIPE_WEBHOOK_SECRET: "whsec_allow_head" });
}, 120_000);
afterAll(() => {
  app?.stop();
  return closeDb();
});

/** The methods a route takes, as its module says: a GET-only resource route's action is `refuseMethod("GET")` or `methodNotAllowed("GET")`. */
function takes(r: { path: string; file: string }): { get: boolean; post: boolean } {
  if (!isApi(r.path)) return { get: allowedMethods(r.path).includes("GET"), post: allowedMethods(r.path).includes("POST") };
  const src = readFileSync(`app/${r.file}`, "utf8");
  return { get: !/export const loader = (refuseMethod|calcMethodNotAllowed)/.test(src), post: !/export const action = refuseMethod\(/.test(src) };
}

/** What is wrong with one Allow (null: nothing): GET without HEAD, no OPTIONS, a method twice. */
function wrongAllow(allow: string | null): string | null {
  if (!allow) return "no Allow";
  const list = allow.split(",").map((m) => m.trim());
  if (new Set(list).size !== list.length) return `a method twice in "${allow}"`;
  if (list.includes("GET") && !list.includes("HEAD")) return `GET without HEAD in "${allow}" (RFC 9110 §9.3.2)`;
  if (!list.includes("OPTIONS")) return `no OPTIONS in "${allow}"`;
  return null;
}
const asSet = (allow: string | null) => (allow ?? "").split(",").map((m) => m.trim()).sort().join(", ");

describe.skipIf(!built)("Allow on the wire, every route", () => {
  test("every 405 and every OPTIONS answer: an Allow naming HEAD with GET and OPTIONS always, one list per route, and HEAD answered where it is named", async () => {
    const fails: string[] = [];
    const session = (await startSession(owner.m.userId, new Request(BASE))).split(";")[0];
    const ask = async (method: string, p: string, headers: Record<string, string>) => {
      const res = await fetch(`${app!.base}${p}`, { method, headers: { origin: app!.base, ...headers }, redirect: "manual" });
      return { status: res.status, allow: res.headers.get("allow"), type: res.headers.get("content-type") ?? "" };
    };
    let asked = 0;
    for (const r of ROUTES) {
      if (r.path === "api/*") continue; // no route: 404 to every method
      const p = pathFor(r.path, GOOD_PARAMS[r.path]?.(owner) ?? {});
      const api = isApi(r.path);
      const as: Record<string, string> = api ? { authorization: `Bearer ${owner.token}` } : { cookie: session };
      const t = takes(r);
      const refused = ["PUT", "PROPFIND", ...(t.post ? [] : ["POST"]), ...(t.get ? [] : ["GET"])];
      const allows: [string, string | null][] = [];
      for (const method of refused) {
        const a = await ask(method, p, { ...as, "content-type": api ? "application/json" : "application/x-www-form-urlencoded" });
        asked++;
        if (a.status !== 405) fails.push(`${method} /${r.path} → ${a.status}, not 405`);
        else allows.push([method, a.allow]);
      }
      const o = await ask("OPTIONS", p, as);
      asked++;
      if (o.status !== 204) fails.push(`OPTIONS /${r.path} → ${o.status}, not 204`);
      else allows.push(["OPTIONS", o.allow]);
      for (const [method, allow] of allows) {
        const wrong = wrongAllow(allow);
        if (wrong) fails.push(`${method} /${r.path} → ${wrong}`);
      }
      if (new Set(allows.map(([, a]) => asSet(a))).size > 1) fails.push(`/${r.path}: Allows differ — ${allows.map(([m, a]) => `${m}: ${a}`).join("; ")}`);
      if (allows.some(([, a]) => asSet(a).split(", ").includes("HEAD"))) {
        const h = await ask("HEAD", p, as);
        asked++;
        if (h.status === 405) fails.push(`HEAD /${r.path} → 405, though its Allow names HEAD`);
      }
    }
    console.info(`Allow: ${asked} requests on ${ROUTES.length} routes`);
    if (fails.length) console.error(`${fails.length} failures:\n${fails.join("\n")}`);
    expect(asked).toBeGreaterThan(ROUTES.length * 3);
    expect(fails).toEqual([]);
  }, 300_000);
});
