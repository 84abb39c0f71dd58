// The photos one field check may carry, one source for the phone (checked before a check is queued, so it is
// never refused whole when sent) and the server (`readPhotos`, and the amendment's carried photos). Pure: the
// browser imports it. The total follows the body limit of both routes a check is posted to (body-limits.mjs).
import { fmtNumExact } from "~/engine/quantityText";
import { FIELD_CHECK_BODY_BYTES } from "../shared/body-limits.mjs";

const MiB = 1024 * 1024;
export const MAX_PHOTOS = 6;
/** One photo (a phone camera's JPEG is 2–5 MB; common practice). */
export const MAX_PHOTO_BYTES = 8 * MiB;
/** Kept for the form's fields and the multipart framing in the body: the fields take a few KB, the notes up to 16 KB. */
export const FORM_ROOM_BYTES = MiB / 2;
/** The photos of one check together: the body limit less the room for the fields (12 MiB − 0.5 MiB = 11.5 MiB). */
export const MAX_CHECK_PHOTO_BYTES = FIELD_CHECK_BODY_BYTES - FORM_ROOM_BYTES;

/** A limit in MB as written in the rules ("8", "11.5"); MB here is 1024 × 1024 bytes. */
const limitMb = (bytes: number) => String(Number((bytes / MiB).toFixed(2)));
/** A size beside its limit, with the decimals that keep them apart ("8.000001" beside 8, "12.0" beside 11.5). */
const sizeMb = (bytes: number, limit: number) => fmtNumExact(bytes / MiB, [limit / MiB], 1);

/** The rule in words, for the form's hint: "up to 6 photos, 8 MB each, 11.5 MB in one check". */
export function photoLimitsText(): string {
  return `up to ${MAX_PHOTOS} photos, ${limitMb(MAX_PHOTO_BYTES)} MB each, ${limitMb(MAX_CHECK_PHOTO_BYTES)} MB in one check`;
}

/**
 * The first reason these photos cannot go with one check, with its numbers, or null: too many (with those carried from
 * the version amended, which the server copies and the phone does not send), one too large, or too large together.
 */
export function photoProblem(files: readonly { name: string; size: number }[], carried = 0): string | null {
  if (files.length + carried > MAX_PHOTOS)
    return `At most ${MAX_PHOTOS} photos per check (${files.length} chosen${carried ? `, ${carried} carried from the earlier version` : ""}).`;
  for (const f of files) if (f.size > MAX_PHOTO_BYTES) return `${f.name} is ${sizeMb(f.size, MAX_PHOTO_BYTES)} MB; each photo may be at most ${limitMb(MAX_PHOTO_BYTES)} MB.`;
  const total = files.reduce((sum, f) => sum + f.size, 0);
  if (total > MAX_CHECK_PHOTO_BYTES)
    return `The photos come to ${sizeMb(total, MAX_CHECK_PHOTO_BYTES)} MB together; one check may carry at most ${limitMb(MAX_CHECK_PHOTO_BYTES)} MB. Leave some out or send smaller ones.`;
  return null;
}

/** What the phone says of a check the server refused for its size (413: the body limit), before it is sent without its photos. */
export function tooLargeText(): string {
  return `The server refused this check as too large: its photos may come to at most ${limitMb(MAX_CHECK_PHOTO_BYTES)} MB in one check, ${limitMb(MAX_PHOTO_BYTES)} MB each. Send it without the photos, or delete it.`;
}
