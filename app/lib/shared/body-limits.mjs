// The one table of request-body limits, by path. Plain JavaScript (ESM) because app/serve.mjs runs
// under node without a build step and counts the bytes actually read against it; the root
// middleware (app/root.tsx) refuses a declared Content-Length over the same limits before any
// action reads a body. Types for the TypeScript side: body-limits.d.mts.

/**
 * A field check with its photos, both ways it is posted (the page's form to …/photos, the phone's queue to …/checks).
 * The photos a check may carry together are this less room for the form's fields (fieldchecks/photo-limits.ts).
 */
export const FIELD_CHECK_BODY_BYTES = 12 * 1024 * 1024;

/** Route classes, first match wins; anything else gets DEFAULT_BODY_LIMIT. */
export const BODY_LIMITS = Object.freeze([
  Object.freeze({ name: "upload", pattern: /\/upload$/, bytes: 25 * 1024 * 1024 }), // CSV uploads (20 MB file + multipart framing)
  Object.freeze({ name: "photos", pattern: /\/photos$/, bytes: FIELD_CHECK_BODY_BYTES }), // field-check photos
  Object.freeze({ name: "field-check-sync", pattern: /^\/field\/selections\/\d+\/checks$/, bytes: FIELD_CHECK_BODY_BYTES }), // a check queued on a phone, with its photos
  Object.freeze({ name: "stripe-webhook", pattern: /^\/api\/stripe\/webhook$/, bytes: 512 * 1024 }),
]);

/** Every other route: forms and JSON. */
export const DEFAULT_BODY_LIMIT = 1024 * 1024;

/** The limit in bytes for a request path (no query string). */
export function bodyLimitFor(pathname) {
  for (const c of BODY_LIMITS) if (c.pattern.test(pathname)) return c.bytes;
  return DEFAULT_BODY_LIMIT;
}
