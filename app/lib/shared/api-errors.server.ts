import * as v from "valibot";
import { badRequest, forbidden, notFound, problem } from "./problem.server";
import { IdField } from "./forms.server";
import { renderDeep, SI_UNITS, type UnitChoice } from "./units";

const TITLES: Record<number, string> = { 409: "Conflict", 422: "Unprocessable Content" };

/**
 * Turns a thrown route `data(message, { status })` into problem+json for API routes; rethrows anything else. A refusal
 * may carry `data({ detail, ...members })`: the members (e.g. `errors`) join the problem, quantity tokens written in `units`.
 */
export function asProblem(e: unknown, units: UnitChoice = SI_UNITS): Response {
  if (e instanceof Response) return e;
  const d = e as { type?: string; data?: unknown; init?: { status?: number } | null };
  if (d?.type === "DataWithResponseInit" && d.init?.status) {
    const { detail, ...members } = typeof d.data === "string" ? { detail: d.data } : detailed(d.data) ? d.data : { detail: formMessage(d.data) };
    if (d.init.status === 404) return notFound(detail);
    if (d.init.status === 403) return forbidden(detail);
    return problem(renderDeep({ title: TITLES[d.init.status] ?? "Request refused", status: d.init.status, detail, ...members }, units));
  }
  throw e;
}

const detailed = (x: unknown): x is { detail: string } & Record<string, unknown> => !!x && typeof x === "object" && typeof (x as { detail?: unknown }).detail === "string";
/** A form reader's refusal (`{ errors: { _form } }`, readFormSafe) thrown inside an API action: its message is the detail. */
const formMessage = (x: unknown): string | undefined => {
  const m = (x as { errors?: { _form?: unknown } } | null)?.errors?._form;
  return typeof m === "string" ? m : undefined;
};

/**
 * An API read of one record by its path `:id`: a 400 naming `what` when the id is not a number, else
 * `answer(id)` as JSON, with the service's refusals (404, 403, 409…) as problem+json (tokens in `units`). The caller's guard runs first.
 */
export async function answerById(raw: string | undefined, what: string, answer: (id: number) => Promise<unknown>, units?: UnitChoice): Promise<Response> {
  const id = v.safeParse(IdField, raw);
  if (!id.success) return badRequest(`${what} id must be a number.`);
  try {
    return Response.json(await answer(id.output));
  } catch (e) {
    return asProblem(e, units);
  }
}

/**
 * An API read's query string against the parameters it takes (`one`: at most once each; `many`: any number of times):
 * a 400 problem naming the first parameter it does not take, or a single-valued one given more than once; else null.
 * Ignored, they would be answered as if not asked: `?units=us` in SI, `?Page=2` with the first page, `?page=1&page=3`
 * with one of them. Keys are matched as written (case matters). `_`, the usual cache-buster a client appends
 * (`?_=1733230000000`), is taken by every read and ignored, as its sender means it (common practice).
 */
/** The cache-busting parameter every API read takes and ignores. */
export const CACHE_BUSTER = "_";

export function queryProblem(url: URL | string, takes: { one?: readonly string[]; many?: readonly string[] } = {}): Response | null {
  const u = typeof url === "string" ? new URL(url) : url;
  const one = takes.one ?? [];
  const many = takes.many ?? [];
  const all = [...one, ...many];
  const seen = new Set<string>();
  for (const key of u.searchParams.keys()) {
    if (key === CACHE_BUSTER) continue;
    const name = JSON.stringify(key.slice(0, 40));
    if (!all.includes(key)) {
      const what = all.length ? `this address takes ${all.join(", ")}` : "this address takes no query parameters";
      return badRequest(`Unknown query parameter ${name}: ${what}. Answers are in SI units (see /api).`);
    }
    if (one.includes(key) && seen.has(key)) return badRequest(`The query parameter ${name} is given more than once: give it once.`);
    seen.add(key);
  }
  return null;
}
