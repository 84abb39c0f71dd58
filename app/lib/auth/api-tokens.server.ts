// API tokens: shown once, stored hashed, read or write scope; only for a confirmed address.
// Revoking clears the verified-token cache (token-cache.server.ts) at once in this process.
import { and, eq, isNull } from "drizzle-orm";
import { affectedRows, db } from "@db/client.server";
import { apiTokens } from "@db/schema";
import { hashSecret, newSecret } from "./secrets.server";
import { forgetTokens } from "./token-cache.server";
import { requireVerified } from "./accounts.server";

export const API_TOKEN_PREFIX = "dmk_";

/** A new API token: returned once, stored hashed. */
export async function createApiToken(input: { userId: string; workspaceId: number; name: string; scope: "read" | "write" }) {
  await requireVerified(input.userId, "creating API tokens");
  const secret = `${API_TOKEN_PREFIX}${newSecret(30)}`;
  const [{ id }] = await db()
    .insert(apiTokens)
    .values({ ...input, prefix: secret.slice(0, 10), tokenHash: hashSecret(secret) })
    .$returningId();
  return { id, token: secret };
}

export async function listApiTokens(userId: string, workspaceId: number) {
  return db()
    .select({ id: apiTokens.id, name: apiTokens.name, prefix: apiTokens.prefix, scope: apiTokens.scope, lastUsedAt: apiTokens.lastUsedAt, createdAt: apiTokens.createdAt })
    .from(apiTokens)
    .where(and(eq(apiTokens.userId, userId), eq(apiTokens.workspaceId, workspaceId), isNull(apiTokens.revokedAt)));
}

export async function revokeApiToken(userId: string, tokenId: number): Promise<boolean> {
  const r = await db()
    .update(apiTokens)
    .set({ revokedAt: new Date() })
    .where(and(eq(apiTokens.id, tokenId), eq(apiTokens.userId, userId), isNull(apiTokens.revokedAt)));
  forgetTokens();
  return affectedRows(r) === 1;
}
