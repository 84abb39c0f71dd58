// What the field page sends to the browser of a frozen selection: what a check is judged with, not the
// owner's commercial figures (purchase price, duty-cycle energy, life-cycle cost). Product rule: the page is
// read by contractors of other workspaces. Real MariaDB through the route's loader.
import { afterAll, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import { call, makeMember } from "./harness";
import { frozenFixture, storeSelection } from "./fieldcheck-fixture";
import * as fieldForm from "~/routes/field.selections.$id";
import { createElement } from "react";
import { renderToString } from "react-dom/server";
import { SelectionSummary, type SummarySelection } from "~/components/field/SelectionSummary";
import { DEFAULT_ADJUSTMENT } from "~/lib/projects/hydraulics";
import { SI_UNITS, US_UNITS } from "~/lib/shared/units";
import { eq } from "drizzle-orm";
import { db } from "@db/client.server";
import { users } from "@db/schema";

afterAll(() => closeDb());

test("GET /field/selections/:id: the frozen selection comes without its energy, purchase price, life-cycle cost and yearly energy cost; the pump and result are there", async () => {
  const m = await makeMember("engineer");
  // A whole energy part as frozen (CandidateEnergy: a part missing its fields is a damaged document, refused with 409).
  const energy = {
    control: "fixed-speed", controlLabel: "Fixed speed", profileSource: "common-practice", profileLabel: "Common practice", cycle: null, cycleError: "no motor rating or efficiency: no duty cycle",
    annualCost: 1234.5, purchasePrice: 2450.5, costMissing: null, assumptions: [],
    lcc: { purchase: 2450.5, purchaseGiven: true, yearly: [], energyPresentValue: 96314.9, total: 98765.4, cumulative: [], source: "invented" },
  };
  expect(frozenFixture().result.figures?.annualCost, "the fixture has a yearly energy cost to hide").toBeGreaterThan(0);
  const { selectionId } = await storeSelection(m.workspaceId, m.userId, { ...frozenFixture(), energy } as never, "Priced");
  const r = await call(fieldForm.loader as never, { path: `/field/selections/${selectionId}`, params: { id: String(selectionId) }, cookie: m.cookie });
  expect(r.status).toBe(200);
  const body = JSON.stringify(r.body);
  for (const secret of ["purchasePrice", "2450.5", "98765.4", '"lcc"']) expect(body, secret).not.toContain(secret);
  const figures = (r.body as { selection: { frozen: { result: { figures: { annualCost: unknown; motor: { annualCost: unknown } } } } } }).selection.frozen.result.figures;
  expect(figures.annualCost).toBeNull(); // the owner's tariff at work
  expect(figures.motor.annualCost).toBeNull();
  const frozen = (r.body as { selection: { frozen: Record<string, unknown> } }).selection.frozen;
  expect(Object.keys(frozen)).toEqual(expect.arrayContaining(["system", "pump", "adjustment", "result"]));
  expect(frozen).not.toHaveProperty("energy");
});

// The setting on the field page is the report's (setting-step.ts: whole rpm, whole mm; one decimal more off the step), so the
// contractor sets what the report says. A selection frozen before settings were rounded up holds a solved 1644.3 rpm: the field
// page showed "1644 rpm" (rounded to the nearest, where the pump falls short) while the report shows "1644.3 rpm"; a trimmed
// impeller was not shown at all. Check values: the affinity laws (speed = ratio × the curve's 2900 rpm, common practice) and
// the fixture's made-up 200 mm impeller.
test("GET /field/selections/:id: the design speed and a trimmed impeller in the report's words, old selections included", async () => {
  const m = await makeMember("engineer");
  const shown = async (frozen: ReturnType<typeof frozenFixture>, name: string) => {
    const { selectionId } = await storeSelection(m.workspaceId, m.userId, frozen, name);
    const r = await call(fieldForm.loader as never, { path: `/field/selections/${selectionId}`, params: { id: String(selectionId) }, cookie: m.cookie });
    expect(r.status).toBe(200);
    const selection = (r.body as { selection: SummarySelection }).selection;
    return renderToString(createElement(SelectionSummary, { selection, unitSystem: SI_UNITS })).replace(/<!-- -->/g, "");
  };
  const old = frozenFixture({ adjustment: { ...DEFAULT_ADJUSTMENT, method: "speed" } });
  const before = { ...old, result: { ...old.result, ratio: 1644.3 / 2900, solvedRatio: undefined } };
  const html = await shown(before as never, "Old speed");
  expect(html).toContain("1644.3 rpm");
  expect(html).not.toMatch(/>1644 rpm</);
  const now = await shown(old, "New speed");
  expect(now).toContain(`${Math.round(old.result.ratio * 2900)} rpm`); // on the whole-rpm step (the rounding rule), no decimal
  expect(Number.isInteger(Number((old.result.ratio * 2900).toPrecision(12)))).toBe(true);
  const t = frozenFixture();
  const trimmed = { ...t, adjustment: { ...t.adjustment, method: "trim" as const }, pump: { ...t.pump, impellerDiameter: 0.2 }, result: { ...t.result, ratio: 0.91 } };
  const trim = await shown(trimmed, "Trimmed");
  expect(trim).toContain("trimmed to Ø182 mm");
  expect(trim).toContain("2900 rpm"); // the speed as published
});

// A trim is set in whole mm for every reader (setting-step.ts): the report's Adjustment writes it "Ø7.17 in [182 mm]" to a US
// reader, the whole mm a site turns the impeller to beside the inches; the field page, where the contractor checks the pump
// against the report, wrote "trimmed to Ø7.17 in" alone. Check values: the fixture's made-up 200 mm impeller × 0.91 = 182 mm;
// 182 mm / 25.4 mm per inch = 7.165 in (the inch is 25.4 mm exactly, NIST SP 811).
test("GET /field/selections/:id, a US reader: the trimmed impeller in inches with the whole mm it is set in, as the report", async () => {
  const m = await makeMember("engineer");
  await db().update(users).set({ unitSystem: "US" }).where(eq(users.id, m.userId));
  const t = frozenFixture();
  const trimmed = { ...t, adjustment: { ...t.adjustment, method: "trim" as const }, pump: { ...t.pump, impellerDiameter: 0.2 }, result: { ...t.result, ratio: 0.91 } };
  const { selectionId } = await storeSelection(m.workspaceId, m.userId, trimmed, "Trimmed US");
  const r = await call(fieldForm.loader as never, { path: `/field/selections/${selectionId}`, params: { id: String(selectionId) }, cookie: m.cookie });
  expect(r.status).toBe(200);
  const selection = (r.body as { selection: SummarySelection }).selection;
  const html = renderToString(createElement(SelectionSummary, { selection, unitSystem: US_UNITS })).replace(/<!-- -->/g, "");
  expect(/data-testid="design-impeller">([^<]*)</.exec(html)?.[1]).toBe("trimmed to Ø7.17 in [182 mm]");
});
