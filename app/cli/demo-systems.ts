// The engineering firm's demo systems (invented projects and sites): a chilled-water loop and a
// reservoir booster, built from catalogue pipe runs. The seed stores them; tests start from them.
import { defaultSystemInput, tableRun, type SystemInput } from "../lib/projects/hydraulics";
import { material as materialOf } from "../engine";

const M3H = 1 / 3600;

export type DemoSystem = { project: { name: string; site: string; description: string }; system: string; input: SystemInput };

export function demoSystems(): DemoSystem[] {
  const ductile = materialOf("ductile-iron-lined");
  return [
    {
      project: { name: "Harbourside Offices — chilled water", site: "Harbourside Offices, Quay Street (invented)", description: "Secondary chilled-water loop serving floors 1–8." },
      system: "CHW secondary loop",
      input: {
        ...defaultSystemInput(),
        temperatureC: 7,
        mode: "closed-loop",
        staticLow: 0,
        staticHigh: 0,
        controlHead: 14,
        suctionSurfacePressure: 101325 + 150000,
        suctionStaticHead: 1,
        runs: [
          tableRun("suction", "Header to pump", "steel-sch40", "6", "steel", 12, [{ id: "elbow-90-standard", count: 3 }, { id: "butterfly-valve-open", count: 1 }, { id: "tee-run", count: 2 }]),
          tableRun("discharge", "Riser and floor branches (index circuit)", "steel-sch40", "6", "steel", 180, [{ id: "elbow-90-standard", count: 16 }, { id: "tee-run", count: 8 }, { id: "butterfly-valve-open", count: 3 }, { id: "swing-check", count: 1 }], 4),
        ],
        duty: { flow: 100 * M3H, head: 1 },
        hoursPerYear: 3200,
        tariffPerKWh: 0.24,
        npshMargin: 1.2,
      },
    },
    {
      project: { name: "Copse Hill reservoir booster", site: "Copse Hill service reservoir (invented)", description: "Booster set lifting treated water from the valley tank to the hillside reservoir." },
      system: "Valley tank to hillside reservoir",
      input: {
        ...defaultSystemInput(),
        temperatureC: 12,
        mode: "open",
        staticLow: 26,
        staticHigh: 30,
        suctionStaticHead: 2.5,
        runs: [
          tableRun("suction", "Tank outlet", "steel-sch40", "4", "steel", 6, [{ id: "entrance-sharp", count: 1 }, { id: "gate-valve-open", count: 1 }, { id: "elbow-90-standard", count: 1 }]),
          { side: "discharge", name: "Rising main", pipeTable: "", nominal: "", diameter: 0.104, material: "ductile-iron-lined", roughness: ductile.roughnessNew, agedRoughness: ductile.roughnessAged, length: 420, fittings: [{ id: "elbow-90-long-radius", count: 6 }, { id: "swing-check", count: 1 }, { id: "gate-valve-open", count: 1 }, { id: "exit", count: 1 }], extraK: 0 },
        ],
        duty: { flow: 40 * M3H, head: 1 },
        hoursPerYear: 5000,
        tariffPerKWh: 0.19,
        npshMargin: 1.3,
      },
    },
  ];
}
