// The check's page says which instrument accuracy was not given, and an entered 0 as "±0"; a vacuum reading with the true
// minus sign (decision "fieldmeter"). Real route module, guards and MariaDB (app/test/harness.ts). The fixture curve is
// invented (app/test/fieldcheck-fixture.ts: H = 40 − 1000·Q); the readings are made up for the words, not the verdict.
import { afterAll, beforeAll, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import { fluidAt } from "~/engine";
import { viewerOfUser } from "~/lib/projects/test-kit";
import { parseCheckFields } from "~/lib/fieldchecks";
import { recordFieldCheck } from "~/lib/fieldchecks/records.server";
import * as checkPage from "~/routes/field.checks.$id";
import { makeMember, type TestMember } from "./harness";
import { loadedPage, plainHtml } from "./render-page";
import { fieldsForHead, storeSelection } from "./fieldcheck-fixture";

afterAll(() => closeDb());

const RHO20 = fluidAt({ kind: "water" }, 20).density;
let m: TestMember;
let id = 0;
let noMeter = 0; // no flow meter, both gauges' accuracy blank
let oneGauge = 0; // no flow meter, the suction gauge's ±5 kPa, the discharge gauge's blank
let typed = 0; // the meter's ±7 %, the power reading's ±0.25 %, as typed

beforeAll(async () => {
  m = await makeMember("admin");
  const v = await viewerOfUser(m.userId);
  const { selectionId } = await storeSelection(m.workspaceId, m.userId, undefined, "Accuracy");
  // Suction −20 kPa gauge (a vacuum), its accuracy blank; the discharge gauge's typed as 0; the meter's blank.
  const p = parseCheckFields(fieldsForHead(26, RHO20, { flow: "0.012", sPressure: "-20", dAccuracy: "0", flowUnit: "m3/s" }), { kind: "water" });
  if (!p.ok) throw new Error(JSON.stringify(p.errors));
  id = (await recordFieldCheck(v, selectionId, { readings: p.readings, fields: p.fields, notes: "", gradeId: "2B" }, [], { notify: false })).id;
  const record = async (extra: Record<string, string>) => {
    const q = parseCheckFields(fieldsForHead(26, RHO20, extra), { kind: "water" });
    if (!q.ok) throw new Error(JSON.stringify(q.errors));
    return (await recordFieldCheck(v, selectionId, { readings: q.readings, fields: q.fields, notes: "", gradeId: "2B" }, [], { notify: false })).id;
  };
  noMeter = await record({});
  oneGauge = await record({ sAccuracy: "5" });
  typed = await record({ flow: "0.012", flowUnit: "m3/s", flowAccuracy: "7", powerMode: "input", powerUnit: "kW", power: "5", motorEfficiency: "90", powerAccuracy: "0.25" });
});

test("the readings' rows: 'accuracy not given' for a blank, '±0 kPa' for a typed 0, '−20.0 kPa' with U+2212", async () => {
  const { html } = await loadedPage(m, checkPage, "/field/checks/:id", `/field/checks/${id}`, { id: String(id) });
  // Was: "-20.0 kPa gauge · at 0.00 m …" (a hyphen; the blank accuracy and the typed 0 alike said nothing).
  expect(html).toMatch(/\u221220\.0 kPa gauge \(accuracy not given\) · at /);
  expect(html).toMatch(/kPa gauge ±0 kPa · at /);
  expect(html).toContain("43.2 m³/h (the meter's accuracy not given)");
  expect(html).not.toMatch(/>-20\.0 kPa/);
});

test("no flow meter: the band from gauge accuracy says which accuracy was not given, never a band of ±0", async () => {
  const none = plainHtml((await loadedPage(m, checkPage, "/field/checks/:id", `/field/checks/${noMeter}`, { id: String(noMeter) })).html);
  // Was: "… to … (head ±0.000 m) width ±0 % of the flow", as if the gauges were perfect.
  expect(none).toContain("Flow band from gauge accuracy</dt><dd>none: the gauges' accuracy was not given, so the flow is the curve's at the head as read");
  expect(none).not.toMatch(/width ±0 %/);
  const one = plainHtml((await loadedPage(m, checkPage, "/field/checks/:id", `/field/checks/${oneGauge}`, { id: String(oneGauge) })).html);
  expect(one).toMatch(/\(head ±0\.5\d* m, the discharge gauge's accuracy not given\)/); // 5 kPa / (998.2 × 9.80665) = 0.511 m
});

test("the instruments' accuracies as typed: the meter's '±7 %' (was ±7.0 %), the power reading's '±0.25 %' (was ±0.3 %)", async () => {
  const html = plainHtml((await loadedPage(m, checkPage, "/field/checks/:id", `/field/checks/${typed}`, { id: String(typed) })).html);
  expect(html).toContain("43.2 m³/h ±7 %</dd>");
  expect(html).toContain(" · reading accuracy ±0.25 %");
  expect(html).not.toMatch(/±7\.0 %|±0\.3 %/);
});
