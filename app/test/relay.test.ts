// The test relay (fixtures/proxy/round-robin.mjs) that `npm test` puts between the browser and two app processes:
// it alternates, retries a page load once on a 503, and never leaves a client waiting on an answer its upstream cut.
import { spawn, type ChildProcess } from "node:child_process";
import http from "node:http";
import path from "node:path";
import { afterAll, beforeAll, expect, test } from "vitest";
import { freePort, ROOT } from "./harness";

let relay: ChildProcess;
let base = "";
const upstreams: http.Server[] = [];
const seen: string[] = [];

function upstream(name: string) {
  return http.createServer((req, res) => {
    seen.push(`${name} ${req.url}`);
    if (req.url === "/busy" && name === "a") return void res.writeHead(503).end("busy");
    if (req.url === "/cut") {
      // Headers and half the declared body, then the connection goes (a keep-alive socket reset mid-answer).
      res.writeHead(200, { "Content-Length": "100", "Content-Type": "text/plain" });
      res.write("x".repeat(50), () => setTimeout(() => res.socket?.destroy(), 20));
      return;
    }
    res.writeHead(200, { "Content-Type": "text/plain" }).end(name);
  });
}

beforeAll(async () => {
  const ports: number[] = [];
  for (const name of ["a", "b"]) {
    const s = upstream(name);
    const p = await freePort();
    await new Promise<void>((r) => s.listen(p, "127.0.0.1", r));
    upstreams.push(s);
    ports.push(p);
  }
  const port = await freePort();
  base = `http://127.0.0.1:${port}`;
  relay = spawn(process.execPath, [path.join(ROOT, "fixtures/proxy/round-robin.mjs"), String(port), ...ports.map(String)], { stdio: ["ignore", "pipe", "inherit"] });
  await new Promise<void>((r) => relay.stdout!.once("data", () => r()));
});
afterAll(async () => {
  relay?.kill("SIGTERM");
  await Promise.all(upstreams.map((s) => new Promise((r) => s.close(r))));
});

test("requests go to each upstream in turn; a page load that meets a 503 is tried once more on the other", async () => {
  const bodies = [];
  for (let i = 0; i < 4; i++) bodies.push(await (await fetch(`${base}/hello`)).text());
  expect(bodies.sort()).toEqual(["a", "a", "b", "b"]);
  const busy = await fetch(`${base}/busy`);
  expect(busy.status).toBe(200);
  expect(await busy.text()).toBe("b");
});

test("an answer its upstream cuts mid-body is cut for the client too, not left open (it hung a browser test's wait for network idle)", async () => {
  // Red on the relay that used r.pipe(res): the client got the headers and 50 bytes and then waited for ever.
  const outcome = await new Promise<string>((resolve) => {
    const timer = setTimeout(() => resolve("still open after 3 s"), 3000);
    http.get(`${base}/cut`, (res) => {
      res.on("data", () => {});
      res.on("end", () => { clearTimeout(timer); resolve("ended as if whole"); });
      res.on("error", () => { clearTimeout(timer); resolve("cut"); });
      res.on("aborted", () => { clearTimeout(timer); resolve("cut"); });
    }).on("error", () => { clearTimeout(timer); resolve("cut"); });
  });
  expect(outcome).toBe("cut");
});
