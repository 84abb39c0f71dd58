// The enumerations the schema's columns need (roles, visibilities, plans). The app reads them
// through app/lib/shared/constants.ts; the database layer imports nothing of the app.
export const ROLES = ["admin", "engineer", "distributor", "contractor", "viewer"] as const;
export type Role = (typeof ROLES)[number];

export const VISIBILITIES = ["private", "workspace", "shared"] as const;
export type Visibility = (typeof VISIBILITIES)[number];

/** Workspace plans: the free one, and the paid one that opens every shared library. */
export const PLANS = ["free", "network"] as const;
export type Plan = (typeof PLANS)[number];

/**
 * A project share's state (project_shares.state): offered and waiting for the receiving workspace's admins, accepted by
 * them (only then are the project's selections open to that workspace for field checks), or declined by them (final:
 * offering the project again makes a new share).
 */
export const SHARE_STATES = ["pending", "accepted", "declined"] as const;
export type ShareState = (typeof SHARE_STATES)[number];
