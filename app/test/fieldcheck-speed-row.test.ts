// A recorded check whose measured speed lies just outside the range the curve may be translated in: the page's "Speed"
// rows (the result's and the readings') print it apart from the range's end, as the warning beside them does — 1449.7 rpm
// of a 2900 rpm curve read "1450 rpm measured" (50 % of 2900 rpm, inside) beside "No tolerance verdict: the measured
// speed (1449.7 rpm) is 49.99 % …". rpm reads the same in SI and US units. Real route module, guards and MariaDB
// (app/test/harness.ts). Check values: the 50–120 % range (ISO 9906, from memory; SPEED_RANGE); the fixture curve is an
// invented straight line at 2900 rpm (app/test/fieldcheck-fixture.ts).
import { afterAll, beforeAll, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import { fluidAt } from "~/engine";
import { viewerOfUser } from "~/lib/projects/test-kit";
import { parseCheckFields } from "~/lib/fieldchecks";
import { recordFieldCheck } from "~/lib/fieldchecks/records.server";
import * as checkPage from "~/routes/field.checks.$id";
import { makeMember, type TestMember } from "./harness";
import { loadedPage } from "./render-page";
import { fieldsForHead, storeSelection } from "./fieldcheck-fixture";

afterAll(() => closeDb());

const RHO20 = fluidAt({ kind: "water" }, 20).density;
let m: TestMember;
const ids: Record<string, number> = {};

beforeAll(async () => {
  m = await makeMember("admin");
  const v = await viewerOfUser(m.userId);
  const { selectionId } = await storeSelection(m.workspaceId, m.userId, undefined, "Speed row");
  // 1449.7 rpm: 49.99 % of 2900 rpm (below 50 %); 3480.3 rpm: 120.01 % (above 120 %); 2000 rpm: inside, a whole number.
  for (const rpm of ["1449.7", "3480.3", "2000"]) {
    const p = parseCheckFields(fieldsForHead(28, RHO20, { flow: "0.012", rpm }), { kind: "water" });
    if (!p.ok) throw new Error(JSON.stringify(p.errors));
    ids[rpm] = (await recordFieldCheck(v, selectionId, { readings: p.readings, fields: p.fields, notes: "", gradeId: "2B" }, [], { notify: false })).id;
  }
});

/** `stored`: changes the loaded record first (a check stored before a change of its texts). */
async function speedRows(id: number, stored?: (body: { result: { chart: { measuredLabel: string } } }) => void): Promise<{ rows: string[]; html: string }> {
  const { html } = await loadedPage(m, checkPage, "/field/checks/:id", `/field/checks/${id}`, { id: String(id) }, stored);
  return { rows: [...html.matchAll(/<dt class="text-slate-600">Speed<\/dt><dd>(.*?)<\/dd>/g)].map((x) => x[1]), html };
}

test("1449.7 rpm, below 50 % of the curve's 2900 rpm: both Speed rows read 1449.7 rpm, not the range's end 1450 rpm", async () => {
  const { rows, html } = await speedRows(ids["1449.7"]);
  expect(html).toContain("the measured speed (1449.7 rpm) is 49.99 % of the curve's 2900 rpm, outside the 50 %–120 %"); // the warning beside
  expect(rows).toEqual(["1449.7 rpm measured · 2900 rpm selected · curve at 2900 rpm", "1449.7 rpm"]);
});

test("3480.3 rpm, above 120 % of 2900 rpm (3480 rpm): read apart from it", async () => {
  const { rows } = await speedRows(ids["3480.3"]);
  expect(rows).toEqual(["3480.3 rpm measured · 2900 rpm selected · curve at 2900 rpm", "3480.3 rpm"]);
});

test("a speed well inside the range reads as it always did, to the whole rpm", async () => {
  const { rows } = await speedRows(ids["2000"]);
  expect(rows).toEqual(["2000 rpm measured · 2900 rpm selected · curve at 2900 rpm", "2000 rpm"]);
});

// The hint on the speed and the chart's curve at the measured speed (its legend and table caption, "2. At the measured …")
// read it as the Speed row does: they printed "(1450 rpm against 2900 rpm)" and "At the measured 1450 rpm" for 1449.7 rpm.
test("1449.7 rpm: the speed hint and the chart's measured curve read 1449.7 rpm, as the warning beside", async () => {
  const { html } = await speedRows(ids["1449.7"]);
  expect(html).toContain("The measured speed differs from the selection's speed (1449.7 rpm against 2900 rpm)");
  expect(html).toContain("2. At the measured 1449.7 rpm");
  expect(html).not.toMatch(/\b1450 rpm/);
});

test("a check stored with the old label ('At the measured 1450 rpm') reads 1449.7 rpm on its chart too", async () => {
  const { html } = await speedRows(ids["1449.7"], (b) => (b.result.chart.measuredLabel = "At the measured 1450 rpm"));
  expect(html).toContain("At the measured 1449.7 rpm");
  expect(html).not.toContain("At the measured 1450 rpm");
});

test("3480.3 rpm (above 120 % of 2900 rpm, 3480 rpm) and 2000 rpm (inside, to the whole rpm) on the chart", async () => {
  expect((await speedRows(ids["3480.3"])).html).toContain("At the measured 3480.3 rpm");
  expect((await speedRows(ids["2000"])).html).toContain("At the measured 2000 rpm");
});
