// What a selection's report says beside its figures — the result's warnings, the ratio note, the duty check, the system's
// and each run's warnings, a traced curve's source and caution, the liquid's methods — is carried by its CSV too, and the
// report's "Methods and assumptions" follow the liquid and the ANSI/HI 9.6.7 status frozen with the result (it used to
// say "Water properties: IAPWS…" for any liquid and nothing of the viscosity correction). Real route modules and MariaDB.
// Liquids invented: an oil of 900 kg/m³ at 0.09 Pa·s is 100 cSt (ν = μ/ρ, definition), at 20 Pa·s 22 222 cSt. Pumps: the
// Tallowmere demo curves and a traced low-head pump (invented). Expected texts come from the frozen document (rendered in SI,
// as the CSV is) and from the tracer's own constant, so what is checked is that each reaches the report and the CSV.
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { libraryRevisions, selections } from "@db/schema";
import { analyseStored, createLibrary, getUpload, importUpload, listModels, type Viewer } from "~/lib/libraries";
import { addCandidate, createProject, createSystem, getSelection, searchForSystem, selectCandidate } from "~/lib/projects";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, type Adjustment, type SystemInput } from "~/lib/projects/hydraulics";
import type { FrozenSelection } from "~/lib/projects/stored-selection";
import { boosterInput, demoLibrary, importCsvText, viewerOfUser } from "~/lib/projects/test-kit";
import { storePicture, storeTracedCsv } from "~/lib/tracer/pictures.server";
import { TRACE_CAUTION, tracedOrigin } from "~/lib/tracer/sniff";
import { chartPdf } from "~/lib/tracer/test-chart";
import { renderDeep, SI_UNITS } from "~/lib/shared/units";
import { makeMember, type TestMember } from "./harness";
import { csvFigures, figureCell, selectionPages, textOf } from "./selection-pages";
import { LOWHEAD_CSV } from "./lowhead-pump";

afterAll(() => closeDb());

let m: TestMember;
let v: Viewer;
let project = 0;
let curveSetId = 0;
const oil = (mu: number): SystemInput => ({ ...boosterInput(), fluid: { kind: "custom", name: "Test oil", density: 900, dynamicViscosity: mu, vaporPressure: 100 } });

beforeAll(async () => {
  m = await makeMember("admin");
  v = await viewerOfUser(m.userId);
  await demoLibrary(v, "Caution pumps");
  project = await createProject(v, { name: "Cautions", site: "", description: "" });
  curveSetId = (await searchForSystem(v, await createSystem(v, project, "Donor", boosterInput()))).results[0].curveSetId;
});

/** A selection of the Tallowmere pump the booster search ranks first, on `input` with `adj`: its id and frozen document in SI. */
async function select(name: string, input: SystemInput, adj: Adjustment = DEFAULT_ADJUSTMENT, setId = curveSetId) {
  const systemId = await createSystem(v, project, name, input);
  const added = await addCandidate(v, systemId, setId, adj);
  if (!added.ok) throw new Error(added.reason);
  const id = await selectCandidate(v, added.id, name, "");
  return { id, f: renderDeep((await getSelection(v, id)).frozen, SI_UNITS) as FrozenSelection };
}
const methods = (html: string) => textOf(/<h2[^>]*>Methods and assumptions<\/h2>([\s\S]*?)<\/section>/.exec(html)?.[1] ?? "");

describe("the CSV carries every caution the report shows (a trimmed pump on a 100 cSt oil)", () => {
  test("warning_N, ratio_note, duty_check, system_warning_N and run_warning_N, each as the report shows it", async () => {
    const { id, f } = await select("Oil, trimmed", oil(0.09), { ...DEFAULT_ADJUSTMENT, method: "trim" });
    const pages = await selectionPages(m, id);
    const warnings = f.result.warnings;
    expect(warnings.length).toBeGreaterThanOrEqual(5); // control: trim approximation, the ANSI/HI 9.6.7 correction and its power, POR…
    expect(warnings.some((w) => /ANSI\/HI 9\.6\.7 parameter B = [\d.]+ .*C_Q/.test(w))).toBe(true);
    const notes = figureCell(pages.html, "Notes");
    for (const w of warnings) expect(notes).toContain(textOf(w)); // control: the report shows them
    const rows = csvFigures(pages.csv);
    warnings.forEach((w, i) => expect(rows.get(`warning_${i + 1}`)?.[0], `warning_${i + 1}`).toBe(w));
    expect(rows.has(`warning_${warnings.length + 1}`)).toBe(false);
    expect(f.result.ratioNote).toBeTruthy();
    expect(rows.get("ratio_note")?.[0]).toBe(f.result.ratioNote);
    const dc = f.systemCurve!.dutyCheck!;
    expect(pages.text).toContain(textOf(`${dc.message} ${dc.governs}`)); // control
    expect(rows.get("duty_check")?.[0]).toBe(`${dc.message} ${dc.governs}`);
    const sys = f.systemCurve!.warnings;
    expect(sys.length).toBeGreaterThan(0); // control: Re in the transition on this oil
    sys.forEach((w, i) => expect(rows.get(`system_warning_${i + 1}`)?.[0]).toBe(w));
    for (const w of sys) expect(pages.text).toContain(textOf(w)); // the report shows them too (it did not)
    const runs = f.systemCurve!.runs.flatMap((r) => r.warnings);
    expect(runs.length).toBeGreaterThan(0); // control: laminar runs with catalogue fittings
    runs.forEach((w, i) => expect(rows.get(`run_warning_${i + 1}`)?.[0]).toBe(w));
    const visc = (f.result as { viscosity: { b: number; factors: { flow: number; head: number; efficiency: number } } }).viscosity;
    expect(rows.get("viscosity_status")?.[0]).toBe("corrected");
    expect(Number(rows.get("viscosity_b")?.[0])).toBeCloseTo(visc.b, 6);
    expect(Number(rows.get("viscosity_c_eta")?.[0])).toBeCloseTo(visc.factors.efficiency, 6);
  });
});

describe("Methods and assumptions follow the liquid and the ANSI/HI 9.6.7 status", () => {
  test("water: IAPWS, no viscosity line (as before)", async () => {
    const { id } = await select("Water", boosterInput());
    const t = methods((await selectionPages(m, id)).html);
    expect(t).toContain("Water properties: IAPWS-IF97 (density, saturation pressure) and IAPWS R12-08 (viscosity)");
    expect(t).not.toMatch(/ANSI\/HI 9\.6\.7|Liquid properties/);
  });
  test("a custom liquid corrected: its properties as entered, B and the factors applied; never IAPWS", async () => {
    const { id, f } = await select("Oil 100 cSt", oil(0.09));
    const visc = (f.result as { viscosity: { status: string; b: number; factors: { flow: number; head: number; efficiency: number } } }).viscosity;
    expect(visc.status).toBe("corrected"); // control
    const t = methods((await selectionPages(m, id)).html);
    expect(t).not.toContain("IAPWS");
    expect(t).toContain("Liquid properties: Test oil as entered");
    expect(t).toContain(`Pump curve corrected for viscosity per ANSI/HI 9.6.7: B = ${visc.b.toFixed(2)}`);
    expect(t).toContain(`C_Q ${visc.factors.flow.toFixed(3)}, C_H at the BEP ${visc.factors.head.toFixed(3)}, C_η ${visc.factors.efficiency.toFixed(3)}`);
  });
  test("B above 40: outside the method, the curve not corrected", async () => {
    const { id, f } = await select("Oil 22 000 cSt", oil(20));
    const visc = (f.result as { viscosity: { status: string; b: number } }).viscosity;
    expect(visc.status).toBe("outside-method"); // control
    const t = methods((await selectionPages(m, id)).html);
    expect(t).toContain(`ANSI/HI 9.6.7 parameter B = ${visc.b.toFixed(2)}: above 40, outside the method's range; the curve is not corrected`);
  });
  test("B at or below 1: no correction needed, the water curve as published", async () => {
    const { id, f } = await select("Light liquid", oil(0.0012));
    const visc = (f.result as { viscosity: { status: string; b: number } }).viscosity;
    expect(visc.status).toBe("no-correction"); // control
    const t = methods((await selectionPages(m, id)).html);
    expect(t).toContain(`ANSI/HI 9.6.7 parameter B = ${visc.b.toFixed(2)}: at or below 1, no correction needed`);
    expect(t).not.toContain("IAPWS");
  });
  test("a custom liquid frozen before result.viscosity existed: says nothing was recorded, still reads", async () => {
    const { id } = await select("Old oil", oil(0.09));
    const [row] = await db().select().from(selections).where(eq(selections.id, id));
    const doc = JSON.parse(row.frozenJson);
    delete doc.result.viscosity;
    await db().update(selections).set({ frozenJson: JSON.stringify(doc) }).where(eq(selections.id, id));
    const t = methods((await selectionPages(m, id)).html);
    expect(t).toContain("no ANSI/HI 9.6.7 viscosity check was recorded with this selection");
  });
});

describe("a traced curve's source and caution are frozen with the selection and shown", () => {
  const CSV = LOWHEAD_CSV; // app/test/lowhead-pump.ts (invented)
  const lowHead: SystemInput = { ...defaultSystemInput(), staticLow: 2, staticHigh: 2 };

  test("report (curve data and methods) and CSV (caution line and figures) name the source and the caution; an untraced one says none", async () => {
    const traced = await createLibrary(v, { name: "Traced pumps", description: "" });
    const pic = await storePicture(v, traced, new File([chartPdf()], "datasheet.pdf"));
    const up = await storeTracedCsv(v, traced, pic, CSV, 3);
    const { text, lib } = await getUpload(v, traced, up);
    const { revisionId } = await importUpload(v, traced, up, analyseStored(text, lib).mapping, "checked by hand");
    const setId = (await listModels(v, traced))[0].curves[0].id;
    const { id, f } = await select("Traced", lowHead, DEFAULT_ADJUSTMENT, setId);
    expect(f.pump.library.traced).toEqual({ source: "traced from datasheet.pdf, page 3", caution: TRACE_CAUTION });
    const pages = await selectionPages(m, id);
    const curveData = textOf(/<dt[^>]*>Curve data<\/dt><dd[^>]*>([\s\S]*?)<\/dd>/.exec(pages.html)?.[1] ?? "");
    expect(curveData).toContain(`traced from datasheet.pdf, page 3. ${TRACE_CAUTION}`);
    expect(methods(pages.html)).toContain("traced from datasheet.pdf, page 3");
    expect(pages.csv[2]).toEqual([`# Curve data traced from datasheet.pdf, page 3: ${TRACE_CAUTION}`]);
    expect(csvFigures(pages.csv).get("curve_data_source")?.[0]).toBe(`traced from datasheet.pdf, page 3. ${TRACE_CAUTION}`);

    // The revision no longer linked to its upload: its note still says where the curves came from.
    await db().update(libraryRevisions).set({ uploadId: null }).where(eq(libraryRevisions.id, revisionId));
    expect((await select("Traced, upload unlinked", lowHead, DEFAULT_ADJUSTMENT, setId)).f.pump.library.traced).toEqual({ source: "traced from datasheet.pdf, page 3", caution: TRACE_CAUTION });

    const plain = await createLibrary(v, { name: "Published pumps", description: "" });
    await importCsvText(v, plain, CSV, "lowhead.csv", "from the maker");
    const other = await select("Published", lowHead, DEFAULT_ADJUSTMENT, (await listModels(v, plain))[0].curves[0].id);
    expect(other.f.pump.library.traced).toBeNull(); // known not traced (absent: frozen before this was recorded)
    const otherPages = await selectionPages(m, other.id);
    expect(otherPages.text).not.toContain(TRACE_CAUTION);
    expect(otherPages.csv.filter((l) => String(l[0]).startsWith("# Curve data"))).toEqual([]); // no caution line for an untraced curve
    expect(csvFigures(otherPages.csv).get("curve_data_source")?.[0]).toBe("as imported (not traced)");
  });
});

describe("tracedOrigin (the revision's upload decides while linked, else its note as importUpload writes it)", () => {
  const note = `traced from scan.png. ${TRACE_CAUTION} checked`;
  test("a linked upload with a source is traced; one without is not, whatever its note says", () => {
    expect(tracedOrigin("anything", { source: "traced from scan.png" })).toEqual({ source: "traced from scan.png", caution: TRACE_CAUTION });
    expect(tracedOrigin(`copied: ". ${TRACE_CAUTION}"`, { source: null })).toBeNull();
  });
  test("no upload linked: the note's source before the caution, or null without the caution", () => {
    expect(tracedOrigin(note, null)).toEqual({ source: "traced from scan.png", caution: TRACE_CAUTION });
    expect(tracedOrigin("from the maker", null)).toBeNull();
    expect(tracedOrigin(`. ${TRACE_CAUTION}`, null)).toBeNull(); // no source before it
  });
});
