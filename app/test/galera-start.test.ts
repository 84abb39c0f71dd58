// How db/galera.mjs starts the test cluster when a node's port is taken between choosing it free and binding it
// (another process on the machine), on real MariaDB Galera nodes: two-node clusters in a temp directory, on ports
// the OS says are free, some of them occupied on purpose. Runs under `npm run test:cluster` (db/cli.mjs sets
// DUTYMARK_GALERA_TESTS=1 before it starts its own cluster); `npm test` leaves this file out (vite.config.ts):
// it needs Debian's galera-4 and rsync, which only the cluster suite installs.
// By hand: DUTYMARK_GALERA_TESTS=1 npx vitest run app/test/galera-start.test.ts
import { mkdtempSync, readdirSync, readFileSync, rmSync } from "node:fs";
import net from "node:net";
import os from "node:os";
import path from "node:path";
import { afterAll, expect, test } from "vitest";
// @ts-expect-error plain ESM module without types
import { sqlAt, startGaleraCluster, wsrepStatus } from "../../db/galera.mjs";
// @ts-expect-error plain ESM module without types
import { freePort, pidAlive } from "../../db/mariadb.mjs";

type Cluster = { nodes: { name: string; port: number; socket: string; pid: number }[]; stopAll: () => Promise<void> };
type PortChooser = (node: string, role: string) => Promise<number>;

const roots: string[] = [];
const held: net.Server[] = [];
const clusters: Cluster[] = [];
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** A directory of its own for one cluster's files (sockets stay short: no /tmp fallback shared by two clusters). */
function newRoot(): string {
  const root = mkdtempSync(path.join(os.tmpdir(), "dm-galera-start-"));
  roots.push(root);
  return root;
}

/** Occupies 127.0.0.1:port as "another process" would (mariadbd binds 127.0.0.1 and gets "Address already in use"). */
function occupy(port: number): Promise<void> {
  return new Promise((resolve, reject) => {
    const srv = net.createServer();
    srv.once("error", reject);
    srv.listen(port, "127.0.0.1", () => {
      held.push(srv);
      resolve();
    });
  });
}

/** Pids of the mariadbd processes whose data directory is under `root` (this file's clusters only), with their node. */
function mariadbdUnder(root: string): { pid: number; node: string }[] {
  const found: { pid: number; node: string }[] = [];
  for (const entry of readdirSync("/proc")) {
    if (!/^\d+$/.test(entry)) continue;
    let argv: string[];
    try {
      argv = readFileSync(`/proc/${entry}/cmdline`, "utf8").split("\0");
    } catch {
      continue; // gone meanwhile
    }
    const datadir = argv.find((a) => a.startsWith(`--datadir=${root}/`));
    if (path.basename(argv[0] ?? "") === "mariadbd" && datadir) found.push({ pid: Number(entry), node: path.basename(datadir) });
  }
  return found;
}

/** Waits (at most ~10 s) until none of `pids` runs; returns those still running. */
async function stillRunning(pids: number[]): Promise<number[]> {
  for (let i = 0; i < 100 && pids.some((p) => pidAlive(p)); i++) await sleep(100);
  return pids.filter((p) => pidAlive(p));
}

afterAll(async () => {
  for (const c of clusters) await c.stopAll().catch(() => {});
  // Whatever of ours still runs (a test that failed halfway): killed by pid, never by name.
  for (const root of roots) for (const { pid } of mariadbdUnder(root)) process.kill(pid, "SIGKILL");
  for (const root of roots) await stillRunning(mariadbdUnder(root).map((p) => p.pid));
  await Promise.all(held.map((s) => new Promise((r) => s.close(r))));
  for (const root of roots) rmSync(root, { recursive: true, force: true });
}, 120_000);

test("a node whose client port is taken before it binds starts again on other ports, and the cluster comes up", async () => {
  const root = newRoot();
  let taken = 0;
  // Node 1's client port is occupied right after it is chosen: the race the retry is for.
  const choosePort: PortChooser = async (node, role) => {
    const port = await freePort();
    if (node === "node1" && role === "client" && !taken) {
      await occupy(port);
      taken = port;
    }
    return port;
  };
  const cluster: Cluster = await startGaleraCluster(2, { root, choosePort });
  clusters.push(cluster);
  const [n1, n2] = cluster.nodes;
  expect(taken).toBeGreaterThan(0);
  expect(n1.port).not.toBe(taken);
  // The first try really met the occupied port (MariaDB's own words in node 1's log).
  expect(readFileSync(path.join(root, "node1.err"), "utf8")).toMatch(/Bind on TCP\/IP port|Address already in use/);
  // Both nodes synced in one cluster of two, node 1 on its new port.
  for (const n of [n1, n2]) {
    expect(wsrepStatus(n.socket, "wsrep_local_state_comment")).toBe("Synced");
    expect(wsrepStatus(n.socket, "wsrep_cluster_size")).toBe("2");
  }
  expect(Number(sqlAt(n1.socket, "SELECT @@port").trim())).toBe(n1.port);
}, 120_000);

test("a chooser that gives node 2's IST port again for its SST port: node 2 gets another SST port, and the cluster comes up", async () => {
  const root = newRoot();
  const asked: string[] = [];
  let ist = 0;
  // As freePort() once did in CI (IST 34457, SST 34457): node 2's SST port first offered is its IST port.
  const choosePort: PortChooser = async (node, role) => {
    asked.push(`${node} ${role}`);
    if (node === "node2" && role === "SST" && asked.filter((a) => a === "node2 SST").length === 1) return ist;
    const port = await freePort();
    if (node === "node2" && role === "IST") ist = port;
    return port;
  };
  const cluster: Cluster = await startGaleraCluster(2, { root, choosePort });
  clusters.push(cluster);
  const n2 = cluster.nodes[1] as Cluster["nodes"][number] & { istPort: number; sstPort: number };
  expect(asked.filter((a) => a === "node2 SST")).toHaveLength(2); // asked again after the repeat
  expect(n2.istPort).toBe(ist);
  expect(n2.sstPort).not.toBe(ist);
  // Node 2 joined on its first ports: no listener of its own found its port taken (the CI run's "Failed to open IST listener").
  expect(readFileSync(path.join(root, "node2.err"), "utf8")).not.toMatch(/Address already in use|Failed to open IST listener/);
  for (const n of cluster.nodes) expect(wsrepStatus(n.socket, "wsrep_cluster_size")).toBe("2");
}, 120_000);

/** A two-node start expected to fail: the first line of its error (a cluster that started all the same is kept to be stopped). */
async function failedStart(root: string, choosePort: PortChooser): Promise<string> {
  const failure = await startGaleraCluster(2, { root, choosePort }).then(
    (c: Cluster) => (clusters.push(c), null),
    (e: Error) => e,
  );
  expect(failure, "the start should have failed").toBeInstanceOf(Error);
  return failure!.message.split("\n")[0];
}

test("a node whose client port is taken on every try gives up after three, naming itself and each set of ports", async () => {
  const root = newRoot();
  const occupied: number[] = [];
  const choosePort: PortChooser = async (node, role) => {
    const port = await freePort();
    if (node === "node1" && role === "client") {
      await occupy(port);
      occupied.push(port);
    }
    return port;
  };
  const message = await failedStart(root, choosePort);
  expect(occupied.length).toBe(3); // the first try and two retries, no more
  expect(message).toMatch(/^node1 did not join the cluster on any of its 3 sets of ports/);
  for (const port of occupied) expect(message).toContain(`client ${port},`);
  expect(await stillRunning(mariadbdUnder(root).map((p) => p.pid))).toEqual([]);
}, 120_000);

test("a node that cannot start fails the start, naming it and its ports, and the node already running is stopped", async () => {
  const root = newRoot();
  const occupied: number[] = [];
  const runningMeanwhile: { pid: number; node: string }[] = [];
  // Every client port node 2 is given is occupied at once.
  const choosePort: PortChooser = async (node, role) => {
    const port = await freePort();
    if (node === "node2" && role === "client") {
      // On a retry node 1 is up in the cluster: note its process (and node 2's) to check afterwards.
      runningMeanwhile.push(...mariadbdUnder(root));
      await occupy(port);
      occupied.push(port);
    }
    return port;
  };
  const message = await failedStart(root, choosePort);
  expect(message).toMatch(/^node2 did not join the cluster/);
  expect(occupied.length).toBeGreaterThanOrEqual(2);
  for (const port of occupied) expect(message).toContain(`client ${port},`);
  // Node 1 was running while node 2 tried again: the failed start stopped it, and every node 2 process.
  expect(runningMeanwhile.some((p) => p.node === "node1")).toBe(true);
  const pids = [...new Set([...runningMeanwhile, ...mariadbdUnder(root)].map((p) => p.pid))];
  expect(await stillRunning(pids)).toEqual([]);
  expect(mariadbdUnder(root)).toEqual([]);
}, 120_000);
