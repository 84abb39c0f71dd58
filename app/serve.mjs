#!/usr/bin/env node
// Dutymark's HTTP server for the production build (`npm start` runs it): Express + React Router's
// request handler, like react-router-serve, plus what that one lacks here:
//  - the client address handed to the app in a header it can trust (sign-in throttling per address),
//  - security headers on every response (CSP, frame-ancestors, nosniff, referrer policy),
//  - a clean stop on SIGTERM/SIGINT (HTTP server closed, then the process exits so the DB pool ends).
import http from "node:http";
import path from "node:path";
import { pathToFileURL } from "node:url";
import express from "express";
import compression from "compression";
import { createRequestHandler } from "@react-router/express";

const buildPath = path.resolve(process.argv[2] ?? "build/server/index.js");
const build = await import(pathToFileURL(buildPath).href);
const port = Number(process.env.PORT ?? 3000);
const host = process.env.HOST ?? "127.0.0.1";
const trustProxy = process.env.TRUST_PROXY === "1";

export const CLIENT_IP_HEADER = "x-dutymark-client-ip";

const app = express();
app.disable("x-powered-by");
if (trustProxy) app.set("trust proxy", true);
app.use(compression());
app.use((req, res, next) => {
  // Overwrites anything a client sent under this name.
  req.headers[CLIENT_IP_HEADER] = (trustProxy ? req.ip : req.socket.remoteAddress) ?? "";
  res.setHeader(
    "Content-Security-Policy",
    "default-src 'self'; script-src 'self' 'unsafe-inline'; style-src 'self' 'unsafe-inline'; img-src 'self' data: blob:; " +
      "font-src 'self' data:; connect-src 'self'; frame-src 'self'; frame-ancestors 'none'; form-action 'self' http://127.0.0.1:* http://localhost:* https://checkout.stripe.com https://billing.stripe.com; base-uri 'self'; object-src 'none'",
  );
  res.setHeader("X-Content-Type-Options", "nosniff");
  res.setHeader("Referrer-Policy", "strict-origin-when-cross-origin");
  res.setHeader("X-Frame-Options", "DENY");
  res.setHeader("Cross-Origin-Opener-Policy", "same-origin");
  next();
});
const assetsDir = path.join(path.dirname(buildPath), "..", "client");
app.use("/assets", express.static(path.join(assetsDir, "assets"), { immutable: true, maxAge: "1y" }));
app.use(express.static(assetsDir, { maxAge: "1h" }));
if (process.env.ACCESS_LOG !== "0") {
  app.use((req, res, next) => {
    const t0 = process.hrtime.bigint();
    res.on("finish", () => {
      const ms = Number(process.hrtime.bigint() - t0) / 1e6;
      process.stdout.write(`${req.method} ${req.originalUrl} ${res.statusCode} ${ms.toFixed(1)} ms\n`);
    });
    next();
  });
}
app.all("*", createRequestHandler({ build, mode: process.env.NODE_ENV }));

// The public calculators are the hottest, simplest endpoints: stateless, no cookies, no page. They go
// straight to their route module's action (the same code React Router would call), skipping Express
// and the router's matching. Everything they need (auth, rate limit, validation, problem+json) is in
// calcAction itself; the root middleware exempts them from the CSRF check anyway.
const CALC = new Map(
  ["pipe-loss", "system-curve", "operating-point"].map((n) => [`/api/v1/calc/${n}`, build.routes[`routes/api.v1.calc.${n}`]?.module]),
);
const SECURITY_HEADERS = {
  "Content-Security-Policy": "default-src 'none'; frame-ancestors 'none'",
  "X-Content-Type-Options": "nosniff",
  "Referrer-Policy": "strict-origin-when-cross-origin",
  "X-Frame-Options": "DENY",
};

async function calcFastPath(req, res, mod) {
  const t0 = process.hrtime.bigint();
  try {
    const url = `http://${req.headers.host ?? `${host}:${port}`}${req.url}`;
    const headers = new Headers();
    for (const [k, v] of Object.entries(req.headers)) if (v !== undefined) headers.set(k, Array.isArray(v) ? v.join(", ") : v);
    headers.set(CLIENT_IP_HEADER, (trustProxy ? String(req.headers["x-forwarded-for"] ?? "").split(",")[0].trim() : "") || req.socket.remoteAddress || "");
    const request = new Request(url, { method: req.method, headers, body: req, duplex: "half" });
    const response = await mod.action({ request, params: {}, context: {} });
    const out = { ...SECURITY_HEADERS };
    response.headers.forEach((v, k) => (out[k] = v));
    res.writeHead(response.status, out);
    res.end(Buffer.from(await response.arrayBuffer()));
  } catch (err) {
    if (req.destroyed || err?.code === "ECONNRESET" || err?.message === "aborted") return; // the client went away
    process.stderr.write(`[serve] calc: ${err?.stack ?? err}\n`);
    if (!res.headersSent) res.writeHead(500, { "Content-Type": "application/problem+json", ...SECURITY_HEADERS });
    res.end(JSON.stringify({ type: "about:blank", title: "Internal Server Error", status: 500 }));
  }
  if (process.env.ACCESS_LOG !== "0") process.stdout.write(`${req.method} ${req.url} ${res.statusCode} ${(Number(process.hrtime.bigint() - t0) / 1e6).toFixed(1)} ms\n`);
}

const server = http.createServer((req, res) => {
  const path = (req.url ?? "").split("?")[0].replace(/\/$/, "");
  const mod = req.method === "POST" ? CALC.get(path) : undefined;
  if (mod?.action) return void calcFastPath(req, res, mod);
  app(req, res);
});
server.listen(port, host, () => {
  process.stdout.write(`[serve] Dutymark listening on http://${host}:${port}\n`);
});
for (const signal of ["SIGTERM", "SIGINT"]) {
  process.once(signal, () => {
    server.close(() => process.exit(0));
    setTimeout(() => process.exit(0), 3000).unref();
  });
}
