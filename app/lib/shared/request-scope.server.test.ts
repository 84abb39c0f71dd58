// One memo per request (request-scope.server.ts): React Router gives the root middleware, the root
// loader and the route's loader Request objects of their own, so the session and the workspace list
// are shared through the scope the root middleware opens. Reads (GET, HEAD) share; writes never do;
// outside a scope nothing is shared between Request objects. Against the real MariaDB (sessions).
import { afterAll, describe, expect, test, vi } from "vitest";
import { eq } from "drizzle-orm";
import { closeDb, db, getPool } from "@db/client.server";
import { memberships, sessions, users } from "@db/schema";
import { endSession, getAuth } from "../auth/session.server";
import { authWithWorkspaces, membershipFor, workspacesOf } from "../auth/guards.server";
import { makeMember, makeWorkspace } from "~/test/harness";
import { oncePerRequest, requestScope } from "./request-scope.server";

afterAll(() => closeDb());

const BASE = "http://127.0.0.1:5173";
const req = (cookie: string, method = "GET") => new Request(`${BASE}/projects`, { method, headers: { cookie } });

describe("oncePerRequest", () => {
  test("one make per key inside a GET or HEAD scope; every call makes on a write and outside a scope", () => {
    let made = 0;
    const make = () => ++made;
    for (const method of ["GET", "HEAD"]) {
      made = 0;
      requestScope(new Request(BASE, { method }), () => {
        expect([oncePerRequest("k", make), oncePerRequest("k", make), oncePerRequest("j", make)]).toEqual([1, 1, 2]);
      });
    }
    for (const method of ["POST", "PUT", "DELETE", "PATCH"]) {
      made = 0;
      requestScope(new Request(BASE, { method }), () => {
        expect([oncePerRequest("k", make), oncePerRequest("k", make)], method).toEqual([1, 2]);
      });
    }
    made = 0;
    expect([oncePerRequest("k", make), oncePerRequest("k", make)]).toEqual([1, 2]);
  });

  test("two requests at once keep their own memos (the scope follows each request's async work)", async () => {
    const seen: number[] = [];
    let n = 0;
    const one = () =>
      requestScope(new Request(BASE), async () => {
        const a = oncePerRequest("k", () => ++n);
        await new Promise((r) => setTimeout(r, 5));
        seen.push(a, oncePerRequest("k", () => ++n));
      });
    await Promise.all([one(), one()]);
    expect(seen.sort()).toEqual([1, 1, 2, 2]);
  });
});

describe("the session and workspace list of one page", () => {
  test("inside a GET scope, distinct Request objects with one cookie share one session lookup and one workspace list", async () => {
    const m = await makeMember("engineer");
    await requestScope(req(m.cookie), async () => {
      const [a, b] = [getAuth(req(m.cookie)), getAuth(req(m.cookie))];
      expect(a).toBe(b);
      const auth = (await a)!;
      expect(auth.user.id).toBe(m.userId);
      expect(membershipFor(auth)).toBe(membershipFor(auth));
      expect((await membershipFor(auth)).current?.id).toBe(m.workspaceId);
    });
    // Outside a scope (loaders called directly): each Request its own lookup, as before.
    expect(getAuth(req(m.cookie))).not.toBe(getAuth(req(m.cookie)));
  });

  test("a POST scope shares nothing: after signing out in the action, the next lookup sees no session", async () => {
    const m = await makeMember("engineer");
    await requestScope(req(m.cookie, "POST"), async () => {
      expect((await getAuth(req(m.cookie, "POST")))?.user.id).toBe(m.userId);
      await endSession(req(m.cookie, "POST"));
      expect(await getAuth(req(m.cookie, "POST"))).toBeNull();
    });
  });
});

describe("the session check and the workspace list in one round trip (authWithWorkspaces)", () => {
  /** The pool's queries in order of start and end, named by the table they read first. */
  function watchQueries() {
    const pool = getPool();
    const events: string[] = [];
    const real = pool.query.bind(pool);
    const spy = vi.spyOn(pool, "query").mockImplementation(async (q: unknown, params?: unknown) => {
      const text = typeof q === "string" ? q : (q as { sql: string }).sql;
      const name = /from `sessions`[^]*join `memberships`/i.test(text) ? "workspaces" : /from `sessions`/i.test(text) ? "session" : "other";
      events.push(`start ${name}`);
      try {
        return await real(q as never, params as never);
      } finally {
        events.push(`end ${name}`);
      }
    });
    return { events, stop: () => spy.mockRestore() };
  }

  test("inside a GET scope the list is asked for before the session check has answered, and is the signed-in user's", async () => {
    const m = await makeMember("engineer");
    const other = await makeWorkspace();
    await db().insert(memberships).values({ workspaceId: other.id, userId: m.userId, role: "viewer" });
    const stranger = await makeMember("admin", other.id); // another user in the same workspace: not m's list
    const w = watchQueries();
    try {
      const got = await requestScope(req(m.cookie), () => authWithWorkspaces(req(m.cookie)));
      expect(got?.auth.user.id).toBe(m.userId);
      // Both reads were on their way before either came back (before this change: session, then list).
      expect(w.events.indexOf("start workspaces"), w.events.join(", ")).toBeGreaterThanOrEqual(0);
      expect(w.events.indexOf("start workspaces"), w.events.join(", ")).toBeLessThan(w.events.indexOf("end session"));
      expect(got!.membership.list.map((x) => x.id)).toEqual((await workspacesOf(m.userId)).map((x) => x.id));
      expect(got!.membership.list.map((x) => x.id).sort()).toEqual([m.workspaceId, other.id].sort());
      expect(got!.membership.current?.id).toBe(m.workspaceId); // the user's current workspace, not the first by name
    } finally {
      w.stop();
    }
    // The other member's own session gives that member's list and role.
    const s = await requestScope(req(stranger.cookie), () => authWithWorkspaces(req(stranger.cookie)));
    expect(s!.membership.list.map((x) => [x.id, x.role])).toEqual([[other.id, "admin"]]);
  });

  test("a switch of current workspace is followed; a forged, an expired and a missing cookie give no one and no list", async () => {
    const m = await makeMember("engineer");
    const second = await makeWorkspace();
    await db().insert(memberships).values({ workspaceId: second.id, userId: m.userId, role: "admin" });
    await db().update(users).set({ currentWorkspaceId: second.id }).where(eq(users.id, m.userId));
    const got = await requestScope(req(m.cookie), () => authWithWorkspaces(req(m.cookie)));
    expect([got!.membership.current?.id, got!.membership.current?.role]).toEqual([second.id, "admin"]);

    const forged = "dm_session=zzzzzzzzzzzzzzzzzzzzzzzzzzzzzzzzzzzzzzzz";
    expect(await requestScope(req(forged), () => authWithWorkspaces(req(forged)))).toBeNull();
    expect(await requestScope(req(""), () => authWithWorkspaces(req("")))).toBeNull();
    const sid = m.cookie.split("=")[1];
    await db().update(sessions).set({ expiresAt: new Date(Date.now() - 1000) }).where(eq(sessions.id, sid));
    expect(await requestScope(req(m.cookie), () => authWithWorkspaces(req(m.cookie)))).toBeNull();
  });

  test("in a POST scope (nothing shared) no early list is read: the session first, then one list", async () => {
    const m = await makeMember("engineer");
    const w = watchQueries();
    try {
      const got = await requestScope(req(m.cookie, "POST"), () => authWithWorkspaces(req(m.cookie, "POST")));
      expect(got?.membership.current?.id).toBe(m.workspaceId);
      expect(w.events.filter((e) => e.startsWith("start")), w.events.join(", ")).toEqual(["start session", "start workspaces"]);
      expect(w.events.indexOf("end session")).toBeLessThan(w.events.indexOf("start workspaces"));
    } finally {
      w.stop();
    }
  });
});
