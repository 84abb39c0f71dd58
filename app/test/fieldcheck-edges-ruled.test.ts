// The field check's edges through the service the page's form and the phone's queue both post to (submit.server.ts
// `submitCheckForm`): a reading of NaN or Infinity, a negative pressure, a zero flow, gauge heights that make the head
// negative, an instrument tolerance (accuracy) of 0 and of its maximum, an unknown grade. Each is refused with a named field
// and a 4xx (never a 5xx), or recorded and judged with a stated rule and its numbers (listed-verdict.ts `verdictRule`: the
// tolerance cross's arms, or why no verdict). A guard: it passed before this change too. Real records in MariaDB. Check
// values: the form's limits (form.ts: gauge down to −1 standard atmosphere, ISO 2533 / common practice; flow meter accuracy
// to 50 %, gauge accuracy to 10 000 kPa, power accuracy to 20 %, product rules); ISO 9906:2012 grade 2B (from memory); the
// fixture curve is invented (H = 40 − 1000·Q: 28 m at 12 L/s).
import { afterAll, beforeAll, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import { fluidAt } from "~/engine";
import { viewerOfUser } from "~/lib/projects/test-kit";
import { submitCheckForm } from "~/lib/fieldchecks/submit.server";
import { getFieldCheck } from "~/lib/fieldchecks/records.server";
import { verdictRule } from "~/lib/fieldchecks";
import { makeMember, type TestMember } from "./harness";
import { fieldsForHead, powerCheckFields, storeSelection } from "./fieldcheck-fixture";

afterAll(() => closeDb());

const RHO20 = fluidAt({ kind: "water" }, 20).density;
let m: TestMember;
let sel = 0;
beforeAll(async () => {
  m = await makeMember("admin");
  sel = (await storeSelection(m.workspaceId, m.userId, undefined, "Edges ruled")).selectionId;
});

async function submit(fields: Record<string, string>) {
  const form = new FormData();
  for (const [k, v] of Object.entries(fields)) form.set(k, v);
  return submitCheckForm(await viewerOfUser(m.userId), sel, form);
}
const at = (extra: Record<string, string>) => fieldsForHead(28 * 1.02, RHO20, { flow: "0.012", ...extra });

const REFUSED: [what: string, fields: Record<string, string>, field: string][] = [
  ["NaN flow", at({ flow: "NaN" }), "flow"],
  ["Infinity discharge pressure", at({ dPressure: "Infinity" }), "dPressure"],
  ["−Infinity suction pressure", at({ sPressure: "-Infinity" }), "sPressure"],
  ["a negative absolute pressure", at({ sRef: "absolute", sPressure: "-1" }), "sPressure"],
  ["a gauge below full vacuum", at({ sPressure: "-101.326" }), "sPressure"],
  ["a negative flow", at({ flow: "-0.001" }), "flow"],
  ["a discharge gauge 30 m below the suction's: head −1.5 m", at({ dElevation: "-30" }), "dPressure"],
  ["flow meter accuracy past 50 %", at({ flowAccuracy: "50.0001" }), "flowAccuracy"],
  ["a negative gauge accuracy", at({ sAccuracy: "-0.1" }), "sAccuracy"],
  ["power accuracy past 20 %", powerCheckFields(25, 5000, RHO20, { powerAccuracy: "20.0001" }), "powerAccuracy"],
  ["an unknown grade", at({ gradeId: "9Z" }), "gradeId"],
];

for (const [what, fields, field] of REFUSED)
  test(`refused with a named field and a 4xx: ${what}`, async () => {
    const r = await submit(fields);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.status).toBeGreaterThanOrEqual(400);
    expect(r.status).toBeLessThan(500);
    expect("errors" in r && Object.keys(r.errors)).toContain(field);
  });

const JUDGED: [what: string, fields: Record<string, string>, rule: RegExp][] = [
  ["a suction vacuum of −50 kPa gauge", at({ sPressure: "-50", dPressure: String((28 * 1.02 * RHO20 * 9.80665) / 1000 - 50) }), /^Tolerance cross of grade 2B, as read .*head \+2\.0 %/],
  ["a zero flow on the meter", at({ flow: "0" }), /\d/],
  ["flow meter and gauge accuracy of 0", at({ flowAccuracy: "0", sAccuracy: "0", dAccuracy: "0" }), /^Tolerance cross of grade 2B, as read .*head \+2\.0 %/],
  ["flow meter accuracy of 50 % (its maximum), head +6 %", fieldsForHead(28 * 1.06, RHO20, { flow: "0.012", flowAccuracy: "50" }), /^No tolerance verdict: the readings' uncertainty/],
  ["gauge accuracy of 10 000 kPa (its maximum)", at({ sAccuracy: "10000", dAccuracy: "10000" }), /^Tolerance cross of grade 2B, as read .*met/],
  ["power accuracy of 0 and of 20 % (its maximum)", powerCheckFields(25, 5000, RHO20, { powerAccuracy: "20" }), /power and efficiency limits/],
  ["power accuracy of 0", powerCheckFields(25, 5000, RHO20, { powerAccuracy: "0" }), /power and efficiency limits/],
];

for (const [what, fields, rule] of JUDGED)
  test(`recorded and judged with a stated rule and its numbers: ${what}`, async () => {
    const r = await submit(fields);
    expect(r.ok, JSON.stringify(r)).toBe(true);
    if (!r.ok) return;
    const c = await getFieldCheck(await viewerOfUser(m.userId), r.id);
    expect(c.readable).toBe(true);
    if (!c.readable) return;
    const said = verdictRule(c.result);
    expect(said, `${c.result.verdict}: ${said}`).toMatch(rule);
    expect(said).toMatch(/\d/);
    if (c.result.verdict === "unknown") expect(said).toMatch(/^No tolerance verdict: /);
  });
