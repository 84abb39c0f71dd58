// The refusals app/serve.mjs answers itself, before React Router (a method React Router does not take, a cross-site
// write, a body over its limit), in the two shapes the app answers everywhere else: under /api/ an RFC 9457 problem
// document (the API's own, problem.server.ts `problemBody`), elsewhere a small HTML page in the app's look (the root
// ErrorBoundary's heading and sentence, the app's stylesheet, no script). serve.mjs is plain JavaScript run by node: it
// gets this function from the server build (app/entry.server.tsx re-exports it, as it does unknownMethodAnswer and
// csrfRefusal), so the shape is written once, in TypeScript, and tested here. Pure.
import { problemBody } from "./problem.server";
import { allowHeader } from "./methods";

/** What is refused: the status, its reason phrase (RFC 9110), the sentence for the reader and, for a 405, the Allow. */
export type Refusal = { status: number; title: string; detail: string; allow?: string };
/** A whole answer, as serve.mjs writes it. */
export type RefusalAnswer = { status: number; headers: Record<string, string>; body: string };

const escapeHtml = (s: string) => s.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;").replace(/'/g, "&#39;");

/**
 * The page for a refusal outside /api/: the root ErrorBoundary's markup (a heading "405 Method Not Allowed", the sentence,
 * a way back) inside the app's header bar, with the build's stylesheets (`stylesheets`: the root route's CSS from the
 * build's asset manifest). Everything of the request it names (the Origin of a cross-site write) is escaped.
 */
export function refusalPage(r: Refusal, stylesheets: readonly string[] = []): string {
  const heading = escapeHtml(`${r.status} ${r.title}`);
  const css = stylesheets.map((href) => `<link rel="stylesheet" href="${escapeHtml(href)}">`).join("");
  return (
    `<!DOCTYPE html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">` +
    `<title>${heading} · Dutymark</title>${css}</head><body class="min-h-screen"><div class="flex min-h-screen flex-col">` +
    `<header class="border-b border-brand-900 bg-brand-800 text-white"><div class="mx-auto flex max-w-7xl items-center gap-x-6 px-4 py-2">` +
    `<a href="/" class="text-lg font-bold text-white no-underline hover:no-underline">Dutymark</a></div></header>` +
    `<main id="main" class="mx-auto w-full max-w-7xl flex-1 px-4 py-6"><section class="panel max-w-2xl">` +
    `<h1 class="text-2xl font-bold">${heading}</h1><p class="mt-2 text-slate-700">${escapeHtml(r.detail)}</p>` +
    `<p class="mt-4"><a href="/">Back to the start page</a></p></section></main></div></body></html>`
  );
}

/** The answer to a refusal at `pathname`: problem+json under /api/, the page elsewhere; never cached; Allow kept on a 405. */
export function refusalAnswer(pathname: string, r: Refusal, stylesheets: readonly string[] = []): RefusalAnswer {
  const api = pathname.startsWith("/api/");
  const headers: Record<string, string> = {
    "Content-Type": api ? "application/problem+json" : "text/html; charset=utf-8",
    "Cache-Control": "no-store",
    ...(r.allow ? { Allow: allowHeader(r.allow) } : {}), // the route's methods and OPTIONS, as its OPTIONS answer says
  };
  const body = api ? JSON.stringify(problemBody({ title: r.title, status: r.status, detail: r.detail })) : refusalPage(r, stylesheets);
  return { status: r.status, headers, body };
}

/**
 * The same answer as a Response, for the root middleware (app/root.tsx): its refusals of requests that reach the app
 * another way than app/serve.mjs (the dev server, tests). It does not know the build's assets, so its page has no stylesheet.
 */
export function refusalResponse(pathname: string, r: Refusal): Response {
  const a = refusalAnswer(pathname, r);
  return new Response(a.body, { status: a.status, headers: a.headers });
}
