// Demo data for field checks, idempotent: both Kestrel projects shared with Lowmoor Commissioning and accepted by its
// admin (so the contractor's journeys start with them open), and one demo check recorded by Lowmoor's contractor on the
// first selection (no e-mail sent).
import { SI_UNITS } from "~/lib/shared/units";
import { and, eq } from "drizzle-orm";
import { db } from "../../db/client.server";
import { fieldChecks, projects, projectShares, selections, users, workspaces } from "../../db/schema";
import { fieldSelection, recordFieldCheck } from "../lib/fieldchecks/records.server";
import { blankFields, evaluateCheck, type Readings } from "../lib/fieldchecks";
import { fluidOf } from "../lib/projects/hydraulics";
import { G0 } from "../engine";
import type { Viewer } from "../lib/libraries";

export async function seedFieldChecks(): Promise<{ shared: number; checks: number }> {
  const [kestrel] = await db().select().from(workspaces).where(eq(workspaces.slug, "kestrel"));
  const [lowmoor] = await db().select().from(workspaces).where(eq(workspaces.slug, "lowmoor"));
  const [tom] = await db().select().from(users).where(eq(users.email, "contractor@lowmoor.example"));
  const [eng] = await db().select().from(users).where(eq(users.email, "engineer@kestrel.example"));
  const [nell] = await db().select().from(users).where(eq(users.email, "admin@lowmoor.example"));
  if (!kestrel || !lowmoor || !tom) return { shared: 0, checks: 0 };
  let shared = 0;
  const projs = await db().select().from(projects).where(eq(projects.workspaceId, kestrel.id));
  for (const p of projs) {
    const have = await db().select({ id: projectShares.id }).from(projectShares).where(and(eq(projectShares.projectId, p.id), eq(projectShares.workspaceId, lowmoor.id)));
    if (have.length) continue;
    await db().insert(projectShares).values({ projectId: p.id, workspaceId: lowmoor.id, createdBy: eng?.id ?? null, state: "accepted", decidedBy: nell?.id ?? null, decidedAt: new Date() });
    shared++;
  }
  const sels = await db().select().from(selections).where(eq(selections.workspaceId, kestrel.id)).orderBy(selections.id);
  const target = sels.find((s) => projs.some((p) => p.id === s.projectId && p.name.startsWith("Copse Hill"))) ?? sels[0];
  if (!target) return { shared, checks: 0 };
  const existing = await db().select({ id: fieldChecks.id }).from(fieldChecks).where(eq(fieldChecks.selectionId, target.id));
  if (existing.length) return { shared, checks: 0 };

  const viewer: Viewer = { userId: tom.id, workspace: { id: lowmoor.id, name: lowmoor.name, slug: lowmoor.slug, plan: lowmoor.plan }, role: "contractor" };
  const sel = await fieldSelection(viewer, target.id);
  const f = sel.frozen;
  const op = f.result?.operating ?? f.system.input.duty;
  if (!op) return { shared, checks: 0 };
  // Invented site readings: 4 % less flow than the design point, gauges read so that the TDH sits
  // 2 % under the curve at that flow; same pipe size both sides.
  const d = f.system.input.runs.find((r) => r.side === "discharge")?.diameter ?? 0.1;
  const s = f.system.input.runs.find((r) => r.side === "suction")?.diameter ?? d;
  const flow = op.flow * 0.96;
  const base: Readings = {
    suction: { pressure: 25_000, reference: "gauge", elevation: 0.3, diameter: s, accuracy: 2_500 },
    discharge: { pressure: 0, reference: "gauge", elevation: 0.9, diameter: d, accuracy: 2_500 },
    flow,
    flowAccuracy: 0.02,
    speed: f.pump.speed ? { mode: "rpm", rpm: Math.round(f.pump.speed * (f.adjustment.method === "speed" ? (f.result?.ratio ?? 1) : 1)) } : { mode: "none" },
    power: { mode: "none" },
    temperatureC: f.system.input.temperatureC,
  };
  const probe = evaluateCheck(f, base, "2B"); // pd = 0: TDH below the curve by the curve head
  const rho = fluidOf({ ...f.system.input, temperatureC: base.temperatureC }).density;
  const curveHead = probe.engine.curveHead ?? op.head;
  base.discharge.pressure = Math.round((curveHead * 0.98 - probe.delivered.head) * rho * G0);
  const fields = { ...blankFields(SI_UNITS), sPressure: "25", dPressure: (base.discharge.pressure / 1000).toFixed(1), sAccuracy: "2.5", dAccuracy: "2.5", sElevation: "0.3", dElevation: "0.9", sDiameter: (s * 1000).toFixed(1), dDiameter: (d * 1000).toFixed(1), flow: (flow * 3600).toFixed(2), flowAccuracy: "2", rpm: base.speed.mode === "rpm" ? String(base.speed.rpm) : "", temperature: String(base.temperatureC) };
  base.discharge.pressure = Number(fields.dPressure) * 1000;
  base.flow = Number(fields.flow) / 3600;
  await recordFieldCheck(viewer, target.id, { readings: base, fields, notes: "Demo check at handover (invented readings).", gradeId: "2B" }, [], { notify: false });
  return { shared, checks: 1 };
}
