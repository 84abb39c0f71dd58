// The HTTP methods each route outside /api/ takes, answered by the root middleware (app/root.tsx)
// before any loader or action runs. React Router runs a route's action on every method but GET and
// HEAD (PUT, PATCH and DELETE as if they were POST), and answers a POST to a route without an action,
// OPTIONS and the WebDAV-style rest with a 405 it logs with a stack. A plain HTML form can only GET or
// POST, and nothing of ours sends anything else to these routes. API routes (/api/…) answer wrong
// methods themselves (refuseMethod in problem.server.ts, app/test/methods.test.ts). Methods React Router
// does not take at all (PROPFIND, TRACE…) are answered before it by app/serve.mjs (unknownMethodAnswer below), and so
// are the ones this table refuses outside /api/ (pageMethodRefusal), so that every refusal of a page is one page.
//
// Keys are React Router's route patterns (the paths of app/routes.ts). app/test/route-walk.test.ts
// checks this table against the route modules: a page without an action, or a resource route that
// refuses POST or GET, must be listed here.

import { matchRoutes } from "react-router";

/** Pages without an action, and files, probes and exports (resource routes whose action answers 405). */
const GET_ONLY = [
  "", // the start page
  "api", // the API reference page
  "field",
  "field/checks/:id",
  "selections/:id",
  "*", // not found
  "healthz",
  "livez",
  "libraries/:id/export.csv",
  "libraries/:id/export.json",
  "libraries/:id/trace/:pictureId/file",
  "selections/:id/export.csv",
  "selections/:id/export.json",
  "field/selections/:id/export.csv",
  "field/checks/:id/photos/:photoId",
];

/** Resource routes that only take a POST (their loader answers 405). */
const POST_ONLY = ["field/selections/:id/checks"];

const GET = Object.freeze(["GET", "HEAD"]);
const POST = Object.freeze(["POST"]);
const GET_AND_POST = Object.freeze(["GET", "HEAD", "POST"]);

const TABLE = new Map<string, readonly string[]>([...GET_ONLY.map((p) => [p, GET] as const), ...POST_ONLY.map((p) => [p, POST] as const)]);

/** A route pattern as a key of the table: no leading or trailing slash ("/" is the start page, ""). */
const key = (pattern: string) => pattern.replace(/^\/+|\/+$/g, "");

/** The methods a route outside /api/ takes (every other page, and a request without a pattern: GET, HEAD and POST). */
export function allowedMethods(pattern: string | undefined): readonly string[] {
  if (pattern === undefined) return GET_AND_POST;
  return TABLE.get(key(pattern)) ?? GET_AND_POST;
}

/** The patterns this table names (for the test that checks it against app/routes.ts). */
export const listedPatterns = (): string[] => [...TABLE.keys()];

/**
 * What the root middleware does with a request to a route outside /api/: "pass" to the route,
 * "options" (204 with Allow, `optionsAllow`) or "refuse" (405 with Allow), never running the route's action.
 * GET and HEAD always pass: loaders are reads, and a POST-only route's loader answers 405 itself
 * with its own words.
 */
export function methodVerdict(method: string, pattern: string | undefined): { verdict: "pass" | "options" | "refuse"; allow: readonly string[] } {
  const allow = allowedMethods(pattern);
  const m = method.toUpperCase();
  if (m === "GET" || m === "HEAD") return { verdict: "pass", allow };
  if (m === "OPTIONS") return { verdict: "options", allow };
  return { verdict: allow.includes(m) ? "pass" : "refuse", allow };
}

/** A route of React Router's manifest: the server build's carries the route module (`module`), the browser's its file name. */
type RouteEntry = { id: string; parentId?: string; path?: string; index?: boolean; caseSensitive?: boolean; module?: unknown };
type Tree = { id: string; path?: string; index?: boolean; caseSensitive?: boolean; children?: Tree[] };

/**
 * The routes React Router matches for a path, outermost first, from the build's route manifest (undefined: none).
 * A segment that is no UTF-8 once decoded (%FF) matches as a placeholder: it can only ever fill a parameter, and
 * matchRoutes would warn on the console about it (a line in the log for anyone who sends one).
 */
function matchesOf(routes: Record<string, RouteEntry | undefined>, rawPathname: string) {
  const pathname = rawPathname
    .split("/")
    .map((s) => {
      try {
        decodeURIComponent(s);
        return s;
      } catch {
        return "_";
      }
    })
    .join("/");
  const all = Object.values(routes).filter((r): r is RouteEntry => Boolean(r));
  const tree = (parentId: string | undefined): Tree[] =>
    all.filter((r) => r.parentId === parentId).map((r) => ({ id: r.id, path: r.path, index: r.index, caseSensitive: r.caseSensitive, ...(r.index ? {} : { children: tree(r.id) }) }) as Tree);
  return matchRoutes(tree(undefined) as Parameters<typeof matchRoutes>[0], pathname) ?? undefined;
}

/**
 * React Router's pattern for a path (the paths of its matched routes joined), from the build's route
 * manifest: for the 405s React Router answers before any middleware runs (OPTIONS on a page,
 * PROPFIND and the like), whose Allow app/entry.server.tsx adds from this table.
 */
export function patternOf(routes: Record<string, RouteEntry | undefined>, pathname: string): string | undefined {
  return matchesOf(routes, pathname)
    ?.map((m) => m.route.path)
    .filter(Boolean)
    .join("/");
}

/**
 * The methods React Router takes at all (its own list, plus OPTIONS, which it answers on resource routes).
 * Any other (PROPFIND, MKCOL, TRACE, LOCK…) it refuses before any middleware runs: on a resource route with
 * {"message":"Unexpected Server Error"} and no Allow, a stack in the log each time.
 */
export const ROUTER_METHODS: ReadonlySet<string> = new Set(["GET", "HEAD", "POST", "PUT", "PATCH", "DELETE", "OPTIONS"]);

/** What app/serve.mjs answers, before React Router, to a method outside ROUTER_METHODS. */
export type UnknownMethodAnswer = { status: 405; allow: string; detail: string } | { status: 404; detail: string } | { status: 204; allow: string };

/**
 * The Allow header of every answer that carries one: the methods the route takes, HEAD beside GET, and OPTIONS, which every
 * route answers (204, `unknownMethodAnswer`). RFC 9110 §10.2.1: Allow lists the methods the target resource supports, so a
 * 405's Allow and the OPTIONS answer's are the same list (helper "formedges"; the 405s left OPTIONS out until then); §9.3.2:
 * a resource that takes GET takes HEAD (React Router answers HEAD with the loader), and an API route's `refuseMethod("GET")`
 * said "GET, OPTIONS" (helper "routeedges"). Each method once.
 */
export const allowHeader = (allow: readonly string[] | string) => {
  const named = (typeof allow === "string" ? allow.split(",") : [...allow]).map((m) => m.trim()).filter(Boolean);
  return [...new Set(named.flatMap((m) => (m === "GET" ? ["GET", "HEAD"] : [m])).concat("OPTIONS"))].join(", ");
};

/**
 * The Allow of an answer to OPTIONS (`allowHeader`). One rule on every route, page or API (DEVELOPERS.md, decision
 * "wirereq"): 204 with this Allow, nothing else (no CORS: no Access-Control-* header, so a browser's preflight from
 * another origin still fails).
 */
export const optionsAllow = allowHeader;

/**
 * The answer to a method React Router does not take (null for one it does), and to OPTIONS on every route (204, Allow by
 * `optionsAllow`; React Router refused OPTIONS on a page with its own 405 and ran an API route's loader for it),
 * with the route's own Allow:
 * outside /api/ from the table above; on an API route the `allow` its refusing export carries
 * (`refuseMethod` in problem.server.ts: the route's one statement of what it takes); an /api/ path no
 * route serves is a 404, as the API's not-found route answers every method. `routes` is the build's
 * route manifest (app/serve.mjs hands it over); a `.data` path is matched as its page, as React Router does.
 */
export function unknownMethodAnswer(routes: Record<string, RouteEntry | undefined>, method: string, pathname: string): UnknownMethodAnswer | null {
  const m = method.toUpperCase();
  // OPTIONS: React Router runs an API route's loader for it as for a GET (the answer's body and all) and refuses it on a
  // page (405) before any middleware; it is answered here, on every route, with the route's Allow and nothing else.
  const options = m === "OPTIONS";
  if (ROUTER_METHODS.has(m) && !options) return null;
  const path = pathname === "/_root.data" ? "/" : pathname.replace(/\.data$/, "");
  const matches = matchesOf(routes, path);
  const refuse = (allow: string) => ({ status: 405 as const, allow, detail: `${m} is not taken here: use ${allow.split(", ").join(" or ")}.` });
  if (!path.startsWith("/api/")) {
    const allow = allowedMethods(matches?.map((x) => x.route.path).filter(Boolean).join("/"));
    return options ? { status: 204, allow: optionsAllow(allow) } : refuse(allow.join(", "));
  }
  const leaf = routes[matches?.at(-1)?.route.id ?? ""]?.module as { loader?: { allow?: unknown }; action?: { allow?: unknown } } | undefined;
  const allow = [leaf?.loader?.allow, leaf?.action?.allow].find((a): a is string => typeof a === "string");
  if (!allow) return { status: 404, detail: "No API route at this path." };
  return options ? { status: 204, allow: optionsAllow(allow) } : refuse(allow);
}

/**
 * Outside /api/, a method React Router takes that the table refuses (PUT, PATCH or DELETE anywhere, a POST to a page or
 * file without an action): the root middleware's own 405 (methodVerdict), for app/serve.mjs to answer first — after its
 * CSRF check, as the middleware — so it is the same page as its other refusals, with the app's stylesheet. Null for
 * anything else (API routes answer wrong methods themselves; GET, HEAD and OPTIONS go on; unknown methods:
 * unknownMethodAnswer). A `.data` path is matched as its page.
 */
export function pageMethodRefusal(routes: Record<string, RouteEntry | undefined>, method: string, pathname: string): { status: 405; allow: string; detail: string } | null {
  const m = method.toUpperCase();
  // GET, HEAD and OPTIONS always go on (methodVerdict): no route matching on the requests nearly every visit makes.
  if (m === "GET" || m === "HEAD" || m === "OPTIONS") return null;
  const path = pathname === "/_root.data" ? "/" : pathname.replace(/\.data$/, "");
  if (path.startsWith("/api/") || !ROUTER_METHODS.has(m)) return null;
  const { verdict, allow } = methodVerdict(m, patternOf(routes, path));
  return verdict === "refuse" ? { status: 405, allow: allow.join(", "), detail: `${m} is not taken here: use ${allow.join(" or ")}.` } : null;
}
