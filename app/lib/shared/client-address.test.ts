// Who is asking as far as the network says (client-address.ts): loopback addresses and the signs of
// a proxy. Address ranges: RFC 6890 (127.0.0.0/8 loopback), RFC 4291 (::1, ::ffff:a.b.c.d mapped).
import { expect, test } from "vitest";
import { CLIENT_IP_HEADER, fromThisMachine, isLoopback } from "./client-address";

test("isLoopback: all of 127.0.0.0/8 and ::1, also IPv4-mapped; nothing else", () => {
  for (const a of ["127.0.0.1", "127.255.255.255", "127.0.0.2", "::1", "::ffff:127.0.0.1", "0:0:0:0:0:0:0:1"]) expect([a, isLoopback(a)]).toEqual([a, true]);
  for (const a of ["", "128.0.0.1", "126.255.255.255", "10.0.0.1", "192.168.1.10", "203.0.113.7", "::2", "::ffff:10.0.0.1", "127.0.0.1.evil.example", "127.0.0.256", "127.1", "localhost", "unknown"])
    expect([a, isLoopback(a)]).toEqual([a, false]);
});

test("fromThisMachine: a loopback client address with no proxy header and no TRUST_PROXY", () => {
  const req = (ip: string | null, extra: Record<string, string> = {}) => new Request("http://127.0.0.1:3999/dev/mailbox", { headers: { ...(ip === null ? {} : { [CLIENT_IP_HEADER]: ip }), ...extra } });
  expect(fromThisMachine(req("127.0.0.1"), false)).toBe(true);
  expect(fromThisMachine(req("::1"), false)).toBe(true);
  expect(fromThisMachine(req("203.0.113.7"), false)).toBe(false);
  expect(fromThisMachine(req(null), false)).toBe(false); // no address handed over: not known to be local
  expect(fromThisMachine(req("127.0.0.1"), true)).toBe(false); // a proxy in front (TRUST_PROXY=1)
  // A reverse proxy on the same machine connects from loopback for every client; these headers give it away (common practice: nginx, Caddy, Apache).
  for (const h of ["x-forwarded-for", "forwarded", "x-real-ip", "via", "x-forwarded-host"]) expect([h, fromThisMachine(req("127.0.0.1", { [h]: "203.0.113.7" }), false)]).toEqual([h, false]);
});
