// Types of body-limits.mjs (the table itself is plain JavaScript so app/serve.mjs can import it).
export interface BodyLimitClass {
  readonly name: "upload" | "photos" | "field-check-sync" | "stripe-webhook";
  readonly pattern: RegExp;
  readonly bytes: number;
}
export declare const FIELD_CHECK_BODY_BYTES: number;
export declare const BODY_LIMITS: readonly BodyLimitClass[];
export declare const DEFAULT_BODY_LIMIT: number;
export declare function bodyLimitFor(pathname: string): number;
