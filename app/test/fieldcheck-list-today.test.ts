// The engineer's list of a selection's checks (selection-checks.server.ts, SelectionFieldChecks) keeps each stored verdict and,
// where the check's own readings give another under today's rules (judged-today.ts), says today's beside it; an agreeing row
// says nothing more. Real records in MariaDB (app/test/harness.ts). Check values: ISO 9906:2012 grade 2B head ±5 % (from
// memory, TOLERANCE_GRADES); the fixture curve is invented (H = 40 − 1000·Q: 28 m at 12 L/s).
import { afterAll, beforeAll, expect, test } from "vitest";
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { closeDb } from "@db/client.server";
import { viewerOfUser } from "~/lib/projects/test-kit";
import { getSelection } from "~/lib/projects/selections.server";
import { checksOfSelection } from "~/lib/fieldchecks/selection-checks.server";
import { SelectionFieldChecks, type SelectionCheckRow } from "~/components/SelectionFieldChecks";
import { renderDeep, SI_UNITS } from "~/lib/shared/units";
import { fmtDate } from "~/lib/shared/format";
import { makeMember, type TestMember } from "./harness";
import { recordAtHead, storeSelection } from "./fieldcheck-fixture";

afterAll(() => closeDb());

let m: TestMember;
let sel = 0;
let agreed = 0;
let drifted = 0;

beforeAll(async () => {
  m = await makeMember("admin");
  sel = (await storeSelection(m.workspaceId, m.userId, undefined, "List today")).selectionId;
  agreed = await recordAtHead(m.userId, sel, 28 * 1.02); // head +2 %: within 2B's ±5 %
  drifted = await recordAtHead(m.userId, sel, 28 * 1.02, "fail"); // as if recorded under an earlier rule
});

test("stored 'fail', today 'pass': the row keeps fail and says today's; the agreeing row says nothing more", async () => {
  const v = await viewerOfUser(m.userId);
  const rows = await checksOfSelection(await getSelection(v, sel));
  const by = new Map(rows.map((r) => [r.id, r]));
  const d = by.get(drifted)!;
  const a = by.get(agreed)!;
  expect(d.readable && [d.verdict, d.today]).toEqual(["fail", "pass"]); // was: no today
  expect(a.readable && [a.verdict, a.today]).toEqual(["pass", null]);
  const html = renderToStaticMarkup(createElement(SelectionFieldChecks, { checks: renderDeep(rows, SI_UNITS) as SelectionCheckRow[], unitSystem: SI_UNITS, selectionId: sel }));
  expect(html.match(/data-testid="verdict-today"/g)?.length).toBe(1);
  // Since decision "fieldverdicts": both verdicts labelled, the stored one with the day it was saved (badge: today's).
  expect(html).toContain(`outside tolerance against grade 2B when saved on ${fmtDate(new Date())}; today: within tolerance. The record keeps the verdict saved; amend it to record today&#x27;s.`);
});
