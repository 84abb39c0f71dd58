import type { Route } from "./+types/home";
import { routeErrorBoundary } from "~/components/RouteError";

export const meta: Route.MetaFunction = () => [{ title: "Dutymark" }];

const JOBS = [
  {
    who: "Design engineers",
    what: "Build the system curve from pipe runs and fittings, overlay candidate pumps, find the operating point, trim or slow the best one to the duty and print a report for sign-off.",
    to: "/projects",
    action: "Open projects",
  },
  {
    who: "Distributors",
    what: "Turn vendor curve exports into clean, versioned pump libraries, fix what the importer flags and publish them to subscribers.",
    to: "/libraries",
    action: "Open pump libraries",
  },
  {
    who: "Contractors",
    what: "At commissioning, enter gauge readings and get the delivered duty point and a verdict against the design duty.",
    to: "/field",
    action: "Open field checks",
  },
];

export default function Home() {
  return (
    <div className="space-y-6">
      <section>
        <h1 className="text-3xl font-bold text-brand-900">Size the pump to the system, then prove it on site.</h1>
        <p className="mt-2 max-w-3xl text-slate-700">
          Dutymark computes system curves (Darcy-Weisbach with Colebrook, fittings, fluid properties by temperature),
          overlays pump curves, finds where they cross and checks efficiency, NPSH margin and motor load.
        </p>
      </section>
      <ul className="grid gap-4 md:grid-cols-3">
        {JOBS.map((j) => (
          <li key={j.who} className="panel flex flex-col">
            <h2 className="text-lg font-semibold">{j.who}</h2>
            <p className="mt-1 flex-1 text-sm text-slate-700">{j.what}</p>
            <p className="mt-3">
              <a className="btn" href={j.to}>
                {j.action}
              </a>
            </p>
          </li>
        ))}
      </ul>
    </div>
  );
}

export const ErrorBoundary = routeErrorBoundary({ what: "the start page", back: { href: "/", label: "Reload the start page" } });
