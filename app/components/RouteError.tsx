// Each route's own ErrorBoundary, in that route's words: what could not be shown and where to go
// back to. It renders inside the shell (header and navigation stay), unlike the root's last-resort
// boundary. Usage in a route module:
//   export const ErrorBoundary = routeErrorBoundary({ what: "this project", back: { href: "/projects", label: "Your projects" } });
import { isRouteErrorResponse, useRouteError } from "react-router";

export type RouteWords = {
  /** What the page shows, as it reads after "could not show": "this project", "the pump library". */
  what: string;
  /** Where to go from here. */
  back: { href: string; label: string };
  /** The 404 sentence, when the route has a better one than the default. */
  notFound?: string;
  /** The 404 title (default "Not found"). */
  notFoundTitle?: string;
};

/** Title and sentence for an error thrown in a route, in the route's words. */
export function routeErrorText(error: unknown, words: RouteWords, dev = false): { title: string; detail: string; stack?: string } {
  if (isRouteErrorResponse(error)) {
    // A refusal says why in its data: a string, or `{ detail }` (with members for the API, e.g. `errors`).
    const text = typeof error.data === "string" ? error.data : typeof error.data?.detail === "string" ? (error.data.detail as string) : "";
    const said = text.trim() ? text : null;
    switch (error.status) {
      case 400:
        return { title: "That request could not be read", detail: said ?? `Something in the address or the form for ${words.what} is not valid.` };
      case 401:
        return { title: "Please sign in", detail: `Sign in to see ${words.what}.` };
      case 403:
        return { title: "Not allowed", detail: said ?? `Your role in this workspace does not allow you to see or change ${words.what}.` };
      case 404:
        return {
          title: words.notFoundTitle ?? "Not found",
          detail: words.notFound ?? `We could not find ${words.what}. It may have been deleted, the link may be wrong, or it belongs to a workspace you are not in.`,
        };
      case 409:
        return { title: "Not possible as things stand", detail: said ?? `Something about ${words.what} has to be put right first.` };
      case 413:
        return { title: "Too large", detail: said ?? "What you sent is larger than this page accepts." };
      case 503:
        return { title: "Temporarily unavailable", detail: "The database is not answering. Your data is safe; try again in a moment." };
      default:
        return { title: `${error.status} ${error.statusText}`.trim(), detail: said ?? `Something went wrong while showing ${words.what}.` };
    }
  }
  const detail = `Something went wrong while showing ${words.what}. Try again; if it keeps happening, tell your workspace admin.`;
  if (dev && error instanceof Error) return { title: "Something went wrong", detail: error.message, stack: error.stack };
  return { title: "Something went wrong", detail };
}

/** An ErrorBoundary component for one route. */
export function routeErrorBoundary(words: RouteWords) {
  return function RouteErrorBoundary() {
    const error = useRouteError();
    const { title, detail, stack } = routeErrorText(error, words, import.meta.env.DEV);
    return (
      <section className="panel max-w-2xl" role="alert" aria-labelledby="route-error-title">
        <h1 id="route-error-title" className="text-2xl font-bold">
          {title}
        </h1>
        <p className="mt-2 text-slate-700">{detail}</p>
        {stack && <pre className="mt-4 overflow-x-auto text-xs">{stack}</pre>}
        <p className="mt-4">
          <a href={words.back.href}>{words.back.label}</a>
        </p>
      </section>
    );
  };
}
