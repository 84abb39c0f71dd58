// Two invented pumps for the search on a viscous liquid (fictional "Visc probe" curves, 2900 rpm, H = h_b·(1.3 − 0.3·(Q/Q_b)²),
// η = η_b·(Q/Q_b)·(2 − Q/Q_b), BEP at Q_b). "Visc probe Thin" passes 2 % above the liquid's duty on WATER (BEP at the duty
// flow): as published it meets the duty on water and falls short on the liquid. "Visc probe Thick" is sized on the
// equivalent water duty of a 200 cSt oil (ANSI/HI 9.6.7 from memory: C_Q = C_H ≈ 0.908 for this duty, so Q_W ≈ Q/0.908,
// H_W ≈ H/0.908, BEP there): on water it is far above the duty head, on the liquid it meets it. Used by the search's liquid tests.
import { createLibrary, updateLibrary, type Viewer } from "~/lib/libraries";
import { createProject, createSystem } from "~/lib/projects/projects.server";
import { defaultSystemInput, evaluateSystem, type SystemInput } from "~/lib/projects/hydraulics";
import { importCsvText, M3H } from "~/lib/projects/test-kit";

/** The duty flow, m³/h; the oil: 900 kg/m³, 0.18 Pa·s (ν = 200 cSt). */
export const VISC_DUTY_FLOW_M3H = 100;
export const OIL = (dynamicViscosity = 0.18): SystemInput["fluid"] => ({ kind: "custom", name: "Probe oil", density: 900, dynamicViscosity, vaporPressure: 100 });

/**
 * Static lift 20 m, 250 mm runs, on `fluid`; the duty head is the system's head at the duty flow on that liquid, m, unless
 * `dutyHead` is given (m).
 */
export function viscInput(fluid: SystemInput["fluid"], dutyHead?: number): SystemInput {
  const input: SystemInput = { ...defaultSystemInput(), fluid, staticLow: 20, staticHigh: 20, duty: { flow: VISC_DUTY_FLOW_M3H * M3H, head: 1 } };
  input.runs = input.runs.map((r) => ({ ...r, diameter: 0.25 }));
  input.duty = { flow: VISC_DUTY_FLOW_M3H * M3H, head: dutyHead ?? evaluateSystem(input).dutyCheck!.governingHead };
  return input;
}

const rows = (model: string, qb: number, hb: number) =>
  [0, 0.25, 0.5, 0.75, 1, 1.25, 1.5, 1.75].map((x) => `${model},end-suction,DN100,2900,200,${(x * qb).toFixed(3)},${(hb * (1.3 - 0.3 * x * x)).toFixed(3)},${x === 0 ? 0 : (78 * x * (2 - x)).toFixed(1)}`);

/**
 * A workspace library of the two probes drawn to the oil's duty head, and a project to put systems in. `nameless`: also
 * "Visc probe Nameless", Thin's curve with no speed given (so no B can be computed for it).
 */
export async function viscProbeProject(v: Viewer, o: { nameless?: boolean } = {}): Promise<number> {
  const hd = viscInput(OIL()).duty!.head;
  const csv = ["model,type,size,speed_rpm,impeller_mm,flow_m3h,head_m,efficiency_pct",
    ...rows("Visc probe Thin", VISC_DUTY_FLOW_M3H, 1.02 * hd), ...rows("Visc probe Thick", VISC_DUTY_FLOW_M3H / 0.908, (1.02 * hd) / 0.908)].join("\n");
  const library = async (name: string, text: string) => {
    const lib = await createLibrary(v, { name, description: "" });
    await importCsvText(v, lib, text);
    await updateLibrary(v, lib, { name, description: "", visibility: "workspace" });
  };
  await library("Viscous probes", csv);
  // No speed column at all (a blank cell in one is an import error).
  if (o.nameless) await library("Viscous probes without speed", ["model,type,size,impeller_mm,flow_m3h,head_m,efficiency_pct",
    ...rows("Visc probe Nameless", VISC_DUTY_FLOW_M3H, 1.02 * hd).map((l) => l.replace(",2900,", ","))].join("\n"));
  return createProject(v, { name: "Search on oil", site: "", description: "" });
}

/** A system of `input` (by default the oil's, with the duty the probes are drawn to). */
export function viscProbeSystem(v: Viewer, projectId: number, input: SystemInput = viscInput(OIL()), name = "Oil line"): Promise<number> {
  return createSystem(v, projectId, name, input);
}
