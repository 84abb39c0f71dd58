// Who is asking and what they may do: sessions and passwords, accounts (sign-up, verification, reset),
// API tokens, guards for loaders and actions, the permission map, CSRF and secrets.
export * from "./permissions";
export * from "./session.server";
export * from "./accounts.server";
export * from "./api-tokens.server";
export * from "./guards.server";
export * from "./viewer.server";
export * from "./csrf.server";
export * from "./secrets.server";
export { TOKEN_CACHE_MS, forgetTokens } from "./token-cache.server";
