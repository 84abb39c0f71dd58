#!/usr/bin/env node
// Dutymark's HTTP server for the production build (`npm start` runs it): Express + React Router's
// request handler, like react-router-serve, plus what that one lacks here:
//  - the client address handed to the app in a header it can trust (sign-in throttling per address),
//  - security headers on every response (CSP, frame-ancestors, nosniff, referrer policy),
//  - a clean stop on SIGTERM/SIGINT (HTTP server closed, then the process exits so the DB pool ends).
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

const server = app.listen(port, host, () => {
  process.stdout.write(`[serve] Dutymark listening on http://${host}:${port}\n`);
});
for (const signal of ["SIGTERM", "SIGINT"]) {
  process.once(signal, () => {
    server.close(() => process.exit(0));
    setTimeout(() => process.exit(0), 3000).unref();
  });
}
