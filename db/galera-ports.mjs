// The ports of a test cluster's nodes (db/galera.mjs), handed out by one book per cluster (db/port-book.mjs: each port
// once, a retry's ports included, held by listening on it until its node is about to start). A node once got IST == SST
// (34457) from two freePort() calls, its IST listener found the port taken by its own rsync daemon, and the node aborted.
// Plain Node, no npm dependencies.
import { holdPort, portBook as book } from "./port-book.mjs";

/**
 * A book of the ports handed out to one cluster's nodes. `choosePort(nodeName, role)` (role: client, group, IST,
 * SST) proposes a port; `hold(port)` keeps it (default: listening on it; the tests of the book pass their own). A
 * port the book cannot hold (a test occupies it on purpose) is handed out all the same.
 */
export function portBook(choosePort, { hold = holdPort } = {}) {
  const ports = book(choosePort, { hold, among: "the cluster's other ports" });
  const take = ports.take;
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
    release: ports.release,
    /** Lets go of every port still held (a start that failed before some node started). */
    releaseAll: ports.releaseAll,
    /** Every port handed out so far, in order. */
    given: ports.given,
  };
}
