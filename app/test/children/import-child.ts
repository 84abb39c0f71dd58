// Child process for app/test/faults.test.ts: imports a CSV into a library and, just before COMMIT,
// says so on stdout and waits — so the parent can kill this process or cut its database connection
// at the worst moment. Run with DATABASE_URL, LIB_ID, USER_ID, WORKSPACE_ID, CSV_PATH.
import { readFileSync } from "node:fs";
import { analyseStored, getUpload, importUpload, storeUpload } from "~/lib/libraries";

const viewer = { userId: process.env.USER_ID!, workspace: { id: Number(process.env.WORKSPACE_ID), name: "w", slug: "w", plan: "free" as const }, role: "distributor" as const };
const libId = Number(process.env.LIB_ID);
const text = readFileSync(process.env.CSV_PATH!, "utf8");
const uploadId = await storeUpload(viewer, libId, new File([text], "big.csv", { type: "text/csv" }));
const { text: stored, lib } = await getUpload(viewer, libId, uploadId);
const mapping = analyseStored(stored, lib).mapping;
try {
  await importUpload(viewer, libId, uploadId, mapping, "fault test", {
    beforeCommit: async () => {
      process.stdout.write("before-commit\n");
      await new Promise((r) => setTimeout(r, 4000));
    },
  });
  process.stdout.write("committed\n");
} catch (e) {
  process.stdout.write(`failed: ${(e as Error).message}\n`);
}
process.exit(0);
