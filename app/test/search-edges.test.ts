// The search page and its read API at their edges: no curve open to the viewer (no library, or a library with nothing
// imported), and filter values the search cannot use in the query string. Each answers 200 with a message that says
// why (page) — never a 500 — or, for the API, its problem+json 400 (an unknown method: systems-api.test.ts). Odd values
// of every query key are also walked by route-walk.test.ts (no 5xx); this checks the words. Real MariaDB and route
// modules; check values: our product rules (the filter's rule and the text typed, quoted).
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import { createLibrary } from "~/lib/libraries";
import { createApiToken } from "~/lib/auth/api-tokens.server";
import { createProject, createSystem } from "~/lib/projects";
import { defaultSystemInput } from "~/lib/projects/hydraulics";
import { viewerOfUser } from "~/lib/projects/test-kit";
import * as searchPage from "~/routes/systems.$id.search";
import * as apiSearch from "~/routes/api.v1.systems.$id.search";
import { call, makeMember, type TestMember } from "./harness";

afterAll(() => closeDb());

let m: TestMember;
let systemId = 0;
let token = "";
type PageData = { locked: unknown[]; message: string | null; filterNotes: string[]; results: unknown[]; stats: { searched: number } | null; powerFilter: unknown };
const page = async (query = "") => {
  const r = await call(searchPage.loader as never, { path: `/systems/${systemId}/search${query}`, params: { id: String(systemId) }, cookie: m.cookie });
  expect(r.status, query).toBe(200);
  return r.body as PageData;
};

beforeAll(async () => {
  m = await makeMember("admin");
  const v = await viewerOfUser(m.userId);
  const p = await createProject(v, { name: "Edges", site: "", description: "" });
  systemId = await createSystem(v, p, "No pumps", { ...defaultSystemInput(), duty: { flow: 20 / 3600, head: 25 } });
  token = (await createApiToken({ userId: m.userId, workspaceId: m.workspaceId, name: "edges", scope: "read" })).token;
});

describe("no curve open to the viewer", () => {
  test("no library, then a library with nothing imported: the page and the API answer 200 with no rows and say none was searched", async () => {
    for (const step of ["no library", "empty library"]) {
      if (step === "empty library") await createLibrary(await viewerOfUser(m.userId), { name: "Nothing yet", description: "" });
      const d = await page();
      expect(d.results, step).toEqual([]);
      // Other tests' shared libraries may be listed as not open on this free plan: the message then points at them.
      const locked = d.locked.length ? "the shared libraries listed below are not open on your plan; import" : "import";
      expect(d.message, step).toBe(`No pump curves are open to you to search: ${locked} a pump library (or ask for one to be shared) first.`);
      const api = await call(apiSearch.loader as never, { path: `/api/v1/systems/${systemId}/search`, params: { id: String(systemId) }, headers: { authorization: `Bearer ${token}` } });
      expect(api.status, step).toBe(200);
      expect((api.body as { message: string; results: unknown[] }).message, step).toBe(d.message);
    }
  });
});

describe("filter values the search cannot use: set aside, and the page says which and why", () => {
  test.each([
    ["0", "Max shaft power must be a number above 0 kW: “0” is not, so no power limit is applied."],
    ["-1", "Max shaft power must be a number above 0 kW: “-1” is not, so no power limit is applied."],
    ["NaN", "Max shaft power must be a number above 0 kW: “NaN” is not a number, so no power limit is applied."],
    ["Infinity", "Max shaft power must be a number above 0 kW: “Infinity” is not a number, so no power limit is applied."],
    ["1e400", "Max shaft power must be a number: “1e400” is out of range, so no power limit is applied."],
    ["1e308", "Max shaft power must be at most 1e12 kW: “1e308” is past it, so no power limit is applied."],
    ["1,500", "Max shaft power “1,500” is ambiguous: 1500 (a thousands comma) or 1.500 (a decimal comma)? Write 1500 or 1 500 for the first, 1.500 or 1.5 for the second, so no power limit is applied."],
  ])("maxPower=%s", async (value, note) => {
    const d = await page(`?maxPower=${encodeURIComponent(value)}`);
    expect(d.filterNotes).toEqual([note]);
    expect(d.powerFilter).toBeNull();
  });

  test("speed=0 and an unknown way to meet the duty", async () => {
    expect((await page("?speed=0")).filterNotes).toEqual(["Speed must be a number above 0 rpm: “0” is not, so no speed filter is applied."]);
    expect((await page("?method=sideways")).filterNotes).toEqual(["Unknown way to meet the duty “sideways” (the search knows direct, trim and speed): set aside, so every way is searched."]);
    expect((await page("?method=sideways&method=trim")).filterNotes).toEqual(["Unknown way to meet the duty “sideways” (the search knows direct, trim and speed): set aside, so only trim is searched."]);
    expect((await page("?maxPower=2.5&speed=2900&method=trim")).filterNotes).toEqual([]);
  });
});
