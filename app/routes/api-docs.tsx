import type { Route } from "./+types/api-docs";
import { ANON_RATE_LIMIT, CALC_LIMITS } from "~/lib/calc-api/schemas";
import { PUMP_HEAD_SHAPE, REQUEST_SCHEMAS, UNIT_SUFFIXES, calculatorCorrelations, describeRequest } from "~/lib/calc-api/docs";
import { CALC_ENDPOINT_DOCS, PIPE_LOSS_REQ } from "~/lib/calc-api/examples";
import { SystemsApiDocs } from "~/components/api-docs-systems";
import { DocTable } from "~/components/DocTable";
import { routeErrorBoundary } from "~/components/RouteError";
import { CURVE_PAGE_SETS, MODEL_PAGE_ROWS } from "~/lib/libraries";
import { SEARCH_EVALUATED, SEARCH_SHOWN } from "~/lib/projects";

// /api — how to call Dutymark from other software: the public calculators and the account API.
// Field tables and limits are generated from the request schemas (app/lib/calc-api/docs.ts).
export function loader() {
  return {
    limits: CALC_LIMITS,
    rate: ANON_RATE_LIMIT,
    endpoints: CALC_ENDPOINT_DOCS.map((e) => ({ ...e, fields: describeRequest(REQUEST_SCHEMAS[e.id]) })),
    correlations: calculatorCorrelations(),
    headShape: PUMP_HEAD_SHAPE.rules,
    /** Rows a page of the API's lists (each route answers with the same constant). */
    pageSizes: {
      /** GET /api/v1/libraries/:id/models */
      models: MODEL_PAGE_ROWS,
      /** GET /api/v1/libraries/:id/curves (sets with their points) */
      curveSets: CURVE_PAGE_SETS,
      /** GET /api/v1/systems/:id/search */
      searchResults: SEARCH_SHOWN,
    },
    /** The search judges at most this many distinct curves: its pages are slices of those. */
    searchJudged: SEARCH_EVALUATED,
  };
}

export const meta: Route.MetaFunction = () => [
  { title: "API — Dutymark" },
  { name: "description", content: "Pipe loss, system curve and operating point over HTTP and JSON, in SI units." },
];

const ERROR_EXAMPLE = `HTTP/1.1 400 Bad Request
Content-Type: application/problem+json

{
  "type": "about:blank",
  "title": "Bad Request",
  "status": 400,
  "detail": "segments[0].diameter_m: must be greater than 0 m",
  "errors": [
    { "field": "segments[0].diameter_m", "message": "must be greater than 0 m" }
  ]
}`;

const DIMENSIONLESS = "dimensionless: efficiency (a fraction 0–1, not per cent), minor_k (ΣK), reynolds, friction_factor, relative_roughness";

type PageSizes = ReturnType<typeof loader>["pageSizes"];

const accountEndpoints = (size: PageSizes): [string, string, string][] => [
  ["GET /api/v1/me", "workspace.read", "Who the token speaks for: user id, workspace, role, token scope."],
  ["GET /api/v1/libraries", "library.read", "Every pump library you may see; locked shared libraries are listed without curves."],
  [
    "GET /api/v1/libraries/:id/curves[?revision=N][&page=N]",
    "library.read",
    `The curve sets of one library (latest revision unless given) with their points, SI: flow m³/s, head m, efficiency 0–1, power W, NPSHr m, impeller diameter m, speed rpm, and each set's minFlow, the maker's minimum continuous flow as imported (m³/s; null: none recorded); by model name, then speed, then impeller (largest first); ${size.curveSets} sets a page: { units, revision, paging, links, curveSets }. revision is the revision answered and every link names it, so following links.next reads one revision even when a new import lands between your requests. Changed: this list used to answer every curve set at once; without page it now answers the first page only, so a client written before paging reads at most ${size.curveSets} sets of a larger library and sees no error — read paging.pages, or follow links.next until it is null. 403 when a shared library needs the Network plan.`,
  ],
  [
    "GET /api/v1/libraries/:id/models[?page=N]",
    "library.read",
    `The models of one library's current revision with their curve sets (no points; flowMax m³/s, headMax m, impeller diameter m, speed rpm), in name order, ${size.models} a page: { units, paging, links, models }. 403 when a shared library needs the Network plan.`,
  ],
  ["GET /api/v1/models/:id", "library.read", "One model (name, type, size, notes), its library and revision, and its curve sets with their points, SI as for …/curves."],
  [
    "POST /api/v1/libraries/:id/upload",
    "library.write",
    "multipart/form-data: file (a CSV of curve points), optional mapping (JSON), policy (skip-curves or drop-points), import=1 and note. 201 { report, savedMappingUnreadable }: report holds the upload id, encoding, title, the mapping used, stats and every problem by line and column; with import=1 also revision (number, models, curves, points, skipped). With no mapping sent, the library's saved mapping (from its last import) is used when it still fits the file's headers, else one is proposed from them. A saved mapping that cannot be read is set aside, as on the mapping page, and savedMappingUnreadable says so — { detail, errors: [{ field, message }] }, field the place in the saved mapping, message what is wrong and the value stored; null otherwise. 400 for a mapping that is not valid (errors by field), 422 when nothing can be imported (the problem carries report and savedMappingUnreadable).",
  ],
];

/** How every list of the API pages (stated once; each list's row gives its page size). */
function PagingDocs() {
  return (
    <p id="paging" className="text-sm text-slate-700">
      <strong>Lists come a page at a time.</strong> Beside the list each answer carries{" "}
      <code>{"paging: { page, pages, pageSize, total }"}</code> and <code>{"links: { self, first, prev, next, last }"}</code>{" "}
      (paths with the rest of your query kept; <code>prev</code> is null on the first page, <code>next</code> on the last).
      Pages count from 1; a page past the last answers the last, and a page that is not a whole number from 1 (0, -1, 1.5,
      1e9, abc) answers the first — <code>paging.page</code> says which page you got. To read a whole list, follow{" "}
      <code>links.next</code> until it is null.
    </p>
  );
}

function Code({ children }: { children: string }) {
  return <pre tabIndex={0} className="mt-1 overflow-x-auto rounded-md bg-slate-900 p-3 text-xs leading-relaxed text-slate-100">{children}</pre>;
}

export default function ApiDocs({ loaderData }: Route.ComponentProps) {
  const { limits, rate, endpoints, correlations, headShape, pageSizes, searchJudged } = loaderData;
  return (
    <div className="max-w-4xl space-y-8">
      <header className="space-y-2">
        <h1 className="text-3xl font-bold text-brand-900">Dutymark API</h1>
        <p className="text-slate-700">
          Three hydraulic calculators anyone can call over HTTP — pipe loss, system curve, operating point — and a
          small account API for your own pump libraries. Requests and answers are JSON; every quantity is SI and
          its unit is part of the field name, so a number never travels without its unit.
        </p>
        <p className="caution" role="note">
          Figures from this API are design guidance. Check them against the pump maker's certified data, the codes
          that apply where you build, and a licensed engineer before you rely on them.
        </p>
        <nav aria-label="On this page" className="text-sm">
          <a href="#units">Units</a> · <a href="#access">Access and limits</a> · <a href="#errors">Errors</a> ·{" "}
          {endpoints.map((e) => (
            <span key={e.id}>
              <a href={`#${e.id}`}>{e.id}</a> ·{" "}
            </span>
          ))}
          <a href="#correlations">Correlations</a> · <a href="#account">Account API</a>
        </nav>
      </header>

      <section id="units" className="panel space-y-2">
        <h2 className="text-xl font-semibold">Units in field names</h2>
        <DocTable
          head={["suffix", "unit", "used for"]}
          cells={["font-mono"]}
          top={false}
          rows={[...UNIT_SUFFIXES.map((u) => [u.suffix, u.unit, u.what]), ["(none)", "—", DIMENSIONLESS]]}
        />
        <p className="text-sm text-slate-700">
          Unknown fields are refused rather than ignored: sending <code>flow</code> instead of <code>flow_m3s</code> gives a
          400 naming <code>flow</code>. Fluid properties are those of liquid water at <code>temperature_c</code>{" "}
          (IAPWS formulations, 0–100 °C); <code>kinematic_viscosity_m2s</code> replaces the viscosity for other liquids.
        </p>
      </section>

      <section id="access" className="panel space-y-2">
        <h2 className="text-xl font-semibold">Access and limits</h2>
        <ul className="list-disc space-y-1 pl-5 text-sm text-slate-700">
          <li>
            <strong>Without an account</strong> the calculators answer up to {rate.limit} requests per{" "}
            {rate.windowSeconds} seconds from one network address (fixed windows starting on the minute). Every answer
            carries <code>RateLimit-Limit</code>, <code>RateLimit-Remaining</code> and <code>RateLimit-Reset</code>{" "}
            (seconds). Past the limit you get <strong>429 Too Many Requests</strong> with <code>Retry-After</code> in
            seconds.
          </li>
          <li>
            <strong>With an API token</strong> — create one on your <a href="/account">account page</a>; read scope is
            enough — send <code>Authorization: Bearer &lt;token&gt;</code> and there is no request limit. A token that
            is unknown, revoked or malformed gets <strong>401</strong>: the request is not quietly served as
            anonymous.
          </li>
          <li>
            Calculator requests are <code>POST</code> with <code>Content-Type: application/json</code> (415
            otherwise); any other method gets <strong>405</strong> with <code>Allow: POST, OPTIONS</code>. They read no cookies
            and store nothing you send.
          </li>
          <li>
            Size limits: at most {limits.flows} flows, {limits.segments} pipe segments and {limits.pumpPoints} pump
            points per request, and a body of at most {Math.round(limits.bodyBytes / 1024)} KiB (413 above it).
          </li>
        </ul>
        <Code>{`curl -sS https://<your Dutymark address>/api/v1/calc/pipe-loss \\
  -H 'Content-Type: application/json' \\
  -d '${PIPE_LOSS_REQ.replace(/\s+/g, " ")}'`}</Code>
      </section>

      <section id="errors" className="panel space-y-2">
        <h2 className="text-xl font-semibold">Errors</h2>
        <p className="text-sm text-slate-700">
          Every error is an RFC 9457 problem document (<code>application/problem+json</code>) with <code>title</code>,{" "}
          <code>status</code> and a readable <code>detail</code>. Input errors (400) list each offending field in{" "}
          <code>errors</code>, named as you wrote it — nested fields with dots and list positions with brackets
          (counting from 0). A fault in the body as a whole (not JSON, not an object, empty) is reported for the field{" "}
          <code>(body)</code>. Up to 25 fields are listed; only the first complaint per field.
        </p>
        <p className="text-sm text-slate-700">
          Some requests are refused before any route reads them, in the same shape (<code>type</code>, <code>title</code>,{" "}
          <code>status</code>, <code>detail</code>): a method the route does not take (<strong>405</strong>, with the
          methods it does take, <code>OPTIONS</code> among them, in <code>Allow</code>; <code>OPTIONS</code> answers <strong>204</strong> with that{" "}
          <code>Allow</code>), a path no API route serves (<strong>404</strong>), a write from another site's page carrying
          your session cookie (<strong>403</strong>; token calls send no cookie) and a body over its limit (
          <strong>413</strong>).
        </p>
        <p className="text-sm text-slate-700">
          A read (<code>GET</code>) takes only the query parameters listed for it, each once (<code>method</code> of the
          systems search any number of times): any other, or one given twice, is a <strong>400</strong> naming it, never
          silently ignored — answers are always in SI units, so <code>?units=us</code> is refused rather than answered in SI.
          The one exception is <code>_</code>, a cache-buster (<code>?_=1733230000000</code>): every read takes it, any
          number of times, and ignores it.
        </p>
        <Code>{ERROR_EXAMPLE}</Code>
      </section>

      {endpoints.map((e) => (
        <section key={e.id} id={e.id} className="panel space-y-3">
          <h2 className="text-xl font-semibold">
            <span className="mr-2 rounded bg-brand-700 px-1.5 py-0.5 font-mono text-xs text-white">POST</span>
            <code>{e.path}</code>
          </h2>
          <p className="text-sm text-slate-700">{e.summary}</p>
          <DocTable head={["request field", "rule"]} cells={["font-mono"]} rows={e.fields.map((f) => [f.field, f.rule])} />
          {e.id === "operating-point" && (
            <div id="pump-head-shape">
              <h3 className="label">Pump head shape</h3>
              <ul className="list-disc space-y-1 pl-5 text-sm text-slate-700">
                {headShape.map((r) => (
                  <li key={r}>{r}</li>
                ))}
              </ul>
            </div>
          )}
          <div className="grid gap-3 md:grid-cols-2">
            <div>
              <h3 className="label">Example request</h3>
              <Code>{e.request}</Code>
            </div>
            <div>
              <h3 className="label">Answer (200, rounded here)</h3>
              <Code>{e.response}</Code>
            </div>
          </div>
          {e.notes && (
            <ul className="list-disc space-y-1 pl-5 text-sm text-slate-700">
              {e.notes.map((n) => (
                <li key={n}>{n}</li>
              ))}
            </ul>
          )}
          <p className="text-xs text-slate-500">
            <code>warnings</code> lists {"{ code, message, field? }"} notes, e.g. a Reynolds number in the transition range
            or outside a correlation's validity.
          </p>
        </section>
      ))}

      <section id="correlations" className="panel space-y-2">
        <h2 className="text-xl font-semibold">Friction correlations used</h2>
        <p className="text-sm text-slate-700">
          From the engine's correlation registry, with the ranges inside which each is stated valid. Outside them the
          answer still comes, with a warning in <code>warnings</code>.
        </p>
        <DocTable
          head={["correlation", "formula", "valid for", "source"]}
          cells={["", "font-mono text-xs", "", "text-xs"]}
          rows={correlations.map((c) => [
            c.name,
            c.formula,
            `Re ${c.reynolds[0].toLocaleString("en-GB")}–${c.reynolds[1].toExponential(0)}, ε/D ${c.relativeRoughness[0]}–${c.relativeRoughness[1]}`,
            c.reference,
          ])}
        />
      </section>

      <section id="account" className="panel space-y-2">
        <h2 className="text-xl font-semibold">Account API</h2>
        <p className="text-sm text-slate-700">
          These need an API token (<code>Authorization: Bearer …</code>) or, from Dutymark's own pages, your signed-in
          session; without either, 401. A token acts for its workspace with its owner's role; a role that may not do
          something gets 403.
        </p>
        <DocTable head={["request", "needs", "answer"]} cells={["font-mono", "font-mono text-xs"]} rows={accountEndpoints(pageSizes)} />
        <PagingDocs />
        <Code>{`curl -sS https://<your Dutymark address>/api/v1/libraries \\
  -H 'Authorization: Bearer <token>'`}</Code>
      </section>

      <SystemsApiDocs Code={Code} pageRows={pageSizes.searchResults} judged={searchJudged} />
    </div>
  );
}

export const ErrorBoundary = routeErrorBoundary({ what: "the API documentation", back: { href: "/", label: "The start page" } });
