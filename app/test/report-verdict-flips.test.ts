// The report's motor and NPSH verdicts flip where their inputs cross the rule's threshold, through the services the pages
// use (createSystem → addCandidate → selectCandidate, then the report's loader rendered with its page; the system page's
// candidates table beside it): each case a part in 10⁶ inside and outside, read off the report's verdict line and its
// figures table, and the report's verdict cell the same as the system page's (one computation).
// Motor (rule: verdict-motor.ts, figures.ts — common practice, a motor runs within rating × service factor; non-overloading
// over the whole curve): the invented probe pump (probe-pump.ts: shaft power 2 + 0.05 Q kW, Q 0–40 m³/h, meeting 30 m³/h at
// 20.5 m at about 33.7 m³/h) rated just above and just below its largest power on the curve, and just above and just
// below its shaft power at the operating point. NPSH (rule: npshOverBand, figures.ts npshStatus — common practice, ANSI/HI
// 9.6.1 guidance): the demo curve TFS Meregate 80, 2900 rpm, Ø195 mm (fixtures/demo/tallowmere.csv, invented) on an open
// booster; the wanted ratio set a part in 10⁶ either side of the lowest NPSHa / NPSHr judged (ok ↔ low margin), and the
// suction surface pressure moved so that NPSHa at the deciding point sits a part in 10⁶ either side of NPSHr (low margin ↔
// cavitation risk). The thresholds are read from the system's own workbench (the frozen figures), not hand-computed.
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import { createLibrary, listModels, type Viewer } from "~/lib/libraries";
import { addCandidate, createProject, createSystem, selectCandidate, systemWorkbench } from "~/lib/projects";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, type Adjustment, type SystemInput } from "~/lib/projects/hydraulics";
import { demoLibrary, importCsvText, M3H, viewerOfUser } from "~/lib/projects/test-kit";
import { G0 } from "~/engine";
import * as sysPage from "~/routes/systems.$id";
import { makeMember, type TestMember } from "./harness";
import { loadedPage } from "./render-page";
import { selectionPages, textOf } from "./selection-pages";
import { candidateColumns, verdictProblems } from "./report-walk-checks";

afterAll(() => closeDb());

let m: TestMember;
let v: Viewer;
let project = 0;
beforeAll(async () => {
  m = await makeMember("admin");
  v = await viewerOfUser(m.userId);
  project = await createProject(v, { name: "Verdict flips", site: "", description: "" });
});

type Read = { html: string; text: string; motorNote: string | null; npshNote: string | null; motorCheck: string; npshCell: string; reportVerdict: string; systemVerdict: string; problems: string[] };
/** The system with the candidate, its selection's report as the member reads it, and the system page's verdict cell. */
async function reportOf(name: string, input: SystemInput, setId: number, adj: Adjustment): Promise<Read> {
  const systemId = await createSystem(v, project, name, input);
  const added = await addCandidate(v, systemId, setId, adj);
  if (!added.ok) throw new Error(added.reason);
  const id = await selectCandidate(v, added.id, name, "");
  const { html, text } = await selectionPages(m, id);
  const system = (await loadedPage(m, sysPage, "/systems/:id", `/systems/${systemId}`, { id: String(systemId) })).html;
  const span = (t: string) => {
    const s = new RegExp(`data-testid="report-verdict-${t}"[^>]*>([\\s\\S]*?)</span>`).exec(html);
    return s ? textOf(s[1]).replace(/^— /, "") : null;
  };
  const report = candidateColumns(html)[0];
  return {
    html, text, motorNote: span("motor"), npshNote: span("npsh"),
    motorCheck: textOf(/data-testid="motor-check-\d+"[^>]*>([\s\S]*?)<\/div>/.exec(html)?.[1] ?? ""),
    npshCell: report.get("NPSH margin over the band") ?? "", reportVerdict: report.get("Verdict") ?? "", systemVerdict: candidateColumns(system)[0].get("Verdict") ?? "",
    problems: verdictProblems(html),
  };
}

describe("the motor verdict flips at rating × service factor", () => {
  const SYSTEM: SystemInput = { ...defaultSystemInput(), staticLow: 19, staticHigh: 20, duty: { flow: 30 * M3H, head: 20.5 } };
  let setId = 0;
  let maxPower = 0;
  let atDuty = 0;
  beforeAll(async () => {
    const lib = await createLibrary(v, { name: "Motor flips", description: "" });
    await importCsvText(v, lib, ["model,type,size,speed_rpm,impeller_mm,flow_m3h,head_m,power_kw", ...[0, 10, 20, 30, 40].map((q) => `Flip 40,end-suction,DN50,2900,200,${q},${30 - 0.008 * q * q},${2 + 0.05 * q}`)].join("\n"), "flip.csv");
    setId = (await listModels(v, lib))[0].curves[0].id;
    // The thresholds as the workbench computes them (suggested motor): the largest power on the curve and one pump's at the operating point.
    const probe = await createSystem(v, project, "Motor probe", SYSTEM);
    await addCandidate(v, probe, setId, DEFAULT_ADJUSTMENT);
    const f = (await systemWorkbench(v, probe)).candidates[0].result!.figures!;
    maxPower = f.maxPower!;
    atDuty = f.motorLoadAtDuty! * f.motor!.rating!;
    expect(maxPower).toBeGreaterThan(atDuty * 1.01); // control: the two thresholds lie apart (3.99 kW and about 3.68 kW, probe-pump.ts)
  }, 60_000);

  test("just above the largest power on the curve: non-overloading, nothing on the verdict's line; just below: 'can overload' on it", async () => {
    const inside = await reportOf("Motor at max +1e-6", SYSTEM, setId, { ...DEFAULT_ADJUSTMENT, motorRating: maxPower * (1 + 1e-6) });
    const outside = await reportOf("Motor at max −1e-6", SYSTEM, setId, { ...DEFAULT_ADJUSTMENT, motorRating: maxPower * (1 - 1e-6) });
    expect(inside.motorNote).toBeNull();
    expect(inside.motorCheck).toMatch(/^non-overloading: largest power on the curve 3\.99\d* kW at 40\.0 m³\/h is within motor rating × service factor 3\.99\d* kW$/);
    expect(outside.motorNote).toMatch(/^but the motor can overload: largest power on the curve 3\.99\d* kW at 40\.0 m³\/h exceeds motor rating × service factor 3\.99\d* kW$/);
    expect(outside.motorCheck).toMatch(/^can overload: /);
    for (const r of [inside, outside]) {
      expect(r.html).toMatch(/data-testid="report-verdict" data-status="meets"/); // the duty verdict itself does not read the motor
      expect(r.problems).toEqual([]);
      expect(r.reportVerdict).toBe(r.systemVerdict);
    }
  });

  test("just above one pump's shaft power at the operating point: only 'can overload'; just below: 'overloaded at the operating point' with both figures", async () => {
    const inside = await reportOf("Motor at duty +1e-6", SYSTEM, setId, { ...DEFAULT_ADJUSTMENT, motorRating: atDuty * (1 + 1e-6) });
    const outside = await reportOf("Motor at duty −1e-6", SYSTEM, setId, { ...DEFAULT_ADJUSTMENT, motorRating: atDuty * (1 - 1e-6) });
    expect(inside.motorNote).toMatch(/^but the motor can overload: /);
    const over = /^but the motor is overloaded at the operating point: one pump takes ([\d.]+) kW, above motor rating × service factor ([\d.]+) kW$/.exec(outside.motorNote ?? "");
    expect(over, outside.motorNote ?? "no motor note").toBeTruthy();
    expect(Number(over![1])).toBeGreaterThan(Number(over![2])); // the power is written apart from its limit (fmtQExact), a part in 10⁶ above it
    expect(outside.html).toMatch(/data-testid="report-verdict" data-status="meets" [^>]*data-motor="against"/);
    for (const r of [inside, outside]) {
      expect(r.problems).toEqual([]);
      expect(r.reportVerdict).toBe(r.systemVerdict);
    }
  });
});

describe("the NPSH verdict flips at the wanted ratio and at 1", () => {
  const booster = (): SystemInput => ({ ...defaultSystemInput(), staticLow: 35, staticHigh: 37, duty: { flow: 40 * M3H, head: 40 } });
  let setId = 0;
  let lowest = 0;
  let shiftToOne = 0; // m of NPSHa to add everywhere so that the lowest NPSHa / NPSHr is exactly 1 (negative: take away)
  let required = 0;
  let density = 0;
  beforeAll(async () => {
    const lib = await demoLibrary(v, "NPSH flips");
    setId = (await listModels(v, lib)).find((x) => x.name === "TFS Meregate 80")!.curves.find((c) => c.speed === 2900 && c.impellerDiameter != null && Math.abs(c.impellerDiameter - 0.195) < 1e-9)!.id;
    const probe = await createSystem(v, project, "NPSH probe", booster());
    await addCandidate(v, probe, setId, DEFAULT_ADJUSTMENT);
    const bench = await systemWorkbench(v, probe);
    const n = bench.candidates[0].result!.npsh!;
    expect(n.status).toBe("ok"); // control: NPSHr published at every judged point
    lowest = n.marginRatio!;
    // NPSHa moves alike at every point with the suction surface pressure (Δp / ρg): the first point to reach NPSHa = NPSHr is the one least above it.
    const gaps = n.judgedAt!.map((p) => p.required! - p.available!);
    shiftToOne = Math.max(...gaps);
    required = n.judgedAt![gaps.indexOf(shiftToOne)].required!;
    density = bench.evaluation!.fluid.density;
  }, 60_000);

  test("the wanted ratio a part in 10⁶ below the lowest ratio judged: ok; above it: low margin, on the verdict's line with both ratios", async () => {
    const inside = await reportOf("NPSH wanted −1e-6", { ...booster(), npshMargin: lowest * (1 - 1e-6) }, setId, DEFAULT_ADJUSTMENT);
    const outside = await reportOf("NPSH wanted +1e-6", { ...booster(), npshMargin: lowest * (1 + 1e-6) }, setId, DEFAULT_ADJUSTMENT);
    expect(inside.npshNote).toBeNull();
    expect(inside.npshCell).toMatch(/\(ok: at least the wanted [\d.]+\)/);
    expect(outside.npshNote).toMatch(/^but NPSHa \/ NPSHr ([\d.]+) at [^(]+ \(NPSHa [\d.]+ m \/ NPSHr [\d.]+ m\), below the wanted ([\d.]+): low NPSH margin$/);
    expect(outside.npshCell).toMatch(/\(low-margin: below the wanted [\d.]+\)/);
    expect(outside.html).toMatch(/data-testid="report-verdict" data-status="meets" data-npsh="against"/);
    for (const r of [inside, outside]) {
      expect(r.problems).toEqual([]);
      expect(r.reportVerdict).toBe(r.systemVerdict);
    }
  });

  test("NPSHa a part in 10⁶ of NPSHr above NPSHr at the deciding point: low margin; below it: cavitation risk, with NPSHa and NPSHr", async () => {
    const at = (eps: number) => ({ ...booster(), npshMargin: 1.5, suctionSurfacePressure: booster().suctionSurfacePressure + (shiftToOne + eps * required) * density * G0 });
    const inside = await reportOf("NPSH at 1 +1e-6", at(1e-6), setId, DEFAULT_ADJUSTMENT);
    const outside = await reportOf("NPSH at 1 −1e-6", at(-1e-6), setId, DEFAULT_ADJUSTMENT);
    expect(inside.npshNote).toMatch(/^but NPSHa \/ NPSHr 1\.\d+ at .*below the wanted 1\.5: low NPSH margin$/);
    expect(inside.npshCell).toMatch(/\(low-margin: below the wanted 1\.5\)/);
    const risk = /^but NPSHa ([\d.]+) m below NPSHr ([\d.]+) m at [^(]+ \(NPSHa \/ NPSHr 0\.\d+, below 1\): cavitation risk$/.exec(outside.npshNote ?? "");
    expect(risk, outside.npshNote ?? "no NPSH note").toBeTruthy();
    expect(Number(risk![1])).toBeLessThan(Number(risk![2])); // NPSHa written apart from NPSHr (fmtQExact), never as it
    expect(outside.npshCell).toMatch(/\(cavitation-risk: below 1\)/);
    for (const r of [inside, outside]) {
      expect(r.problems).toEqual([]);
      expect(r.reportVerdict).toBe(r.systemVerdict);
    }
  });
});
