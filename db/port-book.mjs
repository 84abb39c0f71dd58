// A book of TCP ports handed out to the processes one command starts (db/cli.mjs's app processes, relay and stand-ins;
// db/galera-ports.mjs's cluster nodes). A chooser such as freePort() binds port 0, reads the port and closes it, so
// nothing stops two calls from returning the same port (a cluster node once got IST == SST, 34457, and aborted). The
// book asks again when a port was already handed out, and holds each port it hands out by listening on it until its
// owner is about to start, so the OS does not give it out again meanwhile (to this command or to another process).
// Plain Node, no npm dependencies.
import net from "node:net";
import { freePort } from "./mariadb.mjs";

/** How many times a chooser is asked for one port before the book gives up on it. */
export const MAX_ASKS = 20;

/** Listens on 127.0.0.1:port (as the app, the stand-ins and mariadbd bind it); null when that fails (already in use). */
export function holdPort(port) {
  return new Promise((resolve) => {
    const srv = net.createServer();
    srv.once("error", () => resolve(null));
    srv.listen(port, "127.0.0.1", () => resolve(srv));
  });
}

const closeServer = (srv) => new Promise((resolve) => srv.close(() => resolve()));

/**
 * A book of ports. `take(owner, role)` asks `choosePort(owner, role)` until it proposes a port this book has not handed
 * out yet, holds it with `hold(port)` (default: listening on it) and returns it; `release(owner)` lets go of the owner's
 * ports right before the owner binds them. `among` names the book's ports in the message of a chooser that only repeats.
 * A port the book cannot hold (something else listens on it): with `busy: "hand out"` (the default; the cluster's tests
 * occupy a node's port on purpose) it is handed out all the same; with `busy: "ask again"` it is passed over.
 */
export function portBook(choosePort, { hold = holdPort, among = "the ports this book handed out", busy = "hand out" } = {}) {
  const given = new Set();
  const held = new Map(); // owner → what `hold` returned for its ports not yet released

  async function take(owner, role) {
    const repeats = [];
    const inUse = [];
    for (let ask = 0; ask < MAX_ASKS; ask++) {
      const port = await choosePort(owner, role);
      if (given.has(port)) {
        repeats.push(port);
        continue;
      }
      given.add(port); // before the hold's await: a take running alongside sees it at once
      const handle = await hold(port);
      if (!handle && busy === "ask again") {
        given.delete(port);
        inUse.push(port);
        continue;
      }
      if (handle) held.set(owner, [...(held.get(owner) ?? []), handle]);
      return port;
    }
    const why = [repeats.length ? `already handed out: ${[...new Set(repeats)].join(", ")}` : "", inUse.length ? `in use: ${[...new Set(inUse)].join(", ")}` : ""];
    throw new Error(`${owner}: no ${role} port apart from ${among} after ${MAX_ASKS} asks (each was ${why.filter(Boolean).join("; ")})`);
  }

  async function release(owner) {
    const handles = held.get(owner) ?? [];
    held.delete(owner);
    await Promise.all(handles.map((h) => (h instanceof net.Server ? closeServer(h) : h?.close?.())));
  }

  return {
    take,
    release,
    /** Lets go of every port still held (a start that failed before some owner started). */
    async releaseAll() {
      for (const owner of [...held.keys()]) await release(owner);
    },
    /** A port fixed from outside (PORT, TEST_PORT): never handed out by this book. */
    reserve(port) {
      given.add(port);
    },
    /** Every port handed out or reserved so far, in order. */
    given: () => [...given],
  };
}

/**
 * The book of one `npm start` / `npm test` / `npm run test:cluster` (db/cli.mjs): ports the OS says are free, each
 * handed out once, held until its process starts, one that another process took meanwhile passed over.
 */
export function servicePorts(choosePort = () => freePort()) {
  return portBook(choosePort, { among: "the other ports of this run", busy: "ask again" });
}
