// A three-node MariaDB Galera cluster on loopback, from Debian's packages (mariadb-server depends
// on galera-4 and rsync), for `npm run test:cluster`. Plain Node, no npm dependencies.
// Each node: its own data directory under DATA_ROOT/galera/nodeN, its own socket, and four ports
// the OS says are free (SQL, group communication, IST, SST), every port of every node a different one
// (db/galera-ports.mjs: held until the node starts). Node 1 bootstraps the cluster
// (--wsrep-new-cluster); nodes 2 and 3 start from a copy of its data directory and join it.
import { spawn, spawnSync } from "node:child_process";
import { cpSync, existsSync, mkdirSync, readFileSync, rmSync } from "node:fs";
import path from "node:path";
import { portBook } from "./galera-ports.mjs";
import { DATA_ROOT, createDatabase, ensureDebianPackages, freePort, initDataDir, pidAlive, ping, serverArgs } from "./mariadb.mjs";

const log = (msg) => process.stderr.write(`[galera] ${msg}\n`);
const sleep = (ms) => new Promise((r) => setTimeout(r, ms));

export const GALERA_PROVIDER = "/usr/lib/galera/libgalera_smm.so";

function which(cmd) {
  for (const dir of ["/usr/sbin", "/usr/bin", "/sbin", "/usr/local/sbin", "/usr/local/bin"]) {
    const p = path.join(dir, cmd);
    if (existsSync(p)) return p;
  }
  return cmd;
}

/** mariadb-server, galera-4 and rsync (the IST hand-shake), installed when missing. */
export function ensureGaleraInstalled() {
  ensureDebianPackages(["mariadb-server", "galera-4", "rsync"], {
    present: () => existsSync(which("mariadbd")) && existsSync(GALERA_PROVIDER) && existsSync(which("rsync")),
    why: "the Galera cluster test",
  });
}

/** Runs SQL as root through a node's socket; returns stdout (tab-separated, no headers). */
export function sqlAt(socket, sql) {
  const r = spawnSync(which("mariadb"), ["--no-defaults", `--socket=${socket}`, "-uroot", "-N", "-B", "-e", sql], { encoding: "utf8" });
  if (r.status !== 0) throw new Error(`SQL on ${socket} failed: ${r.stderr.trim()}`);
  return r.stdout;
}

/** A status variable of a node ('' when the node does not answer). */
export function wsrepStatus(socket, name) {
  try {
    const out = sqlAt(socket, `SHOW STATUS LIKE '${name}'`).trim();
    return out.split("\t")[1] ?? "";
  } catch {
    return "";
  }
}

/** Stops a node: a clean shutdown, or SIGKILL (a crash) with `kill`. Waits until the process is gone. */
async function stopNode(node, { kill = false } = {}) {
  if (kill) {
    try {
      process.kill(node.pid, "SIGKILL");
    } catch {}
  } else {
    spawnSync(which("mariadb-admin"), ["--no-defaults", `--socket=${node.socket}`, "-uroot", "shutdown"]);
  }
  for (let k = 0; k < 300 && pidAlive(node.pid); k++) await sleep(100);
  if (pidAlive(node.pid)) process.kill(node.pid, "SIGKILL");
}

/** A port taken between freePort() and the server's bind (another process on the machine): the log says so. */
const PORT_TAKEN = /Can't start server: Bind on TCP\/IP port|Address already in use/;

/** The ports of a node, as its messages name them. */
const portsText = (n) => `client ${n.port}, group ${n.gcommPort}, IST ${n.istPort}, SST ${n.sstPort}`;

async function startNode(node, { bootstrap, clusterAddress, recover = false, ports }, attempt = 1, tried = []) {
  tried.push(portsText(node));
  let logBefore = 0;
  try {
    logBefore = readFileSync(node.logFile, "utf8").length;
  } catch {}
  initDataDir(node.dir, node.name);
  const args = [
    ...serverArgs({ ...node, bufferPool: "128M" }),
    // What Galera needs: row-based replication, InnoDB, interleaved auto-increment locks.
    "--binlog-format=ROW",
    "--default-storage-engine=InnoDB",
    "--innodb-autoinc-lock-mode=2",
    "--wsrep-on=ON",
    `--wsrep-provider=${GALERA_PROVIDER}`,
    `--wsrep-cluster-name=dutymark-test`,
    `--wsrep-cluster-address=${bootstrap ? "gcomm://" : clusterAddress}`,
    `--wsrep-node-name=${node.name}`,
    `--wsrep-node-address=127.0.0.1:${node.gcommPort}`,
    `--wsrep-provider-options=gmcast.listen_addr=tcp://127.0.0.1:${node.gcommPort};ist.recv_addr=127.0.0.1:${node.istPort};gcache.size=256M`,
    // Joiners start from a copy of node 1's data directory, so they catch up by IST (incremental,
    // from the donor's gcache), also after a restart in the node-loss test; rsync runs the IST
    // hand-shake, and a full transfer if one is ever needed. Its daemon, started by root, writes as
    // `nobody`: the node's files are opened to it (test data directories only, see startNode).
    "--wsrep-sst-method=rsync",
    `--wsrep-sst-receive-address=127.0.0.1:${node.sstPort}`,
    // Read-your-writes across nodes: a read waits until the node has applied what the cluster committed before it.
    "--wsrep-sync-wait=1",
  ];
  if (bootstrap) args.push("--wsrep-new-cluster");
  // The book has kept the node's ports until now (db/galera-ports.mjs): let go of them for mariadbd to bind.
  await ports.release(node.name);
  if (recover) {
    // After a crash the node does not know its position (grastate.dat says seqno -1): recover it
    // from InnoDB the way the packaged service does (mariadbd --wsrep-recover), then start from it,
    // so the node catches up by IST instead of needing a full state transfer.
    const recoverLog = path.join(path.dirname(node.logFile), `${node.name}.recover.err`);
    rmSync(recoverLog, { force: true });
    spawnSync(which("mariadbd"), [...args.filter((a) => !a.startsWith("--log-error=")), `--log-error=${recoverLog}`, "--wsrep-recover"], { stdio: "ignore" });
    const m = /Recovered position:\s*([0-9a-f-]{36}:-?\d+)/.exec(readFileSync(recoverLog, "utf8"));
    if (m) {
      args.push(`--wsrep-start-position=${m[1]}`);
      log(`${node.name}: recovered position ${m[1]}`);
    }
  }
  // A full state transfer (rsync) writes as `nobody` when started by root: open the node's files to it.
  spawnSync("chmod", ["-R", "a+rwX", node.dir]);
  const child = spawn(which("mariadbd"), args, { stdio: "ignore", detached: true });
  child.unref();
  node.pid = child.pid;
  // Ready when the node answers and says it is synced with the cluster.
  for (let i = 0; i < 1200; i++) {
    if (ping(node.socket) && wsrepStatus(node.socket, "wsrep_local_state_comment") === "Synced") return;
    // Gone: exited, or killed by a signal (after "Aborting" on a port already in use, mariadbd dies by SIGABRT: no exit code)
    if (child.exitCode !== null || child.signalCode !== null) break;
    await sleep(100);
  }
  let log_ = "";
  try {
    log_ = readFileSync(node.logFile, "utf8");
  } catch {}
  // Its own ports were free when chosen but another process took one before the node bound it: new ports, once or
  // twice (the node's client, IST and SST ports are its own; its group port is in every node's cluster address).
  if (attempt < 3 && PORT_TAKEN.test(log_.slice(logBefore))) {
    if (pidAlive(node.pid)) process.kill(node.pid, "SIGKILL");
    for (let k = 0; k < 50 && pidAlive(node.pid); k++) await sleep(100);
    Object.assign(node, await ports.renew(node.name));
    log(`${node.name}: a port was taken before it could bind (another process); starting again on 127.0.0.1:${node.port}`);
    return startNode(node, { bootstrap, clusterAddress, recover, ports }, attempt + 1, tried);
  }
  const tail = log_.split("\n").slice(-25).join("\n");
  const where = tried.length > 1 ? `on any of its ${tried.length} sets of ports (${tried.join("; ")})` : `on 127.0.0.1 (${tried[0]})`;
  throw new Error(`${node.name} did not join the cluster ${where}. Last lines of its log:\n${tail}`);
}

/**
 * Starts a cluster of `size` nodes (fresh data directories each time) and returns
 * { nodes: [{ name, port, socket, stop(), start() }], stopAll() }.
 * `root` holds the nodes' files (emptied first); `choosePort(nodeName, role)` gives each port (role: client, group,
 * IST, SST), a free one by default — the tests of this file take their own directory and hand out ports they occupy.
 */
export async function startGaleraCluster(size = 3, { root = path.join(DATA_ROOT, "galera"), choosePort = freePort } = {}) {
  ensureGaleraInstalled();
  rmSync(root, { recursive: true, force: true });
  mkdirSync(root, { recursive: true });
  const nodes = [];
  // Every port of every node, a retry's too, comes from this cluster's book (db/galera-ports.mjs).
  const ports = portBook(choosePort);
  try {
    for (let i = 1; i <= size; i++) {
      const dir = path.join(root, `node${i}`);
      let socket = path.join(root, `node${i}.sock`);
      if (socket.length > 100) socket = path.join("/tmp", `dutymark-galera-${process.pid}-${i}.sock`);
      nodes.push({
        name: `node${i}`,
        dir,
        socket,
        pidFile: path.join(root, `node${i}.pid`),
        logFile: path.join(root, `node${i}.err`),
        ...(await ports.node(`node${i}`)),
        pid: 0,
      });
    }
  } catch (e) {
    await ports.releaseAll(); // the ports held so far, not left open in this process
    throw e;
  }
  const clusterAddress = `gcomm://${nodes.map((n) => `127.0.0.1:${n.gcommPort}`).join(",")}`;
  // Seed every node with the same state instead of a network state transfer: node 1 bootstraps a
  // one-node cluster and stops cleanly, its data directory is copied to the others, so each joins
  // at the same position (Galera then transfers nothing, or the little that changed, by IST).
  const first = nodes[0];
  try {
    await startNode(first, { bootstrap: true, clusterAddress, ports });
    await stopNode(first);
    for (const node of nodes.slice(1)) {
      rmSync(node.dir, { recursive: true, force: true });
      cpSync(first.dir, node.dir, { recursive: true });
      rmSync(path.join(node.dir, "gvwstate.dat"), { force: true });
    }
    rmSync(path.join(first.dir, "gvwstate.dat"), { force: true });
    for (const [i, node] of nodes.entries()) {
      const t0 = Date.now();
      await startNode(node, { bootstrap: i === 0, clusterAddress, ports });
      log(`${node.name} synced on 127.0.0.1:${node.port} (${((Date.now() - t0) / 1000).toFixed(1)} s)`);
      node.stop = (opts) => stopNode(node, opts);
      node.start = () => startNode(node, { bootstrap: false, clusterAddress, recover: true, ports });
    }
  } catch (e) {
    // A node that did not join: the nodes already running are stopped, not left behind (they outlived a failed run).
    for (const n of [...nodes].reverse()) if (n.pid && pidAlive(n.pid)) process.kill(n.pid, "SIGKILL");
    throw e;
  } finally {
    await ports.releaseAll();
  }
  const size_ = wsrepStatus(nodes[0].socket, "wsrep_cluster_size");
  if (Number(size_) !== size) throw new Error(`the cluster has ${size_} nodes, expected ${size}`);
  const stopAll = async () => {
    for (const n of [...nodes].reverse()) {
      if (n.pid && pidAlive(n.pid)) await n.stop();
    }
    log("cluster stopped");
  };
  return { nodes, stopAll };
}

/** Creates the database and its user through one node; Galera replicates both to every node. */
export function createClusterDatabase(socket, spec) {
  createDatabase(socket, spec);
}
