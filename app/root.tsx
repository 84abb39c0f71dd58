import {
  isRouteErrorResponse,
  Links,
  Meta,
  NavLink,
  Outlet,
  Scripts,
  ScrollRestoration,
} from "react-router";
import type { Route } from "./+types/root";
import "./app.css";

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
