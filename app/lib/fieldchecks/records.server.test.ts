// Field checks: the head from readings (hand-worked), verdict boundaries per grade, the flow band
// against curve slope, the codec's units, photos, and the recorded journey across two workspaces.
import Papa from "papaparse";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { and, desc, eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { fieldCheckPhotos, fieldChecks, outbox, users, workspaces } from "@db/schema";
import { fluidAt, gaugeTdh, TOLERANCE_GRADES, type ToleranceGrade } from "~/engine";
import { fieldSelection, getFieldCheck, checkHistory, recordFieldCheck } from "./records.server";
import { readPhotos, sniffImage, PhotoRejected } from "./photos.server";
import { evaluateCheck, historyCsv, inputPowerW, parseCheckFields, speedRpm, type Readings } from "./index";
import { listShares, shareProject, unshareProject } from "../projects/shares.server";
import { shareAccepted } from "../projects/test-kit";
import { call, makeMember, type TestMember } from "~/test/harness";
import { fieldsForHead, frozenFixture, linearPoints, storeSelection } from "~/test/fieldcheck-fixture";
import * as formRoute from "~/routes/field.selections.$id";
import * as recordRoute from "~/routes/field.checks.$id";
import * as photoRoute from "~/routes/field.checks.$id.photos.$photoId";
import * as csvRoute from "~/routes/field.selections.$id.export-csv";
import * as shareRoute from "~/routes/projects.$id.share";
import type { Viewer } from "../libraries";

const RHO20 = fluidAt({ kind: "water" }, 20).density;

function readingsFromFields(f: Record<string, string>): Readings {
  const r = parseCheckFields(f, { kind: "water" });
  if (!r.ok) throw new Error(`fixture fields invalid: ${JSON.stringify(r.errors)}`);
  return r.readings;
}

describe("head from readings (hand-worked)", () => {
  test("gaugeTdh matches a hand-worked case", () => {
    // Hand-worked (Bernoulli between the taps, common practice), ρ = 1000 kg/m³, g₀ = 9.80665 m/s²:
    //   p_s = 50 kPa, p_d = 350 kPa → (p_d − p_s)/(ρg) = 300 000 / 9806.65 = 30.5915 m
    //   z_s = 0.2 m, z_d = 0.9 m → z_d − z_s = 0.7 m
    //   Q = 0.02 m³/s, D_s = 100 mm → A_s = π·0.1²/4 = 7.8540e-3 m², V_s = 2.5465 m/s, V_s²/2g = 0.33062 m
    //                  D_d = 80 mm  → A_d = π·0.08²/4 = 5.0265e-3 m², V_d = 3.9789 m/s, V_d²/2g = 0.80718 m
    //   TDH = 30.5915 + 0.7 + 0.80718 − 0.33062 = 31.7680 m
    const r = gaugeTdh({ pressure: 50_000, elevation: 0.2, pipeDiameter: 0.1 }, { pressure: 350_000, elevation: 0.9, pipeDiameter: 0.08 }, 0.02, 1000);
    expect(r.vhs).toBeCloseTo(0.33062, 4);
    expect(r.vhd).toBeCloseTo(0.80718, 4);
    expect(r.tdh).toBeCloseTo(31.768, 3);
  });

  test("the same readings typed in kPa gauge, kPa absolute and psi give the same TDH through the form", () => {
    // Same case at 20 °C water: ρ = 998.21 kg/m³ (IAPWS, from memory), so the pressure head is
    // 300 000 / (998.21·9.80665) = 30.6464 m; TDH = 30.6464 + 0.7 + 0.80718 − 0.33062 = 31.8230 m.
    expect(RHO20).toBeCloseTo(998.21, 1);
    const f = frozenFixture({ points: linearPoints(60, 1000, 0.04) });
    const common = { elevationUnit: "m", sElevation: "0.2", dElevation: "0.9", diameterUnit: "mm", sDiameter: "100", dDiameter: "80", flowUnit: "m3/h", flow: "72", temperatureUnit: "C", temperature: "20", rpm: "2900" };
    const kpa = readingsFromFields({ ...common, pressureUnit: "kPa", sPressure: "50", dPressure: "350" });
    const abs = readingsFromFields({ ...common, pressureUnit: "kPa", sRef: "absolute", dRef: "absolute", sPressure: "151.325", dPressure: "451.325" });
    // 50 kPa = 7.251887 psi and 350 kPa = 50.763207 psi (1 psi = 6894.757 Pa, NIST SP 811).
    const psi = readingsFromFields({ ...common, pressureUnit: "psi", sPressure: "7.251887", dPressure: "50.763207" });
    // Mixed: suction absolute 151.325 kPa = 50 kPa gauge against the standard atmosphere (101.325 kPa).
    const mixed = readingsFromFields({ ...common, pressureUnit: "kPa", sRef: "absolute", sPressure: "151.325", dPressure: "350" });
    for (const rd of [kpa, abs, psi, mixed]) {
      const r = evaluateCheck(f, rd, "2B");
      expect(r.delivered.head).toBeCloseTo(31.823, 2);
      expect(r.delivered.flow).toBeCloseTo(0.02, 9);
    }
    expect(evaluateCheck(f, mixed, "2B").warnings.join(" ")).toMatch(/standard atmosphere/);
    expect(evaluateCheck(f, abs, "2B").warnings.join(" ")).not.toMatch(/standard atmosphere/);
  });

  test("electrical input power and drive speed", () => {
    // Three-phase P = √3·V·I·PF (AC power, electrical handbook): 1.7320508 × 400 × 10 × 0.85 = 5888.97 W.
    expect(inputPowerW({ mode: "electrical", volts: 400, amps: 10, powerFactor: 0.85, phases: 3, motorEfficiency: null })).toBeCloseTo(5888.97, 1);
    // Single-phase P = V·I·PF: 230 × 4 × 0.9 = 828 W.
    expect(inputPowerW({ mode: "electrical", volts: 230, amps: 4, powerFactor: 0.9, phases: 1, motorEfficiency: null })).toBeCloseTo(828, 6);
    // Drive: 2900 rpm × 45 Hz / 50 Hz = 2610 rpm (common practice, slip as at the nameplate).
    expect(speedRpm({ mode: "vfd", hz: 45, baseHz: 50, baseRpm: 2900 })).toBeCloseTo(2610, 9);
  });

  test("efficiency estimate from measured power", () => {
    // Curve H = 40 − 1000·Q; flow meter 0.012 m³/s, TDH 28 m at 20 °C:
    //   hydraulic power = ρ·g·Q·H = 998.21 × 9.80665 × 0.012 × 28 = 3289.1 W
    //   input 5 kW → overall efficiency 3289.1 / 5000 = 0.6578; motor 90 % → shaft 4500 W → pump 0.7309.
    const f = frozenFixture();
    const rd = readingsFromFields(fieldsForHead(28, RHO20, { flow: "0.012", powerMode: "input", power: "5", motorEfficiency: "90" }));
    const r = evaluateCheck(f, rd, "2B");
    expect(r.power?.hydraulic).toBeCloseTo(3289.1, 0);
    expect(r.power?.overall).toBeCloseTo(0.6578, 3);
    expect(r.power?.pump).toBeCloseTo(0.7309, 3);
  });
});

describe("verdict boundaries, per grade (just inside / just outside)", () => {
  // Curve H(Q) = 40 − 1000·Q (m, m³/s), flow meter Qm = 0.012 m³/s, speed as rated. A point passes a
  // grade when it meets either arm of the tolerance cross (ISO 9906:2012 6.4.2, from memory; grades as in
  // TOLERANCE_GRADES): head arm — Hm within (1 − c)..(1 + d) × H(Qm); flow arm — Qm within (1 − a)..(1 + b)
  // × Q(Hm), i.e. Hm within 40 − 1000·Qm/(1 − a) .. 40 − 1000·Qm/(1 + b). Worked for 2B (a = b = 8 %,
  // c = d = 5 %): H(Qm) = 28 → head arm 26.6..29.4 m; flow arm 26.957..28.889 m → upper 29.4 m, lower 26.6 m.
  const f = frozenFixture();
  const H = (q: number) => 40 - 1000 * q;
  const Qm = 0.012;
  const bounds = (g: ToleranceGrade) => ({
    upper: Math.max((1 + g.head[1]) * H(Qm), 40 - (1000 * Qm) / (1 + g.flow[1])),
    lower: Math.min((1 - g.head[0]) * H(Qm), g.flow[0] >= 1 ? -Infinity : 40 - (1000 * Qm) / (1 - g.flow[0])),
  });
  const verdictAt = (head: number, gradeId: string, extra: Record<string, string> = {}) =>
    evaluateCheck(f, readingsFromFields(fieldsForHead(head, RHO20, { flow: String(Qm), ...extra })), gradeId).verdict;

  test("2B bounds by hand", () => {
    const b = bounds(TOLERANCE_GRADES.find((g) => g.id === "2B")!);
    expect(b.upper).toBeCloseTo(29.4, 3);
    expect(b.lower).toBeCloseTo(26.6, 3);
  });

  for (const g of TOLERANCE_GRADES) {
    test(`grade ${g.id}`, () => {
      const { upper, lower } = bounds(g);
      expect(verdictAt(upper * 0.999, g.id)).toBe("pass");
      expect(verdictAt(upper * 1.001, g.id)).toBe("fail");
      expect(verdictAt(lower * 1.001, g.id)).toBe("pass");
      expect(verdictAt(lower * 0.999, g.id)).toBe("fail");
    });
  }

  test("just outside but within the gauges' accuracy is marginal; far outside stays a fail", () => {
    // Gauges ±5 kPa each → head uncertainty √(5² + 5²) kPa / (ρg) = 7071 / (998.21 × 9.80665) = 0.7223 m.
    const { upper } = bounds(TOLERANCE_GRADES.find((g) => g.id === "2B")!);
    const acc = { sAccuracy: "5", dAccuracy: "5" };
    expect(verdictAt(upper + 0.3, "2B", acc)).toBe("marginal"); // 0.3 m out, inside 0.72 m
    expect(verdictAt(upper + 1.5, "2B", acc)).toBe("fail"); // 1.5 m out, beyond 0.72 m
    expect(verdictAt(upper + 0.3, "2B")).toBe("fail"); // no accuracy stated: no benefit of the doubt
  });

  test("the curve is rescaled to the measured speed before judging", () => {
    // At 2610 rpm (0.9 × 2900): Q' = 0.9·Q, H' = 0.81·H (affinity laws). At Q' = 0.009: Q = 0.01, H = 30 → H' = 24.3 m.
    const at90 = evaluateCheck(f, readingsFromFields(fieldsForHead(24.3, RHO20, { flow: "0.009", rpm: "2610" })), "2B");
    expect(at90.engine.curveHead).toBeCloseTo(24.3, 3);
    expect(at90.verdict).toBe("pass");
    // The same point against the rated-speed curve: H(0.009) = 31 m, 24.3/31 − 1 = −21.6 % → fail.
    const rated = evaluateCheck(f, readingsFromFields(fieldsForHead(24.3, RHO20, { flow: "0.009", rpm: "2900" })), "2B");
    expect(rated.deviation.curveHead).toBeCloseTo(24.3 / 31 - 1, 3);
    expect(rated.verdict).toBe("fail");
    expect(rated.hints.join(" ")).toMatch(/air/);
    expect(rated.hints.join(" ")).toMatch(/wear/);
    expect(rated.hints[0]).toMatch(/not a diagnosis/);
  });

  test("less flow and more head than the duty points at a more resistant system, worded as things to check", () => {
    // Duty 0.012 m³/s at 28 m; delivered 0.008 m³/s at H(0.008) = 32 m (on the curve, 33 % short of the duty flow).
    const r = evaluateCheck(f, readingsFromFields(fieldsForHead(32, RHO20, { flow: "0.008" })), "2B");
    expect(r.verdict).toBe("pass"); // the pump is on its curve …
    expect(r.deviation.dutyFlow).toBeCloseTo(0.008 / 0.012 - 1, 6); // … the system is not where designed
    expect(r.hints.join(" ")).toMatch(/throttled or closed valves/);
    expect(r.hints.join(" ")).toMatch(/clogged strainer/);
  });
});

describe("no flow meter: flow inferred with a band", () => {
  // Gauges ±5 kPa each → ΔH = 0.7223 m (above). Equal pipe sizes, so velocity heads cancel and the band
  // is exactly [Q(H + ΔH), Q(H − ΔH)] on a straight curve H = 40 − k·Q: width 2·ΔH/k.
  const dH = Math.hypot(5000, 5000) / (RHO20 * 9.80665);
  const band = (k: number, head: number) => {
    const f = frozenFixture({ points: linearPoints(40, k, 0.03) });
    return evaluateCheck(f, readingsFromFields(fieldsForHead(head, RHO20, { sAccuracy: "5", dAccuracy: "5" })), "2B");
  };

  test("the band follows the gauges' accuracy and widens as the curve flattens", () => {
    expect(dH).toBeCloseTo(0.7223, 3);
    const steep = band(1000, 28); // Q = 0.012, width 2 × 0.7223/1000 = 1.445e-3 m³/s (±6.0 %)
    const flat = band(250, 35); //   Q = 0.020, width 2 × 0.7223/250 = 5.778e-3 m³/s (±14.4 %)
    for (const [r, k, q] of [[steep, 1000, 0.012], [flat, 250, 0.02]] as const) {
      expect(r.verdict).toBe("unknown");
      expect(r.engine.flowSource).toBe("inferred-from-curve");
      expect(r.delivered.flow).toBeCloseTo(q, 6);
      expect(r.engine.flowBand!.high! - r.engine.flowBand!.low!).toBeCloseTo((2 * dH) / k, 6);
    }
    const rel = (r: typeof steep) => (r.engine.flowBand!.high! - r.engine.flowBand!.low!) / r.delivered.flow!;
    expect(rel(flat)).toBeGreaterThan(2 * rel(steep));
    expect(flat.warnings.join(" ")).toMatch(/flat curve/);
    expect(steep.warnings.join(" ")).not.toMatch(/flat curve/);
  });
});

describe("form codec", () => {
  test("names the bad fields", () => {
    const r = parseCheckFields({ ...fieldsForHead(20, RHO20), sPressure: "", dPressure: "abc", sDiameter: "0.1", temperature: "900" }, { kind: "water" });
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.errors.sPressure).toMatch(/Enter/);
      expect(r.errors.dPressure).toMatch(/number/);
      expect(r.errors.sDiameter).toMatch(/too low/); // 0.1 mm: below the 5 mm plausibility bound
      expect(r.errors.temperature).toMatch(/too high/);
    }
  });
  test("an absolute gauge cannot read below zero; a gauge reading can (vacuum)", () => {
    expect(parseCheckFields({ ...fieldsForHead(20, RHO20), sRef: "absolute", sPressure: "-5" }, { kind: "water" }).ok).toBe(false);
    expect(parseCheckFields({ ...fieldsForHead(20, RHO20), sPressure: "-30" }, { kind: "water" }).ok).toBe(true);
  });
});

describe("photos", () => {
  const JPEG = Buffer.from([0xff, 0xd8, 0xff, 0xe0, 0, 16, 0x4a, 0x46]);
  const PNG = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0]);
  const WEBP = Buffer.from("RIFF\0\0\0\0WEBPVP8 ", "latin1");
  test("type by magic bytes, not by name or claimed type", async () => {
    expect(sniffImage(JPEG)).toBe("image/jpeg");
    expect(sniffImage(PNG)).toBe("image/png");
    expect(sniffImage(WEBP)).toBe("image/webp");
    expect(sniffImage(Buffer.from("GIF89a"))).toBeNull();
    const ok = await readPhotos([new File([PNG], "gauge.jpg", { type: "image/jpeg" })]);
    expect(ok[0].contentType).toBe("image/png");
    await expect(readPhotos([new File(["<svg/>"], "x.jpg", { type: "image/jpeg" })])).rejects.toBeInstanceOf(PhotoRejected);
    await expect(readPhotos([new File([JPEG, Buffer.alloc(8 * 1024 * 1024)], "big.jpg")])).rejects.toThrow(/at most 8 MB/);
    await expect(readPhotos(Array.from({ length: 7 }, (_, i) => new File([JPEG], `p${i}.jpg`)))).rejects.toThrow(/At most 6/);
    expect(await readPhotos([new File([], "")])).toEqual([]); // an empty file input is no photo
  });
});

describe("recorded checks across workspaces", () => {
  let eng: TestMember, con: TestMember, other: TestMember;
  let sel: Awaited<ReturnType<typeof storeSelection>>;
  let conSlug: string;
  const vOf = (m: TestMember, name: string, slug: string, role = m.role): Viewer => ({ userId: m.userId, workspace: { id: m.workspaceId, name, slug, plan: "free" }, role });
  let engV: Viewer, conV: Viewer;

  beforeAll(async () => {
    eng = await makeMember("engineer");
    con = await makeMember("contractor");
    other = await makeMember("contractor");
    const [ew] = await db().select().from(workspaces).where(eq(workspaces.id, eng.workspaceId));
    const [cw] = await db().select().from(workspaces).where(eq(workspaces.id, con.workspaceId));
    conSlug = cw.slug;
    engV = vOf(eng, ew.name, ew.slug);
    conV = vOf(con, cw.name, cw.slug);
    sel = await storeSelection(eng.workspaceId, eng.userId);
  });
  afterAll(() => closeDb());

  test("not shared: 404; offered by slug: still 404 until the contractor's admin accepts, then open; offering twice is one share", async () => {
    await expect(fieldSelection(conV, sel.selectionId)).rejects.toMatchObject({ init: { status: 404 } });
    const r1 = await shareProject(engV, sel.projectId, conSlug);
    const r2 = await shareProject(engV, sel.projectId, conSlug.toUpperCase());
    expect(r1).toMatchObject({ ok: true, outcome: "offered" });
    expect(r2).toMatchObject({ ok: true, outcome: "pending" });
    expect((await listShares(engV, sel.projectId)).shares).toMatchObject([{ state: "pending" }]);
    expect(await shareProject(engV, sel.projectId, "no such workspace anywhere")).toMatchObject({ ok: false });
    await expect(fieldSelection(conV, sel.selectionId)).rejects.toMatchObject({ init: { status: 404 } }); // pending opens nothing
    await shareAccepted(engV, sel.projectId, conSlug);
    expect(await shareProject(engV, sel.projectId, conSlug)).toMatchObject({ ok: true, outcome: "accepted" });
    expect((await fieldSelection(conV, sel.selectionId)).id).toBe(sel.selectionId);
    // A contractor cannot share the engineer's project onwards.
    const denied = await call(shareRoute.action as never, { path: `/projects/${sel.projectId}/share`, cookie: con.cookie, params: { id: String(sel.projectId) }, form: { intent: "share", workspace: "x" } });
    expect(denied.status).toBe(403);
  });

  let checkId = 0;
  test("the contractor records a check through the form (with a photo); the engineer is mailed; both see the same numbers", async () => {
    const fd = new FormData();
    for (const [k, val] of Object.entries(fieldsForHead(28, RHO20, { flow: "0.012", notes: "=HYPERLINK(\"x\") valve V3 found half shut", pageWorkspaceId: String(con.workspaceId) }))) fd.append(k, val);
    fd.append("photos", new File([Buffer.from([0xff, 0xd8, 0xff, 0xe0, 1, 2, 3])], "gauges.jpg", { type: "image/jpeg" }));
    const res = await call(formRoute.action as never, { path: `/field/selections/${sel.selectionId}/photos`, cookie: con.cookie, params: { id: String(sel.selectionId) }, body: fd });
    expect(res.status).toBe(302);
    const m = /\/field\/checks\/(\d+)/.exec(res.location ?? "");
    expect(m).not.toBeNull();
    checkId = Number(m![1]);
    const [row] = await db().select().from(fieldChecks).where(eq(fieldChecks.id, checkId));
    expect(row).toMatchObject({ selectionId: sel.selectionId, workspaceId: con.workspaceId, version: 1, chainId: checkId, verdict: "pass", grade: "2B" });

    const mail = await db().select().from(outbox).where(eq(outbox.toAddress, eng.email)).orderBy(desc(outbox.id));
    expect(mail).toHaveLength(1);
    expect(mail[0].subject).toContain("Fixture selection");
    expect(mail[0].subject).toContain("within tolerance");
    expect(mail[0].textBody).toContain(`/field/checks/${checkId}`);
    expect(mail[0].textBody).toContain("43.2 m³/h"); // 0.012 m³/s × 3600

    const asCon = await call(recordRoute.loader as never, { path: `/field/checks/${checkId}`, cookie: con.cookie, params: { id: String(checkId) } });
    const asEng = await call(recordRoute.loader as never, { path: `/field/checks/${checkId}`, cookie: eng.cookie, params: { id: String(checkId) } });
    expect(asCon.status).toBe(200);
    expect(asEng.status).toBe(200);
    const pick = (b: unknown) => { const x = b as { result: unknown; check: { verdict: string } }; return JSON.stringify([x.result, x.check.verdict]); };
    expect(pick(asEng.body)).toBe(pick(asCon.body));
    expect((asEng.body as { mayAmend: boolean }).mayAmend).toBe(false);

    const [photo] = await db().select().from(fieldCheckPhotos).where(eq(fieldCheckPhotos.fieldCheckId, checkId));
    const img = await call(photoRoute.loader as never, { path: `/field/checks/${checkId}/photos/${photo.id}`, cookie: eng.cookie, params: { id: String(checkId), photoId: String(photo.id) } });
    expect(img.status).toBe(200);
    expect(img.headers.get("content-type")).toBe("image/jpeg");
  });

  test("bad readings come back with field messages and record nothing", async () => {
    const before = (await db().select().from(fieldChecks).where(eq(fieldChecks.selectionId, sel.selectionId))).length;
    const res = await call(formRoute.action as never, { path: `/field/selections/${sel.selectionId}/photos`, cookie: con.cookie, params: { id: String(sel.selectionId) }, form: { ...fieldsForHead(28, RHO20), dPressure: "", pageWorkspaceId: String(con.workspaceId) } });
    expect(res.status).toBe(400);
    expect((res.body as { errors: Record<string, string> }).errors.dPressure).toBeTruthy();
    expect((await db().select().from(fieldChecks).where(eq(fieldChecks.selectionId, sel.selectionId))).length).toBe(before);
  });

  test("an amendment is a new version; the first stays as it was; only the recording workspace may amend", async () => {
    const [v1] = await db().select().from(fieldChecks).where(eq(fieldChecks.id, checkId));
    const rd = readingsFromFields(fieldsForHead(40, RHO20, { flow: "0.012" })); // 40 m at 0.012: far above the curve (28 m) → fail
    // The engineer reads in US units with flow in L/s: the notice speaks them (0.012 m³/s = 12.0 L/s; 40 m = 131 ft, 1 ft = 0.3048 m, NIST SP 811).
    await db().update(users).set({ unitSystem: "US", units: JSON.stringify({ flow: "L/s" }) }).where(eq(users.id, eng.userId));
    const r = await recordFieldCheck(conV, sel.selectionId, { readings: rd, fields: {}, notes: "re-read after gauge swap", gradeId: "2B", amends: checkId });
    await db().update(users).set({ unitSystem: "SI", units: "{}" }).where(eq(users.id, eng.userId));
    const [notice] = await db().select().from(outbox).where(eq(outbox.toAddress, eng.email)).orderBy(desc(outbox.id)).limit(1);
    expect(notice.textBody).toMatch(/Delivered 12\.0 L\/s \(measured\) at 131 ft/);
    expect(notice.textBody).not.toMatch(/m³\/h|\d m\b|⟦/);
    const [v2] = await db().select().from(fieldChecks).where(eq(fieldChecks.id, r.id));
    expect(v2).toMatchObject({ chainId: checkId, version: 2, verdict: "fail" });
    const [v1after] = await db().select().from(fieldChecks).where(eq(fieldChecks.id, checkId));
    expect(v1after).toEqual(v1);
    expect((await db().select().from(fieldCheckPhotos).where(eq(fieldCheckPhotos.fieldCheckId, r.id))).length).toBe(1); // carried over
    await expect(recordFieldCheck(engV, sel.selectionId, { readings: rd, fields: {}, notes: "", gradeId: "2B", amends: checkId })).rejects.toMatchObject({ init: { status: 403 } });
    const h = await checkHistory(engV, sel.selectionId);
    expect(h.checks.map((c) => [c.version, c.superseded])).toEqual([[2, false], [1, true]]);
    const got = await getFieldCheck(engV, checkId);
    expect(got.latest).toBe(false);
    expect(got.versions.map((x) => x.version)).toEqual([1, 2]);
  });

  test("history CSV: one row per version, formulas from notes defused", async () => {
    const res = await call(csvRoute.loader as never, { path: `/field/selections/${sel.selectionId}/export.csv`, cookie: eng.cookie, params: { id: String(sel.selectionId) } });
    expect(res.status).toBe(200);
    const text = String(res.body);
    const lines = text.trim().split("\r\n");
    expect(lines[3]).toMatch(/^check_id,chain_id,version/);
    expect(lines.slice(4)).toHaveLength(2);
    // Each row carries the grade's allowances beside its deviations, and the verdict follows from them by the rule line
    // (either arm of the cross; grade 2B: head ±5 %, flow ±8 %, ISO 9906:2012 from memory).
    expect(lines[2]).toMatch(/^"?# verdict: pass when either arm/);
    const rows = Papa.parse<Record<string, string>>(lines.slice(3).join("\n"), { header: true }).data;
    for (const row of rows) {
      expect([row.grade, row.head_allowed_below, row.head_allowed_above, row.flow_allowed_below, row.flow_allowed_above]).toEqual(["2B", "0.05", "0.05", "0.08", "0.08"]);
      const within = (d: string, lo: string, hi: string) => d !== "" && Number(d) >= -Number(lo) - 1e-12 && Number(d) <= Number(hi) + 1e-12;
      const eitherArm = within(row.head_dev_from_curve, row.head_allowed_below, row.head_allowed_above) || within(row.flow_dev_from_curve, row.flow_allowed_below, row.flow_allowed_above);
      if (row.verdict === "pass") expect(eitherArm).toBe(true);
      if (row.verdict === "fail") expect(eitherArm && row.power_limits !== "not met").toBe(false);
      if (row.verdict === "marginal") expect(eitherArm && row.power_limits !== "met within accuracy").toBe(false);
    }
    expect(rows.map((r) => r.verdict).filter((v) => v !== "unknown").length).toBeGreaterThan(0);
    expect(text).toContain(`"'=HYPERLINK(""x"") valve V3 found half shut"`);
    expect(historyCsv(await checkHistory(engV, sel.selectionId))).toBe(text);
  });

  test("a third workspace reaches none of it; unsharing closes it for the contractor", async () => {
    for (const [fn, path, params] of [
      [formRoute.loader, `/field/selections/${sel.selectionId}`, { id: String(sel.selectionId) }],
      [recordRoute.loader, `/field/checks/${checkId}`, { id: String(checkId) }],
      [csvRoute.loader, `/field/selections/${sel.selectionId}/export.csv`, { id: String(sel.selectionId) }],
    ] as const) {
      const r = await call(fn as never, { path, cookie: other.cookie, params });
      expect(r.status).toBe(404);
      expect(JSON.stringify(r.body)).not.toContain("Fixture");
    }
    const [share] = (await listShares(engV, sel.projectId)).shares;
    expect(await unshareProject(engV, sel.projectId, share.id)).toBe("accepted");
    const r = await call(recordRoute.loader as never, { path: `/field/checks/${checkId}`, cookie: con.cookie, params: { id: String(checkId) } });
    expect(r.status).toBe(404);
    // … and the engineer still sees the checks recorded before.
    expect((await checkHistory(engV, sel.selectionId)).checks.length).toBe(2);
    expect((await db().select().from(fieldChecks).where(and(eq(fieldChecks.selectionId, sel.selectionId)))).length).toBe(2);
  });
});
