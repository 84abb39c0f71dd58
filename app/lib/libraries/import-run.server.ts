// An import from start to end: its `imports` row, the write (import-write.server.ts) with progress per
// batch, and the row's end state. `runImport` waits for it; `startImport` returns at once and lets it
// run in the background of this process (the mapping page does so for big files).
import type { ImportPlan } from "./import-plan";
import { writeImport, type ImportResult } from "./import-write.server";
import { failImportRow, finishImportRow, progressWriter, startImportRow } from "./import-progress.server";

/** From the mapping page, imports of at least this many points run in the background (a few seconds or more). */
export const BACKGROUND_IMPORT_POINTS = 20_000;

export type ImportArgs = { libraryId: number; uploadId: number; userId: string | null; plan: ImportPlan; note: string };
type Hooks = { beforeCommit?: () => Promise<void> };

async function run(importId: number, args: ImportArgs, hooks: Hooks): Promise<ImportResult> {
  const progress = progressWriter(importId);
  try {
    const r = await writeImport(args, { ...hooks, progress: progress.sink });
    await progress.flush();
    await finishImportRow(importId, r);
    return r;
  } catch (e) {
    await progress.flush();
    await failImportRow(importId, e instanceof Error ? e.message : String(e)).catch(() => {});
    throw e;
  }
}

/** Runs the import and waits for it; its row ends done or failed. */
export async function runImport(args: ImportArgs, hooks: Hooks = {}): Promise<ImportResult & { importId: number }> {
  const importId = await startImportRow({ ...args, pointsTotal: args.plan.points });
  return { ...(await run(importId, args, hooks)), importId };
}

/** Starts the import and returns its row's id at once; the outcome is in the row (never an unhandled rejection). */
export async function startImport(args: ImportArgs): Promise<number> {
  const importId = await startImportRow({ ...args, pointsTotal: args.plan.points });
  run(importId, args, {}).catch(() => {}); // recorded in the row by run()
  return importId;
}
