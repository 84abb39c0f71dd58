// One memo per request (request-scope.server.ts): React Router gives the root middleware, the root
// loader and the route's loader Request objects of their own, so the session and the workspace list
// are shared through the scope the root middleware opens. Reads (GET, HEAD) share; writes never do;
// outside a scope nothing is shared between Request objects. Against the real MariaDB (sessions).
import { afterAll, describe, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import { endSession, getAuth } from "../auth/session.server";
import { membershipFor } from "../auth/guards.server";
import { makeMember } from "~/test/harness";
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
