// React Router's default Node entry (7.18), plus the CSP nonce: app/serve.mjs makes one per request
// and hands it over in a request header it overwrites; <ServerRouter nonce> gives it to <Scripts>,
// <ScrollRestoration> and <Links>, and React's own inline scripts get it from renderToPipeableStream.
import { PassThrough } from "node:stream";
import type { EntryContext } from "react-router";
import { createReadableStreamFromReadable } from "@react-router/node";
import { ServerRouter } from "react-router";
import { isbot } from "isbot";
import type { RenderToPipeableStreamOptions } from "react-dom/server";
import { renderToPipeableStream } from "react-dom/server";
import { assertSettings } from "~/lib/shared/env.server";

/**
 * Every setting, validated once when the server build is loaded: a missing or bad value stops the
 * server here with one line per problem (app/serve.mjs prints them), instead of failing later.
 */
export const startupSettings = assertSettings();

export const streamTimeout = 5_000;

/** Set by app/serve.mjs (a client's own value is overwritten there). */
export const CSP_NONCE_HEADER = "x-dutymark-csp-nonce";

export default function handleRequest(request: Request, responseStatusCode: number, responseHeaders: Headers, routerContext: EntryContext) {
  if (request.method.toUpperCase() === "HEAD") {
    return new Response(null, { status: responseStatusCode, headers: responseHeaders });
  }
  const raw = request.headers.get(CSP_NONCE_HEADER) ?? "";
  const nonce = /^[A-Za-z0-9+/=_-]{16,64}$/.test(raw) ? raw : undefined;
  return new Promise((resolve, reject) => {
    let shellRendered = false;
    const userAgent = request.headers.get("user-agent");
    const readyOption: keyof RenderToPipeableStreamOptions = (userAgent && isbot(userAgent)) || routerContext.isSpaMode ? "onAllReady" : "onShellReady";
    let timeoutId: ReturnType<typeof setTimeout> | undefined = setTimeout(() => abort(), streamTimeout + 1000);
    const { pipe, abort } = renderToPipeableStream(<ServerRouter context={routerContext} url={request.url} nonce={nonce} />, {
      nonce,
      [readyOption]() {
        shellRendered = true;
        const body = new PassThrough({
          final(callback) {
            clearTimeout(timeoutId);
            timeoutId = undefined;
            callback();
          },
        });
        const stream = createReadableStreamFromReadable(body);
        responseHeaders.set("Content-Type", "text/html");
        pipe(body);
        resolve(new Response(stream, { headers: responseHeaders, status: responseStatusCode }));
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
