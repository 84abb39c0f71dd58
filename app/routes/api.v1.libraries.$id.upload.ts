import * as v from "valibot";
import type { Route } from "./+types/api.v1.libraries.$id.upload";
import { requireApi } from "~/lib/auth/guards.server";
import { viewerOfApi } from "~/lib/auth/viewer.server";
import { storeUpload, UploadRejected } from "~/lib/libraries";
import { AnalysisFailed, analyseForImport } from "~/lib/libraries/upload-analysis.server";
import { runImport } from "~/lib/libraries/import-run.server";
import { badRequest, methodNotAllowed, problem, refuseMethod } from "~/lib/shared/problem.server";
import { asProblem } from "~/lib/shared/api-errors.server";
import { discardUpload, getUploadMeta } from "~/lib/libraries/uploads.server";
import { IdField, readFormSafe } from "~/lib/shared/forms.server";
import { renderDeep } from "~/lib/shared/units";

class MappingRefused extends Error {}

// POST /api/v1/libraries/:id/upload (multipart/form-data: file; optional mapping = JSON; optional import = "1";
// optional policy = "skip-curves" (default) | "drop-points", which overrides the mapping's policy).
// Without import=1: stores the file and returns the validation report (problems named by line and column,
// the mapping used). With import=1: imports the good curves as a new revision and returns it.
export async function action({ request, params }: Route.ActionArgs) {
  if (request.method !== "POST") return methodNotAllowed("POST"); // an action runs on any method but GET: PUT/PATCH/DELETE are not ours
  const c = await requireApi(request, "library.write");
  const id = v.safeParse(IdField, params.id);
  if (!id.success) return badRequest("Library id must be a number.");
  if (!(request.headers.get("content-type") ?? "").startsWith("multipart/form-data")) {
    return problem({ title: "Unsupported Media Type", status: 415, detail: "Send multipart/form-data with a 'file' field." });
  }
  const viewer = viewerOfApi(c);
  try {
    const form = await readFormSafe(request);
    const file = form.get("file");
    if (!(file instanceof File)) return badRequest("The 'file' field is missing.", { errors: [{ field: "file", message: "required" }] });
    let mapping: unknown = undefined;
    const raw = form.get("mapping");
    if (typeof raw === "string" && raw.trim()) {
      try {
        mapping = JSON.parse(raw);
      } catch {
        return badRequest("The 'mapping' field is not JSON.", { errors: [{ field: "mapping", message: "not JSON" }] });
      }
    }
    const policy = form.get("policy");
    if (policy !== null && policy !== "skip-curves" && policy !== "drop-points")
      return badRequest("The 'policy' field must be skip-curves or drop-points.", { errors: [{ field: "policy", message: "skip-curves or drop-points" }] });
    const wantsImport = form.get("import") === "1";
    const uploadId = await storeUpload(viewer, id.output, file);
    // Decoding, parsing and validating happen once, in the analysis worker for big files (never on
    // the main thread): the report and, with import=1, the plan the import writes.
    const { upload, lib } = await getUploadMeta(viewer, id.output, uploadId);
    let analysis;
    try {
      analysis = await analyseForImport(upload, { mappingJson: lib.mappingJson, mapping, policy: policy ?? undefined, report: true, plan: wantsImport });
    } catch (e) {
      if (e instanceof AnalysisFailed && e.mappingRefused) return badRequest("The mapping is not valid.", { errors: e.issues.map((i) => ({ field: `mapping.${(i.path ?? []).join(".")}`, message: i.message })) });
      throw e;
    }
    const report = renderDeep({ uploadId, ...analysis.report! }, c.units); // curve names in SI for a token (the caller's units on our pages)
    if (!wantsImport) return Response.json({ report }, { status: 201 });
    try {
      if (analysis.mappingRefused) throw new MappingRefused(analysis.mappingRefused);
      if (!analysis.plan) throw new UploadRejected("No curve in this file passed the checks; nothing to import.");
      const { importId, ...revision } = await runImport({ libraryId: lib.id, uploadId, userId: viewer.userId || null, plan: analysis.plan, note: String(form.get("note") ?? "API import") });
      return Response.json({ report, revision: { ...revision, importId } }, { status: 201 });
    } catch (e) {
      // A rejected import keeps nothing: the stored file goes with it.
      await discardUpload(id.output, uploadId);
      if (e instanceof MappingRefused) return problem({ title: "Unprocessable Content", status: 422, detail: `Nothing imported: ${e.message}.`, report });
      throw e;
    }
  } catch (e) {
    if (e instanceof UploadRejected) return problem({ title: "Unprocessable Content", status: 422, detail: e.message });
    return asProblem(e);
  }
}

export const loader = refuseMethod("POST", "Use POST with multipart/form-data.");
