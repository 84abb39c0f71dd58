/**
 * One call for the browser preview and the server: analyseCsv(text, mapping?).
 * The server must run it again on the uploaded bytes (decoded as UTF-8) and never trust a
 * parse sent by the browser. Pure: no Node or DOM APIs.
 */
import * as v from "valibot";
import { checkMapping, MappingSchema, suggestMapping, toLongRows, type Mapping } from "./mapping";
import { normaliseNewlines, parseRows, stripBom, isBlankRow, type SourceRow } from "./parse";
import { sniffCsv, type SniffResult } from "./sniff";
import type { Problem } from "./types";
import { validateLongRows, type ValidationResult } from "./validate";

export interface AnalyseResult {
  sniff: SniffResult;
  /** What the importer guesses from the headers; offer it when no saved mapping fits. */
  suggestedMapping: Mapping;
  /** The mapping actually applied (the one passed in, or the suggestion). */
  mapping: Mapping;
  /** Non-blank data rows below the header, with their 1-based source lines. */
  rows: SourceRow[];
  result: ValidationResult;
}

/**
 * Sniff, parse, map and validate a CSV text (already decoded from UTF-8; a BOM is fine).
 * `mapping` may come from a form or a saved library mapping: it is checked with MappingSchema
 * first and an invalid one throws v.ValiError (the caller shows the issues next to the form).
 * Its optional `source` block overrides the sniffer (delimiter, decimal comma, header row).
 */
export function analyseCsv(text: string, mapping?: unknown): AnalyseResult {
  const given = mapping === undefined ? undefined : v.parse(MappingSchema, mapping);
  const sniff = sniffCsv(text, given?.source ?? {});
  const body = normaliseNewlines(stripBom(text).text);
  const parsed = parseRows(body, { delimiter: sniff.delimiter });
  const rows = parsed.rows.slice(sniff.dataStartRow).filter((r) => !isBlankRow(r.cells));
  const suggestedMapping = suggestMapping(sniff.headers, rows.slice(0, 200), sniff.decimalComma);
  const used = given ?? suggestedMapping;
  const headerLine = sniff.headerLine || sniff.dataStartLine;

  const structural = checkMapping(used, sniff.headers, headerLine);
  const csvIssues: Problem[] = parsed.issues.map((i) => ({
    row: i.line, column: null, reason: `CSV syntax: ${i.message}`, severity: "error", code: "csv-syntax", curveKey: null,
  }));
  const long = toLongRows(rows, used, sniff.headers);
  const fatal = structural.some((p) => p.severity === "error");
  const result = fatal
    ? validateLongRows([], { decimalComma: sniff.decimalComma, headerLine })
    : validateLongRows(long.rows, { decimalComma: sniff.decimalComma, headerLine });
  const empty: Problem[] =
    rows.length === 0 && !fatal
      ? [{ row: headerLine, column: null, reason: "the file has no data rows below its header", severity: "error", code: "missing-value", curveKey: null }]
      : [];
  const problems = [...structural, ...empty, ...csvIssues, ...(fatal ? [] : long.problems), ...result.problems].sort((a, b) => a.row - b.row);
  const errors = problems.filter((p) => p.severity === "error").length;
  return {
    sniff,
    suggestedMapping,
    mapping: used,
    rows,
    result: { ...result, problems, stats: { ...result.stats, errors, warnings: problems.length - errors } },
  };
}

export { sniffCsv, type SniffResult, type SniffOverrides } from "./sniff";
export { parseRows, CsvChunkParser, stripBom, normaliseNewlines, type SourceRow, type Delimiter, type ParseIssue } from "./parse";
export {
  MappingSchema, MappedColumnSchema, BlockSchema, suggestMapping, toLongRows, checkMapping, blockLabel,
  type Mapping, type MappedColumn, type Block, type LongRow, type Cell,
} from "./mapping";
export { validateLongRows, curveKey, CurveSetSchema, CurvePointSchema, type CurveSet, type CurvePoint, type ValidationResult, type ValidationStats } from "./validate";
export {
  FIELDS, NUMERIC_FIELDS, TEXT_FIELDS, UNITS_BY_FIELD, SI_FACTOR, DEFAULT_UNIT, toSI, guessHeader, unitAllowed,
  type Field, type NumericField, type TextField, type Unit,
} from "./units-in-headers";
export { parseNumber } from "./numbers";
export type { Problem, ProblemCode, Severity } from "./types";
