// The generated demo libraries (fixtures/demo/, all invented) through the import core.
// Sources of the expected values:
// - "generator": fixtures/demo/generate.ts (its curves, printed decimals, and the faults it wrote);
// - unit factors: 1 h = 3600 s; 1 US gal = 3.785411784 L, 1 ft = 0.3048 m, 1 in = 0.0254 m,
//   1 hp = 550 ft·lbf/s = 745.69987158227022 W (NIST SP 811, Appendix B) — written out here, not
//   taken from the importer's own table;
// - physics: P = ρ g Q H / η with ρ = 998.2 kg/m³ (water, 20 °C), g = 9.80665 m/s²; affinity laws.
// Tolerances: a printed value differs from the true one by at most half a unit of its last printed
// digit, so two prints of one value differ by at most the sum of both half-units (times the exact
// unit factor of each), plus 1e-9 relative for binary floating point.
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { DECIMALS, G, RHO, curveKeyMm, generateDemo, type DemoCurve, type DemoDistributor } from "../../../fixtures/demo/generate";
import { demoLibraries } from "../../../fixtures/demo";
import { DEMO_WORKSPACES } from "../../cli/seed";
import { analyseCsv, type CurveSet } from "./index";

const M3H = 1 / 3600; // m³/s per m³/h (definition of the hour)
const GPM = 3.785411784e-3 / 60; // m³/s per US gpm (NIST SP 811)
const FT = 0.3048; // m (NIST SP 811)
const IN = 0.0254; // m (NIST SP 811)
const HP = 550 * 0.3048 * 4.4482216152605; // W (NIST SP 811: ft·lbf/s × 550)

const demo = generateDemo();
const fileText = (name: string) => readFileSync(new URL(`../../../fixtures/demo/${name}`, import.meta.url), "utf8");
const half = (decimals: number, factor: number) => 0.5 * 10 ** -decimals * factor;
const near = (a: number, b: number, tol: number) => Math.abs(a - b) <= tol + 1e-9 * Math.max(Math.abs(a), Math.abs(b)) + 1e-15;

type Printed = { flow: [number, number]; head: [number, number]; efficiency: [number, number]; power: [number, number]; npshr: [number, number]; impeller: [number, number] };
/** [decimals, SI factor] of each printed quantity, per file style (generator DECIMALS; factors above). */
const SI_PRINT: Printed = {
  flow: [DECIMALS.si.flow, M3H], head: [DECIMALS.si.head, 1], efficiency: [DECIMALS.si.efficiency, 0.01],
  power: [DECIMALS.si.power, 1000], npshr: [DECIMALS.si.npshr, 1], impeller: [DECIMALS.si.impeller, 1e-3],
};
const US_PRINT: Printed = {
  flow: [DECIMALS.us.flow, GPM], head: [DECIMALS.us.head, FT], efficiency: [DECIMALS.us.efficiency, 0.01],
  power: [DECIMALS.us.power, HP], npshr: [DECIMALS.us.npshr, FT], impeller: [DECIMALS.us.impeller, IN],
};
const FIELDS = ["flow", "head", "efficiency", "power", "npshr"] as const;

/** The generator's exact curve in SI. */
function exactSI(c: DemoCurve) {
  return c.points.map((p) => ({ flow: p.flowM3h * M3H, head: p.headM, efficiency: p.effPct / 100, power: p.powerKw * 1000, npshr: p.npshrM }));
}

/** Asserts that `got` (read from a file printed as `gotPrint`) matches `want` (printed as `wantPrint`, or exact when null). */
function expectSameCurve(got: CurveSet, want: { impeller: number; points: Partial<Record<(typeof FIELDS)[number], number>>[] }, gotPrint: Printed, wantPrint: Printed | null, label: string) {
  const tol = (f: keyof Printed) => half(...gotPrint[f]) + (wantPrint ? half(...wantPrint[f]) : 0);
  expect(near(got.impellerDiameter!, want.impeller, tol("impeller")), `${label} impeller ${got.impellerDiameter} vs ${want.impeller}`).toBe(true);
  expect(got.points.length, `${label} point count`).toBe(want.points.length);
  got.points.forEach((p, i) => {
    for (const f of FIELDS) {
      const a = p[f];
      const b = want.points[i][f];
      expect(a !== undefined && b !== undefined && near(a, b, tol(f)), `${label} point ${i} ${f}: ${a} vs ${b}`).toBe(true);
    }
  });
}

describe("generator and committed files", () => {
  it("the committed CSV files are exactly what generate.ts writes (regenerate with npx tsx fixtures/demo/generate.ts)", () => {
    for (const d of demo) for (const f of d.files) expect(fileText(f.name), f.name).toBe(f.text); // source: generator
  });

  it("is deterministic and depends on the seed", () => {
    const again = generateDemo();
    expect(again.map((d) => d.files.map((f) => f.text))).toEqual(demo.map((d) => d.files.map((f) => f.text))); // source: generator contract (fixed seed)
    expect(generateDemo(7)[0].files[0].text).not.toBe(demo[0].files[0].text); // source: another seed draws other pumps
  });

  it("demoLibraries() gives three invented distributors, the demo distributor workspace first, one clean file each", () => {
    const libs = demoLibraries();
    expect(libs.map((l) => l.distributor)).toEqual(["Harrow & Vell Pumps", "Nordquay Hydraulics", "Tallowmere Fluid Systems"]); // source: brief (hand-written)
    expect(DEMO_WORKSPACES.map((w) => w.name)).toContain(libs[0].distributor); // source: app/cli/seed.ts demo distributor workspace
    for (const l of libs) {
      expect(l.files.filter((f) => !f.variantOf).map((f) => f.name), l.distributor).toHaveLength(1); // source: generator (one clean file)
      const clean = l.files.find((f) => !f.variantOf)!;
      expect(l.files.filter((f) => f.variantOf).every((f) => f.variantOf === clean.name)).toBe(true); // source: generator
      expect(l.files).toHaveLength(5); // source: generator (clean + 4 messy variants)
    }
    const total = libs.reduce((n, l) => n + l.files.reduce((s, f) => s + f.text.length, 0), 0);
    expect(total).toBeLessThan(600_000); // source: brief ("a few hundred KB total at most")
  });
});

describe.each(demo.map((d) => [d.distributor, d] as [string, DemoDistributor]))("%s", (_name, d) => {
  const clean = d.files.find((f) => f.variant === "clean")!;
  const a = analyseCsv(clean.text);
  const sets = a.result.curveSets;

  it("clean file: no problems, the generator's curves in order, values within print rounding", () => {
    expect(a.result.problems).toEqual([]); // source: generator writes only sound curves
    expect(a.mapping).toEqual(a.suggestedMapping); // the documented format needs no mapping changes
    expect(sets.map((c) => c.key)).toEqual(d.curves.map(curveKeyMm)); // source: generator (model|rpm|mm)
    sets.forEach((s, i) => {
      const c = d.curves[i];
      expect([s.type, s.size, s.speed]).toEqual([c.type, c.size, c.speed]); // source: generator
      expectSameCurve(s, { impeller: c.impellerMm / 1000, points: exactSI(c) }, SI_PRINT, null, s.key);
    });
  });

  it("clean file: ~40 models in all, 2900/1450 rpm, 2–3 diameters per model and speed, 8–12 points", () => {
    const models = new Set(sets.map((s) => s.model));
    expect(models.size).toBeGreaterThanOrEqual(13); // source: generator (13–14 models per distributor, 40 in all)
    expect(new Set(sets.map((s) => s.speed))).toEqual(new Set([2900, 1450])); // source: brief (2- and 4-pole)
    const perModelSpeed = new Map<string, number>();
    for (const s of sets) perModelSpeed.set(`${s.model}|${s.speed}`, (perModelSpeed.get(`${s.model}|${s.speed}`) ?? 0) + 1);
    for (const [k, n] of perModelSpeed) expect(n >= 2 && n <= 3, `${k}: ${n} diameters`).toBe(true); // source: brief
    for (const s of sets) expect(s.points.length >= 8 && s.points.length <= 12, s.key).toBe(true); // source: brief
    expect(new Set(sets.map((s) => s.type))).toEqual(new Set(["end-suction", "inline", "multistage"])); // source: brief
  });

  it("clean file: physically consistent (P = ρgQH/η, falling head, rising power and NPSHr, BEP η 60–85 %)", () => {
    for (const s of sets) {
      const pts = s.points;
      for (let i = 1; i < pts.length; i++) {
        const [p, q] = [pts[i - 1], pts[i]];
        // source: brief (falling head, rising power and NPSHr); at 2 printed decimals two neighbours of a flat
        // stretch (near shutoff, at 1450 rpm) may print equal, so head and NPSHr are compared with ≤ / ≥ here
        // and strictly over the whole curve below
        expect(q.head <= p.head && q.power! > p.power! && q.npshr! >= p.npshr!, `${s.key} point ${i}`).toBe(true);
        // ρ g Q H / η from the printed Q, H, η; relative rounding bound = sum of relative half-units
        const hydraulic = (RHO * G * q.flow * q.head) / q.efficiency!;
        const rel = half(...SI_PRINT.flow) / q.flow + half(...SI_PRINT.head) / q.head + half(...SI_PRINT.efficiency) / q.efficiency! + half(...SI_PRINT.power) / q.power!;
        expect(Math.abs(hydraulic - q.power!) <= rel * q.power! * 1.01, `${s.key} point ${i}: ${hydraulic} W vs ${q.power} W`).toBe(true);
      }
      expect(pts.at(-1)!.head < pts[0].head && pts.at(-1)!.npshr! > pts[0].npshr!, s.key).toBe(true); // source: brief
      expect(pts[0].flow).toBe(0); // source: brief (curves start at zero flow)
      const best = pts.reduce((m, p) => (p.efficiency! > m.efficiency! ? p : m));
      expect(best.efficiency! >= 0.6 - 0.0005 && best.efficiency! <= 0.85, `${s.key} BEP η ${best.efficiency}`).toBe(true); // source: brief
      const reach = pts.at(-1)!.flow / best.flow; // generator ends at 120–130 % of BEP flow; the best printed point is within one step of the BEP
      expect(reach > 1.05 && reach < 1.6, `${s.key} reach ${reach}`).toBe(true);
    }
  });

  it("clean file: trims and speeds follow the affinity laws (shutoff head ∝ n²·D²)", () => {
    const byModel = new Map<string, CurveSet[]>();
    for (const s of sets) byModel.set(s.model, [...(byModel.get(s.model) ?? []), s]);
    for (const [model, list] of byModel) {
      const ref = list[0]; // generator writes 2900 rpm, full impeller first
      expect([ref.speed, ref.impellerDiameter]).toEqual([2900, Math.max(...list.map((s) => s.impellerDiameter!))]); // source: generator order
      for (const s of list) {
        const ratio = (s.speed! / ref.speed!) ** 2 * (s.impellerDiameter! / ref.impellerDiameter!) ** 2;
        expect(near(s.points[0].head, ref.points[0].head * ratio, 2 * half(...SI_PRINT.head)), `${model} ${s.key}`).toBe(true);
        const qRatio = (s.speed! / ref.speed!) * (s.impellerDiameter! / ref.impellerDiameter!);
        const j = s.points.length - 1; // same grid fraction on every curve of a model (generator)
        expect(near(s.points[j].flow, ref.points[j].flow * qRatio, 2 * half(...SI_PRINT.flow)), `${model} ${s.key} end flow`).toBe(true);
      }
    }
  });

  describe.each([
    ["semicolon", SI_PRINT],
    ["us-units", US_PRINT],
    ["wide", SI_PRINT],
  ] as const)("%s variant", (variant, print) => {
    const f = d.files.find((x) => x.variant === variant)!;
    const m = analyseCsv(f.text); // suggested mapping, no override needed (the wide headers carry "<D>mm")

    it("reads without problems to the clean file's curves, within the rounding of both prints", () => {
      expect(f.variantOf).toBe(clean.name); // source: generator
      expect(m.result.problems).toEqual([]); // source: generator writes the same sound curves
      expect(m.result.curveSets).toHaveLength(sets.length); // source: generator (same curves)
      const used = new Set<CurveSet>();
      for (const s of sets) {
        // match on model and speed, and the diameter within the rounding of both prints
        const tolD = half(...print.impeller) + half(...SI_PRINT.impeller);
        const hit = m.result.curveSets.filter((x) => x.model === s.model && x.speed === s.speed && near(x.impellerDiameter!, s.impellerDiameter!, tolD));
        expect(hit, `${variant}: ${s.key}`).toHaveLength(1);
        used.add(hit[0]);
        expectSameCurve(hit[0], { impeller: s.impellerDiameter!, points: s.points }, print, SI_PRINT, `${variant}: ${s.key}`);
      }
      expect(used.size).toBe(sets.length); // one-to-one
    });

    it("is read with the expected sniff and layout", () => {
      if (variant === "semicolon") {
        expect([m.sniff.delimiter, m.sniff.decimalComma, m.sniff.hadBom, m.sniff.headerLine]).toEqual([";", true, true, 3]); // source: generator (BOM, two title lines)
      } else if (variant === "us-units") {
        expect(m.mapping.columns.filter((c) => c.unit).map((c) => c.unit)).toEqual(["rpm", "in", "gpm", "ft", "%", "hp", "ft"]); // source: generator header
      } else {
        const diameters = new Set(d.curves.map((c) => c.impellerMm));
        expect(m.mapping.layout).toBe("wide");
        expect(m.mapping.columns.filter((c) => c.block)).toHaveLength(5 * diameters.size); // source: generator (5 columns per diameter)
        expect(new Set(m.mapping.columns.filter((c) => c.block).map((c) => c.block!.impeller))).toEqual(diameters);
      }
    });
  });

  describe("broken variant", () => {
    const f = d.files.find((x) => x.variant === "broken")!;
    const b = analyseCsv(f.text);

    it("flags exactly the rows the generator broke (row, column, reason)", () => {
      expect(d.broken).toHaveLength(5); // source: generator (five faults)
      expect(b.result.problems.map((p) => [p.row, p.column, p.code, p.severity, p.curveKey])).toEqual(
        d.broken.map((x) => [x.line, x.column, x.code, "error", x.curve]),
      ); // source: generator's list of faults
      b.result.problems.forEach((p, i) => {
        const x = d.broken[i];
        if (x.code === "too-few-points") expect(p.reason).toContain("2 good point"); // source: generator cut the curve to 2 points
        else expect(p.reason).toContain(x.code === "efficiency-over-100" ? "130" : x.cell.trim()); // source: generator's cell text
      });
    });

    it("keeps every other curve exactly as in the clean file and marks the broken ones bad", () => {
      const bad = new Set(d.broken.map((x) => x.curve));
      expect(b.result.curveSets.filter((c) => !c.ok).map((c) => c.key).sort()).toEqual([...bad].sort()); // source: generator
      const good = b.result.curveSets.filter((c) => c.ok);
      expect(good).toHaveLength(sets.length - bad.size);
      for (const g of good) {
        const want = sets.find((s) => s.key === g.key);
        expect(want, g.key).toBeDefined();
        expect({ ...g, sourceRows: [] }, g.key).toEqual({ ...want!, sourceRows: [] }); // same cell text as the clean file → same numbers
      }
    });
  });
});
