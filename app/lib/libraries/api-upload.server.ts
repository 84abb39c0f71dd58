// The upload API's work (POST /api/v1/libraries/:id/upload, routes/api.v1.libraries.$id.upload.ts, which reads and checks
// the form): store the file, analyse it once (in the analysis worker for big files, never on the main thread) with the
// mapping given, else the library's saved one, else the suggestion, and answer the validation report — with import=1 also
// import the good curves as a new revision. A saved mapping that cannot be read is set aside, as on the mapping page, and
// the answer says so (`savedMappingUnreadable`, upload-analysis.ts savedMappingApiNotice).
import type { Policy } from "../import";
import type { Viewer } from "../auth/viewer.server";
import { renderDeep, type UnitChoice } from "../shared/units";
import { discardUpload, getUploadMeta, storeUpload } from "./uploads.server";
import { AnalysisFailed, analyseForImport } from "./upload-analysis.server";
import { savedMappingApiNotice } from "./upload-analysis";
import { runImport } from "./import-run.server";

export type ApiUploadRequest = { file: File; mapping?: unknown; policy?: Policy; import: boolean; note: string };

/**
 * Why nothing was imported, for the route to answer: 400 when the mapping given is not a valid one (`errors` by field),
 * 422 when the file or its mapping gives nothing to import (`members`: the report and the saved-mapping notice).
 */
export class ApiUploadRefused extends Error {
  constructor(
    public readonly status: 400 | 422,
    message: string,
    public readonly members: Record<string, unknown> = {},
  ) {
    super(message);
    this.name = "ApiUploadRefused";
  }
}

/** Stores and analyses the file, imports it when asked; the answer's JSON (201). Refusals: ApiUploadRefused, UploadRejected (a file not taken: uploads.server.ts). */
export async function uploadForApi(viewer: Viewer, libraryId: number, req: ApiUploadRequest, units: UnitChoice) {
  const uploadId = await storeUpload(viewer, libraryId, req.file);
  const { upload, lib } = await getUploadMeta(viewer, libraryId, uploadId);
  let analysis;
  try {
    analysis = await analyseForImport(upload, { mappingJson: lib.mappingJson, mapping: req.mapping, policy: req.policy, report: true, plan: req.import });
  } catch (e) {
    if (e instanceof AnalysisFailed && e.mappingRefused)
      throw new ApiUploadRefused(400, "The mapping is not valid.", { errors: e.issues.map((i) => ({ field: `mapping.${(i.path ?? []).join(".")}`, message: i.message })) });
    throw e;
  }
  const report = renderDeep({ uploadId, ...analysis.report! }, units); // curve names in SI for a token (the caller's units on our pages)
  const savedMappingUnreadable = savedMappingApiNotice(analysis.savedMappingProblems);
  if (!req.import) return { report, savedMappingUnreadable };
  try {
    if (analysis.mappingRefused) throw new ApiUploadRefused(422, `Nothing imported: ${analysis.mappingRefused}.`, { report, savedMappingUnreadable });
    if (!analysis.plan) throw new ApiUploadRefused(422, "No curve in this file passed the checks; nothing to import.", { report, savedMappingUnreadable });
    const { importId, ...revision } = await runImport({ libraryId: lib.id, uploadId, userId: viewer.userId || null, plan: analysis.plan, note: req.note });
    return { report, savedMappingUnreadable, revision: { ...revision, importId } };
  } catch (e) {
    // A rejected import keeps nothing: the stored file goes with it.
    await discardUpload(libraryId, uploadId);
    throw e;
  }
}
