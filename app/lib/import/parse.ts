/**
 * CSV → rows of string cells, each with its 1-based source line number. Pure (papaparse only).
 */
import Papa from "papaparse";

export type Delimiter = "," | ";" | "\t";

export interface SourceRow {
  /** 1-based line in the uploaded text (after the BOM is removed) where the record starts. */
  line: number;
  cells: string[];
}

export interface ParseIssue {
  line: number;
  message: string;
}

export interface ParseOutput {
  rows: SourceRow[];
  issues: ParseIssue[];
}

export function stripBom(text: string): { text: string; hadBom: boolean } {
  return text.charCodeAt(0) === 0xfeff ? { text: text.slice(1), hadBom: true } : { text, hadBom: false };
}

/** CRLF and lone CR become LF so that line numbers count the way editors show them. */
export function normaliseNewlines(text: string): string {
  return text.indexOf("\r") === -1 ? text : text.replace(/\r\n?/g, "\n");
}

export function isBlankRow(cells: string[]): boolean {
  for (const c of cells) if (c.trim() !== "") return false;
  return true;
}

export interface ParseOptions {
  delimiter: Delimiter;
  /** Stop after this many records (sniffing). */
  maxRows?: number;
  /** Line number of the first character of `text` (used by the chunk parser). Default 1. */
  firstLine?: number;
  /** Keep rows whose cells are all blank. Default true (the sniffer needs them to count lines). */
  keepBlank?: boolean;
}

/**
 * Parse a whole string. Records keep their source line even when a quoted cell spans lines.
 * Expects LF newlines (see normaliseNewlines) and no BOM (see stripBom).
 */
export function parseRows(text: string, opts: ParseOptions): ParseOutput {
  const rows: SourceRow[] = [];
  const issues: ParseIssue[] = [];
  let line = opts.firstLine ?? 1;
  let scanned = 0; // offset up to which newlines have been counted into `line`
  let rowStart = 0;
  const keepBlank = opts.keepBlank ?? true;
  const advanceTo = (offset: number) => {
    for (let i = scanned; i < offset; i++) if (text.charCodeAt(i) === 10) line++;
    scanned = Math.max(scanned, offset);
  };
  if (text.length === 0) return { rows, issues };
  Papa.parse<string[]>(text, {
    delimiter: opts.delimiter,
    newline: "\n",
    quoteChar: '"',
    escapeChar: '"',
    skipEmptyLines: false,
    step: (result, p) => {
      advanceTo(rowStart);
      const cells = result.data;
      for (const e of result.errors) issues.push({ line, message: e.message });
      if (keepBlank || !isBlankRow(cells)) rows.push({ line, cells });
      rowStart = result.meta.cursor;
      if (opts.maxRows !== undefined && rows.length >= opts.maxRows) p.abort();
    },
  });
  // papaparse reports a trailing newline as one more empty record; drop it.
  const last = rows[rows.length - 1];
  if (keepBlank && last && last.cells.length === 1 && last.cells[0] === "" && text.endsWith("\n")) rows.pop();
  return { rows, issues };
}

/**
 * Incremental parser for big uploads read in pieces (File.stream(), a request body...).
 * push() returns the complete records found so far; finish() returns the rest.
 * A record boundary is a newline outside quotes (an even number of quote characters seen),
 * which is exact for RFC 4180 quoting where a literal quote is written "".
 */
export class CsvChunkParser {
  private buffer = "";
  private nextLine = 1;
  private first = true;
  private pendingCR = false;
  private quoteCount = 0; // quotes in buffer up to `scanned`
  private scanned = 0;
  readonly issues: ParseIssue[] = [];

  constructor(private readonly delimiter: Delimiter, private readonly keepBlank = false) {}

  push(chunk: string): SourceRow[] {
    if (this.first) {
      chunk = stripBom(chunk).text;
      this.first = false;
    }
    if (this.pendingCR) {
      chunk = "\r" + chunk;
      this.pendingCR = false;
    }
    if (chunk.endsWith("\r")) {
      this.pendingCR = true;
      chunk = chunk.slice(0, -1);
    }
    this.buffer += normaliseNewlines(chunk);
    // find the last newline outside quotes
    let cut = -1;
    let q = this.quoteCount;
    for (let i = this.scanned; i < this.buffer.length; i++) {
      const c = this.buffer.charCodeAt(i);
      if (c === 34) q++;
      else if (c === 10 && q % 2 === 0) cut = i;
    }
    if (cut === -1) {
      this.quoteCount = q;
      this.scanned = this.buffer.length;
      return [];
    }
    const piece = this.buffer.slice(0, cut + 1);
    this.buffer = this.buffer.slice(cut + 1);
    let rest = 0;
    for (let i = 0; i < this.buffer.length; i++) if (this.buffer.charCodeAt(i) === 34) rest++;
    this.quoteCount = rest;
    this.scanned = this.buffer.length;
    return this.parsePiece(piece);
  }

  finish(): SourceRow[] {
    if (this.pendingCR) {
      this.buffer += "\n";
      this.pendingCR = false;
    }
    const piece = this.buffer;
    this.buffer = "";
    this.scanned = 0;
    this.quoteCount = 0;
    return piece.length ? this.parsePiece(piece) : [];
  }

  private parsePiece(piece: string): SourceRow[] {
    const out = parseRows(piece, { delimiter: this.delimiter, firstLine: this.nextLine, keepBlank: this.keepBlank });
    this.issues.push(...out.issues);
    for (let i = 0; i < piece.length; i++) if (piece.charCodeAt(i) === 10) this.nextLine++;
    return out.rows;
  }
}
