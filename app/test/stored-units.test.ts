// A user's stored unit settings (users.unit_system, users.units) damaged in the database — text that is not JSON, a unit id
// that is none of its quantity's, a key the account form never writes, a list, a preset that is neither SI nor US — were
// dropped to the default without a word (units.ts picksOf / unitsOf kept what they could and fell back silently). They are
// still set aside — a unit setting is a preference, not data, so the pages show the defaults — but now the account page says
// the stored settings cannot be read, where and what was stored, and that the defaults are shown until the form is saved;
// saving writes sound settings in their place. The API's /me answers as before (never a 500).
// Real route modules, guards and MariaDB (app/test/harness.ts). Check values: our product rules (auth/stored-units.ts, the
// account form's choices in routes/account.tsx), the engine's unit ids and labels (engine/units.ts).
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { eq } from "drizzle-orm";
import { closeDb, db, getPool } from "@db/client.server";
import { users } from "@db/schema";
import { createApiToken } from "~/lib/auth/api-tokens.server";
import * as accountRoute from "~/routes/account";
import * as meApi from "~/routes/api.v1.me";
import { BASE, call, makeMember, userRow, type TestMember } from "./harness";
import { renderPage } from "./render-page";

afterAll(() => closeDb());

type Notice = { text: string; problems: { label: string; message: string; stored: string | null }[]; count: number } | null;
type Page = { user: { unitSystem: string; overrides: Record<string, string> }; unitsUnreadable?: Notice };

const page = (m: TestMember) => call(accountRoute.loader as never, { path: "/account", cookie: m.cookie });
const render = (data: unknown) => {
  return renderPage("/account", accountRoute.default, "/account", data).replace(/<!-- -->/g, "");
};

/** MariaDB refuses a value outside an ENUM in strict mode; without it the value is stored as '' (what a loose import leaves). */
async function storeLoosePreset(userId: string, value: string) {
  const conn = await getPool().getConnection();
  try {
    await conn.query("SET SESSION sql_mode = ''");
    await conn.query("UPDATE users SET unit_system = ? WHERE id = ?", [value, userId]);
  } finally {
    await conn.query("SET SESSION sql_mode = DEFAULT").catch(() => {});
    conn.release();
  }
}

test("control: sound settings are used, and no notice", async () => {
  const m = await makeMember("engineer");
  await db().update(users).set({ unitSystem: "US", units: JSON.stringify({ flow: "L/s" }) }).where(eq(users.id, m.userId));
  const r = await page(m);
  expect(r.status).toBe(200);
  expect((r.body as Page).user).toMatchObject({ unitSystem: "US", overrides: { flow: "L/s" } });
  expect((r.body as Page).unitsUnreadable ?? null).toBeNull();
});

type Case = { name: string; units: string; preset?: string; label: string; message: RegExp; stored: string | null; shownPreset: "SI" | "US" };
const CASES: Case[] = [
  { name: "text that is not JSON", units: '{"flow":"L/s"', label: "the stored unit settings", message: /^Is not valid JSON/, stored: null, shownPreset: "US" },
  { name: "a unit that is none of its quantity's", units: '{"flow":"L/s","head":"furlong"}', label: "unit of head", message: /^Should be one of the units of head: m, ft/, stored: '"furlong"', shownPreset: "US" },
  { name: "a key the account form never writes", units: '{"flow":"L/s","speed":"rpm"}', label: "speed", message: /^Is not a quantity whose unit the account page sets\.$/, stored: '"rpm"', shownPreset: "US" },
  { name: "a list instead of settings", units: '["L/s"]', label: "the stored unit settings", message: /^Should be a group of unit settings/, stored: "a list of 1", shownPreset: "US" },
  { name: "a preset that is neither SI nor US", units: '{"flow":"L/s"}', preset: "metric", label: "unit preset", message: /^Should be SI or US\.$/, stored: '""', shownPreset: "SI" },
];

describe.each(CASES)("stored unit settings: $name", (c) => {
  let m: TestMember;
  let data: Page;
  beforeAll(async () => {
    m = await makeMember("engineer");
    await db().update(users).set({ unitSystem: "US", units: c.units }).where(eq(users.id, m.userId));
    if (c.preset) await storeLoosePreset(m.userId, c.preset);
    const r = await page(m);
    expect(r.status).toBe(200);
    data = r.body as Page;
  });

  test("are set aside: the form shows the defaults (the preset as read, no pick of its own)", () => {
    expect(data.user).toEqual(expect.objectContaining({ unitSystem: c.shownPreset, overrides: {} }));
  });

  test("and the account page says so, where and what was stored (was: nothing said)", () => {
    const notice = data.unitsUnreadable;
    expect(notice?.text).toMatch(/^The unit settings stored with your account cannot be read \(1 problem: /);
    expect(notice?.text).toContain(`: ${c.label}), so the defaults are shown — the ${c.shownPreset} preset's units on every page — until you save your profile below.`);
    expect(notice?.count).toBe(1);
    const p = notice!.problems[0];
    expect([p.label, p.stored]).toEqual([c.label, c.stored]);
    expect(p.message).toMatch(c.message);
    // The page: the sentence, and the problem listed as every stored document's are (components/StoredProblems.tsx).
    const html = render(data);
    expect(html).toContain('data-testid="units-unreadable">The unit settings stored with your account cannot be read');
    expect(html).toContain(`<span class="font-semibold">${c.label}</span>: `);
  });

  test("/api/v1/me answers for the session and for a token (never a 500)", async () => {
    const s = await call(meApi.loader as never, { path: "/api/v1/me", cookie: m.cookie });
    expect([s.status, (s.body as { userId: string }).userId]).toEqual([200, m.userId]);
    const { token } = await createApiToken({ userId: m.userId, workspaceId: m.workspaceId, name: "units", scope: "read" });
    const t = await call(meApi.loader as never, { path: "/api/v1/me", headers: { authorization: `Bearer ${token}` } });
    expect([t.status, (t.body as { via: string }).via]).toEqual([200, "token"]);
  });

  test("saving the profile writes sound settings in their place, and the notice goes", async () => {
    const r = await call(accountRoute.action as never, { path: "/account", cookie: m.cookie, headers: { origin: BASE }, form: { intent: "profile", name: "Una Units", unitSystem: "SI", "unit.flow": "L/s" } });
    expect(r.status).toBe(200);
    const row = await userRow(m.userId);
    expect([row.unitSystem, JSON.parse(row.units)]).toEqual(["SI", { flow: "L/s" }]);
    expect(((await page(m)).body as Page).unitsUnreadable ?? null).toBeNull();
  });
});
