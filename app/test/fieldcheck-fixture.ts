// A small frozen selection for field-check tests: a straight-line pump curve (easy to work by hand)
// on the default system, stored as a project / system / selection of a workspace.
import { db } from "@db/client.server";
import { projects, selections, systems } from "@db/schema";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, evaluateCandidate, type Adjustment, type SystemInput } from "~/lib/projects/hydraulics";
import type { FrozenSelection } from "~/lib/projects";
import { eq } from "drizzle-orm";
import { fieldChecks } from "@db/schema";
import { fluidAt } from "~/engine";
import { viewerOfUser } from "~/lib/projects/test-kit";
import { historyCsv, parseCheckFields, type CheckResult, type Readings } from "~/lib/fieldchecks";
import { recordFieldCheck } from "~/lib/fieldchecks/records.server";

/** Points of H = h0 − k·Q (m, m³/s) from Q = 0 to qMax, with a flat 70 % efficiency hump. */
export function linearPoints(h0 = 40, k = 1000, qMax = 0.03, n = 7) {
  return Array.from({ length: n }, (_, i) => {
    const q = (qMax * i) / (n - 1);
    return { flow: q, head: h0 - k * q, efficiency: i === 0 ? 0 : 0.4 + 0.3 * Math.sin((Math.PI * i) / (n - 1)), power: null, npshr: null };
  });
}

export function frozenFixture(opts: { points?: ReturnType<typeof linearPoints>; speed?: number | null; duty?: { flow: number; head: number }; adjustment?: Adjustment; input?: Partial<SystemInput> } = {}): FrozenSelection {
  const points = opts.points ?? linearPoints();
  const input: SystemInput = { ...defaultSystemInput(), ...opts.input, duty: opts.duty ?? { flow: 0.012, head: 28 } };
  const adjustment = opts.adjustment ?? DEFAULT_ADJUSTMENT;
  const speed = opts.speed === undefined ? 2900 : opts.speed;
  const set = { points, speed, impellerDiameter: null };
  return {
    format: "dutymark-selection/1",
    frozenAt: new Date().toISOString(),
    project: { id: 0, name: "Fixture project" },
    system: { id: 0, name: "Fixture system", input },
    systemCurve: null,
    pump: { label: "Fixture pump", model: "FX 40", type: "", size: "", library: {}, curveSetId: 0, speed, impellerDiameter: null, points },
    adjustment,
    result: evaluateCandidate(input, set, adjustment),
    flowMax: 0.03,
  };
}

/** Stores a project, system and selection in `workspaceId`, created by `userId`. */
export async function storeSelection(workspaceId: number, userId: string, frozen: FrozenSelection = frozenFixture(), name = "Fixture") {
  const [{ id: projectId }] = await db().insert(projects).values({ workspaceId, name: `${name} project`, createdBy: userId }).$returningId();
  const [{ id: systemId }] = await db().insert(systems).values({ projectId, workspaceId, name: `${name} system`, inputJson: JSON.stringify(frozen.system.input) }).$returningId();
  const f = { ...frozen, project: { id: projectId, name: `${name} project` }, system: { ...frozen.system, id: systemId, name: `${name} system` } };
  const [{ id: selectionId }] = await db()
    .insert(selections)
    .values({ systemId, projectId, workspaceId, title: `${name} selection`, frozenJson: JSON.stringify(f), createdBy: userId })
    .$returningId();
  return { projectId, systemId, selectionId, frozen: f };
}

/** Form fields (SI display units) for readings that give TDH = head exactly: equal elevations and pipes, suction 0 kPa. */
export function fieldsForHead(head: number, density: number, extra: Record<string, string> = {}): Record<string, string> {
  const pd = (head * density * 9.80665) / 1000; // kPa
  return {
    pressureUnit: "kPa", sRef: "gauge", dRef: "gauge", sPressure: "0", dPressure: String(pd), sAccuracy: "", dAccuracy: "",
    elevationUnit: "m", sElevation: "0", dElevation: "0", diameterUnit: "mm", sDiameter: "100", dDiameter: "100",
    flowUnit: "m3/s", flow: "", flowAccuracy: "", speedMode: "rpm", rpm: "2900", hz: "", baseHz: "", baseRpm: "",
    powerMode: "none", powerUnit: "kW", power: "", volts: "", amps: "", powerFactor: "", phases: "3", motorEfficiency: "", powerAccuracy: "",
    temperatureUnit: "C", temperature: "20", notes: "", gradeId: "2B",
    ...extra,
  };
}

/**
 * Where the power tests read frozenFixture()'s default curve: its knot Q = 0.015 m³/s, H = 25 m (40 − 1000·Q), 70 % efficient
 * (0.4 + 0.3·sin(π/2), linearPoints), with a motor efficiency of 90 % entered (invented).
 */
export const POWER_KNOT = { flow: 0.015, head: 25, efficiency: 0.7, motorEfficiency: 0.9 } as const;

/**
 * Form fields for a check at POWER_KNOT's flow and `head` m whose motor input power is `shaft` W / 90 % with that motor
 * efficiency entered (no power at all when `shaft` is null), water of density `rho` kg/m³.
 */
export function powerCheckFields(head: number, shaft: number | null, rho: number, extra: Record<string, string> = {}): Record<string, string> {
  const m = POWER_KNOT.motorEfficiency;
  const power: Record<string, string> = shaft === null ? {} : { powerMode: "input", power: String(shaft / m / 1000), motorEfficiency: String(m * 100) };
  return fieldsForHead(head, rho, { flow: String(POWER_KNOT.flow), ...power, ...extra });
}

/** The history CSV of one check (notes blank, so no quoted cells): its header and its row, split on commas. */
export function oneCheckCsv(readings: Readings, result: CheckResult): { header: string[]; row: string[] } {
  const csv = historyCsv({
    selection: { id: 1, title: "Fixture", projectName: "Project" },
    checks: [{
      id: 1, chainId: 1, version: 1, superseded: false, createdAt: "2026-12-03T09:00:00Z",
      times: { takenAt: null, recordedAt: "2026-12-03T09:00:00Z", text: "recorded 2026-12-03 09:00 UTC", warnings: [] } as never,
      byName: "A", byWorkspace: "W", verdict: result.verdict, grade: result.grade.id, notes: "", readable: true, result, readings,
    }],
  });
  const lines = csv.trim().split("\r\n");
  return { header: lines.at(-2)!.split(","), row: lines.at(-1)!.split(",") };
}

/**
 * A check recorded on the fixture's selection by `userId` at 0.012 m³/s and `head` m of water at 20 °C, grade 2B (its id);
 * `stored` overwrites the verdict stored, as if recorded under an earlier rule (judged-today.ts).
 */
export async function recordAtHead(userId: string, selectionId: number, head: number, stored?: "pass" | "fail"): Promise<number> {
  const v = await viewerOfUser(userId);
  const p = parseCheckFields(fieldsForHead(head, fluidAt({ kind: "water" }, 20).density, { flow: "0.012" }), { kind: "water" });
  if (!p.ok) throw new Error(JSON.stringify(p.errors));
  const id = (await recordFieldCheck(v, selectionId, { readings: p.readings, fields: p.fields, notes: "", gradeId: "2B" }, [], { notify: false })).id;
  if (stored) await db().update(fieldChecks).set({ verdict: stored }).where(eq(fieldChecks.id, id));
  return id;
}
