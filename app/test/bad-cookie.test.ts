// A Cookie header with a bad percent-escape in any cookie (a forged one, or another app's on the same
// host: cookies are shared across ports) made every page and API call answer 500 — lucia's cookie
// reader throws URIError (found by the helper "attack", 2026-12-02). Now such a header reads as no
// session, or as the session its dm_session cookie names when that one is whole.
import { afterAll, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import * as projectsPage from "~/routes/projects";
import * as apiMe from "~/routes/api.v1.me";
import { call, makeMember } from "./harness";

afterAll(() => closeDb());

test("dm_session=%FF%FE: the sign-in redirect for a page and 401 problem+json for the API (were 500)", async () => {
  const page = await call(projectsPage.loader as never, { path: "/projects", cookie: "dm_session=%FF%FE" });
  expect(page.status).toBe(302);
  expect(page.location).toMatch(/^\/signin/);
  const api = await call(apiMe.loader as never, { path: "/api/v1/me", cookie: "dm_session=%FF%FE" });
  expect(api.status).toBe(401);
  expect(api.headers.get("content-type")).toBe("application/problem+json");
});

test("another cookie with a bad escape beside a good session: still signed in (was 500)", async () => {
  const m = await makeMember("engineer");
  for (const cookie of [`other=%E0%A4%A; ${m.cookie}`, `${m.cookie}; other=%FF`]) {
    const r = await call(apiMe.loader as never, { path: "/api/v1/me", cookie });
    expect(r.status, cookie).toBe(200);
    expect((r.body as { userId: string }).userId).toBe(m.userId);
  }
});
