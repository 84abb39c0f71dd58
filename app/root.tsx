import {
  data,
  Form,
  isRouteErrorResponse,
  Links,
  Meta,
  NavLink,
  Outlet,
  Scripts,
  ScrollRestoration,
  useRouteLoaderData,
} from "react-router";
import type { Route } from "./+types/root";
import "./app.css";
import { csrfRefusal } from "~/lib/auth/csrf.server";
import { getAuth } from "~/lib/auth/session.server";
import { authWithWorkspaces } from "~/lib/auth/guards.server";
import { problem } from "~/lib/shared/problem.server";
import { refusalResponse } from "~/lib/shared/refusal.server";
import { methodVerdict, optionsAllow } from "~/lib/shared/methods";
import { requestScope } from "~/lib/shared/request-scope.server";
import { ensureOutboxFlusher } from "~/lib/mail/outbox.server";
import { databaseTrouble } from "~/lib/shared/health.server";
// Bodies that declare more than their limit are refused before any action reads them (413); the
// bytes actually read (chunked bodies too) are counted by app/serve.mjs against the same table.
import { bodyLimitFor } from "~/lib/shared/body-limits.mjs";

export const middleware: Route.MiddlewareFunction[] = [
  // One memo for the whole request (session, workspace list): see lib/shared/request-scope.server.ts.
  ({ request }, next) => requestScope(request, next),
  async ({ request, pattern }, next) => {
    ensureOutboxFlusher(); // idempotent: retries unsent mail in the background of each app process
    const url = new URL(request.url);
    const isApi = url.pathname.startsWith("/api/");
    const refusal = csrfRefusal(request);
    if (refusal) {
      if (isApi) throw problem({ title: "Forbidden", status: 403, detail: refusal });
      throw data(refusal, { status: 403 });
    }
    // Outside /api/ the method is checked here, after the CSRF check and before any action can run (React
    // Router runs an action on PUT, PATCH and DELETE as on POST): the table is lib/shared/methods.ts. API
    // routes answer wrong methods themselves (problem.server.ts methodNotAllowed). The refusal is the small
    // HTML page of lib/shared/refusal.server.ts, with Allow: app/serve.mjs answers the same before React
    // Router in the same order (pageMethodRefusal), with the app's stylesheet; this one is for requests that
    // reach the app otherwise (the dev server, tests).
    if (!isApi) {
      const { verdict, allow } = methodVerdict(request.method, pattern);
      if (verdict === "options") return new Response(null, { status: 204, headers: { Allow: optionsAllow(allow) } });
      if (verdict === "refuse") {
        const detail = `${request.method.toUpperCase()} is not taken here: use ${allow.join(" or ")}.`;
        return refusalResponse(url.pathname, { status: 405, title: "Method Not Allowed", detail, allow: allow.join(", ") });
      }
    }
    const length = Number(request.headers.get("content-length") ?? 0);
    const limit = bodyLimitFor(url.pathname);
    if (length > limit) {
      const detail = `The request is too large (${(length / 1048576).toFixed(1)} MB; the limit here is ${(limit / 1048576).toFixed(0)} MB).`;
      if (isApi) throw problem({ title: "Content Too Large", status: 413, detail });
      throw data(detail, { status: 413, statusText: "Content Too Large" });
    }
    const res = await next();
    // A request that failed because the database is away (or a cluster node just went) is a 503
    // (the page says "temporarily unavailable"; the API answers problem+json), never a 500. The
    // pool reconnects, or moves to the next node, by itself.
    if (res instanceof Response && res.status === 500 && (await databaseTrouble(800))) {
      const detail = "The database is not answering. Your data is safe; try again in a moment.";
      if (isApi) return problem({ title: "Service Unavailable", status: 503, detail }, { "Retry-After": "5" });
      throw data(detail, { status: 503, headers: { "Retry-After": "5" } });
    }
    const auth = await getAuth(request).catch(() => null);
    if (auth?.refreshCookie && res instanceof Response) res.headers.append("Set-Cookie", auth.refreshCookie);
    // Nothing personal is kept by a browser or a shared cache: signed-in pages, exports and the API.
    if (res instanceof Response && (auth || isApi || /\/export\.(csv|json)$/.test(url.pathname))) {
      try {
        res.headers.set("Cache-Control", "private, no-store");
      } catch {
        /* immutable headers (a fetched Response): leave them */
      }
    }
    return res;
  },
];

export async function loader({ request }: Route.LoaderArgs) {
  const signedIn = await authWithWorkspaces(request);
  if (!signedIn) return { me: null };
  const { auth, membership: { current } } = signedIn;
  return {
    me: {
      name: auth.user.name || auth.user.email,
      email: auth.user.email,
      unitSystem: auth.user.unitSystem,
      workspace: current ? { name: current.name, role: current.role, plan: current.plan } : null,
    },
  };
}

export const meta: Route.MetaFunction = () => [
  { title: "Dutymark — pump selection and system curves" },
  { name: "description", content: "System curves, pump curves, duty points and field checks for pumped piping systems." },
];

const AREAS = [
  { to: "/projects", label: "Projects" },
  { to: "/libraries", label: "Pump libraries" },
  { to: "/field", label: "Field checks" },
  { to: "/workspace", label: "Workspace" },
];

const FAVICON =
  "data:image/svg+xml," +
  encodeURIComponent(
    '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 22 22"><rect width="22" height="22" rx="4" fill="#0d4a45"/><path d="M2 17 C8 16, 13 12, 20 4" stroke="#a7e2d9" stroke-width="2" fill="none"/><path d="M13 8 v8 M9 12 h8" stroke="#f59e0b" stroke-width="2"/></svg>',
  );

export const links: Route.LinksFunction = () => [{ rel: "icon", href: FAVICON, type: "image/svg+xml" }];

export function Layout({ children }: { children: React.ReactNode }) {
  return (
    <html lang="en">
      <head>
        <meta charSet="utf-8" />
        <meta name="viewport" content="width=device-width, initial-scale=1" />
        <Meta />
        <Links />
      </head>
      <body className="min-h-screen">
        <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-50 focus:bg-white focus:p-2">
          Skip to content
        </a>
        {children}
        <ScrollRestoration />
        <Scripts />
      </body>
    </html>
  );
}

export function Shell({ children }: { children: React.ReactNode }) {
  return (
    <div className="flex min-h-screen flex-col">
      <header className="no-print border-b border-brand-900 bg-brand-800 text-white">
        <div className="mx-auto flex max-w-7xl flex-wrap items-center gap-x-6 gap-y-2 px-4 py-2">
          <a href="/" className="flex items-center gap-2 text-lg font-bold text-white no-underline hover:no-underline">
            <DutyGlyph />
            Dutymark
          </a>
          <nav aria-label="Main" className="flex flex-wrap gap-1 text-sm">
            {AREAS.map((a) => (
              <NavLink
                key={a.to}
                to={a.to}
                className={({ isActive }) =>
                  `rounded px-2 py-1 font-semibold text-brand-50 no-underline hover:bg-brand-700 hover:no-underline ${isActive ? "bg-brand-900" : ""}`
                }
              >
                {a.label}
              </NavLink>
            ))}
          </nav>
          <UserMenu />
        </div>
      </header>
      <main id="main" className="mx-auto w-full max-w-7xl flex-1 px-4 py-6">
        {children}
      </main>
      <footer className="no-print border-t border-slate-200 bg-white">
        <p className="mx-auto max-w-7xl px-4 py-3 text-xs text-slate-500">
          Dutymark figures are for design guidance. Verify against the manufacturer's certified data, local codes
          and a licensed engineer.
        </p>
      </footer>
    </div>
  );
}

function UserMenu() {
  const d = useRouteLoaderData<typeof loader>("root");
  const me = d?.me;
  if (!me) {
    return (
      <div className="ml-auto flex gap-2 text-sm">
        <a href="/signin" className="rounded px-2 py-1 font-semibold text-white">
          Sign in
        </a>
        <a href="/signup" className="rounded bg-white px-2 py-1 font-semibold text-brand-800 no-underline hover:no-underline">
          Create account
        </a>
      </div>
    );
  }
  return (
    <div className="ml-auto flex items-center gap-3 text-sm">
      {me.workspace ? (
        <a href="/workspace" className="text-brand-50" title="Current workspace and your role">
          {me.workspace.name} · {me.workspace.role}
        </a>
      ) : null}
      <a href="/account" className="font-semibold text-white">
        {me.name}
      </a>
      <Form method="post" action="/signout">
        <button className="rounded border border-brand-200 px-2 py-0.5 text-brand-50 hover:bg-brand-700">Sign out</button>
      </Form>
    </div>
  );
}

/** Our mark: a system curve rising through a target cross. */
function DutyGlyph() {
  return (
    <svg width="22" height="22" viewBox="0 0 22 22" aria-hidden="true">
      <path d="M2 17 C8 16, 13 12, 20 4" stroke="#a7e2d9" strokeWidth="2" fill="none" />
      <path d="M13 8 v8 M9 12 h8" stroke="#f59e0b" strokeWidth="2" />
    </svg>
  );
}

export default function App() {
  return (
    <Shell>
      <Outlet />
    </Shell>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  let title = "Something went wrong";
  let detail = "An unexpected error stopped this page. Try again; if it keeps happening, tell your workspace admin.";
  let stack: string | undefined;
  if (isRouteErrorResponse(error)) {
    if (error.status === 404) {
      title = "Page not found";
      detail = "Nothing lives at this address. Check the link or go back to the start page.";
    } else if (error.status === 403) {
      title = "Not allowed";
      detail = typeof error.data === "string" && error.data ? error.data : "Your role in this workspace does not allow this.";
    } else if (error.status === 503) {
      title = "Temporarily unavailable";
      detail = "The database is not answering. Your data is safe; try again in a moment.";
    } else {
      title = `${error.status} ${error.statusText}`;
      detail = typeof error.data === "string" ? error.data : detail;
    }
  } else if (import.meta.env.DEV && error instanceof Error) {
    detail = error.message;
    stack = error.stack;
  }
  return (
    <Shell>
      <section className="panel max-w-2xl">
        <h1 className="text-2xl font-bold">{title}</h1>
        <p className="mt-2 text-slate-700">{detail}</p>
        {stack && <pre className="mt-4 overflow-x-auto text-xs">{stack}</pre>}
        <p className="mt-4">
          <a href="/">Back to the start page</a>
        </p>
      </section>
    </Shell>
  );
}
