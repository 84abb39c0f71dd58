// One request's memo. React Router hands the root middleware, the root loader and the route's loader
// each a Request object of its own, so a WeakMap keyed on the Request shares nothing between them
// (a signed-in page read the session three times and the workspace list twice). The root middleware
// opens this scope around the whole request instead; lookups made inside it share one answer.
// Only reads share: GET and HEAD. A POST's action may sign in or out or change the workspace before
// its loaders run, so there every call makes its own.
import { AsyncLocalStorage } from "node:async_hooks";

const scope = new AsyncLocalStorage<{ method: string; memo: Map<string, unknown> }>();

/** Runs `run` (the rest of the request) inside a fresh scope for `request`. */
export function requestScope<T>(request: Request, run: () => T): T {
  return scope.run({ method: request.method, memo: new Map() }, run);
}

/** `make()` once per request scope and key on reads; outside a scope, or on a write, each call makes its own. */
export function oncePerRequest<T>(key: string, make: () => T): T {
  if (!readsShared()) return make();
  const s = scope.getStore()!;
  if (s.memo.has(key)) return s.memo.get(key) as T;
  const made = make();
  s.memo.set(key, made);
  return made;
}

/** True inside a scope whose lookups are shared (a GET or HEAD): what `oncePerRequest` makes now is reused. */
export function readsShared(): boolean {
  const s = scope.getStore();
  return !!s && (s.method === "GET" || s.method === "HEAD");
}
