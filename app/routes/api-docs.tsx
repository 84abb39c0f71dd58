import type { Route } from "./+types/api-docs";
import { ANON_RATE_LIMIT, CALC_LIMITS } from "~/lib/calc-api.server";
import { SystemsApiDocs } from "~/components/api-docs-systems";

// /api — how to call Dutymark from other software: the public calculators and the account API.
export function loader() {
  return {
    limits: CALC_LIMITS,
    rate: ANON_RATE_LIMIT,
  };
}

export const meta: Route.MetaFunction = () => [
  { title: "API — Dutymark" },
  { name: "description", content: "Pipe loss, system curve and operating point over HTTP and JSON, in SI units." },
];

const UNITS: [string, string, string][] = [
  ["_m3s", "m³/s", "volumetric flow"],
  ["_m", "m", "length, diameter, roughness, head"],
  ["_ms", "m/s", "mean velocity"],
  ["_pa", "Pa", "pressure, pressure difference"],
  ["_c", "°C", "temperature"],
  ["_m2s", "m²/s", "kinematic viscosity"],
  ["_kgm3", "kg/m³", "density"],
  ["(none)", "—", "dimensionless: efficiency (a fraction 0–1, not per cent), minor_k (ΣK), reynolds, friction_factor, relative_roughness"],
];

type Field = [name: string, rule: string];

type Endpoint = {
  id: string;
  path: string;
  summary: string;
  fields: Field[];
  request: string;
  response: string;
  notes?: string[];
};

const PIPE_LOSS_REQ = `{
  "flow_m3s": 0.1,
  "diameter_m": 0.2,
  "length_m": 100,
  "roughness_m": 0.00026,
  "temperature_c": 15.6,
  "kinematic_viscosity_m2s": 1.12e-6
}`;

const ENDPOINTS = (l: typeof CALC_LIMITS): Endpoint[] => [
  {
    id: "pipe-loss",
    path: "/api/v1/calc/pipe-loss",
    summary:
      "Head loss in one straight pipe with its fittings: Darcy-Weisbach with the Colebrook friction factor (64/Re when laminar), plus ΣK·V²/2g for the fittings.",
    fields: [
      ["flow_m3s", `required, 0 to ${l.flowMax}`],
      ["diameter_m", `required, inner diameter, above 0, at most ${l.diameterMax}`],
      ["length_m", `required, 0 to ${l.lengthMax}`],
      ["roughness_m", "required, absolute roughness ε, 0 or more and below diameter_m"],
      ["minor_k", `optional, sum of fitting loss coefficients ΣK, 0 to ${l.minorKMax} (default 0)`],
      ["temperature_c", "optional, water temperature 0–100 (default 20)"],
      ["kinematic_viscosity_m2s", `optional, replaces water's viscosity (above 0, at most ${l.kinematicViscosityMax})`],
    ],
    request: PIPE_LOSS_REQ,
    response: `{
  "velocity_ms": 3.1831,
  "reynolds": 568410,
  "relative_roughness": 0.0013,
  "friction_factor": 0.021393,
  "friction_method": "colebrook",
  "regime": "turbulent",
  "head_loss_m": 5.5259,
  "friction_loss_m": 5.5259,
  "minor_loss_m": 0,
  "velocity_head_m": 0.51659,
  "pressure_drop_pa": 54136,
  "fluid": {
    "name": "Given ν, water density at 15.6 °C",
    "temperature_c": 15.6,
    "density_kgm3": 999.01,
    "kinematic_viscosity_m2s": 1.12e-6,
    "viscosity_source": "given"
  },
  "warnings": []
}`,
    notes: [
      "regime is laminar (Re ≤ 2000), transition (2000–4000, flagged in warnings: friction is uncertain there), turbulent, or no_flow at zero flow.",
      "pressure_drop_pa = ρ·g₀·head_loss_m with the density of water at temperature_c, also when you give your own viscosity.",
    ],
  },
  {
    id: "system-curve",
    path: "/api/v1/calc/system-curve",
    summary:
      "The head a pump must give at each flow: static head plus the losses of pipe segments in series. At zero flow the head equals the static head.",
    fields: [
      ["static_head_m", `required, discharge level minus suction level, −${l.staticHeadAbsMax} to ${l.staticHeadAbsMax}`],
      ["segments", `required, 0 to ${l.segments} objects { length_m, diameter_m, roughness_m, minor_k? } with the rules above`],
      ["flows_m3s", `required, 1 to ${l.flows} flows, each 0 to ${l.flowMax}`],
      ["temperature_c", "optional, as above (default 20)"],
      ["kinematic_viscosity_m2s", "optional, as above"],
    ],
    request: `{
  "static_head_m": 10,
  "segments": [
    { "length_m": 200, "diameter_m": 0.15, "roughness_m": 0.000045, "minor_k": 5 }
  ],
  "flows_m3s": [0, 0.03, 0.06]
}`,
    response: `{
  "points": [
    { "flow_m3s": 0, "head_m": 10, "pressure_pa": 97891 },
    { "flow_m3s": 0.03, "head_m": 14.116, "pressure_pa": 138190 },
    { "flow_m3s": 0.06, "head_m": 25.68, "pressure_pa": 251390 }
  ],
  "fluid": { "name": "Water 20 °C", "temperature_c": 20, "density_kgm3": 998.21,
             "kinematic_viscosity_m2s": 1.0034e-6, "viscosity_source": "water" },
  "warnings": []
}`,
    notes: ["pressure_pa = ρ·g₀·head_m: the pressure rise the pump must add at that flow."],
  },
  {
    id: "operating-point",
    path: "/api/v1/calc/operating-point",
    summary: "Where a pump curve meets a system curve.",
    fields: [
      ["pump.points", `required, 2 to ${l.pumpPoints} objects { flow_m3s, head_m, efficiency? }, flows strictly increasing, head 0 to ${l.headMax}`],
      ["pump.points[].efficiency", "optional, a fraction 0–1 (0.75, not 75)"],
      ["system.static_head_m", "required, as above"],
      ["system.segments", "required, as above"],
      ["system.temperature_c", "optional, as above (default 20)"],
      ["system.kinematic_viscosity_m2s", "optional, as above"],
    ],
    request: `{
  "pump": { "points": [
    { "flow_m3s": 0,    "head_m": 40 },
    { "flow_m3s": 0.02, "head_m": 38, "efficiency": 0.55 },
    { "flow_m3s": 0.04, "head_m": 34, "efficiency": 0.72 },
    { "flow_m3s": 0.06, "head_m": 27, "efficiency": 0.75 },
    { "flow_m3s": 0.08, "head_m": 17, "efficiency": 0.65 }
  ] },
  "system": {
    "static_head_m": 10,
    "segments": [ { "length_m": 200, "diameter_m": 0.15, "roughness_m": 0.000045, "minor_k": 5 } ]
  }
}`,
    response: `{
  "status": "ok",
  "flow_m3s": 0.061391,
  "head_m": 26.395,
  "efficiency": 0.74907,
  "message": "Operating point found",
  "intersections": [ { "flow_m3s": 0.061391, "head_m": 26.395 } ],
  "fluid": { "name": "Water 20 °C", "temperature_c": 20, "density_kgm3": 998.21,
             "kinematic_viscosity_m2s": 1.0034e-6, "viscosity_source": "water" },
  "warnings": []
}`,
    notes: [
      "status ok: the curves cross once.",
      "status multiple: a drooping curve crosses more than once; every crossing is in intersections and the highest-flow one is reported (the stable one). Running there may still be unstable.",
      "status no_intersection: the pump's head at its first point is below the system head there (shutoff below static head) and the curves never meet; flow_m3s and head_m are null.",
      "status beyond_curve: the pump still gives more head than the system needs at the last published point; the real operating point lies beyond the curve data. flow_m3s and head_m are null.",
      "efficiency is present only when the points carry efficiency covering the operating flow.",
    ],
  },
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

const ACCOUNT_ENDPOINTS: [string, string, string][] = [
  ["GET /api/v1/me", "workspace.read", "Who the token speaks for: user id, workspace, role, token scope."],
  ["GET /api/v1/libraries", "library.read", "Every pump library you may see; locked shared libraries are listed without curves."],
  [
    "GET /api/v1/libraries/:id/curves[?revision=N]",
    "library.read",
    "The curve sets of one library (latest revision unless given), SI: flow m³/s, head m, efficiency 0–1, power W, NPSHr m, impeller diameter m, speed rpm. 403 when a shared library needs the Network plan.",
  ],
];

function Code({ children }: { children: string }) {
  return <pre tabIndex={0} className="mt-1 overflow-x-auto rounded-md bg-slate-900 p-3 text-xs leading-relaxed text-slate-100">{children}</pre>;
}

export default function ApiDocs({ loaderData }: Route.ComponentProps) {
  const { limits, rate } = loaderData;
  const endpoints = ENDPOINTS(limits);
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
          <a href="#account">Account API</a>
        </nav>
      </header>

      <section id="units" className="panel space-y-2">
        <h2 className="text-xl font-semibold">Units in field names</h2>
        <table className="w-full text-left text-sm">
          <thead>
            <tr className="border-b border-slate-200">
              <th className="py-1 pr-4">suffix</th>
              <th className="py-1 pr-4">unit</th>
              <th className="py-1">used for</th>
            </tr>
          </thead>
          <tbody>
            {UNITS.map(([s, u, what]) => (
              <tr key={s} className="border-b border-slate-100">
                <td className="py-1 pr-4 font-mono">{s}</td>
                <td className="py-1 pr-4">{u}</td>
                <td className="py-1">{what}</td>
              </tr>
            ))}
          </tbody>
        </table>
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
            otherwise); any other method gets <strong>405</strong> with <code>Allow: POST</code>. They read no cookies
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
        <Code>{ERROR_EXAMPLE}</Code>
      </section>

      {endpoints.map((e) => (
        <section key={e.id} id={e.id} className="panel space-y-3">
          <h2 className="text-xl font-semibold">
            <span className="mr-2 rounded bg-brand-700 px-1.5 py-0.5 font-mono text-xs text-white">POST</span>
            <code>{e.path}</code>
          </h2>
          <p className="text-sm text-slate-700">{e.summary}</p>
          <table className="w-full text-left text-sm">
            <thead>
              <tr className="border-b border-slate-200">
                <th className="py-1 pr-4">request field</th>
                <th className="py-1">rule</th>
              </tr>
            </thead>
            <tbody>
              {e.fields.map(([name, rule]) => (
                <tr key={name} className="border-b border-slate-100 align-top">
                  <td className="py-1 pr-4 font-mono">{name}</td>
                  <td className="py-1">{rule}</td>
                </tr>
              ))}
            </tbody>
          </table>
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

      <section id="account" className="panel space-y-2">
        <h2 className="text-xl font-semibold">Account API</h2>
        <p className="text-sm text-slate-700">
          These need an API token (<code>Authorization: Bearer …</code>) or, from Dutymark's own pages, your signed-in
          session; without either, 401. A token acts for its workspace with its owner's role; a role that may not do
          something gets 403.
        </p>
        <table className="w-full text-left text-sm">
          <thead>
            <tr className="border-b border-slate-200">
              <th className="py-1 pr-4">request</th>
              <th className="py-1 pr-4">needs</th>
              <th className="py-1">answer</th>
            </tr>
          </thead>
          <tbody>
            {ACCOUNT_ENDPOINTS.map(([path, perm, what]) => (
              <tr key={path} className="border-b border-slate-100 align-top">
                <td className="py-1 pr-4 font-mono">{path}</td>
                <td className="py-1 pr-4 font-mono text-xs">{perm}</td>
                <td className="py-1">{what}</td>
              </tr>
            ))}
          </tbody>
        </table>
        <Code>{`curl -sS https://<your Dutymark address>/api/v1/libraries \\
  -H 'Authorization: Bearer <token>'`}</Code>
      </section>

      <SystemsApiDocs Code={Code} />
    </div>
  );
}
