/**
 * Sniff the shape of a vendor CSV: delimiter, decimal comma, where the header row is.
 * Pure: no Node or DOM APIs; the browser preview and the server run the same code.
 */
import { isCommaDecimalCell, isDotDecimalCell, parseNumber } from "./numbers";
import { isBlankRow, normaliseNewlines, parseRows, stripBom, type Delimiter, type SourceRow } from "./parse";
import { extractQualifier, normaliseHeader } from "./units-in-headers";
import { unitsRowOf, type UnitsRow } from "./units-row";

export interface SniffResult {
  delimiter: Delimiter;
  decimalComma: boolean;
  /** 0-based index of the (first) header record among all records, blank lines included; -1 when the file has no header row. */
  headerRowIndex: number;
  /** 1 normally; 2 when a units row sits under the names, or a group row ("2900 rpm") sits above them. */
  headerRowCount: number;
  /** The units row merged into the names, with the units in it that no field knows (units-row.ts); null when there is none. */
  unitsRow: UnitsRow | null;
  /** 1-based source line of the header row (0 when none). */
  headerLine: number;
  /** One name per column. Blank or missing names become "Column N" (1-based). */
  headers: string[];
  /** 0-based record index of the first data record. */
  dataStartRow: number;
  /** 1-based source line of the first data record. */
  dataStartLine: number;
  hadBom: boolean;
}

export interface SniffOverrides {
  delimiter?: Delimiter;
  decimalComma?: boolean;
  /** 0-based record index of the header row, as in SniffResult (a single header row is assumed). */
  headerRowIndex?: number;
}

const SAMPLE_CHARS = 64 * 1024;
const SAMPLE_ROWS = 200;
const DELIMITERS: Delimiter[] = ["\t", ";", ","]; // preference order when several fit

/** Count fields in one physical line, honouring double quotes (good enough for sniffing). */
function countFields(line: string, d: string): number {
  let n = 1;
  let inQ = false;
  for (let i = 0; i < line.length; i++) {
    const c = line[i];
    if (c === '"') inQ = !inQ;
    else if (c === d && !inQ) n++;
  }
  return n;
}

/** The sample's records, a quoted cell's line breaks kept inside its record (a notes or model cell written on two lines). */
function quotedRecords(sample: string): string[] {
  const out: string[] = [];
  let inQ = false;
  let start = 0;
  for (let i = 0; i < sample.length; i++) {
    const c = sample[i];
    if (c === '"') inQ = !inQ;
    else if (c === "\n" && !inQ) {
      out.push(sample.slice(start, i));
      start = i + 1;
    }
  }
  if (start < sample.length) out.push(sample.slice(start));
  return out;
}

/** The first delimiter in preference order whose field count is the same on 70 % of the lines (fits), else the best scored. */
function fitDelimiter(all: string[]): { d: Delimiter; fits: boolean } {
  const lines = all.filter((l) => l.trim() !== "");
  // Title lines sit at the top: judge the delimiter on the lower two thirds of the sample.
  const body = lines.length > 3 ? lines.slice(Math.floor(lines.length / 3)) : lines;
  let best: { d: Delimiter; score: number } = { d: ",", score: -1 };
  for (const d of DELIMITERS) {
    const freq = new Map<number, number>();
    for (const l of body) {
      const n = countFields(l, d);
      freq.set(n, (freq.get(n) ?? 0) + 1);
    }
    let mode = 1;
    let modeCount = 0;
    for (const [n, c] of freq) if (c > modeCount || (c === modeCount && n > mode)) [mode, modeCount] = [n, c];
    const consistency = body.length ? modeCount / body.length : 0;
    if (mode >= 2 && consistency >= 0.7) return { d, fits: true }; // first fitting one in preference order
    const score = mode >= 2 ? mode * consistency : 0;
    if (score > best.score) best = { d, score };
  }
  return { d: best.d, fits: false };
}

/**
 * The delimiter, judged line by line; when none fits so, judged again record by record with quoted line breaks kept inside
 * their record (a model or notes cell on two lines on every row split each row in two, and none fitted: the file was read
 * tab-separated and every row refused). Lines first: a stray quote (an inch mark, 6") then spoils only its own line.
 */
export function detectDelimiter(sample: string): Delimiter {
  const byLine = fitDelimiter(sample.split("\n"));
  if (byLine.fits || !sample.includes('"')) return byLine.d;
  const byRecord = fitDelimiter(quotedRecords(sample));
  return byRecord.fits ? byRecord.d : byLine.d;
}

export function detectDecimalComma(rows: SourceRow[], delimiter: Delimiter): boolean {
  if (delimiter === ",") return false;
  let comma = 0;
  let dot = 0;
  for (const r of rows)
    for (const c of r.cells) {
      if (isCommaDecimalCell(c)) comma++;
      else if (isDotDecimalCell(c)) dot++;
    }
  return comma > 0 && comma >= dot * 4; // a few stray dot decimals do not overturn clear comma evidence
}

interface RowShape {
  nonEmpty: number;
  numeric: number;
}

function shape(cells: string[], decimalComma: boolean): RowShape {
  let nonEmpty = 0;
  let numeric = 0;
  for (const c of cells) {
    if (c.trim() === "") continue;
    nonEmpty++;
    if (!Number.isNaN(parseNumber(c, decimalComma))) numeric++;
  }
  return { nonEmpty, numeric };
}

const isHeaderish = (s: RowShape) => s.nonEmpty >= 2 && s.numeric / s.nonEmpty < 0.5;
const isDataish = (s: RowShape) => s.numeric >= 1 && s.numeric / s.nonEmpty >= 0.5;

export function sniffCsv(raw: string, overrides: SniffOverrides = {}): SniffResult {
  const { text: noBom, hadBom } = stripBom(raw);
  let sampleText = noBom.length > SAMPLE_CHARS ? noBom.slice(0, SAMPLE_CHARS) : noBom;
  if (noBom.length > SAMPLE_CHARS) sampleText = sampleText.slice(0, sampleText.lastIndexOf("\n") + 1 || undefined);
  sampleText = normaliseNewlines(sampleText);

  const delimiter = overrides.delimiter ?? detectDelimiter(sampleText);
  const records = parseRows(sampleText, { delimiter, maxRows: SAMPLE_ROWS }).rows;
  const decimalComma = overrides.decimalComma ?? detectDecimalComma(records, delimiter);
  const shapes = records.map((r) => shape(r.cells, decimalComma));
  const nonBlank = records.map((_, i) => i).filter((i) => !isBlankRow(records[i].cells));

  let headerRowIndex = -1;
  let headerRowCount = 1;
  let unitsRow: UnitsRow | null = null;
  let dataStartRow = nonBlank[0] ?? 0;
  let headerCells: string[] = [];

  if (overrides.headerRowIndex !== undefined) {
    headerRowIndex = overrides.headerRowIndex;
    headerCells = records[headerRowIndex]?.cells ?? [];
    dataStartRow = headerRowIndex + 1;
  } else {
    let found = -1;
    for (let k = 0; k < nonBlank.length; k++) {
      const i = nonBlank[k];
      if (!isHeaderish(shapes[i])) continue;
      const next = nonBlank.slice(k + 1, k + 4);
      if (next.length && next.every((j) => isDataish(shapes[j]))) {
        found = k;
        break;
      }
      // names row followed by a units row (every filled cell a unit word, known ones in the majority: units-row.ts), then data
      const after = nonBlank[k + 1];
      const units = after === undefined ? null : unitsRowOf(records[after].cells);
      if (units && nonBlank.slice(k + 2, k + 5).length > 0 && nonBlank.slice(k + 2, k + 5).every((j) => isDataish(shapes[j]))) {
        headerRowIndex = i;
        headerRowCount = 2;
        const cells = records[after].cells;
        headerCells = records[i].cells.map((c, n) => (cells[n]?.trim() ? `${c.trim()} ${cells[n].trim()}` : c));
        unitsRow = { line: records[after].line, known: units.known, unknown: units.unknown.map((n) => ({ index: n, unit: cells[n].trim(), name: (records[i].cells[n] ?? "").trim() })) };
        dataStartRow = after + 1;
        break;
      }
    }
    if (found >= 0) {
      const i = nonBlank[found];
      headerRowIndex = i;
      headerCells = records[i].cells;
      dataStartRow = i + 1;
      // a group row right above ("2900 rpm;;1450 rpm;") whose labels qualify the blocks below
      const above = found > 0 ? nonBlank[found - 1] : undefined;
      if (above !== undefined && above === i - 1) {
        const cells = records[above].cells;
        const labels = cells.filter((c) => c.trim() !== "");
        // a group label is little more than a qualifier ("2900 rpm", "Impeller Ø 250 mm"); a title line that mentions a speed is not one
        const qualified = (c: string) => {
          const q = extractQualifier(normaliseHeader(c));
          return q.qualifier !== null && q.rest.replace(/\b(impeller|speed|diameter|dia|trim|at|bei|laufrad|drehzahl)\b/g, "").replace(/[^a-z0-9]/g, "").length <= 2; // little besides the qualifier
        };
        const nQualified = labels.filter(qualified).length;
        if (nQualified > 0 && nQualified * 2 >= labels.length) {
          let group = "";
          headerCells = headerCells.map((c, n) => {
            const label = (cells[n] ?? "").trim();
            if (label) group = qualified(label) ? label : "";
            return group && c.trim() ? `${c.trim()} @ ${group}` : c;
          });
          headerRowIndex = above;
          headerRowCount = 2;
        }
      }
    } else if (headerRowIndex < 0) {
      const first = nonBlank[0];
      if (first !== undefined && isDataish(shapes[first])) {
        headerRowIndex = -1; // no header row at all
        dataStartRow = first;
      } else if (first !== undefined) {
        const withCells = nonBlank.find((i) => shapes[i].nonEmpty >= 2) ?? first;
        headerRowIndex = withCells;
        headerCells = records[withCells].cells;
        dataStartRow = withCells + 1;
      }
    }
  }

  // width: the header, widened to unnamed columns that are filled on at least half the sampled data
  // rows (a stray cell here and there is left for the extra-cells warning instead)
  let width = headerCells.length;
  const dataRows = records.slice(dataStartRow).filter((r) => !isBlankRow(r.cells));
  const filled: number[] = [];
  for (const r of dataRows)
    for (let n = width; n < r.cells.length; n++) if (r.cells[n].trim() !== "") filled[n] = (filled[n] ?? 0) + 1;
  for (let n = filled.length - 1; n >= width; n--)
    if ((filled[n] ?? 0) * 2 >= dataRows.length) {
      width = n + 1;
      break;
    }
  const headers = Array.from({ length: width }, (_, n) => headerCells[n]?.trim() || `Column ${n + 1}`);
  const headerLine = headerRowIndex >= 0 ? (records[headerRowIndex]?.line ?? 0) : 0;
  const dataStartLine =
    records[dataStartRow]?.line ?? (records.length ? records[records.length - 1].line + 1 : 1);
  return { delimiter, decimalComma, headerRowIndex, headerRowCount, unitsRow, headerLine, headers, dataStartRow, dataStartLine, hadBom };
}
