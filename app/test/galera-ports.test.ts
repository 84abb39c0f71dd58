// The ports a test cluster's nodes are handed (db/galera-ports.mjs, used by db/galera.mjs), without starting a node.
// A chooser binds port 0, reads the port and closes it, so two calls may return the same port: in a fresh-clone CI
// run node2 got IST 34457 and SST 34457 (from that run's log), its IST listener found its own rsync daemon on the port,
// and its retry needed a full transfer that fails here. Stub choosers repeat ports on purpose; one test holds real ports.
import net from "node:net";
import { afterEach, expect, test } from "vitest";
// @ts-expect-error plain ESM module without types
import { portBook } from "../../db/galera-ports.mjs";
// @ts-expect-error plain ESM module without types
import { freePort } from "../../db/mariadb.mjs";

type NodePorts = { port: number; gcommPort: number; istPort: number; sstPort: number };
type Book = {
  node: (name: string) => Promise<NodePorts>;
  renew: (name: string) => Promise<Omit<NodePorts, "gcommPort">>;
  release: (name: string) => Promise<void>;
  releaseAll: () => Promise<void>;
  given: () => number[];
};

const books: Book[] = [];
const servers: net.Server[] = [];
afterEach(async () => {
  for (const b of books.splice(0)) await b.releaseAll();
  await Promise.all(servers.splice(0).map((s) => new Promise((r) => s.close(r))));
});

/** A book whose holding is a no-op token (no sockets), so the stub's made-up ports are never bound. */
function stubBook(choosePort: (node: string, role: string) => Promise<number>): Book {
  const book = portBook(choosePort, { hold: async () => ({ close() {} }) }) as Book;
  books.push(book);
  return book;
}

/** A chooser that gives the ports of `queue` in order (repeats included; more may be pushed later), then 41000, 41001, … */
function scripted(queue: number[]) {
  const asked: string[] = [];
  let next = 41000;
  const choose = async (node: string, role: string) => {
    asked.push(`${node} ${role}`);
    return queue.length ? queue.shift()! : next++;
  };
  return { choose, asked, queue };
}

/** Ports that appear more than once. */
const repeated = (ports: number[]) => [...new Set(ports.filter((p, i) => ports.indexOf(p) !== i))];

const flat = (n: Partial<NodePorts>) => [n.port, n.gcommPort, n.istPort, n.sstPort].filter((p): p is number => p !== undefined);

/** Listens on 127.0.0.1:port as another process would; false when the port is in use. */
function occupy(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const srv = net.createServer();
    srv.once("error", () => resolve(false));
    srv.listen(port, "127.0.0.1", () => (servers.push(srv), resolve(true)));
  });
}

test("a chooser that gives a port twice (IST 34457 = SST 34457, as in the CI run) never gets one port two uses in a cluster", async () => {
  // node1 client, group, IST, then SST = its IST again; node2 gets node1's group and client ports again.
  const { choose, asked } = scripted([40001, 40002, 34457, 34457, 40001, 40002]);
  const book = stubBook(choose);
  const nodes = [await book.node("node1"), await book.node("node2"), await book.node("node3")];
  const all = nodes.flatMap(flat);
  expect(repeated(all)).toEqual([]);
  expect(all).toHaveLength(12);
  expect(nodes[0].istPort).toBe(34457);
  expect(nodes[0].sstPort).not.toBe(34457);
  // The chooser was asked again for each repeat: 12 ports, 3 repeats.
  expect(asked).toHaveLength(15);
  expect(asked.slice(3, 5)).toEqual(["node1 SST", "node1 SST"]);
});

test("a node starting again gets new client, IST and SST ports apart from every port the cluster was handed", async () => {
  const { choose, queue } = scripted([]);
  const book = stubBook(choose);
  const n1 = await book.node("node1");
  const n2 = await book.node("node2");
  const before = [...flat(n1), ...flat(n2)];
  // For node2's retry the chooser offers node2's own IST, node1's client and node2's own SST, then 42000 twice.
  queue.push(n2.istPort, n1.port, n2.sstPort, 42000, 42000, 42001);
  const retry = await book.renew("node2");
  expect(retry).toEqual({ port: 42000, istPort: 42001, sstPort: 41008 }); // 41008: the stub's next fresh port
  expect(repeated([...before, ...flat(retry)])).toEqual([]);
});

test("a chooser that only gives ports already handed out is refused with the node, role and port, not asked for ever", async () => {
  const book = stubBook(async () => 34457);
  // node1's client port is 34457; its group port cannot be.
  await expect(book.node("node1")).rejects.toThrow(/^node1: no group port apart from the cluster's other ports after 20 asks \(each was already handed out: 34457\)$/);
});

test("the ports handed out are held until the node's release: nothing else binds them meanwhile (real sockets)", async () => {
  const book = portBook(freePort) as Book;
  books.push(book);
  const n1 = await book.node("node1");
  const n2 = await book.node("node2");
  expect(repeated([...flat(n1), ...flat(n2)])).toEqual([]);
  for (const port of [...flat(n1), ...flat(n2)]) expect(await occupy(port), `port ${port} is held`).toBe(false);
  await book.release("node1");
  for (const port of flat(n1)) expect(await occupy(port), `port ${port} is let go`).toBe(true);
  for (const port of flat(n2)) expect(await occupy(port), `port ${port} is still held`).toBe(false);
});

test("a chooser that occupies its own port before handing it out (galera-start.test.ts) gets that port handed out as it is", async () => {
  const occupied: number[] = [];
  const book = portBook(async (node: string, role: string) => {
    const port = await freePort();
    if (node === "node1" && role === "client") {
      expect(await occupy(port)).toBe(true);
      occupied.push(port);
    }
    return port;
  }) as Book;
  books.push(book);
  const n1 = await book.node("node1");
  expect(n1.port).toBe(occupied[0]);
  expect(occupied).toHaveLength(1);
  await book.release("node1"); // what the book could not hold it does not close: the port stays occupied
  expect(await occupy(n1.port)).toBe(false);
});
