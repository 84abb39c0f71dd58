// The HTTP methods each route outside /api/ takes, answered by the root middleware (app/root.tsx)
// before any loader or action runs. React Router runs a route's action on every method but GET and
// HEAD (PUT, PATCH and DELETE as if they were POST), and answers a POST to a route without an action,
// OPTIONS and the WebDAV-style rest with a 405 it logs with a stack. A plain HTML form can only GET or
// POST, and nothing of ours sends anything else to these routes. API routes (/api/…) answer wrong
// methods themselves (methodNotAllowed in problem.server.ts, app/test/methods.test.ts).
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
  "libraries/:id/trace",
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
 * "options" (204 with Allow) or "refuse" (405 with Allow), never running the route's action.
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

type RouteEntry = { id: string; parentId?: string; path?: string; index?: boolean; caseSensitive?: boolean };
type Tree = { id: string; path?: string; index?: boolean; caseSensitive?: boolean; children?: Tree[] };

/**
 * React Router's pattern for a path (the paths of its matched routes joined), from the build's route
 * manifest: for the 405s React Router answers before any middleware runs (OPTIONS on a page,
 * PROPFIND and the like), whose Allow app/entry.server.tsx adds from this table.
 */
export function patternOf(routes: Record<string, RouteEntry | undefined>, pathname: string): string | undefined {
  const all = Object.values(routes).filter((r): r is RouteEntry => Boolean(r));
  const tree = (parentId: string | undefined): Tree[] =>
    all.filter((r) => r.parentId === parentId).map((r) => ({ id: r.id, path: r.path, index: r.index, caseSensitive: r.caseSensitive, ...(r.index ? {} : { children: tree(r.id) }) }) as Tree);
  const matches = matchRoutes(tree(undefined) as Parameters<typeof matchRoutes>[0], pathname);
  return matches ? matches.map((m) => m.route.path).filter(Boolean).join("/") : undefined;
}
