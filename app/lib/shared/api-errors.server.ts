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
    const { detail, ...members } = typeof d.data === "string" ? { detail: d.data } : detailed(d.data) ? d.data : { detail: undefined };
    if (d.init.status === 404) return notFound(detail);
    if (d.init.status === 403) return forbidden(detail);
    return problem(renderDeep({ title: TITLES[d.init.status] ?? "Request refused", status: d.init.status, detail, ...members }, units));
  }
  throw e;
}

const detailed = (x: unknown): x is { detail: string } & Record<string, unknown> => !!x && typeof x === "object" && typeof (x as { detail?: unknown }).detail === "string";

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
