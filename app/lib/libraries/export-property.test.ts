// Property: our library CSV export (csv-export.ts) read by the importer and exported again gives the very same
// text, for every curve set of the demo data (app/test/demo-curves.ts, and each fixture file the importer reads:
// fixtures/demo in every variant, fixtures/csv), with and without speeds and impeller diameters, libraries mixing
// both. Pure: the database round trip is export-roundtrip.test.ts. All data invented.
import { readFileSync, readdirSync } from "node:fs";
import { describe, expect, test } from "vitest";
import { analyseCsv, decodeBytes, type CurveSet } from "~/lib/import";
import { curvesToCsv } from "./csv-export";
import type { LibraryCurveSet } from "./libraries.server";
import { demoCurves } from "~/test/demo-curves";
import { generateDemo } from "../../../fixtures/demo/generate";
import { prng } from "../../../fixtures/prng";

type Mode = "as stored" | "no diameter" | "no speed" | "neither";
const MODES: Mode[] = ["as stored", "no diameter", "no speed", "neither"];

const M3H = 1 / 3600;
const asLibrarySet = (c: Omit<LibraryCurveSet, "id" | "modelId" | "impellerMin" | "impellerMax" | "ratedSpeed" | "minFlow"> & { minFlow?: number | null }): LibraryCurveSet =>
  ({ id: 0, modelId: 0, impellerMin: null, impellerMax: null, ratedSpeed: null, minFlow: null, ...c });
const fromImport = (c: CurveSet) =>
  asLibrarySet({
    model: c.model, type: c.type ?? "", nominalSize: c.size ?? "", speed: c.speed, impellerDiameter: c.impellerDiameter, minFlow: c.minFlow ?? null,
    points: c.points.map((p) => ({ flow: p.flow, head: p.head, efficiency: p.efficiency ?? null, power: p.power ?? null, npshr: p.npshr ?? null })),
  });

/** The curve sets of each source: the generated demo curves, and the sets the importer takes from each fixture file. */
function sources(): Array<{ name: string; sets: LibraryCurveSet[] }> {
  const out = [{
    name: "app/test/demo-curves.ts",
    sets: demoCurves.map((c) => asLibrarySet({
      model: c.model, type: c.type, nominalSize: c.size, speed: c.speed, impellerDiameter: c.impellerMm / 1000,
      points: c.points.map((p) => ({ flow: p.flowM3h * M3H, head: p.headM, efficiency: p.effPct / 100, power: p.powerKw * 1000, npshr: p.npshrM })),
    })),
  }];
  for (const d of generateDemo()) for (const f of d.files) out.push({ name: `fixtures/demo/${f.name}`, sets: analyseCsv(f.text).result.curveSets.filter((c) => c.ok).map(fromImport) });
  const dir = new URL("../../../fixtures/csv/", import.meta.url);
  for (const name of readdirSync(dir).filter((n) => n.endsWith(".csv")).sort()) {
    const text = decodeBytes(new Uint8Array(readFileSync(new URL(name, dir)))).text;
    out.push({ name: `fixtures/csv/${name}`, sets: analyseCsv(text).result.curveSets.filter((c) => c.ok).map(fromImport) });
  }
  return out;
}

/** Each model's sets with their keys dropped as its mode says (one set per remaining key: the first). */
function library(sets: LibraryCurveSet[], modeOf: (model: string) => Mode): LibraryCurveSet[] {
  const seen = new Set<string>();
  const out: LibraryCurveSet[] = [];
  for (const c of sets) {
    const mode = modeOf(c.model);
    const speed = mode === "no speed" || mode === "neither" ? null : c.speed;
    const impellerDiameter = mode === "no diameter" || mode === "neither" ? null : c.impellerDiameter;
    const key = JSON.stringify([c.model, speed, impellerDiameter]);
    if (seen.has(key)) continue;
    seen.add(key);
    out.push({ ...c, speed, impellerDiameter });
  }
  return out;
}

/** libraryCurves' order (libraries.server.ts: model, speed with none first, diameter largest first with none last). */
const stored = (sets: LibraryCurveSet[]) =>
  [...sets].sort((a, b) => (a.model < b.model ? -1 : a.model > b.model ? 1 : 0) || (a.speed ?? -1) - (b.speed ?? -1) || (b.impellerDiameter ?? -1) - (a.impellerDiameter ?? -1));

function shuffled(sets: LibraryCurveSet[], seed: number): LibraryCurveSet[] {
  const r = prng(seed);
  const out = [...sets];
  for (let i = out.length - 1; i > 0; i--) {
    const j = Math.floor(r() * (i + 1));
    [out[i], out[j]] = [out[j], out[i]];
  }
  return out;
}

/** Export, import, export: the same text; the importer takes every set, with no error, as written. */
function expectRoundTrip(sets: LibraryCurveSet[]) {
  const csv = curvesToCsv(sets);
  const a = analyseCsv(csv).result;
  expect(a.problems.filter((p) => p.severity === "error")).toEqual([]); // source: construction (our own export of sets the importer took)
  expect(a.curveSets.map((c) => [c.model, c.speed, c.impellerDiameter == null, c.ok])).toEqual(sets.map((c) => [c.model, c.speed, c.impellerDiameter == null, true])); // source: construction
  expect(curvesToCsv(a.curveSets.map(fromImport))).toBe(csv); // source: construction (same sets, same printed digits)
}

describe("library CSV export → import → export is byte-identical", () => {
  const all = sources();

  test("every source but one holds curve sets the importer takes (the sweep covers them)", () => {
    // source: vendor-cases.test.ts (blank-speed.csv's one curve is refused for its blank speed cell)
    expect(all.filter((s) => s.sets.length === 0).map((s) => s.name)).toEqual(["fixtures/csv/blank-speed.csv"]);
    expect(all.find((s) => s.name === "app/test/demo-curves.ts")!.sets.length).toBe(demoCurves.length); // source: construction
  });

  for (const s of all.filter((s) => s.sets.length > 0)) {
    test(`${s.name}: each model with, without diameter, without speed, without both, mixed in one library`, () => {
      const models = [...new Set(s.sets.map((c) => c.model))];
      for (let turn = 0; turn < MODES.length; turn++) {
        // every model takes every mode over the four turns; a library of several models mixes them
        const modeOf = (m: string) => MODES[(models.indexOf(m) + turn) % MODES.length];
        const lib = library(s.sets, modeOf);
        expectRoundTrip(stored(lib));
        expectRoundTrip(shuffled(lib, 20261203 + turn)); // any order of whole sets (seeded, fixtures/prng.ts)
      }
    });
  }
});
