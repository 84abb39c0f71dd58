// A check whose measured flow lies beyond the curve's end says the same on every surface (curve-ends.ts): the check's page,
// the engineer's e-mail, the checks' CSV and the selection page's list — no tolerance verdict where the tolerance cross
// does not reach the published curve, with the measured flow and the curve's end; judged on the published part where it
// does. Real route modules, guards, mail outbox and MariaDB. Check values: ISO 9906:2012 grade 2B as in TOLERANCE_GRADES,
// from memory (flow ±8 %); the fixture curve is invented (H = 40 − 1000·Q to 0.03 m³/s = 108 m³/h at 10 m).
import { afterAll, beforeAll, expect, test } from "vitest";
import { desc, eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { outbox } from "@db/schema";
import { fluidAt } from "~/engine";
import { viewerOfUser } from "~/lib/projects/test-kit";
import { parseCheckFields } from "~/lib/fieldchecks";
import { recordFieldCheck } from "~/lib/fieldchecks/records.server";
import type { SelectionCheckRow } from "~/components/SelectionFieldChecks";
import * as selectionPage from "~/routes/selections.$id";
import * as checkPage from "~/routes/field.checks.$id";
import * as csvRoute from "~/routes/field.selections.$id.export-csv";
import { call, makeMember, type TestMember } from "./harness";
import { loadedPage } from "./render-page";
import { fieldsForHead, storeSelection } from "./fieldcheck-fixture";

afterAll(() => closeDb());

const RHO20 = fluidAt({ kind: "water" }, 20).density;
let m: TestMember;
let selectionId = 0;
const ids = { beyond: 0, published: 0 };
const mails: Record<string, string> = {};

beforeAll(async () => {
  m = await makeMember("admin");
  const v = await viewerOfUser(m.userId);
  selectionId = (await storeSelection(m.workspaceId, m.userId, undefined, "Curve end")).selectionId;
  for (const [key, flow] of [["beyond", 0.03 * 1.1], ["published", 0.03 * 1.05]] as const) {
    const p = parseCheckFields(fieldsForHead(10, RHO20, { flow: String(flow) }), { kind: "water" });
    if (!p.ok) throw new Error(JSON.stringify(p.errors));
    ids[key] = (await recordFieldCheck(v, selectionId, { readings: p.readings, fields: p.fields, notes: "", gradeId: "2B" }, [])).id;
    const [mail] = await db().select().from(outbox).where(eq(outbox.toAddress, m.email)).orderBy(desc(outbox.id)).limit(1);
    mails[key] = mail.textBody;
  }
});

const pageHtml = async (id: number) => (await loadedPage(m, checkPage, "/field/checks/:id", `/field/checks/${id}`, { id: String(id) })).html;

// 118.8 m³/h: the arm reaches back to 110 m³/h, past the end; 113.4 m³/h: to 105 m³/h, and the curve's 10 m is at its end (+5 %).
const BEYOND = "No tolerance verdict: the measured flow 119 m³/h lies beyond the curve's end at 108 m³/h, and the curve states nothing there; grade 2B's flow arm (+8 %) reaches back only to 110 m³/h, short of it";
const PUBLISHED = "Judged on the published part of the curve: the measured flow 113 m³/h lies beyond the curve's end at 108 m³/h";

test("the check's page: the verdict and the note with both flows", async () => {
  const beyond = await pageHtml(ids.beyond);
  expect(beyond).toContain('data-verdict="unknown"'); // was "fail"
  expect(beyond).toContain(BEYOND);
  const published = await pageHtml(ids.published);
  expect(published).toContain('data-verdict="pass"');
  expect(published).toContain(PUBLISHED);
});

test("the engineer's e-mail says the same", () => {
  expect(mails.beyond).toContain(BEYOND);
  expect(mails.published).toContain("within tolerance");
  expect(mails.published).toContain(PUBLISHED);
});

test("the checks' CSV: verdict and verdict_note", async () => {
  const r = await call(csvRoute.loader as never, { path: `/field/selections/${selectionId}/export.csv`, params: { id: String(selectionId) }, cookie: m.cookie });
  const lines = String(r.body).trim().split("\r\n").filter((l) => !/^"?#/.test(l));
  const head = lines[0].split(",");
  const row = (id: number) => lines.find((l) => l.startsWith(`${id},`))!;
  expect(row(ids.beyond).split(",")[head.indexOf("verdict")]).toBe("unknown");
  expect(row(ids.beyond)).toContain(BEYOND);
  expect(row(ids.published).split(",")[head.indexOf("verdict")]).toBe("pass");
  expect(row(ids.published)).toContain(PUBLISHED);
});

test("the selection page's list of checks: the verdict and its note", async () => {
  const r = await call(selectionPage.loader as never, { path: `/selections/${selectionId}`, params: { id: String(selectionId) }, cookie: m.cookie });
  const rows = (r.body as { fieldChecks: SelectionCheckRow[] }).fieldChecks;
  const of = (id: number) => rows.find((x) => x.id === id) as Extract<SelectionCheckRow, { readable: true }>;
  expect([of(ids.beyond).verdict, of(ids.published).verdict]).toEqual(["unknown", "pass"]);
  expect(of(ids.beyond).note).toContain(BEYOND);
  expect(of(ids.published).note).toContain(PUBLISHED);
});
