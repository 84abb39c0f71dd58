// An invented drooping pump for the start-from-rest tests (selection-start-texts.test.ts, verdict-start-surfaces.test.ts):
// "Droop 80", 40 m shut-off rising 4.75 % to a 41.9 m peak (within the importer's 5 % rise allowance), imported into a
// library of its own. Flow m³/h, head m, efficiency %.
import { createLibrary, listModels, type Viewer } from "~/lib/libraries";
import { importCsvText } from "~/lib/projects/test-kit";

export const DROOP_ROWS = [[0, 40, 0], [18, 41.5, 45], [36, 41.9, 68], [54, 40.8, 74], [72, 37, 70], [90, 30, 58]];
export const DROOP_CSV = ["model,type,size,speed_rpm,impeller_mm,flow_m3h,head_m,efficiency_pct", ...DROOP_ROWS.map(([q, h, e]) => `Droop 80,end-suction,DN80,2900,200,${q},${h},${e}`)].join("\n");

/** Imports the drooping pump into a new library of `v`'s workspace; its curve set's id. */
export async function importDroopPump(v: Viewer): Promise<number> {
  const lib = await createLibrary(v, { name: "Drooping pumps", description: "" });
  await importCsvText(v, lib, DROOP_CSV, "droop.csv");
  return (await listModels(v, lib))[0].curves[0].id;
}
