// The ports of a test cluster's nodes (db/galera.mjs), handed out by one book per cluster: each port as the
// chooser gives it (freePort() by default). Plain Node, no npm dependencies.

/**
 * A book of the ports handed out to one cluster's nodes. `choosePort(nodeName, role)` (role: client, group, IST,
 * SST) gives each port.
 */
export function portBook(choosePort) {
  const given = [];
  async function take(node, role) {
    const port = await choosePort(node, role);
    given.push(port);
    return port;
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
    /** Lets go of a node's ports before its mariadbd binds them (nothing to do here). */
    async release() {},
    /** Lets go of every port still held. */
    async releaseAll() {},
    /** Every port handed out so far, in order. */
    given: () => [...given],
  };
}
