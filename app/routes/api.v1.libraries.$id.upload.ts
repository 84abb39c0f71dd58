import * as v from "valibot";
import type { Route } from "./+types/api.v1.libraries.$id.upload";
import { requireApi } from "~/lib/auth/guards.server";
import { analyseStored, getUpload, importUpload, storeUpload, UploadRejected } from "~/lib/libraries.server";
import { badRequest, problem } from "~/lib/shared/problem.server";
import { asProblem } from "~/lib/shared/api-errors.server";
import { discardUpload } from "~/lib/uploads.server";
import { IdField, readFormSafe } from "~/lib/shared/forms.server";
import { curveNameOfKey } from "~/lib/import";

// POST /api/v1/libraries/:id/upload (multipart/form-data: file; optional mapping = JSON; optional import = "1";
// optional policy = "skip-curves" (default) | "drop-points", which overrides the mapping's policy).
// Without import=1: stores the file and returns the validation report (problems named by line and column,
// the mapping used). With import=1: imports the good curves as a new revision and returns it.
export async function action({ request, params }: Route.ActionArgs) {
  const c = await requireApi(request, "library.write");
  const id = v.safeParse(IdField, params.id);
  if (!id.success) return badRequest("Library id must be a number.");
  if (!(request.headers.get("content-type") ?? "").startsWith("multipart/form-data")) {
    return problem({ title: "Unsupported Media Type", status: 415, detail: "Send multipart/form-data with a 'file' field." });
  }
  const viewer = { userId: c.userId, workspace: c.workspace, role: c.role };
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
    const uploadId = await storeUpload(viewer, id.output, file);
    const { upload, lib } = await getUpload(viewer, id.output, uploadId);
    let analysis;
    try {
      analysis = analyseStored(upload.content, lib, mapping);
      if (policy && analysis.mapping.policy !== policy) analysis = analyseStored(upload.content, lib, { ...analysis.mapping, policy });
    } catch (e) {
      if (e instanceof v.ValiError) return badRequest("The mapping is not valid.", { errors: e.issues.map((i) => ({ field: `mapping.${(i.path ?? []).map((p: { key: unknown }) => String(p.key)).join(".")}`, message: i.message })) });
      throw e;
    }
    const report = {
      uploadId,
      encoding: analysis.decoded.encoding,
      title: analysis.title,
      mapping: analysis.mapping,
      stats: analysis.result.stats,
      problems: analysis.result.problems.map((p) => ({ ...p, curve: p.curveKey ? curveNameOfKey(p.curveKey) : null })),
    };
    if (form.get("import") !== "1") return Response.json({ report }, { status: 201 });
    try {
      const revision = await importUpload(viewer, id.output, uploadId, analysis.mapping, String(form.get("note") ?? "API import"));
      return Response.json({ report, revision }, { status: 201 });
    } catch (e) {
      // A rejected import keeps nothing: the stored file goes with it.
      await discardUpload(id.output, uploadId);
      if (e instanceof v.ValiError) return problem({ title: "Unprocessable Content", status: 422, detail: `Nothing imported: ${e.message}.`, report });
      throw e;
    }
  } catch (e) {
    if (e instanceof UploadRejected) return problem({ title: "Unprocessable Content", status: 422, detail: e.message });
    return asProblem(e);
  }
}

export function loader() {
  return problem({ title: "Method Not Allowed", status: 405, detail: "Use POST with multipart/form-data." }, { Allow: "POST" });
}
