// Who is asking, as far as the network says: the client address app/serve.mjs hands the app (its
// own header, always overwritten there: the socket's address, or behind proxies (TRUST_PROXY: a number of
// hops or the proxies' addresses) the address the outermost proxy of ours saw, read from the right of
// X-Forwarded-For; the dev server sets the socket's, vite.config.ts) and whether the request came through a proxy.

export const CLIENT_IP_HEADER = "x-dutymark-client-ip";

export function clientIp(request: Request): string {
  return (request.headers.get(CLIENT_IP_HEADER) ?? "").slice(0, 64);
}

/** 127.0.0.0/8 and ::1, also written as IPv4-mapped IPv6 (::ffff:127.0.0.1), as Node reports them. */
export function isLoopback(address: string): boolean {
  const a = address.trim().toLowerCase();
  if (a === "::1" || a === "0:0:0:0:0:0:0:1") return true;
  const v4 = a.startsWith("::ffff:") ? a.slice(7) : a;
  const parts = v4.split(".");
  return parts.length === 4 && parts[0] === "127" && parts.every((p) => /^\d{1,3}$/.test(p) && Number(p) <= 255);
}

/** Headers a proxy adds: a request that carries any came from elsewhere through something on this machine. */
const FORWARDING_HEADERS = ["forwarded", "x-forwarded-for", "x-forwarded-host", "x-real-ip", "via"];

/**
 * A request from this machine itself: a loopback client address and no sign of a proxy in between
 * (a reverse proxy on the same machine connects from loopback for every client on the internet).
 * `trustProxy` (TRUST_PROXY set, not 0) means a proxy is in front, so never.
 */
export function fromThisMachine(request: Request, trustProxy: boolean): boolean {
  if (trustProxy) return false;
  if (FORWARDING_HEADERS.some((h) => request.headers.has(h))) return false;
  return isLoopback(clientIp(request));
}
