// A recorded check whose stored verdict differs from what its own readings give under today's rules (a rule changed after it
// was recorded): its page keeps the stored verdict and says today's beside it, with its words and how to record it; a check
// whose verdicts agree says nothing more, and a selection whose frozen document no longer reads leaves the page as it was.
// Real route module, guards and MariaDB (app/test/harness.ts). Check values: ISO 9906:2012 grade 2B head ±5 % (from memory,
// TOLERANCE_GRADES); the fixture curve is invented (H = 40 − 1000·Q: 28 m at 12 L/s, fieldcheck-fixture.ts).
import { afterAll, beforeAll, expect, test } from "vitest";
import { eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { selections } from "@db/schema";
import * as checkPage from "~/routes/field.checks.$id";
import { makeMember, type TestMember } from "./harness";
import { loadedPage } from "./render-page";
import { recordAtHead, storeSelection } from "./fieldcheck-fixture";

afterAll(() => closeDb());

let m: TestMember;
let agreed = 0; // stored "pass", today "pass"
let drifted = 0; // stored "fail" (as if recorded under an earlier rule), today "pass"
let unreadable = 0; // stored "fail", today "pass", but the selection's frozen document does not read

beforeAll(async () => {
  m = await makeMember("admin");
  const a = await storeSelection(m.workspaceId, m.userId, undefined, "Today A");
  agreed = await recordAtHead(m.userId, a.selectionId, 28 * 1.02); // head +2 %: within 2B's ±5 %
  drifted = await recordAtHead(m.userId, a.selectionId, 28 * 1.02, "fail");
  const b = await storeSelection(m.workspaceId, m.userId, undefined, "Today B");
  unreadable = await recordAtHead(m.userId, b.selectionId, 28 * 1.02, "fail");
  await db().update(selections).set({ frozenJson: "{" }).where(eq(selections.id, b.selectionId));
});

const page = (id: number) => loadedPage(m, checkPage, "/field/checks/:id", `/field/checks/${id}`, { id: String(id) });

test("stored and today's verdicts agree: the page shows the stored one alone", async () => {
  const { html } = await page(agreed);
  expect(html).toContain('data-verdict="pass"');
  expect(html).not.toContain('data-testid="judged-today"');
});

test("stored 'outside tolerance', today 'within tolerance': both said, the stored one kept, how to record today's", async () => {
  const { html } = await page(drifted);
  const note = html.match(/data-testid="judged-today">([\s\S]*?)<\/div>/)?.[1] ?? "(no note)";
  expect(html.indexOf('data-verdict="fail"')).toBeLessThan(html.indexOf('data-testid="judged-today"')); // the stored badge first
  expect(note).toContain("as outside tolerance, the verdict this record keeps");
  expect(note).toContain('data-verdict="pass"');
  expect(note).toMatch(/within tolerance · grade 2B<\/span> — Delivered point [^<]*2B/);
  expect(note).toContain("amend this check");
  expect(note).not.toContain("⟦");
  // Today's verdict with its rule and numbers, as the lists say it (decision "fieldverdicts"; was: the sentence alone).
  expect(note.replace(/&#x27;/g, "'")).toContain("Today's rule and numbers: Tolerance cross of grade 2B, as read (either arm meets it): head +2.0 % of the curve's 28.0 m at the measured flow (allowed −5 % to +5 %), met;");
});

test("a selection whose frozen document no longer reads: the check's page still shows its stored record, without today's verdict", async () => {
  const { html } = await page(unreadable);
  expect(html).toContain('data-verdict="fail"');
  expect(html).not.toContain('data-testid="judged-today"');
});
