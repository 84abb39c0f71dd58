// The lists that show a check's verdict without its page carry its rule and numbers on flow and head (cross.ts
// `crossSummary`), in the reader's units: the field page's history (`/field/selections/:id`) and the selection report's
// list of checks (`/selections/:id`). Was: the delivered point and the verdict only (the report's list also the grade's
// rule), so "within tolerance" and "outside tolerance" read the same numbers a millionth apart. Real route modules, guards
// and MariaDB (app/test/harness.ts). Check values: ISO 9906:2012 grade 2B as in TOLERANCE_GRADES, from memory (head ±5 %);
// the fixture curve is invented (H = 40 − 1000·Q: 28 m at 12 L/s), deviations worked by hand.
import { afterAll, beforeAll, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import { fluidAt } from "~/engine";
import { viewerOfUser } from "~/lib/projects/test-kit";
import { parseCheckFields } from "~/lib/fieldchecks";
import { recordFieldCheck } from "~/lib/fieldchecks/records.server";
import * as fieldForm from "~/routes/field.selections.$id";
import * as report from "~/routes/selections.$id";
import { call, makeMember, type TestMember } from "./harness";
import { fieldsForHead, storeSelection } from "./fieldcheck-fixture";

afterAll(() => closeDb());

const RHO20 = fluidAt({ kind: "water" }, 20).density;
let m: TestMember;
let selectionId = 0;
const ids: Record<"inside" | "outside", number> = { inside: 0, outside: 0 };

beforeAll(async () => {
  m = await makeMember("admin");
  const v = await viewerOfUser(m.userId);
  selectionId = (await storeSelection(m.workspaceId, m.userId, undefined, "Listed")).selectionId;
  for (const [key, ratio] of [["inside", 1.05 - 1e-6], ["outside", 1.05 + 1e-6]] as const) {
    const p = parseCheckFields(fieldsForHead(28 * ratio, RHO20, { flow: "0.012" }), { kind: "water" });
    if (!p.ok) throw new Error(JSON.stringify(p.errors));
    ids[key] = (await recordFieldCheck(v, selectionId, { readings: p.readings, fields: p.fields, notes: "", gradeId: "2B" }, [], { notify: false })).id;
  }
});

type Row = { id: number; verdict?: string; cross?: string | null };
const expected = {
  inside: "Tolerance cross of grade 2B, as read (either arm meets it): head +4.9999 % of the curve's 28.0 m at the measured flow (allowed −5 % to +5 %), met;",
  outside: "Tolerance cross of grade 2B, as read (either arm meets it): head +5.0001 % of the curve's 28.0 m at the measured flow (allowed −5 % to +5 %), not met;",
};

test("the field page's history: each check's verdict with its arms' numbers, a millionth either side of 2B's +5 %", async () => {
  const r = await call(fieldForm.loader as never, { path: `/field/selections/${selectionId}`, params: { id: String(selectionId) }, cookie: m.cookie });
  expect(r.status).toBe(200);
  const rows = (r.body as { history: Row[] }).history;
  const of = (id: number) => rows.find((x) => x.id === id)!;
  expect([of(ids.inside).verdict, of(ids.outside).verdict]).toEqual(["pass", "fail"]);
  expect(of(ids.inside).cross).toContain(expected.inside);
  expect(of(ids.outside).cross).toContain(expected.outside);
  expect(JSON.stringify(rows)).not.toContain("⟦");
});

test("the selection report's list of checks: the same numbers beside the rule", async () => {
  const r = await call(report.loader as never, { path: `/selections/${selectionId}`, params: { id: String(selectionId) }, cookie: m.cookie });
  expect(r.status).toBe(200);
  const rows = (r.body as { fieldChecks: Row[] }).fieldChecks;
  const of = (id: number) => rows.find((x) => x.id === id)!;
  expect([of(ids.inside).verdict, of(ids.outside).verdict]).toEqual(["pass", "fail"]);
  expect(of(ids.inside).cross).toContain(expected.inside);
  expect(of(ids.outside).cross).toContain(expected.outside);
  expect(JSON.stringify(rows)).not.toContain("⟦");
});
