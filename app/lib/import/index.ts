/**
 * One call for the browser preview and the server: analyseCsv(text, mapping?).
 * The server must run it again on the uploaded bytes (decoded as UTF-8) and never trust a
 * parse sent by the browser. Pure: no Node or DOM APIs.
 */
import * as v from "valibot";
import { checkMapping, MappingSchema, suggestMapping, toLongRows, type Mapping } from "./mapping";
import { fastLongValidate } from "./fast";
import { normaliseNewlines, parseRows, stripBom, isBlankRow, type ParseIssue, type SourceRow } from "./parse";
import { readTitle, withTitleDefaults, type TitleInfo } from "./title";
import { sniffCsv, type SniffResult } from "./sniff";
import { unitsRowAgrees, unknownUnitProblems } from "./units-row";
import type { Problem } from "./types";
import { validateLongRows, type ValidationResult } from "./validate";
import { withRatingValues } from "./rated-values";
import { unnamedTailOf } from "./shifted-cells";

export interface AnalyseOptions {
  /** Try the fast path for clean long-layout files first (default true; tests turn it off to compare). */
  fast?: boolean;
}

export interface AnalyseResult {
  sniff: SniffResult;
  /** What the importer guesses from the headers; offer it when no saved mapping fits. */
  suggestedMapping: Mapping;
  /** The mapping actually applied (the one passed in, or the suggestion). */
  mapping: Mapping;
  /** Non-blank data rows below the header, with their 1-based source lines (parsed on first use after the fast path). */
  readonly rows: SourceRow[];
  /** Title lines above the header and what was read from them (model, speed, diameter, fluid). */
  title: TitleInfo;
  /** True when the fast path produced the result (clean long-layout file). */
  fastPath: boolean;
  result: ValidationResult;
}

/**
 * Sniff, parse, map and validate a CSV text (already decoded from UTF-8; a BOM is fine).
 * `mapping` may come from a form or a saved library mapping: it is checked with MappingSchema
 * first and an invalid one throws v.ValiError (the caller shows the issues next to the form).
 * Its optional `source` block overrides the sniffer (delimiter, decimal comma, header row).
 */
/** The first `lines` lines of `text` (a sample for the suggestion; a quoted cell cut short there only costs the sample). */
function headOf(text: string, lines: number): string {
  let at = 0;
  for (let n = 0; n < lines; n++) {
    const nl = text.indexOf("\n", at);
    if (nl === -1) return text;
    at = nl + 1;
  }
  return text.slice(0, at);
}

/** Why a file with no data rows cannot be read: nothing but blank lines, or a header (or one line) and nothing below it. */
function emptyReason(sniff: SniffResult): string {
  const named = sniff.headers.filter((h, n) => h !== `Column ${n + 1}`);
  if (named.length === 0) return "the file has no data rows: it holds nothing but blank lines; a curve file has a header and rows of flow and head below it";
  const shown = named.join(", ");
  return `the file has no data rows: line ${sniff.headerLine || 1} (“${shown.length > 80 ? `${shown.slice(0, 79)}…` : shown}”) is all it holds, read as its header; a curve file has rows of flow and head below it`;
}

/** The same cells, each trimmed and without regard to case (a header written again). */
function sameCells(a: string[], b: string[]): boolean {
  const n = Math.max(a.length, b.length);
  for (let i = 0; i < n; i++) if ((a[i] ?? "").trim().toLowerCase() !== (b[i] ?? "").trim().toLowerCase()) return false;
  return true;
}

export function analyseCsv(text: string, mapping?: unknown, opts: AnalyseOptions = {}): AnalyseResult {
  const given = mapping === undefined ? undefined : v.parse(MappingSchema, mapping);
  const sniff = sniffCsv(text, given?.source ?? {});
  const body = normaliseNewlines(stripBom(text).text);
  const headerLine = sniff.headerLine || sniff.dataStartLine;
  // The suggestion needs a sample only: the first 200 data rows.
  const sample = parseRows(headOf(body, sniff.dataStartRow + 400), { delimiter: sniff.delimiter }).rows.slice(sniff.dataStartRow).filter((r) => !isBlankRow(r.cells)).slice(0, 200);
  const title = readTitle(body, sniff);
  const suggestedMapping = withTitleDefaults(suggestMapping(sniff.headers, sample, sniff.decimalComma), title);
  const used = given ?? suggestedMapping;
  const structural = [...checkMapping(used, sniff.headers, headerLine), ...unknownUnitProblems(sniff, used)];
  const vopts = { decimalComma: sniff.decimalComma, headerLine, policy: used.policy };

  let allRows: SourceRow[] | null = null;
  let parseIssues: ParseIssue[] = [];
  let repeats: SourceRow[] = []; // the header row written again below it (two exports joined): skipped with a warning
  const unitsUnder = new Map<number, number>(); // a repeat's line → the line of the units row under it, skipped with it (units-row.ts unitsRowAgrees)
  const parseAll = () => {
    if (!allRows) {
      const parsed = parseRows(body, { delimiter: sniff.delimiter });
      const header = sniff.headerLine ? parsed.rows[sniff.headerRowIndex] : undefined;
      const same = (r: SourceRow) => header !== undefined && sameCells(r.cells, header.cells);
      const data = parsed.rows.slice(sniff.dataStartRow).filter((r) => !isBlankRow(r.cells));
      repeats = data.filter(same);
      if (repeats.length) {
        const kept: SourceRow[] = [];
        for (let i = 0; i < data.length; i++) {
          if (!same(data[i])) kept.push(data[i]);
          else if (i + 1 < data.length && unitsRowAgrees(data[i + 1].cells, used)) unitsUnder.set(data[i].line, data[++i].line);
        }
        allRows = kept;
      } else allRows = data;
      parseIssues = parsed.issues;
    }
    return allRows;
  };
  const base = { sniff, suggestedMapping, mapping: used, title };
  const withRows = <T extends object>(o: T): T & { readonly rows: SourceRow[] } =>
    Object.defineProperty(o, "rows", { get: parseAll, enumerable: false }) as T & { readonly rows: SourceRow[] };

  // Unnamed columns after the last named one in a comma-separated file: a number there may be a decimal comma split off
  // the last named column (shifted-cells.ts), which the full path names at the row.
  const unnamedTail = sniff.delimiter === "," && unnamedTailOf(sniff.headers, new Set(used.columns.filter((c) => c.field !== "ignore").map((c) => c.index))) !== null;
  if (opts.fast !== false && structural.length === 0 && !unnamedTail) {
    const quick = fastLongValidate(body, sniff, used);
    if (quick) return withRows({ ...base, fastPath: true, result: quick });
  }

  const rows = parseAll();
  const csvIssues: Problem[] = parseIssues.map((i) => ({
    row: i.line, column: null, reason: `CSV syntax: ${i.message}`, severity: "error", code: "csv-syntax", curveKey: null,
  }));
  const long = toLongRows(rows, used, sniff.headers, sniff.delimiter);
  const fatal = structural.some((p) => p.severity === "error");
  const result = fatal ? validateLongRows([], vopts) : validateLongRows(long.rows, vopts);
  // No data rows: said first and alone — the mapping's errors ("no column is mapped to model" for a file holding "A") follow from it.
  const empty: Problem[] = rows.length === 0 ? [{ row: headerLine || 1, column: null, reason: emptyReason(sniff), severity: "error", code: "missing-value", curveKey: null }] : [];
  // A rating column mapped to power all the same is kept (the user's choice); its warning gets the values, curve by curve (rated-values.ts).
  const said = empty.length ? [] : fatal ? structural : withRatingValues(structural, used, sniff.headers, long.rows, vopts, result.curveSets);
  const repeated: Problem[] = repeats.map((r) => ({
    row: r.line, column: null, severity: "warning", code: "header-repeated", curveKey: null,
    reason: `line ${r.line} repeats the header of line ${headerLine} cell for cell (two exports joined into one file?)${unitsUnder.has(r.line) ? `, with its units row, line ${unitsUnder.get(r.line)}, in the units the columns are read in` : ""}: ` +
      `read as a header again and skipped; the rows below it are read by the same columns`,
  }));
  const problems = [...said, ...empty, ...csvIssues, ...repeated, ...(fatal ? [] : long.problems), ...result.problems].sort((a, b) => a.row - b.row);
  const errors = problems.filter((p) => p.severity === "error").length;
  return withRows({
    ...base,
    fastPath: false,
    result: { ...result, problems, stats: { ...result.stats, errors, warnings: problems.length - errors } },
  });
}

export { sniffCsv, type SniffResult, type SniffOverrides } from "./sniff";
export { parseRows, CsvChunkParser, stripBom, normaliseNewlines, type SourceRow, type Delimiter, type ParseIssue } from "./parse";
export {
  MappingSchema, MappedColumnSchema, BlockSchema, suggestMapping, toLongRows, checkMapping, blockLabel,
  type Mapping, type MappedColumn, type Block, type LongRow, type Cell,
} from "./mapping";
export { validateLongRows, curveKey, NO_SPEED_WARNING, WATER_20C_DENSITY, CONSISTENCY_TOLERANCE, type Policy, CurveSetSchema, CurvePointSchema, type CurveSet, type CurvePoint, type ValidationResult, type ValidationStats } from "./validate";
export {
  FIELDS, NUMERIC_FIELDS, TEXT_FIELDS, UNITS_BY_FIELD, SI_FACTOR, DEFAULT_UNIT, DIAMETER_UNITS, toSI, guessHeader, unitAllowed,
  headerUnitRefusal, refusalMessage, headerNamesInputPower, headerPowerKind,
  type Field, type PowerKind, type NumericField, type TextField, type Unit, type UnitRefusal,
} from "./units-in-headers";
export { powerKindNote, powerKindMessage } from "./power-kinds";
export { gallonAssumedNote } from "./unit-words";
export { isUnitCell, unitsRowOf, type UnitsRow } from "./units-row";
export { parseNumber } from "./numbers";
export { undefused, textCell } from "./text-cells";
export { readTitle, withTitleDefaults, type TitleInfo } from "./title";
export { decodeBytes, encodingNamed, looksBinary, looksUtf16WithoutBom, ENCODINGS, ENCODING_LABEL, type Encoding, type Decoded } from "./decode";
export { curveName, curveNameOfKey } from "./names";
export { splittingBlanks, type SplittingBlank, type KeyColumn } from "./blank-keys";
export type { Problem, ProblemCode, Severity } from "./types";
export { applyCellEdits, csvField, EditRefused, MAX_EDITS, type CellEdit } from "./edit";
