// A drooping pump 15 % above shut-off, published through the importer (kept with its drooping-curve warning since
// "droopimport"; before, refused as head-rising), in the search and as a candidate: where the system's head at zero flow —
// static head plus the pressure difference — is above its 40 m shut-off head it cannot open its check valve, so it is
// never offered as meeting the duty (verdict no-operating-point, with the rule's numbers); just below, it runs. Check
// values: the rule is common practice (a pump starts against its closed check valve; from
// memory); the curve is invented (40 m at shut-off, 46 m at its 36 m³/h peak); water at 20 °C,
// 998.2 kg/m³ (the app's default liquid), g₀ 9.80665 m/s² (CGPM 1901).
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import type { Viewer } from "../libraries";
import { addCandidate, createProject, createSystem, listCandidates } from "./projects.server";
import { searchForSystem } from "./search.server";
import { defaultSystemInput, evaluateCandidate, type SystemInput } from "./hydraulics";
import { M3H, oneModelLibrary, viewerOfUser } from "./test-kit";
import { makeMember } from "~/test/harness";
import { inSI } from "~/engine/quantityText";

afterAll(() => closeDb());

let v: Viewer;
let projectId = 0;
const MODEL = "Droop fifteen 65";
// flow m³/h, head m, efficiency % (invented: 40 m shut-off, peak 46 m at 36 m³/h, BEP 74 % at 72 m³/h)
const ROWS = [[0, 40, 0], [18, 44, 35], [36, 46, 55], [54, 45, 67], [72, 42, 74], [108, 34, 72], [144, 22, 60]];

beforeAll(async () => {
  const m = await makeMember("admin");
  v = await viewerOfUser(m.userId);
  await oneModelLibrary(v, "Droop fifteen", { model: MODEL, size: "DN65", impellerMm: 210, rows: ROWS });
  projectId = await createProject(v, { name: "Droop fifteen search", site: "", description: "" });
});

/** Static `s` m at both levels and `dp` Pa pressure difference, 300 mm runs (little friction); duty typed on the curve: 72 m³/h at 42 m. */
function input(s: number, dp = 0): SystemInput {
  const base = defaultSystemInput();
  return { ...base, staticLow: s, staticHigh: s, pressureDifference: dp, runs: base.runs.map((r) => ({ ...r, diameter: 0.3 })), duty: { flow: 72 * M3H, head: 42 } };
}
async function probe(s: number, dp = 0) {
  const systemId = await createSystem(v, projectId, `Static ${s} m, ${dp} Pa`, input(s, dp));
  const r = await searchForSystem(v, systemId, { allowBeyondCatalogue: true });
  const row = r.results.find((x) => x.model === MODEL);
  return { systemId, row };
}
/** The candidate as the candidates table judges it: added from the search row, read back, evaluated on the system. */
async function candidateVerdict(systemId: number, s: number, dp: number, curveSetId: number) {
  expect((await addCandidate(v, systemId, curveSetId)).ok).toBe(true);
  const c = (await listCandidates(v, systemId)).readable.find((x) => x.curveSetId === curveSetId)!;
  return evaluateCandidate(input(s, dp), c.set, c.adjustment);
}

describe("a drooping pump (15 % above shut-off) imported, searched and added: offered as meeting the duty only where it can start", () => {
  test("static 40.1 m above its 40 m shut-off: ranked at the typed duty, but the row and the candidate say no operating point, naming both heads", async () => {
    const { systemId, row } = await probe(40.1);
    expect(row).toBeDefined(); // old code: undefined — the importer refused the curve (head-rising), nothing to search
    expect(row!.method).toBe("direct"); // the curve's 42 m at 72 m³/h is the typed duty: the engine's match
    expect(row!.verdict?.status).toBe("no-operating-point");
    expect(row!.operatingPoint).toBeNull();
    expect(inSI(row!.verdict!.reasons.join(" "))).toMatch(/shut-off head 40\.0 m is below the system's 40\.1 m at zero flow: the pump cannot open its check valve/);
    const e = await candidateVerdict(systemId, 40.1, 0, row!.curveSetId);
    expect(e.verdict?.status).toBe("no-operating-point");
  });
  test("the flip: static 39.9 m, below the shut-off: the row and the candidate have an operating point on the falling part, and another verdict", async () => {
    const { systemId, row } = await probe(39.9);
    expect(row!.verdict?.status).not.toBe("no-operating-point");
    expect(row!.operatingPoint!.flow).toBeGreaterThan(72 * M3H); // 39.9 m lies between 42 m at 72 m³/h and 34 m at 108 m³/h (geometry)
    const e = await candidateVerdict(systemId, 39.9, 0, row!.curveSetId);
    expect(e.verdict?.status).toBe(row!.verdict?.status);
  });
  test("static 38 m plus 25 kPa (2.55 m): 40.55 m at zero flow, above the shut-off — no operating point; plus 15 kPa (1.53 m, 39.53 m): it runs", async () => {
    const above = await probe(38, 25_000); // 25 000 / (998.2 × 9.80665) = 2.554 m
    expect(above.row!.verdict?.status).toBe("no-operating-point");
    expect(inSI(above.row!.verdict!.reasons.join(" "))).toMatch(/shut-off head 40\.0 m is below the system's 40\.6 m at zero flow/);
    const below = await probe(38, 15_000); // 15 000 / (998.2 × 9.80665) = 1.532 m
    expect(below.row!.verdict?.status).not.toBe("no-operating-point");
    expect(below.row!.operatingPoint).not.toBeNull();
  });
});
