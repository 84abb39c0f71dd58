// The phone's queue ("On this phone", PendingChecks.tsx) shows each kept check's readings worked out again with the engine
// the phone has now (pending-shown.ts), the verdict kept when it was saved beside it where they differ: "outside tolerance
// against grade 2B when saved on 2026-12-04; today: within tolerance", with today's rule and numbers. Was: the kept verdict
// alone. Check values: ISO 9906:2012 grade 2B head ±5 % (from memory, TOLERANCE_GRADES); the fixture curve is invented
// (H = 40 − 1000·Q: 28 m at 12 L/s, app/test/fieldcheck-fixture.ts), so 28 × 1.02 m at 12 L/s is +2 % (hand).
import { createElement } from "react";
import { renderToString } from "react-dom/server";
import { expect, test } from "vitest";
import { fluidAt } from "~/engine";
import { SI_UNITS } from "~/lib/shared/units";
import { fieldsForHead, frozenFixture } from "~/test/fieldcheck-fixture";
import { checkOnPhone } from "./local-check";
import { PendingChecks } from "./PendingChecks";
import { pendingShown } from "./pending-shown";
import type { QueuedCheck } from "./queue";

const RHO20 = fluidAt({ kind: "water" }, 20).density;
const frozen = frozenFixture();

/** A check kept from `fields`, its kept verdict overwritten by `kept` (as if worked out by an earlier copy of the page). */
function keptCheck(fields: Record<string, string>, kept?: "fail", withFrozen = true): QueuedCheck {
  const r = checkOnPhone(fields, frozen, SI_UNITS);
  if (!r.ok) throw new Error(JSON.stringify(r.errors));
  const local = kept ? { ...r.local, verdict: kept, verdictText: "outside tolerance" } : r.local;
  return { clientId: "c1", owner: "u/1", selectionId: 1, selectionTitle: "S", basedOn: "fp1", fields, photos: [], createdAt: "2026-12-04T05:00:00Z", local, status: "waiting", ...(withFrozen ? { frozen } : {}) };
}
const panel = (c: QueuedCheck, selection?: { fingerprint: string; frozen: typeof frozen }) =>
  renderToString(createElement(PendingChecks, { pending: { queued: [c], sent: [], refresh: async () => {}, send: async () => {}, setSent: () => {} } as never, unitSystem: SI_UNITS, selection }))
    .replace(/<!-- -->/g, "")
    .replace(/&#x27;/g, "'");

test("kept as 'fail', today 'pass': the panel says both, labelled, with today's rule and numbers", () => {
  const html = panel(keptCheck(fieldsForHead(28 * 1.02, RHO20, { flow: "0.012" }), "fail"));
  expect(html).toContain("outside tolerance against grade 2B when saved on 2026-12-04; today: within tolerance."); // was: "outside tolerance against grade 2B."
  expect(html).toContain("Tolerance cross of grade 2B, as read (either arm meets it): head +2.0 % of the curve's 28.0 m at the measured flow (allowed −5 % to +5 %), met;");
  expect(html).toContain('data-differs="yes"');
});

test("a check kept before checks carried their selection: worked out against the page's when it is the same one, else said so", () => {
  const c = keptCheck(fieldsForHead(28 * 1.02, RHO20, { flow: "0.012" }), "fail", false);
  expect(panel(c, { fingerprint: "fp1", frozen })).toContain("today: within tolerance.");
  const elsewhere = pendingShown(c, { fingerprint: "another", frozen }, SI_UNITS);
  expect([elsewhere.verdict, elsewhere.judgedToday]).toEqual(["fail", false]);
  expect(elsewhere.label).toBe("outside tolerance against grade 2B when saved on 2026-12-04 (not worked out again on this page: the selection's own field page does)");
});

test("today's verdict flips a millionth either side of 2B's +5 % on head", () => {
  const at = (ratio: number) => pendingShown(keptCheck(fieldsForHead(28 * 1.05 * ratio, RHO20, { flow: "0.012" })), null, SI_UNITS);
  const inside = at(1 - 1e-6);
  const outside = at(1 + 1e-6);
  expect([inside.verdict, inside.today]).toEqual(["pass", null]);
  expect(inside.rule).toContain("head +4.9999 % of the curve's ⟦");
  expect(inside.rule).toContain("(allowed −5 % to +5 %), met;");
  expect([outside.verdict, outside.today]).toEqual(["fail", null]);
  expect(outside.rule).toContain("head +5.0001 % of the curve's ⟦");
  expect(outside.rule).toContain("(allowed −5 % to +5 %), not met;");
});
