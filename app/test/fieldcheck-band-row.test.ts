// The check page's "Flow band from gauge accuracy" row (no flow meter): its width with the decimals that keep it apart from
// the ±10 % past which the check says to fit a flow meter, the same number as the warning. Was: "width ±10 %" printed next
// to the warning "…a flow band of ±10.00001 %, wider than ±10 %". Real route module, guards and MariaDB (app/test/harness.ts).
// Check values: the fixture curve is invented, H = 40 − 1000·Q (28 m at 12 L/s), so a head uncertainty ΔH gives a band
// of ±ΔH / 1000 m³/s, ±ΔH / 12 m of 12 L/s (hand calculation); ΔH = √(a² + a²)/(ρ·g) (common practice, quadrature); the
// ±10 % is the engine's WIDE_FLOW_BAND (common practice).
import { afterAll, beforeAll, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import { fluidAt, G0 } from "~/engine";
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
let selectionId = 0;

beforeAll(async () => {
  m = await makeMember("admin");
  selectionId = (await storeSelection(m.workspaceId, m.userId, undefined, "Band")).selectionId;
});

/** The page of a check at 28 m without a flow meter whose gauges give a band of ±`half` (fraction) of 12 L/s: the row's width and the warning's. */
async function band(half: number) {
  const gauge = String((half * 12 * RHO20 * G0) / Math.SQRT2 / 1000); // kPa each
  const p = parseCheckFields(fieldsForHead(28, RHO20, { sAccuracy: gauge, dAccuracy: gauge }), { kind: "water" });
  if (!p.ok) throw new Error(JSON.stringify(p.errors));
  const v = await viewerOfUser(m.userId);
  const { id } = await recordFieldCheck(v, selectionId, { readings: p.readings, fields: p.fields, notes: "", gradeId: "2B" }, [], { notify: false });
  const { html } = await loadedPage(m, checkPage, "/field/checks/:id", `/field/checks/${id}`, { id: String(id) });
  return { width: html.match(/width (±[^ ]+ %) of the flow/)?.[1] ?? "(no row)", warned: html.match(/a flow band of (±[^ ]+ %), wider than ±10 %/)?.[1] ?? null };
}

test("±10 % × (1 + 1e-6): the row reads ±10.00001 %, as the warning does, never ±10 %", async () => {
  const past = await band(0.1 * (1 + 1e-6));
  expect(past.warned).toBe("±10.00001 %");
  expect(past.width).toBe("±10.00001 %");
});

test("±10 % × (1 − 1e-6): no warning, and the row reads ±9.99999 %", async () => {
  const within = await band(0.1 * (1 - 1e-6));
  expect(within.warned).toBeNull();
  expect(within.width).toBe("±9.99999 %");
});
