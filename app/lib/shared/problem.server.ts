// RFC 9457 problem details for API routes.
import { allowHeader } from "./methods";
export type Problem = { type?: string; title: string; status: number; detail?: string; [k: string]: unknown };

/** The document itself (`type` "about:blank" unless given): every problem of the API, and app/serve.mjs's own (refusal.server.ts). */
export const problemBody = (p: Problem): Problem => ({ type: p.type ?? "about:blank", ...p });

export function problem(p: Problem, headers?: HeadersInit): Response {
  const body = problemBody(p);
  const h = new Headers(headers);
  h.set("Content-Type", "application/problem+json");
  h.set("Cache-Control", "no-store");
  return new Response(JSON.stringify(body), { status: p.status, headers: h });
}

export const unauthorized = (detail = "A valid API token is required: Authorization: Bearer <token>.") =>
  problem({ title: "Unauthorized", status: 401, detail }, { "WWW-Authenticate": 'Bearer realm="dutymark"' });
export const forbidden = (detail = "This token or role may not do this.") => problem({ title: "Forbidden", status: 403, detail });
export const notFound = (detail = "No such resource in this workspace.") => problem({ title: "Not Found", status: 404, detail });
export const badRequest = (detail: string, extra?: Record<string, unknown>) =>
  problem({ title: "Bad Request", status: 400, detail, ...extra });
/**
 * The method a route does not take, with the ones it does in Allow (a resource route's own answer;
 * the root middleware's for every route outside /api/: app/lib/shared/methods.ts).
 */
export const methodNotAllowed = (allow: string | readonly string[], detail?: string) => {
  const list = typeof allow === "string" ? allow : allow.join(", ");
  return problem({ title: "Method Not Allowed", status: 405, detail: detail ?? `Use ${list} here.` }, { Allow: allowHeader(list) }); // and OPTIONS (methods.ts)
};

/** An API route's loader or action that takes no method: 405 with Allow, the methods the route takes kept on it as `allow`. */
export type MethodRefusal = ((args?: { request?: Request }) => Response) & { readonly allow: string };

/**
 * The export of an API route that refuses (`export const action = refuseMethod("GET")`: the route takes GET;
 * a POST-only route's loader: `refuseMethod("POST")`). The route's own Allow is kept on the function, so the
 * methods React Router refuses before any route runs (PROPFIND, MKCOL, TRACE…) are answered with the same
 * Allow by app/serve.mjs (unknownMethodAnswer in lib/shared/methods.ts reads it from the build's route modules): one
 * place says what an API route takes. `detail` may be written from the method asked.
 */
export function refuseMethod(allow: string | readonly string[], detail?: string | ((method: string) => string)): MethodRefusal {
  const list = typeof allow === "string" ? allow : allow.join(", ");
  const refuse = (args?: { request?: Request }) => methodNotAllowed(list, typeof detail === "function" ? detail(args?.request?.method ?? "") : detail);
  return Object.assign(refuse, { allow: list });
}

/** Whether a Content-Type names JSON (`application/json`, parameters such as charset aside). */
export function isJsonContentType(value: string | null): boolean {
  return !!value && value.split(";")[0].trim().toLowerCase() === "application/json";
}

/**
 * A JSON API's refusal of a body that is not declared JSON: 415 problem+json with `Accept-Post: application/json`
 * (RFC 9110 §15.5.16), else null. `headers` join it (the calculators' rate-limit headers).
 */
export function notJsonBody(request: Request, errors?: unknown[], headers?: HeadersInit): Response | null {
  const got = request.headers.get("content-type");
  if (isJsonContentType(got)) return null;
  const detail = `Send the body as JSON with Content-Type: application/json (got ${got ? got : "no Content-Type"}).`;
  return problem({ title: "Unsupported Media Type", status: 415, detail, ...(errors ? { errors } : {}) }, new Headers([...new Headers(headers), ["Accept-Post", "application/json"]]));
}
