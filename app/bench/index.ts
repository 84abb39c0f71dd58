// `npm run bench`: every benchmark, one after the other, each in its own process, output in one report.
// db/cli.mjs prepares a fresh `dutymark_bench` database and builds the app first.
import { spawnSync } from "node:child_process";
import os from "node:os";

const benches = [
  ["Engine", "app/bench/engine.ts"],
  ["Import vs LOAD DATA", "app/bench/import.ts"],
  ["HTTP", "app/bench/http.ts"],
  ["Search page at catalogue scale", "app/bench/search-page.ts"],
  ["Mapping page of a 200 000-row upload", "app/bench/mapping-page.ts"],
] as const;

const started = new Date();
console.log(`Dutymark benchmarks — ${started.toISOString().slice(0, 16).replace("T", " ")} UTC · ${os.cpus().length} × ${os.cpus()[0]?.model ?? "cpu"} · ${(os.totalmem() / 2 ** 30).toFixed(0)} GiB · Node ${process.version} · load ${os.loadavg().map((x) => x.toFixed(1)).join(" ")}`);
let failed = 0;
for (const [title, file] of benches) {
  console.log(`\n=== ${title} (${file}) ===\n`);
  const r = spawnSync(process.execPath, ["--import", "tsx", file], { stdio: "inherit", env: process.env });
  if (r.status !== 0) {
    failed++;
    console.log(`!! ${title} exited with ${r.status}`);
  }
}
process.exit(failed ? 1 : 0);
