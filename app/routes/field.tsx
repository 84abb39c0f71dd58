import { useLoaderData } from "react-router";
import type { Route } from "./+types/field";
import { requireMember } from "~/lib/auth/guards.server";
import { viewerOf } from "~/lib/auth/viewer.server";
import { fieldHome } from "~/lib/fieldchecks/records.server";
import { CheckWhen, FieldCaution, VerdictBadge } from "~/components/fieldcheck";
import { PendingChecks, usePendingChecks } from "~/components/field/PendingChecks";
import { OfflineReady, useOfflineCopies } from "~/components/field/offline";
import { routeErrorBoundary } from "~/components/RouteError";
import { renderDeep } from "~/lib/shared/units";

// GET /field — selections open for field checks (shared with this workspace, and its own) and recent checks (newest
// first by the time their readings were taken, else recorded; both times shown, as in the history).

export const meta: Route.MetaFunction = () => [{ title: "Field checks · Dutymark" }, { name: "theme-color", content: "#0d4a45" }];
export const links: Route.LinksFunction = () => [{ rel: "manifest", href: "/field.webmanifest" }, { rel: "apple-touch-icon", href: "/icons/field-192.png" }];

export async function loader({ request }: Route.LoaderArgs) {
  const m = await requireMember(request, "fieldcheck.read");
  const h = await fieldHome(viewerOf(m));
  return { ...renderDeep(h, m.user.units), workspace: m.workspace.name, role: m.role, unitSystem: m.user.units, owner: `${m.user.id}/${m.workspace.id}` };
}

export default function FieldHome() {
  const d = useLoaderData<typeof loader>();
  const shared = d.selections.filter((s) => !s.own);
  const own = d.selections.filter((s) => s.own);
  const pending = usePendingChecks(d.owner, null);
  // Copies for site: this list and every selection's form (with its curve data) open to this workspace.
  const kept = useOfflineCopies(["/field", ...d.selections.map((s) => `/field/selections/${s.id}`)]);
  const list = (items: typeof d.selections) => (
    <ul className="mt-2 divide-y divide-slate-100">
      {items.map((s) => (
        <li key={s.id} className="py-2">
          <a href={`/field/selections/${s.id}`} className="inline-block py-2 font-semibold">
            {s.title}
          </a>
          <span className="block text-sm text-slate-600">
            {s.projectName} · {s.systemName}
            {s.own ? "" : ` · from ${s.ownerName}`}
          </span>
        </li>
      ))}
    </ul>
  );
  return (
    <article className="mx-auto max-w-xl space-y-4">
      <header>
        <h1 className="text-xl font-bold text-brand-900">Field checks</h1>
        <p className="text-sm text-slate-700">
          Check on site that an installed pump delivers its design duty. Pick a selection, enter the gauge readings, get the delivered point and a verdict;
          the engineer of the project is told by e-mail.
        </p>
      </header>
      <FieldCaution />
      <OfflineReady kept={kept} />
      <PendingChecks pending={pending} unitSystem={d.unitSystem} showSelection />
      <section className="panel">
        <h2 className="font-semibold">Shared with {d.workspace}</h2>
        {shared.length ? list(shared) : <p className="mt-2 text-sm text-slate-600">No project has been shared with this workspace yet. Ask the engineer to share it with “{d.workspace}”.</p>}
      </section>
      {own.length ? (
        <section className="panel">
          <h2 className="font-semibold">This workspace's selections</h2>
          {list(own)}
        </section>
      ) : null}
      <section className="panel">
        <h2 className="font-semibold">Recent checks</h2>
        {d.checks.length === 0 ? (
          <p className="mt-2 text-sm text-slate-600">None yet.</p>
        ) : (
          <ul className="mt-2 divide-y divide-slate-100 text-sm">
            {d.checks.map((c) => (
              <li key={c.id} className="flex flex-wrap items-center justify-between gap-2 py-2">
                <a href={`/field/checks/${c.id}`} className="inline-block py-2">
                  {c.selection} · check {c.id} v{c.version}
                </a>
                <span className="text-slate-600">
                  <CheckWhen times={c.times} /> · {c.byName || "—"} ({c.byWorkspace})
                </span>
                {/* Today's verdict with its rule and numbers; the stored one beside it, dated, where they differ (listed-verdict.ts). */}
                <VerdictBadge verdict={c.shown.verdict} grade={c.grade} />
                <span className="w-full text-xs text-slate-600" data-testid="verdict-shown" data-differs={c.shown.today !== null ? "yes" : "no"}>
                  {c.shown.text}
                </span>
              </li>
            ))}
          </ul>
        )}
      </section>
    </article>
  );
}

export const ErrorBoundary = routeErrorBoundary({ what: "the field checks", back: { href: "/", label: "The start page" } });
