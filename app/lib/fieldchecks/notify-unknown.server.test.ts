// The engineer's e-mail for a check with a flow meter but no tolerance verdict names the reason the check gives, with its
// rule and numbers: a measured speed outside 50–120 % of the curve's (ISO 9906, from memory; SPEED_RANGE), or a viscous
// liquid outside ANSI/HI 9.6.7 (B above 40, from memory) — it said "the measured speed is too far from the curve's" for both.
// Real mail outbox and MariaDB (app/test/harness.ts). Check values: the fixture curve (invented, H = 40 − 1000·Q at
// 2900 rpm; app/test/fieldcheck-fixture.ts); 5 000 cSt gives B ≈ 43 on it (liquid-curve.test.ts's hand estimate).
import { afterAll, beforeAll, expect, test } from "vitest";
import { desc, eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { outbox } from "@db/schema";
import { fluidAt } from "~/engine";
import { viewerOfUser } from "~/lib/projects/test-kit";
import { makeMember, type TestMember } from "~/test/harness";
import { fieldsForHead, frozenFixture } from "~/test/fieldcheck-fixture";
import { evaluateCheck, parseCheckFields } from "./index";
import { notifyEngineer } from "./notify.server";
import type { Viewer } from "../libraries";

afterAll(() => closeDb());

let m: TestMember;
let v: Viewer;
const times = { takenAt: null, recordedAt: "2026-12-03T09:00:00Z", text: "recorded 2026-12-03 09:00 UTC", warnings: [] } as never;

beforeAll(async () => {
  m = await makeMember("admin");
  v = await viewerOfUser(m.userId);
});

async function mailFor(f: ReturnType<typeof frozenFixture>, fields: Record<string, string>, liquid: "water" | "custom") {
  const p = parseCheckFields(fields, { kind: liquid });
  if (!p.ok) throw new Error(JSON.stringify(p.errors));
  const r = evaluateCheck(f, p.readings, "2B");
  expect(r.verdict).toBe("unknown");
  await notifyEngineer(v, { title: "Notice", projectName: "Project", createdBy: m.userId, projectCreatedBy: null }, 1, r, "new", times);
  const [mail] = await db().select().from(outbox).where(eq(outbox.toAddress, m.email)).orderBy(desc(outbox.id)).limit(1);
  return mail.textBody;
}

test("a speed outside the affinity range: the mail gives the measured speed, its share of the curve's and the range", async () => {
  const text = await mailFor(frozenFixture(), fieldsForHead(28, fluidAt({ kind: "water" }, 20).density, { flow: "0.012", rpm: "1400" }), "water");
  // 1400 / 2900 = 48.3 % (hand calculation), below 50 %.
  expect(text).toContain("No tolerance verdict: the measured speed (1400 rpm) is 48.3 % of the curve's 2900 rpm, outside the 50 %–120 %");
});

test("a viscous liquid outside ANSI/HI 9.6.7: the mail gives B and the method's limit, not the speed", async () => {
  const oil = { kind: "custom" as const, name: "Test oil", density: 900, dynamicViscosity: 5000e-6 * 900, vaporPressure: 100 };
  const text = await mailFor(frozenFixture({ input: { fluid: oil } }), fieldsForHead(20, 900, { flow: "0.012" }), "custom");
  // Was: "No tolerance verdict: the measured speed is too far from the curve's to judge against it (the check says why)."
  expect(text).not.toContain("the measured speed is too far");
  expect(text).toMatch(/No tolerance verdict: the ANSI\/HI 9\.6\.7 parameter B for Test oil is 4\d\.\d, above 40, outside the method's range/);
});
