import * as v from "valibot";
import type { Route } from "./+types/api.v1.libraries.$id.upload";
import { requireApi } from "~/lib/auth/guards.server";
import { viewerOfApi } from "~/lib/auth/viewer.server";
import { UploadRejected } from "~/lib/libraries";
import { ApiUploadRefused, uploadForApi } from "~/lib/libraries/api-upload.server";
import { badRequest, methodNotAllowed, problem, refuseMethod } from "~/lib/shared/problem.server";
import { asProblem } from "~/lib/shared/api-errors.server";
import { IdField, readFormSafe } from "~/lib/shared/forms.server";
import { parseStrictJson } from "~/lib/shared/strict-json";

// POST /api/v1/libraries/:id/upload (multipart/form-data: file; optional mapping = JSON; optional import = "1";
// optional policy = "skip-curves" (default) | "drop-points", which overrides the mapping's policy; optional note).
// Without import=1: stores the file and returns the validation report (problems named by line and column,
// the mapping used). With import=1: imports the good curves as a new revision and returns it. Either answer says
// when the library's saved mapping could not be read and was set aside (savedMappingUnreadable). The work is
// lib/libraries/api-upload.server.ts; this module reads and checks the form.
export async function action({ request, params }: Route.ActionArgs) {
  if (request.method !== "POST") return methodNotAllowed("POST"); // an action runs on any method but GET: PUT/PATCH/DELETE are not ours
  const c = await requireApi(request, "library.write");
  const id = v.safeParse(IdField, params.id);
  if (!id.success) return badRequest("Library id must be a number.");
  if (!(request.headers.get("content-type") ?? "").startsWith("multipart/form-data")) {
    return problem({ title: "Unsupported Media Type", status: 415, detail: "Send multipart/form-data with a 'file' field." });
  }
  try {
    const form = await readFormSafe(request);
    const file = form.get("file");
    if (!(file instanceof File)) return badRequest("The 'file' field is missing.", { errors: [{ field: "file", message: "required" }] });
    let mapping: unknown = undefined;
    const raw = form.get("mapping");
    if (typeof raw === "string" && raw.trim()) {
      // Strictly (strict-json.ts): a name twice in one object is refused with its JSON Pointer, as the JSON APIs refuse it.
      const json = parseStrictJson(raw);
      if (!json.ok) return badRequest(`The 'mapping' field ${json.problem}.`, { errors: [{ field: "mapping", message: json.problem }] });
      mapping = json.value;
    }
    const policy = form.get("policy");
    if (policy !== null && policy !== "skip-curves" && policy !== "drop-points")
      return badRequest("The 'policy' field must be skip-curves or drop-points.", { errors: [{ field: "policy", message: "skip-curves or drop-points" }] });
    const answer = await uploadForApi(viewerOfApi(c), id.output, { file, mapping, policy: policy ?? undefined, import: form.get("import") === "1", note: String(form.get("note") ?? "API import") }, c.units);
    return Response.json(answer, { status: 201 });
  } catch (e) {
    if (e instanceof ApiUploadRefused) return e.status === 400 ? badRequest(e.message, e.members) : problem({ title: "Unprocessable Content", status: 422, detail: e.message, ...e.members });
    if (e instanceof UploadRejected) return problem({ title: "Unprocessable Content", status: 422, detail: e.message });
    return asProblem(e);
  }
}

export const loader = refuseMethod("POST", "Use POST with multipart/form-data.");
