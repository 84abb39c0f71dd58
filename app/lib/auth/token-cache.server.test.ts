// The verified-token cache (token-cache.server.ts) against the real MariaDB: a token is looked up once
// per window, and every change made through the services takes effect at once in this process.
import { afterAll, describe, expect, test } from "vitest";
import { eq } from "drizzle-orm";
import { closeDb, db, getPool, withTransaction } from "@db/client.server";
import { apiTokens, memberships } from "@db/schema";
import { makeMember } from "~/test/harness";
import { createApiToken, revokeApiToken } from "./api-tokens.server";
import { changeRole, removeMember } from "../workspaces";
import { requireApi } from "./guards.server";
import { TOKEN_CACHE_MS, cachedToken, forgetTokens, rememberToken, tokenGeneration } from "./token-cache.server";
import { SI_UNITS } from "../shared/units";

afterAll(() => closeDb());

const call = (token: string) => new Request("http://127.0.0.1/api/v1/me", { headers: { authorization: `Bearer ${token}` } });
const status = (p: Promise<unknown>) => p.then(() => 200, (e: unknown) => (e instanceof Response ? e.status : Promise.reject(e)));

describe("verified API tokens are remembered for a few seconds", () => {
  test("a token revoked behind the services' back stays trusted only until the cache is cleared (the documented window)", async () => {
    const m = await makeMember("engineer");
    const { id, token } = await createApiToken({ userId: m.userId, workspaceId: m.workspaceId, name: "cache", scope: "read" });
    expect(await status(requireApi(call(token), "library.read"))).toBe(200);
    // Straight to the table, as another app process would: this process still trusts its cached answer…
    await db().update(apiTokens).set({ revokedAt: new Date() }).where(eq(apiTokens.id, id));
    expect(await status(requireApi(call(token), "library.read"))).toBe(200);
    // …until its window ends (simulated by clearing), then the database answers again.
    forgetTokens();
    expect(await status(requireApi(call(token), "library.read"))).toBe(401);
  });

  test("revoking through the service takes effect at once", async () => {
    const m = await makeMember("engineer");
    const { id, token } = await createApiToken({ userId: m.userId, workspaceId: m.workspaceId, name: "cache", scope: "read" });
    expect(await status(requireApi(call(token), "library.read"))).toBe(200);
    expect(await revokeApiToken(m.userId, id)).toBe(true);
    expect(await status(requireApi(call(token), "library.read"))).toBe(401);
  });

  test("a role change and a removal take effect at once", async () => {
    const admin = await makeMember("admin");
    const m = await makeMember("engineer", admin.workspaceId);
    const { token } = await createApiToken({ userId: m.userId, workspaceId: m.workspaceId, name: "cache", scope: "write" });
    expect(await status(requireApi(call(token), "project.write"))).toBe(200);
    const [row] = await db().select({ id: memberships.id }).from(memberships).where(eq(memberships.userId, m.userId));
    expect(await changeRole(m.workspaceId, row.id, "viewer")).toEqual({ changed: true, withdrawnSentByThem: 0 });
    expect(await status(requireApi(call(token), "project.write"))).toBe(403); // viewers may not write projects (permissions.ts)
    expect(await removeMember(m.workspaceId, row.id)).toMatchObject({ removed: true });
    expect(await status(requireApi(call(token), "library.read"))).toBe(401);
  });

  test("scope and role are still checked on a cached caller", async () => {
    const m = await makeMember("engineer");
    const { token } = await createApiToken({ userId: m.userId, workspaceId: m.workspaceId, name: "cache", scope: "read" });
    expect(await status(requireApi(call(token), "library.read"))).toBe(200);
    expect(await status(requireApi(call(token), "project.write"))).toBe(403); // read scope, cached or not
  });

  test("entries expire after TOKEN_CACHE_MS", () => {
    rememberToken("h-expiry", { caller, tokenId: 1, lastUsedAt: 0 }, tokenGeneration(), 1_000);
    expect(cachedToken("h-expiry", 1_000 + TOKEN_CACHE_MS - 1)).not.toBeNull();
    expect(cachedToken("h-expiry", 1_000 + TOKEN_CACHE_MS)).toBeNull();
  });
});

const caller = { userId: "u", workspace: { id: 1, name: "w", slug: "w", plan: "free" as const }, role: "engineer" as const, via: "token" as const, scope: "read" as const, units: SI_UNITS };

/** Resolves once `check` answers true (polled every 20 ms; fails after 15 s). A wait for a state, not a timing assertion. */
async function until(what: string, check: () => Promise<boolean>) {
  for (const end = Date.now() + 15_000; Date.now() < end; await new Promise((r) => setTimeout(r, 20))) if (await check()) return;
  throw new Error(`never happened: ${what}`);
}

describe("a lookup in flight when the cache is cleared does not put its answer back", () => {
  test("the cache's own order: lookup begins, cache cleared, lookup's answer → not remembered", () => {
    const began = tokenGeneration();
    forgetTokens(); // a revocation meanwhile
    rememberToken("h-stale", { caller, tokenId: 2, lastUsedAt: 0 }, began);
    expect(cachedToken("h-stale")).toBeNull();
    rememberToken("h-fresh", { caller, tokenId: 3, lastUsedAt: 0 }, tokenGeneration()); // begun after: kept
    expect(cachedToken("h-fresh")).not.toBeNull();
  });

  test("requireApi read the token, the token is revoked before it caches it: the next call is 401, not a cached 200", async () => {
    const m = await makeMember("engineer");
    const { id, token } = await createApiToken({ userId: m.userId, workspaceId: m.workspaceId, name: "race", scope: "read" });
    // A never-used token: requireApi reads it, then writes last_used_at. Holding the row's lock keeps that write
    // (and so the caching after it) waiting while the token is revoked and the cache cleared, as revokeApiToken does.
    let inFlight: Promise<number> | null = null;
    await withTransaction(async (tx) => {
      await tx.select({ id: apiTokens.id }).from(apiTokens).where(eq(apiTokens.id, id)).for("update");
      inFlight = status(requireApi(call(token), "library.read"));
      await until("requireApi waits on its last_used_at write", async () => {
        const rows = (await getPool().query(
          "SELECT COUNT(*) AS n FROM information_schema.PROCESSLIST WHERE INFO LIKE 'update `api_tokens` set `last_used_at`%' AND INFO LIKE ?",
          [`%= ${id}`],
        )) as { n: number }[];
        return Number(rows[0]?.n ?? 0) > 0;
      });
      await tx.update(apiTokens).set({ revokedAt: new Date() }).where(eq(apiTokens.id, id));
      forgetTokens();
    });
    expect(await inFlight).toBe(200); // it began before the revocation
    expect(await status(requireApi(call(token), "library.read"))).toBe(401);
  }, 30_000);
});
