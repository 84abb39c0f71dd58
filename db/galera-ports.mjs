// The ports of a test cluster's nodes (db/galera.mjs), handed out by one book per cluster. A chooser such as
// freePort() binds port 0, reads the port and closes it, so nothing stops two calls from returning the same port:
// a node once got IST == SST (34457), its IST listener found the port taken by its own rsync daemon, and the node
// aborted. The book asks again when a port was already handed out in this cluster (a retry's ports included), and
// holds each port it hands out by listening on it until the node is about to start, so the OS does not give it
// out again meanwhile (to this cluster or to another process). Plain Node, no npm dependencies.
import net from "node:net";

/** How many times a chooser is asked for one port before the book gives up on it. */
export const MAX_ASKS = 20;

/** Listens on 127.0.0.1:port (as mariadbd and Galera bind it); null when that fails (already in use). */
export function holdPort(port) {
  return new Promise((resolve) => {
    const srv = net.createServer();
    srv.once("error", () => resolve(null));
    srv.listen(port, "127.0.0.1", () => resolve(srv));
  });
}

const closeServer = (srv) => new Promise((resolve) => srv.close(() => resolve()));

/**
 * A book of the ports handed out to one cluster's nodes. `choosePort(nodeName, role)` (role: client, group, IST,
 * SST) proposes a port; `hold(port)` keeps it (default: listening on it; the tests of the book pass their own). A
 * port the book cannot hold (a test occupies it on purpose) is handed out all the same.
 */
export function portBook(choosePort, { hold = holdPort } = {}) {
  const given = new Set();
  const held = new Map(); // node name → what `hold` returned for its ports not yet released

  async function take(node, role) {
    const repeats = [];
    for (let ask = 0; ask < MAX_ASKS; ask++) {
      const port = await choosePort(node, role);
      if (given.has(port)) {
        repeats.push(port);
        continue;
      }
      given.add(port);
      const handle = await hold(port);
      if (handle) held.set(node, [...(held.get(node) ?? []), handle]);
      return port;
    }
    throw new Error(
      `${node}: no ${role} port apart from the cluster's other ports after ${MAX_ASKS} asks (each was already handed out: ${[...new Set(repeats)].join(", ")})`,
    );
  }

  async function release(node) {
    const handles = held.get(node) ?? [];
    held.delete(node);
    await Promise.all(handles.map((h) => (h instanceof net.Server ? closeServer(h) : h?.close?.())));
  }

  return {
    /** The four ports of a new node: client, group, IST, SST, as the node object names them. */
    async node(name) {
      return { port: await take(name, "client"), gcommPort: await take(name, "group"), istPort: await take(name, "IST"), sstPort: await take(name, "SST") };
    },
    /** New client, IST and SST ports for a node starting again (its group port is in every node's cluster address). */
    async renew(name) {
      return { port: await take(name, "client"), istPort: await take(name, "IST"), sstPort: await take(name, "SST") };
    },
    /** Lets go of a node's held ports, right before its mariadbd binds them. */
    release,
    /** Lets go of every port still held (a start that failed before some node started). */
    async releaseAll() {
      for (const node of [...held.keys()]) await release(node);
    },
    /** Every port handed out so far, in order. */
    given: () => [...given],
  };
}
