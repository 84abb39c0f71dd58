import * as v from "valibot";
import { badRequest, forbidden, notFound, problem } from "./problem.server";
import { IdField } from "./forms.server";

/** Turns a thrown route `data(message, { status })` into problem+json for API routes; rethrows anything else. */
export function asProblem(e: unknown): Response {
  if (e instanceof Response) return e;
  const d = e as { type?: string; data?: unknown; init?: { status?: number } | null };
  if (d?.type === "DataWithResponseInit" && d.init?.status) {
    const detail = typeof d.data === "string" ? d.data : undefined;
    if (d.init.status === 404) return notFound(detail);
    if (d.init.status === 403) return forbidden(detail);
    return problem({ title: d.init.status === 422 ? "Unprocessable Content" : "Request refused", status: d.init.status, detail });
  }
  throw e;
}

/**
 * An API read of one record by its path `:id`: a 400 naming `what` when the id is not a number, else
 * `answer(id)` as JSON, with the service's refusals (404, 403…) as problem+json. The caller's guard runs first.
 */
export async function answerById(raw: string | undefined, what: string, answer: (id: number) => Promise<unknown>): Promise<Response> {
  const id = v.safeParse(IdField, raw);
  if (!id.success) return badRequest(`${what} id must be a number.`);
  try {
    return Response.json(await answer(id.output));
  } catch (e) {
    return asProblem(e);
  }
}
