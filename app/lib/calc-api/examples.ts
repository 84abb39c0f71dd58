// The calculators' documentation text: what each endpoint does, an example request and the answer it
// gives (rounded), and notes. The field tables are generated from the schemas (docs.ts); the examples
// are checked against the calculations by calc-api/docs.test.ts, so neither can drift.
import type { CalcEndpoint } from "./schemas";

export type EndpointDoc = {
  id: CalcEndpoint;
  path: string;
  summary: string;
  /** JSON text of an example request. */
  request: string;
  /** JSON text of the answer to it, numbers rounded to about 5 significant digits. */
  response: string;
  notes?: string[];
};

export const PIPE_LOSS_REQ = `{
  "flow_m3s": 0.1,
  "diameter_m": 0.2,
  "length_m": 100,
  "roughness_m": 0.00026,
  "temperature_c": 15.6,
  "kinematic_viscosity_m2s": 1.12e-6
}`;

export const CALC_ENDPOINT_DOCS: readonly EndpointDoc[] = [
  {
    id: "pipe-loss",
    path: "/api/v1/calc/pipe-loss",
    summary:
      "Head loss in one straight pipe with its fittings: Darcy-Weisbach with the Colebrook friction factor (64/Re when laminar), plus ΣK·V²/2g for the fittings.",
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
      "status multiple: a drooping curve crosses more than once; every crossing is in intersections and the one the pump settles at from rest is reported (the first where its head falls below the system's); an unstable crossing above it (the pump's head rising above the system's again) is a warning.",
      "status no_intersection: the pump's head at its first point is below the system head there (shutoff below static head): it cannot open its check valve from rest, so there is no operating point even where the curves cross further out (those crossings are still listed in intersections and named in the message); flow_m3s and head_m are null.",
      "status beyond_curve: the pump still gives more head than the system needs at the last published point; the real operating point lies beyond the curve data. flow_m3s and head_m are null.",
      "status coincident: the curves coincide (their heads within 1 part in 10⁸ of the pump's over 1 % of the published flows or more) over a stretch the pump reaches from rest (a flat stretch of its curve against a system curve as flat at that head): there is no single operating point; the stretch's first flow is in intersections, its first and last flow and its head in stretch (flow_from_m3s, flow_to_m3s, head_m, present with coincident only) and in the message. flow_m3s and head_m are null.",
      "efficiency is present only when the points carry efficiency covering the operating flow.",
    ],
  },
];
