// React Router's default Node entry (7.18), rendered whole (see onAllReady below), plus the CSP nonce: app/serve.mjs makes one per request
// and hands it over in a request header it overwrites; <ServerRouter nonce> gives it to <Scripts>,
// <ScrollRestoration> and <Links>, and React's own inline scripts get it from renderToPipeableStream.
import { Writable } from "node:stream";
import type { EntryContext, HandleErrorFunction } from "react-router";
import { isRouteErrorResponse, ServerRouter } from "react-router";
import { renderToPipeableStream } from "react-dom/server";
import { assertSettings } from "~/lib/shared/env.server";
import { encodeDocument } from "~/lib/shared/encode-document.server";
import { allowedMethods, allowHeader, patternOf } from "~/lib/shared/methods";

// For app/serve.mjs, which answers these before React Router sees the request (it reads them from the build
// as it reads startupSettings): methods React Router does not take at all, and cross-site writes; and the shape of its
// answers (problem+json under /api/, a small HTML page elsewhere).
export { pageMethodRefusal, unknownMethodAnswer } from "~/lib/shared/methods";
export { csrfRefusal } from "~/lib/auth/csrf.server";
export { refusalAnswer } from "~/lib/shared/refusal.server";

/**
 * Every setting, validated once when the server build is loaded: a missing or bad value stops the
 * server here with one line per problem (app/serve.mjs prints them), instead of failing later.
 */
export const startupSettings = assertSettings();

export const streamTimeout = 5_000;

/**
 * React Router's own error log (its default handler, 7.18), less the 405s it makes itself: a method a
 * route does not take (PROPFIND on an API route, a POST to a page without an action that got past the
 * root middleware's table) is the client's mistake, and a stack for each let anyone fill the log at will.
 */
export const handleError: HandleErrorFunction = (error, { request }) => {
  if (request.signal.aborted) return;
  if (isRouteErrorResponse(error) && error.status === 405) return;
  const inner = isRouteErrorResponse(error) ? (error as { error?: unknown }).error : undefined;
  console.error(inner ?? error);
};

/** Set by app/serve.mjs (a client's own value is overwritten there). */
export const CSP_NONCE_HEADER = "x-dutymark-csp-nonce";

export default function handleRequest(request: Request, responseStatusCode: number, responseHeaders: Headers, routerContext: EntryContext) {
  if (request.method.toUpperCase() === "HEAD") {
    return new Response(null, { status: responseStatusCode, headers: responseHeaders });
  }
  // React Router's own 405 page (a method it refuses before any middleware: OPTIONS on a page, PROPFIND
  // and the like) carries no Allow: the route's methods from the one table (lib/shared/methods.ts).
  if (responseStatusCode === 405 && !responseHeaders.has("Allow")) {
    responseHeaders.set("Allow", allowHeader(allowedMethods(patternOf(routerContext.manifest.routes, new URL(request.url).pathname))));
  }
  const raw = request.headers.get(CSP_NONCE_HEADER) ?? "";
  const nonce = /^[A-Za-z0-9+/=_-]{16,64}$/.test(raw) ? raw : undefined;
  return new Promise((resolve, reject) => {
    let shellRendered = false;
    let timeoutId: ReturnType<typeof setTimeout> | undefined = setTimeout(() => abort(), streamTimeout + 1000);
    const { pipe, abort } = renderToPipeableStream(<ServerRouter context={routerContext} url={request.url} nonce={nonce} />, {
      nonce,
      // The whole document at once, in one chunk. No route streams deferred data (no <Await>/<Suspense>),
      // and React Router's Node adapter writes and flushes every chunk it is given: React's 2 KB chunks
      // each became a compression flush (a zlib round trip and a worse ratio), a third of a 70 KB
      // page's server time (measured: 12.4 ms against 8.6 ms without compression, before this change).
      // That one chunk is then compressed in one call (encode-document.server.ts).
      onAllReady() {
        shellRendered = true;
        const chunks: Buffer[] = [];
        const whole = new Writable({
          write(chunk: Buffer, _encoding, callback) {
            chunks.push(chunk);
            callback();
          },
          final(callback) {
            clearTimeout(timeoutId);
            timeoutId = undefined;
            responseHeaders.set("Content-Type", "text/html");
            responseHeaders.append("Vary", "Accept-Encoding");
            encodeDocument(request.headers.get("accept-encoding"), Buffer.concat(chunks)).then(({ body, encoding }) => {
              if (encoding) responseHeaders.set("Content-Encoding", encoding);
              resolve(new Response(body, { headers: responseHeaders, status: responseStatusCode }));
              callback();
            }, (error: unknown) => {
              reject(error);
              callback();
            });
          },
        });
        pipe(whole);
      },
      onShellError(error: unknown) {
        reject(error);
      },
      onError(error: unknown) {
        responseStatusCode = 500;
        if (shellRendered) console.error(error);
      },
    });
  });
}
