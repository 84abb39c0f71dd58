// What the field page sends to the browser of a frozen selection: what a check is judged with, not the
// owner's commercial figures (purchase price, duty-cycle energy, life-cycle cost). Product rule: the page is
// read by contractors of other workspaces. Real MariaDB through the route's loader.
import { afterAll, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import { call, makeMember } from "./harness";
import { frozenFixture, storeSelection } from "./fieldcheck-fixture";
import * as fieldForm from "~/routes/field.selections.$id";

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
