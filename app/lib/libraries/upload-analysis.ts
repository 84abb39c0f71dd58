// What the mapping page shows of an upload: the analysis (decode, sniff, title lines, mapping,
// validation) boiled down to a summary a page can carry. Pure (no Node, no database), so it runs in
// a worker thread (upload-analysis.server.ts) — a 200 000-row file takes seconds to analyse — and
// on the server's import path alike.
import * as v from "valibot";
import {
  analyseCsv, curveName, curveNameOfKey, decodeBytes, encodingNamed, MappingSchema,
  type AnalyseResult, type Decoded, type Encoding, type Mapping,
} from "../import";
import { firstCurveSets } from "../import/packed";

export const PROBLEM_ROWS_SHOWN = 300;
export const PREVIEW_CURVES = 12;
export const FLAGGED_ROWS_SHOWN = 50;
/** Points per preview curve at most (a curve with more is thinned evenly, both ends kept): the page stays small. */
export const PREVIEW_POINTS = 200;

function thin<T>(points: T[], max = PREVIEW_POINTS): T[] {
  if (points.length <= max) return points;
  const step = (points.length - 1) / (max - 1);
  return Array.from({ length: max }, (_, i) => points[Math.round(i * step)]);
}

/** A row with an error, its cells and what is wrong with which cell (the fix grid). */
export type FlaggedRow = { line: number; cells: string[]; problems: { index: number | null; reason: string }[] };

/** The encoding a mapping asks for, if it is a valid one (mappings come from forms and saved JSON). */
export function encodingOf(mapping: unknown): Encoding | undefined {
  return encodingNamed((mapping as { encoding?: unknown } | null | undefined)?.encoding);
}

/** The saved mapping of the library when it still fits the file's headers, else null. */
export function savedMappingFor(lib: { mappingJson: string | null }, headers: string[]): Mapping | null {
  if (!lib.mappingJson) return null;
  try {
    const m = v.parse(MappingSchema, JSON.parse(lib.mappingJson));
    const norm = (h: string | undefined) => (h ?? "").trim().toLowerCase();
    return m.columns.every((c) => norm(headers[c.index]) === norm(c.header)) ? m : null;
  } catch {
    return null;
  }
}

export type StoredAnalysis = AnalyseResult & { mappingSource: "form" | "saved" | "suggested"; decoded: Decoded };

/**
 * Analyses the stored upload on the server with the given mapping (or the saved one, or the
 * suggestion). Given the stored bytes, it decodes them in the mapping's encoding (or detects it).
 */
export function analyseStored(source: string | Uint8Array, lib: { mappingJson: string | null }, mapping?: unknown): StoredAnalysis {
  const decodedAs = (m: unknown): Decoded =>
    typeof source === "string" ? { text: source, encoding: "utf-8", bom: false, how: "valid-utf-8" } : decodeBytes(source, encodingOf(m));
  const out = (a: AnalyseResult, mappingSource: StoredAnalysis["mappingSource"], decoded: Decoded): StoredAnalysis =>
    Object.assign(a, { mappingSource, decoded }); // (not a spread: `rows` is a lazy getter)
  if (mapping !== undefined) {
    const d = decodedAs(mapping);
    return out(analyseCsv(d.text, mapping), "form", d);
  }
  const d = decodedAs(undefined);
  const first = analyseCsv(d.text);
  const saved = savedMappingFor(lib, first.sniff.headers);
  if (saved) {
    try {
      const ds = decodedAs(saved);
      return out(analyseCsv(ds.text, saved), "saved", ds);
    } catch {
      /* fall through to the suggestion */
    }
  }
  return out(first, "suggested", d);
}


/** Rows with an error, with their cells, for the fix grid (first FLAGGED_ROWS_SHOWN). */
function flaggedRows(analysis: StoredAnalysis): { rows: FlaggedRow[]; total: number } {
  const { headers, dataStartLine } = analysis.sniff;
  const byLine = new Map<number, FlaggedRow["problems"]>();
  for (const p of analysis.result.problems) {
    if (p.severity !== "error" || p.row < dataStartLine) continue;
    const index = p.column === null ? null : headers.indexOf(p.column);
    byLine.set(p.row, [...(byLine.get(p.row) ?? []), { index: index === -1 ? null : index, reason: p.reason }]);
  }
  if (byLine.size === 0) return { rows: [], total: 0 };
  const lines = [...byLine.keys()].sort((a, b) => a - b).slice(0, FLAGGED_ROWS_SHOWN);
  const want = new Set(lines);
  const cellsOf = new Map(analysis.rows.filter((r) => want.has(r.line)).map((r) => [r.line, r.cells]));
  return {
    rows: lines.filter((l) => cellsOf.has(l)).map((line) => ({ line, cells: headers.map((_, i) => cellsOf.get(line)![i] ?? ""), problems: byLine.get(line)! })),
    total: byLine.size,
  };
}

/**
 * What the mapping page needs, and no more: it is copied from the worker and sent to the browser, so
 * it stays small whatever the file's size (no per-curve list: counts are in `stats`; at most
 * PREVIEW_CURVES curves of at most PREVIEW_POINTS points, PROBLEM_ROWS_SHOWN problems, FLAGGED_ROWS_SHOWN rows).
 */
export function summarise(analysis: StoredAnalysis) {
  const { result, sniff, mapping } = analysis;
  const problems = result.problems;
  return {
    sniff: { delimiter: sniff.delimiter === "\t" ? "tab" : sniff.delimiter, decimalComma: sniff.decimalComma, headerLine: sniff.headerLine, hadBom: sniff.hadBom || analysis.decoded.bom },
    encoding: { name: analysis.decoded.encoding, how: analysis.decoded.how },
    title: analysis.title,
    flagged: flaggedRows(analysis),
    headers: sniff.headers,
    samples: sniff.headers.map((_, i) => analysis.rows.slice(0, 3).map((r) => r.cells[i] ?? "")),
    mapping,
    mappingSource: analysis.mappingSource,
    stats: result.stats,
    problems: problems.slice(0, PROBLEM_ROWS_SHOWN).map((p) => ({ ...p, curve: p.curveKey ? curveNameOfKey(p.curveKey) : "" })),
    problemCount: problems.length,
    preview: firstCurveSets(result, PREVIEW_CURVES).map((c) => ({
      id: c.key,
      label: `${curveName(c.model, c.speed, c.impellerDiameter)}${c.ok ? "" : " (flagged)"}`,
      points: thin(c.points).map((p) => ({ flow: p.flow, head: p.head, efficiency: p.efficiency ?? null, power: p.power ?? null, npshr: p.npshr ?? null })),
    })),
  };
}

export type UploadSummary = ReturnType<typeof summarise>;
