// Enumerations shared by the schema (db/schema.ts), the server and the browser.
export const ROLES = ["admin", "engineer", "distributor", "contractor", "viewer"] as const;
export type Role = (typeof ROLES)[number];

export const VISIBILITIES = ["private", "workspace", "shared"] as const;
export type Visibility = (typeof VISIBILITIES)[number];

/** Workspace plans: the free one, and the paid one that opens every shared library. */
export const PLANS = ["free", "network"] as const;
export type Plan = (typeof PLANS)[number];

/** Lifetimes of e-mailed links, minutes. */
export const EMAIL_TOKEN_TTL = { verify: 48 * 60, reset: 30 } as const;
export const INVITE_TTL_DAYS = 14;
