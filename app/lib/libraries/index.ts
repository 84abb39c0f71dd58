// Pump libraries, public face for loaders, actions and scripts (server only: it re-exports
// `.server` modules; browser code imports the pure files by path, e.g. `./plans`, `./csv-export`).
// Libraries and revisions (libraries.server), the plan gate (plans), uploads kept byte for byte
// (uploads.server), the analysis off the main thread (upload-analysis*), imports (import-*),
// models (models.server), our CSV export (csv-export).
export type { Viewer } from "../auth/viewer.server";
export * from "./plans";
export * from "./libraries.server";
export * from "./uploads.server";
export * from "./models.server";
export * from "./csv-export";
