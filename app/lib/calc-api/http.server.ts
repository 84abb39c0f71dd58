// Calc API, part 3: the HTTP edge the route modules delegate to — method, credentials or the
// per-address rate limit, content type, body size, JSON, then the calculation.
import { clientIp } from "../auth/session.server";
import { requireApi } from "../auth/guards.server";
import { notJsonBody, problem, refuseMethod } from "../shared/problem.server";
import { hitRateLimit } from "../shared/ratelimit.server";
import { runCalc } from "./calculations";
import { ANON_RATE_LIMIT, BODY_FIELD, CALC_LIMITS, MAX_ERRORS, type CalcEndpoint, type CalcOutcome, type FieldError } from "./schemas";
import { renderDeep, SI_UNITS } from "../shared/units";
import { parseStrictJson } from "../shared/strict-json";

// ───────────────────────────── HTTP edge ─────────────────────────────

export function validationProblem(errors: FieldError[], headers?: HeadersInit): Response {
  const shown = errors.slice(0, MAX_ERRORS);
  const first = shown[0];
  const more = errors.length > shown.length ? ` (${errors.length - shown.length} more not listed)` : "";
  const detail = first
    ? `${first.field}: ${first.message}${errors.length > 1 ? ` (and ${errors.length - 1} more)` : ""}${more}`
    : "The request is not valid.";
  return problem({ title: "Bad Request", status: 400, detail, errors: shown }, headers);
}

/** GET, HEAD and any method other than POST: a calculator route's loader, and its action's answer to the rest. */
export const calcMethodNotAllowed = refuseMethod("POST", (method) => `${method} is not supported here: POST a JSON body (see /api).`);

type BodyRead = { ok: true; value: unknown } | { ok: false; response: Response };

/** Reads at most `limit` bytes of UTF-8 JSON, each name once per object (strict-json.ts). */
async function readJson(request: Request, limit: number, headers: Headers): Promise<BodyRead> {
  const tooLarge = () => ({
    ok: false as const,
    response: problem({ title: "Content Too Large", status: 413, detail: `The body is larger than ${limit} bytes.` }, headers),
  });
  const bad = (message: string) => ({ ok: false as const, response: validationProblem([{ field: BODY_FIELD, message }], headers) });
  const declared = Number(request.headers.get("content-length") ?? "");
  if (Number.isFinite(declared) && declared > limit) return tooLarge();
  const chunks: Uint8Array[] = [];
  let size = 0;
  if (request.body) {
    const reader = request.body.getReader();
    for (;;) {
      let next: ReadableStreamReadResult<Uint8Array>;
      try {
        next = await reader.read();
      } catch {
        return bad("could not be read to its end"); // cut by app/serve.mjs past its limit, which has answered 413
      }
      const { done, value } = next;
      if (done) break;
      size += value.byteLength;
      if (size > limit) {
        await reader.cancel().catch(() => {});
        return tooLarge();
      }
      chunks.push(value);
    }
  }
  const bytes = new Uint8Array(size);
  let at = 0;
  for (const c of chunks) {
    bytes.set(c, at);
    at += c.byteLength;
  }
  let text: string;
  try {
    text = new TextDecoder("utf-8", { fatal: true }).decode(bytes);
  } catch {
    return bad("is not valid UTF-8");
  }
  if (text.trim() === "") return bad("is empty: send a JSON object");
  const json = parseStrictJson(text); // a name twice in one object refused too (JSON.parse keeps the last)
  return json.ok ? json : bad(json.problem);
}


/**
 * The whole POST handling of one calc endpoint. A Bearer token is checked (invalid → 401, never
 * an anonymous fallback) and is not rate-limited; without an Authorization header the caller is
 * anonymous and counted per client address (429 with Retry-After past the limit).
 * @param opts.now clock for the rate-limit window (tests)
 */
export async function calcAction(request: Request, endpoint: CalcEndpoint, opts: { now?: Date } = {}): Promise<Response> {
  if (request.method.toUpperCase() !== "POST") return calcMethodNotAllowed({ request });
  const headers = new Headers({ "Cache-Control": "no-store" });
  if (request.headers.has("authorization")) {
    try {
      await requireApi(request, "calc.use");
    } catch (e) {
      if (e instanceof Response) return e;
      throw e;
    }
  } else {
    const address = clientIp(request) || "unknown";
    let rl;
    try {
      rl = await hitRateLimit(`calc:${address}`, ANON_RATE_LIMIT, opts.now ?? new Date());
    } catch (e) {
      console.error("calc rate limit unavailable", e);
      return problem(
        { title: "Service Unavailable", status: 503, detail: "The request counter is not answering; try again shortly, or use an API token." },
        { "Retry-After": "5" },
      );
    }
    headers.set("RateLimit-Limit", String(rl.limit));
    headers.set("RateLimit-Remaining", String(rl.remaining));
    headers.set("RateLimit-Reset", String(rl.resetSeconds));
    if (!rl.allowed) {
      headers.set("Retry-After", String(rl.resetSeconds));
      return problem(
        {
          title: "Too Many Requests",
          status: 429,
          detail: `Anonymous use is limited to ${rl.limit} requests per ${ANON_RATE_LIMIT.windowSeconds} s per address. Try again in ${rl.resetSeconds} s, or send an API token (Authorization: Bearer …) for unlimited use.`,
          retry_after_s: rl.resetSeconds,
        },
        headers,
      );
    }
  }
  const notJson = notJsonBody(request, [{ field: BODY_FIELD, message: "Content-Type must be application/json" }], headers);
  if (notJson) return notJson;
  const body = await readJson(request, CALC_LIMITS.bodyBytes, headers);
  if (!body.ok) return body.response;
  let out: CalcOutcome<unknown>;
  try {
    out = runCalc(endpoint, body.value);
  } catch (e) {
    console.error(`calc ${endpoint} failed`, e);
    return problem({ title: "Internal Server Error", status: 500, detail: "The calculation failed unexpectedly; this is our fault." }, headers);
  }
  // The calculators answer in SI (field names carry the unit): quantity tokens in engine messages are written out in SI.
  if (!out.ok) return validationProblem(renderDeep(out.errors, SI_UNITS), headers);
  headers.set("Content-Type", "application/json");
  return new Response(JSON.stringify(renderDeep(out.body, SI_UNITS)), { status: 200, headers });
}
