// The checks' CSV keeps each row's stored verdict and, where the row's own readings give another under today's rules (a rule
// changed after it was recorded: judged-today.ts), says today's in `verdict_today`, blank where they agree or where the
// selection's frozen document no longer reads. Real records in MariaDB (app/test/harness.ts). Check values: ISO 9906:2012
// grade 2B head ±5 % (from memory, TOLERANCE_GRADES); the fixture curve is invented (H = 40 − 1000·Q: 28 m at 12 L/s).
import { afterAll, beforeAll, expect, test } from "vitest";
import { eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { fieldChecks, selections } from "@db/schema";
import { fluidAt } from "~/engine";
import { viewerOfUser } from "~/lib/projects/test-kit";
import { historyCsv, parseCheckFields } from "~/lib/fieldchecks";
import { checkRecords, recordFieldCheck } from "~/lib/fieldchecks/records.server";
import { makeMember, type TestMember } from "./harness";
import { storeSelection, fieldsForHead } from "./fieldcheck-fixture";

afterAll(() => closeDb());

const RHO20 = fluidAt({ kind: "water" }, 20).density;
let m: TestMember;
let selA = 0;
let selB = 0;
let agreed = 0;
let drifted = 0;

async function record(selectionId: number, head: number): Promise<number> {
  const v = await viewerOfUser(m.userId);
  const p = parseCheckFields(fieldsForHead(head, RHO20, { flow: "0.012" }), { kind: "water" });
  if (!p.ok) throw new Error(JSON.stringify(p.errors));
  return (await recordFieldCheck(v, selectionId, { readings: p.readings, fields: p.fields, notes: "", gradeId: "2B" }, [], { notify: false })).id;
}

beforeAll(async () => {
  m = await makeMember("admin");
  selA = (await storeSelection(m.workspaceId, m.userId, undefined, "CSV today A")).selectionId;
  agreed = await record(selA, 28 * 1.02); // head +2 %: within 2B's ±5 %
  drifted = await record(selA, 28 * 1.02);
  await db().update(fieldChecks).set({ verdict: "fail" }).where(eq(fieldChecks.id, drifted)); // as if recorded under an earlier rule
  selB = (await storeSelection(m.workspaceId, m.userId, undefined, "CSV today B")).selectionId;
  const unreadable = await record(selB, 28 * 1.02);
  await db().update(fieldChecks).set({ verdict: "fail" }).where(eq(fieldChecks.id, unreadable));
  await db().update(selections).set({ frozenJson: "{" }).where(eq(selections.id, selB));
});

/** The CSV's rows by check id: the column `name` of each. */
async function column(selectionId: number, name: string): Promise<Map<string, string>> {
  const v = await viewerOfUser(m.userId);
  const lines = historyCsv(await checkRecords(v, selectionId)).split(/\r?\n/).filter((l) => l && !l.startsWith("#") && !l.startsWith('"#'));
  const header = lines[0].split(",");
  const at = header.indexOf(name);
  expect(at, `${name} in ${header.join(",")}`).toBeGreaterThan(-1);
  return new Map(lines.slice(1).map((l) => { const cells = l.split(","); return [cells[0], cells[at]]; }));
}

test("stored 'fail', today 'pass': verdict fail, verdict_today pass; an agreeing row leaves verdict_today blank", async () => {
  const verdict = await column(selA, "verdict");
  const today = await column(selA, "verdict_today"); // was: no such column
  expect([verdict.get(String(drifted)), today.get(String(drifted))]).toEqual(["fail", "pass"]);
  expect([verdict.get(String(agreed)), today.get(String(agreed))]).toEqual(["pass", ""]);
});

test("a frozen document that no longer reads: the stored verdict alone, verdict_today blank", async () => {
  const v = await viewerOfUser(m.userId);
  const csv = historyCsv(await checkRecords(v, selB)); // the CSV reads each check's own record: no 409 for the frozen document
  expect(csv).toContain("verdict_today");
  expect(csv).toMatch(/,fail,,/);
});

test("the verdict rule line documents verdict_today", async () => {
  const v = await viewerOfUser(m.userId);
  expect(historyCsv(await checkRecords(v, selA))).toContain("verdict_today is what the row's own readings give under today's rules where that differs");
});
