// The check page's "From the curve at the measured speed" row beside the verdict: each deviation with the decimals that keep
// it apart from its arm's allowance (the cross's own words), and the verdict's sentence with its sign. Was: one decimal,
// "head +5.0 %" beside "within tolerance" at +4.9999 % and beside "outside tolerance" at +5.0001 %, and the sentence
// "(head 5.0001 % from curve)" without its "+". Real route module, guards and MariaDB (app/test/harness.ts).
// Check values: ISO 9906:2012 grade 2B as in TOLERANCE_GRADES, from memory (flow ±8 %, head ±5 %); the fixture curves are
// invented straight lines (app/test/fieldcheck-fixture.ts), deviations worked by hand.
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import { fluidAt } from "~/engine";
import { viewerOfUser } from "~/lib/projects/test-kit";
import { parseCheckFields } from "~/lib/fieldchecks";
import { recordFieldCheck } from "~/lib/fieldchecks/records.server";
import * as checkPage from "~/routes/field.checks.$id";
import { makeMember, type TestMember } from "./harness";
import { loadedPage } from "./render-page";
import { fieldsForHead, frozenFixture, linearPoints, storeSelection } from "./fieldcheck-fixture";

afterAll(() => closeDb());

const RHO20 = fluidAt({ kind: "water" }, 20).density;
let m: TestMember;
let flat = 0; // H = 40 − 1000·Q: 28 m at 12 L/s
let steep = 0; // H = 40 − 3000·Q: 10 m at 10 L/s

beforeAll(async () => {
  m = await makeMember("admin");
  flat = (await storeSelection(m.workspaceId, m.userId, frozenFixture(), "Flat")).selectionId;
  steep = (await storeSelection(m.workspaceId, m.userId, frozenFixture({ points: linearPoints(40, 3000, 0.013) }), "Steep")).selectionId;
});

/** The check page of readings at `head` m and `flow` m³/s on `selectionId`: its verdict, the row's text and the verdict's sentence. */
async function page(selectionId: number, head: number, flow: number) {
  const v = await viewerOfUser(m.userId);
  const p = parseCheckFields(fieldsForHead(head, RHO20, { flow: String(flow) }), { kind: "water" });
  if (!p.ok) throw new Error(JSON.stringify(p.errors));
  const { id } = await recordFieldCheck(v, selectionId, { readings: p.readings, fields: p.fields, notes: "", gradeId: "2B" }, [], { notify: false });
  const { html } = await loadedPage(m, checkPage, "/field/checks/:id", `/field/checks/${id}`, { id: String(id) });
  return {
    verdict: html.match(/data-verdict="(\w+)"/)?.[1],
    row: html.match(/From the curve at the measured speed<\/dt><dd>([^<]*)<\/dd>/)?.[1] ?? "(no row)",
    said: html.match(/<p class="text-sm">(Delivered point[^<]*)<\/p>/)?.[1] ?? "(no sentence)",
  };
}

describe("the head arm's edges (28 m × (1 ± 5 %) at 12 L/s)", () => {
  test("+5 % less and more a millionth: pass beside +4.9999 %, fail beside +5.0001 %, never both '+5.0 %'", async () => {
    const inside = await page(flat, 28 * (1.05 - 1e-6), 0.012);
    const outside = await page(flat, 28 * (1.05 + 1e-6), 0.012);
    expect([inside.verdict, outside.verdict]).toEqual(["pass", "fail"]);
    expect(inside.row).toMatch(/, head \+4\.9999 %$/);
    expect(outside.row).toMatch(/, head \+5\.0001 %$/);
    expect(outside.said).toBe("Delivered point is outside every grade checked (head: the measured 29.4 m is +5.0001 % of the curve's 28.0 m at the measured flow (allowed −5 % to +5 %); flow: the measured 43.2 m³/h is +13.2 % of the curve's 38.2 m³/h at the measured head (allowed −8 % to +8 %))."); // was "(head 5.0001 % …)"
  });
  test("−5 % less and more a millionth: pass beside −4.9999 %, fail beside −5.0001 %", async () => {
    const inside = await page(flat, 28 * (0.95 + 1e-6), 0.012);
    const outside = await page(flat, 28 * (0.95 - 1e-6), 0.012);
    expect([inside.verdict, outside.verdict]).toEqual(["pass", "fail"]);
    expect(inside.row).toMatch(/, head −4\.9999 %$/);
    expect(outside.row).toMatch(/, head −5\.0001 %$/);
  });
  test("exactly +5 % (floating-point noise 4e-17 past it) is met and reads the limit, '+5 %'", async () => {
    const at = await page(flat, 28 * 1.05, 0.012);
    expect(at.verdict).toBe("pass");
    expect(at.row).toMatch(/, head \+5 %$/);
  });
});

describe("the flow arm's edges (steep curve: 10 m at 10 L/s; 2B flow ±8 %)", () => {
  test("+8 % less and more a millionth at 10 m: pass beside +7.9999 %, fail beside +8.0001 %", async () => {
    const inside = await page(steep, 10, 0.01 * (1.08 - 1e-6));
    const outside = await page(steep, 10, 0.01 * (1.08 + 1e-6));
    expect([inside.verdict, outside.verdict]).toEqual(["pass", "fail"]);
    expect(inside.row).toMatch(/^flow \+7\.9999 %, /);
    expect(outside.row).toMatch(/^flow \+8\.0001 %, /);
  });
  test("−8 % more and less a millionth at 10 m: pass beside −7.9999 %, fail beside −8.0001 %", async () => {
    const inside = await page(steep, 10, 0.01 * (0.92 + 1e-6));
    const outside = await page(steep, 10, 0.01 * (0.92 - 1e-6));
    expect([inside.verdict, outside.verdict]).toEqual(["pass", "fail"]);
    expect(inside.row).toMatch(/^flow −7\.9999 %, /);
    expect(outside.row).toMatch(/^flow −8\.0001 %, /);
  });
});
