// What every domain uses, public face for loaders, actions and scripts (server only: it re-exports
// `.server` modules; browser code imports the pure files by path: `csv`, `constants`). Input reading
// (forms.server), the one reader of numbers typed into forms (decimal), the one CSV writer (csv), the user's units per
// quantity (units) and number/date formatting (format), settings (env.server), problem+json (problem.server,
// api-errors.server), rate limits, health, the lists the schema shares (constants). `encode-document.server`
// (a whole page compressed at once: inline up to 256 KB, on the thread pool past that) is app/entry.server.tsx's alone. `body-limits.mjs`
// is read by `app/serve.mjs` too and is imported by path; so are `methods` (the root middleware's method table) and
// `client-address` (also read by vite.config.ts).
export * from "./forms.server";
export * from "./csv";
export * from "./env.server";
export * from "./problem.server";
export * from "./api-errors.server";
export * from "./ratelimit.server";
export * from "./health.server";
export * from "./constants";
export * from "./units";
export * from "./format";
export * from "./decimal";
