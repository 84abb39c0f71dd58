// What the mapping page shows of an upload: the analysis (sniff, mapping, validation) boiled down
// to a summary a page can carry. Pure (no Node, no database), so it can run in a worker thread
// (upload-analysis.server.ts) — a 200 000-row file takes seconds to analyse.
import * as v from "valibot";
import { analyseCsv, MappingSchema, type AnalyseResult, type Mapping } from "./import";
import { curveLabel } from "../components/library-bits";

export const PROBLEM_ROWS_SHOWN = 300;
export const PREVIEW_CURVES = 12;

/** The upload's bytes as text: UTF-8, or Windows-1252 when they are not valid UTF-8 (as storeUpload accepts them). */
export function decodeUpload(bytes: Uint8Array): string {
  try {
    return new TextDecoder("utf-8", { fatal: true }).decode(bytes);
  } catch {
    return new TextDecoder("windows-1252").decode(bytes);
  }
}

/** The saved mapping of the library when it still fits the file's headers, else null. */
export function savedMappingFits(mappingJson: string | null, headers: string[]): Mapping | null {
  if (!mappingJson) return null;
  try {
    const m = v.parse(MappingSchema, JSON.parse(mappingJson));
    const norm = (h: string | undefined) => (h ?? "").trim().toLowerCase();
    return m.columns.every((c) => norm(headers[c.index]) === norm(c.header)) ? m : null;
  } catch {
    return null;
  }
}

/** The given mapping, else the library's saved one when it fits, else the suggestion. */
export function analyseText(text: string, mappingJson: string | null, mapping?: unknown): AnalyseResult & { mappingSource: "form" | "saved" | "suggested" } {
  if (mapping !== undefined) return { ...analyseCsv(text, mapping), mappingSource: "form" };
  const first = analyseCsv(text);
  const saved = savedMappingFits(mappingJson, first.sniff.headers);
  if (saved) {
    try {
      return { ...analyseCsv(text, saved), mappingSource: "saved" };
    } catch {
      /* fall through to the suggestion */
    }
  }
  return { ...first, mappingSource: "suggested" };
}

export function summarise(analysis: ReturnType<typeof analyseText>) {
  const { result, sniff, mapping } = analysis;
  const problems = result.problems;
  return {
    sniff: { delimiter: sniff.delimiter === "\t" ? "tab" : sniff.delimiter, decimalComma: sniff.decimalComma, headerLine: sniff.headerLine, hadBom: sniff.hadBom },
    headers: sniff.headers,
    samples: sniff.headers.map((_, i) => analysis.rows.slice(0, 3).map((r) => r.cells[i] ?? "")),
    mapping,
    mappingSource: analysis.mappingSource,
    stats: result.stats,
    problems: problems.slice(0, PROBLEM_ROWS_SHOWN),
    problemCount: problems.length,
    curveSets: result.curveSets.map((c) => ({ key: c.key, model: c.model, speed: c.speed, impellerDiameter: c.impellerDiameter, points: c.points.length, ok: c.ok })),
    preview: result.curveSets.slice(0, PREVIEW_CURVES).map((c) => ({
      id: c.key,
      label: `${c.model} ${curveLabel(c.speed, c.impellerDiameter)}${c.ok ? "" : " (flagged)"}`,
      points: c.points.map((p) => ({ flow: p.flow, head: p.head, efficiency: p.efficiency ?? null, power: p.power ?? null, npshr: p.npshr ?? null })),
    })),
  };
}

export type UploadSummary = ReturnType<typeof summarise>;
