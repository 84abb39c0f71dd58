// Tests only: a route's page as the server first sends it — loader data rendered with the route's component through
// React Router's test stub (`renderPage`), or the loader called first as a member, 200 expected (`loadedPage`).
// What the page tests read: markup, or markup with React's text separators and the usual entities undone (`plainHtml`).
import { createElement, type ComponentType } from "react";
import { renderToString } from "react-dom/server";
import { createRoutesStub } from "react-router";
import { expect } from "vitest";
import { call } from "./harness";

/** The markup of the page at `url` (route pattern `pattern`) rendered from `data`, as its loader's answer. */
export function renderPage(pattern: string, Component: unknown, url: string, data: unknown): string {
  const Stub = createRoutesStub([{ path: pattern, Component: Component as ComponentType, loader: () => data }]);
  return renderToString(createElement(Stub, { initialEntries: [url], hydrationData: { loaderData: { "0": data } } } as never));
}

/** Markup with React's `<!-- -->` text separators dropped and `&#x27;` / `&quot;` written as the quotes they stand for. */
export const plainHtml = (html: string) => html.replace(/<!-- -->/g, "").replace(/&#x27;/g, "'").replace(/&quot;/g, '"');

type PageRoute = { loader?: unknown; default: unknown };

/**
 * The page of `route` at `path` (its query included) as `m` gets it: the loader called (200 expected), then the page
 * rendered from its answer with `pattern`'s `:id` set from `params`; `change` may alter the loaded data first.
 */
export async function loadedPage(
  m: { cookie: string },
  route: PageRoute,
  pattern: string,
  path: string,
  params: Record<string, string>,
  change?: (data: never) => void,
): Promise<{ html: string; data: unknown }> {
  const r = await call(route.loader as never, { path, params, cookie: m.cookie });
  expect(r.status, path).toBe(200);
  change?.(r.body as never);
  return { html: plainHtml(renderPage(pattern, route.default, path.split("?")[0], r.body)), data: r.body };
}
