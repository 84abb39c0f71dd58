/**
 * Field-check lists of a long history (a script, not a test): one selection with 200 checks (invented readings on the
 * fixture's straight-line curve, app/test/fieldcheck-fixture.ts), then each list that shows a verdict timed as its
 * loader's service runs it — the engineer's list (`checksOfSelection`), the contractor's history (`checkPage`), the field
 * home's recent checks (`fieldHome`, 30) and the CSV's records (`checkRecords`). Median of 7 runs after one warm-up;
 * the first run (a cold cache, where there is one) printed apart.
 *
 *   DATABASE_URL=… npx tsx app/bench/field-lists.ts [checks]
 */
import { performance } from "node:perf_hooks";
import { fluidAt } from "~/engine";
import { makeMember } from "~/test/harness";
import { viewerOfUser } from "~/lib/projects/test-kit";
import { getSelection } from "~/lib/projects/selections.server";
import { parseCheckFields } from "~/lib/fieldchecks";
import { recordFieldCheck, fieldHome, checkRecords } from "~/lib/fieldchecks/records.server";
import { checksOfSelection } from "~/lib/fieldchecks/selection-checks.server";
import { checkPage } from "~/lib/fieldchecks/page.server";
import { SI_UNITS } from "~/lib/shared/units";
import { fieldsForHead, storeSelection } from "~/test/fieldcheck-fixture";
import { runAsScript } from "./run-script";

async function bench(): Promise<string> {
  const n = Number(process.argv[2] ?? 200);
  const m = await makeMember("admin");
  const sel = (await storeSelection(m.workspaceId, m.userId, undefined, "Field lists bench")).selectionId;
  const v = await viewerOfUser(m.userId);
  const rho = fluidAt({ kind: "water" }, 20).density;
  const t0 = performance.now();
  for (let i = 0; i < n; i++) {
    // Heads from −8 % to +8 % of the curve's 28 m at 12 L/s: passes, fails and a few at the edges.
    const p = parseCheckFields(fieldsForHead(28 * (0.92 + (0.16 * i) / n), rho, { flow: "0.012", sAccuracy: i % 3 ? "" : "2", dAccuracy: i % 3 ? "" : "2" }), { kind: "water" });
    if (!p.ok) throw new Error(JSON.stringify(p.errors));
    await recordFieldCheck(v, sel, { readings: p.readings, fields: p.fields, notes: "", gradeId: "2B" }, [], { notify: false });
  }
  const lines = [`${n} checks recorded in ${(performance.now() - t0).toFixed(0)} ms`, "list                          | first ms | median ms (7 runs)"];
  const time = async (label: string, fn: () => Promise<unknown>) => {
    const t1 = performance.now();
    await fn();
    const first = performance.now() - t1;
    const runs: number[] = [];
    for (let i = 0; i < 7; i++) {
      const t = performance.now();
      await fn();
      runs.push(performance.now() - t);
    }
    runs.sort((a, b) => a - b);
    lines.push(`${label.padEnd(30)}| ${first.toFixed(1).padStart(8)} | ${runs[3].toFixed(1).padStart(8)}`);
  };
  await time("engineer's list (200)", async () => checksOfSelection(await getSelection(v, sel)));
  await time("contractor's history (200)", () => checkPage(v, sel, SI_UNITS, ""));
  await time("field home, recent (30)", () => fieldHome(v));
  await time("CSV records (200)", () => checkRecords(v, sel));
  return lines.join("\n");
}

runAsScript(import.meta.url, bench);
