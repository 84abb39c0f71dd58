// Enumerations shared by the server and the browser. The lists the schema needs live in db/enums.ts.
export { ROLES, VISIBILITIES, PLANS, SHARE_STATES, type Role, type Visibility, type Plan, type ShareState } from "@db/enums";

/** Lifetimes of e-mailed links, minutes. */
export const EMAIL_TOKEN_TTL = { verify: 48 * 60, reset: 30 } as const;
export const INVITE_TTL_DAYS = 14;
