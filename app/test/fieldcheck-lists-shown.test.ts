// Every list that shows a field check's verdict shows today's (the check's own readings judged again with today's engine,
// listed-verdict.ts) with its rule and numbers, and, where the verdict stored when the check was saved differs, both,
// labelled: "outside tolerance against grade 2B when saved on <date>; today: within tolerance — <rule with numbers>".
// Lists: the contractor's field home (`/field`, recent checks), the contractor's history (`/field/selections/:id`), the
// engineer's list (selection-checks.server.ts). Was: the stored verdict alone on the contractor's lists (with the cross's
// numbers on the history, none on the home). Real route loaders and MariaDB (app/test/harness.ts). Check values: ISO
// 9906:2012 grade 2B head ±5 % (from memory, TOLERANCE_GRADES); the fixture curve is invented (H = 40 − 1000·Q: 28 m at
// 12 L/s), so a head of 28 × 1.02 m at 12 L/s is +2 % (hand).
import { afterAll, beforeAll, expect, test } from "vitest";
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { closeDb } from "@db/client.server";
import { viewerOfUser } from "~/lib/projects/test-kit";
import { getSelection } from "~/lib/projects/selections.server";
import { checksOfSelection } from "~/lib/fieldchecks/selection-checks.server";
import { checkRecords } from "~/lib/fieldchecks/records.server";
import { historyCsv } from "~/lib/fieldchecks";
import { fmtDate } from "~/lib/shared/format";
import { renderDeep, SI_UNITS } from "~/lib/shared/units";
import { CheckHistoryList, type HistoryEntry } from "~/components/field/SelectionSummary";
import * as home from "~/routes/field";
import * as fieldForm from "~/routes/field.selections.$id";
import { call, makeMember, type TestMember } from "./harness";
import { recordAtHead, storeSelection } from "./fieldcheck-fixture";

afterAll(() => closeDb());

let m: TestMember;
let sel = 0;
const ids = { drifted: 0, agreed: 0, inside: 0, outside: 0 };
const today = fmtDate(new Date());

beforeAll(async () => {
  m = await makeMember("admin");
  sel = (await storeSelection(m.workspaceId, m.userId, undefined, "Lists shown")).selectionId;
  ids.agreed = await recordAtHead(m.userId, sel, 28 * 1.02); // head +2 %: within 2B's ±5 %
  ids.drifted = await recordAtHead(m.userId, sel, 28 * 1.02, "fail"); // stored "fail", as if saved under an earlier rule
  ids.inside = await recordAtHead(m.userId, sel, 28 * 1.05 * (1 - 1e-6)); // a millionth inside 2B's +5 %
  ids.outside = await recordAtHead(m.userId, sel, 28 * 1.05 * (1 + 1e-6)); // a millionth outside
});

type Shown = { verdict: string; today: string | null; text: string; rule: string };
type Row = { id: number; verdict: string; shown?: Shown };

const DRIFTED = `outside tolerance against grade 2B when saved on ${today}; today: within tolerance — Tolerance cross of grade 2B, as read (either arm meets it): head +2.0 % of the curve's 28.0 m at the measured flow (allowed −5 % to +5 %), met;`;
const AGREED = "within tolerance against grade 2B — Tolerance cross of grade 2B, as read (either arm meets it): head +2.0 % of the curve's 28.0 m at the measured flow (allowed −5 % to +5 %), met;";

function expectLists(rows: Row[]) {
  const of = (id: number) => rows.find((r) => r.id === id)!;
  const d = of(ids.drifted);
  expect(d.verdict).toBe("fail"); // the stored verdict stays in the data
  expect([d.shown?.verdict, d.shown?.today]).toEqual(["pass", "pass"]); // was: no `shown`
  expect(d.shown?.text).toContain(DRIFTED);
  expect([of(ids.agreed).shown?.verdict, of(ids.agreed).shown?.today]).toEqual(["pass", null]);
  expect(of(ids.agreed).shown?.text).toContain(AGREED);
  // The flip a millionth either side of +5 %, with the arm's numbers apart from the limit.
  expect(of(ids.inside).shown?.verdict).toBe("pass");
  expect(of(ids.inside).shown?.text).toContain("within tolerance against grade 2B — Tolerance cross of grade 2B, as read (either arm meets it): head +4.9999 % of the curve's 28.0 m at the measured flow (allowed −5 % to +5 %), met;");
  expect(of(ids.outside).shown?.verdict).toBe("fail");
  expect(of(ids.outside).shown?.text).toContain("outside tolerance against grade 2B — Tolerance cross of grade 2B, as read (either arm meets it): head +5.0001 % of the curve's 28.0 m at the measured flow (allowed −5 % to +5 %), not met;");
  expect(JSON.stringify(rows)).not.toContain("⟦");
}

test("the contractor's field home: today's verdict with its rule and numbers, both labelled where the stored one differs", async () => {
  const r = await call(home.loader as never, { path: "/field", cookie: m.cookie });
  expect(r.status).toBe(200);
  expectLists((r.body as { checks: Row[] }).checks);
});

test("the contractor's history on the selection's field page: the same, and its list says it", async () => {
  const r = await call(fieldForm.loader as never, { path: `/field/selections/${sel}`, params: { id: String(sel) }, cookie: m.cookie });
  expect(r.status).toBe(200);
  const history = (r.body as { history: Row[] }).history;
  expectLists(history);
  const html = renderToStaticMarkup(createElement(CheckHistoryList, { selectionId: sel, history: history as unknown as HistoryEntry[], unitSystem: SI_UNITS })).replace(/&#x27;/g, "'");
  expect(html).toContain(DRIFTED);
  expect(html.match(/data-differs="yes"/g)?.length).toBe(1);
});

test("the engineer's list: the same verdicts and texts", async () => {
  const v = await viewerOfUser(m.userId);
  expectLists(renderDeep(await checksOfSelection(await getSelection(v, sel)), SI_UNITS) as unknown as Row[]); // the report's loader renders its tokens so
});

test("the CSV: verdict_today with today's rule and numbers in verdict_today_rule (the last column), blank where they agree", async () => {
  const v = await viewerOfUser(m.userId);
  const lines = historyCsv(await checkRecords(v, sel)).trim().split("\r\n").filter((l) => !/^"?#/.test(l));
  expect(lines[0].split(",").at(-1)).toBe("verdict_today_rule"); // was: no such column
  const row = (id: number) => lines.find((l) => l.startsWith(`${id},`))!;
  expect(row(ids.drifted)).toContain(`,"Tolerance cross of grade 2B, as read (either arm meets it): head +2.0 % of the curve's 28.0 m at the measured flow (allowed −5 % to +5 %), met;`);
  expect(row(ids.agreed).endsWith(",")).toBe(true);
});
