import * as v from "valibot";
import { data } from "react-router";
import { parseStrictJson } from "./strict-json";

export type FieldErrors = Record<string, string>;

// ── One way to read what a request brings: ids, query strings, bodies ──────────────────────────
// Page routes let the thrown data() become the error page (404/400); API routes turn it into
// problem+json with asProblem() (app/lib/api-errors.server.ts). Nothing here ever becomes a 500.

/** A path or form id: 1–15 digits (safe integer), else null. */
export function parseId(raw: unknown): number | null {
  if (typeof raw !== "string" || !/^\d{1,15}$/.test(raw)) return null;
  return Number(raw);
}

/** The id in a route path (`params.id`): anything that is not a plain number is a page that does not exist (404). */
export function readId(raw: string | undefined): number {
  const id = parseId(raw);
  if (id === null) throw data("Nothing lives at this address.", { status: 404 });
  return id;
}

/** An id field of a form body: a bad one is a 400. */
export function formId(form: FormData, key: string): number {
  const id = parseId(form.get(key));
  if (id === null) throw data({ errors: { [key]: "Bad id." } }, { status: 400 });
  return id;
}

// eslint-disable-next-line no-control-regex -- control characters are exactly what is dropped
const cleanQueryValue = (x: string, max: number) => x.replace(/[\u0000-\u001f\u007f]/g, "").trim().slice(0, max);

/**
 * The query string, read one way:
 *  - `readQuery(url, key, max?)`: one value, trimmed and capped (long or control-character values
 *    never reach a service);
 *  - `readQuery(url, schema, { many })`: every key as its first value (cleaned and capped the same
 *    way; keys listed in `many` as all their values), validated by a valibot object schema. A value
 *    the schema refuses is a 400 — give a field `v.fallback(…)` (QueryText, QueryFlag, QueryId) to
 *    keep a default instead, as pages with filters do.
 */
export function readQuery(url: URL | string, key: string, max?: number): string;
export function readQuery<S extends v.GenericSchema>(url: URL | string, schema: S, opts?: { many?: string[]; max?: number }): v.InferOutput<S>;
export function readQuery(url: URL | string, keyOrSchema: string | v.GenericSchema, opts: number | { many?: string[]; max?: number } = {}): unknown {
  const u = typeof url === "string" ? new URL(url) : url;
  if (typeof keyOrSchema === "string") return cleanQueryValue(u.searchParams.get(keyOrSchema) ?? "", typeof opts === "number" ? opts : 200);
  const o = typeof opts === "number" ? {} : opts;
  const max = o.max ?? 200;
  const raw: Record<string, string | string[]> = {};
  for (const k of new Set(u.searchParams.keys())) {
    raw[k] = o.many?.includes(k) ? u.searchParams.getAll(k).slice(0, 20).map((x) => cleanQueryValue(x, max)) : cleanQueryValue(u.searchParams.get(k) ?? "", max);
  }
  for (const k of o.many ?? []) raw[k] ??= [];
  const r = v.safeParse(keyOrSchema, raw);
  if (!r.success) throw data(`The query string is not valid: ${r.issues.map((i) => i.message).join("; ")}.`, { status: 400 });
  return r.output;
}

/** Query fields that fall back instead of refusing (pages keep working with odd links). */
export const QueryText = (max = 200) => v.fallback(v.pipe(v.optional(v.string(), ""), v.transform((x) => x.slice(0, max))), "");
/** "1" is true; anything else (or nothing) false. */
export const QueryFlag = v.fallback(v.pipe(v.optional(v.string(), ""), v.transform((x) => x === "1")), false);
/** A positive id, else null. */
export const QueryId = v.fallback(v.pipe(v.optional(v.string(), ""), v.transform((x) => parseId(x)), v.transform((x) => (x ? x : null))), null);

/**
 * The request body as FormData (urlencoded or multipart); a malformed body is a 400, never a 500. An urlencoded body is
 * read strictly: bytes or percent escapes that are not UTF-8, or a broken escape ("%zz"), are a 400 — the lenient reading
 * (`request.formData()`) would store U+FFFD in their place, a name nobody typed (browsers always send valid UTF-8). A
 * multipart body's text fields and part headers likewise (a file's content is its own bytes).
 */
export async function readFormSafe(request: Request): Promise<FormData> {
  const contentType = request.headers.get("content-type") ?? "";
  const type = contentType.split(";")[0].trim().toLowerCase();
  if (type === "application/x-www-form-urlencoded") return readUrlencoded(request);
  if (type === "multipart/form-data") return readMultipart(request, contentType);
  try {
    return await request.formData();
  } catch {
    throw data({ errors: { _form: "The form could not be read." } }, { status: 400 });
  }
}

/** A body whose bytes could not be read to the end (app/serve.mjs cut it past its limit and answered 413): nothing of it is used. */
const UNREADABLE = "The form could not be read to its end: send it again from the page.";

/**
 * A multipart body (RFC 7578): its text fields and every part's headers must be UTF-8 (the lenient reading stored U+FFFD
 * in their place); a file part's content is the file's own bytes, read by whoever takes the file.
 */
async function readMultipart(request: Request, contentType: string): Promise<FormData> {
  let buffer: ArrayBuffer;
  try {
    buffer = await request.arrayBuffer();
  } catch {
    throw data({ errors: { _form: UNREADABLE } }, { status: 400 });
  }
  const body = checkedMultipart(buffer, contentType);
  try {
    return await body.formData();
  } catch {
    throw data({ errors: { _form: "The form could not be read." } }, { status: 400 });
  }
}

/**
 * The body, checked, as a Response to parse. Not an async function: the bytes read are held by nothing once it returns (the
 * Response keeps its own copy), so a large upload is in memory twice while parsed, as with `request.formData()`, not three times.
 */
function checkedMultipart(buffer: ArrayBuffer, contentType: string): Response {
  const m = /;\s*boundary=(?:"([^"]+)"|([^;\s]+))/i.exec(contentType);
  if (m && !multipartTextIsUtf8(new Uint8Array(buffer), m[1] ?? m[2])) throw data({ errors: { _form: NOT_UTF8 } }, { status: 400 });
  return new Response(buffer, { headers: { "content-type": contentType } });
}

/** Whether each part's headers, and each part without a filename, are UTF-8 (parts split at CRLF "--" boundary). */
function multipartTextIsUtf8(bytes: Uint8Array, boundary: string): boolean {
  const body = Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const delimiter = Buffer.from(`\r\n--${boundary}`);
  const strict = new TextDecoder("utf-8", { fatal: true });
  const utf8 = (b: Uint8Array) => {
    try {
      strict.decode(b);
      return true;
    } catch {
      return false;
    }
  };
  // The first delimiter may open the body without the CRLF before it.
  const first = body.subarray(0, delimiter.length - 2).equals(delimiter.subarray(2)) ? 0 : body.indexOf(delimiter);
  if (first < 0) return true;
  let at = first === 0 ? delimiter.length - 2 : first + delimiter.length;
  for (;;) {
    const next = body.indexOf(delimiter, at + 1);
    if (next < 0) break; // the close delimiter ("--" after the last boundary) or a body cut short: the parser judges
    const part = body.subarray(at, next);
    const headEnd = part.indexOf("\r\n\r\n");
    if (headEnd >= 0) {
      const head = part.subarray(0, headEnd);
      if (!utf8(head)) return false;
      if (!/filename\*?=/i.test(head.toString("utf8")) && !utf8(part.subarray(headEnd + 4))) return false;
    }
    at = next + delimiter.length;
  }
  return true;
}

const NOT_UTF8 = "The form is not valid UTF-8 (a byte or percent escape that is not UTF-8, or a broken escape): send it again from the page.";

async function readUrlencoded(request: Request): Promise<FormData> {
  let text: string;
  try {
    text = new TextDecoder("utf-8", { fatal: true }).decode(await request.arrayBuffer());
  } catch {
    throw data({ errors: { _form: NOT_UTF8 } }, { status: 400 });
  }
  const form = new FormData();
  const decode = (x: string) => decodeURIComponent(x.replaceAll("+", " ")); // throws URIError on "%zz" and on escapes that are not UTF-8
  for (const pair of text.split("&")) {
    if (!pair) continue;
    const at = pair.indexOf("=");
    try {
      form.append(decode(at < 0 ? pair : pair.slice(0, at)), decode(at < 0 ? "" : pair.slice(at + 1)));
    } catch {
      throw data({ errors: { _form: NOT_UTF8 } }, { status: 400 });
    }
  }
  return form;
}

/**
 * The request body as JSON, read strictly: bytes that are not UTF-8 are refused (`request.json()` would put U+FFFD in
 * their place, text nobody sent), as is an empty body or one that is not one JSON text. One byte-order mark before it is
 * taken (RFC 8259 §8.1: a parser MAY ignore it), as the calculators take it; a second is not JSON. A name given twice in
 * one object is refused (`parseStrictJson`, strict-json.ts), as the calculators refuse it. `problem`: why not,
 * for the route's refusal.
 */
export async function readJsonBody(request: Request): Promise<{ ok: true; value: unknown } | { ok: false; problem: string }> {
  let bytes: ArrayBuffer;
  try {
    bytes = await request.arrayBuffer();
  } catch {
    return { ok: false, problem: "the body could not be read to its end" }; // cut by app/serve.mjs past its limit (413 sent)
  }
  let text: string;
  try {
    text = new TextDecoder("utf-8", { fatal: true }).decode(bytes);
  } catch {
    return { ok: false, problem: "the body is not valid UTF-8" };
  }
  if (text.trim() === "") return { ok: false, problem: "the body is empty" };
  const json = parseStrictJson(text); // a name twice in one object refused too (JSON.parse keeps the last)
  return json.ok ? json : { ok: false, problem: `the body ${json.problem}` };
}

/** Reads a form body and validates it with a valibot object schema. Oversized bodies are refused upstream (middleware). */
export async function readForm<S extends v.GenericSchema>(
  request: Request,
  schema: S,
): Promise<{ ok: true; value: v.InferOutput<S>; form: FormData } | { ok: false; errors: FieldErrors; form: FormData }> {
  const form = await readFormSafe(request);
  const obj: Record<string, unknown> = {};
  for (const [k, val] of form.entries()) if (typeof val === "string") obj[k] = val;
  const r = v.safeParse(schema, obj);
  if (r.success) return { ok: true, value: r.output, form };
  const errors: FieldErrors = {};
  for (const issue of r.issues) {
    const key = issue.path?.map((p) => String(p.key)).join(".") || "_form";
    errors[key] ??= issue.message;
  }
  return { ok: false, errors, form };
}

export const invalid = (errors: FieldErrors, status = 400) => data({ errors }, { status });

export const Email = v.pipe(v.string("Enter an e-mail address."), v.trim(), v.maxLength(254, "That address is too long."), v.email("Enter a valid e-mail address."));
export const NewPassword = v.pipe(
  v.string("Choose a password."),
  v.minLength(10, "Use at least 10 characters."),
  v.maxLength(200, "Use at most 200 characters."),
);
export const AnyPassword = v.pipe(v.string("Enter your password."), v.minLength(1, "Enter your password."), v.maxLength(200, "Password too long."));
export const Name = (label: string, max = 120) =>
  v.pipe(v.string(`Enter ${label}.`), v.trim(), v.minLength(1, `Enter ${label}.`), v.maxLength(max, `Keep ${label} under ${max} characters.`));
/** Optional free text (a description, a site): trimmed, at most `max` characters. */
export const FreeText = (what: string, max: number) => v.pipe(v.string(), v.trim(), v.maxLength(max, `Keep the ${what} under ${max} characters.`));
export const IdField = v.pipe(v.string(), v.regex(/^\d{1,15}$/, "Bad id."), v.transform(Number));
/**
 * The workspace a page showed, sent back by each of its forms (`PageWorkspaceField` in components/forms.tsx);
 * the action compares it with the session's workspace (`staleWorkspacePage` in auth/guards.server.ts).
 */
export const PageWorkspaceId = v.pipe(
  v.optional(v.string(), ""), // missing (a page from before the field) reads as blank: the message below, not valibot's
  v.regex(/^\d{1,15}$/, "This form came from an older page: reload the page and try again."),
  v.transform(Number),
);

/**
 * Only local paths may be returned to after sign-in (no open redirect). Browsers drop tabs and
 * newlines and read a backslash as a slash, so any control character, whitespace or backslash is
 * refused outright, and the result is re-read as a URL that must stay on our origin.
 */
export function safeNext(next: string | null | undefined, fallback = "/"): string {
  // eslint-disable-next-line no-control-regex -- control characters are exactly what is refused
  if (!next || next.length > 2000 || !next.startsWith("/") || /[\u0000-\u0020\u007f\\]/.test(next)) return fallback;
  if (next.startsWith("//")) return fallback;
  try {
    const base = "http://dutymark.invalid";
    const u = new URL(next, base);
    if (u.origin !== base) return fallback;
    return u.pathname + u.search + u.hash;
  } catch {
    return fallback;
  }
}
