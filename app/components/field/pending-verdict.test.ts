// What the phone shows of a check it keeps to send ("Worked out on this phone", PendingChecks.tsx from local-check.ts): the
// verdict with its grade and its rule and numbers on flow and head (cross.ts `crossSummary`), or why there is none
// (`verdictNote`). Was: "…, within tolerance." / "…, outside tolerance." with the delivered point only, a millionth apart.
// Check values: ISO 9906:2012 grade 2B as in TOLERANCE_GRADES, from memory (head ±5 %); the fixture curve is invented
// (H = 40 − 1000·Q: 28 m at 12 L/s, app/test/fieldcheck-fixture.ts); water's vapour pressure from the engine (IAPWS-IF97).
import { createElement } from "react";
import { renderToString } from "react-dom/server";
import { describe, expect, test } from "vitest";
import { fluidAt, G0, STANDARD_ATMOSPHERE } from "~/engine";
import { SI_UNITS } from "~/lib/shared/units";
import { fieldsForHead, frozenFixture } from "~/test/fieldcheck-fixture";
import { checkOnPhone } from "./local-check";
import { PendingChecks } from "./PendingChecks";
import type { QueuedCheck } from "./queue";

const RHO20 = fluidAt({ kind: "water" }, 20).density;
const frozen = frozenFixture();

/** The phone's words for a check kept from `fields`: the "On this phone" panel rendered with it waiting. */
function shown(fields: Record<string, string>): string {
  const r = checkOnPhone(fields, frozen, SI_UNITS);
  if (!r.ok) throw new Error(JSON.stringify(r.errors));
  const c: QueuedCheck = { clientId: "c1", owner: "u/1", selectionId: 1, selectionTitle: "S", basedOn: "f", fields, photos: [], createdAt: "2026-12-04T05:00:00Z", local: r.local, status: "waiting", frozen };
  const pending = { queued: [c], sent: [], refresh: async () => {}, send: async () => {}, setSent: () => {} };
  return renderToString(createElement(PendingChecks, { pending: pending as never, unitSystem: SI_UNITS })).replace(/<!-- -->/g, "").replace(/&#x27;/g, "'");
}

describe("a millionth either side of 2B's +5 % on head", () => {
  test("within tolerance beside +4.9999 %, outside beside +5.0001 %, each with the grade and its allowance", () => {
    const inside = shown(fieldsForHead(28 * (1.05 - 1e-6), RHO20, { flow: "0.012" }));
    const outside = shown(fieldsForHead(28 * (1.05 + 1e-6), RHO20, { flow: "0.012" }));
    expect(inside).toContain("within tolerance against grade 2B.");
    expect(inside).toContain("Tolerance cross of grade 2B, as read (either arm meets it): head +4.9999 % of the curve's 28.0 m at the measured flow (allowed −5 % to +5 %), met;");
    expect(outside).toContain("outside tolerance against grade 2B.");
    expect(outside).toContain("head +5.0001 % of the curve's 28.0 m at the measured flow (allowed −5 % to +5 %), not met;");
  });
});

test("no tolerance verdict: the reason with its numbers (a suction reading below the vapour pressure)", () => {
  const s = fluidAt({ kind: "water" }, 20).vaporPressure * (1 - 1e-6) - STANDARD_ATMOSPHERE; // Pa gauge
  const html = shown(fieldsForHead(0, RHO20, { pressureUnit: "Pa", sPressure: String(s), dPressure: String(s + 28 * RHO20 * G0), flow: "0.012" }));
  expect(html).toContain("no tolerance verdict against grade 2B.");
  expect(html).toMatch(/No tolerance verdict: the suction reading \([−-]99\.0 kPa gauge, 2\.339212 kPa absolute/);
  expect(html).not.toContain("⟦");
});
