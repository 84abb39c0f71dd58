// What the mapping page shows of an upload: the analysis (decode, sniff, title lines, mapping,
// validation) boiled down to a summary a page can carry. Pure (no Node, no database), so it runs in
// a worker thread (upload-analysis.server.ts) — a 200 000-row file takes seconds to analyse — and
// on the server's import path alike.
import {
  analyseCsv, curveName, curveNameOfKey, decodeBytes, encodingNamed, MappingSchema,
  type AnalyseResult, type Decoded, type Encoding, type Mapping,
} from "../import";
import { firstCurveSets } from "../import/packed";
import { minFlowList, withMinFlowColumns } from "./upload-min-flows";
import { MAX_PROBLEMS_LISTED, problemErrors, problemLine, problemsSummary, readStoredDoc, type DocProblem, type DocWords } from "../projects/stored-doc";

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

const MAPPING_WORDS: DocWords = {
  whole: "the saved mapping",
  labels: { version: "format version", layout: "layout (long or wide)", columns: "columns", index: "position", header: "header", field: "field", unit: "unit", unitSource: "where the unit came from", block: "curve block", defaults: "values for missing columns", fillDownModel: "fill the model down", fillDownKeys: "fill speed and impeller down", policy: "curves with bad points", encoding: "text encoding", source: "file layout corrections" },
  items: { columns: "column" },
  quantities: {},
};

/**
 * The library's saved mapping read against `MappingSchema` (projects/stored-doc.ts): the mapping, none saved, or what is
 * wrong with it. A saved mapping is a convenience, not data: one that cannot be read is set aside (a fresh mapping is
 * proposed, as for a first upload) and the mapping page says so; the next import saves the mapping it used in its place.
 */
export function readSavedMapping(mappingJson: string | null): { mapping: Mapping | null; problems: DocProblem[] } {
  if (!mappingJson) return { mapping: null, problems: [] };
  const r = readStoredDoc(mappingJson, MappingSchema, MAPPING_WORDS);
  return r.ok ? { mapping: r.value, problems: [] } : { mapping: null, problems: r.problems };
}

/** The saved mapping of the library when it can be read and still fits the file's headers, else null. */
export function savedMappingFor(lib: { mappingJson: string | null }, headers: string[]): Mapping | null {
  const m = readSavedMapping(lib.mappingJson).mapping;
  const norm = (h: string | undefined) => (h ?? "").trim().toLowerCase();
  return m && m.columns.every((c) => norm(headers[c.index]) === norm(c.header)) ? m : null;
}

export type StoredAnalysis = AnalyseResult & {
  mappingSource: "form" | "saved" | "suggested";
  decoded: Decoded;
  /** The library's saved mapping when it was looked at (no mapping given) and could not be read: what is wrong with it. */
  savedMappingProblems: DocProblem[];
};

/**
 * Analyses the stored upload on the server with the given mapping (or the saved one, or the
 * suggestion). Given the stored bytes, it decodes them in the mapping's encoding (or detects it).
 */
export function analyseStored(source: string | Uint8Array, lib: { mappingJson: string | null }, mapping?: unknown): StoredAnalysis {
  const decodedAs = (m: unknown): Decoded =>
    typeof source === "string" ? { text: source, encoding: "utf-8", bom: false, how: "valid-utf-8" } : decodeBytes(source, encodingOf(m));
  const out = (a: AnalyseResult, mappingSource: StoredAnalysis["mappingSource"], decoded: Decoded, savedMappingProblems: DocProblem[] = []): StoredAnalysis =>
    Object.assign(a, { mappingSource, decoded, savedMappingProblems }); // (not a spread: `rows` is a lazy getter)
  if (mapping !== undefined) {
    const d = decodedAs(mapping);
    return out(analyseCsv(d.text, mapping), "form", d);
  }
  const d = decodedAs(undefined);
  const first = analyseCsv(d.text);
  const stored = readSavedMapping(lib.mappingJson);
  const fits = savedMappingFor(lib, first.sniff.headers);
  // A maker's minimum flow column the saved mapping does not list is read (upload-min-flows.ts).
  const saved = fits && withMinFlowColumns(fits, first.mapping);
  if (saved) {
    try {
      const ds = decodedAs(saved);
      return out(analyseCsv(ds.text, saved), "saved", ds);
    } catch {
      /* fall through to the suggestion */
    }
  }
  return out(first, "suggested", d, stored.problems);
}

const unreadable = (problems: readonly DocProblem[]) =>
  `The column mapping saved with this library from its last import cannot be read (${problemsSummary(problems)}), so it is not used: `;

/** What the mapping page says of a saved mapping that cannot be read (null when there is none such). */
export function savedMappingNotice(problems: readonly DocProblem[]) {
  if (!problems.length) return null;
  return {
    text:
      unreadable(problems) +
      "the mapping below is proposed from this file's headers, as for a first upload. Check it before importing; the import saves the mapping it uses in its place.",
    lines: problems.slice(0, MAX_PROBLEMS_LISTED).map(problemLine),
  };
}

/**
 * The same notice in the upload API's answer (`savedMappingUnreadable`, null when there is none such): `detail` as the page
 * says it, for a caller that reads the report, and `errors` as the API lists a stored document's problems (problemErrors:
 * the dotted path in the saved mapping, the page's line).
 */
export function savedMappingApiNotice(problems: readonly DocProblem[]) {
  if (!problems.length) return null;
  return {
    detail:
      unreadable(problems) +
      "report.mapping was proposed from this file's headers, as for a first upload. An import saves the mapping it used in its place; send mapping to choose one.",
    errors: problemErrors(problems),
  };
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
 * it stays small whatever the file's size (no list of every curve: counts are in `stats`; at most
 * PREVIEW_CURVES curves of at most PREVIEW_POINTS points, PROBLEM_ROWS_SHOWN problems, FLAGGED_ROWS_SHOWN rows, and the
 * maker's minimum flow of one page of MIN_FLOW_CURVES_SHOWN curves with their source lines, upload-min-flows.ts).
 */
export function summarise(analysis: StoredAnalysis, minFlowPage?: number | null) {
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
    savedMappingUnreadable: savedMappingNotice(analysis.savedMappingProblems),
    stats: result.stats,
    problems: problems.slice(0, PROBLEM_ROWS_SHOWN).map((p) => ({ ...p, curve: p.curveKey ? curveNameOfKey(p.curveKey) : "" })),
    problemCount: problems.length,
    minFlows: minFlowList(analysis, minFlowPage), // one page of curves with their maker's minimum flow, for the page's editor
    preview: firstCurveSets(result, PREVIEW_CURVES).map((c) => ({
      id: c.key,
      label: `${curveName(c.model, c.speed, c.impellerDiameter)}${c.ok ? "" : " (flagged)"}`,
      points: thin(c.points).map((p) => ({ flow: p.flow, head: p.head, efficiency: p.efficiency ?? null, power: p.power ?? null, npshr: p.npshr ?? null })),
    })),
  };
}

export type UploadSummary = ReturnType<typeof summarise>;
