// Field checks: site readings against a frozen selection → the delivered duty point, deviations,
// a verdict against a labelled tolerance grade, plain hints; versioned records, photos, the
// engineer's notice, history CSV; and project sharing with another workspace (the contractor).
//
// Who sees what: a selection is open for field checks to its own workspace and to every workspace
// its project is shared with; its checks are open to the same workspaces. Ids from elsewhere
// answer 404, never data. A check is never edited: an amendment is a new version of its chain.
import { createHash } from "node:crypto";
import { and, desc, eq, inArray, or, sql } from "drizzle-orm";
import { data } from "react-router";
import { db, withTransaction } from "@db/client.server";
import { fieldCheckPhotos, fieldChecks, projects, projectShares, selections, systems, users, workspaces } from "@db/schema";
import {
  createPumpCurve,
  EngineInputError,
  efficiencyAt,
  fieldCheck,
  G0,
  sampleCurve,
  scaleBySpeed,
  scaleByTrim,
  STANDARD_ATMOSPHERE,
  TOLERANCE_GRADES,
  withinGrade,
  type FieldCheckResult,
  type PumpCurve,
  type ToleranceGrade,
} from "~/engine";
import { fluidOf, toPumpPoints } from "./hydraulics";
import { inputPowerW, MAX_PHOTO_BYTES, MAX_PHOTOS, speedRpm, VERDICT_TEXT, type CheckFields, type Readings, type Verdict } from "./fieldcheck-form";
import type { FrozenSelection } from "./projects.server";
import type { Viewer } from "./libraries.server";
import { sendMail } from "./mail/outbox.server";
import { escapeHtml, fieldCheckMail, oneLine } from "./mail/templates";
import { appUrl } from "./auth/accounts.server";
import { toCsv } from "./shared/csv";
import type { CheckResult, Pt } from "./fieldcheck-result";

export const FIELD_CHECK_FORMAT = "dutymark-fieldcheck/1";
export { DEFAULT_GRADE, MAX_PHOTOS, MAX_PHOTO_BYTES, VERDICT_TEXT, type Verdict } from "./fieldcheck-form";

const notFound = (what: string) => data(`No such ${what} open to this workspace.`, { status: 404 });

export function gradeById(id: string): ToleranceGrade | null {
  return TOLERANCE_GRADES.find((g) => g.id === id) ?? null;
}

// ── The check itself (pure: no database) ───────────────────────────────────────────────────
export type { CheckResult } from "./fieldcheck-result";


/** One pump's curve as selected (trim applied; speed ratio returned separately). */
function selectedCurve(f: FrozenSelection): { base: PumpCurve; trimmed: PumpCurve; designRatio: number } {
  const base = createPumpCurve({ points: toPumpPoints(f.pump.points), speed: f.pump.speed ?? undefined, impellerDiameter: f.pump.impellerDiameter ?? undefined, riseTolerance: 1 });
  const ratio = f.result?.ratio ?? 1;
  if (f.adjustment.method === "trim" && ratio !== 1) return { base, trimmed: scaleByTrim(base, ratio).curve, designRatio: 1 };
  return { base, trimmed: base, designRatio: f.adjustment.method === "speed" ? ratio : 1 };
}

function sample(c: PumpCurve, rho: number) {
  const s = sampleCurve(c, 41, rho);
  return {
    head: s.flows.map((q, i) => ({ flow: q, y: s.head[i] })),
    eff: s.flows.map((q, i) => ({ flow: q, y: s.efficiency[i] })).filter((p): p is Pt => p.y != null),
  };
}

/**
 * Verdict against one grade. Flow meter: pass if the point is within the grade of the curve at the
 * measured speed; marginal if not, but some point within the reading uncertainty (head ± gauge
 * accuracy, flow ± meter accuracy) is; fail otherwise. No flow meter: unknown.
 */
export function verdictFor(curve: PumpCurve, grade: ToleranceGrade, e: FieldCheckResult, flowAccuracy: number, headUncertainty: number): Verdict {
  if (e.flowSource !== "measured" || e.flow === null) return "unknown";
  const q = e.flow;
  const h = e.tdh;
  if (h > 0 && withinGrade(curve, q, h, grade)) return "pass";
  if (headUncertainty > 0 || flowAccuracy > 0) {
    const steps = [-1, -0.5, 0, 0.5, 1];
    for (const a of steps)
      for (const b of steps) {
        const qq = q * (1 + a * flowAccuracy);
        const hh = h + b * headUncertainty;
        if (qq > 0 && hh > 0 && withinGrade(curve, qq, hh, grade)) return "marginal";
      }
  }
  return "fail";
}

/** Usual causes, worded as things to check — never a diagnosis. */
function hintsFor(r: { verdict: Verdict; deviation: CheckResult["deviation"]; speed: CheckResult["speed"]; engine: FieldCheckResult }): string[] {
  const hints: string[] = [];
  const { dutyFlow, dutyHead, curveHead } = r.deviation;
  const offDuty = dutyFlow !== null && Math.abs(dutyFlow) > 0.05;
  if (offDuty && dutyFlow! < 0 && (dutyHead ?? 0) > 0)
    hints.push("Less flow and more head than the design duty usually means the system is more resistant than designed: look for throttled or closed valves, a clogged strainer or filter, a fouled coil or a stuck check valve.");
  if (offDuty && dutyFlow! > 0 && (dutyHead ?? 0) < 0)
    hints.push("More flow and less head than the design duty usually means the system is less resistant than designed: look for an open bypass, a balancing valve left wide open, or a branch open that should be closed.");
  if (r.speed.measured !== null && r.speed.design !== null && Math.abs(r.speed.measured / r.speed.design - 1) > 0.03)
    hints.push(`The measured speed differs from the selection's speed (${Math.round(r.speed.measured)} rpm against ${Math.round(r.speed.design)} rpm): check the drive's set point and limits, the motor's poles and the nameplate.`);
  if ((r.verdict === "fail" || r.verdict === "marginal") && curveHead !== null && curveHead < 0)
    hints.push("The pump is delivering less head than its curve at this flow. Usual causes to check: air in the pump or suction (entrained or trapped), cavitation (noise, low suction pressure), reverse rotation, a partly blocked impeller, or wear of the impeller and wear rings.");
  if ((r.verdict === "fail" || r.verdict === "marginal") && curveHead !== null && curveHead > 0)
    hints.push("The readings sit above the pump's curve: check the gauges' zero and calibration, the gauge elevations, the pipe diameters entered, and the flow meter's range and installation.");
  if (r.engine.verdict === "off-curve")
    hints.push("The measured head is not on the curve at all: check the readings first (gauge reference, units, elevations), then the speed and whether the valve is shut.");
  if (hints.length) hints.unshift("Usual causes to check — these are possibilities, not a diagnosis:");
  return hints;
}

/** The delivered duty point and verdict from readings against a frozen selection (SI in, SI out). */
export function evaluateCheck(f: FrozenSelection, readings: Readings, gradeId: string): CheckResult {
  const grade = gradeById(gradeId);
  if (!grade) throw new EngineInputError("grade", `unknown tolerance grade "${gradeId}"`);
  const fluid = fluidOf({ ...f.system.input, temperatureC: readings.temperatureC });
  const rho = fluid.density;
  const warnings: string[] = [];
  const { trimmed, designRatio } = selectedCurve(f);
  const rated = f.pump.speed ?? null;
  const design = rated !== null ? rated * designRatio : null;
  const measured = speedRpm(readings.speed);
  const designCurve = designRatio !== 1 ? scaleBySpeed(trimmed, designRatio).curve : trimmed;
  let curve = designCurve;
  let rescaled = false;
  if (measured !== null && rated !== null) {
    const s = scaleBySpeed(trimmed, measured / rated);
    curve = s.curve;
    rescaled = true;
    warnings.push(...s.warnings.map((w) => w.message));
  } else if (measured !== null) warnings.push("The pump curve has no rated speed, so it could not be rescaled to the measured speed: compared at the selected curve as stored.");
  else warnings.push("No speed entered: compared with the curve at the selection's design speed.");
  if (readings.speed.mode === "vfd") warnings.push("Speed from the drive frequency: base speed × frequency / base frequency (the motor's slip is taken as at the nameplate).");

  // Both gauges on the gauge reference; an absolute reading is taken relative to the standard atmosphere.
  const asGauge = (g: Readings["suction"]) => (g.reference === "absolute" ? g.pressure - STANDARD_ATMOSPHERE : g.pressure);
  const mixed = readings.suction.reference !== readings.discharge.reference;
  if (mixed) warnings.push("One gauge is absolute and the other is gauge: the absolute reading was taken relative to the standard atmosphere (101.325 kPa); local barometric pressure differs.");
  const ps = asGauge(readings.suction);
  const pd = asGauge(readings.discharge);

  const n = f.adjustment.arrangement === "single" ? 1 : f.adjustment.dutyPumps;
  const dutyAll = f.system.input.duty ?? f.result?.operating ?? null;
  const duty = dutyAll
    ? { flow: f.adjustment.arrangement === "parallel" ? dutyAll.flow / n : dutyAll.flow, head: f.adjustment.arrangement === "series" ? dutyAll.head / n : dutyAll.head }
    : null;
  if (n > 1) warnings.push(`The selection runs ${n} pumps in ${f.adjustment.arrangement}: readings are judged against one pump's curve and one pump's share of the duty.`);

  const input = inputPowerW(readings.power);
  const motorEff = readings.power.mode === "none" ? null : readings.power.motorEfficiency;
  const shaft = input !== null && motorEff !== null ? input * motorEff : null;

  const engine = fieldCheck({
    curve,
    fluid,
    suction: { pressure: ps, elevation: readings.suction.elevation, pipeDiameter: readings.suction.diameter, accuracy: readings.suction.accuracy },
    discharge: { pressure: pd, elevation: readings.discharge.elevation, pipeDiameter: readings.discharge.diameter, accuracy: readings.discharge.accuracy },
    measuredFlow: readings.flow ?? undefined,
    measuredPower: shaft ?? undefined,
    grades: [grade],
    duty: duty ?? undefined,
  });
  warnings.push(...engine.warnings.map((w) => w.message));
  const headUncertainty = Math.hypot(readings.suction.accuracy, readings.discharge.accuracy) / (rho * G0);
  const verdict = verdictFor(curve, grade, engine, readings.flowAccuracy, headUncertainty);

  const q = engine.flow;
  const hydraulic = q !== null ? rho * G0 * q * engine.tdh : null;
  const power =
    input === null
      ? null
      : {
          input,
          hydraulic,
          overall: hydraulic !== null && input > 0 ? hydraulic / input : null,
          shaft,
          pump: hydraulic !== null && shaft ? hydraulic / shaft : null,
          curve: q !== null ? efficiencyAt(curve, q) : null,
        };
  if (power && power.overall !== null && power.overall > 1) warnings.push("The efficiency comes out above 100 %: a reading or its unit is wrong.");

  const deviation = {
    curveFlow: engine.flowDeviation,
    curveHead: engine.headDeviation,
    dutyFlow: engine.dutyDeviation?.flow ?? null,
    dutyHead: engine.dutyDeviation?.head ?? null,
  };
  const speed = { rated, design, measured, rescaled, designRatio: rated !== null && design !== null ? design / rated : null };
  const sel = sample(designCurve, rho);
  const mea = sample(curve, rho);
  const ev = f.systemCurve;
  const flowMax = Math.max(curve.flowMax, designCurve.flowMax, (q ?? 0) * 1.1, (duty?.flow ?? 0) * 1.2, engine.flowBand?.high ?? 0);
  const result: CheckResult = {
    format: FIELD_CHECK_FORMAT,
    grade: { id: grade.id, flow: grade.flow, head: grade.head, source: grade.source },
    verdict,
    verdictText: VERDICT_TEXT[verdict],
    message: engine.message,
    engine,
    fluid: { name: fluid.name, density: rho },
    speed,
    gauges: { suction: ps, discharge: pd, headUncertainty, assumedAtmosphere: mixed },
    duty,
    delivered: { flow: q, head: engine.tdh },
    deviation,
    power,
    hints: [],
    warnings: [...new Set(warnings)],
    chart: {
      selected: sel.head,
      measured: mea.head,
      selectedEff: sel.eff,
      measuredEff: mea.eff,
      system: ev && n === 1 ? ev.flows.map((x, i) => ({ flow: x, y: ev.design[i] })) : null,
      flowMax,
      band: engine.flowBand ? { low: engine.flowBand.low, high: engine.flowBand.high } : null,
      selectedLabel: `As selected${design !== null ? ` (${Math.round(design)} rpm)` : ""}`,
      measuredLabel: rescaled ? `At the measured ${Math.round(measured!)} rpm` : "Curve compared",
    },
  };
  result.hints = hintsFor(result);
  return result;
}

// ── Access ─────────────────────────────────────────────────────────────────────────────────
/** Workspace ids whose projects are shared with the viewer's workspace. */
async function sharedProjectIds(viewer: Viewer): Promise<number[]> {
  const rows = await db().select({ projectId: projectShares.projectId }).from(projectShares).where(eq(projectShares.workspaceId, viewer.workspace.id));
  return rows.map((r) => r.projectId);
}

/** A selection open to the viewer for field checks: its own workspace's, or one of a project shared with it. */
export async function fieldSelection(viewer: Viewer, selectionId: number) {
  const [row] = await db()
    .select({ s: selections, projectName: projects.name, projectCreatedBy: projects.createdBy, systemName: systems.name, ownerName: workspaces.name, shareId: projectShares.id })
    .from(selections)
    .innerJoin(projects, eq(projects.id, selections.projectId))
    .innerJoin(systems, eq(systems.id, selections.systemId))
    .innerJoin(workspaces, eq(workspaces.id, selections.workspaceId))
    .leftJoin(projectShares, and(eq(projectShares.projectId, selections.projectId), eq(projectShares.workspaceId, viewer.workspace.id)))
    .where(eq(selections.id, selectionId));
  if (!row || (row.s.workspaceId !== viewer.workspace.id && row.shareId == null)) throw notFound("selection");
  return {
    id: row.s.id,
    title: row.s.title,
    projectId: row.s.projectId,
    projectName: row.projectName,
    systemName: row.systemName,
    ownerWorkspace: row.ownerName,
    own: row.s.workspaceId === viewer.workspace.id,
    createdBy: row.s.createdBy,
    projectCreatedBy: row.projectCreatedBy,
    frozen: JSON.parse(row.s.frozenJson) as FrozenSelection,
  };
}

/** Selections open to the viewer: shared with their workspace, and their own workspace's. */
export async function fieldHome(viewer: Viewer) {
  const shared = await sharedProjectIds(viewer);
  const where = shared.length ? or(eq(selections.workspaceId, viewer.workspace.id), inArray(selections.projectId, shared)) : eq(selections.workspaceId, viewer.workspace.id);
  const sels = await db()
    .select({ id: selections.id, title: selections.title, projectName: projects.name, systemName: systems.name, ownerName: workspaces.name, workspaceId: selections.workspaceId })
    .from(selections)
    .innerJoin(projects, eq(projects.id, selections.projectId))
    .innerJoin(systems, eq(systems.id, selections.systemId))
    .innerJoin(workspaces, eq(workspaces.id, selections.workspaceId))
    .where(where)
    .orderBy(desc(selections.id))
    .limit(200);
  const ids = sels.map((s) => s.id);
  const checks = ids.length
    ? await db()
        .select({ id: fieldChecks.id, selectionId: fieldChecks.selectionId, version: fieldChecks.version, verdict: fieldChecks.verdict, grade: fieldChecks.grade, createdAt: fieldChecks.createdAt, byName: users.name, byWorkspace: workspaces.name })
        .from(fieldChecks)
        .leftJoin(users, eq(users.id, fieldChecks.createdBy))
        .innerJoin(workspaces, eq(workspaces.id, fieldChecks.workspaceId))
        .where(inArray(fieldChecks.selectionId, ids))
        .orderBy(desc(fieldChecks.id))
        .limit(30)
    : [];
  const titleOf = new Map(sels.map((s) => [s.id, `${s.title} · ${s.projectName}`]));
  return {
    selections: sels.map((s) => ({ id: s.id, title: s.title, projectName: s.projectName, systemName: s.systemName, ownerName: s.ownerName, own: s.workspaceId === viewer.workspace.id })),
    checks: checks.map((c) => ({ ...c, createdAt: c.createdAt.toISOString(), selection: titleOf.get(c.selectionId) ?? "" })),
  };
}

type CheckRow = typeof fieldChecks.$inferSelect;

/** A check open to the viewer (through its selection), with its selection. */
export async function getFieldCheck(viewer: Viewer, checkId: number) {
  const [row] = await db().select().from(fieldChecks).where(eq(fieldChecks.id, checkId));
  if (!row) throw notFound("field check");
  let sel;
  try {
    sel = await fieldSelection(viewer, row.selectionId);
  } catch {
    throw notFound("field check");
  }
  const [by] = row.createdBy ? await db().select({ name: users.name, email: users.email }).from(users).where(eq(users.id, row.createdBy)) : [];
  const [ws] = await db().select({ name: workspaces.name }).from(workspaces).where(eq(workspaces.id, row.workspaceId));
  const photos = await db()
    .select({ id: fieldCheckPhotos.id, filename: fieldCheckPhotos.filename, contentType: fieldCheckPhotos.contentType, sizeBytes: fieldCheckPhotos.sizeBytes })
    .from(fieldCheckPhotos)
    .where(eq(fieldCheckPhotos.fieldCheckId, row.id))
    .orderBy(fieldCheckPhotos.id);
  const chain = await db()
    .select({ id: fieldChecks.id, version: fieldChecks.version, verdict: fieldChecks.verdict, createdAt: fieldChecks.createdAt })
    .from(fieldChecks)
    .where(eq(fieldChecks.chainId, row.chainId ?? row.id))
    .orderBy(fieldChecks.version);
  const stored = JSON.parse(row.readingsJson) as { readings: Readings; fields: CheckFields };
  return {
    check: row,
    selection: sel,
    readings: stored.readings,
    fields: stored.fields,
    result: JSON.parse(row.resultJson) as CheckResult,
    recordedBy: by?.name || by?.email || "a former member",
    recordedIn: ws?.name ?? "",
    mayAmend: row.workspaceId === viewer.workspace.id,
    photos,
    versions: chain.map((c) => ({ ...c, createdAt: c.createdAt.toISOString() })),
    latest: chain.length ? chain[chain.length - 1].id === row.id : true,
  };
}

/** Every check of a selection, newest first. */
export async function checkHistory(viewer: Viewer, selectionId: number) {
  const sel = await fieldSelection(viewer, selectionId);
  const rows = await db()
    .select({ c: fieldChecks, byName: users.name, byWorkspace: workspaces.name })
    .from(fieldChecks)
    .leftJoin(users, eq(users.id, fieldChecks.createdBy))
    .innerJoin(workspaces, eq(workspaces.id, fieldChecks.workspaceId))
    .where(eq(fieldChecks.selectionId, sel.id))
    .orderBy(desc(fieldChecks.id));
  const latestOfChain = new Map<number, number>();
  for (const r of rows) {
    const chain = r.c.chainId ?? r.c.id;
    if (!latestOfChain.has(chain) || latestOfChain.get(chain)! < r.c.version) latestOfChain.set(chain, r.c.version);
  }
  return {
    selection: sel,
    checks: rows.map((r) => {
      const result = JSON.parse(r.c.resultJson) as CheckResult;
      return {
        id: r.c.id,
        chainId: r.c.chainId ?? r.c.id,
        version: r.c.version,
        superseded: latestOfChain.get(r.c.chainId ?? r.c.id)! > r.c.version,
        verdict: r.c.verdict,
        grade: r.c.grade,
        notes: r.c.notes,
        createdAt: r.c.createdAt.toISOString(),
        byName: r.byName ?? "",
        byWorkspace: r.byWorkspace,
        result,
        readings: (JSON.parse(r.c.readingsJson) as { readings: Readings }).readings,
      };
    }),
  };
}

// ── Photos ─────────────────────────────────────────────────────────────────────────────────
export class PhotoRejected extends Error {}

/** Content type from the file's first bytes (JPEG, PNG, WebP only); the client's claim is ignored. */
export function sniffImage(bytes: Uint8Array): "image/jpeg" | "image/png" | "image/webp" | null {
  const b = bytes;
  if (b.length >= 3 && b[0] === 0xff && b[1] === 0xd8 && b[2] === 0xff) return "image/jpeg";
  if (b.length >= 8 && [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a].every((x, i) => b[i] === x)) return "image/png";
  if (b.length >= 12 && String.fromCharCode(...b.slice(0, 4)) === "RIFF" && String.fromCharCode(...b.slice(8, 12)) === "WEBP") return "image/webp";
  return null;
}

export type PhotoIn = { filename: string; contentType: string; bytes: Buffer };

/** Checks uploaded files: type by magic bytes, size, count. Empty file inputs are skipped. */
export async function readPhotos(files: FormDataEntryValue[], already = 0): Promise<PhotoIn[]> {
  const out: PhotoIn[] = [];
  for (const f of files) {
    if (!(f instanceof File) || (f.size === 0 && !f.name)) continue;
    if (f.size === 0) throw new PhotoRejected(`${f.name} is empty.`);
    if (f.size > MAX_PHOTO_BYTES) throw new PhotoRejected(`${f.name} is ${(f.size / 1048576).toFixed(1)} MB; each photo may be at most 8 MB.`);
    const bytes = Buffer.from(await f.arrayBuffer());
    const type = sniffImage(bytes);
    if (!type) throw new PhotoRejected(`${f.name} is not a JPEG, PNG or WebP image.`);
    // eslint-disable-next-line no-control-regex -- control characters are exactly what is stripped
    const name = (f.name.split(/[\\/]/).pop() ?? "photo").replace(/[\u0000-\u001f\u007f"]/g, "").slice(0, 200) || "photo";
    out.push({ filename: name, contentType: type, bytes });
  }
  if (out.length + already > MAX_PHOTOS) throw new PhotoRejected(`At most ${MAX_PHOTOS} photos per check${already ? ` (${already} carried from the earlier version)` : ""}.`);
  return out;
}

export async function getPhoto(viewer: Viewer, checkId: number, photoId: number) {
  await getFieldCheck(viewer, checkId);
  const [p] = await db()
    .select()
    .from(fieldCheckPhotos)
    .where(and(eq(fieldCheckPhotos.id, photoId), eq(fieldCheckPhotos.fieldCheckId, checkId)));
  if (!p) throw notFound("photo");
  return p;
}

// ── Recording ──────────────────────────────────────────────────────────────────────────────
export type NewCheck = { readings: Readings; fields: CheckFields; notes: string; gradeId: string; amends?: number | null };

/**
 * Records a check (or an amendment: a new version of the amended check's chain) with its photos,
 * in one transaction, then tells the engineer of the selection by e-mail.
 */
export async function recordFieldCheck(viewer: Viewer, selectionId: number, input: NewCheck, photos: PhotoIn[] = [], opts: { notify?: boolean } = {}) {
  const sel = await fieldSelection(viewer, selectionId);
  let amended: CheckRow | null = null;
  if (input.amends) {
    const [row] = await db().select().from(fieldChecks).where(eq(fieldChecks.id, input.amends));
    if (!row || row.selectionId !== sel.id) throw notFound("field check");
    if (row.workspaceId !== viewer.workspace.id) throw data("Only the workspace that recorded a check may amend it.", { status: 403 });
    amended = row;
  }
  const result = evaluateCheck(sel.frozen, input.readings, input.gradeId);
  const id = await withTransaction(async (tx) => {
    let chainId: number | null = null;
    let version = 1;
    let carried: (typeof fieldCheckPhotos.$inferSelect)[] = [];
    if (amended) {
      chainId = amended.chainId ?? amended.id;
      // Lock the chain's first version so two amendments cannot take the same number.
      await tx.select({ id: fieldChecks.id }).from(fieldChecks).where(eq(fieldChecks.id, chainId)).for("update");
      const [{ v }] = await tx.select({ v: sql<number>`MAX(${fieldChecks.version})` }).from(fieldChecks).where(eq(fieldChecks.chainId, chainId));
      version = Number(v ?? 1) + 1;
      carried = await tx.select().from(fieldCheckPhotos).where(eq(fieldCheckPhotos.fieldCheckId, amended.id));
      if (carried.length + photos.length > MAX_PHOTOS) throw new PhotoRejected(`At most ${MAX_PHOTOS} photos per check (${carried.length} carried from the earlier version).`);
    }
    const [{ id }] = await tx
      .insert(fieldChecks)
      .values({
        selectionId: sel.id,
        chainId,
        version,
        workspaceId: viewer.workspace.id,
        createdBy: viewer.userId,
        readingsJson: JSON.stringify({ readings: input.readings, fields: input.fields }),
        resultJson: JSON.stringify(result),
        verdict: result.verdict,
        grade: result.grade.id,
        notes: input.notes,
      })
      .$returningId();
    if (!chainId) await tx.update(fieldChecks).set({ chainId: id }).where(eq(fieldChecks.id, id));
    for (const p of carried) await tx.insert(fieldCheckPhotos).values({ fieldCheckId: id, filename: p.filename, contentType: p.contentType, sizeBytes: p.sizeBytes, sha256: p.sha256, content: p.content });
    for (const p of photos)
      await tx.insert(fieldCheckPhotos).values({ fieldCheckId: id, filename: p.filename, contentType: p.contentType, sizeBytes: p.bytes.length, sha256: createHash("sha256").update(p.bytes).digest("hex"), content: p.bytes });
    return id;
  });
  const mail = opts.notify === false ? null : await notifyEngineer(viewer, sel, id, result, amended ? "amended" : "new");
  return { id, result, mail };
}


/** The sentence with the delivered duty point, SI display units (m³/h, m), for the e-mail. */
export function deliveredSentence(r: CheckResult): string {
  const m3h = (q: number) => `${(q * 3600).toFixed(1)} m³/h`;
  const m = (h: number) => `${h.toFixed(1)} m`;
  const q = r.delivered.flow;
  const src = r.engine.flowSource === "measured" ? "measured" : "inferred from the curve";
  const first = q !== null ? `Delivered ${m3h(q)} (${src}) at ${m(r.delivered.head)}` : `Measured head ${m(r.delivered.head)}; flow could not be inferred`;
  const duty = r.duty ? ` (design duty ${m3h(r.duty.flow)} at ${m(r.duty.head)})` : "";
  return `${first}${duty}. Judged against grade ${r.grade.id}: ${r.verdictText}.`;
}

async function notifyEngineer(viewer: Viewer, sel: Awaited<ReturnType<typeof fieldSelection>>, checkId: number, r: CheckResult, kind: "new" | "amended") {
  const userId = sel.createdBy ?? sel.projectCreatedBy;
  if (!userId) return null;
  const [to] = await db().select({ email: users.email, name: users.name }).from(users).where(eq(users.id, userId));
  if (!to) return null;
  const [me] = await db().select({ name: users.name, email: users.email }).from(users).where(eq(users.id, viewer.userId));
  const checkedBy = `${me?.name || me?.email || "A member"} (${viewer.workspace.name})`;
  const link = `${appUrl()}/field/checks/${checkId}`;
  const detail = `${kind === "amended" ? "This is an amended version of an earlier check. " : ""}${deliveredSentence(r)}`;
  let msg;
  if (r.verdict === "unknown") {
    // The shared template has words for pass / marginal / fail only; without a flow meter there is no verdict.
    const selection = oneLine(sel.title);
    const project = oneLine(sel.projectName);
    const text = [
      to.name ? `Hello ${oneLine(to.name)},` : "Hello,",
      "",
      `${oneLine(checkedBy)} recorded a field check on the selection “${selection}” in the project “${project}”.`,
      "No tolerance verdict: there was no flow meter, so the flow was inferred from the curve.",
      detail,
      "",
      `Open the field check: ${link}`,
      "",
      "Figures are for design guidance; verify against the manufacturer's certified data, local codes and a licensed engineer.",
    ].join("\n");
    const html = text
      .split("\n")
      .map((l) => (l.startsWith("Open the field check: ") ? `<p><a href="${escapeHtml(link)}">Open the field check</a></p>` : l ? `<p>${escapeHtml(l)}</p>` : ""))
      .join("");
    msg = { subject: `Field check on ${selection} (${project}): no tolerance verdict`, text, html };
  } else {
    msg = fieldCheckMail({ engineerName: to.name, checkedBy, projectName: sel.projectName, selectionName: sel.title, verdict: r.verdict, detail, link });
  }
  try {
    return await sendMail({ to: to.email, ...msg });
  } catch (e) {
    // The check is recorded; a mail that cannot even be queued is logged, not fatal.
    console.error(`[fieldchecks] notice for check ${checkId} not queued: ${e instanceof Error ? e.message : e}`);
    return null;
  }
}

// ── History CSV ────────────────────────────────────────────────────────────────────────────
const csvRow = (xs: unknown[]) => xs;

export function historyCsv(h: Awaited<ReturnType<typeof checkHistory>>): string {
  const lines = [
    csvRow(["# Dutymark field checks", `selection ${h.selection.id}`, h.selection.title, h.selection.projectName]),
    csvRow(["# SI units in every header. Pressurised systems, rotating equipment and electrical work are for qualified people; follow site rules, local codes and licensed practice."]),
    csvRow([
      "check_id", "chain_id", "version", "superseded", "recorded_at", "recorded_by", "workspace", "verdict", "grade", "flow_source",
      "flow_m3s", "flow_band_low_m3s", "flow_band_high_m3s", "tdh_m", "curve_head_m", "head_dev_from_curve", "flow_dev_from_curve",
      "duty_flow_m3s", "duty_head_m", "flow_dev_from_duty", "head_dev_from_duty", "speed_rpm", "input_power_w", "overall_efficiency",
      "suction_pa_as_read", "suction_reference", "discharge_pa_as_read", "discharge_reference",
      "suction_pa_gauge", "discharge_pa_gauge", "temperature_c", "notes",
    ]),
  ];
  for (const c of [...h.checks].reverse()) {
    const r = c.result;
    lines.push(
      csvRow([
        c.id, c.chainId, c.version, c.superseded ? "yes" : "no", c.createdAt, c.byName, c.byWorkspace, c.verdict, c.grade, r.engine.flowSource,
        r.delivered.flow, r.engine.flowBand?.low, r.engine.flowBand?.high, r.delivered.head, r.engine.curveHead, r.deviation.curveHead, r.deviation.curveFlow,
        r.duty?.flow, r.duty?.head, r.deviation.dutyFlow, r.deviation.dutyHead, r.speed.measured, r.power?.input, r.power?.overall,
        c.readings.suction.pressure, c.readings.suction.reference, c.readings.discharge.pressure, c.readings.discharge.reference,
        r.gauges.suction, r.gauges.discharge, c.readings.temperatureC, c.notes,
      ]),
    );
  }
  return toCsv(lines, { precision: 8 });
}

// ── Sharing ────────────────────────────────────────────────────────────────────────────────
async function ownProject(viewer: Viewer, projectId: number) {
  const [p] = await db().select().from(projects).where(and(eq(projects.id, projectId), eq(projects.workspaceId, viewer.workspace.id)));
  if (!p) throw data("No such project in this workspace.", { status: 404 });
  return p;
}

export async function listShares(viewer: Viewer, projectId: number) {
  const p = await ownProject(viewer, projectId);
  const rows = await db()
    .select({ id: projectShares.id, workspaceName: workspaces.name, workspaceSlug: workspaces.slug, createdAt: projectShares.createdAt })
    .from(projectShares)
    .innerJoin(workspaces, eq(workspaces.id, projectShares.workspaceId))
    .where(eq(projectShares.projectId, p.id))
    .orderBy(workspaces.name);
  return { project: { id: p.id, name: p.name }, shares: rows.map((r) => ({ ...r, createdAt: r.createdAt.toISOString() })) };
}

/** Shares a project with the workspace of that exact name or slug. Idempotent. */
export async function shareProject(viewer: Viewer, projectId: number, nameOrSlug: string): Promise<{ ok: true; name: string; already: boolean } | { ok: false; error: string }> {
  const p = await ownProject(viewer, projectId);
  const key = nameOrSlug.trim();
  if (!key) return { ok: false, error: "Enter the other workspace's exact name or its short name (slug)." };
  const found = await db().select({ id: workspaces.id, name: workspaces.name }).from(workspaces).where(or(eq(workspaces.slug, key.toLowerCase()), eq(workspaces.name, key))).limit(2);
  // Exact match only (the collation ignores case); the answer is the same for "no such workspace" and "ambiguous".
  if (found.length !== 1) return { ok: false, error: "No workspace has exactly that name or short name. Ask them for it (it is shown on their Workspace page)." };
  const w = found[0];
  if (w.id === viewer.workspace.id) return { ok: false, error: "This is your own workspace: its members already see the project." };
  const [have] = await db().select({ id: projectShares.id }).from(projectShares).where(and(eq(projectShares.projectId, p.id), eq(projectShares.workspaceId, w.id)));
  if (have) return { ok: true, name: w.name, already: true };
  await db().insert(projectShares).values({ projectId: p.id, workspaceId: w.id, createdBy: viewer.userId });
  return { ok: true, name: w.name, already: false };
}

export async function unshareProject(viewer: Viewer, projectId: number, shareId: number): Promise<boolean> {
  const p = await ownProject(viewer, projectId);
  const r = await db().delete(projectShares).where(and(eq(projectShares.id, shareId), eq(projectShares.projectId, p.id)));
  return Number((r as unknown as [{ affectedRows?: number }])?.[0]?.affectedRows ?? 0) === 1;
}
