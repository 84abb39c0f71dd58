// The ports db/cli.mjs hands the processes it starts (app processes, relay, SMTP and Stripe stand-ins), from one book
// (db/port-book.mjs, servicePorts). Each used to come from its own freePort() call, which binds port 0, reads the port
// and closes it: nothing stopped two calls from returning the same port (a cluster node once got IST == SST that way).
// Here the OS is stubbed to report one free port twice, as it may; the book must still hand out distinct ports, held.
import net from "node:net";
import { afterEach, expect, test, vi } from "vitest";
// @ts-expect-error plain ESM module without types
import { servicePorts } from "../../db/port-book.mjs";
// @ts-expect-error plain ESM module without types
import { freePort } from "../../db/mariadb.mjs";

type Book = {
  take: (owner: string, role: string) => Promise<number>;
  release: (owner: string) => Promise<void>;
  releaseAll: () => Promise<void>;
  reserve: (port: number) => void;
  given: () => number[];
};

const books: Book[] = [];
const servers: net.Server[] = [];
afterEach(async () => {
  vi.restoreAllMocks();
  for (const b of books.splice(0)) await b.releaseAll();
  await Promise.all(servers.splice(0).map((s) => new Promise((r) => s.close(r))));
});

const book = (choose?: () => Promise<number>): Book => {
  const b = (choose ? servicePorts(choose) : servicePorts()) as Book;
  books.push(b);
  return b;
};

/** Listens on 127.0.0.1:port as another process would; false when the port is in use. */
function occupy(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const srv = net.createServer();
    srv.once("error", () => resolve(false));
    srv.listen(port, "127.0.0.1", () => (servers.push(srv), resolve(true)));
  });
}

/** Makes the OS report `port` as the port bound by the next `times` listens on port 0 (freePort's), as if it chose it each time. */
async function osRepeats(port: number, times: number) {
  const real = net.Server.prototype.address;
  let left = times;
  vi.spyOn(net.Server.prototype, "address").mockImplementation(function (this: net.Server) {
    const a = real.call(this);
    if (left > 0 && a && typeof a === "object") {
      left--;
      return { ...a, port };
    }
    return a;
  });
}

const repeated = (ports: number[]) => [...new Set(ports.filter((p, i) => ports.indexOf(p) !== i))];

test("six ports asked at once while the OS reports one free port twice: six distinct ports, each held until its owner is released", async () => {
  const twice = await freePort();
  await osRepeats(twice, 2);
  const b = book();
  const owners = ["relay", "app 1", "app 2", "SMTP stand-in", "SMTP stand-in", "Stripe stand-in"];
  const ports = await Promise.all(owners.map((o, i) => b.take(o, `role ${i}`)));
  expect(repeated(ports)).toEqual([]);
  expect(ports).toContain(twice); // the stub was asked: one of the six got the reported port, the other asked again
  // Held: nothing else (another process, a test server asking the OS for a free port) can bind them.
  for (const p of ports) expect(await occupy(p), `port ${p} is held`).toBe(false);
  // The owner's ports are let go of right before it starts (startService), the others stay held.
  await b.release("SMTP stand-in");
  for (const p of [ports[3], ports[4]]) expect(await occupy(p), `port ${p} is let go`).toBe(true);
  for (const p of [ports[0], ports[1], ports[2], ports[5]]) expect(await occupy(p), `port ${p} is still held`).toBe(false);
});

test("a port another process binds between the chooser and the hold is passed over, not handed out in use", async () => {
  const taken = await freePort();
  expect(await occupy(taken)).toBe(true);
  const offers = [taken];
  const b = book(async () => offers.shift() ?? freePort());
  const port = await b.take("relay", "HTTP");
  expect(port).not.toBe(taken);
  expect(await occupy(port)).toBe(false);
});

test("a port reserved from outside (TEST_PORT, PORT) is never handed out", async () => {
  const fixed = await freePort();
  const offers = [fixed, fixed];
  const b = book(async () => offers.shift() ?? freePort());
  b.reserve(fixed);
  expect(await b.take("app 1", "HTTP")).not.toBe(fixed);
});

test("a chooser that only repeats one port is refused with the owner, role and port", async () => {
  const b = book(async () => 34457);
  b.reserve(34457);
  await expect(b.take("app 2", "HTTP")).rejects.toThrow(/^app 2: no HTTP port apart from the other ports of this run after 20 asks \(each was already handed out: 34457\)$/);
});
