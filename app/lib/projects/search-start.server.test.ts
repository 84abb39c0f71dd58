// A search row for a drooping pump that cannot start from rest: the engine's duty search ranks it at the typed duty (its
// curve passes there), but the row's verdict is judged by evaluateCandidate on the system's band, which applies the
// start-from-rest rule (engine operatingPoint.ts). Check values: the rule is common practice (from memory) — a pump starts
// against a closed check valve, so its shut-off head must exceed the system's head at zero flow; the curve is invented
// ("Droop probe", 40 m at shut-off, 41.9 m at its peak), the system's static head set above or below that 40 m.
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import type { Viewer } from "../libraries";
import { createProject, createSystem } from "./projects.server";
import { searchForSystem } from "./search.server";
import { defaultSystemInput, type SystemInput } from "./hydraulics";
import { M3H, oneModelLibrary, viewerOfUser } from "./test-kit";
import { makeMember } from "~/test/harness";
import { inSI } from "~/engine/quantityText";

afterAll(() => closeDb());

let v: Viewer;
let projectId = 0;
const MODEL = "Droop probe 80";
// flow m³/h, head m, efficiency % (invented; rises 4.75 % from shut-off, within the importer's 5 % rise allowance)
const ROWS = [[0, 40, 0], [18, 41.5, 45], [36, 41.9, 68], [54, 40.8, 74], [72, 37, 70], [90, 30, 58]];

beforeAll(async () => {
  const m = await makeMember("admin");
  v = await viewerOfUser(m.userId);
  await oneModelLibrary(v, "Droop probes", { model: MODEL, size: "DN80", impellerMm: 200, rows: ROWS });
  projectId = await createProject(v, { name: "Droop search", site: "", description: "" });
});

/** Static `s` m at both levels, 300 mm runs (little friction), the duty typed where the curve passes it: 36 m³/h at 41.5 m. */
function input(s: number): SystemInput {
  const base = defaultSystemInput();
  return { ...base, staticLow: s, staticHigh: s, runs: base.runs.map((r) => ({ ...r, diameter: 0.3 })), duty: { flow: 36 * M3H, head: 41.5 } };
}
async function probeRow(s: number) {
  const id = await createSystem(v, projectId, `Static ${s} m`, input(s));
  const r = await searchForSystem(v, id, { allowBeyondCatalogue: true });
  return r.results.find((x) => x.model === MODEL);
}

describe("search row of a drooping pump whose shut-off head is below the static head", () => {
  test("static 41 m above its 40 m shut-off: ranked by the engine at the typed duty, but the row's verdict is no operating point, with the rule's numbers", async () => {
    const row = (await probeRow(41))!;
    expect(row).toBeDefined();
    expect(row.method).toBe("direct"); // the curve's 41.9 m at 36 m³/h is within 41.5–43.6 m (typed head + 5 %): the search's match
    expect(row.verdict?.status).toBe("no-operating-point");
    expect(row.operatingPoint).toBeNull();
    expect(row.shaftPower).toBeNull(); // no figures claimed for a point it never reaches
    expect(inSI(row.verdict!.reasons.join(" "))).toMatch(/shut-off head 40\.0 m is below the system's 41\.0 m at zero flow: the pump cannot open its check valve/);
  });
  test("the flip: static 39.5 m, below the shut-off: the row has an operating point and another verdict", async () => {
    const row = (await probeRow(39.5))!;
    expect(row.verdict?.status).not.toBe("no-operating-point");
    expect(row.operatingPoint).not.toBeNull();
  });
});
