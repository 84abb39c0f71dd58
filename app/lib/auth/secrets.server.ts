import { createHash, randomBytes, timingSafeEqual } from "node:crypto";

/** A random URL-safe secret with `bytes` of entropy (default 32 bytes = 256 bits). */
export function newSecret(bytes = 32): string {
  return randomBytes(bytes).toString("base64url");
}

/** Secrets are stored only as SHA-256 hashes (hex): a database leak gives no usable link or token. */
export function hashSecret(secret: string): string {
  return createHash("sha256").update(secret, "utf8").digest("hex");
}

export function sameHash(a: string, b: string): boolean {
  const x = Buffer.from(a, "hex");
  const y = Buffer.from(b, "hex");
  return x.length === y.length && timingSafeEqual(x, y);
}
