#!/usr/bin/env node
// Dutymark's HTTP server for the production build (`npm start` runs it): Express + React Router's
// request handler, like react-router-serve, plus what that one lacks here:
//  - the client address handed to the app in a header it can trust (sign-in throttling per address): the socket's,
//    or behind proxies (TRUST_PROXY: hops or addresses) the one the last proxy of ours saw,
//  - security headers on every response through helmet: a per-request nonce CSP (no inline script
//    without it), form-action limited to our origin and the Stripe checkout, HSTS behind https,
//  - request bodies capped by the bytes actually read (chunked or not): 413 at the limit,
//  - a lingering close after any answer sent before its request's body came in (a refusal, a 413), so a client still
//    sending reads the answer instead of a reset,
//  - answers of its own, before React Router, where React Router would refuse first and log a stack: a method
//    it does not take (PROPFIND, TRACE…: 405 with the route's Allow) and a cross-site write (our CSRF check: 403),
//    and the methods a route outside /api/ does not take (the root middleware's table: PUT, PATCH, DELETE…),
//    each as the app answers elsewhere: problem+json under /api/, a small HTML page otherwise (refusalAnswer),
//  - a clean stop on SIGTERM/SIGINT (HTTP server closed, then the process exits so the DB pool ends).
import http from "node:http";
import fs from "node:fs";
import crypto from "node:crypto";
import path from "node:path";
import { pathToFileURL } from "node:url";
import express from "express";
import compression from "compression";
import helmet from "helmet";
import { createRequestHandler } from "@react-router/express";
// Body limits by path, counted on the bytes read: one table shared with app/root.tsx (which refuses
// the same sizes up front by Content-Length). The calculators (calcAction) also read at most their
// own limit themselves.
import { bodyLimitFor } from "./lib/shared/body-limits.mjs";

const buildPath = path.resolve(process.argv[2] ?? "build/server/index.js");
let build;
try {
  build = await import(pathToFileURL(buildPath).href);
} catch (err) {
  // app/lib/shared/env.server.ts: every bad setting named, one per line; no stack needed.
  if (err?.name === "SettingsError") {
    process.stderr.write(`[serve] ${err.message}\n`);
    process.exit(1);
  }
  throw err;
}
/** Validated by app/lib/shared/env.server.ts when the build loaded (app/entry.server.tsx). */
const settings = build.entry.module.startupSettings;
const { port, host, proxyTrust } = settings;
/**
 * app/entry.server.tsx hands these over from app/lib: lib/shared/methods.ts (two), lib/auth/csrf.server.ts and
 * lib/shared/refusal.server.ts (the shape of every answer of ours below: one place, in TypeScript, with the API's problem).
 */
const { unknownMethodAnswer, csrfRefusal, pageMethodRefusal, refusalAnswer } = build.entry.module;
/** The app's stylesheet for our refusal pages (the root route's CSS in the build's asset manifest). */
const stylesheets = build.assets?.routes?.root?.css ?? [];

export const CLIENT_IP_HEADER = "x-dutymark-client-ip";
/** Read by app/entry.server.tsx; always overwritten here. */
export const CSP_NONCE_HEADER = "x-dutymark-csp-nonce";

function originOf(url) {
  try {
    return url ? new URL(url).origin : null;
  } catch {
    return null;
  }
}
const appOrigin = originOf(settings.appUrl);
const https = appOrigin?.startsWith("https://") ?? false;
// Forms post to us; the billing form is answered by a redirect to the Stripe checkout (or the local
// stand-in when STRIPE_API_BASE points at it), which form-action also governs.
const formAction = ["'self'", appOrigin, ...(settings.stripe.apiBase ? [originOf(settings.stripe.apiBase)] : ["https://checkout.stripe.com", "https://billing.stripe.com"])].filter(Boolean);
const securityHeaders = helmet({
  contentSecurityPolicy: {
    useDefaults: false,
    directives: {
      defaultSrc: ["'self'"],
      scriptSrc: ["'self'", (_req, res) => `'nonce-${res.locals.cspNonce}'`],
      // Charts and bars set style attributes; nonces do not cover attributes.
      styleSrc: ["'self'", "'unsafe-inline'"],
      imgSrc: ["'self'", "data:", "blob:"],
      fontSrc: ["'self'", "data:"],
      connectSrc: ["'self'"],
      frameSrc: ["'self'"],
      frameAncestors: ["'none'"],
      formAction,
      baseUri: ["'self'"],
      objectSrc: ["'none'"],
    },
  },
  strictTransportSecurity: https ? { maxAge: 31536000, includeSubDomains: true } : false,
  xFrameOptions: { action: "deny" },
  referrerPolicy: { policy: "strict-origin-when-cross-origin" },
  crossOriginOpenerPolicy: { policy: "same-origin" },
  crossOriginEmbedderPolicy: false,
  crossOriginResourcePolicy: { policy: "same-origin" },
  xPoweredBy: false,
});

/**
 * An answer that goes out before the request's body has all come in — a refusal made before reading it (our 403 and 405,
 * the app's 401, 403 and 405) or our 413 — is lost to a client still sending if the connection is simply closed: with
 * `Connection: close` Node ends the socket after the answer and destroys it, and a socket destroyed with bytes unread is
 * answered by the kernel with a reset, which can reach the client before it has read the answer (EPIPE, ECONNRESET;
 * RFC 9112 §9.6). So the close lingers, as nginx's lingering_close and Apache's lingering close do: what the client still
 * sends is read and dropped — never kept — up to LINGER_BYTES or for LINGER_MS, and
 * only then is the connection destroyed; a body that ends meanwhile ends it cleanly (a kept-alive connection stays).
 */
const LINGER_BYTES = 64 * 1024 * 1024;
const LINGER_MS = 30_000;

function lingerAfterAnswer(req, res, next) {
  res.on("finish", () => {
    const socket = req.socket;
    if (req.complete || !socket || socket.destroyed) return;
    // Node's own finish handler ran first (registered when the request came in): without keep-alive it has ended the
    // socket and set it to be destroyed once written. That destroy waits for the body's end here instead.
    socket.removeListener("finish", socket.destroy);
    const close = () => socket.destroy();
    const timer = setTimeout(close, LINGER_MS).unref();
    // Up to LINGER_BYTES whatever the route's limit: the answer is out, and a body past that limit (the answer came before
    // the limit was reached) is dropped like any other — cut at the route's limit, the client's last writes met a reset.
    const cap = LINGER_BYTES;
    let dropped = 0;
    req.removeAllListeners("data"); // whoever was reading the body (React Router) has answered without it
    req.on("error", () => {});
    req.on("data", (chunk) => {
      dropped += chunk.length;
      if (dropped > cap) close();
    });
    req.once("end", () => {
      clearTimeout(timer);
      if (!socket.writableEnded) return; // kept alive: the next request may come
      if (socket.writableFinished) close();
      else socket.once("finish", close);
    });
    req.resume();
  });
  next();
}

const pathOf = (req) => (req.originalUrl ?? req.url ?? "").split("?")[0];

function tooLarge(req, res, limit, seen) {
  res.locals.tooLarge = true;
  // Whoever was reading the body (React Router) stops here with an error: no action runs on a cut body.
  req.removeAllListeners("data");
  if (req.listenerCount("error") > 0) req.emit("error", Object.assign(new Error("request body over the limit"), { code: "BODY_TOO_LARGE" }));
  req.on("error", () => {});
  const detail = `The request is too large: the limit here is ${limit} bytes (${seen} read or declared).`;
  refuse(res, pathOf(req), { status: 413, title: "Content Too Large", detail }); // then lingerAfterAnswer drops the rest
}

/** Counts the body bytes as they are read (by React Router, or by nobody); over the limit → 413. */
function bodyLimit(req, res, next) {
  if (req.method === "GET" || req.method === "HEAD") return next();
  const limit = bodyLimitFor(pathOf(req));
  const declared = Number(req.headers["content-length"]);
  if (Number.isFinite(declared) && declared > limit) return tooLarge(req, res, limit, declared);
  let seen = 0;
  const count = (chunk) => {
    seen += chunk.length;
    if (seen <= limit) return;
    req.off("data", count);
    if (!res.headersSent) tooLarge(req, res, limit, seen);
    else if (!res.writableFinished) req.socket?.destroy(); // an answer being written: it cannot be finished now
    // else answered before the body was read: lingerAfterAnswer drops the rest, up to LINGER_BYTES
  };
  // Attached in the same tick as React Router's own reader (createRequestHandler builds the Request
  // synchronously), so both see every chunk.
  req.on("data", count);
  next();
}

/**
 * The request's URL as @react-router/express builds it for the app (createRemixRequest, 7.18): the CSRF
 * check compares the Origin with this URL's origin, here exactly as in the root middleware.
 */
function appUrlOf(req) {
  const [, forwardedPort] = req.app.enabled("trust proxy") ? (req.get("X-Forwarded-Host")?.split(":") ?? []) : [];
  const [, hostPort] = req.get("host")?.split(":") ?? [];
  const a = Number.parseInt(forwardedPort, 10);
  const b = Number.parseInt(hostPort, 10);
  const p = Number.isSafeInteger(a) ? a : Number.isSafeInteger(b) ? b : "";
  const hostname = req.hostname.split(/[\\/?#@]/)[0] || "localhost";
  return `${req.protocol}://${hostname}${p ? `:${p}` : ""}${req.originalUrl}`;
}

/**
 * Our own refusal ({ status, title, detail, allow? }): problem+json under /api/, a small HTML page elsewhere (refusalAnswer,
 * lib/shared/refusal.server.ts). Nothing of the request is echoed but its method (and a cross-site write's Origin, escaped).
 */
function refuse(res, pathname, refusal) {
  const answer = refusalAnswer(pathname, refusal, stylesheets);
  res.writeHead(answer.status, answer.headers);
  res.end(answer.body);
}

/**
 * What React Router would refuse before any middleware of ours runs, answered here instead: a method it does not
 * take (its 405 on a resource route said "Unexpected Server Error", with no Allow and a stack in the log), and a
 * cross-site write (its own Origin check on document and `.data` POSTs answered 400 and logged two stacks a request,
 * so anyone could fill the log). The CSRF check is the root middleware's own (lib/auth/csrf.server.ts), run earlier;
 * after it, as in the middleware, so is its method table outside /api/ (PUT, PATCH, DELETE, a POST to a page without an
 * action: lib/shared/methods.ts), so that every refusal of a page is the same page, with the app's stylesheet.
 */
function beforeRouter(req, res, next) {
  const pathname = req.path;
  const unknown = unknownMethodAnswer(build.routes, req.method, pathname);
  if (unknown?.status === 204) return void res.writeHead(204, { Allow: unknown.allow, "Cache-Control": "no-store" }).end();
  if (unknown?.status === 405) return refuse(res, pathname, { status: 405, title: "Method Not Allowed", detail: unknown.detail, allow: unknown.allow });
  if (unknown) return refuse(res, pathname, { status: unknown.status, title: "Not Found", detail: unknown.detail });
  const request = { method: req.method, get url() { return appUrlOf(req); }, headers: { get: (name) => req.get(name) ?? null } };
  const refusal = csrfRefusal(request);
  if (refusal) return refuse(res, pathname, { status: 403, title: "Forbidden", detail: refusal });
  const wrong = pageMethodRefusal(build.routes, req.method, pathname);
  if (wrong) return refuse(res, pathname, { status: 405, title: "Method Not Allowed", detail: wrong.detail, allow: wrong.allow });
  next();
}

const app = express();
app.disable("x-powered-by");
app.use(lingerAfterAnswer);
// Never `true` (every X-Forwarded-For entry believed: the left-most, which the client writes itself, became its address).
// A number of hops or the proxies' addresses (TRUST_PROXY, checked in lib/shared/env.server.ts): req.ip is then the
// address the last trusted proxy saw, whatever the client put before it.
if (proxyTrust !== false) app.set("trust proxy", proxyTrust);
// First, so a request's logged time is all Express does for it: from here to the last byte handed to the socket.
if (settings.accessLog) {
  app.use((req, res, next) => {
    const t0 = process.hrtime.bigint();
    res.on("finish", () => {
      const ms = Number(process.hrtime.bigint() - t0) / 1e6;
      process.stdout.write(`${req.method} ${req.originalUrl} ${res.statusCode} ${ms.toFixed(1)} ms\n`);
    });
    next();
  });
}
app.use(compression());
app.use((req, res, next) => {
  // Overwrites anything a client sent under these names.
  req.headers[CLIENT_IP_HEADER] = (proxyTrust !== false ? req.ip : req.socket.remoteAddress) ?? "";
  res.locals.cspNonce = crypto.randomBytes(18).toString("base64");
  req.headers[CSP_NONCE_HEADER] = res.locals.cspNonce;
  next();
});
app.use(securityHeaders);
const assetsDir = path.join(path.dirname(buildPath), "..", "client");
app.use("/assets", express.static(path.join(assetsDir, "assets"), { immutable: true, maxAge: "1y" }));
// The public folder's files (service worker, manifest, icons), looked up only under their own top-level
// names: a page's path never waits on a file-system lookup that fails (one per page request before).
const publicNames = new Set(fs.readdirSync(assetsDir).filter((name) => name !== "assets"));
const publicFiles = express.static(assetsDir, { maxAge: "1h" });
app.use((req, res, next) => (publicNames.has(req.path.split("/")[1]) ? publicFiles(req, res, next) : next()));
app.use(beforeRouter);
app.use(bodyLimit);
// Mounted with use(), not all("*"): a route pattern makes Express decode the path first, and a bad escape
// (/projects/%FF) became its own HTML 400 with a URIError logged; the router answers such paths (404).
app.use(createRequestHandler({ build, mode: process.env.NODE_ENV }));
// After a 413 the app's own answer (its body read failed) has nowhere to go: drop it quietly.
app.use((err, req, res, next) => {
  if (res.locals.tooLarge) return; // answered already; the connection closes after the linger
  if (res.headersSent) return void req.socket?.destroy();
  next(err);
});

// One way in: every request, the calculators included, goes through Express and the router.
const server = http.createServer(app);
server.listen(port, host, () => {
  process.stdout.write(`[serve] Dutymark listening on http://${host}:${port}\n`);
});
for (const signal of ["SIGTERM", "SIGINT"]) {
  process.once(signal, () => {
    server.close(() => process.exit(0));
    setTimeout(() => process.exit(0), 3000).unref();
  });
}
