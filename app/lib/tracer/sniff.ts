// What a datasheet picture is, from its first bytes (the client's claim and the file name are not
// trusted). PDF: "%PDF-" (ISO 32000-1 §7.5.2); PNG: the 8-byte signature (RFC 2083 §3.1); JPEG:
// FF D8 FF (SOI marker, ITU T.81 Annex B). Pure: also used by the page before sending.
export type PictureType = "application/pdf" | "image/png" | "image/jpeg";

export function sniffPicture(bytes: Uint8Array): PictureType | null {
  const b = bytes;
  if (b.length >= 5 && [0x25, 0x50, 0x44, 0x46, 0x2d].every((x, i) => b[i] === x)) return "application/pdf";
  if (b.length >= 8 && [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a].every((x, i) => b[i] === x)) return "image/png";
  if (b.length >= 3 && b[0] === 0xff && b[1] === 0xd8 && b[2] === 0xff) return "image/jpeg";
  return null;
}

/** The source line's room (`uploads.source`, VARCHAR(300)). */
export const SOURCE_MAX = 300;

/**
 * "traced from <file>, page N" (N only for a PDF): the source line kept with the upload and the revision;
 * with the page's `note` after "; " (the peak not traced: peak.ts `peakNote`), control characters made
 * spaces, cut with "…" where the line would pass `SOURCE_MAX`.
 */
export function tracedSource(filename: string, type: string, page: number | null, note = ""): string {
  const name = filename.replace(/[\r\n\t]/g, " ").slice(0, 200);
  const base = type === "application/pdf" && page ? `traced from ${name}, page ${page}` : `traced from ${name}`;
  // eslint-disable-next-line no-control-regex -- control characters are exactly what is replaced
  const n = note.replace(/[\u0000-\u001f\u007f]+/g, " ").trim();
  if (!n) return base;
  const room = SOURCE_MAX - base.length - 2;
  return `${base}; ${n.length <= room ? n : `${n.slice(0, room - 1).trimEnd()}…`}`;
}

export const TRACE_CAUTION = "Traced data is approximate: check it against the datasheet before relying on a selection.";

/**
 * Whether a library revision's curves were traced, and from what: its upload's source line while the upload is linked
 * (an upload with no source was not traced), else — the upload no longer linked — what the revision's note records
 * (`importUpload` writes "<source>. <TRACE_CAUTION> <the user's note>"). Null when not traced. The caution is the tracer's own.
 * @param note the revision's note as stored
 * @param upload the revision's upload (its source), or null when the revision links none any more
 */
export function tracedOrigin(note: string, upload: { source: string | null } | null): { source: string; caution: string } | null {
  if (upload) return upload.source ? { source: upload.source, caution: TRACE_CAUTION } : null;
  const at = note.indexOf(`. ${TRACE_CAUTION}`);
  return at > 0 ? { source: note.slice(0, at), caution: TRACE_CAUTION } : null;
}
