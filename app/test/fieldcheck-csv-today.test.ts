// The checks' CSV keeps each row's stored verdict and, where the row's own readings give another under today's rules (a rule
// changed after it was recorded: judged-today.ts), says today's in `verdict_today`, blank where they agree or where the
// selection's frozen document no longer reads. Real records in MariaDB (app/test/harness.ts). Check values: ISO 9906:2012
// grade 2B head ±5 % (from memory, TOLERANCE_GRADES); the fixture curve is invented (H = 40 − 1000·Q: 28 m at 12 L/s).
import { afterAll, beforeAll, expect, test } from "vitest";
import { eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { selections } from "@db/schema";
import { viewerOfUser } from "~/lib/projects/test-kit";
import { historyCsv } from "~/lib/fieldchecks";
import { checkRecords } from "~/lib/fieldchecks/records.server";
import { makeMember, type TestMember } from "./harness";
import { recordAtHead, storeSelection } from "./fieldcheck-fixture";

afterAll(() => closeDb());

let m: TestMember;
let selA = 0;
let selB = 0;
let agreed = 0;
let drifted = 0;

beforeAll(async () => {
  m = await makeMember("admin");
  selA = (await storeSelection(m.workspaceId, m.userId, undefined, "CSV today A")).selectionId;
  agreed = await recordAtHead(m.userId, selA, 28 * 1.02); // head +2 %: within 2B's ±5 %
  drifted = await recordAtHead(m.userId, selA, 28 * 1.02, "fail"); // as if recorded under an earlier rule
  selB = (await storeSelection(m.workspaceId, m.userId, undefined, "CSV today B")).selectionId;
  await recordAtHead(m.userId, selB, 28 * 1.02, "fail");
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
