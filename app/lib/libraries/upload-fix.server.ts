// Fix in the browser: corrected cells of flagged rows → a corrected copy of the upload, kept as a
// new upload beside the original (both with their SHA-256), which the mapping page then checks
// again on the server. Only members who may edit the library get here (getUpload checks it).
import { applyCellEdits, EditRefused, sniffCsv, type CellEdit, type Encoding } from "../import";
import { decodeBytes } from "../import";
import type { Viewer } from "../auth/viewer.server";
import { getUpload, insertUpload, UploadRejected, MAX_UPLOAD_BYTES } from "./uploads.server";

/** The corrected file's name: "pumps.csv" → "pumps.corrected.csv" (again: "pumps.corrected-2.csv"). */
export function correctedName(filename: string): string {
  const m = /^(.*?)(?:\.corrected(?:-(\d+))?)?(\.[^.]*)?$/i.exec(filename)!;
  const had = /\.corrected(?:-\d+)?(\.[^.]*)?$/i.test(filename);
  const n = had ? Number(m[2] ?? 1) + 1 : 0;
  return `${m[1]}.corrected${n ? `-${n}` : ""}${m[3] ?? ".csv"}`;
}

/**
 * Applies `edits` (only the cells that differ from the file are kept) to the upload's text as
 * decoded in `encoding` and stores the result (UTF-8) as a new upload. Returns its id, or null when
 * nothing changed. `extraColumns`: columns the edits may add after the header's last (the maker's
 * minimum flow editor's, min-flow-form.ts).
 */
export async function saveCorrectedUpload(viewer: Viewer, libraryId: number, uploadId: number, edits: CellEdit[], encoding?: Encoding, extraColumns = 0): Promise<number | null> {
  const { lib, upload } = await getUpload(viewer, libraryId, uploadId);
  const text = decodeBytes(upload.content, encoding).text;
  const sniff = sniffCsv(text);
  let corrected: string;
  try {
    corrected = applyCellEdits(text, sniff.delimiter, edits, sniff.headers.length + extraColumns);
  } catch (e) {
    if (e instanceof EditRefused) throw new UploadRejected(`The corrections could not be applied: ${e.message}.`);
    throw e;
  }
  const original = text.replace(/^\uFEFF/, "").replace(/\r\n?/g, "\n");
  if (corrected === original) return null;
  const bytes = Buffer.from(corrected, "utf8");
  if (bytes.length > MAX_UPLOAD_BYTES) throw new UploadRejected("The corrected file would be larger than the upload limit.");
  // A corrected copy of traced points keeps where they came from (issue 20).
  const traced = upload.source && upload.tracePictureId ? { source: upload.source, tracePictureId: upload.tracePictureId } : null;
  return insertUpload(viewer, lib.id, correctedName(upload.filename), bytes, traced);
}
