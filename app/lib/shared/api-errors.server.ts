import { forbidden, notFound, problem } from "./problem.server";

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
