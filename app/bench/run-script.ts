// A bench file run on its own (`npx tsx app/bench/<name>.ts`): print its report, close the pool and
// exit (0, or 1 on an error). Does nothing when the file is imported by another script.
import path from "node:path";
import { fileURLToPath } from "node:url";
import { closeDb } from "@db/client.server";

export function runAsScript(moduleUrl: string, bench: () => Promise<string>): void {
  if (!process.argv[1] || fileURLToPath(moduleUrl) !== path.resolve(process.argv[1])) return;
  bench()
    .then(async (report) => {
      console.log(report);
      await closeDb();
      // Done: leave even if something the bench touched keeps a handle open (the import's analysis
      // worker, a keep-alive socket), as the HTTP bench did after printing its report.
      process.exit(0);
    })
    .catch(async (e) => {
      console.error(e);
      await closeDb().catch(() => {});
      process.exit(1);
    });
}
